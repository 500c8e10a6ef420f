/**
 * @module analysis/assess
 * `assess(series, options)`: can this site's weather dry this product by this method, when, how fast,
 * and with how much supplemental heat. Hourly conditions are computed once per method (and once for the
 * backup heater) and reused by every batch. Returns a JSON-safe {@link Assessment}.
 */
import { FUELS, fuelForHeat } from '../drying/fuels.ts'
import {
  computeHourlyConditions,
  computeSolarColumns,
  type HourlyConditions,
} from '../drying/hourly-conditions.ts'
import {
  type DryingMethod,
  type DryingMethodInput,
  type FuelId,
  type HeatedMethod,
  heatedSchema,
  parseDryingMethod,
} from '../drying/method.ts'
import { productResponse } from '../drying/product-response.ts'
import { tabulatedResponse } from '../drying/product-tables.ts'
import { type DryingThresholds, parseDryingThresholds } from '../drying/thresholds.ts'
import { heatOfSorption } from '../product/equilibrium.ts'
import { moistureDbFromWbPct, waterToRemoveKg } from '../product/moisture-basis.ts'
import type { ProductProfile } from '../product/profile.ts'
import { type HourlySeries, QualityFlag } from '../weather/series.ts'
import { ASSESSMENT_SCHEMA, type Assessment, type FuelFigure, type HeatSummary } from './assessment.ts'
import { assessmentAssumptions } from './assumptions.ts'
import { localTimeColumns } from './local-time.ts'
import {
  countMonthly,
  hourOfDayTable,
  MONTH_COVERAGE_REQUIRED,
  monthlyRows,
  totalReasons,
} from './monthly-tables.ts'
import { HEATED_SAMPLE_BATCHES, planAssessment } from './plan.ts'
import {
  bestStartWindows,
  type MonthDay,
  runStart,
  type StartContext,
  type StartOutcome,
  startDateTable,
  startIndexFor,
} from './start-dates.ts'
import { quantileSorted, roundOrNull, spread } from './statistics.ts'

export interface AssessProgress {
  stage: 'hourly-conditions' | 'monthly-heat' | 'start-dates' | 'done'
  done: number
  total: number
}

export interface AssessOptions {
  product: ProductProfile
  method: DryingMethodInput | DryingMethod
  /** Target moisture [% wb]; default the profile's. */
  targetWbPct?: number
  /** Initial moisture [% wb]; default the profile's. */
  initialWbPct?: number
  thicknessMm?: number
  /** Season of start dates, 'MM-DD'; default the whole year. */
  seasonStart?: string
  seasonEnd?: string
  /** Days between start dates; default 1 when a season is given, else 7. */
  startStepDays?: number
  /** Local standard hour at which batches start; default 8. */
  startHourLocal?: number
  /** The user's window to finish [days]; default 14. */
  deadlineDays?: number
  /** Maximum duration of a batch before it counts as failed [days]; default 60. */
  maxDays?: number
  /** Batch size [kg fresh]; default 1000. */
  batchKgFresh?: number
  thresholds?: Partial<DryingThresholds>
  /** Backup heater for supplemental heat (ignored when the method is heated). Defaults of `heatedSchema`. */
  backupHeater?: Partial<Omit<HeatedMethod, 'kind'>>
  /** Fuel for the heat figures; default the heater's fuel. */
  fuel?: FuelId
  /** Prices per fuel unit; missing prices use the marked examples. */
  fuelPrices?: Partial<Record<FuelId, number>>
  onProgress?: (p: AssessProgress) => void
}

/** Hours of data that make a year count when no month of it is complete enough: one week (our choice). */
const MIN_HOURS_FOR_A_YEAR = 168

function isoHour(ms: number): string {
  return new Date(ms).toISOString().slice(0, 13) + ':00Z'
}

/**
 * Share of the usable hours that may lack irradiance before a method that needs the sun is refused:
 * one half (common practice, no source). Below it the engine takes the missing hours as 0 W/m² and
 * says how many; above it the figures would describe a sunless site.
 */
export const MAX_SUNLESS_SHARE = 0.5

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
    throw new RangeError(
      `the ${kind} method needs the sun, and ${sunless} of the ${usable} hours with dry bulb and humidity have no irradiance: ` +
        (placed
          ? 'the file has none, and neither cloud cover nor whole days of temperatures to estimate it from; ' +
            'use a file with irradiance or cloud cover, or assess the shade or heated method'
          : "the file has none, and an estimate needs the site's position (--lat and --lon) besides cloud cover or whole " +
            'days of temperatures; give the position, use a file with irradiance, or assess the shade or heated method'),
    )
  }
}

/** Daylight hours (irradiance above 0) whose irradiance the reader estimated. */
function countEstimatedSun(series: HourlySeries): number {
  let n = 0
  for (let i = 0; i < series.hours; i++)
    if (series.quality[i] & QualityFlag.irradianceEstimated && series.ghiWm2[i] > 0) n++
  return n
}

/** Assess one site (one series) for one product and method. Throws RangeError for bad options. */
export function assess(series: HourlySeries, options: AssessOptions): Assessment {
  if (series.hours < 24)
    throw new RangeError(`the weather series must hold at least 24 hours, got ${series.hours}`)
  const profile = options.product
  const method = parseDryingMethod(options.method)
  if (method.kind === 'open-air' || method.kind === 'solar-cabinet') requireSun(series, method.kind)
  const thresholds = parseDryingThresholds(options.thresholds ?? {})
  const plan = planAssessment(options)
  const { initialWbPct, targetWbPct, deadlineDays, maxDays, batchKgFresh, startHourLocal, stepDays } = plan

  const product = tabulatedResponse(productResponse(profile, options.thicknessMm))
  const initialDb = moistureDbFromWbPct(initialWbPct)
  const targetDb = moistureDbFromWbPct(targetWbPct)
  const loadingKgPerM2 =
    (method.kind === 'open-air' || method.kind === 'shade' ? method.loadingKgPerM2 : undefined) ??
    profile.defaultLoadingKgPerM2.value
  const maxT = profile.maxProductTempC?.value ?? null
  // the azimuth is read only by the solar cabinet's collector (the backup heater needs none)
  const solar = computeSolarColumns(series, { azimuth: method.kind === 'solar-cabinet' })
  const conditionOptions = {
    targetDb,
    initialWbPct,
    loadingKgPerM2,
    thresholds,
    maxProductTempC: maxT,
    solar,
  }
  const progress = options.onProgress
  progress?.({ stage: 'hourly-conditions', done: 0, total: 2 })
  // the primary's report-only columns are not read by an assessment (monthly tables use the verdict ones)
  const primary = computeHourlyConditions(series, method, product, {
    ...conditionOptions,
    diagnostics: false,
  })
  const backupMethod: HeatedMethod =
    method.kind === 'heated' ? method : heatedBackup(options.backupHeater, product.erhPct(25, targetDb), maxT)
  const backup: HourlyConditions =
    method.kind === 'heated'
      ? primary
      : computeHourlyConditions(series, backupMethod, product, {
          ...conditionOptions,
          verdict: false,
          lazy: true,
          diagnostics: false,
          ambientSaturationPa: primary.ambientSaturationPa,
        })
  progress?.({ stage: 'hourly-conditions', done: 2, total: 2 })

  const time = localTimeColumns(series)
  const counts = countMonthly(primary, time)
  const monthly = monthlyRows(counts)
  const warnings: string[] = []
  const ctx: StartContext = {
    series,
    utcOffsetHours: time.utcOffsetHours,
    primary,
    backup,
    product,
    initialDb,
    targetDb,
    deadlineHours: Math.round(deadlineDays * 24),
    maxHours: Math.round(maxDays * 24),
    startHourLocal,
    wrap: series.typicalYear,
  }
  // Years with at least one month of enough data (a UTC file shifted to local time touches one hour of
  // the next year: that is not a year of data).
  // A short file (a logger export of a few weeks) still counts its year when it holds at least a week.
  // hours with data per local year, counted in a typed array (a Map update per hour costs ~10 ms on 30 years)
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
  const hoursInYear = new Map<number, number>()
  yearHours.forEach((h, k) => {
    if (h > 0) hoursInYear.set(firstYear + k, h)
  })
  const years = counts.years.filter(
    (y) =>
      monthly.some((m) => m.usableHours.byYear.some((v) => v.year === y)) ||
      (hoursInYear.get(y) ?? 0) >= MIN_HOURS_FOR_A_YEAR,
  )

  // Monthly heat: batches from the 1st and 16th of every month.
  for (let month = 1; month <= 12; month++) {
    const outcomes: StartOutcome[] = []
    for (const day of [1, 16]) {
      for (const year of years) {
        const index = startIndexFor(ctx, year, { month, day })
        if (index !== null) outcomes.push(runStart(ctx, index))
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
    progress?.({ stage: 'monthly-heat', done: month, total: 12 })
  }

  const days: MonthDay[] = plan.startDays
  const table = startDateTable(ctx, days, years, (di) =>
    progress?.({ stage: 'start-dates', done: di + 1, total: days.length }),
  )
  const best = bestStartWindows(table.rows)
  const heat = heatSummary(table.outcomes, backupMethod, backup, options, batchKgFresh, {
    profile,
    initialWbPct,
    targetWbPct,
    targetDb,
    ctx,
  })

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
  const estimatedSunHours = countEstimatedSun(series)
  if (estimatedSunHours > 0 && (method.kind === 'open-air' || method.kind === 'solar-cabinet')) {
    const from = (series.supplied ?? [])
      .filter((s) => s.name.startsWith('irradiance estimated from '))
      .map((s) => s.name.slice('irradiance estimated from '.length))
    warnings.push(
      `the sun in ${estimatedSunHours} daylight hours is estimated${from.length > 0 ? ` from ${from.join(' and ')}` : ''}, ` +
        'not measured: usable hours and drying times rest on that estimate, which is meant for sums over many days ' +
        'and is rough hour by hour (see the assumptions)',
    )
  }
  if (primary.noRainData && method.kind === 'open-air') {
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
      `the site's clock is taken from the file's local timestamps (UTC${time.utcOffsetHours >= 0 ? '+' : ''}${time.utcOffsetHours}); give --site-tz <zone> if the site keeps another`,
    )
  }
  if (primary.assumedIrradianceHours > 0) {
    warnings.push(
      `${primary.assumedIrradianceHours} daylight hours had no irradiance and were taken as 0 W/m²`,
    )
  }
  if (table.batches === 0) warnings.push('no start date in the season had a complete batch in the data')
  const reasons = totalReasons(counts)
  return {
    schema: ASSESSMENT_SCHEMA,
    site: {
      name: series.site.name,
      latitudeDeg: series.site.latitudeDeg,
      longitudeDeg: series.site.longitudeDeg,
      elevationM: series.site.elevationM,
      utcOffsetHours: time.utcOffsetHours,
      utcOffsetSource: time.offsetSource,
      typicalYear: series.typicalYear,
    },
    product: {
      id: profile.id,
      name: profile.name,
      initialMoistureWbPct: initialWbPct,
      targetMoistureWbPct: targetWbPct,
      targetErhPctAt25C: roundOrNull(product.erhPct(25, targetDb), 1) ?? 0,
      maxProductTempC: maxT,
      thicknessMm: product.thicknessMm,
      loadingKgPerM2,
      cautions: [...profile.cautions],
    },
    method,
    season: {
      start: plan.seasonStart,
      end: plan.seasonEnd,
      stepDays,
      startHourLocal,
    },
    deadlineDays,
    maxDays,
    monthly,
    hourOfDay: hourOfDayTable(counts),
    hoursByReason: reasons,
    startDates: table.rows,
    bestStartWindows: best.windows,
    bestStartWindowCriterion: best.criterion,
    heat,
    assumptions: [
      ...assessmentAssumptions(
        method,
        backupMethod,
        thresholds,
        profile,
        product.thicknessMm,
        loadingKgPerM2,
      ),
      // what the weather reader supplied rather than read (estimated irradiance, a constant pressure)
      ...(series.supplied ?? []),
    ],
    warnings,
    coverage: {
      firstHourUtc: isoHour(series.startUtcMs[0]),
      lastHourUtc: isoHour(series.startUtcMs[series.hours - 1]),
      hours: series.hours,
      missingHours: reasons.missingData,
      years,
      monthCoverageRequired: MONTH_COVERAGE_REQUIRED,
      assumedIrradianceHours: primary.assumedIrradianceHours,
      estimatedIrradianceHours: estimatedSunHours,
      assumedWindHours: primary.assumedWindHours,
      hasRainData: !primary.noRainData,
      startDateBatchesRun: table.batches,
      startDateBatchesSkippedForData: table.skipped,
    },
  }
}

/** Lowest air temperature of the backup heater when the user gives none [°C] (assumption, from memory:
 * batch dryers run fruit at 45–65 °C and grain at 45–80 °C; 45 °C is the low end of both). */
export const BACKUP_MIN_AIR_C = 45

/**
 * The backup heater: the user's values over `heatedSchema` defaults; its target RH is at most 80 % of the
 * product's equilibrium RH at target (at 25 °C), so heated air always dries toward the target, and its air
 * is at least {@link BACKUP_MIN_AIR_C} (or the product's limit when lower) unless the user says otherwise.
 */
function heatedBackup(
  given: AssessOptions['backupHeater'],
  targetErhPct: number,
  maxProductTempC: number | null,
): HeatedMethod {
  const base = heatedSchema.parse({ kind: 'heated', ...(given ?? {}) })
  if (base.setPointC === undefined && given?.targetRhPct === undefined) {
    base.targetRhPct = Math.min(base.targetRhPct, 0.8 * targetErhPct)
  }
  if (given?.minAirC === undefined)
    base.minAirC = Math.min(BACKUP_MIN_AIR_C, maxProductTempC ?? BACKUP_MIN_AIR_C)
  return base
}

interface HeatContext {
  profile: ProductProfile
  initialWbPct: number
  targetWbPct: number
  targetDb: number
  ctx: StartContext
}

function heatSummary(
  outcomes: StartOutcome[],
  heater: HeatedMethod,
  backup: HourlyConditions,
  options: AssessOptions,
  batchKgFresh: number,
  h: HeatContext,
): HeatSummary {
  const perTonne = outcomes.map((o) => o.heatKwhPerTonne)
  const tonnes = batchKgFresh / 1000
  const eff = heater.heaterEfficiency
  const s = spread(perTonne, 1)
  const scale = (x: number | null, f: number): number | null => (x === null ? null : roundOrNull(x * f, 1))
  const selectedFuel = options.fuel ?? heater.fuel
  const fuels: FuelFigure[] = (Object.keys(FUELS) as FuelId[]).map((id) => {
    const price = options.fuelPrices?.[id]
    const use = s.median === null ? null : fuelForHeat(s.median, eff, id, price)
    return {
      fuel: id,
      unit: FUELS[id].unit,
      quantityPerTonne: use ? roundOrNull(use.quantity, 2) : null,
      quantityPerBatch: use ? roundOrNull(use.quantity * tonnes, 2) : null,
      costPerTonne: use ? roundOrNull(use.cost, 2) : null,
      costPerBatch: use ? roundOrNull(use.cost * tonnes, 2) : null,
      pricePerUnit: price ?? FUELS[id].examplePricePerUnit,
      priceIsExample: price === undefined,
      heatingValueMjPerUnit: roundOrNull(FUELS[id].heatingValueMjPerUnit, 3) ?? 0,
      heatingValueSource: FUELS[id].source,
    }
  })
  // Cross-check: water to remove × (λ + net sorption heat at the target) ÷ efficiency.
  const water = waterToRemoveKg(1000, h.initialWbPct, h.targetWbPct)
  const meanComputedC = meanOf(backup.airC)
  // no batch needed the backup heater: take its lowest air temperature for the latent heat
  const meanHeatedC = Number.isFinite(meanComputedC) ? meanComputedC : heater.minAirC
  const sorption = heatOfSorption(h.profile, Math.min(Math.max(meanHeatedC, 0), 90), h.targetDb)
  const evaporationFuelKwh = (water * sorption.totalKjPerKg) / 3600 / eff
  const heatedOnly = heatedEveryHourSample(h.ctx, HEATED_SAMPLE_BATCHES)
  const ratio =
    heatedOnly.length > 0
      ? quantileSorted(
          heatedOnly.sort((a, b) => a - b),
          0.5,
        ) /
        eff /
        evaporationFuelKwh
      : Number.NaN
  return {
    heaterEfficiency: eff,
    airFlowKgPerSPerTonne: heater.airFlowKgPerSPerTonne,
    targetRhPct: heater.setPointC === undefined ? roundOrNull(heater.targetRhPct, 1) : null,
    setPointC: heater.setPointC ?? null,
    batchKgFresh,
    heatToAirKwhPerTonne: s,
    heatToAirKwhPerBatch: {
      median: scale(s.median, tonnes),
      p10: scale(s.p10, tonnes),
      p90: scale(s.p90, tonnes),
    },
    fuelHeatKwhPerTonne: {
      median: scale(s.median, 1 / eff),
      p10: scale(s.p10, 1 / eff),
      p90: scale(s.p90, 1 / eff),
    },
    fuels,
    selectedFuel,
    crossCheck: {
      waterToRemoveKgPerTonne: roundOrNull(water, 1) ?? 0,
      heatOfEvaporationKjPerKg: roundOrNull(sorption.totalKjPerKg, 0) ?? 0,
      heatOfEvaporationMethod: `latent heat of free water 2501 − 2.361·T (FAO-56 form) at the mean heated-air temperature ${meanHeatedC.toFixed(1)} °C, plus ${sorption.method}`,
      evaporationHeatFuelKwhPerTonne: roundOrNull(evaporationFuelKwh, 1) ?? 0,
      ratioHeatedEveryHour: roundOrNull(ratio, 2),
      note: 'A dryer heated every hour spends more than the evaporation heat because its exhaust leaves warm and unsaturated (ratio > 1); supplemental heat can be below it because ambient air does part of the drying.',
    },
  }
}

function meanOf(column: Float64Array): number {
  let sum = 0
  let count = 0
  for (let i = 0; i < column.length; i++) {
    const v = column[i]
    if (Number.isFinite(v)) {
      sum += v
      count++
    }
  }
  return count > 0 ? sum / count : Number.NaN
}

/** Heater heat [kWh/t] of up to `count` batches heated every hour, started evenly through the file. */
function heatedEveryHourSample(ctx: StartContext, count: number): number[] {
  const out: number[] = []
  const last = ctx.series.hours - (ctx.wrap ? 1 : ctx.maxHours)
  if (last <= 0) return out
  const heated: StartContext = { ...ctx, primary: ctx.backup }
  for (let k = 0; k < count; k++) {
    const index = Math.floor((k * last) / count)
    const o = runStart(heated, index)
    if (Number.isFinite(o.heatKwhPerTonne)) out.push(o.heatKwhPerTonne)
  }
  return out
}
