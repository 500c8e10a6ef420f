/**
 * @module physics/air-columns
 * Column form of the moist-air state for hourly series: fills preallocated Float64Arrays without
 * allocating per hour. Same equations as {@link airState} (ASHRAE HOF 2017 ch. 1), RH over liquid water.
 * Missing input (NaN) or input outside the valid domain (the ranges of {@link airState}, and a dry bulb
 * at or above the boiling point at that pressure) gives NaN in every output for that hour.
 *
 * Speed: pws at the dry bulb comes from the interpolated table of eq 6 (src/physics/saturation-table.ts,
 * within 1e-9 relative, so W, h and density agree with airState to about 1e-9 relative), one logarithm
 * per hour starts the dew point, and Ws at the dry bulb sharpens the wet-bulb start value; see
 * bench/sections/moist-air.ts.
 */
import {
  DRY_BULB_MAX_C,
  DRY_BULB_MIN_C,
  GAS_CONSTANT_DRY_AIR_KJ_PER_KG_K,
  MOLAR_MASS_RATIO_WATER_AIR,
  PRESSURE_MAX_KPA,
  PRESSURE_MIN_KPA,
  saturationTemperatureC,
  VAPOR_PRESSURE_MIN_KPA,
  wetBulbWithDewPointC,
} from './moist-air.ts'
import { KELVIN_OFFSET } from './saturation.ts'
import { saturationPressureFromTableKpa } from './saturation-table.ts'

export interface AirColumnsInput {
  dryBulbC: Float64Array
  /** RH over liquid water [%]. */
  relativeHumidityPct: Float64Array
  pressureKpa: Float64Array
}

/** Output columns; any may be omitted, and omitted ones are not computed (the wet bulb costs most). */
export interface AirColumnsOutput {
  humidityRatioKgPerKg?: Float64Array
  vaporPressureKpa?: Float64Array
  dewPointC?: Float64Array
  wetBulbC?: Float64Array
  enthalpyKjPerKg?: Float64Array
  densityKgPerM3?: Float64Array
}

/**
 * Fill `out` for every hour of `input`. Returns the number of hours whose input was missing or outside
 * the domain (those hours are NaN in every output).
 */
export function fillAirStateColumns(input: AirColumnsInput, out: AirColumnsOutput): number {
  const n = input.dryBulbC.length
  const { dryBulbC, relativeHumidityPct, pressureKpa } = input
  const wOut = out.humidityRatioKgPerKg
  const pwOut = out.vaporPressureKpa
  const tdOut = out.dewPointC
  const twbOut = out.wetBulbC
  const hOut = out.enthalpyKjPerKg
  const rhoOut = out.densityKgPerM3
  let invalid = 0
  for (let i = 0; i < n; i++) {
    const t = dryBulbC[i]
    const rh = relativeHumidityPct[i]
    const p = pressureKpa[i]
    if (
      !(t >= DRY_BULB_MIN_C && t <= DRY_BULB_MAX_C) ||
      !(rh > 0 && rh <= 100) ||
      !(p >= PRESSURE_MIN_KPA && p <= PRESSURE_MAX_KPA)
    ) {
      invalid++
      if (wOut) wOut[i] = Number.NaN
      if (pwOut) pwOut[i] = Number.NaN
      if (tdOut) tdOut[i] = Number.NaN
      if (twbOut) twbOut[i] = Number.NaN
      if (hOut) hOut[i] = Number.NaN
      if (rhoOut) rhoOut[i] = Number.NaN
      continue
    }
    // pws over liquid water from the interpolated eq 6 table: within 1e-9 relative of the formula.
    const pws = saturationPressureFromTableKpa(t, false)
    const pw = (rh / 100) * pws
    if (!(pws < p) || !(pw >= VAPOR_PRESSURE_MIN_KPA)) {
      invalid++
      if (wOut) wOut[i] = Number.NaN
      if (pwOut) pwOut[i] = Number.NaN
      if (tdOut) tdOut[i] = Number.NaN
      if (twbOut) twbOut[i] = Number.NaN
      if (hOut) hOut[i] = Number.NaN
      if (rhoOut) rhoOut[i] = Number.NaN
      continue
    }
    const w = (MOLAR_MASS_RATIO_WATER_AIR * pw) / (p - pw)
    if (wOut) wOut[i] = w
    if (pwOut) pwOut[i] = pw
    if (tdOut || twbOut) {
      let td = saturationTemperatureC(pw, Math.log(pw * 1000), false)
      if (td > t) td = t
      if (tdOut) tdOut[i] = td
      if (twbOut) {
        const wst = (MOLAR_MASS_RATIO_WATER_AIR * pws) / (p - pws)
        twbOut[i] = wetBulbWithDewPointC(t, w, p, td, wst)
      }
    }
    if (hOut) hOut[i] = 1.006 * t + w * (2501 + 1.86 * t)
    if (rhoOut) {
      rhoOut[i] =
        ((1 + w) * p) / (GAS_CONSTANT_DRY_AIR_KJ_PER_KG_K * (t + KELVIN_OFFSET) * (1 + 1.607858 * w))
    }
  }
  return invalid
}
