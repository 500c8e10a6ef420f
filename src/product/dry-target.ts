/**
 * @module product/dry-target
 * When the product is dry: water activity decides. The target moisture of a batch is the moisture at which
 * the product's desorption isotherm gives its safe water activity at the storage temperature (rounded down to
 * 0.1 % wb, so the water activity stays at or below the safe value), unless the profile's own moisture figure
 * (a trade or quality limit, such as dehydrated onion at 4–5 %) is drier: that one holds then, and it keeps the
 * water activity lower still. A target the user gives is used as given; when it leaves the water activity
 * above the safe value at the storage temperature, a warning says so and names the moisture that would not.
 */
import { equilibriumMoistureDb, equilibriumRelativeHumidityPct } from './equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from './isotherm-models.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from './moisture-basis.ts'
import type { ProductProfile } from './profile.ts'

/**
 * Storage temperature [°C] at which the water activity of the dried product is judged when none is given:
 * 25 °C, a warm store (assumption; water-activity limits for microbial growth are usually stated near room
 * temperature, from memory). Sorption isotherms give a higher water activity at the same moisture in a warmer
 * store, so a warmer storage temperature asks for drier product.
 */
export const DEFAULT_STORAGE_TEMP_C = 25
/** Accepted storage temperatures [°C]. */
export const STORAGE_TEMP_RANGE_C = [0, 50] as const
/** A user's target leaves the water activity "above the safe value" only beyond this margin (rounding) [–]. */
const AW_MARGIN = 0.005

export type DryTargetBasis = 'water-activity' | 'profile-moisture' | 'user'

export interface DryTarget {
  /** The moisture the batch dries to [% wb]. */
  targetWbPct: number
  /**
   * Where it comes from: the safe water activity through the isotherm; the profile's own moisture figure
   * (drier than that, or the isotherm gives no moisture there); or the user.
   */
  basis: DryTargetBasis
  /** Water activity at or below which the dried product is safe [–], with its source. */
  safeWaterActivity: number
  safeWaterActivitySource: string
  /** Temperature of the store at which the water activity is judged [°C]. */
  storageTempC: number
  /** Moisture [% wb] at the safe water activity and storage temperature (desorption isotherm); null when the isotherm has none. */
  moistureAtSafeWaterActivityWbPct: number | null
  /** Water activity of the product at the target moisture and storage temperature [–]. */
  waterActivityAtTarget: number | null
  /** The profile's own target moisture [% wb] (a trade or quality limit) and its water activity at the storage temperature. */
  profileMoistureWbPct: number
  waterActivityAtProfileMoisture: number | null
  /** A warning for the user when the target leaves the water activity above the safe value; null otherwise. */
  warning: string | null
  /** What "dry" means here, in one sentence to follow the words "dry means" (e.g. "14.3 % wb: water activity 0.60 at 25 °C …"). */
  sentence: string
}

function awAt(profile: ProductProfile, tC: number, wbPct: number): number | null {
  try {
    const aw = equilibriumRelativeHumidityPct(profile, tC, moistureDbFromWbPct(wbPct), 'desorption') / 100
    return Number.isFinite(aw) ? aw : null
  } catch {
    return null
  }
}

function moistureAtAw(profile: ProductProfile, tC: number, aw: number): number | null {
  if (!(aw > 0 && aw < 1)) return null
  try {
    const wb = moistureWbPctFromDb(equilibriumMoistureDb(profile, tC, 100 * aw, 'desorption'))
    return Number.isFinite(wb) && wb > 0 ? wb : null
  } catch {
    return null
  }
}

const f2 = (x: number | null): string => (x === null ? 'unknown' : x.toFixed(2))
const f1 = (x: number): string => String(Math.round(10 * x) / 10)

/**
 * The dry target of `profile`: the user's `userTargetWbPct` when given, else the moisture of its safe water
 * activity at `storageTempC` (or the profile's moisture figure when drier). Throws RangeError for a storage
 * temperature outside {@link STORAGE_TEMP_RANGE_C} or outside the isotherm's temperature range.
 */
export function resolveDryTarget(
  profile: ProductProfile,
  options: { userTargetWbPct?: number; storageTempC?: number } = {},
): DryTarget {
  const storageTempC = options.storageTempC ?? DEFAULT_STORAGE_TEMP_C
  const [lo, hi] = STORAGE_TEMP_RANGE_C
  if (
    !(
      storageTempC >= lo &&
      storageTempC <= hi &&
      storageTempC >= ISOTHERM_T_MIN_C &&
      storageTempC <= ISOTHERM_T_MAX_C
    )
  ) {
    throw new RangeError(`storage temperature must be between ${lo} and ${hi} °C, got ${storageTempC}`)
  }
  const safe = profile.waterActivityTarget.value
  const profileWb = profile.targetMoistureWbPct.value
  const atSafe = moistureAtAw(profile, storageTempC, safe)
  // rounded down to 0.1 % wb: the water activity stays at or below the safe value
  const atSafeRounded = atSafe === null ? null : Math.floor(10 * atSafe + 1e-9) / 10
  const user =
    options.userTargetWbPct ?? (profile.targetMoistureWbPct.confidence === 'user' ? profileWb : undefined)
  let targetWbPct: number
  let basis: DryTargetBasis
  if (user !== undefined) {
    targetWbPct = user
    basis = 'user'
  } else if (atSafeRounded !== null && atSafeRounded < profileWb) {
    targetWbPct = atSafeRounded
    basis = 'water-activity'
  } else {
    targetWbPct = profileWb
    basis = 'profile-moisture'
  }
  const awTarget = awAt(profile, storageTempC, targetWbPct)
  const awProfile = awAt(profile, storageTempC, profileWb)
  const storage = `${f1(storageTempC)} °C`
  let warning: string | null = null
  if (basis === 'user' && awTarget !== null && awTarget > safe + AW_MARGIN) {
    warning =
      `the target ${f1(targetWbPct)} % wb leaves the product at water activity ${f2(awTarget)} at ${storage}, above its safe ${f2(safe)}: ` +
      `moulds and yeasts can grow in store${atSafeRounded === null ? '' : `; dry to ${f1(atSafeRounded)} % wb (water activity ${f2(safe)}) to store it safely`}`
  }
  let sentence: string
  if (basis === 'water-activity') {
    sentence = `${f1(targetWbPct)} % wb: water activity ${f2(safe)} at ${storage} by the product's isotherm (the profile's ${f1(profileWb)} % wb would leave ${f2(awProfile)})`
  } else if (basis === 'profile-moisture') {
    sentence =
      atSafe === null
        ? `${f1(targetWbPct)} % wb, the profile's moisture figure (its isotherm gives no moisture at water activity ${f2(safe)} and ${storage})`
        : `${f1(targetWbPct)} % wb, the profile's moisture figure, drier than the ${f1(atSafeRounded as number)} % wb of water activity ${f2(safe)} at ${storage} (water activity ${f2(awTarget)} there)`
  } else {
    sentence = `${f1(targetWbPct)} % wb as given: water activity ${f2(awTarget)} at ${storage} (safe: ${f2(safe)}${atSafeRounded === null ? '' : `, reached at ${f1(atSafeRounded)} % wb`})`
  }
  return {
    targetWbPct,
    basis,
    safeWaterActivity: safe,
    safeWaterActivitySource: profile.waterActivityTarget.source,
    storageTempC,
    moistureAtSafeWaterActivityWbPct: atSafe,
    waterActivityAtTarget: awTarget,
    profileMoistureWbPct: profileWb,
    waterActivityAtProfileMoisture: awProfile,
    warning,
    sentence,
  }
}
