/**
 * @module product/stepping
 * The product through changing hours: one step of the falling-rate period under the hour's air, with
 * - Page (and Thompson) stepped by equivalent time: the time the product would have needed under this
 *   hour's conditions to reach its present moisture ratio, plus the step (e.g. Brooker, Bakker-Arkema &
 *   Hall 1992, ch. 9; from memory); for first-order models this reduces to MR·exp(−k·Δt), and
 *   Henderson–Pabis (MR = a·exp(−k·t)) steps exactly like Lewis with its k: `a` only shifts the time origin;
 * - a constant-rate cap: the loss in a step cannot exceed the wet-surface evaporation the caller computed
 *   (Penman, or humidity-ratio deficit × air flow), per kg of dry matter on the tray;
 * - rewetting when the adsorption EMC is above the moisture, first order at `rewettingRateFactor` × the
 *   drying rate; no change inside the hysteresis band between adsorption and desorption EMC.
 * Air above 99.5 % RH (fog, saturation) is treated as 99.5 % with `saturatedAir` set, because no
 * equilibrium moisture exists at 100 %; air below 0.5 % RH as 0.5 %.
 */

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
    const mr = m0 > meDes ? (m - meDes) / (m0 - meDes) : 1
    let mrNext: number
    const p = rateParametersAt(profile, tC, rh, airVelocityMs, thicknessMm)
    if (p) {
      const tEq = mr >= 1 ? 0 : (-Math.log(mr) / p.kPerHn) ** (1 / p.n)
      mrNext = Math.exp(-p.kPerHn * (tEq + dtH) ** p.n)
    } else {
      const s = timeScaleFactor(profile, thicknessMm, airVelocityMs)
      const tEq = mr >= 1 ? 0 : thompsonTimeH(tC, mr)
      mrNext = thompsonMoistureRatio(tC, tEq + dtH / s)
    }
    const next = meDes + mrNext * (m0 - meDes)
    const cap = conditions.maxEvaporationKgPerM2H
    if (cap !== undefined) {
      if (!(cap >= 0)) throw new RangeError(`maximum evaporation must be ≥ 0 kg/(m²·h), got ${cap}`)
      const maxLoss = (cap * dtH) / product.dryMatterKgPerM2
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
