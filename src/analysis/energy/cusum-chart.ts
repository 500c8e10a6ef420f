/**
 * @module analysis/energy/cusum-chart
 * Tabular (Page) cumulative-sum chart for individual values, standardized: zᵢ = (xᵢ − μ₀)/σ,
 * C⁺ᵢ = max(0, zᵢ − k + C⁺ᵢ₋₁), C⁻ᵢ = max(0, −zᵢ − k + C⁻ᵢ₋₁), a signal when either exceeds h (Page 1954,
 * "Continuous inspection schemes", Biometrika 41:100; the tabular form and the standardized version as in
 * Montgomery & Runger, *Applied Statistics and Probability for Engineers*, section 16-10). μ₀ and σ come from the
 * baseline (the individuals chart's x̄ and MR̄/d2). The sums run over the baseline (a phase I check) and
 * start again from zero at the first monitored batch, so the monitoring chart does not inherit the
 * baseline's wander.
 *
 * Design: k = 0.5 and h = 5, the usual choice for shifts of about one σ ("h = 4 or h = 5 and k = 1/2 will
 * generally provide a CUSUM that has good ARL properties against a shift of about 1σ": Montgomery & Runger,
 * *Applied Statistics and Probability for Engineers*, section 16-10, read in an online copy whose edition is
 * not stated). Its two-sided in-control average run length is about 465 batches and a 3σ step is found
 * in about 2.6 batches on average, as computed by ./cusum-arl.ts, whose integral-equation values agree with
 * Lucas & Crosier (1982) Table 1 at h = 4 (test/analysis/energy/cusum.test.ts, docs/energy-charts.md).
 * h = 5 rather than 4 because μ₀ and σ are estimated from a short baseline (20 batches by default), which
 * shortens the real in-control run length below the table's.
 */

/** Reference value k in σ units (Montgomery & Runger, section 16-10: k = 1/2 for a one-σ shift). */
export const CUSUM_K = 0.5
/** Decision interval h in σ units (Montgomery & Runger, section 16-10: h = 4 or 5 with k = 1/2). */
export const CUSUM_H = 5

export interface CusumChart {
  k: number
  h: number
  /** μ₀ of the standardization. */
  centerLine: number
  /** σ of the standardization. */
  sigma: number
  baselineCount: number
  /** C⁺ᵢ in σ units, every point (restarted at 0 at the first monitored point). */
  upper: number[]
  /** C⁻ᵢ in σ units. */
  lower: number[]
  /** Points where C⁺ > h (above) or C⁻ > h (below). */
  signals: { index: number; side: 'above' | 'below' }[]
  /** First monitored point with C⁺ > h, or null. */
  firstUpperSignal: number | null
  /** First monitored point with C⁻ > h, or null. */
  firstLowerSignal: number | null
}

/**
 * CUSUM of `values` against μ₀ = `centerLine` with σ = `sigma`. Example: μ₀ = 0, σ = 1, k = 0.5, h = 5 and
 * values 2, 2, 2, 2 → C⁺ = 1.5, 3, 4.5, 6: a signal on the fourth.
 */
export function cusumChart(
  values: readonly number[],
  centerLine: number,
  sigma: number,
  baselineCount: number,
  k = CUSUM_K,
  h = CUSUM_H,
): CusumChart {
  if (!(sigma > 0 && Number.isFinite(sigma))) throw new RangeError(`CUSUM σ must be > 0, got ${sigma}`)
  if (!(k >= 0 && h > 0)) throw new RangeError(`CUSUM needs k ≥ 0 and h > 0, got k = ${k}, h = ${h}`)
  const upper: number[] = []
  const lower: number[] = []
  const signals: CusumChart['signals'] = []
  let cu = 0
  let cl = 0
  for (let i = 0; i < values.length; i++) {
    if (i === baselineCount) {
      cu = 0
      cl = 0
    }
    const z = (values[i] - centerLine) / sigma
    cu = Math.max(0, z - k + cu)
    cl = Math.max(0, -z - k + cl)
    upper.push(cu)
    lower.push(cl)
    if (cu > h) signals.push({ index: i, side: 'above' })
    if (cl > h) signals.push({ index: i, side: 'below' })
  }
  const first = (side: 'above' | 'below') =>
    signals.find((s) => s.index >= baselineCount && s.side === side)?.index ?? null
  return {
    k,
    h,
    centerLine,
    sigma,
    baselineCount,
    upper,
    lower,
    signals,
    firstUpperSignal: first('above'),
    firstLowerSignal: first('below'),
  }
}
