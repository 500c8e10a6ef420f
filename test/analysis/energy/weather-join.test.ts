import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import { analyzeEnergyLog } from '../../../src/analysis/energy/energy-chart.ts'
import {
  batchAmbientFromSeries,
  humidityRatioGPerKgFromRh,
} from '../../../src/analysis/energy/weather-join.ts'
import { createEmptySeries, type HourlySeries } from '../../../src/weather/series.ts'

psychrolib.SetUnitSystem(psychrolib.SI)

function series(hours: number, startUtcMs: number, utcOffsetHours: number | null = null): HourlySeries {
  const s = createEmptySeries(
    {
      name: 'test',
      latitudeDeg: 0,
      longitudeDeg: 0,
      elevationM: 0,
      timeZone: null,
      utcOffsetHours,
      windHeightM: 10,
    },
    startUtcMs,
    hours,
  )
  for (let i = 0; i < hours; i++) {
    s.dryBulbC[i] = 10 + (i % 24) // 10, 11, 12, … each day
    s.relativeHumidityPct[i] = 50
    s.pressureKpa[i] = 101.325
  }
  return s
}

describe('outside air joined from a weather series', () => {
  it('humidity ratio agrees with PsychroLib (ASHRAE HOF 2017 formulation) to 0.1 %', () => {
    const ref = 1000 * psychrolib.GetHumRatioFromRelHum(25, 0.6, 101325)
    expect(humidityRatioGPerKgFromRh(25, 60, 101.325)).toBeCloseTo(ref, 2)
  })
  it('averages the hours a batch covers: start 02:00 UTC for 3 h takes hours 2, 3, 4', () => {
    const t0 = Date.UTC(2026, 8, 1)
    const a = batchAmbientFromSeries(series(24, t0), t0 + 2 * 3_600_000, 3, 101.325)
    expect(a?.dryBulbC).toBeCloseTo(13, 12) // mean of 12, 13, 14
    expect(a?.hoursUsed).toBe(3)
  })
  it('refuses a batch whose hours are mostly missing (coverage below 75 %)', () => {
    const t0 = Date.UTC(2026, 8, 1)
    const s = series(24, t0)
    for (let i = 2; i < 6; i++) s.dryBulbC[i] = Number.NaN
    expect(batchAmbientFromSeries(s, t0 + 2 * 3_600_000, 6, 101.325)).toBeNull() // 2 of 6 hours
    expect(batchAmbientFromSeries(s, t0 + 100 * 3_600_000, 3, 101.325)).toBeNull() // after the series
  })
  it('the assessment fills missing ambient columns from the weather, in the file’s local time', () => {
    const t0 = Date.UTC(2026, 8, 1) // series starts 00:00 UTC
    const w = series(24 * 40, t0, -6)
    const rows = Array.from({ length: 12 }, (_, i) => {
      const day = String(i + 1).padStart(2, '0')
      return `2026-09-${day}T06:00,2,${10000 + 500 * (i % 3)},${9000 + 400 * (i % 3)},${1100 + 37 * ((i * 7) % 5)}`
    })
    const text = ['start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh', ...rows].join('\n')
    const a = analyzeEnergyLog(text, { weather: w, baselineCount: 10 })
    // 06:00 local at UTC−6 is 12:00 UTC: hours 12 and 13 of day 1 → dry bulb (22 + 23)/2 = 22.5.
    expect(a.batches[0].ambient?.source).toBe('weather')
    expect(a.batches[0].ambient?.dryBulbC).toBeCloseTo(22.5, 12)
    expect(a.assumptions.some((s) => /UTC-6 h/.test(s))).toBe(true)
  })
})
