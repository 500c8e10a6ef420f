/**
 * @module analysis/compare-methods
 * Several drying methods on the same weather, product and season, side by side: for each method the days
 * to target, the chance of finishing by the deadline, the spoilage risk where the assessment carries it,
 * the heat and fuel to finish by the deadline and the fuel cost per kg of DRIED product; a season calendar
 * (one row per method, one cell per start week, each cell one of the {@link CALENDAR_STATES} by a stated
 * rule) and a one-line recommendation that states its criterion. Every figure comes from the methods'
 * assessments (`assess()`), which the comparison carries.
 */
import { DRYING_METHOD_KINDS, type DryingMethod, type DryingMethodInput } from '../drying/method.ts'
import { methodModel } from '../drying/methods/index.ts'
import type { HourlySeries } from '../weather/series.ts'
import { type AssessOptions, assess, MethodRefused } from './assess.ts'
import type { Assessment, AssessmentProduct, AssessmentSite } from './assessment.ts'
import { BIN_MEANING, binMethodFigures, type MethodBinFigures } from './compare-methods-bin.ts'
import {
  type MethodCalendar,
  methodCalendar,
  SPOILAGE_MARGINAL_SHARE,
  spoilageOf,
} from './method-calendar.ts'
import { GOOD_START_PROBABILITY } from './start-dates.ts'
import { meanOrNull, medianNotReached, roundOrNull, type Spread } from './statistics.ts'

export const METHOD_COMPARISON_SCHEMA = 'dryhours.method-comparison/1'

export {
  CALENDAR_RULES,
  CALENDAR_STATES,
  type CalendarRow,
  type CalendarState,
  calendarState,
  HALF_OF_YEARS,
  type MethodCalendar,
  SPOILAGE_MARGINAL_SHARE,
} from './method-calendar.ts'

const pct = (x: number): string => `${Math.round(100 * x)} %`
/** A share of years in words: "every year", "no year" or "N % of years". */
const ofYears = (x: number): string => (x >= 1 ? 'every year' : x <= 0 ? 'no year' : `${pct(x)} of years`)

/** One method's figures over the season. */
export interface MethodFigures {
  kind: DryingMethod['kind']
  /** The method in plain words. */
  label: string
  /** Days to target by the method alone, across the season's start dates: the median of the start dates' medians and of their P90s [days]; null when not within the maximum duration. */
  daysToTarget: { median: number | null; p90: number | null }
  /** Share of years finishing within the deadline by the method as set, mean over the season's start dates [0–1]; null when no start date had a complete batch. */
  probabilityWithinDeadline: number | null
  /** Spoilage before the batch is dry, mean share of years over the season's start dates [0–1]; null when the assessment carries no spoilage model. */
  spoilageProbability: number | null
  /** Heat into the air to finish by the deadline (the method's own heater, or the backup heater where the method falls short), over the season's batches [kWh per tonne fresh]. */
  heatToAirKwhPerTonne: Spread
  /** Fuel heat at the median, heat into the air ÷ heater efficiency [kWh per tonne fresh]. */
  fuelHeatKwhPerTonne: number | null
  /** The fuel of the cost figures. */
  fuel: {
    id: string
    name: string
    unit: string
    quantityPerTonne: number | null
    pricePerUnit: number
    priceIsExample: boolean
  }
  /** Fuel cost at the median heat per tonne of fresh product [currency per tonne fresh]. */
  costPerTonneFresh: number | null
  /** Fuel cost at the median heat per kg of dried product [currency per kg dried]. */
  costPerKgDried: number | null
  /** Grain in a bin: the airflow of these figures, the fan's electricity and what the shares mean; null for batch methods. */
  bin: MethodBinFigures | null
}

export interface MethodRecommendation {
  /** The recommended method, or null when none meets the criterion. */
  kind: DryingMethod['kind'] | null
  /** One line: the recommendation and why. */
  text: string
  /** The criterion, in words. */
  criterion: string
}

export interface MethodComparison {
  schema: typeof METHOD_COMPARISON_SCHEMA
  site: AssessmentSite
  product: AssessmentProduct
  season: Assessment['season']
  deadlineDays: number
  maxDays: number
  /** Dried product from one tonne of fresh product at the initial and target moistures [kg]. */
  driedKgPerTonneFresh: number
  /** The currency of the costs as the user named it; null when not named. */
  currency: string | null
  /** What the costs include. */
  costNote: string
  /** Whether any method's assessment carries a spoilage model. */
  spoilageAssessed: boolean
  methods: MethodFigures[]
  /** Methods asked for (with `all`) that could not be assessed on this file, with the reason. */
  notAssessed: { kind: string; reason: string }[]
  calendar: MethodCalendar
  recommendation: MethodRecommendation
  /** The full assessment of every method, in the order of `methods`. */
  assessments: Assessment[]
}

/**
 * The methods to compare: a list (each a kind or a method object); `all` (every registered method with its
 * defaults); or `{ all: list }` (every registered method, those in the list with their parameters).
 */
export type MethodList =
  | 'all'
  | { all: (DryingMethodInput | DryingMethod)[] }
  | (DryingMethodInput | DryingMethod)[]

/** Whether `list` asks for every method (methods the file or product cannot take are then listed, not refused). */
export function isAllMethods(
  list: MethodList,
): list is 'all' | { all: (DryingMethodInput | DryingMethod)[] } {
  return !Array.isArray(list)
}

const COST_NOTE =
  'fuel for heat only, at the median heat of the season’s batches: no fans, labour, equipment or its depreciation'
const COST_NOTE_BIN =
  '; for grain in a bin, its fan’s electricity too (the fan is its dryer), at the median of the season’s start dates'

const capitalised = (t: string): string => t.charAt(0).toUpperCase() + t.slice(1)

/** Dried product from one tonne fresh [kg]: the dry matter carried to the target moisture. */
export function driedKgPerTonne(initialWbPct: number, targetWbPct: number): number {
  return (1000 * (100 - initialWbPct)) / (100 - targetWbPct)
}

function figures(a: Assessment, driedKg: number): MethodFigures {
  const base = { kind: a.method.kind, label: a.methodLabel }
  if (a.bin) {
    const b = binMethodFigures({ ...a, bin: a.bin })
    const costPerKgDried = b.costPerTonneFresh === null ? null : roundOrNull(b.costPerTonneFresh / driedKg, 3)
    return { ...base, ...b, costPerKgDried }
  }
  const rows = a.startDates.filter((r) => r.years > 0)
  const spoil = rows.map(spoilageOf).filter((v): v is number => v !== null)
  const fuel = a.heat.fuels.find((f) => f.fuel === a.heat.selectedFuel) ?? a.heat.fuels[0]
  const p = meanOrNull(rows.map((r) => r.probabilityWithinDeadline))
  return {
    ...base,
    daysToTarget: {
      median: medianNotReached(rows.map((r) => r.daysToTarget.median)),
      p90: medianNotReached(rows.map((r) => r.daysToTarget.p90)),
    },
    probabilityWithinDeadline: p === null ? null : roundOrNull(p, 3),
    spoilageProbability: spoil.length > 0 ? roundOrNull(meanOrNull(spoil) as number, 3) : null,
    heatToAirKwhPerTonne: a.heat.heatToAirKwhPerTonne,
    fuelHeatKwhPerTonne: a.heat.fuelHeatKwhPerTonne.median,
    fuel: {
      id: fuel.fuel,
      name: fuel.name,
      unit: fuel.unit,
      quantityPerTonne: fuel.quantityPerTonne,
      pricePerUnit: fuel.pricePerUnit,
      priceIsExample: fuel.priceIsExample,
    },
    costPerTonneFresh: fuel.costPerTonne,
    costPerKgDried: fuel.costPerTonne === null ? null : roundOrNull(fuel.costPerTonne / driedKg, 3),
    bin: null,
  }
}

/**
 * The recommendation when no method meets the criterion: which method comes closest, said with both of
 * its shares (a method that finishes in time but spoils first is not "the most reliable"): the least
 * spoilage among those that finish in time often enough, else the most years finishing in time.
 */
function noMethodText(methods: MethodFigures[], deadlineDays: number, spoilageAssessed: boolean): string {
  const head = `No method meets the criterion: none finishes within ${deadlineDays} days by itself in ${pct(GOOD_START_PROBABILITY)} of years${spoilageAssessed ? ' without spoiling' : ''}`
  const known = methods.filter((m) => m.probabilityWithinDeadline !== null)
  if (known.length === 0) return `${head}.`
  const inTime = known.filter((m) => (m.probabilityWithinDeadline as number) >= GOOD_START_PROBABILITY)
  const closest = (inTime.length > 0 ? inTime : known).sort(
    (x, y) =>
      (inTime.length > 0 ? (x.spoilageProbability ?? 0) - (y.spoilageProbability ?? 0) : 0) ||
      (y.probabilityWithinDeadline as number) - (x.probabilityWithinDeadline as number) ||
      (x.spoilageProbability ?? 0) - (y.spoilageProbability ?? 0),
  )[0]
  const spoils =
    closest.spoilageProbability === null ? '' : `, spoils first in ${ofYears(closest.spoilageProbability)}`
  return `${head}; the closest is ${closest.label}: it finishes in time in ${ofYears(closest.probabilityWithinDeadline as number)}${spoils}.`
}

function recommend(
  methods: MethodFigures[],
  deadlineDays: number,
  spoilageAssessed: boolean,
  currency: string | null,
): MethodRecommendation {
  const spoilPart = spoilageAssessed
    ? ` and spoil before they are dry in fewer than ${pct(SPOILAGE_MARGINAL_SHARE)} of years`
    : ''
  const criterion = `the lowest fuel cost per kg of dried product among the methods whose batches finish within ${deadlineDays} days by themselves in at least ${pct(GOOD_START_PROBABILITY)} of years (mean over the season's start dates)${spoilPart}; ties go to fewer median days to target${methods.some((m) => m.bin) ? `; ${BIN_MEANING}; a bin's cost includes its fan's electricity` : ''}`
  const qualifies = methods.filter(
    (m) =>
      m.probabilityWithinDeadline !== null &&
      m.probabilityWithinDeadline >= GOOD_START_PROBABILITY &&
      (m.spoilageProbability === null || m.spoilageProbability < SPOILAGE_MARGINAL_SHARE),
  )
  const cost = (m: MethodFigures) => m.costPerKgDried ?? Number.POSITIVE_INFINITY
  const days = (m: MethodFigures) => m.daysToTarget.median ?? Number.POSITIVE_INFINITY
  if (qualifies.length === 0) {
    return { kind: null, text: noMethodText(methods, deadlineDays, spoilageAssessed), criterion }
  }
  const chosen = [...qualifies].sort((x, y) => cost(x) - cost(y) || days(x) - days(y))[0]
  const what = chosen.bin ? 'fuel and fan electricity' : 'fuel'
  const example = chosen.bin ? chosen.bin.electricityPriceIsExample : chosen.fuel.priceIsExample
  const money =
    chosen.costPerKgDried === null
      ? `${what} cost not computed`
      : chosen.costPerKgDried === 0
        ? 'no fuel at the median batch'
        : `${what} ${chosen.costPerKgDried}${currency ? ` ${currency}` : ''} per kg dried${example ? ' at an example price' : ''}`
  return {
    kind: chosen.kind,
    text: chosen.bin
      ? `${capitalised(chosen.label)} at ${chosen.bin.airflowM3PerMinPerTonne} m³/min per t: the top layer dries safely in ${ofYears(chosen.probabilityWithinDeadline ?? 0)}, median ${chosen.daysToTarget.median ?? '–'} days, ${money}; the fan uses ${chosen.bin.fanEnergyKwhPerTonne ?? '–'} kWh of electricity per tonne.`
      : `${capitalised(chosen.label)}: finishes within ${deadlineDays} days in ${ofYears(chosen.probabilityWithinDeadline ?? 0)}, median ${chosen.daysToTarget.median ?? '–'} days, ${money}.`,
    criterion,
  }
}

/**
 * The methods of `list` to assess, and (when `list` asks for every method) those the product cannot take,
 * with the method's reason (e.g. fruit in a grain bin). An explicit list is assessed as given: a method that
 * cannot take the product is then an error naming it.
 */
export function methodsToAssess(
  list: MethodList,
  product: AssessOptions['product'],
): { inputs: (DryingMethodInput | DryingMethod)[]; notAssessed: { kind: string; reason: string }[] } {
  if (isAllMethods(list)) {
    const given = list === 'all' ? [] : list.all
    const inputs: (DryingMethodInput | DryingMethod)[] = []
    const notAssessed: { kind: string; reason: string }[] = []
    for (const kind of DRYING_METHOD_KINDS) {
      const unfit = methodModel(kind).productFits?.(product) ?? null
      if (unfit !== null) notAssessed.push({ kind, reason: unfit })
      else inputs.push(given.find((m) => m.kind === kind) ?? ({ kind } as DryingMethodInput))
    }
    return { inputs, notAssessed }
  }
  if (list.length === 0) throw new RangeError('give at least one method to compare')
  const kinds = list.map((m) => m.kind)
  const twice = kinds.find((k, i) => kinds.indexOf(k) !== i)
  if (twice !== undefined) throw new RangeError(`method ${twice} is listed twice`)
  return { inputs: list, notAssessed: [] }
}

/**
 * The option sets a request runs: its options alone (`methods` null), or the shared options with each method
 * that will be assessed side by side, as {@link compareMethods} runs them. The work limit of every entry point
 * is asked of these (plan.ts `estimateWork`), so the page and the API count the same work.
 */
export function methodOptionSets(
  options: AssessOptions | Omit<AssessOptions, 'method'>,
  methods: MethodList | null,
): AssessOptions[] {
  if (methods === null) return [options as AssessOptions]
  return methodsToAssess(methods, options.product).inputs.map((method) => ({ ...options, method }))
}

/**
 * Assess `series` with every method of `methods` (the other options alike) and compare them. When every
 * method is asked for, a method the product or the file cannot serve (grain in a bin for fruit; one that
 * needs the sun on a sunless file) is listed in `notAssessed` with its reason; with an explicit list its
 * refusal is an error naming the method.
 */
export function compareMethods(
  series: HourlySeries,
  options: Omit<AssessOptions, 'method'>,
  methods: MethodList,
): MethodComparison {
  const { inputs, notAssessed } = methodsToAssess(methods, options.product)
  const assessments: Assessment[] = []
  for (const method of inputs) {
    try {
      assessments.push(assess(series, { ...options, method }))
    } catch (e) {
      if (!(e instanceof MethodRefused) || !isAllMethods(methods)) throw e
      notAssessed.push({ kind: method.kind, reason: e.message })
    }
  }
  if (assessments.length === 0) {
    throw new RangeError(
      `no method could be assessed on this file: ${notAssessed.map((n) => `${n.kind}: ${n.reason}`).join('; ')}`,
    )
  }
  const first = assessments[0]
  const driedKg = driedKgPerTonne(first.product.initialMoistureWbPct, first.product.targetMoistureWbPct)
  const list = assessments.map((a) => figures(a, driedKg))
  const spoilageAssessed = list.some((m) => m.spoilageProbability !== null)
  return {
    schema: METHOD_COMPARISON_SCHEMA,
    site: first.site,
    product: first.product,
    season: first.season,
    deadlineDays: first.deadlineDays,
    maxDays: first.maxDays,
    driedKgPerTonneFresh: roundOrNull(driedKg, 1) ?? 0,
    currency: first.heat.currency,
    costNote: list.some((m) => m.bin) ? COST_NOTE + COST_NOTE_BIN : COST_NOTE,
    spoilageAssessed,
    methods: list,
    notAssessed,
    calendar: methodCalendar(assessments),
    recommendation: recommend(list, first.deadlineDays, spoilageAssessed, first.heat.currency),
    assessments,
  }
}
