/**
 * The solar tunnel and the natural-air bin are choices wherever a method is chosen: the page's form (a radio
 * per method of the registry, their own fields, POST /report) and `compare` (the CLI command and POST
 * /v1/compare), each giving that method's assessment.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { Comparison } from '../../src/analysis/compare.ts'
import { createApp } from '../../src/api/app.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { METHOD_MODELS } from '../../src/drying/methods/index.ts'
import { renderPage } from '../../src/web/page-html.ts'

const app = createApp()
const lowland = readFileSync('climate-demo/tamarel-lowland-2021-2023-utc.csv')
const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')

function form(fields: Record<string, string>, file: { name: string; bytes: Uint8Array }): FormData {
  const f = new FormData()
  for (const [k, v] of Object.entries(fields)) f.set(k, v)
  f.append('file', new File([file.bytes as Uint8Array<ArrayBuffer>], file.name, { type: 'text/csv' }))
  return f
}

async function cli(args: string[]): Promise<{ code: number; out: string }> {
  const out: string[] = []
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: () => {},
    readFile: async (path) => new Uint8Array(readFileSync(path)),
    writeFile: async () => {},
  }
  const code = await runCli(args, io)
  return { code, out: out.join('') }
}

interface Bundle {
  article: string
  json: string
}

describe('the page offers the tunnel and the natural-air bin', () => {
  it('has one choice per method of the registry on both forms, the tunnel and the bin among them, with their own fields', () => {
    // the assess form takes one or several methods (checkboxes), the compare form one (radios)
    for (const [task, type] of [
      ['assess', 'checkbox'],
      ['compare', 'radio'],
    ] as const) {
      const page = renderPage({ task })
      const kinds = [
        ...page.matchAll(new RegExp(`<input type="${type}" name="method" value="([a-z-]+)"`, 'g')),
      ].map((m) => m[1])
      expect(kinds, task).toEqual(METHOD_MODELS.map((m) => m.kind))
      expect(kinds).toContain('tunnel')
      expect(kinds).toContain('natural-air-bin')
    }
    const html = renderPage({})
    for (const kind of ['tunnel', 'natural-air-bin']) {
      const model = METHOD_MODELS.find((m) => m.kind === kind)
      expect(html).toMatch(new RegExp(`value="${kind}"( checked)?><span><strong>${model?.title}</strong>`))
    }
    // the loading field is shown for the tunnel and the greenhouse; the bin's fields only for the bin
    expect(html).toMatch(/data-methods="open-air shade tunnel greenhouse"><label for="[^"]+">Loading/)
    expect(html).toMatch(/data-methods="natural-air-bin"><label for="[^"]+">Airflows to compare/)
  })

  it('POST /report with method=tunnel assesses the tunnel at the loading typed, with the spoilage section', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form(
        {
          product: 'apricot-halves',
          method: 'tunnel',
          loadingKgPerM2: '6',
          seasonStart: '02-01',
          seasonEnd: '02-20',
          // the tunnel's cover needs the sun's position: the site of climate-demo/sites.json
          lat: '11.9',
          lon: '104.6',
          elevation: '95',
          utcOffset: '0',
          siteTz: 'Asia/Bangkok',
          format: 'bundle',
        },
        { name: 'tamarel.csv', bytes: lowland },
      ),
    })
    expect(res.status).toBe(200)
    const b = (await res.json()) as Bundle
    const a = JSON.parse(b.json) as {
      method: { kind: string; loadingKgPerM2: number }
      product: { loadingKgPerM2: number }
      spoilage: { model: { id: string } } | null
      startDates: unknown[]
    }
    expect(a.method.kind).toBe('tunnel')
    expect(a.method.loadingKgPerM2).toBe(6)
    expect(a.product.loadingKgPerM2).toBe(6)
    expect(a.startDates.length).toBeGreaterThan(0)
    expect(a.spoilage?.model.id).toBe('mould-free-time')
    expect(b.article).toContain('solar tunnel')
    expect(b.article).toContain('data-section="spoilage"')
  }, 60_000)

  it('POST /report with method=natural-air-bin runs the bin at the airflows and depth typed', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form(
        {
          product: 'shelled-corn',
          method: 'natural-air-bin',
          binAirflows: '1 2',
          binDepthM: '3',
          initialWbPct: '20',
          targetWbPct: '15.5',
          seasonStart: '12-01',
          seasonEnd: '12-08',
          utcOffset: '0',
          siteTz: 'Asia/Bangkok',
          format: 'bundle',
        },
        { name: 'tamarel.csv', bytes: lowland },
      ),
    })
    expect(res.status).toBe(200)
    const b = (await res.json()) as Bundle
    const a = JSON.parse(b.json) as {
      method: { kind: string; airflowsM3PerMinPerTonne: number[]; depthM: number }
      bin?: { airflows: { airflowM3PerMinPerTonne: number }[]; startDates: unknown[] }
    }
    expect(a.method.kind).toBe('natural-air-bin')
    expect(a.method.airflowsM3PerMinPerTonne).toEqual([1, 2])
    expect(a.method.depthM).toBe(3)
    expect(a.bin?.airflows.map((f) => f.airflowM3PerMinPerTonne)).toEqual([1, 2])
    expect(a.bin?.startDates.length).toBeGreaterThan(0)
    expect(b.article).toContain('data-section="bin"')
  }, 120_000)
})

describe('compare takes the tunnel and the natural-air bin', () => {
  it('dryhours compare --method tunnel ranks two demo sites by tunnel assessments, with the spoilage share', async () => {
    // EPW files carry their own site (the tunnel needs the sun's position at each)
    const args = [
      'compare',
      'climate-demo/ardentine-upland-typical-year.epw',
      'climate-demo/gullhaven-coast-2022-2024.epw',
      '--product',
      'apricot-halves',
      '--method',
      'tunnel',
      '--start',
      '07-01',
      '--end',
      '07-31',
      '--step-days',
      '10',
      '--quiet',
    ]
    const text = await cli(args)
    expect(text.code).toBe(0)
    expect(text.out).toMatch(/apricot halves, tunnel/i)
    const json = await cli([...args, '--json'])
    expect(json.code).toBe(0)
    const c = JSON.parse(json.out) as Comparison
    expect(c.method.kind).toBe('tunnel')
    expect(c.assessments.map((a) => a.method.kind)).toEqual(['tunnel', 'tunnel'])
    expect(c.sites.map((s) => s.rank).sort()).toEqual([1, 2])
    for (const s of c.sites) {
      expect(typeof s.spoilageProbability).toBe('number')
      const a = c.assessments.find((x) => x.spoilage?.season.probability === s.spoilageProbability)
      expect(a).toBeDefined()
    }
  }, 120_000)

  it('POST /v1/compare with a natural-air-bin method object compares bins at the airflows given', async () => {
    const f = new FormData()
    f.append('site', new Blob([upland]), 'upland.csv')
    f.append('site', new Blob([lowland]), 'lowland.csv')
    f.append(
      'options',
      JSON.stringify({
        product: 'shelled-corn',
        method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1, 3], depthM: 2 },
        initialWbPct: 20,
        targetWbPct: 15.5,
        seasonStart: '09-15',
        seasonEnd: '09-20',
      }),
    )
    const res = await app.request('/v1/compare', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const c = (await res.json()) as Comparison
    expect(c.method.kind).toBe('natural-air-bin')
    expect(c.sites).toHaveLength(2)
    for (const s of c.sites) expect(s).toHaveProperty('binSeasonMinimumAirflowM3PerMinPerTonne')
    for (const a of c.assessments) {
      expect(a.bin?.airflows.map((x) => x.airflowM3PerMinPerTonne)).toEqual([1, 3])
    }
  }, 120_000)
})
