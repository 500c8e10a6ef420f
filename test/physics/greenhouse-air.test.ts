/**
 * The air inside a naturally ventilated cover (src/physics/greenhouse-air.ts) against the published relations and
 * measured coefficients it is built from.
 */
import { describe, expect, it } from 'vitest'
import {
  airChangeVentilationM3PerS,
  coverHeatLossCoefficientWm2K,
  enclosureAirRiseK,
  MIHARA_HAYASHI_1979,
  openingsInSeriesAreaM2,
  STANDARD_GRAVITY_M_PER_S2,
  stackVentilationM3PerS,
  ventilatedHumidityRatio,
} from '../../src/physics/greenhouse-air.ts'

describe('cover heat loss', () => {
  it("reproduces Mihara & Hayashi's measured regressions (J. Agric. Meteorol. 35(1):13–19, 1979, abstract)", () => {
    // "Glasshouse k = 4.41 + 0.40w, PVC house k = 4.87 + 0.54w" (W m⁻² K⁻¹, w the wind speed in m/s)
    expect(coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.pvcFilm, 0)).toBeCloseTo(4.87, 10)
    expect(coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.pvcFilm, 2)).toBeCloseTo(4.87 + 1.08, 10)
    expect(coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.glass, 3)).toBeCloseTo(4.41 + 1.2, 10)
    // the film house loses more than the glasshouse at every wind speed, as measured
    for (const w of [0, 1, 5, 10]) {
      expect(coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.pvcFilm, w)).toBeGreaterThan(
        coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.glass, w),
      )
    }
    expect(() => coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.glass, -1)).toThrow(RangeError)
  })

  it("a closed house's inside–outside difference is its heat input over k·A, as k was measured (Mihara & Hayashi 1979)", () => {
    // their k is the heat put into a closed house per m² of cover and kelvin: 5.41 kW into a PVC house of 100 m²
    // in 1 m/s of wind (k = 5.41 W m⁻² K⁻¹) holds it 10 K above the outside
    const k = coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.pvcFilm, 1)
    const rise = enclosureAirRiseK({
      netHeatW: k * 100 * 10,
      coverLossWK: k * 100,
      fixedAirKgPerS: 0,
      stackAirKgPerSPerRootK: 0,
      cpJPerKgK: 1006,
    })
    expect(rise).toBeCloseTo(10, 6)
  })
})

describe('ventilation', () => {
  it("two equal openings: the stack flow is ASHRAE's Q = C_D·A·√(2g·ΔH_NPL·ΔT/T_i) with the neutral plane half-way", () => {
    // ASHRAE Handbook of Fundamentals 1997 ch. 25 eq 37 (as quoted in a question-and-answer page; transcribed):
    // 1 m² low and 1 m² high, 2 m apart (ΔH_NPL = 1 m), 35 °C inside, 25 °C outside, C_D 0.65
    const ashrae = 0.65 * 1 * Math.sqrt((2 * 9.80665 * 1 * 10) / (35 + 273.15))
    expect(ashrae).toBeCloseTo(0.5186, 3)
    const ours = stackVentilationM3PerS(0.65, openingsInSeriesAreaM2(1, 1), 2, 10, 25)
    // the two differ only in dividing by the mean rather than the inside absolute temperature (0.8 % here)
    expect(ours / ashrae).toBeGreaterThan(1)
    expect(ours / ashrae).toBeLessThan(1.02)
  })

  it('the effective area of openings in series is that of one when the other is large, and zero when one is shut', () => {
    expect(openingsInSeriesAreaM2(1, 1e6)).toBeCloseTo(1, 6)
    expect(openingsInSeriesAreaM2(0, 3)).toBe(0)
    expect(openingsInSeriesAreaM2(2, 2)).toBeCloseTo(Math.SQRT2, 12)
  })

  it('buoyancy flow grows with the square root of the temperature difference and of the height (Bernoulli)', () => {
    const a = openingsInSeriesAreaM2(0.5, 0.5)
    const q1 = stackVentilationM3PerS(0.65, a, 1, 4, 20)
    expect(stackVentilationM3PerS(0.65, a, 4, 4, 20) / q1).toBeCloseTo(2, 10)
    expect(stackVentilationM3PerS(0.65, a, 1, 16, 20) / q1).toBeCloseTo(2 * Math.sqrt(295.15 / 301.15), 10)
    expect(stackVentilationM3PerS(0.65, a, 1, 0, 20)).toBe(0)
    expect(STANDARD_GRAVITY_M_PER_S2).toBe(9.80665)
  })

  it('air changes: N volumes an hour', () => {
    expect(airChangeVentilationM3PerS(36, 100)).toBeCloseTo(1, 12)
    expect(() => airChangeVentilationM3PerS(1, 0)).toThrow(RangeError)
  })
})

describe('the balances', () => {
  it('water: the ventilation air leaves with the water evaporated into it (mass balance)', () => {
    // 0.2 kg/s of dry air carrying 2 g/s of evaporated water leaves 10 g/kg wetter
    expect(ventilatedHumidityRatio(0.008, 0.002, 0.2)).toBeCloseTo(0.018, 12)
    expect(ventilatedHumidityRatio(0.008, 0, 0)).toBe(0.008)
    expect(() => ventilatedHumidityRatio(0.008, 0.001, 0)).toThrow(RangeError)
  })

  it('heat: the rise found balances sun, cover loss and stack ventilation, and falls with larger openings', () => {
    const stack = (area: number) =>
      stackVentilationM3PerS(0.65, openingsInSeriesAreaM2(area, area), 1, 1, 30) * 1.15
    const balance = (area: number) => ({
      netHeatW: 8000,
      coverLossWK: 5.4 * 28,
      fixedAirKgPerS: 0,
      stackAirKgPerSPerRootK: stack(area),
      cpJPerKgK: 1015,
    })
    const small = enclosureAirRiseK(balance(0.25))
    const large = enclosureAirRiseK(balance(2.4))
    for (const [area, rise] of [
      [0.25, small],
      [2.4, large],
    ]) {
      const flow = stack(area) * Math.sqrt(rise)
      expect((5.4 * 28 + flow * 1015) * rise).toBeCloseTo(8000, 3)
    }
    expect(small).toBeGreaterThan(large)
    // evaporation that takes more than the sun cools the air below the outside (the stack then reverses)
    expect(enclosureAirRiseK({ ...balance(1), netHeatW: -500 })).toBeLessThan(0)
    expect(enclosureAirRiseK({ ...balance(1), netHeatW: 0 })).toBe(0)
  })
})
