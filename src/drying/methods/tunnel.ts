/**
 * @module drying/methods/tunnel
 * Solar tunnel (greenhouse-type) dryer: a long, low tunnel under a transparent cover; ambient air is drawn in
 * at one end, warmed over a black absorber floor (the collector section) and blown by fans over the product,
 * which lies on the floor of the drying section under the same cover and absorbs the sun that passes it. The
 * design goes back to the University of Hohenheim; the fans are usually driven by a photovoltaic module, so
 * their speed follows the sunshine and the tunnel's temperature stays fairly steady (described so for the
 * Hohenheim tunnel by its users, e.g. the Tamera project's "Solar Tunnel-Dryer" page, read).
 *
 * What it assumes, hour by hour:
 * - cover: the film or glass transmits the sun by Fresnel reflection and Bouguer absorption at the beam's
 *   angle of incidence (physics/cover-transmittance.ts), the cover taken as horizontal: beam at the sun's
 *   zenith angle, diffuse at the equivalent angle of an isotropic sky (Brandemuehl & Beckman 1980 via Duffie &
 *   Beckman); the beam/diffuse split of the measured global irradiance by Erbs et al. (1982);
 * - collector section (ambient air in): useful gain Qu = FR·Ac·S with S = τ·α·G absorbed on the floor and FR of
 *   the hour's air flow (Duffie & Beckman 2013 ch. 6, physics/collector.ts `heatRemovalFactor`); the air
 *   is heated at constant humidity ratio, T = Ta + Qu/(ṁ·cp);
 * - drying section: the air at the product is the collector's outlet air (the drying floor's own sun warms the
 *   product, not the air: a simplification that puts the drying section's gain into the product);
 * - the product's surface balances, per m² of floor it covers, as open air's does (physics/wet-surface.ts, the
 *   same kernel through method-model.ts): the sun it absorbs through the cover (α_p·τ·G), long-wave exchange with
 *   the cover rather than the sky, convection and evaporation in the tunnel air. Convection: hc = 2.8 + 3.0·v
 *   (Watmuff et al. 1977 via Duffie & Beckman 2013 §3.15, from memory) through the exchange surface A of the
 *   layer (product/layer-geometry.ts), v the air speed over the product at the hour's fan flow (in proportion to
 *   it); heat and vapour through the same resistance (Lewis analogy). Long-wave: the product sees the cover, as
 *   in the solar tunnel model of Bala & Woods (1994) as written out by Bala (International Solar Food Processing
 *   Conference 2009; radiation between product and cover, transcribed), exchanging R = 4·ε·σ·T_c³ per kelvin;
 *   the cover taken opaque to long-wave, at the temperature its two faces' convection gives between the tunnel
 *   air and the ambient (physics/cover-exchange.ts). Glass is opaque beyond about 3 µm; clear polyethylene film
 *   lets part of the long-wave through (films with infrared additives are made to block it: Kalfas 1988,
 *   Polimery no. 4 p. 148, abstract read), so under clear film the product also sees some of the colder sky,
 *   which is not modelled (stated limit: under clear film the model's product runs a little too warm). A wet product sits at the
 *   balance's wet-surface temperature, one that evaporates nothing at T_air + Q/(H + R), and a drying batch
 *   between them by the share of the wet-surface rate it evaporates (drying/batch.ts), as in open air;
 * - the constant-rate limit is the smaller of that wet-surface evaporation and the air's own capacity, the
 *   deficit to saturation × the hour's air flow per tonne (the air's moisture pick-up along the tunnel is not
 *   followed: the whole floor sees the inlet air);
 * - fans: 'pv' — the flow follows the irradiance, ṁ = ṁ_nominal·min(1, G/G_full), and stops below the
 *   collector threshold (a PV fan has no store; common practice, no source for the linear form); 'constant' —
 *   the nominal flow every hour, day and night (grid or battery);
 * - when the fans stop: 'closed' — the tunnel is shut, no drying and no rewetting (as the cabinet's paused
 *   hours); 'open' — the product sits in still ambient air under the cover: it does not dry (no flow, so no
 *   forced-air capacity) but rewets toward the ambient equilibrium;
 * - rain does not reach the product.
 * Energy input: the collector heat (kWh per tonne), no fuel; the fans' electricity is from the PV module.
 */
import { z } from 'zod'
import { heatRemovalFactor } from '../../physics/collector.ts'
import { thinCoverTemperatureC } from '../../physics/cover-exchange.ts'
import {
  type CoverSpec,
  coverTransmittance,
  GLASS_REFRACTIVE_INDEX,
  LOW_IRON_GLASS_EXTINCTION_PER_M,
} from '../../physics/cover-transmittance.ts'
import {
  flatPlateHeatTransferCoefficientWm2K,
  radiativeHeatTransferCoefficientWm2K,
} from '../../physics/evaporation.ts'
import { moistAirHeatCapacityKjPerKgK } from '../../physics/moist-air.ts'
import { resistanceOfHeatTransferCoefficientSPerM, WetSurface } from '../../physics/wet-surface.ts'
import { layerGeometry } from '../../product/layer-geometry.ts'
import { HorizontalCoverSun } from './cover-sun.ts'
import { HourMode, type MethodHour, type MethodModel, wetSurfaceEvaporationInAir } from './method-model.ts'
import { PRODUCT_EMISSIVITY } from './open-air.ts'
import { fraction, loadingSchema } from './parameters.ts'

/**
 * Cover materials with stated optics. Polyethylene film: refractive index 1.51 and K·L 0.05 (about 0.87 solar
 * transmittance at normal incidence for a clear film of a few tenths of a millimetre) — from memory, no
 * measured pair for clear film was found (physics/cover-transmittance.ts says why the one pair read is not
 * used). Glass: n 1.526 (Duffie & Beckman, from memory) and K 4 m⁻¹ (low-iron glass, Int. J. Photoenergy
 * 2015, 693463, Table 2, read) for a 4 mm pane.
 */
export const TUNNEL_COVERS = {
  polyethylene: { refractiveIndex: 1.51, extinctionThickness: 0.05 },
  glass: {
    refractiveIndex: GLASS_REFRACTIVE_INDEX,
    extinctionThickness: LOW_IRON_GLASS_EXTINCTION_PER_M * 0.004,
  },
} as const satisfies Record<string, CoverSpec>

export const tunnelSchema = z.object({
  kind: z.literal('tunnel'),
  /**
   * Length of the collector section [m]. 4.5 m, the solar air heater of the CIAE Bhopal tunnel (2.0 m wide,
   * 4.5 m heater, 8.0 m drying tunnel, UV-stabilised polyethylene film, PV-driven axial fans; Singh, Ganesan &
   * Singh, "Performance Study of a Solar Tunnel Dryer for Horticultural Crops", RERIC journal, abstract read).
   * 0: no collector section (a plastic tunnel or greenhouse over the trays; the air enters at ambient).
   */
  collectorLengthM: z.number().min(0).max(100).default(4.5),
  /** Length of the drying section [m]; 8.0 m as in the CIAE tunnel (abstract read, above). */
  dryingLengthM: z.number().gt(0).max(200).default(8),
  /** Inside width of the tunnel [m]; 2.0 m as in the CIAE tunnel (abstract read, above). */
  widthM: z.number().gt(0).max(20).default(2),
  /** Product on the drying floor [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: loadingSchema,
  /**
   * Dry-air flow of the fans at full flow [kg/s]. 0.1 kg/s (about 300 m³/h) is an assumption, chosen so that
   * the default collector warms the air by 30–35 K at 900 W/m² and by 25–30 K at half that (the PV fans slow
   * down), within the 50–75 °C tunnel air the CIAE tunnel reached on sunny days (abstract read, above).
   */
  airFlowKgPerS: z.number().gt(0).max(20).default(0.1),
  /** 'pv': the fans follow the sun (photovoltaic module, no battery); 'constant': nominal flow every hour. */
  fans: z.enum(['pv', 'constant']).default('pv'),
  /** Irradiance at which PV-driven fans reach their nominal flow [W/m²]; 800 W/m² is an assumption. */
  pvFullFlowWm2: z.number().gt(0).max(1400).default(800),
  /** When the fans stop: 'closed' (tunnel shut, no exchange) or 'open' (still ambient air: rewetting only). */
  nightPractice: z.enum(['closed', 'open']).default('closed'),
  /** Cover material (optics in {@link TUNNEL_COVERS}); `coverRefractiveIndex`/`coverExtinctionThickness` override. */
  cover: z.enum(['polyethylene', 'glass']).default('polyethylene'),
  coverRefractiveIndex: z.number().gt(1).lt(3).optional(),
  /** Extinction coefficient × thickness of the cover, K·L [–]. */
  coverExtinctionThickness: z.number().min(0).lt(5).optional(),
  /** Solar absorptance of the collector floor; 0.9 for a black-painted floor or black film (from memory). */
  absorberAbsorptance: fraction('absorberAbsorptance').default(0.9),
  /** Loss coefficient UL of the collector section [W m⁻² K⁻¹]; 8, a single-cover collector (from memory). */
  collectorLossWm2K: z.number().gt(0).max(50).default(8),
  /** Collector efficiency factor F′ [–]; 0.7 for air flowing over a flat absorber (from memory). */
  collectorEfficiencyFactor: fraction('collectorEfficiencyFactor').default(0.7),
  /** Fraction of the sun reaching the product that it absorbs; 0.7 as for open air (assumption, from memory). */
  productAbsorptivity: fraction('productAbsorptivity').default(0.7),
  /**
   * Product surface that meets the air per m² of floor it covers [m²/m²]; when absent, from the product's shape
   * as for open air (product/layer-geometry.ts: π for berries, pods and grains, 2 for slices on a mesh).
   */
  surfaceAreaPerTrayArea: z.number().min(1).max(20).optional(),
  /**
   * Air speed over the product at the fans' nominal flow [m/s] (in proportion to the hour's flow: PV fans slow
   * down with the sun, and the air is still when they stop); 0.25 m/s as measured in a 12 m × 2 m solar tunnel with alternating
   * collector and drying zones (dates; abstract read at scholarmate.com/S/6WpLUx, authors not in the copy read).
   */
  airSpeedOverProductMs: z.number().min(0).max(10).default(0.25),
})

export type TunnelMethod = z.output<typeof tunnelSchema>

/** Loading used when neither the method nor the caller gives one [kg/m²] (the engine always passes the product's). */
const FALLBACK_LOADING_KG_PER_M2 = 10

/** Tonnes of fresh product in the tunnel at `loadingKgPerM2`. */
export function tunnelTonnes(m: TunnelMethod, loadingKgPerM2?: number): number {
  const loading = m.loadingKgPerM2 ?? loadingKgPerM2 ?? FALLBACK_LOADING_KG_PER_M2
  return (m.dryingLengthM * m.widthM * loading) / 1000
}

/** The cover optics of `m`: its material's, with the overrides it gives. */
export function coverOf(m: {
  cover: keyof typeof TUNNEL_COVERS
  coverRefractiveIndex?: number
  coverExtinctionThickness?: number
}): CoverSpec {
  const base = TUNNEL_COVERS[m.cover]
  return {
    refractiveIndex: m.coverRefractiveIndex ?? base.refractiveIndex,
    extinctionThickness: m.coverExtinctionThickness ?? base.extinctionThickness,
  }
}

export const tunnel: MethodModel<typeof tunnelSchema> = {
  kind: 'tunnel',
  label: 'solar tunnel (product under a transparent cover, air warmed by a collector section, fans)',
  title: 'Solar tunnel',
  hint: 'product under a plastic or glass cover; air warmed over a black floor and blown by PV fans',
  schema: tunnelSchema,
  exposure: 'forced-air',
  surfaceBalance: true,
  usesLoading: true,
  airFlowKgPerSPerTonne: (m, loadingKgPerM2) => m.airFlowKgPerS / tunnelTonnes(m, loadingKgPerM2),
  heatsWithFuel: false,
  rainMatters: () => false,
  needs: { sun: true, sunAzimuth: false, coordinates: true },
  assumptions: (m) => {
    const cover = coverOf(m)
    return [
      {
        name: 'tunnel',
        value: `collector ${m.collectorLengthM} m, drying section ${m.dryingLengthM} m, width ${m.widthM} m`,
        source:
          'CIAE Bhopal solar tunnel (Singh, Ganesan & Singh, RERIC journal, abstract read): 2.0 m wide, 4.5 m air heater, 8.0 m drying tunnel',
      },
      {
        name: 'cover',
        value: `${m.cover}: refractive index ${cover.refractiveIndex}, K·L ${cover.extinctionThickness}; normal transmittance ${coverTransmittance(cover, 0).toFixed(3)}`,
        source:
          'Fresnel and Bouguer (Duffie & Beckman ch. 5); polyethylene optics from memory; glass n from memory, low-iron K Int. J. Photoenergy 2015 693463',
      },
      {
        name: 'collector section',
        value: `Qu = FR·Ac·τα·G, α ${m.absorberAbsorptance}, UL ${m.collectorLossWm2K} W m⁻² K⁻¹, F′ ${m.collectorEfficiencyFactor}, FR from the hour's flow`,
        source: 'Duffie & Beckman 2013 ch. 6; α, UL and F′ from memory',
      },
      {
        name: 'fans',
        value:
          m.fans === 'pv'
            ? `photovoltaic: ${m.airFlowKgPerS} kg/s at ${m.pvFullFlowWm2} W/m² and above, in proportion below, stopped under the collector threshold`
            : `constant ${m.airFlowKgPerS} kg/s every hour`,
        source: 'flow an assumption; PV fans following the sun as described for the Hohenheim tunnel',
      },
      {
        name: 'when the fans stop',
        value:
          m.nightPractice === 'closed'
            ? 'tunnel closed: no drying, no rewetting'
            : 'open: rewetting toward ambient equilibrium',
        source: 'method setting',
      },
      {
        name: 'product temperature',
        value: `surface balance in the tunnel air: absorbed sun α_p·τ·G (α_p ${m.productAbsorptivity}), long-wave with the cover (opaque, between tunnel air and ambient by convection), convection hc = 2.8 + 3.0·v (v ${m.airSpeedOverProductMs} m/s at full flow) through ${m.surfaceAreaPerTrayArea === undefined ? "the product's exchange surface (π for berries, pods and grains, 2 for slices)" : `${m.surfaceAreaPerTrayArea} m² per m² covered`}, evaporative cooling`,
        source:
          'Penman form with radiative resistance as for open air (physics/wet-surface.ts); product–cover radiation as in Bala & Woods 1994 (tunnel model, transcribed); hc Watmuff et al. 1977 via Duffie & Beckman 2013 §3.15 (from memory); air speed: a 12 m × 2 m tunnel, abstract read',
      },
      {
        name: 'constant-rate limit',
        value:
          "the smaller of the product's wet-surface evaporation and the air's capacity (deficit to saturation × the hour's flow)",
        source: 'method assumption; the moisture pick-up along the tunnel is not followed',
      },
    ]
  },
  prepare(m, { solar, thresholds, product }) {
    const cover = coverOf(m)
    const coverSun = new HorizontalCoverSun(cover)
    const collectorAreaM2 = m.collectorLengthM * m.widthM
    const tonnes = tunnelTonnes(m, product.loadingKgPerM2)
    const layer = layerGeometry(
      product.shape,
      product.sizeMm,
      product.loadingKgPerM2,
      m.surfaceAreaPerTrayArea,
    )
    const surface = new WetSurface()
    surface.exchangeAreaRatio = layer.exchangeAreaRatio
    surface.exact = true
    const { altitudeDeg, raWm2 } = solar
    return (hour: MethodHour): void => {
      const i = hour.index
      const t = hour.dryBulbC
      const g = hour.night ? 0 : hour.ghiWm2
      let share = 0
      if (m.fans === 'constant') share = 1
      else if (g >= thresholds.collectorOnWm2) share = g >= m.pvFullFlowWm2 ? 1 : g / m.pvFullFlowWm2
      hour.airFlowShare = share
      if (share === 0 && m.nightPractice === 'closed') {
        // fans stopped and the tunnel shut: no exchange (paused)
        hour.mode = HourMode.paused
        hour.pausedByNight = true
        hour.airC = t
        hour.productC = t
        return
      }
      // sun through the cover (horizontal): beam at the zenith angle, diffuse at the isotropic-sky angle
      const transmitted = coverSun.transmittedWm2(g, raWm2[i], altitudeDeg[i])
      // the collector section warms the air at constant humidity ratio (none with the fans stopped: still air)
      let tAir = t
      if (share > 0) {
        const capacity = m.airFlowKgPerS * share * 1000 * moistAirHeatCapacityKjPerKgK(hour.humidityRatio)
        const fr =
          collectorAreaM2 > 0
            ? heatRemovalFactor(collectorAreaM2, m.collectorLossWm2K, m.collectorEfficiencyFactor, capacity)
            : 0
        const gainW = fr * collectorAreaM2 * m.absorberAbsorptance * transmitted
        tAir = t + gainW / capacity
        hour.solarKwhPerTonne = gainW / 1000 / tonnes
      }
      hour.airC = tAir
      // the product's surface balance in the tunnel air (physics/wet-surface.ts through method-model.ts)
      const hIn = flatPlateHeatTransferCoefficientWm2K(m.airSpeedOverProductMs * share)
      const coverC = thinCoverTemperatureC(
        hIn,
        tAir,
        flatPlateHeatTransferCoefficientWm2K(hour.windAt2mMs),
        t,
      )
      surface.radiativeConductanceWm2K = radiativeHeatTransferCoefficientWm2K(PRODUCT_EMISSIVITY, coverC)
      const available =
        m.productAbsorptivity * transmitted - surface.radiativeConductanceWm2K * (tAir - coverC)
      const resistance = resistanceOfHeatTransferCoefficientSPerM(
        hIn,
        tAir,
        hour.humidityRatio,
        hour.pressureKpa,
      )
      const conductance = wetSurfaceEvaporationInAir(
        hour,
        surface,
        available,
        tAir,
        resistance,
        layer.coverage,
      )
      // a surface that evaporates nothing: T_air + Q/(H + R)
      hour.productC = tAir + available / conductance
    }
  },
}
