/**
 * The fish's pathogen-exposure model (product/spoilage/fish-pathogen-exposure.ts: US FDA 2020, Fish and Fishery
 * Products Hazards and Controls Guidance, Appendix 4, summary of Table A-2) stepped through the engine: open-air
 * fish in warm, humid weather and fish in a warm heated dryer use up the allowed exposure within hours (the
 * guidance counts every hour the fish is above 10 °C and below 57.2 °C); fish held at or above 57.2 °C in a
 * heated dryer accrues nothing. Weather invented (test/drying/synthetic-weather.ts).
 */
import { describe, expect, it } from 'vitest'
import { spoilageSetup } from '../../src/analysis/spoilage.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import { FISH_EXPOSURE_MAX_C } from '../../src/product/spoilage/index.ts'
import { constantSeries, diurnalSeries } from './synthetic-weather.ts'

function run(profile: ProductProfile, method: unknown, series: ReturnType<typeof constantSeries>) {
  const product = tabulatedResponse(productResponse(profile))
  const targetDb = moistureDbFromWbPct(profile.targetMoistureWbPct.value)
  const c = computeHourlyConditions(series, parseDryingMethod(method), product, {
    targetDb,
    initialWbPct: profile.initialMoistureWbPct.value,
    loadingKgPerM2: profile.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: profile.maxProductTempC?.value ?? null,
  })
  const setup = spoilageSetup(profile)
  expect(setup.model.id).toBe('fish-pathogen-exposure')
  const r = simulateBatch(c, product, {
    startIndex: 8,
    maxHours: 24 * 12,
    initialDb: moistureDbFromWbPct(profile.initialMoistureWbPct.value),
    targetDb,
    recordTrace: true,
    spoilage: setup,
  })
  return { r, c, setup }
}

const fish = productById('fish-fillets')
/** A warm, humid coastal week: 26–33 °C, dew point 25 °C, clear sky, 2 m/s (invented). */
const warmHumid = diurnalSeries({
  latitudeDeg: 6,
  longitudeDeg: 1,
  utcOffsetHours: 0,
  firstDayUtcMs: Date.UTC(2021, 2, 1),
  days: 14,
  tMinC: 26,
  tMaxC: 33,
  dewPointC: 25,
  windMs: 2,
})

describe('fish spoilage through the engine (FDA App. 4, Table A-2 summary)', () => {
  it('open-air fish in warm, humid weather uses up its exposure long before it is dry', () => {
    const { r } = run(fish, { kind: 'open-air' }, warmHumid)
    expect(r.spoilage?.spoiledBeforeDry).toBe(true)
    // 2 hours above 21.1 °C reach the limit: by then the fish is still fresh (aw far above 0.83)
    expect(r.spoilage?.limitUsedFraction).toBeGreaterThanOrEqual(1)
    expect(r.spoilageWaterActivityTrace?.[1]).toBeGreaterThan(0.95)
  })

  it('a heated dryer at 45 °C does not stop pathogens: the limit is used within the first hours', () => {
    const { r, c } = run(fish, { kind: 'heated', setPointC: 45 }, warmHumid)
    expect(c.productC[8]).toBe(45)
    expect(r.spoilage?.spoiledBeforeDry).toBe(true)
    expect(r.spoilage?.hoursAtRisk).toBeGreaterThanOrEqual(2)
  })

  it('fish held at or above 57.2 °C in a heated dryer accrues nothing and dries', () => {
    // a user's own profile that allows 65 °C (the catalogue's fish limit is 55 °C, from memory)
    const hot: ProductProfile = {
      ...fish,
      maxProductTempC: { value: 65, source: 'user setting for this test', confidence: 'user' },
    }
    const { r, c } = run(
      hot,
      { kind: 'heated', setPointC: 60 },
      constantSeries({ dryBulbC: 28, relativeHumidityPct: 80 }),
    )
    expect(c.productC[8]).toBeGreaterThanOrEqual(FISH_EXPOSURE_MAX_C)
    expect(r.reached).toBe(true)
    expect(r.spoilage?.measure).toBe(0)
    expect(r.spoilage?.hoursAtRisk).toBe(0)
    expect(r.spoilage?.spoiledBeforeDry).toBe(false)
    // the same fish at 55 °C (below 57.2 °C) uses up its exposure
    const warm = run(
      hot,
      { kind: 'heated', setPointC: 55 },
      constantSeries({ dryBulbC: 28, relativeHumidityPct: 80 }),
    )
    expect(warm.r.spoilage?.spoiledBeforeDry).toBe(true)
  })
})
