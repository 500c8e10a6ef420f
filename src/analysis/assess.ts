/**
 * @module analysis/assess
 * `assess(series, options)`: can this site's weather dry this product by this method, when, how fast,
 * and with how much supplemental heat. A short pipeline of named stages:
 * 1. {@link resolveAssessOptions}: the options checked and completed with the engine's defaults;
 * 2. {@link hourlyConditionsStage}: the hourly conditions of the method and of the backup heater, once,
 *    reused by every batch;
 * 3. {@link calendarStage}: local time, usable hours per month and year, the years with data;
 * 4. {@link monthlyHeatStage}: batches from the 1st and 16th of every month (heat and days per month);
 * 5. {@link startDatesStage}: the start-date table and the best start windows;
 * 6. {@link heatSummary} (analysis/heat-summary.ts): heat and fuel, with a cross-check;
 * 7. {@link psychrometricSummary} (analysis/psychrometric.ts): the hours on a psychrometric chart;
 * 8. {@link assembleAssessment} (analysis/assemble.ts): the JSON-safe {@link Assessment} with its assumptions and
 *    warnings.
 * For grain in a bin (a method with `batches: 'deep-bed'`), stages 4–5 are the bin stage instead
 * (analysis/bin-stage.ts: the deep-bed model per start date × airflow × year), and the heat has no batches.
 */
import {
  computeHourlyConditions,
  computeSolarColumns,
  type HourlyConditions,
} from '../drying/hourly-conditions.ts'
import { type HourlySeries, QualityFlag } from '../weather/series.ts'
import { assembleAssessment, MIN_HOURS_FOR_A_YEAR } from './assemble.ts'
import type { AssessOptions } from './assess-options.ts'
import {
  MONTHLY_HEAT_START_DAYS,
  type ResolvedAssessOptions,
  resolveAssessOptions,
} from './assess-options.ts'
import type { Assessment, MonthlyRow } from './assessment.ts'
import { binStage } from './bin-stage.ts'
import { heatSummary } from './heat-summary.ts'
import { type LocalTimeColumns, localTimeColumns } from './local-time.ts'
import { countMonthly, type MonthlyCounts, monthlyRows } from './monthly-tables.ts'
import { psychrometricSummary } from './psychrometric.ts'
import { assessmentSpoilage, spoilageSetup, summariseSpoilage } from './spoilage.ts'
import {
  bestStartWindows,
  knownOutcomes,
  runStart,
  type StartContext,
  type StartOutcome,
  type StartTableResult,
  startDateTable,
  startIndexFor,
  startRecord,
} from './start-dates.ts'
import { quantileSorted, roundOrNull, spread } from './statistics.ts'

export { assembleAssessment, assessmentWarnings } from './assemble.ts'

export {
  type AssessOptions,
  type AssessProgress,
  BACKUP_MIN_AIR_C,
  resolveAssessOptions,
} from './assess-options.ts'

/**
 * Share of the usable hours that may lack irradiance before a method that needs the sun is refused:
 * one half (common practice, no source). Below it the engine takes the missing hours as 0 W/m² and
 * says how many; above it the figures would describe a sunless site.
 */
export const MAX_SUNLESS_SHARE = 0.5

/** A method this weather file cannot serve (e.g. one that needs the sun on a sunless file): the reason in words. */
export class MethodRefused extends RangeError {
  override name = 'MethodRefused'
}

/**
 * Refuse a method that needs the sun (open air, solar cabinet) when the series has no irradiance
 * for most of its usable hours: no irradiance column and nothing to estimate it from
 * (`weather/sun-estimate.ts` needs the site's position and cloud cover or whole days of temperatures).
 */
export function requireSun(series: HourlySeries, kind: string): void {
  let usable = 0
  let sunless = 0
  for (let i = 0; i < series.hours; i++) {
    if (series.quality[i] & QualityFlag.missingCore) continue
    usable++
    if (Number.isNaN(series.ghiWm2[i])) sunless++
  }
  if (usable > 0 && sunless > MAX_SUNLESS_SHARE * usable) {
    const placed = series.site.latitudeDeg !== null && series.site.longitudeDeg !== null
    throw new MethodRefused(
      `the ${kind} method needs the sun, and ${sunless} of the ${usable} hours with dry bulb and humidity have no irradiance: ` +
        (placed
          ? 'the file has none, and neither cloud cover nor whole days of temperatures to estimate it from; ' +
            'use a file with irradiance or cloud cover, or assess the shade or heated method'
          : "the file has none, and an estimate needs the site's position (--lat and --lon) besides cloud cover or whole " +
            'days of temperatures; give the position, use a file with irradiance, or assess the shade or heated method'),
    )
  }
}

/**
 * Refuse a method that needs the site's position (a collector or cover facing the sun) when the series has
 * none, as a {@link MethodRefused}: methods side by side over every method then list it as not assessed
 * with this reason instead of failing the whole request.
 */
export function requireCoordinates(series: HourlySeries, kind: string): void {
  if (series.site.latitudeDeg !== null && series.site.longitudeDeg !== null) return
  throw new MethodRefused(
    `the ${kind} method needs the site's latitude and longitude (its collector or cover faces the sun), and the file gives none: give the position (--lat and --lon) or assess the open-air, shade or heated method`,
  )
}

/** Assess one site (one series) for one product and method. Throws RangeError for bad options. */
export function assess(series: HourlySeries, options: AssessOptions): Assessment {
  if (series.hours < 24)
    throw new RangeError(`the weather series must hold at least 24 hours, got ${series.hours}`)
  const run = resolveAssessOptions(options)
  if (run.model.needs.coordinates) requireCoordinates(series, run.method.kind)
  if (run.model.needs.sun) requireSun(series, run.method.kind)
  const { primary, backup } = hourlyConditionsStage(series, run)
  const calendar = calendarStage(series, primary)
  const ctx = startContext(series, run, calendar.time, primary, backup)
  const psychrometric = () =>
    psychrometricSummary(series, run.profile, run.targetWbPct, {
      utcOffsetHours: calendar.time.utcOffsetHours,
      saturationPa: primary.ambientSaturationPa,
    })
  if (run.model.batches === 'deep-bed') {
    // grain in a bin: the deep-bed model per start date, airflow and year instead of batches
    const bin = binStage(series, run, calendar.time)
    const starts: StartDates = { table: { rows: [], outcomes: [], batches: 0, skipped: 0 }, best: NO_WINDOWS }
    const heat = heatSummary([], backup, run, ctx, { heatedSample: false })
    return assembleAssessment(series, run, {
      primary,
      calendar,
      starts,
      heat,
      psychrometric: psychrometric(),
      bin,
      unknownBatches: { count: 0, missingHours: 0 },
    })
  }
  const monthlyUnknown = monthlyHeatStage(ctx, calendar.monthly, calendar.years, run)
  const starts = startDatesStage(ctx, calendar.years, run)
  const known = knownOutcomes(starts.table.outcomes)
  const heat = heatSummary(known, backup, run, ctx)
  const unknown = [...monthlyUnknown, ...starts.table.outcomes.filter((o) => o.unknown)]
  const spoilage =
    ctx.spoilage === undefined
      ? null
      : assessmentSpoilage(
          ctx.spoilage.model,
          known.map((o) => o.spoilage),
        )
  return assembleAssessment(series, run, {
    primary,
    calendar,
    starts,
    heat,
    psychrometric: psychrometric(),
    spoilage,
    unknownBatches: {
      count: unknown.length,
      missingHours: unknown.reduce((sum, o) => sum + o.missingHours, 0),
    },
  })
}

/** The best windows of a bin assessment: none (its answer is the minimum airflow per start month). */
const NO_WINDOWS: StartDates['best'] = {
  windows: [],
  criterion: 'grain in a bin: see the minimum airflow per start month instead of start windows',
}

/** Stage 2: the method's hourly conditions for every hour and the backup heater's, lazily. */
export function hourlyConditionsStage(
  series: HourlySeries,
  run: ResolvedAssessOptions,
): { primary: HourlyConditions; backup: HourlyConditions } {
  const progress = run.onProgress
  // the azimuth is read only by tilted collectors (the backup heater needs none)
  const solar = computeSolarColumns(series, { azimuth: run.model.needs.sunAzimuth })
  const conditionOptions = {
    targetDb: run.targetDb,
    initialWbPct: run.initialWbPct,
    loadingKgPerM2: run.loadingKgPerM2,
    thresholds: run.thresholds,
    maxProductTempC: run.maxProductTempC,
    solar,
  }
  progress?.({ stage: 'hourly-conditions', done: 0, total: 2 })
  // the primary's report-only columns are not read by an assessment (monthly tables use the verdict ones)
  const primary = computeHourlyConditions(series, run.method, run.product, {
    ...conditionOptions,
    diagnostics: false,
  })
  const backup =
    run.method === run.backupMethod
      ? primary
      : computeHourlyConditions(series, run.backupMethod, run.product, {
          ...conditionOptions,
          verdict: false,
          lazy: true,
          diagnostics: false,
          ambientSaturationPa: primary.ambientSaturationPa,
        })
  progress?.({ stage: 'hourly-conditions', done: 2, total: 2 })
  return { primary, backup }
}

export interface Calendar {
  time: LocalTimeColumns
  counts: MonthlyCounts
  /** Monthly rows without the heat columns (filled by {@link monthlyHeatStage}). */
  monthly: MonthlyRow[]
  /** Years with at least one month of enough data, or at least a week of hours. */
  years: number[]
}

/** Stage 3: local time, usable hours per month and year, and the years with data. */
export function calendarStage(series: HourlySeries, primary: HourlyConditions): Calendar {
  const time = localTimeColumns(series)
  const counts = countMonthly(primary, time)
  const monthly = monthlyRows(counts)
  // Years with at least one month of enough data (a UTC file shifted to local time touches one hour of
  // the next year: that is not a year of data). A short file (a logger export of a few weeks) still
  // counts its year when it holds at least a week. Hours per year in a typed array (a Map update per
  // hour costs ~10 ms on 30 years).
  let firstYear = Number.POSITIVE_INFINITY
  let lastYear = Number.NEGATIVE_INFINITY
  for (let i = 0; i < series.hours; i++) {
    const y = time.year[i]
    if (y < firstYear) firstYear = y
    if (y > lastYear) lastYear = y
  }
  const yearHours = new Int32Array(series.hours > 0 ? lastYear - firstYear + 1 : 0)
  for (let i = 0; i < series.hours; i++) {
    if ((series.quality[i] & QualityFlag.missingCore) === 0) yearHours[time.year[i] - firstYear]++
  }
  const years = counts.years.filter(
    (y) =>
      monthly.some((m) => m.usableHours.byYear.some((v) => v.year === y)) ||
      (yearHours[y - firstYear] ?? 0) >= MIN_HOURS_FOR_A_YEAR,
  )
  return { time, counts, monthly, years }
}

/** The context every batch of an assessment runs in, with an empty record of the starts already run. */
export function startContext(
  series: HourlySeries,
  run: ResolvedAssessOptions,
  time: LocalTimeColumns,
  primary: HourlyConditions,
  backup: HourlyConditions,
): StartContext {
  const ctx: StartContext = {
    series,
    toUtcMs: time.toUtcMs,
    primary,
    backup,
    product: run.product,
    initialDb: run.initialDb,
    targetDb: run.targetDb,
    deadlineHours: Math.round(run.deadlineDays * 24),
    maxHours: Math.round(run.maxDays * 24),
    startHourLocal: run.season.startHourLocal,
    wrap: series.typicalYear,
    spoilage: run.spoilage ? spoilageSetup(run.profile) : undefined,
  }
  ctx.ran = startRecord(ctx)
  return ctx
}

/** Stage 4: batches from the 1st and 16th of every month; their heat and median days fill `monthly`. */
export function monthlyHeatStage(
  ctx: StartContext,
  monthly: MonthlyRow[],
  years: number[],
  run: ResolvedAssessOptions,
): StartOutcome[] {
  const unknown: StartOutcome[] = []
  for (let month = 1; month <= 12; month++) {
    const outcomes: StartOutcome[] = []
    for (const day of MONTHLY_HEAT_START_DAYS) {
      for (const year of years) {
        const index = startIndexFor(ctx, year, { month, day })
        if (index === null) continue
        const o = runStart(ctx, index)
        // a batch that ran into missing weather has no known outcome: left out, not counted as slow
        if (o.unknown) unknown.push(o)
        else outcomes.push(o)
      }
    }
    const row = monthly[month - 1]
    row.supplementalHeatKwhPerTonne = spread(
      outcomes.map((o) => o.heatKwhPerTonne),
      1,
    )
    if (outcomes.length < 5) row.supplementalHeatKwhPerTonne.p10 = row.supplementalHeatKwhPerTonne.p90 = null
    const days = outcomes.map((o) => o.hoursToTarget / 24).sort((a, b) => a - b)
    row.medianDaysToTarget = roundOrNull(quantileSorted(days, 0.5), 1)
    row.spoilage =
      ctx.spoilage === undefined
        ? null
        : summariseSpoilage(
            ctx.spoilage.model,
            outcomes.map((o) => o.spoilage),
          )
    run.onProgress?.({ stage: 'monthly-heat', done: month, total: 12 })
  }
  return unknown
}

export interface StartDates {
  table: StartTableResult
  best: ReturnType<typeof bestStartWindows>
}

/** Stage 5: one batch per start day of the season and year, and the best start windows. */
export function startDatesStage(ctx: StartContext, years: number[], run: ResolvedAssessOptions): StartDates {
  const days = run.startDays
  const table = startDateTable(ctx, days, years, (di) =>
    run.onProgress?.({ stage: 'start-dates', done: di + 1, total: days.length }),
  )
  return { table, best: bestStartWindows(table.rows) }
}
