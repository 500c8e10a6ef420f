/**
 * @module analysis/method-calendar
 * The season calendar of the methods side by side (the states, their rules and the weeks of
 * analysis/season-calendar.ts, the one-method calendar): one row per method, one cell per start week (weeks of
 * 7 days from the season's first start date), each cell one of {@link CALENDAR_STATES} by the rule stated
 * in {@link CALENDAR_RULES}, from the shares of years of the week's start dates. A bin's row is at the
 * airflow of its figures (analysis/compare-methods-bin.ts).
 */
import type { DryingMethod } from '../drying/method.ts'
import { MS_PER_DAY } from '../physics/constants.ts'
import type { Assessment } from './assessment.ts'
import { binComparisonAirflow, binRowsAt, binSpoiledShare } from './compare-methods-bin.ts'
import { parseMonthDay } from './local-time.ts'
import {
  CALENDAR_RULES,
  CALENDAR_STATES,
  type CalendarState,
  calendarState,
  seasonWeekStarts,
  spoilageOf,
} from './season-calendar.ts'
import { meanOrNull, roundOrNull } from './statistics.ts'

export {
  CALENDAR_RULES,
  CALENDAR_STATES,
  type CalendarState,
  calendarState,
  HALF_OF_YEARS,
  SPOILAGE_MARGINAL_SHARE,
  spoilageOf,
} from './season-calendar.ts'

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
  const weekStarts = seasonWeekStarts(assessments[0].season)
  return {
    weekStarts,
    rows: assessments.map((a) => calendarRow(a, weekStarts.length)),
    rules: CALENDAR_STATES.map((state) => ({ state, rule: CALENDAR_RULES[state] })),
  }
}
