import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { rankAssessments, typicalYearCaveats } from '../../src/analysis/compare.ts'
import { parseSitesCsv, sitesFromJson } from '../../src/analysis/compare-sites.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { demoSeries } from '../drying/demo-weather.ts'

describe('sites with their own settings (analysis/compare-sites.ts)', () => {
  it('reads the demo sites file: each site its name, file and own weather options', () => {
    const sites = parseSitesCsv(
      readFileSync('climate-demo/verrowmark-sites.csv', 'utf8'),
      'verrowmark-sites.csv',
    )
    expect(sites.map((s) => s.name)).toEqual([
      'Ardentine Ridge',
      'Quillow Landing',
      'Gullhaven Point',
      'Tamarel Estate',
    ])
    expect(sites[0].weather).toMatchObject({
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      elevationM: 1050,
      siteTimeZone: 'Europe/Madrid',
      utcOffsetHours: 0,
      siteName: 'Ardentine Ridge',
    })
    expect(sites[1].weather).toMatchObject({ timeZone: 'America/Chicago' })
    // the EPW states its own site: nothing but its name is given
    expect(sites[2].weather).toEqual({ siteName: 'Gullhaven Point' })
    expect(sites[3].where).toBe(
      "verrowmark-sites.csv line 8 (site 'Tamarel Estate', file tamarel-lowland-2021-2023-utc.csv)",
    )
  })

  it('takes any weather option by its API name, CLI flag or key; several map values separated by ;', () => {
    const [s] = parseSitesCsv(
      'name;file;site-tz;map;windHeightM\nNorth;n.csv;Europe/Madrid;dryBulb=T:F;relativeHumidity=H;2\n'.replace(
        'dryBulb=T:F;relativeHumidity=H',
        '"dryBulb=T:F;relativeHumidity=H"',
      ),
      's.csv',
    )
    expect(s.weather.siteTimeZone).toBe('Europe/Madrid')
    expect(s.weather.windHeightM).toBe(2)
    expect(Object.keys(s.weather.mapping ?? {})).toEqual(['dryBulb', 'relativeHumidity'])
  })

  it('names the site and its file in every error', () => {
    const bad = (text: string) => () => parseSitesCsv(text, 'sites.csv')
    expect(bad('name,file,lat\nNorth,n.csv,abc\n')).toThrow(
      "sites.csv line 2 (site 'North', file n.csv): lat: must be a number, got 'abc'",
    )
    expect(bad('name,file,lat\nNorth,n.csv,95\n')).toThrow(/site 'North', file n\.csv\): lat: Too big/)
    expect(bad('name,file,altitude\nNorth,n.csv,5\n')).toThrow(
      /unknown column 'altitude'; a site takes name, file and the weather options siteName, lat, lon/,
    )
    expect(bad('name,file\nNorth,\n')).toThrow(
      "sites.csv line 2 (site 'North'): the site has no weather file (column file)",
    )
    expect(bad('name,file\nNorth,a.csv\nnorth,b.csv\n')).toThrow(
      /line 3 .*the name is used twice \(also sites.csv line 2/,
    )
    expect(bad('site,path\nNorth,a.csv\n')).toThrow(/header must name the columns name and file/)
    expect(bad('name,file\n')).toThrow(/no site below the header/)
    expect(bad('name,file,lat\nNorth,a.csv\n')).toThrow(/line 2: 2 cells for 3 columns/)
  })

  it('the API form: a JSON array of sites, the same columns', () => {
    const sites = sitesFromJson([{ name: 'A', file: 'a.csv', lat: 38.3, lon: -2.6, tz: 'Europe/Madrid' }])
    expect(sites[0].weather).toMatchObject({
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      timeZone: 'Europe/Madrid',
    })
    expect(() => sitesFromJson({ name: 'A' })).toThrow(/JSON array of sites/)
    expect(() => sitesFromJson([{ name: 'A', file: 'a.csv', lat: { x: 1 } }])).toThrow(
      /sites\[0\]\.lat must be a number or a text/,
    )
    expect(() => sitesFromJson([{ name: 'A', file: 'a.csv', __proto__x: 1 }])).toThrow(/unknown column/)
  })
})

describe('an option never silently replaces what the file states about its site', () => {
  const epw = readFileSync('climate-demo/gullhaven-coast-2022-2024.epw', 'utf8')
  it('EPW: a different latitude and elevation are listed and warned of, naming both values', () => {
    const r = readWeather(epw, { latitudeDeg: 50, elevationM: 12 })
    expect(r.overrides).toEqual([{ option: 'latitudeDeg', given: '50° N', value: 50, stated: '57.3° N' }])
    expect(r.warnings).toContain('--lat 50 replaces the latitude the file states (57.3° N)')
    expect(r.series.site.latitudeDeg).toBe(50)
  })
  it('the same values as the file, or no option: nothing is replaced', () => {
    expect(readWeather(epw, { latitudeDeg: 57.3, longitudeDeg: -7.2 }).overrides).toEqual([])
    expect(readWeather(epw, {}).overrides).toEqual([])
  })
  it('a data service file that states its coordinates (Open-Meteo layout)', () => {
    const text = readFileSync('test/fixtures/weather/dialects/open-meteo-hourly.csv', 'utf8')
    const stated = readWeather(text, {}).series.site
    const r = readWeather(text, { longitudeDeg: (stated.longitudeDeg ?? 0) + 1 })
    expect(r.overrides?.map((o) => o.option)).toEqual(['longitudeDeg'])
  })
})

describe('the ranking states its tie-break and marks typical years', () => {
  const opts = {
    product: productById('apricot-halves'),
    method: { kind: 'open-air' as const },
    seasonStart: '07-01',
    seasonEnd: '07-29',
    startStepDays: 14,
  }
  const typical = assess(demoSeries('typicalUpland'), opts)
  const real = assess(demoSeries('dryUpland'), opts)
  it('lists sites best first with the criterion that placed each, and the assessments in the same order', () => {
    const c = rankAssessments([real, typical, real], 'probability-within-deadline', {
      labels: ['R1', 'T', 'R2'],
      files: ['r1.csv', 't.epw', 'r2.csv'],
    })
    expect(c.tieBreak).toBe(
      'sites equal on probability-within-deadline are ordered by usable-hours-p10, then by heat-per-tonne, then by the order they were given',
    )
    expect(c.sites.map((s) => s.rank)).toEqual([1, 2, 3])
    c.sites.forEach((s, i) => {
      expect(c.assessments[i]).toBe([real, typical, real][s.given])
    })
    // R1 and R2 are the same assessment: only the order given separates them
    const r2 = c.sites.find((s) => s.site === 'R2')
    const r1 = c.sites.find((s) => s.site === 'R1')
    expect(r2?.rank).toBe((r1?.rank ?? 0) + 1)
    expect(r2?.decidedBy).toBe('order-given')
    expect(c.sites.find((s) => s.site === 'T')?.typicalYear).toBe(true)
    expect(c.caveats).toHaveLength(1)
    expect(c.caveats[0]).toMatch(
      /^T is a typical year \(one constructed year\) ranked against multi-year files \(R1: 4 years, R2: 4 years\)/,
    )
  })
  it('all typical years: the caveat says the ranking compares single years', () => {
    expect(
      typicalYearCaveats([
        { site: 'A', typicalYear: true, years: 1 },
        { site: 'B', typicalYear: true, years: 1 },
      ])[0],
    ).toMatch(/^A, B: typical years/)
    expect(typicalYearCaveats([{ site: 'A', typicalYear: false, years: 3 }])).toEqual([])
  })
})
