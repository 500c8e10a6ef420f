/**
 * @module analysis/season-calendar
 * The season at a glance: the start-date table folded into start weeks, each in one state a grower acts on:
 * the batch dries by the deadline, it is marginal, it needs heat, it cannot finish even with heat, or it
 * spoils first. Derived from the start-date rows only (no weather), so an assessment's JSON gives the same
 * calendar again; the criterion is stated with the cells.
 */
import type { StartDateRow } from './assessment.ts'
import { GOOD_START_PROBABILITY } from './start-dates.ts'

/**
 * Below {@link GOOD_START_PROBABILITY} but at least this share of years within the deadline: "marginal"
 * (half the years: our choice, stated in the criterion).
 */
export const MARGINAL_START_PROBABILITY = 0.5

/** A week whose batches spoil before they are dry in at least this share of years is "spoils first" (our choice). */
export const SPOILS_FIRST_PROBABILITY = 0.5

export const CALENDAR_STATES = [
  'dries',
  'marginal',
  'needs-heat',
  'out-of-reach',
  'spoils-first',
  'no-data',
] as const
export type CalendarState = (typeof CALENDAR_STATES)[number]

export interface SeasonCalendarCell {
  /** First and last start day of the week ('MM-DD' on the site's clock). */
  from: string
  to: string
  /** Start days of the table in this week. */
  starts: number
  state: CalendarState
  /** Lowest share of years finishing within the deadline by the method alone, over the week's start days [0–1]; null without data. */
  minProbabilityWithinDeadline: number | null
  /** Highest share of years in which a batch of the week spoils before it is dry [0–1]; null when the assessment has no spoilage figure. */
  maxSpoilageProbability: number | null
}

export interface SeasonCalendar {
  /** How a week gets its state, in words. */
  criterion: string
  cells: SeasonCalendarCell[]
}

/** The spoilage probability of a start row, when the assessment carries one (`startDates[].spoilage.probability`). */
function spoilageProbability(row: StartDateRow): number | null {
  const p = (row as StartDateRow & { spoilage?: { probability?: unknown } | null }).spoilage?.probability
  return typeof p === 'number' && Number.isFinite(p) ? p : null
}

function stateOf(rows: StartDateRow[]): Omit<SeasonCalendarCell, 'from' | 'to' | 'starts'> {
  const withYears = rows.filter((r) => r.years > 0)
  if (withYears.length === 0)
    return { state: 'no-data', minProbabilityWithinDeadline: null, maxSpoilageProbability: null }
  const minP = Math.min(...withYears.map((r) => r.probabilityWithinDeadline))
  const spoil = withYears.map(spoilageProbability).filter((p): p is number => p !== null)
  const maxSpoil = spoil.length > 0 ? Math.max(...spoil) : null
  const outOfReach = withYears.some((r) => r.yearsNotReachable >= r.years)
  const state: CalendarState =
    maxSpoil !== null && maxSpoil >= SPOILS_FIRST_PROBABILITY
      ? 'spoils-first'
      : minP >= GOOD_START_PROBABILITY
        ? 'dries'
        : minP >= MARGINAL_START_PROBABILITY
          ? 'marginal'
          : outOfReach
            ? 'out-of-reach'
            : 'needs-heat'
  return { state, minProbabilityWithinDeadline: minP, maxSpoilageProbability: maxSpoil }
}

/**
 * Fold the start-date rows (in season order, `stepDays` apart) into weeks of 7 days from the season's first
 * start day; a week takes the state of its worst start day.
 */
export function seasonCalendar(rows: readonly StartDateRow[], stepDays: number): SeasonCalendar {
  const perWeek = Math.max(1, Math.floor(7 / Math.max(1, stepDays)))
  const cells: SeasonCalendarCell[] = []
  for (let i = 0; i < rows.length; i += perWeek) {
    const week = rows.slice(i, i + perWeek)
    cells.push({
      from: week[0].start,
      to: week[week.length - 1].start,
      starts: week.length,
      ...stateOf(week),
    })
  }
  const good = Math.round(GOOD_START_PROBABILITY * 100)
  const marginal = Math.round(MARGINAL_START_PROBABILITY * 100)
  const spoil = Math.round(SPOILS_FIRST_PROBABILITY * 100)
  return {
    criterion:
      `each cell is a start week (its worst start day counts): dries = batches finish within the deadline by the method alone in at least ${good} % of years; ` +
      `marginal = in ${marginal} to ${good} % of years; needs heat = in fewer than ${marginal} % of years, heat would finish them; ` +
      `out of reach = not even heating every hour finishes them in time; spoils first = the batch spoils before it is dry in at least ${spoil} % of years (where the assessment has a spoilage figure)`,
    cells,
  }
}
