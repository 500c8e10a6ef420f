/**
 * @module analysis/method-calendar
 * The season calendar of the methods side by side: one row per method, one cell per start week (weeks of
 * 7 days from the season's first start date), each cell one of {@link CALENDAR_STATES} by the rule stated
 * in {@link CALENDAR_RULES}, from the shares of years of the week's start dates. A bin's row is at the
 * airflow of its figures (analysis/compare-methods-bin.ts).
 */
import type { DryingMethod } from '../drying/method.ts'
import { MS_PER_DAY } from '../physics/constants.ts'
import type { Assessment, StartDateRow } from './assessment.ts'
import { binComparisonAirflow, binRowsAt, binSpoiledShare } from './compare-methods-bin.ts'
import { parseMonthDay } from './local-time.ts'
import { formatMonthDay, GOOD_START_PROBABILITY } from './start-dates.ts'
import { meanOrNull, roundOrNull } from './statistics.ts'

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

/** The rule of each calendar state, in words (also in the JSON, so every reader sees the same rule). */
export const CALENDAR_RULES: Record<CalendarState, string> = {
  dries: `the method as set finishes a batch within the deadline in at least ${pct(GOOD_START_PROBABILITY)} of years (mean over the week's start dates) and, where spoilage is assessed, spoils before it is dry in fewer than ${pct(SPOILAGE_MARGINAL_SHARE)} of years`,
  marginal: `finishes within the deadline in ${pct(HALF_OF_YEARS)} to ${pct(GOOD_START_PROBABILITY)} of years, or spoils before it is dry in ${pct(SPOILAGE_MARGINAL_SHARE)} to ${pct(HALF_OF_YEARS)} of years`,
  'needs-heat': `finishes within the deadline in fewer than ${pct(HALF_OF_YEARS)} of years: a batch needs (more) heat to finish in time`,
  'spoils-first': `spoils before it is dry in at least ${pct(HALF_OF_YEARS)} of years (only where the assessment carries a spoilage model); this state wins over the others`,
  'no-data': 'no start date of the week had a complete batch in any year of the file',
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

/** Spoilage share of a start-date row when its assessment carries a spoilage model, else null. */
export function spoilageOf(row: StartDateRow): number | null {
  const s = (row as { spoilage?: { probability?: unknown } }).spoilage
  return s !== undefined && s !== null && typeof s.probability === 'number' ? s.probability : null
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

/** One start date's shares for the calendar: days after the season's first start date, and its shares [0–1]. */
interface CalendarEntry {
  day: number
  probability: number
  spoilage: number | null
}

/** Days from the season's first start date to `monthDay` ('MM-DD'), across the year end when needed. */
function daysIntoSeason(season: Assessment['season'], monthDay: string): number {
  const s = parseMonthDay(season.start, 'season start')
  const d = parseMonthDay(monthDay, 'start date')
  const ref = 2001 // a non-leap year, as the start-date table uses
  const startMs = Date.UTC(ref, s.month - 1, s.day)
  let dayMs = Date.UTC(ref, d.month - 1, d.day)
  if (dayMs < startMs) dayMs = Date.UTC(ref + 1, d.month - 1, d.day)
  return Math.round((dayMs - startMs) / MS_PER_DAY)
}

/** The start dates of an assessment as calendar entries (a bin: at the airflow of its figures). */
function calendarEntries(a: Assessment): CalendarEntry[] {
  if (a.bin) {
    const bin = a.bin
    return binRowsAt(bin, binComparisonAirflow(bin).airflow).map((s) => ({
      day: daysIntoSeason(a.season, s.startDate),
      probability: s.shareOfYearsSafe,
      spoilage: binSpoiledShare(s),
    }))
  }
  // row k of the start-date table starts k × stepDays days after the season's first start date
  return a.startDates.flatMap((row, k) =>
    row.years > 0
      ? [
          {
            day: k * a.season.stepDays,
            probability: row.probabilityWithinDeadline,
            spoilage: spoilageOf(row),
          },
        ]
      : [],
  )
}

function calendarRow(a: Assessment, weeks: number): CalendarRow {
  const probability: (number | null)[] = []
  const spoilage: (number | null)[] = []
  const byWeek: CalendarEntry[][] = Array.from({ length: weeks }, () => [])
  for (const e of calendarEntries(a)) {
    const w = Math.floor(e.day / 7)
    if (w < weeks) byWeek[w].push(e)
  }
  for (const entries of byWeek) {
    const p = meanOrNull(entries.map((e) => e.probability))
    const spoil = entries.map((e) => e.spoilage).filter((v): v is number => v !== null)
    probability.push(p === null ? null : roundOrNull(p, 3))
    spoilage.push(spoil.length > 0 ? roundOrNull(meanOrNull(spoil) as number, 3) : null)
  }
  return {
    kind: a.method.kind,
    label: a.methodLabel,
    cells: probability.map((p, w) => calendarState(p, spoilage[w])),
    probabilityWithinDeadline: probability,
    spoilageProbability: spoilage,
  }
}

/** The calendar of `assessments` (one row each, in their order) over the season of the first. */
export function methodCalendar(assessments: Assessment[]): MethodCalendar {
  const weeks = seasonWeeks(assessments[0].season)
  return {
    weekStarts: weeks.starts,
    rows: assessments.map((a) => calendarRow(a, weeks.count)),
    rules: CALENDAR_STATES.map((state) => ({ state, rule: CALENDAR_RULES[state] })),
  }
}
