/**
 * @module weather/station-pressure
 * Station pressure: a column held at one value through the file is a supplied constant (noted, or
 * replaced by the standard atmosphere when far from it), and hours without pressure take the standard
 * atmosphere at the site's elevation.
 */
import { standardPressureKpaAtElevation } from '../physics/moist-air.ts'
import type { ColumnReport } from './result.ts'
import { QualityFlag } from './series.ts'

/**
 * Pressure held at one value through a whole file is a supplied constant (typical-year files are
 * often written with the standard atmosphere), not a stuck sensor. Beyond this difference [kPa]
 * from the standard atmosphere at a known elevation (about 170 m of height), the constant is
 * replaced by that standard atmosphere. Common practice, no source.
 */
export const CONSTANT_PRESSURE_TOLERANCE_KPA = 2

/** Hours whose pressure the file marks as supplied (its own flags), as stuck-check exemptions. */
export function suppliedPressureHours(quality: Uint8Array, fromFile: boolean): Uint8Array | undefined {
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
export function constantPressure(
  values: Float64Array,
  elevationM: number | null,
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
  const elevation = elevationM
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

/**
 * Pressure: the file's, else (and in its long gaps) the standard atmosphere at the site elevation
 * (ASHRAE HOF 2017 ch. 1 eq 3), flagged. Only hours with a dry bulb need it (humidity from a wet bulb
 * uses it); an hour without one is excluded anyway, and its export row stays empty rather than show a
 * pressure nobody measured. A table without a pressure column gets the supplied column in its account.
 */
export function fillStandardPressure(
  pressureKpa: Float64Array,
  dryBulbC: Float64Array,
  quality: Uint8Array,
  site: { elevationM: number | null; elevationKnown: boolean; hasPressureColumn: boolean },
  columns: ColumnReport[],
  warnings: string[],
): void {
  const elevation = site.elevationM ?? 0
  const standardKpa = standardPressureKpaAtElevation(elevation)
  let pressureSupplied = 0
  for (let s = 0; s < pressureKpa.length; s++) {
    if (Number.isNaN(pressureKpa[s]) && !Number.isNaN(dryBulbC[s])) {
      pressureKpa[s] = standardKpa
      quality[s] |= QualityFlag.pressureFromElevation
      pressureSupplied++
    }
  }
  if (!site.hasPressureColumn) {
    columns.push({
      variable: 'pressure',
      source: `standard atmosphere at ${elevation} m (ASHRAE HOF 2017 ch. 1 eq 3)`,
      unit: 'kPa',
      unitFrom: 'supplied',
      timing: 'instant',
      missing: 0,
    })
    warnings.push(
      site.elevationKnown
        ? `no pressure column: station pressure is the standard atmosphere at ${elevation} m (${standardKpa.toFixed(2)} kPa)`
        : 'no pressure column and no elevation: station pressure assumed at sea level (101.325 kPa); give --elevation <m> for the site',
    )
  } else if (pressureSupplied > 0) {
    warnings.push(`${pressureSupplied} hours without pressure take the standard atmosphere at ${elevation} m`)
  }
}
