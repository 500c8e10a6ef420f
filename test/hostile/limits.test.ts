/**
 * One planner, one set of limits (issue "no input may freeze or exhaust the server", item 1): the engine's
 * planner gives the defaults and the cost, and the API, the page and the CLI ask it; every route that takes
 * a file has a row, column and byte limit and a time budget that covers reading. Time bounds are generous
 * (10× or more what was measured on a loaded 2-core machine): they check the refusal comes before the work.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  ASSESS_DEFAULTS,
  assessmentCost,
  estimateBatchHours,
  planAssessment,
} from '../../src/analysis/plan.ts'
import { createApp } from '../../src/api/app.ts'
import { DEFAULT_API_CONFIG, limitsTable } from '../../src/api/config.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { productById } from '../../src/product/catalogue.ts'
import { app, expectProblem, inventedDays, post } from './hostile-helpers.ts'

const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')
const JULY = inventedDays(3)
const figs = productById('figs')
const OPEN_AIR = { kind: 'open-air' as const }

async function timed<T>(fn: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now()
  const value = await fn()
  return { value, ms: performance.now() - t0 }
}

describe('the planner', () => {
  it('resolves maxDays from the deadline when the deadline is longer than the default (60 days)', () => {
    const plan = planAssessment({ product: figs, method: OPEN_AIR, deadlineDays: 90 })
    expect(plan.maxDays).toBe(90)
    expect(planAssessment({ product: figs, method: OPEN_AIR }).maxDays).toBe(ASSESS_DEFAULTS.maxDays)
  })

  it('counts the cost with the resolved maximum batch length (the route used to assume 60 days)', () => {
    const options = { product: figs, method: OPEN_AIR, seasonStart: '07-01', seasonEnd: '07-30' }
    const hours = 3 * 8760 + 8784 // 2021–2024 hourly
    const at60 = estimateBatchHours(options, [hours])
    const at365 = estimateBatchHours({ ...options, deadlineDays: 365 }, [hours])
    // 30 start days + 24 monthly heat starts, 4 years, + 30 heated samples = 246 batches
    expect(assessmentCost(planAssessment(options), hours).batches).toBe((30 + 24) * 4 + 30)
    expect(at60).toBe(246 * 60 * 24)
    expect(at365).toBe(246 * 365 * 24)
  })

  it('the assessment reports the plan it ran on', async () => {
    const res = await post(
      '/v1/assess?product=figs&method=open-air&start=07-01&end=07-02&deadlineDays=2.5',
      inventedDays(5),
      'text/csv',
    )
    expect(res.status).toBe(200)
    const a = (await res.json()) as { deadlineDays: number; maxDays: number; season: { stepDays: number } }
    expect(a.deadlineDays).toBe(2.5)
    expect(a.maxDays).toBe(ASSESS_DEFAULTS.maxDays)
    expect(a.season.stepDays).toBe(ASSESS_DEFAULTS.stepDaysWithSeason)
  })
})

describe('the page form has the API limits', () => {
  function pageForm(extra: Record<string, string>): FormData {
    const form = new FormData()
    form.append('file', new Blob([new Uint8Array(upland)]), 'upland.csv')
    form.append('product', 'figs')
    form.append('method', 'open-air')
    form.append('format', 'json')
    for (const [k, v] of Object.entries(extra)) form.append(k, v)
    return form
  }

  it('work the API refuses (a whole-year daily season, a 365-day deadline, 4 years) is refused by the page too, before the work', async () => {
    const season = { seasonStart: '01-01', seasonEnd: '12-31', deadlineDays: '365' }
    const { value: res, ms } = await timed(() => post('/report', pageForm(season)))
    const page = await expectProblem(res, [422])
    expect(page.type).toMatch(/too-much-work$/)
    const api = await expectProblem(
      await post(
        '/v1/assess?product=figs&method=open-air&start=01-01&end=12-31&deadlineDays=365',
        new Uint8Array(upland),
        'text/csv',
      ),
      [422],
    )
    // the same estimate (the planner's) in both answers: (365 + 24) × 4 + 30 batches × 365 days
    const million = (((365 + 24) * 4 + 30) * 365 * 24) / 1e6
    for (const p of [page, api]) expect(p.detail).toContain(`about ${million.toFixed(1)} million batch-hours`)
    expect(ms).toBeLessThan(20_000)
  })

  it('the page has the time budget (a clock that jumps 400 ms per reading, a 1 s budget)', async () => {
    let t = 0
    const slow = createApp({ timeBudgetMs: 1000, now: () => (t += 400) })
    const p = await expectProblem(await post('/report', pageForm({}), undefined, slow), [422])
    expect(p.type).toMatch(/time-budget$/)
    expect(p.detail).toMatch(/budget of 1 s/)
  })

  it('the page takes as many files as the API (maxSites), not a number of its own', async () => {
    const two = createApp({ maxSites: 2 })
    const form = pageForm({})
    form.set('task', 'compare')
    form.delete('file')
    for (const i of [1, 2, 3]) form.append(`site${i}.file`, new Blob([JULY]), `s${i}.csv`)
    const p = await expectProblem(await post('/report', form, undefined, two), [400])
    expect(p.detail).toMatch(/at most 2 sites/)
    // and the page shows that many rows at most
    expect(await (await two.request('/compare')).text()).not.toContain('data-site="3"')
  })
})

describe('every route that takes a file has a row, column and byte limit', () => {
  const wide = `time,${Array.from({ length: 1000 }, (_, i) => `c${i}`).join(',')}\n`

  /** A request of each file route with `file` as its file. */
  const routes: [string, (file: string) => Promise<Response>][] = [
    ['POST /v1/inspect', (f) => post('/v1/inspect', f, 'text/csv')],
    ['POST /v1/assess', (f) => post('/v1/assess?product=figs&method=open-air', f, 'text/csv')],
    ['POST /v1/fit', (f) => post('/v1/fit?dryMass=150', f, 'text/csv')],
    ['POST /v1/energy-chart', (f) => post('/v1/energy-chart', f, 'text/csv')],
    [
      'POST /v1/compare',
      (f) => {
        const form = new FormData()
        form.append('site', new Blob([f]), 'a.csv')
        form.append('site', new Blob([JULY]), 'b.csv')
        form.append('options', JSON.stringify({ product: 'figs', method: 'open-air' }))
        return post('/v1/compare', form)
      },
    ],
    [
      'POST /report',
      (f) => {
        const form = new FormData()
        form.append('file', new Blob([f]), 'a.csv')
        form.append('product', 'figs')
        form.append('format', 'json')
        return post('/report', form)
      },
    ],
  ]

  it.each(routes)('%s: a line of 1,001 fields is a 413 naming the column limit', async (_name, send) => {
    const p = await expectProblem(await send(wide), [413])
    expect(p.detail).toMatch(/more than the limit of 1000 columns/)
  })

  it.each(routes)('%s: a body over the byte limit is a 413', async (name, _send) => {
    const small = createApp({ maxBodyBytes: 10_000 })
    const path = name.split(' ')[1]
    const res = await small.request(path, {
      method: 'POST',
      body: JULY.repeat(8),
      headers: { 'content-type': 'text/csv' },
    })
    const p = await expectProblem(res, [413])
    expect(p.type).toMatch(/too-large$/)
  })

  it('a batch log of 200,000 batches (35 s and 463 MB before the limit) is a 413 naming the row limit, quickly', async () => {
    const row = '2026-09-01T08:00-06:00,4,10000,9000,1150,18,60\n'
    const log = `start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh,ambient_temp_c,ambient_rh_pct\n${row.repeat(200_000)}`
    const { value: res, ms } = await timed(() => post('/v1/energy-chart?format=html', log, 'text/csv'))
    const p = await expectProblem(res, [413])
    expect(p.detail).toMatch(/about 200001 rows, more than the limit of 10000/)
    expect(ms).toBeLessThan(10_000)
  })

  it('130,000 weighings (a stack overflow before the limit) are a 413 on /v1/fit, quickly', async () => {
    const rows = Array.from({ length: 130_000 }, (_, i) => `${(i / 60).toFixed(3)},${1000 - i * 0.005}`)
    const { value: res, ms } = await timed(() =>
      post('/v1/fit?dryMass=150', `elapsed_h,mass_g\n${rows.join('\n')}\n`, 'text/csv'),
    )
    const p = await expectProblem(res, [413])
    expect(p.detail).toMatch(/more than the limit of 10000; keep one weighing every few minutes/)
    expect(ms).toBeLessThan(10_000)
  })

  it('a weather file over the row limit is a 413 on every weather route (limit lowered to 1,000 rows)', async () => {
    const few = createApp({ maxRows: 1000 })
    for (const url of ['/v1/inspect', '/v1/assess?product=figs&method=open-air']) {
      const p = await expectProblem(await post(url, new Uint8Array(upland), 'text/csv', few), [413])
      expect(p.detail).toMatch(/more than the limit of 1000; split it by years/)
    }
  })

  it('the CLI does not overflow on 150,000 weighings (Math.min over a spread array before)', async () => {
    // No drying in these weighings: the fit stops right after the lowest moisture is found (one pass).
    const rows = Array.from({ length: 150_000 }, (_, i) => `${(i / 60).toFixed(3)},1000`)
    const err: string[] = []
    const io: CliIo = {
      stdout: () => {},
      stderr: (t) => err.push(t),
      readFile: async () => new TextEncoder().encode(`elapsed_h,mass_g\n${rows.join('\n')}\n`),
      writeFile: async () => {},
    }
    const code = await runCli(['fit', 'w.csv', '--dry-mass', '150'], io)
    expect(code).toBe(2)
    expect(err.join('')).toMatch(/almost no drying/)
  })
})

describe('the time budget covers reading', () => {
  it('inspect (no engine at all) stops with 422 time-budget when reading the file overruns the budget', async () => {
    let t = 0
    const slow = createApp({ timeBudgetMs: 1000, now: () => (t += 600) })
    const p = await expectProblem(await post('/v1/inspect', new Uint8Array(upland), 'text/csv', slow), [422])
    expect(p.type).toMatch(/time-budget$/)
    expect(p.detail).toMatch(
      /reading and computing this request took longer than this server's budget of 1 s/,
    )
  })

  it('energy charts and fits have it too', async () => {
    let t = 0
    const slow = createApp({ timeBudgetMs: 1000, now: () => (t += 600) })
    const log = readFileSync('climate-demo/energy/quillow-dryer-batches-2026.csv')
    const e = await expectProblem(
      await post('/v1/energy-chart', new Uint8Array(log), 'text/csv', slow),
      [422],
    )
    expect(e.type).toMatch(/time-budget$/)
    const weighings = readFileSync('test/fixtures/product/demo-weighings.csv')
    const f = await expectProblem(
      await post('/v1/fit?dryMass=150', new Uint8Array(weighings), 'text/csv', slow),
      [422],
    )
    expect(f.type).toMatch(/time-budget$/)
  })
})

describe('the limits are published', () => {
  it('/openapi.json lists every limit with the values this server uses', async () => {
    const custom = createApp({ maxRows: 1234, maxLogRows: 77 })
    const doc = (await (await custom.request('/openapi.json')).json()) as {
      'x-limits': { setting: string; variable: string; value: number }[]
    }
    const byName = Object.fromEntries(doc['x-limits'].map((l) => [l.setting, l]))
    expect(byName.maxRows.value).toBe(1234)
    expect(byName.maxLogRows.value).toBe(77)
    expect(byName.maxRows.variable).toBe('DRYHOURS_MAX_ROWS')
    expect(doc['x-limits'].map((l) => l.setting).sort()).toEqual(
      limitsTable(DEFAULT_API_CONFIG)
        .map((l) => l.setting)
        .sort(),
    )
  })

  it('/docs shows the limits and the problem types', async () => {
    const html = await (await app.request('/docs')).text()
    expect(html).toContain('id="limits"')
    expect(html).toContain('DRYHOURS_MAX_LOG_ROWS')
    expect(html).toContain('id="problem-too-much-work"')
  })
})
