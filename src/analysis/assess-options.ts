/**
 * @module analysis/assess-options
 * The first stage of an assessment: the user's options checked and completed with the engine's defaults.
 * Everything that decides how much work an assessment is (season, start-date step, maximum batch length)
 * is resolved by {@link resolveSchedule} from the options alone, so that a planner that estimates the cost
 * before any weather is read uses the very numbers the engine will use.
 */
import {
  type DryingMethod,
  type DryingMethodInput,
  type FuelId,
  type HeatedMethod,
  heatedSchema,
  parseDryingMethod,
} from '../drying/method.ts'
import { methodLoadingKgPerM2, methodModel } from '../drying/methods/index.ts'
import type { MethodModel } from '../drying/methods/method-model.ts'
import { type ProductResponse, productResponse } from '../drying/product-response.ts'
import { tabulatedResponse } from '../drying/product-tables.ts'
import { type DryingThresholds, parseDryingThresholds } from '../drying/thresholds.ts'
import { moistureDbFromWbPct } from '../product/moisture-basis.ts'
import type { ProductProfile } from '../product/profile.ts'
import { parseMonthDay } from './local-time.ts'
import { type MonthDay, seasonDays } from './start-dates.ts'

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
  /** Maximum duration of a batch before it counts as failed [days]; default the larger of 60 and the deadline. */
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

/** Defaults of the options (our choices, stated in every assessment through its figures). */
export const ASSESS_DEFAULTS = {
  seasonStart: '01-01',
  seasonEnd: '12-31',
  /** Start-date step [days] with a season given, and without one (the whole year). */
  stepDaysWithSeason: 1,
  stepDaysWholeYear: 7,
  startHourLocal: 8,
  deadlineDays: 14,
  /** Maximum batch length [days] when not given: this, or the deadline when that is longer. */
  maxDays: 60,
  batchKgFresh: 1000,
} as const

/** Batches run for the monthly heat column: from these days of every month, in every year. */
export const MONTHLY_HEAT_START_DAYS = [1, 16] as const

/**
 * Lowest air temperature of the backup heater when the user gives none [°C] (assumption, from memory:
 * batch dryers run fruit at 45–65 °C and grain at 45–80 °C; 45 °C is the low end of both).
 */
export const BACKUP_MIN_AIR_C = 45

/** How much work an assessment is, from its options alone. */
export interface AssessSchedule {
  season: { start: string; end: string; stepDays: number; startHourLocal: number }
  /** The start days of the start-date table. */
  startDays: MonthDay[]
  deadlineDays: number
  maxDays: number
  /** Batches per year of data: start days plus the monthly heat batches (12 × {@link MONTHLY_HEAT_START_DAYS}). */
  batchesPerYear: number
}

function checkRange(name: string, value: number, lo: number, hi: number, unit: string): void {
  if (!(value >= lo && value <= hi))
    throw new RangeError(`${name} must be between ${lo} and ${hi} ${unit}, got ${value}`)
}

/** The season, start days and batch lengths of `options`. Throws RangeError for bad values. */
export function resolveSchedule(options: Omit<AssessOptions, 'product' | 'method'>): AssessSchedule {
  const d = ASSESS_DEFAULTS
  const deadlineDays = options.deadlineDays ?? d.deadlineDays
  const maxDays = options.maxDays ?? Math.max(d.maxDays, deadlineDays)
  checkRange('deadline', deadlineDays, 0.25, 365, 'days')
  checkRange('maximum duration', maxDays, deadlineDays, 366, 'days (and at least the deadline)')
  const startHourLocal = options.startHourLocal ?? d.startHourLocal
  if (!(Number.isInteger(startHourLocal) && startHourLocal >= 0 && startHourLocal <= 23)) {
    throw new RangeError(`start hour must be a whole hour from 0 to 23, got ${startHourLocal}`)
  }
  const seasonGiven = options.seasonStart !== undefined || options.seasonEnd !== undefined
  const start = options.seasonStart ?? d.seasonStart
  const end = options.seasonEnd ?? d.seasonEnd
  const stepDays = options.startStepDays ?? (seasonGiven ? d.stepDaysWithSeason : d.stepDaysWholeYear)
  const startDays = seasonDays(
    parseMonthDay(start, 'season start'),
    parseMonthDay(end, 'season end'),
    stepDays,
  )
  return {
    season: { start, end, stepDays, startHourLocal },
    startDays,
    deadlineDays,
    maxDays,
    batchesPerYear: startDays.length + 12 * MONTHLY_HEAT_START_DAYS.length,
  }
}

/** Everything the later stages need, checked and with every default filled. */
export interface ResolvedAssessOptions extends AssessSchedule {
  profile: ProductProfile
  method: DryingMethod
  model: MethodModel
  thresholds: DryingThresholds
  /** The product's per-hour response at its thickness (lazily tabulated grids). */
  product: ProductResponse
  initialWbPct: number
  targetWbPct: number
  initialDb: number
  targetDb: number
  batchKgFresh: number
  loadingKgPerM2: number
  maxProductTempC: number | null
  /** The backup heater (the method itself when it is the heated method). */
  backupMethod: HeatedMethod
  fuel?: FuelId
  fuelPrices?: Partial<Record<FuelId, number>>
  onProgress?: (p: AssessProgress) => void
}

/** Check the options and fill their defaults. Throws RangeError for bad options. */
export function resolveAssessOptions(options: AssessOptions): ResolvedAssessOptions {
  const profile = options.product
  const method = parseDryingMethod(options.method)
  const thresholds = parseDryingThresholds(options.thresholds ?? {})
  const initialWbPct = options.initialWbPct ?? profile.initialMoistureWbPct.value
  const targetWbPct = options.targetWbPct ?? profile.targetMoistureWbPct.value
  checkRange('initial moisture', initialWbPct, 1, 95, '% wb')
  checkRange('target moisture', targetWbPct, 0.5, 90, '% wb')
  if (!(targetWbPct < initialWbPct)) {
    throw new RangeError(
      `target moisture ${targetWbPct} % wb must be below the initial moisture ${initialWbPct} % wb`,
    )
  }
  const schedule = resolveSchedule(options)
  const batchKgFresh = options.batchKgFresh ?? ASSESS_DEFAULTS.batchKgFresh
  checkRange('batch size', batchKgFresh, 1, 1e7, 'kg')
  const product = tabulatedResponse(productResponse(profile, options.thicknessMm))
  const targetDb = moistureDbFromWbPct(targetWbPct)
  const maxProductTempC = profile.maxProductTempC?.value ?? null
  return {
    ...schedule,
    profile,
    method,
    model: methodModel(method.kind),
    thresholds,
    product,
    initialWbPct,
    targetWbPct,
    initialDb: moistureDbFromWbPct(initialWbPct),
    targetDb,
    batchKgFresh,
    loadingKgPerM2: methodLoadingKgPerM2(method) ?? profile.defaultLoadingKgPerM2.value,
    maxProductTempC,
    backupMethod:
      method.kind === 'heated'
        ? method
        : heatedBackup(options.backupHeater, product.erhPct(25, targetDb), maxProductTempC),
    fuel: options.fuel,
    fuelPrices: options.fuelPrices,
    onProgress: options.onProgress,
  }
}

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
