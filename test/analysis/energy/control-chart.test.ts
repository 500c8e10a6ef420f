import { describe, expect, it } from 'vitest'
import {
  D2_MOVING_RANGE_OF_TWO,
  D3_MOVING_RANGE_OF_TWO,
  D3_SMALL_MOVING_RANGE_OF_TWO,
  D4_MOVING_RANGE_OF_TWO,
} from '../../../src/analysis/energy/control-constants.ts'
import { ewmaChart } from '../../../src/analysis/energy/ewma-chart.ts'
import { individualsChart } from '../../../src/analysis/energy/individuals-chart.ts'

describe('control-chart constants for moving ranges of two', () => {
  // Montgomery, Introduction to Statistical Quality Control, Appendix Table VI "Factors for constructing
  // variables control charts", row n = 2: d2 = 1.128, d3 = 0.853, D3 = 0, D4 = 3.267.
  it('match Montgomery Appendix Table VI, n = 2', () => {
    expect(D2_MOVING_RANGE_OF_TWO).toBe(1.128)
    expect(D3_SMALL_MOVING_RANGE_OF_TWO).toBe(0.853)
    expect(D3_MOVING_RANGE_OF_TWO).toBe(0)
    expect(D4_MOVING_RANGE_OF_TWO).toBe(3.267)
  })
  it('agree with their definitions: d2(2) = 2/√π, D4 = 1 + 3·d3/d2 (table rounding, 3 decimals)', () => {
    // E|X1 − X2| for standard normals = 2/√π (textbook result, e.g. Montgomery ch. 6).
    expect(D2_MOVING_RANGE_OF_TWO).toBeCloseTo(2 / Math.sqrt(Math.PI), 3)
    expect(D4_MOVING_RANGE_OF_TWO).toBeCloseTo(
      1 + (3 * D3_SMALL_MOVING_RANGE_OF_TWO) / D2_MOVING_RANGE_OF_TWO,
      2,
    )
  })
})

describe('individuals and moving-range chart', () => {
  it('worked example computed by hand', () => {
    // Baseline x = 10, 12, 11, 13, 12 (5 points), then 2 monitoring points 20 and 11.
    // x̄ = 58/5 = 11.6. Moving ranges |12−10|, |11−12|, |13−11|, |12−13| = 2, 1, 2, 1 → MR̄ = 6/4 = 1.5.
    // σ̂ = 1.5/1.128 = 1.329787. UCL = 11.6 + 3·1.329787 = 15.589362, LCL = 11.6 − 3.989362 = 7.610638.
    // MR chart: UCL = 3.267·1.5 = 4.9005, LCL = 0·1.5 = 0.
    // Point 20 (index 5) is beyond the UCL (WE1); its moving range |20 − 12| = 8 > 4.9005, and so is
    // |11 − 20| = 9 (index 6).
    const chart = individualsChart([10, 12, 11, 13, 12, 20, 11], 5)
    expect(chart.centerLine).toBeCloseTo(11.6, 12)
    expect(chart.meanMovingRange).toBeCloseTo(1.5, 12)
    expect(chart.sigma).toBeCloseTo(1.329787, 6)
    expect(chart.upperControlLimit).toBeCloseTo(15.589362, 6)
    expect(chart.lowerControlLimit).toBeCloseTo(7.610638, 6)
    expect(chart.movingRangeUpperLimit).toBeCloseTo(4.9005, 10)
    expect(chart.movingRangeLowerLimit).toBe(0)
    expect(chart.movingRanges).toEqual([null, 2, 1, 2, 1, 8, 9])
    expect(chart.movingRangeSignals).toEqual([5, 6])
    expect(chart.signals.filter((s) => s.rule === 'WE1').map((s) => s.index)).toEqual([5])
    expect(chart.firstMonitoringSignal).toBe(5)
  })
  it('uses only the baseline for its limits (phase II points do not move them)', () => {
    const a = individualsChart([10, 12, 11, 13, 12, 100, -50], 5)
    const b = individualsChart([10, 12, 11, 13, 12], 5)
    expect(a.upperControlLimit).toBe(b.upperControlLimit)
    expect(a.meanMovingRange).toBe(b.meanMovingRange)
  })
  it('rejects a baseline that is too short, too long or without spread, naming the value', () => {
    expect(() => individualsChart([1, 2, 3, 4, 5, 6], 4)).toThrow(
      /baseline must be a whole number of batches ≥ 5, got 4/,
    )
    expect(() => individualsChart([1, 2, 3, 4, 5], 6)).toThrow(/longer than the 5 batches/)
    expect(() => individualsChart([3, 3, 3, 3, 3, 4], 5)).toThrow(/all equal/)
    expect(() => individualsChart([1, 2, Number.NaN, 4, 5], 5)).toThrow(/charted value 3/)
  })
})

describe('EWMA chart', () => {
  it('worked example computed by hand (λ = 0.1, L = 2.814, μ0 = 0, σ = 1)', () => {
    // z1 = 0.1·1 + 0.9·0 = 0.1; half-width1 = 2.814·√(0.1/1.9·(1 − 0.9²)) = 2.814·√(0.0526316·0.19) = 2.814·0.1 = 0.2814
    // z2 = 0.1·1 + 0.9·0.1 = 0.19; half-width2 = 2.814·√(0.0526316·(1 − 0.6561)) = 2.814·√0.0181000 = 2.814·0.134536
    //    = 0.378584
    const c = ewmaChart([1, 1], 0, 1, 0)
    expect(c.lambda).toBe(0.1)
    expect(c.limitWidthL).toBe(2.814)
    expect(c.ewma[0]).toBeCloseTo(0.1, 12)
    expect(c.ewma[1]).toBeCloseTo(0.19, 12)
    expect(c.upperLimits[0]).toBeCloseTo(0.2814, 9)
    expect(c.upperLimits[1]).toBeCloseTo(0.378584, 5)
    expect(c.lowerLimits[1]).toBeCloseTo(-0.378584, 5)
  })
  it('limits approach the steady state L·σ·√(λ/(2 − λ)) (Montgomery, EWMA section)', () => {
    const c = ewmaChart(new Array(200).fill(5), 5, 2, 0)
    expect(c.upperLimits[199]).toBeCloseTo(5 + 2.814 * 2 * Math.sqrt(0.1 / 1.9), 9)
    expect(c.signals).toEqual([])
  })
  it('in-control average run length is about 500 (Lucas & Saccucci 1990 design for λ = 0.10, L = 2.814)', () => {
    // 1000 simulated in-control sequences (xorshift32 + Box–Muller); run length = first signal. The mean of
    // 1000 run lengths with ARL ≈ 500 has a standard error of about 16: accept 420…580.
    let x = 2463534242
    const u = () => {
      x ^= x << 13
      x >>>= 0
      x ^= x >>> 17
      x ^= x << 5
      x >>>= 0
      return (x + 0.5) / 4294967296
    }
    const normal = () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u())
    let total = 0
    const runs = 1000
    for (let r = 0; r < runs; r++) {
      const values = Array.from({ length: 3000 }, normal)
      const first = ewmaChart(values, 0, 1, 0).firstMonitoringSignal
      total += first === null ? values.length : first + 1
    }
    const arl = total / runs
    expect(arl).toBeGreaterThan(420)
    expect(arl).toBeLessThan(580)
  })
  it('signals a sustained 1σ shift that no single point shows beyond 3σ', () => {
    const values = [...new Array(20).fill(0), ...new Array(30).fill(1)]
    const c = ewmaChart(values, 0, 1, 20)
    // After the shift zᵢ = 1 − 0.9^k; the steady half-width is 2.814·0.229416 = 0.6456: crossed when
    // 0.9^k < 0.3544, k ≥ 10, i.e. the 10th shifted point (index 29).
    expect(c.firstMonitoringSignal).toBe(29)
    expect(c.signals[0]).toEqual({ index: 29, side: 'above' })
  })
})
