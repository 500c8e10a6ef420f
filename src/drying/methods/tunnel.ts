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
 *   product, not the air: a simplification that puts the drying section's gain into the product temperature);
 *   the product's surface is warmed above that air by the sun it absorbs through the cover,
 *   ΔT = τ·α_p·G / ((hc + hr)·surface ratio), hc = 2.8 + 3.0·v at the air speed over the product, hr = 4εσT³;
 * - fans: 'pv' — the flow follows the irradiance, ṁ = ṁ_nominal·min(1, G/G_full), and stops below the
 *   collector threshold (a PV fan has no store; common practice, no source for the linear form); 'constant' —
 *   the nominal flow every hour, day and night (grid or battery);
 * - when the fans stop: 'closed' — the tunnel is shut, no drying and no rewetting (as the cabinet's paused
 *   hours); 'open' — the product sits in still ambient air under the cover: it does not dry (no flow, so no
 *   forced-air capacity) but rewets toward the ambient equilibrium;
 * - the constant-rate limit is the forced-air one: deficit to saturation × the hour's air flow per tonne;
 * - rain does not reach the product.
 * Energy input: the collector heat (kWh per tonne), no fuel; the fans' electricity is from the PV module.
 */
import { z } from 'zod'
import { heatRemovalFactor } from '../../physics/collector.ts'
import {
  type CoverSpec,
  coverTransmittance,
  diffuseEquivalentAnglesDeg,
  GLASS_REFRACTIVE_INDEX,
  LOW_IRON_GLASS_EXTINCTION_PER_M,
} from '../../physics/cover-transmittance.ts'
import {
  flatPlateHeatTransferCoefficientWm2K,
  radiativeHeatTransferCoefficientWm2K,
} from '../../physics/evaporation.ts'
import { diffuseHorizontalErbsWm2 } from '../../physics/irradiance.ts'
import { moistAirHeatCapacityKjPerKgK } from '../../physics/moist-air.ts'
import { HourMode, type MethodHour, type MethodModel } from './method-model.ts'
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
  /** Product surface per m² of drying floor (see the open-air method); 3 as for open air. */
  surfaceAreaPerTrayArea: z.number().min(1).max(20).default(3),
  /**
   * Air speed over the product [m/s]; 0.25 m/s as measured in a 12 m × 2 m solar tunnel with alternating
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

function coverOf(m: TunnelMethod): CoverSpec {
  const base = TUNNEL_COVERS[m.cover]
  return {
    refractiveIndex: m.coverRefractiveIndex ?? base.refractiveIndex,
    extinctionThickness: m.coverExtinctionThickness ?? base.extinctionThickness,
  }
}

/** Beam transmittance every whole degree of incidence 0…90 (one table per series: no allocation per hour). */
function transmittanceTable(cover: CoverSpec): Float64Array {
  const t = new Float64Array(92)
  for (let d = 0; d <= 89; d++) t[d] = coverTransmittance(cover, d)
  return t
}

/** Linear interpolation in the table at `incidenceDeg` (0 at and beyond 90°). */
function tableTransmittance(table: Float64Array, incidenceDeg: number): number {
  if (!(incidenceDeg < 89)) return incidenceDeg >= 90 ? 0 : table[89] * (90 - incidenceDeg)
  const x = Math.max(incidenceDeg, 0)
  const i = Math.floor(x)
  const f = x - i
  return table[i] * (1 - f) + table[i + 1] * f
}

export const tunnel: MethodModel<typeof tunnelSchema> = {
  kind: 'tunnel',
  label: 'solar tunnel (product under a transparent cover, air warmed by a collector section, fans)',
  title: 'Solar tunnel',
  hint: 'product under a plastic or glass cover; air warmed over a black floor and blown by PV fans',
  schema: tunnelSchema,
  exposure: 'forced-air',
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
        value: `collector outlet air + τ·α_p·G/((hc + hr)·${m.surfaceAreaPerTrayArea}), hc = 2.8 + 3.0·${m.airSpeedOverProductMs} m/s, α_p ${m.productAbsorptivity}`,
        source:
          'Watmuff et al. 1977 via Duffie & Beckman 2013 §3.15 (from memory); air speed: a 12 m × 2 m tunnel, abstract read',
      },
    ]
  },
  prepare(m, { solar, thresholds, product }) {
    const cover = coverOf(m)
    const table = transmittanceTable(cover)
    const diffuseTau = tableTransmittance(table, diffuseEquivalentAnglesDeg(0).skyDeg)
    const collectorAreaM2 = m.collectorLengthM * m.widthM
    const tonnes = tunnelTonnes(m, product.loadingKgPerM2)
    const hc = flatPlateHeatTransferCoefficientWm2K(m.airSpeedOverProductMs)
    const { altitudeDeg, raWm2 } = solar
    return (hour: MethodHour): void => {
      const i = hour.index
      const t = hour.dryBulbC
      const g = hour.night ? 0 : hour.ghiWm2
      let share = 0
      if (m.fans === 'constant') share = 1
      else if (g >= thresholds.collectorOnWm2) share = g >= m.pvFullFlowWm2 ? 1 : g / m.pvFullFlowWm2
      hour.airFlowShare = share
      // sun through the cover (horizontal): beam at the zenith angle, diffuse at the isotropic-sky angle
      let transmitted = 0
      if (g > 0) {
        const diffuse = diffuseHorizontalErbsWm2(g, raWm2[i])
        const beam = g - diffuse
        transmitted = beam * tableTransmittance(table, 90 - altitudeDeg[i]) + diffuse * diffuseTau
      }
      if (share === 0) {
        // fans stopped: shut (paused) or open to still ambient air (no forced flow: rewetting only)
        if (m.nightPractice === 'closed') {
          hour.mode = HourMode.paused
          hour.pausedByNight = true
        }
        hour.airC = t
        hour.productC = t
        return
      }
      const flow = m.airFlowKgPerS * share
      const capacity = flow * 1000 * moistAirHeatCapacityKjPerKgK(hour.humidityRatio)
      const fr =
        collectorAreaM2 > 0
          ? heatRemovalFactor(collectorAreaM2, m.collectorLossWm2K, m.collectorEfficiencyFactor, capacity)
          : 0
      const gainW = fr * collectorAreaM2 * m.absorberAbsorptance * transmitted
      const tAir = t + gainW / capacity
      hour.airC = tAir
      hour.solarKwhPerTonne = gainW / 1000 / tonnes
      const hr = radiativeHeatTransferCoefficientWm2K(PRODUCT_EMISSIVITY, tAir)
      hour.productC = tAir + (m.productAbsorptivity * transmitted) / ((hc + hr) * m.surfaceAreaPerTrayArea)
    }
  },
}
