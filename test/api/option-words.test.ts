/**
 * Core messages name options by their CLI flags (`set --baseline`, `give --site-tz <zone>`); every answer names
 * them as its user knows them, from the one table of option names (weather/option-spec.ts and
 * analysis/option-names.ts): the API by its query parameter or JSON key, the page by the field's label, the CLI by
 * the flag. No API answer carries a CLI flag.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

const app = createApp()
const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')
const quillow = readFileSync('climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv')
const log = readFileSync('climate-demo/energy/quillow-dryer-batches-2026.csv')

/** A CLI flag written in a text: two dashes and a letter at the start of a word. */
const FLAG = /(^|[\s('"“])--[a-z]/

/** Every string of a JSON answer that carries a CLI flag, with its path. */
function flagWords(value: unknown, path = '', out: string[] = []): string[] {
  if (typeof value === 'string') {
    if (FLAG.test(value)) out.push(`${path}: ${value}`)
  } else if (Array.isArray(value)) {
    for (const [i, v] of value.entries()) flagWords(v, `${path}[${i}]`, out)
  } else if (value !== null && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) flagWords(v, `${path}.${k}`, out)
  return out
}

const post = (url: string, body: BodyInit, type?: string) =>
  app.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined })

async function json(res: Response): Promise<unknown> {
  expect(res.status).toBe(200)
  return res.json()
}

function cliIo(out: string[]): CliIo {
  return {
    stdout: (t) => out.push(t),
    stderr: (t) => out.push(t),
    readFile: async (path) => new Uint8Array(readFileSync(path)),
    writeFile: async () => {},
  }
}

describe('option names in the answers', () => {
  it('energy charts: the API names the baseline by its key, the CLI by its flag, the page by its label', async () => {
    const api = (await json(await post('/v1/energy-chart', log, 'text/csv'))) as { assumptions: string[] }
    expect(flagWords(api)).toEqual([])
    expect(api.assumptions.join('\n')).toContain('(default; set baseline)')

    const out: string[] = []
    expect(
      await runCli(['energy-chart', 'climate-demo/energy/quillow-dryer-batches-2026.csv'], cliIo(out)),
    ).toBe(0)
    expect(out.join('')).toContain('(default; set --baseline)')

    const f = new FormData()
    f.set('task', 'energy')
    f.set('format', 'bundle')
    f.append('log', new File([log as Uint8Array<ArrayBuffer>], 'batches.csv', { type: 'text/csv' }))
    const page = (await json(await app.request('/report', { method: 'POST', body: f }))) as {
      article: string
      json: string
    }
    expect(page.article).toContain('set “Batches in the baseline”')
    expect(page.article).not.toMatch(FLAG)
    expect(flagWords(JSON.parse(page.json))).toEqual([])
  }, 60_000)

  it('energy charts: the log offset is utcOffsetHours in the API (the flag --utc-offset means the log there)', async () => {
    // a log whose start times carry no offset, without a weather file: the engine assumes UTC and says so
    const noOffset = new TextDecoder()
      .decode(log)
      .replace(/([0-9]{2}:[0-9]{2})(:[0-9]{2})?(Z|[+-][0-9]{2}:?[0-9]{2})/g, '$1')
    const api = (await json(await post('/v1/energy-chart', noOffset, 'text/csv'))) as {
      assumptions: string[]
    }
    expect(flagWords(api)).toEqual([])
    expect(api.assumptions.join('\n')).toContain('no utcOffsetHours and no offset in the weather file')
  }, 60_000)

  it('sites compared: the site clock warning names siteTz in a query request and siteTimeZone in a JSON one, in the ranking too', async () => {
    const form = () => {
      const f = new FormData()
      f.append('file', new Blob([upland]), 'upland.csv')
      f.append('file', new Blob([quillow]), 'valley.csv')
      return f
    }
    const query = (await json(
      await post(
        '/v1/compare?product=apricot-halves&method=open-air&start=07-01&end=07-10&stepDays=5&tz=America/Chicago',
        form(),
      ),
    )) as { sites: { warnings: string[] }[]; assessments: { warnings: string[] }[] }
    expect(flagWords(query)).toEqual([])
    expect(query.sites.flatMap((s) => s.warnings).join('\n')).toContain('give siteTz=<zone>')
    expect(query.assessments.flatMap((a) => a.warnings).join('\n')).toContain('give siteTz=<zone>')

    const f = form()
    f.append(
      'options',
      JSON.stringify({
        product: 'apricot-halves',
        method: 'open-air',
        seasonStart: '07-01',
        seasonEnd: '07-10',
        startStepDays: 5,
        weather: { timeZone: 'America/Chicago' },
      }),
    )
    const fromJson = (await json(await post('/v1/compare', f))) as { sites: { warnings: string[] }[] }
    expect(flagWords(fromJson)).toEqual([])
    expect(fromJson.sites.flatMap((s) => s.warnings).join('\n')).toContain('give siteTimeZone: <zone>')
  }, 120_000)

  it('methods side by side: warnings of every method, in the API words', async () => {
    const body = await json(
      await post(
        '/v1/assess?product=apricot-halves&method=open-air,heated&start=07-01&end=07-10&stepDays=5&tz=America/Chicago',
        quillow,
        'text/csv',
      ),
    )
    expect(flagWords(body)).toEqual([])
    expect(JSON.stringify(body)).toContain('give siteTz=<zone>')
  }, 120_000)

  it('a fit whose first weighing has no mass: the API names initialWb, the CLI --initial-wb', async () => {
    const csv = 'elapsed_h,mass_g\n0,\n1,780\n2,610\n3,490\n4,400\n6,290\n8,230\n10,200\n'
    const res = await post('/v1/fit?initialWb=80', csv, 'text/csv')
    expect(res.status).toBeGreaterThanOrEqual(400)
    const p = (await res.json()) as { detail: string }
    expect(p.detail).toContain('initialWb needs the first weighing')
    expect(p.detail).not.toMatch(FLAG)

    const out: string[] = []
    const io = { ...cliIo(out), readFile: async () => new TextEncoder().encode(csv) }
    expect(await runCli(['fit', 'weighings.csv', '--initial-wb', '80'], io)).toBe(2)
    expect(out.join('')).toContain('--initial-wb needs the first weighing')
  })
})
