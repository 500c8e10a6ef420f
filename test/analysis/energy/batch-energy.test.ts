import { describe, expect, it } from 'vitest'
import { batchEnergy } from '../../../src/analysis/energy/batch-energy.ts'
import { readBatchLog } from '../../../src/analysis/energy/batch-log.ts'
import { batchSorptionHeatMj } from '../../../src/analysis/energy/sorption-heat.ts'
import { latentHeatVaporizationMjPerKg } from '../../../src/physics/evaporation.ts'
import { productById } from '../../../src/product/catalogue.ts'
import { netIsostericHeatMjPerKg } from '../../../src/product/sorption-heat.ts'

describe('per-batch energy', () => {
  it('worked example: 10 t to 9 t with 4,000 MJ at 60 °C', () => {
    // Water 1,000 kg; specific energy 4,000/1,000 = 4.000 MJ/kg; λ(60 °C) = 2.501 − 0.002361·60 = 2.35934 MJ/kg
    // (FAO-56 Annex 3 eq 3-1); ideal 2,359.34 MJ; efficiency 2,359.34/4,000 = 58.98 %.
    const [b] = readBatchLog(
      'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh\n2026-09-01T08:00,5,10000,9000,1111.1111111111\n',
    ).batches
    const e = batchEnergy(b, 0, 0, null, { dryingTempC: 60 })
    expect(e.waterRemovedKg).toBe(1000)
    expect(e.specificEnergyMjPerKg).toBeCloseTo(4, 6)
    expect(e.latentHeatMjPerKg).toBeCloseTo(2.35934, 9)
    expect(e.thermalEfficiencyPct).toBeCloseTo(58.98, 2)
    expect(e.sorptionHeatMj).toBeNull()
  })
  it('water from moistures: 1,000 kg from 25 % to 15 % w.b. removes 117.6 kg (m·(w0 − w1)/(1 − w1))', () => {
    const [b] = readBatchLog(
      'start,duration_h,fresh_mass_kg,initial_moisture_wb_pct,final_moisture_wb_pct,energy_kwh,drying_temp_c\n2026-09-01T08:00,5,1000,25,15,100,40\n',
    ).batches
    const e = batchEnergy(b, 0, 0, null, { dryingTempC: 60 })
    expect(e.waterRemovedKg).toBeCloseTo(117.647, 3)
    expect(e.dryingTempC).toBe(40) // the row's own drying temperature wins over the option
  })
  it('adds the heat of sorption from the product isotherm when a profile is given', () => {
    const [b] = readBatchLog(
      'start,duration_h,fresh_mass_kg,initial_moisture_wb_pct,final_moisture_wb_pct,energy_kwh\n2026-09-01T08:00,5,10000,25,15,1000\n',
    ).batches
    const corn = productById('shelled-corn')
    const withProfile = batchEnergy(b, 0, 0, null, { dryingTempC: 30, profile: corn })
    const without = batchEnergy(b, 0, 0, null, { dryingTempC: 30 })
    expect(withProfile.sorptionHeatMj).toBeGreaterThan(0)
    expect(withProfile.idealHeatMj).toBeCloseTo(
      without.idealHeatMj + (withProfile.sorptionHeatMj as number),
      9,
    )
    // Drying corn 25 → 15 % w.b. (0.333 → 0.176 d.b.): bound-water heat adds a few per cent to λ (Thompson 1968
    // relation gives 1.2925·exp(−16.961·M): 0.5 % at 0.333, 6.5 % at 0.176, mean about 2 %).
    const extraPct = (100 * (withProfile.sorptionHeatMj as number)) / without.idealHeatMj
    expect(extraPct).toBeGreaterThan(0.8)
    expect(extraPct).toBeLessThan(5)
  })
})

describe('implausible batches', () => {
  it('a batch using less than the latent heat of its water is charted but named in the warnings', async () => {
    const { analyzeEnergyLog } = await import('../../../src/analysis/energy/energy-chart.ts')
    const rows = Array.from(
      { length: 8 },
      (_, i) => `2026-09-0${i + 1}T08:00,5,10000,9000,${i === 6 ? 500 : 1300 + 20 * (i % 3)}`,
    )
    const a = analyzeEnergyLog(
      ['start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh', ...rows].join('\n'),
      { baselineCount: 5 },
    )
    // Line 8: 500 kWh = 1,800 MJ for 1,000 kg water = 1.80 MJ/kg < λ(60 °C) = 2.36 MJ/kg → efficiency 131 %.
    expect(a.warnings).toEqual([
      'batch line 8 (line 8): 1.80 MJ/kg water is below the ideal 2.36 MJ/kg (efficiency 131 %): check its energy and masses',
    ])
  })
})

describe('heat of sorption by Clausius–Clapeyron from the corn isotherm', () => {
  // Outside check: for corn, h_fg/λ − 1 = 1.2925·exp(−16.961·M), M decimal d.b. (Thompson, Peart & Foster 1968;
  // Brooker, Bakker-Arkema & Hall 1992; drying-science.md §4.1): 0.237 at M = 0.10, 0.102 at 0.15, 0.043 at 0.20.
  // Two different methods (their formula vs the derivative of the Chung–Pfost isotherm): agree within 20 % at 30 °C.
  const eq = productById('shelled-corn').isotherm.desorption.equation
  for (const [m, thompson] of [
    [0.1, 1.2925 * Math.exp(-16.961 * 0.1)],
    [0.15, 1.2925 * Math.exp(-16.961 * 0.15)],
    [0.2, 1.2925 * Math.exp(-16.961 * 0.2)],
  ]) {
    it(`M = ${m} d.b. at 30 °C: q_net/λ within 20 % of Thompson's ${thompson.toFixed(3)}`, () => {
      const ratio = netIsostericHeatMjPerKg(eq, 30, m) / latentHeatVaporizationMjPerKg(30)
      expect(Math.abs(ratio / thompson - 1)).toBeLessThan(0.2)
    })
  }
  it('falls as moisture rises (drying-science.md §4.1: isosteric heats fall towards free water)', () => {
    const q = [0.08, 0.12, 0.16, 0.2, 0.3].map((m) => netIsostericHeatMjPerKg(eq, 30, m))
    for (let i = 1; i < q.length; i++) expect(q[i]).toBeLessThan(q[i - 1])
  })
  it('the Simpson integral equals q·Δm for a narrow interval', () => {
    const q = netIsostericHeatMjPerKg(eq, 30, 0.15)
    expect(batchSorptionHeatMj(eq, 30, 1000, 0.1501, 0.1499)).toBeCloseTo(1000 * 0.0002 * q, 6)
    expect(() => batchSorptionHeatMj(eq, 30, 1000, 0.1, 0.2)).toThrow(/0 < final < initial/)
  })
})
