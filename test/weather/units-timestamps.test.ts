// Unit tokens, timestamp forms and header words against hand-computed values. Conversion factors:
// NIST SP 811 (Thompson & Taylor 2008, "Guide for the Use of the International System of Units
// (SI)", App. B.8 and B.9): °F (t − 32)/1.8, K t − 273.15, 1 inHg (conventional) = 3386.389 Pa,
// 1 mph = 0.44704 m/s, 1 knot = 1852/3600 m/s, 1 in = 25.4 mm, 1 cal_th/cm² (langley) = 41 840 J/m²
// (from memory). Two-digit years: The Open Group, Single UNIX Specification v2, strptime `%y`.

import { describe, expect, it } from 'vitest'
import { analyseHeader } from '../../src/weather/header-parts.ts'
import { headerTimeBasis } from '../../src/weather/header-time.ts'
import { createTimestampColumns, type TimestampColumns } from '../../src/weather/timestamp-columns.ts'
import { parseTimeOfDay, parseTimestampInto } from '../../src/weather/timestamps.ts'
import { isUnitToken, unitConversion, type WeatherVariable } from '../../src/weather/units.ts'

function si(variable: WeatherVariable, token: string, value: number): number {
  const c = unitConversion(variable, token)
  if (c === null) throw new Error(`no conversion for ${token}`)
  return value * c.scale + c.offset
}

describe('unit tokens (NIST SP 811 factors)', () => {
  it.each([
    ['°F', 32, 0],
    ['F', 212, 100],
    ['degF', 50, 10],
    ['℉', -40, -40],
    ['degrees Fahrenheit', 98.6, 37],
    ['°C', 21.5, 21.5],
    ['deg C', 21.5, 21.5],
    ['℃', 5, 5],
    ['K', 273.15, 0],
    ['kelvin', 300, 26.85],
  ])('temperature %s: %d → %d °C', (token, value, expected) => {
    expect(si('dryBulb', token, value)).toBeCloseTo(expected, 10)
  })

  it.each([
    ['knots', 10, 5.144444444444],
    ['kt', 1, 0.514444444444],
    ['mph', 10, 4.4704],
    ['km/h', 36, 10],
    ['km h-1', 18, 5],
    ['m s-1', 3, 3],
    ['meters/second', 2.5, 2.5],
    ['m/s', 4, 4],
  ])('wind %s: %d → %d m/s', (token, value, expected) => {
    expect(si('wind', token, value)).toBeCloseTo(expected, 9)
  })

  it.each([
    ['inHg', 29.92, 101.3207589],
    ['in Hg', 30, 101.59167],
    ['hPa', 1013.25, 101.325],
    ['mbar', 1000, 100],
    ['mB', 986.4, 98.64],
    ['Pa', 101325, 101.325],
    ['kPa', 99.5, 99.5],
  ])('pressure %s: %d → %d kPa', (token, value, expected) => {
    expect(si('pressure', token, value)).toBeCloseTo(expected, 5)
  })

  it.each([
    ['W/m²', 500, 500],
    ['W m-2', 500, 500],
    ['W/m^2', 500, 500],
    ['w/m2', 500, 500],
    ['Wh/m2', 650, 650], // an hour's amount equals its mean in W/m² (1 Wh/m² per 3600 s)
    ['kWh/m2', 0.65, 650],
    ['J/m2', 3.6e6, 1000], // 3.6 MJ over 3600 s
    ['J m**-2', 1.8e6, 500],
    ['kJ/m2', 1800, 500],
    ['MJ/m²', 3.6, 1000],
    ['J/cm²', 360, 1000], // 360 J/cm² = 3.6 MJ/m²
    ['ly', 1, 11.6222222222], // 41 840 J/m² over an hour
    ['Ly/day', 100, 48.4259259259], // 4.184 MJ/m² over a day (86 400 s)
    ['W/sq.m', 250, 250],
  ])('irradiance %s: %d → %d W/m² (hour mean)', (token, value, expected) => {
    expect(si('ghi', token, value)).toBeCloseTo(expected, 6)
  })

  it('energy-per-area units are marked as amounts over the interval, rates are not', () => {
    expect(unitConversion('ghi', 'J/m2')?.amount).toBe(true)
    expect(unitConversion('ghi', 'Wh/m2')?.amount).toBe(true)
    expect(unitConversion('ghi', 'W/m2')?.amount).toBeUndefined()
    expect(unitConversion('ghi', 'Ly/day')?.amount).toBeUndefined()
  })

  it.each([
    ['in', 0.5, 12.7],
    ['inches', 1, 25.4],
    ['mm', 2.2, 2.2],
    ['cm', 1.5, 15],
    ['m', 0.0012, 1.2],
    ['kg m-2', 3, 3], // 1 kg of water over 1 m² is 1 mm deep (density 1000 kg/m³)
    ['in/hr', 0.1, 2.54],
  ])('precipitation %s: %d → %d mm', (token, value, expected) => {
    expect(si('rain', token, value)).toBeCloseTo(expected, 9)
  })

  it('humidity and cloud cover: fractions, oktas, tenths', () => {
    expect(si('relativeHumidity', 'fraction', 0.55)).toBeCloseTo(55, 10)
    expect(si('relativeHumidity', '%RH', 55)).toBe(55)
    expect(si('cloudCover', 'oktas', 4)).toBe(50)
    expect(si('cloudCover', 'tenths', 3)).toBe(30)
  })

  it('a token of one family is not a unit of another; long text is no unit', () => {
    expect(unitConversion('dryBulb', 'mph')).toBeNull()
    expect(unitConversion('wind', '°C')).toBeNull()
    expect(unitConversion('pressure', 'in')).toBeNull() // inches alone are a depth; inHg is a pressure
    expect(isUnitToken('LGR S/N: 20814467')).toBe(false)
    expect(isUnitToken('x'.repeat(41))).toBe(false)
  })
})

function parsed(text: string, time?: string): TimestampColumns | null {
  const out = createTimestampColumns(1)
  return parseTimestampInto(out, 0, text, time) ? out : null
}

/** [year, first, second, minute of day, offset min or NaN, ordered (1 = month/day known)] */
function parts(t: TimestampColumns | null): number[] | null {
  return t && [t.year[0], t.first[0], t.second[0], t.minuteOfDay[0], t.offsetMin[0], t.yearFirst[0]]
}

describe('timestamp forms', () => {
  it.each([
    ['2021-07-01T13:30:00Z', [2021, 7, 1, 810, 0, 1]],
    ['2021-07-01 13:30', [2021, 7, 1, 810, Number.NaN, 1]],
    ['2021-07-01T13:30:00.000Z', [2021, 7, 1, 810, 0, 1]],
    ['2021-07-01 13:30:00+02:00', [2021, 7, 1, 810, 120, 1]],
    ['2021-07-01T13:30-0500', [2021, 7, 1, 810, -300, 1]],
    ['2021-07-01 13:30 UTC', [2021, 7, 1, 810, 0, 1]],
    ['2021-07-01 13:30 GMT-3', [2021, 7, 1, 810, -180, 1]],
    ['2021/7/1 1:05', [2021, 7, 1, 65, Number.NaN, 1]],
    ['07/01/2021 13:30', [2021, 7, 1, 810, Number.NaN, 0]], // order decided over the whole file
    ['07/01/21 01:30:00 PM', [2021, 7, 1, 810, Number.NaN, 0]], // two-digit year
    ['1/2/69 00:00', [1969, 1, 2, 0, Number.NaN, 0]], // pivot: 69 → 1969
    ['1/2/68 00:00', [2068, 1, 2, 0, Number.NaN, 0]], // 68 → 2068
    ['01.07.2021 13:30', [2021, 7, 1, 810, Number.NaN, 1]], // dotted: day first
    ['1-Jul-2021 00:00', [2021, 7, 1, 0, Number.NaN, 1]],
    ['3 mars 2021 12:00', [2021, 3, 3, 720, Number.NaN, 1]],
    ['15 dic 2021 06:00', [2021, 12, 15, 360, Number.NaN, 1]],
    ['Jan 3, 2021 1:00 pm', [2021, 1, 3, 780, Number.NaN, 1]],
    ['2021010100', [2021, 1, 1, 0, Number.NaN, 1]],
    ['2021010113', [2021, 1, 1, 780, Number.NaN, 1]],
    ['202101011330', [2021, 1, 1, 810, Number.NaN, 1]],
    ['20210101133015', [2021, 1, 1, 810.25, Number.NaN, 1]],
    ['20090101:0010', [2009, 1, 1, 10, Number.NaN, 1]],
    ['2023070923:26', [2023, 7, 9, 23 * 60 + 26, Number.NaN, 1]],
    ['2021-01-01 24:00', [2021, 1, 1, 1440, Number.NaN, 1]],
  ])('%s', (text, expected) => {
    expect(parts(parsed(text))).toEqual(expected)
  })

  it('a date column and a time or hour column', () => {
    expect(parts(parsed('3/8/23', '12:30a'))).toEqual([2023, 3, 8, 30, Number.NaN, 0])
    expect(parts(parsed('3/8/2023', '2400'))).toEqual([2023, 3, 8, 1440, Number.NaN, 0])
    expect(parts(parsed('15/01/2024', '0330'))).toEqual([2024, 15, 1, 210, Number.NaN, 0])
    expect(parts(parsed('2023-07-10', '23'))).toEqual([2023, 7, 10, 1380, Number.NaN, 1])
  })

  it.each([
    ['1:00a', 60],
    ['12:00a', 0],
    ['12:30p', 750],
    ['1:00 p.m.', 780],
    ['12:00 PM', 720],
    ['01:00:30 AM', 60.5],
    ['0100', 60],
    ['100', 60],
    ['2400', 1440],
    ['1', 60],
    ['13', 780],
    ['23:59', 1439],
  ])('time of day %s → %d min', (text, minutes) => {
    expect(parseTimeOfDay(text)).toBe(minutes)
  })

  it.each(['25:00', '12:60', '13:00 pm', '0:00 am', '24:30', '1:0', 'noon', '12:00 pmx'])(
    'not a time of day: %s',
    (text) => {
      expect(Number.isNaN(parseTimeOfDay(text))).toBe(true)
    },
  )

  it.each([
    '2021-07-01 25:00',
    '2021-07-01 13:30 CEST',
    '2021-07-01 13:30 +15:00',
    '2021 07 01',
    '123/4/2021',
  ])('not a timestamp: %s', (text) => {
    expect(parsed(text)).toBeNull()
  })
})

describe('header words in six languages, and the columns that are not what they look like', () => {
  it.each([
    ['Temperatur (°C)', 'dryBulb', '°C'],
    ['rel. Feuchte (%)', 'relativeHumidity', '%'],
    ['Taupunkt (°C)', 'dewPoint', '°C'],
    ['Luftdruck (hPa)', 'pressure', 'hPa'],
    ['Windgeschw. (km/h)', 'wind', 'km/h'],
    ['Globalstrahlung (W/m²)', 'ghi', 'W/m²'],
    ['Niederschlag (mm)', 'rain', 'mm'],
    ['Humedad relativa (%)', 'relativeHumidity', '%'],
    ['Velocidad del viento (km/h)', 'wind', 'km/h'],
    ['Radiación solar (W/m²)', 'ghi', 'W/m²'],
    ['Precipitación (mm)', 'rain', 'mm'],
    ['Température (°C)', 'dryBulb', '°C'],
    ['Humidité relative (%)', 'relativeHumidity', '%'],
    ['Pression station (hPa)', 'pressure', 'hPa'],
    ['Vent moyen (m/s)', 'wind', 'm/s'],
    ['Rayonnement global (J/cm²)', 'ghi', 'J/cm² per hour'],
    ['Umidade relativa (%)', 'relativeHumidity', '%'],
    ['Ponto de orvalho (°C)', 'dewPoint', '°C'],
    ['Pressão atmosférica (mB)', 'pressure', 'mbar'],
    ['Radiação global (kJ/m²)', 'ghi', 'kJ/m² per hour'],
    ['Umidità relativa (%)', 'relativeHumidity', '%'],
    ['Velocità vento (m/s)', 'wind', 'm/s'],
    ['Pioggia (mm)', 'rain', 'mm'],
    ['tmpf', 'dryBulb', '°F'],
    ['dwpf', 'dewPoint', '°F'],
    ['sknt', 'wind', 'knots'],
    ['p01i', 'rain', 'in'],
    ['Temp, °F (LGR S/N: 20814467, SEN S/N: 20814467)', 'dryBulb', '°F'],
    ['Temperature in F', 'dryBulb', '°F'],
    ['temp_f', 'dryBulb', '°F'],
    ['tempf', 'dryBulb', '°F'],
    ['windspeedmph', 'wind', 'mph'],
    ['baromabsin', 'pressure', 'inHg'],
    ['HourlyDryBulbTemperature', 'dryBulb', null],
    ['AirTC_Avg', 'dryBulb', null],
    ['Outdoor Temperature(℉)', 'dryBulb', '°F'],
    ['ABS Pressure(inHg)', 'pressure', 'inHg'],
    ['HR (%)', 'relativeHumidity', '%'],
  ])('%s → %s', (header, variable, unit) => {
    const a = analyseHeader(header)
    expect(a.meaning).toMatchObject({ kind: 'variable', variable })
    const conversion =
      a.units.map((u) => unitConversion(variable as WeatherVariable, u)).find(Boolean) ?? null
    expect(conversion?.unit ?? null).toBe(unit)
  })

  it.each([
    ['Luftdruck NN (hPa)', 'sea-level'],
    ['Pression mer (hPa)', 'sea-level'],
    ['pressure_msl (hPa)', 'sea-level'],
    ['HourlySeaLevelPressure', 'sea-level'],
    ['REL Pressure(inHg)', 'sea-level'],
    ['alti', 'altimeter'],
    ['HourlyAltimeterSetting', 'altimeter'],
    ['Presión de vapor (hPa)', 'vapour'],
    ['Vap Pres (mBars)', 'vapour'],
    ['vapour_pressure_deficit (kPa)', 'vapour'],
    ['Indoor Temperature(℉)', 'indoor'],
    ['In Temp', 'indoor'],
    ['Temp In (°F)', 'indoor'],
  ])('%s is excluded (%s)', (header, why) => {
    const m = analyseHeader(header).meaning
    expect(m?.kind).toBe('excluded')
    expect(m?.kind === 'excluded' ? m.reason : '').toContain(why)
  })

  it.each([
    'Windrichtung (°)',
    'Direction du vent (°)',
    'wind_gusts_10m (km/h)',
    'Feels Like(℉)',
    'Hi Temp',
    'Solar Zenith Angle',
    'H_sun',
    'Clearsky GHI',
    'Daily Rain(in)',
    'Rain Rate (in/h)',
    'sunshine_duration (s)',
    'Soil Temp (F)',
    'qc',
    'RECORD',
  ])('%s is not a variable', (header) => {
    const m = analyseHeader(header).meaning
    expect(m === null || m.kind === 'excluded').toBe(true)
  })

  it('wind components are components, not a speed', () => {
    expect(analyseHeader('u10').meaning).toEqual({ kind: 'wind-component', component: 'u' })
    expect(analyseHeader('10m v-component of wind').meaning).toEqual({
      kind: 'wind-component',
      component: 'v',
    })
  })

  it.each([
    ['Date Time, GMT-05:00', { kind: 'offset', hours: -5 }],
    ['time (local standard time, UTC+07:00)', { kind: 'offset', hours: 7 }],
    ['Hour (PST)', { kind: 'offset', hours: -8 }],
    ['Heure (UTC)', { kind: 'utc' }],
    ['timestamp_utc', { kind: 'utc' }],
    ['Hour (PDT)', { kind: 'none' }], // daylight-saving names give no fixed offset
  ])('time header %s', (header, expected) => {
    expect(headerTimeBasis(header)).toMatchObject(expected)
  })
})
