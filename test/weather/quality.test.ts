// Quality control and gap filling. Thresholds are the module's documented rules (most are
// "common practice, no source"); the clear-sky model is Haurwitz (1945), G = 1098·μ·exp(−0.057/μ).
import { describe, expect, it } from 'vitest'
import { clearSkyGhiHaurwitzCosZenithWm2 as haurwitzClearSkyWm2 } from '../../src/physics/irradiance.ts'
import { sinGeometricSunAltitude } from '../../src/physics/sun.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'
import { csv, hourStamps } from './csv-builder.ts'

const wavy = (i: number): number => Math.round((15 + 5 * Math.sin(i / 3)) * 10) / 10

function read(columns: Record<string, (number | string)[]>, options: Record<string, unknown> = {}) {
  const names = Object.keys(columns)
  const n = columns[names[0]].length
  const stamps = hourStamps('2021-06-01T00:00Z', n)
  const rows = stamps.map((t, i) => [t, ...names.map((k) => columns[k][i])])
  return readWeather(csv(['timestamp', ...names], rows), { utcOffsetHours: 0, ...options })
}

const n = 30
const temps = Array.from({ length: n }, (_, i) => wavy(i))
const rh = Array.from({ length: n }, (_, i) => 50 + (i % 7))

describe('quality control', () => {
  it('a stuck temperature sensor (12 equal hours) is rejected; the rows are counted rejected', () => {
    const t = [...temps]
    for (let i = 5; i < 17; i++) t[i] = 17.3
    const r = read({ temp: t, rh })
    expect(r.problemCounts['stuck-sensor']).toBe(12)
    for (let s = 5; s < 17; s++) expect(Number.isNaN(r.series.dryBulbC[s])).toBe(true)
    expect(r.rows.rejected).toBe(12)
    expect(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded).toBe(n)
  })

  it('11 equal hours are not a stuck sensor', () => {
    const t = [...temps]
    for (let i = 5; i < 16; i++) t[i] = 17.3
    expect(read({ temp: t, rh }).problemCounts['stuck-sensor']).toBeUndefined()
  })

  it('a one-hour spike of +15 °C is rejected and filled by interpolation', () => {
    const t = [...temps]
    t[10] = temps[10] + 15
    const r = read({ temp: t, rh })
    expect(r.problems.find((p) => p.kind === 'step')?.line).toBe(12)
    expect(r.series.dryBulbC[10]).toBeCloseTo((temps[9] + temps[11]) / 2, 9)
    expect(r.series.quality[10] & QualityFlag.filled).toBeTruthy()
  })

  it('dew point above dry bulb: by 0.3 K set to the dry bulb, by 3 K rejected', () => {
    const dew = temps.map((t) => t - 5)
    dew[3] = temps[3] + 0.3
    dew[8] = temps[8] + 3
    const r = read({ temp: temps, dewpoint: dew })
    expect(r.series.relativeHumidityPct[3]).toBeCloseTo(100, 9)
    expect(r.problems.filter((p) => p.kind === 'dew-point-above-dry-bulb').map((p) => p.line)).toEqual([
      5, 10,
    ])
    // rejected at hour 8, then filled from its neighbours (1-hour gap)
    expect(r.series.quality[8] & QualityFlag.filled).toBeTruthy()
  })

  it('RH of 101 % is clamped to 100 %, RH of 130 % rejected', () => {
    const h = [...rh]
    h[4] = 101
    h[9] = 130
    const r = read({ temp: temps, rh: h })
    expect(r.series.relativeHumidityPct[4]).toBe(100)
    expect(r.problemCounts['rh-above-100']).toBe(2)
    expect(r.series.quality[9] & QualityFlag.rejectedValue).toBeTruthy()
  })

  it('gaps of 3 hours are filled and flagged, gaps of 4 hours stay missing and the hours are excluded', () => {
    const t: (number | string)[] = [...temps]
    for (const i of [5, 6, 7]) t[i] = ''
    for (const i of [15, 16, 17, 18]) t[i] = 'NA'
    const r = read({ temp: t, rh })
    for (const s of [5, 6, 7]) expect(r.series.quality[s] & QualityFlag.filled).toBeTruthy()
    expect(r.series.dryBulbC[6]).toBeCloseTo((temps[4] + temps[8]) / 2, 9)
    for (const s of [15, 16, 17, 18]) {
      expect(Number.isNaN(r.series.dryBulbC[s])).toBe(true)
      expect(r.series.quality[s] & QualityFlag.missingCore).toBeTruthy()
    }
    expect(r.rows).toEqual({ read: n, used: n - 7, repaired: 3, rejected: 4, superseded: 0 })
    expect(r.hoursMissingCore).toBe(4)
  })

  it('missing hours with no row at all are counted, filled when short', () => {
    const stamps = hourStamps('2021-06-01T00:00Z', 10).filter((_, i) => i !== 4)
    const r = readWeather(
      csv(
        ['timestamp', 'temp', 'rh'],
        stamps.map((t, i) => [t, wavy(i), 50 + i]),
      ),
      { utcOffsetHours: 0 },
    )
    expect(r.series.hours).toBe(10)
    expect(r.hoursWithoutRow).toBe(1)
    expect(r.series.quality[4] & QualityFlag.filled).toBeTruthy()
    expect(r.rows.read).toBe(9)
  })

  it('an unreadable number is reported with its line and read as missing', () => {
    const t: (number | string)[] = [...temps]
    t[2] = 'warm'
    const r = read({ temp: t, rh })
    expect(r.problems.find((p) => p.kind === 'unparseable-number')).toMatchObject({
      line: 4,
      variable: 'dryBulb',
    })
  })
})

describe('irradiance', () => {
  // An invented site at 40° N, 0° E; 2021-06-01 UTC. Night hours come from the sun module.
  const site = { latitudeDeg: 40, longitudeDeg: 0 }
  const hours = 24
  const mu = (s: number): number =>
    sinGeometricSunAltitude(Date.parse('2021-06-01T00:00Z') + s * 3_600_000 + 1_800_000, 40, 0)
  const ghi = Array.from({ length: hours }, (_, s) => Math.round(0.7 * haurwitzClearSkyWm2(mu(s))))
  const t24 = Array.from({ length: hours }, (_, i) => wavy(i))
  const rh24 = Array.from({ length: hours }, (_, i) => 50 + (i % 7))

  it('negative night values near zero are set to 0; 300 W/m² at midnight is rejected as irradiance at night', () => {
    const g: number[] = [...ghi]
    g[1] = -3
    g[0] = 300
    const r = read({ temp: t24, rh: rh24, ghi: g }, site)
    expect(r.series.ghiWm2[1]).toBe(0)
    expect(r.series.ghiWm2[0]).toBe(0)
    expect(r.problems.find((p) => p.kind === 'irradiance-at-night')?.line).toBe(2)
    expect(r.problems.find((p) => p.kind === 'negative-irradiance')?.line).toBe(3)
  })

  it('a daytime gap is filled from the clear-sky index of its neighbour, never invented otherwise', () => {
    const g: (number | string)[] = [...ghi]
    g[12] = ''
    const r = read({ temp: t24, rh: rh24, ghi: g }, site)
    // neighbour index 0.7 (rounded values) times the hour's clear-sky irradiance
    expect(r.series.ghiWm2[12]).toBeGreaterThan(0.69 * haurwitzClearSkyWm2(mu(12)) * 0.97)
    expect(r.series.ghiWm2[12]).toBeLessThan(0.71 * haurwitzClearSkyWm2(mu(12)) * 1.03)
    expect(r.series.quality[12] & QualityFlag.irradianceFilled).toBeTruthy()
  })

  it('without latitude and longitude irradiance is neither checked nor filled, and the user is told', () => {
    const g: (number | string)[] = [...ghi]
    g[12] = ''
    const r = read({ temp: t24, rh: rh24, ghi: g })
    expect(Number.isNaN(r.series.ghiWm2[12])).toBe(true)
    expect(r.warnings.some((w) => /latitude and longitude are unknown/.test(w))).toBe(true)
  })

  it('a file whose sunshine sits in the night hours (wrong time zone) gets a warning', () => {
    const shifted = ghi.map((_, s) => ghi[(s + 12) % 24])
    const r = read({ temp: t24, rh: rh24, ghi: shifted }, site)
    expect(r.warnings.some((w) => /time zone or the timestamp labels are probably wrong/.test(w))).toBe(true)
  })

  it('no irradiance column: irradiance is NaN (the engine decides); no pressure: standard atmosphere, flagged', () => {
    const r = read({ temp: t24, rh: rh24 }, { elevationM: 1000 })
    expect(Number.isNaN(r.series.ghiWm2[5])).toBe(true)
    expect(Number.isNaN(r.series.rainMm[5])).toBe(true)
    // ASHRAE HOF 2017 ch. 1 eq 3 example: 1000 m -> 89.875 kPa
    expect(r.series.pressureKpa[5]).toBeCloseTo(89.875, 2)
    expect(r.series.quality[5] & QualityFlag.pressureFromElevation).toBeTruthy()
  })
})
