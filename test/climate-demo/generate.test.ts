/**
 * Tests of the demo-climate generator. The weather is invented: the climate checks below are
 * plausibility only (ranges from the project's demo brief, common practice, no source), not truth.
 * Format checks follow the EPW data dictionary as summarised in the project's weather-file reference.
 */
import { describe, expect, it } from 'vitest'
import { localDstImperialCsv, utcSiCsv } from '../../climate-demo/csv-formats.ts'
import { DEMO_SEED, siteHoursForYears } from '../../climate-demo/demo-files.ts'
import { multiYearEpw } from '../../climate-demo/epw-format.ts'
import { faultyLoggerCsv } from '../../climate-demo/faulty-logger.ts'
import { mulberry32, standardNormalCdf } from '../../climate-demo/random.ts'
import {
  ARDENTINE_UPLAND,
  type DemoSite,
  GULLHAVEN_COAST,
  QUILLOW_VALLEY,
  TAMAREL_LOWLAND,
} from '../../climate-demo/sites.ts'
import { haurwitzClearSkyGhiWm2, monthlyValue } from '../../climate-demo/sky.ts'
import {
  type DemoHours,
  generateSiteHours,
  rainWetness,
  softDewPointDepressionK,
} from '../../climate-demo/weather-model.ts'

const HOUR_MS = 3_600_000

describe('building blocks', () => {
  it('Haurwitz clear sky matches pvlib test values (pvlib tests/test_clearsky.py, 1e-9 relative)', () => {
    const expected: [number, number][] = [
      [5, 48.6298687941956],
      [10, 135.741748091813],
      [30, 487.894132885425],
      [50, 778.766689344363],
      [90, 1035.0920325345],
    ]
    for (const [alt, ghi] of expected) expect(haurwitzClearSkyGhiWm2(alt)).toBeCloseTo(ghi, 6)
    expect(haurwitzClearSkyGhiWm2(-1)).toBe(0)
  })
  it('Φ(1.96) ≈ 0.9750 and Φ(−1) ≈ 0.1587 (standard normal table, Abramowitz & Stegun 1964 table 26.1)', () => {
    expect(standardNormalCdf(1.96)).toBeCloseTo(0.975, 4)
    expect(standardNormalCdf(-1)).toBeCloseTo(0.158655, 5)
  })
  it('mulberry32 is uniform enough: mean of 10,000 draws within 0.5 ± 0.01', () => {
    const next = mulberry32(1)
    let sum = 0
    for (let i = 0; i < 10_000; i++) sum += next()
    expect(Math.abs(sum / 10_000 - 0.5)).toBeLessThan(0.01)
  })
  it('monthly tables interpolate to the mid-month value and wrap over new year', () => {
    const table = [0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100, 110] as const
    expect(monthlyValue(table, 15.5)).toBeCloseTo(0, 9) // mid-January
    expect(monthlyValue(table, 0)).toBeGreaterThan(0) // between mid-December (110) and mid-January (0)
    expect(monthlyValue(table, 0)).toBeCloseTo(110 * (15.5 / 31), 6)
  })
})

describe('rain wetting and the near-saturation cap', () => {
  it('wetness ramps over rain hours (0.35, 0.7, 1) and decays after (×0.7 per hour)', () => {
    const w = rainWetness(Float64Array.from([0, 1, 1, 1, 1, 0, 0]))
    const expected = [0, 0.35, 0.7, 1, 1, 0.7, 0.49]
    for (const [i, x] of expected.entries()) expect(w[i]).toBeCloseTo(x, 12)
  })
  it('the cap is continuous at its scale, positive below it and rejects a scale ≤ 0', () => {
    expect(softDewPointDepressionK(1.5 - 1e-9)).toBeCloseTo(1.5, 6)
    expect(softDewPointDepressionK(-3)).toBeGreaterThan(0)
    expect(softDewPointDepressionK(-3, 2)).toBeCloseTo(2 * Math.exp(-2.5), 12)
    expect(() => softDewPointDepressionK(1, 0)).toThrow(/scaleK must be above 0/)
  })
})

describe('determinism (same seed → same bytes)', () => {
  const opts = { firstStartUtcMs: Date.UTC(2022, 6, 1), hours: 72, seed: 42 }
  const text = (seed: number) => {
    const h = generateSiteHours(ARDENTINE_UPLAND, { ...opts, seed })
    return utcSiCsv(h, opts.firstStartUtcMs, opts.firstStartUtcMs + opts.hours * HOUR_MS)
  }
  it('two runs with one seed give identical text', () => expect(text(42)).toBe(text(42)))
  it('another seed gives other weather', () => expect(text(43)).not.toBe(text(42)))
  it('rejects a seed outside 32 bits with a message naming it', () => {
    expect(() => generateSiteHours(ARDENTINE_UPLAND, { ...opts, seed: -1 })).toThrow(/seed must be/)
  })
})

/** One local-standard year (2022) per site with the committed seed. */
const year = new Map<string, DemoHours>()
function hoursOf(site: DemoSite): DemoHours {
  let h = year.get(site.id)
  if (!h) {
    h = siteHoursForYears(site, 2022, 2022, DEMO_SEED)
    year.set(site.id, h)
  }
  return h
}

function select(
  site: DemoSite,
  col: (h: DemoHours) => Float64Array,
  months: number[],
  solarHours?: [number, number],
) {
  const h = hoursOf(site)
  const values: number[] = []
  for (let k = 0; k < h.hours; k++) {
    const ms = h.firstStartUtcMs + k * HOUR_MS
    const local = new Date(ms + site.utcOffsetHours * HOUR_MS)
    if (local.getUTCFullYear() !== 2022 || !months.includes(local.getUTCMonth() + 1)) continue
    const solarHour = new Date(ms + HOUR_MS / 2 + (site.longitudeDeg / 15) * HOUR_MS).getUTCHours()
    if (solarHours && (solarHour < solarHours[0] || solarHour > solarHours[1])) continue
    values.push(col(h)[k])
  }
  return values.sort((a, b) => a - b)
}
const median = (v: number[]) => v[Math.floor(v.length / 2)]
const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length
const afternoon: [number, number] = [13, 16]
const all = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]

describe('plausibility of the invented climates (invented data, plausibility only)', () => {
  it('dry upland: July–August afternoons 30–38 °C with RH 15–35 % (medians)', () => {
    expect(median(select(ARDENTINE_UPLAND, (h) => h.dryBulbC, [7, 8], afternoon))).toBeGreaterThan(30)
    expect(median(select(ARDENTINE_UPLAND, (h) => h.dryBulbC, [7, 8], afternoon))).toBeLessThan(38)
    const rh = median(select(ARDENTINE_UPLAND, (h) => h.relativeHumidityPct, [7, 8], afternoon))
    expect(rh).toBeGreaterThan(15)
    expect(rh).toBeLessThan(35)
  })
  it('humid lake valley: RH above 70 % in most hours of the year', () => {
    const rh = select(QUILLOW_VALLEY, (h) => h.relativeHumidityPct, all)
    expect(rh.filter((x) => x > 70).length / rh.length).toBeGreaterThan(0.5)
  })
  it('cool maritime coast: summer afternoons 15–22 °C (median), humid (median RH > 75 %)', () => {
    const t = median(select(GULLHAVEN_COAST, (h) => h.dryBulbC, [6, 7, 8], afternoon))
    expect(t).toBeGreaterThan(15)
    expect(t).toBeLessThan(22)
    expect(median(select(GULLHAVEN_COAST, (h) => h.relativeHumidityPct, all))).toBeGreaterThan(75)
  })
  it('tropical: 24–33 °C mostly, wet-season RH > 80 %, dry-season afternoons 45–60 %', () => {
    const t = select(TAMAREL_LOWLAND, (h) => h.dryBulbC, all)
    expect(mean(t)).toBeGreaterThan(24)
    expect(median(select(TAMAREL_LOWLAND, (h) => h.dryBulbC, all, afternoon))).toBeLessThan(33)
    expect(mean(select(TAMAREL_LOWLAND, (h) => h.relativeHumidityPct, [7, 8, 9]))).toBeGreaterThan(80)
    const dry = median(select(TAMAREL_LOWLAND, (h) => h.relativeHumidityPct, [1, 2], afternoon))
    expect(dry).toBeGreaterThan(45)
    expect(dry).toBeLessThan(60)
  })
  it('every site: dew point ≤ dry bulb, RH ≤ 100 %, GHI ≥ 0 and ≤ extraterrestrial, no GHI at night', () => {
    for (const site of [ARDENTINE_UPLAND, QUILLOW_VALLEY, GULLHAVEN_COAST, TAMAREL_LOWLAND]) {
      const h = hoursOf(site)
      for (let k = 0; k < h.hours; k++) {
        expect(h.dewPointC[k]).toBeLessThanOrEqual(h.dryBulbC[k])
        expect(h.relativeHumidityPct[k]).toBeLessThanOrEqual(100)
        expect(h.ghiWm2[k]).toBeGreaterThanOrEqual(0)
        expect(h.ghiWm2[k]).toBeLessThanOrEqual(h.extraterrestrialHorizontalWm2[k] + 1e-9)
        if (h.extraterrestrialHorizontalWm2[k] === 0) expect(h.ghiWm2[k]).toBe(0)
      }
    }
  })
})

describe('hour-to-hour humidity (common practice, no source: what a reader QC calls a spike or a stuck sensor)', () => {
  const sites = [ARDENTINE_UPLAND, QUILLOW_VALLEY, GULLHAVEN_COAST, TAMAREL_LOWLAND]
  it('every site: the dew point changes by at most 4 K from one hour to the next, rain hours included', () => {
    for (const site of sites) {
      const h = hoursOf(site)
      let maxStepK = 0
      for (let k = 1; k < h.hours; k++) {
        maxStepK = Math.max(maxStepK, Math.abs(h.dewPointC[k] - h.dewPointC[k - 1]))
      }
      expect(maxStepK, site.id).toBeLessThanOrEqual(4)
    }
  })
  it('every site: whole-percent RH below 99 % never repeats for 10 hours or more', () => {
    for (const site of sites) {
      const h = hoursOf(site)
      let longest = 0
      let run = 1
      for (let k = 1; k < h.hours; k++) {
        const rh = Math.round(h.relativeHumidityPct[k])
        run = rh === Math.round(h.relativeHumidityPct[k - 1]) ? run + 1 : 1
        if (rh < 99) longest = Math.max(longest, run)
      }
      expect(longest, site.id).toBeLessThan(10)
    }
  })
  it('coast: RH in long rain events spreads over several percent (no single capped value)', () => {
    const h = hoursOf(GULLHAVEN_COAST)
    const wet = rainWetness(h.rainMm)
    const rh: number[] = []
    for (let k = 0; k < h.hours; k++) if (wet[k] === 1) rh.push(Math.round(h.relativeHumidityPct[k]))
    rh.sort((a, b) => a - b)
    expect(rh.length).toBeGreaterThan(100)
    expect(
      rh[Math.floor(0.9 * (rh.length - 1))] - rh[Math.floor(0.1 * (rh.length - 1))],
    ).toBeGreaterThanOrEqual(3)
  })
})

describe('file formats', () => {
  it('EPW: 8 header lines, 35 fields, hour 1–24 ending, leap day kept, 8784 rows in 2024', () => {
    const h = siteHoursForYears(GULLHAVEN_COAST, 2024, 2024, DEMO_SEED)
    const lines = multiYearEpw(GULLHAVEN_COAST, h, 2024, 2024).trimEnd().split('\n')
    expect(lines[0]).toMatch(/^LOCATION,Gullhaven Point,.*,57\.30,-7\.20,0\.0,12\.0$/)
    expect(lines[7]).toBe('DATA PERIODS,1,1,Data,Monday,1/1/2024,12/31/2024') // 1 Jan 2024 was a Monday
    const rows = lines.slice(8).map((l) => l.split(','))
    expect(rows.length).toBe(8784)
    expect(rows.every((r) => r.length === 35)).toBe(true)
    expect(rows[0].slice(0, 4)).toEqual(['2024', '1', '1', '1'])
    expect(rows[23].slice(0, 4)).toEqual(['2024', '1', '1', '24'])
    expect(rows.some((r) => r[1] === '2' && r[2] === '29')).toBe(true)
    expect(rows.every((r) => Number(r[13]) <= Number(r[10]))).toBe(true) // GHI ≤ extraterrestrial horizontal
  })
  it('local DST export: the spring 02:00 is absent and the autumn 01:00 written twice (America/Chicago 2022)', () => {
    const h = siteHoursForYears(QUILLOW_VALLEY, 2022, 2022, DEMO_SEED)
    const text = localDstImperialCsv(QUILLOW_VALLEY, h, Date.UTC(2022, 2, 13, 6), Date.UTC(2022, 10, 6, 12))
    expect(text).not.toContain('\n2022-03-13 02:00,')
    expect(text.split('\n2022-11-06 01:00,').length - 1).toBe(2)
    expect(text.split('\n')[0]).toContain('(°F)')
    expect(text.split('\n')[0]).toContain('(mph)')
  })
  it('faulty file: the manifest line numbers point at rows with the faulty timestamps', () => {
    const h = siteHoursForYears(TAMAREL_LOWLAND, 2023, 2023, DEMO_SEED)
    const f = faultyLoggerCsv(TAMAREL_LOWLAND, h, 2023)
    const lines = f.text.trimEnd().split('\n')
    // RFC 4180: an unquoted header cell holds no comma, so the header has one cell per column.
    expect(lines[0].split(',').length).toBe(8)
    expect(lines[0].split(',')[0]).toBe('time (local standard time UTC+07:00)')
    expect(lines.length - 1).toBe(f.rows)
    expect(f.rows).toBe(8760 - 2 - 3 - 60 + 2) // gaps removed, two doubled hours added
    for (const fault of f.faults) {
      for (const n of fault.lines) expect(fault.times).toContain(lines[n - 1].slice(0, 16))
      if (fault.kind.endsWith('gap')) for (const t of fault.times) expect(f.text).not.toContain(`\n${t},`)
    }
    expect(f.faults.find((x) => x.kind === 'missing-code' && x.variable === 'dewPoint')?.lines.length).toBe(1)
    const kinds = new Set(f.faults.map((x) => x.kind))
    for (const k of [
      'missing-code',
      'stuck-sensor',
      'short-gap',
      'long-gap',
      'duplicate-row',
      'out-of-order',
    ]) {
      expect(kinds.has(k as never)).toBe(true)
    }
  })
})
