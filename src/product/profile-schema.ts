/**
 * @module product/profile-schema
 * zod schemas for user product profiles: a full profile, or a variant of a catalogue profile that
 * overrides a few numbers (thickness, loading, target …). `parseUserProfile` returns a complete
 * `ProductProfile` or throws a RangeError listing every problem with its field path.
 */
import { z } from 'zod'
import { productById } from './catalogue.ts'
import { ISOTHERM_MODEL_NAMES } from './isotherm-models.ts'
import type { ProductProfile, Sourced } from './profile.ts'

const confidence = z.enum(['published', 'transcribed', 'fitted', 'memory', 'user'])
const parameterSources = z
  .record(z.string().max(64), z.object({ source: z.string().min(1).max(1000), confidence }))
  .refine((r) => Object.keys(r).length <= 32, 'at most 32 parameter sources')
  .optional()
const text = z.string().min(1, 'must not be empty').max(1000)
const sourcedNumber = (min: number, max: number, unit: string) =>
  z.object({
    value: z.number().min(min, `must be at least ${min} ${unit}`).max(max, `must be at most ${max} ${unit}`),
    source: text,
    confidence,
  })

const positive = z.number().positive('must be > 0')
const finite = z.number().refine(Number.isFinite, 'must be a finite number')
const d245 = (model: 'modified-henderson' | 'modified-chung-pfost' | 'modified-halsey' | 'modified-oswin') =>
  z.object({ model: z.literal(model), a: finite, b: finite, c: finite })

export const isothermEquationSchema = z.discriminatedUnion('model', [
  d245('modified-henderson'),
  d245('modified-chung-pfost'),
  d245('modified-halsey'),
  d245('modified-oswin'),
  z.object({
    model: z.literal('gab'),
    xm0: positive.max(2, 'must be at most 2 kg/kg db'),
    c0: positive,
    k0: positive.max(1.5, 'must be at most 1.5'),
    hxJPerMol: finite.default(0),
    hcJPerMol: finite.default(0),
    hkJPerMol: finite.default(0),
  }),
])

const range = (min: number, max: number) =>
  z
    .tuple([z.number().min(min), z.number().max(max)])
    .refine(([a, b]) => a <= b, 'lower bound must not exceed upper bound')

export const isothermSpecSchema = z.object({
  equation: isothermEquationSchema,
  source: text,
  confidence,
  validTempC: range(-20, 100),
  validRhPct: range(0, 100),
  parameters: parameterSources,
})

const rateLaw = z.discriminatedUnion('form', [
  z.object({
    form: z.literal('arrhenius'),
    kRefPerH: positive,
    tRefC: z.number().min(-20).max(150),
    activationEnergyJPerMol: z.number().min(0).max(200000),
  }),
  z.object({
    form: z.literal('linear-t-rh'),
    k0: finite,
    kPerC: finite,
    kPerRh: finite,
    timeUnit: z.enum(['min', 'h']),
  }),
])
const pageExponent = z.union([
  z.number().gt(0).lt(5),
  z.object({ n0: finite, nPerC: finite, nPerRh: finite }),
])

export const kineticsEquationSchema = z.discriminatedUnion('model', [
  z.object({ model: z.literal('lewis'), k: rateLaw }),
  z.object({ model: z.literal('page'), k: rateLaw, n: pageExponent }),
  z.object({ model: z.literal('henderson-pabis'), k: rateLaw, a: positive }),
  z.object({
    model: z.literal('diffusion'),
    dRefM2PerS: positive.max(1e-5, 'must be at most 1e-5 m²/s'),
    tRefC: z.number().min(-20).max(150),
    activationEnergyJPerMol: z.number().min(0).max(200000),
  }),
  z.object({ model: z.literal('thompson-corn') }),
])

export const kineticsSpecSchema = z.object({
  equation: kineticsEquationSchema,
  referenceThicknessMm: positive.max(1000),
  shape: z.enum(['slab', 'cylinder', 'sphere']),
  source: text,
  confidence,
  parameters: parameterSources,
  rewettingRateFactor: sourcedNumber(0, 10, ''),
  airVelocity: z
    .object({ referenceMs: positive.max(30), exponent: z.number().min(0).max(3), source: text, confidence })
    .optional(),
  biotNumber: sourcedNumber(1e-4, 1e6, '').optional(),
  wallThicknessMm: sourcedNumber(0.05, 100, 'mm').optional(),
  referenceWallThicknessMm: positive.max(100).optional(),
})

const kebab = z
  .string()
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'must be kebab-case: lower-case letters, digits and single hyphens')
  .max(64)

export const productProfileSchema = z
  .object({
    id: kebab,
    name: text,
    category: z.enum(['grain', 'oilseed', 'fruit', 'vegetable', 'herb', 'fish', 'beverage-crop']),
    variantOf: kebab.optional(),
    initialMoistureWbPct: sourcedNumber(1, 99, '% wb'),
    targetMoistureWbPct: sourcedNumber(0.5, 98, '% wb'),
    waterActivityTarget: sourcedNumber(0.05, 1, ''),
    maxProductTempC: sourcedNumber(0, 150, '°C').nullable(),
    isotherm: z.object({ desorption: isothermSpecSchema, adsorption: isothermSpecSchema.optional() }),
    kinetics: kineticsSpecSchema,
    defaultThicknessMm: sourcedNumber(0.01, 1000, 'mm'),
    defaultLoadingKgPerM2: sourcedNumber(0.01, 2000, 'kg/m²'),
    cautions: z.array(text).max(50),
    notes: z.string().max(4000).optional(),
  })
  .refine((p) => p.targetMoistureWbPct.value < p.initialMoistureWbPct.value, {
    message: 'target moisture must be below the initial moisture',
    path: ['targetMoistureWbPct', 'value'],
  })

/** A variant of a catalogue profile: plain numbers override the catalogue's, marked as given by the user. */
export const profileVariantSchema = z
  .object({
    variantOf: kebab,
    id: kebab,
    name: text.optional(),
    initialMoistureWbPct: z.number().min(1).max(99).optional(),
    targetMoistureWbPct: z.number().min(0.5).max(98).optional(),
    waterActivityTarget: z.number().min(0.05).max(1).optional(),
    maxProductTempC: z.number().min(0).max(150).optional(),
    thicknessMm: z.number().positive().max(1000).optional(),
    /** Hollow products: the wall [mm] (the drying length); the kinetics scale from the profile's wall. */
    wallThicknessMm: z.number().min(0.05).max(100).optional(),
    loadingKgPerM2: z.number().positive().max(2000).optional(),
    kinetics: kineticsSpecSchema.optional(),
  })
  .strict()

export type ProfileVariant = z.infer<typeof profileVariantSchema>

function issuesText(error: z.ZodError): string {
  return error.issues.map((i) => `${i.path.length ? i.path.join('.') : '(profile)'}: ${i.message}`).join('; ')
}

const user = (value: number): Sourced<number> => ({ value, source: 'given by the user', confidence: 'user' })

/** Build a complete profile from a validated variant. */
export function applyVariant(v: ProfileVariant): ProductProfile {
  const base = productById(v.variantOf)
  const p: ProductProfile = {
    ...base,
    id: v.id,
    name: v.name ?? `${base.name} (variant)`,
    variantOf: base.id,
  }
  if (v.initialMoistureWbPct !== undefined) p.initialMoistureWbPct = user(v.initialMoistureWbPct)
  if (v.targetMoistureWbPct !== undefined) p.targetMoistureWbPct = user(v.targetMoistureWbPct)
  if (v.waterActivityTarget !== undefined) p.waterActivityTarget = user(v.waterActivityTarget)
  if (v.maxProductTempC !== undefined) p.maxProductTempC = user(v.maxProductTempC)
  if (v.thicknessMm !== undefined) p.defaultThicknessMm = user(v.thicknessMm)
  if (v.loadingKgPerM2 !== undefined) p.defaultLoadingKgPerM2 = user(v.loadingKgPerM2)
  if (v.kinetics !== undefined) p.kinetics = v.kinetics
  if (v.wallThicknessMm !== undefined) {
    if (p.kinetics.wallThicknessMm === undefined) {
      throw new RangeError(`profile: wallThicknessMm applies to hollow products only; ${base.id} is not one`)
    }
    p.kinetics = {
      ...p.kinetics,
      referenceWallThicknessMm: p.kinetics.referenceWallThicknessMm ?? p.kinetics.wallThicknessMm.value,
      wallThicknessMm: user(v.wallThicknessMm),
    }
  }
  if (!(p.targetMoistureWbPct.value < p.initialMoistureWbPct.value)) {
    throw new RangeError(
      `profile: target moisture ${p.targetMoistureWbPct.value} % wb must be below the initial moisture ${p.initialMoistureWbPct.value} % wb`,
    )
  }
  return p
}

/**
 * Validate a user profile (parsed JSON): either a full profile or a variant (`variantOf` plus a few numbers).
 * Throws RangeError naming every invalid field.
 */
export function parseUserProfile(input: unknown): ProductProfile {
  const isVariant =
    typeof input === 'object' && input !== null && 'variantOf' in input && !('isotherm' in input)
  if (isVariant) {
    const r = profileVariantSchema.safeParse(input)
    if (!r.success) throw new RangeError(`invalid profile variant: ${issuesText(r.error)}`)
    return applyVariant(r.data)
  }
  const r = productProfileSchema.safeParse(input)
  if (!r.success) throw new RangeError(`invalid product profile: ${issuesText(r.error)}`)
  return r.data as ProductProfile
}

export { ISOTHERM_MODEL_NAMES }
