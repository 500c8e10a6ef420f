import fc from 'fast-check'
import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { idealDryerHeat } from '../../../src/analysis/energy/dryer-physics.ts'
import {
  expectedSpecificEnergy,
  fitPhysics,
  physicsLeverage,
} from '../../../src/analysis/energy/physics-fit.ts'
import { latentHeatVaporizationMjPerKg } from '../../../src/physics/evaporation.ts'
import { moistAirEnthalpyKjPerKg } from '../../../src/physics/moist-air.ts'

psychrolib.SetUnitSystem(psychrolib.SI)

describe('ideal heat per kg of water of a convective dryer', () => {
  const base = { outsideTempC: 15, outsideHumidityRatioKgPerKg: 0.009, dryingTempC: 60, pressureKpa: 101.325 }
  it('worked example against psychrolib (ASHRAE HOF 2017 ch. 1 in code form)', () => {
    const r = idealDryerHeat(base)
    // q = 1.006·45 + 0.009·1.86·45 = 45.270 + 0.753 = 46.023 kJ/kg dry air (eq 30 by hand).
    expect(r.heatingKjPerKgAir).toBeCloseTo(46.023, 3)
    const wetBulb = psychrolib.GetTWetBulbFromHumRatio(60, 0.009, 101325)
    expect(r.heatedWetBulbC).toBeCloseTo(wetBulb, 2)
    const capacity = psychrolib.GetSatHumRatio(wetBulb, 101325) - 0.009
    expect(r.pickupCapacityKgPerKgAir).toBeCloseTo(capacity, 5)
    const phi =
      (psychrolib.GetMoistAirEnthalpy(60, 0.009) - psychrolib.GetMoistAirEnthalpy(15, 0.009)) / capacity
    expect(r.idealHeatMjPerKgWater).toBeCloseTo(phi / 1e6, 3)
    // t* ≈ 27.1 °C, ΔW* ≈ 13.8 g/kg: φ ≈ 3.33 MJ per kg of water, 1.36 times the latent heat at t*.
    expect(r.idealHeatMjPerKgWater).toBeCloseTo(3.333, 2)
  })
  it('closes the energy balance of adiabatic saturation: h(t*, W*) = h(t_d, Wₐ) + ΔW*·4.186·t* (ASHRAE eq 33)', () => {
    const r = idealDryerHeat(base)
    const wStar = base.outsideHumidityRatioKgPerKg + r.pickupCapacityKgPerKgAir
    const left = moistAirEnthalpyKjPerKg(r.heatedWetBulbC, wStar)
    const right = moistAirEnthalpyKjPerKg(60, 0.009) + r.pickupCapacityKgPerKgAir * 4.186 * r.heatedWetBulbC
    expect(left).toBeCloseTo(right, 2)
  })
  it('needs more heat per kg of water in colder and in moister outside air (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 35, noNaN: true }),
        fc.double({ min: 0.002, max: 0.015, noNaN: true }),
        (t, w) => {
          const at = (tC: number, wa: number) =>
            idealDryerHeat({ ...base, outsideTempC: tC, outsideHumidityRatioKgPerKg: wa })
              .idealHeatMjPerKgWater
          expect(at(t, w)).toBeGreaterThan(at(t + 2, w))
          expect(at(t, w + 0.001)).toBeGreaterThan(at(t, w))
        },
      ),
      { numRuns: 200, seed: 18 },
    )
  })
  it('adds the heat of sorption as air that carries less water: φ × (1 + q_s/λ(t*))', () => {
    const free = idealDryerHeat(base)
    const bound = idealDryerHeat({ ...base, sorptionHeatMjPerKgWater: 0.2 })
    expect(bound.idealHeatMjPerKgWater / free.idealHeatMjPerKgWater).toBeCloseTo(
      1 + 0.2 / latentHeatVaporizationMjPerKg(free.heatedWetBulbC),
      12,
    )
  })
  it('rejects drying air that is not warmer than outside', () => {
    expect(() => idealDryerHeat({ ...base, outsideTempC: 60 })).toThrow(/must be warmer than the outside air/)
  })
})

describe('physics fit: efficiency and fixed loss over the baseline', () => {
  const phi = [3.1, 3.3, 2.9, 3.2, 3.0, 3.4, 2.8, 3.15]
  const water = [1100, 900, 1300, 1000, 1250, 950, 1200, 1050]
  it('recovers η and L from batches that follow the model exactly', () => {
    const e = phi.map((p, i) => p / 0.7 + 150 / water[i])
    const fit = fitPhysics(phi, water, e)
    expect(fit.efficiency).toBeCloseTo(0.7, 10)
    expect(fit.fixedLossMj).toBeCloseTo(150, 6)
    expect(fit.fixedLossHeldAtZero).toBe(false)
    expect(fit.crossValidatedError).toBeLessThan(1e-9)
    expect(expectedSpecificEnergy(fit, 3, 1000)).toBeCloseTo(3 / 0.7 + 0.15, 9)
  })
  it('holds a negative fixed loss at zero', () => {
    const e = phi.map((p, i) => p / 0.7 - 100 / water[i])
    const fit = fitPhysics(phi, water, e)
    expect(fit.fixedLossHeldAtZero).toBe(true)
    expect(fit.fixedLossMj).toBe(0)
    expect(fit.fixedLossStandardError).toBeNull()
  })
  it('its cross-validated error equals refitting without each batch in turn (PRESS identity)', () => {
    const noise = [0.015, -0.025, 0.01, 0.02, -0.005, -0.015, 0.025, -0.01]
    const e = phi.map((p, i) => p / 0.7 + 400 / water[i] + noise[i])
    const fit = fitPhysics(phi, water, e)
    expect(fit.fixedLossHeldAtZero).toBe(false)
    let press = 0
    for (let i = 0; i < phi.length; i++) {
      const keep = (_: number, j: number) => j !== i
      const f = fitPhysics(phi.filter(keep), water.filter(keep), e.filter(keep))
      expect(f.fixedLossHeldAtZero).toBe(false)
      press += (e[i] - expectedSpecificEnergy(f, phi[i], water[i])) ** 2
    }
    expect(fit.crossValidatedError).toBeCloseTo(Math.sqrt(press / phi.length), 10)
    // Leverages of the fitted batches sum to the number of parameters (2).
    expect(phi.reduce((s, p, i) => s + physicsLeverage(fit, p, water[i]), 0)).toBeCloseTo(2, 10)
    // A batch in weather far from the baseline's (φ well below) has a larger leverage.
    expect(physicsLeverage(fit, 2.2, 1100)).toBeGreaterThan(physicsLeverage(fit, 3.1, 1100))
  })
  it('rejects too few batches and values that are not positive', () => {
    expect(() => fitPhysics([1, 2, 3], [1, 2, 3], [1, 2, 3])).toThrow(/at least 4/)
    expect(() => fitPhysics([1, 2, 3, -1], [1, 2, 3, 4], [1, 2, 3, 4])).toThrow(/batch 4/)
  })
})
