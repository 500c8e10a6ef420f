/**
 * @module analysis/energy/cusum-arl
 * Average run lengths (ARL) of the tabular CUSUM for normal individual values, to check its design against
 * published tables and to tell the user what k and h mean in batches:
 * - one-sided zero-state ARL from the integral equation of Page (1954),
 *   L(z) = 1 + L(0)·Φ(k − z − μ) + ∫₀ʰ L(y)·φ(y − z + k − μ) dy, solved by the Nyström method on
 *   Gauss–Legendre nodes (Goel & Wu 1971, Technometrics 13:221; Vance 1986, J. Quality Technology 18:189);
 * - two-sided ARL from the one-sided ones, 1/ARL = 1/ARL⁺ + 1/ARL⁻ (Lucas & Crosier 1982,
 *   Technometrics 24:199);
 * - Siegmund's approximation ARL ≈ (e^(−2Δb) + 2Δb − 1)/(2Δ²), Δ = μ − k, b = h + 1.166 (Siegmund 1985,
 *   *Sequential Analysis*, Springer; read in a secondary copy, an R implementation that cites Montgomery's
 *   pages 416–417 for it; neither book read here).
 * μ is the shift of the mean in σ units. Checked against Lucas & Crosier (1982) Table 1 (two-sided, k = 0.5,
 * h = 4) in test/analysis/energy/cusum.test.ts.
 */
import { errorFunction } from 'simple-statistics'

/** Standard normal Φ(x) from the error function of simple-statistics (fractional error < 1.2e−7). */
function normalCdf(x: number): number {
  return 0.5 * (1 + errorFunction(x / Math.SQRT2))
}

function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI)
}

/**
 * Gauss–Legendre nodes and weights on [a, b]: roots of P_n by Newton's method from cos(π(i − ¼)/(n + ½))
 * (the classical algorithm, e.g. Press et al., *Numerical Recipes*, gauleg; from memory).
 */
export function gaussLegendre(n: number, a: number, b: number): { nodes: number[]; weights: number[] } {
  const nodes = new Array<number>(n)
  const weights = new Array<number>(n)
  const mid = 0.5 * (a + b)
  const half = 0.5 * (b - a)
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5))
    let dp = 0
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1
      let p1 = x
      for (let j = 2; j <= n; j++) {
        const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j
        p0 = p1
        p1 = p2
      }
      const pn = n === 1 ? x : p1
      const pn1 = n === 1 ? 1 : p0
      dp = (n * (x * pn - pn1)) / (x * x - 1)
      const dx = pn / dp
      x -= dx
      if (Math.abs(dx) < 1e-15) break
    }
    const w = 2 / ((1 - x * x) * dp * dp)
    nodes[i] = mid - half * x
    nodes[n - 1 - i] = mid + half * x
    weights[i] = half * w
    weights[n - 1 - i] = half * w
  }
  return { nodes, weights }
}

/** Solve A·x = b by Gaussian elimination with partial pivoting (A is overwritten). */
function solve(a: number[][], b: number[]): number[] {
  const n = b.length
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r
    ;[a[c], a[p]] = [a[p], a[c]]
    ;[b[c], b[p]] = [b[p], b[c]]
    for (let r = c + 1; r < n; r++) {
      const f = a[r][c] / a[c][c]
      if (f === 0) continue
      for (let j = c; j < n; j++) a[r][j] -= f * a[c][j]
      b[r] -= f * b[c]
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]
    for (let j = r + 1; j < n; j++) s -= a[r][j] * x[j]
    x[r] = s / a[r][r]
  }
  return x
}

/** Quadrature nodes of the Nyström solution (ample: the tables' 3 significant digits need far fewer). */
const NYSTROM_NODES = 48

/**
 * Zero-state ARL of the upper one-sided CUSUM with reference k and decision interval h (σ units) when the
 * mean has shifted by `shift` σ. Example: k = 0.5, h = 4, no shift → about 336 (two-sided 168).
 */
export function oneSidedCusumArl(k: number, h: number, shift: number, nodes = NYSTROM_NODES): number {
  if (!(h > 0 && k >= 0)) throw new RangeError(`ARL needs h > 0 and k ≥ 0, got h = ${h}, k = ${k}`)
  const { nodes: y, weights: w } = gaussLegendre(nodes, 0, h)
  const points = [0, ...y]
  const m = points.length
  const a = points.map((z, i) => {
    const row = new Array<number>(m).fill(0)
    row[i] += 1
    row[0] -= normalCdf(k - z - shift)
    for (let j = 0; j < y.length; j++) row[j + 1] -= w[j] * normalPdf(y[j] - z + k - shift)
    return row
  })
  return solve(a, new Array<number>(m).fill(1))[0]
}

/** Two-sided zero-state ARL: 1/ARL = 1/ARL⁺(μ) + 1/ARL⁻(μ), ARL⁻(μ) = ARL⁺(−μ). */
export function twoSidedCusumArl(k: number, h: number, shift: number): number {
  return 1 / (1 / oneSidedCusumArl(k, h, shift) + 1 / oneSidedCusumArl(k, h, -shift))
}

/** Siegmund's approximation of the one-sided ARL (see the module comment). */
export function siegmundOneSidedArl(k: number, h: number, shift: number): number {
  const delta = shift - k
  const b = h + 1.166
  if (Math.abs(delta) < 1e-9) return b * b
  return (Math.exp(-2 * delta * b) + 2 * delta * b - 1) / (2 * delta * delta)
}

/** Siegmund's approximation of the two-sided ARL. */
export function siegmundTwoSidedArl(k: number, h: number, shift: number): number {
  return 1 / (1 / siegmundOneSidedArl(k, h, shift) + 1 / siegmundOneSidedArl(k, h, -shift))
}
