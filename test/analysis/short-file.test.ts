import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

// A grower's logger export of a few weeks (here cut from the invented dry-upland demo file) must still
// give start-date results for the days it covers, not "no complete batch".
describe('a short weather file', () => {
  const lines = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv', 'utf8').split('\n')
  const first = lines.findIndex((l) => l.startsWith('2022-07-01T00'))
  const text = [lines[0], ...lines.slice(first, first + 20 * 24)].join('\n')
  const series = readWeather(text, {
    latitudeDeg: 38.3,
    longitudeDeg: -2.6,
    elevationM: 1050,
    utcOffsetHours: 1,
  }).series

  it('20 days of July give a result for each start date whose batch fits in the data', () => {
    const a = assess(series, {
      product: productById('apricot-halves'),
      method: { kind: 'open-air' },
      seasonStart: '07-01',
      seasonEnd: '07-05',
      // apricots take about 10 days in July here: 14-day batches from 07-01 to 07-05 fit in the 20 days
      deadlineDays: 14,
      maxDays: 14,
    })
    expect(a.startDates.length).toBe(5)
    for (const row of a.startDates) {
      expect(row.years).toBe(1)
      expect(row.daysToTarget.median).toBeGreaterThan(0)
    }
    expect(a.warnings.join(' ')).toMatch(/one year/)
  })
})

describe('a file with no week of data in any year', () => {
  it('says the tables are empty and why, instead of "the file holds one year"', () => {
    const lines = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv', 'utf8').split('\n')
    const first = lines.findIndex((l) => l.startsWith('2022-07-01T00'))
    const text = [lines[0], ...lines.slice(first, first + 5 * 24)].join('\n')
    const series = readWeather(text, {
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      elevationM: 1050,
      utcOffsetHours: 1,
    }).series
    const a = assess(series, {
      product: productById('apricot-halves'),
      method: { kind: 'shade' },
      seasonStart: '07-01',
      seasonEnd: '07-02',
    })
    expect(a.coverage.years).toEqual([])
    expect(a.warnings.join(' ')).toMatch(/no year holds 168 hours \(a week\) with dry bulb and humidity/)
    expect(a.warnings.join(' ')).not.toMatch(/holds one year/)
  })
})
