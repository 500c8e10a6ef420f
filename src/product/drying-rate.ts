/**
 * @module product/drying-rate
 * Rate constants of a profile at the hour's conditions, at any thickness and air velocity.
 * Thickness: drying is taken as diffusion-controlled, so time scales with (d/dRef)² (Crank 1975; the
 * k ∝ Deff/L² rule of `diffusion.ts`), i.e. MR_d(t) = MR_dRef(t/s) with s = (d/dRef)². Air velocity: time
 * scales with (vRef/v)^e when the profile gives an exponent, otherwise velocity is ignored.
 */
import { power } from '../physics/power.ts'
import { diffusionRateConstantPerH, sizeTimeScale } from './diffusion.ts'
import { diffusivityAt, pageExponentAt, rateConstantAt, thompsonTimeH } from './kinetics-models.ts'
import type { ProductProfile } from './profile.ts'

/**
 * Drying length of `profile` at thickness or diameter `thicknessMm` [mm] and the length at which its kinetics
 * hold: the wall of a hollow product (its diameter does not enter), else the thickness or diameter itself.
 */
export function dryingLengthsMm(
  profile: ProductProfile,
  thicknessMm: number,
): { sizeMm: number; referenceMm: number } {
  const k = profile.kinetics
  if (k.wallThicknessMm !== undefined) {
    return {
      sizeMm: k.wallThicknessMm.value,
      referenceMm: k.referenceWallThicknessMm ?? k.wallThicknessMm.value,
    }
  }
  return { sizeMm: thicknessMm, referenceMm: k.referenceThicknessMm }
}

/**
 * Time-scale factor s: the product at thickness d and velocity v needs s times the reference time. Size:
 * by the first term of diffusion with the profile's surface resistance (`biotNumber`; none: (d/dRef)², Crank
 * 1975), over the wall for hollow products (product/diffusion.ts `sizeTimeScale`).
 */
export function timeScaleFactor(
  profile: ProductProfile,
  thicknessMm?: number,
  airVelocityMs?: number,
): number {
  const k = profile.kinetics
  let s = 1
  if (thicknessMm !== undefined && k.equation.model !== 'diffusion') {
    if (!(thicknessMm > 0 && thicknessMm < 1000)) {
      throw new RangeError(`thickness must be between 0 and 1000 mm, got ${thicknessMm}`)
    }
    const { sizeMm, referenceMm } = dryingLengthsMm(profile, thicknessMm)
    s *=
      k.biotNumber === undefined
        ? (sizeMm / referenceMm) ** 2
        : sizeTimeScale(k.shape, sizeMm, referenceMm, k.biotNumber.value)
  }
  if (airVelocityMs !== undefined && k.airVelocity) {
    if (!(airVelocityMs > 0 && airVelocityMs <= 30)) {
      throw new RangeError(`air velocity must be above 0 and at most 30 m/s, got ${airVelocityMs}`)
    }
    s *= power(k.airVelocity.referenceMs / airVelocityMs, k.airVelocity.exponent)
  }
  return s
}

/** Page-form parameters at the hour: MR = exp(−k·tⁿ), t in h (n = 1 for Lewis, Henderson–Pabis and diffusion). */
export interface RateParameters {
  /** k [h⁻ⁿ] at the given thickness and velocity. */
  kPerHn: number
  n: number
}

/**
 * Rate parameters of the exponential models at tC [°C], rhPct [%]; `null` for the Thompson corn equation
 * (not of Page form). Thickness `thicknessMm` defaults to the profile's default.
 */
export function rateParametersAt(
  profile: ProductProfile,
  tC: number,
  rhPct: number,
  airVelocityMs?: number,
  thicknessMm?: number,
): RateParameters | null {
  const eq = profile.kinetics.equation
  const d = thicknessMm ?? profile.defaultThicknessMm.value
  if (eq.model === 'thompson-corn') return null
  if (eq.model === 'diffusion') {
    const kin = profile.kinetics
    const { sizeMm, referenceMm } = dryingLengthsMm(profile, d)
    const biot =
      kin.biotNumber === undefined ? Number.POSITIVE_INFINITY : (kin.biotNumber.value * sizeMm) / referenceMm
    // a hollow product's wall dries from its outer face: a slab of twice the wall drying from both faces
    const hollow = kin.wallThicknessMm !== undefined
    const k = diffusionRateConstantPerH(
      diffusivityAt(eq, tC),
      hollow ? 'slab' : kin.shape,
      hollow ? 2 * sizeMm : sizeMm,
      biot,
    )
    return { kPerHn: k / timeScaleFactor(profile, undefined, airVelocityMs), n: 1 }
  }
  const n = eq.model === 'page' ? pageExponentAt(eq.n, tC, rhPct) : 1
  const s = timeScaleFactor(profile, d, airVelocityMs)
  return { kPerHn: rateConstantAt(eq.k, tC, rhPct, n) / power(s, n), n }
}

/**
 * First-order-equivalent drying rate constant [h⁻¹] of `profile` at tC [°C] and rhPct [%]: 1 / (time for
 * MR to fall to 1/e). Equals k for Lewis, Henderson–Pabis and diffusion (first term), k^(1/n) for Page.
 * Used for rewetting and for quick comparisons; `stepMoisture` uses the full model.
 */
export function dryingRateConstantPerH(
  profile: ProductProfile,
  tC: number,
  rhPct: number,
  airVelocityMs?: number,
  thicknessMm?: number,
): number {
  const p = rateParametersAt(profile, tC, rhPct, airVelocityMs, thicknessMm)
  if (p) return power(p.kPerHn, 1 / p.n)
  const s = timeScaleFactor(profile, thicknessMm ?? profile.defaultThicknessMm.value, airVelocityMs)
  return 1 / (s * thompsonTimeH(tC, Math.exp(-1)))
}
