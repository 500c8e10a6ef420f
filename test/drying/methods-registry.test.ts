/**
 * Every method of the registry (src/drying/methods/index.ts) is complete: a new method module added to the
 * list is checked here without editing this file (its defaults parse, its hours are computed with physical
 * values, it lists its assumptions, and the CLI, API and page offer it).
 */
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { DRYING_METHOD_KINDS, dryingMethodSchema, parseDryingMethod } from '../../src/drying/method.ts'
import { METHOD_MODELS, methodModel } from '../../src/drying/methods/index.ts'
import { HourMode } from '../../src/drying/methods/method-model.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { humidityRatioFromVaporPressure, moistAirEnthalpyKjPerKg } from '../../src/physics/moist-air.ts'
import { saturationPressureLiquidPa } from '../../src/physics/saturation.ts'
import { PRODUCT_CATALOGUE, productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { renderPage } from '../../src/web/page-html.ts'
import { demoSeries, sliceSeries } from './demo-weather.ts'

const week = sliceSeries(demoSeries('dryUpland'), 24 * 190, 24 * 7)
const apricots = productById('apricot-halves')
/** The ambient humidity ratio of hour i as the hourly driver computes it (drying/hourly-conditions.ts). */
const ambientW = (i: number): number =>
  humidityRatioFromVaporPressure(
    (week.relativeHumidityPct[i] / 100) * (saturationPressureLiquidPa(week.dryBulbC[i]) * 1e-3),
    week.pressureKpa[i],
  )

describe('the method registry', () => {
  it('kinds are unique, in registry order, and the union schema accepts each with its defaults', () => {
    const kinds = METHOD_MODELS.map((m) => m.kind)
    expect(new Set(kinds).size).toBe(kinds.length)
    expect([...DRYING_METHOD_KINDS]).toEqual(kinds)
    for (const kind of kinds) {
      expect(dryingMethodSchema.safeParse({ kind }).success, kind).toBe(true)
      expect(methodModel(kind).kind).toBe(kind)
    }
    expect(() => methodModel('no-such-method')).toThrow(/kinds: open-air/)
  })
  for (const model of METHOD_MODELS) {
    it(`${model.kind}: hours with physical values, its assumptions listed, offered on the page`, () => {
      const method = parseDryingMethod({ kind: model.kind })
      // apricots, or the first catalogue product the method takes (a grain bin takes grain only)
      const product = [apricots, ...PRODUCT_CATALOGUE].find((p) => (model.productFits?.(p) ?? null) === null)
      if (!product) throw new Error(`${model.kind} takes no catalogue product`)
      if (product !== apricots) expect(model.productFits?.(apricots)).toMatch(/apricot/i)
      const c = computeHourlyConditions(week, method, productResponse(product), {
        targetDb: moistureDbFromWbPct(product.targetMoistureWbPct.value),
        initialWbPct: product.initialMoistureWbPct.value,
        loadingKgPerM2: product.defaultLoadingKgPerM2.value,
        thresholds: parseDryingThresholds({}),
        maxProductTempC: product.maxProductTempC?.value ?? null,
      })
      expect(c.airFlowKgPerSPerTonne > 0).toBe(model.exposure === 'forced-air')
      let active = 0
      for (let i = 0; i < c.hours; i++) {
        if (c.mode[i] === HourMode.missing) continue
        // heating only: the air at the product never holds less energy than the ambient (an enclosure's air may be
        // cooler than the ambient where the product's evaporation takes more than the sun gives, but wetter)
        const hAmbient = moistAirEnthalpyKjPerKg(week.dryBulbC[i], ambientW(i))
        expect(moistAirEnthalpyKjPerKg(c.airC[i], c.humidityRatio[i])).toBeGreaterThanOrEqual(hAmbient - 0.05)
        if (c.humidityRatio[i] === ambientW(i))
          expect(c.airC[i]).toBeGreaterThanOrEqual(week.dryBulbC[i] - 1e-9)
        expect(c.productC[i]).toBeGreaterThan(-60)
        expect(c.productC[i]).toBeLessThanOrEqual(100)
        expect(c.heaterKwhPerTonne[i]).toBeGreaterThanOrEqual(0)
        expect(c.solarKwhPerTonne[i]).toBeGreaterThanOrEqual(0)
        if (c.mode[i] === HourMode.paused) continue
        active++
        expect(c.capDbPerH[i]).toBeGreaterThanOrEqual(0)
        if (model.exposure === 'exposed') expect(Number.isFinite(c.evaporationKgPerM2H[i])).toBe(true)
        else expect(c.deficitToSaturationGPerKg[i]).toBeGreaterThanOrEqual(0)
      }
      expect(active).toBeGreaterThan(0)
      if (model.heatsWithFuel) expect(c.heaterKwhPerTonne.some((v) => v > 0)).toBe(true)
      const a = assess(week, {
        product,
        method,
        seasonStart: '07-10',
        seasonEnd: '07-11',
        maxDays: 3,
        deadlineDays: 2,
      })
      expect(a.methodLabel).toBe(model.label)
      const named = { id: product.id, name: product.name, category: product.category }
      for (const x of methodModel(model.kind).assumptions(method, named))
        expect(a.assumptions).toContainEqual(x)
      expect(renderPage({})).toContain(`value="${model.kind}"`)
    })
  }
})

describe('energy inputs a method declares it never sets (columns left empty when computed for an assessment)', () => {
  const grapes = productResponse(productById('grapes-to-raisins'))
  const base = {
    targetDb: moistureDbFromWbPct(18),
    initialWbPct: 78.2,
    loadingKgPerM2: 12,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: 70,
  }
  for (const model of METHOD_MODELS) {
    const declared = model.energyInputs
    if (declared === undefined) continue
    it(`${model.kind}: the heater and collector columns it declares unused hold only zeros`, () => {
      const method = parseDryingMethod({ kind: model.kind })
      const full = computeHourlyConditions(week, method, grapes, base)
      if (!declared.heater) expect(full.heaterKwhPerTonne.every((v) => v === 0)).toBe(true)
      if (!declared.solar) expect(full.solarKwhPerTonne.every((v) => v === 0)).toBe(true)
      const slim = computeHourlyConditions(week, method, grapes, { ...base, diagnostics: false })
      expect(slim.heaterKwhPerTonne.length).toBe(declared.heater ? week.hours : 0)
      expect(slim.solarKwhPerTonne.length).toBe(declared.solar ? week.hours : 0)
      // Lewis kinetics (grapes): batches step by the decay column; the rate columns are left empty
      expect(slim.rateK.length).toBe(0)
      expect(Array.from(slim.decayPerHour)).toEqual(Array.from(full.decayPerHour))
    })
  }
})
