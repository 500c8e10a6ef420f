/**
 * @module product/fit-isotherm
 * Fit the three constants of an ASABE D245 form (modified Henderson, Chung–Pfost, Halsey or Oswin; the forms in
 * `isotherm-models.ts`) to published equilibrium-moisture points by least squares (Levenberg–Marquardt,
 * `least-squares.ts`). The residual is the difference in moisture, % wet basis, between the isotherm and the
 * point, because the tables growers and extension services publish are in % wet basis: the fit minimises what a
 * reader of the table would see. The isotherm is evaluated by `emcDb`, the function the engine uses, so the
 * constants that come out are the ones the engine needs. `fitGabIsotherm` does the same for the GAB form (Xm0, C0,
 * K0; the temperature terms are held at the starting set's, because points at one temperature cannot give them).
 */
import { emcDb, type IsothermEquation } from './isotherm-models.ts'
import { levenbergMarquardt } from './least-squares.ts'
import { moistureWbPctFromDb } from './moisture-basis.ts'

/** One published point: air temperature [°C], relative humidity [%], equilibrium moisture [% wb]. */
export interface EmcPoint {
  tC: number
  rhPct: number
  emcWbPct: number
}

export type ThreeConstantModel = Exclude<IsothermEquation['model'], 'gab'>

export interface IsothermFit {
  equation: Extract<IsothermEquation, { model: ThreeConstantModel }>
  /** Root-mean-square residual [% wb points]. */
  rmseWbPct: number
  /** Largest absolute residual [% wb points]. */
  maxAbsWbPct: number
  n: number
  converged: boolean
}

/** Residuals [% wb] of `eq` at `points`: isotherm minus point. Throws RangeError outside the model's domain. */
export function emcResidualsWbPct(eq: IsothermEquation, points: readonly EmcPoint[]): number[] {
  return points.map((p) => moistureWbPctFromDb(emcDb(eq, p.tC, p.rhPct)) - p.emcWbPct)
}

/** Residual summary of a given equation against points. */
export function emcFitQuality(
  eq: IsothermEquation,
  points: readonly EmcPoint[],
): { rmseWbPct: number; maxAbsWbPct: number } {
  const r = emcResidualsWbPct(eq, points)
  return {
    rmseWbPct: Math.sqrt(r.reduce((s, v) => s + v * v, 0) / r.length),
    maxAbsWbPct: Math.max(...r.map(Math.abs)),
  }
}

/**
 * Least-squares constants of `start.model` for `points`, starting from `start`'s constants (a previous set for
 * the same product, or a set for a similar grain: the forms are non-linear and need a start in their domain).
 */
export function fitIsotherm(
  start: Extract<IsothermEquation, { model: ThreeConstantModel }>,
  points: readonly EmcPoint[],
): IsothermFit {
  const model = start.model
  return fitThreeConstants(
    (p) => ({ model, a: p[0], b: p[1], c: p[2] }) as IsothermFit['equation'],
    [start.a, start.b, start.c],
    points,
  )
}

/**
 * The least-squares fit both forms share: three constants `p` turned into an equation by `eqOf`, residuals in
 * % wb through `emcDb` (a step outside the form's domain, or one `admissible` refuses, is rejected by the solver).
 */
function fitThreeConstants<E extends IsothermEquation>(
  eqOf: (p: number[]) => E,
  start: number[],
  points: readonly EmcPoint[],
  admissible: (p: number[]) => boolean = () => true,
): Omit<IsothermFit, 'equation'> & { equation: E } {
  if (points.length < 4) throw new RangeError(`an isotherm fit needs at least 4 points, got ${points.length}`)
  const residuals = (p: number[]) => {
    if (!admissible(p)) throw new RangeError("constants outside the form's admissible range")
    const r = emcResidualsWbPct(eqOf(p), points)
    if (!r.every(Number.isFinite)) throw new RangeError('isotherm outside its domain')
    return r
  }
  const result = levenbergMarquardt(residuals, start, { maxIterations: 500, tolerance: 1e-12 })
  const equation = eqOf(result.params)
  return { equation, ...emcFitQuality(equation, points), n: points.length, converged: result.converged }
}

export type GabEquation = Extract<IsothermEquation, { model: 'gab' }>

export interface GabFit extends Omit<IsothermFit, 'equation'> {
  equation: GabEquation
}

/**
 * Least-squares Xm0, C0 and K0 of the GAB form for `points` [% wb], from `start`; ΔHx, ΔHc and ΔHk stay at
 * `start`'s. A step that puts K·aw at or above 1 at a point (where GAB diverges) is rejected by the solver.
 */
export function fitGabIsotherm(start: GabEquation, points: readonly EmcPoint[]): GabFit {
  return fitThreeConstants(
    (p): GabEquation => ({ ...start, xm0: p[0], c0: p[1], k0: p[2] }),
    [start.xm0, start.c0, start.k0],
    points,
    // GAB constants are positive
    (p) => p[0] > 0 && p[1] > 0 && p[2] > 0,
  )
}
