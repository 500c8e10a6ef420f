import { describe, expect, it } from 'vitest'
import {
  fillNightShortwaveRatioColumn,
  NIGHT_RS_RSO_DEFAULT,
  netLongwaveHourlyMjM2,
  referenceEtHourlyFao56,
  shortwaveRatio,
  soilHeatFluxHourlyMjM2,
} from '../../src/physics/fao56-reference-et.ts'

// FAO-56 (Allen et al. 1998) Example 19: hourly ETo at N'Diaye, Senegal, 16°13'N, Lm 16.25°W, 8 m, 1 October.
// The example uses Lz = 15°W for the time-zone centre (its published ω = 0.682 rad needs it), not GMT.
// Published values as listed in the "FAO56 example 19" test of a public Python FAO-56 hourly module
// (quoted in the project reference evaporation-and-sun.md), checked at their published rounding.
const site = {
  latitudeDeg: 16 + 13 / 60,
  longitudeWestDeg: 16.25,
  timeZoneCentreWestDeg: 15,
  elevationM: 8,
  year: 2001, // FAO-56 gives no year; any non-leap year puts 1 October on J = 274
  month: 10,
  day: 1,
}

describe('FAO-56 Example 19, 14:00–15:00 (38 °C, 52 %, u2 3.3 m/s, Rs 2.450 MJ m⁻² h⁻¹)', () => {
  const r = referenceEtHourlyFao56({
    ...site,
    clockHourMid: 14.5,
    airTempC: 38,
    relativeHumidityPct: 52,
    windAt2mMs: 3.3,
    solarRadiationMjM2: 2.45,
  })
  it('J = 274', () => expect(r.dayOfYear).toBe(274))
  it('e° = 6.625, ea = 3.445, es − ea = 3.180 kPa', () => {
    expect(r.saturationVaporPressureKpa).toBeCloseTo(6.625, 3)
    expect(r.vaporPressureKpa).toBeCloseTo(3.445, 3)
    expect(r.saturationVaporPressureKpa - r.vaporPressureKpa).toBeCloseTo(3.18, 3)
  })
  it('Δ = 0.358, γ = 0.0673 kPa/°C', () => {
    expect(r.slopeKpaPerC).toBeCloseTo(0.358, 3)
    expect(r.psychrometricKpaPerC).toBeCloseTo(0.0673, 4)
  })
  it('ω = 0.682 rad', () => expect(r.hourAngleRad).toBeCloseTo(0.682, 3))
  it('Ra = 3.543, Rso = 2.658 MJ m⁻² h⁻¹', () => {
    expect(r.extraterrestrialMjM2).toBeCloseTo(3.543, 3)
    expect(r.clearSkyMjM2).toBeCloseTo(2.658, 3)
  })
  it('Rns = 1.887, Rnl = 0.137, Rn = 1.749, G = 0.175 MJ m⁻² h⁻¹', () => {
    expect(r.netShortwaveMjM2).toBeCloseTo(1.887, 2) // 0.77 × 2.450 = 1.8865, printed 1.887
    expect(r.netLongwaveMjM2).toBeCloseTo(0.137, 3)
    expect(r.netRadiationMjM2).toBeCloseTo(1.749, 3)
    expect(r.soilHeatFluxMjM2).toBeCloseTo(0.175, 3)
  })
  it('ETo = 0.63 mm/h', () => expect(r.referenceEtMmPerH).toBeCloseTo(0.63, 2))
})

describe('FAO-56 Example 19, 02:00–03:00 (28 °C, 90 %, u2 1.9 m/s, Rs 0)', () => {
  const r = referenceEtHourlyFao56({
    ...site,
    clockHourMid: 2.5,
    airTempC: 28,
    relativeHumidityPct: 90,
    windAt2mMs: 1.9,
    solarRadiationMjM2: 0,
  })
  it('e° = 3.780, ea = 3.402, es − ea = 0.378 kPa', () => {
    expect(r.saturationVaporPressureKpa).toBeCloseTo(3.78, 3)
    expect(r.vaporPressureKpa).toBeCloseTo(3.402, 3)
    expect(r.saturationVaporPressureKpa - r.vaporPressureKpa).toBeCloseTo(0.378, 3)
  })
  it('Δ = 0.220 kPa/°C', () => expect(r.slopeKpaPerC).toBeCloseTo(0.22, 3))
  it('ω = −2.46 rad, sun down: Ra = 0, Rs/Rso = 0.8 assumed', () => {
    expect(r.hourAngleRad).toBeCloseTo(-2.46, 2)
    expect(r.extraterrestrialMjM2).toBe(0)
    expect(r.shortwaveRatio).toBe(0.8)
  })
  it('Rnl = 0.100, Rn = −0.100, G = −0.050 MJ m⁻² h⁻¹', () => {
    expect(r.netLongwaveMjM2).toBeCloseTo(0.1, 3)
    expect(r.netRadiationMjM2).toBeCloseTo(-0.1, 3)
    expect(r.soilHeatFluxMjM2).toBeCloseTo(-0.05, 3)
  })
  it('ETo ≈ 0.0 mm/h', () => expect(r.referenceEtMmPerH).toBeCloseTo(0, 1))
})

describe('eq 39 and the night Rs/Rso ratio', () => {
  it('FAO-56 Example 11 (daily, Tmax 25.1, Tmin 19.1, ea 2.1, Rs/Rso 14.5/18.8) → Rnl 3.5 MJ m⁻² d⁻¹ as 24 × hourly form', () => {
    // The daily form averages T⁴ of Tmax and Tmin; σ_daily = 24 σ_hourly (4.903e-9 vs 24 × 2.043e-10 = 4.9032e-9).
    const tK4 = ((25.1 + 273.16) ** 4 + (19.1 + 273.16) ** 4) / 2
    const tEffC = tK4 ** 0.25 - 273.16
    expect(24 * netLongwaveHourlyMjM2(tEffC, 2.1, 14.5 / 18.8)).toBeCloseTo(3.5, 1)
  })
  it('ratio limited to 0.3…1 (FAO-56 eq 39 upper, ASCE-EWRI 2005 eq 45 lower), NaN at night', () => {
    expect(shortwaveRatio(3, 2)).toBe(1)
    expect(shortwaveRatio(0.1, 2)).toBe(0.3)
    expect(Number.isNaN(shortwaveRatio(0, 0))).toBe(true)
  })
  it('column: night hours carry the last ratio with the sun above 0.3 rad; start of series uses 0.8', () => {
    const rs = new Float64Array([0, 0.5, 1.8, 1.2, 0.1, 0, 0])
    const rso = new Float64Array([0, 1, 2, 2, 0.5, 0, 0])
    const alt = new Float64Array([-5, 10, 40, 30, 5, -3, -20])
    const out = new Float64Array(7)
    fillNightShortwaveRatioColumn(rs, rso, alt, out)
    expect(Array.from(out)).toEqual([NIGHT_RS_RSO_DEFAULT, 0.5, 0.9, 0.6, 0.3, 0.6, 0.6])
  })
  it('G = 0.1 Rn by day (eq 45), 0.5 Rn at night (eq 46)', () => {
    expect(soilHeatFluxHourlyMjM2(2, true)).toBeCloseTo(0.2, 12)
    expect(soilHeatFluxHourlyMjM2(-0.2, false)).toBeCloseTo(-0.1, 12)
  })
  it('RangeErrors name the input', () => {
    expect(() => netLongwaveHourlyMjM2(20, 1, 1.2)).toThrow(/Rs\/Rso/)
    expect(() =>
      referenceEtHourlyFao56({
        ...site,
        clockHourMid: 12,
        airTempC: 30,
        relativeHumidityPct: 120,
        windAt2mMs: 2,
        solarRadiationMjM2: 2,
      }),
    ).toThrow(/relative humidity.*120/)
    expect(() =>
      fillNightShortwaveRatioColumn(
        new Float64Array(3),
        new Float64Array(2),
        new Float64Array(3),
        new Float64Array(3),
      ),
    ).toThrow(/3 values/)
  })
})
