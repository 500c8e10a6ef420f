// EPW data-dictionary conventions (EnergyPlus Auxiliary Programs, "EnergyPlus Weather File (EPW) Data
// Dictionary", as summarised in the project's weather-file reference §3) on the hand-made fixture
// test/fixtures/weather/invented-mesa-2days.epw (invented site; values chosen by hand, see its COMMENTS lines).
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'

const text = readFileSync(new URL('../fixtures/weather/invented-mesa-2days.epw', import.meta.url), 'utf8')
const dataRow = (i: number): string[] => text.split('\n')[8 + i - 1].split(',')

describe('EPW reader', () => {
  const r = readWeather(text)
  const s = r.series

  it('reads LOCATION: latitude +N, longitude +E (west negative), time zone, elevation', () => {
    expect(r.format).toBe('epw')
    expect(s.site.latitudeDeg).toBe(35.5)
    expect(s.site.longitudeDeg).toBe(-106.25)
    expect(s.site.utcOffsetHours).toBe(-7)
    expect(s.site.elevationM).toBe(1650)
  })

  it('hour 1 labels the end of 00:00–01:00 local standard time: the series starts at 00:00 local = 07:00 UTC', () => {
    expect(r.period.start).toBe('2023-01-01T07:00:00.000Z')
    expect(new Date(s.startUtcMs[0]).toISOString()).toBe('2023-01-01T07:00:00.000Z')
    // dry bulb of row 1 (hour 1) is the first hour's value
    expect(s.dryBulbC[0]).toBe(Number(dataRow(1)[6]))
  })

  it('hour 24 of 1 January is the hour 23:00–24:00 local, i.e. 06:00–07:00 UTC on 2 January', () => {
    expect(new Date(s.startUtcMs[23]).toISOString()).toBe('2023-01-02T06:00:00.000Z')
    expect(s.dryBulbC[23]).toBe(Number(dataRow(24)[6]))
    expect(s.hours).toBe(48)
    expect(r.period.end).toBe('2023-01-03T07:00:00.000Z')
  })

  it('a value at the missing code (dew 99.9, RH 999, pressure 999999) or above it (dew 120) is missing, never data', () => {
    const dew = r.columns.find((c) => c.variable === 'dewPoint')!
    expect(dew.missing).toBe(2) // rows 5 (99.9) and 8 (120.0)
    expect(r.columns.find((c) => c.variable === 'relativeHumidity')!.missing).toBe(1)
    expect(r.columns.find((c) => c.variable === 'pressure')!.missing).toBe(1)
    // row 6: RH missing -> derived from the dew point over liquid water, not 999
    expect(s.relativeHumidityPct[5]).toBeGreaterThan(0)
    expect(s.relativeHumidityPct[5]).toBeLessThanOrEqual(100)
    // row 7: station pressure missing -> interpolated between rows 6 and 8 (83,560 and 83,580 Pa)
    expect(s.pressureKpa[6]).toBeCloseTo(83.57, 6)
    expect(s.quality[6] & QualityFlag.filled).toBeTruthy()
    for (const v of s.dryBulbC) expect(v).toBeLessThan(70)
  })

  it('station pressure is read in Pa and stored in kPa', () => {
    expect(s.pressureKpa[0]).toBeCloseTo(83.51, 9)
  })

  it('radiation is the total over the preceding hour [Wh/m²], stored as the mean over the hour [W/m²]', () => {
    // row 12 = hour 12 = 11:00–12:00 local: GHI field 14
    expect(s.ghiWm2[11]).toBe(Number(dataRow(12)[13]))
    expect(r.columns.find((c) => c.variable === 'ghi')!.timing).toBe('interval-total')
    // row 30: GHI 9999 (missing) at 05:00–06:00 local, a night hour: filled with 0 and flagged
    expect(s.ghiWm2[29]).toBe(0)
    expect(s.quality[29] & QualityFlag.irradianceFilled).toBeTruthy()
  })

  it('a field missing in every row (illuminance, here rain is present) is absent; rain is read in mm', () => {
    expect(s.rainMm[14]).toBe(1.2)
    expect(s.rainMm[0]).toBe(0)
  })

  it('row counts add up', () => {
    expect(r.rows.read).toBe(48)
    expect(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded).toBe(r.rows.read)
  })

  it('hour 0 or 25 is a bad timestamp reported with its line', () => {
    const lines = text.split('\n')
    const f = lines[9].split(',')
    f[3] = '25'
    lines[9] = f.join(',')
    const bad = readWeather(lines.join('\n'))
    expect(bad.rows.rejected).toBeGreaterThanOrEqual(1)
    expect(bad.problems.find((p) => p.kind === 'bad-timestamp')?.line).toBe(10)
  })

  it('a broken LOCATION line is an input error naming the field', () => {
    const broken = text.replace('35.50,-106.25', 'north,-106.25')
    expect(() => readWeather(broken)).toThrow(WeatherInputError)
    expect(() => readWeather(broken)).toThrow(/latitude/)
  })

  it('sub-hourly EPW (DATA PERIODS with 4 records per hour) is refused with a message', () => {
    expect(() => readWeather(text.replace('DATA PERIODS,1,1,', 'DATA PERIODS,1,4,'))).toThrow(
      /records per hour/,
    )
  })
})
