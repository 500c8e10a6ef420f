/**
 * Spoilage along a batch (drying/batch.ts with `options.spoilage`, drying/water-activity-table.ts): the
 * water-activity grid against the isotherm, the hour-by-hour stepping against a direct re-run of the model
 * over the batch's own trace, and the rule "spoiled before dry".
 */
import { describe, expect, it } from 'vitest'
import { spoilageSetup } from '../../src/analysis/spoilage.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions, type HourlyConditionsOptions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { HourMode } from '../../src/drying/methods/method-model.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { WaterActivityTable, waterActivityDirect } from '../../src/drying/water-activity-table.ts'
import { saturationPressureLiquidPa } from '../../src/physics/saturation.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import {
  initialSpoilageState,
  mouldFreeTimeModel,
  spoilageModelFor,
} from '../../src/product/spoilage/index.ts'
import { demoSeries } from './demo-weather.ts'
import { constantSeries } from './synthetic-weather.ts'

function options(id: string): HourlyConditionsOptions {
  const p = productById(id)
  return {
    targetDb: moistureDbFromWbPct(p.targetMoistureWbPct.value),
    initialWbPct: p.initialMoistureWbPct.value,
    loadingKgPerM2: p.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: p.maxProductTempC?.value ?? null,
  }
}

describe('water-activity grid', () => {
  it('agrees with the isotherm within 0.004 aw over the drying range (fruit, grain, coffee, fish)', () => {
    for (const id of [
      'apricot-halves',
      'grapes-to-raisins',
      'shelled-corn',
      'coffee-parchment',
      'fish-fillets',
    ]) {
      const profile = productById(id)
      const table = new WaterActivityTable(profile)
      const wbTop = profile.initialMoistureWbPct.value
      let worst = 0
      for (let t = -5; t <= 70; t += 3.3) {
        for (let wb = 5; wb <= wbTop; wb += 1.7) {
          const m = moistureDbFromWbPct(wb)
          worst = Math.max(worst, Math.abs(table.at(t, m) - waterActivityDirect(profile, t, m)))
        }
      }
      expect(worst, id).toBeLessThan(0.004)
    }
  })

  it('reads 0 for bone-dry product and stays within 0–1', () => {
    const table = new WaterActivityTable(productById('apricot-halves'))
    expect(table.at(25, 0)).toBe(0)
    for (const m of [0.01, 0.3, 1, 6, 50]) {
      const aw = table.at(30, m)
      expect(aw).toBeGreaterThanOrEqual(0)
      expect(aw).toBeLessThanOrEqual(1)
    }
  })
})

describe('spoilage stepped along a batch', () => {
  const id = 'apricot-halves'
  const profile = productById(id)
  const product = tabulatedResponse(productResponse(profile))
  const series = demoSeries('humidValley')
  const c = computeHourlyConditions(series, parseDryingMethod({ kind: 'open-air' }), product, options(id))
  const o = options(id)
  const setup = spoilageSetup(profile)
  const base = {
    maxHours: 24 * 40,
    initialDb: moistureDbFromWbPct(profile.initialMoistureWbPct.value),
    targetDb: o.targetDb,
  }

  it('equals the model stepped by hand over the batch trace (product temperature, moisture at the hour start, surface water activity)', () => {
    let surfaceBalanced = 0
    const seen = { paused: 0, drying: 0, belowPiece: 0 }
    for (const startIndex of [4000, 4500, 5000]) {
      const r = simulateBatch(c, product, { ...base, startIndex, recordTrace: true, spoilage: setup })
      const model = spoilageModelFor(profile)
      expect(model.waterActivityOf).toBe('surface')
      let state = initialSpoilageState()
      let m = base.initialDb
      for (let h = 0; h < r.hoursSimulated; h++) {
        const i = startIndex + h
        // the batch's product temperature: on the surface balance in drying hours (productTrace), the
        // conditions' in covered hours (where the trace has none)
        const traced = r.productTrace?.[h] as number
        const t = Number.isNaN(traced) ? c.productC[i] : traced
        if (t !== c.productC[i]) surfaceBalanced++
        const next = r.trace?.[h] as number
        // the surface's water activity, worked out here from the module's rule (surface-water-activity.ts)
        const piece = setup.waterActivity.at(t, m)
        let aw = piece
        if (c.mode[i] === HourMode.rainExposed) aw = 1
        else if (c.mode[i] === HourMode.active) {
          const rh = Math.min(1, c.vaporPressureKpa[i] / (saturationPressureLiquidPa(t) / 1000))
          const w = m > c.emcDesorptionDb[i] ? Math.min(1, (m - next) / c.capDbPerH[i]) : 0
          aw = w + (1 - w) * rh
          if (w > 0) aw = Math.min(aw, piece)
          if (w > 0) seen.drying++
          if (aw < piece - 0.2) seen.belowPiece++
        } else seen.paused++
        expect(r.spoilageWaterActivityTrace?.[h]).toBeCloseTo(aw, 6)
        state = model.step(state, {
          productTempC: t,
          moistureWbPct: (100 * m) / (1 + m),
          waterActivity: aw,
          hours: 1,
        })
        m = next
      }
      expect(r.spoilage?.measure).toBeCloseTo(state.measure, 6)
      expect(r.spoilage?.hoursAtRisk).toBe(state.hoursAtRisk)
      expect(r.spoilage?.hours).toBe(r.hoursSimulated)
      expect(r.spoilage?.spoiledBeforeDry).toBe(state.measure >= model.spoiledAt)
      expect(r.spoilage?.limitUsedFraction).toBeCloseTo(state.measure / model.spoiledAt, 6)
    }
    // open air is an exposed method: in its drying hours the product sits below the no-evaporation temperature
    expect(surfaceBalanced).toBeGreaterThan(24)
    // every kind of hour occurred, and in some the skin was far drier than the piece
    expect(seen.paused).toBeGreaterThan(24)
    expect(seen.drying).toBeGreaterThan(24)
    expect(seen.belowPiece).toBeGreaterThan(0)
  })

  it('changes nothing in the drying itself', () => {
    const a = simulateBatch(c, product, { ...base, startIndex: 4300 })
    const b = simulateBatch(c, product, { ...base, startIndex: 4300, spoilage: setup })
    expect(b.hoursToTarget).toBe(a.hoursToTarget)
    expect(b.finalDb).toBe(a.finalDb)
    expect(a.spoilage).toBeUndefined()
  })

  it('a batch that never dries in constant humid warmth spoils; in dry warm air it dries before its mould-free time is used', () => {
    const humid = constantSeries({ dryBulbC: 27, relativeHumidityPct: 95, hours: 24 * 30 })
    const dry = constantSeries({ dryBulbC: 27, relativeHumidityPct: 20, hours: 24 * 30 })
    const run = (s: typeof humid) => {
      const cc = computeHourlyConditions(s, parseDryingMethod({ kind: 'shade' }), product, options(id))
      return simulateBatch(cc, product, { ...base, maxHours: 24 * 30, startIndex: 0, spoilage: setup })
    }
    const wet = run(humid)
    expect(wet.reached).toBe(false)
    expect(wet.spoilage?.spoiledBeforeDry).toBe(true)
    const fast = run(dry)
    expect(fast.reached).toBe(true)
    expect(fast.spoilage?.limitUsedFraction).toBeLessThan(wet.spoilage?.limitUsedFraction as number)
  })

  it('holds the last product temperature through hours with missing weather (the clock runs)', () => {
    const s = constantSeries({ dryBulbC: 25, relativeHumidityPct: 90, hours: 24 * 5 })
    for (let i = 30; i < 40; i++) s.dryBulbC[i] = Number.NaN
    const cc = computeHourlyConditions(s, parseDryingMethod({ kind: 'shade' }), product, options(id))
    const r = simulateBatch(cc, product, { ...base, maxHours: 24 * 5, startIndex: 0, spoilage: setup })
    expect(r.missingHours).toBe(10)
    expect(r.spoilage?.hours).toBe(r.hoursSimulated)
  })

  it('the mould-free model counts nothing at or above 42.5 °C (Niles, Norman & Pimbley 1985; Tassou et al. 2007)', () => {
    const model = mouldFreeTimeModel()
    const at = (t: number) =>
      model.step(initialSpoilageState(), {
        productTempC: t,
        moistureWbPct: 60,
        waterActivity: 0.95,
        hours: 1,
      }).measure
    expect(at(42.5)).toBe(0)
    expect(at(48)).toBe(0)
    expect(at(42)).toBeGreaterThan(0)
  })
})
