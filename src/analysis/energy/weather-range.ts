/**
 * @module analysis/energy/weather-range
 * Which monitored batches ran in weather the baseline never saw (outside temperature or outside humidity
 * ratio beyond the baseline's lowest and highest), and whether a chart's rise signal stands without them:
 * the CUSUM run again on the same series with those batches left out, against the same baseline centre and σ.
 */
import type { BatchEnergy } from './batch-energy.ts'
import type { ChartSet } from './chart-set.ts'
import { cusumChart } from './cusum-chart.ts'

export interface WeatherRange {
  tempC: [number, number]
  humidityRatioGPerKg: [number, number]
}

/** The baseline's range of outside air, or null when no baseline batch has outside air. */
export function baselineWeatherRange(batches: BatchEnergy[], baselineCount: number): WeatherRange | null {
  const base = batches.filter((b) => b.index < baselineCount && b.ambient !== null)
  if (base.length === 0) return null
  const range = (xs: number[]): [number, number] => [
    xs.reduce((m, x) => Math.min(m, x), Number.POSITIVE_INFINITY),
    xs.reduce((m, x) => Math.max(m, x), Number.NEGATIVE_INFINITY),
  ]
  return {
    tempC: range(base.map((b) => b.ambient!.dryBulbC)),
    humidityRatioGPerKg: range(base.map((b) => b.ambient!.humidityRatioGPerKg)),
  }
}

/** Per batch: true for a monitored batch whose outside air lies outside the baseline's range. */
export function outsideBaselineWeather(
  batches: BatchEnergy[],
  baselineCount: number,
  range: WeatherRange | null,
): boolean[] {
  return batches.map((b) => {
    if (b.index < baselineCount || !b.ambient || !range) return false
    const t = b.ambient.dryBulbC
    const w = b.ambient.humidityRatioGPerKg
    return (
      t < range.tempC[0] ||
      t > range.tempC[1] ||
      w < range.humidityRatioGPerKg[0] ||
      w > range.humidityRatioGPerKg[1]
    )
  })
}

export interface SignalWithoutOutside {
  /** Monitored batches on the chart, and how many of them lie outside the baseline's weather. */
  monitored: number
  outside: number
  /**
   * `stands`: the CUSUM still signals a rise without them; `does-not-stand`: it does not; `cannot-check`:
   * no batch from the estimated change on is left inside the baseline's weather; `no-signal`: the chart has
   * no rise signal.
   */
  verdict: 'stands' | 'does-not-stand' | 'cannot-check' | 'no-signal'
  /** First rise signal without them (batch id), when it stands. */
  firstSignalBatchId: string | null
  /** Batches inside the baseline's weather from the estimated change on (what the check rests on). */
  insideFromChange: number
}

/** Re-run the chart's CUSUM without the monitored batches flagged `outside` (indexed by batch). */
export function signalWithoutOutside(
  set: ChartSet,
  batches: BatchEnergy[],
  outside: readonly boolean[],
): SignalWithoutOutside {
  const base = set.individuals.baselineCount
  const keep = set.batchIndices.map((b, point) => point < base || !outside[b])
  const monitored = set.batchIndices.length - base
  const outsideCount = set.batchIndices.filter((b, point) => point >= base && outside[b]).length
  const change = set.finding.estimatedChangeStart
  const insideFromChange = change
    ? set.batchIndices.filter((b, point) => point >= base && b >= change.batchIndex && !outside[b]).length
    : 0
  const common = { monitored, outside: outsideCount, insideFromChange }
  if (set.finding.cusumRise === null) return { ...common, verdict: 'no-signal', firstSignalBatchId: null }
  if (insideFromChange === 0) return { ...common, verdict: 'cannot-check', firstSignalBatchId: null }
  const values = set.individuals.values.filter((_, i) => keep[i])
  const indices = set.batchIndices.filter((_, i) => keep[i])
  const c = cusumChart(
    values,
    set.individuals.centerLine,
    set.individuals.sigma,
    base,
    set.cusum.k,
    set.cusum.h,
  )
  if (c.firstUpperSignal === null) return { ...common, verdict: 'does-not-stand', firstSignalBatchId: null }
  return { ...common, verdict: 'stands', firstSignalBatchId: batches[indices[c.firstUpperSignal]].batchId }
}
