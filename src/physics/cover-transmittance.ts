/**
 * @module physics/cover-transmittance
 * Solar transmittance of transparent covers (glass, plastic film) as a function of the angle of incidence, for
 * solar tunnel and greenhouse dryers and glazed collectors. The method of Duffie & Beckman, *Solar Engineering of
 * Thermal Processes* (ch. 5, "Radiation transmission through glazing"):
 * - Snell's law, n1·sin θ1 = n2·sin θ2 (air n1 = 1);
 * - Fresnel reflectance of unpolarised light, the mean of the two polarisation components
 *   r⊥ = sin²(θ2 − θ1)/sin²(θ2 + θ1), r∥ = tan²(θ2 − θ1)/tan²(θ2 + θ1); at normal incidence ((n − 1)/(n + 1))²;
 * - reflection losses of N covers with all inter-reflections, per component: (1 − r)/(1 + (2N − 1)·r);
 * - absorption (Bouguer's law): τ_a = exp(−N·K·L/cos θ2), K the extinction coefficient [1/m], L the thickness [m];
 * - τ ≈ τ_r·τ_a (Duffie & Beckman's approximation for weakly absorbing covers), done per component here.
 * Diffuse sky and ground radiation are handled by the equivalent beam angles of Brandemuehl & Beckman (1980),
 * as given by Duffie & Beckman: θ_sky = 59.7 − 0.1388·β + 0.001497·β², θ_ground = 90 − 0.5788·β + 0.002693·β²
 * (degrees; β the cover slope) — the coefficients are from memory, not re-read.
 *
 * Cover materials (sources graded as in the product catalogue):
 * - glass: refractive index 1.526 (Duffie & Beckman's value for glass in the solar range; from memory);
 *   corroborated by a published ray-trace study that takes n = 1.52 and an extinction coefficient K = 4 m⁻¹ for
 *   low-iron glass (International Journal of Photoenergy 2015, article 693463, "Theoretical and experimental
 *   optical evaluation and comparison of symmetric 2D CPC and V-trough collector for photovoltaic applications",
 *   Table 2, read). K of ordinary (greenish) float glass is several times higher (about 32 m⁻¹; from memory).
 * - polyethylene film: no default is set. The one published pair found, n = 1.58 and σ = 3.86 mm⁻¹ for new
 *   low-density polyethylene sheets before a year of arid-climate exposure (abstract of "Degradation
 *   characteristics of the optical constants of PE-LD sheets", read in a university repository; authors and
 *   journal not read), comes with a solar transmittance of only 0.42, far below that of clear greenhouse film, and
 *   is not used. Callers give n and K·L of their film; the Fresnel and Bouguer relations here then apply.
 */

/** Refractive index of glass in the solar range: 1.526 (Duffie & Beckman; from memory; 1.52 in a published ray-trace study, see above). */
export const GLASS_REFRACTIVE_INDEX = 1.526
/**
 * Extinction coefficient of low-iron (water-white) glass [1/m]: 4, as taken in the published ray-trace study above
 * (Int. J. Photoenergy 2015, 693463, Table 2). Multiply by the thickness [m] for `extinctionThickness`.
 */
export const LOW_IRON_GLASS_EXTINCTION_PER_M = 4

export interface CoverSpec {
  /** Refractive index of the cover material (glass: {@link GLASS_REFRACTIVE_INDEX}). */
  refractiveIndex: number
  /** Extinction coefficient × thickness of one cover, K·L (dimensionless); 0 for a non-absorbing cover. */
  extinctionThickness: number
  /** Number of identical covers (default 1). */
  covers?: number
}

const DEG = Math.PI / 180

function check(spec: CoverSpec): number {
  const n = spec.covers ?? 1
  if (!(spec.refractiveIndex > 1 && spec.refractiveIndex < 3)) {
    throw new RangeError(`refractive index must be between 1 and 3, got ${spec.refractiveIndex}`)
  }
  if (!(spec.extinctionThickness >= 0 && spec.extinctionThickness < 5)) {
    throw new RangeError(`extinction × thickness must be between 0 and 5, got ${spec.extinctionThickness}`)
  }
  if (!(Number.isInteger(n) && n >= 1 && n <= 4)) throw new RangeError(`covers must be 1 to 4, got ${n}`)
  return n
}

/** Fresnel reflectance of the two polarisation components at one air–cover surface. */
export function fresnelReflectance(
  incidenceDeg: number,
  refractiveIndex: number,
): { perpendicular: number; parallel: number; refractionDeg: number } {
  if (!(incidenceDeg >= 0 && incidenceDeg < 90)) {
    throw new RangeError(`angle of incidence must be in [0, 90) degrees, got ${incidenceDeg}`)
  }
  const t1 = incidenceDeg * DEG
  const t2 = Math.asin(Math.sin(t1) / refractiveIndex)
  if (incidenceDeg < 1e-6) {
    const r = ((refractiveIndex - 1) / (refractiveIndex + 1)) ** 2
    return { perpendicular: r, parallel: r, refractionDeg: 0 }
  }
  const perpendicular = Math.sin(t2 - t1) ** 2 / Math.sin(t2 + t1) ** 2
  const parallel = Math.tan(t2 - t1) ** 2 / Math.tan(t2 + t1) ** 2
  return { perpendicular, parallel, refractionDeg: t2 / DEG }
}

/** Beam transmittance of the cover system at an angle of incidence [deg]; 0 at and beyond 90°. */
export function coverTransmittance(spec: CoverSpec, incidenceDeg: number): number {
  const n = check(spec)
  if (incidenceDeg >= 90) return 0
  const { perpendicular, parallel, refractionDeg } = fresnelReflectance(incidenceDeg, spec.refractiveIndex)
  const tauA = Math.exp((-n * spec.extinctionThickness) / Math.cos(refractionDeg * DEG))
  const perComponent = (r: number) => (1 - r) / (1 + (2 * n - 1) * r)
  return 0.5 * (perComponent(perpendicular) + perComponent(parallel)) * tauA
}

/** Equivalent beam angles [deg] for isotropic diffuse sky and ground radiation on a cover of slope β [deg]. */
export function diffuseEquivalentAnglesDeg(slopeDeg: number): { skyDeg: number; groundDeg: number } {
  if (!(slopeDeg >= 0 && slopeDeg <= 90))
    throw new RangeError(`slope must be between 0 and 90°, got ${slopeDeg}`)
  return {
    skyDeg: 59.7 - 0.1388 * slopeDeg + 0.001497 * slopeDeg * slopeDeg,
    groundDeg: 90 - 0.5788 * slopeDeg + 0.002693 * slopeDeg * slopeDeg,
  }
}

/**
 * Transmitted irradiance [W/m²] through the cover for beam, sky-diffuse and ground-reflected parts on the
 * cover plane (isotropic-sky split, computed by the caller), with the beam's angle of incidence [deg].
 */
export function transmittedIrradianceWm2(
  spec: CoverSpec,
  parts: {
    beamWm2: number
    skyDiffuseWm2: number
    groundWm2: number
    incidenceDeg: number
    slopeDeg: number
  },
): number {
  const { skyDeg, groundDeg } = diffuseEquivalentAnglesDeg(parts.slopeDeg)
  return (
    parts.beamWm2 * coverTransmittance(spec, parts.incidenceDeg) +
    parts.skyDiffuseWm2 * coverTransmittance(spec, skyDeg) +
    parts.groundWm2 * coverTransmittance(spec, groundDeg)
  )
}
