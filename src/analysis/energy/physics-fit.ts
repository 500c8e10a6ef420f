/**
 * @module analysis/energy/physics-fit
 * Fit the two numbers that turn the ideal heat of ./dryer-physics.ts into the expected heat of one
 * dryer, over its baseline batches: an overall efficiency η (heater, flue, and the share of the air's
 * capacity for water that the dryer uses) and a fixed loss L per batch (warming the dryer, purging,
 * cooling), so that the expected heat of a batch is Q̂ = m_w·φ/η + L, or per kg of water
 * ê = φ/η + L/m_w. Least squares on the specific energy e = Q/m_w, linear in a = 1/η and L (no intercept:
 * the regressors are φ and 1/m_w). L is held at zero when the free fit makes it negative (a loss cannot
 * be a gain). Leave-one-out cross-validated error from the hat matrix, eᵢ/(1 − hᵢᵢ) (the PRESS residual,
 * Montgomery, Peck & Vining, *Introduction to Linear Regression Analysis*, ch. 4), and the leverage
 * h = xᵀ(XᵀX)⁻¹x of any batch, x = (φ, 1/m_w), which grows as a batch's weather moves away from the
 * baseline's (ch. 3, prediction of new observations).
 */

export interface PhysicsFit {
  /** Overall efficiency η = 1/a (fraction). */
  efficiency: number
  /** Fixed loss per batch L [MJ]; 0 when held there. */
  fixedLossMj: number
  /** True when the free fit gave L < 0 and L was held at 0. */
  fixedLossHeldAtZero: boolean
  /** Standard error of η (delta method, SE(a)/a²). */
  efficiencyStandardError: number
  /** Standard error of L [MJ] (null when held at 0). */
  fixedLossStandardError: number | null
  /** Root mean square of the fit's residuals in specific energy [MJ/kg water] (divided by n − p). */
  residualStandardError: number
  /** Root mean square of the leave-one-out prediction errors [MJ/kg water]. */
  crossValidatedError: number
  observations: number
  /** (XᵀX)⁻¹ of the fit's regressors (1×1 when L is held at 0), for {@link physicsLeverage}. */
  inverse: number[][]
}

/** Leverage h = xᵀ(XᵀX)⁻¹x of a batch with ideal heat φ [MJ/kg] and water removed [kg] under `fit`. */
export function physicsLeverage(fit: PhysicsFit, idealMjPerKg: number, waterKg: number): number {
  const x = fit.fixedLossHeldAtZero ? [idealMjPerKg] : [idealMjPerKg, 1 / waterKg]
  return x.reduce((s, v, a) => s + v * x.reduce((t, w, b) => t + fit.inverse[a][b] * w, 0), 0)
}

/** Expected specific energy [MJ/kg water] of a batch with ideal heat φ [MJ/kg] and water removed [kg]. */
export function expectedSpecificEnergy(fit: PhysicsFit, idealMjPerKg: number, waterKg: number): number {
  return idealMjPerKg / fit.efficiency + fit.fixedLossMj / waterKg
}

/** Solve the least-squares problem on columns `x` (no intercept); returns β, (XᵀX)⁻¹ and residuals. */
function leastSquares(x: number[][], y: number[]) {
  const p = x[0].length
  const xtx = Array.from({ length: p }, (_, a) =>
    Array.from({ length: p }, (_, b) => x.reduce((s, r) => s + r[a] * r[b], 0)),
  )
  const xty = Array.from({ length: p }, (_, a) => x.reduce((s, r, i) => s + r[a] * y[i], 0))
  let inv: number[][]
  if (p === 1) inv = [[1 / xtx[0][0]]]
  else {
    const det = xtx[0][0] * xtx[1][1] - xtx[0][1] * xtx[1][0]
    if (!(Math.abs(det) > 1e-12 * xtx[0][0] * xtx[1][1]))
      throw new RangeError('the physics fit cannot separate the efficiency from the fixed loss')
    inv = [
      [xtx[1][1] / det, -xtx[0][1] / det],
      [-xtx[1][0] / det, xtx[0][0] / det],
    ]
  }
  const beta = inv.map((row) => row.reduce((s, v, j) => s + v * xty[j], 0))
  const residuals = x.map((r, i) => y[i] - r.reduce((s, v, j) => s + v * beta[j], 0))
  const hat = x.map((r) => r.reduce((s, v, a) => s + v * r.reduce((t, w, b) => t + inv[a][b] * w, 0), 0))
  return { beta, inv, residuals, hat }
}

/**
 * Fit η and L over the baseline: `idealMjPerKg[i]` is φ of batch i, `waterKg[i]` its water removed,
 * `specificMjPerKg[i]` its measured fuel heat per kg of water. Needs at least 4 batches. Example: batches
 * with e = φ/0.5 + 100/m_w exactly give η = 0.5, L = 100 MJ.
 */
export function fitPhysics(
  idealMjPerKg: readonly number[],
  waterKg: readonly number[],
  specificMjPerKg: readonly number[],
): PhysicsFit {
  const n = idealMjPerKg.length
  if (n < 4) throw new RangeError(`the physics fit needs at least 4 baseline batches, got ${n}`)
  if (waterKg.length !== n || specificMjPerKg.length !== n)
    throw new RangeError('the physics fit needs one water mass and one specific energy per batch')
  for (let i = 0; i < n; i++) {
    if (!(idealMjPerKg[i] > 0 && waterKg[i] > 0 && Number.isFinite(specificMjPerKg[i])))
      throw new RangeError(`physics fit: batch ${i + 1} has a value that is not a positive finite number`)
  }
  const y = [...specificMjPerKg]
  let x = idealMjPerKg.map((phi, i) => [phi, 1 / waterKg[i]])
  let fit = leastSquares(x, y)
  let held = false
  if (!(fit.beta[1] >= 0)) {
    held = true
    x = idealMjPerKg.map((phi) => [phi])
    fit = leastSquares(x, y)
  }
  const a = fit.beta[0]
  if (!(a > 0)) throw new RangeError('the physics fit gives no positive efficiency: check the log')
  const p = x[0].length
  const rss = fit.residuals.reduce((s, r) => s + r * r, 0)
  const s2 = rss / (n - p)
  const press = fit.residuals.reduce((s, r, i) => s + (r / (1 - fit.hat[i])) ** 2, 0)
  return {
    efficiency: 1 / a,
    fixedLossMj: held ? 0 : fit.beta[1],
    fixedLossHeldAtZero: held,
    efficiencyStandardError: Math.sqrt(s2 * fit.inv[0][0]) / (a * a),
    fixedLossStandardError: held ? null : Math.sqrt(s2 * fit.inv[1][1]),
    residualStandardError: Math.sqrt(s2),
    crossValidatedError: Math.sqrt(press / n),
    observations: n,
    inverse: fit.inv,
  }
}
