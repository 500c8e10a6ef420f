/**
 * @module weather/hourly-aggregate
 * Rows to hours, per variable. Readings (hourly or sub-hourly) are binned by what each value is:
 * an instant goes to the hour its time stands for (label start: the hour it begins; label end: the
 * hour it ends); an interval mean or total to the hours its interval overlaps, in proportion to the
 * overlap. Instants and means are averaged, totals summed; an hour is kept only when enough of it is
 * covered ({@link MIN_MEAN_COVERAGE}, {@link MIN_TOTAL_COVERAGE}). Weather reports (METAR/SYNOP-style
 * files: one routine report near each hour plus specials) are aligned to the nearest hour and one
 * report per hour is taken, the routine one before a special, the nearest to the hour first.
 * Running totals (counters since a reset) are first turned into interval totals.
 */
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.ts'
import type { IntervalLabel, RowSampling, ValueKind } from './raw-table.ts'
import { ReportKind } from './raw-table.ts'

/**
 * Share of an hour that readings must cover for an hourly mean (instants and interval means): one
 * half. EPA (2000), Meteorological Monitoring Guidance for Regulatory Modeling Applications,
 * EPA-454/R-99-005, §6.1: "At least two valid 15-minute periods are required to represent the
 * hourly period" (two of four quarter-hours). Applied to any reading interval as the covered share.
 */
export const MIN_MEAN_COVERAGE = 0.5

/**
 * Share of an hour that readings must cover for an hourly total (rain, irradiation amounts): all
 * of it, since a sum with readings missing understates the total. Common practice, no source.
 */
export const MIN_TOTAL_COVERAGE = 1

/** Rounding slack on coverage shares (floating-point sums of minutes). */
const COVERAGE_EPSILON = 1e-9

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

/** Most common spacing [min] (as {@link modeStepMinutes}), and whether the times increase and are all on the hour. */
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

/** Most common positive spacing between consecutive rows (file order) [min]; 60 when none. */
export function modeStepMinutes(utcMs: Float64Array): number {
  const small = new Int32Array(1441)
  const large = new Map<number, number>()
  let previous = Number.NaN
  for (let i = 0; i < utcMs.length; i++) {
    const t = utcMs[i]
    if (Number.isNaN(t)) continue
    if (!Number.isNaN(previous)) {
      const d = Math.round((t - previous) / MS_PER_MINUTE)
      if (d > 0) {
        if (d <= 1440) small[d]++
        else large.set(d, (large.get(d) ?? 0) + 1)
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
  for (const [d, c] of large) {
    if (c > count) {
      count = c
      best = d
    }
  }
  return best
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
  let utcMs = times.utcMs
  let summaryRows = 0
  if (times.reportKind !== undefined) {
    utcMs = Float64Array.from(times.utcMs)
    for (let i = 0; i < n; i++) {
      if (times.reportKind[i] === ReportKind.summary) {
        utcMs[i] = Number.NaN
        summaryRows++
      }
    }
  }
  // One pass: the spacing of the rows, whether they are in increasing time and all on the hour.
  const scan = scanTimes(utcMs)
  const stepMinutes = scan.stepMinutes
  let reportMinute: number | null = null
  let sampling: RowSampling
  if (times.sampling === 'reports') {
    sampling = 'reports'
    reportMinute = detectReportMinute(utcMs, 60)
  } else if (times.sampling === 'readings' || scan.onHour) sampling = 'readings'
  else {
    reportMinute = detectReportMinute(utcMs, stepMinutes)
    sampling = reportMinute === null ? 'readings' : 'reports'
  }
  const timeMs = sampling === 'reports' ? new Float64Array(n) : utcMs
  let alignedReports = 0
  let rank: Uint8Array | undefined
  let offsetMs: Float64Array | undefined
  if (sampling === 'reports') {
    rank = new Uint8Array(n)
    offsetMs = new Float64Array(n)
    for (let i = 0; i < n; i++) {
      const t = utcMs[i]
      const aligned = Math.round(t / MS_PER_HOUR) * MS_PER_HOUR
      timeMs[i] = aligned
      offsetMs[i] = Math.abs(t - aligned)
      if (aligned !== t && !Number.isNaN(t)) alignedReports++
      const kind = times.reportKind?.[i] ?? ReportKind.unknown
      if (kind === ReportKind.routine) rank[i] = 0
      else if (kind === ReportKind.special) rank[i] = 2
      else if (times.reportKind === undefined && reportMinute !== null)
        rank[i] = minuteOf(t) === reportMinute ? 0 : 2
      else rank[i] = 1
    }
  }
  // Rows in strictly increasing time cannot repeat a time; rows also all on the hour are one per hour.
  const increasing = sampling === 'reports' ? false : scan.increasing
  const onHour = scan.onHour
  let firstHour = Number.POSITIVE_INFINITY
  let lastHour = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    const t = timeMs[i]
    if (Number.isNaN(t)) continue
    const h = instantHour(t, 0, labels)
    if (h < firstHour) firstHour = h
    if (h > lastHour) lastHour = h
  }
  if (times.extendToHoursMs !== undefined && Number.isFinite(firstHour)) {
    firstHour = Math.min(firstHour, Math.floor(times.extendToHoursMs[0] / MS_PER_HOUR))
    lastHour = Math.max(lastHour, Math.floor(times.extendToHoursMs[1] / MS_PER_HOUR))
  }
  const firstHourMs = Number.isFinite(firstHour) ? firstHour * MS_PER_HOUR : Number.NaN
  const hours = Number.isFinite(firstHour) ? lastHour - firstHour + 1 : 0
  const rowHour = new Int32Array(n).fill(-1)
  for (let i = 0; i < n; i++) {
    const t = timeMs[i]
    if (!Number.isNaN(t)) rowHour[i] = instantHour(t, firstHourMs, labels)
  }

  // Exact duplicates (readings): rows with the same instant as an earlier row, found through a
  // per-hour chain of rows (a handful per hour even for minute data).
  const duplicateOf = new Int32Array(n).fill(-1)
  if (sampling === 'readings' && !increasing && hours > 0 && hours <= MAX_CHAIN_HOURS) {
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
  }

  const hourly = sampling === 'readings' && increasing && onHour
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
    rank,
    offsetMs,
    duplicateOf,
    alignedReports,
    summaryRows,
  }
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

/** One variable's hourly values and how they came about. */
export interface HourlyVariable {
  values: Float64Array
  /** Representative row of each hour (first contributing or chosen row), −1 when none; empty when not kept. */
  row: Int32Array
  /** Hours with readings too few to keep (coverage rule). */
  belowCoverage: number
  /** Hours kept although some readings were missing (empty: none). */
  partial: Uint8Array
  /** Hours built from more than one row. */
  fromSeveralRows: number
  /** Rows whose value was placed (1) in some hour (empty: not tracked, readings of an hourly file). */
  rowPlaced: Uint8Array
}

/** How to aggregate one variable. */
export interface VariableRule {
  kind: Exclude<ValueKind, 'running-total'>
  label: IntervalLabel
  /** Interval length [min] of interval values. */
  intervalMinutes: number
}

/**
 * Running totals to interval totals, in place: the increment from the previous placed row (a fall
 * means the counter was reset, the value itself is then the increment); the first row and rows
 * after a missing value become missing. Returns the count of resets seen.
 */
export function deaccumulate(
  values: Float64Array,
  plan: RowPlan,
): { resets: number; intervalMs: Float64Array } {
  const n = values.length
  const intervalMs = new Float64Array(n).fill(Number.NaN)
  let previous = -1
  let previousValue = Number.NaN
  let resets = 0
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(plan.timeMs[i]) || plan.duplicateOf[i] >= 0) continue
    const v = values[i]
    if (previous < 0 || Number.isNaN(previousValue) || Number.isNaN(v)) values[i] = Number.NaN
    else {
      intervalMs[i] = plan.timeMs[i] - plan.timeMs[previous]
      if (v >= previousValue) values[i] = v - previousValue
      else resets++
    }
    previous = i
    previousValue = v
  }
  return { resets, intervalMs }
}

/**
 * Aggregate one variable's per-row values (series unit, NaN = missing) onto the hour grid.
 * `intervalMs` gives per-row interval lengths (de-accumulated running totals), else the rule's. For a
 * contiguous hourly file the returned column may be `values` itself.
 */
export function aggregateVariable(
  values: Float64Array,
  plan: RowPlan,
  rule: VariableRule,
  intervalMs?: Float64Array,
): HourlyVariable {
  const { hours } = plan
  const direct =
    plan.hourly && intervalMs === undefined && (rule.kind === 'instant' || rule.intervalMinutes === 60)
  // the common hourly file: the rows' column (converted in place, owned by the caller) is the hours' column
  if (direct && plan.contiguous && rule.label === plan.labels)
    return {
      values,
      row: NO_ROWS,
      belowCoverage: 0,
      partial: NO_FLAGS,
      fromSeveralRows: 0,
      rowPlaced: NO_FLAGS,
    }
  const out = new Float64Array(hours).fill(Number.NaN)
  if (direct) return placeHourly(values, plan, rule, out)
  const row = new Int32Array(hours).fill(-1)
  const partial = new Uint8Array(hours)
  const rowPlaced = new Uint8Array(values.length)
  if (plan.sampling === 'reports') return chooseReports(values, plan, rule, out, row, partial, rowPlaced)
  const sum = new Float64Array(hours)
  const covered = new Float64Array(hours)
  const count = new Uint16Array(hours)
  const n = values.length
  const first = plan.firstHourMs
  const hourMs = MS_PER_HOUR
  const ownLabel = rule.label !== plan.labels
  for (let i = 0; i < n; i++) {
    const t = plan.timeMs[i]
    if (Number.isNaN(t) || plan.duplicateOf[i] >= 0) continue
    const v = values[i]
    if (Number.isNaN(v)) continue
    if (rule.kind === 'instant') {
      // the variable's own label may differ from the file's
      const h = ownLabel ? instantHour(t, first, rule.label) : plan.rowHour[i]
      if (h < 0 || h >= hours) continue
      sum[h] += v
      covered[h] += plan.spanMs[i]
      if (count[h] < 65535) count[h]++
      if (row[h] < 0) row[h] = i
      rowPlaced[i] = 1
      continue
    }
    const length = intervalMs !== undefined ? intervalMs[i] : rule.intervalMinutes * MS_PER_MINUTE
    if (!(length > 0)) continue
    const a = rule.label === 'end' ? t - length : t
    const b = a + length
    let h = Math.floor((a - first) / hourMs)
    const hEnd = Math.ceil((b - first) / hourMs)
    for (; h < hEnd; h++) {
      if (h < 0 || h >= hours) continue
      const lo = Math.max(a, first + h * hourMs)
      const hi = Math.min(b, first + (h + 1) * hourMs)
      const overlap = hi - lo
      if (overlap <= 0) continue
      // means: time-weighted; totals: the share of the amount that falls in this hour
      sum[h] += rule.kind === 'interval-mean' ? v * overlap : (v * overlap) / length
      covered[h] += overlap
      if (count[h] < 65535) count[h]++
      if (row[h] < 0) row[h] = i
      rowPlaced[i] = 1
    }
  }
  let belowCoverage = 0
  let fromSeveralRows = 0
  const need = rule.kind === 'interval-total' ? MIN_TOTAL_COVERAGE : MIN_MEAN_COVERAGE
  for (let h = 0; h < hours; h++) {
    if (count[h] === 0) continue
    const share = Math.min(1, covered[h] / hourMs)
    if (share + COVERAGE_EPSILON < need) {
      belowCoverage++
      continue
    }
    if (count[h] > 1) fromSeveralRows++
    if (share + COVERAGE_EPSILON < 1) partial[h] = 1
    if (rule.kind === 'instant') out[h] = sum[h] / count[h]
    else if (rule.kind === 'interval-mean') out[h] = sum[h] / covered[h]
    else out[h] = sum[h]
  }
  return { values: out, row, belowCoverage, partial, fromSeveralRows, rowPlaced }
}

const NO_ROWS = new Int32Array(0)
const NO_FLAGS = new Uint8Array(0)

/**
 * One row per hour, on the hour: each value goes to its hour directly (an instant to the hour its
 * label stands for, a one-hour interval to the hour it covers). Same result as the general path,
 * without its per-hour sums; `row`, `partial` and `rowPlaced` are left empty.
 */
function placeHourly(
  values: Float64Array,
  plan: RowPlan,
  rule: VariableRule,
  out: Float64Array,
): HourlyVariable {
  const shift = (plan.labels === 'end' ? 1 : 0) - (rule.label === 'end' ? 1 : 0)
  const hours = plan.hours
  const rowHour = plan.rowHour
  for (let i = 0; i < values.length; i++) {
    const v = values[i]
    if (Number.isNaN(v)) continue
    const r = rowHour[i]
    if (r < 0) continue
    const h = r + shift
    if (h >= 0 && h < hours) out[h] = v
  }
  return {
    values: out,
    row: NO_ROWS,
    belowCoverage: 0,
    partial: NO_FLAGS,
    fromSeveralRows: 0,
    rowPlaced: NO_FLAGS,
  }
}

/** Reports: per hour, the best report with a value (routine before special, nearest the hour first). */
function chooseReports(
  values: Float64Array,
  plan: RowPlan,
  rule: VariableRule,
  out: Float64Array,
  row: Int32Array,
  partial: Uint8Array,
  rowPlaced: Uint8Array,
): HourlyVariable {
  const { hours } = plan
  const score = new Float64Array(hours).fill(Number.POSITIVE_INFINITY)
  const candidates = new Uint16Array(hours)
  const rank = plan.rank!
  for (let i = 0; i < values.length; i++) {
    const t = plan.timeMs[i]
    const v = values[i]
    if (Number.isNaN(t) || Number.isNaN(v)) continue
    // an interval value (rain over the past hour) ends at its report: the hour before an end label
    let h: number
    if (rule.kind === 'instant')
      h = rule.label === plan.labels ? plan.rowHour[i] : instantHour(t, plan.firstHourMs, rule.label)
    else {
      const length = rule.intervalMinutes * MS_PER_MINUTE
      const mid = rule.label === 'end' ? t - length / 2 : t + length / 2
      h = Math.floor((mid - plan.firstHourMs) / MS_PER_HOUR)
    }
    if (h < 0 || h >= hours) continue
    if (candidates[h] < 65535) candidates[h]++
    const s = rank[i] * 1e12 + plan.offsetMs![i]
    if (s < score[h]) {
      score[h] = s
      row[h] = i
    }
  }
  let fromSeveralRows = 0
  for (let h = 0; h < hours; h++) {
    const i = row[h]
    if (i < 0) continue
    out[h] = values[i]
    rowPlaced[i] = 1
    if (candidates[h] > 1) fromSeveralRows++
  }
  return { values: out, row, belowCoverage: 0, partial, fromSeveralRows, rowPlaced }
}
