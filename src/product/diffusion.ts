/**
 * @module product/diffusion
 * Fick's second law with constant effective diffusivity Deff, uniform initial moisture and the surface at
 * equilibrium (Crank 1975, *The Mathematics of Diffusion*, 2nd ed.: plane sheet eq 4.18, cylinder eq 5.23,
 * sphere eq 6.20), written with τ = Deff·t/L², L = half-thickness (slab drying from both faces) or radius:
 * - slab:     MR = Σ 8/((2n+1)²π²)·exp(−(2n+1)²π²τ/4)
 * - cylinder: MR = Σ 4/βn²·exp(−βn²τ), βn the roots of J0 (2.40483, 5.52008, …)
 * - sphere:   MR = Σ 6/(n²π²)·exp(−n²π²τ)
 * The first term gives the rate constant used hour by hour: k = π²Deff/(4L²) (slab), β1²Deff/r² (cylinder),
 * π²Deff/r² (sphere). Halving the thickness quadruples k.
 */
import type { Shape } from './profile.ts'

/** First roots of the Bessel function J0 (Abramowitz & Stegun 1964, Table 9.5). */
const J0_ROOTS = [
  2.404825557695773, 5.520078110286311, 8.653727912911013, 11.79153443901428, 14.93091770848779,
  18.07106396791092, 21.21163662987926, 24.3524715307493, 27.49347913204025, 30.63460646843198,
  33.77582021357357, 36.91709835366404, 40.05842576462824, 43.19979171317673, 46.34118837166181,
  49.48260989739782, 52.624051841115, 55.76551075501998, 58.90698392608094, 62.04846919022717,
]

/** Characteristic length L [m]: half of a slab's thickness (both faces dry), or the radius (cylinder, sphere). */
export function characteristicLengthM(thicknessMm: number): number {
  if (!(thicknessMm > 0 && thicknessMm < 1000)) {
    throw new RangeError(`thickness must be between 0 and 1000 mm, got ${thicknessMm}`)
  }
  return thicknessMm / 2000
}

/** First-eigenvalue squared: λ1 with k = λ1·Deff/L². */
export function firstEigenvalue(shape: Shape): number {
  if (shape === 'slab') return (Math.PI * Math.PI) / 4
  if (shape === 'cylinder') return J0_ROOTS[0] ** 2
  return Math.PI * Math.PI
}

/** Hour-by-hour rate constant [h⁻¹] from Deff [m²/s], shape and thickness/diameter [mm] (first series term). */
export function diffusionRateConstantPerH(
  diffusivityM2PerS: number,
  shape: Shape,
  thicknessMm: number,
): number {
  if (!(diffusivityM2PerS > 0 && diffusivityM2PerS < 1e-5)) {
    throw new RangeError(`effective diffusivity must be between 0 and 1e-5 m²/s, got ${diffusivityM2PerS}`)
  }
  const l = characteristicLengthM(thicknessMm)
  return (firstEigenvalue(shape) * diffusivityM2PerS * 3600) / (l * l)
}

/** Full series MR(τ) for a shape (60 terms); τ < 1e-3 uses the short-time expansion instead. */
export function diffusionMoistureRatio(shape: Shape, tau: number, terms = 60): number {
  if (!(tau >= 0)) throw new RangeError(`dimensionless time must be ≥ 0, got ${tau}`)
  if (tau === 0) return 1
  if (tau < 1e-3) {
    // Short-time expansions of the amount desorbed (Crank 1975 eqs 4.20, 5.24, 6.21):
    // slab 1 − 2√(τ/π); cylinder 1 − 4√(τ/π) + τ; sphere 1 − 6√(τ/π) + 3τ
    const r = Math.sqrt(tau / Math.PI)
    if (shape === 'slab') return 1 - 2 * r
    if (shape === 'cylinder') return 1 - 4 * r + tau
    return 1 - 6 * r + 3 * tau
  }
  let sum = 0
  if (shape === 'slab') {
    for (let n = 0; n < terms; n++) {
      const m = 2 * n + 1
      sum += (8 / (m * m * Math.PI * Math.PI)) * Math.exp((-m * m * Math.PI * Math.PI * tau) / 4)
    }
  } else if (shape === 'sphere') {
    for (let n = 1; n <= terms; n++) {
      sum += (6 / (n * n * Math.PI * Math.PI)) * Math.exp(-n * n * Math.PI * Math.PI * tau)
    }
  } else {
    for (let i = 0; i < Math.min(terms, J0_ROOTS.length); i++) {
      const b = J0_ROOTS[i]
      sum += (4 / (b * b)) * Math.exp(-b * b * tau)
    }
    // beyond the tabulated roots, βn ≈ (n − 1/4)π (McMahon's asymptotic form, A&S 9.5.12)
    for (let n = J0_ROOTS.length + 1; n <= terms; n++) {
      const b = (n - 0.25) * Math.PI
      sum += (4 / (b * b)) * Math.exp(-b * b * tau)
    }
  }
  return Math.min(1, sum)
}

/** MR after tH hours for Deff [m²/s], shape and thickness/diameter [mm], by the full series. */
export function diffusionMoistureRatioAt(
  diffusivityM2PerS: number,
  shape: Shape,
  thicknessMm: number,
  tH: number,
): number {
  const l = characteristicLengthM(thicknessMm)
  return diffusionMoistureRatio(shape, (diffusivityM2PerS * tH * 3600) / (l * l))
}
