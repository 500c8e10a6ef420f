/**
 * @module analysis/assemble
 * The last stage of an assessment: the JSON-safe {@link Assessment} from the stages' results, with every
 * assumption and the warnings (what the file and the options leave uncertain, in sentences for the user).
 */
import type { HourlyConditions } from '../drying/hourly-conditions.ts'
import { heatedLimitWarnings } from '../drying/methods/heated.ts'
import { methodLoadingKgPerM2 } from '../drying/methods/index.ts'
import { type FiguresInUse, figureCounts, figuresFromMemory } from '../product/memory-figures.ts'
import { type HourlySeries, QualityFlag } from '../weather/series.ts'
import type { Calendar, StartDates } from './assess.ts'
import type { ResolvedAssessOptions } from './assess-options.ts'
import { ASSESSMENT_SCHEMA, type Assessment } from './assessment.ts'
import type { BinAssessment } from './assessment-bin.ts'
import { assessmentAssumptions } from './assumptions.ts'
import { hourOfDayTable, MONTH_COVERAGE_REQUIRED, totalReasons } from './monthly-tables.ts'
import type { PsychrometricSummary } from './psychrometric.ts'
import { seasonCalendar } from './season-calendar.ts'
import { roundOrNull } from './statistics.ts'

/** Hours of data that make a year count when no month of it is complete enough: one week (our choice). */
export const MIN_HOURS_FOR_A_YEAR = 168

/** How the weather reader names the assumption it adds when it estimates the sun. */
const ESTIMATED_SUN_PREFIX = 'irradiance estimated from '

/** Daylight hours (irradiance above 0) whose irradiance the reader estimated. */
function countEstimatedSun(series: HourlySeries): number {
  let n = 0
  for (let i = 0; i < series.hours; i++)
    if (series.quality[i] & QualityFlag.irradianceEstimated && series.ghiWm2[i] > 0) n++
  return n
}

/** What the file and the options leave uncertain, in sentences for the user. */
export function assessmentWarnings(
  series: HourlySeries,
  run: ResolvedAssessOptions,
  primary: HourlyConditions,
  calendar: Calendar,
  starts: StartDates,
  estimatedSunHours: number,
  bin?: BinAssessment,
): string[] {
  const warnings: string[] = []
  if (run.dryTarget.warning !== null) warnings.push(run.dryTarget.warning)
  warnings.push(
    ...(run.method.kind === 'heated'
      ? heatedLimitWarnings(run.method, run.maxProductTempC, 'heated air')
      : heatedLimitWarnings(run.backupMethod, run.maxProductTempC, 'backup heater')),
  )
  const { years, time } = calendar
  if (years.length === 0) {
    warnings.push(
      `no year holds ${MIN_HOURS_FOR_A_YEAR} hours (a week) with dry bulb and humidity: the monthly and start-date tables are empty`,
    )
  } else if (series.typicalYear || years.length < 2) {
    warnings.push(
      series.typicalYear
        ? 'typical-year file: one synthetic year, so spread across years (P10/P90) cannot be computed; the figures describe that one year only'
        : 'the file holds one year: spread across years (P10/P90) cannot be computed',
    )
  } else if (years.length < 10) {
    warnings.push(`only ${years.length} years of data: P10 and P90 across so few years are rough`)
  }
  if (estimatedSunHours > 0 && run.model.needs.sun) {
    const from = (series.supplied ?? [])
      .filter((s) => s.name.startsWith(ESTIMATED_SUN_PREFIX))
      .map((s) => s.name.slice(ESTIMATED_SUN_PREFIX.length))
    warnings.push(
      `the sun in ${estimatedSunHours} daylight hours is estimated${from.length > 0 ? ` from ${from.join(' and ')}` : ''}, ` +
        'not measured: usable hours and drying times rest on that estimate, which is meant for sums over many days ' +
        'and is rough hour by hour (see the assumptions)',
    )
  }
  if (primary.noRainData && run.model.rainMatters(run.method)) {
    warnings.push(
      'the file has no rain: rain on the exposed product is not assessed (hours are never flagged as rain)',
    )
  }
  if (time.offsetSource === 'longitude' || time.offsetSource === 'assumed-utc') {
    warnings.push(
      `the site's clock is not known: local time taken as UTC${time.utcOffsetHours >= 0 ? '+' : ''}${time.utcOffsetHours} (${time.offsetSource === 'longitude' ? 'longitude / 15' : 'no longitude either'}); give --site-tz <zone> for the site's own`,
    )
  } else if (time.offsetSource === 'timestamps') {
    warnings.push(
      // the zone when the timestamps name one (its daylight saving is followed), else their fixed offset
      `the site's clock is taken from the file's local timestamps (${time.timeZone ? `${time.timeZone} time` : `UTC${time.utcOffsetHours >= 0 ? '+' : ''}${time.utcOffsetHours}`}); give --site-tz <zone> if the site keeps another`,
    )
  }
  if (primary.assumedIrradianceHours > 0) {
    warnings.push(
      `${primary.assumedIrradianceHours} daylight hours had no irradiance and were taken as 0 W/m²`,
    )
  }
  if (bin) warnings.push(...binWarnings(bin))
  else if (starts.table.batches === 0)
    warnings.push('no start date in the season had a complete batch in the data')
  return warnings
}

/** The warning for batches that ran into hours without weather (none when there are none). */
function unknownBatchWarnings(u: UnknownBatches): string[] {
  if (u.count === 0) return []
  return [
    `${u.count} batch${u.count === 1 ? '' : 'es'} ran into hours without weather (${u.missingHours} such hours, summed over those batches): ` +
      'what the product did then is not known, so their outcome is unknown; they are left out of the days to ' +
      'target, the probabilities and the heat figures (not counted as slow)',
  ]
}

/** Batches that ran into hours without weather (outcome unknown) and the hours they missed, summed. */
export interface UnknownBatches {
  count: number
  missingHours: number
}

/** The product's dry target as the assessment shows it (basis, water activities, the sentence). */
function dryTargetView(run: ResolvedAssessOptions): Assessment['product']['dryTarget'] {
  const t = run.dryTarget
  return {
    basis: t.basis,
    safeWaterActivity: t.safeWaterActivity,
    safeWaterActivitySource: t.safeWaterActivitySource,
    storageTempC: t.storageTempC,
    waterActivityAtTarget: roundOrNull(t.waterActivityAtTarget ?? Number.NaN, 3),
    moistureAtSafeWaterActivityWbPct: roundOrNull(t.moistureAtSafeWaterActivityWbPct ?? Number.NaN, 2),
    profileMoistureWbPct: t.profileMoistureWbPct,
    waterActivityAtProfileMoisture: roundOrNull(t.waterActivityAtProfileMoisture ?? Number.NaN, 3),
    sentence: t.sentence,
  }
}

/**
 * Which of the profile's own figures this answer uses: a figure the user replaced (the run's value differs from
 * the profile's, or the method sets the loading) is the user's; the profile's target moisture counts only when it
 * decides "dry".
 */
function profileFiguresInUse(run: ResolvedAssessOptions): FiguresInUse {
  const p = run.profile
  return {
    initialMoisture: run.initialWbPct === p.initialMoistureWbPct.value,
    targetMoisture: run.dryTarget.basis === 'profile-moisture',
    thickness: run.product.thicknessMm === p.defaultThicknessMm.value,
    loading: methodLoadingKgPerM2(run.method) === undefined,
  }
}

function isoHour(ms: number): string {
  return new Date(ms).toISOString().slice(0, 13) + ':00Z'
}

/** Stage 8: the JSON-safe assessment. */
export function assembleAssessment(
  series: HourlySeries,
  run: ResolvedAssessOptions,
  parts: {
    primary: HourlyConditions
    calendar: Calendar
    starts: StartDates
    heat: Assessment['heat']
    psychrometric: PsychrometricSummary
    /** The bin stage's answer (methods with deep-bed batches). */
    bin?: BinAssessment
    /** The spoilage block (null when the assessment ran without spoilage; absent: null). */
    spoilage?: Assessment['spoilage']
    /** Batches that ran into hours without weather (outcome unknown) and the hours they missed. */
    unknownBatches: UnknownBatches
  },
): Assessment {
  const { primary, calendar, starts } = parts
  const { profile, product } = run
  const reasons = totalReasons(calendar.counts)
  const estimatedSunHours = countEstimatedSun(series)
  const inUse = profileFiguresInUse(run)
  return {
    schema: ASSESSMENT_SCHEMA,
    site: {
      name: series.site.name,
      latitudeDeg: series.site.latitudeDeg,
      longitudeDeg: series.site.longitudeDeg,
      elevationM: series.site.elevationM,
      utcOffsetHours: calendar.time.utcOffsetHours,
      utcOffsetSource: calendar.time.offsetSource,
      timeZone: calendar.time.timeZone,
      typicalYear: series.typicalYear,
    },
    product: {
      id: profile.id,
      name: profile.name,
      initialMoistureWbPct: run.initialWbPct,
      targetMoistureWbPct: run.targetWbPct,
      targetErhPctAt25C: roundOrNull(product.erhPct(25, run.targetDb), 1) ?? 0,
      dryTarget: dryTargetView(run),
      maxProductTempC: run.maxProductTempC,
      thicknessMm: product.thicknessMm,
      loadingKgPerM2: run.loadingKgPerM2,
      cautions: [...profile.cautions],
      figuresFromMemory: figuresFromMemory(profile, inUse),
      figureCounts: figureCounts(profile, inUse),
    },
    method: run.method,
    methodLabel: run.model.label,
    season: run.season,
    deadlineDays: run.deadlineDays,
    maxDays: run.maxDays,
    monthly: calendar.monthly,
    hourOfDay: hourOfDayTable(calendar.counts),
    hoursByReason: reasons,
    startDates: starts.table.rows,
    spoilage: parts.spoilage ?? null,
    bestStartWindows: starts.best.windows,
    bestStartWindowCriterion: starts.best.criterion,
    // a bin has no batches by start week (its answer is the minimum airflow per start month): no cells
    seasonCalendar: parts.bin ? { rules: [], cells: [] } : seasonCalendar(starts.table.rows, run.season),
    heat: parts.heat,
    psychrometric: parts.psychrometric,
    assumptions: [
      ...assessmentAssumptions(run),
      // what the weather reader supplied rather than read (estimated irradiance, a constant pressure)
      ...(series.supplied ?? []),
    ],
    warnings: [
      ...assessmentWarnings(series, run, primary, calendar, starts, estimatedSunHours, parts.bin),
      ...unknownBatchWarnings(parts.unknownBatches),
    ],
    coverage: {
      firstHourUtc: isoHour(series.startUtcMs[0]),
      lastHourUtc: isoHour(series.startUtcMs[series.hours - 1]),
      hours: series.hours,
      missingHours: reasons.missingData,
      years: calendar.years,
      monthCoverageRequired: MONTH_COVERAGE_REQUIRED,
      assumedIrradianceHours: primary.assumedIrradianceHours,
      estimatedIrradianceHours: estimatedSunHours,
      assumedWindHours: primary.assumedWindHours,
      hasRainData: !primary.noRainData,
      startDateBatchesRun: starts.table.batches,
      startDateBatchesSkippedForData: starts.table.skipped,
      batchesWithUnknownOutcome: parts.unknownBatches.count,
      missingWeatherHoursInBatches: parts.unknownBatches.missingHours,
    },
    ...(parts.bin ? { bin: parts.bin } : {}),
  }
}

/** What a bin assessment leaves uncertain. */
function binWarnings(bin: BinAssessment): string[] {
  const out: string[] = []
  if (bin.runs === 0) out.push('no start date in the season had a complete bin run in the data')
  if (bin.runsLeftOut > 0)
    out.push(
      `${bin.runsLeftOut} bin runs were left out: the ${bin.seasonDays}-day season ran past the end of the file, or the first day had no weather`,
    )
  if (bin.startDates.some((s) => s.years > 0 && s.yearsTopLayerDryWithinSeason < s.years))
    out.push(
      `in some years the top layer was not dry within ${bin.seasonDays} days: grain left wet in the bin must be cooled and managed until drying weather returns (not modelled)`,
    )
  return out
}
