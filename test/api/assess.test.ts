import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { createApp } from '../../src/api/app.ts'
import { productById } from '../../src/product/catalogue.ts'
import { renderOptionNames } from '../../src/weather/option-spec.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

const app = createApp()
const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')
const lowland = readFileSync('climate-demo/tamarel-lowland-2021-2023-utc.csv')
const post = (url: string, body: BodyInit, type?: string) =>
  app.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined })

async function expectProblem(res: Response, status: number) {
  expect(res.status).toBe(status)
  expect(res.headers.get('content-type')).toBe('application/problem+json')
  const body = (await res.json()) as { status: number; detail: string; errors?: { path: string }[] }
  expect(body.status).toBe(status)
  return body
}

describe('POST /v1/assess', () => {
  it('answers the same assessment as the engine called directly (as `dryhours assess --json` does)', async () => {
    const url =
      '/v1/assess?product=apricot-halves&method=open-air&start=07-01&end=07-31&stepDays=5&lat=38.3&lon=-2.6&elevation=1050'
    const res = await post(url, upland, 'text/csv')
    expect(res.status).toBe(200)
    const body = await res.json()
    const read = readWeather(new TextDecoder().decode(upland), {
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      elevationM: 1050,
    })
    read.series.site.name = 'weather file' // the API names an unnamed site after the upload
    const direct = assess(read.series, {
      product: productById('apricot-halves'),
      method: { kind: 'open-air' },
      seasonStart: '07-01',
      seasonEnd: '07-31',
      startStepDays: 5,
      fuelPrices: {},
    })
    // the same, with option names in the API's words (the engine writes the CLI's)
    direct.warnings = direct.warnings.map((w) => renderOptionNames(w, 'query'))
    expect(body).toEqual(JSON.parse(JSON.stringify(direct)))
    expect(body.monthly).toHaveLength(12)
  })

  it('takes a multipart request with a JSON options part (heated method object)', async () => {
    const form = new FormData()
    form.append('file', new Blob([lowland]), 'lowland.csv')
    form.append(
      'options',
      JSON.stringify({
        product: 'cocoa-beans',
        method: { kind: 'heated', setPointC: 55, fuel: 'wood-pellets' },
        seasonStart: '08-01',
        seasonEnd: '08-15',
        startStepDays: 7,
        fuelPrices: { 'wood-pellets': 0.3 },
      }),
    )
    const res = await post('/v1/assess', form)
    expect(res.status).toBe(200)
    const body = (await res.json()) as { method: { kind: string }; startDates: unknown[] }
    expect(body.method.kind).toBe('heated')
    expect(body.startDates.length).toBeGreaterThan(0)
  })

  it('format=html is a self-contained document; format=csv neutralises formulas in names', async () => {
    const html = await post(
      '/v1/assess?product=figs&method=shade&start=08-01&end=08-10&format=html',
      upland,
      'text/csv',
    )
    expect(html.status).toBe(200)
    const text = await html.text()
    expect(text.startsWith('<!doctype html>')).toBe(true)
    expect(text).not.toMatch(/(src|href)="(https?:)?\/\//)
    const csv = await post(
      '/v1/assess?product=figs&method=shade&start=08-01&end=08-10&format=csv&siteName=%3DHYPERLINK(%22x%22)',
      upland,
      'text/csv',
    )
    expect(csv.status).toBe(200)
    expect(csv.headers.get('content-type')).toContain('text/csv')
    const body = await csv.text()
    expect(body).not.toMatch(/(^|,)=HYPERLINK/m)
  })

  it.each([
    ['/v1/assess?method=open-air', 'product'],
    ['/v1/assess?product=figs', 'method'],
    ['/v1/assess?product=figs&method=sauna', 'method'],
    ['/v1/assess?product=figs&method=open-air&start=13-01', 'start'],
    ['/v1/assess?product=figs&method=open-air&price=propane=-1', 'price'],
    ['/v1/assess?product=no-such&method=open-air', 'product'],
  ])('%s is a 400 naming %s', async (url, field) => {
    const body = await expectProblem(await post(url, upland, 'text/csv'), 400)
    expect(JSON.stringify(body.errors ?? body.detail)).toContain(field)
  })

  it('400 for wrongly typed JSON options, 415 for JSON bodies, 422 for an unusable file', async () => {
    const form = new FormData()
    form.append('file', new Blob([lowland]), 'lowland.csv')
    form.append(
      'options',
      JSON.stringify({ product: 'figs', method: 'open-air', deadlineDays: 'soon', extra: 1 }),
    )
    const bad = await expectProblem(await post('/v1/assess', form), 400)
    expect(JSON.stringify(bad.errors)).toContain('options.deadlineDays')
    await expectProblem(await post('/v1/assess?product=figs&method=open-air', '{}', 'application/json'), 415)
    await expectProblem(
      await post('/v1/assess?product=figs&method=open-air', 'time,temp_c\n2024-01-01T00:00Z,3\n', 'text/csv'),
      422,
    )
  })
})

describe('POST /v1/compare', () => {
  it('ranks the dry upland above the humid tropical lowland for open-air apricots in summer', async () => {
    const form = new FormData()
    form.append('site', new Blob([lowland]), 'lowland.csv')
    form.append('site', new Blob([upland]), 'upland.csv')
    form.append(
      'options',
      JSON.stringify({
        product: 'apricot-halves',
        method: 'open-air',
        seasonStart: '07-01',
        seasonEnd: '08-15',
        startStepDays: 7,
      }),
    )
    const res = await post('/v1/compare', form)
    expect(res.status).toBe(200)
    const body = (await res.json()) as { sites: { rank: number; site: string }[] }
    expect(body.sites.find((s) => s.rank === 1)?.site).toBe('upland.csv')
  })
  it('400 with only one file', async () => {
    const form = new FormData()
    form.append('site', new Blob([upland]), 'upland.csv')
    form.append('options', JSON.stringify({ product: 'figs', method: 'open-air' }))
    await expectProblem(await post('/v1/compare', form), 400)
  })
})
