/**
 * @module weather/coverage
 * Share of usable hours (dry bulb and humidity present) per calendar month, in site standard time.
 */
import { daysInMonth } from '../physics/calendar.ts'
import { MS_PER_HOUR } from '../physics/constants.ts'
import type { MonthCoverage } from './result.ts'
import type { HourlySeries } from './series.ts'

/** Coverage per month and the distinct years, months taken in the site's standard time (UTC when unknown). */
export function summarizeCoverage(
  series: HourlySeries,
  missing: Uint8Array,
): { months: MonthCoverage[]; years: number[] } {
  const offsetMs = (series.site.utcOffsetHours ?? 0) * MS_PER_HOUR
  const counts = new Map<number, number>()
  let key = 0
  let nextMonthMs = Number.NEGATIVE_INFINITY
  let count = 0
  for (let s = 0; s < series.hours; s++) {
    const local = series.startUtcMs[s] + offsetMs
    if (local >= nextMonthMs) {
      if (key !== 0) counts.set(key, (counts.get(key) ?? 0) + count)
      const d = new Date(local)
      key = d.getUTCFullYear() * 100 + d.getUTCMonth() + 1
      nextMonthMs = Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1)
      count = 0
    }
    if (!missing[s]) count++
  }
  if (key !== 0) counts.set(key, (counts.get(key) ?? 0) + count)
  const months: MonthCoverage[] = []
  const years = new Set<number>()
  for (const [key, count] of [...counts].sort((a, b) => a[0] - b[0])) {
    const year = Math.floor(key / 100)
    const month = key % 100
    years.add(year)
    months.push({ year, month, percent: Math.round((1000 * count) / (24 * daysInMonth(year, month))) / 10 })
  }
  return { months, years: [...years] }
}
