/**
 * @module drying/deep-bed/grain-tables
 * Precomputed tables of a grain's equilibrium relative humidity ERH(T, M) and net heat of sorption q(T, M),
 * built once per grain from its own functions (`DeepBedGrain.erhPct`, `netSorptionHeatKjPerKg`) and read by
 * bilinear interpolation in the bin model's inner loop: the isotherm is evaluated there some tens of millions of
 * times per assessment, and a table read costs a few multiplications instead of the isotherm's exponentials,
 * range checks and closures.
 *
 * Grid and interpolation error (measured by dryhours against the exact functions, at the cell centres and
 * quarter points of every cell, for the five grain isotherms of the catalogue; checked again in
 * `test/drying/deep-bed/grain-tables.test.ts`):
 * - ERH, as water activity: nodes every 0.5 K from −20 to 60 °C and every 0.0005 kg/kg db from 0.02 to 0.60;
 *   largest error 1.0e-4 in aw (0.01 % RH), for shelled corn at −20 °C (the curvature of the modified
 *   Chung–Pfost equation in T is largest there); below 4e-5 for the other grains and above 0 °C.
 *   An error of 1e-4 in aw moves the equilibrium moisture by about 2e-5 kg/kg (0.002 points).
 * - Net heat of sorption: nodes every 1 K and 0.002 kg/kg; q enters only the energy balance, where it is a
 *   tenth or less of the latent heat; the largest relative error is stated by the test.
 * Outside the grid the exact functions are called (slower, same result).
 */
import type { DeepBedGrain } from './layer-model.ts'

/** Grid of the ERH table. */
export const ERH_TABLE_GRID = {
  tMinC: -20,
  tMaxC: 60,
  tStepC: 0.5,
  mMinDb: 0.02,
  mMaxDb: 0.6,
  mStepDb: 0.0005,
} as const

/** Grid of the sorption-heat table. */
export const SORPTION_HEAT_TABLE_GRID = {
  tMinC: -20,
  tMaxC: 60,
  tStepC: 0.5,
  mMinDb: 0.02,
  mMaxDb: 0.6,
  mStepDb: 0.001,
} as const

interface Grid {
  tMinC: number
  tMaxC: number
  tStepC: number
  mMinDb: number
  mMaxDb: number
  mStepDb: number
}

/** A 2-D table over (T, M) with bilinear interpolation; values node-major in M (row = one temperature). */
export class BilinearTable {
  /** Node values, row by row (one row per temperature, nM values each); read only. */
  readonly values: Float64Array
  readonly nT: number
  readonly nM: number
  /** Grid origin and inverse spacings, and the last cell index + 1 in each direction (for inline reads). */
  readonly tMin: number
  readonly mMin: number
  readonly invDt: number
  readonly invDm: number
  readonly tSpan: number
  readonly mSpan: number

  constructor(grid: Grid, f: (tC: number, mDb: number) => number) {
    this.nT = Math.round((grid.tMaxC - grid.tMinC) / grid.tStepC) + 1
    this.nM = Math.round((grid.mMaxDb - grid.mMinDb) / grid.mStepDb) + 1
    this.tMin = grid.tMinC
    this.mMin = grid.mMinDb
    this.invDt = 1 / grid.tStepC
    this.invDm = 1 / grid.mStepDb
    this.tSpan = this.nT - 1
    this.mSpan = this.nM - 1
    this.values = new Float64Array(this.nT * this.nM)
    for (let i = 0; i < this.nT; i++) {
      const t = grid.tMinC + i * grid.tStepC
      const row = i * this.nM
      for (let j = 0; j < this.nM; j++) this.values[row + j] = f(t, grid.mMinDb + j * grid.mStepDb)
    }
  }

  private readonly scratch = new Float64Array(2)

  /** Interpolated value, or NaN outside the grid (the caller then uses the exact function). */
  at(tC: number, mDb: number): number {
    return this.atWithSlopes(tC, mDb, this.scratch)
  }

  /**
   * As {@link at}, and writes the interpolant's partial derivatives ∂/∂T [per K] and ∂/∂M [per kg/kg db] to
   * `slopes[0]`, `slopes[1]` (those of the bilinear cell; NaN outside the grid, slopes untouched).
   */
  atWithSlopes(tC: number, mDb: number, slopes: Float64Array): number {
    const s = (tC - this.tMin) * this.invDt
    const r = (mDb - this.mMin) * this.invDm
    if (!(s >= 0 && s < this.tSpan && r >= 0 && r < this.mSpan)) return Number.NaN
    const i = s | 0
    const j = r | 0
    const u = s - i
    const v = r - j
    const k = i * this.nM + j
    const a = this.values
    const k2 = k + this.nM
    const dLo = a[k + 1] - a[k]
    const dHi = a[k2 + 1] - a[k2]
    const lo = a[k] + v * dLo
    const hi = a[k2] + v * dHi
    slopes[0] = (hi - lo) * this.invDt
    slopes[1] = (dLo + u * (dHi - dLo)) * this.invDm
    return lo + u * (hi - lo)
  }
}

/** The tables of one grain, with the exact functions as fallback outside the grids. */
export class GrainTables {
  readonly erh: BilinearTable
  readonly sorptionHeat: BilinearTable | null
  constructor(readonly grain: DeepBedGrain) {
    this.erh = new BilinearTable(ERH_TABLE_GRID, (t, m) => grain.erhPct(t, m))
    const q = grain.netSorptionHeatKjPerKg
    this.sorptionHeat = q ? new BilinearTable(SORPTION_HEAT_TABLE_GRID, (t, m) => q.call(grain, t, m)) : null
  }

  /** ERH [%] at tC and moisture [kg/kg db]. */
  erhPct(tC: number, mDb: number): number {
    const v = this.erh.at(tC, mDb)
    return !Number.isNaN(v) ? v : this.grain.erhPct(tC, mDb)
  }

  /**
   * ERH [%] and its partial derivatives [%/K, %/(kg/kg db)] in `slopes[0..1]`; outside the grid the exact
   * function with central differences (0.01 K, 1e-5 kg/kg).
   */
  erhPctWithSlopes(tC: number, mDb: number, slopes: Float64Array): number {
    const v = this.erh.atWithSlopes(tC, mDb, slopes)
    if (!Number.isNaN(v)) return v
    const g = this.grain
    const dm = Math.min(1e-5, 0.5 * mDb)
    slopes[0] = (g.erhPct(tC + 0.01, mDb) - g.erhPct(tC - 0.01, mDb)) / 0.02
    slopes[1] = (g.erhPct(tC, mDb + dm) - g.erhPct(tC, mDb - dm)) / (2 * dm)
    return g.erhPct(tC, mDb)
  }

  /** Net heat of sorption [kJ/kg water]; 0 when the grain has none. */
  netSorptionHeatKjPerKg(tC: number, mDb: number): number {
    if (this.sorptionHeat === null) return 0
    const v = this.sorptionHeat.at(tC, mDb)
    return !Number.isNaN(v) ? v : (this.grain.netSorptionHeatKjPerKg?.(tC, mDb) ?? 0)
  }
}

const cache = new WeakMap<DeepBedGrain, GrainTables>()

/**
 * The tables of `grain`, built on first use and kept while the grain object lives (about 190,000 ERH and
 * 17,000 sorption-heat evaluations; tens of milliseconds). Build a grain once and reuse it across runs.
 */
export function grainTables(grain: DeepBedGrain): GrainTables {
  let t = cache.get(grain)
  if (!t) {
    t = new GrainTables(grain)
    cache.set(grain, t)
  }
  return t
}
