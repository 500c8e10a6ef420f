/**
 * @module product/catalogue-helpers
 * Small builders that keep the catalogue files readable. Sources cite `drying-science.md §n`, the project
 * reference file that collected them (`../shared/references/drying-science.md`), by section.
 */
import type { IsothermEquation } from './isotherm-models.ts'
import type { KineticsEquation, RateLaw } from './kinetics-models.ts'
import type { Confidence, IsothermSpec, KineticsSpec, Shape, Sourced } from './profile.ts'

export function sourced<T>(value: T, source: string, confidence: Confidence): Sourced<T> {
  return { value, source, confidence }
}

export function isotherm(
  equation: IsothermEquation,
  source: string,
  confidence: Confidence,
  validTempC: [number, number],
  validRhPct: [number, number],
): IsothermSpec {
  return { equation, source, confidence, validTempC, validRhPct }
}

export function gab(xm0: number, c0: number, k0: number): IsothermEquation {
  return { model: 'gab', xm0, c0, k0, hxJPerMol: 0, hcJPerMol: 0, hkJPerMol: 0 }
}

export function arrhenius(kRefPerH: number, tRefC: number, activationEnergyJPerMol: number): RateLaw {
  return { form: 'arrhenius', kRefPerH, tRefC, activationEnergyJPerMol }
}

/** Rewetting at half the drying rate: an assumption of dryhours, no source (adsorption is slower). */
export const REWETTING_HALF: Sourced<number> = sourced(
  0.5,
  'assumption, no source: rewetting rate constant taken as half the drying rate constant',
  'memory',
)

export function kinetics(
  equation: KineticsEquation,
  referenceThicknessMm: number,
  shape: Shape,
  source: string,
  confidence: Confidence,
): KineticsSpec {
  return { equation, referenceThicknessMm, shape, source, confidence, rewettingRateFactor: REWETTING_HALF }
}

/** Activation energy used where none was found for a product: 30 kJ/mol, within the 17–40 kJ/mol that
 * reference §2.3 lists for tomato, mango and cocoa (Doymaz 2007; Akoy 2014; cocoa 2010). An assumption. */
export const ASSUMED_EA_J_PER_MOL = 30000

export const SAFE_AW_MOULD = sourced(
  0.65,
  'Beuchat 1981, Cereal Foods World 26:345: below aw 0.65 only osmophilic yeasts and a few moulds grow (drying-science.md §3)',
  'published',
)
export const SAFE_AW_DRIED_FRUIT = sourced(
  0.6,
  'Beuchat 1981: no microbial proliferation below aw 0.60; trade specification for dried foods < 0.60 (drying-science.md §3)',
  'published',
)
