/**
 * @module product/profile
 * The `ProductProfile` type: what the drying engine needs to know about a product, with the source and
 * a confidence flag for every number. Catalogue profiles live in `catalogue-*.ts`; user profiles are
 * validated by `profile-schema.ts`.
 */
import type { IsothermEquation } from './isotherm-models.ts'
import type { KineticsEquation } from './kinetics-models.ts'

/**
 * How a number was obtained (ordered from strongest to weakest for the catalogue's own numbers):
 * - `published`: read in the original publication, standard or official page (its abstract, table or text),
 *   cited with authors (or issuing body) and year (`n.d.` when the page carries none);
 * - `transcribed`: copied from a secondary source that cites the original (both named in the source text,
 *   "X, as given in Y"): the original was not read;
 * - `fitted`: derived by dryhours from named published data (a least-squares fit, or a representative value
 *   inside a published range), with the data named in the source text;
 * - `memory`: recalled or assumed, not verified in a document: treat as approximate;
 * - `user`: given by the user (own weighings or own values).
 */
export type Confidence = 'published' | 'transcribed' | 'fitted' | 'memory' | 'user'

/** Every confidence level, strongest first. */
export const CONFIDENCE_LEVELS: readonly Confidence[] = [
  'published',
  'transcribed',
  'fitted',
  'memory',
  'user',
]

/** Rank for "weakest of": published 4 … memory 1; user values are the user's responsibility (rank 2). */
export const CONFIDENCE_RANK: Record<Confidence, number> = {
  published: 4,
  transcribed: 3,
  fitted: 2,
  user: 2,
  memory: 1,
}

export interface Sourced<T> {
  value: T
  source: string
  confidence: Confidence
}

/** Source and confidence of one constant inside an equation, where it differs from the equation's own. */
export interface ParameterSource {
  source: string
  confidence: Confidence
}

export interface IsothermSpec {
  equation: IsothermEquation
  /** Source of the equation's constants (those without an entry in `parameters`). */
  source: string
  /** The weakest confidence among the equation's constants. */
  confidence: Confidence
  /** Per-constant sources, keyed by the constant's name in `equation` (e.g. `xm0`, `c0`, `hxJPerMol`). */
  parameters?: Record<string, ParameterSource>
  /** Range of the data behind the constants: the model extrapolates outside it. */
  validTempC: [number, number]
  validRhPct: [number, number]
}

export type Shape = 'slab' | 'cylinder' | 'sphere'

export interface KineticsSpec {
  equation: KineticsEquation
  /** Thickness (slab) or diameter (cylinder, sphere) [mm] at which `equation` was measured or fitted. */
  referenceThicknessMm: number
  shape: Shape
  /** Source of the constants (those without an entry in `parameters`). */
  source: string
  /** The weakest confidence among the constants (equation and reference thickness). */
  confidence: Confidence
  /**
   * Per-constant sources, keyed by the constant's path in `equation` (`k.kRefPerH`, `k.activationEnergyJPerMol`,
   * `n`, `dRefM2PerS` …) or `referenceThicknessMm`.
   */
  parameters?: Record<string, ParameterSource>
  /**
   * Rewetting rate constant as a fraction of the drying rate constant at the same conditions.
   * Always an assumption unless a source is given (adsorption is slower than desorption).
   */
  rewettingRateFactor: Sourced<number>
  /**
   * Air-velocity effect: drying time scales with (vRef/v)^exponent. Absent: velocity is ignored
   * (Madamba, Driscoll & Buckle 1996 found air flow not significant for garlic slices above 0.5 m/s).
   */
  airVelocity?: { referenceMs: number; exponent: number; source: string; confidence: Confidence }
  /**
   * Mass-transfer Biot number at the reference size, Bi = h·L/D: the resistance of the surface (a skin)
   * against that of the inside. Small for fruit whose skin limits drying (drying time ∝ size near d¹), large
   * for cut faces and slices (time ∝ d²); absent: no surface resistance (Bi = ∞). Bi grows with size
   * (product/diffusion.ts `sizeTimeScale`, Crank 1975 surface-evaporation condition).
   */
  biotNumber?: Sourced<number>
  /**
   * Hollow products (pods): water leaves through the wall, so the wall thickness [mm] is the drying length;
   * the pod's diameter (the product's thickness or diameter) only places it on the tray. The kinetics hold
   * at this wall; a variant with another wall scales time by it.
   */
  wallThicknessMm?: Sourced<number>
  /** The wall [mm] at which the kinetics were measured (hollow products); the profile's own wall when absent. */
  referenceWallThicknessMm?: number
}

export type ProductCategory = 'grain' | 'oilseed' | 'fruit' | 'vegetable' | 'herb' | 'fish' | 'beverage-crop'

export interface ProductProfile {
  /** kebab-case id, e.g. `shelled-corn`. */
  id: string
  name: string
  category: ProductCategory
  /** Id of the catalogue profile this one was derived from (a variant), if any. */
  variantOf?: string
  initialMoistureWbPct: Sourced<number>
  targetMoistureWbPct: Sourced<number>
  /** Water activity (0–1) at or below which the dried product is considered safe. */
  waterActivityTarget: Sourced<number>
  /** Highest product (or drying-air) temperature for quality [°C], where one applies; null otherwise. */
  maxProductTempC: Sourced<number> | null
  isotherm: { desorption: IsothermSpec; adsorption?: IsothermSpec }
  kinetics: KineticsSpec
  /** Default thickness (slab) or diameter (cylinder/sphere) [mm]. */
  defaultThicknessMm: Sourced<number>
  /** Default loading [kg fresh product per m² of tray or floor]. */
  defaultLoadingKgPerM2: Sourced<number>
  /** Food-safety and quality cautions the report must show. */
  cautions: string[]
  notes?: string
}

/** The isotherm for a direction: desorption (drying) or adsorption (rewetting, falls back to desorption). */
export function isothermFor(profile: ProductProfile, direction: 'desorption' | 'adsorption'): IsothermSpec {
  return direction === 'adsorption'
    ? (profile.isotherm.adsorption ?? profile.isotherm.desorption)
    : profile.isotherm.desorption
}
