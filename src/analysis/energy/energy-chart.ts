/**
 * @module analysis/energy/energy-chart
 * The energy control-chart assessment of a dryer batch log: per-batch specific energy and efficiency,
 * individuals/moving-range and EWMA charts with a phase I baseline, and the same charts on the residuals
 * of a regression of specific energy on outside humidity ratio, outside temperature and load fitted over
 * the baseline (what the weather and the load do not explain). Plain JSON-safe data for report/.
 */
import type { FuelId } from '../../drying/method.ts'
import { STANDARD_PRESSURE_KPA, standardPressureKpaAtElevation } from '../../physics/moist-air.ts'
import type { ProductProfile } from '../../product/profile.ts'
import type { HourlySeries } from '../../weather/series.ts'
import { type BatchAmbientValues, type BatchEnergy, batchEnergy } from './batch-energy.ts'
import { type BatchLogAccounting, type BatchRowRejection, readBatchLog } from './batch-log.ts'
import { estimateChangeStart } from './change-start.ts'
import { CONTROL_CHART_SOURCE } from './control-constants.ts'
import { summaryLines } from './energy-summary.ts'
import { type EwmaChart, ewmaChart } from './ewma-chart.ts'
import { type IndividualsChart, individualsChart, MIN_BASELINE_POINTS } from './individuals-chart.ts'
import { type LinearRegression, leverage, ordinaryLeastSquares, predict } from './linear-regression.ts'
import type { RunRuleId } from './run-rules.ts'
import { batchAmbientFromSeries, humidityRatioGPerKgFromRh, MIN_WEATHER_COVERAGE } from './weather-join.ts'

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
/** Regressors of the adjusted chart, in order. */
export const ADJUSTMENT_REGRESSORS = ['ambientHumidityRatioGPerKg', 'ambientTempC', 'freshMassT'] as const

export interface ChartSignal {
  batchIndex: number
  batchId: string
  startText: string
  /** Rules that fired on this batch (on this side). */
  rules: (RunRuleId | 'EWMA')[]
  /** `above`: more energy per kg water than the baseline (worse); `below`: less (better). */
  side: 'above' | 'below'
  /** 1 for the first batch after the baseline. */
  batchesAfterBaseline: number
}

export interface ChartFinding {
  /** First monitored batch with any signal, or null when the chart stays in control after the baseline. */
  firstSignal: ChartSignal | null
  /** First monitored batch signalling a rise in energy use (the dryer doing worse), or null. */
  firstRiseSignal: ChartSignal | null
  /** Most likely first batch of the rise (change-point estimate), when a rise signal fired. */
  estimatedChangeStart: { batchIndex: number; batchId: string; startText: string } | null
  /** Mean of the charted value from the estimated change to the end, minus the centre line. */
  shiftAfterChange: number | null
  /** Signals inside the baseline itself: a baseline that is not in control gives limits to distrust. */
  baselineSignals: number
}

export interface ChartSet {
  /** Batch index (into `batches`) of each charted point. */
  batchIndices: number[]
  individuals: IndividualsChart
  ewma: EwmaChart
  finding: ChartFinding
}

export interface EnergyChartAssessment {
  kind: 'energy-chart'
  accounting: BatchLogAccounting
  rejections: BatchRowRejection[]
  batches: BatchEnergy[]
  baselineCount: number
  /** Specific energy [MJ/kg water] chart. */
  raw: ChartSet
  /** Residual [MJ/kg water] chart after the weather-and-load regression, or null (see reason). */
  adjusted:
    | (ChartSet & {
        regression: Omit<LinearRegression, 'residuals' | 'leverages' | 'regressorMeans' | 'centredInverse'>
        fitted: number[]
        /** y − ŷ [MJ/kg water] of each charted batch. */
        residuals: number[]
        /** Leverage h of each charted batch (baseline: in the fit; monitored: of a new observation). */
        leverages: number[]
        /** What is charted: baseline e/√(1 − h), monitored e/√(1 + h); each has variance σ² when in control. */
        standardizedResiduals: number[]
      })
    | null
  adjustedUnavailableReason: string | null
  assumptions: string[]
  /** Implausible batches kept in the charts (e.g. efficiency above 100 %): check their numbers. */
  warnings: string[]
  sources: string[]
  /** Plain-language findings, one sentence each. */
  summary: string[]
}

function signalAt(
  set: Omit<ChartSet, 'finding'>,
  batches: BatchEnergy[],
  baselineCount: number,
  side: 'above' | 'below' | 'any',
): ChartSignal | null {
  const { individuals, ewma, batchIndices } = set
  const first = <T extends { index: number; side: 'above' | 'below' }>(list: T[]) =>
    list.find((s) => s.index >= individuals.baselineCount && (side === 'any' || s.side === side))
  const a = first(individuals.signals)
  const b = first(ewma.signals)
  const pick = a && b ? (a.index <= b.index ? a : b) : (a ?? b)
  if (!pick) return null
  const point = pick.index
  const pointSide = pick.side
  const rules: (RunRuleId | 'EWMA')[] = individuals.signals
    .filter((s) => s.index === point && s.side === pointSide)
    .map((s) => s.rule)
  if (ewma.signals.some((s) => s.index === point && s.side === pointSide)) rules.push('EWMA')
  const batch = batches[batchIndices[point]]
  return {
    batchIndex: batch.index,
    batchId: batch.batchId,
    startText: batch.startText,
    rules: [...new Set(rules)],
    side: pointSide,
    batchesAfterBaseline: batch.index - baselineCount + 1,
  }
}

function finding(
  set: Omit<ChartSet, 'finding'>,
  batches: BatchEnergy[],
  baselineCount: number,
): ChartFinding {
  const { individuals, batchIndices } = set
  const baselineSignals = new Set(
    individuals.signals.filter((s) => s.index < individuals.baselineCount).map((s) => s.index),
  ).size
  const firstSignal = signalAt(set, batches, baselineCount, 'any')
  const firstRiseSignal = signalAt(set, batches, baselineCount, 'above')
  if (!firstRiseSignal)
    return {
      firstSignal,
      firstRiseSignal,
      estimatedChangeStart: null,
      shiftAfterChange: null,
      baselineSignals,
    }
  const point = batchIndices.indexOf(firstRiseSignal.batchIndex)
  const changePoint = estimateChangeStart(
    individuals.values,
    individuals.centerLine,
    individuals.baselineCount,
    point,
    'up',
  )
  const c = batches[batchIndices[changePoint]]
  const after = individuals.values.slice(changePoint)
  return {
    firstSignal,
    firstRiseSignal,
    estimatedChangeStart: { batchIndex: c.index, batchId: c.batchId, startText: c.startText },
    shiftAfterChange: after.reduce((s, v) => s + v, 0) / after.length - individuals.centerLine,
    baselineSignals,
  }
}

function chartSet(
  values: number[],
  batchIndices: number[],
  baseline: number,
  batches: BatchEnergy[],
  batchBaseline: number,
): ChartSet {
  const individuals = individualsChart(values, baseline)
  const ewma = ewmaChart(values, individuals.centerLine, individuals.sigma, baseline)
  const set = { batchIndices, individuals, ewma }
  return { ...set, finding: finding(set, batches, batchBaseline) }
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
    .map((b) => ({ b, startUtcMs: b.startLocalMs - (b.startOffsetHours ?? offset ?? 0) * 3_600_000 }))
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
  )

  let adjusted: EnergyChartAssessment['adjusted'] = null
  let adjustedUnavailableReason: string | null = null
  let extrapolation: string | null = null
  const complete = batches.filter((b) => b.ambient !== null)
  const completeBaseline = complete.filter((b) => b.index < baselineCount)
  const regressorsOf = (b: BatchEnergy): number[] => [
    b.ambient!.humidityRatioGPerKg,
    b.ambient!.dryBulbC,
    b.freshMassKg / 1000,
  ]
  if (completeBaseline.length < baselineCount) {
    adjustedUnavailableReason = `${baselineCount - completeBaseline.length} baseline batches have no outside temperature and RH (add ambient_temp_c and ambient_rh_pct, or a weather file covering them)`
  } else if (completeBaseline.length < ADJUSTMENT_REGRESSORS.length + 3) {
    adjustedUnavailableReason = `the regression needs at least ${ADJUSTMENT_REGRESSORS.length + 3} baseline batches, got ${completeBaseline.length}`
  } else {
    try {
      const model = ordinaryLeastSquares(
        completeBaseline.map(regressorsOf),
        completeBaseline.map((b) => b.specificEnergyMjPerKg),
        ADJUSTMENT_REGRESSORS,
      )
      const {
        residuals: _fitResiduals,
        leverages: _fitLeverages,
        regressorMeans: _means,
        centredInverse: _inverse,
        ...regression
      } = model
      const fitted = complete.map((b) => predict(model, regressorsOf(b)))
      const residuals = complete.map((b, i) => b.specificEnergyMjPerKg - fitted[i])
      const leverages = complete.map((b) => leverage(model, regressorsOf(b)))
      // Internally studentized in the baseline, prediction-standardized after it (Montgomery, Peck & Vining
      // ch. 4 and 3): the chart then weighs a monitored batch by how far the regression had to reach for it.
      const standardizedResiduals = residuals.map((e, i) =>
        complete[i].index < baselineCount
          ? e / Math.sqrt(Math.max(1e-9, 1 - leverages[i]))
          : e / Math.sqrt(1 + leverages[i]),
      )
      const set = chartSet(
        standardizedResiduals,
        complete.map((b) => b.index),
        completeBaseline.length,
        batches,
        baselineCount,
      )
      // The size of a shift is reported in MJ/kg of plain residual (the standardized one is shrunk by √(1 + h)).
      const change = set.finding.estimatedChangeStart
      if (change) {
        const from = set.batchIndices.indexOf(change.batchIndex)
        const after = residuals.slice(from)
        set.finding.shiftAfterChange = after.reduce((sum, v) => sum + v, 0) / after.length
      }
      adjusted = { ...set, regression, fitted, residuals, leverages, standardizedResiduals }
      extrapolation = extrapolationWarning(
        completeBaseline.map(regressorsOf),
        complete.filter((b) => b.index >= baselineCount).map(regressorsOf),
      )
      if (complete.length < n)
        assumptions.push(
          `${n - complete.length} monitored batches lack outside air and are left off the adjusted chart`,
        )
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      adjustedUnavailableReason = e.message
    }
  }
  return {
    kind: 'energy-chart',
    accounting: log.accounting,
    rejections: log.rejections,
    batches,
    baselineCount,
    raw,
    adjusted,
    adjustedUnavailableReason,
    assumptions,
    warnings: [
      ...batches
        .filter((b) => b.thermalEfficiencyPct > 100)
        .map(
          (b) =>
            `batch ${b.batchId} (line ${b.line}): ${b.specificEnergyMjPerKg.toFixed(2)} MJ/kg water is below the ideal ` +
            `${(b.idealHeatMj / b.waterRemovedKg).toFixed(2)} MJ/kg (efficiency ${b.thermalEfficiencyPct.toFixed(0)} %): check its energy and masses`,
        ),
      ...(extrapolation ? [extrapolation] : []),
    ],
    sources: [
      CONTROL_CHART_SOURCE,
      'Latent heat λ = 2.501 − 0.002361·T MJ/kg (FAO-56 Annex 3 eq 3-1); heat of sorption from the isotherm by Clausius–Clapeyron.',
      'Heating values: higher heating values of src/drying/fuels.ts (US EIA Btu conversion factors).',
      'Regression: ordinary least squares over the baseline batches (specific energy on outside humidity ratio, outside temperature, load); ' +
        'the adjusted chart plots residuals standardized by their leverage h, e/√(1 − h) in the baseline and e/√(1 + h) after it ' +
        '(Montgomery, Peck & Vining, Introduction to Linear Regression Analysis, ch. 3–4).',
    ],
    summary: summaryLines(batches, baselineCount, raw, adjusted, adjustedUnavailableReason),
  }
}

const REGRESSOR_WORDS = ['outside humidity ratio', 'outside temperature', 'load']

/**
 * A warning when monitored batches lie outside the baseline's range of a regressor: there the regression
 * extrapolates, and an error in a coefficient becomes a steady offset of the residuals that the run rules
 * and the EWMA read as a shift. Null when every monitored batch is inside the baseline's ranges.
 */
export function extrapolationWarning(baseline: number[][], monitored: number[][]): string | null {
  if (monitored.length === 0) return null
  const parts: string[] = []
  REGRESSOR_WORDS.forEach((word, j) => {
    const lo = baseline.reduce((m, r) => (r[j] < m ? r[j] : m), Number.POSITIVE_INFINITY)
    const hi = baseline.reduce((m, r) => (r[j] > m ? r[j] : m), Number.NEGATIVE_INFINITY)
    const outside = monitored.filter((r) => r[j] < lo || r[j] > hi).length
    if (outside > 0)
      parts.push(`${outside} ${parts.length === 0 ? "lie outside the baseline's range of " : 'of '}${word}`)
  })
  if (parts.length === 0) return null
  return (
    `Of ${monitored.length} monitored batches, ${parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}` : parts[0]}: the adjusted chart ` +
    'extrapolates the regression there, so a run of signals on those batches may come from an error in a coefficient ' +
    'rather than the dryer. A baseline that spans the season (or a later re-fit) makes the adjusted chart safer.'
  )
}
