// Column recognition, explicit mapping, and RH from wet bulb (checked against psychrolib 1.1.1,
// which implements ASHRAE Handbook — Fundamentals 2017 ch. 1; above 0 °C its RH is over liquid water like ours).

import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { planColumns } from '../../src/weather/columns.ts'
import { analyseHeader, classifyHeader, splitHeader } from '../../src/weather/header-parts.ts'
import { parseMappingArgument } from '../../src/weather/options.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { csv, hourStamps } from './csv-builder.ts'

psychrolib.SetUnitSystem(psychrolib.SI)
/** psychrolib 1.1.1 has GetRelHumFromTWetBulb(T [°C], Twb [°C], p [Pa]) → RH [0–1]; the project's type file omits it. */
const relHumFromWetBulb = (t: number, twb: number, p: number): number =>
  (
    psychrolib as unknown as { GetRelHumFromTWetBulb: (t: number, twb: number, p: number) => number }
  ).GetRelHumFromTWetBulb(t, twb, p)

describe('headers', () => {
  it('split name, unit and measurement height', () => {
    expect(splitHeader('Wind Speed at 2 m (km/h)')).toMatchObject({
      name: 'wind speed at 2 m',
      unitText: 'km/h',
      heightM: 2,
    })
    expect(analyseHeader('temp_F')).toMatchObject({
      meaning: { kind: 'variable', variable: 'dryBulb' },
      units: ['f'],
    })
    expect(splitHeader('Pressure [hPa]')).toMatchObject({ name: 'pressure', unitText: 'hPa' })
  })

  it('dew point, wet bulb and sea-level pressure are not taken for dry bulb or station pressure', () => {
    expect(classifyHeader('dew point temperature')).toMatchObject({ kind: 'variable', variable: 'dewPoint' })
    expect(classifyHeader('wet bulb temperature')).toMatchObject({ kind: 'variable', variable: 'wetBulb' })
    expect(classifyHeader('sea level pressure')).toMatchObject({ kind: 'excluded' })
    expect(classifyHeader('wind direction')).toBeNull()
    expect(classifyHeader('dry bulb source flag')).toBeNull()
  })

  it('a mapping by column number and "none" override detection', () => {
    const plan = planColumns(['time', 'temperature', 'rh', 'solar'], {
      dryBulb: { column: '#2', unit: 'F' },
      ghi: { column: 'none' },
    })
    expect(plan.variables.dryBulb).toMatchObject({ index: 1, unitSource: 'mapping' })
    expect(plan.variables.dryBulb?.conversion?.unit).toBe('°F')
    expect(plan.variables.ghi).toBeUndefined()
  })

  it('mapping arguments: variable=column[:unit], time fields take no unit', () => {
    expect(parseMappingArgument('relativeHumidity=obs_humid:fraction')).toEqual([
      'relativeHumidity',
      { column: 'obs_humid', unit: 'fraction' },
    ])
    expect(parseMappingArgument('time=Time (HH:MM)')).toEqual(['time', { column: 'Time (HH:MM)' }])
    expect(() => parseMappingArgument('humidity=rh')).toThrow(/unknown variable 'humidity'/)
    expect(() => readWeather('a,b\n1,2\n', { mapping: { dryBulb: { column: 'x' } } })).toThrow(
      /no such column/,
    )
    expect(() =>
      readWeather('time,t\n1,2\n', { mapping: { dryBulb: { column: 't', unit: 'furlongs' } } }),
    ).toThrow(/not a unit of dryBulb/)
  })
})

describe('humidity from wet bulb', () => {
  it('matches psychrolib GetRelHumFromTWetBulb at the file pressure', () => {
    const cases = [
      [30, 20, 101.325],
      [25, 15, 90],
      [12, 10, 100],
      [5, 2, 95],
    ]
    // one file per case: different pressures in consecutive hours would be rejected as spikes
    for (const [t, twb, p] of cases) {
      const [stamp] = hourStamps('2021-06-01T00:00Z', 1)
      const r = readWeather(
        csv(['timestamp', 'dry bulb (C)', 'wet bulb (C)', 'pressure (kPa)'], [[stamp, t, twb, p]]),
        { utcOffsetHours: 0 },
      )
      const expected = 100 * relHumFromWetBulb(t, twb, p * 1000)
      expect(r.series.relativeHumidityPct[0]).toBeCloseTo(expected, 6)
    }
  })
})
