/**
 * @module analysis/start-dates
 * The start-date table: for each start day of a season, one batch per year from the same local hour,
 * with the supplemental heat needed to finish by the deadline; the best start windows; and the batches
 * from the 1st and 16th of every month for the monthly heat column. Every batch reuses the hourly
 * conditions computed once per method.
 */

import type { BatchSpoilageResult, BatchSpoilageSetup } from '../drying/batch.ts'
import type { HourlyConditions } from '../drying/hourly-conditions.ts'
import type { ProductResponse } from '../drying/product-response.ts'
import { type HeatStrategy, supplementalHeat } from '../drying/supplemental-heat.ts'
import { MS_PER_DAY, MS_PER_HOUR } from '../physics/constants.ts'
import type { HourlySeries } from '../weather/series.ts'
import type { StartDateRow, StartWindow } from './assessment.ts'
import { summariseSpoilage } from './spoilage.ts'
import { quantileSorted, roundOrNull } from './statistics.ts'

/** Windows are runs of start days whose probability of finishing within the deadline is at least this (assumption). */
export const GOOD_START_PROBABILITY = 0.8

export interface StartContext {
  series: HourlySeries
  /** The UTC instant of a time on the site's clock (analysis/local-time.ts). */
  toUtcMs: (year: number, month: number, day: number, hour: number) => number
  primary: HourlyConditions
  backup: HourlyConditions
  product: ProductResponse
  initialDb: number
  targetDb: number
  deadlineHours: number
  maxHours: number
  startHourLocal: number
  /** Typical year: batches wrap from the end of the file to its start. */
  wrap: boolean
  /** The spoilage model stepped along every batch of the method alone; absent: no spoilage figures. */
  spoilage?: BatchSpoilageSetup
  /**
   * Outcomes already run, by start hour: a start on the 1st or 16th of a month inside the season is both a
   * monthly-heat start and a start-date row, and its batch is run once (the outcome is read, never changed).
   */
  ran?: StartRecord
}

/**
 * Outcomes of the batches run on one set of conditions: read only by a context with the same primary and
 * backup conditions and spoilage model (a context derived with others, such as the heater every hour, runs its
 * own batches even though it carries the record).
 */
export interface StartRecord {
  primary: HourlyConditions
  backup: HourlyConditions
  spoilage: BatchSpoilageSetup | undefined
  outcomes: Map<number, StartOutcome>
}

/** An empty record of the batches run on `ctx`'s conditions. */
export function startRecord(ctx: Omit<StartContext, 'ran'>): StartRecord {
  return { primary: ctx.primary, backup: ctx.backup, spoilage: ctx.spoilage, outcomes: new Map() }
}

export interface StartOutcome {
  /**
   * True when the batch ran into hours without weather: its outcome is unknown, and it is left out of every
   * time, probability and heat figure (counted in `yearsUnknown` instead).
   */
  unknown: boolean
  /** Hours without weather the batch ran into. */
  missingHours: number
  /** Hours to target by the method alone; +Infinity when not within the maximum duration; NaN when unknown. */
  hoursToTarget: number
  withinDeadline: boolean
  rewettingHours: number
  rainExposureHours: number
  /** Heat into the air to finish by the deadline [kWh/t]; NaN when not reachable. */
  heatKwhPerTonne: number
  /** Solar collector heat into the air during the batch by the method alone [kWh/t] (solar cabinet). */
  solarKwhPerTonne: number
  strategy: HeatStrategy
  /** The spoilage model's outcome along the method-alone batch (when the context has a model). */
  spoilage?: BatchSpoilageResult
}

export interface MonthDay {
  month: number
  day: number
}

const pad = (x: number): string => String(x).padStart(2, '0')
export const formatMonthDay = (d: MonthDay): string => `${pad(d.month)}-${pad(d.day)}`

/** Start days from `start` to `end` inclusive (wrapping the year end), every `stepDays`; 29 Feb skipped. */
export function seasonDays(start: MonthDay, end: MonthDay, stepDays: number): MonthDay[] {
  if (!(Number.isInteger(stepDays) && stepDays >= 1 && stepDays <= 365)) {
    throw new RangeError(`start-date step must be a whole number of days from 1 to 365, got ${stepDays}`)
  }
  const ref = 2001 // a non-leap year
  const startMs = Date.UTC(ref, start.month - 1, start.day)
  let endMs = Date.UTC(ref, end.month - 1, end.day)
  if (endMs < startMs) endMs = Date.UTC(ref + 1, end.month - 1, end.day)
  const days: MonthDay[] = []
  for (let t = startMs; t <= endMs; t += stepDays * MS_PER_DAY) {
    const d = new Date(t)
    days.push({ month: d.getUTCMonth() + 1, day: d.getUTCDate() })
  }
  return days
}

/** Index of the hour starting at `startHourLocal` on the site's clock on year-month-day, or null when outside the series. */
export function startIndexFor(ctx: StartContext, year: number, d: MonthDay): number | null {
  if (d.month === 2 && d.day === 29) return null
  const utcMs = ctx.toUtcMs(year, d.month, d.day, ctx.startHourLocal)
  const index = Math.round((utcMs - ctx.series.startUtcMs[0]) / MS_PER_HOUR)
  if (index < 0 || index >= ctx.series.hours) return null
  if (!ctx.wrap && index + ctx.maxHours > ctx.series.hours) return null
  return index
}

/** One batch from hour `index`: the method alone, then the heat needed by the deadline. */
export function runStart(ctx: StartContext, index: number): StartOutcome {
  const r = ctx.ran
  const record =
    r !== undefined && r.primary === ctx.primary && r.backup === ctx.backup && r.spoilage === ctx.spoilage
      ? r.outcomes
      : undefined
  const ran = record?.get(index)
  if (ran !== undefined) return ran
  const outcome = runBatchAt(ctx, index)
  record?.set(index, outcome)
  return outcome
}

/** The batch of {@link runStart}, run. */
function runBatchAt(ctx: StartContext, index: number): StartOutcome {
  const r = supplementalHeat(
    ctx.primary,
    ctx.backup,
    ctx.product,
    {
      startIndex: index,
      maxHours: ctx.maxHours,
      initialDb: ctx.initialDb,
      targetDb: ctx.targetDb,
      wrap: ctx.wrap,
      spoilage: ctx.spoilage,
    },
    ctx.deadlineHours,
  )
  const unknown = r.natural.outcomeUnknown
  const hours = unknown ? Number.NaN : r.natural.reached ? r.natural.hoursToTarget : Number.POSITIVE_INFINITY
  return {
    unknown,
    missingHours: r.natural.missingHours,
    hoursToTarget: hours,
    withinDeadline: hours <= ctx.deadlineHours,
    rewettingHours: r.natural.rewettingHours,
    rainExposureHours: r.natural.rainExposureHours,
    heatKwhPerTonne: unknown ? Number.NaN : r.heatKwhPerTonne,
    solarKwhPerTonne: r.natural.solarKwhPerTonne,
    strategy: r.strategy,
    spoilage: r.natural.spoilage,
  }
}

/** The outcomes whose batches met no missing weather (the others are unknown, not slow). */
export function knownOutcomes(outcomes: StartOutcome[]): StartOutcome[] {
  return outcomes.filter((o) => !o.unknown)
}

function sortedFinite(values: number[]): number[] {
  return values.filter((v) => !Number.isNaN(v)).sort((a, b) => a - b)
}

function medianP90(values: number[], digits: number): { median: number | null; p90: number | null } {
  const s = sortedFinite(values)
  return {
    median: roundOrNull(quantileSorted(s, 0.5), digits),
    p90: roundOrNull(quantileSorted(s, 0.9), digits),
  }
}

/**
 * Summarise the outcomes of one start day across years (spoilage with `spoilage`'s model, when given). Batches
 * whose outcome is unknown (they ran into hours without weather) are left out of every figure, spoilage too.
 */
export function startDateRow(
  start: MonthDay,
  all: StartOutcome[],
  spoilage?: BatchSpoilageSetup,
): StartDateRow {
  const outcomes = knownOutcomes(all)
  const n = outcomes.length
  const days = outcomes.map((o) => o.hoursToTarget / 24)
  const heat = outcomes.map((o) => o.heatKwhPerTonne)
  return {
    start: formatMonthDay(start),
    years: n,
    yearsUnknown: all.length - n,
    missingWeatherHours: all.reduce((sum, o) => sum + (o.unknown ? o.missingHours : 0), 0),
    daysToTarget: medianP90(days, 1),
    probabilityWithinDeadline:
      n > 0 ? (roundOrNull(outcomes.filter((o) => o.withinDeadline).length / n, 3) ?? 0) : 0,
    probabilityWithinMaxDuration:
      n > 0 ? (roundOrNull(outcomes.filter((o) => Number.isFinite(o.hoursToTarget)).length / n, 3) ?? 0) : 0,
    rewettingHours: medianP90(
      outcomes.map((o) => o.rewettingHours),
      0,
    ),
    rainExposureHours: medianP90(
      outcomes.map((o) => o.rainExposureHours),
      0,
    ),
    supplementalHeat: {
      medianKwhPerTonne: medianP90(heat, 1).median,
      p90KwhPerTonne: medianP90(heat, 1).p90,
      yearsNeedingHeat: outcomes.filter((o) => o.strategy !== 'none-needed').length,
    },
    yearsNotReachable: outcomes.filter((o) => o.strategy === 'not-reachable').length,
    solarHeatKwhPerTonne: medianP90(
      outcomes.map((o) => o.solarKwhPerTonne),
      1,
    ),
    spoilage:
      spoilage === undefined
        ? null
        : summariseSpoilage(
            spoilage.model,
            outcomes.map((o) => o.spoilage),
          ),
  }
}

export interface StartTableResult {
  rows: StartDateRow[]
  /** Every outcome, for season-wide heat figures (unknown ones included: filter with {@link knownOutcomes}). */
  outcomes: StartOutcome[]
  batches: number
  skipped: number
}

/** Run every start day × year. `onBatch` is called after each start day with the number of batches so far. */
export function startDateTable(
  ctx: StartContext,
  days: MonthDay[],
  years: number[],
  onDay?: (dayIndex: number) => void,
): StartTableResult {
  const rows: StartDateRow[] = []
  const all: StartOutcome[] = []
  let batches = 0
  let skipped = 0
  days.forEach((d, di) => {
    const outcomes: StartOutcome[] = []
    for (const year of years) {
      const index = startIndexFor(ctx, year, d)
      if (index === null) {
        skipped++
        continue
      }
      outcomes.push(runStart(ctx, index))
      batches++
    }
    rows.push(startDateRow(d, outcomes, ctx.spoilage))
    all.push(...outcomes)
    onDay?.(di)
  })
  return { rows, outcomes: all, batches, skipped: ctx.wrap ? 0 : skipped - countMissingLeapDays(days, years) }
}

function countMissingLeapDays(days: MonthDay[], years: number[]): number {
  return days.some((d) => d.month === 2 && d.day === 29) ? years.length : 0
}

/**
 * Best start windows: runs of consecutive start rows with probability within the deadline ≥
 * {@link GOOD_START_PROBABILITY}; when none reaches it, runs at the season's highest probability (within
 * 0.05). Ranked by their lowest probability, then by median days to target. At most 3.
 */
export function bestStartWindows(rows: StartDateRow[]): { windows: StartWindow[]; criterion: string } {
  const withYears = rows.filter((r) => r.years > 0)
  if (withYears.length === 0) return { windows: [], criterion: 'no start date had a complete batch' }
  const best = Math.max(...withYears.map((r) => r.probabilityWithinDeadline))
  const threshold = best >= GOOD_START_PROBABILITY ? GOOD_START_PROBABILITY : Math.max(best - 0.05, 0)
  const criterion =
    best >= GOOD_START_PROBABILITY
      ? `consecutive start dates whose batches finish within the deadline in at least ${GOOD_START_PROBABILITY * 100} % of years`
      : `no start date reaches ${GOOD_START_PROBABILITY * 100} % of years within the deadline; windows at the best probability found (${Math.round(best * 100)} %, within 5 points)`
  if (best <= 0) return { windows: [], criterion: 'no start date finishes within the deadline in any year' }
  const windows: StartWindow[] = []
  let run: StartDateRow[] = []
  const flush = (): void => {
    if (run.length === 0) return
    const medians = run.map((r) => r.daysToTarget.median ?? Number.POSITIVE_INFINITY).sort((a, b) => a - b)
    windows.push({
      from: run[0].start,
      to: run[run.length - 1].start,
      days: run.length,
      minProbabilityWithinDeadline: Math.min(...run.map((r) => r.probabilityWithinDeadline)),
      medianDaysToTarget: roundOrNull(quantileSorted(medians, 0.5), 1),
    })
    run = []
  }
  for (const r of rows) {
    if (r.years > 0 && r.probabilityWithinDeadline >= threshold) run.push(r)
    else flush()
  }
  flush()
  windows.sort(
    (a, b) =>
      b.minProbabilityWithinDeadline - a.minProbabilityWithinDeadline ||
      (a.medianDaysToTarget ?? Number.POSITIVE_INFINITY) -
        (b.medianDaysToTarget ?? Number.POSITIVE_INFINITY) ||
      b.days - a.days,
  )
  return { windows: windows.slice(0, 3), criterion }
}
