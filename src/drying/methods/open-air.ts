/**
 * @module drying/methods/open-air
 * Open air: racks, trays or mats in the sun. What it assumes:
 * - the product sees the ambient air, and the wind at its height by the FAO-56 eq 47 log profile;
 * - it is covered from sunset to sunrise and during rain unless told otherwise (common practice for fruit
 *   and grain, no source); covered hours neither dry nor rewet;
 * - by day its surface is warmed by the sunshine it absorbs, ΔT = α·G / ((hc + hr)·A_s): hc = 2.8 + 3.0·u
 *   (Watmuff, Charters & Proctor 1977, via Duffie & Beckman 2013 §3.15, from memory), hr = 4εσT³ with
 *   ε = 0.9 (assumption, from memory), A_s the product surface per tray area; uncovered at night, its
 *   surface is cooled below the air by the stated sky-cooling threshold;
 * - its constant-rate limit is the Penman wet-surface evaporation with available energy α·G − Rnl
 *   (Rnl the net longwave of FAO-56 eq 39) and the Penman 1948 wind function at 2 m;
 * - rain on an uncovered product rewets it toward equilibrium at high RH.
 * No fuel; the sun is the energy input.
 */
import { z } from 'zod'
import {
  flatPlateHeatTransferCoefficientWm2K,
  radiativeHeatTransferCoefficientWm2K,
  windRatioFrom2mToHeight,
} from '../../physics/evaporation.ts'
import { netLongwaveHourlyMjM2 } from '../../physics/fao56-reference-et.ts'
import { wm2FromMjPerM2Hour } from '../../physics/fao56-solar.ts'
import { WetSurface } from '../../physics/wet-surface.ts'
import { HourMode, type MethodHour, type MethodModel, wetSurfaceEvaporationOfHour } from './method-model.ts'
import { fraction, loadingSchema } from './parameters.ts'

/** Emissivity of a moist product surface for the radiative coefficient hr (assumption, 0.9; from memory). */
export const PRODUCT_EMISSIVITY = 0.9

export const openAirSchema = z.object({
  kind: z.literal('open-air'),
  /**
   * Fraction of global horizontal irradiance the product absorbs. 0.7 for dark fruit such as grapes
   * and apricot halves is an assumption from memory (dark, moist surfaces absorb 0.6–0.85).
   */
  absorptivity: fraction('absorptivity').default(0.7),
  /** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: loadingSchema,
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
      name: 'product surface per tray area',
      value: String(m.surfaceAreaPerTrayArea),
      source:
        product === undefined || product.id.startsWith('grapes')
          ? 'own estimate for a single layer of grape berries (17 mm) at 10 kg/m²'
          : `the default, estimated for a single layer of grape berries (17 mm) at 10 kg/m²; not estimated for ${product.name} (flat slices on a tray are nearer 1–2)`,
    },
    {
      name: 'covered at night / in rain',
      value: `${m.coveredAtNight} / ${m.coveredInRain}`,
      source: 'common practice for fruit and grain, no source',
    },
    {
      name: 'product temperature in sun',
      value: 'T_air + α·G/((hc + hr)·surface ratio), hc = 2.8 + 3.0·u, hr = 4·0.9·σ·T³',
      source: 'Watmuff et al. 1977 via Duffie & Beckman 2013 §3.15 (from memory); emissivity 0.9 assumed',
    },
    {
      name: 'wet-surface evaporation',
      value: 'Penman combination equation, Rn = α·G − Rnl (FAO-56 eq 39), Penman 1948 wind function',
      source: 'Penman 1948; McMahon et al. 2013 HESS 17:1331 Suppl. S4.11, S11.23',
    },
  ],
  prepare(m, { solar, thresholds }) {
    const windAtProductPer2m = windRatioFrom2mToHeight(m.productHeightM)
    const rsOverRso = solar.rsOverRso
    const surface = new WetSurface()
    return (hour: MethodHour): void => {
      const t = hour.dryBulbC
      if (m.coveredAtNight && hour.night) {
        hour.mode = HourMode.paused
        hour.pausedByNight = true
      } else if (hour.raining && m.coveredInRain) {
        hour.mode = HourMode.paused
        hour.coveredForRain = true
      } else if (hour.raining) hour.mode = HourMode.rainExposed
      const absorbed = m.absorptivity * hour.ghiWm2
      if (hour.night) {
        hour.uncoveredNight = !m.coveredAtNight
        hour.productC = t - thresholds.nightSurfaceCoolingK
      } else {
        const hc = flatPlateHeatTransferCoefficientWm2K(hour.windAt2mMs * windAtProductPer2m)
        const hr = radiativeHeatTransferCoefficientWm2K(PRODUCT_EMISSIVITY, t)
        hour.productC = t + absorbed / ((hc + hr) * m.surfaceAreaPerTrayArea)
      }
      if (hour.mode !== HourMode.paused) {
        const rnl = wm2FromMjPerM2Hour(netLongwaveHourlyMjM2(t, hour.vaporPressureKpa, rsOverRso[hour.index]))
        wetSurfaceEvaporationOfHour(hour, surface, absorbed - rnl, hour.windAt2mMs)
      }
    }
  },
}
