/**
 * @module analysis/psychrometric
 * What the psychrometric chart of a report shows, computed with the assessment: the site's hours binned
 * by dry bulb and humidity ratio (each hour's own station pressure), the boundary of the air that dries
 * the product to its target, the share of hours under it, and the curves of constant relative humidity
 * at the site's median pressure. The humidity ratio is ASHRAE HOF 2017 ch. 1 eq 20 from the hour's RH
 * over liquid water (eq 6); the boundary is the product isotherm's equilibrium RH at the target moisture
 * (product/equilibrium.ts) as a humidity ratio at that pressure.
 */
import { humidityRatioFromRh } from '../physics/air-processes.ts'
import { MS_PER_HOUR } from '../physics/constants.ts'
import { humidityRatioFromVaporPressure, STANDARD_PRESSURE_KPA } from '../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../physics/saturation.ts'
import { equilibriumRelativeHumidityPct } from '../product/equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from '../product/isotherm-models.ts'
import { moistureDbFromWbPct } from '../product/moisture-basis.ts'
import type { ProductProfile } from '../product/profile.ts'
import type { HourlySeries } from '../weather/series.ts'
import { orderStatistic } from './statistics.ts'

export interface PsychroCell {
  /** Lower edge of the dry-bulb bin [°C]. */
  dryBulbC: number
  /** Lower edge of the humidity-ratio bin [g/kg]. */
  humidityRatioGPerKg: number
  hours: number
}

export interface PsychroDensity {
  binDryBulbC: number
  binHumidityRatioGPerKg: number
  /** Plotted dry-bulb range [°C] (bin edges, covering 99.8 % of the hours or more). */
  dryBulbRangeC: [number, number]
  /** Top of the humidity-ratio axis [g/kg]. */
  humidityRatioMaxGPerKg: number
  cells: PsychroCell[]
  /** Hours binned (with dry bulb, RH and pressure present). */
  hoursCounted: number
  /** Median station pressure of the counted hours [kPa], for the RH curves. */
  pressureKpa: number
}

export interface RegionPoint {
  dryBulbC: number
  humidityRatioGPerKg: number
}

/** The psychrometric block of an assessment. */
export interface PsychrometricSummary extends PsychroDensity {
  /** Boundary of the air that dries the product to its target; empty when the isotherm gives none. */
  region: RegionPoint[]
  /** Share of binned hours whose cell lies (by its centre) under the boundary [0–1]; null without a region. */
  shareOfHoursInRegion: number | null
  /** Dry bulbs [°C] at which the RH curves are given. */
  rhCurveDryBulbC: number[]
  /** Humidity ratio [g/kg] of each RH curve at those dry bulbs, up to the first point above the axis top. */
  rhCurves: { rhPct: number; humidityRatioGPerKg: number[] }[]
}

export interface DensityOptions {
  /** Months (1–12) to include, by the hour's UTC month shifted by `utcOffsetHours`; all when absent. */
  months?: number[]
  utcOffsetHours?: number
  binDryBulbC?: number
  binHumidityRatioGPerKg?: number
  /** exp(ln pws) [Pa] of each hour's dry bulb when already computed (NaN where not): saves an exp and a log. */
  saturationPa?: Float64Array
}

/** RH of the curves drawn on the chart [%]. */
export const RH_CURVES_PCT = [10, 20, 30, 40, 50, 60, 70, 80, 90, 100] as const
/** Segments of each RH curve across the dry-bulb range. */
export const RH_CURVE_SEGMENTS = 80
/** Humidity-ratio bins [g/kg] counted in a typed array; hours beyond (very hot humid air) go to a map. */
const GRID_W_BINS = 1024

/** Humidity ratio [g/kg] at dry bulb tC and RH rhPct (over liquid water) at pressureKpa (eqs 6, 20). */
export function humidityRatioAtRhGPerKg(tC: number, rhPct: number, pressureKpa: number): number {
  return 1000 * humidityRatioFromRh(tC, rhPct, pressureKpa)
}

class CellCounter {
  readonly t0: number
  readonly grid: Int32Array
  readonly other = new Map<string, PsychroCell>()
  constructor(
    readonly bt: number,
    readonly bw: number,
  ) {
    this.t0 = Math.floor(-100 / bt)
    this.grid = new Int32Array((Math.floor(200 / bt) - this.t0 + 1) * GRID_W_BINS)
  }
  add(t: number, w: number): void {
    const kt = Math.floor(t / this.bt)
    const kw = Math.floor(w / this.bw)
    if (kw >= 0 && kw < GRID_W_BINS) this.grid[(kt - this.t0) * GRID_W_BINS + kw]++
    else {
      const tb = kt * this.bt
      const wb = kw * this.bw
      const key = `${tb}|${wb}`
      const cell = this.other.get(key)
      if (cell) cell.hours++
      else this.other.set(key, { dryBulbC: tb, humidityRatioGPerKg: wb, hours: 1 })
    }
  }
  cells(): PsychroCell[] {
    const out = [...this.other.values()]
    for (let k = 0; k < this.grid.length; k++) {
      const hours = this.grid[k]
      if (hours === 0) continue
      const kt = Math.floor(k / GRID_W_BINS) + this.t0
      out.push({ dryBulbC: kt * this.bt, humidityRatioGPerKg: (k % GRID_W_BINS) * this.bw, hours })
    }
    return out
  }
}

/** Value at rank floor(f·n) of `values[0..n)` (the n-th order statistic used for the plotted ranges). */
function rankValue(values: Float64Array, n: number, f: number): number {
  return n > 0 ? orderStatistic(values.subarray(0, n), Math.min(n - 1, Math.floor(f * n))) : 0
}

/** Bin the series' hours by dry bulb and humidity ratio (each hour's own station pressure). */
export function psychroDensity(series: HourlySeries, o: DensityOptions = {}): PsychroDensity {
  const bt = o.binDryBulbC ?? 2
  const bw = o.binHumidityRatioGPerKg ?? 1
  if (!(bt > 0 && bw > 0)) throw new RangeError(`bin sizes must be > 0, got ${bt} °C and ${bw} g/kg`)
  const monthSet = o.months ? new Set(o.months) : null
  const offsetMs = (o.utcOffsetHours ?? series.site.utcOffsetHours ?? 0) * MS_PER_HOUR
  const counter = new CellCounter(bt, bw)
  const temps = new Float64Array(series.hours)
  const ws = new Float64Array(series.hours)
  const pressures = new Float64Array(series.hours)
  let counted = 0
  let nPressures = 0
  for (let i = 0; i < series.hours; i++) {
    const t = series.dryBulbC[i]
    const rh = series.relativeHumidityPct[i]
    const p = series.pressureKpa[i]
    if (!(Number.isFinite(t) && Number.isFinite(rh) && Number.isFinite(p))) continue
    if (t < -100 || t > 200 || rh < 0 || rh > 100) continue
    if (monthSet && !monthSet.has(new Date(series.startUtcMs[i] + offsetMs).getUTCMonth() + 1)) continue
    const known = o.saturationPa?.[i]
    const pws =
      known !== undefined && !Number.isNaN(known) ? known / 1000 : saturationVaporPressureLiquidKpa(t)
    const w = 1000 * humidityRatioFromVaporPressure((rh / 100) * pws, p)
    counter.add(t, w)
    temps[counted] = t
    ws[counted] = w
    counted++
    if (nPressures < 20_000 || i % 7 === 0) pressures[nPressures++] = p
  }
  const tLo = Math.floor(Math.min(rankValue(temps, counted, 0.001), 0) / 5) * 5
  const tHi = Math.ceil(Math.max(rankValue(temps, counted, 0.999), 30) / 5) * 5
  const wHi = Math.ceil(Math.max(rankValue(ws, counted, 0.999) * 1.15, 12) / 2) * 2
  const cells = counter
    .cells()
    .filter((c) => c.dryBulbC >= tLo - bt && c.dryBulbC <= tHi)
    .sort((a, b) => a.dryBulbC - b.dryBulbC || a.humidityRatioGPerKg - b.humidityRatioGPerKg)
  return {
    binDryBulbC: bt,
    binHumidityRatioGPerKg: bw,
    dryBulbRangeC: [tLo, tHi],
    humidityRatioMaxGPerKg: wHi,
    cells,
    hoursCounted: counted,
    pressureKpa: nPressures > 0 ? rankValue(pressures, nPressures, 0.5) : STANDARD_PRESSURE_KPA,
  }
}

/**
 * Boundary of the air that dries `profile` to `targetMoistureWbPct`: for each dry bulb, the humidity ratio
 * at which the RH equals the product's equilibrium RH at the target (desorption isotherm). Below the curve
 * the equilibrium moisture is below the target. Stops at the product's temperature limit, and leaves out
 * temperatures outside the isotherm's accepted range.
 */
export function dryingRegionBoundary(
  profile: ProductProfile,
  targetMoistureWbPct: number,
  pressureKpa: number,
  dryBulbRangeC: [number, number],
  stepC = 1,
): RegionPoint[] {
  const targetDb = moistureDbFromWbPct(targetMoistureWbPct)
  const limit = profile.maxProductTempC?.value ?? Number.POSITIVE_INFINITY
  const t0 = Math.max(dryBulbRangeC[0], ISOTHERM_T_MIN_C)
  const t1 = Math.min(dryBulbRangeC[1], ISOTHERM_T_MAX_C, limit)
  const out: RegionPoint[] = []
  for (let t = t0; t <= t1 + 1e-9; t += stepC) {
    let erh: number
    try {
      erh = equilibriumRelativeHumidityPct(profile, t, targetDb)
    } catch {
      continue
    }
    if (!(erh > 0)) continue
    const w = humidityRatioAtRhGPerKg(t, Math.min(erh, 100), pressureKpa)
    out.push({ dryBulbC: Math.round(t * 100) / 100, humidityRatioGPerKg: Math.round(w * 1000) / 1000 })
  }
  return out
}

/** Share of binned hours whose cell lies (by its centre) under the drying-region boundary. */
export function shareInRegion(d: PsychroDensity, region: RegionPoint[]): number | null {
  if (region.length < 2 || d.hoursCounted === 0) return null
  let inside = 0
  for (const c of d.cells) {
    const t = c.dryBulbC + d.binDryBulbC / 2
    const w = c.humidityRatioGPerKg + d.binHumidityRatioGPerKg / 2
    if (t < region[0].dryBulbC || t > region[region.length - 1].dryBulbC) continue
    let k = 0
    while (k < region.length - 2 && region[k + 1].dryBulbC < t) k++
    const a = region[k]
    const b = region[k + 1]
    const wb =
      a.humidityRatioGPerKg +
      ((t - a.dryBulbC) / (b.dryBulbC - a.dryBulbC || 1)) * (b.humidityRatioGPerKg - a.humidityRatioGPerKg)
    if (w <= wb) inside += c.hours
  }
  return inside / d.hoursCounted
}

/** The RH curves across the plotted range, each up to its first point above the axis top. */
function rhCurves(d: PsychroDensity): Pick<PsychrometricSummary, 'rhCurveDryBulbC' | 'rhCurves'> {
  const [t0, t1] = d.dryBulbRangeC
  const rhCurveDryBulbC: number[] = []
  for (let i = 0; i <= RH_CURVE_SEGMENTS; i++) rhCurveDryBulbC.push(t0 + ((t1 - t0) * i) / RH_CURVE_SEGMENTS)
  return {
    rhCurveDryBulbC,
    rhCurves: RH_CURVES_PCT.map((rhPct) => {
      const humidityRatioGPerKg: number[] = []
      for (const t of rhCurveDryBulbC) {
        const w = humidityRatioAtRhGPerKg(t, rhPct, d.pressureKpa)
        humidityRatioGPerKg.push(w)
        if (w > d.humidityRatioMaxGPerKg) break
      }
      return { rhPct, humidityRatioGPerKg }
    }),
  }
}

/** The psychrometric block of an assessment of `profile` dried to `targetMoistureWbPct`. */
export function psychrometricSummary(
  series: HourlySeries,
  profile: ProductProfile,
  targetMoistureWbPct: number,
  options: DensityOptions = {},
): PsychrometricSummary {
  const d = psychroDensity(series, options)
  const region = dryingRegionBoundary(profile, targetMoistureWbPct, d.pressureKpa, d.dryBulbRangeC)
  return { ...d, region, shareOfHoursInRegion: shareInRegion(d, region), ...rhCurves(d) }
}
