// Regression tests for reader bugs found by the hostile-input tests (test/hostile/*). Inputs are small
// invented files built here.
import { describe, expect, it } from 'vitest'
import { FIELD_OK, FIELD_UNREADABLE, parseField } from '../../src/weather/numbers.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
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
