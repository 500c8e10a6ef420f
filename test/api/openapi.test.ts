import { Validator } from '@seriousme/openapi-schema-validator'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { listOperations } from '../../src/api/operations.ts'

const app = createApp()

describe('GET /openapi.json', () => {
  it('is an OpenAPI 3.1 document that lists every documented route with responses', async () => {
    const doc = (await (await app.request('/openapi.json')).json()) as {
      openapi: string
      info: { title: string; version: string }
      paths: Record<string, Record<string, { responses: Record<string, unknown>; operationId: string }>>
    }
    // OpenAPI Specification 3.1.0 §4.8.1: `openapi`, `info` (title, version) and `paths` are required.
    expect(doc.openapi).toBe('3.1.0')
    expect(doc.info.title).toBeTruthy()
    expect(doc.info.version).toBeTruthy()
    const ids = new Set<string>()
    for (const op of listOperations()) {
      const item = doc.paths[op.path.replace(/:([a-zA-Z]+)/g, '{$1}')]?.[op.method]
      expect(item, `${op.method} ${op.path}`).toBeDefined()
      expect(item.responses['200']).toBeDefined()
      // §4.8.10.1: operationId must be unique.
      expect(ids.has(item.operationId)).toBe(false)
      ids.add(item.operationId)
    }
  })

  it('validates against the official OpenAPI 3.1 JSON schema (@seriousme/openapi-schema-validator)', async () => {
    const doc = await (await app.request('/openapi.json')).json()
    const validator = new Validator()
    const result = await validator.validate(doc)
    expect(result.errors).toBeUndefined()
    expect(result.valid).toBe(true)
    expect(validator.version).toBe('3.1')
  })

  it('documents every query parameter with its unit', async () => {
    const doc = (await (await app.request('/openapi.json')).json()) as {
      paths: Record<string, Record<string, { parameters: { name: string; description: string }[] }>>
    }
    const params = doc.paths['/v1/air'].get.parameters
    expect(params.map((p) => p.name).sort()).toEqual([
      'elevation',
      'pressure',
      'rh',
      'tdb',
      'tdp',
      'twb',
      'w',
    ])
    for (const p of params) expect(p.description).toMatch(/\[[^\]]+\]/)
  })

  it('every documented example request succeeds', async () => {
    for (const op of listOperations()) {
      for (const ex of op.examples) {
        const init: RequestInit =
          op.method === 'post'
            ? { method: 'POST', body: ex.body, headers: { 'content-type': ex.contentType ?? '' } }
            : {}
        const res = await app.request(ex.url, init)
        expect(res.status, `${ex.name}: ${ex.url}`).toBe(200)
      }
    }
  })

  it('GET /docs lists every route on a page with no external assets', async () => {
    const html = await (await app.request('/docs')).text()
    for (const op of listOperations()) expect(html).toContain(op.path.replace(/:([a-zA-Z]+)/g, '{$1}'))
    expect(html).not.toMatch(/(src|href)="(https?:)?\/\//)
  })
})
