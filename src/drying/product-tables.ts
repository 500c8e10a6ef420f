/**
 * @module drying/product-tables
 * A {@link ProductResponse} whose equilibrium moisture and step parameters are read from grids in
 * temperature and RH, filled lazily (a node is computed the first time an hour needs it) and
 * interpolated bilinearly. A 30-year series needs ~500,000 hour evaluations but only a few thousand
 * distinct grid nodes, so this keeps the per-hour engine fast. Grid: {@link GRID_T_STEP_C} °C ×
 * {@link GRID_RH_STEP_PCT} % RH; the interpolation error is checked against direct evaluation in the
 * tests (within 0.5 % of the value over the weather range).
 */
import {
  EMC_RH_CAP_PCT,
  HOUR_EMC_ADSORPTION,
  HOUR_EMC_DESORPTION,
  HOUR_RATE_K,
  HOUR_RATE_N,
  type ProductResponse,
} from './product-response.ts'

export const GRID_T_STEP_C = 0.5
export const GRID_RH_STEP_PCT = 0.5
const T_MIN = -20
const T_MAX = 100
const NT = Math.round((T_MAX - T_MIN) / GRID_T_STEP_C) + 1
const NRH = Math.round(100 / GRID_RH_STEP_PCT) + 1

interface Grid {
  values: Float64Array
  compute: (tC: number, rhPct: number) => number
}

function makeGrid(compute: (tC: number, rhPct: number) => number): Grid {
  return { values: new Float64Array(NT * NRH).fill(Number.NaN), compute }
}

function node(g: Grid, it: number, ir: number): number {
  const k = it * NRH + ir
  const v = g.values[k]
  return Number.isNaN(v) ? fillNode(g, it, ir) : v
}

/** Compute, store and return node (it, ir) of `g` (its first use). */
function fillNode(g: Grid, it: number, ir: number): number {
  const v = g.compute(T_MIN + it * GRID_T_STEP_C, Math.min(ir * GRID_RH_STEP_PCT, EMC_RH_CAP_PCT))
  g.values[it * NRH + ir] = v
  return v
}

/**
 * Cell of the last {@link locate} call: [x index, RH index, x fraction, RH fraction], then its inputs
 * [tC, rhPct] in slots 4 and 5.
 */
const cell = new Float64Array(6)

/** Grid cell and fractions of (cell[4] °C, cell[5] % RH) into {@link cell}. */
function locate(): void {
  const tC = cell[4]
  const rhPct = cell[5]
  let x = (tC - T_MIN) / GRID_T_STEP_C
  let y = rhPct / GRID_RH_STEP_PCT
  if (x < 0) x = 0
  else if (x > NT - 1.000001) x = NT - 1.000001
  if (y < 0) y = 0
  else if (y > NRH - 1.000001) y = NRH - 1.000001
  const it = Math.floor(x)
  const ir = Math.floor(y)
  cell[0] = it
  cell[1] = ir
  cell[2] = x - it
  cell[3] = y - ir
}

/**
 * Bilinear value of `g` in the cell of the last {@link locate}, written to out[slot]. Reads the cell from {@link cell} and writes to an array, so no double crosses
 * the call (V8 boxes doubles passed to or returned from a call it does not inline).
 */
function interpolateInto(g: Grid, out: Float64Array, slot: number): void {
  const it = cell[0]
  const ir = cell[1]
  const fx = cell[2]
  const fy = cell[3]
  // the four nodes read in place (a double returned from a call that is not inlined is boxed: one heap
  // number per node per hour); a node not yet computed is filled first
  const values = g.values
  const k = it * NRH + ir
  if (Number.isNaN(values[k])) fillNode(g, it, ir)
  if (Number.isNaN(values[k + NRH])) fillNode(g, it + 1, ir)
  if (Number.isNaN(values[k + 1])) fillNode(g, it, ir + 1)
  if (Number.isNaN(values[k + NRH + 1])) fillNode(g, it + 1, ir + 1)
  const a = values[k]
  const b = values[k + NRH]
  const c = values[k + 1]
  const d = values[k + NRH + 1]
  out[slot] = (a * (1 - fx) + b * fx) * (1 - fy) + (c * (1 - fx) + d * fx) * fy
}

/** One value of the separate calls (not the engine's hour): same cell and interpolation as the hour response. */
const lookupOut = new Float64Array(1)

function lookup(g: Grid, tC: number, rhPct: number): number {
  cell[4] = tC
  cell[5] = rhPct
  locate()
  interpolateInto(g, lookupOut, 0)
  return lookupOut[0]
}

/**
 * Wrap `direct` so that EMC (both directions) and the step parameters come from lazily filled grids.
 * `erhPct` at a fixed moisture is cached per 0.1 °C (it is asked for the target moisture every hour).
 * Thompson's parameters (k = temperature) pass through unchanged.
 */
export function tabulatedResponse(direct: ProductResponse): ProductResponse {
  const des = makeGrid((t, rh) => direct.emcDesorptionDb(t, rh))
  const sameIsotherm = direct.profile.isotherm.adsorption === undefined
  const ads = sameIsotherm ? des : makeGrid((t, rh) => direct.emcAdsorptionDb(t, rh))
  const scratch = new Float64Array(2)
  const scratchStep = new Float64Array(2)
  // k varies over orders of magnitude with T: the grid holds ln k.
  const lnKGrid = makeGrid((t, rh) => {
    direct.stepParameters(t, rh, scratch)
    return Math.log(scratch[0])
  })
  const nGrid = makeGrid((t, rh) => {
    direct.stepParameters(t, rh, scratch)
    return scratch[1]
  })
  const thompson = direct.profile.kinetics.equation.model === 'thompson-corn'
  const constantN =
    direct.profile.kinetics.equation.model !== 'page' ||
    typeof direct.profile.kinetics.equation.n === 'number'
  // ERH at one moisture (the target, asked every hour) cached per 0.1 °C from −20 to 100 °C.
  let erhMoisture = Number.NaN
  const erhCache = new Float64Array(1201).fill(Number.NaN)
  // every field written out (no spread copy of `direct`: a copy gets an object shape of its own each time, and the
  // hour functions compiled for the last assessment's product would be compiled again)
  return {
    profile: direct.profile,
    thicknessMm: direct.thicknessMm,
    thompsonTimeScale: direct.thompsonTimeScale,
    rewettingRateFactor: direct.rewettingRateFactor,
    emcDesorptionDb: (t, rh) => lookup(des, t, rh),
    emcAdsorptionDb: (t, rh) => lookup(ads, t, rh),
    erhPct: (t, m) => {
      const key = Math.round(t * 10)
      if (m !== erhMoisture) {
        // another moisture (a batch's own, hour by hour): the same value, not cached; the cache keeps the
        // first moisture asked for (refilling it for every batch moisture cost more than it saved)
        if (!Number.isNaN(erhMoisture)) return direct.erhPct(key / 10, m)
        erhMoisture = m
      }
      const slot = key + 200
      if (!(slot >= 0 && slot < erhCache.length)) return direct.erhPct(key / 10, m)
      let v = erhCache[slot]
      if (Number.isNaN(v)) {
        v = direct.erhPct(key / 10, m)
        erhCache[slot] = v
      }
      return v
    },
    hourResponse: (t, rh, out) => {
      // one cell location for all grids of the hour (same values as the separate lookups)
      cell[4] = t
      cell[5] = rh
      locate()
      interpolateInto(des, out, HOUR_EMC_DESORPTION)
      if (sameIsotherm) out[HOUR_EMC_ADSORPTION] = out[HOUR_EMC_DESORPTION]
      else interpolateInto(ads, out, HOUR_EMC_ADSORPTION)
      if (thompson) {
        direct.stepParameters(t, rh, scratchStep)
        out[HOUR_RATE_K] = scratchStep[0]
        out[HOUR_RATE_N] = scratchStep[1]
        return
      }
      interpolateInto(lnKGrid, out, HOUR_RATE_K)
      out[HOUR_RATE_K] = Math.exp(out[HOUR_RATE_K])
      if (constantN) out[HOUR_RATE_N] = node(nGrid, 0, 0)
      else interpolateInto(nGrid, out, HOUR_RATE_N)
    },
    stepParameters: (t, rh, out) => {
      if (thompson) {
        direct.stepParameters(t, rh, out)
        return
      }
      out[0] = Math.exp(lookup(lnKGrid, t, rh))
      out[1] = constantN ? node(nGrid, 0, 0) : lookup(nGrid, t, rh)
    },
  }
}
