/**
 * @module product/catalogue-helpers
 * Small builders that keep the catalogue files readable. Sources cite the document the number was read in
 * (`citations.ts`), or say "from memory" (or "assumed") when no document was read.
 */
import { BEUCHAT_VIA_LABCELL } from './citations.ts'
import type { IsothermEquation } from './isotherm-models.ts'
import type { KineticsEquation, RateLaw } from './kinetics-models.ts'
import type { Confidence, IsothermSpec, KineticsSpec, ParameterSource, Shape, Sourced } from './profile.ts'

export function sourced<T>(value: T, source: string, confidence: Confidence): Sourced<T> {
  return { value, source, confidence }
}

/** The source of one constant inside an equation. */
export function param(source: string, confidence: Confidence): ParameterSource {
  return { source, confidence }
}

/**
 * An isotherm. `source` and `confidence` are those of the constants without an entry in `parameters`; give
 * the stronger constants their own entry so that `confidence` stays the weakest (a test checks it).
 */
export function isotherm(
  equation: IsothermEquation,
  source: string,
  confidence: Confidence,
  validTempC: [number, number],
  validRhPct: [number, number],
  parameters?: Record<string, ParameterSource>,
): IsothermSpec {
  return { equation, source, confidence, validTempC, validRhPct, ...(parameters ? { parameters } : {}) }
}

/** GAB without temperature dependence (ΔH terms 0: no source read gives them for the product). */
export function gab(xm0: number, c0: number, k0: number): IsothermEquation {
  return { model: 'gab', xm0, c0, k0, hxJPerMol: 0, hcJPerMol: 0, hkJPerMol: 0 }
}

export function arrhenius(kRefPerH: number, tRefC: number, activationEnergyJPerMol: number): RateLaw {
  return { form: 'arrhenius', kRefPerH, tRefC, activationEnergyJPerMol }
}

/** Rewetting at half the drying rate: an assumption of dryhours, no source (adsorption is slower). */
export const REWETTING_HALF: Sourced<number> = sourced(
  0.5,
  'assumed, no source: rewetting rate constant taken as half the drying rate constant',
  'memory',
)

/** Kinetics; `source`/`confidence`/`parameters` as for `isotherm` (keys are paths such as `k.kRefPerH`). */
export function kinetics(
  equation: KineticsEquation,
  referenceThicknessMm: number,
  shape: Shape,
  source: string,
  confidence: Confidence,
  parameters?: Record<string, ParameterSource>,
): KineticsSpec {
  return {
    equation,
    referenceThicknessMm,
    shape,
    source,
    confidence,
    ...(parameters ? { parameters } : {}),
    rewettingRateFactor: REWETTING_HALF,
  }
}

/**
 * Activation energy used where none was found for a product: 30 kJ/mol, an assumption inside the
 * 17–40 kJ/mol read for tomato (Doymaz 2007), cocoa (Ndukwu et al. 2010) and mango slices (Akoy 2014,
 * Int. Food Res. J. 21(5):1911: 37.99 kJ/mol). Also used for kinetics fitted to a user's weighings.
 */
export const ASSUMED_EA_J_PER_MOL = 30000
export const ASSUMED_EA_SOURCE = param(
  'activation energy 30 kJ/mol assumed (no value found for this product; 17–40 kJ/mol was read for tomato, cocoa and mango)',
  'memory',
)

export const SAFE_AW_MOULD = sourced(
  0.65,
  `below aw 0.65 only osmophilic yeasts and a few moulds grow (0.75–0.65: xerophilic moulds), ${BEUCHAT_VIA_LABCELL}`,
  'transcribed',
)
export const SAFE_AW_DRIED_FRUIT = sourced(
  0.6,
  `no microbial proliferation below aw 0.60 (0.65–0.60: osmophilic yeasts, dried fruit at 15–20 % moisture), ${BEUCHAT_VIA_LABCELL}`,
  'transcribed',
)
