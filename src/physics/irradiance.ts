/**
 * @module physics/irradiance
 * Clear-sky global irradiance, the beam/diffuse split of measured global irradiance and isotropic-sky
 * transposition to a tilted surface. Units: W/m² for irradiance (mean over the hour when the input is an
 * hourly value), MJ m⁻² per period where FAO-56 uses it, degrees for angles; azimuths clockwise from north
 * (the suncalc 2 convention of ./sun.ts). Extraterrestrial radiation is in ./fao56-solar.ts.
 */

const RAD = Math.PI / 180

/**
 * Smallest cos(zenith) used when dividing by it (beam horizontal → normal, R_b): 0.065 (sun ≈ 3.7° high),
 * the default of pvlib-python's `erbs(min_cos_zenith=0.065)` (from memory). Avoids the R_b blow-up near
 * sunrise/sunset noted by Duffie & Beckman (2013) §2.14.
 */
export const MIN_COS_ZENITH = 0.065

function checkFinite(name: string, value: number, unit: string): void {
  if (!Number.isFinite(value))
    throw new RangeError(`${name} must be a finite number of ${unit}, got ${value}`)
}

/**
 * Clear-sky solar radiation Rso = (0.75 + 2×10⁻⁵ z) Ra, FAO-56 eq 37 (Allen et al. 1998), for a period
 * with extraterrestrial radiation `extraterrestrialMjM2` (any energy-per-area unit, returned in the same)
 * at station elevation `elevationM` [m]. Example 19: Ra 3.543, z 8 m → 2.658 MJ m⁻² h⁻¹.
 */
export function clearSkyRadiationFao56(extraterrestrial: number, elevationM: number): number {
  if (!(elevationM >= -500 && elevationM <= 9000)) {
    throw new RangeError(`elevation must be between -500 and 9000 m, got ${elevationM}`)
  }
  return (0.75 + 2e-5 * elevationM) * extraterrestrial
}

/**
 * Clear-sky global horizontal irradiance [W/m²] by Haurwitz (1945, 1946), GHI = 1098 cos Z exp(−0.059/cos Z),
 * as given by Reno, Hansen & Stein (2012), SAND2012-2389, with `sunAltitudeDeg` the apparent altitude [°].
 * 0 when the sun is at or below the horizon. Example: altitude 30° → 487.894 W/m² (pvlib test value).
 */
export function clearSkyGhiHaurwitzWm2(sunAltitudeDeg: number): number {
  checkFinite('sun altitude', sunAltitudeDeg, 'degrees')
  return clearSkyGhiHaurwitzCosZenithWm2(Math.sin(sunAltitudeDeg * RAD))
}

/**
 * The same Haurwitz clear-sky irradiance [W/m²] for the cosine of the zenith angle `cosZenith` [–] (the
 * sine of the altitude), for loops that have it already; 0 at or below the horizon, no input check.
 * Constants 1098 W/m² and 0.059 as in pvlib `clearsky.haurwitz`, first implemented by M. Reno for the
 * report above (read in pvlib-python's source); some later papers print 0.057 for the same formula (from
 * memory); the 1945 paper itself was not read.
 */
export function clearSkyGhiHaurwitzCosZenithWm2(cosZenith: number): number {
  return cosZenith > 0 ? 1098 * cosZenith * Math.exp(-0.059 / cosZenith) : 0
}

/**
 * Clearness index kT [–] = measured global / extraterrestrial horizontal for the same period (Duffie &
 * Beckman 2013, *Solar Engineering of Thermal Processes* 4th ed., eq 2.9.3 for an hour). Both in the same
 * unit. 0 when there is no extraterrestrial radiation; capped at 1 (a ratio above 1 is a data error or
 * cloud enhancement the correlations do not cover; common practice, no source).
 */
export function clearnessIndex(globalHorizontal: number, extraterrestrialHorizontal: number): number {
  checkFinite('global horizontal irradiance', globalHorizontal, 'W/m2')
  if (!(extraterrestrialHorizontal > 0) || !(globalHorizontal > 0)) return 0
  const kt = globalHorizontal / extraterrestrialHorizontal
  return Math.min(kt, 1)
}

/**
 * Hourly diffuse fraction Id/I [–] from the clearness index kT, Erbs, Klein & Duffie (1982), *Solar Energy*
 * 28(4):293–302, as Duffie & Beckman (2013) eq 2.10.1: 1 − 0.09 kT (kT ≤ 0.22);
 * 0.9511 − 0.1604 kT + 4.388 kT² − 16.638 kT³ + 12.336 kT⁴ (0.22 < kT ≤ 0.80); 0.165 (kT > 0.80).
 */
export function diffuseFractionErbs(kt: number): number {
  if (!(kt >= 0 && kt <= 1)) throw new RangeError(`clearness index must be between 0 and 1, got ${kt}`)
  if (kt <= 0.22) return 1 - 0.09 * kt
  if (kt <= 0.8) return 0.9511 + kt * (-0.1604 + kt * (4.388 + kt * (-16.638 + kt * 12.336)))
  return 0.165
}

/**
 * Diffuse horizontal irradiance [W/m²] from measured global horizontal `ghiWm2` and the period's
 * extraterrestrial horizontal irradiance `extraterrestrialHorizontalWm2` (same averaging), by Erbs et al.
 * (1982). The beam horizontal part is `ghiWm2` minus this.
 */
export function diffuseHorizontalErbsWm2(ghiWm2: number, extraterrestrialHorizontalWm2: number): number {
  if (!(ghiWm2 > 0)) {
    checkFinite('global horizontal irradiance', ghiWm2, 'W/m2')
    return 0
  }
  if (!(extraterrestrialHorizontalWm2 > 0)) return ghiWm2 // sun below the horizon all period: all diffuse
  return ghiWm2 * diffuseFractionErbs(clearnessIndex(ghiWm2, extraterrestrialHorizontalWm2))
}

/**
 * Cosine of the angle of incidence of the beam on a plane of tilt `tiltDeg` [° from horizontal] facing
 * azimuth `surfaceAzimuthDeg` [° clockwise from north], for sun zenith `zenithDeg` and sun azimuth
 * `sunAzimuthDeg` (clockwise from north): cos θ = cos θz cos β + sin θz sin β cos(γs − γ), Duffie & Beckman
 * (2013) eq 1.6.5 (their azimuths are from south; the difference γs − γ is the same). May be negative
 * (sun behind the plane).
 */
export function cosIncidenceAngle(
  zenithDeg: number,
  sunAzimuthDeg: number,
  tiltDeg: number,
  surfaceAzimuthDeg: number,
): number {
  checkTilt(tiltDeg)
  const z = zenithDeg * RAD
  const b = tiltDeg * RAD
  return (
    Math.cos(z) * Math.cos(b) +
    Math.sin(z) * Math.sin(b) * Math.cos((sunAzimuthDeg - surfaceAzimuthDeg) * RAD)
  )
}

function checkTilt(tiltDeg: number): void {
  if (!(tiltDeg >= 0 && tiltDeg <= 180))
    throw new RangeError(`tilt must be between 0 and 180 degrees, got ${tiltDeg}`)
}

/**
 * Global irradiance on a tilted plane [W/m²] by the isotropic-sky model (Liu & Jordan 1963; Duffie &
 * Beckman 2013 eq 2.15.1): G_T = G_b R_b + G_d (1 + cos β)/2 + G ρg (1 − cos β)/2, with R_b = cos θ / cos θz.
 * Inputs: beam and diffuse horizontal [W/m²], cos θz of the sun, cos θ on the plane (from
 * {@link cosIncidenceAngle}), tilt β [°] and ground albedo ρg [–] (0.2 is the common default; common
 * practice, no source). Beam on the plane is 0 when the sun is behind it; cos θz is floored at
 * {@link MIN_COS_ZENITH}; with the sun below the horizon (cos θz ≤ 0, e.g. the middle of a sunrise hour)
 * the beam part is treated as diffuse (common practice, no source). Tilt 0 returns beam + diffuse = GHI.
 */
export function tiltedIrradianceIsotropicWm2(
  beamHorizontalWm2: number,
  diffuseHorizontalWm2: number,
  cosZenith: number,
  cosIncidence: number,
  tiltDeg: number,
  groundAlbedo: number,
): number {
  checkTilt(tiltDeg)
  if (!(groundAlbedo >= 0 && groundAlbedo <= 1)) {
    throw new RangeError(`ground albedo must be between 0 and 1, got ${groundAlbedo}`)
  }
  checkFinite('beam horizontal irradiance', beamHorizontalWm2, 'W/m2')
  checkFinite('diffuse horizontal irradiance', diffuseHorizontalWm2, 'W/m2')
  const cosB = Math.cos(tiltDeg * RAD)
  const global = beamHorizontalWm2 + diffuseHorizontalWm2
  let diffuse = diffuseHorizontalWm2
  let beam = 0
  if (tiltDeg === 0) beam = beamHorizontalWm2
  else if (!(cosZenith > 0))
    diffuse = global // sun below the horizon at the evaluation instant: all diffuse
  else if (cosIncidence > 0) beam = (beamHorizontalWm2 * cosIncidence) / Math.max(cosZenith, MIN_COS_ZENITH)
  return beam + (diffuse * (1 + cosB)) / 2 + (global * groundAlbedo * (1 - cosB)) / 2
}

/**
 * Global irradiance on a tilted plane [W/m²] for one hour from the measured global horizontal irradiance
 * `ghiWm2`: the Erbs et al. (1982) diffuse split with the hour's extraterrestrial horizontal irradiance
 * `extraterrestrialHorizontalWm2`, then isotropic-sky transposition ({@link tiltedIrradianceIsotropicWm2})
 * for the sun at `sunAltitudeDeg`, `sunAzimuthDeg` (clockwise from north) and a plane of tilt `tiltDeg`
 * facing `surfaceAzimuthDeg` with ground albedo `groundAlbedo`. 0 when the GHI is not positive.
 */
export function tiltedIrradianceFromGhiWm2(
  ghiWm2: number,
  extraterrestrialHorizontalWm2: number,
  sunAltitudeDeg: number,
  sunAzimuthDeg: number,
  tiltDeg: number,
  surfaceAzimuthDeg: number,
  groundAlbedo: number,
): number {
  if (!(ghiWm2 > 0)) return 0
  const diffuse = diffuseHorizontalErbsWm2(ghiWm2, extraterrestrialHorizontalWm2)
  const zenith = 90 - sunAltitudeDeg
  const cosZ = Math.cos((zenith * Math.PI) / 180)
  const cosInc = cosIncidenceAngle(zenith, sunAzimuthDeg, tiltDeg, surfaceAzimuthDeg)
  return tiltedIrradianceIsotropicWm2(ghiWm2 - diffuse, diffuse, cosZ, cosInc, tiltDeg, groundAlbedo)
}
