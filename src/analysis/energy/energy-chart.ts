/**
 * @module analysis/energy/energy-chart
 * The energy control-chart assessment of a dryer batch log: per-batch specific energy and efficiency, and
 * three views of it, each with individuals/moving-range, EWMA and CUSUM charts and limits from a phase I
 * baseline: the raw specific energy; the ratio of measured to expected energy from the dryer's own physics
 * (./physics-view.ts); and the residual of a regression on outside humidity ratio, temperature and load
 * (./regression-view.ts). The answer uses one of the two normalised views (./view-choice.ts), acts on its
 * CUSUM, locates the change (./change-point.ts) and says whether the signal stands without the batches whose
 * weather the baseline never saw (./weather-range.ts). Plain JSON-safe data for report/.
 */

import type { FuelId } from '../../drying/method.ts'
import { MS_PER_HOUR } from '../../physics/constants.ts'
import { STANDARD_PRESSURE_KPA, standardPressureKpaAtElevation } from '../../physics/moist-air.ts'
import type { ProductProfile } from '../../product/profile.ts'
import type { HourlySeries } from '../../weather/series.ts'
import { type BatchAmbientValues, type BatchEnergy, batchEnergy } from './batch-energy.ts'
import { type BatchLogAccounting, type BatchRowRejection, readBatchLog } from './batch-log.ts'
import { type ChartSet, chartSet } from './chart-set.ts'
import { CONTROL_CHART_SOURCE } from './control-constants.ts'
import { twoSidedCusumArl } from './cusum-arl.ts'
import { CUSUM_H, CUSUM_K } from './cusum-chart.ts'
import { summaryLines } from './energy-summary.ts'
import { MIN_BASELINE_POINTS } from './individuals-chart.ts'
import { type PhysicsView, physicsView } from './physics-view.ts'
import { type RegressionView, regressionView } from './regression-view.ts'
import { type AnswerView, chooseAnswerView } from './view-choice.ts'
import { batchAmbientFromSeries, humidityRatioGPerKgFromRh, MIN_WEATHER_COVERAGE } from './weather-join.ts'
import {
  baselineWeatherRange,
  outsideBaselineWeather,
  type SignalWithoutOutside,
  signalWithoutOutside,
  type WeatherRange,
} from './weather-range.ts'

export type { ChartFinding, ChartSet, ChartSignal } from './chart-set.ts'
export { ADJUSTMENT_REGRESSORS, extrapolationWarning } from './regression-view.ts'

export interface EnergyChartOptions {
  /** Batches in the baseline (phase I); default min(20, half the batches), at least 5. */
  baselineCount?: number
  /** Fuel of `fuel_amount` rows without a `fuel` column. */
  fuel?: FuelId
  /** Drying-air temperature [°C] for rows without `drying_temp_c`; default 60 °C (assumption). */
  dryingTempC?: number
  /** Offset of the log's local start times from UTC [h]; else the weather file's, else 0. */
  utcOffsetHours?: number
  /** Site elevation [m] for the pressure when neither log nor weather gives one; else sea level. */
  elevationM?: number
  /** Hourly weather to fill ambient temperature and RH of batches whose row lacks them. */
  weather?: HourlySeries
  /** Product, for the heat of sorption from its isotherm. */
  profile?: ProductProfile
}

/** Default drying-air temperature [°C]: mid-range of heated grain and fruit dryers (assumption, no source). */
export const DEFAULT_DRYING_TEMP_C = 60

/** What the CUSUM's k and h mean in batches: average run lengths from ./cusum-arl.ts. */
export interface CusumDesign {
  k: number
  h: number
  /** Two-sided in-control ARL [batches] with a known baseline mean and σ. */
  inControlArl: number
  /** ARL for sustained shifts of 1, 2 and 3 σ [batches]. */
  arlAtShiftSigma: { shiftSigma: number; arl: number }[]
}

export interface EnergyChartAssessment {
  kind: 'energy-chart'
  accounting: BatchLogAccounting
  rejections: BatchRowRejection[]
  batches: BatchEnergy[]
  baselineCount: number
  /** Specific energy [MJ/kg water] chart. */
  raw: ChartSet
  /** Measured over expected energy [%] from the dryer's own physics, or null (see reason). */
  physics: PhysicsView | null
  physicsUnavailableReason: string | null
  /** Residual [MJ/kg water] chart after the weather-and-load regression, or null (see reason). */
  adjusted: RegressionView | null
  adjustedUnavailableReason: string | null
  /** The view the answer uses, why, and whether its signal stands without the out-of-range batches. */
  answer: AnswerView & { robustness: SignalWithoutOutside }
  /** The baseline's range of outside air, or null when it has none. */
  baselineWeather: WeatherRange | null
  /** Per batch: a monitored batch whose outside air lies outside the baseline's range. */
  outsideBaselineWeather: boolean[]
  cusumDesign: CusumDesign
  assumptions: string[]
  /** Implausible batches kept in the charts (e.g. efficiency above 100 %) and other cautions. */
  warnings: string[]
  sources: string[]
  /** Plain-language findings, one sentence each; the first is the answer. */
  summary: string[]
}

/** Resolve the ambient air of one batch: the log's own values, else the weather file, else null. */
function ambientOf(
  row: {
    ambientTempC: number | null
    ambientRhPct: number | null
    ambientPressureKpa: number | null
    durationH: number
  },
  startUtcMs: number,
  options: EnergyChartOptions,
  fallbackPressureKpa: number,
): BatchAmbientValues | null {
  if (row.ambientTempC !== null && row.ambientRhPct !== null) {
    const p = row.ambientPressureKpa ?? fallbackPressureKpa
    return {
      dryBulbC: row.ambientTempC,
      relativeHumidityPct: row.ambientRhPct,
      humidityRatioGPerKg: humidityRatioGPerKgFromRh(row.ambientTempC, row.ambientRhPct, p),
      pressureKpa: p,
      source: 'log',
    }
  }
  if (!options.weather) return null
  const a = batchAmbientFromSeries(options.weather, startUtcMs, row.durationH, fallbackPressureKpa)
  return a
    ? {
        dryBulbC: a.dryBulbC,
        relativeHumidityPct: a.relativeHumidityPct,
        humidityRatioGPerKg: a.humidityRatioGPerKg,
        pressureKpa: a.pressureKpa,
        source: 'weather',
      }
    : null
}

/**
 * Read a batch log and chart its energy. Throws BatchLogError for an unusable log and RangeError for bad
 * options (baseline outside 5…number of batches, drying temperature outside 0–100 °C).
 */
export function analyzeEnergyLog(text: string, options: EnergyChartOptions = {}): EnergyChartAssessment {
  const log = readBatchLog(text, { fuel: options.fuel })
  const assumptions: string[] = []
  const dryingTempC = options.dryingTempC ?? DEFAULT_DRYING_TEMP_C
  if (!(dryingTempC >= 0 && dryingTempC <= 100)) {
    throw new RangeError(`drying temperature must be between 0 and 100 °C, got ${dryingTempC}`)
  }
  if (log.batches.some((b) => b.dryingTempC === null)) {
    assumptions.push(
      `Latent heat taken at ${dryingTempC} °C drying-air temperature for batches without drying_temp_c` +
        (options.dryingTempC === undefined ? ' (default, an assumption: give --drying-temp)' : ''),
    )
  }
  const batches = batchesInTime(log, options, dryingTempC, assumptions)
  const n = batches.length
  const baselineCount =
    options.baselineCount ?? Math.max(MIN_BASELINE_POINTS, Math.min(20, Math.floor(n / 2)))
  if (options.baselineCount === undefined)
    assumptions.push(`Baseline (phase I): the first ${baselineCount} batches (default; set --baseline)`)
  if (!(Number.isInteger(baselineCount) && baselineCount >= MIN_BASELINE_POINTS && baselineCount <= n)) {
    throw new RangeError(
      `baseline must be a whole number of batches from ${MIN_BASELINE_POINTS} to ${n} (batches in the log), got ${baselineCount}`,
    )
  }
  const all = batches.map((b) => b.index)
  const raw = chartSet(
    batches.map((b) => b.specificEnergyMjPerKg),
    all,
    baselineCount,
    batches,
    baselineCount,
    'MJ/kg water',
  )
  const warnings: string[] = batches
    .filter((b) => b.thermalEfficiencyPct > 100)
    .map(
      (b) =>
        `batch ${b.batchId} (line ${b.line}): ${b.specificEnergyMjPerKg.toFixed(2)} MJ/kg water is below the ideal ` +
        `${(b.idealHeatMj / b.waterRemovedKg).toFixed(2)} MJ/kg (efficiency ${b.thermalEfficiencyPct.toFixed(0)} %): check its energy and masses`,
    )
  const phys = physicsView(batches, baselineCount)
  const reg = regressionView(batches, baselineCount)
  const physics = phys.view
  const adjusted = reg.view
  if (phys.view) {
    const assumed = log.batches.filter((b) => b.dryingTempC === null).length
    warnings.push(...physicsViewWarnings(phys.view, phys.leftOff, assumed, options, dryingTempC))
  }
  if (reg.view && reg.extrapolation) warnings.push(reg.extrapolation)
  const complete = batches.filter((b) => b.ambient !== null).length
  if (complete < n && complete >= baselineCount)
    assumptions.push(
      `${n - complete} monitored batches lack outside air and are left off the normalised views`,
    )
  const baselineWeather = baselineWeatherRange(batches, baselineCount)
  const outside = outsideBaselineWeather(batches, baselineCount, baselineWeather)
  const monitoredWithAir = batches.filter((b) => b.index >= baselineCount && b.ambient !== null).length
  const choice = chooseAnswerView(
    physics ? physics.fit : null,
    adjusted,
    outside.filter(Boolean).length,
    monitoredWithAir,
  )
  const chosen: ChartSet =
    choice.view === 'physics' ? physics! : choice.view === 'regression' ? adjusted! : raw
  const answer = { ...choice, robustness: signalWithoutOutside(chosen, batches, outside) }
  const partial = {
    kind: 'energy-chart' as const,
    accounting: log.accounting,
    rejections: log.rejections,
    batches,
    baselineCount,
    raw,
    physics,
    physicsUnavailableReason: phys.view ? null : phys.reason,
    adjusted,
    adjustedUnavailableReason: reg.view ? null : reg.reason,
    answer,
    baselineWeather,
    outsideBaselineWeather: outside,
    cusumDesign: cusumDesign(),
    assumptions,
    warnings,
    sources: energyChartSources(),
  }
  return { ...partial, summary: summaryLines(partial) }
}

/**
 * Every batch's energy with its outside air (the log's, else the weather file's), in order of start
 * time (UTC: the batch's own offset, else the option's or the weather file's, else UTC); assumptions
 * say what was taken.
 */
function batchesInTime(
  log: ReturnType<typeof readBatchLog>,
  options: EnergyChartOptions,
  dryingTempC: number,
  assumptions: string[],
): BatchEnergy[] {
  const offset = options.utcOffsetHours ?? options.weather?.site.utcOffsetHours ?? null
  if (log.batches.some((b) => b.startOffsetHours === null)) {
    assumptions.push(
      offset === null
        ? 'Start times without an offset are taken as UTC (no --utc-offset and no offset in the weather file)'
        : `Start times without an offset are local standard time at UTC${offset >= 0 ? '+' : ''}${offset} h`,
    )
  }
  const elevation = options.elevationM ?? options.weather?.site.elevationM ?? null
  const fallbackPressureKpa =
    elevation === null ? STANDARD_PRESSURE_KPA : standardPressureKpaAtElevation(elevation)
  const timed = log.batches
    .map((b) => ({ b, startUtcMs: b.startLocalMs - (b.startOffsetHours ?? offset ?? 0) * MS_PER_HOUR }))
    .sort((x, y) => x.startUtcMs - y.startUtcMs)
  const batches = timed.map(({ b, startUtcMs }, i) =>
    batchEnergy(b, i, startUtcMs, ambientOf(b, startUtcMs, options, fallbackPressureKpa), {
      dryingTempC,
      profile: options.profile,
    }),
  )
  if (timed.some(({ b }, i) => i > 0 && b.line < timed[i - 1].b.line))
    assumptions.push('Rows were put in order of start time')
  if (batches.some((b) => b.ambient?.source === 'weather')) {
    assumptions.push(
      `Outside air from the weather file: mean of the batch's hours, needing ${MIN_WEATHER_COVERAGE * 100} % of them`,
    )
  }
  return batches
}

/** What the physics view's fit and inputs call for: batches left off, an efficiency above 1, a default drying temperature. */
function physicsViewWarnings(
  view: PhysicsView,
  leftOff: string[],
  assumedTemperatures: number,
  options: EnergyChartOptions,
  dryingTempC: number,
): string[] {
  const warnings = leftOff.map((t) => `left off the physics view: ${t}`)
  if (view.fit.efficiency > 1) {
    warnings.push(
      `the physics fit gives an overall efficiency of ${(100 * view.fit.efficiency).toFixed(0)} %, above what a dryer can reach: check drying_temp_c (or --drying-temp) and the energy figures`,
    )
  }
  if (assumedTemperatures > 0 && options.dryingTempC === undefined) {
    warnings.push(
      `the physics view takes the drying-air temperature as ${dryingTempC} °C (the default) for ${assumedTemperatures} batches: the expected heat depends on it, so give drying_temp_c in the log or --drying-temp`,
    )
  }
  return warnings
}

/** The tabular CUSUM's design: k, h and its two-sided average run lengths. */
function cusumDesign(): CusumDesign {
  return {
    k: CUSUM_K,
    h: CUSUM_H,
    inControlArl: twoSidedCusumArl(CUSUM_K, CUSUM_H, 0),
    arlAtShiftSigma: [1, 2, 3].map((s) => ({ shiftSigma: s, arl: twoSidedCusumArl(CUSUM_K, CUSUM_H, s) })),
  }
}

/** The methods behind the energy charts, with their sources. */
function energyChartSources(): string[] {
  return [
    CONTROL_CHART_SOURCE,
    `CUSUM: tabular (Page 1954, Biometrika 41:100), standardized by the baseline's x̄ and MR̄/d2, k = ${CUSUM_K}, h = ${CUSUM_H} ` +
      '(Montgomery & Runger, Applied Statistics and Probability for Engineers, section 16-10); average run lengths by the integral equation ' +
      '(Goel & Wu 1971; Vance 1986), checked against Lucas & Crosier (1982, Technometrics 24:199) Table 1.',
    'Change point: posterior over the first shifted batch for one sustained step, flat prior on its size (Smith 1975, ' +
      'Biometrika 62:407); its mode is close to the maximum-likelihood estimate (Hinkley 1970, Biometrika 57:1).',
    'Physics view: heat to warm the outside air to the drying temperature at constant humidity ratio, for the air that ' +
      "carries the water removed up to saturation at the heated air's wet bulb, plus the sorption heat (moist-air relations " +
      'of ASHRAE Handbook — Fundamentals 2017 ch. 1 eqs 20, 30, 33); overall efficiency and fixed loss per batch fitted over ' +
      'the baseline by least squares; views compared by leave-one-out (PRESS) error.',
    'Latent heat λ = 2.501 − 0.002361·T MJ/kg (FAO-56 Annex 3 eq 3-1); heat of sorption from the isotherm by Clausius–Clapeyron.',
    'Heating values: higher heating values of src/drying/fuels.ts (US EIA Btu conversion factors).',
    'Regression: ordinary least squares over the baseline batches (specific energy on outside humidity ratio, outside temperature, load); ' +
      'the regression view plots residuals standardized by their leverage h, e/√(1 − h) in the baseline and e/√(1 + h) after it ' +
      '(Montgomery, Peck & Vining, Introduction to Linear Regression Analysis, ch. 3–4).',
  ]
}
