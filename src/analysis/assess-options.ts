/**
 * @module analysis/assess-options
 * The first stage of an assessment: the user's options checked and completed with the engine's defaults.
 * The defaults and ranges that decide how much work an assessment is (season, start-date step, deadline,
 * maximum batch length, batch size, moistures) come from the planner (analysis/plan.ts), which the API,
 * the page and the CLI ask before any weather is read: they and the engine use the very same numbers.
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
import type { DryTarget } from '../product/dry-target.ts'
import { moistureDbFromWbPct } from '../product/moisture-basis.ts'
import type { ProductProfile } from '../product/profile.ts'
import { planAssessment } from './plan.ts'
import type { MonthDay } from './start-dates.ts'

export interface AssessProgress {
  stage: 'hourly-conditions' | 'monthly-heat' | 'start-dates' | 'bin-runs' | 'done'
  done: number
  total: number
}

export interface AssessOptions {
  product: ProductProfile
  method: DryingMethodInput | DryingMethod
  /**
   * Target moisture [% wb]; default: the moisture at which the product's isotherm gives its safe water activity
   * at the storage temperature, or the profile's moisture figure when that is drier (product/dry-target.ts).
   */
  targetWbPct?: number
  /** Temperature of the store at which the dried product's water activity is judged [°C]; default 25. */
  storageTempC?: number
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
  /**
   * false: skip the spoilage models (every `spoilage` of the assessment is then null). Default true. For
   * benchmarks that time the engine without them; every entry point leaves it on.
   */
  spoilage?: boolean
  onProgress?: (p: AssessProgress) => void
}

/** Batches run for the monthly heat column: from these days of every month, in every year (plan.ts counts 24 a year). */
export const MONTHLY_HEAT_START_DAYS = [1, 16] as const

/**
 * Lowest air temperature of the backup heater when the user gives none [°C] (assumption, from memory:
 * batch dryers run fruit at 45–65 °C and grain at 45–80 °C; 45 °C is the low end of both).
 */
export const BACKUP_MIN_AIR_C = 45

/** Everything the later stages need, checked and with every default filled. */
export interface ResolvedAssessOptions {
  season: { start: string; end: string; stepDays: number; startHourLocal: number }
  /** The start days of the start-date table. */
  startDays: MonthDay[]
  deadlineDays: number
  maxDays: number
  profile: ProductProfile
  method: DryingMethod
  model: MethodModel
  thresholds: DryingThresholds
  /** The product's per-hour response at its thickness (lazily tabulated grids). */
  product: ProductResponse
  initialWbPct: number
  targetWbPct: number
  /** What "dry" means: target, basis, water activities (product/dry-target.ts). */
  dryTarget: DryTarget
  initialDb: number
  targetDb: number
  batchKgFresh: number
  loadingKgPerM2: number
  maxProductTempC: number | null
  /** The backup heater (the method itself when it is the heated method). */
  backupMethod: HeatedMethod
  fuel?: FuelId
  fuelPrices?: Partial<Record<FuelId, number>>
  /** Step the product family's spoilage model along every batch. */
  spoilage: boolean
  onProgress?: (p: AssessProgress) => void
}

/** Check the options and fill their defaults. Throws RangeError for bad options. */
export function resolveAssessOptions(options: AssessOptions): ResolvedAssessOptions {
  // defaults and ranges of the planner, which entry points also ask before any weather is read
  const plan = planAssessment(options)
  const profile = options.product
  const method = parseDryingMethod(options.method)
  const thresholds = parseDryingThresholds(options.thresholds ?? {})
  const { initialWbPct, targetWbPct, batchKgFresh } = plan
  const product = tabulatedResponse(productResponse(profile, options.thicknessMm))
  const targetDb = moistureDbFromWbPct(targetWbPct)
  const maxProductTempC = profile.maxProductTempC?.value ?? null
  return {
    season: {
      start: plan.seasonStart,
      end: plan.seasonEnd,
      stepDays: plan.stepDays,
      startHourLocal: plan.startHourLocal,
    },
    startDays: plan.startDays,
    deadlineDays: plan.deadlineDays,
    maxDays: plan.maxDays,
    profile,
    method,
    model: methodModel(method.kind),
    thresholds,
    product,
    initialWbPct,
    targetWbPct,
    dryTarget: plan.dryTarget,
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
    spoilage: options.spoilage !== false,
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
