import { describe, expect, it } from 'vitest'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { saturationPressureFromTableKpa } from '../../src/physics/saturation-table.ts'
import { solveWetSurface, WetSurface } from '../../src/physics/wet-surface.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { constantSeries } from './synthetic-weather.ts'

function surface(airC: number, rhPct: number, windMs: number, q: number, area = 1, radiative = 0) {
  const s = new WetSurface()
  s.availableEnergyWm2 = q
  s.airC = airC
  s.vaporPressureKpa = (rhPct / 100) * saturationPressureFromTableKpa(airC, false)
  s.pressureKpa = 101.325
  s.windAt2mMs = windMs
  s.exchangeAreaRatio = area
  s.radiativeConductanceWm2K = radiative
  return s
}

describe('vapour conductance of the wet-surface balance', () => {
  it("for a flat wet sheet it is Penman's 1948 wind function 2.626 + 1.381·u2 mm d⁻¹ kPa⁻¹ (McMahon et al. 2013, HESS 17:1331, Supplement eq S4.11)", () => {
    for (const u of [0, 1, 2.5, 6]) {
      const s = surface(25, 50, u, 200)
      solveWetSurface(s)
      expect(s.vaporConductanceKgPerM2HKpa * 24).toBeCloseTo(2.626 + 1.381 * u, 9)
    }
  })
  it('with the exact saturation curve, evaporation = conductance × (es(Ts) − ea) for any exchange surface', () => {
    for (const [t, rh, u, q, a, r] of [
      [35, 25, 2, 500, Math.PI, 6.3],
      [20, 90, 0.5, -40, 2, 5.7],
      [10, 60, 4, 0, 1, 0],
    ]) {
      const s = surface(t, rh, u, q, a, r)
      s.exact = true
      solveWetSurface(s)
      const es = saturationPressureFromTableKpa(s.surfaceC, false)
      const expected = s.vaporConductanceKgPerM2HKpa * (es - s.vaporPressureKpa)
      expect(Math.abs(s.evaporationKgPerM2H - expected)).toBeLessThan(1e-6 * Math.max(1, Math.abs(expected)))
    }
  })
})

describe('an exposed product takes up no more water than the air delivers to its surface', () => {
  // dried figs (22 % wb) in shade in saturated-looking air (20 °C, 98 % RH): the first-order approach to the
  // adsorption equilibrium, whose GAB equilibrium (K = 1) grows without bound toward 100 % RH, would take up
  // water in proportion to that equilibrium
  const figs = productById('figs')
  const r = productResponse(figs)
  const series = constantSeries({ dryBulbC: 20, relativeHumidityPct: 98, hours: 48 })
  const c = computeHourlyConditions(series, parseDryingMethod({ kind: 'shade' }), r, {
    targetDb: moistureDbFromWbPct(15),
    initialWbPct: 22,
    loadingKgPerM2: 8,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: null,
  })
  const m0 = moistureDbFromWbPct(22)
  const b = simulateBatch(c, r, {
    startIndex: 0,
    maxHours: 48,
    initialDb: m0,
    targetDb: moistureDbFromWbPct(10),
    recordTrace: true,
  })
  const trace = b.trace as Float64Array
  it('every hour: uptake ≤ g·(ea − aw·es(T)) per kg dry matter, aw from the isotherm at the moisture before the hour', () => {
    let m = m0
    let bound = 0
    for (let h = 0; h < 48; h++) {
      const aw = r.erhPct(c.productC[h], m) / 100
      const limit = c.vaporUptakeAirDbPerH[h] - aw * c.vaporUptakeSurfaceDbPerH[h]
      const uptake = trace[h] - m
      expect(uptake).toBeGreaterThanOrEqual(0)
      expect(uptake).toBeLessThanOrEqual(limit + 1e-12)
      const firstOrder = c.emcAdsorptionDb[h] - (c.emcAdsorptionDb[h] - m) * c.rewetDecayPerHour[h]
      if (firstOrder - m > limit) bound++
      m = trace[h]
    }
    expect(bound).toBeGreaterThan(0) // the limit is what binds in this air
    expect(b.rewettingHours).toBe(48)
    expect(b.waterToAirDb).toBeCloseTo(-(m - m0), 12)
  })
  it('the limit is zero when the air is no wetter than the product surface (aw·es(T) ≥ ea): no uptake', () => {
    const dry = constantSeries({ dryBulbC: 20, relativeHumidityPct: 40, hours: 4 })
    const cd = computeHourlyConditions(dry, parseDryingMethod({ kind: 'shade' }), r, {
      targetDb: moistureDbFromWbPct(15),
      initialWbPct: 22,
      loadingKgPerM2: 8,
      thresholds: parseDryingThresholds({}),
      maxProductTempC: null,
    })
    const aw = r.erhPct(cd.productC[0], m0) / 100
    expect(cd.vaporUptakeAirDbPerH[0] - aw * cd.vaporUptakeSurfaceDbPerH[0]).toBeLessThan(0)
  })
})
