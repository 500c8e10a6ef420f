/**
 * @module analysis/energy/change-start
 * Where a sustained shift most likely began, given that a chart signalled: the maximum-likelihood change
 * point for a step in the mean of independent normal values with known in-control mean μ₀ and σ, τ̂ =
 * argmax_k (Σ_{i=k}^{s} (xᵢ − μ₀))² / (s − k + 1) over k ≤ s (Hinkley 1970, Biometrika 57:1; the estimate
 * Montgomery suggests reading off a CUSUM). Searched from the end of the baseline to the signal `s`;
 * with `direction` 'up' (or 'down') only candidate steps in that direction count.
 */

/**
 * Index of the most likely first shifted point in `values[from..signalIndex]`. Example: μ₀ = 0,
 * values [0, 0, 0, 2, 2, 2] from 0 to 5 → 3.
 */
export function estimateChangeStart(
  values: readonly number[],
  inControlMean: number,
  from: number,
  signalIndex: number,
  direction: 'up' | 'down' | 'either' = 'either',
): number {
  if (!(from >= 0 && signalIndex >= from && signalIndex < values.length)) {
    throw new RangeError(
      `change search needs 0 ≤ from ≤ signal < ${values.length}, got ${from} and ${signalIndex}`,
    )
  }
  let best = signalIndex
  let bestScore = -1
  let sum = 0
  for (let k = signalIndex; k >= from; k--) {
    sum += values[k] - inControlMean
    const rightWay = direction === 'either' || (direction === 'up' ? sum > 0 : sum < 0)
    const score = rightWay ? (sum * sum) / (signalIndex - k + 1) : -1
    if (score > bestScore) {
      bestScore = score
      best = k
    }
  }
  return best
}
