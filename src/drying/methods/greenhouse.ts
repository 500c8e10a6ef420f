/**
 * @module drying/methods/greenhouse
 * Greenhouse dryer: the product on trays or the floor under a transparent cover (a plastic tunnel or a small
 * greenhouse) with no collector and no fan; the sun that passes the cover and is absorbed by the product and the
 * floor warms the air inside, which leaves through high openings and is replaced through low ones by its own
 * buoyancy (natural draught). What it assumes, hour by hour:
 * - shape: a half-cylinder over a floor `lengthM` × `widthM` (the usual tunnel; crown at half the width), from
 *   which the cover area (curved roof and two ends) and the volume follow unless given;
 * - sun on the floor through the cover taken as horizontal, as for the solar tunnel (./cover-sun.ts: Erbs split,
 *   Fresnel and Bouguer optics); the product absorbs α_p, the bare floor α_f, and a tenth of what is absorbed goes
 *   into the ground (below);
 * - the inside air from a quasi-steady heat balance of the enclosure (no heat stored from hour to hour), its
 *   loss through the cover by an overall coefficient and the ventilation by the stack effect or a stated air-change
 *   rate, and its humidity from the water the ventilation air carries out (physics/greenhouse-air.ts; the coupled
 *   hour in ./greenhouse-hour.ts);
 * - the water that loads the air is that of a fresh batch in its first hour (its own kinetics, never more than its
 *   wet-surface evaporation): later in a batch the product gives less, so the real air is warmer and drier than the
 *   model's (drying times err long; the hourly conditions are shared by every batch of an assessment and cannot
 *   follow each batch's state);
 * - the product's surface balances in the inside air as in the solar tunnel (absorbed sun, long-wave with the cover
 *   at the temperature its two faces' convection gives, convection at the air speed the ventilation gives across
 *   the enclosure, evaporation), between its wet-surface temperature and T_air + Q/(H + R);
 * - its constant-rate limit is the smaller of that evaporation and what the hour's ventilation air can carry to
 *   saturation;
 * - without sun (night, or no irradiance): 'closed' (the default), the greenhouse is shut, no exchange (as the
 *   tunnel's closed nights); 'open', the air inside taken at ambient (the ground's release of the day's heat and
 *   the cover's long-wave loss are not modelled), the product rewets toward its equilibrium in still air;
 * - rain does not reach the product.
 * Energy: the sun absorbed inside and passed to the air (kWh per tonne), no fuel, no fan.
 */
import { z } from 'zod'
import {
  flatPlateHeatTransferCoefficientWm2K,
  radiativeHeatTransferCoefficientWm2K,
} from '../../physics/evaporation.ts'
import {
  airChangeVentilationM3PerS,
  coverHeatLossCoefficientWm2K,
  MIHARA_HAYASHI_1979,
  openingsInSeriesAreaM2,
  stackVentilationM3PerS,
} from '../../physics/greenhouse-air.ts'
import { moistAirSpecificVolumeM3PerKg, STANDARD_PRESSURE_KPA } from '../../physics/moist-air.ts'
import { resistanceOfHeatTransferCoefficientSPerM } from '../../physics/wet-surface.ts'
import { layerGeometry } from '../../product/layer-geometry.ts'
import { moistureDbFromWbPct } from '../../product/moisture-basis.ts'
import { productResponse } from '../product-response.ts'
import { HorizontalCoverSun } from './cover-sun.ts'
import { greenhouseAssumptions } from './greenhouse-assumptions.ts'
import { GreenhouseHour } from './greenhouse-hour.ts'
import { HourMode, type MethodHour, type MethodModel, wetSurfaceEvaporationInAir } from './method-model.ts'
import { PRODUCT_EMISSIVITY } from './open-air.ts'
import { fraction, loadingSchema } from './parameters.ts'
import { coverOf } from './tunnel.ts'

export const greenhouseSchema = z.object({
  kind: z.literal('greenhouse'),
  /** Floor length [m]; 8 m, the drying section of the CIAE solar tunnel (as the tunnel method; an assumption here). */
  lengthM: z.number().gt(0).max(200).default(8),
  /** Floor width [m]; 2 m as the CIAE tunnel (an assumption here); the crown is at half the width. */
  widthM: z.number().gt(0).max(30).default(2),
  /** Cover area [m²]; when absent, the half-cylinder over the floor and its two ends. */
  coverAreaM2: z.number().gt(0).max(20_000).optional(),
  /** Tray (product) area [m²]; when absent, the whole floor. */
  trayAreaM2: z.number().gt(0).max(10_000).optional(),
  /** Product on the trays [kg fresh per m²]; when absent, the product profile's default loading. */
  loadingKgPerM2: loadingSchema,
  /** Cover material: its optics as the tunnel's; its heat loss Mihara & Hayashi's (PVC film for polyethylene). */
  cover: z.enum(['polyethylene', 'glass']).default('polyethylene'),
  coverRefractiveIndex: z.number().gt(1).lt(3).optional(),
  coverExtinctionThickness: z.number().min(0).lt(5).optional(),
  /** Overall heat-loss coefficient of the cover [W m⁻² K⁻¹]; when absent, Mihara & Hayashi's line in the wind. */
  coverLossWm2K: z.number().gt(0).max(50).optional(),
  /**
   * Free area of the openings as a share of the floor, half low (side, inlets) and half high (roof, outlets): 0.3,
   * each 15 % of the floor, the lower end of the ASABE recommendation for naturally ventilated greenhouses (roof
   * vents equal to side vents, each at least 15–20 % of the floor; as given by Greenhouse Management, "Greenhouse
   * natural ventilation guidelines", 2015, transcribed). That is a crop greenhouse's (Fadhel et al.'s dryer was
   * one); no opening area of a purpose-built greenhouse dryer was read.
   */
  ventShareOfFloor: z.number().gt(0).max(2).default(0.3),
  /** Free area of the openings [m²], half low and half high; replaces {@link ventShareOfFloor} when given. */
  ventAreaM2: z.number().gt(0).max(5000).optional(),
  /** Height between the centres of the low and high openings [m]; when absent, the crown height (half the width). */
  ventHeightM: z.number().gt(0).max(30).optional(),
  /** Discharge coefficient of the openings; 0.65 (see physics/greenhouse-air.ts for its sources). */
  dischargeCoefficient: z.number().gt(0).max(1).default(0.65),
  /** Air changes per hour stated by a paper or the user; replaces the stack flow when given. */
  airChangesPerHour: z.number().gt(0).max(600).optional(),
  /**
   * Without sun: 'closed' (vents and doors shut, no exchange: no drying, no rewetting; as the tunnel's default,
   * common practice, no source) or 'open' (still ambient air inside: rewetting only).
   */
  nightPractice: z.enum(['open', 'closed']).default('closed'),
  /** Solar absorptance of the product; 0.7 as for open air (assumption, from memory). */
  productAbsorptivity: fraction('productAbsorptivity').default(0.7),
  /** Solar absorptance of the bare floor between trays; 0.7 for soil or concrete (from memory). */
  floorAbsorptance: fraction('floorAbsorptance').default(0.7),
  /**
   * Share of the absorbed sun that goes into the ground; 0.1, the daylight soil heat flux of FAO-56 (Allen et al.
   * 1998) eq 45 for short grass (G = 0.1·Rn), taken for the floor (a bare floor stores more; stated limit).
   */
  groundShare: fraction('groundShare').default(0.1),
  /** Product surface that meets the air per m² of tray it covers [m²/m²]; when absent, from its shape. */
  surfaceAreaPerTrayArea: z.number().min(1).max(20).optional(),
})

export type GreenhouseMethod = z.output<typeof greenhouseSchema>

/** Loading used when neither the method nor the caller gives one [kg/m²] (the engine always passes the product's). */
const FALLBACK_LOADING_KG_PER_M2 = 10
/** Inside–outside difference at which the nominal (reference) stack flow is stated [K]; our choice, for the per-tonne figure. */
export const REFERENCE_RISE_K = 10
/** Outside air of that reference: 20 °C, W 0.01, standard pressure (our choice). */
const REFERENCE_OUTSIDE_C = 20
const REFERENCE_W = 0.01

/** Floor, cover, tray areas [m²], volume [m³] and cross-section [m²] of `m` (half-cylinder of the width). */
export function greenhouseGeometry(m: GreenhouseMethod): {
  floorM2: number
  coverM2: number
  trayM2: number
  volumeM3: number
  crossSectionM2: number
  ventHeightM: number
  ventAreaM2: number
} {
  const r = m.widthM / 2
  const floorM2 = m.lengthM * m.widthM
  const crossSectionM2 = (Math.PI * r * r) / 2
  const trayM2 = m.trayAreaM2 ?? floorM2
  if (trayM2 > floorM2) {
    throw new RangeError(
      `method.trayAreaM2: the trays (${trayM2} m²) cannot exceed the floor (${floorM2} m²)`,
    )
  }
  return {
    floorM2,
    coverM2: m.coverAreaM2 ?? Math.PI * r * m.lengthM + 2 * crossSectionM2,
    trayM2,
    volumeM3: crossSectionM2 * m.lengthM,
    crossSectionM2,
    ventHeightM: m.ventHeightM ?? r,
    ventAreaM2: m.ventAreaM2 ?? m.ventShareOfFloor * floorM2,
  }
}

/** Tonnes of fresh product on the trays at `loadingKgPerM2`. */
export function greenhouseTonnes(m: GreenhouseMethod, loadingKgPerM2?: number): number {
  const loading = m.loadingKgPerM2 ?? loadingKgPerM2 ?? FALLBACK_LOADING_KG_PER_M2
  return (greenhouseGeometry(m).trayM2 * loading) / 1000
}

/** The ventilation of `m` at the reference difference [kg dry air/s]: the nominal flow of the per-tonne figures. */
export function referenceVentilationKgPerS(m: GreenhouseMethod): number {
  const geo = greenhouseGeometry(m)
  const v = moistAirSpecificVolumeM3PerKg(
    REFERENCE_OUTSIDE_C + REFERENCE_RISE_K,
    REFERENCE_W,
    STANDARD_PRESSURE_KPA,
  )
  if (m.airChangesPerHour !== undefined)
    return airChangeVentilationM3PerS(m.airChangesPerHour, geo.volumeM3) / v
  const a = openingsInSeriesAreaM2(geo.ventAreaM2 / 2, geo.ventAreaM2 / 2)
  return (
    stackVentilationM3PerS(
      m.dischargeCoefficient,
      a,
      geo.ventHeightM,
      REFERENCE_RISE_K,
      REFERENCE_OUTSIDE_C,
    ) / v
  )
}

export const greenhouse: MethodModel<typeof greenhouseSchema> = {
  kind: 'greenhouse',
  label:
    'greenhouse dryer (product under a transparent cover, air warmed by the sun inside, natural draught)',
  title: 'Greenhouse dryer',
  hint: 'product under a plastic or glass cover without collector or fan; vents let the warm air out',
  schema: greenhouseSchema,
  exposure: 'forced-air',
  surfaceBalance: true,
  usesLoading: true,
  airFlowKgPerSPerTonne: (m, loadingKgPerM2) =>
    referenceVentilationKgPerS(m) / greenhouseTonnes(m, loadingKgPerM2),
  heatsWithFuel: false,
  rainMatters: () => false,
  needs: { sun: true, sunAzimuth: false, coordinates: true },
  assumptions: (m) => greenhouseAssumptions(m),
  prepare(m, { solar, product, profile, initialWbPct }) {
    const geo = greenhouseGeometry(m)
    const coverSun = new HorizontalCoverSun(coverOf(m))
    const layer = layerGeometry(
      product.shape,
      product.sizeMm,
      product.loadingKgPerM2,
      m.surfaceAreaPerTrayArea,
    )
    const loading = m.loadingKgPerM2 ?? product.loadingKgPerM2
    const v0 = moistAirSpecificVolumeM3PerKg(
      REFERENCE_OUTSIDE_C + REFERENCE_RISE_K,
      REFERENCE_W,
      STANDARD_PRESSURE_KPA,
    )
    const referenceKgPerS = referenceVentilationKgPerS(m)
    const fixedM3PerS =
      m.airChangesPerHour === undefined ? 0 : airChangeVentilationM3PerS(m.airChangesPerHour, geo.volumeM3)
    const solver = new GreenhouseHour(
      {
        floorM2: geo.floorM2,
        coverM2: geo.coverM2,
        trayM2: geo.trayM2,
        crossSectionM2: geo.crossSectionM2,
        fixedVentilationM3PerS: fixedM3PerS,
        dischargeCoefficient: m.dischargeCoefficient,
        seriesOpeningM2:
          m.airChangesPerHour === undefined
            ? openingsInSeriesAreaM2(geo.ventAreaM2 / 2, geo.ventAreaM2 / 2)
            : 0,
        ventHeightM: geo.ventHeightM,
        productAbsorptivity: m.productAbsorptivity,
        floorAbsorptance: m.floorAbsorptance,
        groundShare: m.groundShare,
        productEmissivity: PRODUCT_EMISSIVITY,
        coverage: layer.coverage,
        dryMatterKgPerM2: loading * (1 - initialWbPct / 100),
        initialDb: moistureDbFromWbPct(initialWbPct),
      },
      productResponse(profile, product.sizeMm),
    )
    solver.surface.exchangeAreaRatio = layer.exchangeAreaRatio
    const coverLoss = m.cover === 'glass' ? MIHARA_HAYASHI_1979.glass : MIHARA_HAYASHI_1979.pvcFilm
    const tonnes = greenhouseTonnes(m, product.loadingKgPerM2)
    const { altitudeDeg, raWm2 } = solar
    return (hour: MethodHour): void => {
      const g = hour.night ? 0 : hour.ghiWm2
      const transmitted = coverSun.transmittedWm2(g, raWm2[hour.index], altitudeDeg[hour.index])
      if (transmitted > 0) {
        const k = m.coverLossWm2K ?? coverHeatLossCoefficientWm2K(coverLoss, hour.windAt2mMs)
        const flow = solver.solve(hour, transmitted, k)
        hour.airFlowShare = flow / referenceKgPerS
        hour.solarKwhPerTonne = solver.sunToAirW / 1000 / tonnes
        return
      }
      if (m.nightPractice === 'closed') {
        hour.mode = HourMode.paused
        hour.pausedByNight = true
        return
      }
      // no sun, open: still ambient air inside (a stated air-change rate still ventilates it)
      hour.airFlowShare = fixedM3PerS / v0 / referenceKgPerS
      // the cover at the air temperature: no net long-wave, no sun; the wet surface cools by evaporation only
      const t = hour.dryBulbC
      const hIn = flatPlateHeatTransferCoefficientWm2K(0)
      solver.surface.radiativeConductanceWm2K = radiativeHeatTransferCoefficientWm2K(PRODUCT_EMISSIVITY, t)
      const resistance = resistanceOfHeatTransferCoefficientSPerM(
        hIn,
        t,
        hour.humidityRatio,
        hour.pressureKpa,
      )
      wetSurfaceEvaporationInAir(hour, solver.surface, 0, t, resistance, layer.coverage)
      hour.productC = t
    }
  },
}
