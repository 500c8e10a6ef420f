/**
 * @module physics/calendar
 * The civil (proleptic Gregorian) calendar, once: leap years, month lengths, days from 1970-01-01 and
 * back to the day of the year. Integer arithmetic only, no `Date` and no allocation, so hourly loops
 * may call it.
 */
import { MS_PER_DAY, MS_PER_HOUR } from './constants.ts'

/** Whether `year` is a leap year of the Gregorian calendar (divisible by 4, centuries only by 400). */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0
}

/**
 * Days from 1970-01-01 to the civil date (proleptic Gregorian); Hinnant (2013), "chrono-Compatible
 * Low-Level Date Algorithms", days_from_civil.
 */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year
  const era = Math.floor(y / 400)
  const yoe = y - era * 400
  const mp = (month + 9) % 12
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy
  return era * 146097 + doe - 719468
}

/** Days in a month of the Gregorian calendar. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31
}

/** Month and day of day-of-year `doy` (1 = 1 January) in `year`; NaN when out of range. */
export function monthDayOfYear(year: number, doy: number): [number, number] {
  if (!Number.isInteger(doy) || !Number.isInteger(year) || doy < 1) return [Number.NaN, Number.NaN]
  let left = doy
  for (let m = 1; m <= 12; m++) {
    const days = daysInMonth(year, m)
    if (left <= days) return [m, left]
    left -= days
  }
  return [Number.NaN, Number.NaN]
}

/**
 * Day of the year (1…366) of the civil date containing `utcMs` + `offsetHours` [h], without
 * allocation (Hinnant 2013, same source, civil_from_days: the day counted from 1 March).
 */
export function dayOfYearAt(utcMs: number, offsetHours = 0): number {
  const days = Math.floor((utcMs + offsetHours * MS_PER_HOUR) / MS_PER_DAY)
  const z = days + 719468
  const era = Math.floor(z / 146097)
  const doe = z - era * 146097
  const yoe = Math.floor(
    (doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365,
  )
  const doyMar = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100)) // days since 1 March
  const year = yoe + era * 400 + (doyMar >= 306 ? 1 : 0)
  return doyMar >= 306 ? doyMar - 305 : doyMar + 60 + (isLeapYear(year) ? 1 : 0)
}
