/**
 * @module physics/moist-air
 * Moist-air properties by the perfect-gas relations of ASHRAE Handbook — Fundamentals (2017) ch. 1.
 * Units: temperature [°C], pressure [kPa], humidity ratio [kg water / kg dry air], enthalpy [kJ/kg dry air],
 * specific volume [m³/kg dry air]. Equation numbers are those of the 2017 SI edition (they change between
 * editions).
 */
import {
  dLnSaturationPressureIceDT,
  dLnSaturationPressureLiquidDT,
  KELVIN_OFFSET,
  lnSaturationPressureIcePa,
  lnSaturationPressureLiquidPa,
  SATURATION_MAX_C,
  SATURATION_MIN_C,
  saturationVaporPressureKpa,
  saturationVaporPressureLiquidKpa,
  TRIPLE_POINT_C,
} from './saturation.ts'

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
/** Convergence tolerance of the temperature solvers [°C]; the step at which iteration stops. */
export const SOLVER_TOLERANCE_C = 1e-5
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
 * (ice = true) equals `vaporPressureKpa`: the dew point, or the frost point. Newton's method on ln pws
 * (ASHRAE HOF 2017 ch. 1 eq 36 inverted), started from the Magnus approximation and kept inside the
 * bracket [−100, 200] °C; stops when the step is below {@link SOLVER_TOLERANCE_C}.
 */
function saturationTemperatureC(vaporPressureKpa: number, ice: boolean): number {
  const lnTarget = Math.log(vaporPressureKpa * 1000)
  // Magnus (Alduchov & Eskridge 1996 coefficients) as starting value only.
  const g = Math.log(vaporPressureKpa / 0.61094)
  let tC = ice ? (272.62 * g) / (22.46 - g) : (243.04 * g) / (17.625 - g)
  if (!(tC > SATURATION_MIN_C && tC < SATURATION_MAX_C)) tC = 0
  for (let i = 0; i < SOLVER_MAX_ITERATIONS; i++) {
    const tK = tC + KELVIN_OFFSET
    const f = (ice ? lnSaturationPressureIcePa(tK) : lnSaturationPressureLiquidPa(tK)) - lnTarget
    const d = ice ? dLnSaturationPressureIceDT(tK) : dLnSaturationPressureLiquidDT(tK)
    let next = tC - f / d
    if (next < SATURATION_MIN_C) next = (tC + SATURATION_MIN_C) / 2
    else if (next > SATURATION_MAX_C) next = (tC + SATURATION_MAX_C) / 2
    if (Math.abs(next - tC) < SOLVER_TOLERANCE_C) return next
    tC = next
  }
  throw new RangeError(`saturation temperature did not converge for vapour pressure ${vaporPressureKpa} kPa`)
}

function checkVaporPressure(vaporPressureKpa: number): void {
  const lowKpa = Math.exp(lnSaturationPressureIcePa(SATURATION_MIN_C + KELVIN_OFFSET)) / 1000
  if (!(vaporPressureKpa >= lowKpa && vaporPressureKpa < 1000)) {
    throw new RangeError(
      `vapour pressure must be between ${lowKpa.toExponential(3)} and 1000 kPa, got ${vaporPressureKpa}`,
    )
  }
}

/**
 * Dew point over liquid water [°C] for vapour pressure `vaporPressureKpa` [kPa]: the weather-station dew
 * point (WMO), which below 0 °C refers to supercooled water. Example: 1.0 kPa → 6.98 °C.
 */
export function dewPointFromVaporPressureC(vaporPressureKpa: number): number {
  checkVaporPressure(vaporPressureKpa)
  return saturationTemperatureC(vaporPressureKpa, false)
}

/**
 * Frost point [°C] for vapour pressure [kPa]: saturation over ice (ASHRAE eq 5). Only meaningful at or
 * below the triple point; above it this returns the dew point over liquid water (ASHRAE convention).
 */
export function frostPointFromVaporPressureC(vaporPressureKpa: number): number {
  checkVaporPressure(vaporPressureKpa)
  const ice = saturationTemperatureC(vaporPressureKpa, true)
  return ice < TRIPLE_POINT_C ? ice : saturationTemperatureC(vaporPressureKpa, false)
}

/**
 * Humidity ratio [kg/kg] given by the psychrometer balance at thermodynamic wet bulb `wetBulbC`:
 * eq 33 for a wet wick (t* ≥ 0 °C), eq 35 for an iced wick (t* < 0 °C), ASHRAE HOF 2017 ch. 1, with Ws*
 * the saturation humidity ratio at t* (over ice below the triple point, as in psychrolib 2.5.0).
 */
export function humidityRatioFromWetBulb(dryBulbC: number, wetBulbC: number, pressureKpa: number): number {
  const wsStar = saturationHumidityRatio(wetBulbC, pressureKpa)
  return wetBulbBalance(dryBulbC, wetBulbC, wsStar)
}

function wetBulbBalance(dryBulbC: number, wetBulbC: number, wsStar: number): number {
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

/** Balance W(t*) and its derivative dW/dt* for the solver; same branch rule as humidityRatioFromWetBulb. */
function wetBulbBalanceWithSlope(
  dryBulbC: number,
  wetBulbC: number,
  pressureKpa: number,
  out: Float64Array,
): void {
  const tK = wetBulbC + KELVIN_OFFSET
  const ice = wetBulbC < TRIPLE_POINT_C
  const lnP = ice ? lnSaturationPressureIcePa(tK) : lnSaturationPressureLiquidPa(tK)
  const dLnP = ice ? dLnSaturationPressureIceDT(tK) : dLnSaturationPressureLiquidDT(tK)
  const pws = Math.exp(lnP) / 1000
  const denomP = pressureKpa - pws
  const ws = (MOLAR_MASS_RATIO_WATER_AIR * pws) / denomP
  // dWs/dT = 0.621945 p pws' / (p − pws)², pws' = pws · dln pws/dT
  const dWs = (MOLAR_MASS_RATIO_WATER_AIR * pressureKpa * pws * dLnP) / (denomP * denomP)
  let a: number
  let da: number
  let b: number
  let db: number
  if (wetBulbC >= 0) {
    a = 2501 - 2.326 * wetBulbC
    da = -2.326
    b = 2501 + 1.86 * dryBulbC - 4.186 * wetBulbC
    db = -4.186
  } else {
    a = 2830 - 0.24 * wetBulbC
    da = -0.24
    b = 2830 + 1.86 * dryBulbC - 2.1 * wetBulbC
    db = -2.1
  }
  const num = a * ws - 1.006 * (dryBulbC - wetBulbC)
  const dNum = da * ws + a * dWs + 1.006
  out[0] = num / b
  out[1] = (dNum * b - num * db) / (b * b)
}

const scratch = new Float64Array(2)

/** Safeguarded Newton (bisection fallback) for W(t*) = target on [lo, hi]; W(t*) increases with t*. */
function solveWetBulbOnBranch(
  dryBulbC: number,
  targetW: number,
  pressureKpa: number,
  lo: number,
  hi: number,
  start: number,
): number {
  let t = Math.min(Math.max(start, lo), hi)
  for (let i = 0; i < SOLVER_MAX_ITERATIONS; i++) {
    wetBulbBalanceWithSlope(dryBulbC, t, pressureKpa, scratch)
    const f = scratch[0] - targetW
    if (f > 0) hi = t
    else lo = t
    let next = scratch[1] > 0 ? t - f / scratch[1] : Number.NaN
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi)
    if (Math.abs(next - t) < SOLVER_TOLERANCE_C || hi - lo < SOLVER_TOLERANCE_C) return next
    t = next
  }
  throw new RangeError(`wet bulb did not converge for dry bulb ${dryBulbC} °C, W ${targetW}`)
}

/**
 * Thermodynamic wet-bulb temperature [°C] from dry bulb [°C], humidity ratio [kg/kg] and pressure [kPa]:
 * the root of the psychrometer balance (ASHRAE HOF 2017 ch. 1 eqs 33/35) between the frost/dew point and
 * the dry bulb, tolerance {@link SOLVER_TOLERANCE_C}.
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
  const pw = vaporPressureFromHumidityRatio(humidityRatioKgPerKg, pressureKpa)
  const dewC = saturationTemperatureC(
    Math.max(pw, 1e-9),
    pw < saturationVaporPressureLiquidKpa(TRIPLE_POINT_C),
  )
  return wetBulbWithDewPointC(dryBulbC, humidityRatioKgPerKg, pressureKpa, dewC)
}

/**
 * As {@link wetBulbFromHumidityRatioC} when the dew (or frost) point `dewC` [°C] is already known; it only
 * serves as the lower end of the bracket and the starting value, so either the dew or the frost point will do.
 */
export function wetBulbWithDewPointC(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
  dewC: number,
): number {
  const low = Math.max(Math.min(dewC, dryBulbC) - 1, SATURATION_MIN_C)
  // Starting value: one third of the way from dew point to dry bulb (a rule of thumb, only a start).
  const start = dewC + (dryBulbC - dewC) / 3
  if (dryBulbC > 0) {
    wetBulbBalanceWithSlope(dryBulbC, 0, pressureKpa, scratch)
    const wAtZero = scratch[0]
    if (humidityRatioKgPerKg >= wAtZero)
      return solveWetBulbOnBranch(dryBulbC, humidityRatioKgPerKg, pressureKpa, 0, dryBulbC, start)
    return solveWetBulbOnBranch(
      dryBulbC,
      humidityRatioKgPerKg,
      pressureKpa,
      low,
      -1e-12,
      Math.min(start, -1e-3),
    )
  }
  return solveWetBulbOnBranch(dryBulbC, humidityRatioKgPerKg, pressureKpa, low, dryBulbC, start)
}
