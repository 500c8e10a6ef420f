/**
 * @module bench/sections/energy-detection
 * The seeded detection study of the energy charts (bench/energy-study.ts): on invented logs whose weather
 * drifts beyond the 20-batch baseline, how many batches each method takes to find a step of 3–10 % in fuel
 * per kg of water from batch 29, and how many logs give a false alarm before it. All methods chart the same
 * logs in the same run. Seeds 1–10 are the ten logs of the acceptance check; seeds 1–200 give the rates.
 * Seeds 1001–1200 were used to design the method (docs/energy-charts.md) and are not reported here.
 * Also the CUSUM's average run lengths against Lucas & Crosier (1982) Table 1.
 */
import { twoSidedCusumArl } from '../../src/analysis/energy/cusum-arl.ts'
import { METHODS, runScenario, STUDY_STEP_BATCH, summarise } from '../energy-study.ts'
import type { BenchFigure, BenchSection } from '../section.ts'

const seeds = (from: number, count: number) => Array.from({ length: count }, (_, i) => from + i)

const SCENARIOS: { label: string; stepFraction: number; stepBatch: number | null; noiseScale: number }[] = [
  { label: 'no fault', stepFraction: 0, stepBatch: null, noiseScale: 1 },
  { label: '3 % step', stepFraction: 0.03, stepBatch: STUDY_STEP_BATCH, noiseScale: 1 },
  { label: '5 % step', stepFraction: 0.05, stepBatch: STUDY_STEP_BATCH, noiseScale: 1 },
  { label: '7 % step', stepFraction: 0.07, stepBatch: STUDY_STEP_BATCH, noiseScale: 1 },
  { label: '10 % step', stepFraction: 0.1, stepBatch: STUDY_STEP_BATCH, noiseScale: 1 },
  { label: '7 % step, noise doubled', stepFraction: 0.07, stepBatch: STUDY_STEP_BATCH, noiseScale: 2 },
]

/** Lucas & Crosier (1982) Table 1, two-sided CUSUM k = 0.5, h = 4 (read in a secondary copy: R package spc docs). */
const LUCAS_CROSIER_H4: [number, number][] = [
  [0, 168],
  [1, 8.38],
  [2, 3.34],
  [3, 2.19],
]

export const section: BenchSection = {
  id: 'energy-detection',
  title:
    'energy charts: detection delay and false alarms per method on invented drifting-season logs (same run)',
  run() {
    const figures: BenchFigure[] = []
    for (const [shift, published] of LUCAS_CROSIER_H4) {
      figures.push({
        name: `CUSUM ARL k = 0.5, h = 4, shift ${shift}σ`,
        value: twoSidedCusumArl(0.5, 4, shift),
        unit: 'batches',
        note: `Lucas & Crosier 1982 Table 1: ${published}`,
      })
    }
    for (const shift of [0, 1, 2, 3]) {
      figures.push({
        name: `CUSUM ARL k = 0.5, h = 5 (used), shift ${shift}σ`,
        value: twoSidedCusumArl(0.5, 5, shift),
        unit: 'batches',
        note: 'integral equation, same code as the h = 4 check',
      })
    }
    for (const [set, list] of [
      ['10 logs', seeds(1, 10)],
      ['200 logs', seeds(1, 200)],
    ] as const) {
      for (const sc of SCENARIOS) {
        const outcomes = runScenario({ ...sc, seeds: [...list] })
        const n = outcomes.length
        for (const s of summarise(outcomes)) {
          const label = METHODS.find((m) => m.id === s.method)!.label
          if (sc.stepBatch !== null) {
            figures.push({
              name: `${sc.label}, ${set}: ${s.method} found within 3 batches`,
              value: s.withinThree,
              unit: `of ${n}`,
              note: `${label}; found at all ${s.detected}, median delay ${s.medianDelay ?? '–'} batches`,
            })
          }
          figures.push({
            name: `${sc.label}, ${set}: ${s.method} false alarms ${sc.stepBatch === null ? 'in 20 monitored batches' : 'before the step'}`,
            value: s.falseAlarmLogs,
            unit: `of ${n}`,
            note: label,
          })
        }
        if (sc.stepBatch !== null) {
          figures.push({
            name: `${sc.label}, ${set}: answer names batch ${sc.stepBatch} first`,
            value: outcomes.filter((o) => o.firstLineNamesStep).length,
            unit: `of ${n}`,
            note: `its ≥ 90 % interval holds it in ${outcomes.filter((o) => o.intervalCovers).length}; physics view chosen in ${outcomes.filter((o) => o.view === 'physics').length}`,
          })
        }
      }
    }
    return figures
  },
}
