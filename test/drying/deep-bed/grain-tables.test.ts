import { describe, expect, it } from 'vitest'
import {
  deepBedGrainFromProfile,
  ERH_TABLE_GRID,
  grainTables,
  SORPTION_HEAT_TABLE_GRID,
} from '../../../src/drying/deep-bed/index.ts'
import { productById } from '../../../src/product/catalogue.ts'

// The error bounds stated in src/drying/deep-bed/grain-tables.ts, measured at cell centres (where bilinear
// interpolation errs most) over the whole grid.
const GRAINS = ['shelled-corn', 'wheat', 'rough-rice', 'soybean', 'sorghum']

describe('isotherm and sorption-heat tables of the bin model', () => {
  it('read water activity within 1.1e-4 of the exact isotherm (corn at −20 °C the worst)', () => {
    const g = ERH_TABLE_GRID
    for (const id of GRAINS) {
      const grain = deepBedGrainFromProfile(productById(id))
      const t = grainTables(grain)
      let worst = 0
      for (let tc = g.tMinC + g.tStepC / 2; tc < g.tMaxC; tc += 4 * g.tStepC) {
        for (let m = g.mMinDb + g.mStepDb / 2; m < g.mMaxDb; m += 3 * g.mStepDb) {
          worst = Math.max(worst, Math.abs(t.erhPct(tc, m) - grain.erhPct(tc, m)) / 100)
        }
      }
      expect(worst, id).toBeLessThan(1.1e-4)
      if (id !== 'shelled-corn') expect(worst, id).toBeLessThan(5e-5)
    }
  })

  it('read the net heat of sorption within 12 kJ/kg (0.5 % of the latent heat) from 10 % db moisture up', () => {
    const g = SORPTION_HEAT_TABLE_GRID
    for (const id of GRAINS) {
      const grain = deepBedGrainFromProfile(productById(id))
      const t = grainTables(grain)
      let worst = 0
      for (let tc = g.tMinC + g.tStepC / 2; tc < g.tMaxC; tc += 2 * g.tStepC) {
        for (let m = 0.1 + g.mStepDb / 2; m < g.mMaxDb; m += 3 * g.mStepDb) {
          worst = Math.max(
            worst,
            Math.abs(t.netSorptionHeatKjPerKg(tc, m) - grain.netSorptionHeatKjPerKg!(tc, m)),
          )
        }
      }
      expect(worst, id).toBeLessThan(12)
    }
  })

  it('falls back to the exact function outside the grid and gives slopes that match a difference quotient', () => {
    const grain = deepBedGrainFromProfile(productById('wheat'))
    const t = grainTables(grain)
    expect(t.erhPct(70, 0.2)).toBe(grain.erhPct(70, 0.2))
    expect(t.erhPct(20, 0.7)).toBe(grain.erhPct(20, 0.7))
    const s = new Float64Array(2)
    const v = t.erhPctWithSlopes(20.1, 0.2101, s)
    expect(v).toBeCloseTo(t.erhPct(20.1, 0.2101), 12)
    expect(s[0]).toBeCloseTo((grain.erhPct(20.5, 0.2101) - grain.erhPct(19.5, 0.2101)) / 1, 1)
    expect(s[1] / ((grain.erhPct(20.1, 0.211) - grain.erhPct(20.1, 0.21)) / 0.001)).toBeCloseTo(1, 2)
  })

  it('builds one grain, and its tables, once per profile', () => {
    const a = deepBedGrainFromProfile(productById('sorghum'))
    const b = deepBedGrainFromProfile(productById('sorghum'))
    expect(a).toBe(b)
    expect(grainTables(a)).toBe(grainTables(b))
    expect(deepBedGrainFromProfile(productById('sorghum'), { bulkDensityKgPerM3: 700 })).not.toBe(a)
  })
})
