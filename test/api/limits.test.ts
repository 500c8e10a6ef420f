import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { configFromVariables, DEFAULT_API_CONFIG } from '../../src/api/config.ts'

const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')
const post = (app: ReturnType<typeof createApp>, url: string, body: BodyInit, type?: string) =>
  app.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined })

async function problem(res: Response, status: number): Promise<string> {
  expect(res.status).toBe(status)
  expect(res.headers.get('content-type')).toBe('application/problem+json')
  return ((await res.json()) as { detail: string }).detail
}

describe('request limits', () => {
  it('a file with more rows than maxRows is a 413 that says how to split', async () => {
    const app = createApp({ maxRows: 1000 })
    const detail = await problem(
      await post(app, '/v1/assess?product=figs&method=open-air', upland, 'text/csv'),
      413,
    )
    expect(detail).toMatch(/split it by years/)
    await problem(await post(app, '/v1/inspect', upland, 'text/csv'), 413)
  })

  it('more simulated batch-hours than maxBatchHours is a 422 before any work, naming the levers', async () => {
    const app = createApp({ maxBatchHours: 100_000 })
    const detail = await problem(
      await post(
        app,
        '/v1/assess?product=figs&method=open-air&start=06-01&end=09-30&stepDays=1',
        upland,
        'text/csv',
      ),
      422,
    )
    expect(detail).toMatch(/batch-hours/)
    // the levers by their names in this request (query form: stepDays, start, maxDays)
    expect(detail).toMatch(/\(stepDays\)/)
  })

  it('more sites than maxSites is a 413', async () => {
    const app = createApp({ maxSites: 2 })
    const form = new FormData()
    for (const n of ['a', 'b', 'c']) form.append('site', new Blob([upland]), `${n}.csv`)
    form.append('options', JSON.stringify({ product: 'figs', method: 'open-air' }))
    await problem(await post(app, '/v1/compare', form), 413)
  })

  it('the wall-clock budget (a clock given by the entry point) stops a long assessment with a 422', async () => {
    let t = 0
    const app = createApp({ timeBudgetMs: 1000, now: () => (t += 400) })
    const detail = await problem(
      await post(
        app,
        '/v1/assess?product=figs&method=open-air&start=06-01&end=06-30&stepDays=2',
        upland,
        'text/csv',
      ),
      422,
    )
    expect(detail).toMatch(/budget/)
  })

  it('settings from variables: numbers parsed, nonsense refused with the variable named', () => {
    expect(
      configFromVariables({
        DRYHOURS_MAX_ROWS: '5000',
        DRYHOURS_CORS_ORIGINS: 'https://a.example, https://b.example',
      }),
    ).toEqual({
      maxRows: 5000,
      corsOrigins: ['https://a.example', 'https://b.example'],
    })
    expect(() => configFromVariables({ DRYHOURS_MAX_SITES: 'lots' })).toThrow(/DRYHOURS_MAX_SITES/)
    expect(DEFAULT_API_CONFIG.corsOrigins).toEqual([])
  })

  it('CORS is off by default and answers only the configured origins when set', async () => {
    const off = await createApp().request('/healthz', { headers: { origin: 'https://a.example' } })
    expect(off.headers.get('access-control-allow-origin')).toBeNull()
    const on = await createApp({ corsOrigins: ['https://a.example'] }).request('/v1/air?tdb=20&rh=50', {
      headers: { origin: 'https://a.example' },
    })
    expect(on.headers.get('access-control-allow-origin')).toBe('https://a.example')
  })
})
