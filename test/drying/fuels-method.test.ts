import { describe, expect, it } from 'vitest'
import { FUELS, fuelForHeat } from '../../src/drying/fuels.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'

describe('fuels', () => {
  // Conversions: US EIA Btu conversion factors, drying-science.md §4.2 (SI column computed there).
  it('propane 91,333 Btu/gal → 25.5 MJ/L', () =>
    expect(FUELS.propane.heatingValueMjPerUnit).toBeCloseTo(25.46, 2))
  it('natural gas 1,025 Btu/ft³ → 38.2 MJ/m³', () =>
    expect(FUELS['natural-gas'].heatingValueMjPerUnit).toBeCloseTo(38.19, 1))
  it('heating oil 138,500 Btu/gal → 38.6 MJ/L', () =>
    expect(FUELS['heating-oil'].heatingValueMjPerUnit).toBeCloseTo(38.6, 1))
  it('pellets 16 million Btu/ton → 18.6 MJ/kg', () =>
    expect(FUELS['wood-pellets'].heatingValueMjPerUnit).toBeCloseTo(18.61, 1))
  it('100 kWh to the air at 80 % with propane is 17.7 L; price marked as example unless given', () => {
    const u = fuelForHeat(100, 0.8, 'propane')
    expect(u.quantity).toBeCloseTo((100 * 3.6) / 0.8 / 25.46, 1)
    expect(u.priceIsExample).toBe(true)
    const v = fuelForHeat(100, 0.8, 'propane', 1.1)
    expect(v.priceIsExample).toBe(false)
    expect(v.cost).toBeCloseTo(v.quantity * 1.1, 9)
  })
  it('electricity: 1 kWh of heat at efficiency 1 is 1 kWh', () =>
    expect(fuelForHeat(1, 1, 'electricity').quantity).toBeCloseTo(1, 12))
  it('rejects a negative heat and an efficiency above 1', () => {
    expect(() => fuelForHeat(-1, 0.8, 'propane')).toThrow(RangeError)
    expect(() => fuelForHeat(1, 1.2, 'propane')).toThrow(/efficiency/)
  })
})

describe('drying methods', () => {
  it('fills stated defaults', () => {
    const m = parseDryingMethod({ kind: 'open-air' })
    expect(m).toMatchObject({
      kind: 'open-air',
      absorptivity: 0.7,
      coveredAtNight: true,
      coveredInRain: true,
    })
    const h = parseDryingMethod({ kind: 'heated' })
    expect(h).toMatchObject({ targetRhPct: 40, heaterEfficiency: 0.8, fuel: 'propane' })
  })
  it('names the field, the value and the range of a bad parameter', () => {
    expect(() => parseDryingMethod({ kind: 'open-air', absorptivity: 1.4 })).toThrow(
      /method\.absorptivity.*between 0 and 1.*1\.4/,
    )
    expect(() => parseDryingMethod({ kind: 'kiln' })).toThrow(
      /kinds: open-air, shade, solar-cabinet, tunnel, heated/,
    )
    expect(() => parseDryingMethod({ kind: 'heated', heaterEfficiency: 0 })).toThrow(/heaterEfficiency/)
  })
  it('thresholds have defaults and reject out-of-range values', () => {
    expect(parseDryingThresholds({}).rainMm).toBe(0.2)
    expect(() => parseDryingThresholds({ rainMm: -1 })).toThrow(/thresholds\.rainMm/)
  })
})
