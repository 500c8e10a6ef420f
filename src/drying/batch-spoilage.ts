/**
 * @module drying/batch-spoilage
 * The product family's spoilage model stepped along one batch (docs/model.md §7). Every hour of the batch,
 * paused and covered hours included, the model is stepped with the hour's product temperature, the moisture
 * at the start of the hour and the water activity of the isotherm at that temperature and moisture
 * (drying/water-activity-table.ts), until the target is reached or the batch ends. Hours with missing weather
 * keep the last product temperature (the clock runs; before the first known hour nothing is stepped). One
 * track per batch, fed through fields; nothing is allocated per hour.
 */
import {
  type SpoilageHourStepper,
  type SpoilageModel,
  spoilageHourStepper,
} from '../product/spoilage/model.ts'
import type { WaterActivityTable } from './water-activity-table.ts'

/** What a batch needs to step a spoilage model along its hours. */
export interface BatchSpoilageSetup {
  model: SpoilageModel
  /** The product's water activity by temperature and moisture (one table per product, shared by batches). */
  waterActivity: WaterActivityTable
}

/** The spoilage model's state when the batch reached its target (or at its end). */
export interface BatchSpoilageResult {
  /** The model's measure (its `measureUnit`); every model's measure only grows, so this is its highest value. */
  measure: number
  /** The measure as a share of the model's limit (1 = spoiled). */
  limitUsedFraction: number
  /** The limit was reached at or before the hour the batch reached its target (or, not reached, by its end). */
  spoiledBeforeDry: boolean
  hoursAtRisk: number
  hoursOutsideRange: number
  /** Hours stepped (hours of the batch with a known product temperature). */
  hours: number
}

/** Product temperatures passed to a spoilage model are held within the models' accepted input range [°C]. */
const SPOILAGE_T_MIN_C = -40
const SPOILAGE_T_MAX_C = 120

/** One batch's spoilage: set `productC` and `moistureDb`, then `stepHour()`, once per hour of the batch. */
export class BatchSpoilageTrack {
  /** The hour's product temperature [°C]; NaN when the hour's weather is missing. */
  productC = Number.NaN
  /** Moisture at the start of the hour [kg/kg db]. */
  moistureDb = Number.NaN
  private lastProductC = Number.NaN
  private readonly stepper: SpoilageHourStepper
  private readonly awTable: WaterActivityTable

  constructor(private readonly setup: BatchSpoilageSetup) {
    this.stepper = spoilageHourStepper(setup.model)
    this.awTable = setup.waterActivity
  }

  stepHour(): void {
    // the hour's product temperature (held through missing hours), the moisture at its start
    const tRead = this.productC
    if (!Number.isNaN(tRead))
      this.lastProductC = Math.min(Math.max(tRead, SPOILAGE_T_MIN_C), SPOILAGE_T_MAX_C)
    const t = this.lastProductC
    if (Number.isNaN(t)) return
    // inputs through fields: no number crosses these calls
    const aw = this.awTable
    aw.tC = t
    aw.moistureDb = this.moistureDb
    aw.lookup()
    const acc = this.stepper
    acc.productTempC = t
    acc.moistureWbPct = (100 * this.moistureDb) / (1 + this.moistureDb)
    acc.waterActivity = aw.aw
    acc.stepHour()
  }

  result(): BatchSpoilageResult {
    const state = this.stepper.state()
    const limit = this.setup.model.spoiledAt
    return {
      measure: state.measure,
      limitUsedFraction: state.measure / limit,
      spoiledBeforeDry: state.measure >= limit,
      hoursAtRisk: state.hoursAtRisk,
      hoursOutsideRange: state.hoursOutsideRange,
      hours: state.hours,
    }
  }
}
