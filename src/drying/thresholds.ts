/**
 * @module drying/thresholds
 * The stated, adjustable thresholds of the usable-hour test (drying/usable-hour.ts) and of the batch
 * model, with their origin. Every assessment lists them in its assumptions.
 */
import { z } from 'zod'

export const dryingThresholdsSchema = z.object({
  /**
   * Below this product temperature an hour is "too cold" [°C]. 5 °C: fruit and fish drying practically
   * stops and mould risk rises in cold, damp air (common practice, no source). Grain natural-air drying
   * runs lower: set 0 °C or below for grain.
   */
  minProductTempC: z.number().min(-20).max(40).default(5),
  /**
   * Smallest humidity-ratio deficit to the product's equilibrium RH at its target moisture for an hour
   * to count as drying [g water per kg dry air]. 0.2 g/kg is an assumption (about a tenth of a typical
   * daytime deficit in dry weather; no source).
   */
  minDeficitGPerKg: z.number().min(0).max(20).default(0.2),
  /** Rain in the hour at or above which an exposed product counts as rained on [mm]: 0.2 mm, the resolution of a common tipping-bucket gauge (from memory). */
  rainMm: z.number().min(0).max(50).default(0.2),
  /**
   * How far an exposed, uncovered product surface cools below the air at night by radiation to the sky
   * [K]. 2 K is an assumption (clear nights cool exposed surfaces 2–4 K below air; common practice, no source).
   * Dew risk is flagged when the cooled surface is at or below the dew point.
   */
  nightSurfaceCoolingK: z.number().min(0).max(10).default(2),
  /** Sun altitude [°] below which an hour is night (0: the horizon, with suncalc's refraction convention). */
  nightSunAltitudeDeg: z.number().min(-18).max(10).default(0),
  /** Solar-cabinet fans run when the tilted irradiance reaches this [W/m²]; 50 W/m² is an assumption (no source). */
  collectorOnWm2: z.number().min(0).max(500).default(50),
})

export type DryingThresholds = z.output<typeof dryingThresholdsSchema>

export function parseDryingThresholds(input: unknown = {}): DryingThresholds {
  const r = dryingThresholdsSchema.safeParse(input ?? {})
  if (r.success) return r.data
  const issue = r.error.issues[0]
  throw new RangeError(`thresholds.${issue.path.join('.')}: ${issue.message}`)
}
