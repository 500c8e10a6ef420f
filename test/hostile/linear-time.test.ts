// Hostile text that used to make patterns backtrack (a timestamp cell padded with 4,000 spaces took
// about 13 s; a header of 1,000 cells of 100 '(' about 12 s, freezing the server). Every reader on
// user text now runs in time linear in its length: these tests assert what is answered, not how
// fast (the times are printed by `npx tsx bench/run.ts hostile`).

import { describe, expect, it } from 'vitest'
import { normaliseHeader } from '../../src/analysis/energy/log-columns.ts'
import { analyseHeader, splitHeader } from '../../src/weather/header-parts.ts'
import { headerTimeBasis } from '../../src/weather/header-time.ts'
import { parseField } from '../../src/weather/numbers.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { createTimestampColumns } from '../../src/weather/timestamp-columns.ts'
import { parseTimeOfDay, parseTimestampInto } from '../../src/weather/timestamps.ts'
import { normalizeUnitToken } from '../../src/weather/units.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'
import { COARSE_QUERY, expectInspect, expectProblem, post } from './hostile-helpers.ts'

const PADDED_STAMP = `2021-07-01 00:00${' '.repeat(4000)}x`
const PAREN_HEADER = Array.from({ length: 1000 }, () => '('.repeat(100)).join(',')

const GOOD_ROWS = ['2021-07-01 01:00,20.5,50', '2021-07-01 02:00,21.0,48', '2021-07-01 03:00,21.5,47']

describe('the two inputs of the issue', () => {
  it('a timestamp cell padded with 4,000 spaces then text: that row is rejected with its line, the others read', () => {
    const r = readWeather(`timestamp,temp_c,rh_pct\n${PADDED_STAMP},20,50\n${GOOD_ROWS.join('\n')}\n`, {
      utcOffsetHours: 0,
    })
    expect(r.rows.read).toBe(4)
    expect(r.rows.rejected).toBe(1)
    const bad = r.problems.find((p) => p.kind === 'bad-timestamp')
    expect(bad?.line).toBe(2)
    expect(bad?.message.length).toBeLessThan(200) // the cell is quoted cut, not whole
    expect(r.series.hours).toBe(3)
  })

  it('4,000 spaces of padding alone (before and after) are spaces: the timestamp reads', () => {
    const out = createTimestampColumns(1)
    expect(parseTimestampInto(out, 0, `${' '.repeat(4000)}2021-07-01 00:00${' '.repeat(4000)}`)).toBe(true)
    expect(out.minuteOfDay[0]).toBe(0)
    expect(parseTimestampInto(out, 0, `2021-07-01${' '.repeat(4000)}13:30`)).toBe(true)
    expect(out.minuteOfDay[0]).toBe(13 * 60 + 30)
  })

  it('a header of 1,000 cells of 100 "(": no header found, said so', () => {
    expect(() => readWeather(`${PAREN_HEADER}\n1,2,3\n`, { utcOffsetHours: 0 })).toThrow(WeatherInputError)
    expect(() => readWeather(`${PAREN_HEADER}\n1,2,3\n`, { utcOffsetHours: 0 })).toThrow(/no header row/)
  })

  it('the same two files sent to POST /v1/inspect: problem details and a read, as problem details and a read', async () => {
    const p = await expectProblem(
      await post('/v1/inspect?utcOffset=0', `${PAREN_HEADER}\n1,2,3\n`, 'text/csv'),
      [400, 422],
    )
    expect(p.detail).toMatch(/no header row/)
    const ok = await expectInspect(
      await post(
        '/v1/inspect?utcOffset=0',
        `timestamp,temp_c,rh_pct\n${PADDED_STAMP},20,50\n${GOOD_ROWS.join('\n')}\n`,
        'text/csv',
      ),
    )
    expect(ok.rows.rejected).toBe(1)
  })
})

describe('the two inputs of the issue through POST /v1/assess', () => {
  it('the header of "(" is refused with why; the padded stamp is one rejected row in a file too short to assess', async () => {
    const p = await expectProblem(
      await post(`${COARSE_QUERY}&utcOffset=0`, `${PAREN_HEADER}\n1,2,3\n`, 'text/csv'),
      [400, 422],
    )
    expect(p.detail).toMatch(/no header row/)
    const q = await expectProblem(
      await post(
        `${COARSE_QUERY}&utcOffset=0`,
        `timestamp,temp_c,rh_pct\n${PADDED_STAMP},20,50\n${GOOD_ROWS.join('\n')}\n`,
        'text/csv',
      ),
      [400, 422],
    )
    expect(q.detail).toMatch(/at least 24 hours, got 3/)
  })
})

describe('more hostile shapes, each read in one pass', () => {
  it('a title with commas above 100 lines of 1,000 semicolon cells of "(": every delimiter tried, no header, said so', () => {
    const lines = Array.from({ length: 100 }, () =>
      Array.from({ length: 1000 }, () => '('.repeat(100)).join(';'),
    )
    const text = `Title, a, b\n${lines.join('\n')}\n1;2;3\n`
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(/no header row with known column names/)
  })

  it('a body whose lines hold no delimiter (each line searched to the end of the file before)', () => {
    const lines = Array.from({ length: 20_000 }, (_, h) => new Date(Date.UTC(2021, 0, 1, h)).toISOString())
    const text = `timestamp,temp_c,rh_pct\n${lines.join('\n')}\n`
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(WeatherInputError)
    expect(() => readWeather(text, { utcOffsetHours: 0 })).toThrow(/no usable hour/)
  })

  it('a number cell of one digit, 100,000 spaces and a letter is unreadable, not a unit', () => {
    const out = new Float64Array(1)
    expect(parseField(`1${' '.repeat(100_000)}x!`, false, out, 0)).toBe(2)
    expect(parseField(`1${'1'.repeat(100_000)}a1`, false, out, 0)).toBe(2)
    expect(parseField('12.5 °c', false, out, 0)).toBe(0)
    expect(out[0]).toBe(12.5)
  })

  it('a header cell of 100,000 characters is cut and classified; brackets never closed stay text', () => {
    expect(splitHeader(`temp (${'°'.repeat(100_000)}`).words).toContain('temp')
    expect(analyseHeader(`${'('.repeat(100_000)}temp`).meaning).toBeNull()
    expect(analyseHeader(`dew ${')'.repeat(100_000)}`).meaning).toMatchObject({ variable: 'dewPoint' })
    expect(normalizeUnitToken(')'.repeat(100_000))).toBe('')
    expect(headerTimeBasis(`utc${'+'.repeat(100_000)}`)).toEqual({ kind: 'utc' })
  })

  it('time cells of 100,000 digits, colons or letters are not times', () => {
    const out = createTimestampColumns(1)
    expect(parseTimestampInto(out, 0, '1'.repeat(100_000))).toBe(false)
    expect(parseTimestampInto(out, 0, `2021-07-01 ${':'.repeat(100_000)}`)).toBe(false)
    expect(parseTimestampInto(out, 0, `jan${'u'.repeat(100_000)} 1 2021`)).toBe(false)
    expect(Number.isNaN(parseTimeOfDay(`1:00${' '.repeat(100_000)}p.m.x`))).toBe(true)
    expect(parseTimeOfDay(`1:00${' '.repeat(100_000)}p.m.`)).toBe(13 * 60)
  })

  it('an energy-log header of 100,000 underscores around a name keeps the name', () => {
    expect(normaliseHeader(`${'_'.repeat(100_000)}energy_kwh${'_'.repeat(100_000)}x`)).toBe(
      `energy_kwh${'_'.repeat(100_000)}x`,
    )
    expect(normaliseHeader(`${'_'.repeat(100_000)}x`)).toBe('x')
  })
})
