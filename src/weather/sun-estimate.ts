/**
 * @module weather/sun-estimate
 * No irradiance column is not no sun. Hours without irradiance (the whole column, or gaps longer
 * than the short-gap rule fills) are estimated from what the file has, and flagged
 * {@link QualityFlag.irradianceEstimated}:
 *
 * 1. Cloud cover of the hour: Kasten & Czeplak (1980), G = G₀·(1 − 0.75·(N/8)^3.4), with their
 *    clear-sky G₀ = 910·sin h − 30 W/m² (N in oktas, h the sun's altitude).
 * 2. Otherwise the day's temperature range: the daily global radiation of Hargreaves & Samani
 *    (1982) as FAO-56 eq 50 gives it, Rs = kRs·√(Tmax − Tmin)·Ra (Allen et al. 1998), at most the
 *    clear-sky Rso of FAO-56 eq 37, spread over the day's hours in proportion to clear-sky
 *    irradiance (Haurwitz 1945, the shape the short-gap filler uses).
 * 3. Otherwise the hour stays missing; the engine states how many daylight hours it took as 0.
 *
 * Night hours (sun below the horizon for the whole hour) are 0. The site's latitude and longitude
 * are needed for any of it.
 */
import { dayOfYearAt } from '../physics/calendar.ts'
import { MS_PER_DAY, MS_PER_HOUR, S_PER_HOUR } from '../physics/constants.ts'
import { extraterrestrialRadiationDailyMjM2 } from '../physics/fao56-solar.ts'
import {
  clearSkyRadiationFao56,
  clearSkyGhiHaurwitzCosZenithWm2 as haurwitzClearSkyWm2,
} from '../physics/irradiance.ts'
import { sinGeometricSunAltitude } from '../physics/sun.ts'
import { type HourlySeries, QualityFlag } from './series.ts'

/**
 * Kasten & Czeplak (1980), "Solar and terrestrial radiation dependent on the amount and type of
 * cloud", Solar Energy 24:177–189: global irradiance under N oktas of cloud is G₀·(1 − A·(N/8)^B)
 * with A = 0.75, B = 3.4, and the clear-sky G₀ = C·sin h − D with C = 910 W/m², D = 30 W/m², fitted to
 * ten years (1964–1973) of hourly Hamburg data. Constants as quoted by several implementations and
 * summaries of the paper (the original was not available to read here).
 */
export const KASTEN_CZEPLAK = { a: 0.75, b: 3.4, clearSlopeWm2: 910, clearInterceptWm2: 30 } as const

/**
 * FAO-56 eq 50 adjustment coefficient kRs [°C^−0.5] (Allen et al. 1998, ch. 3): 0.16 for interior
 * locations, 0.19 for coastal ones (air masses influenced by a nearby large water body). Interior
 * is used; a coastal site gets about 19 % more sun from the same range.
 */
export const KRS_INTERIOR = 0.16
export const KRS_COASTAL = 0.19

/**
 * Hours of dry bulb a day needs for its range to be taken (its maximum and minimum can otherwise
 * fall in the missing hours). Common practice, no source.
 */
export const MIN_HOURS_FOR_DAILY_RANGE = 20

/** What was estimated, for the reading's account and the assessment's assumptions. */
export interface IrradianceEstimate {
  /** Daylight hours given an estimate. */
  hours: number
  fromCloudCover: number
  fromTemperatureRange: number
  /** Daylight hours still without irradiance (nothing to estimate from). */
  daylightHoursLeft: number
  /** Column source text for the account ('estimated: …'). */
  source: string
  warnings: string[]
  /** Sentences for the assumptions (method, source, uncertainty). */
  notes: string[]
  /** The same as assumption entries (name, value, source) for the assessment. */
  supplied: { name: string; value: string; source: string }[]
}

/** Global irradiance of Kasten & Czeplak (1980) for N oktas at a sun altitude with sine `sinH` [W/m²]. */
export function kastenCzeplakWm2(sinH: number, oktas: number): number {
  const clear = Math.max(0, KASTEN_CZEPLAK.clearSlopeWm2 * sinH - KASTEN_CZEPLAK.clearInterceptWm2)
  const n = Math.min(8, Math.max(0, oktas))
  return clear * (1 - KASTEN_CZEPLAK.a * Math.exp(KASTEN_CZEPLAK.b * Math.log(n / 8 || 1e-300)))
}

/**
 * Daily global radiation Rs [MJ m⁻² d⁻¹] from the temperature range: FAO-56 eq 50,
 * Rs = kRs·√(Tmax − Tmin)·Ra (Hargreaves & Samani 1982), limited to Rso = (0.75 + 2·10⁻⁵·z)·Ra
 * (FAO-56 eq 37). FAO-56 Example 15: 45°43'N, Ra 40.6, Tmax 26.6, Tmin 14.8, kRs 0.16 → 22.3.
 */
export function hargreavesSamaniDailyMjM2(
  tMaxC: number,
  tMinC: number,
  raMjM2: number,
  kRs = KRS_INTERIOR,
  elevationM = 0,
): number {
  const range = Math.max(0, tMaxC - tMinC)
  const rs = kRs * Math.sqrt(range) * raMjM2
  return Math.min(rs, clearSkyRadiationFao56(raMjM2, elevationM))
}

/** Mean over the hour starting at `t` of f(sin altitude), by Simpson's rule (start, middle, end). */
function hourMean(t: number, lat: number, lon: number, f: (sinH: number) => number): number {
  const a = sinGeometricSunAltitude(t, lat, lon)
  const m = sinGeometricSunAltitude(t + MS_PER_HOUR / 2, lat, lon)
  const b = sinGeometricSunAltitude(t + MS_PER_HOUR, lat, lon)
  if (a <= 0 && m <= 0 && b <= 0) return 0
  return (f(a) + 4 * f(m) + f(b)) / 6
}

/**
 * Estimate the missing irradiance of `series` in place (see the module). Returns null when nothing
 * is missing by day, or when the site's position is unknown (with a warning, through the result).
 */
export function estimateMissingIrradiance(
  series: HourlySeries,
  context: { hasIrradianceColumn: boolean; kRs?: number },
): IrradianceEstimate | null {
  const n = series.hours
  const ghi = series.ghiWm2
  let missing = 0
  for (let s = 0; s < n; s++) if (Number.isNaN(ghi[s])) missing++
  if (missing === 0) return null
  const lat = series.site.latitudeDeg
  const lon = series.site.longitudeDeg
  const what = context.hasIrradianceColumn ? 'hours without irradiance' : 'the file has no irradiance column'
  if (lat === null || lon === null) {
    return {
      hours: 0,
      fromCloudCover: 0,
      fromTemperatureRange: 0,
      daylightHoursLeft: missing,
      source: '',
      warnings: [
        `${what}: the sun cannot be estimated without the site's latitude and longitude (give --lat and --lon)`,
      ],
      notes: [],
      supplied: [],
    }
  }
  const kRs = context.kRs ?? KRS_INTERIOR
  // clear-sky irradiance of the hours the cloud pass looked at, reused by the range pass
  const clear = new Float64Array(n)
  const fromCloud = estimateFromCloudCover(series, lat, lon, clear)
  const range = estimateFromTemperatureRange(series, lat, lon, clear, kRs)
  return describeEstimate(what, fromCloud, range.estimated, range.left, kRs)
}

/** 1. Cloud cover, hour by hour; night hours are 0. Returns the daylight hours estimated. */
function estimateFromCloudCover(series: HourlySeries, lat: number, lon: number, clear: Float64Array): number {
  const n = series.hours
  const ghi = series.ghiWm2
  const cloud = series.cloudCoverPct
  const quality = series.quality
  let fromCloud = 0
  for (let s = 0; s < n; s++) {
    if (!Number.isNaN(ghi[s])) continue
    const t = series.startUtcMs[s]
    clear[s] = hourMean(t, lat, lon, haurwitzClearSkyWm2)
    if (clear[s] === 0) {
      ghi[s] = 0
      quality[s] |= QualityFlag.irradianceEstimated
      continue
    }
    const c = cloud?.[s]
    if (c !== undefined && !Number.isNaN(c)) {
      ghi[s] = hourMean(t, lat, lon, (x) => kastenCzeplakWm2(x, c / 12.5))
      quality[s] |= QualityFlag.irradianceEstimated
      fromCloud++
    }
  }
  return fromCloud
}

/**
 * 2. The day's temperature range (days of local mean solar time), for the hours still missing: a
 * complete day's Hargreaves–Samani total spread in the clear-sky shape. Returns the hours estimated
 * and the daylight hours left without a value.
 */
function estimateFromTemperatureRange(
  series: HourlySeries,
  lat: number,
  lon: number,
  clear: Float64Array,
  kRs: number,
): { estimated: number; left: number } {
  const n = series.hours
  const ghi = series.ghiWm2
  const quality = series.quality
  const elevation = series.site.elevationM ?? 0
  const solarOffsetMs = (lon / 15) * MS_PER_HOUR
  let fromRange = 0
  let left = 0
  let s = 0
  while (s < n) {
    const day = Math.floor((series.startUtcMs[s] + solarOffsetMs) / MS_PER_DAY)
    let e = s
    let tMax = Number.NEGATIVE_INFINITY
    let tMin = Number.POSITIVE_INFINITY
    let withTemperature = 0
    let needed = 0
    let clearSum = 0
    while (e < n && Math.floor((series.startUtcMs[e] + solarOffsetMs) / MS_PER_DAY) === day) {
      const t = series.dryBulbC[e]
      if (!Number.isNaN(t)) {
        withTemperature++
        if (t > tMax) tMax = t
        if (t < tMin) tMin = t
      }
      if (Number.isNaN(ghi[e])) needed++
      e++
    }
    if (needed > 0) {
      const complete = withTemperature >= MIN_HOURS_FOR_DAILY_RANGE && e - s === 24
      if (complete) {
        for (let k = s; k < e; k++) {
          if (clear[k] === 0 && !Number.isNaN(ghi[k]))
            clear[k] = hourMean(series.startUtcMs[k], lat, lon, haurwitzClearSkyWm2)
          clearSum += clear[k]
        }
        const j = dayOfYearAt(day * MS_PER_DAY)
        const ra = extraterrestrialRadiationDailyMjM2((lat * Math.PI) / 180, j)
        const rsMj = hargreavesSamaniDailyMjM2(tMax, tMin, ra, kRs, elevation)
        for (let k = s; k < e; k++) {
          if (!Number.isNaN(ghi[k])) continue
          ghi[k] = clearSum > 0 ? (rsMj * 1e6 * clear[k]) / (S_PER_HOUR * clearSum) : 0
          quality[k] |= QualityFlag.irradianceEstimated
          fromRange++
        }
      } else for (let k = s; k < e; k++) if (Number.isNaN(ghi[k])) left++
    }
    s = e
  }
  return { estimated: fromRange, left }
}

/** What was estimated, in warnings, assumption notes and supplied entries. */
function describeEstimate(
  what: string,
  fromCloud: number,
  fromRange: number,
  left: number,
  kRs: number,
): IrradianceEstimate {
  const hours = fromCloud + fromRange
  const warnings: string[] = []
  const notes: string[] = []
  const parts: string[] = []
  const supplied: IrradianceEstimate['supplied'] = []
  if (fromCloud > 0) {
    parts.push(`${fromCloud} from cloud cover`)
    supplied.push({
      name: 'irradiance estimated from cloud cover',
      value: `${fromCloud} daylight hours (flag irradianceEstimated): G = (910·sin h − 30)·(1 − 0.75·(N/8)^3.4) W/m²; uncertainty: the mean for a cloud amount, single hours scatter widely; acceptable for monthly sums, not hour by hour`,
      source:
        'Kasten & Czeplak 1980, Solar Energy 24:177 (constants as quoted by implementations of the paper); Hay 1993, Renewable Energy 3:357',
    })
    notes.push(
      `irradiance estimated from cloud cover in ${fromCloud} daylight hours: Kasten & Czeplak (1980, Solar Energy 24:177), ` +
        'G = (910·sin h − 30)·(1 − 0.75·(N/8)^3.4) W/m², fitted to ten years of hourly Hamburg data. ' +
        'Uncertainty: it gives the mean irradiance for a cloud amount; single hours at the same cloud amount scatter widely ' +
        'around it, and the coefficients are regional (later studies refitted them for other climates). Monthly sums are the ' +
        'level at which such cloud-based estimates are acceptable (Hay 1993, Renewable Energy 3:357); hour-by-hour figures are not.',
    )
  }
  if (fromRange > 0) {
    parts.push(`${fromRange} from the daily temperature range`)
    supplied.push({
      name: 'irradiance estimated from the daily temperature range',
      value: `${fromRange} daylight hours (flag irradianceEstimated): Rs = ${kRs}·√(Tmax − Tmin)·Ra per day (kRs ${kRs} interior, ${KRS_COASTAL} coastal), at most Rso, spread in the clear-sky shape; uncertainty: the method is meant for sums over 7–10 days, not single days (a handbook chapter built on FAO-56, read in an online copy); clouds within a day are not represented`,
      source:
        'Hargreaves & Samani 1982; Allen et al. 1998, FAO-56 eqs 21, 37, 50; Haurwitz 1945 (clear-sky shape)',
    })
    notes.push(
      `irradiance estimated from the daily temperature range in ${fromRange} daylight hours: Hargreaves & Samani (1982), ` +
        `FAO-56 eq 50 (Allen et al. 1998), Rs = ${kRs}·√(Tmax − Tmin)·Ra (kRs ${kRs} for an interior site; ${KRS_COASTAL} near a coast), ` +
        'at most the clear-sky Rso (FAO-56 eq 37), spread over the day in the shape of clear-sky irradiance (Haurwitz 1945). ' +
        'Uncertainty: the temperature method is meant for sums over 7–10 days, not day by day (caution with daily ' +
        'computations, in a handbook chapter built on FAO-56, read in an online copy; its attribution from memory); within a day every hour ' +
        'follows the clear-sky shape, so passing clouds and showers are not represented; a range taken from hourly readings ' +
        'is slightly smaller than the thermometer range, so the estimate leans low.',
    )
  }
  if (hours > 0)
    warnings.push(
      `${what}: irradiance estimated for ${hours} daylight hours (${parts.join(', ')}), flagged as estimated; see the assumptions for the method and its uncertainty`,
    )
  if (left > 0)
    warnings.push(
      `${left} daylight hours have no irradiance and nothing to estimate it from (no cloud cover, no complete day of temperatures)`,
    )
  return {
    hours,
    fromCloudCover: fromCloud,
    fromTemperatureRange: fromRange,
    daylightHoursLeft: left,
    source:
      fromCloud > 0 && fromRange > 0
        ? 'estimated: cloud cover (Kasten & Czeplak 1980) and daily temperature range (FAO-56 eq 50)'
        : fromCloud > 0
          ? 'estimated: cloud cover (Kasten & Czeplak 1980)'
          : 'estimated: daily temperature range (Hargreaves & Samani 1982, FAO-56 eq 50)',
    warnings,
    notes,
    supplied,
  }
}
