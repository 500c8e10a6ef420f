// The same weather written as EPW (local standard time, hour-ending, Pa, Wh/m², tenths) and as CSV
// (UTC hour starts, the same units named in the header) must give identical series.
import { describe, expect, it } from 'vitest'
import { readWeather } from '../../src/weather/read-weather.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { csv } from './csv-builder.ts'
import { type EpwHour, epwText } from './epw-builder.ts'

const site = { lat: 38.3, lon: 23.7, tz: 2, elevation: 120 }

function weather(): { epw: string; csvText: string } {
  const hours: EpwHour[] = []
  const rows: (string | number)[][] = []
  // 1 and 2 March 2024 local standard time (UTC+2): EPW hour h covers local (h−1):00–h:00.
  for (let d = 1; d <= 2; d++) {
    for (let h = 1; h <= 24; h++) {
      const i = (d - 1) * 24 + h
      const t = Math.round((12 + 6 * Math.sin(((h - 9) / 24) * 2 * Math.PI)) * 10) / 10
      const dew = Math.round((4 + 0.05 * i) * 10) / 10
      const rh = 40 + (i % 13)
      const pressurePa = 99800 + 7 * i
      const ghiWh = h >= 8 && h <= 18 ? Math.round(500 * Math.sin(((h - 7.5) / 11) * Math.PI)) : 0
      const windMs = Math.round((1 + 0.1 * (i % 17)) * 10) / 10
      const sky = i % 11
      const rainMm = h === 15 ? 0.4 : 0
      hours.push({
        year: 2024,
        month: 3,
        day: d,
        hour: h,
        dryBulbC: t,
        dewPointC: dew,
        rhPct: rh,
        pressurePa,
        ghiWh,
        windMs,
        skyTenths: sky,
        rainMm,
      })
      const startUtc = Date.UTC(2024, 2, d, h - 1) - site.tz * 3_600_000
      rows.push([
        new Date(startUtc).toISOString().replace(':00.000Z', 'Z'),
        t,
        dew,
        rh,
        pressurePa,
        windMs,
        ghiWh,
        rainMm,
        sky,
      ])
    }
  }
  const csvText = csv(
    [
      'time (UTC)',
      'dry bulb (°C)',
      'dew point (°C)',
      'RH (%)',
      'station pressure (Pa)',
      'wind speed (m/s)',
      'GHI (Wh/m2)',
      'rain (mm)',
      'total sky cover (tenths)',
    ],
    rows,
  )
  return { epw: epwText(site, hours), csvText }
}

const columns: (keyof HourlySeries)[] = [
  'startUtcMs',
  'dryBulbC',
  'relativeHumidityPct',
  'pressureKpa',
  'windMs',
  'ghiWm2',
  'rainMm',
  'quality',
  'cloudCoverPct',
]

describe('EPW and CSV of the same weather', () => {
  it('give identical series, value for value', () => {
    const { epw, csvText } = weather()
    const options = { latitudeDeg: site.lat, longitudeDeg: site.lon, elevationM: site.elevation }
    const a = readWeather(epw).series
    const b = readWeather(csvText, options).series
    expect(a.hours).toBe(48)
    expect(b.hours).toBe(48)
    for (const c of columns)
      expect(Array.from(b[c] as ArrayLike<number>), c).toEqual(Array.from(a[c] as ArrayLike<number>))
    expect(new Date(a.startUtcMs[0]).toISOString()).toBe('2024-02-29T22:00:00.000Z')
  })
})
