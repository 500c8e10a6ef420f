/**
 * @module analysis/hourly-detail
 * Hour-by-hour drying potential for a stretch of a series: the air at the product, both humidity-ratio
 * deficits (to free-water saturation and to the product's equilibrium RH at target), wet-surface
 * evaporation, equilibrium moisture and the usable-hour verdict with its reason. For reports and the
 * API; an assessment keeps these as columns and does not list them.
 */

import { computeHourlyConditions } from '../drying/hourly-conditions.ts'
import { parseDryingMethod } from '../drying/method.ts'
import { methodLoadingKgPerM2 } from '../drying/methods/index.ts'
import { productResponse } from '../drying/product-response.ts'
import { parseDryingThresholds } from '../drying/thresholds.ts'
import { HOUR_STATUS_NAMES, type HourStatusName } from '../drying/usable-hour.ts'
import { adiabaticHumidityRatioAtRh } from '../physics/air-processes.ts'
import { resolveDryTarget } from '../product/dry-target.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../product/moisture-basis.ts'
import type { HourlySeries } from '../weather/series.ts'
import type { AssessOptions } from './assess.ts'
import { roundOrNull } from './statistics.ts'

export interface HourDetail {
  startUtc: string
  airC: number | null
  airRhPct: number | null
  /** Product surface temperature [°C] of a product that evaporates nothing (near its target). */
  productC: number | null
  /**
   * Exposed methods: surface temperature [°C] of a product that still holds free water (cooled by what it
   * evaporates); a drying batch lies between the two. Null for forced-air methods and covered hours.
   */
  productWetC: number | null
  surfaceRhPct: number | null
  deficitToSaturationGPerKg: number | null
  deficitToTargetGPerKg: number | null
  /** Penman wet-surface evaporation [kg m⁻² h⁻¹] (exposed methods), null for forced air. */
  evaporationKgPerM2H: number | null
  equilibriumMoistureWbPct: number | null
  usable: boolean
  reason: HourStatusName
}

/** At most this many hours per call (a month is 744). */
export const HOURLY_DETAIL_MAX_HOURS = 24 * 62

/** Per-hour detail for `hours` hours from index `fromIndex` of `series`, for the product and method of `options`. */
export function hourlyDetail(
  series: HourlySeries,
  options: AssessOptions,
  fromIndex: number,
  hours: number,
): HourDetail[] {
  if (!(Number.isInteger(fromIndex) && fromIndex >= 0 && fromIndex < series.hours)) {
    throw new RangeError(`first hour must be an index from 0 to ${series.hours - 1}, got ${fromIndex}`)
  }
  if (!(Number.isInteger(hours) && hours >= 1 && hours <= HOURLY_DETAIL_MAX_HOURS)) {
    throw new RangeError(`hours must be a whole number from 1 to ${HOURLY_DETAIL_MAX_HOURS}, got ${hours}`)
  }
  const to = Math.min(series.hours, fromIndex + hours)
  const slice: HourlySeries = {
    ...series,
    hours: to - fromIndex,
    startUtcMs: series.startUtcMs.subarray(fromIndex, to),
    dryBulbC: series.dryBulbC.subarray(fromIndex, to),
    relativeHumidityPct: series.relativeHumidityPct.subarray(fromIndex, to),
    pressureKpa: series.pressureKpa.subarray(fromIndex, to),
    windMs: series.windMs.subarray(fromIndex, to),
    ghiWm2: series.ghiWm2.subarray(fromIndex, to),
    rainMm: series.rainMm.subarray(fromIndex, to),
    quality: series.quality.subarray(fromIndex, to),
  }
  const profile = options.product
  const method = parseDryingMethod(options.method)
  const initialWbPct = options.initialWbPct ?? profile.initialMoistureWbPct.value
  const targetDb = moistureDbFromWbPct(
    resolveDryTarget(profile, { userTargetWbPct: options.targetWbPct, storageTempC: options.storageTempC })
      .targetWbPct,
  )
  const response = productResponse(profile, options.thicknessMm)
  const c = computeHourlyConditions(slice, method, response, {
    targetDb,
    initialWbPct,
    loadingKgPerM2: methodLoadingKgPerM2(method) ?? profile.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds(options.thresholds ?? {}),
    maxProductTempC: profile.maxProductTempC?.value ?? null,
  })
  const rows: HourDetail[] = []
  for (let i = 0; i < c.hours; i++) {
    let dSat = c.deficitToSaturationGPerKg[i]
    if (Number.isNaN(dSat) && Number.isFinite(c.productC[i])) {
      // exposed methods skip this solver in the engine; compute it here for the table
      const w = c.humidityRatio[i]
      dSat =
        c.surfaceRhPct[i] >= 100
          ? 0
          : 1000 * (adiabaticHumidityRatioAtRh(c.productC[i], w, slice.pressureKpa[i], 1) - w)
    }
    const me = c.emcDesorptionDb[i]
    rows.push({
      startUtc: new Date(slice.startUtcMs[i]).toISOString(),
      airC: roundOrNull(c.airC[i], 2),
      airRhPct: roundOrNull(c.airRhPct[i], 1),
      productC: roundOrNull(c.productC[i], 2),
      productWetC: c.surfaceBalance ? roundOrNull(c.productWetC[i], 2) : null,
      surfaceRhPct: roundOrNull(c.surfaceRhPct[i], 1),
      deficitToSaturationGPerKg: roundOrNull(dSat, 3),
      deficitToTargetGPerKg: roundOrNull(c.deficitToTargetGPerKg[i], 3),
      evaporationKgPerM2H: roundOrNull(c.evaporationKgPerM2H[i], 4),
      equilibriumMoistureWbPct: Number.isFinite(me) ? roundOrNull(moistureWbPctFromDb(me), 2) : null,
      usable: c.status[i] === 0,
      reason: HOUR_STATUS_NAMES[c.status[i]],
    })
  }
  return rows
}
