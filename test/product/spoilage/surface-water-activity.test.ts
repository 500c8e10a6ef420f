/**
 * The water activity at the product surface fed to the mould model (product/spoilage/surface-water-activity.ts):
 * the rule's ends against the drying theory it rests on (a wetted surface in the constant-rate period: Geankoplis
 * §9.6B; an unsaturated surface in equilibrium with the air once the evaporation front is inside: Heldman &
 * Moraru), rain and dew, covered hours, and on whole figs through the engine.
 */
import { describe, expect, it } from 'vitest'
import { spoilageSetup } from '../../../src/analysis/spoilage.ts'
import { simulateBatch } from '../../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../../src/drying/method.ts'
import { HourMode } from '../../../src/drying/methods/method-model.ts'
import { productResponse } from '../../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../../src/drying/thresholds.ts'
import { productById } from '../../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../../src/product/moisture-basis.ts'
import {
  SurfaceExchange,
  spoilageModelFor,
  surfaceWaterActivity,
} from '../../../src/product/spoilage/index.ts'
import { constantSeries } from '../../drying/synthetic-weather.ts'

describe('surface water activity: the rule', () => {
  it('is 1 when rain wets the product, the piece’s own when it meets no air', () => {
    expect(surfaceWaterActivity(SurfaceExchange.wetted, 0.7, 0.3, 0)).toBe(1)
    expect(surfaceWaterActivity(SurfaceExchange.none, 0.93, 0.3, 0.5)).toBe(0.93)
    expect(surfaceWaterActivity(SurfaceExchange.air, 0.93, Number.NaN, 0)).toBe(0.93)
  })

  it('is the air’s RH at the surface when nothing evaporates from a wet film (evaporation front inside)', () => {
    expect(surfaceWaterActivity(SurfaceExchange.air, 0.97, 0.35, 0)).toBeCloseTo(0.35, 12)
    // at or below the dew point the surface is wet
    expect(surfaceWaterActivity(SurfaceExchange.air, 0.6, 1.04, 0)).toBe(1)
    // rewetting: humid air over a drier piece sets the surface at the air's RH
    expect(surfaceWaterActivity(SurfaceExchange.air, 0.6, 0.85, 0)).toBeCloseTo(0.85, 12)
  })

  it('is wet while the product evaporates at the free-water rate, and never wetter than the piece when drying', () => {
    expect(surfaceWaterActivity(SurfaceExchange.air, 1, 0.3, 1)).toBe(1)
    expect(surfaceWaterActivity(SurfaceExchange.air, 0.96, 0.3, 1)).toBe(0.96)
    let last = 0
    for (const w of [0, 0.1, 0.3, 0.6, 0.9]) {
      const aw = surfaceWaterActivity(SurfaceExchange.air, 0.99, 0.3, w)
      expect(aw).toBeGreaterThanOrEqual(last)
      expect(aw).toBeCloseTo(w + (1 - w) * 0.3, 12)
      last = aw
    }
  })
})

describe('surface water activity through the engine (whole figs, open air)', () => {
  const id = 'figs'
  const profile = productById(id)
  const product = tabulatedResponse(productResponse(profile))
  const options = {
    targetDb: moistureDbFromWbPct(profile.targetMoistureWbPct.value),
    initialWbPct: profile.initialMoistureWbPct.value,
    loadingKgPerM2: profile.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: profile.maxProductTempC?.value ?? null,
  }
  const batch = (rh: number, method: Parameters<typeof parseDryingMethod>[0]) => {
    const s = constantSeries({ dryBulbC: 28, relativeHumidityPct: rh, ghiWm2: 600, hours: 24 * 20 })
    const c = computeHourlyConditions(s, parseDryingMethod(method), product, options)
    const r = simulateBatch(c, product, {
      startIndex: 0,
      maxHours: 24 * 20,
      initialDb: moistureDbFromWbPct(profile.initialMoistureWbPct.value),
      targetDb: options.targetDb,
      recordTrace: true,
      spoilage: spoilageSetup(profile),
    })
    return { c, r }
  }

  it('feeds the mould model the surface, not the piece', () => {
    expect(spoilageModelFor(profile).waterActivityOf).toBe('surface')
  })

  it('in dry air the skin of a drying fig is far drier than its flesh; in near-saturated air it is not', () => {
    const dry = batch(25, { kind: 'open-air' })
    const awDry = dry.r.spoilageWaterActivityTrace as Float64Array
    // first day: the piece is near aw 0.97, the skin near the air's RH at the product temperature
    expect(awDry[5]).toBeLessThan(0.5)
    const humid = batch(97, { kind: 'open-air' })
    const awHumid = humid.r.spoilageWaterActivityTrace as Float64Array
    expect(awHumid[5]).toBeGreaterThan(0.9)
    expect(humid.r.spoilage?.limitUsedFraction as number).toBeGreaterThan(
      10 * (dry.r.spoilage?.limitUsedFraction as number),
    )
  })

  it('rain on the product reads as a wet surface (aw 1)', () => {
    const s = constantSeries({ dryBulbC: 28, relativeHumidityPct: 40, ghiWm2: 600, hours: 24 * 3 })
    for (let i = 10; i < 14; i++) s.rainMm[i] = 2
    const c = computeHourlyConditions(
      s,
      parseDryingMethod({ kind: 'open-air', coveredInRain: false }),
      product,
      options,
    )
    const r = simulateBatch(c, product, {
      startIndex: 0,
      maxHours: 24 * 3,
      initialDb: moistureDbFromWbPct(profile.initialMoistureWbPct.value),
      targetDb: options.targetDb,
      recordTrace: true,
      spoilage: spoilageSetup(profile),
    })
    const aw = r.spoilageWaterActivityTrace as Float64Array
    let rained = 0
    for (let h = 0; h < 24 * 3; h++) {
      if (c.mode[h] === HourMode.rainExposed) {
        rained++
        expect(aw[h]).toBe(1)
      }
    }
    expect(rained).toBe(4)
  })
})
