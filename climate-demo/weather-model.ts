/**
 * @module climate-demo/weather-model
 * The stochastic hourly weather model behind the invented demo climates. Pure: no file system, no clock.
 *
 * Daily processes (one value per local solar day, linearly interpolated between day centres so that
 * hours change smoothly across midnight):
 * - wet/dry days: a two-state Markov chain with monthly transition probabilities (the occurrence model
 *   of Richardson 1981, Water Resour. Res. 17:182, "Stochastic simulation of daily precipitation,
 *   temperature, and solar radiation"; from memory);
 * - temperature, dew-point and pressure anomalies: AR(1) series (persistent spells);
 * - cloudiness: logistic of the site's dry-day cloud fraction plus an AR(1) anomaly, raised on wet days.
 * Hourly values:
 * - dry bulb = daily mean + anomaly + ½·diurnal range·shape(solar hour), the shape a half cosine rising
 *   from the minimum near sunrise (05:30 solar) to the maximum at 14:30 solar and a half cosine falling
 *   back (a common two-part form, no particular source); the range shrinks under cloud;
 * - dew point = monthly climatology + anomaly (partly tied to the temperature anomaly) + wet-day rise,
 *   raised over a few hours of rain toward a varying near-saturation value (at most a few K per hour),
 *   eased smoothly below the dry bulb (never above it); RH from the two by the saturation curve
 *   over liquid water (ASHRAE HOF 2017 ch. 1 eq 6, `saturationVaporPressureLiquidKpa`);
 * - GHI = hour-mean Haurwitz clear sky × Kasten–Czeplak cloud transmission (see sky.ts);
 * - wind: Weibull by a Gaussian copula on an hourly AR(1), scaled by a diurnal cycle;
 * - rain: on wet days one event of geometric length, exponential hourly amounts;
 * - station pressure: ASHRAE HOF 2017 ch. 1 eq 3 at the site elevation + synoptic anomaly + a
 *   semi-diurnal tide (peaks near 10 and 22 solar hours; Haurwitz & Cowley 1973, from memory).
 * Instantaneous variables are evaluated at the middle of each hour; GHI is the hour mean, rain the hour total.
 */
import { standardPressureKpaAtElevation } from '../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../src/physics/saturation.ts'
import { ar1Series, randomStream, standardNormalCdf } from './random.ts'
import type { DemoSite } from './sites.ts'
import { cloudTransmission, dayOfYearFraction, hourSun, monthlyValue } from './sky.ts'

const HOUR_MS = 3_600_000
const DAY_MS = 86_400_000
/** Solar hours of the daily temperature minimum and maximum (common practice, no source). */
const MIN_SOLAR_HOUR = 5.5
const MAX_SOLAR_HOUR = 14.5

/** Generated hours of one site: UTC hour starts plus one column per variable (SI). */
export interface DemoHours {
  firstStartUtcMs: number
  hours: number
  dryBulbC: Float64Array
  dewPointC: Float64Array
  relativeHumidityPct: Float64Array
  pressureKpa: Float64Array
  windMs: Float64Array
  ghiWm2: Float64Array
  extraterrestrialHorizontalWm2: Float64Array
  cloudFraction: Float64Array
  rainMm: Float64Array
}

export interface GenerateOptions {
  /** UTC start of the first hour [ms]; must be a whole hour. */
  firstStartUtcMs: number
  /** Number of hours, 1 to 400,000 (about 45 years). */
  hours: number
  /** 32-bit unsigned integer seed. */
  seed: number
}

function checkOptions(o: GenerateOptions): void {
  if (!Number.isInteger(o.firstStartUtcMs) || o.firstStartUtcMs % HOUR_MS !== 0) {
    throw new RangeError(`firstStartUtcMs must be a whole UTC hour in ms, got ${o.firstStartUtcMs}`)
  }
  if (!Number.isInteger(o.hours) || o.hours < 1 || o.hours > 400_000) {
    throw new RangeError(`hours must be an integer from 1 to 400000, got ${o.hours}`)
  }
  if (!Number.isInteger(o.seed) || o.seed < 0 || o.seed > 0xffffffff) {
    throw new RangeError(`seed must be an integer from 0 to 4294967295, got ${o.seed}`)
  }
}

/** Diurnal temperature shape in [−1, 1] at solar hour `h` (0–24). */
function diurnalShape(h: number): number {
  let x = h
  if (x < MIN_SOLAR_HOUR) x += 24
  const rise = MAX_SOLAR_HOUR - MIN_SOLAR_HOUR
  if (x <= MAX_SOLAR_HOUR) return -Math.cos((Math.PI * (x - MIN_SOLAR_HOUR)) / rise)
  return Math.cos((Math.PI * (x - MAX_SOLAR_HOUR)) / (24 - rise))
}

/** Depression below which the dew point is eased toward (never past) saturation [K] (no source; demo choice). */
const SOFT_DEPRESSION_K = 1.5

/**
 * Dew-point depression after a smooth cap of scale `scaleK`: unchanged above it, below it
 * d' = D·exp((d − D)/D), which is continuous with slope 1 at D and stays above 0, so air approaches
 * but rarely reaches saturation (fog and rain hours still reach 99–100 % after rounding).
 */
export function softDewPointDepressionK(depressionK: number, scaleK = SOFT_DEPRESSION_K): number {
  if (!(scaleK > 0)) throw new RangeError(`scaleK must be above 0 K, got ${scaleK}`)
  if (depressionK >= scaleK) return depressionK
  return scaleK * Math.exp((depressionK - scaleK) / scaleK)
}

/**
 * Hour-to-hour variation of the cap scale: D·exp(SD·x) for an hourly AR(1) x of unit variance, so
 * near-saturated hours do not sit at one rounded RH for long (no source; demo choice).
 */
const SOFT_SCALE_LOG_SD = 0.35
const SOFT_SCALE_PHI = 0.6

/** Share of the rain-hour wetting gained per rain hour (no source; demo choice). */
const RAIN_WETTING_PER_HOUR = 0.35
/** Share of the wetting kept per dry hour after rain (no source; demo choice). */
const RAIN_DRYING_KEEP_PER_HOUR = 0.7
/** Largest change of the rain-driven dew-point excess per hour [K] (no source; demo choice). */
const RAIN_DEW_POINT_STEP_K = 2.5
/**
 * Mean, standard deviation and hourly persistence of the rain-hour dew-point depression [K] before the
 * smooth cap ({@link softDewPointDepressionK}); below zero the cap brings air close to, never at,
 * saturation, so rain hours spread over about 93–99 % RH instead of one value (no source; demo choice).
 */
const RAIN_DEPRESSION_MEAN_K = -0.6
const RAIN_DEPRESSION_SD_K = 0.9
const RAIN_DEPRESSION_PHI = 0.8

/**
 * Rain wetness per hour in [0, 1]: rises by {@link RAIN_WETTING_PER_HOUR} each rain hour (so a long
 * event saturates the air over about three hours) and decays by {@link RAIN_DRYING_KEEP_PER_HOUR}
 * each hour after it.
 */
export function rainWetness(rainMm: Float64Array): Float64Array {
  const out = new Float64Array(rainMm.length)
  let w = 0
  for (let k = 0; k < rainMm.length; k++) {
    w = rainMm[k] > 0 ? Math.min(1, w + RAIN_WETTING_PER_HOUR) : w * RAIN_DRYING_KEEP_PER_HOUR
    out[k] = w
  }
  return out
}

const logit = (p: number): number => Math.log(p / (1 - p))
const logistic = (x: number): number => 1 / (1 + Math.exp(-x))
const clamp = (x: number, lo: number, hi: number): number => Math.min(Math.max(x, lo), hi)

/** Daily state of a site, one entry per solar day from `firstDay`. */
interface DailyState {
  firstDay: number
  wet: Uint8Array
  meanC: Float64Array
  rangeK: Float64Array
  dewC: Float64Array
  cloud: Float64Array
  pressureAnomalyKpa: Float64Array
}

function generateDays(site: DemoSite, firstDay: number, days: number, seed: number): DailyState {
  const s = (name: string) => randomStream(seed, `${site.id}/${name}`)
  const wetStream = s('wet-days')
  const tAnom = ar1Series(s('dry-bulb-anomaly'), days, site.dryBulbAnomalyPhi, site.dryBulbAnomalySdK)
  const dAnom = ar1Series(s('dew-point-anomaly'), days, site.dewPointAnomalyPhi, site.dewPointAnomalySdK)
  const cAnom = ar1Series(s('cloud-anomaly'), days, 0.6, 0.9)
  const pAnom = ar1Series(s('pressure-anomaly'), days, 0.8, site.pressureAnomalySdKpa)
  const state: DailyState = {
    firstDay,
    wet: new Uint8Array(days),
    meanC: new Float64Array(days),
    rangeK: new Float64Array(days),
    dewC: new Float64Array(days),
    cloud: new Float64Array(days),
    pressureAnomalyKpa: pAnom,
  }
  let wetYesterday = false
  for (let i = 0; i < days; i++) {
    const doy = dayOfYearFraction((firstDay + i + 0.5) * DAY_MS)
    const pWet = monthlyValue(wetYesterday ? site.wetAfterWetProb : site.wetAfterDryProb, doy)
    const wet = wetStream.uniform() < pWet
    wetYesterday = wet
    state.wet[i] = wet ? 1 : 0
    const cloudDry = monthlyValue(site.cloudFractionDry, doy)
    const cloud = logistic(logit(cloudDry) + cAnom[i] + (wet ? 2.2 : 0))
    state.cloud[i] = cloud
    // Diurnal range shrinks under cloud; 1 at the dry-day climatological cloud (common practice, no source).
    const rangeFactor = clamp((1 - 0.7 * cloud) / (1 - 0.7 * cloudDry), 0.3, 1.4)
    state.rangeK[i] = monthlyValue(site.diurnalRangeK, doy) * rangeFactor
    state.meanC[i] = monthlyValue(site.dryBulbMeanC, doy) + tAnom[i] - (wet ? 0.6 * site.rainCoolingK : 0)
    state.dewC[i] =
      monthlyValue(site.dewPointMeanC, doy) + dAnom[i] + 0.4 * tAnom[i] + (wet ? site.wetDayDewPointRiseK : 0)
    if (wet) state.pressureAnomalyKpa[i] -= 0.5 * site.pressureAnomalySdKpa
  }
  return state
}

/** Linear interpolation of a daily array at solar time `solarDays` (day centres at d + 0.5). */
function atTime(values: Float64Array, firstDay: number, solarDays: number): number {
  const x = solarDays - 0.5 - firstDay
  const i = Math.floor(x)
  const f = x - i
  return values[i] * (1 - f) + values[i + 1] * f
}

/** Rain per hour from the wet days: one event per wet day, geometric length, exponential amounts. */
function generateRain(site: DemoSite, days: DailyState, o: GenerateOptions, lonDays: number): Float64Array {
  const rain = new Float64Array(o.hours)
  const stream = randomStream(o.seed, `${site.id}/rain-events`)
  const pStop = 1 / site.rainEventMeanHours
  for (let i = 0; i < days.wet.length; i++) {
    const u1 = stream.uniform()
    const u2 = stream.uniform()
    let length = 1
    while (stream.uniform() > pStop && length < 24) length++
    if (!days.wet[i]) continue
    const startHour =
      site.rainStartSolarHour === null
        ? Math.floor(u1 * 24)
        : Math.round(site.rainStartSolarHour + 4 * (u1 + u2 - 1)) // triangular ±4 h
    const doy = dayOfYearFraction((days.firstDay + i + 0.5) * DAY_MS)
    const meanMm = monthlyValue(site.rainPerWetHourMm, doy)
    for (let h = 0; h < length; h++) {
      const solarDays = days.firstDay + i + (startHour + h + 0.5) / 24
      const k = Math.round(((solarDays - lonDays) * DAY_MS - HOUR_MS / 2 - o.firstStartUtcMs) / HOUR_MS)
      const amount = -meanMm * Math.log(1 - stream.uniform())
      if (k >= 0 && k < o.hours) rain[k] += Math.max(0.1, Math.round(amount * 10) / 10)
    }
  }
  return rain
}

/**
 * Generate `o.hours` hours of invented weather for `site` from `o.firstStartUtcMs`, deterministically
 * from `o.seed`. Each random process has its own stream named after the site and the process.
 */
export function generateSiteHours(site: DemoSite, o: GenerateOptions): DemoHours {
  checkOptions(o)
  const lonDays = site.longitudeDeg / 360
  const firstSolar = o.firstStartUtcMs / DAY_MS + lonDays
  const firstDay = Math.floor(firstSolar) - 1
  const dayCount = Math.ceil(firstSolar + o.hours / 24) - firstDay + 2
  const days = generateDays(site, firstDay, dayCount, o.seed)
  const rain = generateRain(site, days, o, lonDays)
  const n = o.hours
  const out: DemoHours = {
    firstStartUtcMs: o.firstStartUtcMs,
    hours: n,
    dryBulbC: new Float64Array(n),
    dewPointC: new Float64Array(n),
    relativeHumidityPct: new Float64Array(n),
    pressureKpa: new Float64Array(n),
    windMs: new Float64Array(n),
    ghiWm2: new Float64Array(n),
    extraterrestrialHorizontalWm2: new Float64Array(n),
    cloudFraction: new Float64Array(n),
    rainMm: rain,
  }
  const hourly = (name: string, phi: number, sd: number) =>
    ar1Series(randomStream(o.seed, `${site.id}/${name}`), n, phi, sd)
  const tNoise = hourly('dry-bulb-hourly', 0.85, 0.4)
  const dNoise = hourly('dew-point-hourly', 0.85, 0.5)
  const cNoise = hourly('cloud-hourly', 0.8, 0.12)
  const wNoise = hourly('wind-hourly', 0.85, 1)
  const rainDepressionNoise = hourly('rain-depression-hourly', RAIN_DEPRESSION_PHI, RAIN_DEPRESSION_SD_K)
  const softScale = hourly('soft-cap-scale-hourly', SOFT_SCALE_PHI, SOFT_SCALE_LOG_SD)
  const wetness = rainWetness(rain)
  const p0 = standardPressureKpaAtElevation(site.elevationM)
  let rainExcessK = 0
  for (let k = 0; k < n; k++) {
    const startMs = o.firstStartUtcMs + k * HOUR_MS
    const midMs = startMs + HOUR_MS / 2
    const solar = midMs / DAY_MS + lonDays
    const solarHour = (solar - Math.floor(solar)) * 24
    const doy = dayOfYearFraction(midMs)
    const dayIndex = Math.floor(solar) - firstDay
    const raining = rain[k] > 0
    let cloud = clamp(atTime(days.cloud, firstDay, solar) + cNoise[k], 0, 1)
    if (raining) cloud = Math.max(cloud, 0.92)
    let t =
      atTime(days.meanC, firstDay, solar) +
      0.5 * atTime(days.rangeK, firstDay, solar) * diurnalShape(solarHour)
    t += tNoise[k] - wetness[k] * 0.4 * site.rainCoolingK
    const tdBase = atTime(days.dewC, firstDay, solar) + dNoise[k]
    // Rain moistens the air over hours: the dew point moves a `wetness` share of the way toward its
    // rain-hour value (a varying depression, before the smooth cap below), by at most
    // RAIN_DEW_POINT_STEP_K per hour up or down.
    const rainTargetC = t - (RAIN_DEPRESSION_MEAN_K + rainDepressionNoise[k])
    const excessTargetK = wetness[k] * Math.max(0, rainTargetC - tdBase)
    rainExcessK = clamp(
      excessTargetK,
      rainExcessK - RAIN_DEW_POINT_STEP_K,
      rainExcessK + RAIN_DEW_POINT_STEP_K,
    )
    let td =
      t - softDewPointDepressionK(t - (tdBase + rainExcessK), SOFT_DEPRESSION_K * Math.exp(softScale[k]))
    // Round as the files will carry them, so RH agrees with the written dry bulb and dew point.
    t = Math.round(t * 10) / 10
    td = Math.round(td * 10) / 10
    out.dryBulbC[k] = t
    out.dewPointC[k] = td
    out.relativeHumidityPct[k] = Math.min(
      100,
      (100 * saturationVaporPressureLiquidKpa(td)) / saturationVaporPressureLiquidKpa(t),
    )
    const tide = site.pressureTideKpa * Math.cos((4 * Math.PI * (solarHour - 10)) / 24)
    out.pressureKpa[k] = p0 + atTime(days.pressureAnomalyKpa, firstDay, solar) + tide
    const u = clamp(standardNormalCdf(wNoise[k]), 1e-9, 1 - 1e-9)
    const diurnal = 1 + site.windDiurnalAmplitude * Math.cos((2 * Math.PI * (solarHour - 15)) / 24)
    const stormy = days.wet[dayIndex] ? 1.15 : 1
    const weibull = (-Math.log(1 - u)) ** (1 / site.windShape)
    out.windMs[k] = Math.min(35, monthlyValue(site.windScaleMs, doy) * diurnal * stormy * weibull)
    const sun = hourSun(startMs, site.latitudeDeg, site.longitudeDeg, doy + 1)
    out.ghiWm2[k] = sun.clearSkyGhiWm2 * cloudTransmission(cloud)
    out.extraterrestrialHorizontalWm2[k] = sun.extraterrestrialHorizontalWm2
    out.cloudFraction[k] = cloud
  }
  return out
}
