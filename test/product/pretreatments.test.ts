/**
 * Pretreatment as data: variants derived from the published factors of src/product/pretreatments.ts, never
 * counted twice. Factors checked against the numbers of their sources (named beside each check).
 */
import { describe, expect, it } from 'vitest'
import { calibratedConstant } from '../../src/product/calibration.ts'
import { productById } from '../../src/product/catalogue.ts'
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
  it('a variant whose base already had the treatment is refused (chilli fitted on blanched samples)', () => {
    expect(() => derivePretreatedVariant(productById('chili-peppers'), 'chili-peppers-unblanched')).toThrow(
      /cannot be derived|already includes/,
    )
  })
  it('a variant without a published factor is refused, and not in the catalogue unless it has a rate of its own fitted to a run', () => {
    for (const v of PRETREATMENT_VARIANTS.filter((x) => !x.derivable)) {
      expect(() => derivePretreatedVariant(productById(v.baseId), v.variantId)).toThrow(/cannot be derived/)
      if (v.fittedTo === undefined) expect(() => productById(v.variantId)).toThrow(/unknown product/)
    }
  })
  it('unblanched chillies have their own rate, fitted through the engine to the unblanched open-sun run of Meghwar et al. (not the blanched base times a factor)', () => {
    const spec = PRETREATMENT_VARIANTS.find((v) => v.variantId === 'chili-peppers-unblanched')
    expect(spec?.fittedTo).toBe('meghwar-chilli-umerkot/open-sun')
    const fitted = calibratedConstant('chili-peppers-unblanched', 'k.kRefPerH')
    expect(fitted.caseId).toBe(spec?.fittedTo)
    const p = productById('chili-peppers-unblanched')
    expect(p.variantOf).toBe('chili-peppers')
    expect(rate('chili-peppers-unblanched')).toBe(fitted.value)
    expect(p.kinetics.parameters?.['k.kRefPerH']).toEqual({ source: fitted.source, confidence: 'fitted' })
    expect(fitted.source).toContain('Meghwar')
    // Unblanched chillies dried slower than the (probably blanched) base in every published pair read.
    expect(rate('chili-peppers-unblanched')).toBeLessThan(rate('chili-peppers'))
  })
  it('the blanched base names the unblanched variant in its name and caution, and the variant names the base', () => {
    const base = productById('chili-peppers')
    expect(base.name).toMatch(/blanched/)
    expect(base.cautions.join(' ')).toContain('chili-peppers-unblanched')
    const variant = productById('chili-peppers-unblanched')
    expect(variant.name).toMatch(/unblanched/)
    expect(variant.cautions.join(' ')).toContain('Blanched chillies dry faster: choose chili-peppers')
    expect(variant.cautions.join(' ')).not.toContain('probably blanched')
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
