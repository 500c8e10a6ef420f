// Every dialect fixture read as a user would (only the options the file truly lacks, from the
// manifest's `needs`), compared hour by hour with the weather it was generated from: bias and RMSE
// per variable within the manifest's tolerances, and the diurnal phase (hour of the mean daily
// maximum temperature and of the mean GHI peak) within 1 h of the truth's. The fixtures are invented
// weather in the layouts the services publish (test/fixtures/weather/dialects/README.md).
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { dewPointFromVaporPressureC } from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { detectDialect, dialectHead } from '../../src/weather/dialects/index.ts'
import { hourlyExportCsv } from '../../src/weather/export.ts'
import { decodeWeatherBytes, readWeather, readWeatherBytes } from '../../src/weather/read-weather.ts'
import type { WeatherReadResult } from '../../src/weather/result.ts'
import { WeatherInputError } from '../../src/weather/weather-input-error.ts'

const DIR = join(import.meta.dirname, '../fixtures/weather/dialects')

interface Expectation {
  hours: number
  maxAbsBias: number
  maxRmse: number
}
interface Fixture {
  file: string
  dialect: string
  site: string
  truth: string
  truthExtra?: string
  variables: string[]
  extraVariables?: string[]
  needs: Record<string, number | string>
  expect: Record<string, Expectation>
  missingHours?: Record<string, string[]>
}
interface Site {
  id: string
  standardOffsetHours: number
}
interface Manifest {
  sites: Site[]
  fixtures: Fixture[]
}

const DWD_TU = 'dwd-produkt-tu-stunde.txt'

const manifest = JSON.parse(readFileSync(join(DIR, 'manifest.json'), 'utf8')) as Manifest

/** The manifest's `needs` as read options (the same names the CLI flags map to). */
function optionsOf(needs: Record<string, number | string>): Record<string, unknown> {
  const names: Record<string, string> = {
    lat: 'latitudeDeg',
    lon: 'longitudeDeg',
    elevationM: 'elevationM',
    utcOffsetHours: 'utcOffsetHours',
    tz: 'timeZone',
    siteTz: 'siteTimeZone',
    headerLine: 'headerLine',
  }
  const out: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(needs)) out[names[k] ?? k] = v
  return out
}

/** A truth CSV as hour start [ms] → column → value. */
function readTruth(file: string): Map<number, Record<string, number>> {
  const [head, ...rows] = readFileSync(join(DIR, file), 'utf8').trim().split('\n')
  const names = head.split(',')
  const out = new Map<number, Record<string, number>>()
  for (const row of rows) {
    const cells = row.split(',')
    const values: Record<string, number> = {}
    names.forEach((n, j) => {
      if (j > 0) values[n] = cells[j] === '' || cells[j] === undefined ? Number.NaN : Number(cells[j])
    })
    out.set(Date.parse(cells[0]), values)
  }
  return out
}

/** The read series' value of a truth column in hour `s`. */
function readValue(r: WeatherReadResult, column: string, s: number): number {
  const series = r.series
  switch (column) {
    case 'dry_bulb_c':
      return series.dryBulbC[s]
    case 'relative_humidity_pct':
      return series.relativeHumidityPct[s]
    case 'dew_point_c': {
      const t = series.dryBulbC[s]
      const rh = series.relativeHumidityPct[s]
      if (!(rh > 0)) return Number.NaN
      return dewPointFromVaporPressureC((saturationVaporPressureLiquidKpa(t) * rh) / 100)
    }
    case 'pressure_kpa':
      return series.pressureKpa[s]
    case 'wind_speed_ms':
      return series.windMs[s]
    case 'ghi_wm2':
      return series.ghiWm2[s]
    case 'rain_mm':
      return series.rainMm[s]
    case 'cloud_cover_pct':
      return series.cloudCoverPct?.[s] ?? Number.NaN
    default:
      throw new Error(`unknown truth column ${column}`)
  }
}

interface Comparison {
  hours: number
  bias: number
  rmse: number
}

/**
 * Bias and RMSE of the read series against the truth, over the hours where both have a value, except
 * the hours the file has no value for (the manifest's `missingHours`): a reader may fill those, and
 * filling is judged elsewhere, not against an ideal reading that skips them.
 */
function compare(
  r: WeatherReadResult,
  truth: Map<number, Record<string, number>>,
  column: string,
  skip: ReadonlySet<number>,
): Comparison {
  let n = 0
  let sum = 0
  let sumSq = 0
  for (let s = 0; s < r.series.hours; s++) {
    if (skip.has(r.series.startUtcMs[s])) continue
    const t = truth.get(r.series.startUtcMs[s])?.[column]
    const v = readValue(r, column, s)
    if (t === undefined || Number.isNaN(t) || Number.isNaN(v)) continue
    n++
    sum += v - t
    sumSq += (v - t) ** 2
  }
  return { hours: n, bias: sum / n, rmse: Math.sqrt(sumSq / n) }
}

/**
 * Hour of day (site standard time) of the peak of the mean diurnal cycle of `values` over the hours
 * `starts`; NaN when some hour of day has no value.
 */
function peakHour(starts: number[], values: number[], offsetHours: number): number {
  const sum = new Float64Array(24)
  const count = new Float64Array(24)
  starts.forEach((ms, k) => {
    if (Number.isNaN(values[k])) return
    const h = (((new Date(ms).getUTCHours() + offsetHours) % 24) + 24) % 24
    sum[h] += values[k]
    count[h]++
  })
  let best = -1
  let bestValue = Number.NEGATIVE_INFINITY
  for (let h = 0; h < 24; h++) {
    if (count[h] === 0) return Number.NaN
    if (sum[h] / count[h] > bestValue) {
      bestValue = sum[h] / count[h]
      best = h
    }
  }
  return best
}

function circularDistance(a: number, b: number): number {
  const d = Math.abs(a - b) % 24
  return Math.min(d, 24 - d)
}

describe('every dialect fixture reads back as the weather it was made from', () => {
  for (const f of manifest.fixtures) {
    const site = manifest.sites.find((s) => s.id === f.site)!
    // A DWD product without temperature and humidity is read together with the station's 'tu' product.
    const companion = f.dialect.startsWith('dwd-hourly-') && f.dialect !== 'dwd-hourly-tu' ? DWD_TU : null
    const dialect = companion ? `dwd-hourly-tu+${f.dialect.slice('dwd-hourly-'.length)}` : f.dialect
    const hasHumidity = f.variables.includes('relative_humidity_pct') || f.variables.includes('dew_point_c')
    describe(`${f.file} (${f.dialect})`, () => {
      const own = readFileSync(join(DIR, f.file))
      const bytes = companion
        ? new Uint8Array(Buffer.concat([readFileSync(join(DIR, companion)), own]))
        : new Uint8Array(own)
      const truth = readTruth(f.truth)
      const extra = f.truthExtra ? readTruth(f.truthExtra) : new Map<number, Record<string, number>>()
      for (const [ms, values] of extra) truth.set(ms, { ...truth.get(ms), ...values })
      let result: WeatherReadResult | undefined
      const read = (): WeatherReadResult => {
        result ??= readWeatherBytes(bytes, optionsOf(f.needs))
        return result
      }

      if (!hasHumidity && companion === null) {
        it(`is recognised as ${f.dialect}, and refused for want of humidity rather than read with an invented one`, () => {
          expect(detectDialect(dialectHead(decodeWeatherBytes(bytes)))?.id).toBe(
            f.dialect.replace(/-(tu|ff|p0|rr|st|n)$/, ''),
          )
          expect(read).toThrow(WeatherInputError)
          expect(read).toThrow(/humidity/)
        })
        return
      }

      it(`is recognised as ${dialect} and read with only ${JSON.stringify(f.needs)}${companion ? ` (after ${companion})` : ''}`, () => {
        expect(read().dialect?.id).toBe(dialect)
      })
      if (companion !== null) {
        it(`alone, is refused with the advice to add the station's 'tu' product`, () => {
          expect(() => readWeatherBytes(new Uint8Array(own), optionsOf(f.needs))).toThrow(/"tu" product/)
        })
      }

      for (const column of [...f.variables, ...(f.extraVariables ?? [])]) {
        const e = f.expect[column]
        if (e === undefined) continue
        it(`${column}: bias within ±${e.maxAbsBias}, RMSE within ${e.maxRmse} over at least ${e.hours} hours`, () => {
          const skip = new Set((f.missingHours?.[column] ?? []).map((t) => Date.parse(t)))
          const c = compare(read(), truth, column, skip)
          expect(c.hours).toBeGreaterThanOrEqual(e.hours)
          expect(Math.abs(c.bias)).toBeLessThanOrEqual(e.maxAbsBias)
          expect(c.rmse).toBeLessThanOrEqual(e.maxRmse)
        })
      }

      it('its hourly export reads back unchanged', () => {
        const exported = hourlyExportCsv(read().series)
        expect(hourlyExportCsv(readWeather(exported).series)).toBe(exported)
      })

      for (const column of ['dry_bulb_c', 'ghi_wm2'].filter((c) => f.variables.includes(c))) {
        it(`${column}: the hour of the mean daily peak is within 1 h of the truth's`, () => {
          const r = read()
          const starts = Array.from(r.series.startUtcMs)
          const mine = starts.map((_, s) => readValue(r, column, s))
          const theirs = starts.map((ms) => truth.get(ms)?.[column] ?? Number.NaN)
          const a = peakHour(starts, mine, site.standardOffsetHours)
          const b = peakHour(starts, theirs, site.standardOffsetHours)
          expect(Number.isNaN(b)).toBe(false)
          expect(circularDistance(a, b)).toBeLessThanOrEqual(1)
        })
      }
    })
  }
})

describe('all DWD products of a station in one file', () => {
  // The solar product is stamped off the hour (the UTC instant of a true-solar-time hour, e.g. 23:26);
  // merged with the others it must not break their hours.
  const products = ['tu', 'ff', 'p0', 'rr', 'st', 'n'].map((p) => `dwd-produkt-${p}-stunde.txt`)
  const needs = optionsOf(manifest.fixtures.find((f) => f.file === DWD_TU)!.needs)
  const read = (files: string[]) =>
    readWeatherBytes(new Uint8Array(Buffer.concat(files.map((f) => readFileSync(join(DIR, f))))), needs)

  it('give every variable as the tu file read with that product alone', () => {
    const all = read(products)
    expect(all.dialect?.id).toBe('dwd-hourly-tu+ff+p0+rr+st+n')
    const pairs: [string, (r: WeatherReadResult) => Float64Array][] = [
      ['ff', (r) => r.series.windMs],
      ['p0', (r) => r.series.pressureKpa],
      ['rr', (r) => r.series.rainMm],
      ['st', (r) => r.series.ghiWm2],
      ['tu', (r) => r.series.dryBulbC],
      ['tu', (r) => r.series.relativeHumidityPct],
    ]
    for (const [product, column] of pairs) {
      const pair = read(product === 'tu' ? [DWD_TU] : [DWD_TU, `dwd-produkt-${product}-stunde.txt`])
      let compared = 0
      for (let s = 0; s < pair.series.hours; s++) {
        const k = all.series.startUtcMs.indexOf(pair.series.startUtcMs[s])
        const a = column(pair)[s]
        if (k < 0 || Number.isNaN(a)) continue
        expect(
          column(all)[k],
          `${product} at ${new Date(pair.series.startUtcMs[s]).toISOString()}`,
        ).toBeCloseTo(a, 9)
        compared++
      }
      expect(compared, product).toBeGreaterThanOrEqual(160)
    }
  })
})
