/**
 * @module climate-demo/random
 * Small, seeded, dependency-free random numbers for the invented demo climates. Same seed, same numbers,
 * on every platform: only 32-bit integer arithmetic (`Math.imul`) and IEEE-754 doubles are used.
 */

/**
 * mulberry32: a 32-bit-state generator by Tommy Ettinger (2017, public domain), as widely copied in
 * JavaScript (from memory). Returns a function giving uniform numbers in [0, 1). Period 2^32, plenty for
 * demo weather; not for cryptography.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/**
 * 32-bit FNV-1a hash of a string (Fowler, Noll & Vo; offset basis 2166136261, prime 16777619, from memory),
 * used to give every site and every random process its own stream from one seed.
 */
export function fnv1a32(text: string): number {
  let hash = 2166136261
  for (let i = 0; i < text.length; i++) {
    hash ^= text.charCodeAt(i)
    hash = Math.imul(hash, 16777619)
  }
  return hash >>> 0
}

/** A named random stream: uniform [0, 1) and standard normal draws. */
export interface RandomStream {
  uniform(): number
  normal(): number
}

/**
 * Stream for `(seed, name)`. Normal draws by the Box–Muller transform (Box & Muller 1958, Ann. Math.
 * Statist. 29:610), one value per pair of uniforms (the second is discarded to keep streams simple).
 */
export function randomStream(seed: number, name: string): RandomStream {
  const next = mulberry32((seed ^ fnv1a32(name)) >>> 0)
  return {
    uniform: next,
    normal(): number {
      const u1 = 1 - next() // (0, 1]: log is finite
      const u2 = next()
      return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2)
    },
  }
}

/**
 * Standard normal cumulative distribution Φ(z) via the error function approximation of Abramowitz &
 * Stegun (1964), Handbook of Mathematical Functions, eq 7.1.26 (|error| < 1.5e−7).
 */
export function standardNormalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2
  const t = 1 / (1 + 0.3275911 * x)
  const poly =
    t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))))
  const erf = 1 - poly * Math.exp(-x * x)
  return z >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf)
}

/**
 * First-order autoregressive series x[i] = φ·x[i−1] + σ·√(1−φ²)·ε[i], ε standard normal, started from its
 * stationary distribution, so every value has standard deviation `sd` and lag-one correlation `phi`.
 */
export function ar1Series(stream: RandomStream, length: number, phi: number, sd: number): Float64Array {
  const out = new Float64Array(length)
  const innovationSd = sd * Math.sqrt(1 - phi * phi)
  let x = sd * stream.normal()
  for (let i = 0; i < length; i++) {
    if (i > 0) x = phi * x + innovationSd * stream.normal()
    out[i] = x
  }
  return out
}
