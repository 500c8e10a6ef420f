/**
 * @module physics/evaporation
 * Evaporation from a wet surface (free water on a product, open water) by the Penman combination
 * equation in resistance form, λE = [Δ (Rn − G) + ρa cp (es − ea)/ra] / [Δ + γ (1 + rs/ra)], rs = 0 for a
 * wet surface (Penman 1948; Monteith 1965 resistance form; FAO-56 eq 3, Allen et al. 1998), with its
 * building blocks. Units: °C, kPa, W/m² (mean over the hour), s/m, m/s, kg m⁻² h⁻¹ (= mm/h of water).
 *
 * The wet-surface flux itself, with Hyland–Wexler saturation (ASHRAE HOF 2017 ch. 1 eq 6) and the moist-air
 * density of ./moist-air.ts, is in ./wet-surface.ts; the FAO-56 Tetens forms used by the reference-ET check
 * are in ./fao56-reference-et.ts.
 */

import { KELVIN_OFFSET, S_PER_DAY, S_PER_HOUR, STEFAN_BOLTZMANN_WM2K4 } from './constants.ts'
import { checkPressure } from './moist-air.ts'
import { dLnSaturationPressureLiquidDT, saturationVaporPressureLiquidKpa } from './saturation.ts'

/** Ratio of molar masses water/dry air used by FAO-56 eq 8 (ε = 0.622). */
export const EPSILON_FAO56 = 0.622

/**
 * Latent heat of vaporization of water [MJ/kg] at surface temperature `tC` [°C]: λ = 2.501 − 2.361×10⁻³ T,
 * FAO-56 Annex 3 eq 3-1 (Harrison 1963). 20 °C → 2.454 MJ/kg.
 */
export function latentHeatVaporizationMjPerKg(tC: number): number {
  if (!(tC >= -50 && tC <= 100)) throw new RangeError(`temperature must be between -50 and 100 °C, got ${tC}`)
  return 2.501 - 2.361e-3 * tC
}

/**
 * Slope of the saturation vapour-pressure curve over liquid water [kPa/°C] at `tC`: d pws/dT of
 * Hyland–Wexler (ASHRAE HOF 2017 ch. 1 eq 6), analytic. Within 0.3 % of FAO-56 eq 13 from 0 to 45 °C.
 */
export function saturationSlopeLiquidKpaPerC(tC: number): number {
  return saturationVaporPressureLiquidKpa(tC) * dLnSaturationPressureLiquidDT(tC + KELVIN_OFFSET)
}

/**
 * Psychrometric constant γ [kPa/°C] = cp P / (ε λ), FAO-56 eq 8 in its general form, with total pressure
 * `pressureKpa`, latent heat `latentHeatMjPerKg` [MJ/kg] and specific heat of (moist) air `cpMjPerKgK`
 * (FAO-56 uses 1.013×10⁻³ MJ kg⁻¹ °C⁻¹; with λ = 2.45 this is 0.665×10⁻³ P).
 */
export function psychrometricConstantKpaPerC(
  pressureKpa: number,
  latentHeatMjPerKg: number,
  cpMjPerKgK = 1.013e-3,
): number {
  checkPressure(pressureKpa)
  return (cpMjPerKgK * pressureKpa) / (EPSILON_FAO56 * latentHeatMjPerKg)
}

/**
 * Wind speed at 2 m [m/s] from wind `windMs` measured at `heightM` [m] over short grass, FAO-56 eq 47:
 * u2 = uz · 4.87 / ln(67.8 z − 5.42). Example 14: 3.2 m/s at 10 m → 2.4 m/s.
 */
export function windSpeedAt2mMs(windMs: number, heightM: number): number {
  if (!(windMs >= 0 && windMs < 100))
    throw new RangeError(`wind speed must be between 0 and 100 m/s, got ${windMs}`)
  checkFao56WindHeight(heightM)
  return (windMs * 4.87) / Math.log(67.8 * heightM - 5.42)
}

function checkFao56WindHeight(heightM: number): void {
  if (!(heightM >= 0.5 && heightM <= 200))
    throw new RangeError(`wind height must be between 0.5 and 200 m, got ${heightM}`)
}

/**
 * Ratio of the wind at height `heightM` [m] to the wind at 2 m over short grass [–]: FAO-56 eq 47 inverted,
 * u(z)/u2 = ln(67.8 z − 5.42)/4.87 (e.g. the wind at a drying rack 0.5 m high). Accepted from 0.1 m (where
 * the profile is still positive; eq 47 itself is stated for measurement heights) to 200 m.
 */
export function windRatioFrom2mToHeight(heightM: number): number {
  if (!(heightM >= 0.1 && heightM <= 200))
    throw new RangeError(`height must be between 0.1 and 200 m, got ${heightM}`)
  return Math.log(67.8 * heightM - 5.42) / 4.87
}

/**
 * Wind speed [m/s] at height `toHeightM` from wind `windMs` at `fromHeightM` [m] by the neutral logarithmic
 * profile u(z) ∝ ln((z − d)/z0) with zero-plane displacement `displacementM` d and roughness length
 * `roughnessM` z0 (FAO-56 eq 4 profile; McMahon et al. 2013 Supplement S4.4 with d = 0). FAO-56 eq 47 is this
 * with d = 0.08 m, z0 = 0.01476 m (grass of 0.12 m: d = 2h/3, z0 = 0.123h) and z = 2 m.
 */
export function windSpeedAtHeightLogProfileMs(
  windMs: number,
  fromHeightM: number,
  toHeightM: number,
  roughnessM: number,
  displacementM = 0,
): number {
  if (!(windMs >= 0 && windMs < 100))
    throw new RangeError(`wind speed must be between 0 and 100 m/s, got ${windMs}`)
  if (!(roughnessM > 0 && roughnessM < 5))
    throw new RangeError(`roughness length must be between 0 and 5 m, got ${roughnessM}`)
  for (const [name, z] of [
    ['measurement height', fromHeightM],
    ['target height', toHeightM],
  ] as const) {
    if (!(z - displacementM > roughnessM && z <= 200)) {
      throw new RangeError(
        `${name} must exceed displacement + roughness (${displacementM + roughnessM} m) and be at most 200 m, got ${z}`,
      )
    }
  }
  return (
    (windMs * Math.log((toHeightM - displacementM) / roughnessM)) /
    Math.log((fromHeightM - displacementM) / roughnessM)
  )
}

/**
 * Aerodynamic resistance of the FAO-56 grass reference surface [s/m] = 208/u2 (FAO-56 eq 4 with h = 0.12 m,
 * measurements at 2 m; Allen et al. 1998 Box 4). Infinite for calm air.
 */
export function aerodynamicResistanceGrassSPerM(windAt2mMs: number): number {
  if (!(windAt2mMs >= 0)) throw new RangeError(`wind speed at 2 m must be >= 0 m/s, got ${windAt2mMs}`)
  return 208 / windAt2mMs
}

/**
 * Penman (1948) open-water wind function [mm d⁻¹ kPa⁻¹] = 2.626 + 1.381 u2, in the SI form of McMahon et
 * al. (2013), HESS 17:1331, Supplement eq S4.11. Its intercept stands for free convection in calm air.
 */
export function windFunctionPenman1948MmPerDayKpa(windAt2mMs: number): number {
  if (!(windAt2mMs >= 0)) throw new RangeError(`wind speed at 2 m must be >= 0 m/s, got ${windAt2mMs}`)
  return 2.626 + 1.381 * windAt2mMs
}

/** Penman (1956) wind function [mm d⁻¹ kPa⁻¹] = 1.313 + 1.381 u2; McMahon et al. (2013) Supplement eq S4.3. */
export function windFunctionPenman1956MmPerDayKpa(windAt2mMs: number): number {
  if (!(windAt2mMs >= 0)) throw new RangeError(`wind speed at 2 m must be >= 0 m/s, got ${windAt2mMs}`)
  return 1.313 + 1.381 * windAt2mMs
}

/**
 * Aerodynamic resistance [s/m] equivalent to a Penman wind function f(u) [mm d⁻¹ kPa⁻¹]:
 * ra = ρa cp / (γ λ f(u)), the identity that makes γ/(Δ+γ)·f(u)(es − ea) equal ρa cp (es − ea)/ra/(Δ+γ)
 * (McMahon et al. 2013 Supplement S11.23, there with f in energy units). Inputs: air density [kg/m³], air
 * specific heat [kJ kg⁻¹ K⁻¹], γ [kPa/°C], λ [MJ/kg].
 */
export function aerodynamicResistanceFromWindFunctionSPerM(
  windFunctionMmPerDayKpa: number,
  airDensityKgPerM3: number,
  cpKjPerKgK: number,
  psychrometricKpaPerC: number,
  latentHeatMjPerKg: number,
): number {
  if (!(windFunctionMmPerDayKpa > 0)) {
    throw new RangeError(`wind function must be > 0 mm/d/kPa, got ${windFunctionMmPerDayKpa}`)
  }
  const fKgPerM2SKpa = windFunctionMmPerDayKpa / S_PER_DAY
  return (airDensityKgPerM3 * cpKjPerKgK) / (psychrometricKpaPerC * latentHeatMjPerKg * 1000 * fKgPerM2SKpa)
}

/**
 * Aerodynamic resistance [s/m] equivalent to a Penman wind function f(u) [mm d⁻¹ kPa⁻¹] at air temperature
 * `airTempC`, with the FAO-56 forms: γ λ = cp P/ε (eq 8) and ρa = P/(1.01 (T + 273) R), R = 0.287 kJ kg⁻¹ K⁻¹
 * (FAO-56 Annex 3, from memory for the equation number), so cp and P cancel: ra = ε / (1.01 (T + 273) R f).
 * Example 18 weather (16.9 °C, u2 2.078 m/s): Penman 1948 → 116.3 s/m, Penman 1956 → 152.9 s/m.
 */
export function aerodynamicResistanceFromPenmanWindSPerM(
  windFunctionMmPerDayKpa: number,
  airTempC: number,
): number {
  if (!(windFunctionMmPerDayKpa > 0)) {
    throw new RangeError(`wind function must be > 0 mm/d/kPa, got ${windFunctionMmPerDayKpa}`)
  }
  if (!(airTempC >= -50 && airTempC <= 100)) {
    throw new RangeError(`air temperature must be between -50 and 100 °C, got ${airTempC}`)
  }
  return (EPSILON_FAO56 * S_PER_DAY) / (1.01 * (airTempC + 273) * 0.287 * windFunctionMmPerDayKpa)
}

/**
 * Convective heat-transfer coefficient of a flat plate in wind [W m⁻² K⁻¹], hc = 2.8 + 3.0 u (Watmuff,
 * Charters & Proctor 1977, from memory as quoted in Duffie & Beckman 2013 §3.15; the same form is cited as
 * "h = 3 v + 2.8" after Kumar et al. in a public BenWinchester/PVTModel issue thread; de Winter (2002) notes such
 * wind coefficients scatter widely), u the wind at the
 * surface [m/s]. With the Lewis analogy (Le ≈ 1 for water vapour in air) ra = ρa cp / hc is the resistance
 * to heat and to vapour of a small wet plate (see {@link aerodynamicResistanceFlatPlateSPerM}).
 */
export function flatPlateHeatTransferCoefficientWm2K(windMs: number): number {
  if (!(windMs >= 0)) throw new RangeError(`wind speed must be >= 0 m/s, got ${windMs}`)
  return 2.8 + 3.0 * windMs
}

/**
 * Linearised radiative heat-transfer coefficient of a surface of emissivity `emissivity` at `tC` [°C] to
 * surroundings at about the same temperature [W m⁻² K⁻¹]: hr = 4 ε σ T³ (Duffie & Beckman 2013 §3.10,
 * from memory for the section), σ of physics/constants.ts.
 */
export function radiativeHeatTransferCoefficientWm2K(emissivity: number, tC: number): number {
  const tK = tC + KELVIN_OFFSET
  return 4 * emissivity * STEFAN_BOLTZMANN_WM2K4 * tK * tK * tK
}

/** ra = ρa cp / hc [s/m] for a flat wet plate (Lewis analogy) with hc of {@link flatPlateHeatTransferCoefficientWm2K}. */
export function aerodynamicResistanceFlatPlateSPerM(
  windMs: number,
  airDensityKgPerM3: number,
  cpKjPerKgK: number,
): number {
  return (airDensityKgPerM3 * cpKjPerKgK * 1000) / flatPlateHeatTransferCoefficientWm2K(windMs)
}

/**
 * Penman–Monteith combination equation, latent heat flux λE [W/m²] (FAO-56 eq 3, Allen et al. 1998):
 * λE = [Δ A + ρa cp (es − ea)/ra] / [Δ + γ (1 + rs/ra)], with Δ and γ [kPa/°C], available energy
 * A = Rn − G [W/m²], volumetric heat capacity ρa cp [J m⁻³ K⁻¹], vapour-pressure deficit es − ea [kPa],
 * aerodynamic and surface resistances ra, rs [s/m]. rs = 0 is the Penman wet-surface form. ra = ∞ (calm,
 * no free convection term) leaves the radiation term only. Any consistent energy unit may replace W/m².
 */
export function penmanMonteithLatentFlux(
  slopeKpaPerC: number,
  psychrometricKpaPerC: number,
  availableEnergyWm2: number,
  volumetricHeatCapacityJPerM3K: number,
  vaporPressureDeficitKpa: number,
  aerodynamicResistanceSPerM: number,
  surfaceResistanceSPerM = 0,
): number {
  if (!(aerodynamicResistanceSPerM > 0)) {
    throw new RangeError(`aerodynamic resistance must be > 0 s/m, got ${aerodynamicResistanceSPerM}`)
  }
  if (!(surfaceResistanceSPerM >= 0)) {
    throw new RangeError(`surface resistance must be >= 0 s/m, got ${surfaceResistanceSPerM}`)
  }
  const aero = (volumetricHeatCapacityJPerM3K * vaporPressureDeficitKpa) / aerodynamicResistanceSPerM
  const rsOverRa = Number.isFinite(aerodynamicResistanceSPerM)
    ? surfaceResistanceSPerM / aerodynamicResistanceSPerM
    : 0
  return (slopeKpaPerC * availableEnergyWm2 + aero) / (slopeKpaPerC + psychrometricKpaPerC * (1 + rsOverRa))
}

/** Evaporation [kg m⁻² h⁻¹ = mm/h] from latent heat flux [W/m²] at surface temperature `tC` (λ of FAO-56 Annex 3). */
export function evaporationKgPerM2HFromLatentFlux(latentFluxWm2: number, tC: number): number {
  return (latentFluxWm2 * S_PER_HOUR) / (latentHeatVaporizationMjPerKg(tC) * 1e6)
}
