/**
 * @module weather/readings
 * Each column's readings in the series unit, converted once: the unit as stated, detected from the
 * values or assumed (with a warning), missing codes read as missing, amounts of irradiation turned
 * into mean irradiance over their interval.
 */
import { MS_PER_MINUTE } from '../physics/constants.ts'
import type { ProblemLog } from './problem-log.ts'
import { rangeCheckReadings, VALID_RANGE } from './quality.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import type { ColumnReport } from './result.ts'
import { snippet } from './snippet.ts'
import {
  guessUnitFromValues,
  implausibleUnitWarning,
  SERIES_UNIT,
  siUnit,
  type UnitConversion,
  WEATHER_VARIABLES,
  type WeatherVariable,
} from './units.ts'
import { readTiming, reportedKind } from './variable-timing.ts'

/** Raw numbers that data sources use for "missing": −99, −999, −9999 and their variants (common practice in station exports, no source) and the EPW field codes (EPW data dictionary); see docs/weather.md. */
export const MISSING_CODES = new Set([
  -99999, -9999.9, -9999, -999.9, -999, -99.9, -99, 99.9, 999, 999.9, 9999, 9999.9, 99999, 999999,
])

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

/** Whether a conversion turns an amount (Wh/m², J/m², langley) into a mean irradiance over one hour. */
export function isEnergyAmount(conversion: UnitConversion): boolean {
  return (conversion as { amount?: boolean }).amount === true || / per hour$/.test(conversion.unit)
}

/** Amount-based irradiance (converted as if per hour) to the mean over each row's own interval. */
export function rescaleAmountToMean(
  values: Float64Array,
  intervalMinutes: number,
  intervals: Float64Array | undefined,
): Float64Array {
  for (let i = 0; i < values.length; i++) {
    const minutes = intervals !== undefined ? intervals[i] / MS_PER_MINUTE : intervalMinutes
    values[i] = minutes > 0 ? (values[i] * 60) / minutes : Number.NaN
  }
  return values
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

/** A column converted to its series unit, with the conversion that was applied. */
export interface ConvertedColumn {
  col: RawColumn
  conversion: UnitConversion
}

/**
 * Every column of the table converted in place to its series unit (see the module); readings out of
 * range rejected with their line (running totals later, as increments), `rowChanged` marking the rows
 * touched. Returns the converted columns and the account of each.
 */
export function convertColumns(
  raw: RawTable,
  log: ProblemLog,
  warnings: string[],
): {
  converted: Partial<Record<WeatherVariable, ConvertedColumn>>
  columns: ColumnReport[]
  rowChanged: Uint8Array
} {
  const rowChanged = new Uint8Array(raw.rows)
  const converted: Partial<Record<WeatherVariable, ConvertedColumn>> = {}
  const columns: ColumnReport[] = []
  for (const variable of WEATHER_VARIABLES) {
    const col = raw.columns[variable]
    if (col === undefined) continue
    const { conversion, unitFrom } = decideConversion(variable, col, warnings)
    const codes = convertReadings(raw, col, variable, conversion, warnings)
    // a running total is judged once turned into increments (its day's sum may exceed an hour's range)
    if (readTiming(raw, variable).kind !== 'running-total') {
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
      timing: reportedKind(readTiming(raw, variable).kind),
      missing: col.missingCount + codes,
    })
  }
  return { converted, columns, rowChanged }
}
