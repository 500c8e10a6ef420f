/**
 * @module analysis/season-calendar
 * The season at a glance: the start-date table folded into weeks of 7 days from the season's first start
 * date, each week in one state a grower acts on: the batch dries by the deadline, it is marginal, it needs
 * heat, or it spoils first. Derived from the start-date rows only (no weather), so an assessment's JSON gives
 * the same calendar again; the rule of every state is stated with the cells. The rule is the one of the
 * methods side by side (a week's shares are the means over its start dates), so a one-method calendar reads
 * the same as that method's row there.
 */
import { MS_PER_DAY } from '../physics/constants.ts'
import type { StartDateRow } from './assessment.ts'
import { parseMonthDay } from './local-time.ts'
import { formatMonthDay, GOOD_START_PROBABILITY } from './start-dates.ts'
import { roundOrNull } from './statistics.ts'

/**
 * Below this share of years within the deadline a week "needs heat"; from this share of years spoiling first
 * a week "spoils first" (half the years: our choice, stated in the rules).
 */
export const HALF_OF_YEARS = 0.5
/** From this share of years spoiling first a week is at best "marginal" (our choice, stated in the rules). */
export const SPOILAGE_MARGINAL_SHARE = 0.2

/** The states of a week, from best to worst, then "no data". */
export const CALENDAR_STATES = ['dries', 'marginal', 'needs-heat', 'spoils-first', 'no-data'] as const
export type CalendarState = (typeof CALENDAR_STATES)[number]

const pct = (x: number): string => `${Math.round(100 * x)} %`

/** The rule of each state, in words (also in the JSON, so every reader sees the same rule). */
export const CALENDAR_RULES: Record<CalendarState, string> = {
  dries: `the method as set finishes a batch within the deadline in at least ${pct(GOOD_START_PROBABILITY)} of years (mean over the week's start dates) and, where spoilage is assessed, spoils before it is dry in fewer than ${pct(SPOILAGE_MARGINAL_SHARE)} of years`,
  marginal: `finishes within the deadline in ${pct(HALF_OF_YEARS)} to ${pct(GOOD_START_PROBABILITY)} of years, or spoils before it is dry in ${pct(SPOILAGE_MARGINAL_SHARE)} to ${pct(HALF_OF_YEARS)} of years`,
  'needs-heat': `finishes within the deadline in fewer than ${pct(HALF_OF_YEARS)} of years: a batch needs (more) heat to finish in time`,
  'spoils-first': `spoils before it is dry in at least ${pct(HALF_OF_YEARS)} of years (only where the assessment carries a spoilage model); this state wins over the others`,
  'no-data': 'no start date of the week had a complete batch in any year of the file',
}

export interface SeasonCalendarCell {
  /** First and last day of the week ('MM-DD' on the site's clock). */
  from: string
  to: string
  /** Start dates of the table in this week that had a complete batch. */
  starts: number
  state: CalendarState
  /** Share of years finishing within the deadline by the method as set, mean over the week's start dates [0–1]; null without data. */
  probabilityWithinDeadline: number | null
  /** Share of years in which a batch spoils before it is dry, mean over the week's start dates [0–1]; null when not assessed. */
  spoilageProbability: number | null
}

export interface SeasonCalendar {
  /** The rule of every state, in words. */
  rules: { state: CalendarState; rule: string }[]
  cells: SeasonCalendarCell[]
}

/** The spoilage share of a start row, when the assessment carries one (`startDates[].spoilage.probability`). */
export function spoilageOf(row: StartDateRow): number | null {
  const s = (row as { spoilage?: { probability?: unknown } | null }).spoilage
  return s !== undefined && s !== null && typeof s.probability === 'number' && Number.isFinite(s.probability)
    ? s.probability
    : null
}

/** The state of a week from its mean shares (see {@link CALENDAR_RULES}). */
export function calendarState(probability: number | null, spoilage: number | null): CalendarState {
  if (probability === null) return 'no-data'
  if (spoilage !== null && spoilage >= HALF_OF_YEARS) return 'spoils-first'
  if (probability < HALF_OF_YEARS) return 'needs-heat'
  if (probability < GOOD_START_PROBABILITY || (spoilage !== null && spoilage >= SPOILAGE_MARGINAL_SHARE))
    return 'marginal'
  return 'dries'
}

const mean = (xs: number[]): number | null =>
  xs.length > 0 ? xs.reduce((s, v) => s + v, 0) / xs.length : null

/** First days of the weeks of 7 days from the season's first start date to its last (wrapping the year end). */
export function seasonWeekStarts(season: { start: string; end: string }): string[] {
  const s = parseMonthDay(season.start, 'season start')
  const e = parseMonthDay(season.end, 'season end')
  const ref = 2001 // a non-leap year, as the start-date table uses
  const startMs = Date.UTC(ref, s.month - 1, s.day)
  let endMs = Date.UTC(ref, e.month - 1, e.day)
  if (endMs < startMs) endMs = Date.UTC(ref + 1, e.month - 1, e.day)
  const count = Math.floor((endMs - startMs) / MS_PER_DAY / 7) + 1
  const out: string[] = []
  for (let w = 0; w < count; w++) {
    const d = new Date(startMs + 7 * w * MS_PER_DAY)
    out.push(formatMonthDay({ month: d.getUTCMonth() + 1, day: d.getUTCDate() }))
  }
  return out
}

/** The day 6 days after 'MM-DD' (the last day of its week), in the non-leap reference year. */
function weekEnd(from: string, season: { end: string }, last: boolean): string {
  if (last) return season.end
  const d = parseMonthDay(from, 'week start')
  const t = new Date(Date.UTC(2001, d.month - 1, d.day) + 6 * MS_PER_DAY)
  return formatMonthDay({ month: t.getUTCMonth() + 1, day: t.getUTCDate() })
}

/**
 * The season calendar of a start-date table: row k of the table starts k × `season.stepDays` days after the
 * season's first start date and falls in week ⌊k × stepDays / 7⌋.
 */
export function seasonCalendar(
  rows: readonly StartDateRow[],
  season: { start: string; end: string; stepDays: number },
): SeasonCalendar {
  const weeks = seasonWeekStarts(season)
  const byWeek: StartDateRow[][] = weeks.map(() => [])
  rows.forEach((row, k) => {
    const w = Math.floor((k * season.stepDays) / 7)
    if (w < weeks.length && row.years > 0) byWeek[w].push(row)
  })
  const cells = weeks.map((from, w): SeasonCalendarCell => {
    const inWeek = byWeek[w]
    const p = mean(inWeek.map((r) => r.probabilityWithinDeadline))
    const spoil = inWeek.map(spoilageOf).filter((v): v is number => v !== null)
    const probability = p === null ? null : roundOrNull(p, 3)
    const spoilage = spoil.length > 0 ? roundOrNull(mean(spoil) as number, 3) : null
    return {
      from,
      to: weekEnd(from, season, w === weeks.length - 1),
      starts: inWeek.length,
      state: calendarState(probability, spoilage),
      probabilityWithinDeadline: probability,
      spoilageProbability: spoilage,
    }
  })
  return { rules: CALENDAR_STATES.map((state) => ({ state, rule: CALENDAR_RULES[state] })), cells }
}
