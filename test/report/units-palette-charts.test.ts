/**
 * Display units (NIST SP 811 exact factors), the palette's greyscale and colour-blind properties, tick
 * choice.
 */
import { describe, expect, it } from 'vitest'
import { niceTicks } from '../../src/report/charts/svg.ts'
import { formatNumber, unitFormatter } from '../../src/report/display-units.ts'
import { HIGH_CONTRAST, patternDef, siteStyle, YL_OR_BR } from '../../src/report/palette.ts'

/** WCAG 2.1 relative luminance of an sRGB hex colour (W3C, "relative luminance" definition). */
function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => Number.parseInt(hex.slice(i, i + 2), 16) / 255)
  const lin = c.map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4))
  return 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2]
}

describe('US customary display (NIST SP 811 appendix B, exact factors)', () => {
  const us = unitFormatter('us')
  it('converts temperature: 0 °C = 32 °F, 100 °C = 212 °F, −40 °C = −40 °F', () => {
    expect(us.temperature(0).value).toBeCloseTo(32, 12)
    expect(us.temperature(100).value).toBeCloseTo(212, 12)
    expect(us.temperature(-40).value).toBeCloseTo(-40, 12)
  })
  it('converts fuel sale units: 1 L = 0.264172 gal, 1 m³ = 35.3147 ft³, 1 kg = 2.20462 lb', () => {
    expect(us.fuel(1, 'L')).toEqual({ value: expect.closeTo(0.264172, 6), unit: 'gal' })
    expect(us.fuel(1, 'm³').value).toBeCloseTo(35.3147, 4)
    expect(us.fuel(1, 'kg').value).toBeCloseTo(2.20462, 5)
    expect(us.fuel(5, 'kWh')).toEqual({ value: 5, unit: 'kWh' })
    // A price per litre becomes a price per gallon: 1 per L = 3.785 per gal.
    expect(us.pricePerFuelUnit(1, 'L').value).toBeCloseTo(3.785411784, 9)
  })
  it('converts 1 g/kg to 7 gr/lb (7000 grains per pound) and kWh/t to kWh per short ton', () => {
    expect(us.humidityRatio(1).value).toBeCloseTo(7, 12)
    expect(us.energyPerMass(1000).value).toBeCloseTo(907.18474, 9)
  })
  it('rejects an unknown unit system by name', () => {
    expect(() => unitFormatter('metric' as never)).toThrow(/units must be "si" or "us", got "metric"/)
  })
  it('formats numbers with ISO 80000-1 digit groups and an en dash for missing values', () => {
    expect(formatNumber(35064)).toBe('35\u202F064')
    expect(formatNumber(1234)).toBe('1234')
    expect(formatNumber(-0.04, 1)).toBe('0.0')
    expect(formatNumber(null)).toBe('–')
  })
})

describe('palette', () => {
  it('sequential scale gets darker step by step, so it prints as a grey ramp (WCAG relative luminance)', () => {
    const l = YL_OR_BR.map(luminance)
    for (let i = 1; i < l.length; i++) expect(l[i], `step ${i}`).toBeLessThan(l[i - 1] - 0.02)
  })
  it('high-contrast colours differ in luminance, so they stay apart in greyscale (Tol 2021 high-contrast scheme)', () => {
    const l = [HIGH_CONTRAST.blue, HIGH_CONTRAST.red, HIGH_CONTRAST.yellow, HIGH_CONTRAST.white].map(
      luminance,
    )
    for (let i = 0; i < l.length; i++)
      for (let j = i + 1; j < l.length; j++) expect(Math.abs(l[i] - l[j])).toBeGreaterThan(0.1)
  })
  it('gives the first six sites six different patterns, dashes and markers besides their colours', () => {
    const s = [0, 1, 2, 3, 4, 5].map(siteStyle)
    for (const key of ['colour', 'pattern', 'dash', 'marker'] as const)
      expect(new Set(s.map((x) => x[key])).size).toBe(6)
    expect(patternDef('p', s[0])).toBe('')
    expect(patternDef('p', s[1])).toMatch(/^<pattern id="p"/)
  })
})

describe('axis ticks (Heckbert 1990 nice numbers)', () => {
  it('picks 1, 2 or 5 × 10ⁿ steps', () => {
    expect(niceTicks(0, 448)).toEqual([0, 100, 200, 300, 400])
    expect(niceTicks(-10, 35, 8)).toEqual([-10, -5, 0, 5, 10, 15, 20, 25, 30, 35])
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1])
  })
})
