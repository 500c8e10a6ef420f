/**
 * The acceptance check of the energy charts on the seeded detection study (bench/energy-study.ts; invented
 * logs of climate-demo/energy/drifting-season-model.ts): a 20-batch baseline in cool, humid weather, then
 * warmer and drier weather drifting beyond it, and a 7 % step in fuel per kg of water from batch 29. Seeds
 * 1–10 are the ten logs of the check (the method was designed on seeds 1001–1200). The chart the answer
 * uses must find the step within 3 batches in at least 8 of the 10 logs with at most one false alarm before
 * it, and the regression chart as it was before (run rules + EWMA on the regression residual), measured on
 * the same logs in the same run, must do markedly worse.
 */
import { describe, expect, it } from 'vitest'
import { runScenario, STUDY_STEP_BATCH, summarise } from '../../../bench/energy-study.ts'

const SEEDS = Array.from({ length: 10 }, (_, i) => i + 1)

describe('detection study, 10 invented logs with a 7 % step from batch 29 (seeds 1–10)', () => {
  const outcomes = runScenario({ stepFraction: 0.07, stepBatch: STUDY_STEP_BATCH, seeds: SEEDS })
  const by = Object.fromEntries(summarise(outcomes).map((s) => [s.method, s]))
  it('the answer finds the step within 3 batches in at least 8 of 10 logs, with at most 1 false alarm before it', () => {
    // Measured: 9 of 10 within 3 batches (all 10 found; median delay 2.5 batches), no false alarm.
    expect(by.answer.withinThree).toBeGreaterThanOrEqual(8)
    expect(by.answer.falseAlarmLogs).toBeLessThanOrEqual(1)
  })
  it('the regression chart as it was does markedly worse on the same logs', () => {
    // Measured: 1 of 10 within 3 batches (5 found at all, median delay 8), false alarms in 3 of 10.
    expect(by['regression-rules'].withinThree).toBeLessThanOrEqual(by.answer.withinThree - 5)
    expect(by['regression-rules'].falseAlarmLogs).toBeGreaterThan(by.answer.falseAlarmLogs)
  })
  it("the answer's first line names batch 29 as the most likely start", () => {
    // Measured: 10 of 10; the ≥ 90 % interval holds batch 29 in 10 of 10.
    expect(outcomes.filter((o) => o.firstLineNamesStep).length).toBeGreaterThanOrEqual(8)
    expect(outcomes.filter((o) => o.intervalCovers).length).toBeGreaterThanOrEqual(8)
  })
})

describe('the same ten seasons without a fault', () => {
  const outcomes = runScenario({ stepFraction: 0, stepBatch: null, seeds: SEEDS })
  const by = Object.fromEntries(summarise(outcomes).map((s) => [s.method, s]))
  it('the answer stays quiet more often than the regression chart over all 20 monitored batches', () => {
    // Measured: false alarms in 1 of 10 (answer) and 6 of 10 (regression chart as it was); the raw chart
    // signals in all 10 (the weather, not the dryer).
    expect(by.answer.falseAlarmLogs).toBeLessThanOrEqual(2)
    expect(by['regression-rules'].falseAlarmLogs).toBeGreaterThan(by.answer.falseAlarmLogs)
    expect(by['raw-rules'].falseAlarmLogs).toBe(10)
  })
})
