/**
 * The two-root band of the psychrometer balance near 0 °C (ASHRAE HOF 2017 ch. 1 eq 33 for t* ≥ 0,
 * eq 35 for t* < 0): eq 35 just below 0 °C gives a higher W than eq 33 at 0 °C, so a band of W has one
 * root on each side. Width at 5 °C, 101.325 kPa: RH 32.7–37.0 % (reference file
 * the project's psychrometrics reference notes (psychrometrics.md) §5, computed with psychrolib). wetBulbWithDewPointC
 * documents the choice: the liquid-wick root, whatever the start value.
 */
import { describe, expect, it } from 'vitest'
import { fillAirStateColumns } from '../../src/physics/air-columns.ts'
import { airState } from '../../src/physics/air-state.ts'
import {
  dewPointFromVaporPressureC,
  frostPointFromVaporPressureC,
  humidityRatioFromWetBulb,
  vaporPressureFromHumidityRatio,
} from '../../src/physics/moist-air.ts'
import { wetBulbFromHumidityRatioC, wetBulbWithDewPointC } from '../../src/physics/wet-bulb.ts'

const T = 5
const P = 101.325
const wLiquidAtZero = humidityRatioFromWetBulb(T, 0, P) // eq 33 at t* = 0
const wIceAtZero = humidityRatioFromWetBulb(T, -1e-9, P) // eq 35 at t* = 0⁻

describe('two-root band at 5 °C, 101.325 kPa', () => {
  it('exists: eq 35 at 0⁻ gives a higher W than eq 33 at 0', () =>
    expect(wIceAtZero).toBeGreaterThan(wLiquidAtZero))
  it('spans RH 32.7–37.0 % (reference file §5, ±0.2 points)', () => {
    const lo = airState({ dryBulbC: T, humidityRatioGPerKg: wLiquidAtZero * 1000, pressureKpa: P })
    const hi = airState({ dryBulbC: T, humidityRatioGPerKg: wIceAtZero * 1000, pressureKpa: P })
    expect(Math.abs(lo.relativeHumidityPct - 32.7)).toBeLessThan(0.2)
    expect(Math.abs(hi.relativeHumidityPct - 37.0)).toBeLessThan(0.2)
  })
  const inside = [0.1, 0.3, 0.5, 0.7, 0.9].map((f) => wLiquidAtZero + f * (wIceAtZero - wLiquidAtZero))
  for (const w of inside) {
    it(`W = ${(w * 1000).toFixed(4)} g/kg: both roots exist and the liquid-wick one (≥ 0 °C) is returned`, () => {
      // The ice root, by bisection of eq 35 on [−2, 0⁻].
      let lo = -2
      let hi = -1e-9
      for (let k = 0; k < 100; k++) {
        const m = 0.5 * (lo + hi)
        if (humidityRatioFromWetBulb(T, m, P) > w) hi = m
        else lo = m
      }
      expect(hi).toBeLessThan(0)
      expect(Math.abs(humidityRatioFromWetBulb(T, hi, P) / w - 1)).toBeLessThan(1e-9)
      const twb = wetBulbFromHumidityRatioC(T, w, P)
      expect(twb).toBeGreaterThanOrEqual(0)
      expect(twb).toBeLessThan(0.5)
      expect(Math.abs(humidityRatioFromWetBulb(T, twb, P) / w - 1)).toBeLessThan(1e-7)
    })
  }
  it('is deterministic: the same root from any valid lower bound, repeated calls, airState and columns', () => {
    for (const w of inside) {
      const pw = vaporPressureFromHumidityRatio(w, P)
      const ref = wetBulbFromHumidityRatioC(T, w, P)
      const starts = [dewPointFromVaporPressureC(pw), frostPointFromVaporPressureC(pw), -10, -40]
      for (const dew of starts) expect(Math.abs(wetBulbWithDewPointC(T, w, P, dew) - ref)).toBeLessThan(1e-7)
      expect(wetBulbFromHumidityRatioC(T, w, P)).toBe(ref)
      const s = airState({ dryBulbC: T, humidityRatioGPerKg: w * 1000, pressureKpa: P })
      expect(Math.abs(s.wetBulbC - ref)).toBeLessThan(1e-7)
      const out = { wetBulbC: new Float64Array(1) }
      fillAirStateColumns(
        {
          dryBulbC: Float64Array.of(T),
          relativeHumidityPct: Float64Array.of(s.relativeHumidityPct),
          pressureKpa: Float64Array.of(P),
        },
        out,
      )
      expect(Math.abs(out.wetBulbC[0] - ref)).toBeLessThan(1e-7)
    }
  })
  it('just below the band only the ice root exists and is returned', () => {
    const w = wLiquidAtZero * 0.99
    const twb = wetBulbFromHumidityRatioC(T, w, P)
    expect(twb).toBeLessThan(0)
    expect(Math.abs(humidityRatioFromWetBulb(T, twb, P) / w - 1)).toBeLessThan(1e-7)
  })
})
