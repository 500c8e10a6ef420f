import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  collectorEfficiency,
  collectorOutletC,
  collectorUsefulGainWm2,
  SINGLE_GLAZED_AIR_HEATER,
  UNGLAZED_AIR_HEATER,
} from '../../src/physics/collector.ts'
import { moistAirHeatCapacityKjPerKgK } from '../../src/physics/moist-air.ts'

describe('Hottel–Whillier–Bliss collector (Duffie & Beckman 2013 ch. 6)', () => {
  // Reference-file recomputation: G = 800 W/m², ΔT = Tin − Ta = 10 K → η 0.6375 for (0.70, 5), 0.600 for (0.85, 20).
  it('η = 0.6375 for FR(τα) 0.70, FR·UL 5 at G 800, ΔT 10 K', () => {
    expect(collectorEfficiency({ interceptFrTauAlpha: 0.7, lossSlopeFrUlWm2K: 5 }, 800, 30, 20)).toBeCloseTo(
      0.6375,
      12,
    )
  })
  it('η = 0.600 for the unglazed defaults (0.85, 20) at the same point', () => {
    expect(collectorEfficiency(UNGLAZED_AIR_HEATER, 800, 30, 20)).toBeCloseTo(0.6, 12)
  })
  it('SRCC-rated liquid collector 0.775/5.103 (modelica-buildings data record) at G 1000, ΔT 20 K → 0.6729', () => {
    expect(
      collectorEfficiency({ interceptFrTauAlpha: 0.775, lossSlopeFrUlWm2K: 5.103 }, 1000, 40, 20),
    ).toBeCloseTo(0.67294, 12)
  })
  it('inlet at ambient: η = FR(τα); stagnation ΔT = FR(τα) G/(FR UL) gives 0, beyond it clamps at 0', () => {
    expect(collectorEfficiency(SINGLE_GLAZED_AIR_HEATER, 600, 25, 25)).toBeCloseTo(0.6, 12)
    const stagnation = (0.6 * 600) / 5
    expect(collectorUsefulGainWm2(SINGLE_GLAZED_AIR_HEATER, 600, 25 + stagnation, 25)).toBeCloseTo(0, 9)
    expect(collectorUsefulGainWm2(SINGLE_GLAZED_AIR_HEATER, 600, 25 + stagnation + 5, 25)).toBe(0)
    expect(collectorEfficiency(SINGLE_GLAZED_AIR_HEATER, 0, 25, 25)).toBe(0)
  })
  it('outlet temperature: 2 m² at 360 W/m², 0.05 kg/s dry air, W 0.01 → ΔT = 720/(0.05·1024.6) = 14.05 K', () => {
    // cp = 1.006 + 1.86 × 0.01 = 1.0246 kJ/kg/K (ASHRAE HOF 2017 ch. 1 eq 30 derivative).
    expect(moistAirHeatCapacityKjPerKgK(0.01)).toBeCloseTo(1.0246, 12)
    expect(collectorOutletC(25, 360, 2, 0.05, 0.01)).toBeCloseTo(39.0543, 4) // 25 + 720/51.23 by hand
  })
  it('gain is never negative and never above FR(τα)·G (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1200, noNaN: true }),
        fc.double({ min: -20, max: 80, noNaN: true }),
        fc.double({ min: -20, max: 50, noNaN: true }),
        (g, tin, ta) => {
          const q = collectorUsefulGainWm2(SINGLE_GLAZED_AIR_HEATER, g, tin, ta)
          return q >= 0 && q <= 0.6 * g + 5 * Math.max(0, ta - tin) + 1e-9
        },
      ),
    )
  })
  it('RangeErrors name the input', () => {
    expect(() =>
      collectorUsefulGainWm2({ interceptFrTauAlpha: 1.2, lossSlopeFrUlWm2K: 5 }, 500, 20, 20),
    ).toThrow(/intercept.*1.2/)
    expect(() =>
      collectorUsefulGainWm2({ interceptFrTauAlpha: 0.6, lossSlopeFrUlWm2K: -1 }, 500, 20, 20),
    ).toThrow(/loss slope/)
    expect(() => collectorUsefulGainWm2(SINGLE_GLAZED_AIR_HEATER, -5, 20, 20)).toThrow(/irradiance/)
    expect(() => collectorOutletC(20, 100, 2, 0, 0.01)).toThrow(/mass flow/)
    expect(() => collectorOutletC(20, 100, 0, 0.1, 0.01)).toThrow(/area/)
    expect(() => collectorOutletC(20, 400, 2, 0.05, -0.1)).toThrow(/humidity ratio/)
  })
})
