/**
 * @module physics/greenhouse-air
 * The air inside a naturally ventilated transparent enclosure (a greenhouse dryer, a plastic tunnel over the
 * trays without a collector), hour by hour in a quasi-steady state (no heat stored in the air, the cover or the
 * floor from one hour to the next):
 *
 * - energy: the sun absorbed inside and passed to the air, Q [W], leaves through the cover and with the
 *   ventilation air, or goes into evaporation:
 *   Q = (k·A_c + ṁ·c_p)·(T_i − T_o) + λ·E, the single-zone greenhouse heat balance with an overall heat-loss
 *   coefficient k of the cover (the form of the heating-load and ventilation calculations of greenhouse
 *   engineering, e.g. the overall coefficient k of Mihara & Hayashi 1979 below, defined by the heat input of a
 *   closed house over its cover area and the inside–outside difference);
 * - cover: k = a + b·w, the regressions Mihara & Hayashi measured on single-covered model houses on winter nights
 *   (J. Agric. Meteorol. 35(1):13–19, 1979, "Studies on the insulation of greenhouses (1)", abstract read):
 *   glasshouse k = 4.41 + 0.40·w, PVC house k = 4.87 + 0.54·w [W m⁻² K⁻¹, w the wind speed in m/s];
 * - ventilation by buoyancy (the stack effect) through a low and a high opening a height H apart:
 *   Q_v = C_d·A*·√(2·g·H·|T_i − T_o|/T̄), A* = A₁A₂/√(A₁² + A₂²), the thermal term of the greenhouse ventilation
 *   relation for roof and side openings (Kittas, Boulard & Papadakis 1997, Trans. ASAE 40(2):415–425; the same
 *   form in Vanthoor et al. 2011, Biosystems Eng. 110:363–377; both from memory, the form as given in public
 *   implementations of Vanthoor's model, transcribed). With two equal openings A it is ASHRAE's stack flow
 *   Q = C_D·A·√(2·g·ΔH_NPL·(T_i − T_o)/T_i) with the neutral plane half-way (ΔH_NPL = H/2) (ASHRAE Handbook of
 *   Fundamentals 1997 ch. 25 eq 37, as quoted in a question-and-answer page; transcribed);
 *   or a stated air-change rate N [h⁻¹] of the volume V: Q_v = N·V/3600;
 * - moisture: the ventilation air carries the evaporated water out, W_i = W_o + E/ṁ (a mass balance of the
 *   water vapour with the dry air ṁ that passes).
 * SI throughout: W, kg/s, m, K (°C for temperatures that only enter as differences).
 */
import { KELVIN_OFFSET, S_PER_HOUR } from './constants.ts'

/** Standard acceleration of gravity [m/s²] (3rd CGPM, 1901; the conventional value). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665

/** A cover's overall heat-loss coefficient as a line in the wind speed: k = interceptWm2K + windSlope·w. */
export interface CoverHeatLoss {
  /** k in calm air [W m⁻² K⁻¹ per m² of cover]. */
  interceptWm2K: number
  /** Increase of k per m/s of wind [W m⁻² K⁻¹ per m/s]. */
  windSlopeWm2KPerMs: number
}

/**
 * Overall heat-loss coefficients of single covers measured by Mihara & Hayashi (1979, abstract read; see the
 * module note): a glasshouse and a PVC-film house on winter nights (so the long-wave loss to the night sky is in
 * them). Per m² of cover: the area their eq (1) divides by is not in the abstract (the cover area is the
 * convention of Japanese greenhouse heating loads; from memory).
 */
export const MIHARA_HAYASHI_1979 = {
  glass: { interceptWm2K: 4.41, windSlopeWm2KPerMs: 0.4 },
  pvcFilm: { interceptWm2K: 4.87, windSlopeWm2KPerMs: 0.54 },
} as const satisfies Record<string, CoverHeatLoss>

/** Overall heat-loss coefficient [W m⁻² K⁻¹] of cover `c` at wind speed `windMs` [m/s] (k = a + b·w). */
export function coverHeatLossCoefficientWm2K(c: CoverHeatLoss, windMs: number): number {
  if (!(windMs >= 0)) throw new RangeError(`wind speed must be >= 0 m/s, got ${windMs}`)
  return c.interceptWm2K + c.windSlopeWm2KPerMs * windMs
}

/** Effective area [m²] of a low and a high opening in series for the stack flow: A₁A₂/√(A₁² + A₂²). */
export function openingsInSeriesAreaM2(lowOpeningM2: number, highOpeningM2: number): number {
  if (!(lowOpeningM2 >= 0 && highOpeningM2 >= 0)) {
    throw new RangeError(`opening areas must be >= 0 m², got ${lowOpeningM2} and ${highOpeningM2}`)
  }
  if (lowOpeningM2 === 0 || highOpeningM2 === 0) return 0
  // (√ of the sum of squares rather than Math.hypot: the same bits on every runtime)
  return (
    (lowOpeningM2 * highOpeningM2) / Math.sqrt(lowOpeningM2 * lowOpeningM2 + highOpeningM2 * highOpeningM2)
  )
}

/**
 * Stack coefficient [m³ s⁻¹ K⁻½]: the volume flow per √K of inside–outside difference through a low and a high
 * opening (effective area `seriesAreaM2`, {@link openingsInSeriesAreaM2}) `heightM` apart, discharge coefficient
 * `dischargeCoefficient`, at the mean absolute temperature `meanK` of the two airs: C_d·A*·√(2·g·H/T̄).
 */
export function stackCoefficientM3PerSPerRootK(
  dischargeCoefficient: number,
  seriesAreaM2: number,
  heightM: number,
  meanK: number,
): number {
  if (!(dischargeCoefficient > 0 && seriesAreaM2 >= 0 && heightM >= 0 && meanK > 0)) {
    throw new RangeError(
      `stack flow needs C_d > 0, an area and a height >= 0 and T > 0 K, got ${dischargeCoefficient}, ${seriesAreaM2} m², ${heightM} m, ${meanK} K`,
    )
  }
  return dischargeCoefficient * seriesAreaM2 * Math.sqrt((2 * STANDARD_GRAVITY_M_PER_S2 * heightM) / meanK)
}

/**
 * Volume flow [m³/s] the stack effect drives through the openings of {@link stackCoefficientM3PerSPerRootK} with the
 * inside `riseK` kelvin warmer (or colder) than the outside at `outsideC`: C_d·A*·√(2·g·H·|ΔT|/T̄), T̄ the mean of
 * the two absolute temperatures (see the module note).
 */
export function stackVentilationM3PerS(
  dischargeCoefficient: number,
  seriesAreaM2: number,
  heightM: number,
  riseK: number,
  outsideC: number,
): number {
  const meanK = outsideC + KELVIN_OFFSET + riseK / 2
  return (
    stackCoefficientM3PerSPerRootK(dischargeCoefficient, seriesAreaM2, heightM, meanK) *
    Math.sqrt(Math.abs(riseK))
  )
}

/** Volume flow [m³/s] of `airChangesPerH` changes an hour of an enclosure of `volumeM3`. */
export function airChangeVentilationM3PerS(airChangesPerH: number, volumeM3: number): number {
  if (!(airChangesPerH >= 0 && volumeM3 > 0)) {
    throw new RangeError(
      `air changes must be >= 0 per hour and the volume > 0 m³, got ${airChangesPerH} and ${volumeM3}`,
    )
  }
  return (airChangesPerH * volumeM3) / S_PER_HOUR
}

/** Humidity ratio [kg/kg] of the inside air: the outside `outsideW` plus the water `evaporationKgPerS` carried by `dryAirKgPerS`. */
export function ventilatedHumidityRatio(
  outsideW: number,
  evaporationKgPerS: number,
  dryAirKgPerS: number,
): number {
  if (!(dryAirKgPerS > 0)) {
    if (evaporationKgPerS === 0) return outsideW
    throw new RangeError(
      `evaporation into unventilated air has no steady humidity (air flow ${dryAirKgPerS} kg/s)`,
    )
  }
  return outsideW + evaporationKgPerS / dryAirKgPerS
}

/**
 * The heat balance of the inside air as {@link enclosureAirRiseK} solves it: Q = (UA + (ṁ₀ + s·√|ΔT|)·c_p)·ΔT,
 * a fixed dry-air flow ṁ₀ (stated air changes) plus the stack flow s·√|ΔT| [kg/s per √K] (s from
 * {@link stackVentilationM3PerS} at 1 K times the air density).
 */
export interface EnclosureHeatBalance {
  /** Heat passed to the inside air net of evaporation, Q − λE [W] (negative: evaporation takes more than the sun gives). */
  netHeatW: number
  /** Cover loss k·A_c [W/K]. */
  coverLossWK: number
  /** Fixed dry-air flow [kg/s]. */
  fixedAirKgPerS: number
  /** Stack coefficient: dry-air flow per √K of inside–outside difference [kg s⁻¹ K⁻½]. */
  stackAirKgPerSPerRootK: number
  /** Heat capacity of the air per kg of dry air [J kg⁻¹ K⁻¹]. */
  cpJPerKgK: number
}

const RISE_TOLERANCE_K = 1e-9
const RISE_BRACKET_K = 200

/**
 * Inside–outside temperature difference ΔT [K] that balances `b` (the balance is monotonic in ΔT: one root).
 * Newton's method on f(ΔT) = (UA + ṁ(ΔT)·c_p)·ΔT − Q inside a shrinking bracket (bisection when a step leaves it).
 */
export function enclosureAirRiseK(b: EnclosureHeatBalance): number {
  const { netHeatW: q, coverLossWK: ua, fixedAirKgPerS: m0, stackAirKgPerSPerRootK: s, cpJPerKgK: cp } = b
  if (!(ua >= 0 && m0 >= 0 && s >= 0 && cp > 0 && ua + m0 + s > 0 && Number.isFinite(q))) {
    throw new RangeError(
      `enclosure balance needs losses >= 0 (not all 0), cp > 0 and a finite heat, got UA ${ua} W/K, ṁ ${m0} kg/s, stack ${s}, cp ${cp}, Q ${q} W`,
    )
  }
  if (q === 0) return 0
  let lo = -RISE_BRACKET_K
  let hi = RISE_BRACKET_K
  let x = q / (ua + (m0 + s) * cp)
  for (let i = 0; i < 100; i++) {
    const root = Math.sqrt(Math.abs(x))
    const f = (ua + (m0 + s * root) * cp) * x - q
    if (f === 0) return x
    if (f > 0) hi = x
    else lo = x
    // d/dΔT of (m0 + s·√|ΔT|)·ΔT is m0 + 1.5·s·√|ΔT|
    const slope = ua + (m0 + 1.5 * s * root) * cp
    let next = x - f / slope
    if (!(next >= lo && next <= hi)) next = (lo + hi) / 2
    if (Math.abs(next - x) < RISE_TOLERANCE_K) return next
    x = next
  }
  return x
}
