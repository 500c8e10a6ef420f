/**
 * @module product/pretreatment-variants
 * Pretreated variants of catalogue profiles, derived from the base by the published factor of the treatment
 * (product/pretreatments.ts), never counted twice: a base whose rate was measured on treated product cannot be
 * multiplied by the treatment's factor again, and a variant without a published factor is not derived.
 */
import type { KineticsEquation } from './kinetics-models.ts'
import {
  type PretreatmentVariantSpec,
  pretreatmentById,
  pretreatmentVariantSpec,
  rateFactor,
} from './pretreatments.ts'
import type { ProductProfile } from './profile.ts'

/** The path of the rate constant the factor multiplies, and the equation with it multiplied. */
function scaledRate(
  equation: KineticsEquation,
  factor: number,
): { path: string; equation: KineticsEquation } {
  switch (equation.model) {
    case 'lewis':
    case 'page':
    case 'henderson-pabis':
      if (equation.k.form !== 'arrhenius') break
      return {
        path: 'k.kRefPerH',
        equation: { ...equation, k: { ...equation.k, kRefPerH: equation.k.kRefPerH * factor } },
      }
    case 'diffusion':
      return { path: 'dRefM2PerS', equation: { ...equation, dRefM2PerS: equation.dRefM2PerS * factor } }
  }
  throw new RangeError(`a pretreatment factor cannot be applied to ${equation.model} kinetics`)
}

/**
 * The variant `variantId` of `base` (PRETREATMENT_VARIANTS): the base's rate constant (or diffusivity) times
 * the published rate factor of the treatment. Throws when the variant is declared not derivable or when the
 * base's rate was measured on already treated product (the factor would be counted twice). `spec` replaces
 * the catalogue's entry for the variant (tests of the refusals).
 */
export function derivePretreatedVariant(
  base: ProductProfile,
  variantId: string,
  spec: PretreatmentVariantSpec = pretreatmentVariantSpec(variantId),
): ProductProfile {
  if (spec.baseId !== base.id)
    throw new RangeError(`${variantId} is a variant of ${spec.baseId}, not ${base.id}`)
  if (!spec.derivable) throw new RangeError(`${variantId} cannot be derived: ${spec.note}`)
  if (spec.baseMeasuredOn === 'treated') {
    throw new RangeError(`${variantId}: the base rate already includes the treatment (${spec.baseNote})`)
  }
  const treatment = pretreatmentById(spec.pretreatmentId)
  const factor = rateFactor(treatment.effect)
  if (factor === null) throw new RangeError(`${variantId}: ${treatment.id} gives no rate factor`)
  const { path, equation } = scaledRate(base.kinetics.equation, factor.value)
  const baseLevel = base.kinetics.parameters?.[path]?.confidence ?? base.kinetics.confidence
  const source = `set by dryhours: the rate of ${base.id} (${baseLevel}; see that profile) × ${factor.value.toFixed(3)}, ${factor.text} read in ${treatment.citation} (${treatment.partRead}: ${treatment.effect.statement}). ${spec.baseNote}; ${spec.note}`
  if (source.length > 1000) throw new RangeError(`${variantId}: source text over 1000 characters`)
  return {
    ...base,
    id: spec.variantId,
    name: spec.name,
    variantOf: base.id,
    kinetics: {
      ...base.kinetics,
      equation,
      parameters: { ...base.kinetics.parameters, [path]: { source, confidence: 'fitted' } },
    },
  }
}
