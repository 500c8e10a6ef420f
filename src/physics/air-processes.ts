/**
 * @module physics/air-processes
 * The two things drying does to air, from the moist-air relations of ASHRAE Handbook — Fundamentals
 * (2017) ch. 1 (physics/moist-air.ts): sensible heating at constant humidity ratio (a heater or a solar
 * collector), and adiabatic take-up of water along the line of constant enthalpy (eq 30; the air cools as
 * it evaporates water; constant enthalpy is the usual approximation of the wet-bulb line, ASHRAE HOF 2017
 * ch. 1 §"Adiabatic saturation"). Units: °C, kPa, kg water / kg dry air, kJ/kg dry air.
 *
 * The adiabatic solver has a scalar form ({@link adiabaticHumidityRatioAtRh}) and a kernel form for hot
 * loops ({@link solveAdiabaticPath} on an {@link AdiabaticPath} reused for every hour): the scalar calls the
 * kernel, so both give the same bits. The solver's iterates read saturation and its slope from the
 * interpolated table of eq 6 (physics/saturation-table.ts, within 1e-9 relative of the formula: under 1e-8 K
 * in the end point), which replaces an exp, a log and a derivative per Newton step.
 */

import {
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  dewPointFromVaporPressureC,
  dryBulbFromEnthalpyC,
  humidityRatioFromEnthalpy,
  humidityRatioFromVaporPressure,
  MOLAR_MASS_RATIO_WATER_AIR,
  moistAirEnthalpyKjPerKg,
  saturationHumidityRatio,
  VAPOR_ENTHALPY_0C_KJ_PER_KG,
  vaporPressureFromHumidityRatio,
} from './moist-air.ts'
import { saturationPressureLiquidPa, saturationVaporPressureLiquidKpa } from './saturation.ts'
import { liquidSaturationPressureFromTableKpa } from './saturation-table.ts'
import { wetBulbFromHumidityRatioC } from './wet-bulb.ts'

/** Newton tolerance of the adiabatic solver [°C] and its iteration cap (our choice). */
export const ADIABATIC_TOLERANCE_C = 1e-4
export const ADIABATIC_MAX_ITERATIONS = 30

/** RH over liquid water [%] of air with humidity ratio `w` [kg/kg] at `dryBulbC` and `pressureKpa`. */
export function relativeHumidityPctAt(dryBulbC: number, w: number, pressureKpa: number): number {
  return (100 * vaporPressureFromHumidityRatio(w, pressureKpa)) / saturationVaporPressureLiquidKpa(dryBulbC)
}

/** Humidity ratio [kg/kg] from dry bulb, RH over liquid water [%] and pressure [kPa] (eq 20). */
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
 * Dry bulb [°C] at the end of the adiabatic path from (`dryBulbC`, `w`) after the air took up
 * `takenUpKgPerKg` of water: eq 30 at constant enthalpy, h(t, W) = h(t_end, W + ΔW).
 */
export function adiabaticEndDryBulbC(dryBulbC: number, w: number, takenUpKgPerKg: number): number {
  return dryBulbFromEnthalpyC(moistAirEnthalpyKjPerKg(dryBulbC, w), w + takenUpKgPerKg)
}

/**
 * In and out of {@link solveAdiabaticPath}: the air at the start of the path and the RH at which it ends.
 * One object serves every hour of a loop (no number is boxed on the call).
 */
export class AdiabaticPath {
  /** Dry bulb at the start [°C]. */
  dryBulbC = Number.NaN
  /** Humidity ratio at the start [kg/kg]. */
  humidityRatio = Number.NaN
  pressureKpa = Number.NaN
  /** RH where the path ends [fraction of saturation over liquid water]. */
  endRhFraction = Number.NaN
  /** First iterate [°C] when inside (T − 80, T) (e.g. the previous hour's end point); NaN: the dry bulb. */
  guessC = Number.NaN
  /** exp(ln pws(dry bulb)) [Pa] (eq 6) when the caller has it; NaN: computed. */
  saturationPa = Number.NaN
  /** Out: humidity ratio where the path reaches `endRhFraction` [kg/kg] (the start W when already there). */
  endHumidityRatio = Number.NaN
}

/** dpws/dT [kPa/K] of the solver's last table read. */
const saturationSlope = new Float64Array(1)

/**
 * Humidity ratio reached when air takes up water adiabatically (constant enthalpy) until its RH equals
 * `endRhFraction`: Newton on f(T) = pw(W(T)) − φ·pws(T) with W(T) = (h − 1.006T)/(2501 + 1.86T) (eq 30),
 * pw from eq 20 and pws from eq 6 (its interpolated table), kept inside the bracket (T − 80 °C, T) by bisection. Tolerance
 * {@link ADIABATIC_TOLERANCE_C}, at most {@link ADIABATIC_MAX_ITERATIONS} steps (then the last iterate).
 */
export function solveAdiabaticPath(path: AdiabaticPath): void {
  const dryBulbC = path.dryBulbC
  const w = path.humidityRatio
  const pressureKpa = path.pressureKpa
  const rhFraction = path.endRhFraction
  const startC = path.guessC
  const h = moistAirEnthalpyKjPerKg(dryBulbC, w)
  const pw0 = vaporPressureFromHumidityRatio(w, pressureKpa)
  const pwsPa = Number.isNaN(path.saturationPa) ? saturationPressureLiquidPa(dryBulbC) : path.saturationPa
  if (pw0 >= rhFraction * pwsPa * 1e-3) {
    path.endHumidityRatio = w
    return
  }
  let lo = dryBulbC - 80
  let hi = dryBulbC
  // Start at the dry bulb, or at a caller's guess inside the bracket (e.g. the previous hour's end point).
  let t = startC > lo && startC < hi ? startC : dryBulbC
  for (let i = 0; i < ADIABATIC_MAX_ITERATIONS; i++) {
    const denom = VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * t
    const wt = (h - CP_DRY_AIR_KJ_PER_KG_K * t) / denom
    // dW/dT along constant h
    const dw =
      (-CP_DRY_AIR_KJ_PER_KG_K * denom - (h - CP_DRY_AIR_KJ_PER_KG_K * t) * CP_WATER_VAPOR_KJ_PER_KG_K) /
      (denom * denom)
    const pw = vaporPressureFromHumidityRatio(wt, pressureKpa)
    // x·x is x ** 2 bit for bit (IEEE pow returns x·x for y = 2) without the pow call
    const dpwDenom = MOLAR_MASS_RATIO_WATER_AIR + wt
    const dpw = (pressureKpa * MOLAR_MASS_RATIO_WATER_AIR * dw) / (dpwDenom * dpwDenom)
    const pws = liquidSaturationPressureFromTableKpa(t, saturationSlope)
    const f = pw - rhFraction * pws
    const df = dpw - rhFraction * saturationSlope[0]
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
  path.endHumidityRatio = humidityRatioFromEnthalpy(h, t)
}

const scratch = new AdiabaticPath()

/**
 * Humidity ratio [kg/kg] reached when air at (`dryBulbC`, `w`, `pressureKpa`) takes up water
 * adiabatically until its RH equals `rhFraction` ({@link solveAdiabaticPath}). `startC`: first iterate;
 * `saturationPa`: exp(ln pws(dryBulbC)) in Pa when the caller has it.
 */
export function adiabaticHumidityRatioAtRh(
  dryBulbC: number,
  w: number,
  pressureKpa: number,
  rhFraction: number,
  startC?: number,
  saturationPa?: number,
): number {
  scratch.dryBulbC = dryBulbC
  scratch.humidityRatio = w
  scratch.pressureKpa = pressureKpa
  scratch.endRhFraction = rhFraction
  scratch.guessC = startC ?? Number.NaN
  scratch.saturationPa = saturationPa ?? Number.NaN
  solveAdiabaticPath(scratch)
  return scratch.endHumidityRatio
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
