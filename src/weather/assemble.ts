/**
 * @module weather/assemble
 * The shared back half of every reader, as a pipeline of named stages: row times to UTC instants and
 * the row plan (`placeRows`), the site's clock, units converted once per reading (readings.ts), rows to
 * hours per variable as its timing says (rows-to-hours.ts), quality control and short gaps filled
 * (`checkHours`), pressure and humidity completed, irradiance checked against the sun and estimated
 * where the file has none (`completeIrradiance`), then row accounting and coverage (`account`). Format
 * readers only produce a {@link RawTable}.
 */

import { MS_PER_HOUR } from '../physics/constants.ts'
import { summarizeCoverage } from './coverage.ts'
import { fillDaytimeIrradiance, fixNightIrradiance, hourSun, interpolateShortGaps } from './gap-fill.ts'
import { deriveRelativeHumidity } from './humidity.ts'
import type { ProblemLog } from './problem-log.ts'
import { type HourGrid, humidityBelowDryBulbCheck, spikeCheck, stuckCheck } from './quality.ts'
import type { RawTable } from './raw-table.ts'
import { convertColumns } from './readings.ts'
import type { ColumnReport, HourlyAggregation, WeatherReadResult } from './result.ts'
import {
  countHoursWithoutRow,
  countRows,
  logDuplicates,
  logOrder,
  missingCoreHours,
} from './row-accounting.ts'
import { planRows, type RowPlan } from './row-plan.ts'
import { rowsToHours } from './rows-to-hours.ts'
import { createEmptySeries, type HourlySeries, missingColumn, QualityFlag, type SiteInfo } from './series.ts'
import { resolveSiteClock } from './site-clock.ts'
import { constantPressure, fillStandardPressure, suppliedPressureHours } from './station-pressure.ts'
import { estimateMissingIrradiance } from './sun-estimate.ts'
import { type ResolvedTimes, resolveRowTimes, type TimeBasisInput } from './time-basis.ts'
import { SERIES_UNIT, type WeatherVariable } from './units.ts'
import { mergeErrors, missingCoreColumns, noUsableHour } from './unusable-input.ts'
import { gridReach, type VariableTimingOverride } from './variable-timing.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** Longest series accepted [h]: 100 years. Guards against one stray year turning into a huge grid. */
export const MAX_SERIES_HOURS = 100 * 8784

export interface AssembleContext {
  site: SiteInfo
  time: TimeBasisInput
  log: ProblemLog
  warnings: string[]
  /** Elevation-based pressure is allowed to assume sea level when the elevation is unknown. */
  elevationKnown: boolean
  /** Per-variable timing given by the user (option `labels`), over the reader's. */
  variableTiming?: Partial<Record<WeatherVariable, VariableTimingOverride>>
  /** Notes: how the file was understood and what was supplied rather than read (irradiance estimates); not problems. */
  notes?: string[]
  /** How rows become hours, when the user says (`sampling`); else the reader's or detected. */
  sampling?: 'readings' | 'reports'
  /** The site's clock as the user (`siteTimeZone`) or the file states it; the rest is inferred. */
  siteClock?: { optionZone?: string; fileZone?: string | null; fileOffsetHours?: number | null }
}

/** The hourly columns of a table in series units, by variable. */
type HourlyColumns = Partial<Record<WeatherVariable, Float64Array>>

export function assemble(raw: RawTable, ctx: AssembleContext): WeatherReadResult {
  const { log, warnings } = ctx
  const { times, plan } = placeRows(raw, ctx)
  const first = plan.firstHourMs
  const hours = plan.hours
  applySiteClock(ctx, times, first)
  if (hours > MAX_SERIES_HOURS) {
    const last = first + (hours - 1) * MS_PER_HOUR
    throw new WeatherInputError(
      `the timestamps span ${Math.round(hours / 8766)} years (${new Date(first).toISOString()} to ${new Date(last).toISOString()}); at most 100 years are read: check for stray dates`,
      ['timestamps'],
    )
  }
  // value columns are assigned below from the hourly columns (no copies)
  const series = createEmptySeries(ctx.site, first, hours, false)
  series.typicalYear = times.typicalYear
  const grid = hourGrid(raw, plan, series.quality)
  logOrder(raw, plan, log)
  if (raw.rowFlags) {
    for (let i = 0; i < raw.rows; i++) {
      const h = plan.rowHour[i]
      if (h >= 0 && plan.duplicateOf[i] < 0) series.quality[h] |= raw.rowFlags[i]
    }
  }
  // Units once, per reading; missing codes and ranges judged per reading, with its own line.
  const { converted, columns, rowChanged } = convertColumns(raw, log, warnings)
  const notes = ctx.notes ?? []
  logDuplicates(raw, plan, series.quality, log)
  const hourly = rowsToHours({
    raw,
    plan,
    fileLabels: times.labels,
    overrides: ctx.variableTiming,
    converted,
    columns,
    grid,
    rowChanged,
    log,
    warnings,
    notes,
  })
  const si = hourly.si
  checkHours(raw, si, grid, series, ctx, notes)
  series.pressureKpa = si.pressure ?? missingColumn(hours)
  const dry = si.dryBulb!
  fillStandardPressure(
    series.pressureKpa,
    dry,
    series.quality,
    { elevationM: ctx.site.elevationM, elevationKnown: ctx.elevationKnown, hasPressureColumn: !!si.pressure },
    columns,
    warnings,
  )
  series.dryBulbC = dry
  // measured RH stays in its own column; the gaps are derived into it
  series.relativeHumidityPct = si.relativeHumidity ?? missingColumn(hours)
  const derived = deriveRelativeHumidity(
    series.dryBulbC,
    series.pressureKpa,
    { relativeHumidityPct: si.relativeHumidity, dewPointC: si.dewPoint, wetBulbC: si.wetBulb },
    series.relativeHumidityPct,
  )
  if (derived.fromDewPoint > 0 && si.relativeHumidity)
    warnings.push(`${derived.fromDewPoint} hours without RH take it from the dew point`)
  series.windMs = si.wind ?? missingColumn(hours)
  series.rainMm = si.rain ?? missingColumn(hours)
  if (si.cloudCover) series.cloudCoverPct = si.cloudCover
  completeIrradiance(si.ghi, series, grid, columns, ctx, notes)
  return account(raw, plan, times, series, grid, columns, hourly, rowChanged, notes, ctx)
}

/**
 * Row times to UTC instants (`resolveRowTimes`; an absent dry bulb or humidity column is reported
 * with any time error, all at once) and the row plan, the grid widened to hold interval values that
 * reach beyond the rows' own hours.
 */
function placeRows(raw: RawTable, ctx: AssembleContext): { times: ResolvedTimes; plan: RowPlan } {
  const { log, warnings } = ctx
  const n = raw.rows
  if (n === 0) throw new WeatherInputError('the file has no data rows', ['rows'])
  for (let i = 0; i < n; i++) {
    const reason = raw.timeErrors[i]
    if (reason !== undefined) log.add(raw.lines[i], null, 'bad-timestamp', reason)
  }
  const missingColumns = missingCoreColumns(raw)
  let times: ResolvedTimes
  try {
    times = resolveRowTimes(
      raw.time,
      raw.lines,
      { ...ctx.time, labels: ctx.time.labels ?? raw.labels ?? null },
      log,
    )
  } catch (e) {
    if (e instanceof WeatherInputError && missingColumns.length > 0) throw mergeErrors([e, ...missingColumns])
    throw e
  }
  if (missingColumns.length > 0) throw mergeErrors(missingColumns)
  warnings.push(...times.warnings)
  const rowTimes = {
    utcMs: times.rowUtcMs,
    labels: times.labels,
    sampling: ctx.sampling ?? raw.sampling,
    reportKind: raw.reportKind,
  }
  let plan = planRows(rowTimes)
  // Interval values labelled apart from the rows' instants (rain over the hour before the stamp) may
  // reach an hour beyond the rows' own: the grid holds it, so nothing the file says is dropped.
  const reach = gridReach(raw, plan, times.labels, ctx.variableTiming)
  if (reach !== null) plan = planRows({ ...rowTimes, extendToHoursMs: reach })
  if (plan.hours === 0) {
    throw new WeatherInputError(
      `none of the ${n} rows has a usable timestamp (first problem: ${log.problems[0]?.message ?? 'none'}); ` +
        'map the time columns with --map timestamp=<column> (or date=, time=, year=, month=, day=, hour=)',
      ['timestamps'],
    )
  }
  return { times, plan }
}

/** The site's clock (site-clock.ts) into `ctx.site`, its note among the warnings. */
function applySiteClock(ctx: AssembleContext, times: ResolvedTimes, firstHourMs: number): void {
  const clock = resolveSiteClock({
    ...ctx.siteClock,
    basis: times.basis,
    basisZoneStandardOffsetHours: times.zoneStandardOffsetHours,
    longitudeDeg: ctx.site.longitudeDeg,
    referenceUtcMs: firstHourMs,
  })
  ctx.site.timeZone = clock.timeZone
  ctx.site.utcOffsetHours = clock.utcOffsetHours
  ctx.site.utcOffsetSource = clock.source
  if (clock.note) ctx.warnings.push(clock.note)
}

/** The grid the hourly checks work on, each hour's row the first placed in it. */
function hourGrid(raw: RawTable, plan: RowPlan, quality: Uint8Array): HourGrid {
  const grid: HourGrid = {
    hours: plan.hours,
    slotRow: new Int32Array(plan.hours).fill(-1),
    lines: raw.lines,
    quality,
    changed: new Uint8Array(plan.hours),
  }
  for (let i = 0; i < raw.rows; i++) {
    const h = plan.rowHour[i]
    if (h >= 0 && plan.duplicateOf[i] < 0 && grid.slotRow[h] < 0) grid.slotRow[h] = i
  }
  return grid
}

/**
 * The hourly checks: dew point and wet bulb not above the dry bulb, spikes, stuck sensors (a pressure
 * held constant through the file is a supplied value instead), then short gaps filled. Tables a reader
 * has already checked (the export read back) skip the spike and stuck checks.
 */
function checkHours(
  raw: RawTable,
  si: HourlyColumns,
  grid: HourGrid,
  series: HourlySeries,
  ctx: AssembleContext,
  notes: string[],
): void {
  const { log, warnings } = ctx
  const dry = si.dryBulb!
  if (si.dewPoint) humidityBelowDryBulbCheck(grid, log, 'dewPoint', si.dewPoint, dry)
  if (si.wetBulb) humidityBelowDryBulbCheck(grid, log, 'wetBulb', si.wetBulb, dry)
  const supplied = suppliedPressureHours(series.quality, raw.rowFlags !== undefined)
  for (const variable of [
    'dryBulb',
    'dewPoint',
    'wetBulb',
    'relativeHumidity',
    'pressure',
    'wind',
  ] as const) {
    const v = si[variable]
    if (v === undefined) continue
    if (!raw.checked) spikeCheck(grid, log, variable, v, SERIES_UNIT[variable])
    const notesBefore = notes.length
    if (variable === 'pressure' && constantPressure(v, ctx.site.elevationM, warnings, notes)) {
      series.supplied = [
        ...(series.supplied ?? []),
        {
          name: 'station pressure',
          // the note when the constant is used as given, else the warning that replaced it
          value: notes.length > notesBefore ? notes[notes.length - 1] : warnings[warnings.length - 1],
          source: 'the file',
        },
      ]
      continue
    }
    if (!raw.checked)
      stuckCheck(
        grid,
        log,
        variable,
        v,
        SERIES_UNIT[variable],
        variable === 'pressure' ? supplied : undefined,
      )
    // RH gaps are left to the dew point or wet bulb when the file has one (measured beats interpolated).
    if (variable === 'relativeHumidity' && (si.dewPoint || si.wetBulb)) continue
    interpolateShortGaps(grid, log, variable, v)
  }
}

/**
 * Irradiance: the file's column checked against the sun (night values set to 0, short daytime gaps
 * filled from the clear-sky index), then hours still without it estimated (sun-estimate.ts), what was
 * supplied noted for the assumptions.
 */
function completeIrradiance(
  ghi: Float64Array | undefined,
  series: HourlySeries,
  grid: HourGrid,
  columns: ColumnReport[],
  ctx: AssembleContext,
  notes: string[],
): void {
  const { log, warnings } = ctx
  const lat = ctx.site.latitudeDeg
  const lon = ctx.site.longitudeDeg
  series.ghiWm2 = ghi ?? missingColumn(series.hours)
  if (ghi) {
    if (lat !== null && lon !== null) {
      const sun = hourSun(series.startUtcMs, lat, lon, series.ghiWm2)
      const night = fixNightIrradiance(grid, log, series.ghiWm2, sun)
      fillDaytimeIrradiance(grid, log, series.ghiWm2, sun)
      if (night > 0.02 * series.hours) {
        warnings.push(
          `${night} hours show sunshine while the sun is down: the time zone or the timestamp labels are probably wrong`,
        )
      }
    } else {
      warnings.push(
        'irradiance not checked against the sun and not filled: the site latitude and longitude are unknown (give --lat and --lon)',
      )
    }
  }
  const estimate = estimateMissingIrradiance(series, { hasIrradianceColumn: ghi !== undefined })
  if (estimate !== null) {
    warnings.push(...estimate.warnings)
    notes.push(...estimate.notes)
    if (estimate.supplied.length > 0) series.supplied = [...(series.supplied ?? []), ...estimate.supplied]
    if (estimate.hours > 0)
      columns.push({
        variable: 'ghi',
        source: estimate.source,
        unit: 'W/m²',
        unitFrom: 'supplied',
        timing: 'interval-mean',
        missing: 0,
      })
  }
}

/**
 * The result: hours without dry bulb or humidity flagged (none usable is an error), every row
 * accounted for, coverage per month, problems in line order.
 */
function account(
  raw: RawTable,
  plan: RowPlan,
  times: ResolvedTimes,
  series: HourlySeries,
  grid: HourGrid,
  columns: ColumnReport[],
  hourly: { aggregation: HourlyAggregation; rowPlaced: Uint8Array },
  rowChanged: Uint8Array,
  notes: string[],
  ctx: AssembleContext,
): WeatherReadResult {
  const { log, warnings } = ctx
  const { aggregation } = hourly
  const first = plan.firstHourMs
  const hours = plan.hours
  let missingCore = 0
  for (let s = 0; s < hours; s++) {
    if (Number.isNaN(series.dryBulbC[s]) || Number.isNaN(series.relativeHumidityPct[s])) {
      series.quality[s] |= QualityFlag.missingCore
      missingCore++
    }
  }
  if (missingCore === hours) throw noUsableHour(series, columns, log, aggregation)
  const { rows, rejectedRows } = countRows(raw, plan, series, grid, rowChanged, hourly.rowPlaced, log)
  aggregation.supersededRows = rows.superseded
  series.timing = Object.fromEntries(columns.map((c) => [c.variable, c.timing]))
  const coverage = summarizeCoverage(series, missingCoreHours(series))
  log.problems.sort((a, b) => (a.line ?? Number.MAX_SAFE_INTEGER) - (b.line ?? Number.MAX_SAFE_INTEGER))
  const withoutRow = countHoursWithoutRow(plan)
  return {
    series,
    format: raw.format,
    rows,
    rejectedRows,
    columns,
    problems: log.problems,
    problemCounts: log.counts,
    problemsOmitted: log.omitted,
    warnings,
    notes,
    period: {
      start: new Date(first).toISOString(),
      end: new Date(first + hours * MS_PER_HOUR).toISOString(),
    },
    timeBasis: times.description,
    dstEvents: times.dstEvents,
    coverage: coverage.months,
    hoursWithoutRow: withoutRow,
    hoursMissingCore: missingCore,
    years: coverage.years,
    sourceYears: times.sourceYears,
    hourly: aggregation,
  }
}
