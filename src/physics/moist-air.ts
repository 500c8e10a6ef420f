/**
 * @module physics/moist-air
 * Moist-air properties by the perfect-gas relations of ASHRAE Handbook — Fundamentals (2017) ch. 1.
 * Units: temperature [°C], pressure [kPa], humidity ratio [kg water / kg dry air], enthalpy [kJ/kg dry air],
 * specific volume [m³/kg dry air]. Equation numbers are those of the 2017 SI edition (they change between
 * editions).
 */

import { KELVIN_OFFSET } from './constants.ts'
import {
  lnSaturationPressureIcePa,
  lnSaturationPressureLiquidPa,
  SATURATION_MAX_C,
  SATURATION_MIN_C,
  saturationVaporPressureKpa,
  saturationVaporPressureLiquidKpa,
  TRIPLE_POINT_C,
} from './saturation.ts'
import {
  saturationPressureFromTableKpa,
  saturationTableSlopes,
  saturationTemperatureFromTableC,
} from './saturation-table.ts'

/** Ratio of molar masses of water and dry air, 18.015268/28.966 (ASHRAE HOF 2017 ch. 1 eq 20). */
export const MOLAR_MASS_RATIO_WATER_AIR = 0.621945
/** Gas constant of dry air [kJ/(kg·K)], 8.314472/28.966 (ASHRAE HOF 2017 ch. 1 eq 1). */
export const GAS_CONSTANT_DRY_AIR_KJ_PER_KG_K = 0.287042
/** Standard sea-level pressure [kPa] (ASHRAE HOF 2017 ch. 1 Table 1). */
export const STANDARD_PRESSURE_KPA = 101.325
/** Accepted range of total (station) pressure [kPa]; also catches Pa or hPa given by mistake. */
export const PRESSURE_MIN_KPA = 30
export const PRESSURE_MAX_KPA = 110
/** Accepted dry-bulb range of the state functions [°C]; the wet-bulb relations are not valid above 100 °C. */
export const DRY_BULB_MIN_C = -60
export const DRY_BULB_MAX_C = 100
/**
 * Accuracy of the temperature solvers (dew/frost point, wet bulb) [°C]. They are Halley iterations
 * (cubic convergence) that stop once a step is below {@link SOLVER_STOP_STEP_C}; the error left after
 * such a step is of order 1e-4·step³ (measured below 1e-7 °C over the whole domain in
 * test/physics/solver-accuracy.test.ts against a 1e-12 °C bisection). Bisection fallback steps stop
 * when the bracket is narrower than this value.
 */
export const SOLVER_TOLERANCE_C = 1e-5
/** Halley step [°C] below which the temperature solvers stop (see {@link SOLVER_TOLERANCE_C}). */
export const SOLVER_STOP_STEP_C = 0.02
/** Iteration cap of the temperature solvers. */
export const SOLVER_MAX_ITERATIONS = 60

export function checkPressure(pressureKpa: number): void {
  if (!(pressureKpa >= PRESSURE_MIN_KPA && pressureKpa <= PRESSURE_MAX_KPA)) {
    throw new RangeError(
      `pressure must be between ${PRESSURE_MIN_KPA} and ${PRESSURE_MAX_KPA} kPa, got ${pressureKpa} (is it in Pa or hPa?)`,
    )
  }
}

export function checkDryBulb(dryBulbC: number): void {
  if (!(dryBulbC >= DRY_BULB_MIN_C && dryBulbC <= DRY_BULB_MAX_C)) {
    throw new RangeError(
      `dry bulb must be between ${DRY_BULB_MIN_C} and ${DRY_BULB_MAX_C} °C, got ${dryBulbC}`,
    )
  }
}

/**
 * Standard-atmosphere pressure [kPa] at elevation `elevationM` [m]: p = 101.325 (1 − 2.25577e−5 Z)^5.2559,
 * ASHRAE HOF 2017 ch. 1 eq 3. Example: 1000 m → 89.875 kPa.
 */
export function standardPressureKpaAtElevation(elevationM: number): number {
  if (!(elevationM >= -500 && elevationM <= 9000)) {
    throw new RangeError(`elevation must be between -500 and 9000 m, got ${elevationM}`)
  }
  // exp/log rather than `**`: Math.pow differs in the last bit between V8 versions (Node vs workerd).
  return STANDARD_PRESSURE_KPA * Math.exp(5.2559 * Math.log(1 - 2.25577e-5 * elevationM))
}

/** Humidity ratio [kg/kg] from vapour pressure and total pressure [kPa]; ASHRAE HOF 2017 ch. 1 eq 20. */
export function humidityRatioFromVaporPressure(vaporPressureKpa: number, pressureKpa: number): number {
  return (MOLAR_MASS_RATIO_WATER_AIR * vaporPressureKpa) / (pressureKpa - vaporPressureKpa)
}

/** Vapour pressure [kPa] from humidity ratio [kg/kg] and total pressure [kPa]; eq 20 inverted. */
export function vaporPressureFromHumidityRatio(humidityRatioKgPerKg: number, pressureKpa: number): number {
  return (pressureKpa * humidityRatioKgPerKg) / (MOLAR_MASS_RATIO_WATER_AIR + humidityRatioKgPerKg)
}

/** Saturation humidity ratio [kg/kg] at `tC`, with ice below the triple point; eq 23 (eq 20 at pws). */
export function saturationHumidityRatio(tC: number, pressureKpa: number): number {
  const pws = saturationVaporPressureKpa(tC)
  if (pws >= pressureKpa) {
    throw new RangeError(
      `air at ${tC} °C cannot be saturated at ${pressureKpa} kPa (water boils below that temperature)`,
    )
  }
  return humidityRatioFromVaporPressure(pws, pressureKpa)
}

/** Moist-air enthalpy [kJ/kg dry air]: h = 1.006 t + W (2501 + 1.86 t); ASHRAE HOF 2017 ch. 1 eq 30. */
export function moistAirEnthalpyKjPerKg(dryBulbC: number, humidityRatioKgPerKg: number): number {
  return 1.006 * dryBulbC + humidityRatioKgPerKg * (2501 + 1.86 * dryBulbC)
}

/** Dry bulb [°C] from enthalpy [kJ/kg] and humidity ratio [kg/kg]; eq 30 inverted. */
export function dryBulbFromEnthalpyC(enthalpyKjPerKg: number, humidityRatioKgPerKg: number): number {
  return (enthalpyKjPerKg - 2501 * humidityRatioKgPerKg) / (1.006 + 1.86 * humidityRatioKgPerKg)
}

/** Specific volume [m³/kg dry air]: v = Rda T (1 + 1.607858 W)/p; ASHRAE HOF 2017 ch. 1 eq 26. */
export function moistAirSpecificVolumeM3PerKg(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
): number {
  return (
    (GAS_CONSTANT_DRY_AIR_KJ_PER_KG_K * (dryBulbC + KELVIN_OFFSET) * (1 + 1.607858 * humidityRatioKgPerKg)) /
    pressureKpa
  )
}

/** Moist-air density [kg moist air / m³] = (1 + W)/v; ASHRAE HOF 2017 ch. 1 eq 11 with eq 26. */
export function moistAirDensityKgPerM3(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
): number {
  return (
    (1 + humidityRatioKgPerKg) / moistAirSpecificVolumeM3PerKg(dryBulbC, humidityRatioKgPerKg, pressureKpa)
  )
}

/**
 * Temperature [°C] at which the saturation pressure over liquid water (ice = false) or over ice
 * (ice = true) equals `vaporPressureKpa` (whose natural log in Pa, `lnVaporPressurePa`, the caller
 * passes as well): the dew point, or the frost point (ASHRAE HOF 2017 ch. 1 eq 36 inverted). Halley's
 * method on pws(t) − pw with pws and its derivatives from {@link saturationPressureFromTableKpa},
 * started from the inverse table {@link saturationTemperatureFromTableC} (so one step usually
 * suffices), kept inside the bracket [−100, 200] °C; see {@link SOLVER_TOLERANCE_C}.
 */
export function saturationTemperatureC(
  vaporPressureKpa: number,
  lnVaporPressurePa: number,
  ice: boolean,
): number {
  let tC = saturationTemperatureFromTableC(lnVaporPressurePa, ice)
  if (!(tC > SATURATION_MIN_C && tC < SATURATION_MAX_C)) tC = 0
  for (let i = 0; i < SOLVER_MAX_ITERATIONS; i++) {
    const f = saturationPressureFromTableKpa(tC, ice) - vaporPressureKpa
    const d1 = saturationTableSlopes[0]
    const d2 = saturationTableSlopes[1]
    const step = (2 * f * d1) / (2 * d1 * d1 - f * d2)
    let next = tC - step
    if (next < SATURATION_MIN_C) next = (tC + SATURATION_MIN_C) / 2
    else if (next > SATURATION_MAX_C) next = (tC + SATURATION_MAX_C) / 2
    else if (Math.abs(step) < SOLVER_STOP_STEP_C) return next
    if (Math.abs(next - tC) < SOLVER_TOLERANCE_C) return next
    tC = next
  }
  throw new RangeError(`saturation temperature did not converge for vapour pressure ${vaporPressureKpa} kPa`)
}

/**
 * Lowest vapour pressure with a dew point over liquid water in the range of eqs 5–6 [kPa]: pws over
 * liquid water at −100 °C (eq 6). Lower vapour pressures have no dew point the formulas can give.
 */
export const VAPOR_PRESSURE_MIN_KPA =
  Math.exp(lnSaturationPressureLiquidPa(SATURATION_MIN_C + KELVIN_OFFSET)) / 1000
/** Lowest vapour pressure with a frost point in range [kPa]: pws over ice at −100 °C (eq 5). */
const VAPOR_PRESSURE_MIN_ICE_KPA =
  Math.exp(lnSaturationPressureIcePa(SATURATION_MIN_C + KELVIN_OFFSET)) / 1000
/** Highest vapour pressure the dew-point solver accepts [kPa]: pws at 200 °C (eq 6). */
export const VAPOR_PRESSURE_MAX_KPA =
  Math.exp(lnSaturationPressureLiquidPa(SATURATION_MAX_C + KELVIN_OFFSET)) / 1000

function checkVaporPressure(vaporPressureKpa: number, minKpa: number): void {
  if (!(vaporPressureKpa >= minKpa && vaporPressureKpa <= VAPOR_PRESSURE_MAX_KPA)) {
    throw new RangeError(
      `vapour pressure must be between ${minKpa.toExponential(3)} and ${VAPOR_PRESSURE_MAX_KPA.toFixed(0)} kPa (saturation at ${SATURATION_MIN_C} and ${SATURATION_MAX_C} °C), got ${vaporPressureKpa}`,
    )
  }
}

/**
 * Dew point over liquid water [°C] for vapour pressure `vaporPressureKpa` [kPa]: the weather-station dew
 * point (WMO), which below 0 °C refers to supercooled water. Example: 1.0 kPa → 6.98 °C.
 */
export function dewPointFromVaporPressureC(vaporPressureKpa: number): number {
  checkVaporPressure(vaporPressureKpa, VAPOR_PRESSURE_MIN_KPA)
  return saturationTemperatureC(vaporPressureKpa, Math.log(vaporPressureKpa * 1000), false)
}

/**
 * Frost point [°C] for vapour pressure [kPa]: saturation over ice (ASHRAE eq 5). Only meaningful at or
 * below the triple point; above it this returns the dew point over liquid water (ASHRAE convention).
 */
export function frostPointFromVaporPressureC(vaporPressureKpa: number): number {
  checkVaporPressure(vaporPressureKpa, VAPOR_PRESSURE_MIN_ICE_KPA)
  const lnPa = Math.log(vaporPressureKpa * 1000)
  const ice = saturationTemperatureC(vaporPressureKpa, lnPa, true)
  return ice < TRIPLE_POINT_C ? ice : saturationTemperatureC(vaporPressureKpa, lnPa, false)
}

/**
 * Humidity ratio [kg/kg] given by the psychrometer balance at thermodynamic wet bulb `wetBulbC`:
 * eq 33 for a wet wick (t* ≥ 0 °C), eq 35 for an iced wick (t* < 0 °C), ASHRAE HOF 2017 ch. 1, with Ws*
 * the saturation humidity ratio at t* (over ice below the triple point, as in psychrolib 2.5.0).
 */
export function humidityRatioFromWetBulb(dryBulbC: number, wetBulbC: number, pressureKpa: number): number {
  const wsStar = saturationHumidityRatio(wetBulbC, pressureKpa)
  if (wetBulbC >= 0) {
    return (
      ((2501 - 2.326 * wetBulbC) * wsStar - 1.006 * (dryBulbC - wetBulbC)) /
      (2501 + 1.86 * dryBulbC - 4.186 * wetBulbC)
    )
  }
  return (
    ((2830 - 0.24 * wetBulbC) * wsStar - 1.006 * (dryBulbC - wetBulbC)) /
    (2830 + 1.86 * dryBulbC - 2.1 * wetBulbC)
  )
}

/** Saturation pressure over ice at 0 °C [kPa] (eq 5): Ws* at t* = 0, where eq 33 meets eq 35. */
const SATURATION_PRESSURE_AT_ZERO_KPA = Math.exp(lnSaturationPressureIcePa(KELVIN_OFFSET)) / 1000

/**
 * Root of the psychrometer balance W(t*) = `targetW` on one branch, t* in [lo, hi]: eq 33 (wet wick,
 * liquid = true) or eq 35 (iced wick). Halley's method with the first and second derivatives (pws and
 * its derivatives from {@link saturationPressureFromTableKpa}),
 * started at `start`, falling back to bisection whenever a step leaves the bracket; W(t*) increases
 * with t*, so the sign of W(t*) − targetW keeps the bracket. Returns hi if W(hi) is still below the
 * target (no root at or below the dry bulb), lo if W(lo) is above it.
 */
function solveWetBulbBranch(
  dryBulbC: number,
  targetW: number,
  pressureKpa: number,
  liquid: boolean,
  lo: number,
  hi: number,
  start: number,
): number {
  const a0 = liquid ? 2501 : 2830 // eq 33 / eq 35 numerator constant [kJ/kg]
  const ka = liquid ? 2.326 : 0.24
  const b0 = (liquid ? 2501 : 2830) + 1.86 * dryBulbC
  const kb = liquid ? 4.186 : 2.1
  const p = pressureKpa
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
    const q = (a * ws - 1.006 * (dryBulbC - x)) * invB
    const q1 = (-ka * ws + a * ws1 + 1.006 + kb * q) * invB
    const q2 = (-2 * ka * ws1 + a * ws2 + 2 * kb * q1) * invB
    const f = q - targetW
    if (f === 0) return x
    if (f > 0) hi = x
    else lo = x
    const step = (2 * f * q1) / (2 * q1 * q1 - f * q2)
    const next = x - step
    if (next > lo && next < hi) {
      // Stop on a small step, but not across the kink of Ws* at the triple point (ice → liquid pws).
      if (Math.abs(step) < SOLVER_STOP_STEP_C && next < TRIPLE_POINT_C === ice) return next
      x = next
    } else if (next >= hi && x < hi) {
      // Overshoot past the upper end (a root close to it, as in air near saturation): restart there;
      // W(t*) is convex, so from above the steps approach the root without leaving the bracket.
      x = hi
    } else {
      x = 0.5 * (lo + hi)
    }
    if (hi - lo < SOLVER_TOLERANCE_C) return x
  }
  throw new RangeError(`wet bulb did not converge for dry bulb ${dryBulbC} °C, W ${targetW}`)
}

/**
 * Start value for {@link solveWetBulbBranch}: the balance solved with Ws* replaced by its chord between
 * (xa, wa) and (xb, wb) and the t*-dependent terms taken at the midpoint. Ws* is convex, so this lands
 * at or below the root, usually within a few tenths of a degree.
 */
function chordStartC(
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
  const a = liquid ? 2501 - 2.326 * m : 2830 - 0.24 * m
  const b = liquid ? 2501 + 1.86 * dryBulbC - 4.186 * m : 2830 + 1.86 * dryBulbC - 2.1 * m
  const s = (wb - wa) / (xb - xa)
  return xa + (targetW * b - a * wa + 1.006 * (dryBulbC - xa)) / (a * s + 1.006)
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
  const t = dryBulbC
  const w = humidityRatioKgPerKg
  const dew = Math.min(dewC, t)
  if (dew >= TRIPLE_POINT_C) {
    // Root at or above the dew point, so on the wet-wick branch (eq 33 at t* = dew gives W* ≤ W).
    const wst = saturationHumidityRatioAtDryBulb ?? saturationHumidityRatio(t, pressureKpa)
    return solveWetBulbBranch(t, w, pressureKpa, true, dew, t, chordStartC(t, w, true, dew, w, t, wst))
  }
  if (t > 0) {
    const ws0 =
      (MOLAR_MASS_RATIO_WATER_AIR * SATURATION_PRESSURE_AT_ZERO_KPA) /
      (pressureKpa - SATURATION_PRESSURE_AT_ZERO_KPA)
    const wAtZeroLiquid = (2501 * ws0 - 1.006 * t) / (2501 + 1.86 * t) // eq 33 at t* = 0
    if (w >= wAtZeroLiquid) {
      const wst = saturationHumidityRatioAtDryBulb ?? saturationHumidityRatio(t, pressureKpa)
      const lo = Math.max(dew, 0)
      const start = chordStartC(t, w, true, lo, dew >= 0 ? w : ws0, t, wst)
      return solveWetBulbBranch(t, w, pressureKpa, true, lo, t, start)
    }
    const lo = Math.max(dew - 1, SATURATION_MIN_C)
    const start = chordStartC(t, w, false, dew, w, 0, ws0)
    return Math.max(solveWetBulbBranch(t, w, pressureKpa, false, lo, 0, start), dew)
  }
  const lo = Math.max(dew - 1, SATURATION_MIN_C)
  // Ws over ice at the dry bulb (eq 5 via the table, 1e-9 relative; pws ≪ p below 0 °C).
  const pwsIce = saturationPressureFromTableKpa(t, true)
  const wsIce = (MOLAR_MASS_RATIO_WATER_AIR * pwsIce) / (pressureKpa - pwsIce)
  if (w >= wsIce) return t // supersaturated over ice: no iced-wick root at or below the dry bulb
  const start = chordStartC(t, w, false, dew, w, t, wsIce)
  // The root is at or above the dew/frost point (ASHRAE eq 35 at t* = dew gives W* ≤ W), so clamping
  // there only removes the bisection's last 1e-5 °C.
  return Math.max(solveWetBulbBranch(t, w, pressureKpa, false, lo, t, start), dew)
}
