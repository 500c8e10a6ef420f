/**
 * @module drying/methods/method-model
 * What a drying method is to the engine. Each method is one module in this folder exporting a
 * {@link MethodModel}: its parameters (a zod object with stated defaults), what it assumes (listed in every
 * assessment), and for every hour the air at the product, the product temperature and the energy put in.
 * The registry (./index.ts) lists them; the hourly driver (drying/hourly-conditions.ts) does everything
 * that is the same for all methods: the ambient air, saturation at the product, equilibrium moisture,
 * drying rate, the humidity-ratio deficits and the usable-hour verdict (drying/usable-hour.ts).
 *
 * Speed: `prepare` runs once per series and returns the function called for every hour. It reads and
 * writes one {@link MethodHour} object that lives as long as the series (no allocation per hour; keep
 * per-hour numbers out of captured `let` variables, which V8 would box).
 */
import type { z } from 'zod'
import { solveWetSurface, type WetSurface } from '../../physics/wet-surface.ts'
import type { ProductProfile, Shape } from '../../product/profile.ts'
import type { HourlySeries } from '../../weather/series.ts'
import type { SolarColumns } from '../solar-columns.ts'
import type { DryingThresholds } from '../thresholds.ts'

/** What an hour does to the product in a batch. */
export const HourMode = { active: 0, paused: 1, rainExposed: 2, missing: 3 } as const
export type HourModeCode = (typeof HourMode)[keyof typeof HourMode]

/** A stated assumption with its source, as the assessment lists it. */
export interface MethodAssumption {
  name: string
  value: string
  source: string
}

/**
 * One hour as the driver hands it to a method (ambient air, set before the call) and what the method
 * gives back (set by the call). The driver resets the outputs to their defaults before each hour.
 */
export class MethodHour {
  /** Index of the hour in the series (for the solar columns). */
  index = 0
  /** Ambient dry bulb [°C]. */
  dryBulbC = Number.NaN
  /**
   * Ambient vapour pressure [kPa]; a method that encloses its air (the greenhouse) may set the inside air's, with
   * {@link humidityRatio}, and the driver then takes it as the air at the product.
   */
  vaporPressureKpa = Number.NaN
  /** Ambient humidity ratio [kg/kg] (heating does not change it); see {@link vaporPressureKpa}. */
  humidityRatio = Number.NaN
  /** Station pressure [kPa]. */
  pressureKpa = Number.NaN
  /** Saturation pressure over liquid water at the ambient dry bulb, exp(ln pws) [Pa]. */
  saturationPa = Number.NaN
  /** Wind at 2 m over short grass [m/s] (FAO-56 eq 47 from the file's wind height). */
  windAt2mMs = Number.NaN
  /** Global horizontal irradiance [W/m²], 0 when missing or negative. */
  ghiWm2 = Number.NaN
  /** Sun below the night threshold (or, without coordinates, no irradiance). */
  night = false
  /** Rain in the hour at or above the threshold. */
  raining = false

  /** Out: air temperature at the product [°C] (ambient unless the method heats it). */
  airC = Number.NaN
  /**
   * Out: product (surface) temperature [°C] of a product that evaporates nothing (dry surface, or one that
   * has stopped drying): the temperature of the verdict, of rewetting and of a product near its target.
   */
  productC = Number.NaN
  /**
   * Out: surface temperature [°C] of the product while it still holds free water at its surface (evaporating at
   * the wet-surface rate {@link evaporationKgPerM2H}); a batch's product sits between the two, by how much of
   * that rate it evaporates (drying/batch.ts). NaN: the method has no such balance (forced air, where the
   * kinetics were measured against the air temperature and the product is taken at it).
   */
  productWetC = Number.NaN
  /** Out: {@link HourMode}. */
  mode: HourModeCode = HourMode.active
  /** Out: no drying because of night or no collector heat (covered product, fans off). */
  pausedByNight = false
  /** Out: product covered because of rain. */
  coveredForRain = false
  /** Out: exposed product uncovered at night (dew possible). */
  uncoveredNight = false
  /** Out: wet-surface evaporation per m² of drying surface [kg m⁻² h⁻¹]; NaN when not an exposed method or covered. */
  evaporationKgPerM2H = Number.NaN
  /**
   * Out: vapour conductance between the air and the product surface per m² of drying surface
   * [kg m⁻² h⁻¹ kPa⁻¹] (the transfer of the wet-surface balance); NaN when not an exposed method or covered.
   */
  vaporConductanceKgPerM2HKpa = Number.NaN
  /** Out: heat from a heater into the air [kWh per tonne fresh product in this hour]. */
  heaterKwhPerTonne = 0
  /** Out: heat from a solar collector into the air [kWh per tonne fresh product in this hour]. */
  solarKwhPerTonne = 0
  /**
   * Out: the hour's air flow as a share of the method's nominal flow (`airFlowKgPerSPerTonne`) [0–1]; scales the
   * forced-air constant-rate limit (fans that follow the sun). 1 unless the method says otherwise.
   */
  airFlowShare = 1
}

/** What a method may read when it prepares for a series. */
export interface MethodSetup {
  series: HourlySeries
  /** The product (a bin needs the grain's bulk density and airflow resistance). */
  profile: ProductProfile
  /** Initial and target moisture of the assessment [% wb]. */
  initialWbPct: number
  targetWbPct: number
  /** Sun position and radiation columns of the series. */
  solar: SolarColumns
  thresholds: DryingThresholds
  /** Highest product temperature for quality [°C], or null. */
  maxProductTempC: number | null
  /** The product as laid out: shape, size (diameter or thickness) [mm] and loading [kg fresh per m²]. */
  product: { shape: Shape; sizeMm: number; loadingKgPerM2: number }
}

/** The per-hour function a method returns from `prepare`. */
export type MethodHourFunction = (hour: MethodHour) => void

// biome-ignore lint/suspicious/noExplicitAny: the registry holds models of different parameter shapes
export type AnyMethodSchema = z.ZodObject<any>

/** What a method's assumptions may say about the product assessed. */
export interface AssumptionProduct {
  id: string
  name: string
  category: string
}

export interface MethodModel<S extends AnyMethodSchema = AnyMethodSchema> {
  /** The `kind` of the method (kebab-case), also its zod literal. */
  kind: string
  /** Plain words for reports, e.g. "open air (racks or mats in the sun)". */
  label: string
  /** Short name for a choice on the page, e.g. "Open air". */
  title: string
  /** One line under that name on the page, e.g. "racks, trays or mats in the sun; covered at night and in rain". */
  hint: string
  /** Parameters with their defaults and sources; `kind` is a literal. */
  schema: S
  /**
   * 'exposed': the product lies on a surface open to the air (a loading in kg/m² applies and its
   * constant-rate limit is the wet-surface evaporation); 'forced-air': air is blown through the product at
   * a known flow (the limit is the deficit to saturation × air mass).
   */
  exposure: 'exposed' | 'forced-air'
  /**
   * True when a forced-air method's product lies in the air stream on a floor under the sun (the solar tunnel):
   * its temperature follows the surface balance of exposed methods (the method sets
   * {@link MethodHour.productWetC} and the wet-surface evaporation), its constant-rate limit is the smaller of
   * that evaporation and the air's capacity. Exposed methods always have it.
   */
  surfaceBalance?: boolean
  /**
   * True when a forced-air method's size is set by a drying area and a loading (the solar tunnel): its
   * `loadingKgPerM2` is then taken as the assessment's loading, as for exposed methods.
   */
  usesLoading?: boolean
  /**
   * How the product goes through the hours: `thin-layer` (the default) runs batches of product in the hourly air
   * (the start-date table, monthly heat, supplemental heat); `deep-bed` is grain in a bin, assessed by the
   * deep-bed model of drying/deep-bed/ per start date, airflow and year (analysis/bin-stage.ts) instead.
   */
  batches?: 'thin-layer' | 'deep-bed'
  /**
   * Whether the method can take this product: null when it can, else the reason in a sentence (the planner
   * refuses the assessment with it, naming the method). Absent: every product.
   */
  productFits?(profile: ProductProfile): string | null
  /**
   * Dry-air flow per tonne of fresh product at the nominal flow [kg/s] (0 for exposed methods); `loadingKgPerM2`
   * is the assessment's loading, for methods sized by a drying area.
   */
  airFlowKgPerSPerTonne(method: z.output<S>, loadingKgPerM2?: number): number
  /** True when the method heats its air with fuel: its own heater energy is the heat, and no backup heater is added. */
  heatsWithFuel: boolean
  /**
   * Which energy inputs the method's hours can set (`MethodHour.heaterKwhPerTonne`, `solarKwhPerTonne`); absent:
   * both. A method that declares one false has that column left empty when its conditions are computed (it
   * would hold zeros: less memory per assessment), and its batches count no such energy.
   */
  energyInputs?: { heater: boolean; solar: boolean }
  /** True when rain decides hours of this method (it wets or covers the product): a file without rain then gets a warning. */
  rainMatters(method: z.output<S>): boolean
  /**
   * What the method needs: the sun (irradiance in most hours; a file without is refused), the sun
   * azimuth (tilted collectors), the site coordinates.
   */
  needs: { sun: boolean; sunAzimuth: boolean; coordinates: boolean }
  /**
   * The method's own assumptions, with their sources, for the assessment; `product` lets a default that was
   * estimated for one product say so when another is assessed.
   */
  assumptions(method: z.output<S>, product?: AssumptionProduct): MethodAssumption[]
  /** Prepare for one series; the returned function sets the outputs of each hour. */
  prepare(method: z.output<S>, setup: MethodSetup): MethodHourFunction
}

/**
 * Wet-surface balance of an exposed product in the hour (physics/wet-surface.ts): available energy
 * `availableEnergyWm2` (isothermal: absorbed sun minus the net long-wave at air temperature) per m² of the area
 * the product covers, wind at 2 m `windMs`, the ambient air of `hour`, the exchange surface and radiative
 * conductance set on `scratch` (the method's own {@link WetSurface}, reused every hour). Writes
 * `hour.evaporationKgPerM2H` and `hour.vaporConductanceKgPerM2HKpa` per m² of tray (× `coverage`, the share of
 * the tray the product covers) and `hour.productWetC`; returns H + R [W m⁻² K⁻¹] per m² covered, from which a product evaporating less sits
 * warmer: Ta + (Q − λE)/(H + R).
 */
export function wetSurfaceEvaporationOfHour(
  hour: MethodHour,
  scratch: WetSurface,
  availableEnergyWm2: number,
  windMs: number,
  coverage = 1,
): number {
  scratch.airC = hour.dryBulbC
  scratch.saturationPa = hour.saturationPa
  scratch.windAt2mMs = windMs
  scratch.aerodynamicResistanceSPerM = Number.NaN
  return solveHourSurface(hour, scratch, availableEnergyWm2, coverage)
}

/**
 * The same balance in air warmer than the ambient at the same humidity ratio (a tunnel's air after its
 * collector), air temperature `airC`, through the aerodynamic resistance `resistanceSPerM` [s/m] (from the air
 * speed over the product) instead of the wind function.
 */
export function wetSurfaceEvaporationInAir(
  hour: MethodHour,
  scratch: WetSurface,
  availableEnergyWm2: number,
  airC: number,
  resistanceSPerM: number,
  coverage = 1,
): number {
  scratch.airC = airC
  scratch.saturationPa = airC === hour.dryBulbC ? hour.saturationPa : Number.NaN
  scratch.windAt2mMs = Number.NaN
  scratch.aerodynamicResistanceSPerM = resistanceSPerM
  return solveHourSurface(hour, scratch, availableEnergyWm2, coverage)
}

function solveHourSurface(
  hour: MethodHour,
  scratch: WetSurface,
  availableEnergyWm2: number,
  coverage: number,
): number {
  scratch.availableEnergyWm2 = availableEnergyWm2
  scratch.vaporPressureKpa = hour.vaporPressureKpa
  scratch.pressureKpa = hour.pressureKpa
  scratch.humidityRatio = hour.humidityRatio
  solveWetSurface(scratch)
  hour.evaporationKgPerM2H = scratch.evaporationKgPerM2H * coverage
  hour.vaporConductanceKgPerM2HKpa = scratch.vaporConductanceKgPerM2HKpa * coverage
  hour.productWetC = scratch.surfaceC
  return scratch.heatConductanceWm2K
}
