import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { EnergyChartAssessment } from '../../src/analysis/energy/energy-chart.ts'
import { createApp } from '../../src/api/app.ts'
import { listOperations } from '../../src/api/operations.ts'

const app = createApp()
const demo = readFileSync(
  new URL('../../climate-demo/energy/quillow-dryer-batches-2026.csv', import.meta.url),
  'utf8',
)

async function problem(res: Response, status: number) {
  expect(res.status).toBe(status)
  // RFC 9457 §3: problem details as application/problem+json with type, title, status, detail.
  expect(res.headers.get('content-type')).toMatch(/^application\/problem\+json/)
  const body = (await res.json()) as {
    type: string
    title: string
    status: number
    detail: string
    errors?: { path: string; message: string }[]
  }
  expect(body.status).toBe(status)
  expect(body.type).toMatch(/problems\/[a-z-]+$/)
  expect(body.title).toBeTruthy()
  return body
}

describe('POST /v1/energy-chart', () => {
  it('charts the demo log sent as text/csv: same assessment as the core, the step found', async () => {
    const res = await app.request('/v1/energy-chart', {
      method: 'POST',
      body: demo,
      headers: { 'content-type': 'text/csv' },
    })
    expect(res.status).toBe(200)
    const a = (await res.json()) as EnergyChartAssessment
    expect(a.kind).toBe('energy-chart')
    expect(a.accounting.rowsUsed).toBe(64)
    expect(a.adjusted?.finding.estimatedChangeStart?.batchId).toBe('Q26-041')
    // The answer's view and the physics view travel in the JSON (the same keys as the CLI's --json).
    expect(a.answer.view).toBe('regression')
    expect(a.physics?.fit.efficiency).toBeGreaterThan(0)
    expect(a.summary[0]).toMatch(/^Answer: .* from batch Q26-041 /)
  })
  it('accepts multipart with log, weather-free options part, and answers HTML or CSV on request', async () => {
    const form = new FormData()
    form.append('log', new File([demo], 'quillow <log>.csv', { type: 'text/csv' }))
    form.append('options', JSON.stringify({ baseline: 25, format: 'html' }))
    const res = await app.request('/v1/energy-chart', { method: 'POST', body: form })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/html/)
    const html = await res.text()
    expect(html).toContain('first 25 batches')
    expect(html).toContain('quillow &lt;log&gt;.csv') // the file name is escaped
    expect(html).not.toContain('<log>')
    const csv = await app.request('/v1/energy-chart?format=csv&table=limits', {
      method: 'POST',
      body: demo,
      headers: { 'content-type': 'text/csv' },
    })
    expect(csv.headers.get('content-type')).toMatch(/^text\/csv/)
    expect((await csv.text()).split('\r\n')[0]).toMatch(/^chart,centre,/)
  })
  it('joins outside air from a weather part for a log without ambient columns', async () => {
    const t0 = Date.UTC(2026, 8, 1)
    const weather = ['time,temperature_c,relative_humidity_pct']
    for (let h = 0; h < 24 * 20; h++) {
      const t = new Date(t0 + h * 3_600_000).toISOString().slice(0, 16)
      weather.push(
        `${t}Z,${(15 + 5 * Math.sin(h / 3.8)).toFixed(1)},${(60 + 20 * Math.cos(h / 5.1)).toFixed(0)}`,
      )
    }
    const log = ['start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh']
    for (let d = 1; d <= 14; d++)
      log.push(
        `2026-09-${String(d).padStart(2, '0')}T08:00Z,3,${9000 + 300 * (d % 4)},${8100 + 250 * (d % 4)},${1100 + 40 * ((d * 3) % 7)}`,
      )
    const form = new FormData()
    form.append('log', log.join('\n'))
    form.append('weather', new File([weather.join('\n')], 'w.csv'))
    const res = await app.request('/v1/energy-chart?baseline=8', { method: 'POST', body: form })
    if (res.status !== 200) throw new Error(await res.text())
    const a = (await res.json()) as EnergyChartAssessment
    expect(a.batches.every((b) => b.ambient?.source === 'weather')).toBe(true)
    expect(a.adjusted).not.toBeNull()
  })
  it('415 for a JSON body, naming the accepted types', async () => {
    const body = await problem(
      await app.request('/v1/energy-chart', {
        method: 'POST',
        body: '{}',
        headers: { 'content-type': 'application/json' },
      }),
      415,
    )
    expect(body.detail).toMatch(/text\/csv/)
  })
  it('400 for a bad option, naming the field', async () => {
    const body = await problem(
      await app.request('/v1/energy-chart?baseline=abc&fuel=coal', {
        method: 'POST',
        body: demo,
        headers: { 'content-type': 'text/csv' },
      }),
      400,
    )
    expect(body.errors?.map((e) => e.path)).toEqual(['baseline', 'fuel'])
  })
  it('400 for a baseline longer than the log, and for a multipart body without a log part', async () => {
    const a = await problem(
      await app.request('/v1/energy-chart?baseline=500', {
        method: 'POST',
        body: demo,
        headers: { 'content-type': 'text/csv' },
      }),
      400,
    )
    expect(a.detail).toMatch(/baseline must be a whole number of batches from 5 to 64.*got 500/)
    const form = new FormData()
    form.append('weather', 'x')
    const b = await problem(await app.request('/v1/energy-chart', { method: 'POST', body: form }), 400)
    expect(b.errors).toEqual([{ path: 'log', message: 'missing' }])
  })
  it('422 for a log without usable rows, listing each bad line', async () => {
    const log =
      'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh\n2026-09-01T08:00,5,10000,11000,100\nyesterday,5,10000,9000,100\n'
    const body = await problem(
      await app.request('/v1/energy-chart', {
        method: 'POST',
        body: log,
        headers: { 'content-type': 'text/csv' },
      }),
      422,
    )
    expect(body.errors?.map((e) => e.path)).toEqual(['line 2', 'line 3'])
    expect(body.errors?.[1].message).toMatch(/start must be an ISO 8601 date-time/)
  })
  it('422 for an unusable weather part, 422 for a header without the required columns', async () => {
    const form = new FormData()
    form.append('log', demo)
    form.append('weather', 'nothing,useful\n1,2\n')
    const w = await problem(await app.request('/v1/energy-chart', { method: 'POST', body: form }), 422)
    expect(w.errors?.[0].path).toBe('weather')
    const h = await problem(
      await app.request('/v1/energy-chart', {
        method: 'POST',
        body: 'a,b\n1,2\n',
        headers: { 'content-type': 'text/csv' },
      }),
      422,
    )
    expect(h.detail).toMatch(/header lacks start, duration_h, fresh_mass_kg/)
  })
  it('is documented in the OpenAPI operations with its error statuses, and its example works', async () => {
    const op = listOperations().find((o) => o.path === '/v1/energy-chart')
    expect(op?.method).toBe('post')
    expect(op?.errors).toEqual([400, 413, 415, 422])
    const ex = op!.examples[0]
    const res = await app.request(ex.url, {
      method: 'POST',
      body: ex.body,
      headers: { 'content-type': ex.contentType! },
    })
    expect(res.status).toBe(200)
  })
})
