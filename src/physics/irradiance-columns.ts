/**
 * @module physics/irradiance-columns
 * Column forms for the drying engine: hourly extraterrestrial irradiance and global irradiance on a tilted
 * plane (collector or drying rack) from measured global horizontal irradiance, for whole series at once,
 * without allocation per hour. Each hour is the interval [start, start + 1 h) and is evaluated at its middle.
 *
 * Chain per hour: FAO-56 eq 28 (extraterrestrial horizontal, as a mean W/m² over the hour) → clearness index
 * → Erbs et al. (1982) diffuse fraction → beam horizontal = GHI − diffuse → isotropic-sky transposition
 * (Liu & Jordan 1963) with the mid-hour sun position of ./sun.ts.
 */
import { extraterrestrialRadiationForPeriodUtcMjM2, wm2FromMjPerM2Hour } from './fao56-solar.ts'
import { cosIncidenceAngle, diffuseHorizontalErbsWm2, tiltedIrradianceIsotropicWm2 } from './irradiance.ts'

const RAD = Math.PI / 180

/** A plane receiving sunshine: tilt from horizontal, azimuth of its normal, albedo of the ground in front. */
export interface ReceivingPlane {
  /** Tilt from horizontal [°], 0…90 for collectors and racks. */
  tiltDeg: number
  /** Azimuth the plane faces [°] clockwise from north (180 = facing south). */
  azimuthDeg: number
  /** Ground albedo [–]; 0.2 is the common default (common practice, no source). */
  groundAlbedo: number
}

function checkLengths(n: number, columns: [string, ArrayLike<number>][]): void {
  for (const [name, c] of columns) {
    if (c.length < n) throw new RangeError(`${name} column holds ${c.length} values, needs ${n}`)
  }
}

/**
 * Fill `outWm2[i]` with the mean extraterrestrial irradiance on a horizontal surface [W/m²] over the hour
 * starting at `startUtcMs[i]` (FAO-56 eq 28 with eqs 23–25, 31–33). NaN starts give NaN. Returns n.
 */
export function extraterrestrialHorizontalColumnWm2(
  startUtcMs: Float64Array,
  latDeg: number,
  lonDeg: number,
  outWm2: Float64Array,
): number {
  const n = startUtcMs.length
  checkLengths(n, [['extraterrestrial output', outWm2]])
  for (let i = 0; i < n; i++) {
    const t = startUtcMs[i]
    outWm2[i] = Number.isFinite(t)
      ? wm2FromMjPerM2Hour(extraterrestrialRadiationForPeriodUtcMjM2(t, latDeg, lonDeg, 1))
      : Number.NaN
  }
  return n
}

/**
 * Fill `outWm2[i]` with the global irradiance on `plane` [W/m²] for hour i from measured global horizontal
 * `ghiWm2[i]`, the hour's extraterrestrial horizontal irradiance `extraterrestrialWm2[i]` (from
 * {@link extraterrestrialHorizontalColumnWm2}) and the mid-hour sun `sunAltitudeDeg[i]`, `sunAzimuthDeg[i]`
 * (from `sunPositionColumns`). Missing (NaN) GHI gives NaN; GHI ≤ 0 gives 0. Returns n.
 */
export function tiltedIrradianceColumnWm2(
  ghiWm2: Float64Array,
  extraterrestrialWm2: Float64Array,
  sunAltitudeDeg: Float64Array,
  sunAzimuthDeg: Float64Array,
  plane: ReceivingPlane,
  outWm2: Float64Array,
): number {
  const n = ghiWm2.length
  checkLengths(n, [
    ['extraterrestrial', extraterrestrialWm2],
    ['sun altitude', sunAltitudeDeg],
    ['sun azimuth', sunAzimuthDeg],
    ['tilted irradiance output', outWm2],
  ])
  // Validate the plane once (the scalar functions check it too, but a bad plane should fail before hour 0).
  tiltedIrradianceIsotropicWm2(0, 0, 1, 1, plane.tiltDeg, plane.groundAlbedo)
  for (let i = 0; i < n; i++) {
    const ghi = ghiWm2[i]
    if (Number.isNaN(ghi)) {
      outWm2[i] = Number.NaN
      continue
    }
    if (!(ghi > 0)) {
      outWm2[i] = 0
      continue
    }
    const diffuse = diffuseHorizontalErbsWm2(ghi, extraterrestrialWm2[i])
    const altitude = sunAltitudeDeg[i]
    const cosZenith = Math.sin(altitude * RAD)
    const cosTheta = cosIncidenceAngle(90 - altitude, sunAzimuthDeg[i], plane.tiltDeg, plane.azimuthDeg)
    outWm2[i] = tiltedIrradianceIsotropicWm2(
      ghi - diffuse,
      diffuse,
      cosZenith,
      cosTheta,
      plane.tiltDeg,
      plane.groundAlbedo,
    )
  }
  return n
}
