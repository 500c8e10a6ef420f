/**
 * @module drying/hour-columns
 * The columns of the hourly driver (drying/hourly-conditions.ts), one value per hour of the series, and
 * the options that decide which of them are kept.
 */
import type { DryingMethod } from './method.ts'
import type { SolarColumns } from './solar-columns.ts'
import type { DryingThresholds } from './thresholds.ts'

export interface HourlyConditionsOptions {
  /** Target moisture [kg/kg db] for the usable-hour test. */
  targetDb: number
  /** Initial moisture [% wb], which sets the dry matter per kg fresh product for the per-tonne caps. */
  initialWbPct: number
  /** Loading [kg fresh / m²] for exposed methods (open air, shade). */
  loadingKgPerM2: number
  thresholds: DryingThresholds
  /** Highest product temperature for quality [°C], or null. */
  maxProductTempC: number | null
  /** Sun and radiation columns of the series, when already computed (shared between methods). */
  solar?: SolarColumns
  /**
   * false: skip the usable-hour test (status stays 0 and the deficit to target NaN), for conditions used
   * only as the supplemental-heat backup, whose verdict nobody reads. Default true.
   */
  verdict?: boolean
  /** true: compute hours only when a batch asks for them ({@link HourlyConditions.ensure}). Default false. */
  lazy?: boolean
  /**
   * false: leave the columns only reports read empty (length 0): airRhPct, surfaceRhPct, humidityRatio and
   * deficitToSaturationGPerKg, and also deficitToTargetGPerKg and evaporationKgPerM2H when `verdict` is
   * false. Batches do not read them; an assessment saves their memory. Default true.
   */
  diagnostics?: boolean
  /**
   * {@link HourlyConditions.ambientSaturationPa} of conditions already computed for every hour of the same
   * series (another method): read instead of evaluated again. The values are the same.
   */
  ambientSaturationPa?: Float64Array
}

/** The columns of the hours (one value per hour of the series). */
export interface HourColumns {
  /** Air temperature at the product [°C] (after collector or heater). */
  airC: Float64Array
  /** RH of that air [%]. */
  airRhPct: Float64Array
  /**
   * Product (surface) temperature [°C] of a product that evaporates nothing (near its target, or stopped):
   * the temperature of the verdict, the deficits and the equilibrium columns below.
   */
  productC: Float64Array
  /**
   * Exposed methods: surface temperature [°C] of the product while it holds free water (evaporating at the
   * wet-surface rate); a batch's product lies between it and {@link productC}. NaN for paused and missing
   * hours; empty (length 0) for forced-air methods.
   */
  productWetC: Float64Array
  /** Exposed methods: desorption equilibrium [kg/kg db] at {@link productWetC} and the surface RH there; empty otherwise. */
  emcWetDb: Float64Array
  /** Exposed methods: the step parameters k, n and exp(−k·1 h) (n = 1) at {@link productWetC}; empty otherwise. */
  rateKWet: Float64Array
  rateNWet: Float64Array
  decayWetPerHour: Float64Array
  /**
   * Exposed methods: most water the product can take up from the air in the hour [kg per kg dry matter per h]
   * is vaporUptakeAirDbPerH − aw·vaporUptakeSurfaceDbPerH, aw the product's water activity: the vapour
   * conductance of the wet-surface balance (per kg dry matter, as {@link capDbPerH}) times the ambient vapour
   * pressure and times the saturation pressure at {@link productC}. NaN in paused and missing hours; empty
   * (length 0) for forced-air methods.
   */
  vaporUptakeAirDbPerH: Float64Array
  vaporUptakeSurfaceDbPerH: Float64Array
  /**
   * Vapour pressure of the air at the product [kPa] (heating does not change it): the spoilage track's surface RH
   * at the batch's own product temperature (product/spoilage/surface-water-activity.ts). NaN for missing hours.
   */
  vaporPressureKpa: Float64Array
  /** RH at the product surface [%]: ambient vapour pressure over saturation at the product temperature. */
  surfaceRhPct: Float64Array
  /** Saturation pressure of the ambient air, exp(ln pws) [Pa] (ASHRAE HOF 2017 ch. 1 eq 6); NaN for missing and not yet computed hours. */
  ambientSaturationPa: Float64Array
  /** Ambient (and product-air) humidity ratio [kg/kg]; heating does not change it. */
  humidityRatio: Float64Array
  /** Deficit to free-water saturation along the constant-enthalpy line [g/kg]; NaN for exposed methods. */
  deficitToSaturationGPerKg: Float64Array
  /** Deficit to the product's equilibrium RH at its target moisture [g/kg]. */
  deficitToTargetGPerKg: Float64Array
  /** Wet-surface (Penman) evaporation per m² of drying surface [kg m⁻² h⁻¹]; NaN for forced-air methods and covered hours. */
  evaporationKgPerM2H: Float64Array
  /**
   * Most water the hour can remove [kg per kg dry matter per h]: the constant-rate limit, per kg of the dry
   * matter of fresh product at `initialWbPct` (see {@link HourlyConditions.capInitialDb}).
   */
  capDbPerH: Float64Array
  /**
   * Forced-air methods on a surface balance (the tunnel): the air's own limit [kg per kg dry matter per h], the
   * deficit to saturation × the hour's air flow, while {@link capDbPerH} is the wet-surface evaporation; a batch
   * removes no more than the smaller. Empty (length 0) for other methods.
   */
  airCapDbPerH: Float64Array
  emcDesorptionDb: Float64Array
  /** The same array as {@link emcDesorptionDb} when the profile has one isotherm for both directions. */
  emcAdsorptionDb: Float64Array
  rateK: Float64Array
  rateN: Float64Array
  /** exp(−k·1 h) where n = 1 (first-order models), NaN otherwise: the batch step without an exp. */
  decayPerHour: Float64Array
  /** exp(−f·k₁·1 h), f the rewetting rate factor and k₁ the first-order rate constant. */
  rewetDecayPerHour: Float64Array
  /** Heat from the heater into the air [kWh per tonne fresh product in this hour]. */
  heaterKwhPerTonne: Float64Array
  /** Heat from the solar collector into the air [kWh per tonne fresh product in this hour]. */
  solarKwhPerTonne: Float64Array
  /** {@link HourMode} per hour. */
  mode: Uint8Array
  /** Usable-hour status per hour (drying/usable-hour.ts HourStatus; 0 = usable). */
  status: Uint8Array
  /** 1 at night (sun below the threshold altitude). */
  night: Uint8Array
}

export interface HourlyConditions extends HourColumns {
  hours: number
  /** Make sure hours from..from+count−1 (wrapping past the end when `wrap`) are computed (lazy conditions). */
  ensure: (from: number, count: number, wrap: boolean) => void
  method: DryingMethod
  /** Dry-air flow per tonne of fresh product [kg/s]; 0 for exposed methods. */
  airFlowKgPerSPerTonne: number
  /**
   * True for exposed methods and the tunnel: the product's temperature follows its surface energy balance, between
   * {@link HourColumns.productWetC} and {@link HourColumns.productC} by the share of the wet-surface rate it
   * evaporates (drying/batch.ts). False: the product is at {@link HourColumns.productC} whatever it evaporates.
   */
  surfaceBalance: boolean
  /**
   * Initial moisture [kg/kg db] whose dry matter per kg of fresh product {@link capDbPerH} is per (from
   * `initialWbPct`): a batch that starts at another moisture has another dry matter per tonne (or per m²)
   * and rescales the cap by (1 + its M0)/(1 + this), so the water per kg of air stays what the air can carry.
   */
  capInitialDb: number
  /** Hours whose irradiance or wind was missing and was taken as 0 W/m² / the default wind of drying/hourly-conditions.ts (hours computed when the object was returned). */
  assumedIrradianceHours: number
  assumedWindHours: number
  /** True when the series had no rain column values at all. */
  noRainData: boolean
}

/**
 * Columns that may be left empty: the rate constant and exponent (`rates`: not read by batches of first-order
 * kinetics, whose step is the decay column), the heater's and the collector's energy (for methods that put
 * none in). Empty columns read as `undefined`: keep them when something reads them (diagnostics).
 */
export interface ColumnsKept {
  rates: boolean
  heater: boolean
  solar: boolean
}

export function allocateColumns(
  n: number,
  options: HourlyConditionsOptions,
  sameIsotherm: boolean,
  surfaceBalance: boolean,
  airCap = false,
  keep: ColumnsKept = { rates: true, heater: true, solar: true },
): HourColumns {
  const verdict = options.verdict !== false
  const diagnostics = options.diagnostics !== false
  // Columns not kept are empty: stores past the end of a typed array are ignored, so the hour code is
  // the same either way.
  const nDiagnostic = diagnostics ? n : 0
  const nMonthly = diagnostics || verdict ? n : 0
  const f = (length: number) => new Float64Array(length)
  const shared = options.ambientSaturationPa
  if (shared !== undefined && shared.length !== n) {
    throw new RangeError(`ambient saturation column must hold ${n} values, got ${shared.length}`)
  }
  const emcDesorptionDb = f(n)
  const columns: HourColumns = {
    ambientSaturationPa: shared ?? f(n),
    airC: f(n),
    airRhPct: f(nDiagnostic),
    productC: f(n),
    productWetC: f(surfaceBalance ? n : 0),
    emcWetDb: f(surfaceBalance ? n : 0),
    rateKWet: f(surfaceBalance && keep.rates ? n : 0),
    rateNWet: f(surfaceBalance && keep.rates ? n : 0),
    decayWetPerHour: f(surfaceBalance ? n : 0),
    vaporUptakeAirDbPerH: f(surfaceBalance ? n : 0),
    vaporUptakeSurfaceDbPerH: f(surfaceBalance ? n : 0),
    vaporPressureKpa: f(n),
    surfaceRhPct: f(nDiagnostic),
    humidityRatio: f(nDiagnostic),
    deficitToSaturationGPerKg: f(nDiagnostic),
    deficitToTargetGPerKg: f(nMonthly),
    evaporationKgPerM2H: f(nMonthly),
    capDbPerH: f(n),
    airCapDbPerH: f(airCap ? n : 0),
    emcDesorptionDb,
    // one isotherm for both directions: the two columns are one array (same values, half the memory)
    emcAdsorptionDb: sameIsotherm ? emcDesorptionDb : f(n),
    rateK: f(keep.rates ? n : 0),
    rateN: f(keep.rates ? n : 0),
    decayPerHour: f(n),
    rewetDecayPerHour: f(n),
    heaterKwhPerTonne: f(keep.heater ? n : 0),
    solarKwhPerTonne: f(keep.solar ? n : 0),
    mode: new Uint8Array(n),
    status: new Uint8Array(n),
    night: new Uint8Array(n),
  }
  if (options.lazy === true) {
    // hours not yet computed read as missing temperatures, never as 0 °C
    columns.airC.fill(Number.NaN)
    columns.productC.fill(Number.NaN)
    columns.productWetC.fill(Number.NaN)
    if (shared === undefined) columns.ambientSaturationPa.fill(Number.NaN)
  }
  return columns
}
