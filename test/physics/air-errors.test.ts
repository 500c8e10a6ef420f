/**
 * Every RangeError path of the moist-air functions: the message names the input, shows the value and
 * the accepted range (dryhours conventions, "Errors").
 */
import { describe, expect, it } from 'vitest'
import { airState, resolvePressureKpa } from '../../src/physics/air-state.ts'
import {
  checkDryBulb,
  checkPressure,
  dewPointFromVaporPressureC,
  frostPointFromVaporPressureC,
  saturationHumidityRatio,
  standardPressureKpaAtElevation,
} from '../../src/physics/moist-air.ts'
import {
  saturationVaporPressureIceKpa,
  saturationVaporPressureKpa,
  saturationVaporPressureLiquidKpa,
} from '../../src/physics/saturation.ts'

const sea = { pressureKpa: 101.325 }

describe('airState refuses bad input with a RangeError naming it', () => {
  const cases: [string, Parameters<typeof airState>[0], RegExp][] = [
    ['dry bulb NaN', { dryBulbC: Number.NaN, relativeHumidityPct: 50 }, /dry bulb .*-60 and 100 °C, got NaN/],
    ['dry bulb −61 °C', { dryBulbC: -61, relativeHumidityPct: 50 }, /dry bulb .*got -61/],
    ['dry bulb 101 °C', { dryBulbC: 101, relativeHumidityPct: 50 }, /dry bulb .*got 101/],
    [
      'pressure in Pa',
      { dryBulbC: 20, relativeHumidityPct: 50, pressureKpa: 101325 },
      /pressure .*30 and 110 kPa, got 101325 \(is it in Pa or hPa\?\)/,
    ],
    ['pressure in hPa', { dryBulbC: 20, relativeHumidityPct: 50, pressureKpa: 1013 }, /pressure .*got 1013/],
    ['pressure 29 kPa', { dryBulbC: 20, relativeHumidityPct: 50, pressureKpa: 29 }, /pressure .*got 29/],
    [
      'elevation 9500 m',
      { dryBulbC: 20, relativeHumidityPct: 50, elevationM: 9500 },
      /elevation .*-500 and 9000 m, got 9500/,
    ],
    [
      'pressure and elevation',
      { dryBulbC: 20, relativeHumidityPct: 50, pressureKpa: 90, elevationM: 100 },
      /either pressure or elevation/,
    ],
    [
      'no humidity',
      { dryBulbC: 20, ...sea },
      /exactly one of relative humidity, wet bulb, dew point or humidity ratio/,
    ],
    ['two humidities', { dryBulbC: 20, relativeHumidityPct: 50, dewPointC: 5, ...sea }, /exactly one of/],
    [
      'RH 120 %',
      { dryBulbC: 20, relativeHumidityPct: 120, ...sea },
      /relative humidity .*at most 100 %, got 120/,
    ],
    [
      'RH 0 %',
      { dryBulbC: 20, relativeHumidityPct: 0, ...sea },
      /relative humidity must be greater than 0.*got 0/,
    ],
    ['RH −5 %', { dryBulbC: 20, relativeHumidityPct: -5, ...sea }, /relative humidity .*got -5/],
    ['RH NaN', { dryBulbC: 20, relativeHumidityPct: Number.NaN, ...sea }, /relative humidity .*got NaN/],
    [
      'wet bulb above dry bulb',
      { dryBulbC: 20, wetBulbC: 21, ...sea },
      /wet bulb .*dry bulb \(20 °C\), got 21/,
    ],
    ['wet bulb below −100 °C', { dryBulbC: 20, wetBulbC: -101, ...sea }, /wet bulb .*got -101/],
    [
      'wet bulb below that of dry air',
      { dryBulbC: 40, wetBulbC: 5, ...sea },
      /wet bulb 5 °C is below the wet bulb of perfectly dry air at 40 °C/,
    ],
    [
      'dew point above dry bulb',
      { dryBulbC: 20, dewPointC: 25, ...sea },
      /dew point .*dry bulb \(20 °C\), got 25/,
    ],
    ['dew point below −100 °C', { dryBulbC: 20, dewPointC: -120, ...sea }, /dew point .*got -120/],
    [
      'humidity ratio 0',
      { dryBulbC: 20, humidityRatioGPerKg: 0, ...sea },
      /humidity ratio .*greater than 0 .*got 0/,
    ],
    [
      'humidity ratio above saturation',
      { dryBulbC: 20, humidityRatioGPerKg: 20, ...sea },
      /humidity ratio .*at most 14\.\d+ g\/kg \(saturation at 20 °C\), got 20/,
    ],
    [
      'dry bulb above boiling',
      { dryBulbC: 95, relativeHumidityPct: 10, pressureKpa: 70 },
      /dry bulb 95 °C is at or above the boiling point at 70 kPa/,
    ],
    [
      'dew point below −100 °C from RH',
      { dryBulbC: -55, relativeHumidityPct: 0.1, ...sea },
      /relative humidity 0\.1 % at -55 °C gives a dew point below -100 °C/,
    ],
  ]
  for (const [name, input, message] of cases) {
    it(name, () => {
      expect(() => airState(input)).toThrow(RangeError)
      expect(() => airState(input)).toThrow(message)
    })
  }
})

describe('RangeError paths of the building blocks', () => {
  it('standardPressureKpaAtElevation: below −500 m, above 9000 m, NaN', () => {
    expect(() => standardPressureKpaAtElevation(-600)).toThrow(/elevation .*got -600/)
    expect(() => standardPressureKpaAtElevation(9001)).toThrow(/elevation .*got 9001/)
    expect(() => standardPressureKpaAtElevation(Number.NaN)).toThrow(/elevation .*got NaN/)
  })
  it('resolvePressureKpa: both given; an elevation is checked like a pressure', () => {
    expect(() => resolvePressureKpa(100, 0)).toThrow(/either pressure or elevation/)
    expect(resolvePressureKpa(undefined, undefined)).toBe(101.325)
  })
  it('checkPressure and checkDryBulb', () => {
    expect(() => checkPressure(111)).toThrow(/pressure .*got 111/)
    expect(() => checkDryBulb(Number.POSITIVE_INFINITY)).toThrow(/dry bulb .*got Infinity/)
  })
  it('saturation pressure outside −100…200 °C', () => {
    expect(() => saturationVaporPressureLiquidKpa(201)).toThrow(/temperature .*-100 and 200 °C, got 201/)
    expect(() => saturationVaporPressureIceKpa(-101)).toThrow(/temperature .*got -101/)
    expect(() => saturationVaporPressureKpa(Number.NaN)).toThrow(/temperature .*got NaN/)
  })
  it('saturationHumidityRatio where water boils below the temperature', () => {
    expect(() => saturationHumidityRatio(95, 70)).toThrow(/95 °C cannot be saturated at 70 kPa/)
  })
  it('dew and frost point: vapour pressure out of range', () => {
    expect(() => dewPointFromVaporPressureC(0)).toThrow(/vapour pressure must be between .*got 0/)
    expect(() => dewPointFromVaporPressureC(2000)).toThrow(/vapour pressure .*got 2000/)
    expect(() => frostPointFromVaporPressureC(-1)).toThrow(/vapour pressure .*got -1/)
  })
})
