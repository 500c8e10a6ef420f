/**
 * @module weather/series
 * The columnar hourly weather series that every reader produces and the drying engine consumes.
 * One `Float64Array` per variable, `NaN` for missing, a parallel quality-flag array and the UTC
 * start of each hour. Columns rather than row objects: several times smaller and faster on
 * 30-year files (263,000 hours).
 */
import { MS_PER_HOUR } from '../physics/constants.ts'

/** Where the site is and how its clock relates to UTC. */
export interface SiteInfo {
  /** Display name (from the file header, the file name or the user). Untrusted text: escape on output. */
  name: string
  /** Latitude [degrees north], null when unknown. */
  latitudeDeg: number | null
  /** Longitude [degrees east], null when unknown. */
  longitudeDeg: number | null
  /** Elevation above sea level [m], null when unknown. */
  elevationM: number | null
  /** IANA zone of the SITE's clock, when known (`--site-tz`, the file, or the timestamps' zone). */
  timeZone: string | null
  /**
   * Offset of the SITE's local standard time from UTC [h], when known: local hours, months and batch
   * start times use it. Not the basis of the file's timestamps (a UTC file says nothing about it).
   */
  utcOffsetHours: number | null
  /**
   * Where the site's clock came from: the user (`--site-tz`), the file's own statement (EPW header,
   * a service's metadata), the timestamps' local clock, or the longitude (mean solar time to the hour).
   */
  utcOffsetSource?: 'option' | 'file' | 'timestamps' | 'longitude' | null
  /** Height of the wind measurement above ground [m]; 10 m (WMO standard) unless the file or user says otherwise. */
  windHeightM: number
}

/** Bit flags in {@link HourlySeries.quality}; an hour may carry several. */
export const QualityFlag = {
  /** Dry bulb or humidity missing: the hour cannot be assessed. */
  missingCore: 1,
  /** At least one value in the hour was filled by interpolation across a short gap. */
  filled: 2,
  /** At least one value failed a range, step or consistency check and was set to missing. */
  rejectedValue: 4,
  /** Irradiance was absent or missing and was filled (zero at night, clear-sky-scaled by day). */
  irradianceFilled: 8,
  /** Station pressure was absent and comes from the standard atmosphere at the site elevation. */
  pressureFromElevation: 16,
  /** The hour's timestamp was duplicated in the input (first occurrence kept). */
  duplicateTimestamp: 32,
  /**
   * Irradiance estimated from what the file has (cloud cover, or the day's temperature range) because
   * it has no irradiance column: see `weather/sun-estimate.ts` for the methods and their uncertainty.
   */
  irradianceEstimated: 64,
  /**
   * The hour was built from sub-hourly readings and some were missing (enough remained under the
   * coverage rule of `weather/hourly-aggregate.ts`).
   */
  partialHour: 128,
} as const

/** How a variable's value relates to its timestamp. */
export type ValueTiming = 'instant' | 'interval-mean' | 'interval-total'

export interface HourlySeries {
  site: SiteInfo
  /** Number of hours (length of every column). */
  hours: number
  /** UTC start of each hour [ms since 1970-01-01T00:00Z], strictly increasing by 3,600,000. */
  startUtcMs: Float64Array
  /** Dry-bulb air temperature [°C]. */
  dryBulbC: Float64Array
  /**
   * Relative humidity [%] relative to saturation over liquid water at all temperatures
   * (WMO practice for weather stations, also below 0 °C).
   */
  relativeHumidityPct: Float64Array
  /** Station (not sea-level) pressure [kPa]. */
  pressureKpa: Float64Array
  /** Wind speed at `site.windHeightM` [m/s]. */
  windMs: Float64Array
  /** Global horizontal irradiance, mean over the hour [W/m²]; NaN where unknown. */
  ghiWm2: Float64Array
  /** Rain over the hour [mm]; NaN where the file has no rain. */
  rainMm: Float64Array
  /** Per-hour {@link QualityFlag} bits. */
  quality: Uint8Array
  /** True when the file is a typical (synthetic) year assembled from months of different years. */
  typicalYear: boolean
  /** Total sky cover [%] when the file has it (optional; not used by the drying engine yet). */
  cloudCoverPct?: Float64Array
  /**
   * How each variable's value relates to its hour, keyed by reader variable name (dryBulb,
   * relativeHumidity, dewPoint, wetBulb, pressure, wind, ghi, rain, cloudCover). Instants are read
   * at the hour's labelled time (EPW: its end), interval values cover the hour. Set by the readers.
   */
  timing?: Partial<Record<string, ValueTiming>>
  /**
   * What the reader supplied rather than read (irradiance estimated from cloud cover or the daily
   * temperature range, a constant pressure), with method, source and uncertainty: the assessment lists
   * these among its assumptions.
   */
  supplied?: { name: string; value: string; source: string }[]
}

/**
 * Allocate an empty series of `hours` hours starting at `firstStartUtcMs`, every value missing. With
 * `columns` false the value columns are left empty (length 0) for the caller to assign its own.
 */
export function createEmptySeries(
  site: SiteInfo,
  firstStartUtcMs: number,
  hours: number,
  columns = true,
): HourlySeries {
  const nanColumn = (): Float64Array =>
    columns ? new Float64Array(hours).fill(Number.NaN) : new Float64Array(0)
  const startUtcMs = new Float64Array(hours)
  for (let i = 0; i < hours; i++) startUtcMs[i] = firstStartUtcMs + i * MS_PER_HOUR
  return {
    site,
    hours,
    startUtcMs,
    dryBulbC: nanColumn(),
    relativeHumidityPct: nanColumn(),
    pressureKpa: nanColumn(),
    windMs: nanColumn(),
    ghiWm2: nanColumn(),
    rainMm: nanColumn(),
    quality: new Uint8Array(hours),
    typicalYear: false,
  }
}

/** A column of `hours` missing values. */
export function missingColumn(hours: number): Float64Array {
  return new Float64Array(hours).fill(Number.NaN)
}
