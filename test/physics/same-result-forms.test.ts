/**
 * The hot-loop forms (saturation pressure passed in, as the hourly driver does) give bit for bit the
 * results of the plain functions (the reference here is the project's own plain form; the physics of
 * those is checked elsewhere).
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { adiabaticHumidityRatioAtRh } from '../../src/physics/air-processes.ts'
import { KELVIN_OFFSET } from '../../src/physics/constants.ts'
import { lnSaturationPressureLiquidPa } from '../../src/physics/saturation.ts'
import { wetSurfaceEvaporationPenman1948KgPerM2H } from '../../src/physics/wet-surface.ts'

const air = fc.record({
  t: fc.double({ min: -40, max: 60, noNaN: true }),
  rh: fc.double({ min: 1, max: 100, noNaN: true }),
  p: fc.double({ min: 70, max: 105, noNaN: true }),
  u: fc.double({ min: 0, max: 15, noNaN: true }),
  rn: fc.double({ min: -200, max: 1000, noNaN: true }),
  phi: fc.double({ min: 0.05, max: 1, noNaN: true }),
})

function state(t: number, rh: number, p: number): { satPa: number; pw: number; w: number } {
  const satPa = Math.exp(lnSaturationPressureLiquidPa(t + KELVIN_OFFSET))
  const pw = (rh / 100) * satPa * 1e-3
  return { satPa, pw, w: (0.621945 * pw) / (p - pw) }
}

describe('faster forms are bit-identical', () => {
  it('wet-surface evaporation with the saturation pressure given', () => {
    fc.assert(
      fc.property(air, ({ t, rh, p, u, rn }) => {
        const { satPa, pw, w } = state(t, rh, p)
        expect(
          Object.is(
            wetSurfaceEvaporationPenman1948KgPerM2H(rn, t, pw, p, w, u, satPa),
            wetSurfaceEvaporationPenman1948KgPerM2H(rn, t, pw, p, w, u),
          ),
        ).toBe(true)
      }),
      { seed: 20_261_201, numRuns: 2000 },
    )
  })
  it('adiabatic humidity ratio with the saturation pressure given', () => {
    fc.assert(
      fc.property(air, ({ t, rh, p, phi, u }) => {
        const { satPa, w } = state(t, rh, p)
        const start = t - u
        expect(
          Object.is(
            adiabaticHumidityRatioAtRh(t, w, p, phi, start, satPa),
            adiabaticHumidityRatioAtRh(t, w, p, phi, start),
          ),
        ).toBe(true)
      }),
      { seed: 20_261_201, numRuns: 2000 },
    )
  })
})
