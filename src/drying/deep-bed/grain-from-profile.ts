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
 * Specific heat of the dry matter of grain [kJ/(kg·K)]: 1.465 for shelled corn, the constant of
 * c_p = 1.465 + 3.56·M (kJ/(kg·K) of wet grain, M wet basis as a fraction; Brooker, Bakker-Arkema & Hall 1992,
 * *Drying and Storage of Grains and Oilseeds*; from memory). Corroborated, not read in the original: the same
 * equation in kcal/(kg·°C), 0.350 + 0.851·M, appears in public teaching code for the Thompson drying model that
 * copies it from an unnamed textbook table (which gives 0.278 + 0.960·M for rough rice and 0.391 + 0.461·M for
 * soybean). Used for every grain (an approximation), with the water in the grain at 4.186 kJ/(kg·K): that gives a
 * wet-grain heat capacity about 8 % below the corn equation at 20 % wb (the equation's slope, 3.56, is larger than
 * that of free water less dry matter, 2.72).
 */
export const GRAIN_DRY_MATTER_CP_KJ_PER_KG_K = 1.465

const built = new WeakMap<ProductProfile, Map<string, DeepBedGrain>>()

/**
 * The deep-bed grain of a catalogue or user profile. The same profile and options give the same object, so the
 * bin model's tables (`grain-tables.ts`) are built once per grain and process.
 */
export function deepBedGrainFromProfile(
  profile: ProductProfile,
  options: { bulkDensityKgPerM3?: number; resistanceKey?: string } = {},
): DeepBedGrain {
  const key = `${options.bulkDensityKgPerM3 ?? ''}|${options.resistanceKey ?? ''}`
  let byOptions = built.get(profile)
  if (!byOptions) {
    byOptions = new Map()
    built.set(profile, byOptions)
  }
  const cached = byOptions.get(key)
  if (cached) return cached
  const grain = buildGrain(profile, options)
  byOptions.set(key, grain)
  return grain
}

function buildGrain(
  profile: ProductProfile,
  options: { bulkDensityKgPerM3?: number; resistanceKey?: string },
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
