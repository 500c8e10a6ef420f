/**
 * @module analysis/energy/change-point
 * Where a step in the mean most likely began, and how sure that is. Model: independent normal values with
 * the baseline's mean μ₀ and σ up to batch τ − 1, and mean μ₀ + δ from batch τ to the last one (one
 * sustained step). The maximum-likelihood τ maximises S_τ²/n_τ with S_τ = Σ_{i ≥ τ}(xᵢ − μ₀) and n_τ the
 * number of values from τ on (Hinkley 1970, "Inference about the change-point in a sequence of random
 * variables", Biometrika 57:1; with μ₀ known as in the control-chart setting of Pignatiello & Samuel 2001,
 * J. Quality Technology 33:82). How sure: the posterior probability of each τ under a uniform prior over the
 * candidate batches and a flat prior on the step δ on the chosen side (Smith 1975, "A Bayesian approach to
 * inference about a change-point in a sequence of random variables", Biometrika 62:407), which integrates
 * δ out in closed form:
 *
 *   p(τ | x) ∝ exp(S_τ²/(2σ²n_τ)) · Φ(±S_τ/(σ√n_τ)) / √n_τ
 *
 * (+ for a rise, − for a fall). The interval is the smallest set of batches holding ≥ 90 % of that
 * probability, given as its first and last batch. These probabilities take μ₀ and σ as known (from the
 * baseline) and assume exactly one step among the candidates.
 */
import { errorFunction } from 'simple-statistics'

/** Probability held by the reported interval of change batches. */
export const CHANGE_INTERVAL_PROBABILITY = 0.9

export interface ChangePointEstimate {
  /** Index of the most probable first shifted value (posterior mode; close to Hinkley's likelihood maximum). */
  index: number
  /** Posterior probability of that index. */
  probability: number
  /** First and last index of the smallest set holding ≥ {@link CHANGE_INTERVAL_PROBABILITY}. */
  intervalFrom: number
  intervalTo: number
  /** Probability of every candidate from `intervalFrom` to `intervalTo` (≥ 0.9). */
  intervalProbability: number
  /** Mean of (x − μ₀) from the estimated change to the end. */
  shift: number
  /** Candidate indices and their posterior probabilities. */
  candidates: { index: number; probability: number }[]
}

/** log Φ(x), accurate in the far left tail (asymptotic series there). */
function logNormalCdf(x: number): number {
  if (x > -6) return Math.log(0.5 * (1 + errorFunction(x / Math.SQRT2)))
  // Mills ratio: Φ(x) ≈ φ(x)/|x|·(1 − 1/x² + 3/x⁴) for x → −∞ (Abramowitz & Stegun 26.2.12, from memory).
  const x2 = x * x
  return -0.5 * x2 - Math.log(-x * Math.sqrt(2 * Math.PI)) + Math.log(1 - 1 / x2 + 3 / (x2 * x2))
}

/**
 * Change-point estimate for a step in `direction` among candidates `from..lastCandidate` (indices into
 * `values`), using the values from each candidate to the end. Example: μ₀ = 0, σ = 1, values
 * [0, 0, 0, 3, 3, 3] with candidates 1…5 → index 3 with probability ≈ 0.9.
 */
export function estimateChangePoint(
  values: readonly number[],
  inControlMean: number,
  sigma: number,
  from: number,
  lastCandidate: number,
  direction: 'up' | 'down',
): ChangePointEstimate {
  if (!(from >= 0 && lastCandidate >= from && lastCandidate < values.length)) {
    throw new RangeError(
      `change search needs 0 ≤ first ≤ last candidate < ${values.length}, got ${from} and ${lastCandidate}`,
    )
  }
  if (!(sigma > 0)) throw new RangeError(`change search needs σ > 0, got ${sigma}`)
  const sign = direction === 'up' ? 1 : -1
  const logPost: number[] = []
  const sums: number[] = []
  let sum = 0
  for (let i = values.length - 1; i >= from; i--) {
    sum += values[i] - inControlMean
    if (i <= lastCandidate) {
      const n = values.length - i
      const score = (sum * sum) / (2 * sigma * sigma * n)
      logPost[i - from] = score + logNormalCdf((sign * sum) / (sigma * Math.sqrt(n))) - 0.5 * Math.log(n)
      sums[i - from] = sum
    }
  }
  const max = logPost.reduce((m, l) => Math.max(l, m), Number.NEGATIVE_INFINITY)
  const weights = logPost.map((l) => Math.exp(l - max))
  const total = weights.reduce((s, w) => s + w, 0)
  const candidates = weights.map((w, j) => ({ index: from + j, probability: w / total }))
  const best = candidates.reduce((b, c) => (c.probability > b.probability ? c : b))
  const ranked = [...candidates].sort((a, b) => b.probability - a.probability)
  let held = 0
  let lo = best.index
  let hi = best.index
  for (const c of ranked) {
    held += c.probability
    lo = Math.min(lo, c.index)
    hi = Math.max(hi, c.index)
    if (held >= CHANGE_INTERVAL_PROBABILITY - 1e-12) break
  }
  const n = values.length - best.index
  return {
    index: best.index,
    probability: best.probability,
    intervalFrom: lo,
    intervalTo: hi,
    intervalProbability: Math.min(
      1,
      candidates.filter((c) => c.index >= lo && c.index <= hi).reduce((s, c) => s + c.probability, 0),
    ),
    shift: sums[best.index - from] / n,
    candidates,
  }
}
