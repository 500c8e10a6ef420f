/**
 * Property tests (fast-check) of the moist-air state: round trips, monotonicity, ordering of the three
 * temperatures and no NaN in the valid domain. The invariants follow from the definitions in ASHRAE HOF
 * 2017 ch. 1 (RH = pw/pws eq 22/24, W eq 20, dew point eq 36, psychrometer balance eqs 33/35).
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'
import {
  dewPointFromVaporPressureC,
  frostPointFromVaporPressureC,
  humidityRatioFromWetBulb,
  VAPOR_PRESSURE_MIN_KPA,
} from '../../src/physics/moist-air.ts'
import {
  saturationVaporPressureIceKpa,
  saturationVaporPressureLiquidKpa,
  TRIPLE_POINT_C,
} from '../../src/physics/saturation.ts'

const RUNS = 300
const double = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true })

/** Highest station RH [%] (over water) at which an iced wick still has a balance root: pws,ice/pws,liq. */
function iceLimitPct(tC: number): number {
  return tC < TRIPLE_POINT_C
    ? (100 * saturationVaporPressureIceKpa(tC)) / saturationVaporPressureLiquidKpa(tC)
    : 100
}

/** (dry bulb, RH, pressure) anywhere in the accepted domain, below the boiling point. */
const anyState = fc
  .record({ t: double(-60, 100), rhFraction: double(0.001, 1), p: double(30, 110) })
  .filter(({ t, p }) => saturationVaporPressureLiquidKpa(t) < p)
  .map(({ t, rhFraction, p }) => ({ t, rh: 100 * rhFraction, p }))
  // Dew point at or above −100 °C, the lower end of ASHRAE eqs 5–6 (airState refuses lower).
  .filter(({ t, rh }) => (rh / 100) * saturationVaporPressureLiquidKpa(t) >= VAPOR_PRESSURE_MIN_KPA)

/** Same, but RH no higher than ice saturation below 0 °C (air not supersaturated over ice). */
const ordinaryState = anyState.map(({ t, rh, p }) => ({
  t,
  rh: Math.max(0.1, Math.min(rh, iceLimitPct(t))),
  p,
}))

describe('round trips', () => {
  it('dew point → vapour pressure → dew point (liquid), −100…200 °C, to 1e-6 °C', () => {
    fc.assert(
      fc.property(double(-99.9, 199.9), (td) => {
        expect(Math.abs(dewPointFromVaporPressureC(saturationVaporPressureLiquidKpa(td)) - td)).toBeLessThan(
          1e-6,
        )
      }),
      { numRuns: RUNS },
    )
  })
  it('frost point → vapour pressure over ice → frost point, −100…0 °C, to 1e-6 °C', () => {
    fc.assert(
      fc.property(double(-99.9, 0), (tf) => {
        expect(Math.abs(frostPointFromVaporPressureC(saturationVaporPressureIceKpa(tf)) - tf)).toBeLessThan(
          1e-6,
        )
      }),
      { numRuns: RUNS },
    )
  })
  it('RH → W → RH to 1e-9 relative', () => {
    fc.assert(
      fc.property(anyState, ({ t, rh, p }) => {
        const a = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        const b = airState({ dryBulbC: t, humidityRatioGPerKg: a.humidityRatioGPerKg, pressureKpa: p })
        expect(Math.abs(b.relativeHumidityPct / rh - 1)).toBeLessThan(1e-9)
      }),
      { numRuns: RUNS },
    )
  })
  it('RH → dew point → RH to 1e-6 relative', () => {
    fc.assert(
      fc.property(anyState, ({ t, rh, p }) => {
        const a = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        const b = airState({ dryBulbC: t, dewPointC: a.dewPointC, pressureKpa: p })
        expect(Math.abs(b.relativeHumidityPct / rh - 1)).toBeLessThan(1e-6)
      }),
      { numRuns: RUNS },
    )
  })
  it('RH → wet bulb → W: the wet bulb satisfies the psychrometer balance (W to 1e-6 relative)', () => {
    fc.assert(
      fc.property(ordinaryState, ({ t, rh, p }) => {
        const a = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        const w = humidityRatioFromWetBulb(t, a.wetBulbC, p) * 1000
        // 1e-6 relative plus the W change of 1e-5 °C of wet bulb (the solver accuracy) at dry air.
        expect(Math.abs(w - a.humidityRatioGPerKg)).toBeLessThan(1e-6 * a.humidityRatioGPerKg + 1e-5)
      }),
      { numRuns: RUNS },
    )
  })
})

describe('monotonicity and ordering', () => {
  it('more water at the same dry bulb and pressure → higher dew point, wet bulb and enthalpy', () => {
    fc.assert(
      fc.property(anyState, double(1.0001, 3), ({ t, rh, p }, factor) => {
        const rh2 = Math.min(100, rh * factor)
        fc.pre(rh2 > rh * 1.0001)
        const a = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        const b = airState({ dryBulbC: t, relativeHumidityPct: rh2, pressureKpa: p })
        expect(b.dewPointC).toBeGreaterThan(a.dewPointC)
        expect(b.wetBulbC).toBeGreaterThanOrEqual(a.wetBulbC - 1e-9)
        expect(b.enthalpyKjPerKg).toBeGreaterThan(a.enthalpyKjPerKg)
      }),
      { numRuns: RUNS },
    )
  })
  it('dew point ≤ wet bulb ≤ dry bulb', () => {
    fc.assert(
      fc.property(anyState, ({ t, rh, p }) => {
        const s = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        expect(s.dewPointC).toBeLessThanOrEqual(s.wetBulbC + 1e-9)
        expect(s.wetBulbC).toBeLessThanOrEqual(t + 1e-12)
      }),
      { numRuns: RUNS },
    )
  })
  it('no NaN or infinity in any output over the valid domain', () => {
    fc.assert(
      fc.property(anyState, ({ t, rh, p }) => {
        const s = airState({ dryBulbC: t, relativeHumidityPct: rh, pressureKpa: p })
        for (const [k, v] of Object.entries(s)) {
          if (k === 'frostPointC' && v === null) continue
          expect(Number.isFinite(v), k).toBe(true)
        }
      }),
      { numRuns: RUNS },
    )
  })
  it('supersaturated over ice (RH over water above pws,ice/pws,liq below 0 °C): wet bulb = dry bulb', () => {
    // Documented in wetBulbWithDewPointC: the iced-wick balance has no root at or below the dry bulb.
    const s = airState({ dryBulbC: -20, relativeHumidityPct: 95, pressureKpa: 101.325 })
    expect(iceLimitPct(-20)).toBeLessThan(95)
    expect(s.wetBulbC).toBeCloseTo(-20, 4)
    expect(s.frostPointC as number).toBeGreaterThan(-20)
  })
})
