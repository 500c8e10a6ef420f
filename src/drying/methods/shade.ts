/**
 * @module drying/methods/shade
 * Ventilated shade or shed. What it assumes:
 * - the product sees the ambient air, out of the sun and the rain, and is never covered;
 * - the air moves past it at a fraction of the 2 m wind outside, never below a minimum air speed
 *   (free convection and draughts; assumptions, no source);
 * - it receives no net radiation (the shelter and its surroundings at the air's temperature, Q = 0);
 * - its surface balance is that of open air (open-air.ts) with Q = 0: a product with free water at its
 *   surface sits at the wet-surface temperature (near the wet bulb), one that evaporates nothing at the air's;
 *   exchange surface from the product's shape (product/layer-geometry.ts), R = 4εσT³ with the emissivity of
 *   open-air.ts;
 * - its constant-rate limit is the Penman wet-surface evaporation with Q = 0 and the Penman 1948 wind
 *   function at that air speed, times the share of the tray the product covers.
 * No energy input.
 */
import { z } from 'zod'
import { radiativeHeatTransferCoefficientWm2K } from '../../physics/evaporation.ts'
import { WetSurface } from '../../physics/wet-surface.ts'
import { layerGeometry } from '../../product/layer-geometry.ts'
import { type MethodHour, type MethodModel, wetSurfaceEvaporationOfHour } from './method-model.ts'
import { PRODUCT_EMISSIVITY } from './open-air.ts'
import { fraction, loadingSchema } from './parameters.ts'

export const shadeSchema = z.object({
  kind: z.literal('shade'),
  /** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: loadingSchema,
  /**
   * Air speed at the product as a fraction of the 2 m wind outside. 0.3 for an open-sided shed is an
   * assumption (from memory, no source).
   */
  windFraction: fraction('windFraction').default(0.3),
  /** Lowest air speed at the product [m/s] (free convection and draughts); assumption, no source. */
  minimumAirSpeedMs: z.number().min(0).max(5).default(0.2),
})

export type ShadeMethod = z.output<typeof shadeSchema>

export const shade: MethodModel<typeof shadeSchema> = {
  kind: 'shade',
  label: 'shade (ventilated shelter)',
  title: 'Shade',
  hint: 'a ventilated shelter: no sun, no rain',
  schema: shadeSchema,
  exposure: 'exposed',
  airFlowKgPerSPerTonne: () => 0,
  heatsWithFuel: false,
  energyInputs: { heater: false, solar: false },
  rainMatters: () => false,
  needs: { sun: false, sunAzimuth: false, coordinates: false },
  assumptions: (m) => [
    {
      name: 'air speed at the product',
      value: `max(${m.minimumAirSpeedMs} m/s, ${m.windFraction} × u2)`,
      source: 'assumption, no source',
    },
    { name: 'wet-surface evaporation', value: 'Penman with Q = 0 (no sun)', source: 'Penman 1948' },
    {
      name: 'product temperature',
      value: 'between the wet-surface temperature (free water) and the air temperature (no evaporation)',
      source: 'surface energy balance with Q = 0 (Monteith & Unsworth 2013 ch. 13, from memory)',
    },
  ],
  prepare(m, { product }) {
    const layer = layerGeometry(product.shape, product.sizeMm, product.loadingKgPerM2)
    const surface = new WetSurface()
    surface.exchangeAreaRatio = layer.exchangeAreaRatio
    surface.exact = true
    const coverage = layer.coverage
    return (hour: MethodHour): void => {
      const u = Math.max(m.minimumAirSpeedMs, m.windFraction * hour.windAt2mMs)
      surface.radiativeConductanceWm2K = radiativeHeatTransferCoefficientWm2K(
        PRODUCT_EMISSIVITY,
        hour.dryBulbC,
      )
      wetSurfaceEvaporationOfHour(hour, surface, 0, u, coverage)
    }
  },
}
