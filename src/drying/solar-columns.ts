/**
 * @module drying/solar-columns
 * Sun position and radiation columns of a series, computed once and shared by every method of an
 * assessment: apparent sun altitude and azimuth at mid-hour (physics/sun.ts), hour-mean
 * extraterrestrial horizontal irradiance, and the Rs/Rso ratio of FAO-56 eq 39 with the evening value
 * carried through the night (physics/fao56-reference-et.ts).
 */

import { dayOfYearAt } from '../physics/calendar.ts'
import { MS_PER_DAY, MS_PER_HOUR } from '../physics/constants.ts'
import { fillNightShortwaveRatioColumn } from '../physics/fao56-reference-et.ts'
import {
  inverseRelativeDistanceEarthSun,
  mjPerM2HourFromWm2,
  SOLAR_CONSTANT_WM2,
} from '../physics/fao56-solar.ts'
import { clearSkyRadiationFao56 } from '../physics/irradiance.ts'
import { sunPositionColumns } from '../physics/sun.ts'
import type { HourlySeries } from '../weather/series.ts'

function alloc(n: number): Float64Array {
  return new Float64Array(n)
}

/** Per-hour sun and radiation columns of a series, independent of the method. */
export interface SolarColumns {
  /** Apparent sun altitude at mid-hour [°] (0 when the site has no coordinates). */
  altitudeDeg: Float64Array
  /** Sun azimuth at mid-hour [°] clockwise from north; empty when computed with `azimuth: false`. */
  azimuthDeg: Float64Array
  /** Extraterrestrial horizontal irradiance, hour mean [W/m²]. */
  raWm2: Float64Array
  /** Rs/Rso for FAO-56 eq 39, the evening value carried through the night. */
  rsOverRso: Float64Array
}

/**
 * Sun position (physics/sun.ts) and FAO-56 extraterrestrial and clear-sky radiation for every hour.
 * `azimuth: false` skips the azimuth (only the solar cabinet's collector needs it); the other columns are
 * the same either way.
 */
export function computeSolarColumns(series: HourlySeries, options: { azimuth?: boolean } = {}): SolarColumns {
  const n = series.hours
  const lat = series.site.latitudeDeg
  const lon = series.site.longitudeDeg
  const elevation = series.site.elevationM ?? 0
  const altitudeDeg = alloc(n)
  const azimuthDeg = alloc(options.azimuth === false ? 0 : n)
  const raWm2 = alloc(n)
  const rsOverRso = alloc(n)
  if (lat === null || lon === null) {
    rsOverRso.fill(0.8)
    return { altitudeDeg, azimuthDeg, raWm2, rsOverRso }
  }
  sunPositionColumns(
    series.startUtcMs,
    lat,
    lon,
    altitudeDeg,
    options.azimuth === false ? undefined : azimuthDeg,
  )
  const rso = alloc(n)
  const rs = alloc(n)
  // dr changes once per local day: computed when the day changes (same value as per hour)
  let lastDay = Number.NaN
  let dr = 0
  const offsetMs = (lon / 15) * MS_PER_HOUR
  for (let i = 0; i < n; i++) {
    // Hour-mean extraterrestrial horizontal irradiance by the midpoint rule: Gsc·dr·sin(altitude at
    // mid-hour) (FAO-56 eqs 21–23 integrated over the hour ≈ value at its middle; off by up to one
    // sunrise/sunset hour, which the Rs/Rso carry rule of FAO-56 ch. 4 does not use).
    // sin(altitude) > 0 exactly when the altitude is above 0° (it lies within ±90°): no sine at night
    const alt = altitudeDeg[i]
    const sinAlt = alt > 0 ? Math.sin((alt * Math.PI) / 180) : 0
    const day = Math.floor((series.startUtcMs[i] + offsetMs) / MS_PER_DAY)
    if (day !== lastDay) {
      lastDay = day
      dr = inverseRelativeDistanceEarthSun(dayOfYearAt(series.startUtcMs[i], lon / 15))
    }
    const raW = sinAlt > 0 ? SOLAR_CONSTANT_WM2 * dr * sinAlt : 0
    raWm2[i] = raW
    rso[i] = clearSkyRadiationFao56(mjPerM2HourFromWm2(raW), elevation)
    const g = series.ghiWm2[i]
    rs[i] = Number.isFinite(g) ? mjPerM2HourFromWm2(g) : Number.NaN
  }
  fillNightShortwaveRatioColumn(rs, rso, altitudeDeg, rsOverRso)
  return { altitudeDeg, azimuthDeg, raWm2, rsOverRso }
}
