/**
 * @module physics/saturation-table
 * Saturation vapour pressure (ASHRAE HOF 2017 ch. 1 eqs 5–6, Hyland–Wexler) and its first two
 * derivatives, by piecewise cubic Hermite interpolation of a table built once from the exact formulas.
 * The temperature solvers (dew point, wet bulb) evaluate saturation several times per state; the table
 * replaces an exp and a log per evaluation by a few multiplications.
 *
 * The inverse, temperature as a function of ln pws (the dew or frost point of a vapour pressure), is
 * tabulated the same way on a uniform grid of ln pws, as the start value of the dew-point solver.
 *
 * Accuracy: nodes every 1/8 K carry the exact pws and dpws/dT, so the interpolation error is at most
 * max|pws⁗|·h⁴/384 ≈ (d ln pws/dT)⁴·h⁴/384 relative: below 1e-9 from −100 to 200 °C over liquid
 * water and over ice, largest at −100 °C (checked against eqs 5–6 in
 * test/physics/saturation-table.test.ts), i.e. under 1e-8 °C in a dew point or wet bulb.
 */
import { KELVIN_OFFSET } from './constants.ts'
import {
  dLnSaturationPressureIceDT,
  dLnSaturationPressureLiquidDT,
  lnSaturationPressureIcePa,
  lnSaturationPressureLiquidPa,
  SATURATION_MAX_C,
  SATURATION_MIN_C,
} from './saturation.ts'

/** Node spacing [K]. */
const STEP_C = 0.125
const INV_STEP = 1 / STEP_C
/** Highest tabulated temperature over ice [°C]: the first node above the triple point. */
const ICE_MAX_C = 0.125

function build(minC: number, maxC: number, ice: boolean): Float64Array {
  const nodes = Math.round((maxC - minC) * INV_STEP) + 1
  // Per node: pws [kPa], H·dpws/dT [kPa] (slope already multiplied by the spacing).
  const table = new Float64Array(2 * nodes)
  for (let k = 0; k < nodes; k++) {
    const tK = minC + k * STEP_C + KELVIN_OFFSET
    const pws = Math.exp(ice ? lnSaturationPressureIcePa(tK) : lnSaturationPressureLiquidPa(tK)) / 1000
    table[2 * k] = pws
    table[2 * k + 1] =
      STEP_C * pws * (ice ? dLnSaturationPressureIceDT(tK) : dLnSaturationPressureLiquidDT(tK))
  }
  return table
}

const LIQUID = build(SATURATION_MIN_C, SATURATION_MAX_C, false)
/**
 * The liquid-water table itself, for loops that interpolate it inline (air-columns.ts): node k at
 * −100 + k/8 °C holds [pws kPa, (1/8 K)·dpws/dT kPa]. Read only.
 */
export const LIQUID_SATURATION_TABLE: Readonly<Float64Array> = LIQUID
/** Nodes per kelvin of {@link LIQUID_SATURATION_TABLE}. */
export const SATURATION_TABLE_NODES_PER_K = INV_STEP
const ICE = build(SATURATION_MIN_C, ICE_MAX_C, true)
const LIQUID_LAST = LIQUID.length / 2 - 2
const ICE_LAST = ICE.length / 2 - 2

/** dpws/dT [kPa/K] and d²pws/dT² [kPa/K²] of the last {@link saturationPressureFromTableKpa} call. */
export const saturationTableSlopes = new Float64Array(2)

/**
 * Saturation pressure [kPa] at `tC` [°C] over ice (`ice`) or liquid water, from the table; also writes
 * its first and second derivatives to {@link saturationTableSlopes}. Valid for −100…200 °C (ice:
 * −100…0.125 °C); outside, the end intervals are extrapolated (callers keep inside).
 */
export function saturationPressureFromTableKpa(tC: number, ice: boolean): number {
  const table = ice ? ICE : LIQUID
  const last = ice ? ICE_LAST : LIQUID_LAST
  const s = (tC - SATURATION_MIN_C) * INV_STEP
  let k = Math.floor(s)
  if (k < 0) k = 0
  else if (k > last) k = last
  const u = s - k
  const j = 2 * k
  const y0 = table[j]
  const m0 = table[j + 1]
  const y1 = table[j + 2]
  const m1 = table[j + 3]
  // Cubic Hermite in u ∈ [0, 1): p = y0 + m0 u + c2 u² + c3 u³.
  const c2 = 3 * (y1 - y0) - 2 * m0 - m1
  const c3 = 2 * (y0 - y1) + m0 + m1
  saturationTableSlopes[0] = (m0 + u * (2 * c2 + 3 * c3 * u)) * INV_STEP
  saturationTableSlopes[1] = (2 * c2 + 6 * c3 * u) * INV_STEP * INV_STEP
  return y0 + u * (m0 + u * (c2 + u * c3))
}

/**
 * The liquid-water branch of {@link saturationPressureFromTableKpa} (the same value and first derivative, to the
 * bit) with dpws/dT [kPa/K] written to the caller's `slope[0]` and no second derivative: small enough for the
 * compiler to inline into a solver's inner loop (the bin model's layer solver calls it some ten million times
 * per assessment; as a call it cost that loop about 5 %, measured in `bench/sections/bins.ts`'s workload).
 */
export function liquidSaturationPressureFromTableKpa(tC: number, slope: Float64Array): number {
  const s = (tC - SATURATION_MIN_C) * INV_STEP
  let k = Math.floor(s)
  if (k < 0) k = 0
  else if (k > LIQUID_LAST) k = LIQUID_LAST
  const u = s - k
  const j = 2 * k
  const y0 = LIQUID[j]
  const m0 = LIQUID[j + 1]
  const y1 = LIQUID[j + 2]
  const m1 = LIQUID[j + 3]
  const c2 = 3 * (y1 - y0) - 2 * m0 - m1
  const c3 = 2 * (y0 - y1) + m0 + m1
  slope[0] = (m0 + u * (2 * c2 + 3 * c3 * u)) * INV_STEP
  return y0 + u * (m0 + u * (c2 + u * c3))
}

/** Scratch for the slope {@link liquidSaturationValueFromTableKpa} does not return. */
const unreadSlope = new Float64Array(1)

/**
 * The value alone of {@link liquidSaturationPressureFromTableKpa} [kPa] at `tC` [°C] (the same number, to the bit),
 * for callers that do not read the slope.
 */
export function liquidSaturationValueFromTableKpa(tC: number): number {
  return liquidSaturationPressureFromTableKpa(tC, unreadSlope)
}

/** Node spacing of the inverse table in ln(pws/Pa). */
const LN_STEP = 0.02
const INV_LN_STEP = 1 / LN_STEP

interface InverseTable {
  lnMin: number
  last: number
  /** Per node: t [°C], LN_STEP·dt/d ln pws [K]. */
  nodes: Float64Array
}

function buildInverse(ice: boolean): InverseTable {
  const ln = ice ? lnSaturationPressureIcePa : lnSaturationPressureLiquidPa
  const dln = ice ? dLnSaturationPressureIceDT : dLnSaturationPressureLiquidDT
  const lnMin = ln(SATURATION_MIN_C + KELVIN_OFFSET)
  const lnMax = ln((ice ? ICE_MAX_C : SATURATION_MAX_C) + KELVIN_OFFSET)
  const count = Math.ceil((lnMax - lnMin) * INV_LN_STEP) + 2
  const nodes = new Float64Array(2 * count)
  let tK = SATURATION_MIN_C + KELVIN_OFFSET
  for (let k = 0; k < count; k++) {
    const target = lnMin + k * LN_STEP
    // Newton on the exact eq 5/6 from the previous node: converged to rounding in a few steps.
    for (let i = 0; i < 50; i++) {
      const step = (ln(tK) - target) / dln(tK)
      tK -= step
      if (Math.abs(step) < 1e-12) break
    }
    nodes[2 * k] = tK - KELVIN_OFFSET
    nodes[2 * k + 1] = LN_STEP / dln(tK)
  }
  return { lnMin, last: count - 2, nodes }
}

const INVERSE_LIQUID = buildInverse(false)
const INVERSE_ICE = buildInverse(true)

/**
 * Temperature [°C] at which pws over ice (`ice`) or liquid water equals exp(`lnPressurePa`) Pa, from the
 * inverse table (cubic Hermite in ln pws; interpolation error below 1e-9 °C). Outside −100…200 °C
 * (ice: −100…0.125 °C) the end intervals are extrapolated: a start value only there.
 */
export function saturationTemperatureFromTableC(lnPressurePa: number, ice: boolean): number {
  const table = ice ? INVERSE_ICE : INVERSE_LIQUID
  const s = (lnPressurePa - table.lnMin) * INV_LN_STEP
  let k = Math.floor(s)
  if (k < 0) k = 0
  else if (k > table.last) k = table.last
  const u = s - k
  const n = table.nodes
  const j = 2 * k
  const y0 = n[j]
  const m0 = n[j + 1]
  const y1 = n[j + 2]
  const m1 = n[j + 3]
  const c2 = 3 * (y1 - y0) - 2 * m0 - m1
  const c3 = 2 * (y0 - y1) + m0 + m1
  return y0 + u * (m0 + u * (c2 + u * c3))
}
