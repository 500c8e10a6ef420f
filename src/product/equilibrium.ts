/**
 * @module product/equilibrium
 * Per-hour equilibrium functions of a profile: equilibrium moisture content (EMC) and equilibrium RH (ERH),
 * and the heat of sorption of the same isotherm (product/sorption-heat.ts, Clausius–Clapeyron).
 */
import { MOLAR_MASS_WATER_KG_PER_MOL } from '../physics/constants.ts'
import { latentHeatVaporizationMjPerKg } from '../physics/evaporation.ts'
import { emcDb, erhPct, ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from './isotherm-models.ts'
import { moistureWbPctFromDb } from './moisture-basis.ts'
import { isothermFor, type ProductProfile } from './profile.ts'
import { ISOSTERIC_DT_K, netIsostericHeatMjPerKg } from './sorption-heat.ts'

export type SorptionDirection = 'desorption' | 'adsorption'

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
 * Heat of sorption of `profile` at tC [°C] and moisture [kg/kg db]: the net isosteric heat of its isotherm
 * (product/sorption-heat.ts, Clausius–Clapeyron) and the total with the latent heat of free water
 * (physics/evaporation.ts, FAO-56 Annex 3 eq 3-1). Zero where the isotherm has no temperature dependence
 * (some GAB fits at one temperature) or where aw = 1 (free water). tC is kept 0.5 K inside the isotherm's
 * accepted range.
 */
export function heatOfSorption(
  profile: ProductProfile,
  tC: number,
  moistureDb: number,
  direction: SorptionDirection = 'desorption',
): HeatOfSorption {
  const eq = isothermFor(profile, direction).equation
  const t = Math.min(Math.max(tC, ISOTHERM_T_MIN_C + ISOSTERIC_DT_K), ISOTHERM_T_MAX_C - ISOSTERIC_DT_K)
  const netKjPerKg = 1000 * netIsostericHeatMjPerKg(eq, t, moistureDb)
  const temperatureDependent =
    eq.model !== 'gab' || eq.hxJPerMol !== 0 || eq.hcJPerMol !== 0 || eq.hkJPerMol !== 0
  return {
    temperatureDependent,
    netKjPerMol: netKjPerKg * MOLAR_MASS_WATER_KG_PER_MOL,
    netKjPerKg,
    totalKjPerKg: 1000 * latentHeatVaporizationMjPerKg(tC) + netKjPerKg,
    method: `Clausius–Clapeyron on the ${eq.model} ${direction} isotherm, central difference ±${ISOSTERIC_DT_K} K`,
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
