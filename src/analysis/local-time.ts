/**
 * @module analysis/local-time
 * The site's local clock of each hour, for months, hour-of-day tables and start dates. When the site's
 * IANA zone is known (the weather reader resolves it: `--site-tz`, the file's statement, the zone of local
 * timestamps) the columns follow that zone's clock, daylight saving included, so "batches start at 08:00"
 * and the hour-of-day table mean what the site's clocks show. Otherwise they follow local standard time at
 * the site's `utcOffsetHours` all year (the file's or the user's offset, or longitude/15 rounded to the
 * hour: mean solar time to the nearest hour), which the assessment states.
 */
import { MS_PER_DAY, MS_PER_HOUR } from '../physics/constants.ts'
import type { HourlySeries } from '../weather/series.ts'
import { offsetAtUtc, utcCandidates, type ZoneOffsets, zoneOffsets } from '../weather/time-zone.ts'

export interface LocalTimeColumns {
  /** Offset of local standard time from UTC [h]. */
  utcOffsetHours: number
  /** IANA zone whose clock (daylight saving included) the columns follow; null: standard time all year. */
  timeZone: string | null
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
  /**
   * The UTC instant [ms] at which the site's clock shows `hour`:00 on year-month-day: the earlier of two in
   * an autumn overlap, the first instant after a spring-forward gap.
   */
  toUtcMs(year: number, month: number, day: number, hour: number): number
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

/** The zone's offsets over the series, or null when no zone is known (or the runtime does not know it). */
function siteZone(series: HourlySeries): ZoneOffsets | null {
  const zone = series.site.timeZone
  if (!zone || series.hours === 0 || series.typicalYear) return null
  try {
    return zoneOffsets(zone, series.startUtcMs[0], series.startUtcMs[series.hours - 1])
  } catch {
    return null
  }
}

/** Fill year/month/day/hour columns on the site's clock (its zone's, else standard time). */
export function localTimeColumns(series: HourlySeries): LocalTimeColumns {
  const { utcOffsetHours, offsetSource } = resolveUtcOffsetHours(series)
  const zone = siteZone(series)
  const n = series.hours
  const year = new Int16Array(n)
  const month = new Uint8Array(n)
  const day = new Uint8Array(n)
  const hour = new Uint8Array(n)
  const standardMs = utcOffsetHours * MS_PER_HOUR
  let offsetMs = standardMs
  // the zone's transitions, walked once in step with the increasing hours
  let k = 0
  let nextChangeMs = Number.POSITIVE_INFINITY
  if (zone) {
    offsetMs = zone.offsetMs[0]
    nextChangeMs = k + 1 < zone.fromUtcMs.length ? zone.fromUtcMs[k + 1] : Number.POSITIVE_INFINITY
  }
  let dayStartMs = Number.NaN
  let dayEndMs = Number.NaN
  let y = 0
  let m = 0
  let d = 0
  for (let i = 0; i < n; i++) {
    if (zone && series.startUtcMs[i] >= nextChangeMs) {
      while (k + 1 < zone.fromUtcMs.length && zone.fromUtcMs[k + 1] <= series.startUtcMs[i]) k++
      offsetMs = zone.offsetMs[k]
      nextChangeMs = k + 1 < zone.fromUtcMs.length ? zone.fromUtcMs[k + 1] : Number.POSITIVE_INFINITY
    }
    const localMs = series.startUtcMs[i] + offsetMs
    if (!(localMs >= dayStartMs && localMs < dayEndMs)) {
      const date = new Date(localMs)
      y = date.getUTCFullYear()
      m = date.getUTCMonth() + 1
      d = date.getUTCDate()
      dayStartMs = Date.UTC(y, m - 1, d)
      dayEndMs = dayStartMs + MS_PER_DAY
    }
    year[i] = y
    month[i] = m
    day[i] = d
    hour[i] = Math.floor((localMs - dayStartMs) / MS_PER_HOUR)
  }
  const toUtcMs = (yy: number, mm: number, dd: number, hh: number): number => {
    const wallMs = Date.UTC(yy, mm - 1, dd, hh)
    if (!zone) return wallMs - standardMs
    const candidates = utcCandidates(zone, wallMs)
    // in a spring-forward gap the clock jumps past `hh`: the first hour after the gap
    return candidates.length > 0 ? candidates[0] : wallMs - offsetAtUtc(zone, wallMs - 12 * MS_PER_HOUR)
  }
  return { utcOffsetHours, offsetSource, timeZone: zone ? zone.zone : null, year, month, day, hour, toUtcMs }
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
