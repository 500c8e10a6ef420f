/**
 * The solar tunnel method (drying/methods/tunnel.ts) and the collector heat removal factor it uses.
 */
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { computeHourlyConditions, type HourlyConditionsOptions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { HourMode } from '../../src/drying/methods/method-model.ts'
import { tunnel, tunnelTonnes } from '../../src/drying/methods/tunnel.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { heatRemovalFactor } from '../../src/physics/collector.ts'
import { coverTransmittance } from '../../src/physics/cover-transmittance.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { demoSeries, sliceSeries } from './demo-weather.ts'

const apricots = productById('apricot-halves')

function options(loadingKgPerM2 = apricots.defaultLoadingKgPerM2.value): HourlyConditionsOptions {
  return {
    targetDb: moistureDbFromWbPct(apricots.targetMoistureWbPct.value),
    initialWbPct: apricots.initialMoistureWbPct.value,
    loadingKgPerM2,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: apricots.maxProductTempC?.value ?? null,
  }
}

describe('collector heat removal factor (Duffie & Beckman 2013 ch. 6)', () => {
  it('equals the outlet temperature found by marching the air along the collector (inlet at ambient)', () => {
    // dT/dx = W·F′·[S − UL·(T − Ta)]/(ṁ·cp) integrated in 20 000 steps; FR = ṁcp(T_out − Ta)/(A·S).
    const width = 2
    const length = 4.5
    const ul = 8
    const fPrime = 0.7
    const s = 700
    for (const capacity of [20, 101, 400]) {
      let dT = 0
      const steps = 20_000
      const dx = length / steps
      for (let k = 0; k < steps; k++) dT += (width * fPrime * (s - ul * dT) * dx) / capacity
      const frMarched = (capacity * dT) / (width * length * s)
      expect(heatRemovalFactor(width * length, ul, fPrime, capacity)).toBeCloseTo(frMarched, 4)
    }
  })

  it('rises toward F′ with the flow and is 0 without flow', () => {
    expect(heatRemovalFactor(9, 8, 0.7, 1e7)).toBeCloseTo(0.7, 4)
    expect(heatRemovalFactor(9, 8, 0.7, 50)).toBeLessThan(heatRemovalFactor(9, 8, 0.7, 100))
    expect(heatRemovalFactor(9, 8, 0.7, 0)).toBe(0)
    expect(() => heatRemovalFactor(9, 8, 1.2, 10)).toThrow(/F'/)
  })
})

describe('solar tunnel', () => {
  const week = sliceSeries(demoSeries('dryUpland'), 24 * 190, 24 * 7)
  const direct = productResponse(apricots)

  it('warms the air by about 30–35 K in full sun with the defaults, and PV fans keep the rise at half sun', () => {
    const c = computeHourlyConditions(week, parseDryingMethod({ kind: 'tunnel' }), direct, options())
    let full = 0
    let half = 0
    for (let i = 0; i < week.hours; i++) {
      const g = week.ghiWm2[i]
      const rise = c.airC[i] - week.dryBulbC[i]
      if (g > 850 && g < 950) full = Math.max(full, rise)
      if (g > 300 && g < 500) half = Math.max(half, rise)
    }
    expect(full).toBeGreaterThan(25)
    expect(full).toBeLessThan(40)
    // the flow halves with the sun, so the rise falls far less than the sun (self-regulating)
    expect(half).toBeGreaterThan(0.6 * full)
  })

  it('runs PV fans in proportion to the sun, stops them under the threshold, and shuts or opens the tunnel', () => {
    const closed = computeHourlyConditions(week, parseDryingMethod({ kind: 'tunnel' }), direct, options())
    const open = computeHourlyConditions(
      week,
      parseDryingMethod({ kind: 'tunnel', nightPractice: 'open' }),
      direct,
      options(),
    )
    const constant = computeHourlyConditions(
      week,
      parseDryingMethod({ kind: 'tunnel', fans: 'constant' }),
      direct,
      options(),
    )
    let nights = 0
    for (let i = 0; i < week.hours; i++) {
      if (closed.night[i] !== 1) continue
      nights++
      expect(closed.mode[i]).toBe(HourMode.paused)
      expect(open.mode[i]).toBe(HourMode.active)
      expect(open.airCapDbPerH[i]).toBe(0) // no flow: nothing dries, rewetting still possible
      expect(constant.mode[i]).toBe(HourMode.active)
      expect(constant.airCapDbPerH[i]).toBeGreaterThanOrEqual(0)
    }
    expect(nights).toBeGreaterThan(50)
    // cap per unit deficit ∝ flow share: at half the full-flow irradiance, about half of the constant fans' cap
    for (let i = 0; i < week.hours; i++) {
      const g = week.ghiWm2[i]
      if (closed.night[i] === 1 || !(g > 100 && g < 700)) continue
      const share = closed.airCapDbPerH[i] / closed.deficitToSaturationGPerKg[i]
      const fullShare = constant.airCapDbPerH[i] / constant.deficitToSaturationGPerKg[i]
      if (!(Number.isFinite(share) && Number.isFinite(fullShare) && fullShare > 0)) continue
      // deficits differ (warmer air with less flow); the cap per g/kg of deficit is the flow itself
      expect(share / fullShare).toBeCloseTo(g / 800, 6)
    }
  })

  it('without a collector section (a plastic tunnel over the trays) the air is ambient and only the product is warmed', () => {
    const c = computeHourlyConditions(
      week,
      parseDryingMethod({ kind: 'tunnel', collectorLengthM: 0, fans: 'constant' }),
      direct,
      options(),
    )
    let sunny = 0
    for (let i = 0; i < week.hours; i++) {
      expect(c.airC[i]).toBe(week.dryBulbC[i])
      expect(c.solarKwhPerTonne[i]).toBe(0)
      if (week.ghiWm2[i] > 500) {
        sunny++
        expect(c.productC[i]).toBeGreaterThan(c.airC[i] + 5)
      }
    }
    expect(sunny).toBeGreaterThan(10)
  })

  it('sizes its air per tonne by the drying floor and the loading', () => {
    const m = parseDryingMethod({ kind: 'tunnel' })
    if (m.kind !== 'tunnel') throw new Error('kind')
    expect(tunnelTonnes(m, 10)).toBeCloseTo(0.16, 12) // 8 m × 2 m × 10 kg/m²
    expect(tunnel.airFlowKgPerSPerTonne(m, 10)).toBeCloseTo(0.1 / 0.16, 12)
    const given = parseDryingMethod({ kind: 'tunnel', loadingKgPerM2: 5 })
    const a = assess(week, {
      product: apricots,
      method: given,
      seasonStart: '07-10',
      seasonEnd: '07-10',
      maxDays: 3,
      deadlineDays: 2,
    })
    expect(a.product.loadingKgPerM2).toBe(5)
  })

  it('states a polyethylene cover that transmits about 0.87 of the sun at normal incidence', () => {
    const m = parseDryingMethod({ kind: 'tunnel' })
    if (m.kind !== 'tunnel') throw new Error('kind')
    const tau = coverTransmittance({ refractiveIndex: 1.51, extinctionThickness: 0.05 }, 0)
    expect(tau).toBeGreaterThan(0.85)
    expect(tau).toBeLessThan(0.89)
    expect(tunnel.assumptions(m).some((x) => x.value.includes(tau.toFixed(3)))).toBe(true)
  })

  it('beats open air on the same file (apricots, July and August starts, dry and humid demo sites)', () => {
    for (const key of ['dryUpland', 'humidValley'] as const) {
      const run = (kind: 'open-air' | 'tunnel') =>
        assess(demoSeries(key), {
          product: apricots,
          method: parseDryingMethod({ kind }),
          seasonStart: '07-01',
          seasonEnd: '08-31',
          startStepDays: 5,
        })
      const open = run('open-air')
      const tun = run('tunnel')
      const median = (a: typeof open) => {
        const d = a.startDates
          .map((s) => s.daysToTarget.median ?? Number.POSITIVE_INFINITY)
          .sort((x, y) => x - y)
        return d[Math.floor(d.length / 2)]
      }
      expect(median(tun), key).toBeLessThan(median(open))
      expect(tun.spoilage?.season.probability as number).toBeLessThanOrEqual(
        open.spoilage?.season.probability as number,
      )
    }
  })
})
