/**
 * The interpolated saturation tables (src/physics/saturation-table.ts) against the exact formulas they
 * tabulate: ASHRAE HOF 2017 ch. 1 eq 5 (ice) and eq 6 (liquid water), Hyland–Wexler. The stated
 * accuracy is 1e-9 relative for pws and 1e-9 °C for the inverse; derivatives only steer the solvers.
 */
import { describe, expect, it } from 'vitest'
import {
  dLnSaturationPressureIceDT,
  dLnSaturationPressureLiquidDT,
  lnSaturationPressureIcePa,
  lnSaturationPressureLiquidPa,
  saturationVaporPressureIceKpa,
  saturationVaporPressureLiquidKpa,
} from '../../src/physics/saturation.ts'
import {
  liquidSaturationPressureFromTableKpa,
  saturationPressureFromTableKpa,
  saturationTableSlopes,
  saturationTemperatureFromTableC,
} from '../../src/physics/saturation-table.ts'

// Off-node temperatures across the whole range (step not a multiple of the 1/8 K spacing).
const temps: number[] = []
for (let t = -100; t <= 200; t += 0.0371) temps.push(t)

describe('saturation table', () => {
  it('liquid water, −100…200 °C: pws within 1e-9 relative, dpws/dT within 1e-6', () => {
    let e = 0
    let e1 = 0
    for (const t of temps) {
      const exact = saturationVaporPressureLiquidKpa(t)
      e = Math.max(e, Math.abs(saturationPressureFromTableKpa(t, false) / exact - 1))
      e1 = Math.max(
        e1,
        Math.abs(saturationTableSlopes[0] / (exact * dLnSaturationPressureLiquidDT(t + 273.15)) - 1),
      )
    }
    expect(e).toBeLessThan(1e-9)
    expect(e1).toBeLessThan(1e-6)
  })
  it('the liquid-water inner-loop form gives the same bits as the general read (value and dpws/dT)', () => {
    const slope = new Float64Array(1)
    let differ = 0
    for (const t of temps) {
      const own = liquidSaturationPressureFromTableKpa(t, slope)
      const general = saturationPressureFromTableKpa(t, false)
      if (own !== general || slope[0] !== saturationTableSlopes[0]) differ++
    }
    expect(temps.length).toBeGreaterThan(8000)
    expect(differ).toBe(0)
  })
  it('ice, −100…0.01 °C: pws within 1e-9 relative, dpws/dT within 1e-6', () => {
    let e = 0
    let e1 = 0
    for (const t of temps.filter((x) => x <= 0.01)) {
      const exact = saturationVaporPressureIceKpa(t)
      e = Math.max(e, Math.abs(saturationPressureFromTableKpa(t, true) / exact - 1))
      e1 = Math.max(
        e1,
        Math.abs(saturationTableSlopes[0] / (exact * dLnSaturationPressureIceDT(t + 273.15)) - 1),
      )
    }
    expect(e).toBeLessThan(1e-9)
    expect(e1).toBeLessThan(1e-6)
  })
  it('inverse (dew and frost point from ln pws) within 1e-9 °C', () => {
    let eL = 0
    let eI = 0
    for (const t of temps) {
      eL = Math.max(
        eL,
        Math.abs(saturationTemperatureFromTableC(lnSaturationPressureLiquidPa(t + 273.15), false) - t),
      )
      if (t <= 0.01) {
        eI = Math.max(
          eI,
          Math.abs(saturationTemperatureFromTableC(lnSaturationPressureIcePa(t + 273.15), true) - t),
        )
      }
    }
    expect(eL).toBeLessThan(1e-9)
    expect(eI).toBeLessThan(1e-9)
  })
})
