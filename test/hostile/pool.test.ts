/**
 * Work off the event loop (issue "no input may freeze or exhaust the server", item 2): the Node server
 * started as a user would (`dryhours serve`), its file routes on a pool of worker threads. /healthz answers
 * while every worker computes; a full queue answers 503 with Retry-After; a client that goes away stops its
 * work; the time budget holds on the pool; the pool answers exactly what the app answers in-process.
 * Time bounds are generous (the slow requests below take 10 s or more of one core; the bounds are a few
 * seconds): they check that work stops or is refused, not a speed.
 */
import { type ChildProcess, spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { getHeapStatistics } from 'node:v8'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { longUtcCsv } from '../../climate-demo/demo-files.ts'
import { createApp } from '../../src/api/app.ts'
import { poolFromEnv, QUEUE_PER_THREAD } from '../../src/node/settings.ts'

const tamarel = readFileSync('climate-demo/tamarel-lowland-2021-2023-utc.csv')

interface Running {
  child: ChildProcess
  url: string
  output: () => string
}

function startServer(env: Record<string, string>): Promise<Running> {
  const child = spawn('node', ['bin/dryhours.mjs', 'serve', '--port', '0'], {
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  child.stdout?.on('data', (d) => {
    out += String(d)
  })
  child.stderr?.on('data', (d) => {
    out += String(d)
  })
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start: ${out}`)), 30_000)
    const check = setInterval(() => {
      const m = out.match(/listening on (http:\/\/127\.0\.0\.1:\d+)/)
      if (m) {
        clearTimeout(timer)
        clearInterval(check)
        resolve({ child, url: m[1], output: () => out })
      }
    }, 50)
  })
}

function stop(r: Running): Promise<void> {
  return new Promise((resolve) => {
    if (r.child.exitCode !== null) return resolve()
    r.child.once('exit', () => resolve())
    r.child.kill('SIGTERM')
  })
}

interface Work {
  threads: number
  starting: number
  restarted: number
  running: number
  queued: number
  queueLimit: number
  cancelled: number
  refused: number
}

async function health(url: string): Promise<{ ms: number; work: Work }> {
  const t0 = performance.now()
  const res = await fetch(`${url}/healthz`)
  const body = (await res.json()) as { work: Work }
  return { ms: performance.now() - t0, work: body.work }
}

async function until(url: string, test: (w: Work) => boolean, ms: number): Promise<Work> {
  const end = performance.now() + ms
  let last = (await health(url)).work
  while (!test(last) && performance.now() < end) {
    await new Promise((r) => setTimeout(r, 100))
    last = (await health(url)).work
  }
  return last
}

/**
 * A slow comparison: three copies of the invented three-year tropical file, shelled corn in the shade
 * (batches rarely reach the target, so they run their full length), a start every day of the year and
 * batches up to a year long: about 2 s of one core per site.
 */
function slowRequest(url: string, signal?: AbortSignal): Promise<Response> {
  const form = new FormData()
  for (const name of ['a', 'b', 'c']) form.append('site', new Blob([new Uint8Array(tamarel)]), `${name}.csv`)
  form.append(
    'options',
    JSON.stringify({
      product: 'shelled-corn',
      method: 'shade',
      startStepDays: 1,
      maxDays: 366,
      deadlineDays: 365,
    }),
  )
  return fetch(`${url}/v1/compare`, { method: 'POST', body: form, signal })
}

describe('the worker pool', () => {
  let server: Running

  beforeAll(async () => {
    server = await startServer({
      DRYHOURS_WORKERS: '2',
      DRYHOURS_QUEUE: '1',
      DRYHOURS_MAX_BATCH_HOURS: '1000000000',
    })
    await until(server.url, (w) => w.threads === 2 && w.starting === 0, 20_000)
  })

  afterAll(async () => {
    await stop(server)
  })

  it('/healthz answers while both workers compute; a full queue is a 503 with Retry-After; clients that leave stop their work', async () => {
    const controllers = [new AbortController(), new AbortController(), new AbortController()]
    const pending = controllers.map((c) => slowRequest(server.url, c.signal).catch(() => null))
    const busy = await until(server.url, (w) => w.running === 2 && w.queued === 1, 20_000)
    expect(busy).toMatchObject({ threads: 2, running: 2, queued: 1, queueLimit: 1 })

    // The event-loop thread is free: /healthz answers at once while two assessments compute.
    const probes = []
    for (let i = 0; i < 5; i++) probes.push((await health(server.url)).ms)
    expect(Math.max(...probes)).toBeLessThan(2000)

    // A fourth request finds the queue full.
    const t0 = performance.now()
    const refused = await slowRequest(server.url)
    expect(refused.status).toBe(503)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThanOrEqual(1)
    const p = (await refused.json()) as { type: string; detail: string }
    expect(p.type).toMatch(/busy$/)
    expect(p.detail).toMatch(/every worker is busy/)
    expect(performance.now() - t0).toBeLessThan(5000)

    // The three clients go away: the queued request leaves the queue, the running ones stop at their next
    // checkpoint, long before the 6 s or more each would take.
    for (const c of controllers) c.abort()
    await Promise.all(pending)
    const t1 = performance.now()
    const idle = await until(server.url, (w) => w.running === 0 && w.queued === 0, 10_000)
    expect(idle.running).toBe(0)
    expect(idle.cancelled).toBe(3)
    expect(idle.refused).toBe(1)
    expect(performance.now() - t1).toBeLessThan(5000)
    await new Promise((r) => setTimeout(r, 200))
    expect(server.output()).toMatch(/POST \/v1\/compare 499/)
    expect(server.output()).toMatch(/POST \/v1\/compare 503/)
  })

  it('the pool answers byte for byte what the app answers in-process (the same core code)', async () => {
    const url = '/v1/assess?product=figs&method=open-air&start=07-01&end=07-10&stepDays=3'
    const init = () => ({
      method: 'POST',
      body: new Uint8Array(tamarel),
      headers: { 'content-type': 'text/csv' },
    })
    const pooled = await fetch(server.url + url, init())
    const local = await createApp().request(url, init())
    expect(pooled.status).toBe(200)
    expect(await pooled.text()).toBe(await local.text())
    const problem = await fetch(
      `${server.url}/v1/assess?product=figs&method=open-air&deadlineDays=400`,
      init(),
    )
    expect(problem.status).toBe(400)
    expect(await problem.text()).toBe(
      await (
        await createApp().request('/v1/assess?product=figs&method=open-air&deadlineDays=400', init())
      ).text(),
    )
  })
})

describe('the time budget on the pool', () => {
  it('a request over DRYHOURS_TIME_BUDGET_MS is a 422 time-budget, and the worker is free again', async () => {
    const server = await startServer({
      DRYHOURS_WORKERS: '1',
      DRYHOURS_TIME_BUDGET_MS: '500',
      DRYHOURS_MAX_BATCH_HOURS: '1000000000',
    })
    try {
      await until(server.url, (w) => w.threads === 1 && w.starting === 0, 20_000)
      const t0 = performance.now()
      const res = await slowRequest(server.url)
      expect(res.status).toBe(422)
      const p = (await res.json()) as { type: string; detail: string }
      expect(p.type).toMatch(/time-budget$/)
      expect(p.detail).toMatch(/budget of 0.5 s/)
      // the budget (0.5 s) plus at most the pool's 5 s grace before a stuck worker is stopped
      expect(performance.now() - t0).toBeLessThan(15_000)
      const after = await fetch(`${server.url}/v1/inspect`, {
        method: 'POST',
        body: 'time,temp_c,rh_pct\n2024-07-01T10:00Z,30.1,25\n',
        headers: { 'content-type': 'text/csv' },
      })
      expect(after.status).toBe(200)
    } finally {
      await stop(server)
    }
  })
})

describe('the heap of a worker thread', () => {
  it('a request that needs more than DRYHOURS_WORKER_HEAP_MB is a 422 resource-limit; the thread is replaced', async () => {
    // 32 MiB: enough to load the app (about 20 MiB as of the natural-air bin method; 16 MiB no longer loads it),
    // far too little to read and assess thirty years of hourly weather (a 13 MB file)
    const server = await startServer({ DRYHOURS_WORKERS: '1', DRYHOURS_WORKER_HEAP_MB: '32' })
    try {
      await until(server.url, (w) => w.threads === 1 && w.starting === 0, 20_000)
      const res = await fetch(`${server.url}/v1/assess?product=figs&method=open-air&start=07-01&end=07-31`, {
        method: 'POST',
        body: longUtcCsv(20_210_003, 1991, 2020),
        headers: { 'content-type': 'text/csv' },
      })
      expect(res.status).toBe(422)
      const p = (await res.json()) as { type: string; detail: string }
      expect(p.type).toMatch(/resource-limit$/)
      expect(p.detail).toMatch(/more memory than a worker thread may use \(32 MiB\)/)
      // the thread that ran out was replaced by a fresh one
      const after = await until(server.url, (w) => w.starting === 0 && w.restarted >= 1, 20_000)
      expect(after).toMatchObject({ threads: 1, running: 0 })
      expect(after.restarted).toBeGreaterThanOrEqual(1)
      expect(server.output()).toMatch(/worker thread stopped: .*memory limit/)
    } finally {
      await stop(server)
    }
  })
})

describe('the pool size', () => {
  it('is the machine’s available parallelism unless set, with 8 waiting requests per thread and the engine’s heap', () => {
    expect(poolFromEnv({})).toEqual({
      threads: availableParallelism(),
      queue: QUEUE_PER_THREAD * availableParallelism(),
      heapMb: Math.round(getHeapStatistics().heap_size_limit / 1024 / 1024),
    })
    expect(poolFromEnv({ DRYHOURS_WORKERS: '3' })).toMatchObject({ threads: 3, queue: 24 })
    expect(poolFromEnv({ DRYHOURS_WORKERS: '0', DRYHOURS_QUEUE: '5' })).toMatchObject({
      threads: 0,
      queue: 5,
    })
    expect(() => poolFromEnv({ DRYHOURS_WORKERS: '1.5' })).toThrow(/DRYHOURS_WORKERS must be a whole number/)
  })
})
