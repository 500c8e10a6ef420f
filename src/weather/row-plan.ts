/**
 * @module weather/row-plan
 * Where each row of a table stands in time, shared by every variable: whether the rows are readings
 * or weather reports (declared or detected), their usual spacing, the time each row is binned by
 * (reports aligned to the nearest hour and ranked routine before special), the hour its time stands
 * for under the file's labels, the span it represents, and rows that repeat an earlier row's time.
 * The hour grid spans the rows' hours.
 */
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.ts'
import type { IntervalLabel, RowSampling } from './raw-table.ts'
import { ReportKind } from './raw-table.ts'

/**
 * Reports up to this many minutes before or after an hour stand for that hour. A routine METAR is
 * observed in the last minutes before the hour it is scheduled for ("METAR KDCA 210855Z is the 0900
 * UTC scheduled report … taken at 0855 UTC", Federal Meteorological Handbook No. 1, Surface Weather
 * Observations and Reports, ch. 12, date and time of report; WMO practice enters the scheduled time
 * unless the actual time differs by more than 10 minutes, same place). The 15-minute window covers
 * the usual :45–:59 observing times. Section wording from a course page quoting FMH-1; window width
 * common practice, no source.
 */
export const REPORT_WINDOW_MINUTES = 15

/** The rows' times and how they become hours. */
export interface RowTimes {
  /** UTC instant of each row's time label [ms]; NaN for rows already rejected. */
  utcMs: Float64Array
  /** File-wide label convention (start or end of the interval the row's values describe). */
  labels: IntervalLabel
  /** Declared sampling, or undefined to detect. */
  sampling?: RowSampling
  /** Per-row report kind (routine, special), when the reader knows it. */
  reportKind?: Uint8Array
  /**
   * Hours [UTC ms of their starts] the grid must also hold: those that interval values reach beyond
   * the rows' own hours (rain over the hour before the first row's time).
   */
  extendToHoursMs?: [number, number]
}

/** How the rows were turned into hours, shared by every variable. */
export interface RowPlan {
  sampling: RowSampling
  /**
   * Readings exactly on the hour, in increasing time: one row per hour, nothing to combine. Variables
   * whose values are instants or cover one hour are then placed directly (the common hourly file).
   */
  hourly: boolean
  /** `hourly`, and row i is hour i for every row: a column of the rows is a column of the hours. */
  contiguous: boolean
  /** The file-wide label convention the rows' hours were found with. */
  labels: IntervalLabel
  /** Most common positive spacing of consecutive rows [min] (60 for hourly files). */
  stepMinutes: number
  /** Minute after the hour most reports carry (reports only), else null. */
  reportMinute: number | null
  /** UTC start of the first hour [ms]. */
  firstHourMs: number
  hours: number
  /** Per row: the time it is binned by (reports: aligned to the hour) [ms]; NaN when not placed. */
  timeMs: Float64Array
  /** Per row: the hour index its time stands for (instant rule with the file's labels), −1 when not placed. */
  rowHour: Int32Array
  /** Per row: the span of time it represents [ms] (the smaller spacing to its neighbours, at most 1 h); empty for `hourly` plans. */
  spanMs: Float64Array
  /** Per row: report rank, lower is better (routine 0, unknown 1, special 2), reports only. */
  rank?: Uint8Array
  /** Per row: how far the report was from the hour it was aligned to [ms], reports only. */
  offsetMs?: Float64Array
  /** Per row: 1 when the row duplicates the exact time of an earlier row (readings only; not placed). */
  duplicateOf: Int32Array
  /** Rows whose report time was moved to the nearest hour. */
  alignedReports: number
  /** Summary rows (daily or monthly summaries between the reports) left out. */
  summaryRows: number
}

/** The hour index an instant stands for: label start → the hour it begins; end → the hour it ends. */
export function instantHour(timeMs: number, firstHourMs: number, label: IntervalLabel): number {
  const h = label === 'end' ? Math.ceil(timeMs / MS_PER_HOUR) - 1 : Math.floor(timeMs / MS_PER_HOUR)
  return h - firstHourMs / MS_PER_HOUR
}

/**
 * Most common positive spacing between consecutive rows (file order) [min], 60 when none; and whether
 * the times increase and are all on the hour.
 */
function scanTimes(utcMs: Float64Array): { stepMinutes: number; increasing: boolean; onHour: boolean } {
  const small = new Int32Array(1441)
  let large: Map<number, number> | null = null
  let previous = Number.NaN
  let increasing = true
  let onHour = true
  for (let i = 0; i < utcMs.length; i++) {
    const t = utcMs[i]
    if (Number.isNaN(t)) continue
    if (t % MS_PER_HOUR !== 0) onHour = false
    if (!Number.isNaN(previous)) {
      if (t <= previous) increasing = false
      const d = Math.round((t - previous) / MS_PER_MINUTE)
      if (d > 0) {
        if (d <= 1440) small[d]++
        else {
          large ??= new Map()
          large.set(d, (large.get(d) ?? 0) + 1)
        }
      }
    }
    previous = t
  }
  let best = 60
  let count = 0
  for (let d = 1; d <= 1440; d++) {
    if (small[d] > count) {
      count = small[d]
      best = d
    }
  }
  if (large !== null)
    for (const [d, c] of large) {
      if (c > count) {
        count = c
        best = d
      }
    }
  return { stepMinutes: best, increasing, onHour }
}

/**
 * Whether rows look like weather reports: hourly spacing, most rows at one minute within
 * {@link REPORT_WINDOW_MINUTES} of the hour, and either that minute is not :00 or other rows fall
 * between (specials). Returns that minute, or null for readings.
 */
export function detectReportMinute(utcMs: Float64Array, stepMinutes: number): number | null {
  if (stepMinutes !== 60) return null
  const minutes = new Int32Array(60)
  let n = 0
  for (let i = 0; i < utcMs.length; i++) {
    const t = utcMs[i]
    if (Number.isNaN(t)) continue
    minutes[Math.floor((((t % MS_PER_HOUR) + MS_PER_HOUR) % MS_PER_HOUR) / MS_PER_MINUTE)]++
    n++
  }
  let top = 0
  for (let m = 1; m < 60; m++) if (minutes[m] > minutes[top]) top = m
  if (n === 0 || minutes[top] < 0.5 * n) return null
  const nearHour = top <= REPORT_WINDOW_MINUTES || top >= 60 - REPORT_WINDOW_MINUTES
  if (!nearHour) return null
  if (top === 0 && minutes[0] === n) return null
  return top
}

/**
 * Place the rows: sampling (declared or detected), spacing, the time each row is binned by, its
 * hour under the file's labels, the span it represents, exact duplicates (readings) and report
 * ranks (reports). The hour grid spans the rows' hours.
 */
export function planRows(times: RowTimes): RowPlan {
  const { labels } = times
  const n = times.utcMs.length
  const { utcMs, summaryRows } = withoutSummaryRows(times)
  // One pass: the spacing of the rows, whether they are in increasing time and all on the hour.
  const scan = scanTimes(utcMs)
  const stepMinutes = scan.stepMinutes
  const { sampling, reportMinute } = decideSampling(times.sampling, utcMs, scan)
  const reports = sampling === 'reports' ? alignReports(utcMs, times.reportKind, reportMinute) : null
  const timeMs = reports === null ? utcMs : reports.timeMs
  // Rows in strictly increasing time cannot repeat a time; rows also all on the hour are one per hour.
  const increasing = sampling === 'reports' ? false : scan.increasing
  const { firstHourMs, hours } = hourSpan(timeMs, labels, times.extendToHoursMs)
  const rowHour = new Int32Array(n).fill(-1)
  for (let i = 0; i < n; i++) {
    const t = timeMs[i]
    if (!Number.isNaN(t)) rowHour[i] = instantHour(t, firstHourMs, labels)
  }
  const duplicateOf =
    sampling === 'readings' && !increasing && hours > 0 && hours <= MAX_CHAIN_HOURS
      ? findDuplicates(timeMs, rowHour, hours)
      : new Int32Array(n).fill(-1)
  const hourly = sampling === 'readings' && increasing && scan.onHour
  // every row a reading of the next hour, none missing: a column of the rows is a column of the hours
  let contiguous = hourly && hours === n
  for (let i = 0; contiguous && i < n; i++) if (rowHour[i] !== i) contiguous = false
  const spanMs = hourly ? new Float64Array(0) : rowSpans(timeMs, duplicateOf, stepMinutes)
  return {
    sampling,
    hourly,
    contiguous,
    labels,
    stepMinutes,
    reportMinute,
    firstHourMs,
    hours,
    timeMs,
    rowHour,
    spanMs,
    rank: reports?.rank,
    offsetMs: reports?.offsetMs,
    duplicateOf,
    alignedReports: reports?.aligned ?? 0,
    summaryRows,
  }
}

/** The rows' times with summary rows (daily or monthly summaries among reports) set to NaN, and their count. */
function withoutSummaryRows(times: RowTimes): { utcMs: Float64Array; summaryRows: number } {
  if (times.reportKind === undefined) return { utcMs: times.utcMs, summaryRows: 0 }
  const utcMs = Float64Array.from(times.utcMs)
  let summaryRows = 0
  for (let i = 0; i < utcMs.length; i++) {
    if (times.reportKind[i] === ReportKind.summary) {
      utcMs[i] = Number.NaN
      summaryRows++
    }
  }
  return { utcMs, summaryRows }
}

/** Readings or reports: as declared, readings when every row is on the hour, else reports when they look like them. */
function decideSampling(
  declared: RowSampling | undefined,
  utcMs: Float64Array,
  scan: { stepMinutes: number; onHour: boolean },
): { sampling: RowSampling; reportMinute: number | null } {
  if (declared === 'reports') return { sampling: 'reports', reportMinute: detectReportMinute(utcMs, 60) }
  if (declared === 'readings' || scan.onHour) return { sampling: 'readings', reportMinute: null }
  const reportMinute = detectReportMinute(utcMs, scan.stepMinutes)
  return { sampling: reportMinute === null ? 'readings' : 'reports', reportMinute }
}

/**
 * Reports aligned to the nearest hour, with their distance from it and their rank: routine 0, unknown 1,
 * special 2 (without kinds from the reader, a report at the usual minute is routine and others special).
 */
function alignReports(
  utcMs: Float64Array,
  reportKind: Uint8Array | undefined,
  reportMinute: number | null,
): { timeMs: Float64Array; rank: Uint8Array; offsetMs: Float64Array; aligned: number } {
  const n = utcMs.length
  const timeMs = new Float64Array(n)
  const rank = new Uint8Array(n)
  const offsetMs = new Float64Array(n)
  let aligned = 0
  for (let i = 0; i < n; i++) {
    const t = utcMs[i]
    const hour = Math.round(t / MS_PER_HOUR) * MS_PER_HOUR
    timeMs[i] = hour
    offsetMs[i] = Math.abs(t - hour)
    if (hour !== t && !Number.isNaN(t)) aligned++
    const kind = reportKind?.[i] ?? ReportKind.unknown
    if (kind === ReportKind.routine) rank[i] = 0
    else if (kind === ReportKind.special) rank[i] = 2
    else if (reportKind === undefined && reportMinute !== null) rank[i] = minuteOf(t) === reportMinute ? 0 : 2
    else rank[i] = 1
  }
  return { timeMs, rank, offsetMs, aligned }
}

/** The grid: UTC start of the first hour the rows' times stand for [ms] (NaN when none) and the hours to the last. */
function hourSpan(
  timeMs: Float64Array,
  labels: IntervalLabel,
  extendToHoursMs: [number, number] | undefined,
): { firstHourMs: number; hours: number } {
  let firstHour = Number.POSITIVE_INFINITY
  let lastHour = Number.NEGATIVE_INFINITY
  for (let i = 0; i < timeMs.length; i++) {
    const t = timeMs[i]
    if (Number.isNaN(t)) continue
    const h = instantHour(t, 0, labels)
    if (h < firstHour) firstHour = h
    if (h > lastHour) lastHour = h
  }
  if (extendToHoursMs !== undefined && Number.isFinite(firstHour)) {
    firstHour = Math.min(firstHour, Math.floor(extendToHoursMs[0] / MS_PER_HOUR))
    lastHour = Math.max(lastHour, Math.floor(extendToHoursMs[1] / MS_PER_HOUR))
  }
  if (!Number.isFinite(firstHour)) return { firstHourMs: Number.NaN, hours: 0 }
  return { firstHourMs: firstHour * MS_PER_HOUR, hours: lastHour - firstHour + 1 }
}

/**
 * Exact duplicates (readings): rows with the same instant as an earlier row, found through a per-hour
 * chain of rows (a handful per hour even for minute data). Per row the earlier row it repeats, else −1.
 */
function findDuplicates(timeMs: Float64Array, rowHour: Int32Array, hours: number): Int32Array {
  const n = timeMs.length
  const duplicateOf = new Int32Array(n).fill(-1)
  const head = new Int32Array(hours).fill(-1)
  const next = new Int32Array(n).fill(-1)
  for (let i = 0; i < n; i++) {
    const h = rowHour[i]
    if (h < 0) continue
    let k = head[h]
    let previous = -1
    while (k >= 0 && timeMs[k] !== timeMs[i]) {
      previous = k
      k = next[k]
    }
    if (k >= 0) {
      duplicateOf[i] = k
      continue
    }
    if (previous < 0) head[h] = i
    else next[previous] = i
  }
  return duplicateOf
}

/** Hours beyond which the duplicate chain is not built (the caller refuses such spans anyway). */
const MAX_CHAIN_HOURS = 100 * 8784 + 48

function minuteOf(t: number): number {
  return Math.floor((((t % MS_PER_HOUR) + MS_PER_HOUR) % MS_PER_HOUR) / MS_PER_MINUTE)
}

/**
 * The span each row represents: the smaller positive spacing to its previous and next placed rows
 * (file order), at most one hour. A spacing below an hour that is a whole multiple of the file's step
 * means readings are missing in between, so the row spans one step; a spacing of an hour or more is
 * another regime (an hourly part of a file that later logs every 10 minutes) and is kept. A row with
 * no neighbour takes the file's step.
 */
function rowSpans(timeMs: Float64Array, duplicateOf: Int32Array, stepMinutes: number): Float64Array {
  const n = timeMs.length
  const span = new Float64Array(n)
  const stepMs = stepMinutes * MS_PER_MINUTE
  const fallback = Math.min(stepMs, MS_PER_HOUR)
  let previous = -1
  const gapBefore = new Float64Array(n).fill(Number.POSITIVE_INFINITY)
  const gapAfter = new Float64Array(n).fill(Number.POSITIVE_INFINITY)
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(timeMs[i]) || duplicateOf[i] >= 0) continue
    if (previous >= 0) {
      const d = timeMs[i] - timeMs[previous]
      if (d > 0) {
        gapBefore[i] = d
        gapAfter[previous] = d
      }
    }
    previous = i
  }
  for (let i = 0; i < n; i++) {
    let d = Math.min(gapBefore[i], gapAfter[i])
    if (!Number.isFinite(d)) {
      span[i] = fallback
      continue
    }
    const k = d / stepMs
    if (d < MS_PER_HOUR && k > 1 && Math.abs(k - Math.round(k)) < 1e-9) d = stepMs
    span[i] = Math.min(d, MS_PER_HOUR)
  }
  return span
}

/**
 * The first and last hour starts [ms] an interval value reaches, over rows with a time: for a label
 * at the end, the interval before the time; at the start, the interval after it. Null when none.
 */
export function intervalReach(
  plan: RowPlan,
  label: IntervalLabel,
  intervalMinutes: number,
): [number, number] | null {
  let lo = Number.POSITIVE_INFINITY
  let hi = Number.NEGATIVE_INFINITY
  for (let i = 0; i < plan.timeMs.length; i++) {
    const t = plan.timeMs[i]
    if (Number.isNaN(t)) continue
    if (t < lo) lo = t
    if (t > hi) hi = t
  }
  if (!Number.isFinite(lo)) return null
  const length = Math.min(intervalMinutes, 60) * MS_PER_MINUTE
  const a = label === 'end' ? lo - length : lo
  const b = label === 'end' ? hi - 1 : hi + length - 1
  return [Math.floor(a / MS_PER_HOUR) * MS_PER_HOUR, Math.floor(b / MS_PER_HOUR) * MS_PER_HOUR]
}
