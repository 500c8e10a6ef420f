/**
 * @module physics/air-columns
 * Column form of the moist-air state for hourly series: fills preallocated Float64Arrays without
 * allocating per hour. Same equations as {@link airState} (ASHRAE HOF 2017 ch. 1), RH over liquid water.
 * Missing input (NaN) or input outside the valid domain (the ranges of {@link airState}, and a dry bulb
 * at or above the boiling point at that pressure) gives NaN in every output for that hour.
 *
 * Speed: pws at the dry bulb comes from the interpolated table of eq 6 (src/physics/saturation-table.ts,
 * within 1e-9 relative, so W, h and density agree with airState to about 1e-9 relative), the dew point
 * comes from the inverse table after one logarithm (within 1e-9 °C), Ws at the dry bulb sharpens the
 * wet-bulb start value, and the wet bulb comes from the solver of the scalar form (physics/wet-bulb.ts
 * solveWetBulb) on one state object reused for every hour (no number boxed on the call). Measured against
 * psychrolib in bench/sections/moist-air.ts (`npm run bench`).
 */

import {
  DRY_BULB_MAX_C,
  DRY_BULB_MIN_C,
  humidityRatioFromVaporPressure,
  moistAirDensityKgPerM3,
  moistAirEnthalpyKjPerKg,
  PRESSURE_MAX_KPA,
  PRESSURE_MIN_KPA,
  VAPOR_PRESSURE_MIN_KPA,
} from './moist-air.ts'
import { TRIPLE_POINT_C } from './saturation.ts'
import { saturationPressureFromTableKpa, saturationTemperatureFromTableC } from './saturation-table.ts'
import { chordStartC, solveWetBulb, solveWetBulbBranch, WetBulbSearch } from './wet-bulb.ts'

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

/** NaN in every output column for hour i (missing or out-of-domain input). */
function markInvalid(out: AirColumnsOutput, i: number): void {
  if (out.humidityRatioKgPerKg) out.humidityRatioKgPerKg[i] = Number.NaN
  if (out.vaporPressureKpa) out.vaporPressureKpa[i] = Number.NaN
  if (out.dewPointC) out.dewPointC[i] = Number.NaN
  if (out.wetBulbC) out.wetBulbC[i] = Number.NaN
  if (out.enthalpyKjPerKg) out.enthalpyKjPerKg[i] = Number.NaN
  if (out.densityKgPerM3) out.densityKgPerM3[i] = Number.NaN
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
  const search = new WetBulbSearch()
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
      markInvalid(out, i)
      continue
    }
    // pws over liquid water from the interpolated eq 6 table: within 1e-9 relative of the formula.
    const pws = saturationPressureFromTableKpa(t, false)
    const pw = (rh / 100) * pws
    if (!(pws < p) || !(pw >= VAPOR_PRESSURE_MIN_KPA)) {
      invalid++
      markInvalid(out, i)
      continue
    }
    const w = humidityRatioFromVaporPressure(pw, p)
    if (wOut) wOut[i] = w
    if (pwOut) pwOut[i] = pw
    if (tdOut || twbOut) {
      // Dew point over liquid water straight from the inverse table: within 1e-9 °C of the root of eq 6
      // (test/physics/saturation-table.test.ts), so no solver step is needed here.
      let td = saturationTemperatureFromTableC(Math.log(pw * 1000), false)
      if (td > t) td = t
      if (tdOut) tdOut[i] = td
      if (twbOut) {
        const wst = humidityRatioFromVaporPressure(pws, p)
        search.dryBulbC = t
        search.humidityRatio = w
        search.pressureKpa = p
        if (td >= TRIPLE_POINT_C) {
          // the common case, wet wick (eq 33) between dew point and dry bulb, as solveWetBulb does it
          search.liquid = true
          search.lo = td
          search.hi = t
          search.start = chordStartC(t, w, true, td, w, t, wst)
          solveWetBulbBranch(search)
        } else {
          search.dewPointC = td
          search.saturationHumidityRatio = wst
          solveWetBulb(search)
        }
        twbOut[i] = search.wetBulbC
      }
    }
    if (hOut) hOut[i] = moistAirEnthalpyKjPerKg(t, w)
    if (rhoOut) rhoOut[i] = moistAirDensityKgPerM3(t, w, p)
  }
  return invalid
}
