/**
 * @module physics/wet-bulb
 * Thermodynamic wet-bulb temperature: the root of the psychrometer balance of ASHRAE Handbook —
 * Fundamentals (2017) ch. 1, eq 33 (wet wick, t* ≥ 0 °C) and eq 35 (iced wick), written in
 * physics/moist-air.ts (`humidityRatioFromWetBulb`); here solved for t* with a safeguarded Halley
 * iteration. Units: °C, kPa, kg/kg.
 */

import { KELVIN_OFFSET } from './constants.ts'
import {
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_ICE_KJ_PER_KG_K,
  CP_LIQUID_WATER_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  ICED_WICK_NUMERATOR_SLOPE,
  MOLAR_MASS_RATIO_WATER_AIR,
  SOLVER_MAX_ITERATIONS,
  SOLVER_STOP_STEP_C,
  SOLVER_TOLERANCE_C,
  SUBLIMATION_ENTHALPY_0C_KJ_PER_KG,
  saturationHumidityRatio,
  saturationTemperatureC,
  VAPOR_ENTHALPY_0C_KJ_PER_KG,
  vaporPressureFromHumidityRatio,
  WET_WICK_NUMERATOR_SLOPE,
} from './moist-air.ts'
import {
  lnSaturationPressureIcePa,
  SATURATION_MIN_C,
  saturationVaporPressureLiquidKpa,
  TRIPLE_POINT_C,
} from './saturation.ts'
import { saturationPressureFromTableKpa, saturationTableSlopes } from './saturation-table.ts'

/** Saturation pressure over ice at 0 °C [kPa] (eq 5): Ws* at t* = 0, where eq 33 meets eq 35. */
const SATURATION_PRESSURE_AT_ZERO_KPA = Math.exp(lnSaturationPressureIcePa(KELVIN_OFFSET)) / 1000

/**
 * In and out of {@link solveWetBulb}: one object reused for every hour of a loop (no number is boxed on the
 * call). The branch fields are set by {@link solveWetBulb} itself.
 */
export class WetBulbSearch {
  /** Dry bulb [°C]. */
  dryBulbC = Number.NaN
  /** Humidity ratio [kg/kg]. */
  humidityRatio = Number.NaN
  pressureKpa = Number.NaN
  /** Dew or frost point [°C] (the lower end of the bracket). */
  dewPointC = Number.NaN
  /** Ws at the dry bulb [kg/kg] (over liquid water or ice), or NaN: computed. Only sharpens the start. */
  saturationHumidityRatio = Number.NaN
  /** Branch searched: eq 33 (wet wick) or eq 35 (iced wick), and its bracket and first iterate [°C]. */
  liquid = true
  lo = Number.NaN
  hi = Number.NaN
  start = Number.NaN
  /** Out: thermodynamic wet bulb [°C]. */
  wetBulbC = Number.NaN
}

/**
 * Root of the psychrometer balance W(t*) = W on one branch, t* in [lo, hi] of `s`: eq 33 (wet wick,
 * liquid) or eq 35 (iced wick). Halley's method with the first and second derivatives (pws and its
 * derivatives from {@link saturationPressureFromTableKpa}), started at `s.start`, falling back to
 * bisection whenever a step leaves the bracket; W(t*) increases with t*, so the sign of W(t*) − W keeps
 * the bracket. Gives hi if W(hi) is still below W (no root at or below the dry bulb), lo if W(lo) is
 * above it. Result in `s.wetBulbC`.
 */
export function solveWetBulbBranch(s: WetBulbSearch): void {
  const dryBulbC = s.dryBulbC
  const targetW = s.humidityRatio
  const liquid = s.liquid
  let lo = s.lo
  let hi = s.hi
  const start = s.start
  const a0 = liquid ? VAPOR_ENTHALPY_0C_KJ_PER_KG : SUBLIMATION_ENTHALPY_0C_KJ_PER_KG // eq 33 / eq 35
  const ka = liquid ? WET_WICK_NUMERATOR_SLOPE : ICED_WICK_NUMERATOR_SLOPE
  const b0 = a0 + CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC
  const kb = liquid ? CP_LIQUID_WATER_KJ_PER_KG_K : CP_ICE_KJ_PER_KG_K
  const p = s.pressureKpa
  let x = start > lo && start < hi ? start : 0.5 * (lo + hi)
  for (let i = 0; i < SOLVER_MAX_ITERATIONS; i++) {
    // Ws* over ice below the triple point, also on the wet-wick branch for 0 ≤ t* < 0.01 (psychrolib 2.5.0).
    const ice = x < TRIPLE_POINT_C
    const pv = saturationPressureFromTableKpa(x, ice)
    const pv1 = saturationTableSlopes[0]
    const pv2 = saturationTableSlopes[1]
    // Ws* = ε pv/(p − pv) (eq 20) and its derivatives; one division each for 1/(p − pv) and 1/b.
    const inv = 1 / (p - pv)
    const ws = MOLAR_MASS_RATIO_WATER_AIR * pv * inv
    const e = MOLAR_MASS_RATIO_WATER_AIR * p * inv * inv
    const ws1 = e * pv1
    const ws2 = e * (pv2 + 2 * pv1 * pv1 * inv)
    const a = a0 - ka * x
    const invB = 1 / (b0 - kb * x)
    const q = (a * ws - CP_DRY_AIR_KJ_PER_KG_K * (dryBulbC - x)) * invB
    const q1 = (-ka * ws + a * ws1 + CP_DRY_AIR_KJ_PER_KG_K + kb * q) * invB
    const q2 = (-2 * ka * ws1 + a * ws2 + 2 * kb * q1) * invB
    const f = q - targetW
    if (f === 0) {
      s.wetBulbC = x
      return
    }
    if (f > 0) hi = x
    else lo = x
    const step = (2 * f * q1) / (2 * q1 * q1 - f * q2)
    const next = x - step
    if (next > lo && next < hi) {
      // Stop on a small step, but not across the kink of Ws* at the triple point (ice → liquid pws).
      if (Math.abs(step) < SOLVER_STOP_STEP_C && next < TRIPLE_POINT_C === ice) {
        s.wetBulbC = next
        return
      }
      x = next
    } else if (next >= hi && x < hi) {
      // Overshoot past the upper end (a root close to it, as in air near saturation): restart there;
      // W(t*) is convex, so from above the steps approach the root without leaving the bracket.
      x = hi
    } else {
      x = 0.5 * (lo + hi)
    }
    if (hi - lo < SOLVER_TOLERANCE_C) {
      s.wetBulbC = x
      return
    }
  }
  throw new RangeError(`wet bulb did not converge for dry bulb ${dryBulbC} °C, W ${targetW}`)
}

/**
 * Start value for {@link solveWetBulbBranch}: the balance solved with Ws* replaced by its chord between
 * (xa, wa) and (xb, wb) and the t*-dependent terms taken at the midpoint. Ws* is convex, so this lands
 * at or below the root, usually within a few tenths of a degree.
 */
export function chordStartC(
  dryBulbC: number,
  targetW: number,
  liquid: boolean,
  xa: number,
  wa: number,
  xb: number,
  wb: number,
): number {
  if (!(xb - xa > 1e-9)) return xb
  const m = 0.5 * (xa + xb)
  const a = liquid
    ? VAPOR_ENTHALPY_0C_KJ_PER_KG - WET_WICK_NUMERATOR_SLOPE * m
    : SUBLIMATION_ENTHALPY_0C_KJ_PER_KG - ICED_WICK_NUMERATOR_SLOPE * m
  const b = liquid
    ? VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC - CP_LIQUID_WATER_KJ_PER_KG_K * m
    : SUBLIMATION_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC - CP_ICE_KJ_PER_KG_K * m
  const s = (wb - wa) / (xb - xa)
  return (
    xa + (targetW * b - a * wa + CP_DRY_AIR_KJ_PER_KG_K * (dryBulbC - xa)) / (a * s + CP_DRY_AIR_KJ_PER_KG_K)
  )
}

/**
 * Thermodynamic wet-bulb temperature [°C] from dry bulb [°C], humidity ratio [kg/kg] and pressure [kPa]:
 * the root of the psychrometer balance (ASHRAE HOF 2017 ch. 1 eqs 33/35) between the frost/dew point and
 * the dry bulb, accuracy {@link SOLVER_TOLERANCE_C}.
 *
 * Two roots near 0 °C: eq 35 just below 0 °C gives a higher W than eq 33 just above it, so for dry bulbs
 * of roughly 0–10 °C a narrow band of W has a root on each side of 0 °C. We then always return the
 * liquid-wick root (t* ≥ 0 °C): deterministic, and the state a wet wick reaches when it is not frozen.
 */
export function wetBulbFromHumidityRatioC(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
): number {
  const pw = Math.max(vaporPressureFromHumidityRatio(humidityRatioKgPerKg, pressureKpa), 1e-9)
  const ice = pw < saturationVaporPressureLiquidKpa(TRIPLE_POINT_C)
  const dewC = saturationTemperatureC(pw, Math.log(pw * 1000), ice)
  return wetBulbWithDewPointC(dryBulbC, humidityRatioKgPerKg, pressureKpa, dewC)
}

/**
 * As {@link wetBulbFromHumidityRatioC} when the dew (or frost) point `dewC` [°C] is already known; it is
 * the lower end of the bracket and the chord start, so either the dew or the frost point will do.
 * `saturationHumidityRatioAtDryBulb` (Ws at the dry bulb, over liquid water or ice) only sharpens the
 * start value; it is computed when omitted. The choice between the two roots near 0 °C (see
 * {@link wetBulbFromHumidityRatioC}) is made here: the liquid-wick root whenever W ≥ W(t* = 0) by eq 33.
 *
 * Where W exceeds saturation over ice at a dry bulb at or below 0 °C (station RH over water above
 * pws,ice/pws,liquid, e.g. above 82 % at −20 °C) the iced-wick balance has no root at or below the dry
 * bulb; the dry bulb is returned.
 */
export function wetBulbWithDewPointC(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
  dewC: number,
  saturationHumidityRatioAtDryBulb?: number,
): number {
  const s = scratch
  s.dryBulbC = dryBulbC
  s.humidityRatio = humidityRatioKgPerKg
  s.pressureKpa = pressureKpa
  s.dewPointC = dewC
  s.saturationHumidityRatio = saturationHumidityRatioAtDryBulb ?? Number.NaN
  solveWetBulb(s)
  return s.wetBulbC
}

const scratch = new WetBulbSearch()

/** {@link wetBulbWithDewPointC} on a {@link WetBulbSearch}, for hot loops: the wet bulb into `s.wetBulbC`. */
export function solveWetBulb(s: WetBulbSearch): void {
  const t = s.dryBulbC
  const w = s.humidityRatio
  const pressureKpa = s.pressureKpa
  const dew = Math.min(s.dewPointC, t)
  const wsGiven = s.saturationHumidityRatio
  if (dew >= TRIPLE_POINT_C) {
    // Root at or above the dew point, so on the wet-wick branch (eq 33 at t* = dew gives W* ≤ W).
    const wst = Number.isNaN(wsGiven) ? saturationHumidityRatio(t, pressureKpa) : wsGiven
    searchBranch(s, true, dew, t, chordStartC(t, w, true, dew, w, t, wst))
    return
  }
  if (t > 0) {
    const ws0 =
      (MOLAR_MASS_RATIO_WATER_AIR * SATURATION_PRESSURE_AT_ZERO_KPA) /
      (pressureKpa - SATURATION_PRESSURE_AT_ZERO_KPA)
    // eq 33 at t* = 0
    const wAtZeroLiquid =
      (VAPOR_ENTHALPY_0C_KJ_PER_KG * ws0 - CP_DRY_AIR_KJ_PER_KG_K * t) /
      (VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * t)
    if (w >= wAtZeroLiquid) {
      const wst = Number.isNaN(wsGiven) ? saturationHumidityRatio(t, pressureKpa) : wsGiven
      const lo = Math.max(dew, 0)
      searchBranch(s, true, lo, t, chordStartC(t, w, true, lo, dew >= 0 ? w : ws0, t, wst))
      return
    }
    searchBranch(s, false, Math.max(dew - 1, SATURATION_MIN_C), 0, chordStartC(t, w, false, dew, w, 0, ws0))
    s.wetBulbC = Math.max(s.wetBulbC, dew)
    return
  }
  // Ws over ice at the dry bulb (eq 5 via the table, 1e-9 relative; pws ≪ p below 0 °C).
  const pwsIce = saturationPressureFromTableKpa(t, true)
  const wsIce = (MOLAR_MASS_RATIO_WATER_AIR * pwsIce) / (pressureKpa - pwsIce)
  if (w >= wsIce) {
    s.wetBulbC = t // supersaturated over ice: no iced-wick root at or below the dry bulb
    return
  }
  // The root is at or above the dew/frost point (ASHRAE eq 35 at t* = dew gives W* ≤ W), so clamping
  // there only removes the bisection's last 1e-5 °C.
  searchBranch(s, false, Math.max(dew - 1, SATURATION_MIN_C), t, chordStartC(t, w, false, dew, w, t, wsIce))
  s.wetBulbC = Math.max(s.wetBulbC, dew)
}

function searchBranch(s: WetBulbSearch, liquid: boolean, lo: number, hi: number, start: number): void {
  s.liquid = liquid
  s.lo = lo
  s.hi = hi
  s.start = start
  solveWetBulbBranch(s)
}
