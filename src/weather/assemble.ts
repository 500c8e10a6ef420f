/**
 * @module weather/assemble
 * The shared back half of every reader: row times to UTC instants, rows to hours (sub-hourly
 * readings averaged or summed, reports aligned to the hour, per variable as its timing says),
 * units converted once, quality control, short gaps filled, humidity and pressure completed,
 * irradiance estimated where the file has none, row accounting and coverage. Format readers only
 * produce a {@link RawTable}.
 */

import { standardPressureKpaAtElevation } from '../physics/moist-air.ts'
import { summarizeCoverage } from './coverage.ts'
import { fillDaytimeIrradiance, fixNightIrradiance, hourSun, interpolateShortGaps } from './gap-fill.ts'
import {
  aggregateVariable,
  deaccumulate,
  intervalReach,
  MIN_MEAN_COVERAGE,
  MIN_TOTAL_COVERAGE,
  planRows,
  type RowPlan,
  type VariableRule,
} from './hourly-aggregate.ts'
import { deriveRelativeHumidity } from './humidity.ts'
import type { ProblemLog } from './problem-log.ts'
import {
  type HourGrid,
  humidityBelowDryBulbCheck,
  rangeCheckReadings,
  spikeCheck,
  stuckCheck,
  VALID_RANGE,
} from './quality.ts'
import {
  columnTiming,
  type IntervalLabel,
  type RawColumn,
  type RawTable,
  ReportKind,
  type ValueKind,
} from './raw-table.ts'
import type { ColumnReport, HourlyAggregation, RejectedRow, WeatherReadResult } from './result.ts'
import { createEmptySeries, missingColumn, QualityFlag, type SiteInfo, type ValueTiming } from './series.ts'
import { resolveSiteClock } from './site-clock.ts'
import { snippet } from './snippet.ts'
import { estimateMissingIrradiance } from './sun-estimate.ts'
import { resolveRowTimes, type TimeBasisInput } from './time-basis.ts'
import {
  guessUnitFromValues,
  implausibleUnitWarning,
  SERIES_UNIT,
  siUnit,
  type UnitConversion,
  WEATHER_VARIABLES,
  type WeatherVariable,
} from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

const MS_PER_HOUR = 3_600_000
/** Longest series accepted [h]: 100 years. Guards against one stray year turning into a huge grid. */
export const MAX_SERIES_HOURS = 100 * 8784

/** Raw numbers that data sources use for "missing": −99, −999, −9999 and their variants (common practice in station exports, no source) and the EPW field codes (EPW data dictionary); see docs/weather.md. */
export const MISSING_CODES = new Set([
  -99999, -9999.9, -9999, -999.9, -999, -99.9, -99, 99.9, 999, 999.9, 9999, 9999.9, 99999, 999999,
])

/** The user's statement of how one variable relates to its row times (label, interval). */
export interface VariableTimingOverride {
  label?: IntervalLabel
  intervalMinutes?: number
}

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

const DEFAULT_TIMING: Record<WeatherVariable, ValueTiming> = {
  dryBulb: 'instant',
  relativeHumidity: 'instant',
  dewPoint: 'instant',
  wetBulb: 'instant',
  pressure: 'instant',
  wind: 'instant',
  ghi: 'interval-mean',
  rain: 'interval-total',
  cloudCover: 'instant',
}

/**
 * Pressure held at one value through a whole file is a supplied constant (typical-year files are
 * often written with the standard atmosphere), not a stuck sensor. Beyond this difference [kPa]
 * from the standard atmosphere at a known elevation (about 170 m of height), the constant is
 * replaced by that standard atmosphere. Common practice, no source.
 */
export const CONSTANT_PRESSURE_TOLERANCE_KPA = 2

export function assemble(raw: RawTable, ctx: AssembleContext): WeatherReadResult {
  const { log, warnings } = ctx
  const n = raw.rows
  if (n === 0) throw new WeatherInputError('the file has no data rows', ['rows'])
  for (let i = 0; i < n; i++) {
    const reason = raw.timeErrors[i]
    if (reason !== undefined) log.add(raw.lines[i], null, 'bad-timestamp', reason)
  }
  const missingColumns = missingCoreColumns(raw)
  let times: ReturnType<typeof resolveRowTimes>
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
  const first = plan.firstHourMs
  const hours = plan.hours
  const clock = resolveSiteClock({
    ...ctx.siteClock,
    basis: times.basis,
    basisZoneStandardOffsetHours: times.zoneStandardOffsetHours,
    longitudeDeg: ctx.site.longitudeDeg,
    referenceUtcMs: first,
  })
  ctx.site.timeZone = clock.timeZone
  ctx.site.utcOffsetHours = clock.utcOffsetHours
  ctx.site.utcOffsetSource = clock.source
  if (clock.note) warnings.push(clock.note)
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
  const grid: HourGrid = {
    hours,
    slotRow: new Int32Array(hours).fill(-1),
    lines: raw.lines,
    quality: series.quality,
    changed: new Uint8Array(hours),
  }
  for (let i = 0; i < n; i++) {
    const h = plan.rowHour[i]
    if (h >= 0 && plan.duplicateOf[i] < 0 && grid.slotRow[h] < 0) grid.slotRow[h] = i
  }
  logOrder(raw, plan, log)
  if (raw.rowFlags) {
    for (let i = 0; i < n; i++) {
      const h = plan.rowHour[i]
      if (h >= 0 && plan.duplicateOf[i] < 0) series.quality[h] |= raw.rowFlags[i]
    }
  }

  // Units once, per reading; missing codes and ranges judged per reading, with its own line.
  const rowChanged = new Uint8Array(n)
  const converted: Partial<Record<WeatherVariable, { col: RawColumn; conversion: UnitConversion }>> = {}
  const columns: ColumnReport[] = []
  for (const variable of WEATHER_VARIABLES) {
    const col = raw.columns[variable]
    if (col === undefined) continue
    const { conversion, unitFrom } = decideConversion(variable, col, warnings)
    const codes = convertReadings(raw, col, variable, conversion, warnings)
    // a running total is judged once turned into increments (its day's sum may exceed an hour's range)
    if (columnTiming(raw, variable, DEFAULT_TIMING[variable]).kind !== 'running-total') {
      const implausible = implausibleUnitWarning(variable, col.source, conversion, col.values)
      if (implausible) warnings.push(implausible)
      rangeCheckReadings(raw.lines, log, variable, col.values, SERIES_UNIT[variable], rowChanged)
    }
    converted[variable] = { col, conversion }
    columns.push({
      variable,
      source: col.source,
      unit: conversion.unit,
      unitFrom,
      timing: reportedKind(columnTiming(raw, variable, DEFAULT_TIMING[variable]).kind),
      missing: col.missingCount + codes,
    })
  }
  logDuplicates(raw, plan, series.quality, log)

  // Rows to hours, per variable.
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
    const rule = variableRule(raw, variable, plan, times.labels, ctx.variableTiming?.[variable])
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
      series.quality[h] |= QualityFlag.partialHour
      aggregation.partialHours++
    }
  }
  for (let i = 0; i < n; i++) {
    if (rowChanged[i] === 2) {
      const h = plan.rowHour[i]
      if (h >= 0) {
        series.quality[h] |= QualityFlag.rejectedValue
        grid.changed[h] = 1
      }
    }
  }
  const notes = ctx.notes ?? []
  describeAggregation(aggregation, plan, notes)

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
    if (variable === 'pressure' && constantPressure(v, ctx, warnings, notes)) {
      series.supplied = [
        ...(series.supplied ?? []),
        {
          name: 'station pressure',
          value: notes[notes.length - 1] ?? warnings[warnings.length - 1],
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

  // Pressure: the file's, else (and in its long gaps) the standard atmosphere at the site elevation.
  const elevation = ctx.site.elevationM ?? 0
  const standardKpa = standardPressureKpaAtElevation(elevation)
  series.pressureKpa = si.pressure ?? missingColumn(hours)
  // Only hours with a dry bulb need it (humidity from a wet bulb uses it); an hour without one is
  // excluded anyway, and its export row stays empty rather than show a pressure nobody measured.
  let pressureSupplied = 0
  for (let s = 0; s < hours; s++) {
    if (Number.isNaN(series.pressureKpa[s]) && !Number.isNaN(dry[s])) {
      series.pressureKpa[s] = standardKpa
      series.quality[s] |= QualityFlag.pressureFromElevation
      pressureSupplied++
    }
  }
  if (!si.pressure) {
    columns.push({
      variable: 'pressure',
      source: `standard atmosphere at ${elevation} m (ASHRAE HOF 2017 ch. 1 eq 3)`,
      unit: 'kPa',
      unitFrom: 'supplied',
      timing: 'instant',
      missing: 0,
    })
    warnings.push(
      ctx.elevationKnown
        ? `no pressure column: station pressure is the standard atmosphere at ${elevation} m (${standardKpa.toFixed(2)} kPa)`
        : 'no pressure column and no elevation: station pressure assumed at sea level (101.325 kPa); give --elevation <m> for the site',
    )
  } else if (pressureSupplied > 0) {
    warnings.push(`${pressureSupplied} hours without pressure take the standard atmosphere at ${elevation} m`)
  }

  const humidity = { relativeHumidityPct: si.relativeHumidity, dewPointC: si.dewPoint, wetBulbC: si.wetBulb }
  series.dryBulbC = dry
  // measured RH stays in its own column; the gaps are derived into it
  series.relativeHumidityPct = si.relativeHumidity ?? missingColumn(hours)
  const derived = deriveRelativeHumidity(
    series.dryBulbC,
    series.pressureKpa,
    humidity,
    series.relativeHumidityPct,
  )
  if (derived.fromDewPoint > 0 && si.relativeHumidity)
    warnings.push(`${derived.fromDewPoint} hours without RH take it from the dew point`)
  series.windMs = si.wind ?? missingColumn(hours)
  series.rainMm = si.rain ?? missingColumn(hours)
  if (si.cloudCover) series.cloudCoverPct = si.cloudCover
  const lat = ctx.site.latitudeDeg
  const lon = ctx.site.longitudeDeg
  series.ghiWm2 = si.ghi ?? missingColumn(hours)
  if (si.ghi) {
    if (lat !== null && lon !== null) {
      const sun = hourSun(series.startUtcMs, lat, lon, series.ghiWm2)
      const night = fixNightIrradiance(grid, log, series.ghiWm2, sun)
      fillDaytimeIrradiance(grid, log, series.ghiWm2, sun)
      if (night > 0.02 * hours) {
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
  const estimate = estimateMissingIrradiance(series, { hasIrradianceColumn: si.ghi !== undefined })
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

  let missingCore = 0
  for (let s = 0; s < hours; s++) {
    if (Number.isNaN(series.dryBulbC[s]) || Number.isNaN(series.relativeHumidityPct[s])) {
      series.quality[s] |= QualityFlag.missingCore
      missingCore++
    }
  }
  if (missingCore === hours) throw noUsableHour(series, columns, log, aggregation)
  const { rows, rejectedRows } = countRows(raw, plan, series, grid, rowChanged, rowPlaced, log)
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

/** The hours interval variables reach beyond the rows' own hours, or null when none. */
function gridReach(
  raw: RawTable,
  plan: RowPlan,
  fileLabels: IntervalLabel,
  overrides: AssembleContext['variableTiming'],
): [number, number] | null {
  if (plan.hours === 0) return null
  const last = plan.firstHourMs + (plan.hours - 1) * MS_PER_HOUR
  let lo = plan.firstHourMs
  let hi = last
  for (const variable of WEATHER_VARIABLES) {
    if (raw.columns[variable] === undefined) continue
    const rule = variableRule(raw, variable, plan, fileLabels, overrides?.[variable])
    if (rule.kind === 'instant' || rule.intervalMinutes > 60) continue
    const r = intervalReach(plan, rule.label, rule.intervalMinutes)
    if (r === null) continue
    lo = Math.min(lo, r[0])
    hi = Math.max(hi, r[1])
  }
  return lo < plan.firstHourMs || hi > last ? [lo, hi] : null
}

/** Convert a column's readings to the series unit in place; returns the count of missing codes found here. */
function convertReadings(
  raw: RawTable,
  col: RawColumn,
  variable: WeatherVariable,
  conversion: UnitConversion,
  warnings: string[],
): number {
  const [lo, hi] = VALID_RANGE[variable]
  const { scale, offset } = conversion
  const checkCodes = raw.format === 'csv'
  const values = col.values
  let codes = 0
  for (let i = 0; i < values.length; i++) {
    const v = values[i]
    if (Number.isNaN(v)) continue
    const x = v * scale + offset
    if (checkCodes && (x < lo || x > hi) && MISSING_CODES.has(v)) {
      codes++
      values[i] = Number.NaN
      continue
    }
    values[i] = x
  }
  if (codes > 0) {
    warnings.push(
      `column '${snippet(col.source)}': ${codes} missing codes (such as -9999 or 999) read as missing`,
    )
  }
  return codes
}

/** The timing of a variable: the user's label and interval over the reader's, defaults filled in. */
function variableRule(
  raw: RawTable,
  variable: WeatherVariable,
  plan: RowPlan,
  fileLabels: IntervalLabel,
  override: VariableTimingOverride | undefined,
): { kind: ValueKind; label: IntervalLabel; intervalMinutes: number } {
  const read = columnTiming(raw, variable, DEFAULT_TIMING[variable])
  // a running total's increment covers the time since the previous row: it always ends at its stamp
  const label = read.kind === 'running-total' ? 'end' : (override?.label ?? read.label ?? fileLabels)
  const intervalMinutes =
    override?.intervalMinutes ?? read.intervalMinutes ?? (plan.sampling === 'reports' ? 60 : plan.stepMinutes)
  return { kind: read.kind, label, intervalMinutes }
}

/** Whether a conversion turns an amount (Wh/m², J/m², langley) into a mean irradiance over one hour. */
export function isEnergyAmount(conversion: UnitConversion): boolean {
  return (conversion as { amount?: boolean }).amount === true || / per hour$/.test(conversion.unit)
}

/** Amount-based irradiance (converted as if per hour) to the mean over each row's own interval. */
function rescaleAmountToMean(
  values: Float64Array,
  intervalMinutes: number,
  intervals: Float64Array | undefined,
): Float64Array {
  for (let i = 0; i < values.length; i++) {
    const minutes = intervals !== undefined ? intervals[i] / 60_000 : intervalMinutes
    values[i] = minutes > 0 ? (values[i] * 60) / minutes : Number.NaN
  }
  return values
}

/** A running total is reported as the interval totals it is turned into. */
function reportedKind(kind: ValueKind): ValueTiming {
  return kind === 'running-total' ? 'interval-total' : kind
}

/** Rows placed after a later row (file order), reported once each. */
function logOrder(raw: RawTable, plan: RowPlan, log: ProblemLog): void {
  let maxSeen = Number.NEGATIVE_INFINITY
  for (let i = 0; i < raw.rows; i++) {
    const t = plan.timeMs[i]
    if (Number.isNaN(t) || plan.duplicateOf[i] >= 0) continue
    if (t < maxSeen)
      log.add(
        raw.lines[i],
        null,
        'out-of-order',
        `time ${new Date(t).toISOString().slice(0, 16)}Z comes after a later one; placed at its time`,
      )
    else maxSeen = t
  }
}

/** Rows repeating the exact time of an earlier row: rejected, the first kept, both lines named. */
function logDuplicates(raw: RawTable, plan: RowPlan, quality: Uint8Array, log: ProblemLog): void {
  for (let i = 0; i < raw.rows; i++) {
    const other = plan.duplicateOf[i]
    if (other < 0) continue
    const h = plan.rowHour[i]
    if (h >= 0) quality[h] |= QualityFlag.duplicateTimestamp
    const same = sameValues(raw, other, i)
    log.add(
      raw.lines[i],
      null,
      'duplicate-timestamp',
      `time ${new Date(plan.timeMs[i]).toISOString().slice(0, 16)}Z already given on line ${raw.lines[other]}${same ? ' with the same values' : ' with different values'}: row rejected, first kept`,
    )
  }
}

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

/** Hours whose pressure the file marks as supplied (its own flags), as stuck-check exemptions. */
function suppliedPressureHours(quality: Uint8Array, fromFile: boolean): Uint8Array | undefined {
  if (!fromFile) return undefined
  const out = new Uint8Array(quality.length)
  for (let s = 0; s < quality.length; s++) if (quality[s] & QualityFlag.pressureFromElevation) out[s] = 1
  return out
}

/**
 * A pressure column that holds one value in every hour it has (more than a day of them) is a
 * supplied constant: noted, not a stuck sensor. When the site elevation is known and the constant
 * is far from the standard atmosphere there, the standard atmosphere replaces it. Returns true when
 * the column was constant.
 */
function constantPressure(
  values: Float64Array,
  ctx: AssembleContext,
  warnings: string[],
  notes: string[],
): boolean {
  let value = Number.NaN
  let count = 0
  for (let s = 0; s < values.length; s++) {
    const v = values[s]
    if (Number.isNaN(v)) continue
    if (count > 0 && v !== value) return false
    value = v
    count++
  }
  if (count < 24) return false
  // the value as a reader would write it (896 hPa is 89.6 kPa, not 89.60000000000001)
  const kpa = Number(value.toFixed(4))
  const elevation = ctx.site.elevationM
  if (elevation !== null) {
    const standard = standardPressureKpaAtElevation(elevation)
    if (Math.abs(standard - value) > CONSTANT_PRESSURE_TOLERANCE_KPA) {
      values.fill(Number.NaN)
      warnings.push(
        `pressure is ${kpa} kPa in every hour, far from the standard atmosphere at the site's ${elevation} m (${standard.toFixed(2)} kPa): the standard atmosphere is used instead`,
      )
      return true
    }
  }
  notes.push(
    `pressure is ${kpa} kPa in every hour: a constant the file was made with (the standard atmosphere of typical-year files), used as given, not judged as a sensor`,
  )
  warnings.push(
    `pressure is the same ${kpa} kPa in every hour: taken as a supplied constant, not a stuck sensor`,
  )
  return true
}

/** Rows read, used, repaired, rejected and superseded; rejected rows of hours without core values are logged. */
function countRows(
  raw: RawTable,
  plan: RowPlan,
  series: { quality: Uint8Array; dryBulbC: Float64Array },
  grid: HourGrid,
  rowChanged: Uint8Array,
  rowPlaced: Uint8Array,
  log: ProblemLog,
): { rows: WeatherReadResult['rows']; rejectedRows: RejectedRow[] } {
  /** Every rejected row with its line and why (uncapped, unlike the problem list). */
  const rejectedRows: RejectedRow[] = []
  let used = 0
  let repaired = 0
  let rejected = 0
  let superseded = 0
  const loggedHour = new Uint8Array(plan.hours)
  for (let i = 0; i < raw.rows; i++) {
    const h = plan.rowHour[i]
    if (raw.reportKind?.[i] === ReportKind.summary) {
      superseded++
      continue
    }
    if (h < 0 || plan.duplicateOf[i] >= 0) {
      rejected++
      const line = raw.lines[i]
      rejectedRows.push({
        line,
        kind: h < 0 ? (log.rowKinds.get(line) ?? 'bad-timestamp') : 'duplicate-timestamp',
      })
      continue
    }
    if (plan.sampling === 'reports' && rowPlaced[i] === 0) {
      superseded++
      continue
    }
    if (series.quality[h] & QualityFlag.missingCore) {
      rejected++
      rejectedRows.push({ line: raw.lines[i], kind: 'core-missing' })
      if (loggedHour[h] === 0) {
        loggedHour[h] = 1
        const what = Number.isNaN(series.dryBulbC[h]) ? 'dry bulb' : 'humidity'
        log.add(
          raw.lines[i],
          what === 'dry bulb' ? 'dryBulb' : 'relativeHumidity',
          'core-missing',
          `no ${what} for this hour (missing and not fillable): row rejected, hour excluded`,
        )
      }
      continue
    }
    if (rowChanged[i] !== 0 || grid.changed[h]) repaired++
    else used++
  }
  return { rows: { read: raw.rows, used, repaired, rejected, superseded }, rejectedRows }
}

function countHoursWithoutRow(plan: RowPlan): number {
  const has = new Uint8Array(plan.hours)
  for (let i = 0; i < plan.rowHour.length; i++) {
    const h = plan.rowHour[i]
    if (h >= 0) has[h] = 1
  }
  let count = 0
  for (let h = 0; h < plan.hours; h++) if (!has[h]) count++
  return count
}

/**
 * The error for a file with rows but not one hour that has both dry bulb and humidity: which of the
 * two is missing, how the values were lost (counts of problems by kind) and what to check.
 */
function noUsableHour(
  series: { hours: number; dryBulbC: Float64Array; relativeHumidityPct: Float64Array },
  columns: ColumnReport[],
  log: ProblemLog,
  aggregation: HourlyAggregation,
): WeatherInputError {
  let withDry = 0
  let withHumidity = 0
  for (let s = 0; s < series.hours; s++) {
    if (!Number.isNaN(series.dryBulbC[s])) withDry++
    if (!Number.isNaN(series.relativeHumidityPct[s])) withHumidity++
  }
  const lacking: string[] = []
  const humiditySources = columns
    .filter((c) => c.variable === 'relativeHumidity' || c.variable === 'dewPoint' || c.variable === 'wetBulb')
    .map((c) => `'${snippet(c.source)}'`)
  const drySource = columns.find((c) => c.variable === 'dryBulb')?.source ?? ''
  if (withDry === 0) lacking.push(`no hour has a dry bulb (column '${snippet(drySource)}')`)
  if (withHumidity === 0) lacking.push(`no hour has a humidity (column ${humiditySources.join(', ')})`)
  if (lacking.length === 0)
    lacking.push(`${withDry} hours have a dry bulb and ${withHumidity} a humidity, but never the same hour`)
  const counts = Object.entries(log.counts)
    .sort((a, b) => (b[1] ?? 0) - (a[1] ?? 0))
    .slice(0, 4)
    .map(([k, v]) => `${k} ${v}`)
  const below = Object.entries(aggregation.hoursBelowCoverage).map(
    ([v, k]) => `${v} ${k} hours with too few readings`,
  )
  const why = [...counts, ...below]
  return new WeatherInputError(
    `no usable hour in the file: ${lacking.join('; ')}${why.length > 0 ? ` (problems: ${why.join(', ')})` : ''}; ` +
      'check that the columns hold numbers in the stated units, or map the right ones with --map',
    ['usable hours'],
  )
}

/** Errors for absent dry bulb or humidity columns (checked before anything else is computed). */
function missingCoreColumns(raw: RawTable): WeatherInputError[] {
  const out: WeatherInputError[] = []
  if (!raw.columns.dryBulb) {
    out.push(
      new WeatherInputError(
        `no dry-bulb temperature column found (columns: ${allColumnsText(raw)}); map one with --map dryBulb=<column>[:C|F|K]`,
        ['dry bulb'],
      ),
    )
  }
  if (!raw.columns.relativeHumidity && !raw.columns.dewPoint && !raw.columns.wetBulb) {
    out.push(
      new WeatherInputError(
        `no humidity column (relative humidity, dew point or wet bulb) found; the columns are ${allColumnsText(raw)}: ` +
          'give one with --map relativeHumidity=<column>[:%|fraction], --map dewPoint=<column>[:C|F] or --map wetBulb=<column>[:C|F]',
        ['humidity'],
      ),
    )
  }
  return out
}

function mergeErrors(errors: WeatherInputError[]): WeatherInputError {
  if (errors.length === 1) return errors[0]
  return new WeatherInputError(
    errors.map((e, i) => `(${i + 1}) ${e.message}`).join('; '),
    errors.flatMap((e) => e.missing),
  )
}

function missingCoreHours(series: { quality: Uint8Array }): Uint8Array {
  const out = new Uint8Array(series.quality.length)
  for (let s = 0; s < out.length; s++) out[s] = series.quality[s] & QualityFlag.missingCore ? 1 : 0
  return out
}

function allColumnsText(raw: RawTable): string {
  const used = Object.values(raw.columns).map((c) => `'${snippet(c!.source)}'`)
  return [...used, ...raw.unusedColumns.map((c) => `'${snippet(c)}'`)].join(', ') || 'none'
}

function sameValues(raw: RawTable, a: number, b: number): boolean {
  for (const col of Object.values(raw.columns)) {
    const x = col!.values[a]
    const y = col!.values[b]
    if (!(x === y || (Number.isNaN(x) && Number.isNaN(y)))) return false
  }
  return true
}

function decideConversion(
  variable: WeatherVariable,
  col: RawColumn,
  warnings: string[],
): { conversion: UnitConversion; unitFrom: ColumnReport['unitFrom'] } {
  if (col.conversion !== null) {
    return { conversion: col.conversion, unitFrom: col.unitSource === 'none' ? 'assumed' : col.unitSource }
  }
  const guessed = guessUnitFromValues(variable, col.values)
  if (guessed !== null) {
    warnings.push(
      `column '${snippet(col.source)}' has no unit: its values look like ${guessed.unit}, read as ${guessed.unit} (override with --map ${variable}=${snippet(col.source)}:<unit>)`,
    )
    return { conversion: guessed, unitFrom: 'detected' }
  }
  const si = siUnit(variable)
  warnings.push(
    `column '${snippet(col.source)}' has no unit: assumed ${si.unit} (override with --map ${variable}=${snippet(col.source)}:<unit>)`,
  )
  return { conversion: si, unitFrom: 'assumed' }
}
