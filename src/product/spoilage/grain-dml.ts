/**
 * @module product/spoilage/grain-dml
 * Dry-matter loss (DML) of shelled corn during drying and storage, in the form used by natural-air and
 * low-temperature drying simulations: a reference DML curve in "equivalent hours" at 15.6 °C, 25 % wb and 30 %
 * mechanical damage, and multipliers that stretch or shrink time at other temperatures, moistures and damage.
 * Under varying conditions the equivalent hours add up step by step: θ += Δt / (M_T · M_M · M_D).
 *
 * Sources:
 * - Multipliers: Steele, J.L. (1967), *Deterioration of damaged shelled corn as measured by carbon dioxide
 *   production*, PhD dissertation, Iowa State University, Appendix D; the temperature multiplier's warm-and-wet
 *   correction as used by Thompson, T.L. (1972), "Temporary storage of high-moisture shelled corn using
 *   continuous aeration", *Trans. ASAE* 15(2):333–337. Constants as transcribed, with their Fahrenheit origin,
 *   in public research code that states it checked them against Steele's dissertation
 *   (confidence `transcribed`: Steele's and Thompson's texts were not read for them).
 * - Reference curve: DML(θ) = 0.0883·[exp(0.006·θ) − 1] + 0.00102·θ [%], θ in hours (Thompson 1972, as rendered
 *   in the review literature and in the same code; Thompson's paper itself not read). Corroboration: it reaches
 *   0.5 % at θ = 230.9 h, and Steele (1967, p. 108) independently gives 230 h as the reference time for 0.5 %
 *   DML.
 * - Threshold 0.5 % DML: the loss at which the allowable-storage-time tables for shelled corn are drawn (e.g.
 *   the aerated shelled corn table of extension and equipment literature; Bern, Steele & Morey 2002, *Appl. Eng.
 *   Agric.* 18(6), "Shelled corn CO2 evolution and storage time for 0.5 % dry matter loss").
 *   Ng et al. 1998 (*Trans. ASAE* 41:1095) argue about 0.35 % for combine-shelled corn: pass `spoiledAtPct`.
 *
 * Validity (Steele 1967, as transcribed): moisture 13–35 % wb, temperature 1.7–48.9 °C (35–120 °F), damage
 * 2–40 %. Outside, inputs are clamped to the range (and the hours counted as outside): below 13 % wb and below
 * 1.7 °C the clamp overstates the loss (safe side); above 35 % wb and above 48.9 °C it understates it.
 * The model is for shelled corn; applied to other grains it is an approximation (said so in `cautions`).
 */
import { moistureDbFromWbPct } from '../moisture-basis.ts'
import {
  checkHourStepper,
  checkStepInput,
  type SpoilageHourStepper,
  type SpoilageModel,
  type SpoilageState,
  type SpoilageStepInput,
} from './model.ts'

/** Reference-curve coefficients (Thompson 1972 form): DML = A·(exp(B·θ) − 1) + C·θ, DML in %, θ in h. */
export const DML_CURVE = { a: 0.0883, b: 0.006, c: 0.00102 } as const
/** Mechanical damage at the reference conditions [%] (Steele 1967: multipliers are 1 at 30 % damage). */
export const REFERENCE_DAMAGE_PCT = 30
/** The usual allowable-storage-time threshold [% DML]. */
export const DML_LIMIT_PCT = 0.5

export const DML_VALID_MOISTURE_WB_PCT: readonly [number, number] = [13, 35]
export const DML_VALID_TEMP_C: readonly [number, number] = [1.7, 48.9]
export const DML_VALID_DAMAGE_PCT: readonly [number, number] = [2, 40]

/**
 * Moisture multiplier M_M (Steele 1967, App. D): 0.103·[exp(455/M^1.53) − 0.00845·M + 1.558], M in % dry basis.
 * About 1 at 25 % wb (33.3 % db).
 */
export function moistureMultiplier(moistureWbPct: number): number {
  const mDbPct = 100 * moistureDbFromWbPct(moistureWbPct)
  return 0.103 * (Math.exp(455 * Math.exp(-1.53 * Math.log(mDbPct))) - 0.00845 * mDbPct + 1.558)
}

/**
 * Temperature multiplier M_T (Steele 1967, App. D, stated in °F as 32.3·exp(−3.48·T_F/60), here in °C:
 * 32.3·exp(−0.1044·T − 1.856)); above 15.6 °C (60 °F) and 19 % wb, Thompson's (1972) correction
 * + min(0.01·(M − 19), 0.09)·exp(0.61·(T_F − 60)/60) is added (the coefficient stops at 0.09 from 28 % wb).
 */
export function temperatureMultiplier(tempC: number, moistureWbPct: number): number {
  const tF = 1.8 * tempC + 32
  const base = 32.3 * Math.exp((-3.48 * tF) / 60)
  if (tempC <= 15.6 || moistureWbPct <= 19) return base
  const coefficient = Math.min(0.01 * (moistureWbPct - 19), 0.09)
  return base + coefficient * Math.exp((0.61 * (tF - 60)) / 60)
}

/** Damage multiplier M_D for the 0.5 % DML level (Steele 1967, App. D): 2.08·exp(−0.0239·D), D in %. */
export function damageMultiplier(damagePct: number): number {
  return 2.08 * Math.exp(-0.0239 * damagePct)
}

/** DML [%] after θ equivalent hours at the reference conditions. */
export function dmlFromEquivalentHours(thetaH: number): number {
  return DML_CURVE.a * (Math.exp(DML_CURVE.b * thetaH) - 1) + DML_CURVE.c * thetaH
}

/** Equivalent hours θ at which the reference curve reaches `dmlPct` (inverse of the curve, by Newton). */
export function equivalentHoursForDml(dmlPct: number): number {
  if (!(dmlPct >= 0 && Number.isFinite(dmlPct))) throw new RangeError(`dmlPct must be ≥ 0, got ${dmlPct}`)
  let theta = dmlPct / (DML_CURVE.a * DML_CURVE.b + DML_CURVE.c)
  for (let i = 0; i < 60; i++) {
    const f = dmlFromEquivalentHours(theta) - dmlPct
    const df = DML_CURVE.a * DML_CURVE.b * Math.exp(DML_CURVE.b * theta) + DML_CURVE.c
    const next = theta - f / df
    if (Math.abs(next - theta) < 1e-9) return next
    theta = next
  }
  return theta
}

function clamp(x: number, range: readonly [number, number]): number {
  return Math.min(Math.max(x, range[0]), range[1])
}

/** Product of the three multipliers at clamped conditions; whether any input was clamped. */
export function timeMultiplier(
  tempC: number,
  moistureWbPct: number,
  damagePct: number,
): { multiplier: number; clamped: boolean } {
  const t = clamp(tempC, DML_VALID_TEMP_C)
  const m = clamp(moistureWbPct, DML_VALID_MOISTURE_WB_PCT)
  const d = clamp(damagePct, DML_VALID_DAMAGE_PCT)
  return {
    multiplier: temperatureMultiplier(t, m) * moistureMultiplier(m) * damageMultiplier(d),
    clamped: t !== tempC || m !== moistureWbPct || d !== damagePct,
  }
}

/**
 * Allowable storage time [h] at constant conditions: hours until DML reaches `limitPct` (default 0.5 %).
 * This is what the allowable-storage-time tables tabulate (in days).
 */
export function allowableStorageHours(
  tempC: number,
  moistureWbPct: number,
  damagePct = REFERENCE_DAMAGE_PCT,
  limitPct = DML_LIMIT_PCT,
): number {
  return equivalentHoursForDml(limitPct) * timeMultiplier(tempC, moistureWbPct, damagePct).multiplier
}

export interface GrainDmlOptions {
  /** Mechanical damage [%] (broken kernels and fines); 30 % is the reference (combine-shelled corn). */
  damagePct?: number
  /** The DML that counts as spoiled [%]; default 0.5. */
  spoiledAtPct?: number
  /** Water activity at or above which an hour counts as at risk; default 0.65 (storage-mould limit). */
  atRiskWaterActivity?: number
}

/**
 * The grain DML model. Its state's `measure` is the DML [%]; the equivalent hours θ are recovered from it by
 * inverting the reference curve, so the state stays a plain `SpoilageState`.
 */
export function grainDryMatterLossModel(options: GrainDmlOptions = {}): SpoilageModel {
  const damagePct = options.damagePct ?? REFERENCE_DAMAGE_PCT
  const spoiledAt = options.spoiledAtPct ?? DML_LIMIT_PCT
  const atRiskAw = options.atRiskWaterActivity ?? 0.65
  if (!(damagePct >= 0 && damagePct <= 100)) {
    throw new RangeError(`damagePct must be between 0 and 100 %, got ${damagePct}`)
  }
  if (!(spoiledAt > 0 && spoiledAt <= 5))
    throw new RangeError(`spoiledAtPct must be in (0, 5] %, got ${spoiledAt}`)
  return {
    id: 'grain-dry-matter-loss',
    name: 'Dry-matter loss of grain (Steele 1967 / Thompson 1972)',
    appliesTo: ['grain', 'oilseed'],
    source: {
      citation:
        'Steele, J.L. 1967, Deterioration of damaged shelled corn as measured by carbon dioxide production, PhD dissertation, Iowa State University (multipliers, App. D; reference time 230 h for 0.5 % DML, p. 108); Thompson, T.L. 1972, Temporary storage of high-moisture shelled corn using continuous aeration, Trans. ASAE 15(2):333–337 (DML curve and warm-wet temperature correction; constants as transcribed in public research code that cites both)',
      equation:
        'DML = 0.0883·[exp(0.006·θ) − 1] + 0.00102·θ; θ = Σ Δt/(M_T·M_M·M_D); M_M = 0.103·[exp(455/M_db^1.53) − 0.00845·M_db + 1.558]; M_T = 32.3·exp(−3.48·T_F/60) [+ min(0.01(M_wb − 19), 0.09)·exp(0.61(T_F − 60)/60) above 60 °F and 19 % wb]; M_D = 2.08·exp(−0.0239·D)',
      confidence: 'transcribed',
      short: 'Steele 1967; Thompson 1972',
    },
    measureName: 'dry-matter loss',
    measureUnit: '%',
    spoiledAt,
    spoiledAtSource:
      spoiledAt === DML_LIMIT_PCT
        ? '0.5 % DML, the level of the allowable-storage-time tables for shelled corn (Bern, Steele & Morey 2002)'
        : 'set by the user',
    atRiskWhen: `grain water activity ≥ ${atRiskAw} (interstitial air humid enough for storage moulds)`,
    validity: 'shelled corn, 13–35 % wb, 1.7–48.9 °C, 2–40 % damage (Steele 1967)',
    cautions: [
      'The DML model was measured on shelled corn; for other grains it is an approximation.',
      'Allowable storage time is used up by warm, wet hours and is not restored by drying: grain that came close to the limit keeps poorly.',
      'Where the top layer came near the limit, have the grain tested for mycotoxins before feed or food use.',
    ],
    step(state: SpoilageState, input: SpoilageStepInput): SpoilageState {
      checkStepInput(input)
      const { multiplier, clamped } = timeMultiplier(input.productTempC, input.moistureWbPct, damagePct)
      const theta = equivalentHoursForDml(state.measure) + input.hours / multiplier
      return {
        measure: dmlFromEquivalentHours(theta),
        hoursAtRisk: state.hoursAtRisk + (input.waterActivity >= atRiskAw ? input.hours : 0),
        hoursOutsideRange: state.hoursOutsideRange + (clamped ? input.hours : 0),
        hours: state.hours + input.hours,
      }
    },
    hourStepper: () => new GrainDmlHours(damagePct, atRiskAw),
  }
}

/** The DML model fed hour by hour through fields: θ kept as such (no inversion of the DML curve per hour), same arithmetic as `step` otherwise. */
class GrainDmlHours implements SpoilageHourStepper {
  productTempC = Number.NaN
  moistureWbPct = Number.NaN
  waterActivity = Number.NaN
  theta = 0
  hoursAtRisk = 0
  hoursOutsideRange = 0
  hours = 0
  readonly damage: number
  readonly damageClamped: boolean
  constructor(
    damagePct: number,
    readonly atRiskAw: number,
  ) {
    const d = clamp(damagePct, DML_VALID_DAMAGE_PCT)
    this.damage = damageMultiplier(d)
    this.damageClamped = d !== damagePct
  }
  stepHour(): void {
    checkHourStepper(this)
    const t = clamp(this.productTempC, DML_VALID_TEMP_C)
    const m = clamp(this.moistureWbPct, DML_VALID_MOISTURE_WB_PCT)
    this.theta += 1 / (temperatureMultiplier(t, m) * moistureMultiplier(m) * this.damage)
    if (this.waterActivity >= this.atRiskAw) this.hoursAtRisk += 1
    if (this.damageClamped || t !== this.productTempC || m !== this.moistureWbPct) this.hoursOutsideRange += 1
    this.hours += 1
  }
  get measure(): number {
    return dmlFromEquivalentHours(this.theta)
  }
  state(): SpoilageState {
    return {
      measure: this.measure,
      hoursAtRisk: this.hoursAtRisk,
      hoursOutsideRange: this.hoursOutsideRange,
      hours: this.hours,
    }
  }
}
