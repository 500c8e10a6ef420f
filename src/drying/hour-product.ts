/**
 * @module drying/hour-product
 * The product's side of an hour in the hourly driver (drying/hourly-conditions.ts), once the method has set the
 * air and the product temperature: the equilibrium moisture and step parameters at the product surface (and at
 * its wet surface for exposed methods), the humidity-ratio deficits along the adiabatic path
 * (physics/air-processes.ts), the constant-rate limit, the vapour-uptake limit of rewetting and the usable-hour
 * verdict (drying/usable-hour.ts).
 */
import { adiabaticEndDryBulbC, solveAdiabaticPath } from '../physics/air-processes.ts'
import { saturationPressureFromTableKpa } from '../physics/saturation-table.ts'
import type { Engine } from './hour-engine.ts'
import { HourMode } from './methods/method-model.ts'
import {
  EMC_RH_CAP_PCT,
  firstOrderRateConstant,
  HOUR_EMC_ADSORPTION,
  HOUR_EMC_DESORPTION,
  HOUR_RATE_K,
  HOUR_RATE_N,
} from './product-response.ts'
import { HourStatus, usableHourStatus } from './usable-hour.ts'

/**
 * Humidity-ratio deficit [kg/kg] of the air at the product (its temperature `productC`, the ambient W)
 * to RH `rhFraction` along the adiabatic path, started from the previous hour's cooling `depressionK`.
 */
function deficitAlongPath(
  e: Engine,
  productC: number,
  rhFraction: number,
  depressionK: number,
  saturationPa: number,
): number {
  const path = e.path
  const hour = e.hour
  path.dryBulbC = productC
  path.humidityRatio = hour.humidityRatio
  path.pressureKpa = hour.pressureKpa
  path.endRhFraction = rhFraction
  path.guessC = productC - depressionK
  path.saturationPa = saturationPa
  solveAdiabaticPath(path)
  return path.endHumidityRatio - hour.humidityRatio
}

/**
 * The product's equilibrium and step parameters at the temperature of its wet surface (exposed methods), where
 * a product still holding free water sits: its surface RH is the air's vapour pressure over saturation there.
 * The same as at {@link MethodHour.productC} when the two temperatures are equal (no evaporation, or none
 * possible) or the method gives none.
 */
function wetSurfaceResponse(e: Engine, i: number): void {
  const { columns: c, hour, product } = e
  const tWet = hour.productWetC
  const tDry = hour.productC
  c.productWetC[i] = Number.isNaN(tWet) ? tDry : tWet
  if (Number.isNaN(tWet) || tWet === tDry) {
    c.emcWetDb[i] = c.emcDesorptionDb[i]
    c.rateKWet[i] = c.rateK[i]
    c.rateNWet[i] = c.rateN[i]
    c.decayWetPerHour[i] = c.decayPerHour[i]
    return
  }
  // saturation at the wet surface from the interpolated table of eq 6 (within 1e-9 relative)
  let rhWet = (100 * hour.vaporPressureKpa) / saturationPressureFromTableKpa(tWet, false)
  if (!(rhWet <= EMC_RH_CAP_PCT)) rhWet = EMC_RH_CAP_PCT
  const r = e.responseWet
  if (product.hourResponse !== undefined) product.hourResponse(tWet, rhWet, r)
  else {
    r[HOUR_EMC_DESORPTION] = product.emcDesorptionDb(tWet, rhWet)
    product.stepParameters(tWet, rhWet, e.step)
    r[HOUR_RATE_K] = e.step[0]
    r[HOUR_RATE_N] = e.step[1]
  }
  c.emcWetDb[i] = r[HOUR_EMC_DESORPTION]
  const k = r[HOUR_RATE_K]
  const nExp = r[HOUR_RATE_N]
  c.rateKWet[i] = k
  c.rateNWet[i] = nExp
  c.decayWetPerHour[i] = nExp === 1 ? Math.exp(-k) : Number.NaN
}

/** The product's response, the deficits, the limit and the verdict of an hour in which it meets the air. */
export function productHour(e: Engine, i: number, surfaceRhPct: number, surfaceSaturationPa: number): void {
  const { columns: c, hour, product, response } = e
  const tProduct = hour.productC
  const w = hour.humidityRatio
  const rhForEmc = Math.min(surfaceRhPct, EMC_RH_CAP_PCT)
  if (product.hourResponse !== undefined) product.hourResponse(tProduct, rhForEmc, response)
  else {
    response[HOUR_EMC_DESORPTION] = product.emcDesorptionDb(tProduct, rhForEmc)
    if (c.emcAdsorptionDb !== c.emcDesorptionDb) {
      response[HOUR_EMC_ADSORPTION] = product.emcAdsorptionDb(tProduct, rhForEmc)
    }
    product.stepParameters(tProduct, rhForEmc, e.step)
    response[HOUR_RATE_K] = e.step[0]
    response[HOUR_RATE_N] = e.step[1]
  }
  const k = response[HOUR_RATE_K]
  const nExp = response[HOUR_RATE_N]
  c.emcDesorptionDb[i] = response[HOUR_EMC_DESORPTION]
  if (c.emcAdsorptionDb !== c.emcDesorptionDb) c.emcAdsorptionDb[i] = response[HOUR_EMC_ADSORPTION]
  c.rateK[i] = k
  c.rateN[i] = nExp
  c.decayPerHour[i] = nExp === 1 ? Math.exp(-k) : Number.NaN
  c.rewetDecayPerHour[i] = Math.exp(
    -product.rewettingRateFactor * firstOrderRateConstant(k, nExp, product.thompsonTimeScale),
  )
  if (e.surfaceBalance) wetSurfaceResponse(e, i)
  // Deficits are taken for air at the product temperature (it is what touches the product).
  // Deficit to saturation: the forced-air constant-rate limit. Exposed methods use the Penman rate as
  // their limit and skip it (NaN), which saves a solver per hour.
  const exposed = e.exposed
  let dSat = Number.NaN
  if (!exposed) {
    dSat =
      surfaceRhPct >= 100
        ? 0
        : deficitAlongPath(e, tProduct, 1, e.depressionToSaturationK, surfaceSaturationPa)
    if (dSat > 0) e.depressionToSaturationK = tProduct - adiabaticEndDryBulbC(tProduct, w, dSat)
  }
  c.deficitToSaturationGPerKg[i] = 1000 * dSat
  const erhTarget = e.verdict ? product.erhPct(tProduct, e.options.targetDb) : Number.NaN
  let dTarget = Number.NaN
  if (e.verdict) {
    dTarget =
      surfaceRhPct >= erhTarget
        ? 0
        : deficitAlongPath(e, tProduct, erhTarget / 100, e.depressionToTargetK, surfaceSaturationPa)
    if (dTarget > 0) e.depressionToTargetK = tProduct - adiabaticEndDryBulbC(tProduct, w, dTarget)
  }
  c.deficitToTargetGPerKg[i] = 1000 * dTarget
  const evaporation = hour.evaporationKgPerM2H
  c.evaporationKgPerM2H[i] = evaporation
  // a forced-air method's flow share of the hour (fans on a PV module) scales its limit; 1 for the others
  const airCap = exposed ? Number.NaN : dSat * e.forcedCapFactor * hour.airFlowShare
  // a product on its surface balance: the wet-surface evaporation (per m² of floor → per kg dry matter)
  c.capDbPerH[i] = e.surfaceBalance ? Math.max(0, evaporation) * e.exposedCapFactor : airCap
  c.airCapDbPerH[i] = airCap
  if (e.surfaceBalance) {
    // vapour uptake limit (drying/batch.ts rewetting): conductance × (ea − aw·es(T_product)), per kg dry matter
    const g = hour.vaporConductanceKgPerM2HKpa * e.exposedCapFactor
    c.vaporUptakeAirDbPerH[i] = g * hour.vaporPressureKpa
    c.vaporUptakeSurfaceDbPerH[i] = g * surfaceSaturationPa * 1e-3
  }
  if (!e.verdict) {
    c.status[i] = HourStatus.usable
    return
  }
  const v = e.verdictInput
  v.pausedByNight = hour.pausedByNight
  v.coveredForRain = hour.coveredForRain
  v.rainExposed = hour.mode === HourMode.rainExposed
  v.uncoveredNight = hour.uncoveredNight
  v.productC = tProduct
  v.surfaceRhPct = surfaceRhPct
  v.targetErhPct = erhTarget
  v.deficitToTargetGPerKg = 1000 * dTarget
  c.status[i] = usableHourStatus(v, e.options.thresholds, e.options.maxProductTempC)
}
