/**
 * @module product/equilibrium
 * Per-hour equilibrium functions of a profile: equilibrium moisture content (EMC) and equilibrium RH (ERH),
 * and the heat of sorption derived from the same isotherm by the Clausius–Clapeyron equation, so that
 * energy and equilibrium stay consistent (Iglesias & Chirife 1976; method as in Kaymak-Ertekin & Gedik 2004,
 * *LWT* 37:429): q_net = −R·∂ln aw/∂(1/T) at constant moisture.
 */
import { emcDb, erhPct, GAS_CONSTANT_J_PER_MOL_K } from './isotherm-models.ts'
import { moistureWbPctFromDb } from './moisture-basis.ts'
import { isothermFor, type ProductProfile } from './profile.ts'

export type SorptionDirection = 'desorption' | 'adsorption'

/** Molar mass of water [kg/mol] (IAPWS: 18.015268 g/mol). */
export const MOLAR_MASS_WATER_KG_PER_MOL = 0.018015268

/**
 * Equilibrium moisture content [kg water/kg dry matter] of `profile` in air at tC [°C], rhPct [%].
 * `direction`: 'desorption' while drying, 'adsorption' while regaining water (falls back to desorption
 * constants when the profile has no adsorption isotherm). tC and rhPct are the air state at the product
 * (RH referred to the product temperature). RangeError at RH 0 or 100 % or outside the model's domain.
 */
export function equilibriumMoistureDb(
  profile: ProductProfile,
  tC: number,
  rhPct: number,
  direction: SorptionDirection = 'desorption',
): number {
  return emcDb(isothermFor(profile, direction).equation, tC, rhPct)
}

/** Equilibrium RH [%] (100 × water activity) of `profile` at tC [°C] and moisture [kg/kg db]; 100 = free water. */
export function equilibriumRelativeHumidityPct(
  profile: ProductProfile,
  tC: number,
  moistureDb: number,
  direction: SorptionDirection = 'desorption',
): number {
  return erhPct(isothermFor(profile, direction).equation, tC, moistureDb)
}

/** Latent heat of vaporisation of free water [kJ/kg], λ = 2501 − 2.361·T (FAO-56 form; from memory). */
export function latentHeatFreeWaterKjPerKg(tC: number): number {
  return 2501 - 2.361 * tC
}

export interface HeatOfSorption {
  /** Net isosteric heat q_net [kJ/mol], the heat above that of free water. */
  netKjPerMol: number
  /** Net isosteric heat [kJ/kg water]. */
  netKjPerKg: number
  /** Total heat to evaporate bound water = λ(T) + q_net [kJ/kg water]. */
  totalKjPerKg: number
  /**
   * False when the isotherm has no temperature dependence (GAB fitted at one temperature): q_net is then
   * reported as 0 for lack of data, not because the water is free; use a published isosteric heat instead.
   */
  temperatureDependent: boolean
  method: string
}

/**
 * Heat of sorption of `profile` at tC [°C] and moisture [kg/kg db], from its isotherm by Clausius–Clapeyron,
 * q_net = −R·Δln aw/Δ(1/T) at constant M, central difference over tC ± 1 K. Zero where the isotherm has no
 * temperature dependence (some GAB fits at one temperature) or where aw = 1 (free water).
 */
export function heatOfSorption(
  profile: ProductProfile,
  tC: number,
  moistureDb: number,
  direction: SorptionDirection = 'desorption',
): HeatOfSorption {
  const dT = 1
  const awHi = equilibriumRelativeHumidityPct(profile, tC + dT, moistureDb, direction) / 100
  const awLo = equilibriumRelativeHumidityPct(profile, tC - dT, moistureDb, direction) / 100
  let net = 0
  if (awHi < 1 && awLo < 1) {
    const invHi = 1 / (tC + dT + 273.15)
    const invLo = 1 / (tC - dT + 273.15)
    net = (-GAS_CONSTANT_J_PER_MOL_K * (Math.log(awHi) - Math.log(awLo))) / (invHi - invLo) / 1000
  }
  const netKjPerKg = net / MOLAR_MASS_WATER_KG_PER_MOL
  const eq = isothermFor(profile, direction).equation
  const temperatureDependent =
    eq.model !== 'gab' || eq.hxJPerMol !== 0 || eq.hcJPerMol !== 0 || eq.hkJPerMol !== 0
  return {
    temperatureDependent,
    netKjPerMol: net,
    netKjPerKg,
    totalKjPerKg: latentHeatFreeWaterKjPerKg(tC) + netKjPerKg,
    method: `Clausius–Clapeyron on the ${isothermFor(profile, direction).equation.model} ${direction} isotherm, ±1 K`,
  }
}

/**
 * The moisture [% wb] at which the product reaches its water-activity target at tC [°C] (desorption
 * isotherm), and the stricter (lower) of that and the profile's target moisture. The two differ where the
 * trade's moisture limit and the isotherm disagree (e.g. rough rice at 14 % wb sits near aw 0.74 at 25 °C).
 */
export function safeMoistureWbPct(
  profile: ProductProfile,
  tC: number,
): {
  atWaterActivityTargetWbPct: number
  stricterWbPct: number
} {
  const aw = profile.waterActivityTarget.value
  const at =
    aw >= 1
      ? profile.targetMoistureWbPct.value
      : moistureWbPctFromDb(equilibriumMoistureDb(profile, tC, 100 * aw, 'desorption'))
  return { atWaterActivityTargetWbPct: at, stricterWbPct: Math.min(at, profile.targetMoistureWbPct.value) }
}
