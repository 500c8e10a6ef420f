import { describe, expect, it } from 'vitest'
import {
  aerodynamicResistanceFromPenmanWindSPerM,
  windFunctionPenman1948MmPerDayKpa,
} from '../../src/physics/evaporation.ts'
import { wetSurfaceEvaporationColumnKgPerM2H } from '../../src/physics/evaporation-columns.ts'
import { wetSurfaceEvaporationKgPerM2H } from '../../src/physics/wet-surface.ts'

describe('wet-surface evaporation column', () => {
  const input = {
    availableEnergyWm2: new Float64Array([450, -40, Number.NaN, 200]),
    airTempC: new Float64Array([32, 14, 20, 25]),
    vaporPressureKpa: new Float64Array([1.5, 1.5, 1.2, 1.0]),
    pressureKpa: new Float64Array([100, 100, 100, 95]),
    windAt2mMs: new Float64Array([2.5, 0.5, 1, 0]),
  }
  it('each hour equals the scalar Penman 1948 chain; NaN input gives NaN', () => {
    const out = new Float64Array(4)
    expect(wetSurfaceEvaporationColumnKgPerM2H(input, out)).toBe(4)
    for (const i of [0, 1, 3]) {
      const ra = aerodynamicResistanceFromPenmanWindSPerM(
        windFunctionPenman1948MmPerDayKpa(input.windAt2mMs[i]),
        input.airTempC[i],
      )
      const e = wetSurfaceEvaporationKgPerM2H(
        input.availableEnergyWm2[i],
        0,
        input.airTempC[i],
        input.vaporPressureKpa[i],
        input.pressureKpa[i],
        ra,
      )
      expect(out[i]).toBe(e)
    }
    expect(Number.isNaN(out[2])).toBe(true)
    expect(out[0]).toBeGreaterThan(out[3]) // more sun, wind and deficit
  })
  it('an impossible hour throws naming the hour and the field', () => {
    const bad = { ...input, vaporPressureKpa: new Float64Array([1.5, 9, 1.2, 1.0]) }
    expect(() => wetSurfaceEvaporationColumnKgPerM2H(bad, new Float64Array(4))).toThrow(
      /hour 1: vapour pressure/,
    )
    expect(() => wetSurfaceEvaporationColumnKgPerM2H(input, new Float64Array(2))).toThrow(
      /evaporation output/,
    )
  })
})
