import { describe, expect, it } from 'vitest'
import { PRODUCT_ALIASES, PRODUCT_CATALOGUE, productById, productIds } from '../../src/product/catalogue.ts'
import { parseUserProfile, productProfileSchema } from '../../src/product/profile-schema.ts'

const REQUIRED = [
  'shelled-corn',
  'wheat',
  'rough-rice',
  'soybean',
  'grapes-to-raisins',
  'apricot-halves',
  'figs',
  'plums-to-prunes',
  'apple-slices',
  'tomato-halves',
  'chili-peppers',
  'onion-slices',
  'mint-leaves',
  'fish-fillets',
  'coffee-parchment',
  'cocoa-beans',
  'hops',
]

describe('catalogue', () => {
  it('has at least 15 profiles including every required id, a pre-treated raisin and a salted fish variant', () => {
    expect(PRODUCT_CATALOGUE.length).toBeGreaterThanOrEqual(15)
    for (const id of REQUIRED) expect(productIds()).toContain(id)
    expect(productById('grapes-to-raisins-dipped').variantOf).toBe('grapes-to-raisins')
    expect(productById('fish-fillets-salted').variantOf).toBe('fish-fillets')
    expect(new Set(productIds()).size).toBe(PRODUCT_CATALOGUE.length)
  })
  it('an older id still accepted is no current id and names a current one', () => {
    for (const a of PRODUCT_ALIASES) {
      expect(productIds(), a.alias).not.toContain(a.alias)
      expect(productIds(), a.alias).toContain(a.id)
      expect(productById(a.alias).id).toBe(a.id)
    }
    expect(() => productById('chili-peppers-dried')).toThrow(/unknown product 'chili-peppers-dried'/)
  })
  it('every profile passes its own schema (JSON round trip) and every number carries a source and a flag', () => {
    for (const p of PRODUCT_CATALOGUE) {
      const r = productProfileSchema.safeParse(JSON.parse(JSON.stringify(p)))
      expect(r.success, `${p.id}: ${r.success ? '' : r.error.message}`).toBe(true)
      for (const s of [
        p.initialMoistureWbPct,
        p.targetMoistureWbPct,
        p.waterActivityTarget,
        p.defaultThicknessMm,
        p.defaultLoadingKgPerM2,
      ]) {
        expect(s.source.length).toBeGreaterThan(5)
        expect(['published', 'transcribed', 'fitted', 'memory']).toContain(s.confidence)
      }
      expect(p.isotherm.desorption.source.length).toBeGreaterThan(10)
      expect(p.kinetics.source.length).toBeGreaterThan(10)
      expect(p.cautions.length).toBeGreaterThan(0)
    }
  })
  it('products whose quality needs it carry a temperature limit: hops 60 °C (MSU Extension), seed paddy 42 °C', () => {
    expect(productById('hops').maxProductTempC?.value).toBe(60)
    expect(productById('rough-rice-seed').maxProductTempC?.value).toBe(42)
    expect(productById('mint-leaves').maxProductTempC).not.toBeNull()
  })
  it('unknown id lists the known ones', () =>
    expect(() => productById('bananas')).toThrow(/known products: shelled-corn/))
})

describe('user profiles', () => {
  it('a variant of a catalogue profile (other thickness and target) is completed and marked as the user’s', () => {
    const p = parseUserProfile({
      variantOf: 'apricot-halves',
      id: 'thin-apricots',
      thicknessMm: 8,
      targetMoistureWbPct: 20,
    })
    expect(p.defaultThicknessMm).toEqual({ value: 8, source: 'given by the user', confidence: 'user' })
    expect(p.targetMoistureWbPct.value).toBe(20)
    expect(p.isotherm).toEqual(productById('apricot-halves').isotherm)
  })
  it('errors name the field, the value problem and the range', () => {
    expect(() => parseUserProfile({ variantOf: 'apricot-halves', id: 'Bad Id' })).toThrow(
      /id: must be kebab-case/,
    )
    expect(() => parseUserProfile({ variantOf: 'apricot-halves', id: 'x', thicknessMm: -3 })).toThrow(
      /thicknessMm/,
    )
    expect(() => parseUserProfile({ variantOf: 'apricot-halves', id: 'x', colour: 'red' })).toThrow(
      /colour|Unrecognized/,
    )
    expect(() => parseUserProfile({ variantOf: 'nope', id: 'x' })).toThrow(/unknown product 'nope'/)
    expect(() => parseUserProfile({ variantOf: 'figs', id: 'x', targetMoistureWbPct: 90 })).toThrow(
      /below the initial/,
    )
    const full = JSON.parse(JSON.stringify(productById('wheat')))
    full.targetMoistureWbPct.value = 150
    expect(() => parseUserProfile(full)).toThrow(/targetMoistureWbPct\.value: must be at most 98 % wb/)
    full.targetMoistureWbPct.value = 12
    full.isotherm.desorption.equation = { model: 'gab', xm0: -1, c0: 2, k0: 0.9 }
    expect(() => parseUserProfile(full)).toThrow(/isotherm\.desorption\.equation\.xm0/)
  })
  it('a full user profile round-trips', () => {
    const full = { ...JSON.parse(JSON.stringify(productById('figs'))), id: 'my-figs' }
    expect(parseUserProfile(full).id).toBe('my-figs')
  })
})
