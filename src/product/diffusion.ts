/**
 * @module product/diffusion
 * Fick's second law with constant effective diffusivity Deff, uniform initial moisture and the surface at
 * equilibrium (Crank 1975, *The Mathematics of Diffusion*, 2nd ed.: plane sheet eq 4.18, cylinder eq 5.23,
 * sphere eq 6.20), written with τ = Deff·t/L², L = half-thickness (slab drying from both faces) or radius:
 * - slab:     MR = Σ 8/((2n+1)²π²)·exp(−(2n+1)²π²τ/4)
 * - cylinder: MR = Σ 4/βn²·exp(−βn²τ), βn the roots of J0 (2.40483, 5.52008, …)
 * - sphere:   MR = Σ 6/(n²π²)·exp(−n²π²τ)
 * The first term gives the rate constant used hour by hour: k = π²Deff/(4L²) (slab), β1²Deff/r² (cylinder),
 * π²Deff/r² (sphere). Halving the thickness quadruples k. With a resistance at the surface (a skin), the
 * surface-evaporation condition of Crank 1975 replaces these roots by those of {@link firstSurfaceRoot}, and
 * size scaling moves from d² toward d¹ as the Biot number falls ({@link sizeTimeScale}).
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

/**
 * Hour-by-hour rate constant [h⁻¹] from Deff [m²/s], shape and thickness/diameter [mm] (first series term);
 * with a surface resistance, `biot` Bi = h·L/D at this size, the first root of the surface-evaporation
 * condition replaces the equilibrium-surface one ({@link firstSurfaceRoot}).
 */
export function diffusionRateConstantPerH(
  diffusivityM2PerS: number,
  shape: Shape,
  thicknessMm: number,
  biot = Number.POSITIVE_INFINITY,
): number {
  if (!(diffusivityM2PerS > 0 && diffusivityM2PerS < 1e-5)) {
    throw new RangeError(`effective diffusivity must be between 0 and 1e-5 m²/s, got ${diffusivityM2PerS}`)
  }
  const l = characteristicLengthM(thicknessMm)
  const beta = biot === Number.POSITIVE_INFINITY ? Number.NaN : firstSurfaceRoot(shape, biot)
  const lambda = Number.isNaN(beta) ? firstEigenvalue(shape) : beta * beta
  return (lambda * diffusivityM2PerS * 3600) / (l * l)
}

/**
 * J0(x) and J1(x) by their power series (Abramowitz & Stegun 1964, eq 9.1.10), for 0 ≤ x ≤ 3 where 30 terms
 * reach full double precision; into `out` [J0, J1].
 */
function besselJ01(x: number, out: Float64Array): void {
  const q = -(x * x) / 4
  let term0 = 1
  let term1 = x / 2
  let j0 = term0
  let j1 = term1
  for (let k = 1; k < 30; k++) {
    term0 *= q / (k * k)
    term1 *= q / (k * (k + 1))
    j0 += term0
    j1 += term1
  }
  out[0] = j0
  out[1] = j1
}

const bessel = new Float64Array(2)

/**
 * f(β) whose root in the first interval is the first eigenvalue of drying with a surface resistance (Crank
 * 1975, The Mathematics of Diffusion, 2nd ed., the "evaporation at the surface" condition −D ∂C/∂n = h(C_s − C_e):
 * plane sheet β tan β = Bi (§4.3.5), cylinder β J1(β) − Bi J0(β) = 0 (§5.3.2), sphere β cot β + Bi − 1 = 0
 * (§6.3.4); sections from memory), written without poles: slab β sin β − Bi cos β, sphere β cos β − (1 − Bi)
 * sin β, cylinder β J1(β) − Bi J0(β). Negative left of the root, positive right of it.
 */
function surfaceRootFunction(shape: Shape, biot: number, beta: number): number {
  if (shape === 'slab') return beta * Math.sin(beta) - biot * Math.cos(beta)
  if (shape === 'sphere') return -(beta * Math.cos(beta) - (1 - biot) * Math.sin(beta))
  besselJ01(beta, bessel)
  return beta * bessel[1] - biot * bessel[0]
}

/** The first root's bracket: (0, π/2) for a slab, (0, j0,1) for a cylinder, (0, π) for a sphere. */
function surfaceRootUpper(shape: Shape): number {
  if (shape === 'slab') return Math.PI / 2
  if (shape === 'cylinder') return J0_ROOTS[0]
  return Math.PI
}

let lastShape: Shape | null = null
let lastBiot = Number.NaN
let lastRoot = Number.NaN

/**
 * First root β1 of the surface-evaporation eigenvalue equation for `shape` at Biot number `biot` (Bi = h·L/D,
 * L the half-thickness or the radius; see {@link surfaceRootFunction}), by bisection to 1e-14: the first-term
 * rate constant is β1²·D/L². Bi → ∞ gives the equilibrium-surface roots π/2, 2.40483, π (internal diffusion:
 * time ∝ size²); Bi → 0 gives β1² → Bi, 2·Bi, 3·Bi (the skin limits: k = Bi·D/L² ∝ h/L, time ∝ size). The roots
 * are those tabulated by Crank 1975 (Tables 4.1, 5.2, 6.1, not read here) and by Watts 2007 (Appendix A,
 * Tables A.1 and A.2), checked in test/product/surface-resistance.test.ts. The last result is kept (the engine
 * asks for the same product and size many times).
 */
export function firstSurfaceRoot(shape: Shape, biot: number): number {
  if (!(biot > 0)) throw new RangeError(`Biot number must be above 0, got ${biot}`)
  if (biot === Number.POSITIVE_INFINITY) return Math.sqrt(firstEigenvalue(shape))
  if (shape === lastShape && biot === lastBiot) return lastRoot
  let lo = 0
  let hi = surfaceRootUpper(shape)
  for (let i = 0; i < 200 && hi - lo > 1e-14; i++) {
    const mid = 0.5 * (lo + hi)
    if (surfaceRootFunction(shape, biot, mid) < 0) lo = mid
    else hi = mid
  }
  lastShape = shape
  lastBiot = biot
  lastRoot = 0.5 * (lo + hi)
  return lastRoot
}

/**
 * Time-scale factor [–] of drying at size `sizeMm` against `referenceMm` by the first term of diffusion with a
 * surface resistance: the product at size d needs s times the reference time, s = (d/d_ref)²·β1(Bi_ref)²/β1(Bi_d)²,
 * Bi_d = Bi_ref·d/d_ref (Bi grows with size: the internal resistance does, the skin's does not). Bi_ref = ∞
 * (no surface resistance) gives (d/d_ref)².
 */
export function sizeTimeScale(
  shape: Shape,
  sizeMm: number,
  referenceMm: number,
  biotAtReference: number,
): number {
  const r = sizeMm / referenceMm
  if (biotAtReference === Number.POSITIVE_INFINITY) return r * r
  const bRef = firstSurfaceRoot(shape, biotAtReference)
  const bD = firstSurfaceRoot(shape, biotAtReference * r)
  return (r * r * bRef * bRef) / (bD * bD)
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
