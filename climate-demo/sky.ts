/**
 * @module climate-demo/sky
 * Sun geometry, clear-sky and cloudy-sky irradiance for the demo generator, and the monthly-table
 * interpolation it uses for every seasonal climatology.
 */
import * as SunCalc from 'suncalc'
import type { MonthlyTable } from './sites.ts'

/** Solar constant [W/m²] as used by FAO-56 (Allen et al. 1998, eq 28: Gsc = 0.0820 MJ m⁻² min⁻¹ ≈ 1367 W/m²). */
export const SOLAR_CONSTANT_WM2 = 1367

/**
 * Haurwitz clear-sky global horizontal irradiance [W/m²] for apparent solar altitude `altitudeDeg`:
 * GHI = 1098·cosZ·exp(−0.059/cosZ) (Haurwitz 1945; as given by Reno, Hansen & Stein 2012, SAND2012-2389).
 * Zero with the sun at or below the horizon.
 */
export function haurwitzClearSkyGhiWm2(altitudeDeg: number): number {
  if (!(altitudeDeg > 0)) return 0
  const cosZenith = Math.sin((altitudeDeg * Math.PI) / 180)
  return 1098 * cosZenith * Math.exp(-0.059 / cosZenith)
}

/**
 * Cloud attenuation of global irradiance, G/G_clear = 1 − 0.75·N^3.4 for cloud fraction N (0–1);
 * Kasten & Czeplak (1980), Solar Energy 24:177–189 (from memory).
 */
export function cloudTransmission(cloudFraction: number): number {
  return 1 - 0.75 * cloudFraction ** 3.4
}

/** Inverse relative Earth–Sun distance factor dr = 1 + 0.033·cos(2πJ/365), FAO-56 eq 23. */
export function inverseRelativeDistance(dayOfYear: number): number {
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365)
}

/** Number of sub-steps per hour at which the sun is evaluated to form hour means. */
export const SUN_SUBSTEPS_PER_HOUR = 4

/** Hour-mean clear-sky and extraterrestrial horizontal irradiance for the hour starting at `startUtcMs`. */
export interface HourSun {
  clearSkyGhiWm2: number
  extraterrestrialHorizontalWm2: number
  /** Apparent solar altitude at mid-hour [degrees] (suncalc 2.0.2, refraction included). */
  midAltitudeDeg: number
}

/**
 * Sun for one hour: solar altitude from suncalc 2.0.2 `getPosition` (degrees) at the middle of each of
 * {@link SUN_SUBSTEPS_PER_HOUR} sub-intervals, Haurwitz clear sky and Gsc·dr·sin(altitude) averaged over
 * them. Altitudes at or below 0 count as night (suncalc v2 biases negative altitudes upward).
 */
export function hourSun(
  startUtcMs: number,
  latitudeDeg: number,
  longitudeDeg: number,
  dayOfYear: number,
): HourSun {
  const stepMs = 3_600_000 / SUN_SUBSTEPS_PER_HOUR
  const etNormal = SOLAR_CONSTANT_WM2 * inverseRelativeDistance(dayOfYear)
  let clear = 0
  let extra = 0
  for (let j = 0; j < SUN_SUBSTEPS_PER_HOUR; j++) {
    const alt = SunCalc.getPosition(
      new Date(startUtcMs + (j + 0.5) * stepMs),
      latitudeDeg,
      longitudeDeg,
    ).altitude
    if (alt > 0) {
      clear += haurwitzClearSkyGhiWm2(alt)
      extra += etNormal * Math.sin((alt * Math.PI) / 180)
    }
  }
  const mid = SunCalc.getPosition(new Date(startUtcMs + 1_800_000), latitudeDeg, longitudeDeg).altitude
  return {
    clearSkyGhiWm2: clear / SUN_SUBSTEPS_PER_HOUR,
    extraterrestrialHorizontalWm2: extra / SUN_SUBSTEPS_PER_HOUR,
    midAltitudeDeg: mid,
  }
}

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]
const MID_MONTH_DAY: number[] = []
{
  let start = 0
  for (const days of DAYS_IN_MONTH) {
    MID_MONTH_DAY.push(start + days / 2)
    start += days
  }
}

/**
 * Value of a monthly table on fractional day of year `dayOfYear` (0 = 1 January 00:00, 365 = end of a
 * 365-day year): linear between mid-month points, periodic over the year, so seasons change smoothly.
 */
export function monthlyValue(table: MonthlyTable, dayOfYear: number): number {
  const d = ((dayOfYear % 365) + 365) % 365
  let i = 11
  for (let m = 0; m < 12; m++) {
    if (MID_MONTH_DAY[m] <= d) i = m
  }
  const j = (i + 1) % 12
  let a = MID_MONTH_DAY[i]
  let b = MID_MONTH_DAY[j]
  let x = d
  if (d < MID_MONTH_DAY[0]) {
    a -= 365 // wrap: between mid-December of the previous year and mid-January
  } else if (b < a) b += 365
  if (x < a) x += 365
  const f = (x - a) / (b - a)
  return table[i] * (1 - f) + table[j] * f
}

/** Fractional day of year (0 at 1 January 00:00 UTC) of `utcMs`, scaled to 365 days in leap years. */
export function dayOfYearFraction(utcMs: number): number {
  const year = new Date(utcMs).getUTCFullYear()
  const start = Date.UTC(year, 0, 1)
  const length = Date.UTC(year + 1, 0, 1) - start
  return ((utcMs - start) / length) * 365
}
