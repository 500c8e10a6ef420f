/**
 * @module drying/hourly-conditions
 * The hourly driver: for one weather series, drying method and product, every hour's air at the product,
 * product temperature, both views of drying potential (humidity-ratio deficit and wet-surface
 * evaporation), equilibrium moisture in both directions, thin-layer step parameters, heat put in, and the
 * usable-hour verdict with its reason, as columns. Computed once per method and reused by every batch
 * (start date) of an assessment.
 *
 * Per hour: the ambient air (dry bulb, RH over liquid water and pressure → vapour pressure and humidity
 * ratio by ASHRAE HOF 2017 ch. 1 eqs 6 and 20; wind to 2 m by FAO-56 eq 47); then the method's module
 * (drying/methods/) sets the air at the product, the product temperature and the energy put in; then,
 * the same for every method: the RH at the product surface (the air's vapour pressure over saturation
 * at the product temperature), the product's equilibrium moisture and drying rate there
 * (drying/product-response.ts), the humidity-ratio deficits along the adiabatic path
 * (physics/air-processes.ts), the constant-rate limit and the verdict (drying/usable-hour.ts).
 * Columns preallocated, one state object per series (drying/hour-engine.ts): no allocation per hour. The
 * product's side of an hour is in drying/hour-product.ts.
 */

import { S_PER_HOUR } from '../physics/constants.ts'
import { windSpeedAt2mMs } from '../physics/evaporation.ts'
import { humidityRatioFromVaporPressure } from '../physics/moist-air.ts'
import { liquidSaturationValueFromTableKpa } from '../physics/saturation-table.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../product/moisture-basis.ts'
import type { HourlySeries } from '../weather/series.ts'
import {
  allocateColumns,
  type ColumnsKept,
  type HourlyConditions,
  type HourlyConditionsOptions,
} from './hour-columns.ts'
import { Engine } from './hour-engine.ts'
import { productHour } from './hour-product.ts'
import type { DryingMethod } from './method.ts'
import { methodModel } from './methods/index.ts'
import { HourMode, type MethodModel } from './methods/method-model.ts'
import type { ProductResponse } from './product-response.ts'
import { computeSolarColumns } from './solar-columns.ts'
import { HourStatus, pausedHourStatus } from './usable-hour.ts'

export type { HourColumns, HourlyConditions, HourlyConditionsOptions } from './hour-columns.ts'
export { HourMode } from './methods/method-model.ts'
export { computeSolarColumns, type SolarColumns } from './solar-columns.ts'

/** Wind [m/s] assumed when the file has none for an hour (calm-ish air; assumption, no source). */
export const DEFAULT_WIND_MS = 1
/** Weather accepted for an hour [°C, % RH, kPa]; outside, the hour counts as missing data (our choice). */
const HOUR_DRY_BULB_RANGE_C = [-60, 70] as const
const HOUR_PRESSURE_RANGE_KPA = [30, 110] as const

/**
 * Saturation pressure over liquid water [Pa] at `tC` [°C] from the interpolated table of ASHRAE HOF 2017 ch. 1
 * eq 6 (physics/saturation-table.ts: within 1e-9 relative of the formula, without its exp and log).
 */
function saturationPa(tC: number): number {
  return 1000 * liquidSaturationValueFromTableKpa(tC)
}

/**
 * The ambient air of hour i into `e.hour` (and the night, saturation and humidity-ratio columns). False
 * when the hour's dry bulb, RH or pressure is missing or out of range: the hour is then marked missing.
 */
function readAmbientHour(e: Engine, i: number): boolean {
  const { series, columns: c, hour } = e
  const t = series.dryBulbC[i]
  const rh = series.relativeHumidityPct[i]
  const p = series.pressureKpa[i]
  const isNight = e.hasCoords
    ? e.altitudeDeg[i] < e.options.thresholds.nightSunAltitudeDeg
    : !(series.ghiWm2[i] > 0)
  c.night[i] = isNight ? 1 : 0
  if (
    !(t >= HOUR_DRY_BULB_RANGE_C[0] && t <= HOUR_DRY_BULB_RANGE_C[1]) ||
    !(rh > 0 && rh <= 100) ||
    !(p >= HOUR_PRESSURE_RANGE_KPA[0] && p <= HOUR_PRESSURE_RANGE_KPA[1])
  ) {
    markMissing(e, i)
    return false
  }
  let ghi = series.ghiWm2[i]
  if (!Number.isFinite(ghi)) {
    if (!isNight) e.assumedIrradianceHours++
    ghi = 0
  } else if (ghi < 0) ghi = 0
  let wind = series.windMs[i]
  if (!(wind >= 0)) {
    e.assumedWindHours++
    wind = DEFAULT_WIND_MS
  }
  let pwsPa: number
  if (e.sharedSaturation) pwsPa = c.ambientSaturationPa[i]
  else {
    pwsPa = saturationPa(t)
    c.ambientSaturationPa[i] = pwsPa
  }
  const pw = (rh / 100) * (pwsPa * 1e-3)
  const w = humidityRatioFromVaporPressure(pw, p)
  c.humidityRatio[i] = w
  c.vaporPressureKpa[i] = pw
  hour.index = i
  hour.dryBulbC = t
  hour.pressureKpa = p
  hour.saturationPa = pwsPa
  hour.vaporPressureKpa = pw
  hour.humidityRatio = w
  hour.windAt2mMs = wind * e.windTo2m
  hour.ghiWm2 = ghi
  hour.night = isNight
  hour.raining = series.rainMm[i] >= e.options.thresholds.rainMm
  // outputs the method may leave alone
  hour.airC = t
  hour.productC = t
  hour.productWetC = Number.NaN
  hour.mode = HourMode.active
  hour.pausedByNight = false
  hour.coveredForRain = false
  hour.uncoveredNight = false
  hour.evaporationKgPerM2H = Number.NaN
  hour.vaporConductanceKgPerM2HKpa = Number.NaN
  hour.heaterKwhPerTonne = 0
  hour.solarKwhPerTonne = 0
  hour.airFlowShare = 1
  return true
}

function markMissing(e: Engine, i: number): void {
  const c = e.columns
  if (!e.sharedSaturation) c.ambientSaturationPa[i] = Number.NaN
  c.mode[i] = HourMode.missing
  c.status[i] = HourStatus.missingData
  c.airC[i] = c.airRhPct[i] = c.productC[i] = c.surfaceRhPct[i] = c.humidityRatio[i] = Number.NaN
  c.vaporPressureKpa[i] = Number.NaN
  c.productWetC[i] = c.emcWetDb[i] = c.rateKWet[i] = c.rateNWet[i] = c.decayWetPerHour[i] = Number.NaN
  c.vaporUptakeAirDbPerH[i] = c.vaporUptakeSurfaceDbPerH[i] = Number.NaN
  c.deficitToSaturationGPerKg[i] = c.deficitToTargetGPerKg[i] = c.evaporationKgPerM2H[i] = Number.NaN
  c.emcDesorptionDb[i] = c.emcAdsorptionDb[i] = Number.NaN
  c.airCapDbPerH[i] = 0
}

/** Saturation [Pa] at the air temperature of the hour: the ambient value, the held one, or computed and held. */
function airSaturationPa(e: Engine, airC: number): number {
  const hour = e.hour
  if (airC === hour.dryBulbC) return hour.saturationPa
  if (airC === e.heldAirC) return e.heldSaturationPa
  const pa = saturationPa(airC)
  e.heldAirC = airC
  e.heldSaturationPa = pa
  return pa
}

/** Compute hour i of the series into the columns. */
function computeHour(e: Engine, i: number): void {
  if (!readAmbientHour(e, i)) return
  const { columns: c, hour } = e
  e.methodHour(hour)
  const t = hour.dryBulbC
  const tAir = hour.airC
  const tProduct = hour.productC
  c.mode[i] = hour.mode
  if (hour.vaporPressureKpa !== c.vaporPressureKpa[i]) {
    // a method that encloses its air (the greenhouse) set the inside humidity
    c.vaporPressureKpa[i] = hour.vaporPressureKpa
    c.humidityRatio[i] = hour.humidityRatio
  }
  c.airC[i] = tAir
  c.productC[i] = tProduct
  c.heaterKwhPerTonne[i] = hour.heaterKwhPerTonne
  c.solarKwhPerTonne[i] = hour.solarKwhPerTonne
  // saturation at the air and at the product surface: one exp/log per distinct temperature
  const pwsAirPa = airSaturationPa(e, tAir)
  const pw = hour.vaporPressureKpa
  c.airRhPct[i] = (100 * pw) / (pwsAirPa * 1e-3)
  const pwsSurfacePa =
    tProduct === tAir ? pwsAirPa : tProduct === t ? hour.saturationPa : saturationPa(tProduct)
  let rhSurface = (100 * pw) / (pwsSurfacePa * 1e-3)
  if (rhSurface > 100) rhSurface = 100
  c.surfaceRhPct[i] = rhSurface
  if (hour.mode === HourMode.paused) {
    // covered product or fans off: no exchange with the air, so nothing else is needed for this hour
    c.productWetC[i] = c.emcWetDb[i] = c.rateKWet[i] = c.rateNWet[i] = c.decayWetPerHour[i] = Number.NaN
    c.vaporUptakeAirDbPerH[i] = c.vaporUptakeSurfaceDbPerH[i] = Number.NaN
    c.emcDesorptionDb[i] = c.emcAdsorptionDb[i] = Number.NaN
    c.rateK[i] = c.rateN[i] = c.decayPerHour[i] = c.rewetDecayPerHour[i] = Number.NaN
    c.deficitToSaturationGPerKg[i] = c.deficitToTargetGPerKg[i] = Number.NaN
    c.evaporationKgPerM2H[i] = hour.evaporationKgPerM2H
    c.capDbPerH[i] = 0
    c.airCapDbPerH[i] = 0
    c.status[i] = e.verdict ? pausedHourStatus(hour.pausedByNight) : HourStatus.usable
    return
  }
  productHour(e, i, rhSurface, pwsSurfacePa)
}

/**
 * The columns an assessment can leave empty ({@link ColumnsKept}): the rate constant and exponent of first-order
 * (Lewis) kinetics, whose batches step by the decay column, and the energy inputs the method declares it never
 * sets; everything is kept for diagnostics (the hourly detail shows every column).
 */
function columnsKept(model: MethodModel, product: ProductResponse, diagnostics: boolean): ColumnsKept {
  if (diagnostics) return { rates: true, heater: true, solar: true }
  const energy = model.energyInputs ?? { heater: true, solar: true }
  return {
    rates: product.profile.kinetics.equation.model !== 'lewis',
    heater: energy.heater,
    solar: energy.solar,
  }
}

/** Compute every hour's conditions. Throws RangeError when the method needs coordinates the file lacks. */
export function computeHourlyConditions(
  series: HourlySeries,
  method: DryingMethod,
  product: ProductResponse,
  options: HourlyConditionsOptions,
): HourlyConditions {
  const n = series.hours
  const model = methodModel(method.kind)
  const hasCoords = series.site.latitudeDeg !== null && series.site.longitudeDeg !== null
  if (model.needs.coordinates && !hasCoords) {
    throw new RangeError(`method ${method.kind} needs the site latitude and longitude (the file has none)`)
  }
  // shared columns without the azimuth do not serve a method that needs it
  const solar =
    options.solar !== undefined && (!model.needs.sunAzimuth || options.solar.azimuthDeg.length === n)
      ? options.solar
      : computeSolarColumns(series)
  const surfaceBalance = model.exposure === 'exposed' || model.surfaceBalance === true
  const columns = allocateColumns(
    n,
    options,
    product.profile.isotherm.adsorption === undefined,
    surfaceBalance,
    surfaceBalance && model.exposure === 'forced-air',
    columnsKept(model, product, options.diagnostics !== false),
  )
  const dmPerKgFresh = 1 - options.initialWbPct / 100
  const airFlowKgPerSPerTonne = model.airFlowKgPerSPerTonne(method, options.loadingKgPerM2)
  const methodHour = model.prepare(method, {
    series,
    profile: product.profile,
    initialWbPct: options.initialWbPct,
    targetWbPct: moistureWbPctFromDb(options.targetDb),
    solar,
    thresholds: options.thresholds,
    maxProductTempC: options.maxProductTempC,
    product: {
      shape: product.profile.kinetics.shape,
      sizeMm: product.thicknessMm,
      loadingKgPerM2: options.loadingKgPerM2,
    },
  })
  const e = new Engine(
    series,
    columns,
    methodHour,
    model,
    product,
    options,
    solar.altitudeDeg,
    windSpeedAt2mMs(1, Math.max(series.site.windHeightM, 0.5)),
    hasCoords,
    options.ambientSaturationPa !== undefined,
    options.verdict !== false,
    1 / (options.loadingKgPerM2 * dmPerKgFresh), // × E [kg/m²/h]
    (airFlowKgPerSPerTonne * S_PER_HOUR) / (1000 * dmPerKgFresh), // × deficit [kg/kg]
  )
  let anyRain = false
  for (let i = 0; i < n && !anyRain; i++) if (Number.isFinite(series.rainMm[i])) anyRain = true
  const computed = new Uint8Array(n)
  // hours still to compute, in a typed array (a captured, reassigned `let` would be boxed)
  const remaining = new Int32Array(1)
  remaining[0] = n
  // The columns object itself grows into the result (Object.assign adds the fields one by one, along the object
  // shapes every assessment shares): a spread copy of ~30 fields gets a shape of its own each time, and every
  // batch function compiled for the last assessment's shape would be thrown away and compiled again.
  const result: HourlyConditions = Object.assign(columns, {
    hours: n,
    method,
    // a double placeholder, set below: the field starts with a double representation for every method (an
    // exposed method's 0 would start it as a small integer, and the next heated method's flow would retire that
    // object shape, sending every batch function compiled for it back to be compiled again, each assessment)
    airFlowKgPerSPerTonne: 0.5,
    surfaceBalance,
    capInitialDb: moistureDbFromWbPct(options.initialWbPct),
    assumedIrradianceHours: 0,
    assumedWindHours: 0,
    noRainData: !anyRain,
    ensure: (from: number, count: number, wrap: boolean): void => {
      if (remaining[0] === 0) return
      for (let k = 0; k < count; k++) {
        let i = from + k
        if (i >= n) {
          if (!wrap) return
          i %= n
        }
        if (computed[i] === 0) {
          computeHour(e, i)
          computed[i] = 1
          remaining[0]--
        }
      }
    },
  })
  result.airFlowKgPerSPerTonne = airFlowKgPerSPerTonne
  if (options.lazy !== true) result.ensure(0, n, false)
  result.assumedIrradianceHours = e.assumedIrradianceHours
  result.assumedWindHours = e.assumedWindHours
  return result
}
