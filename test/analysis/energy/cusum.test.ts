import { describe, expect, it } from 'vitest'
import {
  gaussLegendre,
  oneSidedCusumArl,
  siegmundOneSidedArl,
  siegmundTwoSidedArl,
  twoSidedCusumArl,
} from '../../../src/analysis/energy/cusum-arl.ts'
import { CUSUM_H, CUSUM_K, cusumChart } from '../../../src/analysis/energy/cusum-chart.ts'

describe('tabular CUSUM', () => {
  it('worked example by hand: μ0 = 0, σ = 1, k = 0.5, h = 5', () => {
    // C⁺ = max(0, z − 0.5 + C⁺₋₁): 2 → 1.5, 3, 4.5, 6 (> 5: signal on the fourth); C⁻ stays 0.
    const c = cusumChart([2, 2, 2, 2], 0, 1, 0)
    expect(c.upper).toEqual([1.5, 3, 4.5, 6])
    expect(c.lower).toEqual([0, 0, 0, 0])
    expect(c.signals).toEqual([{ index: 3, side: 'above' }])
    expect(c.firstUpperSignal).toBe(3)
    expect(c.firstLowerSignal).toBeNull()
  })
  it('standardizes by μ0 and σ, and sums the lower side for falls', () => {
    // x = 10 − 2·3 = 4 → z = −3: C⁻ = 2.5, 5, 7.5 → signal on the third.
    const c = cusumChart([4, 4, 4], 10, 2, 0)
    expect(c.lower).toEqual([2.5, 5, 7.5])
    expect(c.firstLowerSignal).toBe(2)
  })
  it('starts again from zero at the first monitored point', () => {
    const c = cusumChart([3, 3, 3, 0, 0], 0, 1, 3)
    expect(c.upper.slice(0, 3)).toEqual([2.5, 5, 7.5])
    expect(c.upper[3]).toBe(0)
    expect(c.signals.map((s) => s.index)).toEqual([2])
    expect(c.firstUpperSignal).toBeNull()
  })
  it('uses k = 1/2 and h = 5 (Montgomery & Runger, section 16-10: h = 4 or 5 with k = 1/2)', () => {
    expect(CUSUM_K).toBe(0.5)
    expect(CUSUM_H).toBe(5)
  })
})

describe('CUSUM average run lengths', () => {
  it('Gauss–Legendre with 5 nodes integrates x⁸ on [−1, 1] exactly (2/9) and a cosine on [0, h] closely', () => {
    const g = gaussLegendre(5, -1, 1)
    expect(g.nodes.reduce((s, x, i) => s + g.weights[i] * x ** 8, 0)).toBeCloseTo(2 / 9, 13)
    const h = gaussLegendre(12, 0, 4)
    expect(h.nodes.reduce((s, x, i) => s + h.weights[i] * Math.cos(x), 0)).toBeCloseTo(Math.sin(4), 12)
  })
  it('match Lucas & Crosier (1982) Table 1, two-sided CUSUM, k = 0.5, h = 4, to the digits printed', () => {
    // Lucas, J. M. & Crosier, R. B. (1982), "Fast initial response for CUSUM quality-control schemes: give your
    // CUSUM a head start", Technometrics 24:199–205, Table 1 (no head start), read in a secondary copy: the
    // examples of the R package spc (S. Knoth), man/xcusum.arl.Rd, which quote the table. Shift in σ units →
    // ARL. Montgomery's CUSUM ARL table for h = 4 shows the same column (from memory; not read here).
    const table: [number, number][] = [
      [0, 168],
      [0.25, 74.2],
      [0.5, 26.6],
      [0.75, 13.3],
      [1, 8.38],
      [1.5, 4.75],
      [2, 3.34],
      [2.5, 2.62],
      [3, 2.19],
      [4, 1.71],
      [5, 1.31],
    ]
    for (const [shift, arl] of table) {
      // Half a unit in the last printed digit (3 significant digits).
      const halfUnit = 0.5 * 10 ** (Math.floor(Math.log10(arl)) - 2)
      expect(Math.abs(twoSidedCusumArl(0.5, 4, shift) - arl), `shift ${shift}`).toBeLessThanOrEqual(halfUnit)
    }
  })
  it('match Brook & Evans (1972) for the one-sided CUSUM with k = 0.5, h = 3', () => {
    // Brook, D. & Evans, D. A. (1972), Biometrika 59:539, section 4.3: L0 = 117.59, L1(μ = 1.5) = 3.75 by their
    // Markov chain (read in the same secondary copy). The integral equation agrees within 0.05 %.
    expect(oneSidedCusumArl(0.5, 3, 0)).toBeCloseTo(117.59, 0)
    expect(Math.abs(oneSidedCusumArl(0.5, 3, 0) / 117.59 - 1)).toBeLessThan(5e-4)
    expect(oneSidedCusumArl(0.5, 3, 1.5)).toBeCloseTo(3.75, 2)
  })
  it('the design used (k = 0.5, h = 5): two-sided in-control ARL about 465, about 2.6 batches for a 3σ step', () => {
    // Computed by the same integral equation that matches the published h = 4 column above.
    expect(twoSidedCusumArl(0.5, 5, 0)).toBeCloseTo(465.4, 0)
    expect(twoSidedCusumArl(0.5, 5, 1)).toBeCloseTo(10.38, 1)
    expect(twoSidedCusumArl(0.5, 5, 3)).toBeCloseTo(2.57, 2)
  })
  it("Siegmund's approximation is within 1 % of the integral equation in control and slightly short for large shifts", () => {
    // Siegmund (1985), as given by Montgomery: b = h + 1.166, Δ = μ − k.
    expect(Math.abs(siegmundTwoSidedArl(0.5, 4, 0) / twoSidedCusumArl(0.5, 4, 0) - 1)).toBeLessThan(0.01)
    expect(Math.abs(siegmundTwoSidedArl(0.5, 5, 0) / twoSidedCusumArl(0.5, 5, 0) - 1)).toBeLessThan(0.01)
    expect(siegmundTwoSidedArl(0.5, 4, 3)).toBeLessThan(twoSidedCusumArl(0.5, 4, 3))
    // Δ = 0 (μ = k): the formula's limit b².
    expect(siegmundOneSidedArl(0.5, 4, 0.5)).toBeCloseTo(5.166 ** 2, 9)
  })
  it('a seeded simulation of the CUSUM itself agrees with the integral equation in control (h = 5)', () => {
    // 2000 in-control runs (xorshift32 + Box–Muller); run length = first signal. ARL ≈ 465 with a standard
    // error of about 465/√2000 ≈ 10: accept 420…510.
    let x = 88172645
    const u = () => {
      x ^= x << 13
      x >>>= 0
      x ^= x >>> 17
      x ^= x << 5
      x >>>= 0
      return (x + 0.5) / 4294967296
    }
    const runs = 2000
    let total = 0
    for (let r = 0; r < runs; r++) {
      let cu = 0
      let cl = 0
      let n = 0
      for (;;) {
        n++
        const z = Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u())
        cu = Math.max(0, z - 0.5 + cu)
        cl = Math.max(0, -z - 0.5 + cl)
        if (cu > 5 || cl > 5) break
      }
      total += n
    }
    expect(total / runs).toBeGreaterThan(420)
    expect(total / runs).toBeLessThan(510)
  })
})
