/**
 * @module weather/timestamp-columns
 * The components of every row's timestamp, in columns (year, the two date numbers, minute of the day,
 * written offset), so the date order of slash dates can be decided after every row has been seen; then
 * each row as wall-clock milliseconds under that order.
 */
import { daysFromCivil, daysInMonth } from '../physics/calendar.ts'
import { MS_PER_DAY, MS_PER_MINUTE } from '../physics/constants.ts'

/** Parsed components of all rows; NaN where a row's timestamp could not be read. */
export interface TimestampColumns {
  year: Float64Array
  /** First date number of a slash date whose year is last (month or day, per the date order). */
  first: Float64Array
  /** Second date number. */
  second: Float64Array
  /** Minutes after the day's midnight, 0…1440 (1440 = 24:00); seconds as a fraction. */
  minuteOfDay: Float64Array
  /** Offset written in the text [min east of UTC], NaN when none. */
  offsetMin: Float64Array
  /**
   * 1 when month and day are known regardless of the date order (first = month, second = day): a
   * year-first, dotted, compact or month-word date.
   */
  yearFirst: Uint8Array
  /** Rows whose year was written with two digits (read with TWO_DIGIT_YEAR_PIVOT of timestamps.ts). */
  twoDigitYears: number
}

export function createTimestampColumns(n: number): TimestampColumns {
  return {
    year: new Float64Array(n).fill(Number.NaN),
    first: new Float64Array(n).fill(Number.NaN),
    second: new Float64Array(n).fill(Number.NaN),
    minuteOfDay: new Float64Array(n).fill(Number.NaN),
    offsetMin: new Float64Array(n).fill(Number.NaN),
    yearFirst: new Uint8Array(n),
    twoDigitYears: 0,
  }
}

export type DateOrder = 'ymd' | 'mdy' | 'dmy'

/**
 * The order of slash dates with the year last: `mdy` if some first number exceeds 12 is impossible,
 * `dmy` if some first number exceeds 12; null when every date fits both (ambiguous) or none has the
 * year last. Throws RangeError when both a first and a second number exceed 12 (not one order).
 */
export function detectDateOrder(ts: TimestampColumns): DateOrder | 'ambiguous' | null {
  let anyYearLast = false
  let firstOver12 = false
  let secondOver12 = false
  for (let i = 0; i < ts.year.length; i++) {
    if (ts.yearFirst[i] === 1 || Number.isNaN(ts.year[i])) continue
    anyYearLast = true
    if (ts.first[i] > 12) firstOver12 = true
    if (ts.second[i] > 12) secondOver12 = true
  }
  if (!anyYearLast) return null
  if (firstOver12 && secondOver12) {
    throw new RangeError(
      'dates mix day-first and month-first order (both first and second numbers exceed 12)',
    )
  }
  if (firstOver12) return 'dmy'
  if (secondOver12) return 'mdy'
  return 'ambiguous'
}

/**
 * Wall-clock milliseconds (the local date and time read as if it were UTC) of row `i`, using
 * `order` for year-last dates; NaN when the date is not a calendar date (e.g. 30 February).
 */
export function wallClockMs(ts: TimestampColumns, i: number, order: 'mdy' | 'dmy', year: number): number {
  const yearFirst = ts.yearFirst[i] === 1
  const month = yearFirst || order === 'mdy' ? ts.first[i] : ts.second[i]
  const day = yearFirst || order === 'mdy' ? ts.second[i] : ts.first[i]
  if (!(month >= 1 && month <= 12) || !(day >= 1) || day > daysInMonth(year, month)) return Number.NaN
  if (!(year >= 1800 && year <= 2200)) return Number.NaN
  return daysFromCivil(year, month, day) * MS_PER_DAY + ts.minuteOfDay[i] * MS_PER_MINUTE
}
