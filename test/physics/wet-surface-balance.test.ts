import { describe, expect, it } from 'vitest'
import { radiativeHeatTransferCoefficientWm2K } from '../../src/physics/evaporation.ts'
import { humidityRatioFromVaporPressure } from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { wetBulbFromHumidityRatioC } from '../../src/physics/wet-bulb.ts'
import { solveWetSurface, WetSurface } from '../../src/physics/wet-surface.ts'

const P = 101.325

function surface(
  airC: number,
  rhPct: number,
  availableEnergyWm2: number,
  windMs: number,
  area = 1,
  radiative = 0,
  exact = false,
): WetSurface {
  const s = new WetSurface()
  s.exact = exact
  s.airC = airC
  s.vaporPressureKpa = (rhPct / 100) * saturationVaporPressureLiquidKpa(airC)
  s.pressureKpa = P
  s.windAt2mMs = windMs
  s.availableEnergyWm2 = availableEnergyWm2
  s.exchangeAreaRatio = area
  s.radiativeConductanceWm2K = radiative
  solveWetSurface(s)
  return s
}

describe('wet-surface balance: the surface temperature of the Penman form', () => {
  // With no energy input and no radiative term the wet surface sits at the psychrometric wet bulb: checked
  // against the thermodynamic wet bulb of ASHRAE HOF 2017 ch. 1 eq 33 (physics/wet-bulb.ts). Solved with the
  // saturation curve itself (exact) it is within 0.25 K (the rest: cp of moist air and γ of FAO-56 eq 8 against
  // eq 33's enthalpies); Penman's linearisation, Ta − (es − ea)/(Δ + γ) with Δ at the air temperature, is
  // warmer: the tangent at Ta lies under the convex es(T), so it sees too little vapour pressure at the surface
  // (and too little evaporation), more so the larger the depression.
  for (const [t, rh, linearGapK] of [
    [20, 60, 0.5],
    [30, 40, 1.8],
    [35, 25, 3.8],
    [10, 80, 0.1],
  ] as const) {
    it(`${t} °C, ${rh} % RH, Q = 0: at the wet bulb (exact); Penman's linear form up to ${linearGapK} K warmer`, () => {
      const exact = surface(t, rh, 0, 2, 1, 0, true)
      const w = humidityRatioFromVaporPressure(exact.vaporPressureKpa, P)
      const twb = wetBulbFromHumidityRatioC(t, w, P)
      expect(Math.abs(exact.surfaceC - twb)).toBeLessThan(0.25)
      const linear = surface(t, rh, 0, 2)
      expect(linear.surfaceC).toBeGreaterThanOrEqual(exact.surfaceC - 1e-9)
      expect(linear.surfaceC - exact.surfaceC).toBeLessThan(linearGapK)
    })
  }
  it('the balance closes: Q = (H + R)·(Ts − Ta) + λE, for a flat sheet and for a layer of berries', () => {
    for (const [area, r] of [
      [1, 0],
      [Math.PI, radiativeHeatTransferCoefficientWm2K(0.95, 30)],
      [2, 6],
    ] as const) {
      for (const exact of [false, true]) {
        const s = surface(30, 35, 500, 2, area, r, exact)
        const q = s.heatConductanceWm2K * (s.surfaceC - 30) + s.latentFluxWm2
        expect(Math.abs(q - 500)).toBeLessThan(1e-9)
      }
    }
  })
  it('exact: the latent flux is (H/γ)·(es(Ts) − ea) with the saturation pressure at the surface itself', () => {
    const s = surface(33, 28, 550, 1.8, Math.PI, 6.3, true)
    const h = s.heatConductanceWm2K - 6.3
    const linear = surface(33, 28, 550, 1.8, Math.PI, 6.3)
    // γ from the linear solution's own balance (Penman: λE = (H/γ)(es(Ta) + Δ(Ts − Ta) − ea))
    const es = saturationVaporPressureLiquidKpa(33)
    const d = (saturationVaporPressureLiquidKpa(33.0005) - saturationVaporPressureLiquidKpa(32.9995)) / 0.001
    const gamma = (h * (es - s.vaporPressureKpa + d * (linear.surfaceC - 33))) / linear.latentFluxWm2
    const latent = (h / gamma) * (saturationVaporPressureLiquidKpa(s.surfaceC) - s.vaporPressureKpa)
    expect(Math.abs(latent - s.latentFluxWm2) / s.latentFluxWm2).toBeLessThan(1e-3)
  })
  it('equals the linearised balance solved by hand: H·(Ts − Ta)·(1 + R/H) + (H/γ)·(es + Δ·(Ts − Ta) − ea) = Q', () => {
    // independent algebra: substitute λE = (H/γ)(es(Ta) + Δ(Ts − Ta) − ea) into the balance and solve for Ts
    const s = surface(32, 30, 600, 1.5, Math.PI, 6.3)
    const h = s.heatConductanceWm2K - 6.3
    const ea = s.vaporPressureKpa
    const es = saturationVaporPressureLiquidKpa(32)
    const d = (saturationVaporPressureLiquidKpa(32.0005) - saturationVaporPressureLiquidKpa(31.9995)) / 0.001
    const gamma = (h * (es - ea + d * (s.surfaceC - 32))) / s.latentFluxWm2
    // γ is what the kernel used; it must be the FAO-56 eq 8 value for this air (cp P/(ε λ) ≈ 0.067 kPa/K)
    expect(gamma).toBeGreaterThan(0.064)
    expect(gamma).toBeLessThan(0.069)
    const ts = 32 + (600 - (h / gamma) * (es - ea)) / (h + 6.3 + (h * d) / gamma)
    expect(Math.abs(ts - s.surfaceC)).toBeLessThan(2e-3)
  })
  it('more exchange surface and more radiative loss bring a sunlit wet surface nearer the air', () => {
    const flat = surface(30, 35, 600, 2)
    const layer = surface(30, 35, 600, 2, Math.PI, 6)
    expect(flat.surfaceC).toBeGreaterThan(layer.surfaceC)
    expect(layer.surfaceC).toBeGreaterThan(layer.airC - 10)
    // a surface that evaporates nothing sits at Ta + Q/(H + R), above the wet one
    expect(30 + 600 / layer.heatConductanceWm2K).toBeGreaterThan(layer.surfaceC + 5)
  })
  it('A = 1, R = 0 is the Penman form bit for bit (the same expression as before)', () => {
    const a = surface(25, 50, 300, 2)
    const b = surface(25, 50, 300, 2, 1, 0)
    expect(b.latentFluxWm2).toBe(a.latentFluxWm2)
  })
  it('refuses an exchange area or a radiative conductance out of range', () => {
    expect(() => surface(25, 50, 300, 2, 0)).toThrow(RangeError)
    expect(() => surface(25, 50, 300, 2, 1, -1)).toThrow(RangeError)
  })
})
