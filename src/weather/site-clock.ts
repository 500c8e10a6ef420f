/**
 * @module weather/site-clock
 * The site's clock, kept apart from the clock the file's timestamps are written in. `--utc-offset`
 * and `--tz` say how to read the timestamps; the site's local standard time (for months, hours of
 * the day and batch start times) comes, in this order, from `--site-tz`, from what the file says
 * about its site (EPW header, a service's metadata block), from the timestamps when they are written
 * in local time (a logger set to the site's clock), or from the longitude (mean solar time rounded to
 * the hour, with a warning). A file in UTC says nothing about the site's clock.
 */
import type { SiteInfo } from './series.ts'
import type { TimestampBasis } from './time-basis.ts'
import { formatOffset } from './time-basis.ts'
import { zoneStandardOffsetHours } from './time-zone.ts'

/** Where the site's clock came from. */
export type SiteClockSource = NonNullable<SiteInfo['utcOffsetSource']>

export interface SiteClockInput {
  /** The user's `--site-tz`. */
  optionZone?: string
  /** The site's zone or standard offset as the file states them. */
  fileZone?: string | null
  fileOffsetHours?: number | null
  /** The clock of the timestamps. */
  basis: TimestampBasis
  /** Standard offset of the timestamps' zone over the file [h], when the basis is a zone. */
  basisZoneStandardOffsetHours: number | null
  longitudeDeg: number | null
  /** A UTC instant inside the file, to find a zone's standard offset. */
  referenceUtcMs: number
}

export interface SiteClock {
  timeZone: string | null
  utcOffsetHours: number | null
  source: SiteClockSource | null
  /** A sentence for the warnings when the clock was inferred (timestamps, longitude) or missing. */
  note: string | null
}

/** Resolve the site's clock (see the module). */
export function resolveSiteClock(input: SiteClockInput): SiteClock {
  if (input.optionZone !== undefined) {
    return {
      timeZone: input.optionZone,
      utcOffsetHours: zoneStandardOffsetHours(input.optionZone, input.referenceUtcMs),
      source: 'option',
      note: null,
    }
  }
  if (input.fileZone) {
    return {
      timeZone: input.fileZone,
      utcOffsetHours: input.fileOffsetHours ?? zoneStandardOffsetHours(input.fileZone, input.referenceUtcMs),
      source: 'file',
      note: null,
    }
  }
  if (input.fileOffsetHours !== undefined && input.fileOffsetHours !== null) {
    return { timeZone: null, utcOffsetHours: input.fileOffsetHours, source: 'file', note: null }
  }
  const basis = input.basis
  if (basis.kind === 'zone') {
    return {
      timeZone: basis.zone,
      utcOffsetHours: input.basisZoneStandardOffsetHours,
      source: 'timestamps',
      note: `the site's clock is taken to be the timestamps' zone ${basis.zone}; give --site-tz <zone> if the site keeps another`,
    }
  }
  if (basis.kind === 'offset') {
    return {
      timeZone: null,
      utcOffsetHours: basis.offsetHours,
      source: 'timestamps',
      note: `the site's clock is taken to be the timestamps' UTC${formatOffset(basis.offsetHours)}; give --site-tz <zone> if the site keeps another`,
    }
  }
  if (input.longitudeDeg !== null) {
    const hours = Math.round(input.longitudeDeg / 15) || 0
    return {
      timeZone: null,
      utcOffsetHours: hours,
      source: 'longitude',
      note: `the timestamps are UTC and the file does not say the site's clock: local time taken as UTC${formatOffset(hours)} from the longitude ${input.longitudeDeg}° (mean solar time to the hour); give --site-tz <zone> for the site's own`,
    }
  }
  return {
    timeZone: null,
    utcOffsetHours: null,
    source: null,
    note: "the timestamps are UTC and neither the site's clock nor its longitude is known: local hours, months and start times are in UTC; give --site-tz <zone> or --lon <°E>",
  }
}
