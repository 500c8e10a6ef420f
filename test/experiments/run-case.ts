/**
 * @module test/experiments/run-case
 * Runs one published experiment through the engine exactly as an assessment runs a batch: the weather
 * reconstruction's CSV read by the ordinary weather reader, the options completed by
 * `resolveAssessOptions`, the method's hourly conditions by `hourlyConditionsStage`, one batch by
 * `simulateBatch` from the experiment's start hour. Returns the predicted time to the published end point
 * both as elapsed clock time and as active drying time (hours in which the method dried: not covered, not
 * paused, not missing), with the fraction of the last hour interpolated on the moisture trace.
 */
import { readFileSync } from 'node:fs'
import { hourlyConditionsStage } from '../../src/analysis/assess.ts'
import { resolveAssessOptions } from '../../src/analysis/assess-options.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { HourMode } from '../../src/drying/methods/method-model.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { RECONSTRUCTIONS } from '../fixtures/experiments/weather/reconstructions.ts'
import { caseProfile, type EngineCase } from './cases.ts'
import { hourIndexAt, type Reconstruction, readOptionsFor } from './weather-reconstruction.ts'

const WEATHER_DIR = new URL('../fixtures/experiments/weather/', import.meta.url)

const seriesCache = new Map<string, HourlySeries>()

function reconstruction(weatherId: string): Reconstruction {
  const spec = RECONSTRUCTIONS.find((r) => r.id === weatherId)
  if (!spec) throw new RangeError(`no weather reconstruction '${weatherId}'`)
  return spec
}

/** The reconstruction's hourly series, read from its committed CSV by the ordinary reader. */
export function caseWeather(weatherId: string): HourlySeries {
  const cached = seriesCache.get(weatherId)
  if (cached) return cached
  const spec = reconstruction(weatherId)
  const text = readFileSync(new URL(`${weatherId}.csv`, WEATHER_DIR), 'utf8')
  const { series } = readWeather(text, readOptionsFor(spec))
  seriesCache.set(weatherId, series)
  return series
}

export interface CaseResult {
  /** Predicted elapsed hours from the start to the end point (NaN when not reached in the file). */
  elapsedH: number
  /** Predicted active drying hours to the end point (NaN when not reached). */
  activeH: number
  /** The predicted time of the published kind (elapsed or active), before any sampling. */
  continuousH: number
  /**
   * The predicted time as the paper would have recorded it: the first sample at or after the end point when
   * the paper sampled at fixed intervals (e.g. every 24 h), else {@link continuousH}.
   */
  predictedH: number
  /** Predicted ÷ published ({@link predictedH} ÷ the published time). */
  ratio: number
  reached: boolean
  /** Moisture [% wb] at the end of the file when the end point was not reached. */
  finalWbPct: number
}

/**
 * Run `c` through the engine; `profile` replaces the catalogue profile (the calibration's trial constants) and
 * `series` the committed weather (the calibration's sensitivity to the reconstruction).
 */
export function runCase(
  c: EngineCase,
  profile: ProductProfile = caseProfile(c),
  series: HourlySeries = caseWeather(c.weather),
): CaseResult {
  const startIndex = hourIndexAt(reconstruction(c.weather), c.start.day, c.start.localHour)
  const hoursLeft = series.hours - startIndex
  const run = resolveAssessOptions({
    product: profile,
    method: c.method,
    initialWbPct: c.initialWbPct.value,
    targetWbPct: c.endWbPct.value,
    thicknessMm: c.sizeMm?.value,
    deadlineDays: 1,
    maxDays: Math.max(1, Math.ceil(hoursLeft / 24)),
  })
  const { primary } = hourlyConditionsStage(series, run)
  const batch = simulateBatch(primary, run.product, {
    startIndex,
    maxHours: hoursLeft,
    initialDb: run.initialDb,
    targetDb: run.targetDb,
    recordTrace: true,
  })
  const trace = batch.trace as Float64Array
  let elapsedH = Number.NaN
  let activeH = Number.NaN
  if (batch.reached) {
    const last = batch.hoursToTarget - 1 // index of the hour in which the target was passed
    const before = last > 0 ? trace[last - 1] : run.initialDb
    const after = trace[last]
    const fraction = before > after ? (before - run.targetDb) / (before - after) : 1
    elapsedH = last + fraction
    let active = 0
    for (let h = 0; h < last; h++) {
      const mode = primary.mode[startIndex + h]
      if (mode !== HourMode.paused && mode !== HourMode.missing) active++
    }
    activeH = active + fraction
  }
  const continuousH = c.published.kind === 'active' ? activeH : elapsedH
  const every = c.published.sampledEveryH
  const predictedH = every === undefined ? continuousH : Math.ceil(continuousH / every - 1e-9) * every
  const finalDb = batch.finalDb
  return {
    elapsedH,
    activeH,
    continuousH,
    predictedH,
    ratio: predictedH / c.published.timeH,
    reached: batch.reached,
    finalWbPct: (100 * finalDb) / (1 + finalDb),
  }
}
