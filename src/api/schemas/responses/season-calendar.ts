/**
 * @module api/schemas/responses/season-calendar
 * `assessment.seasonCalendar` (analysis/season-calendar.ts): the start-date table folded into weeks, each
 * in one state by a stated rule, with the unit of every field. Built on first use.
 */
import { z } from 'zod'
import { CALENDAR_STATES, type SeasonCalendar } from '../../../analysis/season-calendar.ts'
import { count, monthDay, numOrNull, once, text } from './common.ts'

export const seasonCalendarSchema = once(() =>
  z
    .strictObject({
      rules: z.array(
        z.strictObject({
          state: z.enum(CALENDAR_STATES).describe('calendar state'),
          rule: text('the rule of the state'),
        }),
      ),
      cells: z.array(
        z.strictObject({
          from: monthDay("first day of the week, on the site's clock"),
          to: monthDay('last day of the week'),
          starts: count('start dates of the week with a complete batch'),
          state: z.enum(CALENDAR_STATES).describe('the state of the week'),
          probabilityWithinDeadline: numOrNull(
            'share of years finishing within the deadline, mean over the week [0–1]; null: no data',
          ),
          spoilageProbability: numOrNull(
            'share of years spoiling before dry, mean over the week [0–1]; null: not assessed',
          ),
        }),
      ),
    })
    .describe('the season at a glance: one state per start week, with the rule of every state'),
)

/** Compile-time check that the schema describes the analysis type (see assessment.ts). */
type Describes<T, S extends T> = S
export type SeasonCalendarDescribed = Describes<
  SeasonCalendar,
  z.output<ReturnType<typeof seasonCalendarSchema>>
>
