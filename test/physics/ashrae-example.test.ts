import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'

describe('ASHRAE Handbook — Fundamentals 2017 ch. 1, Example 1 (40 °C db, 20 °C wb, 101.325 kPa)', () => {
  // Handbook values as quoted in psychrolib's tests (tests/test_psychrolib_si.py): W 0.0065, RH 14 %,
  // h 56.7 kJ/kg, v 0.896 m³/kg. The handbook's W uses the real-gas Ws*; the perfect-gas relations give
  // 0.00640, so W is checked to the handbook's two significant figures.
  const s = airState({ dryBulbC: 40, wetBulbC: 20, pressureKpa: 101.325 })
  it('humidity ratio ≈ 0.0065 kg/kg', () => expect(s.humidityRatioGPerKg / 1000).toBeCloseTo(0.0065, 3))
  it('relative humidity ≈ 14 %', () => expect(Math.abs(s.relativeHumidityPct - 14)).toBeLessThan(0.5))
  it('enthalpy ≈ 56.7 kJ/kg', () => expect(Math.abs(s.enthalpyKjPerKg - 56.7)).toBeLessThan(0.05))
  it('specific volume ≈ 0.896 m³/kg', () =>
    expect(Math.abs(s.specificVolumeM3PerKg - 0.896)).toBeLessThan(0.0005))
})
