// The hourly export (src/weather/export.ts): exact header, UTC hour starts with Z, ghi the mean over the
// hour, rain its total, empty where missing, flags in words; and dryhours reads its own export back
// unchanged (property test over generated series). Weather values are invented.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  dewPointOfHourC,
  flagWords,
  HOURLY_EXPORT_HEADER,
  hourlyExportCsv,
  parseFlagWords,
  summarizeSeries,
} from '../../src/weather/export.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import { csv, hourStamps } from './csv-builder.ts'
import { epwText } from './epw-builder.ts'

describe('the export', () => {
  it('has exactly the documented header and one row per hour, stamped at the hour start in UTC', () => {
    const stamps = hourStamps('2021-03-01T00:00Z', 4, 1) // local UTC+1 stamps
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh_pct', 'rain_mm'],
        stamps.map((t, i) => [t, 5 + i, 70 - i, i === 2 ? 0.4 : 0]),
      ),
      { utcOffsetHours: 1 },
    )
    const lines = hourlyExportCsv(r.series).trimEnd().split('\n')
    expect(lines[0]).toBe(
      'time_utc,dry_bulb_c,relative_humidity_pct,dew_point_c,pressure_kpa,wind_speed_ms,ghi_wm2,rain_mm,flags',
    )
    expect(lines[0]).toBe(HOURLY_EXPORT_HEADER)
    expect(lines).toHaveLength(5)
    expect(lines[1].startsWith('2021-03-01T00:00:00Z,5,70,')).toBe(true)
    expect(lines[3].split(',')[7]).toBe('0.4')
    // no wind column: empty; pressure from the standard atmosphere, flagged
    expect(lines[1].split(',')[5]).toBe('')
    expect(lines[1].split(',')[8]).toBe('pressure-standard')
  })

  it('an EPW hour-ending row 13:00 (local UTC+2) is the export row 10:00Z, its Wh/m² the mean W/m² of 10:00–11:00Z', () => {
    const text = epwText({ lat: 45, lon: 10, tz: 2, elevation: 100 }, [
      ...Array.from({ length: 24 }, (_, k) => ({
        year: 2021,
        month: 6,
        day: 1,
        hour: k + 1,
        dryBulbC: 15 + (k % 7),
        dewPointC: 8,
        rhPct: 60 - (k % 5),
        pressurePa: 100000 + k,
        ghiWh: k + 1 === 13 ? 850 : k >= 6 && k < 19 ? 300 : 0,
        windMs: 2,
        skyTenths: 3,
        rainMm: 0,
      })),
    ])
    const lines = hourlyExportCsv(readWeather(text).series).split('\n')
    const row = lines.find((l) => l.startsWith('2021-06-01T10:00:00Z'))!.split(',')
    expect(row[6]).toBe('850')
    expect(row[4]).toBe('100.012') // 100012 Pa
  })

  it('the dew point is over liquid water from the dry bulb and RH (1.0 kPa ↔ 6.98 °C, see moist-air)', () => {
    // e = 1.0 kPa at 20 °C: RH = 1.0 / es(20 °C) with es 2.3392 kPa (Hyland–Wexler) → dew point 6.98 °C
    expect(dewPointOfHourC(20, (100 * 1.0) / 2.3392)).toBeCloseTo(6.98, 1)
    expect(Number.isNaN(dewPointOfHourC(20, Number.NaN))).toBe(true)
  })

  it('flag words round-trip, unknown words are reported', () => {
    for (let bits = 0; bits < 256; bits++) expect(parseFlagWords(flagWords(bits)).bits).toBe(bits)
    expect(parseFlagWords('filled nonsense').unknown).toEqual(['nonsense'])
  })

  it('the summary gives hours, mean, min and max in SI', () => {
    const r = readWeather(
      csv(
        ['time', 'temp (°F)', 'rh_pct'],
        hourStamps('2021-01-01T00:00Z', 3).map((t, i) => [t, 32 + 9 * i, 50 + i]),
      ),
      { utcOffsetHours: 0 },
    )
    const dry = summarizeSeries(r.series).find((v) => v.variable === 'dryBulb')!
    expect(dry).toEqual({ variable: 'dryBulb', unit: '°C', hours: 3, mean: 5, min: 0, max: 10 })
    expect(summarizeSeries(r.series).find((v) => v.variable === 'wind')).toMatchObject({
      hours: 0,
      mean: null,
    })
  })
})

describe('reading the export back', () => {
  it('is recognised by its header, read as UTC, and the flags come back', () => {
    const stamps = hourStamps('2021-01-01T00:00Z', 8)
    const temps = [1, 2, '', 4, 5, 6, 7, 8]
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh_pct'],
        stamps.map((t, i) => [t, temps[i], 80 - i]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.quality[2] & QualityFlag.filled).toBeTruthy()
    const exported = hourlyExportCsv(r.series)
    const back = readWeather(exported)
    expect(back.notes[0]).toMatch(/own hourly export/)
    expect(back.series.quality[2] & QualityFlag.filled).toBeTruthy()
    expect(hourlyExportCsv(back.series)).toBe(exported)
  })

  it('round trip: export(read(export(series))) equals export(series) for generated files (property)', () => {
    const walk = (n: number, start: number, max: number) =>
      fc
        .array(
          fc.integer({ min: 1, max }).chain((k) => fc.constantFrom(k, -k)),
          { minLength: n, maxLength: n },
        )
        .map((steps) => {
          const out: number[] = []
          for (const [i, d] of steps.entries()) out.push((i === 0 ? start : out[i - 1]) + d)
          return out
        })
    fc.assert(
      fc.property(
        fc.integer({ min: 30, max: 120 }),
        fc.integer({ min: -6, max: 6 }),
        walk(120, 150, 15),
        walk(120, 600, 40),
        fc.array(fc.boolean(), { minLength: 120, maxLength: 120 }),
        fc.boolean(),
        (n, offset, temp, rh, holes, withPressure) => {
          const stamps = hourStamps('2022-05-01T00:00Z', n, offset)
          const header = ['time', 'temp_c', 'rh_pct', ...(withPressure ? ['pressure (hPa)'] : []), 'rain_mm']
          const rows = stamps.map((t, i) => [
            t,
            holes[i] ? '' : temp[i] / 10,
            Math.min(100, Math.max(1, rh[i] / 10)),
            ...(withPressure ? [1000 + (i % 13)] : []),
            i % 17 === 0 ? 0.2 : 0,
          ])
          const first = readWeather(csv(header, rows), {
            utcOffsetHours: offset,
            latitudeDeg: 30,
            longitudeDeg: 15 * offset,
          })
          const a = hourlyExportCsv(first.series)
          const back = readWeather(a)
          expect(hourlyExportCsv(back.series)).toBe(a)
          expect(back.series.hours).toBe(first.series.hours)
        },
      ),
      { numRuns: 40 },
    )
  })
})
