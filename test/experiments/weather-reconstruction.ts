/**
 * @module test/experiments/weather-reconstruction
 * Hourly weather rebuilt from what a drying paper (or, where it says less, the climate of its place and month)
 * reports: the daily range of temperature, the humidity, the sunshine and the wind. A documented, seeded
 * generator: the same spec and seed give the same bytes on every platform. The output is an
 * {@link HourlySeries}, written by `generate.ts` in dryhours' hourly export format (`inspect --export`) as
 * `test/fixtures/experiments/weather/<id>.csv` and read back by the ordinary weather reader.
 *
 * How each hour is made (local mean solar time t = UTC + longitude/15 h):
 * - **Temperature**: each day's minimum at sunrise and maximum at 14:00 solar time, joined by half cosines
 *   (rising from sunrise to 14:00, falling from 14:00 to the next sunrise): a common two-part form, no
 *   particular source (the demo generator uses the same shape). Sunrise from the FAO-56 sunset hour angle,
 *   t = 12 − N/2 with N = 24·ωs/π (Allen et al. 1998, FAO-56 eqs 25 and 34).
 * - **Humidity**: one actual vapour pressure per day (common practice for daily data, FAO-56 ch. 3 "actual
 *   vapour pressure"), linear between solar noons so that no step appears at midnight, from the paper's or the climate's RH range by FAO-56 eq 17,
 *   e_a = [e°(Tmin)·RHmax + e°(Tmax)·RHmin]/200, from a mean RH by eq 19, e_a = RHmean/100·[e°(Tmax) +
 *   e°(Tmin)]/2, or from a dew point; RH of the hour = e_a / e°(T), at most 100 % (the dew point is then the
 *   air temperature). e° by Hyland–Wexler (ASHRAE HOF 2017 ch. 1 eq 6), as everywhere in dryhours.
 * - **Sunshine**: the day's global radiation from sunshine hours by Ångström's formula with the FAO-56
 *   default coefficients, Rs = (0.25 + 0.50·n/N)·Ra (FAO-56 eq 35), or given directly, at most the clear-sky
 *   Rso = (0.75 + 2·10⁻⁵·z)·Ra (eq 37); shared among the day's hours in proportion to each hour's
 *   extraterrestrial radiation (FAO-56 eq 28), i.e. the same clearness all day (assumption).
 * - **Wind**: the stated daily mean at the stated height, linear between solar noons, no diurnal cycle
 *   (assumption: the papers give at most a mean).
 * - **Pressure**: the standard atmosphere at the site's elevation (ASHRAE HOF 2017 ch. 1 eq 3).
 * - **Rain**: none (the trials ran to completion in dry weather; assumption stated per reconstruction).
 * - **Day-to-day variation**: first-order autoregressive anomalies (lag-one correlation `persistence`) of the
 *   daily temperatures (one anomaly for Tmax and Tmin together), the dew point, the sunshine fraction n/N and
 *   the wind (a multiplicative factor), with the standard deviations of the spec (assumptions, stated there).
 *   Set them to 0 for the plain climate normal repeated every day.
 */
import { z } from 'zod'
import { ar1Series, randomStream } from '../../climate-demo/random.ts'
import { dayOfYearAt } from '../../src/physics/calendar.ts'
import {
  daylightHours,
  extraterrestrialRadiationDailyMjM2,
  extraterrestrialRadiationForPeriodUtcMjM2,
  solarDeclinationRad,
  sunsetHourAngleRad,
  wm2FromMjPerM2Hour,
} from '../../src/physics/fao56-solar.ts'
import { clearSkyRadiationFao56 } from '../../src/physics/irradiance.ts'
import { dewPointFromVaporPressureC, standardPressureKpaAtElevation } from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { createEmptySeries, type HourlySeries } from '../../src/weather/series.ts'

const HOUR_MS = 3_600_000
const DAY_MS = 86_400_000
/** Solar hour of the daily maximum temperature (common practice, no source). */
export const MAX_TEMPERATURE_SOLAR_HOUR = 14
/** Ångström coefficients as, bs recommended by FAO-56 where no calibration exists (eq 35). */
export const ANGSTROM_A = 0.25
export const ANGSTROM_B = 0.5

/** Where a number comes from: `published` (the paper), `transcribed` (a table citing its source), `assumed`. */
const level = z.enum(['published', 'transcribed', 'memory', 'assumed'])
const sourced = z.object({ value: z.number(), source: z.string().min(1), level })
export type SourcedValue = z.infer<typeof sourced>

const humidity = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rh-range'), rhMaxPct: sourced, rhMinPct: sourced }),
  z.object({ kind: z.literal('rh-mean'), rhMeanPct: sourced }),
  z.object({ kind: z.literal('dew-point'), dewPointC: sourced }),
])
const sun = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('sunshine-hours'), hours: sourced }),
  z.object({ kind: z.literal('daily-radiation'), mjPerM2: sourced }),
])

export const reconstructionSchema = z.object({
  id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/),
  /** Experiments (ids in test/fixtures/experiments) whose runs use this weather. */
  experimentIds: z.array(z.string()).min(1),
  /** What the weather stands for and why these inputs (what the paper gave, what was assumed). */
  description: z.string().min(1),
  site: z.object({
    place: z.string(),
    latitudeDeg: z.number().min(-90).max(90),
    longitudeDeg: z.number().min(-180).max(180),
    elevationM: z.number().min(-400).max(5000),
    /** IANA zone of the site's clock (for local hours in reports). */
    timeZone: z.string(),
    source: z.string().min(1),
  }),
  /** First local (site clock) date of the file, YYYY-MM-DD; the file starts at its local midnight. */
  firstLocalDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  /** The site's UTC offset on those dates [h] (to place local midnight). */
  utcOffsetHours: z.number().min(-14).max(14),
  days: z.number().int().min(1).max(120),
  datesSource: z.string().min(1),
  temperature: z.object({ tMaxC: sourced, tMinC: sourced }),
  humidity,
  sun,
  wind: z.object({ ms: sourced, heightM: z.number().min(0.5).max(200) }),
  rain: z.string().min(1),
  variability: z.object({
    temperatureSdK: z.number().min(0).max(10),
    dewPointSdK: z.number().min(0).max(10),
    sunshineFractionSd: z.number().min(0).max(1),
    windFactorSd: z.number().min(0).max(1),
    persistence: z.number().min(0).max(0.99),
    source: z.string().min(1),
  }),
  seed: z.number().int().min(0).max(0xffffffff),
})

export type Reconstruction = z.infer<typeof reconstructionSchema>

export const reconstructionFileSchema = z.object({
  note: z.string(),
  reconstructions: z.array(reconstructionSchema).min(1),
})

/** UTC ms of local `localHour` on day `day` of the file (day 0 = `firstLocalDate`). */
export function localTimeUtcMs(spec: Reconstruction, day: number, localHour: number): number {
  const [y, m, d] = spec.firstLocalDate.split('-').map(Number)
  return Date.UTC(y, m - 1, d + day) + (localHour - spec.utcOffsetHours) * HOUR_MS
}

/**
 * UTC ms of the file's first hour: local midnight of `firstLocalDate`, or the whole UTC hour before it
 * where the site's offset is not a whole number of hours (UTC+5:30), since the export's rows are UTC hours.
 */
export function firstHourUtcMs(spec: Reconstruction): number {
  return Math.floor(localTimeUtcMs(spec, 0, 0) / HOUR_MS) * HOUR_MS
}

/** Index of the hour of the file that contains local `localHour` on day `day`. */
export function hourIndexAt(spec: Reconstruction, day: number, localHour: number): number {
  return Math.floor((localTimeUtcMs(spec, day, localHour) - firstHourUtcMs(spec)) / HOUR_MS)
}

/** Actual vapour pressure [kPa] of a day with extremes tMax, tMin from the spec's humidity (FAO-56 eqs 17, 19). */
export function dailyVaporPressureKpa(spec: Reconstruction, tMaxC: number, tMinC: number): number {
  const h = spec.humidity
  const eMax = saturationVaporPressureLiquidKpa(tMaxC)
  const eMin = saturationVaporPressureLiquidKpa(tMinC)
  switch (h.kind) {
    case 'rh-range':
      return (eMin * h.rhMaxPct.value + eMax * h.rhMinPct.value) / 200
    case 'rh-mean':
      return ((h.rhMeanPct.value / 100) * (eMax + eMin)) / 2
    case 'dew-point':
      return saturationVaporPressureLiquidKpa(h.dewPointC.value)
  }
}

/** Daylight hours N and sunrise solar hour of local day `dayOfYear` at `latDeg` (FAO-56 eqs 24, 25, 34). */
function daylight(latDeg: number, dayOfYear: number): { n: number; sunriseSolarH: number } {
  const ws = sunsetHourAngleRad((latDeg * Math.PI) / 180, solarDeclinationRad(dayOfYear))
  const n = daylightHours(ws)
  return { n, sunriseSolarH: 12 - n / 2 }
}

/** Half-cosine interpolation from a (at x = 0) to b (at x = 1). */
function halfCosine(a: number, b: number, x: number): number {
  return a + ((b - a) * (1 - Math.cos(Math.PI * x))) / 2
}

/**
 * Temperature at solar time `s` [h since the first local solar midnight] from the daily extremes. Day k runs
 * from solar midnight k·24; its minimum is at its sunrise, its maximum at 14:00.
 */
function temperatureAt(s: number, tMax: Float64Array, tMin: Float64Array, sunrise: Float64Array): number {
  const days = tMax.length
  let k = Math.floor(s / 24)
  if (k < 0) k = 0
  if (k > days - 1) k = days - 1
  const h = s - 24 * k
  const rise = sunrise[k]
  if (h < rise) {
    // falling from the previous day's maximum (or this day's, on the first day) to this sunrise
    const prev = k > 0 ? k - 1 : k
    const from = 24 * (k - 1) + MAX_TEMPERATURE_SOLAR_HOUR
    const to = 24 * k + rise
    return halfCosine(tMax[prev], tMin[k], (s - from) / (to - from))
  }
  if (h <= MAX_TEMPERATURE_SOLAR_HOUR) {
    return halfCosine(tMin[k], tMax[k], (h - rise) / (MAX_TEMPERATURE_SOLAR_HOUR - rise))
  }
  const next = k + 1 < days ? k + 1 : k
  const to = 24 * (k + 1) + sunrise[next]
  const from = 24 * k + MAX_TEMPERATURE_SOLAR_HOUR
  return halfCosine(tMax[k], tMin[next], (s - from) / (to - from))
}

/** A daily value at solar time `s` [h]: linear between day centres (solar noon), constant beyond the ends. */
function betweenDayCentres(daily: Float64Array, s: number): number {
  const x = (s - 12) / 24
  if (x <= 0) return daily[0]
  const k = Math.floor(x)
  if (k >= daily.length - 1) return daily[daily.length - 1]
  const f = x - k
  return daily[k] * (1 - f) + daily[k + 1] * f
}

/** The daily values the hours are made from (exported for the fixture test). */
export interface ReconstructedDays {
  tMaxC: Float64Array
  tMinC: Float64Array
  vaporPressureKpa: Float64Array
  /** Global radiation of the local solar day [MJ m⁻² d⁻¹]. */
  radiationMjM2: Float64Array
  windMs: Float64Array
}

/** Daily values of the reconstruction (normals plus the seeded anomalies). */
export function reconstructDays(spec: Reconstruction): ReconstructedDays {
  const n = spec.days
  const v = spec.variability
  const stream = (name: string) => randomStream(spec.seed, `${spec.id}/${name}`)
  const tAnomaly = ar1Series(stream('temperature'), n, v.persistence, v.temperatureSdK)
  const dewAnomaly = ar1Series(stream('dew-point'), n, v.persistence, v.dewPointSdK)
  const sunAnomaly = ar1Series(stream('sunshine'), n, v.persistence, v.sunshineFractionSd)
  const windAnomaly = ar1Series(stream('wind'), n, v.persistence, v.windFactorSd)
  const out: ReconstructedDays = {
    tMaxC: new Float64Array(n),
    tMinC: new Float64Array(n),
    vaporPressureKpa: new Float64Array(n),
    radiationMjM2: new Float64Array(n),
    windMs: new Float64Array(n),
  }
  const first = firstHourUtcMs(spec)
  const latRad = (spec.site.latitudeDeg * Math.PI) / 180
  // the normal's vapour pressure at the normal's extremes; each day shifts its dew point by the anomaly
  const normalVaporPressure = dailyVaporPressureKpa(
    spec,
    spec.temperature.tMaxC.value,
    spec.temperature.tMinC.value,
  )
  for (let d = 0; d < n; d++) {
    const tMax = spec.temperature.tMaxC.value + tAnomaly[d]
    const tMin = spec.temperature.tMinC.value + tAnomaly[d]
    out.tMaxC[d] = tMax
    out.tMinC[d] = tMin
    const dew = dewPointFromVaporPressureC(normalVaporPressure) + dewAnomaly[d]
    out.vaporPressureKpa[d] = saturationVaporPressureLiquidKpa(Math.min(dew, tMin))
    const j = dayOfYearAt(first + d * DAY_MS + 12 * HOUR_MS, spec.utcOffsetHours)
    const ra = extraterrestrialRadiationDailyMjM2(latRad, j)
    const rso = clearSkyRadiationFao56(ra, spec.site.elevationM)
    let rs: number
    if (spec.sun.kind === 'sunshine-hours') {
      const nDay = daylight(spec.site.latitudeDeg, j).n
      let fraction = spec.sun.hours.value / nDay + sunAnomaly[d]
      fraction = fraction < 0 ? 0 : Math.min(fraction, 1)
      rs = (ANGSTROM_A + ANGSTROM_B * fraction) * ra
    } else {
      rs = spec.sun.mjPerM2.value * (1 + sunAnomaly[d])
    }
    out.radiationMjM2[d] = Math.max(0, Math.min(rs, rso))
    out.windMs[d] = Math.max(0, spec.wind.ms.value * (1 + windAnomaly[d]))
  }
  return out
}

/** The hourly series of a reconstruction (UTC hour starts from local midnight of the first date). */
export function reconstructWeather(spec: Reconstruction): HourlySeries {
  const days = reconstructDays(spec)
  const hours = spec.days * 24
  const first = firstHourUtcMs(spec)
  const { latitudeDeg: lat, longitudeDeg: lon, elevationM } = spec.site
  const series = createEmptySeries(
    {
      name: spec.site.place,
      latitudeDeg: lat,
      longitudeDeg: lon,
      elevationM,
      timeZone: spec.site.timeZone,
      utcOffsetHours: spec.utcOffsetHours,
      windHeightM: spec.wind.heightM,
    },
    first,
    hours,
  )
  // solar time of the first hour start relative to the first local solar midnight
  const solarShiftH = lon / 15 - spec.utcOffsetHours
  const sunrise = new Float64Array(spec.days)
  for (let d = 0; d < spec.days; d++) {
    const j = dayOfYearAt(first + d * DAY_MS + 12 * HOUR_MS, spec.utcOffsetHours)
    sunrise[d] = daylight(lat, j).sunriseSolarH
  }
  // extraterrestrial radiation of every hour, and its sum per solar day, to share the day's radiation
  const raHour = new Float64Array(hours)
  const raDay = new Float64Array(spec.days + 1)
  const dayOfHour = new Int32Array(hours)
  for (let i = 0; i < hours; i++) {
    const midSolarH = i + 0.5 + solarShiftH
    let d = Math.floor(midSolarH / 24)
    if (d < 0) d = 0
    if (d > spec.days - 1) d = spec.days - 1
    dayOfHour[i] = d
    raHour[i] = extraterrestrialRadiationForPeriodUtcMjM2(first + i * HOUR_MS, lat, lon, 1)
    raDay[d] += raHour[i]
  }
  const pressure = standardPressureKpaAtElevation(elevationM)
  for (let i = 0; i < hours; i++) {
    const d = dayOfHour[i]
    const t = temperatureAt(i + 0.5 + solarShiftH, days.tMaxC, days.tMinC, sunrise)
    const s = i + 0.5 + solarShiftH
    const es = saturationVaporPressureLiquidKpa(t)
    series.dryBulbC[i] = t
    series.relativeHumidityPct[i] = Math.min(100, (100 * betweenDayCentres(days.vaporPressureKpa, s)) / es)
    series.pressureKpa[i] = pressure
    series.windMs[i] = betweenDayCentres(days.windMs, s)
    series.ghiWm2[i] = raDay[d] > 0 ? wm2FromMjPerM2Hour((days.radiationMjM2[d] * raHour[i]) / raDay[d]) : 0
    series.rainMm[i] = 0
  }
  return series
}

/** Options for reading a reconstruction's CSV back with `readWeather` (the export carries no site data). */
export function readOptionsFor(spec: Reconstruction): Record<string, unknown> {
  return {
    latitudeDeg: spec.site.latitudeDeg,
    longitudeDeg: spec.site.longitudeDeg,
    elevationM: spec.site.elevationM,
    siteTimeZone: spec.site.timeZone,
    windHeightM: spec.wind.heightM,
    siteName: spec.site.place,
  }
}
