/**
 * @module physics/fao56-solar
 * Solar geometry and extraterrestrial radiation as FAO-56 states them: Allen, Pereira, Raes & Smith
 * (1998), *Crop evapotranspiration*, FAO Irrigation and Drainage Paper 56, ch. 3, eqs 21–25 and 28–34.
 * Units: radians, MJ m⁻² per period, hours; J is the day of the year (1…366).
 *
 * FAO-56 eq 31 takes standard clock time and longitudes in degrees WEST of Greenwich
 * ({@link fao56HourAngleRad}). The engine works in UTC with east-positive longitude; since clock time
 * t = UTC − Lz/15, the eq 31 term t + (Lz − Lm)/15 equals UTC + lonEast/15, which is what
 * {@link hourAngleFromUtcRad} uses (same result, no time-zone needed; FAO writes 1/15 as 0.06667).
 */
import { dayOfYearAt } from './calendar.ts'
import { MS_PER_DAY, MS_PER_HOUR, S_PER_HOUR } from './constants.ts'

/** Solar constant [MJ m⁻² min⁻¹]; FAO-56 eq 21 (= 1366.7 W/m²). */
export const SOLAR_CONSTANT_MJ_M2_MIN = 0.082
/** Solar constant [W/m²], the same value as {@link SOLAR_CONSTANT_MJ_M2_MIN} (0.0820e6/60). */
export const SOLAR_CONSTANT_WM2 = (SOLAR_CONSTANT_MJ_M2_MIN * 1e6) / 60

/** Mean irradiance over the hour [W/m²] of an hourly amount [MJ m⁻² h⁻¹]: × 1e6 J/MJ ÷ 3600 s/h. */
export function wm2FromMjPerM2Hour(mjPerM2Hour: number): number {
  return (mjPerM2Hour * 1e6) / S_PER_HOUR
}

/** Hourly amount [MJ m⁻² h⁻¹] of a mean irradiance over the hour [W/m²]: × 3600 s/h ÷ 1e6 J/MJ. */
export function mjPerM2HourFromWm2(wm2: number): number {
  return (wm2 * S_PER_HOUR) / 1e6
}

function checkDayOfYear(j: number): void {
  if (!(j >= 1 && j <= 366)) throw new RangeError(`day of year must be between 1 and 366, got ${j}`)
}

function checkLatitudeRad(latRad: number): void {
  if (!(latRad >= -Math.PI / 2 && latRad <= Math.PI / 2)) {
    throw new RangeError(`latitude must be between -pi/2 and pi/2 rad, got ${latRad}`)
  }
}

/** Inverse relative Earth–Sun distance dr [–] = 1 + 0.033 cos(2πJ/365); FAO-56 eq 23. */
export function inverseRelativeDistanceEarthSun(dayOfYear: number): number {
  checkDayOfYear(dayOfYear)
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365)
}

/** Solar declination δ [rad] = 0.409 sin(2πJ/365 − 1.39); FAO-56 eq 24. */
export function solarDeclinationRad(dayOfYear: number): number {
  checkDayOfYear(dayOfYear)
  return 0.409 * Math.sin((2 * Math.PI * dayOfYear) / 365 - 1.39)
}

/**
 * Sunset hour angle ωs [rad] = arccos(−tanφ tanδ); FAO-56 eq 25. Beyond the polar circles the argument
 * leaves [−1, 1]: it is clamped, giving π in polar day and 0 in polar night (the geometric limit; FAO-56
 * does not treat that case).
 */
export function sunsetHourAngleRad(latRad: number, declinationRad: number): number {
  const x = -Math.tan(latRad) * Math.tan(declinationRad)
  return Math.acos(x < -1 ? -1 : Math.min(x, 1))
}

/** Daylight hours N [h] = 24 ωs/π; FAO-56 eq 34. */
export function daylightHours(sunsetHourAngle: number): number {
  return (24 * sunsetHourAngle) / Math.PI
}

/** Seasonal correction for solar time Sc [h]; FAO-56 eqs 32–33 (b = 2π(J − 81)/364). */
export function seasonalCorrectionHours(dayOfYear: number): number {
  checkDayOfYear(dayOfYear)
  const b = (2 * Math.PI * (dayOfYear - 81)) / 364
  return 0.1645 * Math.sin(2 * b) - 0.1255 * Math.cos(b) - 0.025 * Math.sin(b)
}

/** Wraps an angle [rad] to [−π, π). */
function wrapPi(a: number): number {
  return a - 2 * Math.PI * Math.floor((a + Math.PI) / (2 * Math.PI))
}

/**
 * Solar time angle ω [rad] at the midpoint of the period, FAO-56 eq 31:
 * ω = π/12 [(t + 0.06667 (Lz − Lm) + Sc) − 12], with `clockHourMid` t the standard clock time [h] of the
 * midpoint (14.5 for 14:00–15:00), `lzWestDeg` the longitude of the time-zone centre and `lmWestDeg` the
 * site longitude, both in degrees WEST of Greenwich. Wrapped to [−π, π).
 */
export function fao56HourAngleRad(
  clockHourMid: number,
  lzWestDeg: number,
  lmWestDeg: number,
  dayOfYear: number,
): number {
  const sc = seasonalCorrectionHours(dayOfYear)
  return wrapPi((Math.PI / 12) * (clockHourMid + 0.06667 * (lzWestDeg - lmWestDeg) + sc - 12))
}

/**
 * Solar time angle ω [rad] at UTC hour of day `utcHourMid` [h] for east-positive longitude `lonEastDeg`:
 * FAO-56 eq 31 with t + (Lz − Lm)/15 written as UTC + lonEast/15 (see module note). Wrapped to [−π, π).
 */
export function hourAngleFromUtcRad(utcHourMid: number, lonEastDeg: number, dayOfYear: number): number {
  const sc = seasonalCorrectionHours(dayOfYear)
  return wrapPi((Math.PI / 12) * (utcHourMid + lonEastDeg / 15 + sc - 12))
}

/**
 * Extraterrestrial radiation on a horizontal surface for a period [MJ m⁻² per period], FAO-56 eq 28:
 * Ra = (12·60/π) Gsc dr [(ω2 − ω1) sinφ sinδ + cosφ cosδ (sin ω2 − sin ω1)], with ω1,2 = ω ∓ π t1/24
 * (eqs 29–30) and `periodHours` t1 (1 for hourly). The period ends are clipped to the daylight span
 * [−ωs, ωs], as ASCE-EWRI (2005) eq 56 does (as implemented in WSWUP/RefET `ra_hourly`); FAO-56 sets
 * Ra = 0 when ω is outside ±ωs, which the clipping also gives. Never negative.
 */
export function extraterrestrialRadiationPeriodMjM2(
  latRad: number,
  dayOfYear: number,
  hourAngleMidRad: number,
  periodHours = 1,
): number {
  checkLatitudeRad(latRad)
  if (!(periodHours > 0 && periodHours <= 24)) {
    throw new RangeError(`period must be between 0 (exclusive) and 24 hours, got ${periodHours}`)
  }
  const dr = inverseRelativeDistanceEarthSun(dayOfYear)
  const dec = solarDeclinationRad(dayOfYear)
  const ws = sunsetHourAngleRad(latRad, dec)
  const half = (Math.PI * periodHours) / 24
  let w1 = hourAngleMidRad - half
  let w2 = hourAngleMidRad + half
  if (w1 < -ws) w1 = -ws
  if (w2 < -ws) w2 = -ws
  if (w1 > ws) w1 = ws
  if (w2 > ws) w2 = ws
  if (w1 >= w2) return 0
  const ra =
    ((12 * 60) / Math.PI) *
    SOLAR_CONSTANT_MJ_M2_MIN *
    dr *
    ((w2 - w1) * Math.sin(latRad) * Math.sin(dec) +
      Math.cos(latRad) * Math.cos(dec) * (Math.sin(w2) - Math.sin(w1)))
  return Math.max(ra, 0)
}

/** Daily extraterrestrial radiation Ra [MJ m⁻² d⁻¹]; FAO-56 eq 21. Example 8 (20°S, J 246): 32.2. */
export function extraterrestrialRadiationDailyMjM2(latRad: number, dayOfYear: number): number {
  checkLatitudeRad(latRad)
  const dr = inverseRelativeDistanceEarthSun(dayOfYear)
  const dec = solarDeclinationRad(dayOfYear)
  const ws = sunsetHourAngleRad(latRad, dec)
  return (
    ((24 * 60) / Math.PI) *
    SOLAR_CONSTANT_MJ_M2_MIN *
    dr *
    (ws * Math.sin(latRad) * Math.sin(dec) + Math.cos(latRad) * Math.cos(dec) * Math.sin(ws))
  )
}

/**
 * Extraterrestrial radiation on a horizontal surface for the hour (or period) starting at `startUtcMs`
 * [MJ m⁻² per period], for latitude/east longitude [°]: FAO-56 eqs 23–25, 28–33 evaluated at the period
 * midpoint; J is the day of the local mean-solar date (UTC + lon/15 h). No allocation.
 */
export function extraterrestrialRadiationForPeriodUtcMjM2(
  startUtcMs: number,
  latDeg: number,
  lonEastDeg: number,
  periodHours = 1,
): number {
  if (!Number.isFinite(startUtcMs))
    throw new RangeError(`period start must be a finite UTC ms, got ${startUtcMs}`)
  if (!(lonEastDeg >= -180 && lonEastDeg <= 180)) {
    throw new RangeError(`longitude must be between -180 and 180 degrees (east positive), got ${lonEastDeg}`)
  }
  const midMs = startUtcMs + periodHours * (MS_PER_HOUR / 2)
  const j = dayOfYearAt(midMs, lonEastDeg / 15)
  const utcHour = (((midMs % MS_PER_DAY) + MS_PER_DAY) % MS_PER_DAY) / MS_PER_HOUR
  const w = hourAngleFromUtcRad(utcHour, lonEastDeg, j)
  return extraterrestrialRadiationPeriodMjM2((latDeg * Math.PI) / 180, j, w, periodHours)
}
