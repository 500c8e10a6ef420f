// No irradiance column is not no sun (src/weather/sun-estimate.ts). Published checks: FAO-56 (Allen,
// Pereira, Raes & Smith 1998, Irrigation and Drainage Paper 56) Example 15 for eq 50 (Hargreaves &
// Samani) and Example 8 for the daily Ra of eq 21; Kasten & Czeplak (1980, Solar Energy 24:177) for the
// cloud factor 1 − 0.75 (N/8)^3.4 and clear sky 910 sin h − 30 W/m² (constants as quoted by
// implementations of the paper). Weather values are invented.
import { readFileSync } from 'node:fs'
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { extraterrestrialRadiationDailyMjM2 } from '../../src/physics/fao56-solar.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import {
  hargreavesSamaniDailyMjM2,
  KASTEN_CZEPLAK,
  KRS_INTERIOR,
  kastenCzeplakWm2,
} from '../../src/weather/sun-estimate.ts'
import { csv, hourStamps } from './csv-builder.ts'

describe('published values', () => {
  it('FAO-56 Example 15: Ra 40.6, Tmax 26.6, Tmin 14.8, kRs 0.16 give Rs 22.3 MJ m⁻² d⁻¹ (eq 50)', () => {
    // FAO-56 Example 15, p. 61 (as quoted with page numbers by PyETo's tests): 22.3
    expect(hargreavesSamaniDailyMjM2(26.6, 14.8, 40.6, KRS_INTERIOR)).toBeCloseTo(22.3, 1)
  })

  it('FAO-56 eq 50 never exceeds the clear-sky Rso of eq 37', () => {
    const ra = 40.6
    expect(hargreavesSamaniDailyMjM2(45, 0, ra, 0.19, 0)).toBeCloseTo(0.75 * ra, 9)
    expect(hargreavesSamaniDailyMjM2(45, 0, ra, 0.19, 1000)).toBeCloseTo((0.75 + 2e-5 * 1000) * ra, 9)
  })

  it('FAO-56 Example 8: Ra 32.2 MJ m⁻² d⁻¹ at 20°S on 3 September (J 246), the Ra the estimate uses', () => {
    expect(extraterrestrialRadiationDailyMjM2((-20 * Math.PI) / 180, 246)).toBeCloseTo(32.2, 1)
  })

  it('Kasten & Czeplak: clear sky 910 sin h − 30; overcast (8 oktas) keeps a quarter', () => {
    const sinH = Math.sin((60 * Math.PI) / 180)
    const clear = KASTEN_CZEPLAK.clearSlopeWm2 * sinH - KASTEN_CZEPLAK.clearInterceptWm2
    expect(kastenCzeplakWm2(sinH, 0)).toBeCloseTo(910 * sinH - 30, 9)
    expect(kastenCzeplakWm2(sinH, 8)).toBeCloseTo(0.25 * clear, 9)
    expect(kastenCzeplakWm2(sinH, 4)).toBeCloseTo(clear * (1 - 0.75 * 0.5 ** 3.4), 9)
    expect(kastenCzeplakWm2(0.02, 0)).toBe(0) // below 30/910 the clear sky gives nothing
  })

  it('the cloud factor falls as the cloud amount rises (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 1, noNaN: true }), fc.integer({ min: 0, max: 7 }), (sinH, n) => {
        expect(kastenCzeplakWm2(sinH, n + 1)).toBeLessThanOrEqual(kastenCzeplakWm2(sinH, n) + 1e-12)
      }),
    )
  })
})

/** Three summer days at an invented site, hourly UTC, with a daily temperature cycle. */
function days(columns: (h: number) => Record<string, number | string>): string {
  const stamps = hourStamps('2021-07-01T00:00Z', 72)
  const names = Object.keys(columns(0))
  return csv(
    ['time', ...names],
    stamps.map((t, h) => [t, ...names.map((n) => columns(h)[n])]),
  )
}
const temperature = (h: number) => Math.round((22 + 8 * Math.sin(((h % 24) - 9) * (Math.PI / 12))) * 10) / 10
const SITE = { utcOffsetHours: 0, latitudeDeg: 40, longitudeDeg: 0 }

describe('estimates in a read file', () => {
  it('no irradiance column: the sun comes from the daily temperature range, flagged and explained', () => {
    const r = readWeather(
      days((h) => ({ temp_c: temperature(h), rh_pct: 50 + (h % 5) })),
      SITE,
    )
    const s = r.series
    let day = 0
    let night = 0
    for (let i = 24; i < 48; i++) {
      expect(s.quality[i] & QualityFlag.irradianceEstimated).toBeTruthy()
      if (s.ghiWm2[i] > 0) day++
      else night++
    }
    expect(day).toBeGreaterThan(12)
    expect(night).toBeGreaterThan(6)
    // the day's hourly means add up to FAO-56 eq 50 for that day (Ra of day 182 at 40°N, range 16 °C)
    let sumMj = 0
    for (let i = 24; i < 48; i++) sumMj += (s.ghiWm2[i] * 3600) / 1e6
    let tMax = -99
    let tMin = 99
    for (let i = 24; i < 48; i++) {
      tMax = Math.max(tMax, s.dryBulbC[i])
      tMin = Math.min(tMin, s.dryBulbC[i])
    }
    const ra = extraterrestrialRadiationDailyMjM2((40 * Math.PI) / 180, 183)
    expect(sumMj).toBeCloseTo(hargreavesSamaniDailyMjM2(tMax, tMin, ra), 6)
    expect(r.notes.join(' ')).toMatch(/Hargreaves & Samani \(1982\).*FAO-56 eq 50.*7–10 days/s)
    expect(r.warnings.join(' ')).toMatch(/irradiance estimated for \d+ daylight hours/)
    expect(r.columns.find((c) => c.variable === 'ghi')?.source).toMatch(/estimated: daily temperature range/)
  })

  it('cloud cover wins over the temperature range where the hour has it', () => {
    const clear = readWeather(
      days((h) => ({ temp_c: temperature(h), rh_pct: 50 + (h % 5), 'cloud (oktas)': 0 })),
      SITE,
    )
    const overcast = readWeather(
      days((h) => ({ temp_c: temperature(h), rh_pct: 50 + (h % 5), 'cloud (oktas)': 8 })),
      SITE,
    )
    const noon = 36 // 12:00 UTC on day 2, near solar noon at 0°E
    expect(overcast.series.ghiWm2[noon]).toBeCloseTo(0.25 * clear.series.ghiWm2[noon], 6)
    expect(clear.series.ghiWm2[noon]).toBeGreaterThan(700)
    expect(clear.notes.join(' ')).toMatch(/Kasten & Czeplak \(1980/)
  })

  it('without latitude and longitude nothing is estimated, and the warning says what to give', () => {
    const r = readWeather(
      days((h) => ({ temp_c: temperature(h), rh_pct: 50 + (h % 5) })),
      { utcOffsetHours: 0 },
    )
    expect(r.series.ghiWm2.every((v) => Number.isNaN(v))).toBe(true)
    expect(r.warnings.join(' ')).toMatch(/give --lat and --lon/)
  })

  it('a measured column is kept; only its long daytime gaps are estimated', () => {
    const r = readWeather(
      days((h) => ({
        temp_c: temperature(h),
        rh_pct: 50 + (h % 5),
        'ghi (W/m2)':
          h >= 30 && h < 40 ? '' : Math.max(0, Math.round(800 * Math.sin(((h % 24) - 6) * (Math.PI / 12)))),
      })),
      SITE,
    )
    expect(r.series.quality[28] & QualityFlag.irradianceEstimated).toBeFalsy()
    expect(r.series.quality[35] & QualityFlag.irradianceEstimated).toBeTruthy()
    expect(r.series.ghiWm2[35]).toBeGreaterThan(0)
  })
})

describe('through the engine', () => {
  // A consistency check on invented demo weather (its irradiance comes from the demo generator's sky
  // model, not from a measurement): ignoring the file's column, the estimate should give about the same
  // usable hours for open-air drying, and a method that needs the sun is refused when nothing allows one.
  const text = readFileSync(
    new URL('../../climate-demo/ardentine-upland-2021-2024-utc.csv', import.meta.url),
    'utf8',
  )
  const site = { latitudeDeg: 38.3, longitudeDeg: -2.6, elevationM: 1050 }
  const options = {
    product: productById('apricot-halves'),
    method: { kind: 'open-air' as const },
    seasonStart: '07-01',
    seasonEnd: '07-31',
    startStepDays: 15,
  }

  it('usable open-air hours from the estimated sun are within 5 % of those from the file’s irradiance, month by month', () => {
    const measured = assess(readWeather(text, site).series, options)
    const estimated = assess(
      readWeather(text, { ...site, mapping: { ghi: { column: 'none' } } }).series,
      options,
    )
    for (let m = 0; m < 12; m++) {
      const a = measured.monthly[m].usableHours.median!
      const b = estimated.monthly[m].usableHours.median!
      expect(Math.abs(b - a) / a, `month ${m + 1}`).toBeLessThan(0.05)
    }
    // the estimate is said among the warnings (CLI text, report, API), not only in the assumptions
    expect(estimated.warnings.join(' ')).toMatch(
      /the sun in \d+ daylight hours is estimated from the daily temperature range, not measured/,
    )
    expect(estimated.coverage.estimatedIrradianceHours).toBeGreaterThan(0)
    expect(measured.warnings.join(' ')).not.toMatch(/is estimated/)
  })

  it('without the site position nothing allows an estimate: open air is refused, shade is assessed', () => {
    const series = readWeather(text, { mapping: { ghi: { column: 'none' } } }).series
    expect(() => assess(series, options)).toThrow(/the open-air method needs the sun.*--lat and --lon/)
    expect(() => assess(series, { ...options, method: { kind: 'shade' as const } })).not.toThrow()
  })

  it('with the position but no cloud cover and no whole day of temperatures, the refusal names what is missing', () => {
    // daytime rows only (06–19 UTC): no day has the 24 hours the temperature range needs
    const lines = text.split('\n')
    const daytime = lines.filter((l, i) => i === 0 || (l.slice(11, 13) >= '06' && l.slice(11, 13) < '20'))
    const series = readWeather(daytime.slice(0, 1 + 14 * 60).join('\n'), {
      ...site,
      mapping: { ghi: { column: 'none' } },
    }).series
    const refusal = () => assess(series, { ...options, seasonStart: '01-01', seasonEnd: '01-31' })
    expect(refusal).toThrow(/the open-air method needs the sun/)
    expect(refusal).toThrow(/neither cloud cover nor whole days of temperatures/)
    expect(refusal).not.toThrow(/--lat and --lon/)
  })
})
