/**
 * @module analysis/energy/ewma-chart
 * Exponentially weighted moving average chart for individual values (Roberts 1959, Technometrics 1:239;
 * form and time-varying limits as in Montgomery, *Introduction to Statistical Quality Control*, EWMA
 * section): zᵢ = λxᵢ + (1 − λ)zᵢ₋₁, z₀ = μ₀, limits μ₀ ± Lσ√(λ/(2 − λ)·[1 − (1 − λ)^(2i)]).
 * μ₀ and σ come from the baseline (the individuals chart's x̄ and MR̄/d2).
 */
import { EWMA_LAMBDA, EWMA_LIMIT_WIDTH_L } from './control-constants.ts'

export interface EwmaChart {
  lambda: number
  limitWidthL: number
  /** Target μ₀ (baseline mean). */
  centerLine: number
  /** Process σ used for the limits. */
  sigma: number
  /** zᵢ for every point. */
  ewma: number[]
  upperLimits: number[]
  lowerLimits: number[]
  /** Indices where zᵢ is outside its limits. */
  signals: { index: number; side: 'above' | 'below' }[]
  /** First signal at or after `baselineCount`, or null. */
  firstMonitoringSignal: number | null
}

/**
 * EWMA of `values` with target `centerLine` and σ `sigma`. Example: λ = 0.1, μ₀ = 0, x₁ = 1 → z₁ = 0.1,
 * limit 2.814·√(0.1/1.9·(1 − 0.81)) = 2.814·0.1 = 0.2814.
 */
export function ewmaChart(
  values: readonly number[],
  centerLine: number,
  sigma: number,
  baselineCount: number,
  lambda = EWMA_LAMBDA,
  limitWidthL = EWMA_LIMIT_WIDTH_L,
): EwmaChart {
  if (!(lambda > 0 && lambda <= 1)) throw new RangeError(`EWMA λ must be in (0, 1], got ${lambda}`)
  if (!(limitWidthL > 0)) throw new RangeError(`EWMA limit width L must be > 0, got ${limitWidthL}`)
  if (!(sigma > 0 && Number.isFinite(sigma))) throw new RangeError(`EWMA σ must be > 0, got ${sigma}`)
  const ewma: number[] = []
  const upperLimits: number[] = []
  const lowerLimits: number[] = []
  const signals: EwmaChart['signals'] = []
  let z = centerLine
  let decay = 1
  const steady = lambda / (2 - lambda)
  for (let i = 0; i < values.length; i++) {
    z = lambda * values[i] + (1 - lambda) * z
    decay *= (1 - lambda) * (1 - lambda)
    const half = limitWidthL * sigma * Math.sqrt(steady * (1 - decay))
    ewma.push(z)
    upperLimits.push(centerLine + half)
    lowerLimits.push(centerLine - half)
    if (z > centerLine + half) signals.push({ index: i, side: 'above' })
    else if (z < centerLine - half) signals.push({ index: i, side: 'below' })
  }
  const later = signals.find((s) => s.index >= baselineCount)
  return {
    lambda,
    limitWidthL,
    centerLine,
    sigma,
    ewma,
    upperLimits,
    lowerLimits,
    signals,
    firstMonitoringSignal: later ? later.index : null,
  }
}

/** Half-width of the EWMA limits once they have settled [unit of the values]: Lσ√(λ/(2 − λ)). */
export function ewmaSteadyHalfWidth(e: Pick<EwmaChart, 'lambda' | 'limitWidthL' | 'sigma'>): number {
  return e.limitWidthL * e.sigma * Math.sqrt(e.lambda / (2 - e.lambda))
}
