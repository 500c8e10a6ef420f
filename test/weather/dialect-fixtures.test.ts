// The dialect fixtures (test/fixtures/weather/dialects/): invented weather written in the layouts of real
// exports. These tests check the fixtures' own side only: the committed files are what the generator makes,
// the manifest covers every file, and the truth is consistent with itself and with the project physics.
// The readers' tests (bias, RMSE and phase against the truth) live with the readers.
import { readdirSync, readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { sunPosition } from '../../src/physics/sun.ts'
import { buildDialectFixtures, type Manifest } from '../fixtures/weather/dialects/gen/build.ts'
import { SITES } from '../fixtures/weather/dialects/gen/sites.ts'
import { dewPointFromRhC } from '../fixtures/weather/dialects/gen/truth.ts'

const dir = new URL('../fixtures/weather/dialects/', import.meta.url)
const NOT_FIXTURES = new Set(['generate.ts', 'README.md', 'manifest.json', 'gen', 'truth'])
const HOUR_MS = 3_600_000

const built = buildDialectFixtures()
const manifest: Manifest = JSON.parse(readFileSync(new URL('manifest.json', dir), 'utf8'))

type Table = { header: string[]; rows: Record<string, string>[] }
function readCsv(relative: string): Table {
  const text = readFileSync(new URL(relative, dir), 'utf8')
  const [head, ...rest] = text.trimEnd().split('\n')
  const header = head.split(',')
  return {
    header,
    rows: rest.map((line) => {
      const cells = line.split(',')
      return Object.fromEntries(header.map((h, i) => [h, cells[i]]))
    }),
  }
}

describe('dialect fixtures: committed files', () => {
  it('equal a fresh generator run byte for byte', () => {
    for (const f of built) {
      const committed = readFileSync(new URL(f.path, dir))
      const fresh = typeof f.content === 'string' ? Buffer.from(f.content, 'utf8') : Buffer.from(f.content)
      expect(
        committed.equals(fresh),
        `${f.path} differs from a fresh run: npx tsx ${manifest.generator.split(' ').at(-1)}`,
      ).toBe(true)
    }
  })

  it('the manifest lists every file in the folder, and every listed file exists', () => {
    const onDisk = readdirSync(dir).filter((name) => !NOT_FIXTURES.has(name))
    const listed = manifest.fixtures.map((f) => f.file)
    expect(new Set(listed).size).toBe(listed.length)
    expect([...onDisk].sort()).toEqual([...listed].sort())
    const truthOnDisk = readdirSync(new URL('truth/', dir)).map((name) => `truth/${name}`)
    const truthListed = new Set(manifest.fixtures.flatMap((f) => [f.truth, f.truthExtra, f.truthFiveMinute]))
    for (const t of truthListed) expect(truthOnDisk).toContain(t)
    // every truth file belongs to a site of the manifest
    const siteIds = new Set(manifest.sites.map((s) => s.id))
    for (const t of truthOnDisk)
      expect(siteIds.has(t.replace(/^truth\/|-(hourly|hourly-extra|5min)\.csv$/g, ''))).toBe(true)
  })

  it('every fixture states its variables with an expectation, and what a user must give', () => {
    for (const f of manifest.fixtures) {
      expect(f.variables.length + f.extraVariables.length, f.file).toBeGreaterThan(0)
      for (const v of [...f.variables, ...f.extraVariables]) {
        const e = f.expect[v as keyof typeof f.expect]!
        expect(e.hours, `${f.file} ${v}`).toBeGreaterThanOrEqual(24)
        expect(e.maxRmse, `${f.file} ${v}`).toBeGreaterThanOrEqual(e.measured.rmse)
        expect(e.maxAbsBias, `${f.file} ${v}`).toBeGreaterThanOrEqual(Math.abs(e.measured.bias))
      }
      for (const key of Object.keys(f.needs))
        expect(['lat', 'lon', 'elevationM', 'utcOffsetHours', 'siteTz', 'labels']).toContain(key)
      expect(f.exercises.length, f.file).toBeGreaterThan(0)
    }
  })
})

describe.each(SITES.map((s) => [s.id, s] as const))('dialect truth of %s', (id, site) => {
  const hourly = readCsv(`truth/${id}-hourly.csv`)
  const extra = readCsv(`truth/${id}-hourly-extra.csv`)
  const five = readCsv(`truth/${id}-5min.csv`)
  const num = (row: Record<string, string>, key: string) => Number(row[key])

  it('has the export header and whole UTC hours, start of hour, no gaps', () => {
    expect(hourly.header.join(',')).toBe(
      'time_utc,dry_bulb_c,relative_humidity_pct,dew_point_c,pressure_kpa,wind_speed_ms,ghi_wm2,rain_mm,flags',
    )
    expect(hourly.rows.length).toBe(site.days * 24)
    hourly.rows.forEach((r, h) => {
      expect(r.time_utc).toBe(new Date(site.startUtcMs + h * HOUR_MS).toISOString().replace('.000Z', 'Z'))
    })
    expect(five.rows.length).toBe(site.days * 24 * 12)
  })

  it('dew point agrees with RH through the project physics (over liquid water), hourly and 5-minute', () => {
    for (const table of [hourly, five]) {
      for (const r of table.rows) {
        const td = dewPointFromRhC(num(r, 'dry_bulb_c'), num(r, 'relative_humidity_pct'))
        expect(Math.abs(td - num(r, 'dew_point_c'))).toBeLessThanOrEqual(0.0051)
      }
    }
  })

  it('hourly = mean (instants, GHI) or total (rain) of the twelve 5-minute values of the hour', () => {
    const means = [
      'dry_bulb_c',
      'relative_humidity_pct',
      'pressure_kpa',
      'wind_speed_ms',
      'ghi_wm2',
      'cloud_cover_pct',
    ]
    hourly.rows.forEach((r, h) => {
      const slice = five.rows.slice(h * 12, h * 12 + 12)
      for (const v of means) {
        const mean = slice.reduce((s, x) => s + num(x, v), 0) / 12
        const table = v === 'cloud_cover_pct' ? extra.rows[h] : r
        const half = v === 'pressure_kpa' ? 0.0005 : v === 'ghi_wm2' || v === 'cloud_cover_pct' ? 0.05 : 0.005
        expect(Math.abs(mean - num(table, v)), `${r.time_utc} ${v}`).toBeLessThanOrEqual(half + 1e-9)
      }
      const total = slice.reduce((s, x) => s + num(x, 'rain_mm'), 0)
      expect(Math.abs(total - num(r, 'rain_mm'))).toBeLessThanOrEqual(0.0005 + 1e-9)
    })
  })

  it('the sun is up only by day: GHI is zero when the sun is below the horizon all hour, and peaks near solar noon', () => {
    hourly.rows.forEach((r, h) => {
      const start = site.startUtcMs + h * HOUR_MS
      let up = false
      for (let m = 0; m <= 60; m += 5)
        if (sunPosition(start + m * 60_000, site.latitudeDeg, site.longitudeDeg).altitudeDeg > 0) up = true
      if (!up) expect(num(r, 'ghi_wm2'), r.time_utc).toBe(0)
    })
    // the GHI-weighted mean time of day (circular) lies within 45 min of local mean solar noon
    // (12:00 − lon/15 h UTC; the equation of time moves true noon by at most about 16 min)
    let x = 0
    let y = 0
    hourly.rows.forEach((r, h) => {
      const midUtcHour = (site.startUtcMs / HOUR_MS + h + 0.5) % 24
      const angle = (2 * Math.PI * midUtcHour) / 24
      x += num(r, 'ghi_wm2') * Math.cos(angle)
      y += num(r, 'ghi_wm2') * Math.sin(angle)
    })
    const centroidHour = ((((Math.atan2(y, x) * 24) / (2 * Math.PI)) % 24) + 24) % 24
    const noonUtcHour = (((12 - site.longitudeDeg / 15) % 24) + 24) % 24
    expect(Math.abs(((centroidHour - noonUtcHour + 36) % 24) - 12)).toBeLessThanOrEqual(0.75)
  })

  it('is plausible weather (invented; ranges are common practice, no source)', () => {
    for (const r of hourly.rows) {
      expect(num(r, 'relative_humidity_pct')).toBeGreaterThan(5)
      expect(num(r, 'relative_humidity_pct')).toBeLessThanOrEqual(100)
      expect(num(r, 'dew_point_c')).toBeLessThan(num(r, 'dry_bulb_c'))
      expect(num(r, 'pressure_kpa')).toBeGreaterThan(80)
      expect(num(r, 'ghi_wm2')).toBeGreaterThanOrEqual(0)
      expect(num(r, 'ghi_wm2')).toBeLessThan(1100)
      expect(num(r, 'rain_mm')).toBeGreaterThanOrEqual(0)
    }
    const rainy = hourly.rows.filter((r) => num(r, 'rain_mm') > 0).length
    expect(rainy).toBeGreaterThan(0)
  })
})
