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
  TRIPLE_POINT_C,
} from './saturation.ts'
import {
  saturationPressureFromTableKpa,
  saturationTableSlopes,
  saturationTemperatureFromTableC,
} from './saturation-table.ts'

/** Ratio of molar masses of water and dry air, 18.015268/28.966 (ASHRAE HOF 2017 ch. 1 eq 20). */
export const MOLAR_MASS_RATIO_WATER_AIR = 0.621945
/** Specific heat of dry air [kJ kg⁻¹ K⁻¹] in the moist-air enthalpy, ASHRAE HOF 2017 ch. 1 eq 30. */
export const CP_DRY_AIR_KJ_PER_KG_K = 1.006
/** Specific heat of water vapour [kJ kg⁻¹ K⁻¹] in the moist-air enthalpy, eq 30. */
export const CP_WATER_VAPOR_KJ_PER_KG_K = 1.86
/** Specific enthalpy of saturated water vapour at 0 °C [kJ/kg], eq 30 (and the wet-wick balance, eq 33). */
export const VAPOR_ENTHALPY_0C_KJ_PER_KG = 2501
/** Specific heat of liquid water [kJ kg⁻¹ K⁻¹] in the wet-wick psychrometer balance, eq 33. */
export const CP_LIQUID_WATER_KJ_PER_KG_K = 4.186
/** Coefficient of t* in the numerator of eq 33 [kJ kg⁻¹ K⁻¹], 2.326 as printed (c_w − c_pw). */
export const WET_WICK_NUMERATOR_SLOPE = 2.326
/** Enthalpy of sublimation at 0 °C [kJ/kg] in the iced-wick balance, eq 35. */
export const SUBLIMATION_ENTHALPY_0C_KJ_PER_KG = 2830
/** Coefficient of t* in the numerator of eq 35 [kJ kg⁻¹ K⁻¹], 0.24 as printed. */
export const ICED_WICK_NUMERATOR_SLOPE = 0.24
/** Specific heat of ice [kJ kg⁻¹ K⁻¹] in the iced-wick balance, eq 35 (2.1 as printed). */
export const CP_ICE_KJ_PER_KG_K = 2.1
/** 1 + 1.607858 W: the factor of W in the specific volume, M_da/M_w = 1/0.621945, ASHRAE HOF 2017 ch. 1 eq 26. */
export const SPECIFIC_VOLUME_W_FACTOR = 1.607858
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
  return (
    CP_DRY_AIR_KJ_PER_KG_K * dryBulbC +
    humidityRatioKgPerKg * (VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC)
  )
}

/** Dry bulb [°C] from enthalpy [kJ/kg] and humidity ratio [kg/kg]; eq 30 inverted. */
export function dryBulbFromEnthalpyC(enthalpyKjPerKg: number, humidityRatioKgPerKg: number): number {
  return (
    (enthalpyKjPerKg - VAPOR_ENTHALPY_0C_KJ_PER_KG * humidityRatioKgPerKg) /
    (CP_DRY_AIR_KJ_PER_KG_K + CP_WATER_VAPOR_KJ_PER_KG_K * humidityRatioKgPerKg)
  )
}

/**
 * Humidity ratio [kg/kg] of air at `dryBulbC` on the line of constant enthalpy `enthalpyKjPerKg`: eq 30
 * solved for W, W = (h − 1.006 t)/(2501 + 1.86 t).
 */
export function humidityRatioFromEnthalpy(enthalpyKjPerKg: number, dryBulbC: number): number {
  return (
    (enthalpyKjPerKg - CP_DRY_AIR_KJ_PER_KG_K * dryBulbC) /
    (VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC)
  )
}

/** Heat capacity of moist air per kg of dry air [kJ K⁻¹ per kg dry air], ∂h/∂t of eq 30: 1.006 + 1.86 W. */
export function moistAirHeatCapacityKjPerKgK(humidityRatioKgPerKg: number): number {
  return CP_DRY_AIR_KJ_PER_KG_K + CP_WATER_VAPOR_KJ_PER_KG_K * humidityRatioKgPerKg
}

/** Specific volume [m³/kg dry air]: v = Rda T (1 + 1.607858 W)/p; ASHRAE HOF 2017 ch. 1 eq 26. */
export function moistAirSpecificVolumeM3PerKg(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
): number {
  return (
    (GAS_CONSTANT_DRY_AIR_KJ_PER_KG_K *
      (dryBulbC + KELVIN_OFFSET) *
      (1 + SPECIFIC_VOLUME_W_FACTOR * humidityRatioKgPerKg)) /
    pressureKpa
  )
}

/**
 * Heat capacity of moist air per m³ [J m⁻³ K⁻¹]: (1.006 + 1.86 W)·1000 / v, the heat capacity per kg of dry air
 * (∂h/∂t of eq 30) over the volume of that kg (eq 26).
 */
export function moistAirVolumetricHeatCapacityJPerM3K(
  dryBulbC: number,
  humidityRatioKgPerKg: number,
  pressureKpa: number,
): number {
  return (
    (1000 * moistAirHeatCapacityKjPerKgK(humidityRatioKgPerKg)) /
    moistAirSpecificVolumeM3PerKg(dryBulbC, humidityRatioKgPerKg, pressureKpa)
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
      ((VAPOR_ENTHALPY_0C_KJ_PER_KG - WET_WICK_NUMERATOR_SLOPE * wetBulbC) * wsStar -
        CP_DRY_AIR_KJ_PER_KG_K * (dryBulbC - wetBulbC)) /
      (VAPOR_ENTHALPY_0C_KJ_PER_KG +
        CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC -
        CP_LIQUID_WATER_KJ_PER_KG_K * wetBulbC)
    )
  }
  return (
    ((SUBLIMATION_ENTHALPY_0C_KJ_PER_KG - ICED_WICK_NUMERATOR_SLOPE * wetBulbC) * wsStar -
      CP_DRY_AIR_KJ_PER_KG_K * (dryBulbC - wetBulbC)) /
    (SUBLIMATION_ENTHALPY_0C_KJ_PER_KG +
      CP_WATER_VAPOR_KJ_PER_KG_K * dryBulbC -
      CP_ICE_KJ_PER_KG_K * wetBulbC)
  )
}
