import { linearRegression, rSquared } from 'simple-statistics'
import { describe, expect, it } from 'vitest'
import { leverage, ordinaryLeastSquares, predict } from '../../../src/analysis/energy/linear-regression.ts'

/** Small seeded generator for synthetic batches (xorshift32, Marsaglia 2003, J. Stat. Softw. 8:14). */
function xorshift(seed: number): () => number {
  let x = seed >>> 0
  return () => {
    x ^= x << 13
    x >>>= 0
    x ^= x >>> 17
    x ^= x << 5
    x >>>= 0
    return x / 4294967296
  }
}

describe('ordinary least squares', () => {
  it('recovers known coefficients exactly from noise-free synthetic batches', () => {
    // SE = 4.2 + 0.15·W − 0.04·T − 0.12·load, chosen by hand.
    const u = xorshift(7)
    const rows = Array.from({ length: 30 }, () => [4 + 10 * u(), -5 + 30 * u(), 5 + 10 * u()])
    const y = rows.map(([w, t, l]) => 4.2 + 0.15 * w - 0.04 * t - 0.12 * l)
    const fit = ordinaryLeastSquares(rows, y, ['w', 't', 'load'])
    const est = fit.coefficients.map((c) => c.estimate)
    expect(est[0]).toBeCloseTo(4.2, 9)
    expect(est[1]).toBeCloseTo(0.15, 9)
    expect(est[2]).toBeCloseTo(-0.04, 9)
    expect(est[3]).toBeCloseTo(-0.12, 9)
    expect(fit.rSquared).toBeCloseTo(1, 12)
    expect(predict(fit, [7, 10, 9])).toBeCloseTo(4.2 + 1.05 - 0.4 - 1.08, 9)
  })
  it('with noise, recovers each coefficient within 3 standard errors, and the errors shrink as 1/√n', () => {
    const coefficients = [4.2, 0.15, -0.04, -0.12]
    const fitN = (n: number, seed: number) => {
      const u = xorshift(seed)
      const normal = () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u())
      const rows = Array.from({ length: n }, () => [4 + 10 * u(), -5 + 30 * u(), 5 + 10 * u()])
      const y = rows.map(([w, t, l]) => 4.2 + 0.15 * w - 0.04 * t - 0.12 * l + 0.1 * normal())
      return ordinaryLeastSquares(rows, y, ['w', 't', 'load'])
    }
    const small = fitN(40, 11)
    small.coefficients.forEach((c, j) => {
      expect(Math.abs(c.estimate - coefficients[j])).toBeLessThan(3 * c.standardError)
    })
    expect(small.residualStandardError).toBeGreaterThan(0.07)
    expect(small.residualStandardError).toBeLessThan(0.13)
    const large = fitN(640, 11)
    // 16× the data → standard errors about 4× smaller.
    const ratio = small.coefficients[1].standardError / large.coefficients[1].standardError
    expect(ratio).toBeGreaterThan(3)
    expect(ratio).toBeLessThan(5.3)
  })
  it('agrees with simple-statistics for one regressor (slope, intercept, R²)', () => {
    const pairs: [number, number][] = [
      [1, 2.1],
      [2, 3.9],
      [3, 6.2],
      [4, 7.8],
      [5, 10.1],
      [6, 12.2],
    ]
    const ref = linearRegression(pairs)
    const fit = ordinaryLeastSquares(
      pairs.map(([x]) => [x]),
      pairs.map(([, y]) => y),
      ['x'],
    )
    expect(fit.coefficients[0].estimate).toBeCloseTo(ref.b, 10)
    expect(fit.coefficients[1].estimate).toBeCloseTo(ref.m, 10)
    const line = (x: number) => ref.m * x + ref.b
    expect(fit.rSquared).toBeCloseTo(rSquared(pairs, line), 10)
  })
  it('standard error of a simple-regression slope matches s/√Σ(x − x̄)² (textbook formula)', () => {
    const x = [1, 2, 3, 4, 5, 6]
    const y = [2.1, 3.9, 6.2, 7.8, 10.1, 12.2]
    const fit = ordinaryLeastSquares(
      x.map((v) => [v]),
      y,
      ['x'],
    )
    const sxx = x.reduce((s, v) => s + (v - 3.5) ** 2, 0) // 17.5
    expect(fit.coefficients[1].standardError).toBeCloseTo(fit.residualStandardError / Math.sqrt(sxx), 12)
    // Intercept SE = s·√(1/n + x̄²/Sxx).
    expect(fit.coefficients[0].standardError).toBeCloseTo(
      fit.residualStandardError * Math.sqrt(1 / 6 + 3.5 ** 2 / sxx),
      12,
    )
  })
  it('leverages: Σhᵢ = p (trace of the hat matrix), h = 1/n at the regressor means, growing away from them', () => {
    // Hat-matrix identities (Montgomery, Peck & Vining ch. 4): trace H = p; for a new x0 at the means, h0 = 1/n.
    const u = xorshift(3)
    const rows = Array.from({ length: 25 }, () => [u(), 10 * u(), 100 * u()])
    const fit = ordinaryLeastSquares(
      rows,
      rows.map(([a, b, c]) => a + b + c + u()),
      ['a', 'b', 'c'],
    )
    expect(fit.leverages.reduce((s, h) => s + h, 0)).toBeCloseTo(4, 10)
    expect(leverage(fit, fit.regressorMeans)).toBeCloseTo(1 / 25, 12)
    rows.forEach((r, i) => {
      expect(leverage(fit, r)).toBeCloseTo(fit.leverages[i], 12)
    })
    const far = [fit.regressorMeans[0] + 3, fit.regressorMeans[1], fit.regressorMeans[2]]
    expect(leverage(fit, far)).toBeGreaterThan(1)
  })
  it('refuses collinear regressors and too few rows with a clear message', () => {
    const rows = Array.from({ length: 10 }, (_, i) => [i, 2 * i])
    expect(() =>
      ordinaryLeastSquares(
        rows,
        rows.map(([a]) => a + 1 + (a % 2) * 0.1),
        ['a', 'b'],
      ),
    ).toThrow(/collinear/)
    expect(() => ordinaryLeastSquares([[1], [2], [3]], [1, 2, 3], ['x'])).toThrow(
      /needs more than 3 observations/,
    )
  })
})
