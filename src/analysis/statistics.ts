/**
 * @module analysis/statistics
 * Percentiles across years. Convention used everywhere in dryhours: `pXX` is the XX-th percentile of
 * the values across years, by linear interpolation between order statistics (Hyndman & Fan 1996,
 * "Sample quantiles in statistical packages", Am. Stat. 50:361, definition 7, the default of R and
 * NumPy). For usable drying hours, p10 is therefore the figure **exceeded in 9 of 10 years** (a bad
 * year) and p90 the figure exceeded in 1 of 10 years (a good year). For days to target, p90 is the
 * time within which 9 of 10 years finish.
 */
import { orderStatistic, quantileSorted } from '../math/quantile.ts'
import { integerPower } from '../physics/power.ts'

/** The convention, in words, for the assumptions list of an assessment. */
export const PERCENTILE_CONVENTION =
  'pXX = XX-th percentile across years (Hyndman & Fan 1996 definition 7, linear interpolation). ' +
  'For usable hours p10 is exceeded in 9 of 10 years (bad year), p90 in 1 of 10 (good year); ' +
  'for days to target p90 is the time within which 9 of 10 years finish.'

export { orderStatistic, quantileSorted }

export interface Spread {
  median: number | null
  p10: number | null
  p90: number | null
}

/** Round to `digits` decimals, mapping non-finite to null (JSON-safe). */
export function roundOrNull(x: number, digits = 1): number | null {
  if (!Number.isFinite(x)) return null
  const f = integerPower(10, digits)
  return Math.round(x * f) / f
}

/**
 * Median, p10 and p90 of `values` (any order). Non-finite results (no data, or +Infinity meaning
 * "not reached") become null. Example: [10, 20, 30, 40, 50] → median 30, p10 14, p90 46.
 */
export function spread(values: readonly number[], digits = 1): Spread {
  const sorted = values.filter((v) => !Number.isNaN(v)).sort((a, b) => a - b)
  return {
    median: roundOrNull(quantileSorted(sorted, 0.5), digits),
    p10: roundOrNull(quantileSorted(sorted, 0.1), digits),
    p90: roundOrNull(quantileSorted(sorted, 0.9), digits),
  }
}

/** Arithmetic mean, null for no values. */
export function meanOrNull(values: readonly number[]): number | null {
  return values.length > 0 ? values.reduce((s, v) => s + v, 0) / values.length : null
}

/**
 * Median of figures where null means "not reached" (e.g. days to target not within the maximum duration):
 * null sorts above every number, so the median is null when half or more were not reached.
 */
export function medianNotReached(values: readonly (number | null)[], digits = 1): number | null {
  if (values.length === 0) return null
  const sorted = values.map((v) => v ?? Number.POSITIVE_INFINITY).sort((a, b) => a - b)
  return roundOrNull(quantileSorted(sorted, 0.5), digits)
}
