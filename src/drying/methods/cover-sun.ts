/**
 * @module drying/methods/cover-sun
 * The sun that passes a horizontal transparent cover onto the floor under it (solar tunnel, greenhouse dryer):
 * the measured global irradiance split into beam and diffuse by Erbs et al. (1982) (physics/irradiance.ts), the
 * beam transmitted at the sun's zenith angle and the diffuse at the equivalent angle of an isotropic sky
 * (Brandemuehl & Beckman 1980 via Duffie & Beckman), each by Fresnel reflection and Bouguer absorption
 * (physics/cover-transmittance.ts). The beam transmittance is tabulated every whole degree once per series.
 */
import {
  type CoverSpec,
  coverTransmittance,
  diffuseEquivalentAnglesDeg,
} from '../../physics/cover-transmittance.ts'
import { diffuseHorizontalErbsWm2 } from '../../physics/irradiance.ts'

/** Beam transmittance every whole degree of incidence 0…90 (one table per series: no allocation per hour). */
function transmittanceTable(cover: CoverSpec): Float64Array {
  const t = new Float64Array(92)
  for (let d = 0; d <= 89; d++) t[d] = coverTransmittance(cover, d)
  return t
}

/** Linear interpolation in the table at `incidenceDeg` (0 at and beyond 90°). */
function tableTransmittance(table: Float64Array, incidenceDeg: number): number {
  if (!(incidenceDeg < 89)) return incidenceDeg >= 90 ? 0 : table[89] * (90 - incidenceDeg)
  const x = Math.max(incidenceDeg, 0)
  const i = Math.floor(x)
  const f = x - i
  return table[i] * (1 - f) + table[i + 1] * f
}

/** The transmittances of one cover, held for a series. */
export class HorizontalCoverSun {
  private readonly table: Float64Array
  private readonly diffuseTau: number

  constructor(cover: CoverSpec) {
    this.table = transmittanceTable(cover)
    this.diffuseTau = tableTransmittance(this.table, diffuseEquivalentAnglesDeg(0).skyDeg)
  }

  /**
   * Irradiance through the cover onto the floor [W/m²] of global horizontal irradiance `ghiWm2`, with the
   * extraterrestrial horizontal irradiance `raWm2` (for the diffuse split) and the sun `altitudeDeg` high.
   */
  transmittedWm2(ghiWm2: number, raWm2: number, altitudeDeg: number): number {
    if (!(ghiWm2 > 0)) return 0
    const diffuse = diffuseHorizontalErbsWm2(ghiWm2, raWm2)
    const beam = ghiWm2 - diffuse
    return beam * tableTransmittance(this.table, 90 - altitudeDeg) + diffuse * this.diffuseTau
  }
}
