/**
 * @module analysis/plan
 * The engine's planner: the resolved defaults of an assessment and its cost, before any hour is computed.
 * `assess()` runs on the plan it returns, and the API, the page and the CLI ask it (instead of repeating
 * the defaults) for their limits and messages. Runtime-neutral; throws {@link AssessOptionError} naming the
 * option for any value outside its range.
 */
import { parseDryingMethod } from '../drying/method.ts'
import { methodModel } from '../drying/methods/index.ts'
import { binAirflows, type NaturalAirBinMethod } from '../drying/methods/natural-air-bin.ts'
import { type DryTarget, resolveDryTarget, STORAGE_TEMP_RANGE_C } from '../product/dry-target.ts'
import type { AssessOptions } from './assess.ts'
import { parseMonthDay } from './local-time.ts'
import { type MonthDay, seasonDays } from './start-dates.ts'

/** Defaults of an assessment's options (our choices, stated in the README and `--help`). */
export const ASSESS_DEFAULTS = {
  /** The user's window to finish [days]. */
  deadlineDays: 14,
  /** A batch counts as failed after this many days, or after the deadline when that is longer [days]. */
  maxDays: 60,
  /** Batch size [kg fresh]. */
  batchKgFresh: 1000,
  /** Local standard hour at which batches start. */
  startHourLocal: 8,
  /** Start dates of the whole year when no season is given. */
  seasonStart: '01-01',
  seasonEnd: '12-31',
  /** Days between start dates when a season is given / when it is not. */
  stepDaysWithSeason: 1,
  stepDaysWholeYear: 7,
  /**
   * Days between start dates of a bin (grain harvested into a bin): every bin run is a deep-bed simulation per
   * airflow, so the dates are spread wider (7 days with a season, 14 over the whole year; our choice).
   */
  binStepDaysWithSeason: 7,
  binStepDaysWholeYear: 14,
} as const

/** Accepted ranges of the options, checked by {@link planAssessment} [unit in the name]. */
export const ASSESS_RANGES = {
  initialWbPct: [1, 95],
  targetWbPct: [0.5, 90],
  /** Temperature of the store at which the dried product's water activity is judged (product/dry-target.ts). */
  storageTempC: STORAGE_TEMP_RANGE_C,
  deadlineDays: [0.25, 365],
  /** Lower bound: the deadline. */
  maxDays: [0.25, 366],
  batchKgFresh: [1, 1e7],
  startHourLocal: [0, 23],
  startStepDays: [1, 365],
  /** Exclusive bounds, as product/drying-rate.ts and product/diffusion.ts require. */
  thicknessMm: [0, 1000],
} as const

/**
 * Batches run besides the season's start dates: the monthly heat column (1st and 16th of every month, per
 * year) and the heated-every-hour sample of the heat cross-check (heat-summary.ts `heatedEveryHourSample`).
 */
const MONTHLY_HEAT_STARTS = 24
export const HEATED_SAMPLE_BATCHES = 30
/**
 * Hours of a leap year (366 × 24): a series counts ceil(hours / 8784) years, so whole years are never
 * counted twice (4 years with a leap day are 35,064 hours: 4 years, not 5).
 */
const HOURS_PER_LEAP_YEAR = 8784

/** An option outside its accepted range: names the option (the engine's name) for a field path. */
export class AssessOptionError extends RangeError {
  override name = 'AssessOptionError'
  constructor(
    readonly option: keyof AssessOptions,
    message: string,
  ) {
    super(message)
  }
}

/** Every option with its default filled in and its range checked. */
export interface AssessPlan {
  initialWbPct: number
  targetWbPct: number
  /** What "dry" means: the target, its basis (water activity, the profile's moisture or the user's) and the water activities. */
  dryTarget: DryTarget
  deadlineDays: number
  maxDays: number
  batchKgFresh: number
  startHourLocal: number
  /** Whether the user gave a season (decides the default step). */
  seasonGiven: boolean
  seasonStart: string
  seasonEnd: string
  stepDays: number
  /** The season's start days, in order. */
  startDays: MonthDay[]
  /** For a bin (deep-bed) method: its candidate airflows and model layers; null for batch methods. */
  bin: { airflows: number; layers: number } | null
}

function checkRange(
  option: keyof AssessOptions,
  name: string,
  value: number,
  lo: number,
  hi: number,
  unit: string,
): void {
  if (!(value >= lo && value <= hi))
    throw new AssessOptionError(option, `${name} must be between ${lo} and ${hi} ${unit}, got ${value}`)
}

/** Longest currency name accepted [characters]. */
export const MAX_CURRENCY_CHARS = 12

/** The currency name checked: 1–12 printable characters (a code such as EUR or a sign such as US$). */
export function checkCurrency(text: string | undefined): string | null {
  if (text === undefined) return null
  const t = text.trim()
  let printable = t.length > 0 && t.length <= MAX_CURRENCY_CHARS
  for (let i = 0; i < t.length && printable; i++) {
    const c = t.charCodeAt(i)
    if (c < 32 || c === 127 || c === 60 || c === 62) printable = false
  }
  if (!printable) {
    throw new AssessOptionError(
      'currency',
      `currency must be 1 to ${MAX_CURRENCY_CHARS} printable characters other than < and > (a code such as EUR or a sign), got '${t.slice(0, 20)}'`,
    )
  }
  return t
}

/** Resolve the defaults of `options` and check every range; the engine and every entry point use this. */
export function planAssessment(options: AssessOptions): AssessPlan {
  const profile = options.product
  const initialWbPct = options.initialWbPct ?? profile.initialMoistureWbPct.value
  if (options.storageTempC !== undefined) {
    checkRange(
      'storageTempC',
      'storage temperature',
      options.storageTempC,
      ...ASSESS_RANGES.storageTempC,
      '°C',
    )
  }
  const dryTarget = resolveDryTarget(profile, {
    userTargetWbPct: options.targetWbPct,
    storageTempC: options.storageTempC,
  })
  const targetWbPct = dryTarget.targetWbPct
  checkRange('initialWbPct', 'initial moisture', initialWbPct, ...ASSESS_RANGES.initialWbPct, '% wb')
  checkRange('targetWbPct', 'target moisture', targetWbPct, ...ASSESS_RANGES.targetWbPct, '% wb')
  if (!(targetWbPct < initialWbPct)) {
    throw new AssessOptionError(
      'targetWbPct',
      `target moisture ${targetWbPct} % wb must be below the initial moisture ${initialWbPct} % wb`,
    )
  }
  if (options.thicknessMm !== undefined) {
    const [lo, hi] = ASSESS_RANGES.thicknessMm
    if (!(options.thicknessMm > lo && options.thicknessMm < hi)) {
      throw new AssessOptionError(
        'thicknessMm',
        `thickness must be between ${lo} and ${hi} mm, got ${options.thicknessMm}`,
      )
    }
  }
  const deadlineDays = options.deadlineDays ?? ASSESS_DEFAULTS.deadlineDays
  checkRange('deadlineDays', 'deadline', deadlineDays, ...ASSESS_RANGES.deadlineDays, 'days')
  const maxDays = options.maxDays ?? Math.max(ASSESS_DEFAULTS.maxDays, deadlineDays)
  checkRange(
    'maxDays',
    'maximum duration',
    maxDays,
    deadlineDays,
    ASSESS_RANGES.maxDays[1],
    'days (and at least the deadline)',
  )
  const batchKgFresh = options.batchKgFresh ?? ASSESS_DEFAULTS.batchKgFresh
  checkRange('batchKgFresh', 'batch size', batchKgFresh, ...ASSESS_RANGES.batchKgFresh, 'kg')
  const startHourLocal = options.startHourLocal ?? ASSESS_DEFAULTS.startHourLocal
  if (!(Number.isInteger(startHourLocal) && startHourLocal >= 0 && startHourLocal <= 23)) {
    throw new AssessOptionError(
      'startHourLocal',
      `start hour must be a whole hour from 0 to 23, got ${startHourLocal}`,
    )
  }
  checkCurrency(options.currency)
  const bin = binPlan(options)
  const seasonGiven = options.seasonStart !== undefined || options.seasonEnd !== undefined
  const seasonStart = options.seasonStart ?? ASSESS_DEFAULTS.seasonStart
  const seasonEnd = options.seasonEnd ?? ASSESS_DEFAULTS.seasonEnd
  const start = monthDayOption('seasonStart', seasonStart, 'season start')
  const end = monthDayOption('seasonEnd', seasonEnd, 'season end')
  const defaultStep = bin
    ? seasonGiven
      ? ASSESS_DEFAULTS.binStepDaysWithSeason
      : ASSESS_DEFAULTS.binStepDaysWholeYear
    : seasonGiven
      ? ASSESS_DEFAULTS.stepDaysWithSeason
      : ASSESS_DEFAULTS.stepDaysWholeYear
  const stepDays = options.startStepDays ?? defaultStep
  const [stepLo, stepHi] = ASSESS_RANGES.startStepDays
  if (!(Number.isInteger(stepDays) && stepDays >= stepLo && stepDays <= stepHi)) {
    throw new AssessOptionError(
      'startStepDays',
      `start-date step must be a whole number of days from ${stepLo} to ${stepHi}, got ${stepDays}`,
    )
  }
  return {
    initialWbPct,
    targetWbPct,
    dryTarget,
    deadlineDays,
    maxDays,
    batchKgFresh,
    startHourLocal,
    seasonGiven,
    seasonStart,
    seasonEnd,
    stepDays,
    startDays: seasonDays(start, end, stepDays),
    bin,
  }
}

/**
 * The bin part of the plan when the method assesses grain in a bin (deep-bed batches); null for batch methods (and
 * for a method kind that does not exist: the engine names it when it runs). Refuses a product the method cannot
 * take (`productFits`, e.g. fruit in a grain bin).
 */
function binPlan(options: AssessOptions): AssessPlan['bin'] {
  const kind = (options.method as { kind?: unknown }).kind
  if (typeof kind !== 'string') return null
  let model: ReturnType<typeof methodModel>
  try {
    model = methodModel(kind)
  } catch {
    return null
  }
  const unfit = model.productFits?.(options.product) ?? null
  if (unfit !== null) throw new AssessOptionError('method', unfit)
  if (model.batches !== 'deep-bed') return null
  let method: NaturalAirBinMethod
  try {
    method = parseDryingMethod(options.method) as NaturalAirBinMethod
  } catch (e) {
    throw new AssessOptionError('method', (e as Error).message)
  }
  return { airflows: binAirflows(method).length, layers: method.layers }
}

function monthDayOption(option: keyof AssessOptions, text: string, name: string): MonthDay {
  try {
    return parseMonthDay(text, name)
  } catch (e) {
    throw new AssessOptionError(option, (e as Error).message)
  }
}

/**
 * Cost of one layer-hour of the bin model in batch-hours of the thin-layer batches, the unit of the work budget.
 * Measured by dryhours (bench/sections/bins.ts, "bin layer-hour in batch-hours"): CPU time of a bin assessment per
 * layer-hour the planner counts, over CPU time of a slow batch assessment (shade drying of corn, batches running
 * long) per batch-hour it counts, the same demo file in the same process: 1.3–1.65 in three runs on the dry upland
 * and the humid valley files (on a loaded shared machine); 2 leaves a margin.
 */
export const BIN_LAYER_HOUR_IN_BATCH_HOURS = 2

/** What an assessment of a series will cost, before it runs. */
export interface AssessCost {
  /** Years the series spans (at least 1). */
  years: number
  /** Batches simulated: (start days + 24 monthly heat starts) × years + the 30 heated-every-hour samples (0 for a bin). */
  batches: number
  /**
   * The bound on simulated batch-hours: batches × the longest a batch may run [h]; for a bin, its layer-hours in
   * batch-hour equivalents ({@link BIN_LAYER_HOUR_IN_BATCH_HOURS}).
   */
  batchHours: number
  /** Bin runs (start days × airflows × years) and their layer-hours (× season hours × layers); 0 for batch methods. */
  binRuns: number
  binLayerHours: number
}

/** Cost of assessing a series of `seriesHours` hours with this plan. */
export function assessmentCost(plan: AssessPlan, seriesHours: number): AssessCost {
  const years = Math.max(1, Math.ceil(seriesHours / HOURS_PER_LEAP_YEAR))
  const seasonHours = Math.round(plan.maxDays * 24)
  if (plan.bin) {
    const binRuns = plan.startDays.length * plan.bin.airflows * years
    const binLayerHours = binRuns * Math.max(24, seasonHours) * plan.bin.layers
    return {
      years,
      batches: 0,
      batchHours: Math.ceil(binLayerHours * BIN_LAYER_HOUR_IN_BATCH_HOURS),
      binRuns,
      binLayerHours,
    }
  }
  const batches = (plan.startDays.length + MONTHLY_HEAT_STARTS) * years + HEATED_SAMPLE_BATCHES
  return { years, batches, batchHours: batches * seasonHours, binRuns: 0, binLayerHours: 0 }
}

/** Simulated batch-hours of assessing each of the series (hours per series) with the same options. */
export function estimateBatchHours(options: AssessOptions, seriesHours: readonly number[]): number {
  const plan = planAssessment(options)
  return seriesHours.reduce((sum, hours) => sum + assessmentCost(plan, hours).batchHours, 0)
}

/** What a request will cost: its batch-hours and whether bin runs are among them (the limit's message says so). */
export interface WorkEstimate {
  batchHours: number
  bin: boolean
}

/**
 * The cost of running every option set on every series: one set for an assessment or a comparison of sites,
 * one per method for methods side by side (analysis/compare-methods.ts `methodOptionSets`), each with its own
 * plan (a bin's start step and airflows, a batch method's season). The one estimate the API, the page and the
 * CLI's limits ask for.
 */
export function estimateWork(
  optionSets: readonly AssessOptions[],
  seriesHours: readonly number[],
): WorkEstimate {
  let batchHours = 0
  let bin = false
  for (const options of optionSets) {
    const plan = planAssessment(options)
    for (const hours of seriesHours) batchHours += assessmentCost(plan, hours).batchHours
    bin ||= plan.bin !== null
  }
  return { batchHours, bin }
}
