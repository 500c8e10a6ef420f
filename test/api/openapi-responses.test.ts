/**
 * GET /openapi.json promises the unit of every field: every operation declares its answer's schema, every
 * number in it states its unit, and the real answers of every documented example validate against the
 * declared schema (JSON Schema 2020-12, which OpenAPI 3.1 uses, checked with Ajv 8's 2020 draft).
 */
import { readFileSync } from 'node:fs'
import Ajv2020 from 'ajv/dist/2020.js'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { listOperations } from '../../src/api/operations.ts'

const app = createApp()
type Json = Record<string, unknown>

const doc = (await (await app.request('/openapi.json')).json()) as {
  paths: Record<
    string,
    Record<string, { responses: Record<string, { content: Record<string, { schema: Json }> }> }>
  >
}

function declared(method: string, path: string): Json {
  const op = doc.paths[path.replace(/:([a-zA-Z]+)/g, '{$1}')][method]
  return op.responses['200'].content['application/json'].schema
}

const UNIT = /\[[^\]]+\]/

function isNumeric(node: Json): boolean {
  const t = node.type
  return (
    t === 'number' || t === 'integer' || (Array.isArray(t) && (t.includes('number') || t.includes('integer')))
  )
}

/**
 * Every numeric node with no unit in its description or in the description of the nearest node above it
 * within the same field (through nullable wrappers, unions and array items); every field without a
 * description. Paths name them.
 */
function undocumented(node: unknown, path: string, described: string | undefined, out: string[]): string[] {
  if (node === null || typeof node !== 'object') return out
  const n = node as Json
  const here = typeof n.description === 'string' ? n.description : described
  if (isNumeric(n) && !(here && UNIT.test(here))) out.push(`${path}: number without a unit`)
  if (n.properties) {
    for (const [k, v] of Object.entries(n.properties as Record<string, Json>)) {
      const d = typeof v.description === 'string' ? v.description : undefined
      const inner = [v, ...((v.anyOf as Json[]) ?? []), ...((v.oneOf as Json[]) ?? [])]
      const withItems = [
        ...inner,
        ...inner.map((x) => x.items as Json).filter((x) => x && typeof x === 'object'),
      ]
      // containers (objects, lists of objects) are described through their fields; every leaf itself
      const container = withItems.some((x) => x.type === 'object' || x.properties || x.oneOf)
      if (!container && !withItems.some((x) => typeof x.description === 'string') && !v.const)
        out.push(`${path}.${k}: field without a description`)
      undocumented(v, `${path}.${k}`, d, out)
    }
  }
  for (const key of ['anyOf', 'oneOf', 'allOf', 'prefixItems'] as const)
    for (const [i, v] of ((n[key] as Json[]) ?? []).entries())
      undocumented(v, `${path}(${key} ${i})`, here, out)
  if (n.items && typeof n.items === 'object') undocumented(n.items, `${path}[]`, here, out)
  if (n.additionalProperties && typeof n.additionalProperties === 'object')
    undocumented(n.additionalProperties, `${path}{}`, here, out)
  return out
}

describe('OpenAPI: the answers, with the unit of every field', () => {
  const ops = listOperations()

  it.each(ops.map((o) => [`${o.method.toUpperCase()} ${o.path}`, o]))(
    '%s declares its answer’s schema',
    (_n, op) => {
      const s = declared(op.method, op.path)
      expect(Object.keys(s).length, 'an empty response schema').toBeGreaterThan(0)
      expect(s.type ?? s.anyOf ?? s.oneOf).toBeDefined()
    },
  )

  it.each(ops.map((o) => [`${o.method.toUpperCase()} ${o.path}`, o]))(
    '%s: every number states its unit and every leaf field is described',
    (_n, op) => {
      expect(undocumented(declared(op.method, op.path), op.path, undefined, [])).toEqual([])
    },
  )

  it('the check finds a number without a unit and a field without a description', () => {
    const bad = {
      type: 'object',
      properties: {
        a: { type: 'number', description: 'no unit here' },
        b: { type: 'string' },
        c: { anyOf: [{ type: 'number' }, { type: 'null' }], description: 'x [m]' },
      },
    }
    expect(undocumented(bad, 'x', undefined, [])).toEqual([
      'x.a: number without a unit',
      'x.b: field without a description',
    ])
  })

  it('every operation has an example', () => {
    for (const op of ops) expect(op.examples.length, `${op.method} ${op.path}`).toBeGreaterThan(0)
  })

  const ajv = new Ajv2020({ strict: false, allErrors: true })
  const examples = ops.flatMap((op) =>
    op.examples.map((ex) => [`${op.method.toUpperCase()} ${ex.url.slice(0, 90)}`, op, ex] as const),
  )
  it.each(examples)('the answer of %s validates against its declared schema', async (_n, op, ex) => {
    const init: RequestInit =
      op.method === 'post'
        ? { method: 'POST', body: ex.body, headers: { 'content-type': ex.contentType ?? '' } }
        : {}
    const res = await app.request(ex.url, init)
    const text = await res.text()
    expect(res.status, text.slice(0, 300)).toBe(200)
    const validate = ajv.compile(declared(op.method, op.path))
    const ok = validate(JSON.parse(text))
    expect(
      ok
        ? []
        : (validate.errors ?? [])
            .slice(0, 5)
            .map((e) => `${e.instancePath} ${e.message} ${JSON.stringify(e.params)}`),
    ).toEqual([])
  })

  // grain in a bin: assessment.bin, a bin among the methods, bins ranked (the demo valley, invented weather)
  const valley = readFileSync('climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv')
  const corn =
    'product=shelled-corn&tz=America/Chicago&initialWb=20&targetWb=15.5&start=09-15&end=09-29&stepDays=7&airflow=1,2'
  it.each([
    ['one bin', `/v1/assess?${corn}&method=natural-air-bin`],
    ['a bin beside heated air', `/v1/assess?${corn}&method=natural-air-bin,heated`],
  ])('the answer with %s validates against its declared schema', async (_n, url) => {
    const res = await app.request(url, {
      method: 'POST',
      body: valley,
      headers: { 'content-type': 'text/csv' },
    })
    const text = await res.text()
    expect(res.status, text.slice(0, 300)).toBe(200)
    const validate = ajv.compile(declared('post', '/v1/assess'))
    const ok = validate(JSON.parse(text))
    expect(
      ok ? [] : (validate.errors ?? []).slice(0, 40).map((e) => `${e.instancePath} ${e.message}`),
    ).toEqual([])
  })

  it('bins ranked by /v1/compare validate against its declared schema', async () => {
    const f = new FormData()
    f.append('site', new Blob([valley]), 'a.csv')
    f.append('site', new Blob([valley]), 'b.csv')
    f.append(
      'options',
      JSON.stringify({
        product: 'shelled-corn',
        method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [2] },
        initialWbPct: 20,
        targetWbPct: 15.5,
        seasonStart: '09-15',
        seasonEnd: '09-22',
        startStepDays: 7,
        weather: { timeZone: 'America/Chicago' },
      }),
    )
    const res = await app.request('/v1/compare', { method: 'POST', body: f })
    const text = await res.text()
    expect(res.status, text.slice(0, 300)).toBe(200)
    const validate = ajv.compile(declared('post', '/v1/compare'))
    const ok = validate(JSON.parse(text))
    expect(
      ok ? [] : (validate.errors ?? []).slice(0, 40).map((e) => `${e.instancePath} ${e.message}`),
    ).toEqual([])
  })

  it('validation fails for an answer that lacks a field or carries one not documented', () => {
    const validate = ajv.compile(declared('get', '/v1/air'))
    const answer = {
      dryBulbC: 40,
      wetBulbC: 20,
      dewPointC: 10,
      frostPointC: null,
      relativeHumidityPct: 14,
      humidityRatioGPerKg: 7.8,
      enthalpyKjPerKg: 60,
      specificVolumeM3PerKg: 0.9,
      densityKgPerM3: 1.1,
      vaporPressureKpa: 1.2,
      saturationVaporPressureKpa: 7.4,
      pressureKpa: 101.325,
    }
    expect(validate(answer)).toBe(true)
    const { frostPointC: _f, ...missing } = answer
    expect(validate(missing)).toBe(false)
    expect(validate({ ...answer, extra: 1 })).toBe(false)
  })
})
