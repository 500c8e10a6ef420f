/**
 * @module drying/water-activity-table
 * Water activity of the product at its temperature and moisture, from its desorption isotherm
 * (product/equilibrium.ts `equilibriumRelativeHumidityPct`), read from a lazily filled grid: the spoilage
 * models step every hour of every batch with the product's water activity, and a batch's moisture changes
 * every hour, so a cache keyed on one moisture (as for the target's equilibrium RH) does not serve.
 *
 * Grid: temperature from −20 to 100 °C every {@link AW_GRID_T_STEP_C} °C; moisture on the wet-basis
 * fraction from 0 to {@link AW_GRID_WB_MAX} every {@link AW_GRID_WB_STEP} (0.25 % wb): water activity
 * is smooth in wet-basis moisture over the whole drying range (it is near 1 for fresh produce and falls
 * steeply below about 40 % wb), while the dry-basis axis would crowd every dried product into its first
 * cells. Linear in moisture at the nearest temperature node; its error against the isotherm is checked in
 * the tests.
 * Outside the grid: temperature held at its ends; moisture above the top row reads the top row; a node the
 * isotherm cannot evaluate (outside its domain) reads 1 (the wet, safe-side value for spoilage).
 */
import { equilibriumRelativeHumidityPct } from '../product/equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from '../product/isotherm-models.ts'
import type { ProductProfile } from '../product/profile.ts'

export const AW_GRID_T_STEP_C = 0.5
export const AW_GRID_WB_STEP = 0.0025
/** Highest wet-basis fraction of the grid (99 % wb); wetter products read this row. */
export const AW_GRID_WB_MAX = 0.99
const T_MIN = -20
const T_MAX = 100
const NT = Math.round((T_MAX - T_MIN) / AW_GRID_T_STEP_C) + 1
const NU = Math.round(AW_GRID_WB_MAX / AW_GRID_WB_STEP) + 1

/** Water activity (0–1) of `profile` at tC and moisture [kg/kg db], evaluated directly (the grid's nodes). */
export function waterActivityDirect(profile: ProductProfile, tC: number, moistureDb: number): number {
  if (!(moistureDb > 0)) return 0
  const t = tC < ISOTHERM_T_MIN_C ? ISOTHERM_T_MIN_C : Math.min(tC, ISOTHERM_T_MAX_C)
  try {
    const aw = equilibriumRelativeHumidityPct(profile, t, moistureDb, 'desorption') / 100
    return Math.min(Math.max(aw, 0), 1)
  } catch {
    return 1
  }
}

/** A lazily filled water-activity grid of one product (one per assessment, shared by every batch). */
export class WaterActivityTable {
  /** Node values, NaN until computed: index it·NU + iu. */
  private readonly values = new Float64Array(NT * NU).fill(Number.NaN)
  constructor(readonly profile: ProductProfile) {}

  /** Compute and store node (it, iu) (its first use). */
  private fill(it: number, iu: number): void {
    const u = iu * AW_GRID_WB_STEP
    this.values[it * NU + iu] = waterActivityDirect(this.profile, T_MIN + it * AW_GRID_T_STEP_C, u / (1 - u))
  }

  /** In: product temperature [°C] for {@link lookup}. */
  tC = Number.NaN
  /** In: moisture [kg/kg db] for {@link lookup}. */
  moistureDb = Number.NaN
  /** Out: the water activity of the last {@link lookup}. */
  aw = Number.NaN

  /**
   * Water activity (0–1) at `tC` [°C] and `moistureDb` [kg/kg db] into `aw`, through fields (the hour loops call
   * it: no number crosses the call). Linear in moisture on the grid row of the nearest temperature node (water
   * activity changes by a few thousandths per kelvin, so the nearest row, at most 0.25 K away, costs less than
   * the moisture interpolation and halves the reads).
   */
  lookup(): void {
    const m = this.moistureDb
    let x = (this.tC - T_MIN) / AW_GRID_T_STEP_C + 0.5
    let y = m / (1 + m) / AW_GRID_WB_STEP
    if (!(x > 0)) x = 0
    else if (x > NT - 1) x = NT - 1
    if (!(y > 0)) y = 0
    else if (y > NU - 1.000001) y = NU - 1.000001
    const it = Math.floor(x)
    const iu = Math.floor(y)
    // the two nodes read in place (no double returned from a call: it would be boxed), filled on first use
    const values = this.values
    const k = it * NU + iu
    if (Number.isNaN(values[k])) this.fill(it, iu)
    if (Number.isNaN(values[k + 1])) this.fill(it, iu + 1)
    const a = values[k]
    this.aw = a + (values[k + 1] - a) * (y - iu)
  }

  /** Water activity (0–1) at product temperature tC [°C] and moisture [kg/kg db] (the {@link lookup} as a call). */
  at(tC: number, moistureDb: number): number {
    this.tC = tC
    this.moistureDb = moistureDb
    this.lookup()
    return this.aw
  }
}
