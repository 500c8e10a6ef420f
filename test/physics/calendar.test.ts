// The civil calendar (src/physics/calendar.ts) against the proleptic Gregorian calendar of ECMAScript's
// Date (ECMA-262 §21.4.1, "Time Values and Time Range": Day, DaysInYear, MonthFromTime), every day of
// 1800–2200 (the years a timestamp may carry).
import { describe, expect, it } from 'vitest'
import {
  dayOfYearAt,
  daysFromCivil,
  daysInMonth,
  isLeapYear,
  monthDayOfYear,
} from '../../src/physics/calendar.ts'
import { MS_PER_DAY, MS_PER_HOUR } from '../../src/physics/constants.ts'

describe('civil calendar (against ECMA-262 Date)', () => {
  it('days from 1970, day of the year and month/day of the day of the year, 1800–2200', () => {
    const wrong: string[] = []
    for (let t = Date.UTC(1800, 0, 1); t < Date.UTC(2201, 0, 1); t += MS_PER_DAY) {
      const d = new Date(t)
      const y = d.getUTCFullYear()
      const m = d.getUTCMonth() + 1
      const day = d.getUTCDate()
      const doy = Math.round((t - Date.UTC(y, 0, 1)) / MS_PER_DAY) + 1
      if (daysFromCivil(y, m, day) * MS_PER_DAY !== t) wrong.push(`daysFromCivil ${d.toISOString()}`)
      if (dayOfYearAt(t + 13 * MS_PER_HOUR) !== doy) wrong.push(`dayOfYearAt ${d.toISOString()}`)
      const [mm, dd] = monthDayOfYear(y, doy)
      if (mm !== m || dd !== day) wrong.push(`monthDayOfYear ${d.toISOString()}`)
    }
    expect(wrong).toEqual([])
  })
  it('month lengths and leap years', () => {
    for (let y = 1800; y <= 2200; y++) {
      expect(isLeapYear(y)).toBe(new Date(Date.UTC(y, 1, 29)).getUTCMonth() === 1)
      for (let m = 1; m <= 12; m++) expect(daysInMonth(y, m)).toBe(new Date(Date.UTC(y, m, 0)).getUTCDate())
    }
    expect(monthDayOfYear(2001, 366)).toEqual([Number.NaN, Number.NaN])
    expect(monthDayOfYear(2000, 366)).toEqual([12, 31])
  })
})
