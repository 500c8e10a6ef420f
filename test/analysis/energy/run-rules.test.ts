import { describe, expect, it } from 'vitest'
import { westernElectricSignals } from '../../../src/analysis/energy/run-rules.ts'

// Rules as in Western Electric Co. (1956), Statistical Quality Control Handbook, listed in Montgomery,
// Introduction to Statistical Quality Control, section 5.3.6. Centre 0, σ = 1 in every sequence below.
const rulesAt = (values: number[]) =>
  westernElectricSignals(values, 0, 1).map((s) => `${s.index}:${s.rule}:${s.side}`)

describe('Western Electric run rules', () => {
  it('WE1 fires on one point beyond 3σ, either side', () => {
    expect(rulesAt([0.2, -0.1, 3.2])).toEqual(['2:WE1:above'])
    expect(rulesAt([0.2, -0.1, -3.2])).toEqual(['2:WE1:below'])
  })
  it('WE2 fires on two of three beyond 2σ on one side, and not when they are on opposite sides', () => {
    expect(rulesAt([0, 2.5, 0.3, 2.4])).toEqual(['3:WE2:above'])
    expect(rulesAt([-2.5, -2.1])).toEqual(['1:WE2:below'])
    expect(rulesAt([2.5, 0, -2.5])).toEqual([])
  })
  it('WE3 fires on four of five beyond 1σ on one side', () => {
    expect(rulesAt([1.5, 1.2, 0.1, 1.8, 1.3])).toEqual(['4:WE3:above'])
    expect(rulesAt([1.5, 1.2, 0.1, 1.8, -1.3])).toEqual([])
  })
  it('WE4 fires on eight in a row on one side, and again while the run continues', () => {
    const run = new Array(9).fill(-0.4)
    expect(rulesAt(run)).toEqual(['7:WE4:below', '8:WE4:below'])
    expect(rulesAt([...new Array(7).fill(0.4), -0.4])).toEqual([])
  })
  it('points exactly on a zone boundary do not count as beyond it', () => {
    expect(rulesAt([3, 2, 2])).toEqual([])
  })
  it('stays silent on in-control data: a seeded normal sequence with no rule violations by construction', () => {
    // 200 points alternating in sign (no run of 8), |z| < 1 except isolated points below 2σ: no rule can fire.
    const values = Array.from(
      { length: 200 },
      (_, i) => (i % 2 === 0 ? 1 : -1) * (0.2 + 0.7 * Math.abs(Math.sin(i * 1.7))),
    )
    values[50] = 1.9
    values[120] = -1.95
    expect(rulesAt(values)).toEqual([])
  })
  it('on independent standard normals fires about as often as the published in-control rate', () => {
    // With all four rules, the in-control ARL is about 91.75 points (Champ & Woodall 1987, Technometrics 29:393;
    // from memory). Signalled points cluster, so check only that the rate of signalled points per point is
    // between 1/200 and 1/45: far above 3σ limits alone (1/370) and far below a broken rule.
    let seed = 12345
    const uniform = () => {
      seed = (Math.imul(seed, 1103515245) + 12345) >>> 0 // LCG of ANSI C rand (from memory): good enough here
      return (seed + 0.5) / 4294967296
    }
    const normal = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform())
    const values = Array.from({ length: 20000 }, normal)
    const points = new Set(westernElectricSignals(values, 0, 1).map((s) => s.index)).size
    expect(points / values.length).toBeGreaterThan(1 / 200)
    expect(points / values.length).toBeLessThan(1 / 45)
  })
  it('rejects σ ≤ 0', () => {
    expect(() => westernElectricSignals([1, 2], 0, 0)).toThrow(/standard deviation > 0, got 0/)
  })
})
