/**
 * ASHRAE Handbook — Fundamentals 2017 (SI) ch. 1: what the table values in test/fixtures/truth/ (read by
 * test/truth/ashrae-tables.test.ts) do not cover.
 */
import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'
import { standardPressureKpaAtElevation } from '../../src/physics/moist-air.ts'

describe('ASHRAE HOF 2017 ch. 1 eq 3: standard atmosphere (Table 1 itself: test/fixtures/truth/)', () => {
  it('10000 m (26436 Pa in Table 1) is outside the accepted −500…9000 m and is refused', () => {
    expect(() => standardPressureKpaAtElevation(10000)).toThrow(/elevation .*10000/)
  })
  it('airState at 1000 m elevation uses the eq 3 pressure', () => {
    expect(airState({ dryBulbC: 20, relativeHumidityPct: 50, elevationM: 1000 }).pressureKpa).toBeCloseTo(
      89.875,
      3,
    )
  })
})
