/**
 * The weather reconstructions of the published experiments: the committed CSVs are what the documented,
 * seeded generator makes from the specs (test/fixtures/experiments/weather/reconstructions.ts), they read back
 * through the ordinary weather reader, and the hours keep what the specs say (daily extremes, humidity, the
 * day's radiation), so a reconstruction cannot drift from its sources unnoticed.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { hourlyExportCsv } from '../../src/weather/export.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { RECONSTRUCTIONS } from '../fixtures/experiments/weather/reconstructions.ts'
import { ENGINE_CASES } from './cases.ts'
import {
  dailyVaporPressureKpa,
  readOptionsFor,
  reconstructDays,
  reconstructionSchema,
  reconstructWeather,
} from './weather-reconstruction.ts'

const dir = new URL('../fixtures/experiments/weather/', import.meta.url)
const experiments = new Set(ENGINE_CASES.map((c) => c.experimentId))

describe.each(RECONSTRUCTIONS.map((r) => [r.id, r] as const))('weather reconstruction %s', (_id, raw) => {
  const spec = reconstructionSchema.parse(raw)
  const text = readFileSync(new URL(`${spec.id}.csv`, dir), 'utf8')

  it('the committed CSV is what the generator makes (npm run experiments:weather)', () => {
    expect(text).toBe(hourlyExportCsv(reconstructWeather(spec)))
  })

  it('reads back through the weather reader with every hour usable', () => {
    const { series } = readWeather(text, readOptionsFor(spec))
    expect(series.hours).toBe(spec.days * 24)
    for (let i = 0; i < series.hours; i++) {
      expect(Number.isFinite(series.dryBulbC[i]) && Number.isFinite(series.ghiWm2[i])).toBe(true)
    }
  })

  it("keeps the spec's daily extremes, humidity and radiation", () => {
    const { series } = readWeather(text, readOptionsFor(spec))
    const days = reconstructDays(spec)
    // means over the days of the file: within the spread the seeded anomalies allow
    const mean = (a: Float64Array) => a.reduce((s, x) => s + x, 0) / a.length
    const sdOfMean = (3 * spec.variability.temperatureSdK) / Math.sqrt(spec.days / 5) + 0.3
    expect(Math.abs(mean(days.tMaxC) - spec.temperature.tMaxC.value)).toBeLessThan(sdOfMean)
    expect(Math.abs(mean(days.tMinC) - spec.temperature.tMinC.value)).toBeLessThan(sdOfMean)
    // hourly extremes of each full day equal the day's Tmax within the hourly sampling of the cosine (0.3 K)
    let maxSeen = Number.NEGATIVE_INFINITY
    for (let i = 24; i < 48; i++) maxSeen = Math.max(maxSeen, series.dryBulbC[i])
    expect(Math.abs(maxSeen - days.tMaxC[1])).toBeLessThan(0.3)
    // FAO-56 eq 17 (or 19, or the dew point) at the normal's extremes gives the vapour pressure of a day
    // without anomaly: the file's mean vapour pressure is within the dew-point spread of it
    const e = dailyVaporPressureKpa(spec, spec.temperature.tMaxC.value, spec.temperature.tMinC.value)
    expect(Math.abs(mean(days.vaporPressureKpa) / e - 1)).toBeLessThan(0.25)
    // the day's radiation is what the hours add up to (W/m² × 3600 s / 1e6 = MJ/m²)
    let day1 = 0
    for (let i = 24; i < 48; i++) day1 += (series.ghiWm2[i] * 3600) / 1e6
    const shift = spec.site.longitudeDeg / 15 - spec.utcOffsetHours
    expect(Math.abs(day1 - days.radiationMjM2[1])).toBeLessThan(
      0.08 * days.radiationMjM2[1] + Math.abs(shift) * 0.2,
    )
  })

  it('is used by a run of the experiments it names', () => {
    for (const id of spec.experimentIds) expect(experiments.has(id)).toBe(true)
  })
})
