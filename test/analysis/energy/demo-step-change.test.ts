import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  BATCH_COUNT,
  buildDemoBatchLog,
  STEP_BATCH_NUMBER,
} from '../../../climate-demo/energy/batch-log-model.ts'
import {
  analyzeEnergyLog,
  type ChartSet,
  extrapolationWarning,
} from '../../../src/analysis/energy/energy-chart.ts'

const DEMO_PATH = new URL('../../../climate-demo/energy/quillow-dryer-batches-2026.csv', import.meta.url)
const text = readFileSync(DEMO_PATH, 'utf8')
const assessment = analyzeEnergyLog(text)
/** 0-based batch index of the first batch after the invented fault. */
const CHANGE = STEP_BATCH_NUMBER - 1

/** Batches after the change until the first signal of MORE energy use (0 = on the first faulty batch). */
function detectionDelay(set: ChartSet): number | null {
  const indices = [
    ...set.individuals.signals.filter((s) => s.side === 'above').map((s) => s.index),
    ...set.ewma.signals.filter((s) => s.side === 'above').map((s) => s.index),
  ]
    .map((point) => set.batchIndices[point])
    .filter((batch) => batch >= CHANGE)
  return indices.length > 0 ? Math.min(...indices) - CHANGE : null
}

/** Signals of any side in phase II before the change: false alarms, since nothing changed yet. */
function falseAlarms(set: ChartSet, baselineCount: number): number {
  const points = [...set.individuals.signals, ...set.ewma.signals]
    .map((s) => set.batchIndices[s.index])
    .filter((batch) => batch >= baselineCount && batch < CHANGE)
  return new Set(points).size
}

describe('demo batch log (invented, climate-demo/energy)', () => {
  it('is exactly what the seeded generator writes', () => {
    expect(text).toBe(buildDemoBatchLog().csv)
  })
  it('reads with one rejected row (the deliberately incomplete one) and the default baseline of 20', () => {
    expect(assessment.accounting.rowsUsed).toBe(BATCH_COUNT)
    expect(assessment.accounting.rowsRejected).toBe(1)
    expect(assessment.rejections[0].message).toMatch(/^line 27: give final_mass_kg/)
    expect(assessment.baselineCount).toBe(20)
  })
  it('the regression recovers the invented coefficients within 3 standard errors', () => {
    // Invented model (batch-log-model.ts): SE = 4.6 − 0.05(T − 10) + 0.12(W − 7) − 0.14(load − 11) + ε
    // → intercept 4.6 + 0.5 − 0.84 + 1.54 = 5.80, W 0.12 per g/kg, T −0.05 per K, load −0.14 per t.
    const truth = [5.8, 0.12, -0.05, -0.14]
    const coefficients = assessment.adjusted!.regression.coefficients
    coefficients.forEach((c, j) => {
      expect(Math.abs(c.estimate - truth[j])).toBeLessThan(3 * c.standardError)
    })
    expect(assessment.adjusted!.regression.rSquared).toBeGreaterThan(0.8)
  })
  it('the residual chart flags the step change in fewer batches than the raw chart (measured)', () => {
    const raw = detectionDelay(assessment.raw)
    const adjusted = detectionDelay(assessment.adjusted!)
    expect(adjusted).not.toBeNull()
    expect(adjusted as number).toBeLessThan(raw ?? Number.POSITIVE_INFINITY)
    // Measured on the committed log: adjusted 1 batch (Q26-042), raw 19 batches (first rise signal on Q26-060).
    expect(adjusted).toBe(1)
    expect(raw).toBe(19)
  })
  it('the residual chart gives no false alarm between the baseline and the change; the raw chart does', () => {
    expect(falseAlarms(assessment.adjusted!, assessment.baselineCount)).toBe(0)
    expect(falseAlarms(assessment.raw, assessment.baselineCount)).toBeGreaterThan(0)
  })
  it('is JSON-safe: every number in the assessment is finite (no NaN or Infinity turned into null)', () => {
    const bad: string[] = []
    const walk = (v: unknown, path: string) => {
      if (typeof v === 'number' && !Number.isFinite(v)) bad.push(path)
      else if (Array.isArray(v)) for (const [i, x] of v.entries()) walk(x, `${path}[${i}]`)
      else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`)
    }
    walk(assessment, '$')
    expect(bad).toEqual([])
    expect(JSON.parse(JSON.stringify(assessment))).toEqual(assessment)
  })
  it('the text names the batch where the change began', () => {
    const line = assessment.summary.find((s) => s.startsWith('Regression (weather- and load-adjusted) chart'))
    expect(line).toMatch(/MORE energy per kg water at batch Q26-042/)
    expect(assessment.adjusted!.finding.estimatedChangeStart?.batchId).toBe('Q26-041')
    // The demo's invented energy model is a straight line in the weather (batch-log-model.ts), which the
    // regression matches and the physics form does not: the answer uses the regression view (measured: the
    // physics view's cross-validated error is 4.4 times the regression's).
    expect(assessment.answer.view).toBe('regression')
    // The answer line: the invented step is +7 % (batch-log-model.ts STEP_FRACTION); measured shift about 8 %.
    expect(assessment.summary[0]).toMatch(
      /^Answer: the dryer uses more energy per kg of water than expected from batch Q26-041 \(2026-10-24T07:00-06:00\) on \(\d+ % likely the first such batch; \d+ % sure it began between batches Q26-04\d and Q26-04\d\), about \+[78] % \(\+0\.3\d MJ\/kg\), on the regression/,
    )
  })
})

describe('the same comparison over 20 other seeds of the demo generator (same model, other weather and noise)', () => {
  const results = Array.from({ length: 20 }, (_, k) => {
    const a = analyzeEnergyLog(buildDemoBatchLog(k + 1).csv)
    return {
      raw: detectionDelay(a.raw),
      adjusted: detectionDelay(a.adjusted!),
      adjustedFalseAlarms: falseAlarms(a.adjusted!, a.baselineCount),
    }
  })
  it('the residual chart is never later than the raw chart and earlier in most seeds', () => {
    // Measured: earlier in 17 of 20 seeds, tied in 3 (seeds 14, 15, 16), never later; residual delay 0–3 batches.
    expect(results.every((r) => r.adjusted !== null && (r.raw === null || r.adjusted <= r.raw))).toBe(true)
    expect(
      results.filter((r) => r.adjusted !== null && (r.raw === null || r.adjusted < r.raw)).length,
    ).toBeGreaterThanOrEqual(15)
    expect(Math.max(...results.map((r) => r.adjusted as number))).toBeLessThanOrEqual(3)
  })
  it('but it is not free of false alarms: with a September-only baseline it extrapolates into colder weather', () => {
    // Measured: false alarms between the baseline and the change in 8 of 20 seeds (raw chart: 12 of 20; the
    // committed seed has none on the adjusted chart). Plain residuals, not divided by √(1 + h), gave 13 of 20.
    // This is why the assessment warns when monitored batches lie outside the baseline's ranges.
    expect(results.filter((r) => r.adjustedFalseAlarms > 0).length).toBeGreaterThan(0)
    expect(
      assessment.warnings.some((w) => /outside the baseline's range of outside humidity ratio/.test(w)),
    ).toBe(true)
  })
})

describe('extrapolation warning', () => {
  it('counts monitored batches outside the baseline range of each regressor', () => {
    const baseline = [
      [5, 10, 8],
      [9, 20, 12],
    ]
    expect(extrapolationWarning(baseline, [[6, 15, 10]])).toBeNull()
    expect(
      extrapolationWarning(baseline, [
        [4, 15, 10],
        [6, 25, 13],
        [6, 15, 10],
      ]),
    ).toMatch(
      /^Of 3 monitored batches, 1 lie outside the baseline's range of outside humidity ratio, 1 of outside temperature and 1 of load:/,
    )
  })
})
