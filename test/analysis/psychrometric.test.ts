/**
 * The psychrometric block of an assessment (analysis/psychrometric.ts): its curves against psychrolib
 * (ASHRAE HOF 2017 ch. 1 in code form), the drying region at the product's equilibrium RH, and the binning
 * against a plain reference (sort and count) on a demo year.
 */
import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import {
  dryingRegionBoundary,
  humidityRatioAtRhGPerKg,
  psychroDensity,
  psychrometricSummary,
} from '../../src/analysis/psychrometric.ts'
import { humidityRatioFromVaporPressure } from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { productById } from '../../src/product/catalogue.ts'
import { equilibriumRelativeHumidityPct } from '../../src/product/equilibrium.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { demoSeries } from '../drying/demo-weather.ts'

psychrolib.SetUnitSystem(psychrolib.SI)

/** The binning written plainly: every hour's cell counted in a Map, the ranges from fully sorted arrays. */
function plainDensity(series: HourlySeries) {
  const counts = new Map<string, number>()
  const temps: number[] = []
  const ws: number[] = []
  const pressures: number[] = []
  for (let i = 0; i < series.hours; i++) {
    const t = series.dryBulbC[i]
    const rh = series.relativeHumidityPct[i]
    const p = series.pressureKpa[i]
    if (!(Number.isFinite(t) && Number.isFinite(rh) && Number.isFinite(p))) continue
    const pw = (rh / 100) * saturationVaporPressureLiquidKpa(t)
    const w = 1000 * humidityRatioFromVaporPressure(pw, p)
    const key = `${Math.floor(t / 2) * 2}|${Math.floor(w)}`
    counts.set(key, (counts.get(key) ?? 0) + 1)
    temps.push(t)
    ws.push(w)
    if (pressures.length < 20_000 || i % 7 === 0) pressures.push(p)
  }
  const at = (a: number[], f: number) =>
    [...a].sort((x, y) => x - y)[Math.min(a.length - 1, Math.floor(f * a.length))]
  return {
    counts,
    lowT: at(temps, 0.001),
    highT: at(temps, 0.999),
    highW: at(ws, 0.999),
    pressure: at(pressures, 0.5),
  }
}

describe('binning of the hours', () => {
  it('equals a plain Map-and-sort binning of the same hours (dry upland 2021–2024)', () => {
    const series = demoSeries('dryUpland')
    const d = psychroDensity(series)
    const plain = plainDensity(series)
    expect(d.hoursCounted).toBe(series.hours)
    expect(d.pressureKpa).toBe(plain.pressure)
    expect(d.dryBulbRangeC).toEqual([
      Math.floor(Math.min(plain.lowT, 0) / 5) * 5,
      Math.ceil(Math.max(plain.highT, 30) / 5) * 5,
    ])
    expect(d.humidityRatioMaxGPerKg).toBe(Math.ceil(Math.max(plain.highW * 1.15, 12) / 2) * 2)
    for (const c of d.cells) expect(c.hours).toBe(plain.counts.get(`${c.dryBulbC}|${c.humidityRatioGPerKg}`))
    const inRange = [...plain.counts.keys()].filter((k) => {
      const t = Number(k.split('|')[0])
      return t >= d.dryBulbRangeC[0] - 2 && t <= d.dryBulbRangeC[1]
    })
    expect(d.cells).toHaveLength(inRange.length)
  })
  it('the share of hours in the drying region lies in [0, 1] and the RH curves end above the axis or at its right edge', () => {
    const s = psychrometricSummary(demoSeries('dryUpland'), productById('grapes-to-raisins'), 18)
    expect(s.shareOfHoursInRegion).toBeGreaterThan(0)
    expect(s.shareOfHoursInRegion).toBeLessThan(1)
    for (const c of s.rhCurves) {
      const last = c.humidityRatioGPerKg[c.humidityRatioGPerKg.length - 1]
      expect(
        last > s.humidityRatioMaxGPerKg || c.humidityRatioGPerKg.length === s.rhCurveDryBulbC.length,
      ).toBe(true)
    }
  })
})

describe('psychrometric chart curves against psychrolib 1.1 (ASHRAE HOF 2017 ch. 1)', () => {
  it('saturation and RH curves give the same humidity ratio as psychrolib within 0.1 %', () => {
    for (const [t, rh, pKpa] of [
      [20, 100, 101.325],
      [30, 40, 89.9],
      [5, 70, 101.325],
      [45, 10, 95],
    ]) {
      const ours = humidityRatioAtRhGPerKg(t, rh, pKpa)
      const ref = 1000 * psychrolib.GetHumRatioFromRelHum(t, rh / 100, pKpa * 1000)
      expect(Math.abs(ours / ref - 1), `${t} °C ${rh} %`).toBeLessThan(1e-3)
    }
  })

  it("draws the drying region's edge at the product's equilibrium RH at target (shelled corn, 15.5 % wb)", () => {
    const corn = productById('shelled-corn')
    const edge = dryingRegionBoundary(corn, 15.5, 101.325, [0, 40])
    const at25 = edge.find((p) => p.dryBulbC === 25)
    const erh = equilibriumRelativeHumidityPct(corn, 25, moistureDbFromWbPct(15.5))
    const ref = 1000 * psychrolib.GetHumRatioFromRelHum(25, erh / 100, 101325)
    expect(at25?.humidityRatioGPerKg).toBeCloseTo(ref, 2)
    // Natural-air grain drying guidance: corn near 15–16 % wb is in equilibrium with air of roughly 70–80 % RH
    // at 25 °C (ASABE D245.6 modified Henderson/Chung–Pfost for corn; from memory).
    expect(erh).toBeGreaterThan(65)
    expect(erh).toBeLessThan(85)
    // Warmer air holds more water at the same RH: the edge rises with dry bulb.
    for (let i = 1; i < edge.length; i++)
      expect(edge[i].humidityRatioGPerKg).toBeGreaterThan(edge[i - 1].humidityRatioGPerKg)
  })

  it("stops the region at the product's temperature limit", () => {
    const raisins = productById('grapes-to-raisins')
    const limit = raisins.maxProductTempC?.value as number
    const edge = dryingRegionBoundary(raisins, 18, 101.325, [0, 90])
    expect(edge[edge.length - 1].dryBulbC).toBeLessThanOrEqual(limit)
  })
})
