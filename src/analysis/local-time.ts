/**
 * @module analysis/local-time
 * Local standard time (no daylight saving) of each hour, for months, hour-of-day tables and start dates.
 * The offset is the site's `utcOffsetHours` when known (the weather reader resolves it: `--site-tz`,
 * the file's statement, the clock of local timestamps, or the longitude); otherwise longitude/15
 * rounded to the hour (mean solar time to the nearest hour), which the assessment states.
 */
import type { HourlySeries } from '../weather/series.ts'

export interface LocalTimeColumns {
  /** Offset of local standard time from UTC [h]. */
  utcOffsetHours: number
  /**
   * How the site's offset was chosen, for the assumptions: given by the user (`option`), stated by
   * the file (`file`), taken from the clock of its local timestamps (`timestamps`), from the longitude,
   * or nothing known (`assumed-utc`).
   */
  offsetSource: 'option' | 'file' | 'timestamps' | 'longitude' | 'assumed-utc'
  /** Calendar year of each hour (local standard time). */
  year: Int16Array
  /** Month 1–12. */
  month: Uint8Array
  /** Day of month 1–31. */
  day: Uint8Array
  /** Hour of day 0–23 (start of the hour). */
  hour: Uint8Array
}

/** Resolve the offset: file value, else longitude/15 rounded, else 0 (UTC). */
export function resolveUtcOffsetHours(series: HourlySeries): {
  utcOffsetHours: number
  offsetSource: LocalTimeColumns['offsetSource']
} {
  if (series.site.utcOffsetHours !== null) {
    return { utcOffsetHours: series.site.utcOffsetHours, offsetSource: series.site.utcOffsetSource ?? 'file' }
  }
  if (series.site.longitudeDeg !== null) {
    return { utcOffsetHours: Math.round(series.site.longitudeDeg / 15) || 0, offsetSource: 'longitude' }
  }
  return { utcOffsetHours: 0, offsetSource: 'assumed-utc' }
}

/** Fill year/month/day/hour columns in local standard time. */
export function localTimeColumns(series: HourlySeries): LocalTimeColumns {
  const { utcOffsetHours, offsetSource } = resolveUtcOffsetHours(series)
  const n = series.hours
  const year = new Int16Array(n)
  const month = new Uint8Array(n)
  const day = new Uint8Array(n)
  const hour = new Uint8Array(n)
  const offsetMs = utcOffsetHours * 3_600_000
  let dayStartMs = Number.NaN
  let dayEndMs = Number.NaN
  let y = 0
  let m = 0
  let d = 0
  for (let i = 0; i < n; i++) {
    const localMs = series.startUtcMs[i] + offsetMs
    if (!(localMs >= dayStartMs && localMs < dayEndMs)) {
      const date = new Date(localMs)
      y = date.getUTCFullYear()
      m = date.getUTCMonth() + 1
      d = date.getUTCDate()
      dayStartMs = Date.UTC(y, m - 1, d)
      dayEndMs = dayStartMs + 86_400_000
    }
    year[i] = y
    month[i] = m
    day[i] = d
    hour[i] = Math.floor((localMs - dayStartMs) / 3_600_000)
  }
  return { utcOffsetHours, offsetSource, year, month, day, hour }
}

/** Parse 'MM-DD' into month and day, throwing a RangeError naming the field. */
export function parseMonthDay(text: string, field: string): { month: number; day: number } {
  const m = /^(\d{1,2})-(\d{1,2})$/.exec(text.trim())
  const month = m ? Number(m[1]) : Number.NaN
  const day = m ? Number(m[2]) : Number.NaN
  const daysIn = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]
  if (!(month >= 1 && month <= 12 && day >= 1 && day <= daysIn[month - 1])) {
    throw new RangeError(`${field} must be a date MM-DD such as 07-15, got '${text}'`)
  }
  return { month, day }
}
