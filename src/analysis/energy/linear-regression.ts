/**
 * @module analysis/energy/linear-regression
 * Ordinary least squares with an intercept: β̂ = (XᵀX)⁻¹Xᵀy, s² = RSS/(n − p), SE(β̂ⱼ) = s·√[(XᵀX)⁻¹]ⱼⱼ,
 * R² = 1 − RSS/TSS, adjusted R² = 1 − (1 − R²)(n − 1)/(n − p) (textbook OLS, e.g. Montgomery, Peck &
 * Vining, *Introduction to Linear Regression Analysis*, ch. 3). Regressors are centred before the solve
 * (better conditioning); the intercept and its standard error are then given on the original scale.
 */

export interface RegressionCoefficient {
  /** `intercept` or the regressor's name. */
  name: string
  estimate: number
  standardError: number
  /** estimate / standardError; null when the standard error is 0 (exact fit). */
  tStatistic: number | null
}

export interface LinearRegression {
  /** Intercept first, then one per regressor in the order given. */
  coefficients: RegressionCoefficient[]
  rSquared: number
  adjustedRSquared: number
  /** s = √(RSS/(n − p)). */
  residualStandardError: number
  observations: number
  degreesOfFreedom: number
  /** y − ŷ for the fitted rows. */
  residuals: number[]
  /** Leverage hᵢ = xᵢᵀ(XᵀX)⁻¹xᵢ of each fitted row (0 < hᵢ < 1; Σhᵢ = p). */
  leverages: number[]
  /** Regressor means and (XᵀX)⁻¹ of the centred design, for {@link leverage} of new rows. */
  regressorMeans: number[]
  centredInverse: number[][]
}

/** Solve the symmetric positive-definite system and return the inverse, by Gauss–Jordan with pivoting. */
function invert(matrix: number[][]): number[][] {
  const n = matrix.length
  const a = matrix.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))])
  for (let col = 0; col < n; col++) {
    let pivot = col
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) pivot = r
    const scale = Math.max(...matrix.map((row) => Math.abs(row[col])), 1e-300)
    if (Math.abs(a[pivot][col]) <= 1e-12 * scale) {
      throw new RangeError(
        'the regressors are collinear (or one is constant): the regression cannot be solved',
      )
    }
    ;[a[col], a[pivot]] = [a[pivot], a[col]]
    const p = a[col][col]
    for (let j = 0; j < 2 * n; j++) a[col][j] /= p
    for (let r = 0; r < n; r++) {
      if (r === col) continue
      const f = a[r][col]
      if (f !== 0) for (let j = 0; j < 2 * n; j++) a[r][j] -= f * a[col][j]
    }
  }
  return a.map((row) => row.slice(n))
}

/**
 * Fit y = β₀ + Σ βⱼ xⱼ. `rows[i]` holds the regressors of observation i, named by `names`. Needs more
 * observations than coefficients + 1. Example: y = 1 + 2x on x = 0…4 → β₀ = 1, β₁ = 2, R² = 1.
 */
export function ordinaryLeastSquares(
  rows: readonly (readonly number[])[],
  y: readonly number[],
  names: readonly string[],
): LinearRegression {
  const n = y.length
  const k = names.length
  const p = k + 1
  if (rows.length !== n)
    throw new RangeError(`regression: ${rows.length} rows of regressors for ${n} responses`)
  if (n <= p + 1) {
    throw new RangeError(`regression needs more than ${p + 1} observations for ${p} coefficients, got ${n}`)
  }
  for (let i = 0; i < n; i++) {
    if (rows[i].length !== k)
      throw new RangeError(`regression row ${i + 1} has ${rows[i].length} values, expected ${k}`)
    if (!Number.isFinite(y[i]) || rows[i].some((v) => !Number.isFinite(v))) {
      throw new RangeError(`regression row ${i + 1} has a value that is not a finite number`)
    }
  }
  const means = names.map((_, j) => rows.reduce((s, r) => s + r[j], 0) / n)
  const yMean = y.reduce((s, v) => s + v, 0) / n
  // Centred design: [1, x − x̄]; the intercept column is then orthogonal to the rest.
  const design = rows.map((r) => [1, ...r.map((v, j) => v - means[j])])
  const xtx = Array.from({ length: p }, (_, a) =>
    Array.from({ length: p }, (_, b) => design.reduce((s, row) => s + row[a] * row[b], 0)),
  )
  const xty = Array.from({ length: p }, (_, a) => design.reduce((s, row, i) => s + row[a] * y[i], 0))
  const inverse = invert(xtx)
  const beta = inverse.map((row) => row.reduce((s, v, j) => s + v * xty[j], 0))
  const residuals = design.map((row, i) => y[i] - row.reduce((s, v, j) => s + v * beta[j], 0))
  const rss = residuals.reduce((s, r) => s + r * r, 0)
  const leverageOf = (row: number[]) =>
    row.reduce((sum, v, a) => sum + v * row.reduce((t, w, b) => t + inverse[a][b] * w, 0), 0)
  const tss = y.reduce((s, v) => s + (v - yMean) ** 2, 0)
  const df = n - p
  const s2 = rss / df
  // Back to the original scale: β₀ = b₀ − Σ bⱼ x̄ⱼ; Var(β₀) = aᵀ Cov(b) a with a = (1, −x̄).
  const a = [1, ...means.map((m) => -m)]
  let varIntercept = 0
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) varIntercept += a[i] * a[j] * inverse[i][j]
  const intercept = beta[0] - means.reduce((s, m, j) => s + m * beta[j + 1], 0)
  const coefficient = (name: string, estimate: number, variance: number): RegressionCoefficient => {
    const standardError = Math.sqrt(Math.max(0, variance * s2))
    return { name, estimate, standardError, tStatistic: standardError > 0 ? estimate / standardError : null }
  }
  if (!(tss > 0))
    throw new RangeError('regression: the response is the same in every row (no variation to explain)')
  const rSquared = 1 - rss / tss
  return {
    coefficients: [
      coefficient('intercept', intercept, varIntercept),
      ...names.map((name, j) => coefficient(name, beta[j + 1], inverse[j + 1][j + 1])),
    ],
    rSquared,
    adjustedRSquared: 1 - ((1 - rSquared) * (n - 1)) / df,
    residualStandardError: Math.sqrt(s2),
    observations: n,
    degreesOfFreedom: df,
    residuals,
    leverages: design.map(leverageOf),
    regressorMeans: means,
    centredInverse: inverse,
  }
}

/**
 * Leverage of a new row of regressors, h₀ = x₀ᵀ(XᵀX)⁻¹x₀ (with the intercept): the variance of the
 * prediction there is σ²·h₀, and of the prediction error y₀ − ŷ₀ σ²·(1 + h₀) (Montgomery, Peck & Vining,
 * *Introduction to Linear Regression Analysis*, ch. 3, prediction of new observations). Grows with the
 * distance of x₀ from the regressor means: extrapolation.
 */
export function leverage(model: LinearRegression, row: readonly number[]): number {
  const x = [1, ...row.map((v, j) => v - model.regressorMeans[j])]
  const c = model.centredInverse
  return x.reduce((sum, v, a) => sum + v * x.reduce((t, w, b) => t + c[a][b] * w, 0), 0)
}

/** ŷ for one row of regressors from a fitted model. */
export function predict(model: LinearRegression, row: readonly number[]): number {
  const c = model.coefficients
  if (row.length !== c.length - 1)
    throw new RangeError(`predict: ${row.length} values for ${c.length - 1} regressors`)
  return c[0].estimate + row.reduce((s, v, j) => s + v * c[j + 1].estimate, 0)
}
