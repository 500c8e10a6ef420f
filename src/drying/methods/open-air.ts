/**
 * @module drying/methods/open-air
 * Open air: racks, trays or mats in the sun. What it assumes:
 * - the product sees the ambient air and the 2 m wind of the file;
 * - it is covered from sunset to sunrise and during rain unless told otherwise (common practice for fruit
 *   and grain, no source); covered hours neither dry nor rewet;
 * - its surface balances, per m² it covers, the sunshine it absorbs (absorptivity × global horizontal
 *   irradiance), the net long-wave loss at air temperature (FAO-56 eq 39), the extra long-wave of a surface
 *   warmer than the air (R = 4εσT³), convection and evaporation through its exchange surface (A per m²
 *   covered: π for a layer of berries or pods, 2 for slices on a mesh; product/layer-geometry.ts) with the
 *   transfer coefficient of the Penman 1948 wind function, the same for heat and vapour (H = A·ρa·cp/ra;
 *   FAO-56 takes the two resistances equal too): physics/wet-surface.ts. A product with free water at its
 *   surface evaporates at the wet-surface rate and sits at the wet-surface temperature; one that evaporates
 *   nothing sits at Ta + Q/(H + R); a drying batch lies between, by the share of the wet-surface rate it
 *   evaporates (drying/batch.ts);
 * - uncovered at night, its surface is cooled below the air by the stated sky-cooling threshold;
 * - its constant-rate limit is that wet-surface evaporation times the share of the tray it covers;
 * - rain on an uncovered product rewets it toward equilibrium at high RH.
 * No fuel; the sun is the energy input.
 */
import { z } from 'zod'
import { radiativeHeatTransferCoefficientWm2K } from '../../physics/evaporation.ts'
import { netLongwaveHourlyMjM2 } from '../../physics/fao56-reference-et.ts'
import { wm2FromMjPerM2Hour } from '../../physics/fao56-solar.ts'
import { WetSurface } from '../../physics/wet-surface.ts'
import { layerGeometry } from '../../product/layer-geometry.ts'
import { HourMode, type MethodHour, type MethodModel, wetSurfaceEvaporationOfHour } from './method-model.ts'
import { fraction, loadingSchema } from './parameters.ts'

/**
 * Long-wave emissivity of a moist product surface, 0.95: assumption (from memory: plant and fruit surfaces
 * and water lie near 0.94–0.98).
 */
export const PRODUCT_EMISSIVITY = 0.95

export const openAirSchema = z.object({
  kind: z.literal('open-air'),
  /**
   * Fraction of global horizontal irradiance the product absorbs. 0.7 for dark fruit such as grapes
   * and apricot halves is an assumption from memory (dark, moist surfaces absorb 0.6–0.85).
   */
  absorptivity: fraction('absorptivity').default(0.7),
  /** Long-wave emissivity of the product surface (default {@link PRODUCT_EMISSIVITY}, an assumption). */
  emissivity: fraction('emissivity').default(PRODUCT_EMISSIVITY),
  /** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: loadingSchema,
  /** Product gathered or covered from sunset to sunrise: no drying, no rewetting, no dew. */
  coveredAtNight: z.boolean().default(true),
  /** Product covered during rain: no rain exposure, no drying in that hour. */
  coveredInRain: z.boolean().default(true),
  /**
   * Product surface that meets the air per m² of tray it covers [m²/m²]. When absent, from the product's
   * shape (product/layer-geometry.ts): π for a layer of berries, pods or grains, 2 for slices on a mesh;
   * set 1 for slices on a solid mat.
   */
  surfaceAreaPerTrayArea: z.number().min(1).max(20).optional(),
})

export type OpenAirMethod = z.output<typeof openAirSchema>

export const openAir: MethodModel<typeof openAirSchema> = {
  kind: 'open-air',
  label: 'open air (racks or mats in the sun)',
  title: 'Open air',
  hint: 'racks, trays or mats in the sun; covered at night and in rain',
  schema: openAirSchema,
  exposure: 'exposed',
  airFlowKgPerSPerTonne: () => 0,
  heatsWithFuel: false,
  energyInputs: { heater: false, solar: false },
  rainMatters: () => true,
  needs: { sun: true, sunAzimuth: false, coordinates: false },
  assumptions: (m, product) => [
    {
      name: 'absorptivity',
      value: String(m.absorptivity),
      source:
        product === undefined || product.category === 'fruit'
          ? 'assumption for dark moist fruit (from memory)'
          : `assumption for dark moist fruit (from memory), not measured for ${product.name}`,
    },
    {
      name: 'product surface per tray area covered',
      value:
        m.surfaceAreaPerTrayArea === undefined
          ? "from the product's shape: π for berries, pods and grains, 2 for slices"
          : String(m.surfaceAreaPerTrayArea),
      source:
        'geometry of one layer of pieces (product/layer-geometry.ts); density of fresh produce taken as water',
    },
    {
      name: 'covered at night / in rain',
      value: `${m.coveredAtNight} / ${m.coveredInRain}`,
      source: 'common practice for fruit and grain, no source',
    },
    {
      name: 'product temperature in sun',
      value: `between Ta + (α·G − Rnl − λE_wet)/(H + R) (free water) and Ta + (α·G − Rnl)/(H + R) (no evaporation), by the share of the wet-surface rate the product evaporates; H = A·ρa·cp/ra, R = 4·${m.emissivity}·σ·T³`,
      source:
        'surface energy balance (Penman form with radiative resistance, Monteith & Unsworth 2013 ch. 13, from memory); emissivity assumed',
    },
    {
      name: 'wet-surface evaporation',
      value: 'Penman combination equation, Q = α·G − Rnl (FAO-56 eq 39), Penman 1948 wind function',
      source: 'Penman 1948; McMahon et al. 2013 HESS 17:1331 Suppl. S4.11, S11.23',
    },
  ],
  prepare(m, { solar, thresholds, product }) {
    const rsOverRso = solar.rsOverRso
    const layer = layerGeometry(
      product.shape,
      product.sizeMm,
      product.loadingKgPerM2,
      m.surfaceAreaPerTrayArea,
    )
    const surface = new WetSurface()
    surface.exchangeAreaRatio = layer.exchangeAreaRatio
    surface.exact = true
    const coverage = layer.coverage
    return (hour: MethodHour): void => {
      const t = hour.dryBulbC
      if (m.coveredAtNight && hour.night) {
        hour.mode = HourMode.paused
        hour.pausedByNight = true
      } else if (hour.raining && m.coveredInRain) {
        hour.mode = HourMode.paused
        hour.coveredForRain = true
      } else if (hour.raining) hour.mode = HourMode.rainExposed
      if (hour.night) {
        hour.uncoveredNight = !m.coveredAtNight
        hour.productC = t - thresholds.nightSurfaceCoolingK
      }
      if (hour.night && hour.mode === HourMode.paused) return
      // per m² covered: isothermal available energy, and the balance of the wet surface
      const absorbed = m.absorptivity * hour.ghiWm2
      const rnl = wm2FromMjPerM2Hour(netLongwaveHourlyMjM2(t, hour.vaporPressureKpa, rsOverRso[hour.index]))
      surface.radiativeConductanceWm2K = radiativeHeatTransferCoefficientWm2K(m.emissivity, t)
      const conductance = wetSurfaceEvaporationOfHour(
        hour,
        surface,
        absorbed - rnl,
        hour.windAt2mMs,
        coverage,
      )
      // a surface that evaporates nothing: Ta + Q/(H + R)
      if (!hour.night) hour.productC = t + (absorbed - rnl) / conductance
      if (hour.mode === HourMode.paused) {
        // covered in rain by day: the product exchanges nothing
        hour.evaporationKgPerM2H = Number.NaN
        hour.vaporConductanceKgPerM2HKpa = Number.NaN
        hour.productWetC = Number.NaN
      }
    }
  },
}
