/**
 * Against psychrolib 1.1.1 (npm; a copy of PsychroLib 2.5.0, MIT, an implementation of the ASHRAE HOF
 * 2017 ch. 1 formulas) over a grid of 37 dry bulbs (−20…70 °C) × 11 RH (1…100 %) × 4 pressures
 * (70…101.325 kPa) = 1628 states. Tolerances from the project's psychrometrics reference notes (psychrometrics.md) §2:
 * W, h, v to 1e-6 relative; dew/frost point and wet bulb to 0.005 °C (psychrolib's own solvers stop
 * at 0.001 °C), the wet bulb outside the two-root band near 0 °C.
 *
 * Conventions: psychrolib's RH is over ice below 0.01 °C, ours over liquid water at every temperature,
 * so the grid RH is psychrolib's and ours is derived from the same vapour pressure; below the triple
 * point psychrolib's "dew point" is a frost point and is compared with our frostPointC.
 */
import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { type AirState, airState } from '../../src/physics/air-state.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'

psychrolib.SetUnitSystem(psychrolib.SI)

interface Case {
  tC: number
  rhPsy: number
  pKpa: number
  ours: AirState
  psy: number[]
  inBand: boolean
}

const cases: Case[] = []
for (let k = 0; k <= 36; k++) {
  const tC = -20 + 2.5 * k
  for (const rhPct of [1, 5, 10, 20, 35, 50, 65, 80, 90, 95, 100]) {
    for (const pKpa of [70, 85, 95, 101.325]) {
      const rhPsy = rhPct / 100
      // Same vapour pressure: pw = RH_psy · pws(psychrolib branch) = RH_ours · pws,liquid.
      const pwKpa = (rhPsy * psychrolib.GetSatVapPres(tC)) / 1000
      const ours = airState({
        dryBulbC: tC,
        relativeHumidityPct: Math.min(100, (100 * pwKpa) / saturationVaporPressureLiquidKpa(tC)),
        pressureKpa: pKpa,
      })
      const pPa = pKpa * 1000
      const psy = psychrolib.CalcPsychrometricsFromRelHum(tC, rhPsy, pPa)
      // Two-root band: eq 35 at t* = 0⁻ gives a higher W than eq 33 at t* = 0, so W between the two has
      // a wet bulb on each side of 0 °C (reference file §5); psychrolib may return either.
      const inBand =
        tC > 0 &&
        psy[0] >= psychrolib.GetHumRatioFromTWetBulb(tC, 0, pPa) &&
        psy[0] <= psychrolib.GetHumRatioFromTWetBulb(tC, -1e-9, pPa)
      cases.push({ tC, rhPsy, pKpa, ours, psy, inBand })
    }
  }
}

function worst(values: number[]): number {
  return values.reduce((a, b) => Math.max(a, b), 0)
}

describe('psychrolib grid, 1628 states from −20 to 70 °C, 1–100 % RH, 70–101.325 kPa', () => {
  it('has at least 500 states', () => expect(cases.length).toBeGreaterThanOrEqual(500))
  it('humidity ratio to 1e-6 relative', () => {
    expect(worst(cases.map((c) => Math.abs(c.ours.humidityRatioGPerKg / 1000 / c.psy[0] - 1)))).toBeLessThan(
      1e-6,
    )
  })
  it('enthalpy to 1e-6 relative (psychrolib J/kg)', () => {
    expect(worst(cases.map((c) => Math.abs((c.ours.enthalpyKjPerKg * 1000) / c.psy[4] - 1)))).toBeLessThan(
      1e-6,
    )
  })
  it('specific volume to 1e-6 relative', () => {
    expect(worst(cases.map((c) => Math.abs(c.ours.specificVolumeM3PerKg / c.psy[5] - 1)))).toBeLessThan(1e-6)
  })
  it('vapour pressure to 1e-6 relative (psychrolib Pa)', () => {
    expect(worst(cases.map((c) => Math.abs((c.ours.vaporPressureKpa * 1000) / c.psy[3] - 1)))).toBeLessThan(
      1e-6,
    )
  })
  it('dew point (frost point below the triple point) to 0.005 °C', () => {
    const diffs = cases.map((c) => Math.abs((c.ours.frostPointC ?? c.ours.dewPointC) - c.psy[2]))
    expect(worst(diffs)).toBeLessThan(0.005)
  })
  it('our dewPointC is over liquid water: below the frost point when the frost point is below 0 °C', () => {
    const frosty = cases.filter((c) => c.ours.frostPointC !== null && c.ours.frostPointC < -1)
    expect(frosty.length).toBeGreaterThan(50)
    for (const c of frosty) expect(c.ours.dewPointC).toBeLessThan(c.ours.frostPointC as number)
  })
  const outside = cases.filter((c) => !c.inBand)
  const band = cases.filter((c) => c.inBand)
  it('wet bulb to 0.005 °C outside the two-root band', () => {
    expect(worst(outside.map((c) => Math.abs(c.ours.wetBulbC - c.psy[1])))).toBeLessThan(0.005)
  })
  it('few states fall in the two-root band (skipped above), and there we return the liquid-wick root', () => {
    expect(band.length).toBeGreaterThan(0)
    expect(band.length).toBeLessThanOrEqual(0.02 * cases.length)
    for (const c of band) {
      expect(c.ours.wetBulbC).toBeGreaterThanOrEqual(0)
      // Either root lies within 0.7 °C of 0 (reference file §5), so the two answers differ by less.
      expect(Math.abs(c.ours.wetBulbC - c.psy[1])).toBeLessThan(0.7)
    }
  })
})
