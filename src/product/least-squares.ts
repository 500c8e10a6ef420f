/**
 * @module product/least-squares
 * Non-linear least squares by Levenberg–Marquardt (Levenberg 1944; Marquardt 1963, *J. SIAM* 11:431), with
 * the damping update of Nielsen (1999) as given in Madsen, Nielsen & Tingleff 2004, *Methods for Non-Linear
 * Least Squares Problems*, 2nd ed., Algorithm 3.16; forward-difference Jacobian. Standard errors from the
 * covariance s²·(JᵀJ)⁻¹ at the solution, s² = SSE/(n − p) (e.g. Bates & Watts 1988, ch. 2).
 */

export interface LeastSquaresResult {
  params: number[]
  standardErrors: number[]
  sse: number
  iterations: number
  converged: boolean
}

/** Solve the small dense system A·x = b by Gaussian elimination with partial pivoting; null when singular. */
export function solveLinear(a: number[][], b: number[]): number[] | null {
  const n = b.length
  const m = a.map((row, i) => [...row, b[i]])
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r
    if (!(Math.abs(m[p][c]) > 1e-300)) return null
    ;[m[c], m[p]] = [m[p], m[c]]
    for (let r = c + 1; r < n; r++) {
      const f = m[r][c] / m[c][c]
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k]
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n]
    for (let k = r + 1; k < n; k++) s -= m[r][k] * x[k]
    x[r] = s / m[r][r]
  }
  return x.every(Number.isFinite) ? x : null
}

function invert(a: number[][]): number[][] | null {
  const n = a.length
  const cols: number[][] = []
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0)
    e[j] = 1
    const x = solveLinear(a, e)
    if (!x) return null
    cols.push(x)
  }
  return a.map((_, i) => cols.map((c) => c[i]))
}

/**
 * Minimise Σ residuals(p)² from `initial`. `residuals` may throw RangeError or return non-finite values
 * for parameters outside their domain: such steps are rejected (treated as infinite SSE).
 */
export function levenbergMarquardt(
  residuals: (p: number[]) => number[],
  initial: number[],
  options: { maxIterations?: number; tolerance?: number } = {},
): LeastSquaresResult {
  const maxIter = options.maxIterations ?? 200
  const tol = options.tolerance ?? 1e-9
  const evalSse = (p: number[]): { r: number[]; sse: number } | null => {
    try {
      const r = residuals(p)
      const sse = r.reduce((s, v) => s + v * v, 0)
      return Number.isFinite(sse) ? { r, sse } : null
    } catch (e) {
      if (e instanceof RangeError) return null
      throw e
    }
  }
  let p = [...initial]
  let cur = evalSse(p)
  if (!cur) throw new RangeError('least squares: the starting parameters are outside the model domain')
  const jacobian = (q: number[], r0: number[]): number[][] => {
    const jac = r0.map(() => new Array<number>(q.length).fill(0))
    for (let j = 0; j < q.length; j++) {
      const h = 1e-6 * Math.max(Math.abs(q[j]), 1e-8)
      const qh = [...q]
      qh[j] += h
      const e = evalSse(qh)
      const rh = e ? e.r : null
      for (let i = 0; i < r0.length; i++) jac[i][j] = rh ? (rh[i] - r0[i]) / h : 0
    }
    return jac
  }
  const normal = (jac: number[][], r: number[]) => {
    const np = p.length
    const jtj = Array.from({ length: np }, () => new Array<number>(np).fill(0))
    const jtr = new Array<number>(np).fill(0)
    for (let i = 0; i < r.length; i++) {
      for (let a = 0; a < np; a++) {
        jtr[a] += jac[i][a] * r[i]
        for (let b = 0; b < np; b++) jtj[a][b] += jac[i][a] * jac[i][b]
      }
    }
    return { jtj, jtr }
  }
  let jac = jacobian(p, cur.r)
  let { jtj, jtr } = normal(jac, cur.r)
  let mu = 1e-3 * Math.max(...jtj.map((row, i) => row[i]))
  let nu = 2
  let converged = false
  let iter = 0
  for (; iter < maxIter; iter++) {
    const a = jtj.map((row, i) => row.map((v, j) => (i === j ? v + mu * Math.max(v, 1e-30) : v)))
    const step = solveLinear(
      a,
      jtr.map((v) => -v),
    )
    if (!step) {
      mu *= nu
      nu *= 2
      continue
    }
    const pNew = p.map((v, i) => v + step[i])
    const next = evalSse(pNew)
    const predicted = step.reduce((s, d, i) => s + d * (mu * Math.max(jtj[i][i], 1e-30) * d - jtr[i]), 0)
    const rho = next && predicted > 0 ? (cur.sse - next.sse) / predicted : -1
    if (next && rho > 0) {
      const small = step.every((d, i) => Math.abs(d) <= tol * (Math.abs(p[i]) + tol))
      const rel = cur.sse - next.sse <= tol * cur.sse
      p = pNew
      cur = next
      jac = jacobian(p, cur.r)
      ;({ jtj, jtr } = normal(jac, cur.r))
      mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3)
      nu = 2
      if (small || rel) {
        converged = true
        break
      }
    } else {
      mu *= nu
      nu *= 2
      if (mu > 1e20) break
    }
  }
  const n = cur.r.length
  const dof = n - p.length
  const s2 = dof > 0 ? cur.sse / dof : Number.NaN
  const cov = invert(jtj)
  const standardErrors = p.map((_, i) =>
    cov && dof > 0 && cov[i][i] >= 0 ? Math.sqrt(s2 * cov[i][i]) : Number.POSITIVE_INFINITY,
  )
  return { params: p, standardErrors, sse: cur.sse, iterations: iter, converged }
}
