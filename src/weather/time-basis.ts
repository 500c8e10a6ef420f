/**
 * @module weather/time-basis
 * Row timestamps to UTC hour starts: date order, typical-year recognition (months from different
 * years mapped onto one nominal year, leap day kept), hour-ending labels (EPW, and CSV files that
 * run 01:00–24:00), offsets written in the text, a fixed offset, or an IANA zone with daylight
 * saving (spring gap and autumn doubled hour reported).
 */

import { MS_PER_HOUR } from '../physics/constants.ts'
import type { ProblemLog } from './problem-log.ts'
import type { IntervalLabel } from './raw-table.ts'
import { offsetAtUtc, utcCandidates, zoneOffsets } from './time-zone.ts'
import { type DateOrder, detectDateOrder, type TimestampColumns, wallClockMs } from './timestamp-columns.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** Nominal year of a typical-year file without 29 February (any common year would do). */
export const NOMINAL_COMMON_YEAR = 2001
/** Nominal year of a typical-year file that contains 29 February (a leap year, so the day is kept). */
export const NOMINAL_LEAP_YEAR = 2000

export interface TimeBasisInput {
  declaredOrder?: DateOrder
  /** Label convention: declared (option, or the format), or null to detect (hour 24 present → end). */
  labels: IntervalLabel | null
  fixedOffsetHours: number | null
  zone: string | null
  /** The header says the times are UTC. */
  headerSaysUtc: boolean
}

export interface DstEvent {
  kind: 'spring-gap' | 'autumn-overlap'
  /** UTC instant of the change, ISO. */
  atUtc: string
  /** Rows whose local time fell in the missing (spring) or doubled (autumn) hour. */
  rows: number
}

export interface ResolvedTimes {
  /** UTC instant of each row's time label [ms]; NaN when the row is rejected. Hours are made from these in `hourly-aggregate.ts`. */
  rowUtcMs: Float64Array
  typicalYear: boolean
  /** Distinct source years of a typical-year file (sorted), else []. */
  sourceYears: number[]
  labels: IntervalLabel
  /** How local times became UTC, in words. */
  description: string
  dstEvents: DstEvent[]
  warnings: string[]
  /** Standard-time offset of the zone over the span (its smallest offset) [h], when a zone was used. */
  zoneStandardOffsetHours: number | null
  /** The clock the timestamps are written in: UTC, a fixed offset, or a zone. */
  basis: TimestampBasis
}

/** The clock of a file's timestamps (not necessarily the site's). */
export type TimestampBasis =
  | { kind: 'utc' }
  | { kind: 'offset'; offsetHours: number }
  | { kind: 'zone'; zone: string }

/** Years a timestamp may carry; the same range as {@link wallClockMs} (common practice, no source). */
const FIRST_YEAR = 1800
const LAST_YEAR = 2200

/**
 * Hours a typical year must hold to be taken as one: 90 % of 8760. Typical-year files (e.g. TMY3,
 * Wilcox & Marion 2008, NREL/TP-581-43156, from memory) are one complete year of 8760 hours with each
 * calendar month taken whole from one source year; the 10 % margin for missing rows is common
 * practice, no source.
 */
const TYPICAL_YEAR_MIN_HOURS = 7884
/** At most a leap year plus two days of rows (sub-hourly files are never typical years). */
const TYPICAL_YEAR_MAX_HOURS = 8784 + 48

/**
 * A typical (synthetic) year: rows in calendar order, all twelve months present, each month from a
 * single year, at least two source years, and about one year of hours. Rows flagged in `skip` (years
 * outside the accepted range) are left out.
 */
function detectTypicalYear(
  ts: TimestampColumns,
  order: 'mdy' | 'dmy',
  skip: Uint8Array,
): { typical: boolean; years: number[]; leap: boolean } {
  const years = new Set<number>()
  const yearOfMonth = new Float64Array(13).fill(Number.NaN)
  let previousKey = -1
  let monotonic = true
  let monthsFromOneYear = true
  let leap = false
  let valid = 0
  for (let i = 0; i < ts.year.length; i++) {
    if (skip[i] === 1 || Number.isNaN(ts.year[i]) || Number.isNaN(ts.minuteOfDay[i])) continue
    valid++
    const year = ts.year[i]
    years.add(year)
    // month and day under the date order, without a tuple per row (a 30-year file has 263,000 rows)
    const monthFirst = ts.yearFirst[i] === 1 || order === 'mdy'
    const month = monthFirst ? ts.first[i] : ts.second[i]
    const day = monthFirst ? ts.second[i] : ts.first[i]
    if (month >= 1 && month <= 12) {
      if (Number.isNaN(yearOfMonth[month])) yearOfMonth[month] = year
      else if (yearOfMonth[month] !== year) monthsFromOneYear = false
    }
    if (month === 2 && day === 29) leap = true
    const key = (month * 32 + day) * 1441 + ts.minuteOfDay[i]
    if (key < previousKey) monotonic = false
    previousKey = key
  }
  let months = 0
  for (let m = 1; m <= 12; m++) if (!Number.isNaN(yearOfMonth[m])) months++
  const typical =
    years.size > 1 &&
    monotonic &&
    monthsFromOneYear &&
    months === 12 &&
    valid >= TYPICAL_YEAR_MIN_HOURS &&
    valid <= TYPICAL_YEAR_MAX_HOURS
  return { typical, years: [...years].sort((a, b) => a - b), leap }
}

/**
 * Flag rows whose year lies outside {@link FIRST_YEAR}–{@link LAST_YEAR} and report each with its
 * line, so that one stray row cannot change how the others are read.
 */
function rejectOutOfRangeYears(ts: TimestampColumns, lines: Int32Array, log: ProblemLog): Uint8Array {
  const skip = new Uint8Array(ts.year.length)
  for (let i = 0; i < ts.year.length; i++) {
    const year = ts.year[i]
    if (Number.isNaN(year) || Number.isNaN(ts.minuteOfDay[i])) continue
    if (year >= FIRST_YEAR && year <= LAST_YEAR) continue
    skip[i] = 1
    log.add(
      lines[i],
      null,
      'bad-timestamp',
      `year ${year} is outside the accepted ${FIRST_YEAR}–${LAST_YEAR}: row rejected`,
    )
  }
  return skip
}

export function resolveRowTimes(
  ts: TimestampColumns,
  lines: Int32Array,
  input: TimeBasisInput,
  log: ProblemLog,
): ResolvedTimes {
  const n = ts.year.length
  const warnings: string[] = []
  let order: 'mdy' | 'dmy' = 'mdy'
  let detected: DateOrder | 'ambiguous' | null
  try {
    detected = detectDateOrder(ts)
  } catch (e) {
    throw new WeatherInputError(`${(e as Error).message}; give the date order (--date-order mdy or dmy)`, [
      'date order',
    ])
  }
  if (input.declaredOrder === 'dmy' || input.declaredOrder === 'mdy') order = input.declaredOrder
  else if (detected === 'ambiguous') {
    throw new WeatherInputError(
      'dates like 03/04/2020 could be month/day or day/month and no date has a number above 12 to tell: ' +
        'give the date order (--date-order mdy or --date-order dmy, or dateOrder in the options)',
      ['date order'],
    )
  } else if (detected === 'dmy' || detected === 'mdy') order = detected
  if (
    detected !== null &&
    detected !== 'ambiguous' &&
    input.declaredOrder &&
    input.declaredOrder !== 'ymd' &&
    detected !== input.declaredOrder
  ) {
    warnings.push(
      `dates were declared ${input.declaredOrder} but some only fit ${detected}; those rows are rejected`,
    )
  }

  const skip = rejectOutOfRangeYears(ts, lines, log)
  const { typical, years, leap } = detectTypicalYear(ts, order, skip)
  const nominal = leap ? NOMINAL_LEAP_YEAR : NOMINAL_COMMON_YEAR
  if (typical) {
    warnings.push(
      `typical year: months come from ${years.length} different years (${years.join(', ')}); ` +
        `placed on the nominal year ${nominal}${leap ? ' (a leap year, as the file has 29 February)' : ''}`,
    )
  }

  let labels: IntervalLabel = 'start'
  if (input.labels) labels = input.labels
  else {
    let has24 = false
    let has0 = false
    for (let i = 0; i < n; i++) {
      if (ts.minuteOfDay[i] === 1440) has24 = true
      else if (ts.minuteOfDay[i] === 0) has0 = true
    }
    if (has24 && !has0) {
      labels = 'end'
      warnings.push('hours run 01:00–24:00: read as hour-ending labels (01:00 = the hour 00:00–01:00)')
    }
  }

  const wall = new Float64Array(n)
  let anyOffsetInText = false
  let anyWithoutOffset = false
  let nonZeroTextOffset = Number.NaN
  let minWall = Number.POSITIVE_INFINITY
  let maxWall = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    const year = typical ? nominal : ts.year[i]
    const w = skip[i] === 1 || Number.isNaN(ts.minuteOfDay[i]) ? Number.NaN : wallClockMs(ts, i, order, year)
    wall[i] = w
    if (Number.isNaN(w)) continue
    if (w < minWall) minWall = w
    if (w > maxWall) maxWall = w
    if (Number.isNaN(ts.offsetMin[i])) anyWithoutOffset = true
    else {
      anyOffsetInText = true
      if (ts.offsetMin[i] !== 0 && Number.isNaN(nonZeroTextOffset)) nonZeroTextOffset = ts.offsetMin[i] / 60
    }
  }

  let fixedOffsetMs: number | null =
    input.fixedOffsetHours === null ? null : input.fixedOffsetHours * MS_PER_HOUR
  let description = 'offsets written in each timestamp'
  let basis: TimestampBasis = { kind: 'utc' }
  if (anyOffsetInText && !anyWithoutOffset) {
    if (!Number.isNaN(nonZeroTextOffset)) basis = { kind: 'offset', offsetHours: nonZeroTextOffset }
  } else if (fixedOffsetMs !== null) {
    if (input.fixedOffsetHours !== 0) basis = { kind: 'offset', offsetHours: input.fixedOffsetHours! }
  } else if (input.zone !== null) basis = { kind: 'zone', zone: input.zone }
  if (anyOffsetInText && !anyWithoutOffset) {
    // offsets in the text
  } else if (fixedOffsetMs !== null)
    description =
      input.fixedOffsetHours === 0
        ? 'UTC'
        : `local standard time, UTC${formatOffset(input.fixedOffsetHours!)} (no daylight saving)`
  else if (input.zone !== null)
    description = `local time in ${input.zone} (daylight saving applied by the zone's rules)`
  else if (input.headerSaysUtc) {
    fixedOffsetMs = 0
    description = 'UTC (the header says so)'
  } else if (anyWithoutOffset) {
    throw new WeatherInputError(
      "the timestamps carry no UTC offset and none was given: say how the file's clock relates to UTC with " +
        '--utc-offset <hours> (standard time, e.g. -8) or --tz <IANA zone> (e.g. America/Los_Angeles, when the ' +
        'file follows daylight saving); use --utc-offset 0 for UTC',
      ['time zone'],
    )
  } else description = 'no valid timestamps'
  if (anyOffsetInText && anyWithoutOffset) warnings.push('some timestamps carry an offset and some do not')
  if (anyOffsetInText && (fixedOffsetMs !== null || input.zone !== null)) {
    warnings.push('timestamps with a written offset use it; the given offset or zone applies to the others')
  }

  const zone =
    input.zone !== null && fixedOffsetMs === null && Number.isFinite(minWall)
      ? zoneOffsets(input.zone, minWall - 14 * MS_PER_HOUR, maxWall + 14 * MS_PER_HOUR)
      : null
  const out = new Float64Array(n).fill(Number.NaN)
  let lastUtc = Number.NEGATIVE_INFINITY
  const gapRows = new Map<number, number>()
  const overlapRows = new Map<number, number>()
  for (let i = 0; i < n; i++) {
    const w = wall[i]
    if (Number.isNaN(w)) {
      if (skip[i] === 0 && !Number.isNaN(ts.minuteOfDay[i]))
        log.add(
          lines[i],
          null,
          'bad-timestamp',
          'not a calendar date (day beyond the month, or year outside 1800–2200)',
        )
      continue
    }
    let utc: number
    if (!Number.isNaN(ts.offsetMin[i])) utc = w - ts.offsetMin[i] * 60_000
    else if (fixedOffsetMs !== null) utc = w - fixedOffsetMs
    else if (zone !== null) {
      const c = utcCandidates(zone, w)
      if (c.length === 0) {
        const at = transitionNear(zone.fromUtcMs, w - offsetAtUtc(zone, w))
        gapRows.set(at, (gapRows.get(at) ?? 0) + 1)
        log.add(
          lines[i],
          null,
          'dst-gap',
          `local time ${isoWall(w)} does not exist in ${zone.zone} (clocks went forward): row rejected`,
        )
        continue
      }
      if (c.length === 2) {
        const at = transitionNear(zone.fromUtcMs, c[1])
        overlapRows.set(at, (overlapRows.get(at) ?? 0) + 1)
        utc = lastUtc >= c[0] ? c[1] : c[0]
        if (utc === c[1]) {
          log.add(
            lines[i],
            null,
            'dst-doubled-hour',
            `local time ${isoWall(w)} happens twice in ${zone.zone}; this row is read as the second (standard time)`,
          )
        }
      } else utc = c[0]
    } else continue
    out[i] = utc
    lastUtc = utc
  }
  const dstEvents: DstEvent[] = []
  if (zone !== null) {
    for (let k = 1; k < zone.fromUtcMs.length; k++) {
      const at = zone.fromUtcMs[k]
      if (at < minWall - 14 * MS_PER_HOUR || at > maxWall + 14 * MS_PER_HOUR) continue
      const forward = zone.offsetMs[k] > zone.offsetMs[k - 1]
      dstEvents.push({
        kind: forward ? 'spring-gap' : 'autumn-overlap',
        atUtc: new Date(at).toISOString(),
        rows: (forward ? gapRows.get(at) : overlapRows.get(at)) ?? 0,
      })
    }
  }
  return {
    rowUtcMs: out,
    typicalYear: typical,
    sourceYears: typical ? years : [],
    labels,
    description: `${description}; timestamps label the ${labels} of the interval each row describes`,
    dstEvents,
    warnings,
    zoneStandardOffsetHours: zone === null ? null : Math.min(...zone.offsetMs) / MS_PER_HOUR,
    basis,
  }
}

function transitionNear(fromUtcMs: number[], utc: number): number {
  let best = fromUtcMs[1] ?? 0
  for (const t of fromUtcMs) if (Math.abs(t - utc) < Math.abs(best - utc)) best = t
  return best
}

function isoWall(wallMs: number): string {
  return new Date(wallMs).toISOString().slice(0, 16).replace('T', ' ')
}

export function formatOffset(hours: number): string {
  const sign = hours < 0 ? '−' : '+'
  const abs = Math.abs(hours)
  const h = Math.floor(abs)
  const m = Math.round((abs - h) * 60)
  return `${sign}${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`
}
