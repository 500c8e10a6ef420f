import { describe, expect, it } from 'vitest'
import { PRODUCT_CATALOGUE, productById } from '../../src/product/catalogue.ts'
import { resolveDryTarget } from '../../src/product/dry-target.ts'
import { equilibriumRelativeHumidityPct } from '../../src/product/equilibrium.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'

const awAt = (id: string, tC: number, wbPct: number) =>
  equilibriumRelativeHumidityPct(productById(id), tC, moistureDbFromWbPct(wbPct)) / 100

describe('water activity decides "dry" (product/dry-target.ts)', () => {
  it('every catalogue product dried to its default target is at or below its safe water activity at 25 °C', () => {
    // Before: at the profiles' moisture figures the catalogue's own isotherms gave raisins aw 0.68 (safe 0.60),
    // apricots 0.73 (0.65), fish 0.77 (0.70), cocoa 0.66 (0.60).
    for (const p of PRODUCT_CATALOGUE) {
      const t = resolveDryTarget(p)
      expect(t.waterActivityAtTarget, p.id).not.toBeNull()
      expect(t.waterActivityAtTarget as number, p.id).toBeLessThanOrEqual(p.waterActivityTarget.value + 1e-9)
      expect(t.targetWbPct, p.id).toBeLessThanOrEqual(p.targetMoistureWbPct.value)
      expect(t.warning, p.id).toBeNull()
    }
  })
  it('raisins: the moisture of aw 0.60 at 25 °C, rounded down to 0.1 % wb; the profile’s 18 % would leave 0.68', () => {
    const t = resolveDryTarget(productById('grapes-to-raisins'))
    expect(t.basis).toBe('water-activity')
    expect(t.moistureAtSafeWaterActivityWbPct as number).toBeGreaterThan(t.targetWbPct)
    expect((t.moistureAtSafeWaterActivityWbPct as number) - t.targetWbPct).toBeLessThan(0.1)
    expect(awAt('grapes-to-raisins', 25, t.targetWbPct)).toBeLessThanOrEqual(0.6)
    expect(t.waterActivityAtProfileMoisture as number).toBeCloseTo(awAt('grapes-to-raisins', 25, 18), 12)
    expect(t.waterActivityAtProfileMoisture as number).toBeGreaterThan(0.67)
    expect(t.sentence).toContain('0.60 at 25 °C')
  })
  it('a profile moisture figure drier than the safe water activity holds (dehydrated onion)', () => {
    const t = resolveDryTarget(productById('onion-slices'))
    expect(t.basis).toBe('profile-moisture')
    expect(t.targetWbPct).toBe(productById('onion-slices').targetMoistureWbPct.value)
    expect(t.waterActivityAtTarget as number).toBeLessThan(t.safeWaterActivity)
  })
  it("the user's target is used as given, with a warning when it leaves aw above the safe value", () => {
    const wet = resolveDryTarget(productById('grapes-to-raisins'), { userTargetWbPct: 18 })
    expect(wet.basis).toBe('user')
    expect(wet.targetWbPct).toBe(18)
    expect(wet.warning).toMatch(/water activity 0\.68 at 25 °C, above its safe 0\.60/)
    const dry = resolveDryTarget(productById('grapes-to-raisins'), { userTargetWbPct: 12 })
    expect(dry.warning).toBeNull()
  })
  it('a warmer store asks for drier product where the isotherm has a temperature term (shelled corn, ASABE)', () => {
    const cool = resolveDryTarget(productById('shelled-corn'), { storageTempC: 10 })
    const warm = resolveDryTarget(productById('shelled-corn'), { storageTempC: 35 })
    expect(warm.moistureAtSafeWaterActivityWbPct as number).toBeLessThan(
      cool.moistureAtSafeWaterActivityWbPct as number,
    )
    expect(warm.storageTempC).toBe(35)
  })
  it('refuses a storage temperature out of range', () => {
    expect(() => resolveDryTarget(productById('figs'), { storageTempC: 80 })).toThrow(RangeError)
  })
})
