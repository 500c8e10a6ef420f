/**
 * @module drying/batch
 * One batch, hour by hour, over precomputed {@link HourlyConditions} (docs/model.md §7):
 * - drying (M above the desorption equilibrium): thin-layer step by equivalent time
 *   (drying/product-response.ts), never removing more than the hour's constant-rate limit (wet-surface
 *   evaporation for exposed products, humidity-ratio deficit × air mass for forced air); an exposed product's
 *   temperature follows its surface balance between the wet-surface and the no-evaporation temperature by the
 *   share of the wet-surface rate it evaporates ({@link surfaceBalancedDrop});
 * - rewetting (M below the adsorption equilibrium): M → Me_ads − (Me_ads − M)·exp(−f·k·1 h), f the profile's
 *   rewetting rate factor (Lewis form; stated simplification); an exposed product never takes up more than the
 *   vapour the air delivers to its surface in the hour ({@link vaporUptakeLimitDb});
 * - rain on an exposed product: rewetting toward the equilibrium at 99.5 % RH, counted as rain exposure;
 *   that water comes from rain, not from the air;
 * - paused (covered, fans off) and missing hours: no change; a batch that meets missing hours has an unknown
 *   outcome (`outcomeUnknown`), which the assessment reports as such, never as a slow batch.
 * An optional backup (heated forced air) replaces the primary method in every hour the primary would not
 * dry: the supplemental-heat strategy of docs/model.md §8.
 * With `options.spoilage`, the product family's spoilage model is stepped every hour of the batch (paused and
 * covered hours included) with the hour's product temperature (the surface-balanced one in drying hours of
 * exposed methods), the moisture at the start of the hour, and for models of mould what the surface's water
 * activity needs: the hour's mode, the air's vapour pressure and the share of the hour's free-water limit the
 * product evaporated (drying/batch-spoilage.ts, product/spoilage/surface-water-activity.ts).
 */

import { surfaceBalancedDrop } from '../product/stepping.ts'
import { type BatchSpoilageResult, type BatchSpoilageSetup, BatchSpoilageTrack } from './batch-spoilage.ts'
import type { HourlyConditions } from './hourly-conditions.ts'
import { HourMode } from './methods/method-model.ts'
import {
  EMC_RH_CAP_PCT,
  firstOrderRateConstant,
  type ProductResponse,
  stepMoistureRatio,
} from './product-response.ts'
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
  /** Step this spoilage model along the batch (see the module comment). */
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
  /** Hours without weather the batch ran into before it ended (the product is held unchanged through them). */
  missingHours: number
  /**
   * True when the batch ran into hours without weather before it reached its target or its maximum duration:
   * what the product did in them is not known, so neither is the batch's outcome (reported as unknown, not
   * as slow).
   */
  outcomeUnknown: boolean
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
  /**
   * Product (surface) temperature [°C] in each hour, when recordTrace: from its surface balance in drying hours
   * of exposed methods, the conditions' product temperature in other hours, NaN in covered and missing hours.
   */
  productTrace?: Float64Array
  /** Which conditions drove each hour (0 primary, 1 backup), when recordTrace. */
  usedBackup?: Uint8Array
  /**
   * The water activity the spoilage model was fed in each hour (the piece's, or the surface's for mould
   * models), when recordTrace and `options.spoilage`; NaN for hours not stepped.
   */
  spoilageWaterActivityTrace?: Float64Array
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
 * every hour whose primary status is not usable (and not missing). A method that puts no heater or collector
 * energy in has those columns empty (hour-columns.ts): they add nothing.
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
  // a lazy backup computes only the hours the batch hands to it (below), not its whole window
  const trace = options.recordTrace ? new Float64Array(maxHours).fill(Number.NaN) : undefined
  const usedBackup = options.recordTrace ? new Uint8Array(maxHours) : undefined
  const productTrace = options.recordTrace ? new Float64Array(maxHours).fill(Number.NaN) : undefined
  const track =
    options.spoilage && new BatchSpoilageTrack(options.spoilage, options.recordTrace ? maxHours : 0)
  const ts = product.thompsonTimeScale
  // the caps are per kg of the dry matter of the conditions' initial moisture; this batch's dry matter per
  // tonne fresh (or per m²) is 1/(1 + initialDb): rescale so the water per kg of air is what the air carries
  const capScalePrimary = (1 + initialDb) / (1 + primary.capInitialDb)
  const capScaleBackup = backup === undefined ? 1 : (1 + initialDb) / (1 + backup.capInitialDb)
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
      backup.ensure(i, 1, false)
      backupHours++
      if (usedBackup) usedBackup[h] = 1
    }
    const mode = c.mode[i]
    const mStart = m
    let wetShare = 0
    // the product's temperature in the hour: the conditions' (it evaporates nothing), or on its surface balance
    let tHour = c.productC[i]
    if (mode === HourMode.missing) {
      missingHours++
    } else if (mode !== HourMode.paused) {
      if (c.heaterKwhPerTonne.length !== 0) heater += c.heaterKwhPerTonne[i]
      if (c.solarKwhPerTonne.length !== 0) solar += c.solarKwhPerTonne[i]
      if (mode === HourMode.rainExposed) {
        rainExposureHours++
        const next = rainWettedDb(c, i, product, m)
        fromRain += next - m
        m = next
      } else {
        const capScale = c === primary ? capScalePrimary : capScaleBackup
        if (m > c.emcDesorptionDb[i]) {
          const cap = c.capDbPerH[i] * capScale
          const drop = airLimitedDrop(c, i, dryingDropDb(c, i, m, cap, initialDb, ts), capScale)
          // the share of the hour's free-water limit evaporated (an unknown limit: as a free-water surface)
          wetShare = cap > 0 ? drop / cap : drop > 0 ? 1 : 0
          if (c.surfaceBalance && cap > 0) tHour -= (drop / cap) * (tHour - c.productWetC[i])
          if (drop > 0) {
            m -= drop
            toAir += drop
          }
        } else if (m < c.emcAdsorptionDb[i]) {
          rewettingHours++
          const next = rewettedDb(c, i, product, m, capScale)
          toAir -= next - m
          m = next
        }
      }
    }
    if (trace) trace[h] = m
    if (productTrace && mode !== HourMode.paused) productTrace[h] = tHour
    if (track) stepSpoilage(track, h, mode, tHour, mStart, c.vaporPressureKpa[i], wetShare)
    if (m <= targetDb) {
      hoursToTarget = h + 1
      break
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
    outcomeUnknown: missingHours > 0,
    backupHours,
    heaterKwhPerTonne: heater,
    solarKwhPerTonne: solar,
    waterToAirDb: toAir,
    waterFromRainDb: fromRain,
    trace,
    productTrace,
    usedBackup,
    spoilageWaterActivityTrace: track?.waterActivityTrace,
    spoilage: track?.result(),
  }
}

/**
 * Hour `h` of the batch's spoilage track: the hour's inputs set in its fields, then stepped (small enough to be
 * inlined into the hour loop, so the numbers are not boxed on the way).
 */
function stepSpoilage(
  track: BatchSpoilageTrack,
  h: number,
  mode: number,
  productC: number,
  moistureDb: number,
  airVaporPressureKpa: number,
  wetShare: number,
): void {
  track.productC = productC
  track.moistureDb = moistureDb
  track.airVaporPressureKpa = airVaporPressureKpa
  track.wetShare = wetShare
  track.stepBatchHour(h, mode)
}

/**
 * Water [kg/kg db] removed in hour `i` from moisture `m` above the desorption equilibrium: the falling-rate step,
 * never more than the hour's constant-rate limit `cap`; for exposed methods the product sits on its surface
 * balance between the wet-surface and the no-evaporation ends ({@link surfaceBalancedDrop}).
 */
function dryingDropDb(
  c: HourlyConditions,
  i: number,
  m: number,
  cap: number,
  initialDb: number,
  ts: number,
): number {
  const dropDry = fallingRateDrop(
    m,
    c.emcDesorptionDb[i],
    c.decayPerHour[i],
    c.rateK[i],
    c.rateN[i],
    initialDb,
    ts,
  )
  if (!c.surfaceBalance) {
    // (not Math.min: a NaN limit leaves the step as it is, as it always has)
    if (dropDry > cap) return cap
    return dropDry
  }
  const dropWet = fallingRateDrop(
    m,
    c.emcWetDb[i],
    c.decayWetPerHour[i],
    c.rateKWet[i],
    c.rateNWet[i],
    initialDb,
    ts,
  )
  return surfaceBalancedDrop(dropDry, dropWet, cap)
}

/**
 * A forced-air method on a surface balance (the tunnel): the hour's drop `drop` [kg/kg db], never more than the
 * air stream can carry away (its {@link HourlyConditions.airCapDbPerH} × `capScale`); unchanged for other methods.
 */
function airLimitedDrop(c: HourlyConditions, i: number, drop: number, capScale: number): number {
  if (c.airCapDbPerH.length === 0) return drop
  const air = c.airCapDbPerH[i] * capScale
  // (not Math.min: a NaN limit leaves the drop as it is)
  if (drop > air) return air
  return drop
}

/**
 * Moisture [kg/kg db] after hour `i` of a product at `m` below the adsorption equilibrium: first order toward
 * it at the rewetting rate, and for an exposed product never more than the vapour the air delivers
 * ({@link vaporUptakeLimitDb}, × `capScale` for the batch's dry matter).
 */
function rewettedDb(
  c: HourlyConditions,
  i: number,
  product: ProductResponse,
  m: number,
  capScale: number,
): number {
  const meAds = c.emcAdsorptionDb[i]
  const next = meAds - (meAds - m) * c.rewetDecayPerHour[i]
  if (!c.surfaceBalance) return next
  const limit = vaporUptakeLimitDb(c, i, product, m) * capScale
  return next - m > limit ? m + Math.max(0, limit) : next
}

/** Moisture [kg/kg db] after a rain-exposed hour: toward the equilibrium at the highest RH evaluated (the rain-wetted surface). */
function rainWettedDb(c: HourlyConditions, i: number, product: ProductResponse, m: number): number {
  const meWet = product.emcAdsorptionDb(c.productC[i], EMC_RH_CAP_PCT)
  return meWet > m ? meWet - (meWet - m) * c.rewetDecayPerHour[i] : m
}

/**
 * Most water [kg/kg db] an exposed product at moisture `m` can take up from the air in hour `i`: the vapour the
 * air delivers to its surface through the conductance of the wet-surface balance, g·(ea − aw·es(T)), at the
 * product's water activity aw (its isotherm at `m`) and the temperature of a surface that exchanges no latent
 * heat; the heat released by the uptake warms the surface, so the true uptake is less (an upper bound). The
 * first-order approach to the adsorption equilibrium alone takes up water in proportion to that equilibrium,
 * which grows without bound as the surface RH nears 100 % (a radiatively cooled product at dawn). +Infinity
 * when the hour has no conductance (no limit known).
 */
function vaporUptakeLimitDb(c: HourlyConditions, i: number, product: ProductResponse, m: number): number {
  const air = c.vaporUptakeAirDbPerH[i]
  if (!(air >= 0)) return Number.POSITIVE_INFINITY
  const aw = product.erhPct(c.productC[i], m) / 100
  return air - aw * c.vaporUptakeSurfaceDbPerH[i]
}

/**
 * Water [kg/kg db] a falling-rate step of one hour removes from moisture `m` toward equilibrium `me` with the
 * hour's step parameters (first order: exp(−k) as `decay`; Page and Thompson: equivalent time from the batch's
 * `initialDb`); 0 when m is not above me.
 */
function fallingRateDrop(
  m: number,
  me: number,
  decay: number,
  k: number,
  nExp: number,
  initialDb: number,
  ts: number,
): number {
  if (!(m > me)) return 0
  let next: number
  if (!Number.isNaN(decay)) {
    // first order: equivalent-time stepping reduces to M' = Me + (M − Me)·exp(−k)
    next = me + (m - me) * decay
  } else if (initialDb > me) {
    const mr = (m - me) / (initialDb - me)
    next = me + stepMoistureRatio(mr, k, nExp, 1, ts) * (initialDb - me)
  } else {
    next = me + (m - me) * Math.exp(-firstOrderRateConstant(k, nExp, ts))
  }
  return m - next
}
