/**
 * @module weather/hourly-aggregate
 * Rows to hours, per variable. Readings (hourly or sub-hourly) are binned by what each value is:
 * an instant goes to the hour its time stands for (label start: the hour it begins; label end: the
 * hour it ends); an interval mean or total to the hours its interval overlaps, in proportion to the
 * overlap. Instants and means are averaged, totals summed; an hour is kept only when enough of it is
 * covered ({@link MIN_MEAN_COVERAGE}, {@link MIN_TOTAL_COVERAGE}). Weather reports (METAR/SYNOP-style
 * files: one routine report near each hour plus specials) are aligned to the nearest hour (row-plan.ts) and one
 * report per hour is taken, the routine one before a special, the nearest to the hour first.
 * Running totals (counters since a reset) are first turned into interval totals.
 */
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.ts'
import type { IntervalLabel, ValueKind } from './raw-table.ts'
import { instantHour, type RowPlan } from './row-plan.ts'

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
