import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { dayOfYearAt } from '../../src/physics/calendar.ts'
import {
  extraterrestrialRadiationDailyMjM2,
  extraterrestrialRadiationForPeriodUtcMjM2,
  extraterrestrialRadiationPeriodMjM2,
  fao56HourAngleRad,
  hourAngleFromUtcRad,
  solarDeclinationRad,
} from '../../src/physics/fao56-solar.ts'
import {
  clearnessIndex,
  clearSkyGhiHaurwitzCosZenithWm2,
  clearSkyGhiHaurwitzWm2,
  clearSkyRadiationFao56,
  cosIncidenceAngle,
  diffuseFractionErbs,
  diffuseHorizontalErbsWm2,
  tiltedIrradianceIsotropicWm2,
} from '../../src/physics/irradiance.ts'

const DEG = Math.PI / 180

describe('FAO-56 Example 19 hourly sun terms, other forms (the published values: test/fixtures/truth/fao56-examples.json)', () => {
  const lat = (16 + 13 / 60) * DEG
  const j = dayOfYearAt(Date.UTC(2001, 9, 1))
  const w = fao56HourAngleRad(14.5, 15, 16.25, j)
  it('the UTC form gives the same Ra: 14:00 clock at Lz 15°W is 15:00 UTC', () => {
    expect(hourAngleFromUtcRad(15.5, -16.25, j)).toBeCloseTo(w, 4)
    const raUtc = extraterrestrialRadiationForPeriodUtcMjM2(Date.UTC(2001, 9, 1, 15), 16 + 13 / 60, -16.25)
    expect(raUtc).toBeCloseTo(3.543, 3)
  })
  it('with the zone Senegal actually keeps (Lz = 0) Ra is 4.186 instead (reference file’s recomputation)', () => {
    expect(extraterrestrialRadiationPeriodMjM2(lat, j, fao56HourAngleRad(14.5, 0, 16.25, j), 1)).toBeCloseTo(
      4.186,
      2,
    )
  })
})

describe('hourly Ra sums to the daily Ra (eq 28 integrates eq 21; own consistency check)', () => {
  it('sum of 24 hourly values = daily value at 16°N and 50°N', () => {
    for (const latDeg of [16.2, 50.8, -33]) {
      let sum = 0
      for (let h = 0; h < 24; h++)
        sum += extraterrestrialRadiationPeriodMjM2(latDeg * DEG, 187, ((h + 0.5 - 12) * Math.PI) / 12)
      expect(sum).toBeCloseTo(extraterrestrialRadiationDailyMjM2(latDeg * DEG, 187), 6)
    }
  })
  it('extraterrestrial radiation is never negative (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.integer({ min: 1, max: 366 }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        (latDeg, j, w) => extraterrestrialRadiationPeriodMjM2(latDeg * DEG, j, w, 1) >= 0,
      ),
    )
  })
  it('dayOfYearAt handles leap years and offsets', () => {
    expect(dayOfYearAt(Date.UTC(2024, 11, 31, 12))).toBe(366)
    expect(dayOfYearAt(Date.UTC(2023, 11, 31, 23), 2)).toBe(1)
    expect(dayOfYearAt(Date.UTC(1900, 2, 1))).toBe(60)
  })
})

describe('Haurwitz clear-sky GHI', () => {
  // pvlib-python tests/test_clearsky.py, apparent elevations 5, 10, 30, 50, 90°.
  const cases: [number, number][] = [
    [5, 48.6298687941956],
    [10, 135.741748091813],
    [30, 487.894132885425],
    [50, 778.766689344363],
    [90, 1035.0920325345],
  ]
  for (const [alt, ghi] of cases) {
    it(`${alt}° → ${ghi.toFixed(3)} W/m²`, () => expect(clearSkyGhiHaurwitzWm2(alt)).toBeCloseTo(ghi, 6))
  }
  it("the cosine-of-zenith form (the weather reader's gap filler and sun estimate) gives the same values", () => {
    for (const [alt, ghi] of cases)
      expect(clearSkyGhiHaurwitzCosZenithWm2(Math.sin((alt * Math.PI) / 180))).toBeCloseTo(ghi, 6)
    expect(clearSkyGhiHaurwitzCosZenithWm2(0)).toBe(0)
    expect(clearSkyGhiHaurwitzCosZenithWm2(-0.2)).toBe(0)
  })
  it('0 at and below the horizon', () => {
    expect(clearSkyGhiHaurwitzWm2(0)).toBe(0)
    expect(clearSkyGhiHaurwitzWm2(-10)).toBe(0)
  })
})

describe('Erbs et al. (1982) diffuse fraction', () => {
  // Piecewise fit as printed in Duffie & Beckman (2013) eq 2.10.1; its published end values:
  // 1 − 0.09·0.22 = 0.9802 at kT = 0.22, and 0.165 above 0.80 (the quartic gives 0.1654 at 0.80).
  it('kT = 0 → 1, kT = 0.22 → 0.9802 on both sides', () => {
    expect(diffuseFractionErbs(0)).toBe(1)
    expect(diffuseFractionErbs(0.22)).toBeCloseTo(0.9802, 4)
    expect(diffuseFractionErbs(0.2200001)).toBeCloseTo(0.9802, 2)
  })
  it('kT = 0.80 → 0.165 (continuous with the top branch to 0.001), 0.9 → 0.165', () => {
    expect(Math.abs(diffuseFractionErbs(0.8) - 0.165)).toBeLessThan(0.001)
    expect(diffuseFractionErbs(0.9)).toBe(0.165)
  })
  it('reference recomputation: kT 0.1, 0.5, 0.75 → 0.9910, 0.6591, 0.1831', () => {
    expect(diffuseFractionErbs(0.1)).toBeCloseTo(0.991, 4)
    expect(diffuseFractionErbs(0.5)).toBeCloseTo(0.6591, 4)
    expect(diffuseFractionErbs(0.75)).toBeCloseTo(0.1831, 4)
  })
  it('split of measured GHI: diffuse ≤ GHI, all diffuse with no extraterrestrial', () => {
    expect(diffuseHorizontalErbsWm2(400, 800)).toBeCloseTo(400 * diffuseFractionErbs(0.5), 9)
    expect(diffuseHorizontalErbsWm2(20, 0)).toBe(20)
    expect(diffuseHorizontalErbsWm2(0, 800)).toBe(0)
    expect(clearnessIndex(900, 800)).toBe(1)
  })
})

describe('incidence angle and isotropic transposition', () => {
  it('Liu–Jordan example (reference file’s recomputation of D&B eq 2.15.1): GHI 800, DHI 150, θz 40°, tilt 30° facing the sun, ρg 0.2 → 986.3 W/m²', () => {
    const cz = Math.cos(40 * DEG)
    const ci = cosIncidenceAngle(40, 180, 30, 180)
    expect(tiltedIrradianceIsotropicWm2(650, 150, cz, ci, 30, 0.2)).toBeCloseTo(986.3, 1)
  })
  it('vertical plane facing away from the sun gets only sky and ground diffuse', () => {
    const ci = cosIncidenceAngle(40, 180, 90, 0)
    expect(ci).toBeLessThan(0)
    expect(tiltedIrradianceIsotropicWm2(650, 150, Math.cos(40 * DEG), ci, 90, 0.2)).toBeCloseTo(75 + 80, 9)
  })
  it('tilt 0 returns GHI for any sun (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1100, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 90, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (ghi, kd, zen, az, albedo) => {
          const ci = cosIncidenceAngle(zen, az, 0, 123)
          const gt = tiltedIrradianceIsotropicWm2(
            ghi * (1 - kd),
            ghi * kd,
            Math.cos(zen * DEG),
            ci,
            0,
            albedo,
          )
          return Math.abs(gt - ghi) <= 1e-9 * (1 + ghi)
        },
      ),
    )
  })
  it('RangeErrors name the input', () => {
    expect(() => tiltedIrradianceIsotropicWm2(1, 1, 1, 1, 30, 1.5)).toThrow(/albedo.*1.5/)
    expect(() => cosIncidenceAngle(10, 180, -5, 180)).toThrow(/tilt.*-5/)
    expect(() => diffuseFractionErbs(1.2)).toThrow(/clearness index/)
    expect(() => clearSkyRadiationFao56(3, 20000)).toThrow(/elevation/)
    expect(() => solarDeclinationRad(0)).toThrow(/day of year/)
    expect(() => extraterrestrialRadiationPeriodMjM2(0.3, 100, 0, 0)).toThrow(/period/)
  })
})
