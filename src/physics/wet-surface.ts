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
 * A product layer is more than a flat sheet of water: it may expose more surface to the air than its
 * reference area (`exchangeAreaRatio` A: heat and vapour leave through A m² per m²), and a surface warmer than
 * the air radiates more than the isothermal net radiation counts (`radiativeConductanceWm2K` R = 4εσT³ per m²
 * of reference area). With H = A·ρa·cp/ra the balance Q = H(Ts − Ta) + R(Ts − Ta) + λE, linearised in the
 * saturation pressure as Penman's, gives the form of Monteith & Unsworth (Principles of Environmental
 * Physics, 4th ed. 2013, ch. 13, Penman equation with the radiative resistance; from memory for the section):
 * λE = [Δ·Q + (H + R)·(es − ea)] / [Δ + γ·(H + R)/H], Q the isothermal available energy, and the surface
 * temperature Ts = Ta + (Q − λE)/(H + R). A = 1 and R = 0 is Penman's own form (computed by the same
 * expression as before, bit for bit). With no energy input (Q = 0, R = 0) Ts is the psychrometric wet bulb
 * of the linearised balance, Ta − (es − ea)/(Δ + γ).
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
import { saturationPressureFromTableKpa, saturationTableSlopes } from './saturation-table.ts'

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
  /**
   * Surface through which heat and vapour leave, per m² of reference area [m²/m²] (1: a flat wet sheet; a
   * layer of berries exposes about π).
   */
  exchangeAreaRatio = 1
  /**
   * Linearised long-wave exchange per m² of reference area [W m⁻² K⁻¹], 4εσT³: what a surface warmer than the
   * air radiates beyond the isothermal net radiation; 0: Penman's isothermal form.
   */
  radiativeConductanceWm2K = 0
  /**
   * false (default): Penman's linearisation of the saturation curve about the air temperature. true: the
   * balance Q = (H + R)(Ts − Ta) + (H/γ)(es(Ts) − ea) solved with the saturation curve itself (Newton's method
   * from Penman's root, to 1e-4 K): with Δ taken at the air temperature the linearisation puts a wet surface
   * in dry air too warm (about 0.4 K at 20 °C/60 % and 3.4 K at 35 °C/25 % with no sun; the tangent lies under
   * the convex curve) and its evaporation too low with it.
   */
  exact = false
  /** Out: latent heat flux λE [W/m²]. */
  latentFluxWm2 = Number.NaN
  /**
   * Out: H + R [W m⁻² K⁻¹], the sensible and radiative conductance per m² of reference area: a surface of the
   * same air that evaporates E sits at Ta + (Q − λE)/(H + R) (NaN when both are 0).
   */
  heatConductanceWm2K = Number.NaN
  /** Out: temperature of the wet surface [°C], Ta + (Q − λE)/(H + R). */
  surfaceC = Number.NaN
  /** Out: evaporation [kg m⁻² h⁻¹], λE divided by λ at the air temperature. */
  evaporationKgPerM2H = Number.NaN
  /**
   * Out: vapour conductance of the exchange surface per m² of reference area [kg m⁻² h⁻¹ kPa⁻¹], (H/γ)/λ: the
   * vapour flux per kPa of vapour-pressure difference between the surface and the air, the transfer of the
   * latent term above (λE = (H/γ)·(es(Ts) − ea)); 0 with no air exchange.
   */
  vaporConductanceKgPerM2HKpa = Number.NaN
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
  const rhoCp = density * cp * 1000
  const area = s.exchangeAreaRatio
  const radiative = s.radiativeConductanceWm2K
  if (!(area > 0 && area <= 100)) {
    throw new RangeError(`exchange area ratio must be above 0 and at most 100, got ${area}`)
  }
  if (!(radiative >= 0 && radiative < 1000)) {
    throw new RangeError(`radiative conductance must be between 0 and 1000 W m⁻² K⁻¹, got ${radiative}`)
  }
  const sensible = (area * rhoCp) / ra
  const conductance = sensible + radiative
  let latent: number
  if (area === 1 && radiative === 0) {
    // Penman's own form, the same expression as always (bit for bit)
    latent = penmanMonteithLatentFlux(slope, gamma, s.availableEnergyWm2, rhoCp, es - ea, ra)
  } else if (sensible > 0) {
    // Monteith & Unsworth: ρa·cp·D/r_HR with 1/r_HR = (H + R)/(ρa·cp), and γ* = γ·(H + R)/H
    latent = penmanMonteithLatentFlux(
      slope,
      (gamma * conductance) / sensible,
      s.availableEnergyWm2,
      rhoCp,
      es - ea,
      rhoCp / conductance,
    )
  } else latent = 0 // no air exchange (ra = ∞): no evaporation
  s.heatConductanceWm2K = conductance > 0 ? conductance : Number.NaN
  let surfaceC = airC + (s.availableEnergyWm2 - latent) / s.heatConductanceWm2K
  if (s.exact && sensible > 0) {
    // Newton on f(T) = Q − (H + R)(T − Ta) − (H/γ)(es(T) − ea), from Penman's (linearised) root
    const vapour = sensible / gamma
    // (es and its slope from the interpolated table of eq 6, within 1e-9 relative: physics/saturation-table.ts)
    for (let iter = 0; iter < 8; iter++) {
      const t = surfaceC < SATURATION_MIN_C ? SATURATION_MIN_C : Math.min(surfaceC, SATURATION_MAX_C)
      const esT = saturationPressureFromTableKpa(t, false)
      const f = s.availableEnergyWm2 - conductance * (t - airC) - vapour * (esT - ea)
      const step = f / (conductance + vapour * saturationTableSlopes[0])
      surfaceC = t + step
      if (Math.abs(step) < 1e-4) break
    }
    latent = s.availableEnergyWm2 - conductance * (surfaceC - airC)
  }
  s.latentFluxWm2 = latent
  s.surfaceC = surfaceC
  s.evaporationKgPerM2H = evaporationKgPerM2HFromLatentFlux(latent, airC)
  s.vaporConductanceKgPerM2HKpa = sensible > 0 ? evaporationKgPerM2HFromLatentFlux(sensible / gamma, airC) : 0
}

/**
 * Aerodynamic resistance [s/m] of a convective heat-transfer coefficient `hcWm2K` [W m⁻² K⁻¹], ra = ρa·cp/hc, with
 * ρa and cp of the air at `airC`, humidity ratio `w` and pressure `pressureKpa` as {@link solveWetSurface} takes
 * them, so that the solver's H = A·ρa·cp/ra is A·hc exactly (heat and vapour through the same resistance: the
 * Lewis analogy, Le ≈ 1 for water vapour in air).
 */
export function resistanceOfHeatTransferCoefficientSPerM(
  hcWm2K: number,
  airC: number,
  w: number,
  pressureKpa: number,
): number {
  if (!(hcWm2K > 0)) throw new RangeError(`heat-transfer coefficient must be > 0 W m⁻² K⁻¹, got ${hcWm2K}`)
  return (moistAirDensityKgPerM3(airC, w, pressureKpa) * moistAirCpPerKgMoistAir(w) * 1000) / hcWm2K
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
