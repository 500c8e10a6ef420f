/**
 * @module product/kinetics-models
 * Thin-layer drying kinetics under constant conditions: moisture ratio MR = (M − Me)/(M0 − Me) as a
 * function of time t [h]. Forms (as listed in the R package `seedwater`, `dryingmodels`):
 * - Lewis (Newton):   MR = exp(−k·t)
 * - Page (1949):      MR = exp(−k·tⁿ)
 * - Henderson–Pabis:  MR = a·exp(−k·t)
 * - Fick diffusion (Crank 1975, *The Mathematics of Diffusion*, eqs 4.18, 5.23, 6.20; constant Deff,
 *   uniform initial moisture, surface at equilibrium): slab of thickness 2L drying from both faces,
 *   infinite cylinder and sphere of radius r (see `diffusion.ts`).
 * - Thompson et al. 1968 (shelled corn, *Trans. ASAE* 11:582): t = A·ln MR + B·(ln MR)² [constants as transcribed in public code].
 * Rate constants depend on temperature by Arrhenius, k = kRef·exp[−Ea/R·(1/T − 1/Tref)] (T in K), or, for
 * Wang & Singh 1978 (rough rice), linearly on T and RH.
 */
import { GAS_CONSTANT_J_PER_MOL_K } from './isotherm-models.ts'

const KELVIN = 273.15

/** A rate constant that depends on the drying conditions. */
export type RateLaw =
  | {
      form: 'arrhenius'
      /** k at tRefC, in h⁻¹ (Lewis, Henderson–Pabis) or h⁻ⁿ (Page). */
      kRefPerH: number
      tRefC: number
      activationEnergyJPerMol: number
    }
  | {
      /** k = k0 + kPerC·T + kPerRh·RH (RH a fraction), in `timeUnit`⁻ⁿ (Wang & Singh 1978 form). */
      form: 'linear-t-rh'
      k0: number
      kPerC: number
      kPerRh: number
      timeUnit: 'min' | 'h'
    }

/** Page exponent: constant, or n = n0 + nPerC·T + nPerRh·RH (RH a fraction). */
export type PageExponent = number | { n0: number; nPerC: number; nPerRh: number }

export type KineticsEquation =
  | { model: 'lewis'; k: RateLaw }
  | { model: 'page'; k: RateLaw; n: PageExponent }
  | { model: 'henderson-pabis'; k: RateLaw; a: number }
  | {
      model: 'diffusion'
      /** Effective diffusivity at tRefC [m²/s]. */
      dRefM2PerS: number
      tRefC: number
      activationEnergyJPerMol: number
    }
  | { model: 'thompson-corn' }

export type KineticsModelName = KineticsEquation['model']

function checkConditions(tC: number, rhPct: number): void {
  if (!(tC >= -20 && tC <= 150))
    throw new RangeError(`drying temperature must be between -20 and 150 °C, got ${tC}`)
  if (!(rhPct >= 0 && rhPct <= 100))
    throw new RangeError(`relative humidity must be between 0 and 100 %, got ${rhPct}`)
}

/** Arrhenius factor exp[−Ea/R·(1/T − 1/Tref)]. */
export function arrheniusFactor(tC: number, tRefC: number, activationEnergyJPerMol: number): number {
  return Math.exp(
    (-activationEnergyJPerMol / GAS_CONSTANT_J_PER_MOL_K) * (1 / (tC + KELVIN) - 1 / (tRefC + KELVIN)),
  )
}

/** Page exponent n at (tC, rhPct). */
export function pageExponentAt(n: PageExponent, tC: number, rhPct: number): number {
  const value = typeof n === 'number' ? n : n.n0 + n.nPerC * tC + n.nPerRh * (rhPct / 100)
  if (!(value > 0 && value < 5))
    throw new RangeError(`Page exponent must be between 0 and 5, got ${value} at ${tC} °C, ${rhPct} %`)
  return value
}

/** Rate constant [h⁻ⁿ] at (tC, rhPct), with n the Page exponent (1 for Lewis and Henderson–Pabis). */
export function rateConstantAt(k: RateLaw, tC: number, rhPct: number, n = 1): number {
  checkConditions(tC, rhPct)
  let value: number
  if (k.form === 'arrhenius') {
    value = k.kRefPerH * arrheniusFactor(tC, k.tRefC, k.activationEnergyJPerMol)
  } else {
    const perUnit = k.k0 + k.kPerC * tC + k.kPerRh * (rhPct / 100)
    // MR = exp(−k_min·t_min^n) = exp(−k_min·60^n·t_h^n)
    value = k.timeUnit === 'min' ? perUnit * 60 ** n : perUnit
  }
  if (!(value > 0))
    throw new RangeError(`drying rate constant is not positive (${value}) at ${tC} °C and ${rhPct} % RH`)
  return value
}

/** Effective diffusivity [m²/s] at tC by Arrhenius. */
export function diffusivityAt(eq: Extract<KineticsEquation, { model: 'diffusion' }>, tC: number): number {
  checkConditions(tC, 50)
  return eq.dRefM2PerS * arrheniusFactor(tC, eq.tRefC, eq.activationEnergyJPerMol)
}

/**
 * Constants of the Thompson, Peart & Foster (1968) thin-layer equation for shelled corn in the °C form
 * A = a0 + a1·T, B = b0·exp(b1·T), t in h: the paper's constants were not read; these four are as transcribed in
 * public Thompson-model drying code (cited with the corn profile in `catalogue-grains.ts`), and agree with the
 * values dryhours had from memory; the °C form agrees with the °F form A = −1.862 + 0.00488·T_F,
 * B = 427.4·exp(−0.033·T_F) (from memory).
 */
export const THOMPSON_CORN = {
  a0: { value: -1.706, unit: 'h', label: 'A = a0 + a1·T: a0' },
  a1: { value: 0.0088, unit: 'h/°C', label: 'A = a0 + a1·T: a1' },
  b0: { value: 148.7, unit: 'h', label: 'B = b0·exp(b1·T): b0' },
  b1: { value: -0.059, unit: '1/°C', label: 'B = b0·exp(b1·T): b1' },
} as const

/** Thompson et al. 1968 coefficients for shelled corn, T = drying-air temperature [°C], t in h (see THOMPSON_CORN). */
export function thompsonCornCoefficients(tC: number): { a: number; b: number } {
  checkConditions(tC, 50)
  const c = THOMPSON_CORN
  return { a: c.a0.value + c.a1.value * tC, b: c.b0.value * Math.exp(c.b1.value * tC) }
}

/** Thompson: time [h] to reach MR (0 < MR ≤ 1). */
export function thompsonTimeH(tC: number, mr: number): number {
  const { a, b } = thompsonCornCoefficients(tC)
  const x = Math.log(mr)
  return a * x + b * x * x
}

/** Thompson: MR after tH hours, the root of B·x² + A·x − t = 0 with x = ln MR ≤ 0. */
export function thompsonMoistureRatio(tC: number, tH: number): number {
  const { a, b } = thompsonCornCoefficients(tC)
  const x = (-a - Math.sqrt(a * a + 4 * b * tH)) / (2 * b)
  return Math.exp(x)
}
