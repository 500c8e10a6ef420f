/**
 * @module analysis/compare
 * Several sites, one product and one method, ranked by a stated criterion:
 * - `usable-hours-p10`: usable drying hours in the season, summed per year, P10 across years (the figure
 *   exceeded in 9 of 10 years); higher is better;
 * - `probability-within-deadline`: mean over the season's start dates of the share of years finishing
 *   within the deadline by the method alone; higher is better (default);
 * - `heat-per-tonne`: median supplemental heat over the season's batches [kWh/t]; lower is better.
 * Ties are broken by the next criterion in that order.
 */
import { MS_PER_DAY } from '../physics/constants.ts'
import { type AssessOptions, assess } from './assess.ts'
import type { Assessment } from './assessment.ts'
import { parseMonthDay } from './local-time.ts'
import { quantileSorted, roundOrNull } from './statistics.ts'

export const COMPARE_CRITERIA = ['probability-within-deadline', 'usable-hours-p10', 'heat-per-tonne'] as const
export type CompareCriterion = (typeof COMPARE_CRITERIA)[number]

/** The first criterion in words for natural-air bins (their assessments carry no batches). */
export const BIN_PROBABILITY_DESCRIPTION =
  'mean, over the season start dates and the airflows compared, of the share of years in which the top layer of the bin dries below the dry-matter loss limit within the season (higher is better)'

export const CRITERION_DESCRIPTIONS: Record<CompareCriterion, string> = {
  'probability-within-deadline':
    'mean, over the season start dates, of the share of years in which a batch finishes within the deadline by the method alone (higher is better)',
  'usable-hours-p10':
    'usable drying hours in the season per year, P10 across years, i.e. exceeded in 9 of 10 years (higher is better)',
  'heat-per-tonne':
    'median supplemental heat into the air to finish by the deadline, kWh per tonne fresh (lower is better)',
}

export interface SiteScore {
  rank: number
  site: string
  usableHoursInSeasonP10: number | null
  usableHoursInSeasonMedian: number | null
  meanProbabilityWithinDeadline: number | null
  medianHeatKwhPerTonne: number | null
  bestStartWindow: string | null
  /** Share of the season's batches that spoiled before they were dry (the assessment's `spoilage.season`). */
  spoilageProbability: number | null
  /**
   * Natural-air bins: the largest of the start months' minimum airflows [m³/min per t] (the airflow that serves
   * the whole season), null when some month has none among those compared; absent for other methods.
   */
  binSeasonMinimumAirflowM3PerMinPerTonne?: number | null
  warnings: string[]
}

export interface Comparison {
  schema: 'dryhours.comparison/1'
  criterion: CompareCriterion
  criterionDescription: string
  product: Assessment['product']
  method: Assessment['method']
  season: Assessment['season']
  deadlineDays: number
  sites: SiteScore[]
  assessments: Assessment[]
}

/** Weight of each month in the season: the share of its days between season start and end (inclusive). */
export function seasonMonthWeights(start: string, end: string): number[] {
  const s = parseMonthDay(start, 'season start')
  const e = parseMonthDay(end, 'season end')
  const ref = 2001
  const weights = new Array<number>(12).fill(0)
  const startMs = Date.UTC(ref, s.month - 1, s.day)
  let endMs = Date.UTC(ref, e.month - 1, e.day)
  if (endMs < startMs) endMs = Date.UTC(ref + 1, e.month - 1, e.day)
  for (let t = startMs; t <= endMs; t += MS_PER_DAY) {
    const d = new Date(t)
    const month = d.getUTCMonth()
    const days = new Date(Date.UTC(d.getUTCFullYear(), month + 1, 0)).getUTCDate()
    weights[month] += 1 / days
  }
  return weights.map((w) => Math.min(1, w))
}

/** Season usable hours per year, from the monthly byYear figures weighted by the season's share of each month. */
export function seasonUsableHoursByYear(a: Assessment): number[] {
  const weights = seasonMonthWeights(a.season.start, a.season.end)
  const byYear = new Map<number, { sum: number; months: number }>()
  const needed = weights.filter((w) => w > 0).length
  a.monthly.forEach((row, m) => {
    if (weights[m] === 0) return
    for (const v of row.usableHours.byYear) {
      const e = byYear.get(v.year) ?? { sum: 0, months: 0 }
      e.sum += weights[m] * v.hours
      e.months++
      byYear.set(v.year, e)
    }
  })
  return [...byYear.values()].filter((e) => e.months === needed).map((e) => e.sum)
}

/** Mean share of safe years over a bin's start dates × airflows (NaN without runs). */
function binMeanShareSafe(a: Assessment): number {
  const rows = (a.bin?.startDates ?? []).filter((r) => r.years > 0)
  return rows.length > 0 ? rows.reduce((s, r) => s + r.shareOfYearsSafe, 0) / rows.length : Number.NaN
}

/** The airflow that serves every start month of a bin: the largest monthly minimum; null if a month has none. */
function binSeasonMinimumAirflow(a: Assessment): number | null {
  const months = a.bin?.minimumAirflowByMonth ?? []
  if (months.length === 0 || months.some((m) => m.minimumAirflowM3PerMinPerTonne === null)) return null
  return Math.max(...months.map((m) => m.minimumAirflowM3PerMinPerTonne as number))
}

function score(a: Assessment): Omit<SiteScore, 'rank'> {
  const hours = seasonUsableHoursByYear(a).sort((x, y) => x - y)
  const withYears = a.startDates.filter((r) => r.years > 0)
  const meanP = a.bin
    ? binMeanShareSafe(a)
    : withYears.length > 0
      ? withYears.reduce((s, r) => s + r.probabilityWithinDeadline, 0) / withYears.length
      : Number.NaN
  const best = a.bestStartWindows[0]
  return {
    site: a.site.name,
    usableHoursInSeasonP10: hours.length > 1 ? roundOrNull(quantileSorted(hours, 0.1), 0) : null,
    usableHoursInSeasonMedian: roundOrNull(quantileSorted(hours, 0.5), 0),
    meanProbabilityWithinDeadline: roundOrNull(meanP, 3),
    medianHeatKwhPerTonne: a.heat.heatToAirKwhPerTonne.median,
    bestStartWindow: best ? `${best.from} to ${best.to}` : null,
    spoilageProbability: a.spoilage?.season.probability ?? null,
    ...(a.bin ? { binSeasonMinimumAirflowM3PerMinPerTonne: binSeasonMinimumAirflow(a) } : {}),
    warnings: a.warnings,
  }
}

function keyOf(s: Omit<SiteScore, 'rank'>, c: CompareCriterion): number {
  const v =
    c === 'usable-hours-p10'
      ? (s.usableHoursInSeasonP10 ?? s.usableHoursInSeasonMedian)
      : c === 'probability-within-deadline'
        ? s.meanProbabilityWithinDeadline
        : s.medianHeatKwhPerTonne === null
          ? null
          : -s.medianHeatKwhPerTonne
  return v ?? Number.NEGATIVE_INFINITY
}

/**
 * Rank assessments of several sites by `criterion` (ties broken by the other criteria in the order of
 * {@link COMPARE_CRITERIA}); `labels` name the sites, otherwise their site names.
 */
export function rankAssessments(
  assessments: Assessment[],
  criterion: CompareCriterion = 'probability-within-deadline',
  labels?: string[],
): Comparison {
  if (!COMPARE_CRITERIA.includes(criterion)) {
    throw new RangeError(`criterion must be one of ${COMPARE_CRITERIA.join(', ')}, got '${criterion}'`)
  }
  if (assessments.length === 0) throw new RangeError('a comparison needs at least one assessment')
  const order: CompareCriterion[] = [criterion, ...COMPARE_CRITERIA.filter((c) => c !== criterion)]
  const scored = assessments.map((a, i) => ({ ...score(a), site: labels?.[i] ?? a.site.name }))
  const ranked = scored
    .map((s, i) => ({ s, i }))
    .sort((x, y) => {
      for (const c of order) {
        const kx = keyOf(x.s, c)
        const ky = keyOf(y.s, c)
        if (kx !== ky) return ky > kx ? 1 : -1
      }
      return x.i - y.i
    })
    .map(({ s }, r) => ({ rank: r + 1, ...s }))
  const first = assessments[0]
  return {
    schema: 'dryhours.comparison/1',
    criterion,
    criterionDescription:
      criterion === 'probability-within-deadline' && assessments.every((a) => a.bin)
        ? BIN_PROBABILITY_DESCRIPTION
        : CRITERION_DESCRIPTIONS[criterion],
    product: first.product,
    method: first.method,
    season: first.season,
    deadlineDays: first.deadlineDays,
    sites: ranked,
    assessments,
  }
}

/**
 * Assess every series with the same options and rank them. `labels` name the sites when given (e.g. file
 * names), otherwise the site names from the files.
 */
export function compare(
  seriesList: Parameters<typeof assess>[0][],
  options: AssessOptions & { criterion?: CompareCriterion; labels?: string[] },
): Comparison {
  if (seriesList.length < 2)
    throw new RangeError(`compare needs at least 2 weather series, got ${seriesList.length}`)
  const criterion = options.criterion ?? 'probability-within-deadline'
  if (!COMPARE_CRITERIA.includes(criterion)) {
    throw new RangeError(`criterion must be one of ${COMPARE_CRITERIA.join(', ')}, got '${criterion}'`)
  }
  return rankAssessments(
    seriesList.map((s) => assess(s, options)),
    criterion,
    options.labels,
  )
}
