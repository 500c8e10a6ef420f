/**
 * @module drying/deep-bed/grain-from-profile
 * Builds the grain inputs of the deep-bed model from a product profile (its desorption isotherm, the net heat
 * of sorption from that isotherm by Clausius–Clapeyron) and the per-grain bin constants below.
 */
import { equilibriumRelativeHumidityPct, heatOfSorption } from '../../product/equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from '../../product/isotherm-models.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { AIRFLOW_RESISTANCE, BUSHEL_M3, BUSHEL_WEIGHT_KG } from './airflow-resistance.ts'
import type { DeepBedGrain } from './layer-model.ts'

/**
 * Specific heat of the dry matter of grain [kJ/(kg·K)]: 1.465 for shelled corn (Brooker, Bakker-Arkema &
 * Hall 1992, *Drying and Storage of Grains and Oilseeds*, c_p = 1.465 + 3.56·M for corn, M db; from memory).
 * Used for the other grains too (an approximation).
 */
export const GRAIN_DRY_MATTER_CP_KJ_PER_KG_K = 1.465

export function deepBedGrainFromProfile(
  profile: ProductProfile,
  options: { bulkDensityKgPerM3?: number; resistanceKey?: string } = {},
): DeepBedGrain {
  const key = options.resistanceKey ?? profile.variantOf ?? profile.id
  const resistance = AIRFLOW_RESISTANCE[key]
  if (!resistance) {
    throw new RangeError(
      `no airflow-resistance constants for '${key}'; known: ${Object.keys(AIRFLOW_RESISTANCE).join(', ')}`,
    )
  }
  const bushelKg = BUSHEL_WEIGHT_KG[key]
  const density = options.bulkDensityKgPerM3 ?? (bushelKg ? bushelKg / BUSHEL_M3 : undefined)
  if (density === undefined) throw new RangeError(`give bulkDensityKgPerM3 for '${key}'`)
  const clampT = (tC: number) => Math.min(Math.max(tC, ISOTHERM_T_MIN_C), ISOTHERM_T_MAX_C - 1)
  return {
    erhPct: (tC, moistureDb) =>
      equilibriumRelativeHumidityPct(profile, clampT(tC), Math.max(moistureDb, 1e-4)),
    netSorptionHeatKjPerKg: (tC, moistureDb) =>
      Math.max(
        0,
        heatOfSorption(
          profile,
          Math.min(Math.max(tC, ISOTHERM_T_MIN_C + 1), ISOTHERM_T_MAX_C - 2),
          moistureDb,
        ).netKjPerKg,
      ),
    dryMatterCpKjPerKgK: GRAIN_DRY_MATTER_CP_KJ_PER_KG_K,
    bulkDensityKgPerM3: density,
    airflowResistance: resistance,
  }
}
