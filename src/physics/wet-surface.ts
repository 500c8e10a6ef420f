/**
 * @module physics/wet-surface
 * Evaporation from a wet surface (free water on a product, open water) by the Penman combination equation
 * in resistance form with no surface resistance (Penman 1948; Monteith 1965 resistance form; FAO-56 eq 3
 * with rs = 0, Allen et al. 1998), with the properties of the air from this physics layer: saturation
 * pressure and its slope from Hyland–Wexler over liquid water (ASHRAE HOF 2017 ch. 1 eq 6), density from
 * the perfect-gas relations (eqs 11, 26), c_p of the moist air (eq 30 per kg of moist air), λ(T) of FAO-56
 * Annex 3 and γ of FAO-56 eq 8 in its general form (./evaporation.ts).
 *
 * The aerodynamic resistance is either given, or taken from the Penman (1948) open-water wind function
 * f(u) = 2.626 + 1.381 u2 [mm d⁻¹ kPa⁻¹] (McMahon et al. 2013, HESS 17:1331, Supplement eq S4.11) converted
 * to a resistance by ra = ρa·cp/(γ·λ·f(u)) (Supplement S11.23), with ρa, cp and γ of the air at the
 * caller's humidity ratio.
 *
 * One kernel, {@link solveWetSurface} on a {@link WetSurface} reused for every hour of a loop (no number
 * is boxed on the call); the scalar functions below fill a module scratch object and call it, so the hot
 * loop and the plain functions give the same bits. Units: °C, kPa, W/m² (hour mean), s/m, m/s,
 * kg m⁻² h⁻¹ (= mm/h of water). Negative flux or evaporation: condensation (dew) on the surface.
 */
import { KELVIN_OFFSET } from './constants.ts'
import {
  aerodynamicResistanceFromWindFunctionSPerM,
  evaporationKgPerM2HFromLatentFlux,
  latentHeatVaporizationMjPerKg,
  penmanMonteithLatentFlux,
  psychrometricConstantKpaPerC,
  windFunctionPenman1948MmPerDayKpa,
} from './evaporation.ts'
import {
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  checkPressure,
  humidityRatioFromVaporPressure,
  moistAirDensityKgPerM3,
} from './moist-air.ts'
import {
  dLnSaturationPressureLiquidDT,
  SATURATION_MAX_C,
  SATURATION_MIN_C,
  saturationVaporPressureLiquidKpa,
} from './saturation.ts'

/** In and out of {@link solveWetSurface}. */
export class WetSurface {
  /** Available energy at the surface, net radiation minus heat into the product [W/m²]. */
  availableEnergyWm2 = Number.NaN
  /** Air (and surface) temperature [°C]. */
  airC = Number.NaN
  /** Actual vapour pressure of the air [kPa]. */
  vaporPressureKpa = Number.NaN
  /** Total (station) pressure [kPa]. */
  pressureKpa = Number.NaN
  /** exp(ln pws(airC)) [Pa] (eq 6) when the caller has it; NaN: computed with a range check. */
  saturationPa = Number.NaN
  /** Aerodynamic resistance [s/m]; NaN: from the Penman (1948) wind function at {@link windAt2mMs}. */
  aerodynamicResistanceSPerM = Number.NaN
  /** Wind at 2 m [m/s], for the wind function. */
  windAt2mMs = Number.NaN
  /**
   * Humidity ratio [kg/kg] at which ρa, cp and γ of the wind-function conversion are taken (the caller's
   * value of the hour); NaN: that of the vapour pressure.
   */
  humidityRatio = Number.NaN
  /** Out: latent heat flux λE [W/m²]. */
  latentFluxWm2 = Number.NaN
  /** Out: evaporation [kg m⁻² h⁻¹], λE divided by λ at the air temperature. */
  evaporationKgPerM2H = Number.NaN
}

/** Specific heat of moist air per kg of moist air [kJ kg⁻¹ K⁻¹], (1.006 + 1.86 W)/(1 + W) (eq 30). */
function moistAirCpPerKgMoistAir(w: number): number {
  return (CP_DRY_AIR_KJ_PER_KG_K + w * CP_WATER_VAPOR_KJ_PER_KG_K) / (1 + w)
}

/** Penman wet-surface latent flux and evaporation of the state `s` (see the module note). */
export function solveWetSurface(s: WetSurface): void {
  const airC = s.airC
  const ea = s.vaporPressureKpa
  const p = s.pressureKpa
  checkPressure(p)
  let es: number
  if (Number.isNaN(s.saturationPa)) es = saturationVaporPressureLiquidKpa(airC)
  else {
    if (!(airC >= SATURATION_MIN_C && airC <= SATURATION_MAX_C)) {
      throw new RangeError(
        `temperature must be between ${SATURATION_MIN_C} and ${SATURATION_MAX_C} °C, got ${airC}`,
      )
    }
    es = s.saturationPa / 1000
  }
  if (!(ea >= 0 && ea <= es * 1.0001)) {
    throw new RangeError(
      `vapour pressure must be between 0 and the saturation pressure ${es.toFixed(4)} kPa at ${airC} °C, got ${ea}`,
    )
  }
  const lambda = latentHeatVaporizationMjPerKg(airC)
  const w = humidityRatioFromVaporPressure(ea, p)
  const density = moistAirDensityKgPerM3(airC, w, p)
  const cp = moistAirCpPerKgMoistAir(w)
  const gamma = psychrometricConstantKpaPerC(p, lambda, cp / 1000)
  let ra = s.aerodynamicResistanceSPerM
  if (Number.isNaN(ra)) {
    // the caller's humidity ratio is normally this same value: reuse what depends on it when bit-equal
    const wf = Number.isNaN(s.humidityRatio) ? w : s.humidityRatio
    const same = wf === w
    const cpF = same ? cp : moistAirCpPerKgMoistAir(wf)
    ra = aerodynamicResistanceFromWindFunctionSPerM(
      windFunctionPenman1948MmPerDayKpa(s.windAt2mMs),
      same ? density : moistAirDensityKgPerM3(airC, wf, p),
      cpF,
      same ? gamma : psychrometricConstantKpaPerC(p, lambda, cpF / 1000),
      lambda,
    )
  }
  const slope = es * dLnSaturationPressureLiquidDT(airC + KELVIN_OFFSET)
  const latent = penmanMonteithLatentFlux(
    slope,
    gamma,
    s.availableEnergyWm2,
    density * cp * 1000,
    es - ea,
    ra,
  )
  s.latentFluxWm2 = latent
  s.evaporationKgPerM2H = evaporationKgPerM2HFromLatentFlux(latent, airC)
}

const scratch = new WetSurface()

function solveScratch(
  availableEnergyWm2: number,
  airC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  aerodynamicResistanceSPerM: number,
  windAt2mMs: number,
  humidityRatio: number,
  saturationPa: number,
): WetSurface {
  scratch.availableEnergyWm2 = availableEnergyWm2
  scratch.airC = airC
  scratch.vaporPressureKpa = vaporPressureKpa
  scratch.pressureKpa = pressureKpa
  scratch.aerodynamicResistanceSPerM = aerodynamicResistanceSPerM
  scratch.windAt2mMs = windAt2mMs
  scratch.humidityRatio = humidityRatio
  scratch.saturationPa = saturationPa
  solveWetSurface(scratch)
  return scratch
}

/**
 * Latent heat flux [W/m²] from a wet surface at air temperature with a given aerodynamic resistance:
 * net radiation and heat flux into the surface [W/m²], air temperature [°C], actual vapour pressure
 * [kPa], total pressure [kPa], aerodynamic resistance [s/m] (∞: radiation term only).
 */
export function wetSurfaceLatentFluxWm2(
  netRadiationWm2: number,
  heatFluxIntoSurfaceWm2: number,
  airTempC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  aerodynamicResistanceSPerM: number,
): number {
  if (Number.isNaN(aerodynamicResistanceSPerM)) {
    throw new RangeError('aerodynamic resistance must be > 0 s/m, got NaN')
  }
  const s = solveScratch(
    netRadiationWm2 - heatFluxIntoSurfaceWm2,
    airTempC,
    vaporPressureKpa,
    pressureKpa,
    aerodynamicResistanceSPerM,
    Number.NaN,
    Number.NaN,
    Number.NaN,
  )
  return s.latentFluxWm2
}

/** {@link wetSurfaceLatentFluxWm2} as evaporation [kg m⁻² h⁻¹ = mm/h] (λ at the air temperature). */
export function wetSurfaceEvaporationKgPerM2H(
  netRadiationWm2: number,
  heatFluxIntoSurfaceWm2: number,
  airTempC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  aerodynamicResistanceSPerM: number,
): number {
  return evaporationKgPerM2HFromLatentFlux(
    wetSurfaceLatentFluxWm2(
      netRadiationWm2,
      heatFluxIntoSurfaceWm2,
      airTempC,
      vaporPressureKpa,
      pressureKpa,
      aerodynamicResistanceSPerM,
    ),
    airTempC,
  )
}

/**
 * Wet-surface evaporation [kg m⁻² h⁻¹] with available energy `availableEnergyWm2` and the Penman (1948)
 * wind function at the wind at 2 m `windAt2mMs`, its resistance taken at humidity ratio `w` [kg/kg].
 * `saturationPa`: exp(ln pws(airC)) in Pa when the caller has it. Negative: condensation.
 */
export function wetSurfaceEvaporationPenman1948KgPerM2H(
  availableEnergyWm2: number,
  airC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  w: number,
  windAt2mMs: number,
  saturationPa = Number.NaN,
): number {
  return solveScratch(
    availableEnergyWm2,
    airC,
    vaporPressureKpa,
    pressureKpa,
    Number.NaN,
    windAt2mMs,
    w,
    saturationPa,
  ).evaporationKgPerM2H
}
