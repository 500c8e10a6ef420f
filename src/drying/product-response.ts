/**
 * @module drying/product-response
 * What the hourly engine asks of a product profile, evaluated once per hour and stored: equilibrium
 * moisture in both directions, equilibrium RH at the target, and the thin-layer step parameters. The
 * science is the product room's (isotherm-models.ts, kinetics-models.ts, diffusion.ts); this file only
 * adapts it to per-hour columns: Page-form parameters MR(t) = exp(−k·tⁿ) from product/drying-rate.ts
 * (Lewis, Henderson–Pabis and first-term diffusion have n = 1), stepped by equivalent time,
 * t_eq = (−ln MR / k)^(1/n), MR' = exp(−k·(t_eq + Δt)ⁿ) (docs/model.md §7); Thompson's corn
 * equation is stepped in its own equivalent time.
 */
import { power } from '../physics/power.ts'

import { rateParametersAt, timeScaleFactor } from '../product/drying-rate.ts'
import { equilibriumMoistureDb, equilibriumRelativeHumidityPct } from '../product/equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from '../product/isotherm-models.ts'
import { thompsonMoistureRatio, thompsonTimeH } from '../product/kinetics-models.ts'
import type { ProductProfile } from '../product/profile.ts'

/** Highest RH [%] at which an equilibrium moisture is evaluated (isotherms diverge at 100 %). */
export const EMC_RH_CAP_PCT = 99.5
/** Lowest RH [%] passed to an isotherm (very hot heated air); below it the EMC is taken at this RH. */
export const EMC_RH_FLOOR_PCT = 1

/** Slots of the per-hour response array of {@link ProductResponse.hourResponse}. */
export const HOUR_EMC_DESORPTION = 0
export const HOUR_EMC_ADSORPTION = 1
export const HOUR_RATE_K = 2
export const HOUR_RATE_N = 3

/** Marker value of the Page exponent for Thompson's corn equation (k then holds the air temperature). */
export const THOMPSON_EXPONENT = 0

export interface ProductResponse {
  profile: ProductProfile
  thicknessMm: number
  /** Equilibrium moisture [kg/kg db] while drying, at product temperature and the RH at its surface. */
  emcDesorptionDb(tC: number, rhPct: number): number
  /** Equilibrium moisture [kg/kg db] for rewetting (adsorption constants when the profile has them). */
  emcAdsorptionDb(tC: number, rhPct: number): number
  /** Equilibrium RH [%] of the product at moisture `moistureDb` and tC (desorption isotherm). */
  erhPct(tC: number, moistureDb: number): number
  /** Page step parameters at (tC, rhPct) into out[0] = k [h⁻ⁿ], out[1] = n. n = 0 marks Thompson (k = tC). */
  stepParameters(tC: number, rhPct: number, out: Float64Array): void
  /**
   * Optional: the four per-hour values at once into `out` at the slots {@link HOUR_EMC_DESORPTION},
   * {@link HOUR_EMC_ADSORPTION} [kg/kg db], {@link HOUR_RATE_K} [h⁻ⁿ] and {@link HOUR_RATE_N}, equal to the
   * separate calls (a tabulated response shares one grid-cell location between them).
   */
  hourResponse?(tC: number, rhPct: number, out: Float64Array): void
  /** Rewetting rate constant as a fraction of the drying one (profile value and its source). */
  rewettingRateFactor: number
  /** Time-scale factor s of Thompson's equation at this thickness (drying-rate.ts); 1 for other models. */
  thompsonTimeScale: number
}

function clampT(tC: number): number {
  return tC < ISOTHERM_T_MIN_C ? ISOTHERM_T_MIN_C : Math.min(tC, ISOTHERM_T_MAX_C)
}

function clampRh(rhPct: number): number {
  return rhPct > EMC_RH_CAP_PCT ? EMC_RH_CAP_PCT : Math.max(rhPct, EMC_RH_FLOOR_PCT)
}

/**
 * EMC that never throws inside the hourly loop: clamps T and RH to the isotherm's domain and, where the
 * model has no positive root (Chung–Pfost at very low RH), returns a tiny positive moisture.
 */
function safeEmc(
  profile: ProductProfile,
  tC: number,
  rhPct: number,
  direction: 'desorption' | 'adsorption',
): number {
  try {
    return equilibriumMoistureDb(profile, clampT(tC), clampRh(rhPct), direction)
  } catch {
    return 1e-4
  }
}

/**
 * Build the response of `profile` at size `thicknessMm` (default: the profile's). Rate parameters come
 * from product/drying-rate.ts `rateParametersAt` (thickness scaling included; air velocity is not passed,
 * so velocity effects are ignored hour by hour: stated simplification).
 */
export function productResponse(profile: ProductProfile, thicknessMm?: number): ProductResponse {
  const thick = thicknessMm ?? profile.defaultThicknessMm.value
  const timeScale = timeScaleFactor(profile, thick) // validates the thickness
  const stepParameters = (tC: number, rhPct: number, out: Float64Array): void => {
    const t = tC < -20 ? -20 : Math.min(tC, 150)
    const rh = rhPct < 0 ? 0 : Math.min(rhPct, 100)
    const p = rateParametersAt(profile, t, rh, undefined, thick)
    if (p) {
      out[0] = p.kPerHn
      out[1] = p.n
    } else {
      out[0] = t
      out[1] = THOMPSON_EXPONENT
    }
  }
  return {
    profile,
    thicknessMm: thick,
    thompsonTimeScale: timeScale,
    emcDesorptionDb: (tC, rhPct) => safeEmc(profile, tC, rhPct, 'desorption'),
    emcAdsorptionDb: (tC, rhPct) => safeEmc(profile, tC, rhPct, 'adsorption'),
    erhPct: (tC, moistureDb) => equilibriumRelativeHumidityPct(profile, clampT(tC), moistureDb),
    stepParameters,
    rewettingRateFactor: profile.kinetics.rewettingRateFactor.value,
  }
}

/**
 * One equivalent-time step of `hours` for moisture ratio `mr` (0 < mr ≤ 1) with step parameters k, n
 * (and Thompson's time scale s when n = {@link THOMPSON_EXPONENT}). Returns the new moisture ratio.
 * Same equations as product/stepping.ts `stepMoisture`, specialised to precomputed per-hour k and n
 * (checked against it in the tests).
 */
export function stepMoistureRatio(
  mr: number,
  k: number,
  n: number,
  hours: number,
  thompsonTimeScale = 1,
): number {
  if (mr <= 0) return 0
  if (n === THOMPSON_EXPONENT) {
    const tEq = mr >= 1 ? 0 : Math.max(0, thompsonTimeH(k, mr))
    return thompsonMoistureRatio(k, tEq + hours / thompsonTimeScale)
  }
  if (mr >= 1) return Math.exp(-k * power(hours, n))
  if (n === 1) return mr * Math.exp(-k * hours)
  const tEq = power(-Math.log(mr) / k, 1 / n)
  return Math.exp(-k * power(tEq + hours, n))
}

/** First-order rate constant [h⁻¹] for rewetting from step parameters: k^(1/n), or 1/(s·t(MR = 1/e)) for Thompson. */
export function firstOrderRateConstant(k: number, n: number, thompsonTimeScale = 1): number {
  if (n === THOMPSON_EXPONENT) return 1 / (thompsonTimeScale * thompsonTimeH(k, Math.exp(-1)))
  return n === 1 ? k : power(k, 1 / n)
}
