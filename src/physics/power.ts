/**
 * @module physics/power
 * Powers the core computes the same way on every JavaScript engine it runs on (Node and Workers ship
 * different V8 versions, and the Workers parity test compares whole assessments byte for byte):
 * - a real power of a positive base as exp(y·ln x), from Math.exp and Math.log only, never `**` or
 *   Math.pow with a non-integer exponent (test/structure/core-rules.test.ts fails on one);
 * - an integer power by repeated multiplication (exact for the powers of ten used in rounding).
 */

/**
 * x^y [–] for x ≥ 0 as exp(y·ln x); y = 0 gives 1 and y = 1 gives x exactly, x = 0 gives 0 for y > 0.
 * A negative base gives NaN (as Math.pow does for a non-integer exponent).
 */
export function power(base: number, exponent: number): number {
  if (exponent === 1) return base
  if (exponent === 0) return 1
  return Math.exp(exponent * Math.log(base))
}

/** x^n for a whole number n (negative: 1/x^|n|) by repeated multiplication; 10^n is exact for |n| ≤ 22. */
export function integerPower(base: number, n: number): number {
  if (!Number.isInteger(n)) throw new RangeError(`integer power needs a whole exponent, got ${n}`)
  let result = 1
  for (let k = 0; k < Math.abs(n); k++) result *= base
  return n < 0 ? 1 / result : result
}
