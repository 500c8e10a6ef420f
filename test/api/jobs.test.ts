// The three jobs through the API: methods side by side on /v1/assess, sites with their own settings on
// /v1/compare (a `sites` part), and the formats the summaries are made in.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { parseSitesCsv } from '../../src/analysis/compare-sites.ts'
import { createApp } from '../../src/api/app.ts'
import { DRYING_METHOD_KINDS } from '../../src/drying/method.ts'

const app = createApp()
const demo = (f: string) => new Blob([readFileSync(`climate-demo/${f}`)])
const typical = 'ardentine-upland-typical-year.epw'
const coast = 'gullhaven-coast-2022-2024.epw'

async function post(url: string, body: BodyInit, headers: Record<string, string> = {}) {
  const res = await app.request(url, { method: 'POST', body, headers })
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text() }
}

function form(parts: [string, Blob | string, string?][]): FormData {
  const f = new FormData()
  for (const [name, value, fileName] of parts) {
    if (typeof value === 'string') f.append(name, value)
    else f.append(name, value, fileName)
  }
  return f
}

const season = { seasonStart: '07-01', seasonEnd: '07-29', startStepDays: 7 }

describe('POST /v1/assess with several methods', () => {
  it('a JSON list of methods (one with its own parameters): the comparison with every assessment', async () => {
    const r = await post(
      '/v1/assess',
      form([
        ['file', demo(typical), typical],
        [
          'options',
          JSON.stringify({
            product: 'apricot-halves',
            method: ['shade', { kind: 'heated', setPointC: 50 }],
            currency: 'EUR',
            ...season,
          }),
        ],
      ]),
    )
    expect(r.status, r.text.slice(0, 300)).toBe(200)
    const c = JSON.parse(r.text)
    expect(c.schema).toBe('dryhours.method-comparison/1')
    expect(c.assessments.map((a: { method: { kind: string } }) => a.method.kind)).toEqual(['shade', 'heated'])
    expect(c.assessments[1].method.setPointC).toBe(50)
    expect(c.currency).toBe('EUR')
  })
  it('method=all in the query, as HTML and as one CSV table', async () => {
    const q = 'product=apricot-halves&method=all&start=07-01&end=07-29&stepDays=7'
    const html = await post(`/v1/assess?${q}&format=html`, demo(typical), { 'content-type': 'text/csv' })
    expect(html.status).toBe(200)
    expect(html.text).toContain('data-report="methods"')
    const csv = await post(`/v1/assess?${q}&format=csv&table=methods`, demo(typical), {
      'content-type': 'text/csv',
    })
    expect(csv.status).toBe(200)
    // header and one row per method the apricots can take: every registered method but the grain bin
    expect(csv.text.split('\r\n').filter((l) => l !== '')).toHaveLength(DRYING_METHOD_KINDS.length)
  })
  it('refuses a method listed twice, an unknown one, and a currency that is not a short name, naming the field', async () => {
    const bad = async (query: string) =>
      JSON.parse(
        (await post(`/v1/assess?product=figs&${query}`, demo(typical), { 'content-type': 'text/csv' })).text,
      )
    expect((await bad('method=shade,shade')).errors[0].path).toBe('method.1')
    expect((await bad('method=shade,kiln')).detail).toMatch(/method must be one of/)
    const c = await bad('method=shade&currency=%3Cb%3E')
    expect(c.status).toBe(400)
    expect(c.errors[0].path).toBe('currency')
  })
})

describe('POST /v1/assess: a natural-air bin beside heated air', () => {
  it('method=natural-air-bin,heated with airflow: the bin parameters go to the bin; fruit with all lists the bin as not assessed', async () => {
    const q =
      'product=shelled-corn&method=natural-air-bin,heated&tz=America/Chicago&initialWb=20&targetWb=15.5&start=09-15&end=10-15&stepDays=7&airflow=1,2'
    const r = await post(`/v1/assess?${q}`, demo('quillow-valley-2021-2023-local-dst-imperial.csv'), {
      'content-type': 'text/csv',
    })
    expect(r.status, r.text.slice(0, 300)).toBe(200)
    const c = JSON.parse(r.text)
    expect(c.methods.map((m: { kind: string }) => m.kind)).toEqual(['natural-air-bin', 'heated'])
    expect(c.assessments[0].method.airflowsM3PerMinPerTonne).toEqual([1, 2])
    expect([1, 2]).toContain(c.methods[0].bin.airflowM3PerMinPerTonne)
    const html = await post(
      `/v1/assess?${q}&format=html`,
      demo('quillow-valley-2021-2023-local-dst-imperial.csv'),
      {
        'content-type': 'text/csv',
      },
    )
    expect(html.text).toMatch(/figures at [\d.]+ m³\/min per t/)
    const fruit = await post(
      '/v1/assess?product=apricot-halves&method=all&start=07-01&end=07-15&stepDays=7&airflow=2',
      demo(typical),
      { 'content-type': 'text/csv' },
    )
    expect(fruit.status, fruit.text.slice(0, 300)).toBe(200)
    const all = JSON.parse(fruit.text)
    expect(all.notAssessed.map((n: { kind: string }) => n.kind)).toContain('natural-air-bin')
    const refused = await post(
      '/v1/assess?product=apricot-halves&method=shade,heated&airflow=2',
      demo(typical),
      {
        'content-type': 'text/csv',
      },
    )
    expect(refused.status).toBe(400)
    expect(refused.text).toMatch(/airflow goes with method=natural-air-bin/)
  })
})

describe('POST /v1/compare with a sites part', () => {
  const options = JSON.stringify({ product: 'apricot-halves', method: 'open-air', ...season })
  it('each site read with its own settings, the sites best first, a typical year marked with its caveat', async () => {
    const r = await post(
      '/v1/compare',
      form([
        ['site', demo(typical), typical],
        ['site', demo(coast), coast],
        [
          'sites',
          JSON.stringify([
            { name: 'Ridge', file: typical },
            { name: 'Coast', file: coast, lat: 57.0 },
          ]),
        ],
        ['options', options],
      ]),
    )
    expect(r.status, r.text.slice(0, 300)).toBe(200)
    const c = JSON.parse(r.text)
    expect(c.sites.map((s: { rank: number }) => s.rank)).toEqual([1, 2])
    const coastIndex = c.sites.findIndex((s: { site: string }) => s.site === 'Coast')
    expect(c.assessments[coastIndex].site.latitudeDeg).toBe(57)
    // the site's own option replaced what its file states: said in its warnings, naming both values
    expect(c.assessments[coastIndex].warnings[0]).toBe(
      "site 'Coast': lat=57 replaces the latitude the file states (57.3° N)",
    )
    expect(c.sites.find((s: { site: string }) => s.site === 'Ridge').typicalYear).toBe(true)
    expect(c.caveats[0]).toMatch(/^Ridge is a typical year/)
    expect(c.tieBreak).toMatch(/order they were given/)
  })
  it('errors name the site and its file', async () => {
    const missing = JSON.parse(
      (
        await post(
          '/v1/compare',
          form([
            ['site', demo(typical), typical],
            ['site', demo(coast), coast],
            [
              'sites',
              JSON.stringify([
                { name: 'Ridge', file: typical },
                { name: 'Coast', file: 'coast.epw' },
              ]),
            ],
            ['options', options],
          ]),
        )
      ).text,
    )
    expect(missing.detail).toBe(
      `sites[1] (site 'Coast', file coast.epw): no uploaded file is named 'coast.epw' (uploaded: ${typical}, ${coast})`,
    )
    const unused = JSON.parse(
      (
        await post(
          '/v1/compare',
          form([
            ['site', demo(typical), typical],
            ['site', demo(coast), coast],
            ['sites', JSON.stringify([{ name: 'Ridge', file: typical }])],
            ['options', options],
          ]),
        )
      ).text,
    )
    expect(unused.detail).toMatch(/uploaded files no site names: gullhaven/)
    const badLat = JSON.parse(
      (
        await post(
          '/v1/compare',
          form([
            ['site', demo(typical), typical],
            ['site', demo(coast), coast],
            [
              'sites',
              JSON.stringify([
                { name: 'Ridge', file: typical, lat: 'north' },
                { name: 'Coast', file: coast },
              ]),
            ],
            ['options', options],
          ]),
        )
      ).text,
    )
    expect(badLat.detail).toBe(`sites[0] (site 'Ridge', file ${typical}): lat: must be a number, got 'north'`)
    const both = JSON.parse(
      (
        await post(
          '/v1/compare?lat=40',
          form([
            ['site', demo(typical), typical],
            ['site', demo(coast), coast],
            [
              'sites',
              JSON.stringify([
                { name: 'Ridge', file: typical },
                { name: 'Coast', file: coast },
              ]),
            ],
          ]),
        )
      ).text,
    )
    expect(both.status).toBe(400)
  })
  it('an option for every file that would move a site its file states is refused, naming the file and both values', async () => {
    const r = await post(
      `/v1/compare?product=apricot-halves&method=open-air&start=07-01&end=07-15&stepDays=7&lon=-3`,
      form([
        ['site', demo(typical), typical],
        ['site', demo(coast), coast],
      ]),
    )
    expect(r.status).toBe(422)
    expect(JSON.parse(r.text).detail).toMatch(
      /^ardentine-upland-typical-year\.epw: lon=-3 replaces the longitude the file states \(2\.6° W\)/,
    )
  })
  it('format=html: the criterion, the tie-break and the typical year are stated', async () => {
    const r = await post(
      '/v1/compare?format=html',
      form([
        ['site', demo(typical), typical],
        ['site', demo(coast), coast],
        ['options', options],
      ]),
    )
    expect(r.status).toBe(200)
    expect(r.text).toContain('Ranking criterion: ')
    expect(r.text).toContain('Ties: sites equal on probability-within-deadline')
    expect(r.text).toContain('(typical year)')
    expect(r.text).toMatch(/Caveat: .* is a typical year/)
  })
  it('format=csv: the ranking and how it was ranked', async () => {
    const r = await post(
      '/v1/compare?format=csv&table=site-comparison',
      form([
        ['site', demo(typical), typical],
        ['site', demo(coast), coast],
        ['options', options],
      ]),
    )
    expect(r.status, r.text.slice(0, 200)).toBe(200)
    expect(r.type).toMatch(/text\/csv/)
    expect(r.text.split('\r\n')[0]).toMatch(/^rank,site,/)
  })
})

describe('the advisor through the API: one summary per farm of the demo sites table', () => {
  it('each farm of climate-demo/verrowmark-sites.csv, posted with its own settings, answers its HTML summary', async () => {
    const sites = parseSitesCsv(
      readFileSync('climate-demo/verrowmark-sites.csv', 'utf8'),
      'climate-demo/verrowmark-sites.csv',
    )
    expect(sites.map((s) => s.name)).toEqual([
      'Ardentine Ridge',
      'Quillow Landing',
      'Gullhaven Point',
      'Tamarel Estate',
    ])
    for (const site of sites) {
      const options = JSON.stringify({
        product: 'apricot-halves',
        method: 'open-air',
        weather: { ...site.weather, siteName: site.name },
        ...season,
      })
      const html = await post(
        '/v1/assess?format=html',
        form([
          ['file', demo(site.file), site.file],
          ['options', options],
        ]),
      )
      expect(html.status, `${site.name}: ${html.text.slice(0, 300)}`).toBe(200)
      expect(html.text).toMatch(/^<!doctype html>/)
      expect(html.text).toContain(site.name)
    }
  })
})
