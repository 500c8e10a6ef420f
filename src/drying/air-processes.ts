/**
 * @module drying/air-processes
 * The two things drying does to air, from the moist-air relations of ASHRAE Handbook — Fundamentals
 * (2017) ch. 1: sensible heating at constant humidity ratio (a heater or a solar collector), and
 * adiabatic take-up of water along the constant-enthalpy line (the air cools as it evaporates water;
 * constant enthalpy is the usual approximation of the wet-bulb line, ASHRAE HOF 2017 ch. 1 §"Adiabatic
 * saturation"). Units: °C, kPa, kg water / kg dry air, kJ/kg dry air.
 */

import { KELVIN_OFFSET } from '../physics/constants.ts'
import {
  dewPointFromVaporPressureC,
  humidityRatioFromVaporPressure,
  MOLAR_MASS_RATIO_WATER_AIR,
  moistAirEnthalpyKjPerKg,
  saturationHumidityRatio,
  vaporPressureFromHumidityRatio,
} from '../physics/moist-air.ts'
import {
  dLnSaturationPressureLiquidDT,
  lnSaturationPressureLiquidPa,
  saturationVaporPressureLiquidKpa,
} from '../physics/saturation.ts'
import { wetBulbFromHumidityRatioC } from '../physics/wet-bulb.ts'

/** Newton tolerance of {@link adiabaticHumidityRatioAtRh} [°C] and its iteration cap. */
export const ADIABATIC_TOLERANCE_C = 1e-4
export const ADIABATIC_MAX_ITERATIONS = 30

/** RH over liquid water [%] of air with humidity ratio `w` [kg/kg] at `dryBulbC` and `pressureKpa`. */
export function relativeHumidityPctAt(dryBulbC: number, w: number, pressureKpa: number): number {
  return (100 * vaporPressureFromHumidityRatio(w, pressureKpa)) / saturationVaporPressureLiquidKpa(dryBulbC)
}

/**
 * Lowest temperature [°C] at which air of humidity ratio `w` has RH ≤ `targetRhPct` (heating at constant
 * W): the dew point of the vapour pressure pw/φ, i.e. pws(T) = pw/φ exactly. Returns `dryBulbC` when the
 * air is already at or below the target RH (no heating needed).
 * Example: 10 °C, 90 % RH at 101.325 kPa, target 40 % → 22.7 °C.
 */
export function heatedDryBulbForTargetRhC(
  dryBulbC: number,
  w: number,
  pressureKpa: number,
  targetRhPct: number,
): number {
  if (!(targetRhPct > 0 && targetRhPct <= 100)) {
    throw new RangeError(`target RH must be in (0, 100] %, got ${targetRhPct}`)
  }
  const pw = vaporPressureFromHumidityRatio(w, pressureKpa)
  const t = dewPointFromVaporPressureC(pw / (targetRhPct / 100))
  return Math.max(t, dryBulbC)
}

/**
 * Heat taken up by the air [kW] when `airFlowKgPerS` [kg dry air/s] of humidity ratio `w` is heated from
 * `fromC` to `toC` at constant W: ṁ·(h(toC, W) − h(fromC, W)) with h from ASHRAE eq 30.
 */
export function sensibleHeatingKw(airFlowKgPerS: number, w: number, fromC: number, toC: number): number {
  return airFlowKgPerS * (moistAirEnthalpyKjPerKg(toC, w) - moistAirEnthalpyKjPerKg(fromC, w))
}

/**
 * Humidity-ratio deficit to free-water saturation [kg/kg]: Ws(t*) − W, the water one kilogram of dry air
 * can still take up moving along its wet-bulb line (t* thermodynamic wet bulb, ASHRAE eqs 33/35).
 */
export function deficitToSaturationKgPerKg(dryBulbC: number, w: number, pressureKpa: number): number {
  const twb = wetBulbFromHumidityRatioC(dryBulbC, w, pressureKpa)
  return Math.max(0, saturationHumidityRatio(twb, pressureKpa) - w)
}

/**
 * Humidity ratio [kg/kg] reached when air at (`dryBulbC`, `w`) takes up water adiabatically (constant
 * enthalpy) until its RH equals `rhFraction`; Newton on f(T) = pw(W(T)) − φ·pws(T), W(T) = (h − 1.006T)/
 * (2501 + 1.86T). Returns `w` when the air is already at or above that RH. Tolerance
 * {@link ADIABATIC_TOLERANCE_C}, at most {@link ADIABATIC_MAX_ITERATIONS} steps (then the last iterate,
 * which is within the bracket). `startC`, when given inside (T − 80, T), is the first iterate.
 * `saturationPa`, when given, is exp(ln pws(dryBulbC)) in Pa (eq 6) already computed by the caller.
 */
export function adiabaticHumidityRatioAtRh(
  dryBulbC: number,
  w: number,
  pressureKpa: number,
  rhFraction: number,
  startC?: number,
  saturationPa?: number,
): number {
  const io = adiabaticScratch
  io[0] = dryBulbC
  io[1] = w
  io[2] = pressureKpa
  io[3] = rhFraction
  io[4] = startC ?? Number.NaN
  io[5] = saturationPa ?? Number.NaN
  adiabaticHumidityRatioAtRhInto(io)
  return io[6]
}

const adiabaticScratch = new Float64Array(7)

/**
 * {@link adiabaticHumidityRatioAtRh} on an array, for hot loops: io = [dry bulb °C, W kg/kg, pressure kPa,
 * RH fraction, start °C or NaN, exp(ln pws(dry bulb)) Pa or NaN]; the humidity ratio is written to io[6].
 * No double crosses the call, so V8 allocates nothing for it when it does not inline the solver.
 */
export function adiabaticHumidityRatioAtRhInto(io: Float64Array): void {
  const dryBulbC = io[0]
  const w = io[1]
  const pressureKpa = io[2]
  const rhFraction = io[3]
  const startC = io[4]
  const h = 1.006 * dryBulbC + w * (2501 + 1.86 * dryBulbC)
  const pw0 = (pressureKpa * w) / (MOLAR_MASS_RATIO_WATER_AIR + w)
  const pwsPa = Number.isNaN(io[5]) ? Math.exp(lnSaturationPressureLiquidPa(dryBulbC + KELVIN_OFFSET)) : io[5]
  if (pw0 >= rhFraction * pwsPa * 1e-3) {
    io[6] = w
    return
  }
  let lo = dryBulbC - 80
  let hi = dryBulbC
  // Start at the dry bulb, or at a caller's guess inside the bracket (e.g. the previous hour's end point).
  let t = startC > lo && startC < hi ? startC : dryBulbC
  for (let i = 0; i < ADIABATIC_MAX_ITERATIONS; i++) {
    const denom = 2501 + 1.86 * t
    const wt = (h - 1.006 * t) / denom
    // dW/dT along constant h
    const dw = (-1.006 * denom - (h - 1.006 * t) * 1.86) / (denom * denom)
    const pw = (pressureKpa * wt) / (MOLAR_MASS_RATIO_WATER_AIR + wt)
    // x·x is x ** 2 bit for bit (IEEE pow returns x·x for y = 2) without the pow call
    const dpwDenom = MOLAR_MASS_RATIO_WATER_AIR + wt
    const dpw = (pressureKpa * MOLAR_MASS_RATIO_WATER_AIR * dw) / (dpwDenom * dpwDenom)
    const tK = t + KELVIN_OFFSET
    const pws = Math.exp(lnSaturationPressureLiquidPa(tK)) * 1e-3
    const f = pw - rhFraction * pws
    const df = dpw - rhFraction * pws * dLnSaturationPressureLiquidDT(tK)
    if (f < 0) hi = t
    else lo = t
    let next = t - f / df
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi)
    if (Math.abs(next - t) < ADIABATIC_TOLERANCE_C) {
      t = next
      break
    }
    t = next
  }
  io[6] = (h - 1.006 * t) / (2501 + 1.86 * t)
}

/**
 * Humidity-ratio deficit to a relative humidity `rhFraction` (the product's equilibrium RH) [kg/kg]:
 * water one kilogram of dry air can take up adiabatically before its RH reaches that of the product.
 */
export function deficitToRhKgPerKg(
  dryBulbC: number,
  w: number,
  pressureKpa: number,
  rhFraction: number,
): number {
  return adiabaticHumidityRatioAtRh(dryBulbC, w, pressureKpa, rhFraction) - w
}

/** Humidity ratio [kg/kg] from dry bulb, RH [%] and pressure [kPa] (ASHRAE eq 20 with RH over water). */
export function humidityRatioFromRh(
  dryBulbC: number,
  relativeHumidityPct: number,
  pressureKpa: number,
): number {
  return humidityRatioFromVaporPressure(
    (relativeHumidityPct / 100) * saturationVaporPressureLiquidKpa(dryBulbC),
    pressureKpa,
  )
}
