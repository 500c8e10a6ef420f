// The generic delimited reader on layouts no dialect claims: the header anywhere in the first 100
// lines (or named), units from a units row, wind components made into a speed, every ambiguity in
// one message with the --map to give, date and hour columns, day of year. Invented weather.
import { describe, expect, it } from 'vitest'
import { readWeather } from '../../src/weather/read-weather.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'

/** `n` hourly rows from 2022-06-01T00:00Z: `row(h, stamp)` gives the cells after the stamp. */
function rows(
  n: number,
  row: (h: number) => string,
  stamp = (h: number) => new Date(Date.UTC(2022, 5, 1, h)).toISOString().slice(0, 16),
): string[] {
  return Array.from({ length: n }, (_, h) => `${stamp(h)},${row(h)}`)
}

const T = (h: number) => (18 + 6 * Math.sin(((h - 9) / 24) * 2 * Math.PI)).toFixed(1)
const RH = (h: number) => (60 - 20 * Math.sin(((h - 9) / 24) * 2 * Math.PI)).toFixed(0)

describe('header search', () => {
  it('a header below 60 lines of notes is found, and the notes are reported as skipped', () => {
    const notes = Array.from({ length: 60 }, (_, i) => `# note ${i}: station moved in 2019, sensor swapped`)
    const text = [...notes, 'time (UTC),temp (°C),rh (%)', ...rows(24, (h) => `${T(h)},${RH(h)}`)].join('\n')
    const r = readWeather(text)
    expect(r.rows.read).toBe(24)
    expect(r.notes.some((w) => w.includes('header on line 61'))).toBe(true)
    expect(r.notes.some((w) => w.includes('lines 1–60 before the header row were skipped'))).toBe(true)
  })

  it('beyond 100 lines the header is not searched for, unless its line is given', () => {
    const notes = Array.from({ length: 120 }, (_, i) => `note ${i}`)
    const text = [...notes, 'time (UTC),temp (°C),rh (%)', ...rows(24, (h) => `${T(h)},${RH(h)}`)].join('\n')
    expect(() => readWeather(text)).toThrow(/no header row with known column names in the first 100 lines/)
    expect(() => readWeather(text)).toThrow(/--header-line/)
    const r = readWeather(text, { headerLine: 121 })
    expect(r.rows.read).toBe(24)
    expect(r.series.dryBulbC[15]).toBe(24)
  })

  it('a title line with commas above a semicolon table does not decide the delimiter', () => {
    const semicolons = (h: number) => `${T(h).replace('.', ',')};${RH(h)}`
    const stamp = (h: number) => new Date(Date.UTC(2022, 5, 1, h)).toISOString().slice(0, 16)
    const table = Array.from({ length: 24 }, (_, h) => `${stamp(h)};${semicolons(h)}`)
    const text = [
      'Station export, shed 2, v1.3',
      'Zeit (UTC);Temperatur (°C);rel. Feuchte (%)',
      ...table,
    ].join('\n')
    const r = readWeather(text)
    expect(r.notes.some((w) => w.startsWith('semicolon-separated, header on line 2'))).toBe(true)
    expect(r.series.dryBulbC[15]).toBe(24)
    // a header named by its line gives its own delimiter, whatever the names
    const unknown = ['Station export, shed 2, v1.3', 'stamp;probeA;probeB', ...table].join('\n')
    expect(() => readWeather(unknown, { headerLine: 2 })).toThrow(
      /line 2 \('stamp;probeA;probeB'\) names no column/,
    )
    const mapped = readWeather(unknown, {
      headerLine: 2,
      utcOffsetHours: 0,
      mapping: {
        timestamp: { column: 'stamp' },
        dryBulb: { column: 'probeA', unit: 'C' },
        relativeHumidity: { column: 'probeB', unit: '%' },
      },
    })
    expect(mapped.series.dryBulbC[15]).toBe(24)
  })

  it('a units row under the header gives the units (km/h read as km/h, not m/s)', () => {
    const text = [
      'Timestamp,Air temperature,Relative humidity,Wind speed',
      ',°F,%,km/h',
      ...rows(24, (h) => `${(Number(T(h)) * 1.8 + 32).toFixed(1)},${RH(h)},${36 + 3.6 * (h % 4)}`),
    ].join('\n')
    const r = readWeather(text, { utcOffsetHours: 0 })
    expect(r.notes.some((w) => w.includes('line 2 gives the units'))).toBe(true)
    expect(r.columns.find((c) => c.variable === 'wind')).toMatchObject({ unit: 'km/h', unitFrom: 'header' })
    expect(r.series.windMs[4]).toBeCloseTo(10, 10) // 36 km/h = 10 m/s (NIST SP 811: 1 km/h = 1/3.6 m/s)
    expect(r.series.windMs[5]).toBeCloseTo(11, 10) // 39.6 km/h
    expect(r.series.dryBulbC[15]).toBeCloseTo(24, 1) // 75.2 °F
  })
})

describe('columns that are not what they look like', () => {
  it('u10 and v10 are combined into a speed √(u² + v²); neither is taken as the speed itself', () => {
    const text = [
      'time (UTC),t2m (K),rh (%),u10 (m s-1),v10 (m s-1)',
      ...rows(6, (h) => `${(291.15 + h).toFixed(2)},${RH(h)},-3,4`),
    ].join('\n')
    const r = readWeather(text)
    expect(r.series.windMs[0]).toBeCloseTo(5, 10) // 3-4-5 triangle
    expect(r.series.dryBulbC[2]).toBeCloseTo(20, 10) // 293.15 K − 273.15
    expect(r.notes.some((w) => w.includes('√(u² + v²)'))).toBe(true)
  })

  it('one component alone is not a wind speed', () => {
    const text = ['time (UTC),temp (C),rh (%),u10 (m/s)', ...rows(6, (h) => `${T(h)},${RH(h)},-3`)].join('\n')
    const r = readWeather(text)
    expect(r.columns.some((c) => c.variable === 'wind')).toBe(false)
  })

  it('sea-level pressure, altimeter setting and vapour pressure are not station pressure', () => {
    const text = [
      'time (UTC),temp (C),rh (%),slp (hPa),altimeter (inHg),vapour pressure (hPa)',
      ...rows(6, (h) => `${T(h)},${RH(h)},1020.1,30.12,14.2`),
    ].join('\n')
    const r = readWeather(text, { elevationM: 500 })
    const pressure = r.columns.find((c) => c.variable === 'pressure')
    expect(pressure?.unitFrom).toBe('supplied') // the standard atmosphere at 500 m, not 102 kPa
    expect(r.series.pressureKpa[0]).toBeLessThan(96.5)
    for (const name of ['slp', 'altimeter', 'vapour pressure'])
      expect(r.notes.some((w) => w.startsWith(`column '${name}`) && w.includes('not used'))).toBe(true)
  })
})

describe('ambiguity', () => {
  it('every ambiguous variable is named in one message, each with the --map that settles it', () => {
    const text = [
      'time (UTC),temp 2m (C),temp 10m (C),rh (%),humidity (%),wind (m/s)',
      ...rows(3, () => '20,21,50,51,2'),
    ].join('\n')
    let message = ''
    try {
      readWeather(text)
    } catch (e) {
      expect(e).toBeInstanceOf(WeatherInputError)
      message = (e as Error).message
    }
    expect(message).toMatch(/2 variables fit more than one column/)
    expect(message).toMatch(
      /\(1\) dryBulb could be any of 'temp 2m \(C\)', 'temp 10m \(C\)': give --map 'dryBulb=temp 2m \(C\)'/,
    )
    expect(message).toMatch(
      /\(2\) relativeHumidity could be any of 'rh \(%\)', 'humidity \(%\)': give --map 'relativeHumidity=rh \(%\)'/,
    )
  })

  it('the --map given in the message reads the file', () => {
    const text = ['time (UTC),temp 2m (C),temp 10m (C),rh (%)', ...rows(3, () => '20,21,50')].join('\n')
    const r = readWeather(text, { mapping: { dryBulb: { column: 'temp 2m (C)' } } })
    expect(r.series.dryBulbC[0]).toBe(20)
  })
})

describe('time columns', () => {
  it('date and hour columns (hours 1–24 labelling the hour end) make timestamps', () => {
    const lines = ['Fecha;Hora;Temperatura (°C);Humedad relativa (%)']
    for (let h = 1; h <= 24; h++) lines.push(`15/06/2022;${h};${T(h - 1).replace('.', ',')};${RH(h - 1)}`)
    const r = readWeather(lines.join('\n'), { utcOffsetHours: 0 })
    expect(r.rows.read).toBe(24)
    expect(r.period.start).toBe('2022-06-15T00:00:00.000Z') // hour 1 ends 01:00: the series starts at 00:00
    expect(r.series.dryBulbC[15]).toBe(24)
  })

  it('year and day-of-year columns', () => {
    const lines = ['year,doy,hour,temp (C),rh (%)']
    for (let h = 0; h < 24; h++) lines.push(`2024,60,${h},${T(h)},${RH(h)}`) // day 60 of a leap year: 29 February
    const r = readWeather(lines.join('\n'), { utcOffsetHours: 0 })
    expect(r.period.start).toBe('2024-02-29T00:00:00.000Z')
  })
})
