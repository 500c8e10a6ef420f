/**
 * @module physics/evaporation-columns
 * Column form of wet-surface evaporation for the drying engine: one call per series, no allocation per hour.
 * Per hour: Penman (1948) open-water wind function (McMahon et al. 2013 Supplement S4.11) → equivalent
 * aerodynamic resistance → Penman combination equation in resistance form with Hyland–Wexler properties
 * (./evaporation.ts). Missing inputs (NaN) give NaN for that hour; out-of-range values throw with the hour index.
 */
import { aerodynamicResistanceFromPenmanWindSPerM, windFunctionPenman1948MmPerDayKpa } from './evaporation.ts'
import { wetSurfaceEvaporationKgPerM2H } from './wet-surface.ts'

/** Hourly inputs, all of one length. */
export interface WetSurfaceColumnsInput {
  /** Net radiation absorbed by the wet surface, minus heat conducted into the product [W/m²]. */
  availableEnergyWm2: Float64Array
  /** Air temperature [°C]. */
  airTempC: Float64Array
  /** Actual vapour pressure of the air [kPa]. */
  vaporPressureKpa: Float64Array
  /** Total (station) pressure [kPa]. */
  pressureKpa: Float64Array
  /** Wind speed at 2 m [m/s] (convert with windSpeedAt2mMs). */
  windAt2mMs: Float64Array
}

/**
 * Fill `outKgPerM2H[i]` with the wet-surface evaporation [kg m⁻² h⁻¹ = mm/h] of hour i (negative: dew).
 * Returns the number of hours written.
 */
export function wetSurfaceEvaporationColumnKgPerM2H(
  input: WetSurfaceColumnsInput,
  outKgPerM2H: Float64Array,
): number {
  const n = input.airTempC.length
  const columns: [string, Float64Array][] = [
    ['available energy', input.availableEnergyWm2],
    ['vapour pressure', input.vaporPressureKpa],
    ['pressure', input.pressureKpa],
    ['wind at 2 m', input.windAt2mMs],
    ['evaporation output', outKgPerM2H],
  ]
  for (const [name, c] of columns) {
    if (c.length < n) throw new RangeError(`${name} column holds ${c.length} values, needs ${n}`)
  }
  const { availableEnergyWm2, airTempC, vaporPressureKpa, pressureKpa, windAt2mMs } = input
  for (let i = 0; i < n; i++) {
    const a = availableEnergyWm2[i]
    const t = airTempC[i]
    const e = vaporPressureKpa[i]
    const p = pressureKpa[i]
    const u = windAt2mMs[i]
    if (Number.isNaN(a) || Number.isNaN(t) || Number.isNaN(e) || Number.isNaN(p) || Number.isNaN(u)) {
      outKgPerM2H[i] = Number.NaN
      continue
    }
    try {
      const ra = aerodynamicResistanceFromPenmanWindSPerM(windFunctionPenman1948MmPerDayKpa(u), t)
      outKgPerM2H[i] = wetSurfaceEvaporationKgPerM2H(a, 0, t, e, p, ra)
    } catch (error) {
      if (error instanceof RangeError) throw new RangeError(`hour ${i}: ${error.message}`)
      throw error
    }
  }
  return n
}
