/**
 * @module physics/saturation
 * Saturation vapour pressure of water over liquid water and over ice, Hyland–Wexler (1983) as given in
 * ASHRAE Handbook — Fundamentals (2017) ch. 1, eq 5 (ice, −100…0 °C) and eq 6 (liquid, 0…200 °C).
 * Coefficients as printed there for Pa and K (also in psychrolib 2.5.0, which cites the same equations).
 *
 * Weather stations report relative humidity relative to liquid water at every temperature (WMO
 * practice), so {@link saturationVaporPressureLiquidKpa} is the curve for converting a station RH,
 * also below 0 °C. {@link saturationVaporPressureKpa} switches to ice below the triple point, which is
 * the ASHRAE convention for saturated moist air and for the frost point and ice-bulb temperature.
 */
import { KELVIN_OFFSET } from './constants.ts'

/** Triple point of water [°C]. ITS-90 definition (273.16 K). Below it, saturation is over ice. */
export const TRIPLE_POINT_C = 0.01

// ASHRAE HOF 2017 ch. 1 eq 5 (over ice), ln(pws/Pa) = C1/T + C2 + C3 T + C4 T² + C5 T³ + C6 T⁴ + C7 ln T.
const C1 = -5.6745359e3
const C2 = 6.3925247
const C3 = -9.677843e-3
const C4 = 6.2215701e-7
const C5 = 2.0747825e-9
const C6 = -9.484024e-13
const C7 = 4.1635019
// ASHRAE HOF 2017 ch. 1 eq 6 (over liquid water), ln(pws/Pa) = C8/T + C9 + C10 T + C11 T² + C12 T³ + C13 ln T.
const C8 = -5.8002206e3
const C9 = 1.3914993
const C10 = -4.8640239e-2
const C11 = 4.1764768e-5
const C12 = -1.4452093e-8
const C13 = 6.5459673

/** Lowest temperature of eq 5 [°C] (ASHRAE HOF 2017 ch. 1). */
export const SATURATION_MIN_C = -100
/** Highest temperature of eq 6 [°C] (ASHRAE HOF 2017 ch. 1). */
export const SATURATION_MAX_C = 200

/** ln(pws / Pa) over liquid water at `tK` [K]; eq 6. */
export function lnSaturationPressureLiquidPa(tK: number): number {
  return C8 / tK + C9 + tK * (C10 + tK * (C11 + tK * C12)) + C13 * Math.log(tK)
}

/** d ln(pws)/dT over liquid water [1/K]; derivative of eq 6. */
export function dLnSaturationPressureLiquidDT(tK: number): number {
  return -C8 / (tK * tK) + C10 + tK * (2 * C11 + 3 * C12 * tK) + C13 / tK
}

/** d² ln(pws)/dT² over liquid water [1/K²]; second derivative of eq 6 (for the Halley solvers). */
export function d2LnSaturationPressureLiquidDT2(tK: number): number {
  return (2 * C8) / (tK * tK * tK) + 2 * C11 + 6 * C12 * tK - C13 / (tK * tK)
}

/** ln(pws / Pa) over ice at `tK` [K]; eq 5. */
export function lnSaturationPressureIcePa(tK: number): number {
  return C1 / tK + C2 + tK * (C3 + tK * (C4 + tK * (C5 + tK * C6))) + C7 * Math.log(tK)
}

/** d ln(pws)/dT over ice [1/K]; derivative of eq 5. */
export function dLnSaturationPressureIceDT(tK: number): number {
  return -C1 / (tK * tK) + C3 + tK * (2 * C4 + tK * (3 * C5 + 4 * C6 * tK)) + C7 / tK
}

/** d² ln(pws)/dT² over ice [1/K²]; second derivative of eq 5 (for the Halley solvers). */
export function d2LnSaturationPressureIceDT2(tK: number): number {
  return (2 * C1) / (tK * tK * tK) + 2 * C4 + tK * (6 * C5 + 12 * C6 * tK) - C7 / (tK * tK)
}

function checkTemperature(name: string, tC: number): void {
  if (!(tC >= SATURATION_MIN_C && tC <= SATURATION_MAX_C)) {
    throw new RangeError(`${name} must be between ${SATURATION_MIN_C} and ${SATURATION_MAX_C} °C, got ${tC}`)
  }
}

/**
 * Saturation vapour pressure over liquid water [Pa] at `tC` [°C], exp of eq 6, without a range check: for
 * hot loops whose input is already checked ({@link saturationVaporPressureLiquidKpa} is this divided by 1000).
 */
export function saturationPressureLiquidPa(tC: number): number {
  return Math.exp(lnSaturationPressureLiquidPa(tC + KELVIN_OFFSET))
}

/**
 * Saturation vapour pressure over liquid water [kPa] at `tC` [°C], also for supercooled water below 0 °C.
 * ASHRAE HOF 2017 ch. 1 eq 6. Example: 20 °C → 2.3388 kPa.
 */
export function saturationVaporPressureLiquidKpa(tC: number): number {
  checkTemperature('temperature', tC)
  return Math.exp(lnSaturationPressureLiquidPa(tC + KELVIN_OFFSET)) / 1000
}

/**
 * Saturation vapour pressure over ice [kPa] at `tC` [°C] (at or below the triple point).
 * ASHRAE HOF 2017 ch. 1 eq 5. Example: −20 °C → 0.10326 kPa.
 */
export function saturationVaporPressureIceKpa(tC: number): number {
  checkTemperature('temperature', tC)
  return Math.exp(lnSaturationPressureIcePa(tC + KELVIN_OFFSET)) / 1000
}

/**
 * Saturation vapour pressure [kPa] at `tC` [°C]: over ice below the triple point (0.01 °C), over liquid
 * water from it on (ASHRAE HOF 2017 ch. 1 eqs 5–6, the switch as in psychrolib 2.5.0).
 */
export function saturationVaporPressureKpa(tC: number): number {
  return tC < TRIPLE_POINT_C ? saturationVaporPressureIceKpa(tC) : saturationVaporPressureLiquidKpa(tC)
}
