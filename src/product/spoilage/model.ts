/**
 * @module product/spoilage/model
 * The shape every spoilage-during-drying model shares. A model steps hour by hour along a batch, given the
 * product's temperature, its moisture and its water activity (from the product's isotherm, computed by the
 * caller), and accumulates one risk measure (dry-matter loss, hours in a window, fraction of mould-free time).
 * The batch has spoiled once that measure reaches the model's threshold.
 *
 * Models are pure: `step` returns a new state and never mutates its argument, so a caller can branch a state
 * (for example to try another airflow) without copying.
 */

import type { Confidence } from '../profile.ts'

/**
 * How the model's numbers were obtained, in the catalogue's levels (`src/product/profile.ts`):
 * - `published`: read in the cited original;
 * - `transcribed`: read in a secondary text (or public code) that quotes or transcribes the original; the
 *   citation names both ("as quoted in …", "as transcribed in …"); the original was not read;
 * - `fitted`: derived by dryhours from named published data;
 * - `memory`: recalled or assumed, not verified in a document. A rule of thumb of the trade is `memory` and its
 *   citation says "common practice, no source".
 */
export type SpoilageConfidence = Exclude<Confidence, 'user'>

export interface SpoilageSource {
  /** Authors, year, title, journal or standard. */
  citation: string
  /** The equation, table or clause used, with its number where the source numbers it. */
  equation: string
  confidence: SpoilageConfidence
  /** Authors and years only, e.g. "Steele 1967; Thompson 1972", for tables that name the source on every row. */
  short?: string
}

/** Conditions of the product during one step. */
export interface SpoilageStepInput {
  /** Product temperature [°C] (not the air's, where they differ). */
  productTempC: number
  /** Product moisture [% wet basis]. */
  moistureWbPct: number
  /**
   * Water activity (0–1): the product's, from its isotherm at its moisture and temperature, or for models fed
   * the surface's (`SpoilageModel.waterActivityOf`) the water activity at its surface.
   */
  waterActivity: number
  /** Length of the step [h] (> 0). */
  hours: number
}

export interface SpoilageState {
  /** The accumulated risk measure, in `SpoilageModel.measureUnit`. */
  measure: number
  /** Hours the product spent in conditions the model counts as at risk (see `SpoilageModel.atRiskWhen`). */
  hoursAtRisk: number
  /** Hours whose conditions lay outside the range the model's source covers (the model then clamps). */
  hoursOutsideRange: number
  /** Hours stepped in all. */
  hours: number
}

export interface SpoilageModel {
  /** kebab-case id, e.g. `grain-dry-matter-loss`. */
  id: string
  name: string
  /** The product families (profile categories or ids) it is meant for. */
  appliesTo: string[]
  source: SpoilageSource
  /** What `measure` is, in words, e.g. "dry-matter loss". */
  measureName: string
  measureUnit: string
  /** The measure at which the batch counts as spoiled. */
  spoiledAt: number
  /** Where the threshold comes from. */
  spoiledAtSource: string
  /** Plain words: which hours count as "at risk". */
  atRiskWhen: string
  /** The conditions the source covers; outside them the model clamps (and counts `hoursOutsideRange`). */
  validity: string
  /** Cautions the report must show with this model's result. */
  cautions: string[]
  /**
   * Which water activity the model is fed along a batch: 'piece' (default), the product's isotherm at its mean
   * moisture; 'surface', the water activity at the product's surface (mould grows there;
   * product/spoilage/surface-water-activity.ts).
   */
  waterActivityOf?: 'piece' | 'surface'
  step(state: SpoilageState, input: SpoilageStepInput): SpoilageState
  /**
   * Optional form for the long hour loops (every hour of every batch of an assessment, the top layer of every
   * bin run): the inputs are set as fields and `stepHour()` adds one hour, so no number crosses a call V8 may
   * not inline (it would box each one) and no state object is made per hour. Same arithmetic as `step`.
   * {@link spoilageHourStepper} falls back to `step` when a model has none.
   */
  hourStepper?(): SpoilageHourStepper
}

/**
 * A running state of one model fed one hour at a time through fields: set `productTempC` [°C], `moistureWbPct`
 * [% wb] and `waterActivity`, call `stepHour()`. The inputs are checked as in {@link checkStepInput}.
 */
export interface SpoilageHourStepper {
  productTempC: number
  moistureWbPct: number
  waterActivity: number
  /** Adds one hour at the inputs set. */
  stepHour(): void
  /** The accumulated measure so far (as `SpoilageState.measure`). */
  readonly measure: number
  /** A snapshot of the state so far. */
  state(): SpoilageState
}

/** The hour stepper of `model`: its own, or `step` behind fields. */
export function spoilageHourStepper(model: SpoilageModel): SpoilageHourStepper {
  if (model.hourStepper) return model.hourStepper()
  let current = initialSpoilageState()
  const stepper: SpoilageHourStepper = {
    productTempC: Number.NaN,
    moistureWbPct: Number.NaN,
    waterActivity: Number.NaN,
    stepHour() {
      current = model.step(current, {
        productTempC: stepper.productTempC,
        moistureWbPct: stepper.moistureWbPct,
        waterActivity: stepper.waterActivity,
        hours: 1,
      })
    },
    get measure() {
      return current.measure
    },
    state: () => ({ ...current }),
  }
  return stepper
}

/** {@link checkStepInput} for one hour of a stepper (the object crosses the call, not its numbers). */
export function checkHourStepper(s: SpoilageHourStepper): void {
  if (!(s.productTempC >= -40 && s.productTempC <= 120)) {
    throw new RangeError(`spoilage step: productTempC must be between -40 and 120 °C, got ${s.productTempC}`)
  }
  if (!(s.moistureWbPct >= 0 && s.moistureWbPct < 100)) {
    throw new RangeError(
      `spoilage step: moistureWbPct must be in [0, 100) % wet basis, got ${s.moistureWbPct}`,
    )
  }
  if (!(s.waterActivity >= 0 && s.waterActivity <= 1)) {
    throw new RangeError(`spoilage step: waterActivity must be between 0 and 1, got ${s.waterActivity}`)
  }
}

export function initialSpoilageState(): SpoilageState {
  return { measure: 0, hoursAtRisk: 0, hoursOutsideRange: 0, hours: 0 }
}

/** True once the state's measure has reached the model's threshold. */
export function isSpoiled(model: SpoilageModel, state: SpoilageState): boolean {
  return state.measure >= model.spoiledAt
}

/** The measure as a fraction of the threshold (1 = spoiled). */
export function riskFraction(model: SpoilageModel, state: SpoilageState): number {
  return state.measure / model.spoiledAt
}

/** Checks one step's input; throws a RangeError naming the field. */
export function checkStepInput(input: SpoilageStepInput): void {
  checkStepValues(input.productTempC, input.moistureWbPct, input.waterActivity, input.hours)
}

/** {@link checkStepInput} on the four values. */
export function checkStepValues(
  productTempC: number,
  moistureWbPct: number,
  waterActivity: number,
  hours: number,
): void {
  if (!(hours > 0 && Number.isFinite(hours))) {
    throw new RangeError(`spoilage step: hours must be a finite number > 0, got ${hours}`)
  }
  if (!(productTempC >= -40 && productTempC <= 120)) {
    throw new RangeError(`spoilage step: productTempC must be between -40 and 120 °C, got ${productTempC}`)
  }
  if (!(moistureWbPct >= 0 && moistureWbPct < 100)) {
    throw new RangeError(`spoilage step: moistureWbPct must be in [0, 100) % wet basis, got ${moistureWbPct}`)
  }
  if (!(waterActivity >= 0 && waterActivity <= 1)) {
    throw new RangeError(`spoilage step: waterActivity must be between 0 and 1, got ${waterActivity}`)
  }
}

/**
 * Runs a model over a series of equal steps and reports the first hour at which it spoiled (or null).
 * A convenience for tests and for callers that have whole columns.
 */
export function runSpoilage(
  model: SpoilageModel,
  inputs: Iterable<SpoilageStepInput>,
): { state: SpoilageState; spoiledAfterHours: number | null } {
  let state = initialSpoilageState()
  let spoiledAfterHours: number | null = null
  for (const input of inputs) {
    state = model.step(state, input)
    if (spoiledAfterHours === null && isSpoiled(model, state)) spoiledAfterHours = state.hours
  }
  return { state, spoiledAfterHours }
}
