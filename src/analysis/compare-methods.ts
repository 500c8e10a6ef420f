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
import { MS_PER_DAY } from '../physics/constants.ts'
import type { HourlySeries } from '../weather/series.ts'
import { type AssessOptions, assess, MethodRefused } from './assess.ts'
import type { Assessment, AssessmentProduct, AssessmentSite, StartDateRow } from './assessment.ts'
import { parseMonthDay } from './local-time.ts'
import { formatMonthDay, GOOD_START_PROBABILITY } from './start-dates.ts'
import { quantileSorted, roundOrNull, type Spread } from './statistics.ts'

export const METHOD_COMPARISON_SCHEMA = 'dryhours.method-comparison/1'

/** The states of a calendar cell, from best to worst, then "no data". */
export const CALENDAR_STATES = ['dries', 'marginal', 'needs-heat', 'spoils-first', 'no-data'] as const
export type CalendarState = (typeof CALENDAR_STATES)[number]

/**
 * Share of years below which a method "needs heat" (finishes within the deadline in fewer than half the
 * years) and at or above which a batch "spoils first" (our choice, stated in every comparison).
 */
export const HALF_OF_YEARS = 0.5
/** Share of years spoiling first from which a start week is only marginal (our choice, stated). */
export const SPOILAGE_MARGINAL_SHARE = 0.2

const pct = (x: number): string => `${Math.round(100 * x)} %`
/** A share of years in words: "every year", "no year" or "N % of years". */
const ofYears = (x: number): string => (x >= 1 ? 'every year' : x <= 0 ? 'no year' : `${pct(x)} of years`)

/** The rule of each calendar state, in words (also in the JSON, so every reader sees the same rule). */
export const CALENDAR_RULES: Record<CalendarState, string> = {
  dries: `the method as set finishes a batch within the deadline in at least ${pct(GOOD_START_PROBABILITY)} of years (mean over the week's start dates) and, where spoilage is assessed, spoils before it is dry in fewer than ${pct(SPOILAGE_MARGINAL_SHARE)} of years`,
  marginal: `finishes within the deadline in ${pct(HALF_OF_YEARS)} to ${pct(GOOD_START_PROBABILITY)} of years, or spoils before it is dry in ${pct(SPOILAGE_MARGINAL_SHARE)} to ${pct(HALF_OF_YEARS)} of years`,
  'needs-heat': `finishes within the deadline in fewer than ${pct(HALF_OF_YEARS)} of years: a batch needs (more) heat to finish in time`,
  'spoils-first': `spoils before it is dry in at least ${pct(HALF_OF_YEARS)} of years (only where the assessment carries a spoilage model); this state wins over the others`,
  'no-data': 'no start date of the week had a complete batch in any year of the file',
}

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
}

export interface CalendarRow {
  kind: DryingMethod['kind']
  label: string
  /** One state per week of {@link MethodCalendar.weekStarts}. */
  cells: CalendarState[]
  /** Per week: share of years finishing within the deadline, mean over the week's start dates [0–1] (null: no data). */
  probabilityWithinDeadline: (number | null)[]
  /** Per week: share of years spoiling first, mean over the week's start dates [0–1] (null: not assessed or no data). */
  spoilageProbability: (number | null)[]
}

export interface MethodCalendar {
  /** First start date of each week, 'MM-DD' (weeks of 7 days from the season's first start date). */
  weekStarts: string[]
  rows: CalendarRow[]
  /** The rule of every state. */
  rules: { state: CalendarState; rule: string }[]
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

/** `all` or a list: the methods to compare (each a kind or a method object). */
export type MethodList = 'all' | (DryingMethodInput | DryingMethod)[]

const COST_NOTE =
  'fuel for heat only, at the median heat of the season’s batches: no fans, labour, equipment or its depreciation'

/** Spoilage share of a start-date row when its assessment carries a spoilage model, else null. */
function spoilageOf(row: StartDateRow): number | null {
  const s = (row as { spoilage?: { probability?: unknown } }).spoilage
  return s !== undefined && s !== null && typeof s.probability === 'number' ? s.probability : null
}

const capitalised = (t: string): string => t.charAt(0).toUpperCase() + t.slice(1)

function mean(values: number[]): number | null {
  return values.length > 0 ? values.reduce((s, v) => s + v, 0) / values.length : null
}

/** Median of nullable day counts where null is "not within the maximum duration" (sorted last). */
function medianDays(values: (number | null)[]): number | null {
  if (values.length === 0) return null
  const sorted = values.map((v) => v ?? Number.POSITIVE_INFINITY).sort((a, b) => a - b)
  return roundOrNull(quantileSorted(sorted, 0.5), 1)
}

/** Dried product from one tonne fresh [kg]: the dry matter carried to the target moisture. */
export function driedKgPerTonne(initialWbPct: number, targetWbPct: number): number {
  return (1000 * (100 - initialWbPct)) / (100 - targetWbPct)
}

function figures(a: Assessment, driedKg: number): MethodFigures {
  const rows = a.startDates.filter((r) => r.years > 0)
  const spoil = rows.map(spoilageOf).filter((v): v is number => v !== null)
  const fuel = a.heat.fuels.find((f) => f.fuel === a.heat.selectedFuel) ?? a.heat.fuels[0]
  const p = mean(rows.map((r) => r.probabilityWithinDeadline))
  return {
    kind: a.method.kind,
    label: a.methodLabel,
    daysToTarget: {
      median: medianDays(rows.map((r) => r.daysToTarget.median)),
      p90: medianDays(rows.map((r) => r.daysToTarget.p90)),
    },
    probabilityWithinDeadline: p === null ? null : roundOrNull(p, 3),
    spoilageProbability: spoil.length > 0 ? roundOrNull(mean(spoil) as number, 3) : null,
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
  }
}

/** Calendar state of one week from its mean shares (see {@link CALENDAR_RULES}). */
export function calendarState(probability: number | null, spoilage: number | null): CalendarState {
  if (probability === null) return 'no-data'
  if (spoilage !== null && spoilage >= HALF_OF_YEARS) return 'spoils-first'
  if (probability < HALF_OF_YEARS) return 'needs-heat'
  if (probability < GOOD_START_PROBABILITY || (spoilage !== null && spoilage >= SPOILAGE_MARGINAL_SHARE))
    return 'marginal'
  return 'dries'
}

/** Weeks of 7 days from the season's first start date to its last (wrapping the year end). */
function seasonWeeks(season: Assessment['season']): { starts: string[]; count: number } {
  const s = parseMonthDay(season.start, 'season start')
  const e = parseMonthDay(season.end, 'season end')
  const ref = 2001 // a non-leap year, as the start-date table uses
  const startMs = Date.UTC(ref, s.month - 1, s.day)
  let endMs = Date.UTC(ref, e.month - 1, e.day)
  if (endMs < startMs) endMs = Date.UTC(ref + 1, e.month - 1, e.day)
  const count = Math.floor((endMs - startMs) / MS_PER_DAY / 7) + 1
  const starts: string[] = []
  for (let w = 0; w < count; w++) {
    const d = new Date(startMs + 7 * w * MS_PER_DAY)
    starts.push(formatMonthDay({ month: d.getUTCMonth() + 1, day: d.getUTCDate() }))
  }
  return { starts, count }
}

function calendarRow(a: Assessment, weeks: number): CalendarRow {
  const probability: (number | null)[] = []
  const spoilage: (number | null)[] = []
  const byWeek: StartDateRow[][] = Array.from({ length: weeks }, () => [])
  // row k of the start-date table starts k × stepDays days after the season's first start date
  a.startDates.forEach((row, k) => {
    const w = Math.floor((k * a.season.stepDays) / 7)
    if (w < weeks && row.years > 0) byWeek[w].push(row)
  })
  for (const rows of byWeek) {
    const p = mean(rows.map((r) => r.probabilityWithinDeadline))
    const spoil = rows.map(spoilageOf).filter((v): v is number => v !== null)
    probability.push(p === null ? null : roundOrNull(p, 3))
    spoilage.push(spoil.length > 0 ? roundOrNull(mean(spoil) as number, 3) : null)
  }
  return {
    kind: a.method.kind,
    label: a.methodLabel,
    cells: probability.map((p, w) => calendarState(p, spoilage[w])),
    probabilityWithinDeadline: probability,
    spoilageProbability: spoilage,
  }
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
  const criterion = `the lowest fuel cost per kg of dried product among the methods whose batches finish within ${deadlineDays} days by themselves in at least ${pct(GOOD_START_PROBABILITY)} of years (mean over the season's start dates)${spoilPart}; ties go to fewer median days to target`
  const qualifies = methods.filter(
    (m) =>
      m.probabilityWithinDeadline !== null &&
      m.probabilityWithinDeadline >= GOOD_START_PROBABILITY &&
      (m.spoilageProbability === null || m.spoilageProbability < SPOILAGE_MARGINAL_SHARE),
  )
  const cost = (m: MethodFigures) => m.costPerKgDried ?? Number.POSITIVE_INFINITY
  const days = (m: MethodFigures) => m.daysToTarget.median ?? Number.POSITIVE_INFINITY
  if (qualifies.length === 0) {
    const best = [...methods].sort(
      (x, y) => (y.probabilityWithinDeadline ?? -1) - (x.probabilityWithinDeadline ?? -1),
    )[0]
    const bestText =
      best && best.probabilityWithinDeadline !== null
        ? `; the most reliable is ${best.label} (${ofYears(best.probabilityWithinDeadline)})`
        : ''
    return {
      kind: null,
      text: `No method meets the criterion: none finishes within ${deadlineDays} days by itself in ${pct(GOOD_START_PROBABILITY)} of years${spoilageAssessed ? ' without spoiling' : ''}${bestText}.`,
      criterion,
    }
  }
  const chosen = [...qualifies].sort((x, y) => cost(x) - cost(y) || days(x) - days(y))[0]
  const money =
    chosen.costPerKgDried === null
      ? 'fuel cost not computed'
      : chosen.costPerKgDried === 0
        ? 'no fuel at the median batch'
        : `fuel ${chosen.costPerKgDried}${currency ? ` ${currency}` : ''} per kg dried${chosen.fuel.priceIsExample && chosen.costPerKgDried > 0 ? ' at an example price' : ''}`
  return {
    kind: chosen.kind,
    text: `${capitalised(chosen.label)}: finishes within ${deadlineDays} days in ${ofYears(chosen.probabilityWithinDeadline ?? 0)}, median ${chosen.daysToTarget.median ?? '–'} days, ${money}.`,
    criterion,
  }
}

/** The kinds of `list` (`all`: every registered method). */
function methodInputs(list: MethodList): (DryingMethodInput | DryingMethod)[] {
  if (list === 'all') return DRYING_METHOD_KINDS.map((kind) => ({ kind }) as DryingMethodInput)
  if (list.length === 0) throw new RangeError('give at least one method to compare')
  const kinds = list.map((m) => m.kind)
  const twice = kinds.find((k, i) => kinds.indexOf(k) !== i)
  if (twice !== undefined) throw new RangeError(`method ${twice} is listed twice`)
  return list
}

/**
 * Assess `series` with every method of `methods` (the other options alike) and compare them. With `all`,
 * a method the file cannot serve (e.g. one that needs the sun on a sunless file) is listed in
 * `notAssessed` with its reason; with an explicit list its refusal is an error naming the method.
 */
export function compareMethods(
  series: HourlySeries,
  options: Omit<AssessOptions, 'method'>,
  methods: MethodList,
): MethodComparison {
  const inputs = methodInputs(methods)
  const assessments: Assessment[] = []
  const notAssessed: { kind: string; reason: string }[] = []
  inputs.forEach((method) => {
    try {
      assessments.push(assess(series, { ...options, method }))
    } catch (e) {
      if (!(e instanceof MethodRefused) || methods !== 'all') throw e
      notAssessed.push({ kind: method.kind, reason: e.message })
    }
  })
  if (assessments.length === 0) {
    throw new RangeError(
      `no method could be assessed on this file: ${notAssessed.map((n) => `${n.kind}: ${n.reason}`).join('; ')}`,
    )
  }
  const first = assessments[0]
  const driedKg = driedKgPerTonne(first.product.initialMoistureWbPct, first.product.targetMoistureWbPct)
  const list = assessments.map((a) => figures(a, driedKg))
  const spoilageAssessed = list.some((m) => m.spoilageProbability !== null)
  const weeks = seasonWeeks(first.season)
  return {
    schema: METHOD_COMPARISON_SCHEMA,
    site: first.site,
    product: first.product,
    season: first.season,
    deadlineDays: first.deadlineDays,
    maxDays: first.maxDays,
    driedKgPerTonneFresh: roundOrNull(driedKg, 1) ?? 0,
    currency: first.heat.currency,
    costNote: COST_NOTE,
    spoilageAssessed,
    methods: list,
    notAssessed,
    calendar: {
      weekStarts: weeks.starts,
      rows: assessments.map((a) => calendarRow(a, weeks.count)),
      rules: CALENDAR_STATES.map((state) => ({ state, rule: CALENDAR_RULES[state] })),
    },
    recommendation: recommend(list, first.deadlineDays, spoilageAssessed, first.heat.currency),
    assessments,
  }
}
