// Property tests (fast-check): the reader never crashes on arbitrary input, a generated series
// written as CSV reads back equal, and row counts always add up.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { readWeather, readWeatherBytes } from '../../src/weather/read-weather.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'

function readOrInputError(run: () => ReturnType<typeof readWeather>): void {
  try {
    const r = run()
    expect(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded).toBe(r.rows.read)
    expect(r.series.startUtcMs.length).toBe(r.series.hours)
  } catch (e) {
    if (!(e instanceof WeatherInputError)) throw e
    expect(e.message.length).toBeGreaterThan(10)
  }
}

/** A random walk of `n` integer steps in ±1…±max (never 0, so no stuck runs), as tenths; reflected at its bounds. */
const walk = (n: number, start: fc.Arbitrary<number>, max: number) =>
  fc.tuple(
    start,
    fc.array(
      fc.integer({ min: 1, max }).chain((k) => fc.constantFrom(k, -k)),
      { minLength: n, maxLength: n },
    ),
  )

describe('reader properties', () => {
  it('arbitrary bytes never crash: a WeatherInputError with a message, or a series whose counts add up', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (bytes) => {
        readOrInputError(() => readWeatherBytes(bytes, { utcOffsetHours: 0 }))
      }),
      { numRuns: 300 },
    )
  })

  it('CSV-like noise (header words, digits, separators, dates) never crashes', () => {
    const token = fc.constantFrom(
      'timestamp',
      'temp',
      'rh',
      'dew',
      'wind',
      '2021-06-01 00:00',
      '2021-06-01 24:00',
      '13/13/2021 1:00',
      ',',
      ';',
      '\t',
      '\n',
      '\r\n',
      '"',
      '-9999',
      '99.9',
      '1,5',
      'NA',
      '',
      ' ',
      '°F',
      '(hPa)',
      '12',
    )
    fc.assert(
      fc.property(
        fc.array(token, { maxLength: 80 }),
        fc.constantFrom({}, { utcOffsetHours: 3 }, { timeZone: 'Europe/Paris' }),
        (tokens, options) => {
          readOrInputError(() => readWeather(tokens.join(''), options))
        },
      ),
      { numRuns: 300 },
    )
  })

  it('a generated series written as CSV reads back equal', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 60 }).chain((n) =>
          fc.record({
            n: fc.constant(n),
            start: fc.integer({ min: 0, max: 200_000 }), // hours after 2000-01-01T00Z
            t: walk(n, fc.integer({ min: -200, max: 300 }), 5),
            rh: walk(n, fc.integer({ min: 200, max: 800 }), 20),
            p: walk(n, fc.integer({ min: 8500, max: 10300 }), 9),
            w: walk(n, fc.integer({ min: 50, max: 100 }), 4),
          }),
        ),
        ({ n, start, t, rh, p, w }) => {
          // Reflect a step that would leave [lo, hi] instead of clamping it: a clamp repeats the
          // bound (a plateau of 12 equal readings is, rightly, a stuck sensor), a reflection never
          // repeats a value, as the walk's steps are never 0.
          const series = (s: [number, number[]], lo: number, hi: number) => {
            let x = s[0]
            return s[1].map((d) => {
              x = x + d > hi || x + d < lo ? x - d : x + d
              return x
            })
          }
          const tt = series(t, -300, 450).map((k) => k / 10)
          const rr = series(rh, 50, 1000).map((k) => k / 10)
          const pp = series(p, 8000, 10500).map((k) => k / 100)
          const ww = series(w, 1, 300).map((k) => k / 10)
          const t0 = Date.UTC(2000, 0, 1) + start * 3_600_000
          const lines = ['timestamp,temp (C),rh (%),pressure (kPa),wind (m/s)']
          for (let i = 0; i < n; i++)
            lines.push(`${new Date(t0 + i * 3_600_000).toISOString()},${tt[i]},${rr[i]},${pp[i]},${ww[i]}`)
          const r = readWeather(lines.join('\n'))
          expect(r.rows).toEqual({ read: n, used: n, repaired: 0, rejected: 0, superseded: 0 })
          expect(r.series.startUtcMs[0]).toBe(t0)
          expect(Array.from(r.series.dryBulbC)).toEqual(tt)
          expect(Array.from(r.series.relativeHumidityPct)).toEqual(rr)
          expect(Array.from(r.series.pressureKpa)).toEqual(pp)
          expect(Array.from(r.series.windMs)).toEqual(ww)
        },
      ),
      { numRuns: 150 },
    )
  })

  it('row counts add up with random blanks, missing codes, junk and duplicated or dropped rows', () => {
    const cell = fc.oneof(
      fc.integer({ min: 0, max: 300 }).map((k) => String(k / 10)),
      fc.constantFrom('', 'NA', '-9999', 'x', '999.9'),
    )
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.integer({ min: 0, max: 40 }),
            cell,
            cell,
            fc.constantFrom('keep', 'dup', 'drop', 'badtime'),
          ),
          { minLength: 1, maxLength: 60 },
        ),
        (rows) => {
          const lines = ['timestamp,temp,rh']
          let count = 0
          for (const [h, t, rh, what] of rows) {
            if (what === 'drop') continue
            const stamp =
              what === 'badtime' ? '2021-02-30 10:00' : new Date(Date.UTC(2021, 5, 1, h)).toISOString()
            lines.push(`${stamp},${t},${rh}`)
            count++
            if (what === 'dup') {
              lines.push(`${stamp},${t},${rh}`)
              count++
            }
          }
          try {
            const r = readWeather(lines.join('\n'), { utcOffsetHours: 0 })
            expect(r.rows.read).toBe(count)
            expect(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded).toBe(count)
          } catch (e) {
            expect(e).toBeInstanceOf(WeatherInputError)
          }
        },
      ),
      { numRuns: 200 },
    )
  })
})
