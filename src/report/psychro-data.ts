/**
 * @module report/psychro-data
 * What the psychrometric chart shows, prepared from data the report already has: the site's hours binned
 * by dry bulb and humidity ratio, and the boundary of the air that dries a product to its target. No new
 * science: the humidity ratio is ASHRAE HOF 2017 ch. 1 eq 20 (physics/moist-air) from the hour's RH over
 * liquid water, and the region is the product isotherm's equilibrium RH at the target moisture
 * (product/equilibrium), converted to a humidity ratio at the site pressure.
 */
import { humidityRatioFromVaporPressure } from '../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../physics/saturation.ts'
import { equilibriumRelativeHumidityPct } from '../product/equilibrium.ts'
import { ISOTHERM_T_MAX_C, ISOTHERM_T_MIN_C } from '../product/isotherm-models.ts'
import { moistureDbFromWbPct } from '../product/moisture-basis.ts'
import type { ProductProfile } from '../product/profile.ts'
import type { HourlySeries } from '../weather/series.ts'

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
  /** Median station pressure of the counted hours [kPa], for drawing the RH curves. */
  pressureKpa: number
}

export interface RegionPoint {
  dryBulbC: number
  humidityRatioGPerKg: number
}

export interface DensityOptions {
  /** Months (1–12) to include, by the hour's UTC month shifted by `utcOffsetHours`; all when absent. */
  months?: number[]
  utcOffsetHours?: number
  binDryBulbC?: number
  binHumidityRatioGPerKg?: number
}

/** Bin the series' hours by dry bulb and humidity ratio (each hour's own station pressure). */
export function psychroDensity(series: HourlySeries, o: DensityOptions = {}): PsychroDensity {
  const bt = o.binDryBulbC ?? 2
  const bw = o.binHumidityRatioGPerKg ?? 1
  if (!(bt > 0 && bw > 0)) throw new RangeError(`bin sizes must be > 0, got ${bt} °C and ${bw} g/kg`)
  const monthSet = o.months ? new Set(o.months) : null
  const offsetMs = (o.utcOffsetHours ?? series.site.utcOffsetHours ?? 0) * 3_600_000
  const counts = new Map<string, PsychroCell>()
  const temps: number[] = []
  const ws: number[] = []
  const pressures: number[] = []
  for (let i = 0; i < series.hours; i++) {
    const t = series.dryBulbC[i]
    const rh = series.relativeHumidityPct[i]
    const p = series.pressureKpa[i]
    if (!(Number.isFinite(t) && Number.isFinite(rh) && Number.isFinite(p))) continue
    if (t < -100 || t > 200 || rh < 0 || rh > 100) continue
    if (monthSet && !monthSet.has(new Date(series.startUtcMs[i] + offsetMs).getUTCMonth() + 1)) continue
    const w = 1000 * humidityRatioFromVaporPressure((rh / 100) * saturationVaporPressureLiquidKpa(t), p)
    const tb = Math.floor(t / bt) * bt
    const wb = Math.floor(w / bw) * bw
    const key = `${tb}|${wb}`
    const cell = counts.get(key)
    if (cell) cell.hours++
    else counts.set(key, { dryBulbC: tb, humidityRatioGPerKg: wb, hours: 1 })
    temps.push(t)
    ws.push(w)
    if (pressures.length < 20_000 || i % 7 === 0) pressures.push(p)
  }
  const sortNum = (a: number, b: number) => a - b
  temps.sort(sortNum)
  ws.sort(sortNum)
  pressures.sort(sortNum)
  const q = (arr: number[], f: number) =>
    arr.length ? arr[Math.min(arr.length - 1, Math.floor(f * arr.length))] : 0
  const tLo = Math.floor(Math.min(q(temps, 0.001), 0) / 5) * 5
  const tHi = Math.ceil(Math.max(q(temps, 0.999), 30) / 5) * 5
  const wHi = Math.ceil(Math.max(q(ws, 0.999) * 1.15, 12) / 2) * 2
  const cells = [...counts.values()]
    .filter((c) => c.dryBulbC >= tLo - bt && c.dryBulbC <= tHi)
    .sort((a, b) => a.dryBulbC - b.dryBulbC || a.humidityRatioGPerKg - b.humidityRatioGPerKg)
  return {
    binDryBulbC: bt,
    binHumidityRatioGPerKg: bw,
    dryBulbRangeC: [tLo, tHi],
    humidityRatioMaxGPerKg: wHi,
    cells,
    hoursCounted: temps.length,
    pressureKpa: pressures.length ? q(pressures, 0.5) : 101.325,
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
    const w =
      1000 *
      humidityRatioFromVaporPressure(
        (Math.min(erh, 100) / 100) * saturationVaporPressureLiquidKpa(t),
        pressureKpa,
      )
    out.push({ dryBulbC: Math.round(t * 100) / 100, humidityRatioGPerKg: Math.round(w * 1000) / 1000 })
  }
  return out
}
