import { describe, expect, it } from 'vitest'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions, type HourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { type DryingMethodInput, parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { HourStatus } from '../../src/drying/usable-hour.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { DEMO, demoSeries, sliceSeries } from '../drying/demo-weather.ts'
import { copySeries } from '../drying/synthetic-weather.ts'

const raisin = productById('grapes-to-raisins')
const response = tabulatedResponse(productResponse(raisin))
const opts = {
  targetDb: moistureDbFromWbPct(18),
  initialWbPct: 78.2,
  loadingKgPerM2: 12,
  thresholds: parseDryingThresholds({}),
  maxProductTempC: null,
}

function conditions(s: HourlySeries, method: DryingMethodInput): HourlyConditions {
  return computeHourlyConditions(s, parseDryingMethod(method), response, opts)
}

/** Hours to target from every 4th day start at 08:00 UTC-ish index, +Infinity when not reached in 40 days. */
function times(c: HourlyConditions): number[] {
  const out: number[] = []
  for (let start = 8; start + 24 * 40 <= c.hours; start += 24 * 4) {
    const b = simulateBatch(c, response, {
      startIndex: start,
      maxHours: 24 * 40,
      initialDb: moistureDbFromWbPct(78.2),
      targetDb: moistureDbFromWbPct(18),
    })
    out.push(b.reached ? b.hoursToTarget : Number.POSITIVE_INFINITY)
  }
  return out
}

function altered(s: HourlySeries, f: (c: HourlySeries, i: number) => void): HourlySeries {
  const c = copySeries(s)
  for (let i = 0; i < c.hours; i++) f(c, i)
  return c
}

// Demo climates, June–September of their first year (invented sites, climate-demo/).
const sites = ['dryUpland', 'humidValley', 'coolCoast', 'tropical'] as const
const summer = (key: (typeof sites)[number]): HourlySeries => sliceSeries(demoSeries(key), 24 * 151, 24 * 120)

describe('metamorphic: a drier, warmer, windier or sunnier copy never dries slower', () => {
  for (const key of sites) {
    describe(`${key} (${DEMO[key].file})`, () => {
      const base = summer(key)
      const open = times(conditions(base, { kind: 'open-air' }))
      if (key === 'dryUpland' || key === 'tropical') {
        it('the base case finishes some batches (so the comparisons are not all ∞ ≤ ∞)', () => {
          expect(open.filter(Number.isFinite).length).toBeGreaterThan(3)
        })
      }
      it('drier: RH × 0.9 every hour (open air)', () => {
        const t = times(
          conditions(
            altered(base, (c, i) => (c.relativeHumidityPct[i] *= 0.9)),
            { kind: 'open-air' },
          ),
        )
        for (let k = 0; k < t.length; k++) expect(t[k]).toBeLessThanOrEqual(open[k])
      })
      it('warmer: +2 °C at the same RH (open air)', () => {
        const t = times(
          conditions(
            altered(base, (c, i) => (c.dryBulbC[i] += 2)),
            { kind: 'open-air' },
          ),
        )
        for (let k = 0; k < t.length; k++) expect(t[k]).toBeLessThanOrEqual(open[k])
      })
      it('sunnier: GHI × 1.2 (open air)', () => {
        const t = times(
          conditions(
            altered(base, (c, i) => (c.ghiWm2[i] *= 1.2)),
            { kind: 'open-air' },
          ),
        )
        for (let k = 0; k < t.length; k++) expect(t[k]).toBeLessThanOrEqual(open[k])
      })
      // Windier is tested under shade: in the sun, more wind also cools the product, which can slow the
      // falling-rate period (as Thompson 1981 found for swaths), so it is not a monotone change there. And only
      // in hours whose air is drier than the product ever is in a batch (RH below its equilibrium RH at the
      // target): in wetter air more wind also brings more vapour to a product below the air's equilibrium (the
      // vapour-uptake limit of drying/batch.ts), so it may rewet faster, as it physically does.
      it('windier: wind × 1.5 in hours drier than the product at its target (shade)', () => {
        const shade = times(conditions(base, { kind: 'shade' }))
        const t = times(
          conditions(
            altered(base, (c, i) => {
              if (c.relativeHumidityPct[i] < response.erhPct(c.dryBulbC[i], opts.targetDb)) c.windMs[i] *= 1.5
            }),
            { kind: 'shade' },
          ),
        )
        for (let k = 0; k < t.length; k++) expect(t[k]).toBeLessThanOrEqual(shade[k])
      })
    })
  }
})

describe('metamorphic: raising every hour’s RH never increases usable hours', () => {
  for (const key of sites) {
    it(`${key}: RH + 5 points (capped at 100) turns no unusable hour into a usable one`, () => {
      const base = demoSeries(key)
      const wetter = altered(
        base,
        (c, i) => (c.relativeHumidityPct[i] = Math.min(100, c.relativeHumidityPct[i] + 5)),
      )
      for (const method of [{ kind: 'open-air' }, { kind: 'shade' }] as const) {
        const a = conditions(base, method)
        const b = conditions(wetter, method)
        let usableA = 0
        let usableB = 0
        for (let i = 0; i < a.hours; i++) {
          if (a.status[i] === HourStatus.usable) usableA++
          if (b.status[i] === HourStatus.usable) {
            usableB++
            // one exception, physical: humid air sends more long-wave down (FAO-56 eq 39, net emissivity
            // 0.34 − 0.14·√ea), so a sunlit product sits a few hundredths of a kelvin warmer and may just
            // cross the 'too cold' threshold
            const edgeOfCold =
              a.status[i] === HourStatus.tooCold &&
              b.productC[i] - a.productC[i] > 0 &&
              b.productC[i] - a.productC[i] < 0.1 &&
              Math.abs(a.productC[i] - opts.thresholds.minProductTempC) < 0.1
            if (!edgeOfCold) expect(a.status[i]).toBe(HourStatus.usable)
          }
        }
        expect(usableB).toBeLessThan(usableA)
      }
    })
  }
})
