/**
 * @module drying/hourly-conditions
 * For one weather series, drying method and product: the air at the product, the product's
 * temperature, both views of drying potential (humidity-ratio deficit and wet-surface evaporation),
 * the equilibrium moisture in both directions, the thin-layer step parameters, the heat added, and the
 * usable-hour verdict with its reason, for every hour. Computed once per method and reused by every
 * batch (start date) of an assessment. Columns, no allocation per hour.
 *
 * Air at the product, by method (model.md §3):
 * - open air: ambient air; the product surface is warmed by absorbed sun,
 *   ΔT = α·G / ((hc + hr)·A_s), hc = 2.8 + 3.0·u (Watmuff et al. 1977 via Duffie & Beckman, in
 *   physics/evaporation.ts), hr = 4εσT³ with ε = 0.9 (assumption), A_s the surface per tray area; at
 *   night an uncovered surface is cooled below the air by the stated sky-cooling threshold.
 * - shade: ambient air, no sun, reduced wind.
 * - solar cabinet: ambient air heated by the collector gain at constant humidity ratio
 *   (Hottel–Whillier–Bliss with inlet = ambient, Erbs split and Liu–Jordan transposition, physics/).
 * - heated: ambient air heated at constant humidity ratio to a set point or to the target RH.
 * The RH at the product surface is the air's vapour pressure over saturation at the surface temperature.
 */

import { collectorUsefulGainWm2 } from '../physics/collector.ts'
import {
  CP_DRY_AIR_KJ_PER_KG_K,
  flatPlateHeatTransferCoefficientWm2K,
  windSpeedAt2mMs,
} from '../physics/evaporation.ts'
import { netLongwaveHourlyMjM2 } from '../physics/fao56-reference-et.ts'
import {
  cosIncidenceAngle,
  diffuseHorizontalErbsWm2,
  tiltedIrradianceIsotropicWm2,
} from '../physics/irradiance.ts'
import { moistAirEnthalpyKjPerKg } from '../physics/moist-air.ts'
import { lnSaturationPressureLiquidPa } from '../physics/saturation.ts'
import type { HourlySeries } from '../weather/series.ts'
import { adiabaticHumidityRatioAtRhInto, heatedDryBulbForTargetRhC } from './air-processes.ts'
import type { DryingMethod } from './method.ts'
import { EMC_RH_CAP_PCT, firstOrderRateConstant, type ProductResponse } from './product-response.ts'
import { computeSolarColumns, type SolarColumns } from './solar-columns.ts'
import { type DryingThresholds, HourStatus } from './thresholds.ts'
import { wetSurfaceEvaporationInto } from './wet-surface.ts'

export { computeSolarColumns, type SolarColumns } from './solar-columns.ts'

import { KELVIN_OFFSET } from '../physics/constants.ts'

export { wetSurfaceEvaporation } from './wet-surface.ts'

/** Emissivity of a moist product surface for the radiative coefficient hr (assumption, 0.9; from memory). */
export const PRODUCT_EMISSIVITY = 0.9
/** Stefan–Boltzmann constant [W m⁻² K⁻⁴] (CODATA 2018). */
const STEFAN_BOLTZMANN_W = 5.670374419e-8
/** Wind [m/s] assumed when the file has none for an hour (calm-ish air; assumption, no source). */
export const DEFAULT_WIND_MS = 1

/** What an hour does to the product in a batch. */
export const HourMode = { active: 0, paused: 1, rainExposed: 2, missing: 3 } as const

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

export interface HourlyConditions {
  hours: number
  /** Make sure hours from..from+count−1 (wrapping past the end when `wrap`) are computed (lazy conditions). */
  ensure: (from: number, count: number, wrap: boolean) => void
  method: DryingMethod
  /** Air temperature at the product [°C] (after collector or heater). */
  airC: Float64Array
  /** RH of that air [%]. */
  airRhPct: Float64Array
  /** Product (surface) temperature [°C]. */
  productC: Float64Array
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
  /** Most water the hour can remove [kg per kg dry matter per h]: the constant-rate limit. */
  capDbPerH: Float64Array
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
  /** Dry-air flow per tonne of fresh product [kg/s]; 0 for exposed methods. */
  airFlowKgPerSPerTonne: number
  /** {@link HourMode} per hour. */
  mode: Uint8Array
  /** {@link HourStatus} per hour (0 = usable). */
  status: Uint8Array
  /** 1 at night (sun below the threshold altitude). */
  night: Uint8Array
  /** Hours whose irradiance or wind was missing and was taken as 0 W/m² / {@link DEFAULT_WIND_MS} (hours computed when the object was returned). */
  assumedIrradianceHours: number
  assumedWindHours: number
  /** True when the series had no rain column values at all. */
  noRainData: boolean
}

function alloc(n: number): Float64Array {
  return new Float64Array(n)
}

/** Default collector azimuth: facing the equator (180° in the north, 0° in the south). */
function equatorFacingAzimuthDeg(latDeg: number): number {
  return latDeg >= 0 ? 180 : 0
}

/** Compute every hour's conditions. Throws RangeError when the method needs coordinates the file lacks. */
export function computeHourlyConditions(
  series: HourlySeries,
  method: DryingMethod,
  product: ProductResponse,
  options: HourlyConditionsOptions,
): HourlyConditions {
  const n = series.hours
  const { thresholds, targetDb } = options
  const lat = series.site.latitudeDeg
  const lon = series.site.longitudeDeg
  const hasCoords = lat !== null && lon !== null
  if (method.kind === 'solar-cabinet' && !hasCoords) {
    throw new RangeError('method solar-cabinet needs the site latitude and longitude (the file has none)')
  }
  // shared columns without the azimuth do not serve a solar cabinet
  const solar =
    options.solar !== undefined && (method.kind !== 'solar-cabinet' || options.solar.azimuthDeg.length === n)
      ? options.solar
      : computeSolarColumns(series)
  const { altitudeDeg: altitude, azimuthDeg: azimuth, raWm2, rsOverRso } = solar

  const verdict = options.verdict !== false
  const diagnostics = options.diagnostics !== false
  // Columns not kept are empty: stores past the end of a typed array are ignored, so the hour code
  // below is the same either way.
  const nDiagnostic = diagnostics ? n : 0
  const nMonthly = diagnostics || verdict ? n : 0
  const sharedSaturation = options.ambientSaturationPa
  if (sharedSaturation !== undefined && sharedSaturation.length !== n) {
    throw new RangeError(`ambient saturation column must hold ${n} values, got ${sharedSaturation.length}`)
  }
  const ambientSaturationPa = sharedSaturation ?? alloc(n)
  const airC = alloc(n)
  const airRhPct = alloc(nDiagnostic)
  const productC = alloc(n)
  const surfaceRhPct = alloc(nDiagnostic)
  const humidityRatio = alloc(nDiagnostic)
  const deficitToSaturationGPerKg = alloc(nDiagnostic)
  const deficitToTargetGPerKg = alloc(nMonthly)
  const evaporationKgPerM2H = alloc(nMonthly)
  const capDbPerH = alloc(n)
  const emcDesorptionDb = alloc(n)
  // one isotherm for both directions: the two columns are one array (same values, half the memory)
  const emcAdsorptionDb = product.profile.isotherm.adsorption === undefined ? emcDesorptionDb : alloc(n)
  const rateK = alloc(n)
  const rateN = alloc(n)
  const decayPerHour = alloc(n)
  const rewetDecayPerHour = alloc(n)
  const heaterKwhPerTonne = alloc(n)
  const solarKwhPerTonne = alloc(n)
  const mode = new Uint8Array(n)
  const status = new Uint8Array(n)
  const night = new Uint8Array(n)
  const step = new Float64Array(2)
  // [EMC desorption, EMC adsorption, k, n] of the hour
  const response = new Float64Array(4)
  const hourResponse = product.hourResponse
  if (options.lazy === true) {
    // hours not yet computed read as missing temperatures, never as 0 °C
    airC.fill(Number.NaN)
    productC.fill(Number.NaN)
    if (sharedSaturation === undefined) ambientSaturationPa.fill(Number.NaN)
  }

  const dmPerKgFresh = 1 - options.initialWbPct / 100
  const sameIsotherm = product.profile.isotherm.adsorption === undefined
  const exposed = method.kind === 'open-air' || method.kind === 'shade'
  const airFlowKgPerSPerTonne =
    method.kind === 'solar-cabinet'
      ? method.collectorAreaM2PerTonne * method.airFlowKgPerSPerM2
      : method.kind === 'heated'
        ? method.airFlowKgPerSPerTonne
        : 0
  const forcedCapFactor = (airFlowKgPerSPerTonne * 3600) / (1000 * dmPerKgFresh) // × deficit [kg/kg]
  const exposedCapFactor = 1 / (options.loadingKgPerM2 * dmPerKgFresh) // × E [kg/m²/h]
  const maxT = options.maxProductTempC
  const collectorAzimuth =
    method.kind === 'solar-cabinet' ? (method.azimuthDeg ?? equatorFacingAzimuthDeg(lat ?? 0)) : 0
  const collectorParams =
    method.kind === 'solar-cabinet'
      ? { interceptFrTauAlpha: method.frTauAlpha, lossSlopeFrUlWm2K: method.frUlWm2K }
      : null
  let assumedIrradianceHours = 0
  let assumedWindHours = 0
  let anyRain = false
  for (let i = 0; i < n && !anyRain; i++) if (Number.isFinite(series.rainMm[i])) anyRain = true
  // Previous hour's cooling along the adiabatic path: the start of this hour's solver (hours are alike).
  // [0] to saturation, [1] to the target ERH. Kept in a typed array, not in captured `let` doubles, which
  // V8 would box (one heap allocation per hour).
  const depressionK = new Float64Array(2)
  // [temperature °C, exp(ln pws) Pa] of the last heated or damped air temperature evaluated
  const heldSaturation = new Float64Array(2)
  // in/out of the adiabatic solver (air-processes.ts adiabaticHumidityRatioAtRhInto)
  const solverIo = new Float64Array(7)
  // in/out of the wet-surface evaporation (wet-surface.ts wetSurfaceEvaporationInto)
  const evaporationIo = new Float64Array(8)
  // small enough for V8 to inline into the hour: the doubles go through the array
  const wetSurfaceAt = (
    rn: number,
    airC: number,
    pw: number,
    p: number,
    w: number,
    u: number,
    saturationPa: number,
  ): number => {
    evaporationIo[0] = rn
    evaporationIo[1] = airC
    evaporationIo[2] = pw
    evaporationIo[3] = p
    evaporationIo[4] = w
    evaporationIo[5] = u
    evaporationIo[6] = saturationPa
    wetSurfaceEvaporationInto(evaporationIo)
    return evaporationIo[7]
  }
  heldSaturation[0] = Number.NaN

  // FAO-56 eq 47 is linear in the wind: its height factors are computed once.
  const windTo2m = windSpeedAt2mMs(1, Math.max(series.site.windHeightM, 0.5))
  // wind at the product height from the 2 m wind, eq 47 inverted (log profile over short grass)
  const windAtProductPer2m =
    method.kind === 'open-air' ? Math.log(67.8 * method.productHeightM - 5.42) / 4.87 : 1
  const computeHour = (i: number): void => {
    const t = series.dryBulbC[i]
    const rh = series.relativeHumidityPct[i]
    const p = series.pressureKpa[i]
    const isNight = hasCoords ? altitude[i] < thresholds.nightSunAltitudeDeg : !(series.ghiWm2[i] > 0)
    night[i] = isNight ? 1 : 0
    if (!(t >= -60 && t <= 70) || !(rh > 0 && rh <= 100) || !(p >= 30 && p <= 110)) {
      if (sharedSaturation === undefined) ambientSaturationPa[i] = Number.NaN
      mode[i] = HourMode.missing
      status[i] = HourStatus.missingData
      airC[i] = airRhPct[i] = productC[i] = surfaceRhPct[i] = humidityRatio[i] = Number.NaN
      deficitToSaturationGPerKg[i] = deficitToTargetGPerKg[i] = evaporationKgPerM2H[i] = Number.NaN
      emcDesorptionDb[i] = emcAdsorptionDb[i] = Number.NaN
      return
    }
    let ghi = series.ghiWm2[i]
    if (!Number.isFinite(ghi)) {
      if (!isNight) assumedIrradianceHours++
      ghi = 0
    } else if (ghi < 0) ghi = 0
    let wind = series.windMs[i]
    if (!(wind >= 0)) {
      assumedWindHours++
      wind = DEFAULT_WIND_MS
    }
    const rain = series.rainMm[i]
    const raining = rain >= thresholds.rainMm
    const u2 = wind * windTo2m
    let pwsPa: number
    if (sharedSaturation !== undefined) pwsPa = sharedSaturation[i]
    else {
      pwsPa = Math.exp(lnSaturationPressureLiquidPa(t + KELVIN_OFFSET))
      ambientSaturationPa[i] = pwsPa
    }
    const pws = pwsPa * 1e-3
    const pw = (rh / 100) * pws
    const w = (0.621945 * pw) / (p - pw)
    humidityRatio[i] = w

    let tAir = t
    let tProduct = t
    let hourMode: number = HourMode.active
    let pausedByNight = false
    let coveredForRain = false
    let uncoveredNight = false
    let evaporation = Number.NaN
    switch (method.kind) {
      case 'open-air': {
        if (method.coveredAtNight && isNight) {
          hourMode = HourMode.paused
          pausedByNight = true
        } else if (raining && method.coveredInRain) {
          hourMode = HourMode.paused
          coveredForRain = true
        } else if (raining) hourMode = HourMode.rainExposed
        const uProduct = u2 * windAtProductPer2m
        const tK = t + KELVIN_OFFSET
        const hr = 4 * PRODUCT_EMISSIVITY * STEFAN_BOLTZMANN_W * tK * tK * tK
        const absorbed = method.absorptivity * ghi
        if (isNight) {
          uncoveredNight = !method.coveredAtNight
          tProduct = t - thresholds.nightSurfaceCoolingK
        } else {
          tProduct =
            t +
            absorbed / ((flatPlateHeatTransferCoefficientWm2K(uProduct) + hr) * method.surfaceAreaPerTrayArea)
        }
        if (hourMode !== HourMode.paused) {
          const rnl = (netLongwaveHourlyMjM2(t, pw, rsOverRso[i]) * 1e6) / 3600
          evaporation = wetSurfaceAt(absorbed - rnl, t, pw, p, w, u2, pwsPa)
        }
        break
      }
      case 'shade': {
        const u = Math.max(method.minimumAirSpeedMs, method.windFraction * u2)
        evaporation = wetSurfaceAt(0, t, pw, p, w, u, pwsPa)
        break
      }
      case 'solar-cabinet': {
        let gTilt = 0
        if (!isNight && ghi > 0) {
          const diffuse = diffuseHorizontalErbsWm2(ghi, raWm2[i])
          const zenith = 90 - altitude[i]
          const cosZ = Math.cos((zenith * Math.PI) / 180)
          const cosInc = cosIncidenceAngle(zenith, azimuth[i], method.tiltDeg, collectorAzimuth)
          gTilt = tiltedIrradianceIsotropicWm2(
            ghi - diffuse,
            diffuse,
            cosZ,
            cosInc,
            method.tiltDeg,
            method.groundAlbedo,
          )
        }
        const fansOn = !method.fansOnlyInSun || gTilt >= thresholds.collectorOnWm2
        if (!fansOn) {
          hourMode = HourMode.paused
          pausedByNight = true
        }
        const gain = collectorParams && gTilt > 0 ? collectorUsefulGainWm2(collectorParams, gTilt, t, t) : 0
        if (fansOn && gain > 0) {
          const cp = (CP_DRY_AIR_KJ_PER_KG_K + 1.86 * w) * 1000
          tAir = t + gain / (method.airFlowKgPerSPerM2 * cp)
          let used = 1
          if (maxT !== null && tAir > maxT && t < maxT) {
            // a damper mixes in ambient air to hold the product limit (common practice, no source)
            used = (maxT - t) / (tAir - t)
            tAir = maxT
          }
          solarKwhPerTonne[i] = (used * gain * method.collectorAreaM2PerTonne) / 1000
        }
        tProduct = tAir
        break
      }
      case 'heated': {
        let tHeat =
          method.setPointC !== undefined
            ? Math.max(t, method.setPointC)
            : Math.max(heatedDryBulbForTargetRhC(t, w, p, method.targetRhPct), method.minAirC)
        if (maxT !== null && tHeat > maxT) tHeat = Math.max(t, maxT)
        if (tHeat > 100) tHeat = 100
        tAir = tHeat
        tProduct = tHeat
        heaterKwhPerTonne[i] =
          airFlowKgPerSPerTonne * (moistAirEnthalpyKjPerKg(tHeat, w) - moistAirEnthalpyKjPerKg(t, w)) // kW → kWh in 1 h
        break
      }
    }
    mode[i] = hourMode
    airC[i] = tAir
    productC[i] = tProduct
    // saturation at the air and at the product surface: one exp/log per distinct temperature
    // A heater or damper often holds the same air temperature hour after hour (the backup's lowest air
    // temperature, a set point, the product limit): its saturation is kept from the last such hour.
    let pwsAirPa: number
    if (tAir === t) pwsAirPa = pwsPa
    else if (tAir === heldSaturation[0]) pwsAirPa = heldSaturation[1]
    else {
      pwsAirPa = Math.exp(lnSaturationPressureLiquidPa(tAir + KELVIN_OFFSET))
      heldSaturation[0] = tAir
      heldSaturation[1] = pwsAirPa
    }
    airRhPct[i] = (100 * pw) / (pwsAirPa * 1e-3)
    const pwsSurfacePa =
      tProduct === tAir
        ? pwsAirPa
        : tProduct === t
          ? pwsPa
          : Math.exp(lnSaturationPressureLiquidPa(tProduct + KELVIN_OFFSET))
    const pwsSurface = pwsSurfacePa * 1e-3
    let rhSurface = (100 * pw) / pwsSurface
    if (rhSurface > 100) rhSurface = 100
    surfaceRhPct[i] = rhSurface
    if (hourMode === HourMode.paused) {
      // covered product or fans off: no exchange with the air, so nothing else is needed for this hour
      emcDesorptionDb[i] = emcAdsorptionDb[i] = Number.NaN
      rateK[i] = rateN[i] = decayPerHour[i] = rewetDecayPerHour[i] = Number.NaN
      deficitToSaturationGPerKg[i] = deficitToTargetGPerKg[i] = Number.NaN
      evaporationKgPerM2H[i] = evaporation
      capDbPerH[i] = 0
      status[i] = !verdict
        ? HourStatus.usable
        : pausedByNight
          ? HourStatus.nightWithoutDrying
          : HourStatus.rain
      return
    }
    const rhForEmc = Math.min(rhSurface, EMC_RH_CAP_PCT)
    if (hourResponse !== undefined) hourResponse(tProduct, rhForEmc, response)
    else {
      response[0] = product.emcDesorptionDb(tProduct, rhForEmc)
      response[1] = sameIsotherm ? response[0] : product.emcAdsorptionDb(tProduct, rhForEmc)
      product.stepParameters(tProduct, rhForEmc, step)
      response[2] = step[0]
      response[3] = step[1]
    }
    const k = response[2]
    const nExp = response[3]
    emcDesorptionDb[i] = response[0]
    emcAdsorptionDb[i] = sameIsotherm ? response[0] : response[1]
    rateK[i] = k
    rateN[i] = nExp
    decayPerHour[i] = nExp === 1 ? Math.exp(-k) : Number.NaN
    rewetDecayPerHour[i] = Math.exp(
      -product.rewettingRateFactor * firstOrderRateConstant(k, nExp, product.thompsonTimeScale),
    )
    // Deficits are taken for air at the product temperature (it is what touches the product).
    // Deficit to saturation: the forced-air constant-rate limit. Exposed methods use the Penman rate as
    // their limit and skip it (NaN), which saves a solver per hour.
    let dSat = Number.NaN
    if (!exposed) {
      if (rhSurface >= 100) dSat = 0
      else {
        solverIo[0] = tProduct
        solverIo[1] = w
        solverIo[2] = p
        solverIo[3] = 1
        solverIo[4] = tProduct - depressionK[0]
        solverIo[5] = pwsSurfacePa
        adiabaticHumidityRatioAtRhInto(solverIo)
        dSat = solverIo[6] - w
      }
      if (dSat > 0) depressionK[0] = tProduct - adiabaticEndC(tProduct, w, dSat)
    }
    deficitToSaturationGPerKg[i] = 1000 * dSat
    const erhTarget = verdict ? product.erhPct(tProduct, targetDb) : Number.NaN
    let dTarget = Number.NaN
    if (verdict) {
      if (rhSurface >= erhTarget) dTarget = 0
      else {
        solverIo[0] = tProduct
        solverIo[1] = w
        solverIo[2] = p
        solverIo[3] = erhTarget / 100
        solverIo[4] = tProduct - depressionK[1]
        solverIo[5] = pwsSurfacePa
        adiabaticHumidityRatioAtRhInto(solverIo)
        dTarget = solverIo[6] - w
      }
      if (dTarget > 0) depressionK[1] = tProduct - adiabaticEndC(tProduct, w, dTarget)
    }
    deficitToTargetGPerKg[i] = 1000 * dTarget
    evaporationKgPerM2H[i] = evaporation
    capDbPerH[i] = exposed ? Math.max(0, evaporation) * exposedCapFactor : dSat * forcedCapFactor

    // Usable-hour test, reasons in the order of HourStatus.
    let s: number = HourStatus.usable
    if (!verdict) s = HourStatus.usable
    else if (pausedByNight) s = HourStatus.nightWithoutDrying
    else if (coveredForRain || hourMode === HourMode.rainExposed) s = HourStatus.rain
    else if (tProduct < thresholds.minProductTempC) s = HourStatus.tooCold
    else if (maxT !== null && tProduct > maxT) s = HourStatus.aboveProductTempLimit
    else if (uncoveredNight && rhSurface >= 100) s = HourStatus.dewRisk
    else if (rhSurface >= erhTarget || 1000 * dTarget < thresholds.minDeficitGPerKg) s = HourStatus.tooHumid
    status[i] = s
  }
  const computed = new Uint8Array(n)
  // hours still to compute, in a typed array (a captured, reassigned `let` would be boxed)
  const remaining = new Int32Array(1)
  remaining[0] = n
  const ensure = (from: number, count: number, wrap: boolean): void => {
    if (remaining[0] === 0) return
    for (let k = 0; k < count; k++) {
      let i = from + k
      if (i >= n) {
        if (!wrap) return
        i %= n
      }
      if (computed[i] === 0) {
        computeHour(i)
        computed[i] = 1
        remaining[0]--
      }
    }
  }
  if (options.lazy !== true) ensure(0, n, false)
  return {
    hours: n,
    ensure,
    method,
    ambientSaturationPa,
    airC,
    airRhPct,
    productC,
    surfaceRhPct,
    humidityRatio,
    deficitToSaturationGPerKg,
    deficitToTargetGPerKg,
    evaporationKgPerM2H,
    capDbPerH,
    emcDesorptionDb,
    emcAdsorptionDb,
    rateK,
    rateN,
    decayPerHour,
    rewetDecayPerHour,
    heaterKwhPerTonne,
    solarKwhPerTonne,
    airFlowKgPerSPerTonne,
    mode,
    status,
    night,
    assumedIrradianceHours,
    assumedWindHours,
    noRainData: !anyRain,
  }
}

/** Temperature [°C] at the end of the adiabatic (constant-enthalpy) path from (tC, w) after taking up dW. */
function adiabaticEndC(tC: number, w: number, dW: number): number {
  const h = 1.006 * tC + w * (2501 + 1.86 * tC)
  const wEnd = w + dW
  return (h - 2501 * wEnd) / (1.006 + 1.86 * wEnd)
}
