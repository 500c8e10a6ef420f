/**
 * @module weather/time-basis
 * Row timestamps to UTC hour starts: date order, typical years (typical-year.ts: months from different
 * years mapped onto one nominal year, leap day kept), hour-ending labels (EPW, and CSV files that
 * run 01:00–24:00), offsets written in the text, a fixed offset, or an IANA zone with daylight
 * saving (spring gap and autumn doubled hour reported).
 */

import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.ts'
import type { ProblemLog } from './problem-log.ts'
import type { IntervalLabel } from './raw-table.ts'
import { offsetAtUtc, utcCandidates, type ZoneOffsets, zoneOffsets } from './time-zone.ts'
import { type DateOrder, detectDateOrder, type TimestampColumns, wallClockMs } from './timestamp-columns.ts'
import { detectTypicalYear, NOMINAL_COMMON_YEAR, NOMINAL_LEAP_YEAR } from './typical-year.ts'
import { WeatherInputError } from './weather-input-error.ts'

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
  const warnings: string[] = []
  const order = dateOrder(ts, input.declaredOrder, warnings)
  const skip = rejectOutOfRangeYears(ts, lines, log)
  const { typical, years, leap } = detectTypicalYear(ts, order, skip)
  const nominal = leap ? NOMINAL_LEAP_YEAR : NOMINAL_COMMON_YEAR
  if (typical) {
    warnings.push(
      `typical year: months come from ${years.length} different years (${years.join(', ')}); ` +
        `placed on the nominal year ${nominal}${leap ? ' (a leap year, as the file has 29 February)' : ''}`,
    )
  }
  const labels = input.labels ?? detectLabels(ts, warnings)
  const wall = wallClock(ts, order, typical ? nominal : null, skip)
  const clock = clockOfTimestamps(input, wall, warnings)
  const zone =
    input.zone !== null && clock.fixedOffsetMs === null && Number.isFinite(wall.minMs)
      ? zoneOffsets(input.zone, wall.minMs - 14 * MS_PER_HOUR, wall.maxMs + 14 * MS_PER_HOUR)
      : null
  const utc = toUtc(ts, wall.ms, skip, clock.fixedOffsetMs, zone, lines, log)
  return {
    rowUtcMs: utc.rowUtcMs,
    typicalYear: typical,
    sourceYears: typical ? years : [],
    labels,
    description: `${clock.description}; timestamps label the ${labels} of the interval each row describes`,
    dstEvents: zone === null ? [] : dstEvents(zone, wall, utc),
    warnings,
    zoneStandardOffsetHours: zone === null ? null : Math.min(...zone.offsetMs) / MS_PER_HOUR,
    basis: clock.basis,
  }
}

/**
 * The order of slash dates with the year last: as declared, else detected (month/day unless some
 * first number exceeds 12); dates that fit neither order, or both with nothing to tell, are an error.
 */
function dateOrder(ts: TimestampColumns, declared: DateOrder | undefined, warnings: string[]): 'mdy' | 'dmy' {
  let order: 'mdy' | 'dmy' = 'mdy'
  let detected: DateOrder | 'ambiguous' | null
  try {
    detected = detectDateOrder(ts)
  } catch (e) {
    throw new WeatherInputError(`${(e as Error).message}; give the date order (--date-order mdy or dmy)`, [
      'date order',
    ])
  }
  if (declared === 'dmy' || declared === 'mdy') order = declared
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
    declared &&
    declared !== 'ymd' &&
    detected !== declared
  ) {
    warnings.push(`dates were declared ${declared} but some only fit ${detected}; those rows are rejected`)
  }
  return order
}

/** Labels when nobody declared them: hour-ending when the hours run 01:00–24:00 (no 00:00), else start. */
function detectLabels(ts: TimestampColumns, warnings: string[]): IntervalLabel {
  let has24 = false
  let has0 = false
  for (let i = 0; i < ts.minuteOfDay.length; i++) {
    if (ts.minuteOfDay[i] === 1440) has24 = true
    else if (ts.minuteOfDay[i] === 0) has0 = true
  }
  if (!has24 || has0) return 'start'
  warnings.push('hours run 01:00–24:00: read as hour-ending labels (01:00 = the hour 00:00–01:00)')
  return 'end'
}

/** Every row's wall-clock time [ms, local time read as UTC] and what the offsets written in the text say. */
interface WallClock {
  /** NaN for rows rejected or not calendar dates. */
  ms: Float64Array
  minMs: number
  maxMs: number
  anyOffsetInText: boolean
  anyWithoutOffset: boolean
  /** The first non-zero offset written in the text [h], NaN when none. */
  nonZeroTextOffsetHours: number
}

/** Wall-clock times under the date order, on the nominal year for a typical year (`year` not null). */
function wallClock(
  ts: TimestampColumns,
  order: 'mdy' | 'dmy',
  nominalYear: number | null,
  skip: Uint8Array,
): WallClock {
  const n = ts.year.length
  const ms = new Float64Array(n)
  let anyOffsetInText = false
  let anyWithoutOffset = false
  let nonZeroTextOffsetHours = Number.NaN
  let minMs = Number.POSITIVE_INFINITY
  let maxMs = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    const year = nominalYear ?? ts.year[i]
    const w = skip[i] === 1 || Number.isNaN(ts.minuteOfDay[i]) ? Number.NaN : wallClockMs(ts, i, order, year)
    ms[i] = w
    if (Number.isNaN(w)) continue
    if (w < minMs) minMs = w
    if (w > maxMs) maxMs = w
    if (Number.isNaN(ts.offsetMin[i])) anyWithoutOffset = true
    else {
      anyOffsetInText = true
      if (ts.offsetMin[i] !== 0 && Number.isNaN(nonZeroTextOffsetHours))
        nonZeroTextOffsetHours = ts.offsetMin[i] / 60
    }
  }
  return { ms, minMs, maxMs, anyOffsetInText, anyWithoutOffset, nonZeroTextOffsetHours }
}

/**
 * The clock the timestamps are written in: offsets in the text, a fixed offset, a zone, UTC because
 * the header says so; none of them for stamps without an offset is an error naming the options.
 */
function clockOfTimestamps(
  input: TimeBasisInput,
  wall: WallClock,
  warnings: string[],
): { fixedOffsetMs: number | null; description: string; basis: TimestampBasis } {
  const { anyOffsetInText, anyWithoutOffset } = wall
  let fixedOffsetMs: number | null =
    input.fixedOffsetHours === null ? null : input.fixedOffsetHours * MS_PER_HOUR
  let description = 'offsets written in each timestamp'
  let basis: TimestampBasis = { kind: 'utc' }
  if (anyOffsetInText && !anyWithoutOffset) {
    if (!Number.isNaN(wall.nonZeroTextOffsetHours))
      basis = { kind: 'offset', offsetHours: wall.nonZeroTextOffsetHours }
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
  return { fixedOffsetMs, description, basis }
}

/** Rows' UTC instants, and per daylight-saving transition the rows that fell in its gap or overlap. */
interface UtcRows {
  rowUtcMs: Float64Array
  gapRows: Map<number, number>
  overlapRows: Map<number, number>
}

/**
 * Wall-clock times to UTC: the offset written in the row, else the fixed offset, else the zone (a
 * local time in the spring gap is rejected; one in the autumn overlap is the first occurrence unless
 * an earlier row already passed it). Each rejected or doubled row is logged with its line.
 */
function toUtc(
  ts: TimestampColumns,
  wall: Float64Array,
  skip: Uint8Array,
  fixedOffsetMs: number | null,
  zone: ZoneOffsets | null,
  lines: Int32Array,
  log: ProblemLog,
): UtcRows {
  const n = wall.length
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
    if (!Number.isNaN(ts.offsetMin[i])) utc = w - ts.offsetMin[i] * MS_PER_MINUTE
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
  return { rowUtcMs: out, gapRows, overlapRows }
}

/** The zone's transitions within the file's span (14 h of margin), with the rows each affected. */
function dstEvents(zone: ZoneOffsets, wall: WallClock, utc: UtcRows): DstEvent[] {
  const events: DstEvent[] = []
  for (let k = 1; k < zone.fromUtcMs.length; k++) {
    const at = zone.fromUtcMs[k]
    if (at < wall.minMs - 14 * MS_PER_HOUR || at > wall.maxMs + 14 * MS_PER_HOUR) continue
    const forward = zone.offsetMs[k] > zone.offsetMs[k - 1]
    events.push({
      kind: forward ? 'spring-gap' : 'autumn-overlap',
      atUtc: new Date(at).toISOString(),
      rows: (forward ? utc.gapRows.get(at) : utc.overlapRows.get(at)) ?? 0,
    })
  }
  return events
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
