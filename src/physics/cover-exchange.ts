/**
 * @module physics/cover-exchange
 * The temperature of a thin transparent cover (film or pane) between the warm air under it and the ambient air
 * outside, from convection on its two faces: h_in·(T_in − T_c) = h_out·(T_c − T_out), so
 * T_c = (h_in·T_in + h_out·T_out)/(h_in + h_out). What it leaves out, stated: the sun the cover itself absorbs
 * (a few per cent for clear film or low-iron glass) and its own long-wave exchange with the sky and with what
 * lies under it; both enter the cover balance of the solar tunnel model of Bala & Woods (1994), as written out
 * in Bala's tunnel drier model (International Solar Food Processing Conference 2009, eq 1: convection to the
 * ambient and to the tunnel air, radiation to the sky and from the absorber or product below; transcribed), of
 * which this keeps the two convection terms.
 */

/**
 * Temperature [°C] of a thin cover with convective coefficients `insideWm2K` (to the air at `insideC`) and
 * `outsideWm2K` (to the ambient air at `outsideC`) [W m⁻² K⁻¹] (see the module note).
 */
export function thinCoverTemperatureC(
  insideWm2K: number,
  insideC: number,
  outsideWm2K: number,
  outsideC: number,
): number {
  if (!(insideWm2K >= 0 && outsideWm2K >= 0 && insideWm2K + outsideWm2K > 0)) {
    throw new RangeError(
      `cover heat-transfer coefficients must be >= 0 with a positive sum, got ${insideWm2K} and ${outsideWm2K} W m⁻² K⁻¹`,
    )
  }
  return (insideWm2K * insideC + outsideWm2K * outsideC) / (insideWm2K + outsideWm2K)
}
