/**
 * @module product/stepping
 * The product through changing hours: one step of the falling-rate period under the hour's air, with
 * - Page (and Thompson) stepped by equivalent time: the time the product would have needed under this
 *   hour's conditions to reach its present moisture ratio, plus the step (e.g. Brooker, Bakker-Arkema &
 *   Hall 1992, ch. 9; from memory); for first-order models this reduces to MR·exp(−k·Δt), and
 *   Henderson–Pabis (MR = a·exp(−k·t)) steps exactly like Lewis with its k: `a` only shifts the time origin;
 * - a constant-rate cap: the loss in a step cannot exceed the wet-surface evaporation the caller computed
 *   (Penman, or humidity-ratio deficit × air flow), per kg of dry matter on the tray; with a wet-surface state,
 *   the product's temperature follows its surface balance ({@link surfaceBalancedDrop});
 * - rewetting when the adsorption EMC is above the moisture, first order at `rewettingRateFactor` × the
 *   drying rate; no change inside the hysteresis band between adsorption and desorption EMC.
 * Air above 99.5 % RH (fog, saturation) is treated as 99.5 % with `saturatedAir` set, because no
 * equilibrium moisture exists at 100 %; air below 0.5 % RH as 0.5 %.
 */
import { power } from '../physics/power.ts'

import { dryingRateConstantPerH, rateParametersAt, timeScaleFactor } from './drying-rate.ts'
import { equilibriumMoistureDb } from './equilibrium.ts'
import { thompsonMoistureRatio, thompsonTimeH } from './kinetics-models.ts'
import { moistureDbFromWbPct } from './moisture-basis.ts'
import type { ProductProfile } from './profile.ts'

export const RH_STEP_MAX_PCT = 99.5
export const RH_STEP_MIN_PCT = 0.5

/** A profile prepared for a batch: thickness and loading fixed once. */
export interface PreparedProduct {
  profile: ProductProfile
  thicknessMm: number
  /** Dry matter on the tray or floor [kg/m²], from loading and initial moisture. */
  dryMatterKgPerM2: number
}

export function prepareProduct(
  profile: ProductProfile,
  options: { thicknessMm?: number; loadingKgPerM2?: number; initialMoistureWbPct?: number } = {},
): PreparedProduct {
  const thicknessMm = options.thicknessMm ?? profile.defaultThicknessMm.value
  timeScaleFactor(profile, thicknessMm) // validates
  const loading = options.loadingKgPerM2 ?? profile.defaultLoadingKgPerM2.value
  if (!(loading > 0 && loading < 2000))
    throw new RangeError(`loading must be between 0 and 2000 kg/m², got ${loading}`)
  const w0 = options.initialMoistureWbPct ?? profile.initialMoistureWbPct.value
  return { profile, thicknessMm, dryMatterKgPerM2: loading * (1 - w0 / 100) }
}

export interface MoistureState {
  product: PreparedProduct
  /** Present moisture [kg/kg db]. */
  moistureDb: number
  /** Moisture at the start of the batch [kg/kg db], the M0 of the moisture ratio. */
  initialMoistureDb: number
}

export function initialMoistureState(product: PreparedProduct, initialMoistureWbPct?: number): MoistureState {
  const m0 = moistureDbFromWbPct(initialMoistureWbPct ?? product.profile.initialMoistureWbPct.value)
  return { product, moistureDb: m0, initialMoistureDb: m0 }
}

export interface HourConditions {
  /** Temperature of the air at the product (or of the product) [°C]. */
  tC: number
  /** RH of that air referred to tC [%]. */
  rhPct: number
  airVelocityMs?: number
  /** Upper bound on evaporation [kg water/(m²·h)] (wet-surface rate); omit for no cap. */
  maxEvaporationKgPerM2H?: number
  /**
   * With the cap: the product's surface while it holds free water, at temperature `tC` [°C] and the RH of the
   * air there `rhPct` [%] (the wet-surface balance); `tC`/`rhPct` above are then those of a surface that
   * evaporates nothing, and the step follows {@link surfaceBalancedDrop}. Omit: the product is at `tC` whatever
   * it evaporates.
   */
  wetSurface?: { tC: number; rhPct: number }
}

export type StepPhase = 'falling-rate' | 'constant-rate' | 'rewetting' | 'hysteresis-hold'

export interface StepResult {
  state: MoistureState
  phase: StepPhase
  /** The EMC the step moved toward [kg/kg db] (desorption when drying, adsorption when rewetting). */
  equilibriumMoistureDb: number
  /** Water lost in the step [kg per kg dry matter]; negative when the product gained water. */
  waterLossKgPerKgDm: number
  saturatedAir: boolean
}

/**
 * Water [kg/kg db] the falling-rate model removes in `dtH` hours from `m` (batch start `m0`) at tC, rhPct; 0
 * when m is not above the desorption equilibrium there.
 */
function fallingRateLoss(
  profile: ProductProfile,
  thicknessMm: number,
  m: number,
  m0: number,
  tC: number,
  rhPct: number,
  airVelocityMs: number | undefined,
  dtH: number,
): number {
  const rh = Math.min(RH_STEP_MAX_PCT, Math.max(RH_STEP_MIN_PCT, rhPct))
  const me = equilibriumMoistureDb(profile, tC, rh, 'desorption')
  if (!(m > me)) return 0
  return m - fallingRateNextDb(profile, thicknessMm, m, m0, me, tC, rh, airVelocityMs, dtH)
}

/**
 * Moisture [kg/kg db] after `dtH` hours of the falling-rate model from `m` (> `me`, the desorption equilibrium at
 * tC and the clamped `rh`; batch start `m0`): equivalent-time stepping of the profile's thin-layer equation (Page
 * or Lewis by its rate parameters, Thompson's corn equation otherwise).
 */
function fallingRateNextDb(
  profile: ProductProfile,
  thicknessMm: number,
  m: number,
  m0: number,
  me: number,
  tC: number,
  rh: number,
  airVelocityMs: number | undefined,
  dtH: number,
): number {
  const mr = m0 > me ? (m - me) / (m0 - me) : 1
  let mrNext: number
  const p = rateParametersAt(profile, tC, rh, airVelocityMs, thicknessMm)
  if (p) {
    const tEq = mr >= 1 ? 0 : power(-Math.log(mr) / p.kPerHn, 1 / p.n)
    mrNext = Math.exp(-p.kPerHn * power(tEq + dtH, p.n))
  } else {
    const s = timeScaleFactor(profile, thicknessMm, airVelocityMs)
    const tEq = mr >= 1 ? 0 : thompsonTimeH(tC, mr)
    mrNext = thompsonMoistureRatio(tC, tEq + dtH / s)
  }
  return me + mrNext * (m0 - me)
}

/** One step of dtH hours [0 < dtH ≤ 24] under `conditions`. Pure: returns a new state. */
export function stepMoisture(state: MoistureState, conditions: HourConditions, dtH: number): StepResult {
  if (!(dtH > 0 && dtH <= 24)) throw new RangeError(`step must be above 0 and at most 24 h, got ${dtH}`)
  const { product } = state
  const { profile, thicknessMm } = product
  const m = state.moistureDb
  const saturatedAir = conditions.rhPct > RH_STEP_MAX_PCT
  if (!(conditions.rhPct >= 0 && conditions.rhPct <= 100)) {
    throw new RangeError(`relative humidity must be between 0 and 100 %, got ${conditions.rhPct}`)
  }
  const rh = Math.min(RH_STEP_MAX_PCT, Math.max(RH_STEP_MIN_PCT, conditions.rhPct))
  const { tC, airVelocityMs } = conditions
  const meDes = equilibriumMoistureDb(profile, tC, rh, 'desorption')
  const done = (next: number, phase: StepPhase, me: number): StepResult => ({
    state: { product, moistureDb: next, initialMoistureDb: Math.max(state.initialMoistureDb, next) },
    phase,
    equilibriumMoistureDb: me,
    waterLossKgPerKgDm: m - next,
    saturatedAir,
  })

  if (m > meDes) {
    const m0 = Math.max(state.initialMoistureDb, m)
    const next = fallingRateNextDb(profile, thicknessMm, m, m0, meDes, tC, rh, airVelocityMs, dtH)
    const cap = conditions.maxEvaporationKgPerM2H
    if (cap !== undefined) {
      if (!(cap >= 0)) throw new RangeError(`maximum evaporation must be ≥ 0 kg/(m²·h), got ${cap}`)
      const maxLoss = (cap * dtH) / product.dryMatterKgPerM2
      const wet = conditions.wetSurface
      if (wet !== undefined) {
        const dropWet = fallingRateLoss(profile, thicknessMm, m, m0, wet.tC, wet.rhPct, airVelocityMs, dtH)
        const drop = surfaceBalancedDrop(m - next, dropWet, maxLoss)
        return done(m - drop, drop >= maxLoss ? 'constant-rate' : 'falling-rate', meDes)
      }
      if (m - next > maxLoss) return done(m - maxLoss, 'constant-rate', meDes)
    }
    return done(next, 'falling-rate', meDes)
  }

  const meAds = equilibriumMoistureDb(profile, tC, rh, 'adsorption')
  if (m < meAds) {
    const k = dryingRateConstantPerH(profile, tC, rh, airVelocityMs, thicknessMm)
    const f = profile.kinetics.rewettingRateFactor.value
    const next = meAds - (meAds - m) * Math.exp(-f * k * dtH)
    return done(next, 'rewetting', meAds)
  }
  return done(m, 'hysteresis-hold', meDes)
}

/**
 * The hour's drop [kg/kg db] of a product whose temperature follows its surface balance: it evaporates a share
 * f of the wet-surface rate `cap` and sits at T = T_dry − f·(T_dry − T_wet) (exact for the linearised balance,
 * physics/wet-surface.ts; the engine's batch loop, drying/batch.ts, calls it too); its falling-rate drop at that temperature is taken linear between `dropDry` (at
 * T_dry, f = 0) and `dropWet` (at T_wet, f = 1), and f·cap must equal it:
 * f = dropDry / (dropDry − dropWet + cap), or f = 1 (the constant-rate period: the drop is the cap) when the
 * product evaporates the full wet-surface rate even at T_wet.
 */
export function surfaceBalancedDrop(dropDry: number, dropWet: number, cap: number): number {
  if (!(cap > 0)) return 0
  if (dropWet >= cap) return cap
  return (cap * dropDry) / (dropDry - dropWet + cap)
}
