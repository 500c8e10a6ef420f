import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { PRODUCT_CATALOGUE } from '../../src/product/catalogue.ts'
import { equilibriumMoistureDb, equilibriumRelativeHumidityPct } from '../../src/product/equilibrium.ts'

// Over each isotherm's calibrated range (validTempC, validRhPct), clipped to RH 5–95 %.
describe.each(PRODUCT_CATALOGUE.map((p) => [p.id, p] as const))('%s isotherm properties', (_id, p) => {
  const iso = p.isotherm.desorption
  // an isotherm measured at one temperature is exercised ±10 K around it
  const [t0, t1] =
    iso.validTempC[1] - iso.validTempC[0] >= 5
      ? iso.validTempC
      : [iso.validTempC[0] - 10, iso.validTempC[0] + 10]
  const rh0 = Math.max(5, iso.validRhPct[0])
  const rh1 = Math.min(95, iso.validRhPct[1])
  const t = fc.double({ min: t0, max: t1, noNaN: true })
  const rh = fc.double({ min: rh0, max: rh1, noNaN: true })
  it('ERH(EMC(RH)) = RH within 1e-6 % RH', () => {
    fc.assert(
      fc.property(t, rh, (tc, r) => {
        const m = equilibriumMoistureDb(p, tc, r)
        expect(Math.abs(equilibriumRelativeHumidityPct(p, tc, m) - r)).toBeLessThan(1e-6)
      }),
      { numRuns: 60 },
    )
  })
  it('EMC increases with RH', () => {
    fc.assert(
      fc.property(t, rh, fc.double({ min: 0.5, max: 20, noNaN: true }), (tc, r, d) => {
        const r2 = Math.min(rh1, r + d)
        fc.pre(r2 - r > 0.1)
        expect(equilibriumMoistureDb(p, tc, r2)).toBeGreaterThan(equilibriumMoistureDb(p, tc, r))
      }),
      { numRuns: 60 },
    )
  })
  it('EMC does not increase with temperature (strictly decreases where the model has T dependence)', () => {
    const eq = iso.equation
    const tDependent = eq.model !== 'gab' || eq.hxJPerMol !== 0 || eq.hcJPerMol !== 0 || eq.hkJPerMol !== 0
    fc.assert(
      fc.property(t, rh, fc.double({ min: 1, max: 20, noNaN: true }), (tc, r, d) => {
        const tc2 = Math.min(t1, tc + d)
        fc.pre(tc2 - tc > 0.5)
        const a = equilibriumMoistureDb(p, tc, r)
        const b = equilibriumMoistureDb(p, tc2, r)
        if (tDependent) expect(b).toBeLessThan(a)
        else expect(b).toBeCloseTo(a, 12)
      }),
      { numRuns: 60 },
    )
  })
})
