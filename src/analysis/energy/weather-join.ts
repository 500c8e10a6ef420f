/**
 * @module analysis/energy/weather-join
 * Outside air over a batch's hours from an hourly weather series: the mean dry bulb and the mean humidity
 * ratio of the hours whose start falls inside [start, start + duration). Humidity ratio from RH (over
 * liquid water) and station pressure by ASHRAE HOF 2017 ch. 1 eq 20.
 */
import { humidityRatioFromRh } from '../../physics/air-processes.ts'
import { MS_PER_HOUR } from '../../physics/constants.ts'
import type { HourlySeries } from '../../weather/series.ts'

/** Share of a batch's hours that must have dry bulb and RH for a mean (assumption, common practice, no source). */
export const MIN_WEATHER_COVERAGE = 0.75

export interface BatchAmbient {
  dryBulbC: number
  relativeHumidityPct: number
  humidityRatioGPerKg: number
  pressureKpa: number
  hoursUsed: number
  hoursInBatch: number
}

/** Humidity ratio [g/kg dry air] from dry bulb [°C], RH over water [%] and pressure [kPa]. */
export function humidityRatioGPerKgFromRh(dryBulbC: number, rhPct: number, pressureKpa: number): number {
  return 1000 * humidityRatioFromRh(dryBulbC, rhPct, pressureKpa)
}

/**
 * Mean outside air over a batch, or null when fewer than {@link MIN_WEATHER_COVERAGE} of its hours are in
 * the series with dry bulb and RH. `fallbackPressureKpa` replaces a missing station pressure.
 */
export function batchAmbientFromSeries(
  series: HourlySeries,
  startUtcMs: number,
  durationH: number,
  fallbackPressureKpa: number,
): BatchAmbient | null {
  const hoursInBatch = Math.max(1, Math.ceil(durationH))
  const first = series.hours > 0 ? series.startUtcMs[0] : 0
  // Hours start on the hour: the batch covers the hours whose start is in [start, end), plus the hour it began in.
  const fromIndex = Math.floor((startUtcMs - first) / MS_PER_HOUR)
  const toIndex = Math.ceil((startUtcMs + durationH * MS_PER_HOUR - first) / MS_PER_HOUR) - 1
  let n = 0
  let tSum = 0
  let rhSum = 0
  let wSum = 0
  let pSum = 0
  for (let i = Math.max(0, fromIndex); i <= Math.min(series.hours - 1, toIndex); i++) {
    const t = series.dryBulbC[i]
    const rh = series.relativeHumidityPct[i]
    if (!Number.isFinite(t) || !Number.isFinite(rh)) continue
    const p = Number.isFinite(series.pressureKpa[i]) ? series.pressureKpa[i] : fallbackPressureKpa
    n++
    tSum += t
    rhSum += rh
    wSum += humidityRatioGPerKgFromRh(t, rh, p)
    pSum += p
  }
  const span = Math.max(hoursInBatch, toIndex - fromIndex + 1)
  if (n === 0 || n < MIN_WEATHER_COVERAGE * span) return null
  return {
    dryBulbC: tSum / n,
    relativeHumidityPct: rhSum / n,
    humidityRatioGPerKg: wSum / n,
    pressureKpa: pSum / n,
    hoursUsed: n,
    hoursInBatch: span,
  }
}
