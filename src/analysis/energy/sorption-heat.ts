/**
 * @module analysis/energy/sorption-heat
 * Extra heat to remove bound water, beyond the latent heat of free water, derived from the product's own
 * isotherm by the Clausius–Clapeyron relation at constant moisture: q_net = R_w·T²·∂ln aw/∂T
 * (= −R_w·∂ln aw/∂(1/T)), R_w = R/M_w (drying-science.md §4.1, "preferred" method; e.g. Iglesias & Chirife
 * 1976). Integrated over the moisture removed it gives the sorption heat of a batch:
 * Q = m_dry·∫ q_net(M) dM from M_final to M_initial (dry basis). This keeps energy consistent with the EMC model.
 */

import { KELVIN_OFFSET } from '../../physics/saturation.ts'
import { erhPct, GAS_CONSTANT_J_PER_MOL_K, type IsothermEquation } from '../../product/isotherm-models.ts'

/** Molar mass of water [kg/mol], 18.015268 g/mol (IAPWS-95, Wagner & Pruss 2002). */
const MOLAR_MASS_WATER_KG_PER_MOL = 0.018015268
/** Specific gas constant of water vapour [J kg⁻¹ K⁻¹] = R/M_w ≈ 461.52. */
export const GAS_CONSTANT_WATER_VAPOR_J_PER_KG_K = GAS_CONSTANT_J_PER_MOL_K / MOLAR_MASS_WATER_KG_PER_MOL
/** Half-width of the central difference in temperature [K]: small against the isotherm's curvature (choice). */
const DT_K = 0.5

/**
 * Net isosteric heat of sorption [MJ per kg water] at `moistureDb` [kg/kg d.b.] and `tC` [°C]: zero where the
 * isotherm holds free water (aw = 1). Throws RangeError outside the isotherm's domain.
 */
export function netIsostericHeatMjPerKg(eq: IsothermEquation, tC: number, moistureDb: number): number {
  const awLow = erhPct(eq, tC - DT_K, moistureDb) / 100
  const awHigh = erhPct(eq, tC + DT_K, moistureDb) / 100
  if (awLow >= 1 || awHigh >= 1) return 0
  const dLnAwDT = (Math.log(awHigh) - Math.log(awLow)) / (2 * DT_K)
  const tK = tC + KELVIN_OFFSET
  return Math.max(0, (GAS_CONSTANT_WATER_VAPOR_J_PER_KG_K * tK * tK * dLnAwDT) / 1e6)
}

/** Intervals of the Simpson rule over the moisture range (even; 40 is far below the isotherm's error). */
const SIMPSON_INTERVALS = 40

/**
 * Sorption heat [MJ] of drying `dryMatterKg` from `initialDb` to `finalDb` (kg/kg d.b.) at `tC`: composite
 * Simpson rule of {@link netIsostericHeatMjPerKg} over M.
 */
export function batchSorptionHeatMj(
  eq: IsothermEquation,
  tC: number,
  dryMatterKg: number,
  initialDb: number,
  finalDb: number,
): number {
  if (!(finalDb > 0 && initialDb > finalDb)) {
    throw new RangeError(
      `sorption heat needs 0 < final < initial moisture (d.b.), got ${finalDb} and ${initialDb}`,
    )
  }
  const h = (initialDb - finalDb) / SIMPSON_INTERVALS
  let sum = 0
  for (let i = 0; i <= SIMPSON_INTERVALS; i++) {
    const w = i === 0 || i === SIMPSON_INTERVALS ? 1 : i % 2 === 1 ? 4 : 2
    sum += w * netIsostericHeatMjPerKg(eq, tC, finalDb + i * h)
  }
  return (dryMatterKg * sum * h) / 3
}
