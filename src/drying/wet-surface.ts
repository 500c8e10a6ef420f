/**
 * @module drying/wet-surface
 * Wet-surface evaporation of an exposed product by the Penman combination equation, with the
 * Penman (1948) wind function as its aerodynamic resistance (physics/evaporation.ts).
 */

import { KELVIN_OFFSET } from '../physics/constants.ts'
import {
  aerodynamicResistanceFromWindFunctionSPerM,
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  evaporationKgPerM2HFromLatentFlux,
  latentHeatVaporizationMjPerKg,
  penmanMonteithLatentFlux,
  psychrometricConstantKpaPerC,
  wetSurfaceLatentFluxWm2,
  windFunctionPenman1948MmPerDayKpa,
} from '../physics/evaporation.ts'
import { humidityRatioFromVaporPressure, moistAirDensityKgPerM3 } from '../physics/moist-air.ts'
import { dLnSaturationPressureLiquidDT, SATURATION_MAX_C, SATURATION_MIN_C } from '../physics/saturation.ts'

/**
 * Penman wet-surface evaporation [kg m⁻² h⁻¹] with available energy `rnWm2` and the Penman (1948) wind
 * function at wind `uMs` (McMahon et al. 2013, Supplement S4.11) converted to an aerodynamic resistance
 * (S11.23), via physics/evaporation.ts. Negative: condensation.
 */
export function wetSurfaceEvaporation(
  rnWm2: number,
  airC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  w: number,
  uMs: number,
): number {
  const lambda = latentHeatVaporizationMjPerKg(airC)
  const cp = (CP_DRY_AIR_KJ_PER_KG_K + 1.86 * w) / (1 + w)
  const gamma = psychrometricConstantKpaPerC(pressureKpa, lambda, cp / 1000)
  const density = moistAirDensityKgPerM3(airC, w, pressureKpa)
  const ra = aerodynamicResistanceFromWindFunctionSPerM(
    windFunctionPenman1948MmPerDayKpa(uMs),
    density,
    cp,
    gamma,
    lambda,
  )
  const latent = wetSurfaceLatentFluxWm2(rnWm2, 0, airC, vaporPressureKpa, pressureKpa, ra)
  return evaporationKgPerM2HFromLatentFlux(latent, airC)
}

/**
 * {@link wetSurfaceEvaporation} with the saturation pressure of the air given: `saturationPa` =
 * exp(ln pws(airC)) in Pa (ASHRAE HOF 2017 ch. 1 eq 6, as physics/saturation.ts computes it), which the
 * hourly engine has already evaluated for the hour. The same operations in the same order as
 * physics/evaporation.ts `wetSurfaceLatentFluxWm2` (es and its slope both from that one exp), so the
 * result is bit for bit that of {@link wetSurfaceEvaporation} (checked in the tests); it saves two
 * exp/log pairs per hour.
 */
export function wetSurfaceEvaporationAtSaturation(
  rnWm2: number,
  airC: number,
  vaporPressureKpa: number,
  pressureKpa: number,
  w: number,
  uMs: number,
  saturationPa: number,
): number {
  const io = wetSurfaceScratch
  io[0] = rnWm2
  io[1] = airC
  io[2] = vaporPressureKpa
  io[3] = pressureKpa
  io[4] = w
  io[5] = uMs
  io[6] = saturationPa
  wetSurfaceEvaporationInto(io)
  return io[7]
}

const wetSurfaceScratch = new Float64Array(8)

/**
 * {@link wetSurfaceEvaporationAtSaturation} on an array, for hot loops: io = [Rn W/m², air °C, vapour
 * pressure kPa, pressure kPa, W kg/kg, wind m/s, exp(ln pws(air)) Pa]; the evaporation [kg m⁻² h⁻¹] is
 * written to io[7]. No double crosses the call (V8 boxes those of calls it does not inline).
 */
export function wetSurfaceEvaporationInto(io: Float64Array): void {
  const rnWm2 = io[0]
  const airC = io[1]
  const vaporPressureKpa = io[2]
  const pressureKpa = io[3]
  const w = io[4]
  const uMs = io[5]
  const saturationPa = io[6]
  const lambda = latentHeatVaporizationMjPerKg(airC)
  const cp = (CP_DRY_AIR_KJ_PER_KG_K + 1.86 * w) / (1 + w)
  const gamma = psychrometricConstantKpaPerC(pressureKpa, lambda, cp / 1000)
  const density = moistAirDensityKgPerM3(airC, w, pressureKpa)
  const ra = aerodynamicResistanceFromWindFunctionSPerM(
    windFunctionPenman1948MmPerDayKpa(uMs),
    density,
    cp,
    gamma,
    lambda,
  )
  // physics/evaporation.ts wetSurfaceLatentFluxWm2 from here, with es = saturationVaporPressureLiquidKpa
  if (!(airC >= SATURATION_MIN_C && airC <= SATURATION_MAX_C)) {
    throw new RangeError(
      `temperature must be between ${SATURATION_MIN_C} and ${SATURATION_MAX_C} °C, got ${airC}`,
    )
  }
  const es = saturationPa / 1000
  if (!(vaporPressureKpa >= 0 && vaporPressureKpa <= es * 1.0001)) {
    throw new RangeError(
      `vapour pressure must be between 0 and the saturation pressure ${es.toFixed(4)} kPa at ${airC} °C, got ${vaporPressureKpa}`,
    )
  }
  const w2 = humidityRatioFromVaporPressure(vaporPressureKpa, pressureKpa)
  // the caller's w is normally this same value: reuse what depends on it only when it is bit-equal
  const density2 = w2 === w ? density : moistAirDensityKgPerM3(airC, w2, pressureKpa)
  const cp2 = w2 === w ? cp : (CP_DRY_AIR_KJ_PER_KG_K + w2 * CP_WATER_VAPOR_KJ_PER_KG_K) / (1 + w2)
  const gamma2 = w2 === w ? gamma : psychrometricConstantKpaPerC(pressureKpa, lambda, cp2 / 1000)
  const slope = es * dLnSaturationPressureLiquidDT(airC + KELVIN_OFFSET)
  const latent = penmanMonteithLatentFlux(
    slope,
    gamma2,
    rnWm2 - 0,
    density2 * cp2 * 1000,
    es - vaporPressureKpa,
    ra,
  )
  io[7] = evaporationKgPerM2HFromLatentFlux(latent, airC)
}
