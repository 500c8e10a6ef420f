/**
 * @module analysis/energy/regression-view
 * The regression view: specific energy regressed on outside humidity ratio, outside temperature and load
 * over the baseline (./linear-regression.ts), and the charts of what they do not explain, the residual
 * standardized by its leverage (internally studentized in the baseline, prediction-standardized after it;
 * Montgomery, Peck & Vining, *Introduction to Linear Regression Analysis*, ch. 3–4). A straight line fitted
 * to the baseline's weather: good inside that weather, an extrapolation outside it.
 */
import type { BatchEnergy } from './batch-energy.ts'
import { type ChartSet, chartSet } from './chart-set.ts'
import { type LinearRegression, leverage, ordinaryLeastSquares, predict } from './linear-regression.ts'

/** Regressors of the regression view, in order. */
export const ADJUSTMENT_REGRESSORS = ['ambientHumidityRatioGPerKg', 'ambientTempC', 'freshMassT'] as const

export interface RegressionView extends ChartSet {
  regression: Omit<LinearRegression, 'residuals' | 'leverages' | 'regressorMeans' | 'centredInverse'>
  fitted: number[]
  /** y − ŷ [MJ/kg water] of each charted batch. */
  residuals: number[]
  /** Leverage h of each charted batch (baseline: in the fit; monitored: of a new observation). */
  leverages: number[]
  /** What is charted: baseline e/√(1 − h), monitored e/√(1 + h); each has variance σ² when in control. */
  standardizedResiduals: number[]
  /** Root mean square of the leave-one-out (PRESS) errors eᵢ/(1 − hᵢ) over the baseline [MJ/kg water]. */
  crossValidatedError: number
}

const regressorsOf = (b: BatchEnergy): number[] => [
  b.ambient!.humidityRatioGPerKg,
  b.ambient!.dryBulbC,
  b.freshMassKg / 1000,
]

/** The regression view, with the extrapolation warning, or the reason it cannot be drawn. */
export function regressionView(
  batches: BatchEnergy[],
  baselineCount: number,
): { view: RegressionView; extrapolation: string | null } | { view: null; reason: string } {
  const complete = batches.filter((b) => b.ambient !== null)
  const completeBaseline = complete.filter((b) => b.index < baselineCount)
  if (completeBaseline.length < baselineCount) {
    return {
      view: null,
      reason: `${baselineCount - completeBaseline.length} baseline batches have no outside temperature and RH (add ambient_temp_c and ambient_rh_pct, or a weather file covering them)`,
    }
  }
  if (completeBaseline.length < ADJUSTMENT_REGRESSORS.length + 3) {
    return {
      view: null,
      reason: `the regression needs at least ${ADJUSTMENT_REGRESSORS.length + 3} baseline batches, got ${completeBaseline.length}`,
    }
  }
  try {
    const model = ordinaryLeastSquares(
      completeBaseline.map(regressorsOf),
      completeBaseline.map((b) => b.specificEnergyMjPerKg),
      ADJUSTMENT_REGRESSORS,
    )
    const {
      residuals: fitResiduals,
      leverages: fitLeverages,
      regressorMeans: _means,
      centredInverse: _inverse,
      ...regression
    } = model
    const fitted = complete.map((b) => predict(model, regressorsOf(b)))
    const residuals = complete.map((b, i) => b.specificEnergyMjPerKg - fitted[i])
    const leverages = complete.map((b) => leverage(model, regressorsOf(b)))
    const standardizedResiduals = residuals.map((e, i) =>
      complete[i].index < baselineCount
        ? e / Math.sqrt(Math.max(1e-9, 1 - leverages[i]))
        : e / Math.sqrt(1 + leverages[i]),
    )
    const set = chartSet(
      standardizedResiduals,
      complete.map((b) => b.index),
      completeBaseline.length,
      batches,
      baselineCount,
      'MJ/kg water',
    )
    // The size of a shift is reported in MJ/kg of plain residual (the standardized one is shrunk by √(1 + h)).
    const change = set.finding.estimatedChangeStart
    if (change) {
      const after = residuals.slice(set.batchIndices.indexOf(change.batchIndex))
      set.finding.shiftAfterChange = after.reduce((sum, v) => sum + v, 0) / after.length
    }
    const press = fitResiduals.reduce((s, e, i) => s + (e / (1 - fitLeverages[i])) ** 2, 0)
    return {
      view: {
        ...set,
        regression,
        fitted,
        residuals,
        leverages,
        standardizedResiduals,
        crossValidatedError: Math.sqrt(press / fitResiduals.length),
      },
      extrapolation: extrapolationWarning(
        completeBaseline.map(regressorsOf),
        complete.filter((b) => b.index >= baselineCount).map(regressorsOf),
      ),
    }
  } catch (e) {
    if (!(e instanceof RangeError)) throw e
    return { view: null, reason: e.message }
  }
}

const REGRESSOR_WORDS = ['outside humidity ratio', 'outside temperature', 'load']

/**
 * A warning when monitored batches lie outside the baseline's range of a regressor: there the regression
 * extrapolates, and an error in a coefficient becomes a steady offset of the residuals that the run rules
 * and the EWMA read as a shift. Null when every monitored batch is inside the baseline's ranges.
 */
export function extrapolationWarning(baseline: number[][], monitored: number[][]): string | null {
  if (monitored.length === 0) return null
  const parts: string[] = []
  REGRESSOR_WORDS.forEach((word, j) => {
    const lo = baseline.reduce((m, r) => Math.min(r[j], m), Number.POSITIVE_INFINITY)
    const hi = baseline.reduce((m, r) => Math.max(r[j], m), Number.NEGATIVE_INFINITY)
    const outside = monitored.filter((r) => r[j] < lo || r[j] > hi).length
    if (outside > 0)
      parts.push(`${outside} ${parts.length === 0 ? "lie outside the baseline's range of " : 'of '}${word}`)
  })
  if (parts.length === 0) return null
  return (
    `Of ${monitored.length} monitored batches, ${parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}` : parts[0]}: the regression view ` +
    'extrapolates there, so a run of signals on those batches may come from an error in a coefficient ' +
    'rather than the dryer. A baseline that spans the season (or a later re-fit) makes the regression view safer.'
  )
}
