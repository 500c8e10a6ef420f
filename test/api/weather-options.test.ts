// The weather options of the API and the page come from the same table as the CLI flags
// (src/weather/option-spec.ts), and every message names an option as the request gave it: a query
// parameter (`map=…`), a JSON key (`mapping`), or the page's field label. Weather values are invented.
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { HOURLY_EXPORT_HEADER } from '../../src/weather/export.ts'
import { renderOptionNames, WEATHER_OPTION_SPECS } from '../../src/weather/option-spec.ts'

const app = createApp()
const post = (url: string, body: BodyInit, type?: string) =>
  app.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined })

/** Two days of hourly readings with headers no reader recognises (°F, a fraction). */
function oddCsv(): string {
  const rows = ['when;T_a;H_a;P_mm']
  const start = Date.parse('2021-08-01T00:00:00Z')
  for (let h = 0; h < 48; h++) {
    const t = 68 + 18 * Math.sin(((h % 24) - 9) * (Math.PI / 12))
    rows.push(
      `${new Date(start + h * 3_600_000).toISOString().slice(0, 16).replace('T', ' ')};${t.toFixed(1)};${(0.5 + (h % 5) / 100).toFixed(2)};${h === 10 ? 2 : 0}`,
    )
  }
  return `${rows.join('\n')}\n`
}
const MAP = 'map=timestamp=when;dryBulb=T_a:F;relativeHumidity=H_a:fraction;rain=P_mm:mm'

describe('weather options in the API', () => {
  it('every option of the table is a query parameter of /v1/inspect, /v1/assess and /v1/energy-chart in the OpenAPI document', async () => {
    const doc = (await (await app.request('/openapi.json')).json()) as {
      paths: Record<string, { post: { parameters?: { name: string }[] } }>
    }
    for (const path of ['/v1/inspect', '/v1/assess', '/v1/energy-chart']) {
      const names = (doc.paths[path].post.parameters ?? []).map((p) => p.name)
      for (const s of WEATHER_OPTION_SPECS) expect(names, `${path} ${s.param}`).toContain(s.param)
    }
  })

  it('labels, siteTz and map in the query: rain over the preceding hour lands an hour earlier, the site clock is given', async () => {
    const plain = await post(`/v1/inspect?utcOffset=0&${MAP}&format=csv`, oddCsv(), 'text/csv')
    const shifted = await post(
      `/v1/inspect?utcOffset=0&${MAP}&labels=rain%3Dend%3A60&siteTz=Europe/Madrid&format=csv`,
      oddCsv(),
      'text/csv',
    )
    expect(plain.status).toBe(200)
    expect(shifted.status).toBe(200)
    const rainOf = (text: string) =>
      text
        .trim()
        .split('\n')
        .slice(1)
        .map((l) => l.split(','))
        .filter((c) => c[7] === '2')
        .map((c) => c[0])
    expect(rainOf(await plain.text())).toEqual(['2021-08-01T10:00:00Z'])
    expect(rainOf(await shifted.text())).toEqual(['2021-08-01T09:00:00Z'])
    const json = (await (
      await post(`/v1/inspect?utcOffset=0&${MAP}&siteTz=Europe/Madrid`, oddCsv(), 'text/csv')
    ).json()) as { site: { utcOffsetHours: number; utcOffsetSource: string; timeZone: string } }
    expect(json.site).toMatchObject({
      utcOffsetHours: 1,
      utcOffsetSource: 'option',
      timeZone: 'Europe/Madrid',
    })
  })

  it('format=csv answers with the export: exact header, UTC hour starts', async () => {
    const res = await post(`/v1/inspect?utcOffset=0&${MAP}&format=csv`, oddCsv(), 'text/csv')
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    const lines = (await res.text()).trim().split('\n')
    expect(lines[0]).toBe(HOURLY_EXPORT_HEADER)
    expect(lines[1]).toMatch(/^2021-08-01T00:00:00Z,12\.94,50,/) // 55.3 °F as written; 0.50 as a fraction
    expect(lines).toHaveLength(49)
  })

  it('a bad value is a 400 naming the query parameter', async () => {
    const res = await post(`/v1/inspect?utcOffset=0&${MAP}&labels=middle`, oddCsv(), 'text/csv')
    expect(res.status).toBe(400)
    const p = (await res.json()) as { detail: string; errors: { path: string }[] }
    expect(p.detail).toMatch(/^labels: must be one of start, end, got 'middle'/)
    expect(p.errors[0].path).toBe('labels')
  })

  it('a file the reader cannot use is a 422 whose advice names query parameters, not CLI flags', async () => {
    const res = await post('/v1/inspect', oddCsv(), 'text/csv')
    expect(res.status).toBe(422)
    const p = (await res.json()) as { detail: string }
    expect(p.detail).toMatch(/map=timestamp=<column>/)
    expect(p.detail).not.toMatch(/--map/)
  })

  it('with the JSON options part the messages use the JSON keys', async () => {
    const form = new FormData()
    form.append('file', new Blob([oddCsv()]), 'odd.csv')
    form.append('options', JSON.stringify({ utcOffsetHours: 0, mapping: { timestamp: { column: 'when' } } }))
    const res = await post('/v1/inspect', form)
    expect(res.status).toBe(422)
    const p = (await res.json()) as { detail: string }
    expect(p.detail).toMatch(/mapping: relativeHumidity=<column>/)
    expect(p.detail).not.toMatch(/--map/)
  })

  it('assess takes the same query options as inspect (map, labels), and a file without them is a 422', async () => {
    const base = '/v1/assess?product=figs&method=shade&start=08-01&end=08-01&lat=38&lon=-3&utcOffset=0'
    const ok = await post(`${base}&${MAP}&labels=rain%3Dend%3A60`, oddCsv(), 'text/csv')
    expect(ok.status).toBe(200)
    const refused = await post(base, oddCsv(), 'text/csv')
    expect(refused.status).toBe(422)
  })
})

describe('renderOptionNames', () => {
  it('rewrites CLI flags for each surface and leaves other text alone', () => {
    const m =
      "give --utc-offset <h> or --tz <zone>; map with --map dryBulb=<column>[:C|F|K]; --lat and --lon; a header '--x'"
    expect(renderOptionNames(m, 'cli')).toBe(m)
    expect(renderOptionNames(m, 'query')).toBe(
      "give utcOffset=<h> or tz=<zone>; map with map=dryBulb=<column>[:C|F|K]; lat and lon; a header '--x'",
    )
    expect(renderOptionNames(m, 'json')).toBe(
      "give utcOffsetHours: <h> or timeZone: <zone>; map with mapping: dryBulb=<column>[:C|F|K]; latitudeDeg and longitudeDeg; a header '--x'",
    )
    expect(renderOptionNames('--date-order mdy or dmy', 'form')).toBe('“Date order”: mdy or dmy')
  })

  it('runs in time linear in the text (a 200,000-character message of dashes)', () => {
    const text = `${'-'.repeat(100_000)}--lat ${'x'.repeat(100_000)}`
    const out = renderOptionNames(text, 'query')
    expect(out.length).toBeGreaterThan(199_000)
  })
})

describe('weather options on the page', () => {
  it('the form has one field per option of the table, named as the API parameter', async () => {
    const html = await (await app.request('/')).text()
    for (const s of WEATHER_OPTION_SPECS) expect(html, s.param).toContain(`name="${s.param}"`)
  })

  it('a bad value names the field by its label; the labels field shifts rain like the API parameter', async () => {
    const make = (fields: Record<string, string>) => {
      const f = new FormData()
      for (const [k, v] of Object.entries({ product: 'figs', method: 'shade', format: 'json', ...fields }))
        f.set(k, v)
      f.append('file', new File([oddCsv()], 'odd.csv', { type: 'text/csv' }))
      return f
    }
    const bad = await app.request('/report', { method: 'POST', body: make({ lat: 'north', utcOffset: '0' }) })
    expect(bad.status).toBe(400)
    expect(await bad.text()).toContain('“Latitude [° N]”: must be a number')
    const ok = await app.request('/report', {
      method: 'POST',
      body: make({
        utcOffset: '0',
        lat: '38',
        lon: '-3',
        map: 'timestamp=when\ndryBulb=T_a:F\nrelativeHumidity=H_a:fraction\nrain=P_mm:mm',
        labels: 'rain=end:60',
        seasonStart: '08-01',
        seasonEnd: '08-01',
      }),
    })
    expect(ok.status).toBe(200)
  })
})
