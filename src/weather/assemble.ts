/**
 * @module weather/assemble
 * The shared back half of every reader: row times to the UTC hour grid (duplicates and order
 * checked), units converted once, quality control, short gaps filled, humidity and pressure
 * completed, row accounting and coverage. Format readers only produce a {@link RawTable}.
 */

import { standardPressureKpaAtElevation } from '../physics/moist-air.ts'
import { summarizeCoverage } from './coverage.ts'
import { fillDaytimeIrradiance, fixNightIrradiance, hourSun, interpolateShortGaps } from './gap-fill.ts'
import { deriveRelativeHumidity } from './humidity.ts'
import type { ProblemLog } from './problem-log.ts'
import {
  type HourGrid,
  humidityBelowDryBulbCheck,
  rangeCheck,
  spikeCheck,
  stuckCheck,
  VALID_RANGE,
} from './quality.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import type { ColumnReport, RejectedRow, WeatherReadResult } from './result.ts'
import { createEmptySeries, QualityFlag, type SiteInfo, type ValueTiming } from './series.ts'
import { snippet } from './snippet.ts'
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

/** Raw numbers that data sources use for "missing" (reference §1 pitfall 8: −99, −999, −9999 and the EPW codes). */
export const MISSING_CODES = new Set([
  -99999, -9999.9, -9999, -999.9, -999, -99.9, -99, 99.9, 999, 999.9, 9999, 9999.9, 99999, 999999,
])

export interface AssembleContext {
  site: SiteInfo
  time: TimeBasisInput
  log: ProblemLog
  warnings: string[]
  /** Elevation-based pressure is allowed to assume sea level when the elevation is unknown. */
  elevationKnown: boolean
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
    times = resolveRowTimes(raw.time, raw.lines, ctx.time, log)
  } catch (e) {
    if (e instanceof WeatherInputError && missingColumns.length > 0) throw mergeErrors([e, ...missingColumns])
    throw e
  }
  if (missingColumns.length > 0) throw mergeErrors(missingColumns)
  warnings.push(...times.warnings)
  if (ctx.site.utcOffsetHours === null && times.zoneStandardOffsetHours !== null) {
    ctx.site.utcOffsetHours = times.zoneStandardOffsetHours
  }
  const starts = times.hourStartUtcMs
  let first = Number.POSITIVE_INFINITY
  let last = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    const t = starts[i]
    if (t < first) first = t
    if (t > last) last = t
  }
  if (!Number.isFinite(first)) {
    throw new WeatherInputError(
      `none of the ${n} rows has a usable timestamp (first problem: ${log.problems[0]?.message ?? 'none'}); ` +
        'map the time columns with --map timestamp=<column> (or date=, time=, year=, month=, day=, hour=)',
      ['timestamps'],
    )
  }
  const hours = (last - first) / MS_PER_HOUR + 1
  if (hours > MAX_SERIES_HOURS) {
    throw new WeatherInputError(
      `the timestamps span ${Math.round(hours / 8766)} years (${new Date(first).toISOString()} to ${new Date(last).toISOString()}); at most 100 years are read: check for stray dates`,
      ['timestamps'],
    )
  }
  const series = createEmptySeries(ctx.site, first, hours)
  series.typicalYear = times.typicalYear
  const grid: HourGrid = {
    hours,
    slotRow: new Int32Array(hours).fill(-1),
    lines: raw.lines,
    quality: series.quality,
    changed: new Uint8Array(hours),
  }
  const rowStatus = new Uint8Array(n) // 0 pending; rejected: 2 no time, 3 duplicate, 4 no dry bulb or humidity
  let maxSeen = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    const t = starts[i]
    if (Number.isNaN(t)) {
      rowStatus[i] = 2
      continue
    }
    const s = (t - first) / MS_PER_HOUR
    const other = grid.slotRow[s]
    if (other >= 0) {
      rowStatus[i] = 3
      series.quality[s] |= QualityFlag.duplicateTimestamp
      const same = sameValues(raw, other, i)
      log.add(
        raw.lines[i],
        null,
        'duplicate-timestamp',
        `hour ${new Date(t).toISOString().slice(0, 16)}Z already given on line ${raw.lines[other]}${same ? ' with the same values' : ' with different values'}: row rejected, first kept`,
      )
      continue
    }
    if (t < maxSeen)
      log.add(
        raw.lines[i],
        null,
        'out-of-order',
        `hour ${new Date(t).toISOString().slice(0, 16)}Z comes after a later hour; placed at its time`,
      )
    else maxSeen = t
    grid.slotRow[s] = i
  }

  const si: Partial<Record<WeatherVariable, Float64Array>> = {}
  const columns: ColumnReport[] = []
  for (const variable of WEATHER_VARIABLES) {
    const col = raw.columns[variable]
    if (col === undefined) continue
    const { conversion, unitFrom } = decideConversion(variable, col, warnings)
    const out = new Float64Array(hours).fill(Number.NaN)
    const [lo, hi] = VALID_RANGE[variable]
    let codes = col.missingCodeCount
    const { scale, offset } = conversion
    const checkCodes = raw.format === 'csv'
    for (let s = 0; s < hours; s++) {
      const row = grid.slotRow[s]
      if (row < 0) continue
      const v = col.values[row]
      const x = v * scale + offset
      if (checkCodes && (x < lo || x > hi) && MISSING_CODES.has(v)) {
        codes++
        continue
      }
      out[s] = x
    }
    if (codes > col.missingCodeCount && checkCodes) {
      warnings.push(
        `column '${snippet(col.source)}': ${codes - col.missingCodeCount} missing codes (such as -9999 or 999) read as missing`,
      )
    }
    const implausible = implausibleUnitWarning(variable, col.source, conversion, out)
    if (implausible) warnings.push(implausible)
    si[variable] = out
    columns.push({
      variable,
      source: col.source,
      unit: conversion.unit,
      unitFrom,
      timing: raw.timing[variable] ?? DEFAULT_TIMING[variable],
      missing: col.missingCount + (codes - col.missingCodeCount),
    })
  }

  const dry = si.dryBulb!
  for (const variable of WEATHER_VARIABLES) {
    const v = si[variable]
    if (v === undefined) continue
    const unit = SERIES_UNIT[variable]
    rangeCheck(grid, log, variable, v, unit)
  }
  if (si.dewPoint) humidityBelowDryBulbCheck(grid, log, 'dewPoint', si.dewPoint, dry)
  if (si.wetBulb) humidityBelowDryBulbCheck(grid, log, 'wetBulb', si.wetBulb, dry)
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
    spikeCheck(grid, log, variable, v, SERIES_UNIT[variable])
    stuckCheck(grid, log, variable, v, SERIES_UNIT[variable])
    // RH gaps are left to the dew point or wet bulb when the file has one (measured beats interpolated).
    if (variable === 'relativeHumidity' && (si.dewPoint || si.wetBulb)) continue
    interpolateShortGaps(grid, log, variable, v)
  }

  // Pressure: the file's, else (and in its long gaps) the standard atmosphere at the site elevation.
  const elevation = ctx.site.elevationM ?? 0
  const standardKpa = standardPressureKpaAtElevation(elevation)
  if (si.pressure) {
    series.pressureKpa.set(si.pressure)
  }
  let pressureSupplied = 0
  for (let s = 0; s < hours; s++) {
    if (Number.isNaN(series.pressureKpa[s])) {
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
  series.dryBulbC.set(dry)
  const derived = deriveRelativeHumidity(
    series.dryBulbC,
    series.pressureKpa,
    humidity,
    series.relativeHumidityPct,
  )
  if (derived.fromDewPoint > 0 && si.relativeHumidity)
    warnings.push(`${derived.fromDewPoint} hours without RH take it from the dew point`)
  if (si.wind) series.windMs.set(si.wind)
  if (si.rain) series.rainMm.set(si.rain)
  if (si.cloudCover) series.cloudCoverPct = si.cloudCover
  if (si.ghi) {
    series.ghiWm2.set(si.ghi)
    const lat = ctx.site.latitudeDeg
    const lon = ctx.site.longitudeDeg
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

  let missingCore = 0
  for (let s = 0; s < hours; s++) {
    if (Number.isNaN(series.dryBulbC[s]) || Number.isNaN(series.relativeHumidityPct[s])) {
      series.quality[s] |= QualityFlag.missingCore
      missingCore++
    }
  }
  let used = 0
  let repaired = 0
  let rejected = 0
  let withoutRow = 0
  for (let s = 0; s < hours; s++) {
    const row = grid.slotRow[s]
    if (row < 0) {
      withoutRow++
      continue
    }
    if (series.quality[s] & QualityFlag.missingCore) {
      rowStatus[row] = 4
      const what = Number.isNaN(series.dryBulbC[s]) ? 'dry bulb' : 'humidity'
      log.add(
        raw.lines[row],
        what === 'dry bulb' ? 'dryBulb' : 'relativeHumidity',
        'core-missing',
        `no ${what} for this hour (missing and not fillable): row rejected, hour excluded`,
      )
    } else if (grid.changed[s]) repaired++
    else used++
  }
  const rejectedRows: RejectedRow[] = []
  for (let i = 0; i < n; i++) {
    if (rowStatus[i] < 2) continue
    rejected++
    const line = raw.lines[i]
    const kind =
      rowStatus[i] === 3
        ? 'duplicate-timestamp'
        : rowStatus[i] === 4
          ? 'core-missing'
          : (log.rowKinds.get(line) ?? 'bad-timestamp')
    rejectedRows.push({ line, kind })
  }
  series.timing = Object.fromEntries(columns.map((c) => [c.variable, c.timing]))
  const coverage = summarizeCoverage(series, missingCoreHours(series))
  log.problems.sort((a, b) => (a.line ?? Number.MAX_SAFE_INTEGER) - (b.line ?? Number.MAX_SAFE_INTEGER))
  return {
    series,
    format: raw.format,
    rows: { read: n, used, repaired, rejected },
    rejectedRows,
    columns,
    problems: log.problems,
    problemCounts: log.counts,
    problemsOmitted: log.omitted,
    warnings,
    period: { start: new Date(first).toISOString(), end: new Date(last + MS_PER_HOUR).toISOString() },
    timeBasis: times.description,
    dstEvents: times.dstEvents,
    coverage: coverage.months,
    hoursWithoutRow: withoutRow,
    hoursMissingCore: missingCore,
    years: coverage.years,
    sourceYears: times.sourceYears,
  }
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
