/**
 * Everyday psychrometric-chart readings. Common practice, no source: the numbers are what one reads
 * off a sea-level chart, at a chart reader's tolerance (±1 g/kg, ±2 RH points, ±1 kJ/kg).
 */
import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'

describe('chart readings (common practice, no source)', () => {
  const a = airState({ dryBulbC: 22, wetBulbC: 13, pressureKpa: 101.325 })
  it('22 °C dry bulb, 13 °C wet bulb: about 6 g/kg', () => {
    expect(Math.abs(a.humidityRatioGPerKg - 6)).toBeLessThanOrEqual(1)
  })
  it('22 °C dry bulb, 13 °C wet bulb: about 33 % RH', () => {
    expect(Math.abs(a.relativeHumidityPct - 33)).toBeLessThanOrEqual(2)
  })
  it('22 °C dry bulb, 13 °C wet bulb: about 36 kJ/kg', () => {
    expect(Math.abs(a.enthalpyKjPerKg - 36)).toBeLessThanOrEqual(1)
  })
  it('the same air heated to 45 °C at constant humidity ratio: about 9 % RH', () => {
    const b = airState({ dryBulbC: 45, humidityRatioGPerKg: a.humidityRatioGPerKg, pressureKpa: 101.325 })
    expect(Math.abs(b.relativeHumidityPct - 9)).toBeLessThanOrEqual(2)
    // Sensible heating: the dew point stays put and the wet bulb rises.
    expect(b.dewPointC).toBeCloseTo(a.dewPointC, 9)
    expect(b.wetBulbC).toBeGreaterThan(a.wetBulbC)
  })
  it('psychrolib values for the same two states (reference file §4), to 1e-5 relative / 0.005 °C', () => {
    expect(Math.abs(a.humidityRatioGPerKg / 5.629091 - 1)).toBeLessThan(1e-5)
    expect(Math.abs(a.relativeHumidityPct / 34.3641 - 1)).toBeLessThan(1e-5)
    expect(Math.abs(a.enthalpyKjPerKg / 36.4407 - 1)).toBeLessThan(1e-5)
    expect(Math.abs(a.dewPointC - 5.5868)).toBeLessThan(0.005)
    const b = airState({ dryBulbC: 45, humidityRatioGPerKg: a.humidityRatioGPerKg, pressureKpa: 101.325 })
    expect(Math.abs(b.relativeHumidityPct / 9.47383 - 1)).toBeLessThan(1e-5)
    expect(Math.abs(b.wetBulbC - 20.945)).toBeLessThan(0.005)
  })
})
