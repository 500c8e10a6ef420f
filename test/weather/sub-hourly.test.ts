// Rows to hours (src/weather/hourly-aggregate.ts): sub-hourly readings averaged and summed, interval
// labels, "preceding hour" values, weather reports aligned to the hour, the coverage rule. Values are
// invented; the rules are the module's: EPA-454/R-99-005 §6.1 (an hourly mean needs two of four
// 15-minute periods, i.e. half the hour), a total needs the whole hour (common practice, no source),
// reports within 15 minutes of an hour stand for it (FMH-1: "METAR KDCA 210855Z is the 0900 UTC
// scheduled report … taken at 0855 UTC").
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { aggregateVariable, deaccumulate } from '../../src/weather/hourly-aggregate.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { planRows } from '../../src/weather/row-plan.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import { csv } from './csv-builder.ts'

const MS_PER_MINUTE = 60_000
const T0 = Date.parse('2021-06-01T00:00:00Z')
const stamp = (minutes: number): string =>
  new Date(T0 + minutes * MS_PER_MINUTE).toISOString().slice(0, 16).concat('Z')
const iso = (ms: number): string => new Date(ms).toISOString().slice(0, 16)

/** Readings every `step` minutes for `hours` hours: temperature, RH and rain from functions of the minute. */
function readings(
  step: number,
  hours: number,
  temp: (m: number) => number,
  rain: (m: number) => number = () => 0,
  shift = 0,
): (string | number)[][] {
  const rows: (string | number)[][] = []
  for (let m = 0; m < hours * 60; m += step)
    rows.push([stamp(m + shift), temp(m), 40 + ((m / step) % 7), rain(m)])
  return rows
}
const HEADER = ['time', 'temp_c', 'rh_pct', 'rain_mm']

describe('sub-hourly readings', () => {
  it('10-minute readings: temperature is the mean of the six readings, rain their sum, no row rejected', () => {
    const temp = (m: number) => 10 + m / 10 // 10.0, 11.0, … per 10 minutes
    const rain = (m: number) => (m % 20 === 0 ? 0.2 : 0)
    const r = readWeather(csv(HEADER, readings(10, 3, temp, rain)), { utcOffsetHours: 0 })
    expect(r.series.hours).toBe(3)
    expect(r.rows).toEqual({ read: 18, used: 18, repaired: 0, rejected: 0, superseded: 0 })
    expect(r.series.dryBulbC[0]).toBeCloseTo(12.5, 12) // mean of 10…15
    expect(r.series.dryBulbC[2]).toBeCloseTo(24.5, 12)
    expect(r.series.rainMm[1]).toBeCloseTo(0.6, 12) // three 0.2 mm readings
    expect(r.problemCounts['duplicate-timestamp']).toBeUndefined()
    expect(r.hourly).toMatchObject({ sampling: 'readings', stepMinutes: 10, partialHours: 0 })
  })

  it('interval-end labels: readings stamped 00:10 … 01:00 make the hour 00:00–01:00', () => {
    const rows: (string | number)[][] = []
    for (let k = 1; k <= 12; k++) rows.push([stamp(k * 10), k, 50 + (k % 3), 0])
    const r = readWeather(csv(HEADER, rows), { utcOffsetHours: 0, labels: 'end' })
    expect(iso(r.series.startUtcMs[0])).toBe('2021-06-01T00:00')
    expect(r.series.hours).toBe(2)
    expect(r.series.dryBulbC[0]).toBeCloseTo(3.5, 12) // readings 1…6
    expect(r.series.dryBulbC[1]).toBeCloseTo(9.5, 12) // readings 7…12
  })

  it('coverage: an hour with two of six readings is missing, with three it is kept and flagged partial', () => {
    const rows = readings(10, 3, (m) => 20 + (m % 30) / 10).filter((_row, k) => {
      const m = k * 10
      if (m >= 60 && m < 120) return m === 60 || m === 90 // hour 1: two readings
      if (m >= 120) return m !== 130 && m !== 150 && m !== 170 // hour 2: three readings
      return true
    })
    const r = readWeather(csv(HEADER, rows), { utcOffsetHours: 0 })
    expect(r.hourly.stepMinutes).toBe(10)
    expect(r.hourly.hoursBelowCoverage.dryBulb).toBe(1)
    // hour 1 too few (then filled by interpolation as a 1-hour gap, flagged filled, not invented from 2 readings)
    expect(r.series.quality[1] & QualityFlag.filled).toBeTruthy()
    expect(r.problems.some((p) => p.kind === 'too-few-readings')).toBe(true)
    expect(r.series.quality[2] & QualityFlag.partialHour).toBeTruthy()
    expect(r.series.dryBulbC[2]).toBeCloseTo((20 + 21 + 22) / 3, 12)
  })

  it('a rain total needs every reading of the hour: one missing 10-minute reading leaves the hour without rain', () => {
    const rows = readings(
      10,
      2,
      (m) => 15 + m / 60,
      () => 0.1,
    )
    rows[8][3] = '' // 01:20
    const r = readWeather(csv(HEADER, rows), { utcOffsetHours: 0 })
    expect(r.series.rainMm[0]).toBeCloseTo(0.6, 12)
    expect(Number.isNaN(r.series.rainMm[1])).toBe(true)
    expect(r.hourly.hoursBelowCoverage.rain).toBe(1)
  })

  it('an exact duplicate time is still a duplicate: first kept, second rejected', () => {
    const rows = readings(15, 1, (m) => 10 + m / 15)
    rows.splice(2, 0, [...rows[1]])
    rows[2][1] = 99
    const r = readWeather(csv(HEADER, rows), { utcOffsetHours: 0 })
    expect(r.problemCounts['duplicate-timestamp']).toBe(1)
    expect(r.series.dryBulbC[0]).toBeCloseTo(11.5, 12) // 10, 11, 12, 13
  })

  it('irradiance in Wh/m² per 10 minutes is the mean over each interval: 100 Wh/m² per 10 min = 600 W/m²', () => {
    const rows: (string | number)[][] = []
    for (let m = 0; m < 60; m += 10) rows.push([stamp(m + 600), 25, 30 + m / 10, 100])
    const r = readWeather(csv(['time', 'temp_c', 'rh_pct', 'global radiation (Wh/m2)'], rows), {
      utcOffsetHours: 0,
    })
    expect(r.series.ghiWm2[0]).toBeCloseTo(600, 9)
  })
})

describe('values over the preceding hour and running totals', () => {
  it('instants at the stamp, radiation and rain over the preceding hour: each lands in its own hour', () => {
    // like a service that stamps 01:00 with the temperature at 01:00 and the rain of 00:00–01:00
    const rows: (string | number)[][] = []
    for (let h = 0; h < 4; h++)
      rows.push([stamp(h * 60), 10 + h, 50 + h, h === 2 ? 1.5 : 0, h === 2 ? 300 : 0])
    const text = csv(['time', 'temp_c', 'rh_pct', 'rain_mm', 'ghi (W/m2)'], rows)
    const r = readWeather(text, {
      utcOffsetHours: 0,
      variableLabels: {
        rain: { label: 'end', intervalMinutes: 60 },
        ghi: { label: 'end', intervalMinutes: 60 },
      },
    })
    // the first row's rain covers the hour before it: the series starts there (23:00), without a dry bulb
    expect(iso(r.series.startUtcMs[0])).toBe('2021-05-31T23:00')
    expect(r.series.quality[0] & QualityFlag.missingCore).toBeTruthy()
    expect(r.series.rainMm[0]).toBe(0)
    expect(r.series.dryBulbC[3]).toBe(12) // the 02:00 instant stands for 02:00–03:00
    expect(r.series.rainMm[2]).toBe(1.5) // the rain stamped 02:00 fell in 01:00–02:00
    expect(r.series.ghiWm2[2]).toBe(300)
    expect(Number.isNaN(r.series.rainMm[4])).toBe(true) // the last hour's rain would be in the next row
    const plain = readWeather(text, { utcOffsetHours: 0 })
    expect(plain.series.rainMm[2]).toBe(1.5) // without the statement it is read one hour late
  })

  it('a running total (rain since midnight) becomes amounts per hour; a fall is a reset', () => {
    const hour = 3_600_000
    const utcMs = Float64Array.from({ length: 6 }, (_, h) => T0 + h * hour)
    const plan = planRows({ utcMs, labels: 'end' })
    const values = Float64Array.from([0, 0.4, 1.0, 1.0, 0.3, 0.5])
    const { resets, intervalMs } = deaccumulate(values, plan)
    expect(resets).toBe(1)
    expect(Array.from(values.subarray(1))).toEqual(
      [0.4, 1.0 - 0.4, 0, 0.3, 0.5 - 0.3].map((x) => expect.closeTo(x, 12)),
    )
    const hourly = aggregateVariable(
      values,
      plan,
      { kind: 'interval-total', label: 'end', intervalMinutes: 60 },
      intervalMs,
    )
    // label end: the first stamp (00:00) ends the hour before it, so the grid starts at 23:00; the amount
    // stamped 01:00 fell in 00:00–01:00 (index 1); the first row has no amount of its own
    expect(plan.firstHourMs).toBe(T0 - hour)
    expect(Number.isNaN(hourly.values[0])).toBe(true)
    expect(Array.from(hourly.values.subarray(1))).toEqual(
      [0.4, 0.6, 0, 0.3, 0.2].map((x) => expect.closeTo(x, 12)),
    )
  })
})

describe('weather reports (METAR-like)', () => {
  function reports(rows: [number, number, string?][]): string {
    return csv(
      ['time', 'temp_c', 'dewpoint_c', 'report_type'],
      rows.map(([m, t, kind]) => [stamp(m), t, t - 5, kind ?? 'FM-15']),
    )
  }

  it('routine reports at :53 stand for the next hour; the hours are not shifted', () => {
    const r = readWeather(reports([53, 113, 173, 233].map((m, k) => [m, 10 + k])), { utcOffsetHours: 0 })
    expect(r.hourly.sampling).toBe('reports')
    expect(r.hourly.reportMinute).toBe(53)
    expect(iso(r.series.startUtcMs[0])).toBe('2021-06-01T01:00')
    expect(Array.from(r.series.dryBulbC)).toEqual([10, 11, 12, 13])
    expect(r.hourly.alignedReports).toBe(4)
  })

  it('routine before special: a special nearer the hour does not replace the routine report', () => {
    const rows: [number, number][] = [
      [53, 10],
      [113, 11],
      [121, 30], // special at 02:01, nearer to 02:00 than the routine at 01:53
      [173, 12],
      [233, 13],
      [293, 14],
    ]
    const r = readWeather(reports(rows), { utcOffsetHours: 0 })
    expect(Array.from(r.series.dryBulbC)).toEqual([10, 11, 12, 13, 14])
    expect(r.rows.superseded).toBe(1)
    expect(r.rows.read).toBe(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded)
  })

  it('a special stands in for an hour whose routine report is missing', () => {
    const rows: [number, number][] = [
      [53, 10],
      [113, 11],
      [190, 15], // 03:10 special; the 02:53 routine report for 03:00 is missing
      [233, 13],
      [293, 14],
      [353, 16],
    ]
    const r = readWeather(reports(rows), { utcOffsetHours: 0 })
    expect(Array.from(r.series.dryBulbC)).toEqual([10, 11, 15, 13, 14, 16])
  })

  it('readings can be declared: with sampling readings, :53 rows stay in the hour they fall in', () => {
    const r = readWeather(reports([53, 113, 173].map((m, k) => [m, 10 + k])), {
      utcOffsetHours: 0,
      sampling: 'readings',
    })
    expect(iso(r.series.startUtcMs[0])).toBe('2021-06-01T00:00')
  })
})

describe('properties', () => {
  const stepArb = fc.constantFrom(5, 10, 15, 20, 30)
  it('instants average and totals sum within each hour, for any step that divides the hour', () => {
    fc.assert(
      fc.property(
        stepArb,
        fc.integer({ min: 1, max: 6 }),
        fc.array(fc.integer({ min: -3, max: 3 }), { minLength: 360, maxLength: 360 }),
        (step, hours, steps) => {
          const per = 60 / step
          // a walk of ±0.3 °C per reading: hourly means move less than the 10 °C spike limit
          const tenths: number[] = []
          for (const [k, d] of steps.entries()) tenths.push((k === 0 ? 150 : tenths[k - 1]) + d)
          const rows: (string | number)[][] = []
          for (let k = 0; k < hours * per; k++) {
            rows.push([stamp(k * step), tenths[k] / 10, 30 + (k % 11), (Math.abs(tenths[k]) % 7) / 10])
          }
          const r = readWeather(csv(HEADER, rows), { utcOffsetHours: 0 })
          expect(r.series.hours).toBe(hours)
          for (let h = 0; h < hours; h++) {
            let t = 0
            let rain = 0
            for (let k = h * per; k < (h + 1) * per; k++) {
              t += tenths[k] / 10
              rain += (Math.abs(tenths[k]) % 7) / 10
            }
            expect(r.series.dryBulbC[h]).toBeCloseTo(t / per, 9)
            expect(r.series.rainMm[h]).toBeCloseTo(rain, 9)
          }
        },
      ),
      { numRuns: 60 },
    )
  })

  it('start and end labels give the same hours when the stamps move by one step', () => {
    fc.assert(
      fc.property(
        stepArb,
        fc.array(fc.integer({ min: 0, max: 300 }), { minLength: 120, maxLength: 120 }),
        (step, tenths) => {
          const per = 60 / step
          const make = (shift: number) =>
            csv(
              HEADER,
              Array.from({ length: 2 * per }, (_, k) => [
                stamp(k * step + shift),
                tenths[k] / 10,
                40 + (k % 9),
                tenths[k] % 3,
              ]),
            )
          const start = readWeather(make(0), { utcOffsetHours: 0, labels: 'start' })
          const end = readWeather(make(step), { utcOffsetHours: 0, labels: 'end' })
          expect(Array.from(end.series.startUtcMs)).toEqual(Array.from(start.series.startUtcMs))
          expect(Array.from(end.series.dryBulbC)).toEqual(Array.from(start.series.dryBulbC))
          expect(Array.from(end.series.rainMm)).toEqual(Array.from(start.series.rainMm))
        },
      ),
      { numRuns: 40 },
    )
  })

  it('the same readings written in local time with their offset give the same UTC hours', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -11, max: 12 }),
        stepArb,
        fc.array(fc.integer({ min: 0, max: 300 }), { minLength: 120, maxLength: 120 }),
        (offset, step, tenths) => {
          const per = 60 / step
          const rows = (shiftHours: number) =>
            Array.from({ length: 2 * per }, (_, k) => [
              new Date(T0 + (k * step + shiftHours * 60) * MS_PER_MINUTE)
                .toISOString()
                .slice(0, 16)
                .replace('T', ' '),
              tenths[k] / 10,
              40 + (k % 9),
              0,
            ])
          const utc = readWeather(csv(HEADER, rows(0)), { utcOffsetHours: 0 })
          const local = readWeather(csv(HEADER, rows(offset)), { utcOffsetHours: offset })
          expect(Array.from(local.series.startUtcMs)).toEqual(Array.from(utc.series.startUtcMs))
          expect(Array.from(local.series.dryBulbC)).toEqual(Array.from(utc.series.dryBulbC))
        },
      ),
      { numRuns: 40 },
    )
  })
})

describe('a variable labelled apart from the file', () => {
  it('10-minute instants with their own end label, in a file labelled at the start: 00:10 … 01:00 make hour 0', () => {
    const rows: (string | number)[][] = []
    for (let k = 1; k <= 12; k++) rows.push([stamp(k * 10), k, 50 + (k % 3), 0])
    const file = readWeather(csv(HEADER, rows), { utcOffsetHours: 0, labels: 'end' })
    const own = readWeather(csv(HEADER, rows), {
      utcOffsetHours: 0,
      labels: 'start',
      variableLabels: { dryBulb: { label: 'end' } },
    })
    // the file-wide end label and the variable's own end label put the same readings in hour 00:00
    expect(file.series.dryBulbC[0]).toBeCloseTo(3.5, 12)
    const h0 = Array.from(own.series.startUtcMs).indexOf(T0)
    expect(own.series.dryBulbC[h0]).toBeCloseTo(3.5, 12)
  })
})
