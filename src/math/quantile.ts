/**
 * @module math/quantile
 * Sample quantiles, by the convention used everywhere in dryhours: linear interpolation between order
 * statistics (Hyndman & Fan 1996, "Sample quantiles in statistical packages", Am. Stat. 50:361,
 * definition 7, the default of R and NumPy). Lives below every other layer so that the drying models
 * (drying/deep-bed/) and the analysis (analysis/statistics.ts, which re-exports it) share one copy.
 */

/**
 * Quantile `q` ∈ [0, 1] of `sorted` (ascending, finite or +Infinity), Hyndman–Fan definition 7:
 * h = (n − 1)q, x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋+1 − x⌊h⌋). Example: [1, 2, 3, 4] at 0.1 → 1.3.
 * Returns NaN for an empty array. +Infinity entries (e.g. batches that never finished) propagate.
 */
export function quantileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length
  if (n === 0) return Number.NaN
  if (!(q >= 0 && q <= 1)) throw new RangeError(`quantile must be between 0 and 1, got ${q}`)
  const h = (n - 1) * q
  const lo = Math.floor(h)
  const hi = Math.min(lo + 1, n - 1)
  const a = sorted[lo]
  const b = sorted[hi]
  if (a === b) return a
  if (b === Number.POSITIVE_INFINITY) return h === lo ? a : Number.POSITIVE_INFINITY
  return a + (h - lo) * (b - a)
}

/** Quantile `q` of `values` in any order (copied and sorted; the input is left as it is). */
export function quantileOf(values: readonly number[], q: number): number {
  return quantileSorted(
    [...values].sort((a, b) => a - b),
    q,
  )
}

/**
 * The k-th smallest value (0-based) of `values`, by selection (Hoare's quickselect with a median-of-three
 * pivot) in linear expected time: the value `sorted[k]` would hold, without sorting. Reorders `values`.
 */
export function orderStatistic(values: Float64Array, k: number): number {
  if (!(Number.isInteger(k) && k >= 0 && k < values.length)) {
    throw new RangeError(`order statistic index must be from 0 to ${values.length - 1}, got ${k}`)
  }
  let lo = 0
  let hi = values.length - 1
  while (hi > lo) {
    const mid = (lo + hi) >>> 1
    // median of three as the pivot value
    const a = values[lo]
    const b = values[mid]
    const c = values[hi]
    const pivot = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c))
    let i = lo
    let j = hi
    while (i <= j) {
      while (values[i] < pivot) i++
      while (values[j] > pivot) j--
      if (i <= j) {
        const t = values[i]
        values[i] = values[j]
        values[j] = t
        i++
        j--
      }
    }
    if (k <= j) hi = j
    else if (k >= i) lo = i
    else return values[k]
  }
  return values[k]
}
