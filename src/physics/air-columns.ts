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
 * wet-bulb start value, and the wet-wick wet bulb (dew point at or above 0.01 °C, most hours) comes from
 * an iteration written out in the hour loop; other hours go through wetBulbWithDewPointC (physics/wet-bulb.ts). Measured against
 * psychrolib in bench/sections/moist-air.ts (`npm run bench`).
 */

import {
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_LIQUID_WATER_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  DRY_BULB_MAX_C,
  DRY_BULB_MIN_C,
  humidityRatioFromVaporPressure,
  MOLAR_MASS_RATIO_WATER_AIR,
  moistAirDensityKgPerM3,
  moistAirEnthalpyKjPerKg,
  PRESSURE_MAX_KPA,
  PRESSURE_MIN_KPA,
  SOLVER_MAX_ITERATIONS,
  SOLVER_STOP_STEP_C,
  SOLVER_TOLERANCE_C,
  VAPOR_ENTHALPY_0C_KJ_PER_KG,
  VAPOR_PRESSURE_MIN_KPA,
  WET_WICK_NUMERATOR_SLOPE,
} from './moist-air.ts'
import { SATURATION_MIN_C, TRIPLE_POINT_C } from './saturation.ts'
import {
  LIQUID_SATURATION_TABLE,
  SATURATION_TABLE_NODES_PER_K,
  saturationPressureFromTableKpa,
  saturationTemperatureFromTableC,
} from './saturation-table.ts'
import { wetBulbWithDewPointC } from './wet-bulb.ts'

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
        if (td >= TRIPLE_POINT_C) {
          // Wet-wick branch (eq 33), the common case, written out for speed (V8 does not inline a solver
          // call here): the same chord start and safeguarded Halley iteration as wetBulbWithDewPointC in
          // physics/wet-bulb.ts (bracket [dew point, dry bulb], restart at the upper end on overshoot,
          // bisection otherwise, stop on a step below SOLVER_STOP_STEP_C), pws read from the table inline.
          let twb = t
          if (t - td > 1e-9) {
            let lo = td
            let hi = t
            const b0 = VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * t
            const mid = 0.5 * (lo + hi)
            const am = VAPOR_ENTHALPY_0C_KJ_PER_KG - WET_WICK_NUMERATOR_SLOPE * mid
            let x =
              lo +
              (w * (b0 - CP_LIQUID_WATER_KJ_PER_KG_K * mid - am) + CP_DRY_AIR_KJ_PER_KG_K * (t - lo)) /
                ((am * (wst - w)) / (hi - lo) + CP_DRY_AIR_KJ_PER_KG_K)
            if (!(x > lo && x < hi)) x = mid
            for (let k = 0; k < SOLVER_MAX_ITERATIONS; k++) {
              // saturationPressureFromTableKpa(x, false) written out (x is within 0…100 °C here).
              const su = (x - SATURATION_MIN_C) * SATURATION_TABLE_NODES_PER_K
              const j = 2 * Math.floor(su)
              const u = su - 0.5 * j
              const y0 = LIQUID_SATURATION_TABLE[j]
              const m0 = LIQUID_SATURATION_TABLE[j + 1]
              const y1 = LIQUID_SATURATION_TABLE[j + 2]
              const m1 = LIQUID_SATURATION_TABLE[j + 3]
              const c2 = 3 * (y1 - y0) - 2 * m0 - m1
              const c3 = 2 * (y0 - y1) + m0 + m1
              const pv = y0 + u * (m0 + u * (c2 + u * c3))
              const pv1 = (m0 + u * (2 * c2 + 3 * c3 * u)) * SATURATION_TABLE_NODES_PER_K
              const pv2 = (2 * c2 + 6 * c3 * u) * SATURATION_TABLE_NODES_PER_K * SATURATION_TABLE_NODES_PER_K
              const inv = 1 / (p - pv)
              const ws = MOLAR_MASS_RATIO_WATER_AIR * pv * inv
              const e = MOLAR_MASS_RATIO_WATER_AIR * p * inv * inv
              const ws1 = e * pv1
              const ws2 = e * (pv2 + 2 * pv1 * pv1 * inv)
              const a = VAPOR_ENTHALPY_0C_KJ_PER_KG - WET_WICK_NUMERATOR_SLOPE * x
              const invB = 1 / (b0 - CP_LIQUID_WATER_KJ_PER_KG_K * x)
              const q = (a * ws - CP_DRY_AIR_KJ_PER_KG_K * (t - x)) * invB
              const q1 =
                (-WET_WICK_NUMERATOR_SLOPE * ws +
                  a * ws1 +
                  CP_DRY_AIR_KJ_PER_KG_K +
                  CP_LIQUID_WATER_KJ_PER_KG_K * q) *
                invB
              // 2·slope and 2·c_w are exact doublings of the constants
              const q2 =
                (-2 * WET_WICK_NUMERATOR_SLOPE * ws1 + a * ws2 + 2 * CP_LIQUID_WATER_KJ_PER_KG_K * q1) * invB
              const g = q - w
              twb = x
              if (g === 0) break
              if (g > 0) hi = x
              else lo = x
              const step = (2 * g * q1) / (2 * q1 * q1 - g * q2)
              const next = x - step
              if (next > lo && next < hi) {
                twb = next
                if (Math.abs(step) < SOLVER_STOP_STEP_C) break
                x = next
              } else if (next >= hi && x < hi) x = hi
              else x = 0.5 * (lo + hi)
              twb = x
              if (hi - lo < SOLVER_TOLERANCE_C) break
            }
          }
          twbOut[i] = twb
        } else {
          twbOut[i] = wetBulbWithDewPointC(t, w, p, td, wst)
        }
      }
    }
    if (hOut) hOut[i] = moistAirEnthalpyKjPerKg(t, w)
    if (rhoOut) rhoOut[i] = moistAirDensityKgPerM3(t, w, p)
  }
  return invalid
}
