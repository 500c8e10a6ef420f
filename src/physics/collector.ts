/**
 * @module physics/collector
 * Useful gain and outlet temperature of a flat-plate solar air heater by the Hottel–Whillier–Bliss
 * equation (Duffie & Beckman 2013, *Solar Engineering of Thermal Processes* 4th ed., ch. 6):
 * Qu = Ac [FR(τα) G_T − FR UL (Tin − Ta)], η = Qu/(Ac G_T) = FR(τα) − FR UL (Tin − Ta)/G_T.
 * Units: W/m², °C, m², kg/s, kJ kg⁻¹ K⁻¹. FR is defined on the inlet temperature, so use Tin − Ta.
 * The air is heated at constant humidity ratio.
 */
import { moistAirHeatCapacityKjPerKgK } from './moist-air.ts'

/** Linear collector parameters: intercept FR(τα) [–] and slope FR·UL [W m⁻² K⁻¹]. */
export interface CollectorParameters {
  /** FR(τα), optical intercept [–]. */
  interceptFrTauAlpha: number
  /** FR·UL, loss slope [W m⁻² K⁻¹]. */
  lossSlopeFrUlWm2K: number
}

/**
 * Single-glazed flat-plate air heater: FR(τα) = 0.60, FR·UL = 5 W m⁻² K⁻¹, within the typical ranges
 * 0.5–0.7 and 3–8 W m⁻² K⁻¹ given for such heaters in textbooks and ratings (from memory, not verified
 * against a rating; air heaters' FR falls at low air flow, so treat as a mid-flow value).
 */
export const SINGLE_GLAZED_AIR_HEATER: CollectorParameters = {
  interceptFrTauAlpha: 0.6,
  lossSlopeFrUlWm2K: 5,
}
/**
 * Unglazed absorber with air behind it: FR(τα) = 0.85, FR·UL = 20 W m⁻² K⁻¹ (typical ranges 0.7–0.9 and
 * 10–25 W m⁻² K⁻¹, rising with wind; from memory, not verified).
 */
export const UNGLAZED_AIR_HEATER: CollectorParameters = { interceptFrTauAlpha: 0.85, lossSlopeFrUlWm2K: 20 }

function checkParameters(p: CollectorParameters): void {
  if (!(p.interceptFrTauAlpha > 0 && p.interceptFrTauAlpha <= 1)) {
    throw new RangeError(
      `collector intercept FR(tau alpha) must be between 0 and 1, got ${p.interceptFrTauAlpha}`,
    )
  }
  if (!(p.lossSlopeFrUlWm2K >= 0 && p.lossSlopeFrUlWm2K <= 100)) {
    throw new RangeError(
      `collector loss slope FR UL must be between 0 and 100 W/m2K, got ${p.lossSlopeFrUlWm2K}`,
    )
  }
}

/**
 * Useful gain per collector area [W/m²] = max(0, FR(τα) G_T − FR UL (Tin − Ta)) for irradiance on the
 * collector plane `tiltedIrradianceWm2`, inlet and ambient temperatures [°C]. Clamped at 0: with no net
 * gain the fan-off / bypass case is assumed, not a collector that cools the air (common practice, no source).
 */
export function collectorUsefulGainWm2(
  params: CollectorParameters,
  tiltedIrradianceWm2: number,
  inletC: number,
  ambientC: number,
): number {
  checkParameters(params)
  if (!(tiltedIrradianceWm2 >= 0)) {
    throw new RangeError(`irradiance on the collector must be >= 0 W/m2, got ${tiltedIrradianceWm2}`)
  }
  if (!Number.isFinite(inletC) || !Number.isFinite(ambientC)) {
    throw new RangeError(`inlet and ambient temperatures must be finite °C, got ${inletC} and ${ambientC}`)
  }
  const q = params.interceptFrTauAlpha * tiltedIrradianceWm2 - params.lossSlopeFrUlWm2K * (inletC - ambientC)
  return Math.max(q, 0)
}

/**
 * Collector efficiency η [–] = FR(τα) − FR UL (Tin − Ta)/G_T, clamped at 0; 0 when G_T = 0.
 * Example: (0.70, 5), G = 800, ΔT = 10 K → 0.6375.
 */
export function collectorEfficiency(
  params: CollectorParameters,
  tiltedIrradianceWm2: number,
  inletC: number,
  ambientC: number,
): number {
  if (tiltedIrradianceWm2 === 0) return 0
  return collectorUsefulGainWm2(params, tiltedIrradianceWm2, inletC, ambientC) / tiltedIrradianceWm2
}

/**
 * Outlet air temperature [°C] = Tin + Qu Ac / (ṁ cp), with useful gain `usefulGainWm2` [W/m²], collector
 * area `areaM2` [m²], dry-air mass flow `dryAirFlowKgPerS` [kg/s] and humidity ratio [kg/kg] for cp.
 */
export function collectorOutletC(
  inletC: number,
  usefulGainWm2: number,
  areaM2: number,
  dryAirFlowKgPerS: number,
  humidityRatioKgPerKg: number,
): number {
  if (!(areaM2 > 0)) throw new RangeError(`collector area must be > 0 m2, got ${areaM2}`)
  if (!(dryAirFlowKgPerS > 0)) throw new RangeError(`air mass flow must be > 0 kg/s, got ${dryAirFlowKgPerS}`)
  if (!(usefulGainWm2 >= 0)) throw new RangeError(`useful gain must be >= 0 W/m2, got ${usefulGainWm2}`)
  if (!(humidityRatioKgPerKg >= 0 && humidityRatioKgPerKg < 1)) {
    throw new RangeError(`humidity ratio must be between 0 and 1 kg/kg, got ${humidityRatioKgPerKg}`)
  }
  const cpJPerKgK = moistAirHeatCapacityKjPerKgK(humidityRatioKgPerKg) * 1000
  return inletC + (usefulGainWm2 * areaM2) / (dryAirFlowKgPerS * cpJPerKgK)
}

/**
 * Collector heat removal factor FR [–] of a collector of area `areaM2` [m²], loss coefficient `lossUlWm2K`
 * [W m⁻² K⁻¹] and collector efficiency factor F′ `efficiencyFactor` [–], at capacity rate ṁ·cp
 * `capacityRateWPerK` [W/K] (Duffie & Beckman 2013, ch. 6, eq 6.7.6 form):
 * FR = (ṁ·cp / (Ac·UL))·[1 − exp(−Ac·UL·F′ / (ṁ·cp))]. FR → F′ as the flow grows and falls with the flow, which
 * is why a collector whose fans follow the sun keeps its outlet temperature fairly steady. 0 without flow.
 */
export function heatRemovalFactor(
  areaM2: number,
  lossUlWm2K: number,
  efficiencyFactor: number,
  capacityRateWPerK: number,
): number {
  if (!(areaM2 > 0)) throw new RangeError(`collector area must be > 0 m2, got ${areaM2}`)
  if (!(lossUlWm2K > 0 && lossUlWm2K <= 100)) {
    throw new RangeError(`collector loss coefficient UL must be in (0, 100] W/m2K, got ${lossUlWm2K}`)
  }
  if (!(efficiencyFactor > 0 && efficiencyFactor <= 1)) {
    throw new RangeError(`collector efficiency factor F' must be in (0, 1], got ${efficiencyFactor}`)
  }
  if (!(capacityRateWPerK >= 0))
    throw new RangeError(`capacity rate must be >= 0 W/K, got ${capacityRateWPerK}`)
  if (capacityRateWPerK === 0) return 0
  const x = (areaM2 * lossUlWm2K) / capacityRateWPerK
  return (1 - Math.exp(-x * efficiencyFactor)) / x
}
