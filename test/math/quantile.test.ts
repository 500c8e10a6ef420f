import { describe, expect, it } from 'vitest'
import { orderStatistic, quantileSorted } from '../../src/math/quantile.ts'
import { finiteMedian, MEDIAN_SAMPLE } from '../../src/weather/units.ts'

/** A small deterministic generator (Park–Miller), so the cases are the same every run. */
function lcg(seed: number): () => number {
  let s = seed
  return () => {
    s = (s * 48_271) % 2_147_483_647
    return s / 2_147_483_647
  }
}

describe('order statistics by selection', () => {
  it('gives the value the sorted array holds at k, for every k, with ties and negative values', () => {
    const rand = lcg(7)
    for (const n of [1, 2, 3, 10, 101, 1000]) {
      // rounded to one decimal: many ties
      const values = Float64Array.from({ length: n }, () => Math.round((rand() - 0.4) * 200) / 10)
      const sorted = Float64Array.from(values).sort()
      for (let k = 0; k < n; k += Math.max(1, Math.floor(n / 37))) {
        expect(orderStatistic(Float64Array.from(values), k)).toBe(sorted[k])
      }
    }
  })

  it('refuses an index outside the array', () => {
    expect(() => orderStatistic(new Float64Array(3), 3)).toThrow(RangeError)
    expect(() => orderStatistic(new Float64Array(3), 1.5)).toThrow(RangeError)
  })

  it('quantileSorted follows Hyndman & Fan definition 7 ([1, 2, 3, 4] at 0.1 is 1.3, worked by hand from it)', () => {
    // Hyndman R.J., Fan Y. 1996, "Sample quantiles in statistical packages", Am. Stat. 50:361 (definition 7,
    // R's default): h = (n − 1)q = 0.3, so 1 + 0.3·(2 − 1)
    expect(quantileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12)
  })
})

describe('the median that judges a column’s unit', () => {
  it('is the middle sorted value of the finite values, on short and on sampled long columns', () => {
    const rand = lcg(11)
    for (const n of [5, 8760, 50_000]) {
      const values = Float64Array.from({ length: n }, (_, i) => (i % 17 === 0 ? Number.NaN : rand() * 40 - 5))
      const step = Math.max(1, Math.floor(n / MEDIAN_SAMPLE))
      const finite: number[] = []
      for (let i = 0; i < n; i += step) if (Number.isFinite(values[i])) finite.push(values[i])
      finite.sort((a, b) => a - b)
      expect(finiteMedian(values)).toBe(finite[Math.floor(finite.length / 2)])
    }
    expect(Number.isNaN(finiteMedian(Float64Array.from([Number.NaN, Number.NaN])))).toBe(true)
  })
})
