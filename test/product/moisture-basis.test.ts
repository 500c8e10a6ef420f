import { describe, expect, it } from 'vitest'
import {
  dryMatterKg,
  massAtMoistureKg,
  moistureDbFromWbPct,
  moistureRatio,
  moistureWbPctFromDb,
  waterToRemoveKg,
} from '../../src/product/moisture-basis.ts'

// Definitions M_db = M_wb/(1 − M_wb) (Brooker, Bakker-Arkema & Hall 1992, ch. 1); worked values by hand.
describe('moisture bases', () => {
  it('20 % wb is 0.25 kg/kg db and back', () => {
    expect(moistureDbFromWbPct(20)).toBeCloseTo(0.25, 12)
    expect(moistureWbPctFromDb(0.25)).toBeCloseTo(20, 12)
  })
  it('Hossain & Bala 2007 red chilli 2.85 kg/kg db is 74.0 % wb (the paper quotes both)', () => {
    expect(moistureWbPctFromDb(2.85)).toBeCloseTo(74.03, 2)
  })
  it('1000 kg of corn from 25 % to 15 % wb loses 117.6 kg of water', () => {
    expect(waterToRemoveKg(1000, 25, 15)).toBeCloseTo(117.647, 3)
    expect(dryMatterKg(1000, 25)).toBeCloseTo(750, 9)
    expect(massAtMoistureKg(750, 15)).toBeCloseTo(882.353, 3)
  })
  it('moisture ratio', () => expect(moistureRatio(1, 3, 0.5)).toBeCloseTo(0.2, 12))
  it('rejects impossible moistures with RangeError naming the basis', () => {
    expect(() => moistureDbFromWbPct(100)).toThrow(/wet basis/)
    expect(() => moistureDbFromWbPct(-1)).toThrow(RangeError)
    expect(() => moistureWbPctFromDb(Number.NaN)).toThrow(/dry basis/)
    expect(() => waterToRemoveKg(10, 15, 20)).toThrow(/above the initial/)
    expect(() => moistureRatio(1, 0.5, 0.5)).toThrow(RangeError)
  })
})
