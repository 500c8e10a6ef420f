/**
 * @module weather/gap-fill
 * Short gaps filled, long gaps left missing. Temperature, humidity, pressure and wind: linear
 * interpolation across gaps of at most {@link MAX_FILL_GAP_HOURS} hours between two valid values.
 * Irradiance: zero when the sun is below the horizon for the whole hour; by day only from the
 * clear-sky index of the nearest valid daytime neighbour (within the same limit), times the hour's
 * clear-sky irradiance (Haurwitz 1945). Every filled value is flagged and logged.
 */
import { MS_PER_HOUR } from '../physics/constants.ts'
import { clearSkyGhiHaurwitzCosZenithWm2 as haurwitzClearSkyWm2 } from '../physics/irradiance.ts'
import { sinGeometricSunAltitude } from '../physics/sun.ts'
import type { ProblemLog } from './problem-log.ts'
import type { HourGrid } from './quality.ts'
import { QualityFlag } from './series.ts'

/** Longest gap [h] filled by interpolation; the rule (≤ 3 h). Common practice, no source. */
export const MAX_FILL_GAP_HOURS = 3

/** Fill interior NaN runs of at most `maxGap` hours linearly; returns the number of values filled. */
export function interpolateShortGaps(
  grid: HourGrid,
  log: ProblemLog,
  variable: string,
  values: Float64Array,
  maxGap = MAX_FILL_GAP_HOURS,
): number {
  let filled = 0
  let s = 0
  const n = values.length
  while (s < n) {
    if (!Number.isNaN(values[s])) {
      s++
      continue
    }
    const start = s
    while (s < n && Number.isNaN(values[s])) s++
    const length = s - start
    if (start === 0 || s === n || length > maxGap) continue
    const a = values[start - 1]
    const b = values[s]
    for (let k = start; k < s; k++) {
      const f = (k - start + 1) / (length + 1)
      values[k] = a + (b - a) * f
      grid.quality[k] |= QualityFlag.filled
      const row = grid.slotRow[k]
      if (row >= 0) grid.changed[k] = 1
      filled++
    }
    log.add(
      lineOfSlot(grid, start),
      variable,
      'gap-filled',
      `${length}-hour gap in ${variable} filled by linear interpolation`,
    )
  }
  return filled
}

function lineOfSlot(grid: HourGrid, s: number): number | null {
  const row = grid.slotRow[s]
  return row >= 0 ? grid.lines[row] : null
}

/** Sine of the sun altitude at the start, middle and end of each hour, as the mean clear-sky irradiance over the hour uses. */
export interface HourSun {
  /** Mean of Haurwitz clear-sky irradiance at start, middle and end of the hour [W/m²]. */
  clearSkyWm2: Float64Array
  /** 1 when the sun is below the horizon (geometric) at start, middle and end of the hour. */
  night: Uint8Array
  startUtcMs: Float64Array
  latDeg: number
  lonDeg: number
}

/**
 * Sun geometry per hour for hour-long interval values (hour starts in `startUtcMs`). With `ghiWm2`,
 * only hours whose irradiance needs a decision (missing, or above the night limit) are computed:
 * a reading between 0 and the limit is acceptable by night and by day, and one above it with the sun
 * up at mid-hour is day. Skipped hours get clearSky NaN (computed on demand) and night 0.
 */
export function hourSun(
  startUtcMs: Float64Array,
  latDeg: number,
  lonDeg: number,
  ghiWm2?: Float64Array,
): HourSun {
  const n = startUtcMs.length
  const clearSkyWm2 = new Float64Array(n)
  const night = new Uint8Array(n)
  for (let s = 0; s < n; s++) {
    if (ghiWm2 !== undefined) {
      const g = ghiWm2[s]
      if (g >= 0 && g <= NIGHT_IRRADIANCE_LIMIT_WM2) {
        clearSkyWm2[s] = Number.NaN
        continue
      }
      // a reading above the limit only needs the night test: the sun up at mid-hour settles it
      if (
        g > NIGHT_IRRADIANCE_LIMIT_WM2 &&
        sinGeometricSunAltitude(startUtcMs[s] + MS_PER_HOUR / 2, latDeg, lonDeg) > 0
      ) {
        clearSkyWm2[s] = Number.NaN
        continue
      }
    }
    computeHour(startUtcMs[s], latDeg, lonDeg, clearSkyWm2, night, s)
  }
  return { clearSkyWm2, night, startUtcMs, latDeg, lonDeg }
}

function computeHour(
  t: number,
  latDeg: number,
  lonDeg: number,
  clearSkyWm2: Float64Array,
  night: Uint8Array,
  s: number,
): void {
  const a = sinGeometricSunAltitude(t, latDeg, lonDeg)
  const m = sinGeometricSunAltitude(t + MS_PER_HOUR / 2, latDeg, lonDeg)
  const b = sinGeometricSunAltitude(t + MS_PER_HOUR, latDeg, lonDeg)
  // Simpson's rule over the hour: (start + 4·middle + end) / 6
  clearSkyWm2[s] = (haurwitzClearSkyWm2(a) + 4 * haurwitzClearSkyWm2(m) + haurwitzClearSkyWm2(b)) / 6
  night[s] = a <= 0 && m <= 0 && b <= 0 ? 1 : 0
}

/** Clear-sky irradiance of hour `s`, computed now if {@link hourSun} skipped it. */
export function clearSkyAt(sun: HourSun, s: number): number {
  if (Number.isNaN(sun.clearSkyWm2[s]))
    computeHour(sun.startUtcMs[s], sun.latDeg, sun.lonDeg, sun.clearSkyWm2, sun.night, s)
  return sun.clearSkyWm2[s]
}

/** Night irradiance above this [W/m²] is an error (time basis or sensor). Common practice, no source. */
export const NIGHT_IRRADIANCE_LIMIT_WM2 = 20

/**
 * Irradiance at night: reported values above the limit are rejected and set to 0, missing values set
 * to 0. Returns the count of rejected night values (many suggest a wrong time zone).
 */
export function fixNightIrradiance(grid: HourGrid, log: ProblemLog, ghi: Float64Array, sun: HourSun): number {
  let rejected = 0
  for (let s = 0; s < ghi.length; s++) {
    if (sun.night[s] !== 1) continue
    const v = ghi[s]
    if (Number.isNaN(v)) {
      ghi[s] = 0
      grid.quality[s] |= QualityFlag.irradianceFilled
      if (grid.slotRow[s] >= 0) grid.changed[s] = 1
    } else if (v > NIGHT_IRRADIANCE_LIMIT_WM2) {
      ghi[s] = 0
      rejected++
      grid.quality[s] |= QualityFlag.rejectedValue | QualityFlag.irradianceFilled
      if (grid.slotRow[s] >= 0) grid.changed[s] = 1
      log.add(
        lineOfSlot(grid, s),
        'ghi',
        'irradiance-at-night',
        `irradiance ${Math.round(v)} W/m² while the sun is below the horizon: set to 0`,
      )
    } else if (v > 0) {
      ghi[s] = 0
    }
  }
  return rejected
}

/** Clear-sky irradiance below which an hour's clear-sky index is too uncertain to carry [W/m²]. Common practice, no source. */
const MIN_CLEAR_SKY_FOR_INDEX_WM2 = 50

/** Fill daytime irradiance gaps ≤ 3 h from the clear-sky index of the nearest valid neighbour. */
export function fillDaytimeIrradiance(
  grid: HourGrid,
  log: ProblemLog,
  ghi: Float64Array,
  sun: HourSun,
  maxGap = MAX_FILL_GAP_HOURS,
): number {
  let filled = 0
  const n = ghi.length
  for (let s = 0; s < n; s++) {
    if (!Number.isNaN(ghi[s])) continue
    let best = -1
    for (let d = 1; d <= maxGap && best < 0; d++) {
      for (const k of [s - d, s + d]) {
        if (k < 0 || k >= n || best >= 0) continue
        if (
          !Number.isNaN(ghi[k]) &&
          !(grid.quality[k] & QualityFlag.irradianceFilled) &&
          clearSkyAt(sun, k) >= MIN_CLEAR_SKY_FOR_INDEX_WM2
        )
          best = k
      }
    }
    if (best < 0) continue
    const index = Math.min(1.2, ghi[best] / clearSkyAt(sun, best))
    ghi[s] = index * clearSkyAt(sun, s)
    grid.quality[s] |= QualityFlag.irradianceFilled
    if (grid.slotRow[s] >= 0) grid.changed[s] = 1
    filled++
    log.add(
      lineOfSlot(grid, s),
      'ghi',
      'gap-filled',
      `irradiance filled from the clear-sky index ${index.toFixed(2)} of the hour ${best > s ? 'after' : 'before'}`,
    )
  }
  return filled
}
