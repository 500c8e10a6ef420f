/**
 * @module weather/time-zone
 * Local wall-clock time to UTC for an IANA zone through `Intl` (Node and Workers), with the
 * daylight-saving spring gap (a local hour that does not exist) and autumn overlap (a local hour
 * that happens twice) made explicit. Offsets are sampled once per week over the file's span, daily in a week
 * that changed, and the transitions located to the minute ({@link zoneOffsets}).
 */
import { MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.ts'

/** A formatter of the zone's wall clock to the minute (24-hour clock). */
function wallClockFormat(zone: string): Intl.DateTimeFormat {
  return new Intl.DateTimeFormat('en-US', {
    timeZone: zone,
    hourCycle: 'h23',
    year: 'numeric',
    month: 'numeric',
    day: 'numeric',
    hour: 'numeric',
    minute: 'numeric',
  })
}

/** The five numbers of the last {@link wallClockNumbers} call: month, day, year, hour, minute. */
const wallNumbers = new Float64Array(5)

/**
 * The digit runs of an en-US wall clock ("9/9/2001, 14:46") into {@link wallNumbers}, in one pass over the
 * characters; false unless there are exactly five.
 */
function wallClockNumbers(text: string): boolean {
  let count = 0
  let value = -1
  for (let i = 0; i <= text.length; i++) {
    const code = i < text.length ? text.charCodeAt(i) : -1
    if (code >= 48 && code <= 57) value = (value < 0 ? 0 : value * 10) + (code - 48)
    else if (value >= 0) {
      if (count === 5) return false
      wallNumbers[count++] = value
      value = -1
    }
  }
  return count === 5
}

/**
 * Offset of the zone from UTC [ms] at a UTC instant, from Intl's formatted wall clock: the formatted string
 * read directly (about three times faster than `formatToParts`, measured on this project's machine), the
 * parts when the string does not have the expected five numbers.
 */
function intlOffsetMs(format: Intl.DateTimeFormat, utcMs: number): number {
  let y = 0
  let mo = 0
  let d = 0
  let h = 0
  let mi = 0
  if (wallClockNumbers(format.format(utcMs))) {
    mo = wallNumbers[0]
    d = wallNumbers[1]
    y = wallNumbers[2]
    h = wallNumbers[3] % 24
    mi = wallNumbers[4]
  } else {
    for (const p of format.formatToParts(utcMs)) {
      if (p.type === 'year') y = Number(p.value)
      else if (p.type === 'month') mo = Number(p.value)
      else if (p.type === 'day') d = Number(p.value)
      else if (p.type === 'hour') h = Number(p.value) % 24
      else if (p.type === 'minute') mi = Number(p.value)
    }
  }
  const wall = Date.UTC(y, mo - 1, d, h, mi)
  return wall - Math.floor(utcMs / MS_PER_MINUTE) * MS_PER_MINUTE
}

/** A zone's offsets over a span: `offsetMs[k]` applies from `fromUtcMs[k]` on. */
export interface ZoneOffsets {
  zone: string
  fromUtcMs: number[]
  offsetMs: number[]
}

/** Days between the offsets sampled first (the offsets in a week that changed are then sampled every day). */
const SAMPLE_EVERY_DAYS = 7

/**
 * Offsets of `zone` between two UTC instants (two days of margin are added each side). The offset is read
 * every {@link SAMPLE_EVERY_DAYS} days; in a week where it differs from the week before, every day of that
 * week is read and each change located to the minute by bisection. Assumed: no zone changes its offset and
 * changes it back within one week (none of the tz database's rules since 1970 does; a pair of daily changes
 * inside a changed week is still found). About 1,600 + 24 per transition `Intl` calls for 30 years
 * instead of 11,000 (the daily sampling this replaced took ~25 ms per 30-year assessment here).
 */
export function zoneOffsets(zone: string, startUtcMs: number, endUtcMs: number): ZoneOffsets {
  const format = wallClockFormat(zone)
  const start = Math.floor(startUtcMs / MS_PER_DAY) * MS_PER_DAY - 2 * MS_PER_DAY
  const end = endUtcMs + 2 * MS_PER_DAY
  const fromUtcMs = [Number.NEGATIVE_INFINITY]
  const offsetMs = [intlOffsetMs(format, start)]
  let previous = offsetMs[0]
  let previousT = start
  const week = SAMPLE_EVERY_DAYS * MS_PER_DAY
  for (let t = start + week; previousT < end; t += week) {
    const tw = Math.min(t, end)
    if (intlOffsetMs(format, tw) !== previous) {
      // every day of the week that changed, each change to the minute
      let d = previousT
      while (d < tw) {
        const next = Math.min(d + MS_PER_DAY, tw)
        const o = intlOffsetMs(format, next)
        if (o !== previous) {
          fromUtcMs.push(changeInstant(format, previous, d, next))
          offsetMs.push(o)
          previous = o
        }
        d = next
      }
    }
    previousT = tw
  }
  return { zone, fromUtcMs, offsetMs }
}

/** The first minute in (lo, hi] at which the zone's offset is no longer `before` (it is `before` at lo). */
function changeInstant(format: Intl.DateTimeFormat, before: number, loMs: number, hiMs: number): number {
  let lo = loMs
  let hi = hiMs
  while (hi - lo > MS_PER_MINUTE) {
    const mid = lo + Math.floor((hi - lo) / 2 / MS_PER_MINUTE) * MS_PER_MINUTE
    if (intlOffsetMs(format, mid) === before) lo = mid
    else hi = mid
  }
  return hi
}

/** The offset [ms] in force at a UTC instant. */
export function offsetAtUtc(z: ZoneOffsets, utcMs: number): number {
  let lo = 0
  let hi = z.fromUtcMs.length - 1
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if (z.fromUtcMs[mid] <= utcMs) lo = mid
    else hi = mid - 1
  }
  return z.offsetMs[lo]
}

/**
 * The UTC instants [ms] at which the zone's clocks show `wallMs` (local time read as if UTC):
 * one in ordinary hours, none in a spring-forward gap, two (earlier first) in an autumn overlap.
 */
export function utcCandidates(z: ZoneOffsets, wallMs: number): number[] {
  const seen = new Set<number>()
  const out: number[] = []
  const near = [
    offsetAtUtc(z, wallMs - 14 * MS_PER_HOUR),
    offsetAtUtc(z, wallMs),
    offsetAtUtc(z, wallMs + 14 * MS_PER_HOUR),
  ]
  for (const o of near) {
    if (seen.has(o)) continue
    seen.add(o)
    const utc = wallMs - o
    if (offsetAtUtc(z, utc) === o) out.push(utc)
  }
  return out.sort((a, b) => a - b)
}

/**
 * Standard-time offset of an IANA zone [h] near `utcMs`: the smaller of its offsets at noon UTC on
 * 1 January and 1 July of that year (daylight saving only ever adds), read from `Intl`.
 */
export function zoneStandardOffsetHours(zone: string, utcMs: number): number {
  const year = new Date(utcMs).getUTCFullYear()
  const format = wallClockFormat(zone)
  return (
    Math.min(intlOffsetMs(format, Date.UTC(year, 0, 1, 12)), intlOffsetMs(format, Date.UTC(year, 6, 1, 12))) /
    MS_PER_HOUR
  )
}
