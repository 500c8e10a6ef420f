/**
 * @module analysis/energy/sorption-heat
 * Sorption heat of a batch: the net isosteric heat of the product's isotherm (product/sorption-heat.ts,
 * Clausius–Clapeyron) integrated over the moisture removed, Q = m_dry·∫ q_net(M) dM from M_final to
 * M_initial (dry basis), so that energy stays consistent with the equilibrium model.
 */
import type { IsothermEquation } from '../../product/isotherm-models.ts'
import { netIsostericHeatMjPerKg } from '../../product/sorption-heat.ts'

/** Intervals of the Simpson rule over the moisture range (even; 40 is far below the isotherm's error). */
const SIMPSON_INTERVALS = 40

/**
 * Sorption heat [MJ] of drying `dryMatterKg` from `initialDb` to `finalDb` (kg/kg d.b.) at `tC`: composite
 * Simpson rule of net isosteric heat (product/sorption-heat.ts) over M.
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
