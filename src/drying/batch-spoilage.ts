/**
 * @module drying/batch-spoilage
 * The product family's spoilage model stepped along one batch (docs/model.md §7). Every hour of the batch,
 * paused and covered hours included, the model is stepped with the hour's product temperature, the moisture
 * at the start of the hour and the water activity of the isotherm at that temperature and moisture
 * (drying/water-activity-table.ts), until the target is reached or the batch ends; a model of mould
 * (`waterActivityOf: 'surface'`) gets the water activity at the product's surface instead
 * (product/spoilage/surface-water-activity.ts: from the air's vapour pressure at the product temperature, the
 * share of the free-water rate the product evaporated, rain, and whether the product met the air). Hours with
 * missing weather keep the last product temperature (the clock runs; before the first known hour nothing is
 * stepped). One track per batch, fed through fields; nothing is allocated per hour.
 */
import { liquidSaturationValueFromTableKpa } from '../physics/saturation-table.ts'
import {
  type SpoilageHourStepper,
  type SpoilageModel,
  spoilageHourStepper,
} from '../product/spoilage/model.ts'
import { SurfaceExchange, surfaceWaterActivity } from '../product/spoilage/surface-water-activity.ts'
import { HourMode } from './methods/method-model.ts'
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

/** One batch's spoilage: `stepBatchHour` once per hour of the batch (or set the fields and call `stepHour()`). */
export class BatchSpoilageTrack {
  /** The hour's product temperature [°C]; NaN when the hour's weather is missing. */
  productC = Number.NaN
  /** Moisture at the start of the hour [kg/kg db]. */
  moistureDb = Number.NaN
  /** How the product met the air in the hour ({@link SurfaceExchange}); read by surface models only. */
  exchange: number = SurfaceExchange.none
  /** Vapour pressure of the air at the product [kPa] (with `exchange` air). */
  airVaporPressureKpa = Number.NaN
  /** Share of the hour's free-water (constant-rate) limit the product evaporated, 0–1. */
  wetShare = 0
  /** The water activity the model was fed in the last hour stepped. */
  lastWaterActivity = Number.NaN
  private lastProductC = Number.NaN
  private readonly stepper: SpoilageHourStepper
  private readonly awTable: WaterActivityTable
  private readonly surface: boolean

  /** The water activity fed to the model in each hour of the batch, when a trace was asked for (NaN: not stepped). */
  readonly waterActivityTrace: Float64Array | undefined

  /** `traceHours` > 0: keep {@link waterActivityTrace} for that many hours. */
  constructor(
    private readonly setup: BatchSpoilageSetup,
    traceHours = 0,
  ) {
    this.waterActivityTrace = traceHours > 0 ? new Float64Array(traceHours).fill(Number.NaN) : undefined
    this.stepper = spoilageHourStepper(setup.model)
    this.awTable = setup.waterActivity
    this.surface = setup.model.waterActivityOf === 'surface'
  }

  /**
   * Hour `h` of a batch (drying/batch.ts) in {@link HourMode} `mode`, with the hour's inputs already set in
   * {@link productC} (NaN when missing), {@link moistureDb} (at the hour's start), {@link airVaporPressureKpa} and
   * {@link wetShare} (the share of the hour's free-water limit the product evaporated). The numbers go through
   * fields, not arguments: a double passed to a call that is not inlined is boxed, one heap number per hour.
   */
  stepBatchHour(h: number, mode: number): void {
    this.exchange =
      mode === HourMode.rainExposed
        ? SurfaceExchange.wetted
        : mode === HourMode.paused || mode === HourMode.missing
          ? SurfaceExchange.none
          : SurfaceExchange.air
    this.stepHour()
    if (this.waterActivityTrace !== undefined) this.waterActivityTrace[h] = this.lastWaterActivity
  }

  stepHour(): void {
    // the hour's product temperature (held through missing hours), the moisture at its start
    const tRead = this.productC
    if (!Number.isNaN(tRead))
      this.lastProductC = Math.min(Math.max(tRead, SPOILAGE_T_MIN_C), SPOILAGE_T_MAX_C)
    if (Number.isNaN(this.lastProductC)) return
    // inputs and outputs through fields: no number crosses these calls
    if (this.surface && this.exchange !== SurfaceExchange.none) this.surfaceWaterActivityOfHour()
    else this.pieceWaterActivityOfHour()
    const acc = this.stepper
    acc.productTempC = this.lastProductC
    acc.moistureWbPct = (100 * this.moistureDb) / (1 + this.moistureDb)
    acc.waterActivity = this.lastWaterActivity
    acc.stepHour()
  }

  /** The piece's water activity into {@link lastWaterActivity}: the isotherm at the hour's temperature and the moisture at its start. */
  private pieceWaterActivityOfHour(): void {
    const aw = this.awTable
    aw.tC = this.lastProductC
    aw.moistureDb = this.moistureDb
    aw.lookup()
    this.lastWaterActivity = aw.aw
  }

  /**
   * The surface's water activity into {@link lastWaterActivity} in an hour the product met the air or rain
   * ({@link surfaceWaterActivity}), the surface RH at the batch's own product temperature. The piece's water
   * activity is looked up only where the rule reads it (an hour it dried, or no air vapour pressure), which
   * gives the same value as looking it up every hour.
   */
  private surfaceWaterActivityOfHour(): void {
    if (this.exchange === SurfaceExchange.wetted) {
      this.lastWaterActivity = 1
      return
    }
    const ea = this.airVaporPressureKpa
    const rh = ea >= 0 ? ea / liquidSaturationValueFromTableKpa(this.lastProductC) : Number.NaN
    if (!(rh >= 0) || this.wetShare > 0) this.pieceWaterActivityOfHour()
    else this.lastWaterActivity = Number.NaN
    this.lastWaterActivity = surfaceWaterActivity(this.exchange, this.lastWaterActivity, rh, this.wetShare)
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
