/**
 * @module physics/fao56-reference-et
 * FAO-56 hourly reference evapotranspiration (Allen, Pereira, Raes & Smith 1998, *Crop
 * evapotranspiration*, FAO Irrigation and Drainage Paper 56, ch. 3–4, eq 53) and the FAO-56 forms of
 * its building blocks: pressure (eq 7), Tetens saturation pressure (eq 11) and slope (eq 13), γ (eq 8),
 * net longwave (eq 39 hourly form), net radiation (eqs 38, 40), soil heat flux (eqs 45–46).
 *
 * These FAO forms exist so that FAO-56 Example 19 checks the chain at its published rounding; the drying
 * engine's own wet-surface evaporation (./evaporation.ts) uses Hyland–Wexler saturation instead.
 * Units: MJ m⁻² h⁻¹, kPa, °C, m/s, mm/h.
 */

import { dayOfYearAt } from './calendar.ts'
import { extraterrestrialRadiationPeriodMjM2, fao56HourAngleRad } from './fao56-solar.ts'
import { clearSkyRadiationFao56 } from './irradiance.ts'
import { power } from './power.ts'

/** Stefan–Boltzmann constant per hour [MJ K⁻⁴ m⁻² h⁻¹] = 4.903×10⁻⁹/24; FAO-56 eq 39 hourly form. */
export const STEFAN_BOLTZMANN_MJ_PER_HOUR = 2.043e-10
/** Albedo of the grass reference crop [–]; FAO-56 eq 38. */
export const GRASS_REFERENCE_ALBEDO = 0.23
/** Rs/Rso used at night when no daytime ratio is known yet; FAO-56 Example 19 assumes 0.8. */
export const NIGHT_RS_RSO_DEFAULT = 0.8
/**
 * Sun altitude above which an hour's Rs/Rso is kept for the following night [°]: 0.3 rad, the ASCE-EWRI (2005)
 * eq 45 threshold (as in WSWUP/RefET `fcd_hourly`).
 */
export const RS_RSO_CARRY_MIN_ALTITUDE_DEG = (0.3 * 180) / Math.PI

/** Atmospheric pressure [kPa] at elevation z [m], FAO-56 eq 7: 101.3 [(293 − 0.0065 z)/293]^5.26. Example 2: 1800 m → 81.8. */
export function atmosphericPressureFao56Kpa(elevationM: number): number {
  if (!(elevationM >= -500 && elevationM <= 9000)) {
    throw new RangeError(`elevation must be between -500 and 9000 m, got ${elevationM}`)
  }
  return 101.3 * power((293 - 0.0065 * elevationM) / 293, 5.26)
}

/** Saturation vapour pressure [kPa], FAO-56 eq 11 (Tetens form): 0.6108 exp(17.27 T/(T + 237.3)). */
export function saturationVaporPressureFao56Kpa(tC: number): number {
  if (!(tC >= -50 && tC <= 100)) throw new RangeError(`temperature must be between -50 and 100 °C, got ${tC}`)
  return 0.6108 * Math.exp((17.27 * tC) / (tC + 237.3))
}

/** Slope of the saturation curve Δ [kPa/°C], FAO-56 eq 13: 4098 e°(T)/(T + 237.3)². Example 17: 30.2 °C → 0.246. */
export function saturationSlopeFao56KpaPerC(tC: number): number {
  return (4098 * saturationVaporPressureFao56Kpa(tC)) / (tC + 237.3) ** 2
}

/** Psychrometric constant γ [kPa/°C] = 0.665×10⁻³ P, FAO-56 eq 8 with λ = 2.45 MJ/kg. Example 2: 81.8 kPa → 0.054. */
export function psychrometricConstantFao56KpaPerC(pressureKpa: number): number {
  if (!(pressureKpa >= 30 && pressureKpa <= 110)) {
    throw new RangeError(`pressure must be between 30 and 110 kPa, got ${pressureKpa}`)
  }
  return 0.665e-3 * pressureKpa
}

/**
 * Ratio Rs/Rso [–] for eq 39, limited to 0.3…1 (FAO-56 eq 39 requires Rs/Rso ≤ 1; the lower limit 0.3 is
 * ASCE-EWRI (2005) eq 45, as in WSWUP/RefET `fcd_hourly`). NaN when Rso is 0 (night): use the evening value.
 */
export function shortwaveRatio(rs: number, rso: number): number {
  if (!(rso > 0)) return Number.NaN
  const r = rs / rso
  return r > 1 ? 1 : Math.max(r, 0.3)
}

/**
 * Net outgoing longwave radiation for an hour [MJ m⁻² h⁻¹], FAO-56 eq 39 hourly form:
 * Rnl = σ T⁴ (0.34 − 0.14 √ea)(1.35 Rs/Rso − 0.35), σ = 2.043×10⁻¹⁰, T the mean hourly air temperature
 * [°C → K], ea [kPa], and `rsOverRso` the ratio of the hour or, at night, of the hours before sunset
 * (FAO-56 ch. 4; see {@link fillNightShortwaveRatioColumn}).
 */
export function netLongwaveHourlyMjM2(airTempC: number, vaporPressureKpa: number, rsOverRso: number): number {
  if (!(rsOverRso >= 0 && rsOverRso <= 1))
    throw new RangeError(`Rs/Rso must be between 0 and 1, got ${rsOverRso}`)
  if (!(vaporPressureKpa >= 0))
    throw new RangeError(`vapour pressure must be >= 0 kPa, got ${vaporPressureKpa}`)
  const tK = airTempC + 273.16 // FAO-56 eq 39: K = °C + 273.16
  return (
    STEFAN_BOLTZMANN_MJ_PER_HOUR *
    tK ** 4 *
    (0.34 - 0.14 * Math.sqrt(vaporPressureKpa)) *
    (1.35 * rsOverRso - 0.35)
  )
}

/**
 * Fill `out[i]` with the Rs/Rso ratio to use in eq 39 for hour i: the hour's own ratio by day, and at night
 * (Rso = 0, or sun altitude below {@link RS_RSO_CARRY_MIN_ALTITUDE_DEG}) the ratio of the last hour with the sun
 * above that altitude, as FAO-56 ch. 4 asks ("Rs/Rso from 2–3 hours before sunset"); before any such hour,
 * {@link NIGHT_RS_RSO_DEFAULT}. Inputs in any one energy unit; NaN Rs carries the previous ratio.
 * No allocation. Returns the number of values written.
 */
export function fillNightShortwaveRatioColumn(
  rs: Float64Array,
  rso: Float64Array,
  sunAltitudeDeg: Float64Array,
  out: Float64Array,
): number {
  const n = rs.length
  if (rso.length < n || sunAltitudeDeg.length < n || out.length < n) {
    throw new RangeError(`Rs/Rso columns must all hold ${n} values`)
  }
  let carried = NIGHT_RS_RSO_DEFAULT
  for (let i = 0; i < n; i++) {
    const own = shortwaveRatio(rs[i], rso[i])
    if (sunAltitudeDeg[i] >= RS_RSO_CARRY_MIN_ALTITUDE_DEG && Number.isFinite(own)) {
      carried = own
      out[i] = own
    } else if (Number.isFinite(own) && sunAltitudeDeg[i] > 0) {
      out[i] = own // low sun: the hour's own ratio, but not kept for the night
    } else {
      out[i] = carried
    }
  }
  return n
}

/** Soil heat flux for an hour over grass [MJ m⁻² h⁻¹]: 0.1 Rn by day (FAO-56 eq 45), 0.5 Rn at night (eq 46). */
export function soilHeatFluxHourlyMjM2(netRadiation: number, isDaytime: boolean): number {
  return (isDaytime ? 0.1 : 0.5) * netRadiation
}

/**
 * Hourly grass reference evapotranspiration ETo [mm/h], FAO-56 eq 53:
 * ETo = [0.408 Δ (Rn − G) + γ 37/(T + 273) u2 (e°(T) − ea)] / [Δ + γ (1 + 0.34 u2)].
 * Rn, G [MJ m⁻² h⁻¹], T [°C], u2 [m/s], e°, ea [kPa], Δ, γ [kPa/°C].
 */
export function referenceEtHourlyFao56MmPerH(
  netRadiationMjM2: number,
  soilHeatFluxMjM2: number,
  airTempC: number,
  windAt2mMs: number,
  saturationVaporPressureKpa: number,
  vaporPressureKpa: number,
  slopeKpaPerC: number,
  psychrometricKpaPerC: number,
): number {
  if (!(windAt2mMs >= 0)) throw new RangeError(`wind speed at 2 m must be >= 0 m/s, got ${windAt2mMs}`)
  const numerator =
    0.408 * slopeKpaPerC * (netRadiationMjM2 - soilHeatFluxMjM2) +
    psychrometricKpaPerC *
      (37 / (airTempC + 273)) *
      windAt2mMs *
      (saturationVaporPressureKpa - vaporPressureKpa)
  return numerator / (slopeKpaPerC + psychrometricKpaPerC * (1 + 0.34 * windAt2mMs))
}

/** Inputs of {@link referenceEtHourlyFao56} as FAO-56 Example 19 states them. */
export interface Fao56HourlyInput {
  latitudeDeg: number
  /** Site longitude, degrees WEST of Greenwich (FAO-56 eq 31 convention). */
  longitudeWestDeg: number
  /** Longitude of the centre of the time zone, degrees WEST of Greenwich. */
  timeZoneCentreWestDeg: number
  elevationM: number
  /** Calendar date of the hour (local standard time); only month and day and year are used. */
  year: number
  month: number
  day: number
  /** Standard clock time of the middle of the hour [h], 14.5 for 14:00–15:00. */
  clockHourMid: number
  airTempC: number
  relativeHumidityPct: number
  windAt2mMs: number
  /** Measured solar radiation for the hour [MJ m⁻² h⁻¹]. */
  solarRadiationMjM2: number
  /** Rs/Rso to use if the hour is at night (FAO-56: from 2–3 h before sunset); default 0.8. */
  nightShortwaveRatio?: number
}

/** Every intermediate of the FAO-56 hourly chain, for checks and reports. */
export interface Fao56HourlyResult {
  dayOfYear: number
  pressureKpa: number
  psychrometricKpaPerC: number
  slopeKpaPerC: number
  saturationVaporPressureKpa: number
  vaporPressureKpa: number
  hourAngleRad: number
  extraterrestrialMjM2: number
  clearSkyMjM2: number
  shortwaveRatio: number
  netShortwaveMjM2: number
  netLongwaveMjM2: number
  netRadiationMjM2: number
  soilHeatFluxMjM2: number
  referenceEtMmPerH: number
}

/**
 * The whole FAO-56 hourly chain (eqs 7, 8, 11, 13, 23–25, 28–33, 37–40, 45–46, 53, 54) for one hour, with
 * its intermediates. Convenience for checks and one-off use; the engine calls the parts.
 */
export function referenceEtHourlyFao56(input: Fao56HourlyInput): Fao56HourlyResult {
  const j = dayOfYearAt(Date.UTC(input.year, input.month - 1, input.day))
  const pressureKpa = atmosphericPressureFao56Kpa(input.elevationM)
  const gamma = psychrometricConstantFao56KpaPerC(pressureKpa)
  const es = saturationVaporPressureFao56Kpa(input.airTempC)
  if (!(input.relativeHumidityPct >= 0 && input.relativeHumidityPct <= 100)) {
    throw new RangeError(`relative humidity must be between 0 and 100 %, got ${input.relativeHumidityPct}`)
  }
  const ea = (es * input.relativeHumidityPct) / 100 // eq 54
  const slope = saturationSlopeFao56KpaPerC(input.airTempC)
  const w = fao56HourAngleRad(input.clockHourMid, input.timeZoneCentreWestDeg, input.longitudeWestDeg, j)
  const ra = extraterrestrialRadiationPeriodMjM2((input.latitudeDeg * Math.PI) / 180, j, w, 1)
  const rso = clearSkyRadiationFao56(ra, input.elevationM)
  const daytime = ra > 0
  const ratio = daytime
    ? shortwaveRatio(input.solarRadiationMjM2, rso)
    : (input.nightShortwaveRatio ?? NIGHT_RS_RSO_DEFAULT)
  const rns = (1 - GRASS_REFERENCE_ALBEDO) * input.solarRadiationMjM2 // eq 38
  const rnl = netLongwaveHourlyMjM2(input.airTempC, ea, ratio)
  const rn = rns - rnl // eq 40
  const g = soilHeatFluxHourlyMjM2(rn, daytime)
  return {
    dayOfYear: j,
    pressureKpa,
    psychrometricKpaPerC: gamma,
    slopeKpaPerC: slope,
    saturationVaporPressureKpa: es,
    vaporPressureKpa: ea,
    hourAngleRad: w,
    extraterrestrialMjM2: ra,
    clearSkyMjM2: rso,
    shortwaveRatio: ratio,
    netShortwaveMjM2: rns,
    netLongwaveMjM2: rnl,
    netRadiationMjM2: rn,
    soilHeatFluxMjM2: g,
    referenceEtMmPerH: referenceEtHourlyFao56MmPerH(
      rn,
      g,
      input.airTempC,
      input.windAt2mMs,
      es,
      ea,
      slope,
      gamma,
    ),
  }
}
