// Real open data: NOAA 1981–2010 hourly climate normals for Seattle, shipped by the npm package
// vega-datasets 3.2.1 (data/seattle-weather-hourly-normals.csv; NOAA data, a U.S. Government work).
// Columns: date (ISO, no zone), pressure (~1016, hPa), temperature (°C), wind (m/s). No humidity column.
// Facts checked here were read from the file itself (first data row: 2010-01-01T01:00:00,1016.6,4.0,3.8;
// 8,759 rows) and from the project's weather-file reference §4.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { readWeather } from '../../src/weather/read-weather.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'

const path = new URL(
  '../../node_modules/vega-datasets/data/seattle-weather-hourly-normals.csv',
  import.meta.url,
)
const text = readFileSync(path, 'utf8')

describe('NOAA Seattle hourly normals (vega-datasets)', () => {
  it('the missing humidity is reported clearly, naming the columns and the mapping to give', () => {
    let error: unknown
    try {
      readWeather(text, { utcOffsetHours: -8 })
    } catch (e) {
      error = e
    }
    expect(error).toBeInstanceOf(WeatherInputError)
    const e = error as WeatherInputError
    expect(e.missing).toEqual(['humidity'])
    expect(e.message).toMatch(/no humidity column/)
    expect(e.message).toMatch(/'pressure', 'temperature', 'wind'/)
    expect(e.message).toMatch(/--map relativeHumidity=/)
  })

  it('without a time zone it also says how to give one (both problems in one message)', () => {
    expect(() => readWeather(text)).toThrow(/--utc-offset.*no humidity/s)
  })

  // The file has no humidity-like column at all, so the mapping test adds one programmatically:
  // a column 'obs_humid' with invented values (not NOAA data), mapped by name with its unit.
  const lines = text.trimEnd().split(/\r?\n/)
  const withHumidity = [
    `${lines[0]},obs_humid`,
    ...lines.slice(1).map((l, i) => `${l},${0.6 + 0.01 * (i % 30)}`),
  ].join('\n')

  it('is read fully when a humidity column is supplied by mapping', () => {
    const r = readWeather(withHumidity, {
      utcOffsetHours: -8,
      latitudeDeg: 47.45,
      longitudeDeg: -122.31,
      mapping: { relativeHumidity: { column: 'obs_humid', unit: 'fraction' } },
    })
    expect(r.rows).toEqual({ read: 8759, used: 8759, repaired: 0, rejected: 0, superseded: 0 })
    expect(r.series.hours).toBe(8759)
    expect(r.hoursWithoutRow).toBe(0)
    // first row 2010-01-01T01:00 local standard time (UTC−8) = 09:00 UTC
    expect(r.period.start).toBe('2010-01-01T09:00:00.000Z')
    expect(r.series.dryBulbC[0]).toBe(4.0)
    expect(r.series.pressureKpa[0]).toBeCloseTo(101.66, 9) // 1016.6 hPa, unit detected from the values
    expect(r.columns.find((c) => c.variable === 'pressure')).toMatchObject({
      unit: 'hPa',
      unitFrom: 'detected',
    })
    expect(r.series.windMs[0]).toBe(3.8)
    expect(r.series.relativeHumidityPct[0]).toBeCloseTo(60, 9)
    expect(r.series.typicalYear).toBe(false)
    expect(r.coverage).toHaveLength(12)
    // every month complete except January, whose first hour (00:00–01:00) is not in the file
    expect(r.coverage[0].percent).toBeCloseTo((100 * 743) / 744, 1)
    expect(r.coverage.slice(1).every((c) => c.percent === 100)).toBe(true)
  })
})
