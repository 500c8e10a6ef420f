/**
 * @module analysis/energy/individuals-chart
 * Individuals (X) and moving-range (MR) control chart with limits from a baseline (phase I) applied to
 * every later point (phase II monitoring). σ̂ = MR̄/d2, individuals limits x̄ ± 3σ̂, MR chart UCL = D4·MR̄,
 * LCL = D3·MR̄ (Montgomery, *Introduction to Statistical Quality Control*, section 6.4 "control charts for
 * individual measurements", constants from Appendix Table VI at n = 2). Western Electric rules on the X chart.
 */
import {
  D2_MOVING_RANGE_OF_TWO,
  D3_MOVING_RANGE_OF_TWO,
  D4_MOVING_RANGE_OF_TWO,
  SHEWHART_SIGMA_MULTIPLE,
} from './control-constants.ts'
import { type RunRuleSignal, westernElectricSignals } from './run-rules.ts'

export interface IndividualsChart {
  /** The charted values, in batch order. */
  values: number[]
  /** How many leading values form the baseline (phase I). */
  baselineCount: number
  /** Mean of the baseline values. */
  centerLine: number
  /** Mean moving range of the baseline, MR̄ = Σ|xᵢ − xᵢ₋₁|/(m − 1). */
  meanMovingRange: number
  /** σ̂ = MR̄/d2. */
  sigma: number
  upperControlLimit: number
  lowerControlLimit: number
  /** |xᵢ − xᵢ₋₁|; null for the first point. */
  movingRanges: (number | null)[]
  movingRangeUpperLimit: number
  movingRangeLowerLimit: number
  /** Western Electric signals on the individuals chart (all points, both phases). */
  signals: RunRuleSignal[]
  /** Indices whose moving range is above the MR chart's upper limit. */
  movingRangeSignals: number[]
  /** First index ≥ baselineCount with any individuals-chart signal, or null. */
  firstMonitoringSignal: number | null
}

/** Smallest baseline the chart accepts: one moving range needs two points; 5 is a floor, not a recommendation. */
export const MIN_BASELINE_POINTS = 5

/**
 * Build the chart. Example (worked in test/analysis/energy/individuals-chart.test.ts): baseline
 * [10, 12, 11, 13, 12] → x̄ = 11.6, MR̄ = 1.5, σ̂ = 1.3298, limits 7.611…15.589, MR UCL 4.9005.
 */
export function individualsChart(values: readonly number[], baselineCount: number): IndividualsChart {
  if (!Number.isInteger(baselineCount) || baselineCount < MIN_BASELINE_POINTS) {
    throw new RangeError(
      `baseline must be a whole number of batches ≥ ${MIN_BASELINE_POINTS}, got ${baselineCount}`,
    )
  }
  if (baselineCount > values.length) {
    throw new RangeError(
      `baseline of ${baselineCount} batches is longer than the ${values.length} batches charted`,
    )
  }
  values.forEach((v, i) => {
    if (!Number.isFinite(v)) throw new RangeError(`charted value ${i + 1} must be a finite number, got ${v}`)
  })
  const movingRanges: (number | null)[] = values.map((v, i) => (i === 0 ? null : Math.abs(v - values[i - 1])))
  let sum = 0
  for (let i = 0; i < baselineCount; i++) sum += values[i]
  const centerLine = sum / baselineCount
  let mrSum = 0
  for (let i = 1; i < baselineCount; i++) mrSum += movingRanges[i] as number
  const meanMovingRange = mrSum / (baselineCount - 1)
  if (!(meanMovingRange > 0)) {
    throw new RangeError(
      'the baseline values are all equal (mean moving range 0): no spread to set limits from',
    )
  }
  const sigma = meanMovingRange / D2_MOVING_RANGE_OF_TWO
  const signals = westernElectricSignals(values, centerLine, sigma)
  const movingRangeUpperLimit = D4_MOVING_RANGE_OF_TWO * meanMovingRange
  const movingRangeSignals: number[] = []
  movingRanges.forEach((r, i) => {
    if (r !== null && r > movingRangeUpperLimit) movingRangeSignals.push(i)
  })
  const monitoring = signals.filter((s) => s.index >= baselineCount).map((s) => s.index)
  return {
    values: [...values],
    baselineCount,
    centerLine,
    meanMovingRange,
    sigma,
    upperControlLimit: centerLine + SHEWHART_SIGMA_MULTIPLE * sigma,
    lowerControlLimit: centerLine - SHEWHART_SIGMA_MULTIPLE * sigma,
    movingRanges,
    movingRangeUpperLimit,
    movingRangeLowerLimit: D3_MOVING_RANGE_OF_TWO * meanMovingRange,
    signals,
    movingRangeSignals,
    firstMonitoringSignal: monitoring.length > 0 ? monitoring.reduce((a, b) => Math.min(b, a)) : null,
  }
}
