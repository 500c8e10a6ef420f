/**
 * @module bench/energy-study
 * The seeded detection study of the energy charts: invented logs (climate-demo/energy/drifting-season-model.ts)
 * with a 20-batch baseline in cool, humid weather, then warmer and drier weather drifting beyond it, and a
 * step rise of fuel per kg of water from a known batch; every method charts the same logs in the same run.
 * Used by bench/sections/energy-detection.ts (npm run bench) and test/analysis/energy/detection-study.test.ts.
 *
 * Definitions: the delay is the number of faulty batches up to and including the one that signals (1 = the
 * first faulty batch signals); "within 3" means a delay of at most 3. A false alarm is any signal, of more or
 * of less energy, on a monitored batch before the first faulty one (a log counts once).
 */
import { buildDriftingSeasonLog, TESSABY_ELEVATION_M } from '../climate-demo/energy/drifting-season-model.ts'
import type { ChartSet } from '../src/analysis/energy/chart-set.ts'
import { analyzeEnergyLog, type EnergyChartAssessment } from '../src/analysis/energy/energy-chart.ts'

export const STUDY_BATCHES = 40
export const STUDY_BASELINE = 20
/** 1-based first faulty batch (as in the held-out log). */
export const STUDY_STEP_BATCH = 29

export type MethodId =
  | 'answer'
  | 'physics-cusum'
  | 'physics-rules'
  | 'regression-rules'
  | 'regression-cusum'
  | 'raw-rules'
  | 'raw-cusum'

export const METHODS: { id: MethodId; label: string }[] = [
  { id: 'answer', label: 'the answer (chosen view, CUSUM)' },
  { id: 'physics-cusum', label: 'physics view, CUSUM' },
  { id: 'physics-rules', label: 'physics view, run rules + EWMA' },
  { id: 'regression-rules', label: 'regression view, run rules + EWMA (the chart before this change)' },
  { id: 'regression-cusum', label: 'regression view, CUSUM' },
  { id: 'raw-rules', label: 'raw specific energy, run rules + EWMA' },
  { id: 'raw-cusum', label: 'raw specific energy, CUSUM' },
]

/** Monitored signals of one method: 0-based batch index and side. */
function signalsOf(a: EnergyChartAssessment, method: MethodId): { batch: number; side: 'above' | 'below' }[] {
  const set = (m: MethodId): ChartSet | null => {
    if (m === 'answer')
      return a.answer.view === 'physics' ? a.physics : a.answer.view === 'regression' ? a.adjusted : a.raw
    if (m.startsWith('physics')) return a.physics
    if (m.startsWith('regression')) return a.adjusted
    return a.raw
  }
  const s = set(method)
  if (!s) return []
  const rules = method.endsWith('rules')
  const list = rules ? [...s.individuals.signals, ...s.ewma.signals] : s.cusum.signals
  return list
    .map((x) => ({ batch: s.batchIndices[x.index], side: x.side }))
    .filter((x) => x.batch >= a.baselineCount)
}

export interface LogOutcome {
  seed: number
  /** Delay in batches (1 = the first faulty batch signals), or null when no rise signal came. */
  delay: Record<MethodId, number | null>
  falseAlarm: Record<MethodId, boolean>
  /** The view the answer chose. */
  view: EnergyChartAssessment['answer']['view']
  /** 1-based batch the answer names as the most likely start, or null. */
  namedBatch: number | null
  /** Whether the answer's ≥ 90 % interval contains the true first faulty batch. */
  intervalCovers: boolean
  /** True first faulty batch named in the answer's first line. */
  firstLineNamesStep: boolean
}

export interface ScenarioOptions {
  stepFraction: number
  /** null: no fault in the log. */
  stepBatch: number | null
  seeds: number[]
  noiseScale?: number
}

/** Run one scenario over its seeds. */
export function runScenario(o: ScenarioOptions): LogOutcome[] {
  return o.seeds.map((seed) => {
    const { csv, truth } = buildDriftingSeasonLog({
      seed,
      batches: STUDY_BATCHES,
      coolBatches: STUDY_BASELINE,
      stepBatch: o.stepBatch,
      stepFraction: o.stepFraction,
      noiseScale: o.noiseScale,
    })
    const a = analyzeEnergyLog(csv, { baselineCount: STUDY_BASELINE, elevationM: TESSABY_ELEVATION_M })
    const step = o.stepBatch === null ? Number.POSITIVE_INFINITY : o.stepBatch - 1
    const delay = {} as Record<MethodId, number | null>
    const falseAlarm = {} as Record<MethodId, boolean>
    for (const { id } of METHODS) {
      const sig = signalsOf(a, id)
      falseAlarm[id] = sig.some((x) => x.batch < step)
      const hit = sig.filter((x) => x.side === 'above' && x.batch >= step).map((x) => x.batch)
      delay[id] = hit.length > 0 && Number.isFinite(step) ? Math.min(...hit) - step + 1 : null
    }
    const set = a.answer.view === 'physics' ? a.physics : a.answer.view === 'regression' ? a.adjusted : a.raw
    const cp = set?.finding.changePoint ?? null
    const stepId = o.stepBatch === null ? null : truth[o.stepBatch - 1].batchId
    return {
      seed,
      delay,
      falseAlarm,
      view: a.answer.view,
      namedBatch: cp ? cp.batchIndex + 1 : null,
      intervalCovers: cp !== null && step >= cp.intervalFrom.batchIndex && step <= cp.intervalTo.batchIndex,
      firstLineNamesStep: stepId !== null && a.summary[0].includes(`from batch ${stepId} `),
    }
  })
}

export interface MethodSummary {
  method: MethodId
  logs: number
  withinThree: number
  detected: number
  medianDelay: number | null
  falseAlarmLogs: number
}

/** Per method: logs found within 3 batches, found at all, median delay of those found, logs with a false alarm. */
export function summarise(outcomes: LogOutcome[]): MethodSummary[] {
  return METHODS.map(({ id }) => {
    const delays = outcomes.map((o) => o.delay[id]).filter((d): d is number => d !== null)
    const sorted = [...delays].sort((x, y) => x - y)
    const mid = sorted.length >> 1
    return {
      method: id,
      logs: outcomes.length,
      withinThree: delays.filter((d) => d <= 3).length,
      detected: delays.length,
      medianDelay:
        sorted.length === 0 ? null : sorted.length % 2 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]),
      falseAlarmLogs: outcomes.filter((o) => o.falseAlarm[id]).length,
    }
  })
}
