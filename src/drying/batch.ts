/**
 * @module drying/batch
 * One batch, hour by hour, over precomputed {@link HourlyConditions} (docs/model.md §7): the moisture of
 * each hour by drying/batch-moisture.ts (drying, rewetting, rain, paused and missing hours), the product
 * family's spoilage model by drying/batch-spoilage.ts when `options.spoilage` is given.
 * An optional backup (heated forced air) replaces the primary method in every hour the primary would not
 * dry: the supplemental-heat strategy of docs/model.md §8.
 */
import { BatchMoisture } from './batch-moisture.ts'
import { type BatchSpoilageResult, type BatchSpoilageSetup, BatchSpoilageTrack } from './batch-spoilage.ts'
import type { HourlyConditions } from './hourly-conditions.ts'
import { HourMode } from './methods/method-model.ts'
import type { ProductResponse } from './product-response.ts'
import { HourStatus } from './usable-hour.ts'

export type { BatchSpoilageResult, BatchSpoilageSetup } from './batch-spoilage.ts'

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
  const { startIndex, maxHours, targetDb } = options
  const n = primary.hours
  checkBatchOptions(options, n)
  const wrap = options.wrap === true
  primary.ensure(startIndex, maxHours, wrap)
  backup?.ensure(startIndex, maxHours, wrap)
  const trace = options.recordTrace ? new Float64Array(maxHours).fill(Number.NaN) : undefined
  const usedBackup = options.recordTrace ? new Uint8Array(maxHours) : undefined
  const track = options.spoilage === undefined ? undefined : new BatchSpoilageTrack(options.spoilage)
  const batch = new BatchMoisture(product, options.initialDb)
  let backupHours = 0
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
    if (track !== undefined) {
      track.productC = c.productC[i]
      track.moistureDb = batch.moistureDb
      track.stepHour()
    }
    batch.stepHour(c, i)
    if (trace) trace[h] = batch.moistureDb
    if (batch.moistureDb <= targetDb) {
      hoursToTarget = h + 1
      break
    }
  }
  return {
    reached: Number.isFinite(hoursToTarget),
    hoursToTarget,
    hoursSimulated: simulated,
    ranOutOfData: ranOut,
    finalDb: batch.moistureDb,
    rewettingHours: batch.rewettingHours,
    rainExposureHours: batch.rainExposureHours,
    missingHours: batch.missingHours,
    backupHours,
    heaterKwhPerTonne: batch.heaterKwhPerTonne,
    solarKwhPerTonne: batch.solarKwhPerTonne,
    waterToAirDb: batch.waterToAirDb,
    waterFromRainDb: batch.waterFromRainDb,
    trace,
    usedBackup,
    spoilage: track?.result(),
  }
}
