import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { surfaceBalancedDrop } from '../../src/product/stepping.ts'

describe('surfaceBalancedDrop: the drop of a product whose temperature follows its surface balance', () => {
  const drop = fc.double({ min: 0, max: 1, noNaN: true })
  const cap = fc.double({ min: 1e-6, max: 1, noNaN: true })
  it('solves f·cap = dropDry + f·(dropWet − dropDry) for f in [0, 1], or is the cap (constant rate)', () => {
    fc.assert(
      fc.property(drop, drop, cap, (dDry, dWet, c) => {
        const d = surfaceBalancedDrop(dDry, dWet, c)
        expect(d).toBeGreaterThanOrEqual(0)
        expect(d).toBeLessThanOrEqual(c * (1 + 1e-12))
        if (dWet >= c) return d === c
        const f = d / c
        return Math.abs(f * c - (dDry + f * (dWet - dDry))) <= 1e-12 * Math.max(1, dDry, c)
      }),
      { numRuns: 500 },
    )
  })
  it('at one temperature (dropDry = dropWet) it is the plain min(drop, cap)', () => {
    fc.assert(
      fc.property(drop, cap, (d, c) => Math.abs(surfaceBalancedDrop(d, d, c) - Math.min(d, c)) < 1e-12),
      { numRuns: 300 },
    )
  })
  it('no wet-surface rate (cap 0, dew or calm): no drying', () => {
    expect(surfaceBalancedDrop(0.1, 0.05, 0)).toBe(0)
  })
  it('never more than the cap, and never more than the product would lose at its no-evaporation temperature when that is the faster end', () => {
    fc.assert(
      fc.property(drop, drop, cap, (a, b, c) => {
        const dDry = Math.max(a, b)
        const dWet = Math.min(a, b)
        return surfaceBalancedDrop(dDry, dWet, c) <= Math.min(dDry, c) + 1e-15
      }),
      { numRuns: 300 },
    )
  })
})
