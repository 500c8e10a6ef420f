/**
 * @module report/words
 * The words people read for the engine's identifiers: why an hour does not dry, the state of a start week,
 * shares of years, the site's clock. Every display (the HTML report, the CSV, the CLI's text, the page)
 * takes its words from here, so `nightWithoutDrying` or `≥ 100 % of years` never reach a reader.
 */
import type { Assessment } from '../analysis/assessment.ts'
import type { CalendarState } from '../analysis/season-calendar.ts'
import { HOUR_STATUS_WORDS, type HourStatusName } from '../drying/usable-hour.ts'

/** Why an hour is not a drying hour, in a grower's words (short enough for a table cell). */
export const REASON_WORDS: Record<HourStatusName, string> = HOUR_STATUS_WORDS

/** The state of a start week, in words, and its one-letter mark (the second cue beside the colour). */
export const CALENDAR_WORDS: Record<CalendarState, { words: string; mark: string }> = {
  dries: { words: 'dries in time', mark: 'D' },
  marginal: { words: 'marginal', mark: 'M' },
  'needs-heat': { words: 'needs heat', mark: 'H' },
  'spoils-first': { words: 'spoils first', mark: 'S' },
  'no-data': { words: 'no data', mark: '·' },
}

/**
 * A share of years in words: "every year" at 100 %, "no year" at 0, else "73 % of years". Rounded to a
 * whole percent, so a share just under 1 reads "99 % of years", never "100 % of years".
 */
export function yearsWords(share: number): string {
  if (!Number.isFinite(share)) return 'unknown share of years'
  if (share >= 1) return 'every year'
  if (share <= 0) return 'no year'
  const pct = Math.min(99, Math.max(1, Math.round(share * 100)))
  return `${pct} % of years`
}

/** "in every year", "in no year", "in 73 % of years": for sentences that read "finishes … within 14 days". */
export function inYearsWords(share: number): string {
  return `in ${yearsWords(share)}`
}

/** A UTC offset in hours as "UTC+1", "UTC−5:30". */
export function offsetWords(hours: number): string {
  const sign = hours >= 0 ? '+' : '−'
  const abs = Math.abs(hours)
  const h = Math.floor(abs)
  const m = Math.round((abs - h) * 60)
  return `UTC${sign}${h}${m > 0 ? `:${String(m).padStart(2, '0')}` : ''}`
}

const OFFSET_SOURCE_WORDS: Record<Assessment['site']['utcOffsetSource'], string> = {
  option: 'as given',
  file: 'from the file',
  timestamps: "from the file's local time stamps",
  longitude: 'guessed from the longitude',
  'assumed-utc': 'not known, UTC assumed',
}

/**
 * The clock the report's times are on, named: "the site's clock, Europe/Madrid (daylight saving
 * included; standard time UTC+1)" or "local standard time UTC+1 all year (guessed from the longitude; no
 * time zone known, so no daylight saving)".
 */
export function clockWords(
  site: Pick<Assessment['site'], 'timeZone' | 'utcOffsetHours' | 'utcOffsetSource'>,
): string {
  if (site.timeZone)
    return `the site's clock, ${site.timeZone} (daylight saving included; standard time ${offsetWords(site.utcOffsetHours)})`
  return `local standard time ${offsetWords(site.utcOffsetHours)} all year (${OFFSET_SOURCE_WORDS[site.utcOffsetSource] ?? 'as given'}; no time zone known, so no daylight saving)`
}

/** The short name of the clock for axis labels and table headings: "Europe/Madrid time" or "UTC+1 standard time". */
export function clockShort(site: Pick<Assessment['site'], 'timeZone' | 'utcOffsetHours'>): string {
  return site.timeZone ? `${site.timeZone} time` : `${offsetWords(site.utcOffsetHours)} standard time`
}

/** "every 3rd", "every 2nd", "every 4th" … for notes on thinned tables. */
export function everyNth(n: number): string {
  if (n === 1) return 'every'
  const mod100 = n % 100
  const suffix =
    mod100 >= 11 && mod100 <= 13
      ? 'th'
      : n % 10 === 1
        ? 'st'
        : n % 10 === 2
          ? 'nd'
          : n % 10 === 3
            ? 'rd'
            : 'th'
  return `every ${n}${suffix}`
}

/**
 * The note under a table that shows only some of its rows: "Every 3rd start date of 52 is shown (18 rows);
 * the full table has them all." Empty when nothing was left out.
 */
export function thinnedNote(step: number, shown: number, total: number, what: string, where: string): string {
  if (step <= 1 || shown >= total) return ''
  return `${everyNth(step)[0].toUpperCase()}${everyNth(step).slice(1)} ${what} of ${total} is shown (${shown} rows); ${where} has them all.`
}
