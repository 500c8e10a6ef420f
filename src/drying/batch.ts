/**
 * @module drying/batch
 * One batch, hour by hour, over precomputed {@link HourlyConditions} (docs/model.md §7):
 * - drying (M above the desorption equilibrium): thin-layer step by equivalent time
 *   (drying/product-response.ts), never removing more than the hour's constant-rate limit (wet-surface
 *   evaporation for exposed products, humidity-ratio deficit × air mass for forced air);
 * - rewetting (M below the adsorption equilibrium): M → Me_ads − (Me_ads − M)·exp(−f·k·1 h), f the profile's
 *   rewetting rate factor (Lewis form; stated simplification);
 * - rain on an exposed product: rewetting toward the equilibrium at 99.5 % RH, counted as rain exposure;
 *   that water comes from rain, not from the air;
 * - paused (covered, fans off) and missing hours: no change.
 * An optional backup (heated forced air) replaces the primary method in every hour the primary would not
 * dry: the supplemental-heat strategy of docs/model.md §8.
 *
 * Spoilage (optional, `options.spoilage`): every hour of the batch, paused and covered hours included, the
 * product family's spoilage model (product/spoilage/) is stepped with the hour's product temperature, the
 * moisture at the start of the hour and the water activity of the isotherm at that temperature and moisture
 * (drying/water-activity-table.ts), until the target is reached or the batch ends. Hours with missing
 * weather keep the last product temperature (the clock runs; before the first known hour nothing is
 * stepped). One hour stepper per batch, fed through fields; nothing is allocated per hour.
 */
import { type SpoilageModel, spoilageHourStepper } from '../product/spoilage/model.ts'
import type { HourlyConditions } from './hourly-conditions.ts'
import { HourMode } from './methods/method-model.ts'
import {
  EMC_RH_CAP_PCT,
  firstOrderRateConstant,
  type ProductResponse,
  stepMoistureRatio,
} from './product-response.ts'
import { HourStatus } from './usable-hour.ts'
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

export interface BatchOptions {
  /** Index of the first hour. */
  startIndex: number
  /** Hours simulated at most (the maximum duration). */
  maxHours: number
  initialDb: number
  targetDb: number
  /** When the series is a typical year, wrap past its end to its start. */
  wrap?: boolean
  /** Record the moisture after every hour (tests, single-batch reports). */
  recordTrace?: boolean
  /** Step this spoilage model along the batch (the primary method's hours only; see the module comment). */
  spoilage?: BatchSpoilageSetup
}

export interface BatchResult {
  reached: boolean
  /** Hours from start until the target was reached (elapsed, paused hours included); NaN when not reached. */
  hoursToTarget: number
  /** Hours simulated (to target, or all when not reached, or until the series ended). */
  hoursSimulated: number
  /** True when the series ended before the target or the maximum duration. */
  ranOutOfData: boolean
  finalDb: number
  rewettingHours: number
  rainExposureHours: number
  missingHours: number
  /** Hours in which the backup (heated) air was used. */
  backupHours: number
  /** Heat from the heater into the air [kWh per tonne fresh]. */
  heaterKwhPerTonne: number
  /** Heat from the solar collector into the air [kWh per tonne fresh]. */
  solarKwhPerTonne: number
  /** Water the air carried off [kg per kg dry matter] (positive) net of water the air gave back as rewetting. */
  waterToAirDb: number
  /** Water taken up from rain [kg per kg dry matter]. */
  waterFromRainDb: number
  /** Moisture [kg/kg db] after each hour, when recordTrace. */
  trace?: Float64Array
  /** Which conditions drove each hour (0 primary, 1 backup), when recordTrace. */
  usedBackup?: Uint8Array
  /** The spoilage model's outcome, when `options.spoilage` was given. */
  spoilage?: BatchSpoilageResult
}

function checkBatchOptions(options: BatchOptions, hours: number): void {
  if (!(options.startIndex >= 0 && options.startIndex < hours)) {
    throw new RangeError(`batch start index must be between 0 and ${hours - 1}, got ${options.startIndex}`)
  }
  if (!(options.initialDb > options.targetDb)) {
    throw new RangeError(
      `initial moisture ${options.initialDb} kg/kg db must be above the target ${options.targetDb} kg/kg db`,
    )
  }
}

/**
 * Simulate one batch. `primary` is the method's own hourly conditions; `backup`, when given, is used in
 * every hour whose primary status is not usable (and not missing).
 */
export function simulateBatch(
  primary: HourlyConditions,
  product: ProductResponse,
  options: BatchOptions,
  backup?: HourlyConditions,
): BatchResult {
  const { startIndex, maxHours, initialDb, targetDb } = options
  const n = primary.hours
  checkBatchOptions(options, n)
  const wrap = options.wrap === true
  primary.ensure(startIndex, maxHours, wrap)
  backup?.ensure(startIndex, maxHours, wrap)
  const trace = options.recordTrace ? new Float64Array(maxHours).fill(Number.NaN) : undefined
  const usedBackup = options.recordTrace ? new Uint8Array(maxHours) : undefined
  const ts = product.thompsonTimeScale
  const spoilage = options.spoilage
  const acc = spoilage === undefined ? undefined : spoilageHourStepper(spoilage.model)
  const awTable = spoilage?.waterActivity
  let lastProductC = Number.NaN
  let m = initialDb
  let rewettingHours = 0
  let rainExposureHours = 0
  let missingHours = 0
  let backupHours = 0
  let heater = 0
  let solar = 0
  let toAir = 0
  let fromRain = 0
  let hoursToTarget = Number.NaN
  let simulated = 0
  let ranOut = false
  for (let h = 0; h < maxHours; h++) {
    let i = startIndex + h
    if (i >= n) {
      if (!wrap) {
        ranOut = true
        break
      }
      i %= n
    }
    simulated++
    let c = primary
    if (
      backup !== undefined &&
      primary.status[i] !== HourStatus.usable &&
      primary.mode[i] !== HourMode.missing
    ) {
      c = backup
      backupHours++
      if (usedBackup) usedBackup[h] = 1
    }
    if (acc !== undefined && awTable !== undefined) {
      // the hour's product temperature (held through missing hours), the moisture at its start
      const tRead = c.productC[i]
      if (!Number.isNaN(tRead))
        lastProductC = tRead < SPOILAGE_T_MIN_C ? SPOILAGE_T_MIN_C : Math.min(tRead, SPOILAGE_T_MAX_C)
      if (!Number.isNaN(lastProductC)) {
        // inputs through fields: no number crosses these calls
        awTable.tC = lastProductC
        awTable.moistureDb = m
        awTable.lookup()
        acc.productTempC = lastProductC
        acc.moistureWbPct = (100 * m) / (1 + m)
        acc.waterActivity = awTable.aw
        acc.stepHour()
      }
    }
    const mode = c.mode[i]
    if (mode === HourMode.missing) {
      missingHours++
    } else if (mode !== HourMode.paused) {
      heater += c.heaterKwhPerTonne[i]
      solar += c.solarKwhPerTonne[i]
      if (mode === HourMode.rainExposed) {
        rainExposureHours++
        // rain-wetted surface: toward the equilibrium at the highest RH evaluated
        const meWet = product.emcAdsorptionDb(c.productC[i], EMC_RH_CAP_PCT)
        if (meWet > m) {
          const next = meWet - (meWet - m) * c.rewetDecayPerHour[i]
          fromRain += next - m
          m = next
        }
      } else {
        const meDes = c.emcDesorptionDb[i]
        const meAds = c.emcAdsorptionDb[i]
        if (m > meDes) {
          let next: number
          const decay = c.decayPerHour[i]
          if (!Number.isNaN(decay)) {
            // first order: equivalent-time stepping reduces to M' = Me + (M − Me)·exp(−k)
            next = meDes + (m - meDes) * decay
          } else if (initialDb > meDes) {
            const mr = (m - meDes) / (initialDb - meDes)
            next = meDes + stepMoistureRatio(mr, c.rateK[i], c.rateN[i], 1, ts) * (initialDb - meDes)
          } else {
            next = meDes + (m - meDes) * Math.exp(-firstOrderRateConstant(c.rateK[i], c.rateN[i], ts))
          }
          let drop = m - next
          const cap = c.capDbPerH[i]
          if (drop > cap) drop = cap
          if (drop > 0) {
            m -= drop
            toAir += drop
          }
        } else if (m < meAds) {
          rewettingHours++
          const next = meAds - (meAds - m) * c.rewetDecayPerHour[i]
          toAir -= next - m
          m = next
        }
      }
    }
    if (trace) trace[h] = m
    if (m <= targetDb) {
      hoursToTarget = h + 1
      break
    }
  }
  let spoilageResult: BatchSpoilageResult | undefined
  if (acc !== undefined && spoilage !== undefined) {
    const state = acc.state()
    spoilageResult = {
      measure: state.measure,
      limitUsedFraction: state.measure / spoilage.model.spoiledAt,
      spoiledBeforeDry: state.measure >= spoilage.model.spoiledAt,
      hoursAtRisk: state.hoursAtRisk,
      hoursOutsideRange: state.hoursOutsideRange,
      hours: state.hours,
    }
  }
  return {
    reached: Number.isFinite(hoursToTarget),
    hoursToTarget,
    hoursSimulated: simulated,
    ranOutOfData: ranOut,
    finalDb: m,
    rewettingHours,
    rainExposureHours,
    missingHours,
    backupHours,
    heaterKwhPerTonne: heater,
    solarKwhPerTonne: solar,
    waterToAirDb: toAir,
    waterFromRainDb: fromRain,
    trace,
    usedBackup,
    spoilage: spoilageResult,
  }
}
