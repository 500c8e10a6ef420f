// Regression tests for reader bugs found by the hostile-input tests (test/hostile/*). Inputs are small
// invented files built here.
import { describe, expect, it } from 'vitest'
import { FIELD_OK, FIELD_UNREADABLE, parseField } from '../../src/weather/numbers.ts'
import { decodeWeatherBytes, readWeather, readWeatherBytes } from '../../src/weather/read-weather.ts'
import { escapeControlCharacters, SNIPPET_MAX_CHARS, snippet } from '../../src/weather/snippet.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'
import { csv } from './csv-builder.ts'

const STAMPS = ['2024-07-01T10:00Z', '2024-07-01T11:00Z', '2024-07-01T12:00Z']

describe('number literals in weather fields', () => {
  const one = (text: string): [number, number] => {
    const out = new Float64Array(1)
    const code = parseField(text, false, out, 0)
    return [code, out[0]]
  }

  // ECMAScript 2024 §7.1.4.1.1 StringToNumber accepts 0x/0b/0o literals and Infinity; no weather
  // export writes them, so they are unreadable (common practice, no source).
  it.each([
    '0x10',
    '0X1f',
    '0b11',
    '0o17',
    ' 0x10 ',
    '\u00a00x10',
    'Infinity',
    '-Infinity',
    '+Infinity',
    'infinity',
    '1e309',
    '0x',
    '0b',
  ])("'%s' is unreadable", (text) => {
    const [code, value] = one(text)
    expect(code).toBe(FIELD_UNREADABLE)
    expect(Number.isNaN(value)).toBe(true)
  })

  it.each([
    ['0', 0],
    ['00', 0],
    ['010', 10],
    ['0.5', 0.5],
    ['0e5', 0],
    ['16', 16],
    ['1e3', 1000],
    ['25 %', 25],
  ])("'%s' still reads as %d", (text, expected) => {
    expect(one(text)).toEqual([FIELD_OK, expected])
  })

  it('a hex dry bulb in a file is reported with its line and read as missing, not as 16 °C', () => {
    const text = csv(
      ['time', 'temp_c', 'rh_pct'],
      [
        [STAMPS[0], 30, 25],
        [STAMPS[1], '0x10', 22],
        [STAMPS[2], 32, 20],
      ],
    )
    const r = readWeather(text, {})
    expect(r.series.dryBulbC[1]).not.toBe(16)
    const p = r.problems.find((q) => q.kind === 'unparseable-number')
    expect(p?.line).toBe(3)
    expect(p?.message).toMatch(/0x10/)
  })
})

describe('years outside 1800–2200 and typical-year detection', () => {
  const july = (extra: string): string =>
    csv(['time', 'temp_c', 'rh_pct'], [...STAMPS.map((t, i) => [t, 30 + i, 25 - i]), [extra, 33, 19]])

  it.each(['2999-07-01T13:00Z', '2201-07-01T13:00Z', '1799-07-01T13:00Z'])(
    'one row dated %s among July 2024 rows is rejected with its line; no typical year',
    (stamp) => {
      const r = readWeather(july(stamp), {})
      expect(r.series.typicalYear).toBe(false)
      expect(r.sourceYears).toEqual([])
      expect(r.years).toEqual([2024])
      expect(r.rows.rejected).toBe(1)
      expect(r.rows.used).toBe(3)
      const p = r.problems.find((q) => q.kind === 'bad-timestamp')
      expect(p?.line).toBe(5)
      expect(p?.message).toMatch(/outside the accepted 1800–2200/)
      expect(iso(r.series.startUtcMs[0])).toBe('2024-07-01T10:00')
    },
  )

  it('every row outside the range: refused naming the accepted years', () => {
    const all = csv(
      ['time', 'temp_c', 'rh_pct'],
      STAMPS.map((t) => [t.replace('2024', '2999'), 30, 25]),
    )
    expect(() => readWeather(all, {})).toThrow(WeatherInputError)
    expect(() => readWeather(all, {})).toThrow(/1800–2200/)
  })

  // A year of hours in calendar order, each month from one year, except that `split` month's last
  // day comes from another year.
  function typicalRows(split: number | null): (string | number)[][] {
    const rows: (string | number)[][] = []
    for (let m = 1; m <= 12; m++) {
      const y = 1990 + m
      const days = new Date(Date.UTC(y, m, 0)).getUTCDate()
      for (let d = 1; d <= days; d++) {
        const year = m === split && d === days ? y + 20 : y
        for (let h = 0; h < 24; h++) rows.push([year, m, d, h, 10 + (h % 4), 50 + (h % 3)])
      }
    }
    return rows
  }
  const header = ['year', 'month', 'day', 'hour', 'temp', 'rh']

  it('twelve whole months from twelve years are a typical year', () => {
    const r = readWeather(csv(header, typicalRows(null)), { utcOffsetHours: 0 })
    expect(r.series.typicalYear).toBe(true)
    expect(r.years).toEqual([2000]) // February from 1992 has 29 days: the nominal leap year
  })

  it('a month whose rows come from two years is no typical year', () => {
    const r = readWeather(csv(header, typicalRows(7)), { utcOffsetHours: 0 })
    expect(r.series.typicalYear).toBe(false)
  })
})

function iso(ms: number): string {
  return new Date(ms).toISOString().slice(0, 16)
}

describe('byte order marks', () => {
  const text = csv(
    ['time', 'temp_c °C', 'rh_pct'],
    STAMPS.map((t, i) => [t, 30 + i, 25 - i]),
  )
  // UTF-16 code units written by hand (Unicode 15.0 §3.9, D91: one 16-bit unit per BMP character),
  // with the mark FF FE (LE) or FE FF (BE) first (§23.8 Table 23-5, from memory).
  function utf16(s: string, bigEndian: boolean): Uint8Array {
    const out = new Uint8Array(2 + 2 * s.length)
    out.set(bigEndian ? [0xfe, 0xff] : [0xff, 0xfe])
    for (let i = 0; i < s.length; i++) {
      const c = s.charCodeAt(i)
      out[2 + 2 * i] = bigEndian ? c >> 8 : c & 0xff
      out[3 + 2 * i] = bigEndian ? c & 0xff : c >> 8
    }
    return out
  }

  it.each([false, true])('UTF-16 with its mark (big-endian: %s) reads like the text', (bigEndian) => {
    const bytes = utf16(text, bigEndian)
    expect(decodeWeatherBytes(bytes)).toBe(text)
    const r = readWeatherBytes(bytes, {})
    expect(r.rows.used).toBe(3)
    expect(r.series.dryBulbC[2]).toBe(32)
    expect(r.columns.find((c) => c.variable === 'dryBulb')?.source).toBe('temp_c °C')
  })

  it('UTF-8 with its mark EF BB BF: the mark is dropped', () => {
    const body = new TextEncoder().encode(text)
    const bytes = new Uint8Array(3 + body.length)
    bytes.set([0xef, 0xbb, 0xbf])
    bytes.set(body, 3)
    expect(decodeWeatherBytes(bytes)).toBe(text)
    expect(readWeatherBytes(bytes, {}).rows.used).toBe(3)
  })

  it('invalid UTF-8 without a mark is read as ISO-8859-1 (0xB0 is the degree sign, ISO/IEC 8859-1:1998)', () => {
    const bytes = new Uint8Array([0x74, 0xb0, 0x43])
    expect(decodeWeatherBytes(bytes)).toBe('t°C')
  })
})

describe('file text in messages', () => {
  // C0 and C1 control characters (Unicode 15.0 §23.1, from memory); ESC [ 31 m is ECMA-48 SGR "red".
  const CONTROL = /[\u0000-\u001f\u007f-\u009f]/

  it('control characters are written as \\uXXXX and long text is cut', () => {
    expect(escapeControlCharacters('t\u001b[31mRED\tx\u009b\u202e')).toBe(
      't\\u001b[31mRED\\u0009x\\u009b\\u202e',
    )
    expect(escapeControlCharacters('plain °C')).toBe('plain °C')
    const long = 'x'.repeat(500)
    expect(snippet(long)).toBe(`${'x'.repeat(SNIPPET_MAX_CHARS)}…`)
    const pair = `${'x'.repeat(SNIPPET_MAX_CHARS - 1)}😀tail` // the emoji is a surrogate pair
    expect(snippet(pair)).toBe(`${'x'.repeat(SNIPPET_MAX_CHARS - 1)}…`)
  })

  it('an escape sequence in the only header is refused with the sequence escaped', () => {
    let message = ''
    try {
      readWeather('t\u001b[31mRED\r\n1,2\n', {})
    } catch (e) {
      message = (e as Error).message
    }
    expect(message).toMatch(/\\u001b\[31mRED/)
    expect(CONTROL.test(message)).toBe(false)
  })

  it('control characters in column names and cells never reach problems or warnings raw', () => {
    const bad = `\u001b]0;owned\u0007${'9'.repeat(300)}`
    const text = csv(
      ['time', 'temp_c', 'rh_pct', 'note\u001b[2J'],
      [
        [STAMPS[0], 30, 25, 'a'],
        [STAMPS[1], bad, 22, 'b'],
        [STAMPS[2], 32, 20, 'c'],
      ],
    )
    const r = readWeather(text, {})
    const p = r.problems.find((q) => q.kind === 'unparseable-number')
    expect(p?.line).toBe(3)
    expect(p?.message).toMatch(/^'\\u001b\]0;owned\\u00079+…' in column 'temp_c'/)
    expect(p!.message.length).toBeLessThan(200)
    for (const m of [...r.problems.map((q) => q.message), ...r.warnings]) expect(CONTROL.test(m)).toBe(false)
  })
})

describe('an unbalanced double quote (RFC 4180 §2: quotes come in pairs)', () => {
  const header = 'time,temp_c,rh_pct\n'
  const good = (i: number): string => `2024-07-01T${10 + i}:00Z,${30 + i},${25 - i}`

  it('costs only its own line, which is rejected and named', () => {
    const text = `${header}${good(0)}\n2024-07-01T11:00Z,"31.5,22\n${good(2)}\n${good(3)}\n`
    const r = readWeather(text, {})
    expect(r.rows).toEqual({ read: 4, used: 3, repaired: 0, rejected: 1, superseded: 0 })
    const p = r.problems.find((q) => q.kind === 'unbalanced-quote')
    expect(p?.line).toBe(3)
    expect(p?.message).toMatch(/unbalanced double quote/)
    expect(r.warnings.join(' ')).toMatch(/1 line has an unbalanced double quote \(first: line 3\)/)
    expect(r.series.dryBulbC[2]).toBe(32)
    expect(r.series.dryBulbC[3]).toBe(33)
  })

  it('two stray quotes that papaparse would pair across lines: both lines rejected, the lines between kept', () => {
    const text = `${header}2024-07-01T10:00Z,"30,25\n${good(1)}\n${good(2)}\n2024-07-01T13:00Z,33",19\n${good(4)}\n`
    const r = readWeather(text, {})
    expect(r.rows).toEqual({ read: 5, used: 3, repaired: 0, rejected: 2, superseded: 0 })
    expect(r.problems.filter((q) => q.kind === 'unbalanced-quote').map((q) => q.line)).toEqual([2, 5])
  })

  it('a stray quote in the first data row no longer sinks the file', () => {
    const text = `${header}"${good(0)}\n${good(1)}\n${good(2)}\n`
    const r = readWeather(text, {})
    expect(r.rows.used).toBe(2)
    expect(r.problems.find((q) => q.kind === 'unbalanced-quote')?.line).toBe(2)
  })

  it('balanced quotes, including a quoted note over two lines, are read as before', () => {
    const text = `${header.trim()},note\n"2024-07-01T10:00Z","30.5",25,"two\nlines"\n${good(1)},x\n`
    const r = readWeather(text, {})
    expect(r.rows).toEqual({ read: 2, used: 2, repaired: 0, rejected: 0, superseded: 0 })
    expect(r.problems.some((q) => q.kind === 'unbalanced-quote')).toBe(false)
  })
})

describe('line numbers after a quoted field over several lines', () => {
  it('a bad value after a two-line note is reported on its physical line', () => {
    const text =
      'time,temp_c,rh_pct,note\n' +
      '2024-07-01T10:00Z,30,25,"two\r\nlines"\n' + // lines 2–3
      '2024-07-01T11:00Z,x1,22,"three\nmore\nlines"\n' + // lines 4–6
      '2024-07-01T12:00Z,zz,20,c\n' // line 7
    const r = readWeather(text, {})
    expect(r.rows.read).toBe(3)
    const lines = r.problems.filter((q) => q.kind === 'unparseable-number').map((q) => q.line)
    expect(lines).toEqual([4, 7])
  })
})
