import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { integerPower, power } from '../../src/physics/power.ts'

describe('powers with the same bits on every engine (physics/power.ts)', () => {
  it('power(x, y) agrees with x^y to 1e-14 relative over the ranges the isotherms and kinetics use', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        (x, y) => {
          const exact = x ** y // reference only (tests may use **)
          expect(Math.abs(power(x, y) - exact)).toBeLessThanOrEqual(1e-13 * Math.abs(exact))
        },
      ),
      { seed: 20_261_205, numRuns: 2000 },
    )
  })
  it('y = 1 returns x itself, y = 0 returns 1, x = 0 with y > 0 returns 0, a negative base NaN', () => {
    expect(power(0.7315, 1)).toBe(0.7315)
    expect(power(123.4, 0)).toBe(1)
    expect(power(0, 0.37)).toBe(0)
    expect(power(-2, 0.5)).toBeNaN()
  })
  it('integerPower: exact powers of ten, negative exponents as reciprocals, whole exponents only', () => {
    expect(integerPower(10, 3)).toBe(1000)
    expect(integerPower(10, 22)).toBe(1e22)
    expect(integerPower(10, -2)).toBe(0.01)
    expect(integerPower(2, 0)).toBe(1)
    expect(() => integerPower(10, 1.5)).toThrow(/whole exponent/)
  })
})
