import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  aerodynamicResistanceFlatPlateSPerM,
  aerodynamicResistanceFromPenmanWindSPerM,
  aerodynamicResistanceFromWindFunctionSPerM,
  aerodynamicResistanceGrassSPerM,
  evaporationKgPerM2HFromLatentFlux,
  latentHeatVaporizationMjPerKg,
  penmanMonteithLatentFlux,
  psychrometricConstantKpaPerC,
  saturationSlopeLiquidKpaPerC,
  windFunctionPenman1948MmPerDayKpa,
  windFunctionPenman1956MmPerDayKpa,
  windSpeedAt2mMs,
  windSpeedAtHeightLogProfileMs,
} from '../../src/physics/evaporation.ts'
import {
  psychrometricConstantFao56KpaPerC,
  saturationSlopeFao56KpaPerC,
} from '../../src/physics/fao56-reference-et.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { wetSurfaceEvaporationKgPerM2H, wetSurfaceLatentFluxWm2 } from '../../src/physics/wet-surface.ts'

// The FAO-56 worked examples themselves are in test/fixtures/truth/fao56-examples.json (test/truth/).
describe('FAO-56 forms', () => {
  it('log profile with grass d = 0.08 m, z0 = 0.01476 m (FAO-56 eq 4 with h = 0.12 m) reproduces eq 47 within 0.2 %', () => {
    for (const z of [3, 6, 10, 20]) {
      const u2 = windSpeedAtHeightLogProfileMs(5, z, 2, 0.01476, 0.08)
      expect(Math.abs(u2 / windSpeedAt2mMs(5, z) - 1)).toBeLessThan(0.002)
    }
    expect(() => windSpeedAtHeightLogProfileMs(5, 10, 0.05, 0.1)).toThrow(/target height/)
  })
  it('eq 8 general form with cp 1.013e-3, ε 0.622, λ 2.45 equals 0.665e-3 P to 0.1 %', () => {
    expect(psychrometricConstantKpaPerC(100, 2.45) / psychrometricConstantFao56KpaPerC(100)).toBeCloseTo(1, 3)
  })
  it('grass reference ra = 208/u2 (FAO-56 Box 4): 2 m/s → 104 s/m; calm → ∞', () => {
    expect(aerodynamicResistanceGrassSPerM(2)).toBe(104)
    expect(aerodynamicResistanceGrassSPerM(0)).toBe(Number.POSITIVE_INFINITY)
  })
})

describe('latent heat and saturation slope', () => {
  it('λ = 2.501 − 2.361e-3 T (FAO-56 Annex 3 eq 3-1): 20 °C → 2.454, 0 °C → 2.501 MJ/kg', () => {
    expect(latentHeatVaporizationMjPerKg(20)).toBeCloseTo(2.454, 3)
    expect(latentHeatVaporizationMjPerKg(0)).toBe(2.501)
  })
  it('Hyland–Wexler slope matches its own finite difference and FAO-56 eq 13 within 0.5 % (0–45 °C)', () => {
    for (let t = 0; t <= 45; t += 5) {
      const fd =
        (saturationVaporPressureLiquidKpa(t + 1e-4) - saturationVaporPressureLiquidKpa(t - 1e-4)) / 2e-4
      expect(saturationSlopeLiquidKpaPerC(t) / fd).toBeCloseTo(1, 7)
      expect(Math.abs(saturationSlopeLiquidKpaPerC(t) / saturationSlopeFao56KpaPerC(t) - 1)).toBeLessThan(
        0.005,
      )
    }
  })
})

// Penman open-water check, FAO-56 Example 18 weather (Brussels, 6 July) with open-water albedo 0.08:
// Δ 0.1221, γ 0.06658, es − ea 0.5889 kPa, Rn 16.594 MJ m⁻² d⁻¹, u2 2.078 m/s, T 16.9 °C. Expected values
// are the reference file's recomputation with McMahon et al. (2013) Supplement S4.3/S4.11 wind functions:
// f(u) 5.495 / 4.182 mm d⁻¹ kPa⁻¹, E 5.525 / 5.252 mm/d, equivalent ra 116.3 / 152.9 s/m.
describe('Penman wet-surface evaporation, Example 18 weather, open water', () => {
  const u2 = 2.078
  const delta = 0.1221
  const gamma = 0.06658
  const deficit = 0.5889
  const rnWm2 = (16.594e6 / 86400) as number
  const pressure = 100.12
  const rhoA = pressure / (1.01 * (16.9 + 273) * 0.287) // FAO-56 Annex 3
  const cases: [string, number, number, number, number][] = [
    ['Penman 1948', windFunctionPenman1948MmPerDayKpa(u2), 5.495, 5.525, 116.3],
    ['Penman 1956', windFunctionPenman1956MmPerDayKpa(u2), 4.182, 5.252, 152.9],
  ]
  for (const [name, f, fExpected, eExpected, raExpected] of cases) {
    it(`${name}: f(u) ${fExpected}, ra ${raExpected} s/m, E ${eExpected} mm/d`, () => {
      expect(f).toBeCloseTo(fExpected, 2)
      const ra = aerodynamicResistanceFromPenmanWindSPerM(f, 16.9)
      expect(Math.abs(ra - raExpected)).toBeLessThan(0.15)
      expect(aerodynamicResistanceFromWindFunctionSPerM(f, rhoA, 1.013, gamma, 2.45)).toBeCloseTo(ra, 0)
      const latentWm2 = penmanMonteithLatentFlux(delta, gamma, rnWm2, rhoA * 1013, deficit, ra)
      expect((latentWm2 * 86400) / 2.45e6).toBeCloseTo(eExpected, 2)
    })
  }
})

describe('FAO-56 eq 3 in resistance form reproduces Example 19 (14:00–15:00, 0.63 mm/h)', () => {
  it('rs = 70 s/m, ra = 208/u2, FAO constants → 0.63 mm/h within 0.01', () => {
    // Published intermediates (Example 19): Δ 0.358, γ 0.0673, es − ea 3.180, Rn 1.749, G 0.175 MJ m⁻² h⁻¹.
    const rhoA = 101.21 / (1.01 * (38 + 273) * 0.287)
    const ra = aerodynamicResistanceGrassSPerM(3.3)
    const availableWm2 = ((1.749 - 0.175) * 1e6) / 3600
    const latent = penmanMonteithLatentFlux(0.358, 0.0673, availableWm2, rhoA * 1013, 3.18, ra, 70)
    expect(Math.abs((latent * 3600) / 2.45e6 - 0.63)).toBeLessThan(0.01)
  })
})

describe('wet-surface evaporation with Hyland–Wexler properties', () => {
  it('30 °C, 40 % RH, 101.325 kPa, Rn 500 W/m², Penman 1948 at 2 m/s: equals the composed equation', () => {
    const ea = 0.4 * saturationVaporPressureLiquidKpa(30)
    const ra = aerodynamicResistanceFromPenmanWindSPerM(windFunctionPenman1948MmPerDayKpa(2), 30)
    const flux = wetSurfaceLatentFluxWm2(500, 0, 30, ea, 101.325, ra)
    // Penman form with the same Δ, γ (cp of air 1.006+1.86W per kg moist air, λ(T)) computed by hand here:
    const lambda = latentHeatVaporizationMjPerKg(30)
    const delta = saturationSlopeLiquidKpaPerC(30)
    expect(flux).toBeGreaterThan((delta / (delta + 0.0665)) * 500) // aerodynamic term adds to radiation term
    expect(evaporationKgPerM2HFromLatentFlux(flux, 30)).toBeCloseTo((flux * 3600) / (lambda * 1e6), 12)
    expect(wetSurfaceEvaporationKgPerM2H(500, 0, 30, ea, 101.325, ra)).toBeCloseTo(
      (flux * 3600) / (lambda * 1e6),
      12,
    )
    // Order of magnitude, common practice, no source: a sunny wet surface evaporates ~0.5–1.5 mm/h.
    const e = evaporationKgPerM2HFromLatentFlux(flux, 30)
    expect(e).toBeGreaterThan(0.5)
    expect(e).toBeLessThan(1.5)
  })
  it('saturated air and no radiation: no evaporation; dew when Rn < 0 in saturated air', () => {
    const es = saturationVaporPressureLiquidKpa(15)
    expect(wetSurfaceLatentFluxWm2(0, 0, 15, es, 101.325, 100)).toBeCloseTo(0, 9)
    expect(wetSurfaceLatentFluxWm2(-60, 0, 15, es, 101.325, 100)).toBeLessThan(0)
  })
  it('flat-plate resistance: hc = 2.8 + 3u → ra = ρcp/hc, 1.2·1006/8.8 at 2 m/s', () => {
    expect(aerodynamicResistanceFlatPlateSPerM(2, 1.2, 1.006)).toBeCloseTo((1.2 * 1006) / 8.8, 9)
  })
  const state = fc.record({
    t: fc.double({ min: 0, max: 45, noNaN: true }),
    rhFraction: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
    rn: fc.double({ min: -100, max: 900, noNaN: true }),
    p: fc.double({ min: 70, max: 105, noNaN: true }),
  })
  it('evaporation increases with wind when the air is not saturated (property)', () => {
    fc.assert(
      fc.property(
        state,
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0.1, max: 5, noNaN: true }),
        (s, u, du) => {
          const ea = s.rhFraction * saturationVaporPressureLiquidKpa(s.t)
          const ra1 = aerodynamicResistanceFromPenmanWindSPerM(windFunctionPenman1948MmPerDayKpa(u), s.t)
          const ra2 = aerodynamicResistanceFromPenmanWindSPerM(windFunctionPenman1948MmPerDayKpa(u + du), s.t)
          return (
            wetSurfaceLatentFluxWm2(s.rn, 0, s.t, ea, s.p, ra2) >
            wetSurfaceLatentFluxWm2(s.rn, 0, s.t, ea, s.p, ra1)
          )
        },
      ),
    )
  })
  it('evaporation increases with the vapour-pressure deficit (property)', () => {
    fc.assert(
      fc.property(state, fc.double({ min: 0.01, max: 0.5, noNaN: true }), (s, drop) => {
        const es = saturationVaporPressureLiquidKpa(s.t)
        const ra = aerodynamicResistanceFromPenmanWindSPerM(windFunctionPenman1948MmPerDayKpa(2), s.t)
        const moist = wetSurfaceLatentFluxWm2(s.rn, 0, s.t, s.rhFraction * es, s.p, ra)
        const dry = wetSurfaceLatentFluxWm2(s.rn, 0, s.t, Math.max(0, s.rhFraction - drop) * es, s.p, ra)
        return dry > moist && Number.isFinite(dry)
      }),
    )
  })
  it('RangeErrors name the input', () => {
    expect(() => wetSurfaceLatentFluxWm2(0, 0, 20, 5, 101.325, 100)).toThrow(/vapour pressure.*5/)
    expect(() => wetSurfaceLatentFluxWm2(0, 0, 20, 1, 1013, 100)).toThrow(/pressure/)
    expect(() => penmanMonteithLatentFlux(0.1, 0.066, 100, 1200, 1, 0)).toThrow(/aerodynamic resistance/)
    expect(() => penmanMonteithLatentFlux(0.1, 0.066, 100, 1200, 1, 50, -1)).toThrow(/surface resistance/)
    expect(() => windSpeedAt2mMs(-1, 10)).toThrow(/wind speed/)
    expect(() => windSpeedAt2mMs(3, 0.1)).toThrow(/wind height/)
    expect(() => latentHeatVaporizationMjPerKg(150)).toThrow(/temperature/)
    expect(() => aerodynamicResistanceFromPenmanWindSPerM(0, 20)).toThrow(/wind function/)
    expect(() => aerodynamicResistanceGrassSPerM(Number.NaN)).toThrow(/wind speed at 2 m/)
  })
})
