import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { unstable_startWorker } from 'wrangler'
import { createApp } from '../../src/api/app.ts'

// The same app bundled by wrangler and run in workerd must answer byte for byte like the Node app.
type Worker = Awaited<ReturnType<typeof unstable_startWorker>>
let worker: Worker
const nodeApp = createApp({ maxBodyBytes: 33554432 })

beforeAll(async () => {
  worker = await unstable_startWorker({
    config: 'wrangler.toml',
    dev: { server: { hostname: '127.0.0.1', port: 0 }, inspector: false, watch: false },
  })
  await worker.ready
})
afterAll(async () => {
  await worker?.dispose()
})

async function both(path: string, init?: RequestInit): Promise<[Response, Response]> {
  const w = await worker.fetch(`http://127.0.0.1${path}`, init as never)
  const n = await nodeApp.request(path, init)
  return [w as unknown as Response, n]
}

describe('worker and Node give identical answers', () => {
  it('runs inside workerd', async () => {
    const [w] = await both('/healthz')
    expect(w.status).toBe(200)
  })
  it.each([
    '/v1/air?tdb=40&twb=20',
    '/v1/air?tdb=-5&rh=80&elevation=2000',
    '/v1/air?tdb=20&rh=120',
    '/openapi.json',
  ])('GET %s', async (path) => {
    const [w, n] = await both(path)
    expect(w.status).toBe(n.status)
    expect(await w.text()).toBe(await n.text())
  })
})

describe('POST /v1/assess with a demo file: identical JSON from workerd and Node', () => {
  it.each([
    [
      'climate-demo/ardentine-upland-typical-year.epw',
      'product=grapes-to-raisins&method=open-air&start=08-01&end=09-15&stepDays=3',
    ],
    [
      'climate-demo/tamarel-lowland-2021-2023-utc.csv',
      'product=cocoa-beans&method=solar-cabinet&start=01-05&end=02-20&stepDays=5&lat=11.9&lon=104.6&elevation=95',
    ],
  ])('%s', async (file, query) => {
    const body = readFileSync(file)
    const init = { method: 'POST', body, headers: { 'content-type': 'text/csv' } }
    const [w, n] = await both(`/v1/assess?${query}`, init)
    expect(n.status).toBe(200)
    expect(w.status).toBe(200)
    expect(await w.text()).toBe(await n.text())
  })
})
