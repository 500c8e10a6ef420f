/**
 * @module weather/typical-year
 * Typical (synthetic) years: files such as TMY3 that stitch each calendar month from a different source
 * year. Recognised from the rows, and placed on one nominal year (a leap year when the file has 29
 * February).
 */
import type { TimestampColumns } from './timestamp-columns.ts'

/** Nominal year of a typical-year file without 29 February (any common year would do). */
export const NOMINAL_COMMON_YEAR = 2001

/** Nominal year of a typical-year file that contains 29 February (a leap year, so the day is kept). */
export const NOMINAL_LEAP_YEAR = 2000

/**
 * Hours a typical year must hold to be taken as one: 90 % of 8760. Typical-year files (e.g. TMY3,
 * Wilcox & Marion 2008, NREL/TP-581-43156, from memory) are one complete year of 8760 hours with each
 * calendar month taken whole from one source year; the 10 % margin for missing rows is common
 * practice, no source.
 */
const TYPICAL_YEAR_MIN_HOURS = 7884

/** At most a leap year plus two days of rows (sub-hourly files are never typical years). */
const TYPICAL_YEAR_MAX_HOURS = 8784 + 48

/**
 * A typical (synthetic) year: rows in calendar order, all twelve months present, each month from a
 * single year, at least two source years, and about one year of hours. Rows flagged in `skip` (years
 * outside the accepted range) are left out.
 */
export function detectTypicalYear(
  ts: TimestampColumns,
  order: 'mdy' | 'dmy',
  skip: Uint8Array,
): { typical: boolean; years: number[]; leap: boolean } {
  const years = new Set<number>()
  const yearOfMonth = new Float64Array(13).fill(Number.NaN)
  let previousKey = -1
  let monotonic = true
  let monthsFromOneYear = true
  let leap = false
  let valid = 0
  for (let i = 0; i < ts.year.length; i++) {
    if (skip[i] === 1 || Number.isNaN(ts.year[i]) || Number.isNaN(ts.minuteOfDay[i])) continue
    valid++
    const year = ts.year[i]
    years.add(year)
    // month and day under the date order, without a tuple per row (a 30-year file has 263,000 rows)
    const monthFirst = ts.yearFirst[i] === 1 || order === 'mdy'
    const month = monthFirst ? ts.first[i] : ts.second[i]
    const day = monthFirst ? ts.second[i] : ts.first[i]
    if (month >= 1 && month <= 12) {
      if (Number.isNaN(yearOfMonth[month])) yearOfMonth[month] = year
      else if (yearOfMonth[month] !== year) monthsFromOneYear = false
    }
    if (month === 2 && day === 29) leap = true
    const key = (month * 32 + day) * 1441 + ts.minuteOfDay[i]
    if (key < previousKey) monotonic = false
    previousKey = key
  }
  let months = 0
  for (let m = 1; m <= 12; m++) if (!Number.isNaN(yearOfMonth[m])) months++
  const typical =
    years.size > 1 &&
    monotonic &&
    monthsFromOneYear &&
    months === 12 &&
    valid >= TYPICAL_YEAR_MIN_HOURS &&
    valid <= TYPICAL_YEAR_MAX_HOURS
  return { typical, years: [...years].sort((a, b) => a - b), leap }
}
