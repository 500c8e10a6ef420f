/**
 * @module analysis/energy/chart-set
 * One charted series (specific energy, its weather-and-load residual, or its ratio to the physics
 * expectation) with its individuals, EWMA and CUSUM charts sharing the baseline's centre and σ, and what
 * they found after the baseline: the first signal of each kind, and where a rise most likely began
 * (./change-point.ts).
 */
import type { BatchEnergy } from './batch-energy.ts'
import { type ChangePointEstimate, estimateChangePoint } from './change-point.ts'
import { type CusumChart, cusumChart } from './cusum-chart.ts'
import { type EwmaChart, ewmaChart } from './ewma-chart.ts'
import { type IndividualsChart, individualsChart } from './individuals-chart.ts'
import type { RunRuleId } from './run-rules.ts'

export type SignalRule = RunRuleId | 'EWMA' | 'CUSUM'

export interface ChartSignal {
  batchIndex: number
  batchId: string
  startText: string
  /** Rules that fired on this batch (on this side). */
  rules: SignalRule[]
  /** `above`: more energy per kg water than the baseline (worse); `below`: less (better). */
  side: 'above' | 'below'
  /** 1 for the first batch after the baseline. */
  batchesAfterBaseline: number
}

export interface BatchRef {
  batchIndex: number
  batchId: string
  startText: string
}

export interface ChangeLocation extends BatchRef {
  /** Probability that the change began with this batch (one step after the baseline assumed). */
  probability: number
  /** First and last batch of the smallest set of batches holding ≥ 90 % of the probability. */
  intervalFrom: BatchRef
  intervalTo: BatchRef
  /** Probability of every batch from `intervalFrom` to `intervalTo`. */
  intervalProbability: number
  /** Which signal the search ended at (the change began at or before it). */
  searchedUpTo: BatchRef
}

export interface ChartFinding {
  /** First monitored batch with any signal (run rules, EWMA or CUSUM), or null. */
  firstSignal: ChartSignal | null
  /** First monitored batch signalling a rise in energy use by any rule, or null. */
  firstRiseSignal: ChartSignal | null
  /** First monitored batch where the upper CUSUM crosses h: the signal the answer acts on. */
  cusumRise: ChartSignal | null
  /** First monitored batch where the lower CUSUM crosses h (less energy than the baseline). */
  cusumFall: ChartSignal | null
  /** Where the rise most likely began, searched up to the CUSUM rise (else the first rise signal). */
  changePoint: ChangeLocation | null
  /** The same batch as `changePoint`, kept as a plain reference. */
  estimatedChangeStart: BatchRef | null
  /** Mean of the charted value from the estimated change to the end, minus the centre line. */
  shiftAfterChange: number | null
  /** Baseline batches with a run-rule signal: a baseline that is not in control gives limits to distrust. */
  baselineSignals: number
}

export interface ChartSet {
  /** Batch index (into `batches`) of each charted point. */
  batchIndices: number[]
  /** Unit of the charted values. */
  unit: 'MJ/kg water' | '% of expected'
  individuals: IndividualsChart
  ewma: EwmaChart
  cusum: CusumChart
  finding: ChartFinding
}

type Charts = Omit<ChartSet, 'finding'>

function refOf(batches: BatchEnergy[], set: Charts, point: number): BatchRef {
  const b = batches[set.batchIndices[point]]
  return { batchIndex: b.index, batchId: b.batchId, startText: b.startText }
}

/** Every rule that fired on `point` on `side`. */
function rulesAt(set: Charts, point: number, side: 'above' | 'below'): SignalRule[] {
  const rules: SignalRule[] = set.individuals.signals
    .filter((s) => s.index === point && s.side === side)
    .map((s) => s.rule)
  if (set.ewma.signals.some((s) => s.index === point && s.side === side)) rules.push('EWMA')
  if (set.cusum.signals.some((s) => s.index === point && s.side === side)) rules.push('CUSUM')
  return [...new Set(rules)]
}

function signalOf(
  set: Charts,
  batches: BatchEnergy[],
  baselineCount: number,
  point: number,
  side: 'above' | 'below',
): ChartSignal {
  const ref = refOf(batches, set, point)
  return {
    ...ref,
    rules: rulesAt(set, point, side),
    side,
    batchesAfterBaseline: ref.batchIndex - baselineCount + 1,
  }
}

/** First monitored point with a signal of the given rules on `side` ('any' for both sides). */
function firstPoint(
  set: Charts,
  side: 'above' | 'below' | 'any',
): { point: number; side: 'above' | 'below' } | null {
  const start = set.individuals.baselineCount
  const all = [
    ...set.individuals.signals.map((s) => ({ point: s.index, side: s.side })),
    ...set.ewma.signals.map((s) => ({ point: s.index, side: s.side })),
    ...set.cusum.signals.map((s) => ({ point: s.index, side: s.side })),
  ].filter((s) => s.point >= start && (side === 'any' || s.side === side))
  if (all.length === 0) return null
  return all.reduce((a, b) => (b.point < a.point || (b.point === a.point && b.side === 'above') ? b : a))
}

function finding(set: Charts, batches: BatchEnergy[], baselineCount: number): ChartFinding {
  const { individuals, cusum } = set
  const baselineSignals = new Set(
    individuals.signals.filter((s) => s.index < individuals.baselineCount).map((s) => s.index),
  ).size
  const any = firstPoint(set, 'any')
  const rise = firstPoint(set, 'above')
  const firstSignal = any ? signalOf(set, batches, baselineCount, any.point, any.side) : null
  const firstRiseSignal = rise ? signalOf(set, batches, baselineCount, rise.point, 'above') : null
  const cusumRise =
    cusum.firstUpperSignal === null
      ? null
      : signalOf(set, batches, baselineCount, cusum.firstUpperSignal, 'above')
  const cusumFall =
    cusum.firstLowerSignal === null
      ? null
      : signalOf(set, batches, baselineCount, cusum.firstLowerSignal, 'below')
  const until = cusum.firstUpperSignal ?? rise?.point ?? null
  if (until === null) {
    return {
      firstSignal,
      firstRiseSignal,
      cusumRise,
      cusumFall,
      changePoint: null,
      estimatedChangeStart: null,
      shiftAfterChange: null,
      baselineSignals,
    }
  }
  const estimate: ChangePointEstimate = estimateChangePoint(
    individuals.values,
    individuals.centerLine,
    individuals.sigma,
    individuals.baselineCount,
    until,
    'up',
  )
  const at = refOf(batches, set, estimate.index)
  return {
    firstSignal,
    firstRiseSignal,
    cusumRise,
    cusumFall,
    changePoint: {
      ...at,
      probability: estimate.probability,
      intervalFrom: refOf(batches, set, estimate.intervalFrom),
      intervalTo: refOf(batches, set, estimate.intervalTo),
      intervalProbability: estimate.intervalProbability,
      searchedUpTo: refOf(batches, set, until),
    },
    estimatedChangeStart: at,
    shiftAfterChange: estimate.shift,
    baselineSignals,
  }
}

/**
 * Chart `values` (one per batch in `batchIndices`) with limits from the first `baseline` of them.
 * `batchBaseline` is the baseline size in batches (for "batches after the baseline").
 */
export function chartSet(
  values: number[],
  batchIndices: number[],
  baseline: number,
  batches: BatchEnergy[],
  batchBaseline: number,
  unit: ChartSet['unit'],
): ChartSet {
  const individuals = individualsChart(values, baseline)
  const ewma = ewmaChart(values, individuals.centerLine, individuals.sigma, baseline)
  const cusum = cusumChart(values, individuals.centerLine, individuals.sigma, baseline)
  const set = { batchIndices, unit, individuals, ewma, cusum }
  return { ...set, finding: finding(set, batches, batchBaseline) }
}
