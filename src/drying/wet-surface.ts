/**
 * @module drying/wet-surface
 * Wet-surface evaporation of an exposed product by the Penman combination equation, with the
 * Penman (1948) wind function as its aerodynamic resistance (physics/evaporation.ts).
 */
import {
  aerodynamicResistanceFromWindFunctionSPerM,
  CP_DRY_AIR_KJ_PER_KG_K,
  evaporationKgPerM2HFromLatentFlux,
  latentHeatVaporizationMjPerKg,
  psychrometricConstantKpaPerC,
  wetSurfaceLatentFluxWm2,
  windFunctionPenman1948MmPerDayKpa,
} from '../physics/evaporation.ts'
import { moistAirDensityKgPerM3 } from '../physics/moist-air.ts'

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
