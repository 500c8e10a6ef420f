/**
 * @module drying/method
 * The four drying methods as a tagged union with validated parameters and stated defaults.
 * `parseDryingMethod` fills every default and throws a RangeError naming the field, the value and the
 * accepted range. Defaults are typical values, marked with where they come from; change them to match
 * the real dryer.
 */
import { z } from 'zod'

/** Fuel ids known to {@link ../drying/fuels.ts}. */
export const FUEL_IDS = ['propane', 'natural-gas', 'heating-oil', 'wood-pellets', 'electricity'] as const
export type FuelId = (typeof FUEL_IDS)[number]

const fraction = (name: string) =>
  z
    .number({ error: `${name} must be a number` })
    .min(0, `${name} must be between 0 and 1`)
    .max(1, `${name} must be between 0 and 1`)

/**
 * Open air: racks, trays or mats in the sun. The product sees ambient air and absorbs sunshine.
 * Covering at night and in rain is common practice for fruit and grain (common practice, no source).
 */
export const openAirSchema = z.object({
  kind: z.literal('open-air'),
  /**
   * Fraction of global horizontal irradiance the product absorbs. 0.7 for dark fruit such as grapes
   * and apricot halves is an assumption from memory (dark, moist surfaces absorb 0.6–0.85).
   */
  absorptivity: fraction('absorptivity').default(0.7),
  /** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: z.number().gt(0).max(200).optional(),
  /** Product gathered or covered from sunset to sunrise: no drying, no rewetting, no dew. */
  coveredAtNight: z.boolean().default(true),
  /** Product covered during rain: no rain exposure, no drying in that hour. */
  coveredInRain: z.boolean().default(true),
  /** Height of the product above ground [m], for converting the wind to that height (FAO-56 eq 47 form). */
  productHeightM: z.number().min(0.1).max(10).default(0.5),
  /**
   * Product surface area per m² of tray, which spreads the absorbed sunshine over the surface that sheds
   * it. 3 is computed for a single layer of 17 mm berries at 10 kg/m² (about 3,700 berries of 9.1 cm²;
   * own estimate); flat slices on a tray are nearer 1–2.
   */
  surfaceAreaPerTrayArea: z.number().min(1).max(20).default(3),
})

/** Ventilated shade or shed: ambient air, no sun on the product, no rain, reduced wind. */
export const shadeSchema = z.object({
  kind: z.literal('shade'),
  /** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: z.number().gt(0).max(200).optional(),
  /**
   * Air speed at the product as a fraction of the 2 m wind outside. 0.3 for an open-sided shed is an
   * assumption (from memory, no source).
   */
  windFraction: fraction('windFraction').default(0.3),
  /** Lowest air speed at the product [m/s] (free convection and draughts); assumption, no source. */
  minimumAirSpeedMs: z.number().min(0).max(5).default(0.2),
})

/**
 * Solar cabinet (indirect): ambient air heated by a flat-plate solar air collector at constant humidity
 * ratio, then blown over the product. Collector efficiency by Hottel–Whillier–Bliss,
 * η = FR(τα) − FR·UL·(Ti − Ta)/G_T with Ti = Ta (inlet is ambient air). Defaults 0.60/5 W m⁻² K⁻¹ are
 * the single-glazed air-heater mid-range (evaporation-and-sun.md §5, from memory there).
 */
export const solarCabinetSchema = z.object({
  kind: z.literal('solar-cabinet'),
  /** Collector area per tonne of fresh product [m²/t]; 100 m²/t is an assumption (tunnel dryers run 100–200). */
  collectorAreaM2PerTonne: z.number().gt(0).max(10_000).default(100),
  tiltDeg: z.number().min(0).max(90).default(15),
  /** Azimuth the collector faces [degrees clockwise from north]; default faces the equator (set by latitude). */
  azimuthDeg: z.number().min(0).max(360).optional(),
  /** Dry-air flow per m² of collector [kg s⁻¹ m⁻²]; 0.02 is a typical air-heater flow (from memory, 0.01–0.05). */
  airFlowKgPerSPerM2: z.number().gt(0).max(0.5).default(0.02),
  /** FR(τα): intercept of the efficiency line. */
  frTauAlpha: fraction('frTauAlpha').default(0.6),
  /** FR·UL [W m⁻² K⁻¹]: slope of the efficiency line. */
  frUlWm2K: z.number().min(0).max(50).default(5),
  groundAlbedo: fraction('groundAlbedo').default(0.2),
  /** Fans run only while the collector gains heat; otherwise the cabinet is closed (no drying, no rewetting). */
  fansOnlyInSun: z.boolean().default(true),
})

/**
 * Heated air: forced ambient air heated at constant humidity ratio either to a fixed set point or to
 * the lowest temperature that brings its RH down to a target, never above the product's limit.
 */
export const heatedSchema = z.object({
  kind: z.literal('heated'),
  /** Fixed air temperature [°C]; when absent, the air is heated only as far as `targetRhPct` requires. */
  setPointC: z.number().min(0).max(120).optional(),
  /** RH the heater aims for when no set point is given [%]; 40 % is an assumption for fruit and grain. */
  targetRhPct: z.number().gt(1).lt(100).default(40),
  /**
   * Lowest temperature of the heated air when heating to a target RH [°C]: in cold weather the target RH
   * alone would give air too cold to dry. 20 °C is an assumption (no source). Ignored with a set point.
   */
  minAirC: z.number().min(-10).max(100).default(20),
  /** Dry-air flow per tonne of fresh product [kg s⁻¹ t⁻¹]; 0.5 is an assumption for tray/bin batch dryers. */
  airFlowKgPerSPerTonne: z.number().gt(0).max(50).default(0.5),
  /**
   * Fraction of fuel heat that reaches the air. 0.80 is mid-range for indirect-fired heaters (60–85 %,
   * drying-science.md §4.2, from memory there); direct-fired propane ≈ 0.92 (vendor page quoted there).
   */
  heaterEfficiency: z.number().gt(0).max(1).default(0.8),
  fuel: z.enum(FUEL_IDS).default('propane'),
})

export const dryingMethodSchema = z.discriminatedUnion('kind', [
  openAirSchema,
  shadeSchema,
  solarCabinetSchema,
  heatedSchema,
])

export type OpenAirMethod = z.output<typeof openAirSchema>
export type ShadeMethod = z.output<typeof shadeSchema>
export type SolarCabinetMethod = z.output<typeof solarCabinetSchema>
export type HeatedMethod = z.output<typeof heatedSchema>
export type DryingMethod = z.output<typeof dryingMethodSchema>
export type DryingMethodInput = z.input<typeof dryingMethodSchema>
export type DryingMethodKind = DryingMethod['kind']
export const DRYING_METHOD_KINDS: readonly DryingMethodKind[] = [
  'open-air',
  'shade',
  'solar-cabinet',
  'heated',
]

/**
 * Validate a method and fill its defaults. Throws a RangeError naming the field and what is accepted,
 * e.g. `method.absorptivity: absorptivity must be between 0 and 1 (got 1.4)`.
 */
export function parseDryingMethod(input: unknown): DryingMethod {
  const result = dryingMethodSchema.safeParse(input)
  if (result.success) return result.data
  const issue = result.error.issues[0]
  const path = issue.path.length > 0 ? `method.${issue.path.join('.')}` : 'method'
  const got =
    issue.path.length > 0 && typeof input === 'object' && input !== null
      ? (input as Record<string, unknown>)[String(issue.path[0])]
      : input
  const gotText = got === undefined ? '' : ` (got ${JSON.stringify(got)})`
  const hint =
    issue.path[0] === 'kind' || issue.path.length === 0 ? `; kinds: ${DRYING_METHOD_KINDS.join(', ')}` : ''
  throw new RangeError(`${path}: ${issue.message}${gotText}${hint}`)
}

/** True for methods that blow a known air flow over the product (the deficit × air-mass bound applies). */
export function isForcedAir(method: DryingMethod): boolean {
  return method.kind === 'solar-cabinet' || method.kind === 'heated'
}
