/**
 * Pretreatment as data: variants derived from the published factors of src/product/pretreatments.ts, never
 * counted twice. Factors checked against the numbers of their sources (named beside each check).
 */
import { describe, expect, it } from 'vitest'
import { calibratedConstant } from '../../src/product/calibration.ts'
import { canonicalProductId, PRODUCT_ALIASES, productById, productIds } from '../../src/product/catalogue.ts'
import { derivePretreatedVariant } from '../../src/product/pretreatment-variants.ts'
import { PRETREATMENT_VARIANTS, pretreatmentById, rateFactor } from '../../src/product/pretreatments.ts'

const rate = (id: string): number => {
  const eq = productById(id).kinetics.equation
  if (eq.model === 'diffusion') return eq.dRefM2PerS
  if ('k' in eq && eq.k.form === 'arrhenius') return eq.k.kRefPerH
  throw new Error(`${id}: no single rate constant`)
}

describe('pretreated variants in the catalogue', () => {
  it('dipped grapes dry faster than the untreated base by 1 ÷ the middle of the 0.774–0.805 time factor (Doymaz & Ismail 2011, sweet cherry, 19.5–22.6 % shorter)', () => {
    expect(rate('grapes-to-raisins-dipped') / rate('grapes-to-raisins')).toBeCloseTo(
      1 / ((0.774 + 0.805) / 2),
      6,
    )
  })
  it('peeled figs: 1 ÷ 0.54, the peeled-to-unpeeled relaxation-time ratio (Xanthopoulos et al. 2010)', () => {
    expect(rate('figs-peeled') / rate('figs')).toBeCloseTo(1 / 0.54, 6)
  })
  it('dipped tomato: the diffusivity ratio 1.13–1.45, middle 1.29 (Doymaz 2007: 5.65/3.91 and 7.53/6.65)', () => {
    expect(rate('tomato-halves-dipped') / rate('tomato-halves')).toBeCloseTo(1.29, 6)
    expect(5.65 / 3.91).toBeCloseTo(1.445, 3)
    expect(7.53 / 6.65).toBeCloseTo(1.132, 3)
  })
  it('osmotic apple: the diffusivity falls 38–64 % (Simal et al. 1997), middle factor 0.49', () => {
    expect(rate('apple-slices-osmotic') / rate('apple-slices')).toBeCloseTo(0.49, 6)
  })
  it('each derived variant cites its treatment and says what its base was measured on, at level fitted', () => {
    for (const v of PRETREATMENT_VARIANTS.filter((x) => x.derivable)) {
      const p = productById(v.variantId)
      expect(p.variantOf).toBe(v.baseId)
      const sources = Object.values(p.kinetics.parameters ?? {}).filter((s) =>
        s.source.startsWith('set by dryhours'),
      )
      expect(sources).toHaveLength(1)
      expect(sources[0].confidence).toBe('fitted')
      expect(sources[0].source).toContain(pretreatmentById(v.pretreatmentId).citation)
      expect(sources[0].source).toContain(v.baseNote)
    }
  })
})

describe('never counted twice', () => {
  it('a variant whose base already had the treatment is refused (the dip counted twice if dipped grapes were the base)', () => {
    const dipped = PRETREATMENT_VARIANTS.find((v) => v.variantId === 'grapes-to-raisins-dipped')
    if (dipped === undefined) throw new Error('grapes-to-raisins-dipped is not in PRETREATMENT_VARIANTS')
    // As catalogued (base measured on untreated grapes) it derives; the same spec on a treated base does not.
    expect(() => derivePretreatedVariant(productById('grapes-to-raisins'), dipped.variantId)).not.toThrow()
    expect(() =>
      derivePretreatedVariant(productById('grapes-to-raisins'), dipped.variantId, {
        ...dipped,
        baseMeasuredOn: 'treated',
      }),
    ).toThrow(/already includes the treatment/)
  })
  it('no catalogued variant sits on a base that already had its treatment', () => {
    for (const v of PRETREATMENT_VARIANTS) expect(v.baseMeasuredOn, v.variantId).toBe('untreated')
  })
  it('a variant without a published factor is refused, and not in the catalogue unless it has a rate of its own fitted to a run', () => {
    for (const v of PRETREATMENT_VARIANTS.filter((x) => !x.derivable)) {
      expect(() => derivePretreatedVariant(productById(v.baseId), v.variantId)).toThrow(/cannot be derived/)
      if (v.fittedTo === undefined) expect(() => productById(v.variantId)).toThrow(/unknown product/)
    }
  })
  it('the plain chilli profile is unblanched, its rate fitted through the engine to the open-sun run of Meghwar et al. (no pretreatment named)', () => {
    const fitted = calibratedConstant('chili-peppers', 'k.kRefPerH')
    expect(fitted.caseId).toBe('meghwar-chilli-umerkot/open-sun')
    const p = productById('chili-peppers')
    expect(p.variantOf).toBeUndefined()
    expect(rate('chili-peppers')).toBe(fitted.value)
    expect(p.kinetics.parameters?.['k.kRefPerH']).toEqual({ source: fitted.source, confidence: 'fitted' })
    expect(fitted.source).toContain('Meghwar')
    expect(fitted.source).toContain('taken as unblanched')
  })
  it('blanched chillies have their own rate, fitted through the engine to the tunnel run of Hossain & Bala 2007 (not the unblanched base times a factor)', () => {
    const spec = PRETREATMENT_VARIANTS.find((v) => v.variantId === 'chili-peppers-blanched')
    expect(spec?.baseId).toBe('chili-peppers')
    expect(spec?.derivable).toBe(false)
    expect(spec?.fittedTo).toBe('hossain-bala-2007-chilli-solar-tunnel/red-tunnel')
    const fitted = calibratedConstant('chili-peppers-blanched', 'k.kRefPerH')
    expect(fitted.caseId).toBe(spec?.fittedTo)
    const p = productById('chili-peppers-blanched')
    expect(p.variantOf).toBe('chili-peppers')
    expect(rate('chili-peppers-blanched')).toBe(fitted.value)
    expect(p.kinetics.parameters?.['k.kRefPerH']).toEqual({ source: fitted.source, confidence: 'fitted' })
    expect(fitted.source).toContain('Hossain M.A., Bala B.K. 2007')
    expect(pretreatmentById('blanching-chilli').catalogueIds).toEqual(['chili-peppers-blanched'])
    // Blanched chillies dried faster than unblanched in every published pair read (Hossain & Bala 2007;
    // Tunde-Akintunde 2011, abstracts).
    expect(rate('chili-peppers-blanched')).toBeGreaterThan(rate('chili-peppers'))
  })
  it('each chilli profile says which pretreatment it describes and points to the other', () => {
    const plain = productById('chili-peppers')
    expect(plain.name).toMatch(/unblanched/)
    expect(plain.cautions.join(' ')).toContain('for chillies dried without blanching')
    expect(plain.cautions.join(' ')).toContain('choose chili-peppers-blanched')
    expect(plain.cautions.join(' ')).not.toContain('probably blanched')
    const blanched = productById('chili-peppers-blanched')
    expect(blanched.name).toMatch(/, blanched\)/)
    expect(blanched.cautions.join(' ')).toContain('for chillies blanched')
    expect(blanched.cautions.join(' ')).toContain(
      'without blanching, as most growers dry them, choose chili-peppers:',
    )
  })
  it('the old id of unblanched chillies is still accepted and means what it meant (the same profile)', () => {
    expect(canonicalProductId('chili-peppers-unblanched')).toBe('chili-peppers')
    expect(productById('chili-peppers-unblanched')).toBe(productById('chili-peppers'))
    expect(productIds()).not.toContain('chili-peppers-unblanched')
    expect(PRODUCT_ALIASES.find((a) => a.alias === 'chili-peppers-unblanched')?.note).toContain(
      'chili-peppers-blanched',
    )
  })
  it('deriving from an already derived variant is refused (the variant is not the base the spec names)', () => {
    expect(() =>
      derivePretreatedVariant(productById('grapes-to-raisins-dipped'), 'grapes-to-raisins-dipped'),
    ).toThrow(/variant of grapes-to-raisins/)
  })
  it('effects that are not rate factors give none (salting holds water activity, apricot osmotic gives energies)', () => {
    expect(rateFactor(pretreatmentById('salting-fish-brine-aw').effect)).toBeNull()
    expect(rateFactor(pretreatmentById('osmotic-apricot-halves').effect)).toBeNull()
  })
})
