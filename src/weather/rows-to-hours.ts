/**
 * @module weather/rows-to-hours
 * Every variable of a table from its rows to the hour grid, by its own timing (variable-timing.ts):
 * running totals differenced and range-checked, amounts of irradiation turned into means, intervals
 * longer than an hour refused, then `aggregateVariable`; partial hours and rejected values flagged,
 * hours with too few readings logged, and one sentence on how the rows became hours.
 */
import { MS_PER_HOUR } from '../physics/constants.ts'
import {
  aggregateVariable,
  deaccumulate,
  MIN_MEAN_COVERAGE,
  MIN_TOTAL_COVERAGE,
  type VariableRule,
} from './hourly-aggregate.ts'
import type { ProblemLog } from './problem-log.ts'
import { type HourGrid, rangeCheckReadings } from './quality.ts'
import type { IntervalLabel, RawTable } from './raw-table.ts'
import { type ConvertedColumn, isEnergyAmount, rescaleAmountToMean } from './readings.ts'
import type { ColumnReport, HourlyAggregation } from './result.ts'
import type { RowPlan } from './row-plan.ts'
import { QualityFlag } from './series.ts'
import { snippet } from './snippet.ts'
import { SERIES_UNIT, WEATHER_VARIABLES, type WeatherVariable } from './units.ts'
import { type VariableTimingOverride, variableRule } from './variable-timing.ts'

/** One problem per hour whose readings were too few to keep (core variables only). */
function logBelowCoverage(
  values: Float64Array,
  plan: RowPlan,
  grid: HourGrid,
  log: ProblemLog,
  variable: WeatherVariable,
  total: boolean,
): void {
  for (let h = 0; h < plan.hours; h++) {
    if (!Number.isNaN(values[h]) || grid.slotRow[h] < 0) continue
    const row = grid.slotRow[h]
    log.add(
      grid.lines[row],
      variable,
      'too-few-readings',
      `the hour ${new Date(plan.firstHourMs + h * MS_PER_HOUR).toISOString().slice(0, 16)}Z has readings covering less than ${total ? 'all' : 'half'} of it: ${variable} missing for the hour`,
    )
  }
}

/** A sentence on how rows became hours, when it was more than one row per hour. */
function describeAggregation(a: HourlyAggregation, plan: RowPlan, notes: string[]): void {
  if (plan.summaryRows > 0)
    notes.push(
      `${plan.summaryRows} summary rows (daily or monthly summaries) left out: they are not hourly observations`,
    )
  if (a.sampling === 'reports') {
    notes.push(
      `weather reports (most at :${String(a.reportMinute ?? 0).padStart(2, '0')}): each aligned to the nearest hour (${a.alignedReports} moved), one per hour, routine before special`,
    )
    return
  }
  if (plan.stepMinutes < 60) {
    const below = Object.entries(a.hoursBelowCoverage)
      .map(([v, k]) => `${v} ${k}`)
      .join(', ')
    notes.push(
      `readings every ${plan.stepMinutes} minutes: instants averaged and totals summed into hours; ` +
        `${a.partialHours} hour${a.partialHours === 1 ? '' : 's'} kept with some readings missing${below ? `, hours with too few readings left missing: ${below}` : ''}`,
    )
  } else if (plan.stepMinutes > 60) {
    notes.push(
      `rows are ${plan.stepMinutes} minutes apart: hours between rows have no values (gaps up to 3 hours are interpolated)`,
    )
  }
}

/** What {@link rowsToHours} works from. */
export interface RowsToHoursInput {
  raw: RawTable
  plan: RowPlan
  /** The file-wide label convention the rows' times were read with. */
  fileLabels: IntervalLabel
  /** The user's per-variable labels and intervals. */
  overrides: Partial<Record<WeatherVariable, VariableTimingOverride>> | undefined
  converted: Partial<Record<WeatherVariable, ConvertedColumn>>
  /** The account of the columns; a column that cannot be split into hours is taken out of it. */
  columns: ColumnReport[]
  grid: HourGrid
  /** Per row: 1 where a reading was changed, 2 where one was rejected by the range checks (running totals: here). */
  rowChanged: Uint8Array
  log: ProblemLog
  warnings: string[]
  /** How the file was understood (how rows became hours): notes, not problems. */
  notes: string[]
}

/** The hourly columns of the variables a table has, in series units, and how rows became hours. */
export interface HourlyColumnsOfTable {
  si: Partial<Record<WeatherVariable, Float64Array>>
  aggregation: HourlyAggregation
  /** Per row, 1 when a report was placed in an hour (reports only). */
  rowPlaced: Uint8Array
}

/**
 * Rows to hours for every converted column (see the module). Sets the partial-hour and rejected-value
 * flags of the hours, and, for reports, the row each hour's dry bulb came from in `grid.slotRow`.
 */
export function rowsToHours({
  raw,
  plan,
  fileLabels,
  overrides,
  converted,
  columns,
  grid,
  rowChanged,
  log,
  warnings,
  notes,
}: RowsToHoursInput): HourlyColumnsOfTable {
  const n = raw.rows
  const hours = plan.hours
  const si: Partial<Record<WeatherVariable, Float64Array>> = {}
  const aggregation: HourlyAggregation = {
    sampling: plan.sampling,
    stepMinutes: plan.stepMinutes,
    reportMinute: plan.reportMinute,
    alignedReports: plan.alignedReports,
    hoursFromSeveralRows: 0,
    partialHours: 0,
    hoursBelowCoverage: {},
    supersededRows: 0,
    rule:
      plan.sampling === 'reports'
        ? 'one report per hour: a report within 15 minutes of an hour stands for it; the routine report before a special, the nearest to the hour first'
        : `an hourly mean needs readings covering at least ${MIN_MEAN_COVERAGE * 100} % of the hour (EPA-454/R-99-005 §6.1: two of four 15-minute periods); an hourly total needs ${MIN_TOTAL_COVERAGE * 100} % (common practice, no source)`,
  }
  const rowPlaced = new Uint8Array(n)
  const partial = new Uint8Array(hours)
  for (const variable of WEATHER_VARIABLES) {
    const entry = converted[variable]
    if (entry === undefined) continue
    const rule = variableRule(raw, variable, plan, fileLabels, overrides?.[variable])
    let values = entry.col.values
    let intervals: Float64Array | undefined
    if (rule.kind === 'running-total') {
      const d = deaccumulate(values, plan)
      intervals = d.intervalMs
      if (d.resets > 0)
        warnings.push(
          `column '${snippet(entry.col.source)}' is a running total: turned into amounts per row (${d.resets} resets)`,
        )
    }
    const kind: VariableRule['kind'] = rule.kind === 'running-total' ? 'interval-total' : rule.kind
    if (kind !== 'instant' && rule.intervalMinutes > 60 && intervals === undefined) {
      warnings.push(
        `column '${snippet(entry.col.source)}' holds ${kind === 'interval-total' ? 'totals' : 'means'} over ${rule.intervalMinutes} minutes, longer than an hour: not used (it cannot be split into hours)`,
      )
      log.add(
        null,
        variable,
        'interval-too-long',
        `${variable} covers ${rule.intervalMinutes} minutes per row: not used`,
      )
      columns.splice(
        columns.findIndex((c) => c.variable === variable),
        1,
      )
      continue
    }
    if (variable === 'ghi' && isEnergyAmount(entry.conversion)) {
      values = rescaleAmountToMean(values, rule.intervalMinutes, intervals)
    }
    if (rule.kind === 'running-total')
      rangeCheckReadings(raw.lines, log, variable, values, SERIES_UNIT[variable], rowChanged)
    const aggregated = aggregateVariable(
      values,
      plan,
      {
        kind: variable === 'ghi' && kind === 'interval-total' ? 'interval-mean' : kind,
        label: rule.label,
        intervalMinutes: rule.intervalMinutes,
      },
      intervals,
    )
    si[variable] = aggregated.values
    if (plan.sampling === 'reports') {
      for (let i = 0; i < n; i++) if (aggregated.rowPlaced[i]) rowPlaced[i] = 1
      if (variable === 'dryBulb')
        for (let h = 0; h < hours; h++) if (aggregated.row[h] >= 0) grid.slotRow[h] = aggregated.row[h]
    }
    if (aggregated.partial.length > 0)
      for (let h = 0; h < hours; h++) if (aggregated.partial[h]) partial[h] = 1
    if (aggregated.fromSeveralRows > aggregation.hoursFromSeveralRows)
      aggregation.hoursFromSeveralRows = aggregated.fromSeveralRows
    if (aggregated.belowCoverage > 0) aggregation.hoursBelowCoverage[variable] = aggregated.belowCoverage
    if (aggregated.belowCoverage > 0 && (variable === 'dryBulb' || variable === 'relativeHumidity'))
      logBelowCoverage(aggregated.values, plan, grid, log, variable, kind === 'interval-total')
  }
  for (let h = 0; h < hours; h++) {
    if (partial[h]) {
      grid.quality[h] |= QualityFlag.partialHour
      aggregation.partialHours++
    }
  }
  for (let i = 0; i < n; i++) {
    if (rowChanged[i] === 2) {
      const h = plan.rowHour[i]
      if (h >= 0) {
        grid.quality[h] |= QualityFlag.rejectedValue
        grid.changed[h] = 1
      }
    }
  }
  describeAggregation(aggregation, plan, notes)
  return { si, aggregation, rowPlaced }
}
