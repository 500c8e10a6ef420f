/**
 * @module physics/sun
 * Sun position for a place and a UTC instant.
 *
 * Conventions (suncalc 2.0.2, which this module wraps and matches): angles in degrees, azimuth
 * clockwise from north (0 = N, 90 = E, 180 = S, 270 = W), altitude apparent (refraction included by
 * Meeus 1998, *Astronomical Algorithms* 2nd ed., eq 16.4 at standard conditions). suncalc clamps the
 * refraction argument at 0°, so every altitude below the horizon is raised by about 0.48°: treat
 * altitude < 0 as night and do not read below-horizon altitudes as geometric.
 *
 * Hourly weather values describe an interval; evaluate the sun at the interval's middle
 * ({@link intervalMidpointUtcMs}; hour start + 30 min for hour-long values).
 *
 * {@link sunPosition} calls suncalc (it allocates a Date and result objects per call: ~1.4 million
 * positions/s measured on the project machine; the column path about 3–4 million/s). {@link sunAltitudeColumn} and {@link sunPositionColumns}
 * are the engine's path: the same published algorithm (Meeus 1998 ch. 25 low-accuracy solar
 * coordinates, eq 12.4 sidereal time, eq 16.4 refraction, Espenak & Meeus ΔT fit for 2005–2050, all as
 * in suncalc 2.0.2) written out without allocation, and checked against suncalc in the tests.
 */
import * as SunCalc from 'suncalc'
import { MS_PER_DAY, MS_PER_HOUR, S_PER_DAY } from './constants.ts'

/** Julian day of the Unix epoch 1970-01-01 00:00 UT minus 0.5 (Meeus 1998 ch. 7), as used by suncalc. */
const JULIAN_DAY_1970 = 2440588
/** Julian day of the J2000.0 epoch (2000-01-01 12:00 TT); Meeus 1998 ch. 21. */
const JULIAN_DAY_2000 = 2451545
const RAD = Math.PI / 180

/** Sun position in the suncalc 2 convention: degrees, azimuth clockwise from north, apparent altitude. */
export interface SunPosition {
  /** Apparent altitude above the horizon [°], refraction included; < 0 means night. */
  altitudeDeg: number
  /** Azimuth [°] clockwise from north. */
  azimuthDeg: number
}

function checkLatLon(latDeg: number, lonDeg: number): void {
  if (!(latDeg >= -90 && latDeg <= 90)) {
    throw new RangeError(`latitude must be between -90 and 90 degrees, got ${latDeg}`)
  }
  if (!(lonDeg >= -180 && lonDeg <= 180)) {
    throw new RangeError(`longitude must be between -180 and 180 degrees (east positive), got ${lonDeg}`)
  }
}

function checkInstant(utcMs: number): void {
  if (!Number.isFinite(utcMs)) throw new RangeError(`UTC instant must be a finite number of ms, got ${utcMs}`)
}

/**
 * Sun position at the UTC instant `utcMs` [ms since 1970-01-01T00:00Z] for latitude `latDeg` [°, north
 * positive] and longitude `lonDeg` [°, east positive], via suncalc 2.0.2 `getPosition`.
 * Example (Reda & Andreas 2004 SPA example, 2003-10-17T19:30:30Z, 39.742476 N, 105.1786 W):
 * altitude ≈ 39.892°, azimuth ≈ 194.339°.
 */
export function sunPosition(utcMs: number, latDeg: number, lonDeg: number): SunPosition {
  checkLatLon(latDeg, lonDeg)
  checkInstant(utcMs)
  const p = SunCalc.getPosition(new Date(utcMs), latDeg, lonDeg)
  return { altitudeDeg: p.altitude, azimuthDeg: p.azimuth }
}

/**
 * Middle of an interval that starts at `startUtcMs` [ms] and lasts `intervalMinutes` [min] (default 60):
 * the instant at which to evaluate the sun for a value that describes the whole interval.
 */
export function intervalMidpointUtcMs(startUtcMs: number, intervalMinutes = 60): number {
  if (!(intervalMinutes > 0 && intervalMinutes <= 1440)) {
    throw new RangeError(`interval must be between 0 (exclusive) and 1440 minutes, got ${intervalMinutes}`)
  }
  return startUtcMs + intervalMinutes * 30_000
}

/** ΔT = TT − UT [s], Espenak & Meeus polynomial fits (NASA eclipse site, 2006) for 1900–2150, as in suncalc 2.0.2. */
export function deltaTSeconds(daysSinceJ2000: number): number {
  const y = 2000 + daysSinceJ2000 / 365.2425
  let t: number
  if (y < 1920) {
    t = y - 1900
    return -2.79 + t * (1.494119 + t * (-0.0598939 + t * (0.0061966 - t * 0.000197)))
  }
  if (y < 1941) {
    t = y - 1920
    return 21.2 + t * (0.84493 + t * (-0.0761 + t * 0.0020936))
  }
  if (y < 1961) {
    t = y - 1950
    return 29.07 + t * (0.407 + t * (-1 / 233 + t / 2547))
  }
  if (y < 1986) {
    t = y - 1975
    return 45.45 + t * (1.067 + t * (-1 / 260 - t / 718))
  }
  if (y < 2005) {
    t = y - 2000
    return 63.86 + t * (0.3345 + t * (-0.060374 + t * (0.0017275 + t * (0.000651814 + t * 0.00002373599))))
  }
  if (y < 2050) {
    t = y - 2000
    return 62.92 + t * (0.32217 + t * 0.005589)
  }
  t = (y - 1820) / 100
  return -20 + 32 * t * t - 0.5628 * (2150 - y)
}

// Outputs of the last seed or hour step: [sin δ, cos δ cos H, cos δ sin H]. Module-level so that the
// per-hour path allocates nothing.
const scratch = new Float64Array(3)

/** Atmospheric refraction [rad] at geometric altitude h [rad]: Meeus 1998 eq 16.4 (Sæmundsson), h clamped at 0 as suncalc 2.0.2. */
function refractionRad(h: number): number {
  if (h <= 0) return REFRACTION_AT_HORIZON_RAD
  return 0.0002967 / Math.tan(h + 0.00312536 / (h + 0.08901179))
}

/** {@link refractionRad} at h ≤ 0, where suncalc clamps the argument to 0: the same expression, evaluated once. */
const REFRACTION_AT_HORIZON_RAD = 0.0002967 / Math.tan(0 + 0.00312536 / (0 + 0.08901179))

/**
 * Hour-to-hour recurrences of the column path. Of the terms of {@link seedHourlySun}, the mean anomaly M, the node
 * Ω, the apparent longitude λ and the obliquity ε move by less than 0.05° in an hour: rather than eight of the
 * ten sines and cosines per hour, each of their sines and cosines is advanced from the last hour by the
 * angle-addition identities, with the small step's sine and cosine from their Taylor series (|step| < 0.001
 * rad: terms beyond the fifth order are below 1e-18); the sidereal angle θ is evaluated every hour. The angles
 * themselves are recomputed exactly every hour (the same formulas as {@link seedHourlySun}); only their sines and
 * cosines are carried, and they are re-seeded exactly every {@link SEED_EVERY_HOURS} hours and after any step
 * that is not exactly one hour, so rounding cannot accumulate: the columns agree with the hour-by-hour
 * evaluation to about 1e-13° (checked in test/physics/sun.test.ts).
 */
class HourlySun {
  /** Hours since the last exact seed. */
  steps = 0
  m = 0
  sinM = 0
  cosM = 0
  omega = 0
  sinOmega = 0
  cosOmega = 0
  lambda = 0
  sinL = 0
  cosL = 0
  eps = 0
  sinEps = 0
  cosEps = 0
  sinT = 0
  cosT = 0
}

/** Hours between exact evaluations of the recurrences' sines and cosines. */
const SEED_EVERY_HOURS = 24
const hourlySun = new HourlySun()

/**
 * sin θ and cos θ of the local sidereal angle (eq 12.4 + east longitude) at UT day number `d`, evaluated
 * every hour as in {@link seedHourlySun}: the day number of an instant is rounded to about 5e-10 day (it passes
 * through the Julian day), which moves θ by up to ~1e-7°; suncalc rounds it the same way, and carrying θ by a
 * recurrence instead would depart from it by that much.
 */
function siderealAngle(d: number, lonDeg: number): void {
  const theta = RAD * ((280.46061837 + 360.98564736629 * d + lonDeg) % 360)
  hourlySun.sinT = Math.sin(theta)
  hourlySun.cosT = Math.cos(theta)
}

/** The slowly moving angles M, Ω and the mean ε of {@link seedHourlySun} at TT centuries `t` into {@link hourlySun} (no sines). */
function slowAngles(t: number): void {
  const s = hourlySun
  s.m = RAD * (357.52911 + t * (35999.05029 - t * 0.0001537)) // eq 25.3 mean anomaly
  s.omega = RAD * (125.04 - 1934.136 * t) // longitude of the ascending node (Meeus ch. 25)
  s.eps = RAD * (23.439291 - t * (0.0130042 + t * (0.00000016 - t * 0.000000504))) // eq 22.2 mean obliquity
  // ε's nutation term needs cos Ω and λ needs sin M, cos M and sin Ω: added by the callers ({@link apparentLongitude})
}

/** Apparent longitude λ [rad] at TT centuries `t` from the hour's sin M, cos M and sin Ω (as in {@link seedHourlySun}). */
function apparentLongitude(t: number, sinM: number, cosM: number, sinOmega: number): number {
  const l0 = RAD * (280.46646 + t * (36000.76983 + t * 0.0003032)) // eq 25.2 geometric mean longitude
  const c =
    RAD *
    ((1.914602 - t * (0.004817 + t * 0.000014)) * sinM + // equation of centre (Meeus ch. 25)
      (0.019993 - 0.000101 * t) * 2 * sinM * cosM +
      0.000289 * sinM * (3 - 4 * sinM * sinM))
  return l0 + c - RAD * (0.00569 + 0.00478 * sinOmega)
}

/** Sine and cosine of a small angle step `a` [rad] (Taylor series to the fifth order) into `stepSinCos`. */
const stepSinCos = new Float64Array(2)
function smallStep(a: number): void {
  const a2 = a * a
  stepSinCos[0] = a * (1 - (a2 / 6) * (1 - a2 / 20))
  stepSinCos[1] = 1 - (a2 / 2) * (1 - a2 / 12)
}

/** sin δ (eq 25.7), cos δ cos H and cos δ sin H into `scratch` from the carried sines and cosines. */
function writeTerms(): void {
  const s = hourlySun
  const cosEpsSinL = s.cosEps * s.sinL
  scratch[0] = s.sinEps * s.sinL
  scratch[1] = s.cosT * s.cosL + s.sinT * cosEpsSinL
  scratch[2] = s.sinT * s.cosL - s.cosT * cosEpsSinL
}

/**
 * Sun terms at UTC instant `utcMs` for east longitude `lonDeg`, evaluated exactly, written to `scratch`: sin δ,
 * cos δ cos H and cos δ sin H, with δ the apparent declination and H the local hour angle; the angles and their
 * sines and cosines are kept in {@link hourlySun} for the hour steps. Same series as suncalc 2.0.2: Meeus (1998)
 * eqs 25.2–25.8 on Terrestrial Time (TT = UT + ΔT), eq 22.2 mean obliquity with the eq 25.8 correction, eq 12.4
 * sidereal time (linear term) on UT. Right ascension is not formed: cos δ cos H and cos δ sin H follow from
 * tan α = cos ε sin λ / cos λ by the angle-difference identities (same values as atan2/asin, fewer calls).
 */
function seedHourlySun(utcMs: number, lonDeg: number): void {
  const s = hourlySun
  const d = utcMs / MS_PER_DAY - 0.5 + JULIAN_DAY_1970 - JULIAN_DAY_2000 // days since J2000, UT
  const t = (d + deltaTSeconds(d) / S_PER_DAY) / 36525 // Julian centuries, TT
  slowAngles(t)
  s.sinM = Math.sin(s.m)
  s.cosM = Math.cos(s.m)
  s.sinOmega = Math.sin(s.omega)
  s.cosOmega = Math.cos(s.omega)
  s.eps += RAD * 0.00256 * s.cosOmega // eq 25.8 correction for the apparent position
  s.lambda = apparentLongitude(t, s.sinM, s.cosM, s.sinOmega)
  s.sinL = Math.sin(s.lambda)
  s.cosL = Math.cos(s.lambda)
  s.sinEps = Math.sin(s.eps)
  s.cosEps = Math.cos(s.eps)
  siderealAngle(d, lonDeg)
  s.steps = 0
  writeTerms()
}

/** One hour on from the last seed or step: the angles exactly, their sines and cosines by the identities. */
function stepHourlySun(utcMs: number, lonDeg: number): void {
  const s = hourlySun
  const d = utcMs / MS_PER_DAY - 0.5 + JULIAN_DAY_1970 - JULIAN_DAY_2000
  const t = (d + deltaTSeconds(d) / S_PER_DAY) / 36525
  const mPrev = s.m
  const omegaPrev = s.omega
  const lambdaPrev = s.lambda
  const epsPrev = s.eps
  slowAngles(t)
  let sn: number
  smallStep(s.m - mPrev)
  sn = s.sinM * stepSinCos[1] + s.cosM * stepSinCos[0]
  s.cosM = s.cosM * stepSinCos[1] - s.sinM * stepSinCos[0]
  s.sinM = sn
  smallStep(s.omega - omegaPrev)
  sn = s.sinOmega * stepSinCos[1] + s.cosOmega * stepSinCos[0]
  s.cosOmega = s.cosOmega * stepSinCos[1] - s.sinOmega * stepSinCos[0]
  s.sinOmega = sn
  s.eps += RAD * 0.00256 * s.cosOmega
  s.lambda = apparentLongitude(t, s.sinM, s.cosM, s.sinOmega)
  smallStep(s.lambda - lambdaPrev)
  sn = s.sinL * stepSinCos[1] + s.cosL * stepSinCos[0]
  s.cosL = s.cosL * stepSinCos[1] - s.sinL * stepSinCos[0]
  s.sinL = sn
  smallStep(s.eps - epsPrev)
  sn = s.sinEps * stepSinCos[1] + s.cosEps * stepSinCos[0]
  s.cosEps = s.cosEps * stepSinCos[1] - s.sinEps * stepSinCos[0]
  s.sinEps = sn
  siderealAngle(d, lonDeg)
  s.steps++
  writeTerms()
}

/**
 * Fill `outAltitudeDeg[i]` with the apparent sun altitude [°] at `instantsUtcMs[i] + offsetMs` for the
 * place (`latDeg`, `lonDeg`). `offsetMs` defaults to 30 min, i.e. `instantsUtcMs` are hour starts of
 * hour-long values. NaN instants give NaN. No allocation per hour. Returns the number of values written.
 */
export function sunAltitudeColumn(
  instantsUtcMs: Float64Array,
  latDeg: number,
  lonDeg: number,
  outAltitudeDeg: Float64Array,
  offsetMs = 30 * 60_000,
): number {
  return sunPositionColumns(instantsUtcMs, latDeg, lonDeg, outAltitudeDeg, undefined, offsetMs)
}

/**
 * As {@link sunAltitudeColumn}, also filling `outAzimuthDeg` (clockwise from north) when given.
 * Agrees with suncalc 2.0.2 `getPosition` to 1e-8° in altitude and 1e-6° in azimuth (tested; only
 * floating-point rounding differs).
 */
export function sunPositionColumns(
  instantsUtcMs: Float64Array,
  latDeg: number,
  lonDeg: number,
  outAltitudeDeg: Float64Array,
  outAzimuthDeg?: Float64Array,
  offsetMs = 30 * 60_000,
): number {
  checkLatLon(latDeg, lonDeg)
  const n = instantsUtcMs.length
  if (outAltitudeDeg.length < n) {
    throw new RangeError(`altitude output column holds ${outAltitudeDeg.length} values, needs ${n}`)
  }
  if (outAzimuthDeg !== undefined && outAzimuthDeg.length < n) {
    throw new RangeError(`azimuth output column holds ${outAzimuthDeg.length} values, needs ${n}`)
  }
  const phi = RAD * latDeg
  const sinPhi = Math.sin(phi)
  const cosPhi = Math.cos(phi)
  const hour = hourlySun
  hour.steps = SEED_EVERY_HOURS
  let previousT = Number.NaN
  for (let i = 0; i < n; i++) {
    const t = instantsUtcMs[i]
    if (!Number.isFinite(t)) {
      outAltitudeDeg[i] = Number.NaN
      if (outAzimuthDeg !== undefined) outAzimuthDeg[i] = Number.NaN
      previousT = Number.NaN
      continue
    }
    if (t - previousT === MS_PER_HOUR && hour.steps < SEED_EVERY_HOURS) stepHourlySun(t + offsetMs, lonDeg)
    else seedHourlySun(t + offsetMs, lonDeg)
    previousT = t
    const sinDec = scratch[0]
    const x = scratch[1]
    const alt = Math.asin(sinPhi * sinDec + cosPhi * x)
    outAltitudeDeg[i] = (alt + refractionRad(alt)) / RAD
    if (outAzimuthDeg !== undefined) {
      outAzimuthDeg[i] = (Math.atan2(scratch[2], x * sinPhi - sinDec * cosPhi) / RAD + 540) % 360
    }
  }
  return n
}

/**
 * Geometric (refraction-free) sine of the sun altitude at `utcMs` for the place, = cos(zenith);
 * may be negative. Same algorithm as the columns, one instant, no allocation.
 */
export function sinGeometricSunAltitude(utcMs: number, latDeg: number, lonDeg: number): number {
  checkLatLon(latDeg, lonDeg)
  checkInstant(utcMs)
  seedHourlySun(utcMs, lonDeg)
  const phi = RAD * latDeg
  return Math.sin(phi) * scratch[0] + Math.cos(phi) * scratch[1]
}
