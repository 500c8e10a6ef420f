// One test per reader pitfall in the project's weather-file reference notes
// (weather-files-and-users.md §1; issue numbers there). Inputs are small invented files built here.
import { describe, expect, it } from 'vitest'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'
import { csv, hourStamps } from './csv-builder.ts'

const iso = (ms: number): string => new Date(ms).toISOString().slice(0, 16)

describe('daylight saving (pitfall 7)', () => {
  // America/Chicago 2021: clocks forward 14 March 02:00 CST -> 03:00 CDT, back 7 November 02:00 CDT -> 01:00 CST
  // (US Energy Policy Act of 2005, second Sunday of March / first Sunday of November; from memory, checked by Intl).
  it('spring: the missing local hour 02:00 is no gap in UTC, and the change is reported', () => {
    const stamps = ['2021-03-14 00:00', '2021-03-14 01:00', '2021-03-14 03:00', '2021-03-14 04:00']
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh'],
        stamps.map((t, i) => [t, 5 + i, 80]),
      ),
      { timeZone: 'America/Chicago' },
    )
    expect(r.series.hours).toBe(4)
    expect(iso(r.series.startUtcMs[0])).toBe('2021-03-14T06:00')
    expect(iso(r.series.startUtcMs[2])).toBe('2021-03-14T08:00') // 03:00 CDT = 08:00 UTC
    expect(r.hoursWithoutRow).toBe(0)
    expect(r.dstEvents).toEqual([{ kind: 'spring-gap', atUtc: '2021-03-14T08:00:00.000Z', rows: 0 }])
  })

  it('spring: a row stamped with the non-existent 02:30 is rejected with its line', () => {
    const stamps = ['2021-03-14 01:00', '2021-03-14 02:00', '2021-03-14 03:00']
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh'],
        stamps.map((t) => [t, 5, 80]),
      ),
      { timeZone: 'America/Chicago' },
    )
    expect(r.problems.find((p) => p.kind === 'dst-gap')?.line).toBe(3)
    expect(r.rows).toEqual({ read: 3, used: 2, repaired: 0, rejected: 1, superseded: 0 })
  })

  it('autumn: the doubled local 01:00 becomes two different UTC hours (CDT then CST)', () => {
    const stamps = ['2021-11-07 00:00', '2021-11-07 01:00', '2021-11-07 01:00', '2021-11-07 02:00']
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh'],
        stamps.map((t, i) => [t, 10 + i, 70]),
      ),
      { timeZone: 'America/Chicago' },
    )
    expect(r.series.hours).toBe(4)
    expect(Array.from(r.series.startUtcMs, iso)).toEqual([
      '2021-11-07T05:00',
      '2021-11-07T06:00',
      '2021-11-07T07:00',
      '2021-11-07T08:00',
    ])
    expect(Array.from(r.series.dryBulbC)).toEqual([10, 11, 12, 13])
    expect(r.rows.rejected).toBe(0)
    expect(r.dstEvents[0]).toMatchObject({ kind: 'autumn-overlap', rows: 2 })
  })

  it('the same doubled hour read with a fixed offset is a duplicate: first kept, second rejected', () => {
    const stamps = ['2021-11-07 00:00', '2021-11-07 01:00', '2021-11-07 01:00', '2021-11-07 02:00']
    const r = readWeather(
      csv(
        ['time', 'temp_c', 'rh'],
        stamps.map((t, i) => [t, 10 + i, 70]),
      ),
      { utcOffsetHours: -6 },
    )
    expect(r.rows).toEqual({ read: 4, used: 3, repaired: 0, rejected: 1, superseded: 0 })
    expect(r.problems[0]).toMatchObject({ line: 4, kind: 'duplicate-timestamp' })
    expect(r.series.quality[1] & QualityFlag.duplicateTimestamp).toBeTruthy()
  })
})

describe('clock and calendar (pitfalls 3, 4, 5)', () => {
  it('24:00 is midnight at the end of the day, and 01:00–24:00 files are read as hour-ending', () => {
    const rows = Array.from({ length: 24 }, (_, h) => [`1/1/2021`, `${h + 1}:00`, 3 + h, 60 + (h % 5)])
    const r = readWeather(csv(['Date (MM/DD/YYYY)', 'Time (HH:MM)', 'Dry-bulb (C)', 'RHum (%)'], rows), {
      utcOffsetHours: 0,
    })
    expect(r.series.hours).toBe(24)
    expect(iso(r.series.startUtcMs[0])).toBe('2021-01-01T00:00') // 1:00 labels the end of 00:00–01:00
    expect(iso(r.series.startUtcMs[23])).toBe('2021-01-01T23:00') // 24:00 ends the day
    expect(r.timeBasis).toMatch(/label the end of the interval/)
  })

  it('a leap day is kept (2020-02-29 has 24 hours)', () => {
    const stamps = hourStamps('2020-02-28T00:00Z', 72)
    const r = readWeather(
      csv(
        ['timestamp', 'temperature', 'rh'],
        stamps.map((t, i) => [t, 1 + (i % 7), 50 + (i % 5)]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.hours).toBe(72)
    expect(iso(r.series.startUtcMs[24])).toBe('2020-02-29T00:00')
    expect(r.coverage.find((c) => c.month === 2)?.percent).toBeCloseTo((100 * 48) / (29 * 24), 1)
  })

  it('30 February is rejected as not a calendar date', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temperature', 'rh'],
        [
          ['2021-02-28 00:00', 1, 50],
          ['2021-02-30 00:00', 1, 50],
          ['2021-03-01 00:00', 1, 50],
        ],
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.problems.find((p) => p.kind === 'bad-timestamp')?.line).toBe(3)
  })

  it('a typical year whose months come from different years is one continuous year, leap day included', () => {
    // Twelve whole months, each from one year (the structure of TMY3 files, Wilcox & Marion 2008,
    // NREL/TP-581-43156, from memory): Jan 1995, Feb 2004 (with 29 Feb), Mar 1999, Apr–Dec 2001–2009.
    const sourceYear = [1995, 2004, 1999, 2001, 2002, 2003, 2005, 2006, 2007, 2008, 2009, 2001]
    const rows: (string | number)[][] = []
    for (let m = 1; m <= 12; m++) {
      const y = sourceYear[m - 1]
      const days = new Date(Date.UTC(y, m, 0)).getUTCDate()
      for (let d = 1; d <= days; d++)
        for (let h = 0; h < 24; h++) rows.push([y, m, d, h, 10 + (h % 3), 50 + (h % 4)])
    }
    expect(rows.length).toBe(8784)
    const r = readWeather(csv(['year', 'month', 'day', 'hour', 'temp', 'rh'], rows), { utcOffsetHours: 0 })
    expect(r.series.typicalYear).toBe(true)
    expect(r.sourceYears).toEqual([1995, 1999, 2001, 2002, 2003, 2004, 2005, 2006, 2007, 2008, 2009])
    expect(iso(r.series.startUtcMs[0])).toBe('2000-01-01T00:00') // nominal leap year, 29 Feb kept
    expect(r.years).toEqual([2000])
    expect(r.series.hours).toBe(8784)
    expect(r.rows.rejected).toBe(0)
    const feb29 = Date.parse('2000-02-29T00:00Z')
    const s = (feb29 - r.series.startUtcMs[0]) / 3_600_000
    expect(r.series.dryBulbC[s]).toBe(10) // hour 0 of 29 Feb 2004
  })

  it('two days from different years are no typical year (too few hours)', () => {
    const rows: (string | number)[][] = []
    for (const [y, m] of [
      [1995, 1],
      [1999, 3],
    ])
      for (let h = 0; h < 24; h++) rows.push([y, m, 1, h, 10 + (h % 4), 50 + (h % 3)])
    const r = readWeather(csv(['year', 'month', 'day', 'hour', 'temp', 'rh'], rows), { utcOffsetHours: 0 })
    expect(r.series.typicalYear).toBe(false)
    expect(r.years).toEqual([1995, 1996, 1997, 1998, 1999])
  })

  it('a multi-year file in order is not a typical year', () => {
    const stamps = hourStamps('2019-12-31T20:00Z', 10)
    const r = readWeather(
      csv(
        ['timestamp', 'temperature', 'rh'],
        stamps.map((t) => [t, 1, 50]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.typicalYear).toBe(false)
    expect(r.years).toEqual([2019, 2020])
  })

  it('DD/MM/YYYY is detected when a day exceeds 12, and an ambiguous file asks for the date order', () => {
    const dmy = readWeather(
      csv(
        ['date', 'time', 'temp', 'rh'],
        [
          ['12/03/2021', '00:00', 1, 50],
          ['13/03/2021', '00:00', 2, 50],
        ],
      ),
      { utcOffsetHours: 0 },
    )
    expect(iso(dmy.series.startUtcMs[0])).toBe('2021-03-12T00:00')
    const ambiguous = csv(['date', 'time', 'temp', 'rh'], [['03/04/2021', '00:00', 1, 50]])
    expect(() => readWeather(ambiguous, { utcOffsetHours: 0 })).toThrow(/date order/)
    expect(iso(readWeather(ambiguous, { utcOffsetHours: 0, dateOrder: 'dmy' }).series.startUtcMs[0])).toBe(
      '2021-04-03T00:00',
    )
    expect(iso(readWeather(ambiguous, { utcOffsetHours: 0, dateOrder: 'mdy' }).series.startUtcMs[0])).toBe(
      '2021-03-04T00:00',
    )
  })
})

describe('time zone and its sign (pitfall 6)', () => {
  it('ISO offsets follow ISO 8601: 12:00+02:00 is 10:00 UTC, 12:00-05:00 is 17:00 UTC', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temperature', 'rh'],
        [
          ['2021-06-01T12:00+02:00', 20, 50],
          ['2021-06-01T12:00-05:00', 20, 50],
        ],
      ),
    )
    expect(
      Array.from(r.series.startUtcMs)
        .filter((_, i) => !Number.isNaN(r.series.dryBulbC[i]))
        .map(iso),
    ).toEqual(['2021-06-01T10:00', '2021-06-01T17:00'])
  })

  it('a header naming UTC needs no offset; naive times without one are an error that says how to give it', () => {
    const rows = [['2021-06-01 12:00', 20, 50]]
    expect(readWeather(csv(['time (UTC)', 'temperature', 'rh'], rows)).timeBasis).toMatch(/^UTC/)
    expect(() => readWeather(csv(['time', 'temperature', 'rh'], rows))).toThrow(/--utc-offset .*--tz/)
  })
})

describe('missing codes and duplicates (pitfalls 8, 13)', () => {
  it('-9999, -999 and 999.9 are missing where they are not plausible values, and short gaps are filled and flagged', () => {
    const stamps = hourStamps('2021-06-01T00:00Z', 6)
    const temps = [10, -9999, 12, 13, 999.9, 15]
    const rh = [50, 50, -999, 50, 50, 50]
    const r = readWeather(
      csv(
        ['timestamp', 'temp_c', 'rh'],
        stamps.map((t, i) => [t, temps[i], rh[i]]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(Array.from(r.series.dryBulbC)).toEqual([10, 11, 12, 13, 14, 15])
    expect(r.series.relativeHumidityPct[2]).toBe(50)
    expect(r.series.quality[1] & QualityFlag.filled).toBeTruthy()
    expect(r.rows).toEqual({ read: 6, used: 3, repaired: 3, rejected: 0, superseded: 0 })
    expect(r.warnings.some((w) => /missing codes/.test(w))).toBe(true)
  })

  it('RH 99.9 is a value, not a missing code; a dew point of 99.9 °C is a missing code', () => {
    const stamps = hourStamps('2021-06-01T00:00Z', 3)
    const r = readWeather(
      csv(
        ['timestamp', 'temp_c', 'rh'],
        stamps.map((t) => [t, 10, 99.9]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.relativeHumidityPct[1]).toBe(99.9)
  })

  it('duplicate rows: the first is kept, the second rejected with both line numbers', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temp', 'rh'],
        [
          ['2021-06-01 00:00', 1, 50],
          ['2021-06-01 01:00', 2, 50],
          ['2021-06-01 01:00', 2, 50],
          ['2021-06-01 02:00', 3, 50],
        ],
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.rows).toEqual({ read: 4, used: 3, repaired: 0, rejected: 1, superseded: 0 })
    expect(r.problems[0]).toMatchObject({ line: 4, kind: 'duplicate-timestamp' })
    expect(r.problems[0].message).toMatch(/line 3 with the same values/)
  })

  it('out-of-order rows are placed at their time and reported', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temp', 'rh'],
        [
          ['2021-06-01 00:00', 1, 50],
          ['2021-06-01 02:00', 3, 50],
          ['2021-06-01 01:00', 2, 50],
        ],
      ),
      { utcOffsetHours: 0 },
    )
    expect(Array.from(r.series.dryBulbC)).toEqual([1, 2, 3])
    expect(r.problems[0]).toMatchObject({ line: 4, kind: 'out-of-order' })
  })
})

describe('mixed units (pitfall 9)', () => {
  const stamps = hourStamps('2021-06-01T00:00Z', 3)
  it('pressure without unit: 1013 is read as hPa, 101.3 as kPa, 101300 as Pa', () => {
    for (const p of [1013, 101.3, 101300]) {
      const r = readWeather(
        csv(
          ['timestamp', 'temp', 'rh', 'pressure'],
          stamps.map((t) => [t, 20, 50, p]),
        ),
        { utcOffsetHours: 0 },
      )
      expect(r.series.pressureKpa[0]).toBeCloseTo(101.3, 6)
    }
  })

  it('a pressure declared kPa with a median of 1013 is flagged as implausible', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temp', 'rh', 'pressure (kPa)'],
        stamps.map((t) => [t, 20, 50, 1013]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.warnings.some((w) => /median of 1013 kPa/.test(w))).toBe(true)
  })

  it('RH as a fraction (all values ≤ 1) is detected and converted to percent', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temp', 'rh'],
        stamps.map((t, i) => [t, 20, 0.4 + 0.1 * i]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.relativeHumidityPct[0]).toBeCloseTo(40, 9)
    expect(r.columns.find((c) => c.variable === 'relativeHumidity')).toMatchObject({
      unit: 'fraction',
      unitFrom: 'detected',
    })
  })

  it('°F, mph, inHg and inches from header units (NIST SP 811 factors)', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'Temp (°F)', 'Dew Point (F)', 'Wind Speed (mph)', 'Pressure (inHg)', 'Rain (in)'],
        stamps.map((t) => [t, 68, 50, 10, 29.92, 0.1]),
      ),
      { utcOffsetHours: 0 },
    )
    const s = r.series
    expect(s.dryBulbC[0]).toBeCloseTo(20, 9)
    expect(s.windMs[0]).toBeCloseTo(4.4704, 9)
    expect(s.pressureKpa[0]).toBeCloseTo(101.3208, 3)
    expect(s.rainMm[0]).toBeCloseTo(2.54, 9)
    // RH from a 10 °C dew point at 20 °C, over liquid water: es(10)/es(20)
    expect(s.relativeHumidityPct[0]).toBeCloseTo(
      (100 * saturationVaporPressureLiquidKpa(10)) / saturationVaporPressureLiquidKpa(20),
      9,
    )
  })

  it('a °C column with a median of 70 is flagged (probably °F)', () => {
    const r = readWeather(
      csv(
        ['timestamp', 'temperature (C)', 'rh'],
        stamps.map((t) => [t, 70, 50]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.warnings.some((w) => /median of 70 °C/.test(w))).toBe(true)
  })
})

describe('delimited-text variants (reference §5: decimal commas in European CSVs)', () => {
  it('semicolons with decimal commas, BOM and CRLF', () => {
    const text =
      '\uFEFF' +
      csv(
        ['Datum', 'Zeit', 'Temperatur (°C)', 'rel. Feuchte (%)'],
        [
          ['01.06.2021', '00:00', '12,5', '81,0'],
          ['01.06.2021', '01:00', '11,5', '85,5'],
        ],
        ';',
        '\r\n',
      )
    const r = readWeather(text, { utcOffsetHours: 1, dateOrder: 'dmy' })
    expect(Array.from(r.series.dryBulbC)).toEqual([12.5, 11.5])
    expect(Array.from(r.series.relativeHumidityPct)).toEqual([81, 85.5])
    expect(iso(r.series.startUtcMs[0])).toBe('2021-05-31T23:00')
  })

  it('tabs, quoted fields and CR-only line ends', () => {
    const text = csv(
      ['"timestamp"', '"air temp (C)"', '"RH"'],
      [
        ['"2021-06-01 00:00"', '"20.5"', '50'],
        ['"2021-06-01 01:00"', '"19.5"', '55'],
      ],
      '\t',
      '\r',
    )
    const r = readWeather(text, { utcOffsetHours: 0 })
    expect(Array.from(r.series.dryBulbC)).toEqual([20.5, 19.5])
    expect(r.rows.read).toBe(2)
  })

  it('two temperature columns are an error that names the mapping to give', () => {
    const text = csv(['timestamp', 'temperature', 'temp2', 'rh'], [['2021-06-01 00:00', 1, 2, 50]])
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(WeatherInputError)
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(/--map dryBulb=/)
    const r = readWeather(text, { utcOffsetHours: 0, mapping: { dryBulb: { column: 'temp2', unit: 'C' } } })
    expect(r.series.dryBulbC[0]).toBe(2)
  })
})

describe('encoding (pitfall 11: some typical-year CSVs are ISO-8859-1)', () => {
  it('bytes that are not UTF-8 are read as ISO-8859-1, so a Latin-1 degree sign still names °F', async () => {
    const { readWeatherBytes } = await import('../../src/weather/read-weather.ts')
    const text = 'timestamp,Temp (\u00b0F),RH (%)\n2021-06-01T00:00Z,68,50\n'
    const latin1 = Uint8Array.from(text, (c) => c.charCodeAt(0)) // 0xB0 alone is invalid UTF-8
    const r = readWeatherBytes(latin1)
    expect(r.series.dryBulbC[0]).toBeCloseTo(20, 9)
    expect(r.columns[0].unit).toBe('°F')
  })
})
