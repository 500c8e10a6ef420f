// The timestamps' basis kept apart from the site's clock (src/weather/site-clock.ts), and honest ends:
// a file with no usable hour is an error that says why; constant pressure is a note; RH plateaus at or
// above 90 % in wet weather are not a stuck sensor (quality.ts, common practice, no source).

import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { zoneStandardOffsetHours } from '../../src/weather/time-zone.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'
import { csv, hourStamps } from './csv-builder.ts'
import { epwText } from './epw-builder.ts'

const wavy = (i: number): number => Math.round((20 + 6 * Math.sin(i / 4)) * 10) / 10

function utcFile(hours = 48): string {
  return csv(
    ['time', 'temp_c', 'rh_pct'],
    hourStamps('2021-07-01T00:00Z', hours).map((t, i) => [t, wavy(i), 40 + (i % 9)]),
  )
}

describe("the site's clock is not the timestamps' basis", () => {
  it('a UTC file (--utc-offset 0) at 120°W: the site clock comes from the longitude (UTC−8) with a warning, not UTC', () => {
    const r = readWeather(utcFile(), { utcOffsetHours: 0, latitudeDeg: 37, longitudeDeg: -120 })
    expect(r.series.site.utcOffsetHours).toBe(-8)
    expect(r.series.site.utcOffsetSource).toBe('longitude')
    expect(r.warnings.join(' ')).toMatch(/from the longitude -120°.*--site-tz/)
    // the stamps are UTC, not "local standard time, UTC+00:00"
    expect(r.timeBasis).toMatch(/^UTC; timestamps label the start/)
    // batches start at 08:00 site time = 16:00 UTC, not at 08:00 UTC (midnight at the site)
    const a = assess(r.series, {
      product: productById('grapes-to-raisins'),
      method: { kind: 'shade' },
      seasonStart: '07-01',
      seasonEnd: '07-01',
    })
    expect(a.site.utcOffsetHours).toBe(-8)
    expect(a.site.utcOffsetSource).toBe('longitude')
  })

  it('--site-tz gives the site clock (standard time of the zone) whatever the timestamps are in', () => {
    const r = readWeather(utcFile(), {
      utcOffsetHours: 0,
      siteTimeZone: 'America/Los_Angeles',
      longitudeDeg: 10,
    })
    expect(r.series.site.utcOffsetHours).toBe(-8)
    expect(r.series.site.timeZone).toBe('America/Los_Angeles')
    expect(r.series.site.utcOffsetSource).toBe('option')
    expect(Array.from(r.series.startUtcMs.slice(0, 1))).toEqual([Date.parse('2021-07-01T00:00Z')])
  })

  it('local timestamps (--utc-offset 5.5) are taken as the site clock, with a note', () => {
    const text = csv(
      ['time', 'temp_c', 'rh_pct'],
      hourStamps('2021-07-01T00:00Z', 24).map((t, i) => [t, wavy(i), 50 + (i % 4)]),
    )
    const r = readWeather(text, { utcOffsetHours: 5.5 })
    expect(r.series.site.utcOffsetHours).toBe(5.5)
    expect(r.series.site.utcOffsetSource).toBe('timestamps')
  })

  it('the EPW header states the site clock', () => {
    const text = epwText(
      { lat: 45, lon: 10, tz: 1, elevation: 100 },
      Array.from({ length: 24 }, (_, k) => ({
        year: 2021,
        month: 6,
        day: 1,
        hour: k + 1,
        dryBulbC: wavy(k),
        dewPointC: 8,
        rhPct: 60 - (k % 5),
        pressurePa: 100000 + k,
        ghiWh: 0,
        windMs: 2,
        skyTenths: 3,
        rainMm: 0,
      })),
    )
    const r = readWeather(text)
    expect(r.series.site.utcOffsetHours).toBe(1)
    expect(r.series.site.utcOffsetSource).toBe('file')
  })

  it('standard offsets of zones: Europe/Madrid +1, America/Chicago −6, Australia/Sydney +10, Asia/Kolkata +5.5', () => {
    // offsets from the IANA tz database through Intl (from memory of the zones' standard times)
    const t = Date.parse('2021-03-01T00:00Z')
    expect(zoneStandardOffsetHours('Europe/Madrid', t)).toBe(1)
    expect(zoneStandardOffsetHours('America/Chicago', t)).toBe(-6)
    expect(zoneStandardOffsetHours('Australia/Sydney', t)).toBe(10)
    expect(zoneStandardOffsetHours('Asia/Kolkata', t)).toBe(5.5)
  })
})

describe('honest ends', () => {
  it('a file whose humidity column is all missing codes is an error naming why, not an empty table', () => {
    const text = csv(
      ['time', 'temp_c', 'rh_pct'],
      hourStamps('2021-07-01T00:00Z', 10).map((t, i) => [t, wavy(i), -9999]),
    )
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(WeatherInputError)
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(
      /no usable hour in the file: no hour has a humidity \(column 'rh_pct'\)/,
    )
  })

  it('dry bulb and humidity never in the same hour is an error saying so', () => {
    const rows = hourStamps('2021-07-01T00:00Z', 20).map((t, i) => [
      t,
      i < 10 ? wavy(i) : '',
      i >= 10 ? 50 + (i % 3) : '',
    ])
    expect(() => readWeather(csv(['time', 'temp_c', 'rh_pct'], rows), { utcOffsetHours: 0 })).toThrow(
      /10 hours have a dry bulb and 10 a humidity, but never the same hour/,
    )
  })

  it('constant standard-atmosphere pressure in a typical-year EPW is a note, not 8760 stuck-sensor lines', () => {
    const hours = []
    for (let m = 1; m <= 12; m++)
      for (let d = 1; d <= new Date(Date.UTC(2001, m, 0)).getUTCDate(); d++)
        for (let h = 1; h <= 24; h++)
          hours.push({
            year: 1990 + m,
            month: m,
            day: d,
            hour: h,
            dryBulbC: wavy(h + d),
            dewPointC: 5 + (h % 3),
            rhPct: 50 + (h % 7),
            pressurePa: 101325,
            ghiWh: 0,
            windMs: 2 + (h % 3),
            skyTenths: 5,
            rainMm: 0,
          })
    const r = readWeather(epwText({ lat: 40, lon: -3, tz: 1, elevation: 20 }, hours))
    expect(r.series.typicalYear).toBe(true)
    expect(r.problemCounts['stuck-sensor']).toBeUndefined()
    expect(r.rows.used).toBe(8760)
    expect(r.notes.join(' ')).toMatch(/pressure is 101\.325 kPa in every hour/)
    expect(r.series.pressureKpa[100]).toBe(101.325)
  })

  it('the same constant far from the standard atmosphere at a high site is replaced by it, with a warning', () => {
    const stamps = hourStamps('2021-07-01T00:00Z', 48)
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh_pct', 'pressure (kPa)'],
        stamps.map((t, i) => [t, wavy(i), 40 + (i % 9), 101.325]),
      ),
      { utcOffsetHours: 0, elevationM: 1500 },
    )
    expect(r.series.pressureKpa[0]).toBeCloseTo(84.556, 2) // standard atmosphere at 1500 m (ASHRAE HOF 2017 ch. 1 eq 3)
    expect(r.warnings.join(' ')).toMatch(/far from the standard atmosphere/)
  })

  it('the constant is written as the file gives it (896 hPa is 89.6 kPa)', () => {
    const stamps = hourStamps('2021-07-01T00:00Z', 48)
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh_pct', 'pressure (hPa)'],
        stamps.map((t, i) => [t, wavy(i), 40 + (i % 9), 896]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.notes.join(' ')).toMatch(/pressure is 89\.6 kPa in every hour/)
    expect(r.warnings.join(' ')).toMatch(/the same 89\.6 kPa in every hour/)
  })

  it('RH at 96 % for 20 hours of rain is not a stuck sensor; 60 % for 20 hours is', () => {
    const stamps = hourStamps('2021-07-01T00:00Z', 40)
    const read = (plateau: number) =>
      readWeather(
        csv(
          ['time', 'temp_c', 'rh_pct'],
          stamps.map((t, i) => [t, wavy(i), i >= 10 && i < 30 ? plateau : 50 + (i % 7)]),
        ),
        { utcOffsetHours: 0 },
      )
    expect(read(96).problemCounts['stuck-sensor']).toBeUndefined()
    expect(read(90).problemCounts['stuck-sensor']).toBeUndefined()
    expect(read(60).problemCounts['stuck-sensor']).toBe(20)
  })
})
