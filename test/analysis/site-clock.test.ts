import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import type { StartDateRow } from '../../src/analysis/assessment.ts'
import { localTimeColumns } from '../../src/analysis/local-time.ts'
import { seasonCalendar } from '../../src/analysis/season-calendar.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

// The invented dry-upland demo file (UTC time stamps) read for a site that keeps Europe/Madrid's clock.
// Daylight saving in the EU: from the last Sunday of March 01:00 UTC to the last Sunday of October
// 01:00 UTC (Directive 2000/84/EC, art. 2 and 3), so CET (UTC+1) in winter and CEST (UTC+2) in summer.
const lines = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv', 'utf8').split('\n')
const site = { latitudeDeg: 38.3, longitudeDeg: -2.6, elevationM: 1050 }
const zoned = readWeather(lines.join('\n'), { ...site, siteTimeZone: 'Europe/Madrid' }).series
// without a zone the site's clock is mean solar time to the hour from the longitude: UTC+0 here, all year
const standard = readWeather(lines.join('\n'), site).series
const indexOf = (iso: string) => zoned.startUtcMs.indexOf(Date.parse(iso))

describe("the site's clock", () => {
  it('follows the zone with daylight saving when the zone is known, standard time otherwise', () => {
    const t = localTimeColumns(zoned)
    expect(t.timeZone).toBe('Europe/Madrid')
    expect(t.utcOffsetHours).toBe(1)
    expect(t.hour[indexOf('2022-07-01T06:00:00Z')]).toBe(8) // CEST
    expect(t.hour[indexOf('2022-01-10T07:00:00Z')]).toBe(8) // CET
    const s = localTimeColumns(standard)
    expect(s.timeZone).toBeNull()
    expect(s.utcOffsetHours).toBe(0)
    expect(s.hour[indexOf('2022-07-01T06:00:00Z')]).toBe(6)
  })

  it('turns a time on the clock into the instant, through the spring gap and the autumn overlap', () => {
    const t = localTimeColumns(zoned)
    expect(t.toUtcMs(2022, 7, 1, 8)).toBe(Date.parse('2022-07-01T06:00:00Z'))
    expect(t.toUtcMs(2022, 1, 10, 8)).toBe(Date.parse('2022-01-10T07:00:00Z'))
    // 2022-03-27: clocks jump from 02:00 CET to 03:00 CEST; 02:30 does not exist → the first hour after the gap
    expect(t.toUtcMs(2022, 3, 27, 2)).toBe(Date.parse('2022-03-27T01:00:00Z'))
    // 2022-10-30: 02:00 happens twice (CEST, then CET) → the earlier
    expect(t.toUtcMs(2022, 10, 30, 2)).toBe(Date.parse('2022-10-30T00:00:00Z'))
    expect(localTimeColumns(standard).toUtcMs(2022, 7, 1, 8)).toBe(Date.parse('2022-07-01T08:00:00Z'))
  })

  it('moves the hour-of-day table by the zone offset of the season and states the zone in the assessment', () => {
    const options = {
      product: productById('grapes-to-raisins'),
      method: { kind: 'open-air' as const },
      seasonStart: '07-01',
      seasonEnd: '07-08',
    }
    const a = assess(zoned, options)
    const b = assess(standard, options)
    expect(a.site.timeZone).toBe('Europe/Madrid')
    expect(b.site.timeZone).toBeNull()
    // July on CEST is UTC+2, January on CET UTC+1; the tables hold the same hours shifted by that much
    // (a month's first and last hours differ by the shift of its edges, hence the tolerance)
    for (const [month, shift] of [
      [6, 2],
      [0, 1],
    ]) {
      for (let h = 0; h + shift < 24; h++) {
        const onClock = a.hourOfDay.usableFraction[month][h + shift]
        const onSolar = b.hourOfDay.usableFraction[month][h]
        if (onClock === null || onSolar === null) continue
        expect(Math.abs(onClock - onSolar)).toBeLessThan(0.02)
      }
    }
  })
})

describe('usable share of daylight hours', () => {
  it('is above the share of all hours for a method that stops at night, which has no usable night hour', () => {
    const a = assess(standard, {
      product: productById('grapes-to-raisins'),
      method: { kind: 'open-air' },
      seasonStart: '07-01',
      seasonEnd: '07-02',
    })
    for (const m of a.monthly) {
      expect(m.usableNightHoursShare).toBe(0)
      expect(m.usableDaylightFraction as number).toBeGreaterThan(m.usableFraction as number)
    }
  })
})

function row(start: string, p: number, extra: Partial<StartDateRow> = {}): StartDateRow {
  return {
    start,
    years: 4,
    daysToTarget: { median: 10, p90: 12 },
    probabilityWithinDeadline: p,
    probabilityWithinMaxDuration: 1,
    rewettingHours: { median: 0, p90: 0 },
    rainExposureHours: { median: 0, p90: 0 },
    supplementalHeat: { medianKwhPerTonne: 0, p90KwhPerTonne: 0, yearsNeedingHeat: 0 },
    yearsNotReachable: 0,
    yearsUnknown: 0,
    missingWeatherHours: 0,
    solarHeatKwhPerTonne: { median: 0, p90: 0 },
    spoilage: null,
    ...extra,
  } as StartDateRow
}

describe('the season calendar', () => {
  const season = { start: '07-01', end: '07-23', stepDays: 1 }
  it('folds daily start dates into weeks from the first start date, each from the mean of its days, with the rules', () => {
    const rows = [
      ...['07-01', '07-02', '07-03', '07-04', '07-05', '07-06', '07-07'].map((d) => row(d, 1)),
      ...['07-08', '07-09', '07-10', '07-11', '07-12', '07-13'].map((d) => row(d, 0.9)),
      row('07-14', 0),
      ...['07-15', '07-16'].map((d) => row(d, 0.2)),
      ...['07-17', '07-18', '07-19', '07-20', '07-21'].map((d) => ({ ...row(d, 0), years: 0 })),
      ...['07-22', '07-23'].map((d) => ({ ...row(d, 0), years: 0 })),
    ]
    const c = seasonCalendar(rows, season)
    expect(c.cells.map((x) => [x.from, x.to, x.state])).toEqual([
      ['07-01', '07-07', 'dries'],
      ['07-08', '07-14', 'marginal'], // (6 × 0.9 + 0) / 7 = 0.771
      ['07-15', '07-21', 'needs-heat'],
      ['07-22', '07-23', 'no-data'],
    ])
    expect(c.cells[1].probabilityWithinDeadline).toBe(0.771)
    expect(c.cells[2].starts).toBe(2)
    expect(c.rules.find((r) => r.state === 'dries')?.rule).toMatch(/at least 80 % of years/)
  })

  it('keeps one week per start date a week apart, and marks spoilage first (or marginal) where it is assessed', () => {
    const weekly = { start: '06-01', end: '06-29', stepDays: 7 }
    const rows = [
      row('06-01', 0.3),
      row('06-08', 1, { spoilage: { probability: 0.7 } } as Partial<StartDateRow>),
      row('06-15', 1, { spoilage: { probability: 0.3 } } as Partial<StartDateRow>),
      row('06-22', 1),
      { ...row('06-29', 0), years: 0 },
    ]
    const c = seasonCalendar(rows, weekly)
    expect(c.cells.map((x) => x.state)).toEqual([
      'needs-heat',
      'spoils-first',
      'marginal',
      'dries',
      'no-data',
    ])
    expect(c.cells[1].spoilageProbability).toBe(0.7)
    expect(c.cells[3].spoilageProbability).toBeNull()
  })
})
