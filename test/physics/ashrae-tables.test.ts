/**
 * ASHRAE Handbook — Fundamentals 2017 (SI) ch. 1 tables. The values were read second-hand, in
 * psychrolib's test file tests/test_psychrolib_si.py, which attributes them to the 2017 Handbook
 * (see the project's psychrometrics reference notes (psychrometrics.md) §3). Tolerances are those the tables justify.
 */
import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'
import {
  moistAirEnthalpyKjPerKg,
  moistAirSpecificVolumeM3PerKg,
  saturationHumidityRatio,
  standardPressureKpaAtElevation,
} from '../../src/physics/moist-air.ts'
import { saturationVaporPressureKpa } from '../../src/physics/saturation.ts'

describe('ASHRAE HOF 2017 ch. 1 Table 3: saturation pressure of water (Hyland–Wexler eqs 5–6)', () => {
  // Table 3 [Pa]. ASHRAE states eqs 5–6 agree with the tabulated pressures within 300 ppm (as quoted in
  // psychrolib's tests); −60 °C is printed to three figures (1.08 Pa), so it gets half a unit of the
  // last printed digit instead.
  const table: [number, number, number][] = [
    [-60, 1.08, 0.005 / 1.08],
    [-20, 103.24, 3e-4],
    [-5, 401.74, 3e-4],
    [5, 872.6, 3e-4],
    [25, 3169.7, 3e-4],
    [50, 12351.3, 3e-4],
    [100, 101418.0, 3e-4],
    [150, 476101.4, 3e-4],
  ]
  for (const [tC, pwsPa, rel] of table) {
    it(`${tC} °C → ${pwsPa} Pa (±${(rel * 1e6).toFixed(0)} ppm)`, () => {
      const ours = saturationVaporPressureKpa(tC) * 1000
      expect(Math.abs(ours / pwsPa - 1)).toBeLessThanOrEqual(rel)
    })
  }
})

describe('ASHRAE HOF 2017 ch. 1 Table 2: saturation humidity ratio at 101.325 kPa', () => {
  // Table 2 holds real-gas values (with the enhancement factor); the perfect-gas relations used here
  // (eqs 20/23) come out lower. The Handbook states the perfect-gas error is under 0.7 % from −50 to
  // 50 °C (Kuehn et al. 1998, quoted in HOF 2017 ch. 1). So: ours is below the table by 0 to 0.7 %.
  const table: [number, number][] = [
    [-50, 2.43e-5],
    [-20, 6.373e-4],
    [-5, 2.4863e-3],
    [5, 5.425e-3],
    [25, 0.020173],
    [50, 0.086863],
  ]
  for (const [tC, ws] of table) {
    it(`${tC} °C: Ws ${ws} kg/kg, perfect-gas value 0–0.7 % below`, () => {
      const gap = 1 - saturationHumidityRatio(tC, 101.325) / ws
      expect(gap).toBeGreaterThan(0)
      expect(gap).toBeLessThan(0.007)
    })
  }
  it('85 °C: 0.838105 kg/kg; outside the 0.7 % range the gap grows (1.2 %), checked at 1.5 %', () => {
    // The 0.7 % statement covers −50…50 °C only; the reference file measured 1.2 % at 85 °C.
    const gap = 1 - saturationHumidityRatio(85, 101.325) / 0.838105
    expect(gap).toBeGreaterThan(0)
    expect(gap).toBeLessThan(0.015)
  })
  // Table 2 saturated-air enthalpy [kJ/kg]: the same 0.7 % applies to the water-vapour part W(2501 + 1.86 t);
  // the dry-air part 1.006 t (eq 28, constant cp) departs from the table's real-gas dry-air enthalpy by a
  // few hundredths of a kJ/kg at −50 °C (0.04 %), so 0.05 % of |1.006 t| is allowed on top.
  const hs: [number, number][] = [
    [-50, -50.222],
    [-20, -18.542],
    [-5, 1.164],
    [5, 18.639],
    [25, 76.504],
    [50, 275.353],
  ]
  for (const [tC, h] of hs) {
    it(`${tC} °C: saturated enthalpy ${h} kJ/kg (0.7 % of the vapour part, 0.05 % of the dry-air part)`, () => {
      const ws = saturationHumidityRatio(tC, 101.325)
      const ours = moistAirEnthalpyKjPerKg(tC, ws)
      expect(Math.abs(ours - h)).toBeLessThanOrEqual(
        0.007 * ws * (2501 + 1.86 * tC) + 5e-4 * Math.abs(1.006 * tC) + 0.001,
      )
    })
  }
  it('dry-air volume at 25 °C: 0.8443 m³/kg (real gas) vs Rda T/p, within 0.1 %', () => {
    expect(Math.abs(moistAirSpecificVolumeM3PerKg(25, 0, 101.325) / 0.8443 - 1)).toBeLessThan(1e-3)
  })
})

describe('ASHRAE HOF 2017 ch. 1 Table 1 / eq 3: standard atmosphere', () => {
  // Table 1 pressures [Pa], printed to 1 Pa; tolerance 1 Pa.
  const table: [number, number][] = [
    [-500, 107478],
    [0, 101325],
    [500, 95461],
    [1000, 89875],
    [4000, 61640],
  ]
  for (const [z, pPa] of table) {
    it(`${z} m → ${pPa} Pa ± 1 Pa`, () => {
      expect(Math.abs(standardPressureKpaAtElevation(z) * 1000 - pPa)).toBeLessThanOrEqual(1)
    })
  }
  it('eq 3 alone: 1500 m → 84556 Pa, 2000 m → 79495 Pa, 3000 m → 70108 Pa (± 1 Pa)', () => {
    // Values computed from eq 3 in the reference file (§3), not read in the table.
    expect(Math.abs(standardPressureKpaAtElevation(1500) * 1000 - 84556)).toBeLessThanOrEqual(1)
    expect(Math.abs(standardPressureKpaAtElevation(2000) * 1000 - 79495)).toBeLessThanOrEqual(1)
    expect(Math.abs(standardPressureKpaAtElevation(3000) * 1000 - 70108)).toBeLessThanOrEqual(1)
  })
  it('10000 m (26436 Pa in Table 1) is outside the accepted −500…9000 m and is refused', () => {
    expect(() => standardPressureKpaAtElevation(10000)).toThrow(/elevation .*10000/)
  })
  it('airState at 1000 m elevation uses the eq 3 pressure', () => {
    expect(airState({ dryBulbC: 20, relativeHumidityPct: 50, elevationM: 1000 }).pressureKpa).toBeCloseTo(
      89.875,
      3,
    )
  })
})

describe('ASHRAE HOF 2017 ch. 1 Example 1, further quantities', () => {
  const s = airState({ dryBulbC: 40, wetBulbC: 20, pressureKpa: 101.325 })
  it('dew point ≈ 7 °C (handbook, rounded; psychrolib 7.434 °C)', () => {
    expect(Math.abs(s.dewPointC - 7)).toBeLessThan(0.5)
    expect(Math.abs(s.dewPointC - 7.434)).toBeLessThan(0.005)
  })
  it('W 0.0064008 with the perfect-gas Ws* (psychrolib value); 0.00646 with the Table 2 Ws*', () => {
    // With the real-gas Ws*(20 °C) = 0.014758, eq 33 gives 0.006463 (reference file §3, own arithmetic):
    // the handbook's 0.0065 is that value rounded.
    expect(Math.abs(s.humidityRatioGPerKg / 1000 / 0.0064008 - 1)).toBeLessThan(1e-4)
    const wsStar = 0.014758
    const w = ((2501 - 2.326 * 20) * wsStar - 1.006 * 20) / (2501 + 1.86 * 40 - 4.186 * 20)
    expect(w).toBeCloseTo(0.006463, 6)
  })
})
