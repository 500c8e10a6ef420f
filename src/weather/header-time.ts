/**
 * @module weather/header-time
 * The clock a time header names, read in one pass: UTC (`time (UTC)`, `timestamp_utc`, `Z`), an offset
 * (`UTC+07:00`, `GMT-05:00`) or a standard-time zone abbreviation (`PST`). A header naming daylight time
 * gives no fixed offset.
 */
import { formatOffset } from './time-basis.ts'

/** Longest header read [characters]: longer headers are cut (no weather header is that long). */
export const MAX_HEADER_TEXT = 200

/** What a time header says about the clock of its timestamps. */
export type HeaderTimeBasis =
  | { kind: 'none' }
  | { kind: 'utc' }
  | { kind: 'offset'; hours: number; note: string }

/**
 * Standard-time zone abbreviations and their offsets from UTC [h] (IANA time zone database
 * abbreviations; from memory). Only standard-time names: a header that names a daylight-saving
 * abbreviation (PDT, CEST …) gives no fixed offset and the user is asked for the zone.
 */
const STANDARD_ZONE_ABBREVIATIONS: Record<string, number> = {
  est: -5,
  cst: -6,
  mst: -7,
  pst: -8,
  akst: -9,
  hst: -10,
  cet: 1,
  mez: 1,
  eet: 2,
  wet: 0,
  jst: 9,
  awst: 8,
  acst: 9.5,
  aest: 10,
  nzst: 12,
  sast: 2,
}

/**
 * The clock named in a time header, read in one pass: `UTC`, `GMT`, `Z`, `Zulu`, `UTC+07:00`,
 * `GMT-05:00`, `UTC−3`, or a standard-time abbreviation such as `PST`.
 */
export function headerTimeBasis(header: string): HeaderTimeBasis {
  const text = header.length > MAX_HEADER_TEXT ? header.slice(0, MAX_HEADER_TEXT) : header
  const lower = text.toLowerCase()
  let k = 0
  let sawUtc = false
  let abbreviation: string | null = null
  while (k < lower.length) {
    const c = lower.charCodeAt(k)
    if (!(c >= 97 && c <= 122)) {
      k++
      continue
    }
    const from = k
    while (k < lower.length && lower.charCodeAt(k) >= 97 && lower.charCodeAt(k) <= 122) k++
    const word = lower.slice(from, k)
    if (word === 'utc' || word === 'gmt') {
      let j = k
      while (j < lower.length && lower.charCodeAt(j) === 32) j++
      const sign = lower.charCodeAt(j)
      if (sign === 43 || sign === 45 || sign === 0x2212) {
        j++
        while (j < lower.length && lower.charCodeAt(j) === 32) j++
        let digits = 0
        let hours = 0
        while (j < lower.length && digits < 4 && lower.charCodeAt(j) >= 48 && lower.charCodeAt(j) <= 57) {
          hours = hours * 10 + (lower.charCodeAt(j) - 48)
          digits++
          j++
        }
        let minutes = 0
        if (digits === 4) {
          minutes = hours % 100
          hours = Math.floor(hours / 100)
        } else if (digits >= 1 && digits <= 2 && lower.charCodeAt(j) === 58) {
          const m1 = lower.charCodeAt(j + 1) - 48
          const m2 = lower.charCodeAt(j + 2) - 48
          if (m1 >= 0 && m1 <= 5 && m2 >= 0 && m2 <= 9) minutes = m1 * 10 + m2
        }
        if (digits > 0 && digits !== 3 && hours <= 14 && minutes < 60) {
          const value = (sign === 43 ? 1 : -1) * (hours + minutes / 60)
          return { kind: 'offset', hours: value, note: `the time header names UTC${formatOffset(value)}` }
        }
      }
      sawUtc = true
    } else if (word === 'z' || word === 'zulu') sawUtc = true
    else if (abbreviation === null && word in STANDARD_ZONE_ABBREVIATIONS) abbreviation = word
  }
  if (sawUtc) return { kind: 'utc' }
  if (abbreviation !== null) {
    const hours = STANDARD_ZONE_ABBREVIATIONS[abbreviation]
    return {
      kind: 'offset',
      hours,
      note: `the time header names ${abbreviation.toUpperCase()}, read as the fixed standard-time offset UTC${formatOffset(hours)} all year`,
    }
  }
  return { kind: 'none' }
}
