import { describe, expect, it } from 'vitest'
import { estimateChangePoint } from '../../../src/analysis/energy/change-point.ts'

/**
 * Independent check of the closed form: the posterior of τ by numerical integration of the likelihood over
 * the step δ (flat prior on δ > 0, or δ < 0), by the trapezoid rule on a fine grid.
 */
function bruteForce(values: number[], mu: number, sigma: number, from: number, last: number, up: boolean) {
  const logLik = (tau: number, delta: number) =>
    values.reduce((s, x, i) => {
      const m = i >= tau ? mu + delta : mu
      return s - ((x - m) * (x - m)) / (2 * sigma * sigma)
    }, 0)
  const post: number[] = []
  for (let tau = from; tau <= last; tau++) {
    let sum = 0
    const steps = 20000
    const span = 20 * sigma
    for (let j = 0; j <= steps; j++) {
      const delta = ((up ? 1 : -1) * (span * j)) / steps
      sum += (j === 0 || j === steps ? 0.5 : 1) * Math.exp(logLik(tau, delta) - logLik(0, 0))
    }
    post.push(sum)
  }
  const total = post.reduce((s, v) => s + v, 0)
  return post.map((p) => p / total)
}

describe('change-point estimate', () => {
  it('finds a clear step and agrees with numerical integration over the step size', () => {
    const values = [0.1, -0.2, 0.3, 2.8, 3.1, 2.9]
    const e = estimateChangePoint(values, 0, 1, 1, 5, 'up')
    expect(e.index).toBe(3)
    const brute = bruteForce(values, 0, 1, 1, 5, true)
    e.candidates.forEach((c, j) => {
      expect(c.probability).toBeCloseTo(brute[j], 6)
    })
    expect(e.probability).toBeGreaterThan(0.8)
    expect(e.intervalFrom).toBeLessThanOrEqual(3)
    expect(e.intervalTo).toBeGreaterThanOrEqual(3)
    expect(e.intervalProbability).toBeGreaterThanOrEqual(0.9)
    // Shift: mean of (x − μ0) from the change on = (2.8 + 3.1 + 2.9)/3.
    expect(e.shift).toBeCloseTo(8.8 / 3, 12)
  })
  it('is less sure of a small step in noise, and its interval widens', () => {
    const values = [0.3, -0.5, 0.8, -0.1, 0.9, 0.2, 1.4, 0.6, 1.1, 0.7, 1.5, 0.4]
    const e = estimateChangePoint(values, 0, 1, 2, 11, 'up')
    const brute = bruteForce(values, 0, 1, 2, 11, true)
    e.candidates.forEach((c, j) => {
      expect(c.probability).toBeCloseTo(brute[j], 6)
    })
    expect(e.probability).toBeLessThan(0.6)
    expect(e.intervalTo - e.intervalFrom).toBeGreaterThanOrEqual(2)
  })
  it('looks for falls with direction down', () => {
    const values = [5, 5.1, 4.9, 5, 3, 3.1, 2.9]
    const e = estimateChangePoint(values, 5, 0.1, 1, 6, 'down')
    expect(e.index).toBe(4)
    expect(e.shift).toBeCloseTo(-2, 1)
    const brute = bruteForce(values, 5, 0.1, 1, 6, false)
    expect(e.candidates[3].probability).toBeCloseTo(brute[3], 6)
  })
  it('its mode is the maximum-likelihood step of Hinkley (1970) for a clear step', () => {
    // ML: argmax over τ of S_τ²/n_τ with S_τ = Σ_{i ≥ τ}(xᵢ − μ0).
    const values = [0, 0.5, -0.4, 0.2, 1.9, 2.4, 1.7, 2.2, 2.0]
    const score = (tau: number) => {
      const tail = values.slice(tau)
      const s = tail.reduce((a, b) => a + b, 0)
      return (s * s) / tail.length
    }
    const ml = [1, 2, 3, 4, 5, 6, 7, 8].reduce((b, t) => (score(t) > score(b) ? t : b))
    expect(estimateChangePoint(values, 0, 0.5, 1, 8, 'up').index).toBe(ml)
  })
  it('rejects a search outside the values', () => {
    expect(() => estimateChangePoint([1, 2], 0, 1, 1, 3, 'up')).toThrow(/change search needs/)
    expect(() => estimateChangePoint([1, 2], 0, 0, 0, 1, 'up')).toThrow(/σ > 0/)
  })
})
