/**
 * `npm run load`: bounded load test of the Node server started as a user would (`dryhours serve`), on
 * loopback only. Mixes /v1/air, /v1/inspect and /v1/assess (on a one-year demo file) at several
 * concurrencies; prints throughput, p50/p99 latency, non-2xx count (must be 0 for these valid requests)
 * and the server's resident memory before and after each round (read from /proc, Linux).
 */
import { type ChildProcess, spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import autocannon from 'autocannon'
import { type LoadTarget, loadTargets } from './load-targets.ts'

function rssMiB(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8')
  const m = status.match(/VmRSS:\s+(\d+) kB/)
  return m ? Number(m[1]) / 1024 : Number.NaN
}

async function startServer(): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn('node', ['bin/dryhours.mjs', 'serve', '--port', '0'], {
    stdio: ['ignore', 'pipe', 'inherit'],
  })
  let out = ''
  child.stdout?.on('data', (d) => {
    out += String(d)
    if (out.length > 100_000) out = out.slice(-10_000)
  })
  for (let i = 0; i < 400; i++) {
    const m = out.match(/listening on (http:\/\/127\.0\.0\.1:\d+)/)
    if (m) return { child, url: m[1] }
    await new Promise((r) => setTimeout(r, 50))
  }
  child.kill('SIGTERM')
  throw new Error('server did not start')
}

/** Wait until the server answers /healthz within 50 ms (it may still be finishing the last round's requests). */
async function settle(url: string): Promise<void> {
  const until = performance.now() + 30_000
  while (performance.now() < until) {
    const t0 = performance.now()
    try {
      await fetch(`${url}/healthz`)
    } catch {
      // not answering yet
    }
    if (performance.now() - t0 < 50) return
    await new Promise((r) => setTimeout(r, 200))
  }
}

async function main(): Promise<void> {
  const targets: LoadTarget[] = [
    { name: 'GET /v1/air', method: 'GET', path: '/v1/air?tdb=31.5&rh=38&elevation=850' },
    ...(await loadTargets()),
  ]
  const { child, url } = await startServer()
  const pid = child.pid as number
  const durationS = Number(process.env.LOAD_SECONDS ?? 3)
  const passes = Number(process.env.LOAD_PASSES ?? 2)
  const rows: string[] = []
  const rssAfterPass: number[] = []
  const rssStart = rssMiB(pid)
  let badTotal = 0
  try {
    for (let pass = 1; pass <= passes; pass++) {
      for (const t of targets) {
        for (const connections of [1, 8, 32]) {
          await settle(url)
          const before = rssMiB(pid)
          const result = await autocannon({
            url: url + t.path,
            method: t.method,
            body: t.body,
            headers: t.contentType ? { 'content-type': t.contentType } : undefined,
            connections,
            duration: durationS,
          })
          const after = rssMiB(pid)
          const bad = result.non2xx + result.errors + result.timeouts
          badTotal += bad
          rows.push(
            [
              String(pass).padStart(4),
              t.name.padEnd(18),
              String(connections).padStart(4),
              result.requests.average.toFixed(1).padStart(8),
              result.latency.p50.toFixed(1).padStart(8),
              result.latency.p99.toFixed(1).padStart(8),
              String(bad).padStart(6),
              before.toFixed(0).padStart(7),
              after.toFixed(0).padStart(7),
            ].join(' '),
          )
        }
      }
      rssAfterPass.push(rssMiB(pid))
    }
  } finally {
    child.kill('SIGTERM')
  }
  console.log(`load test on ${url}, ${durationS} s per round, ${passes} passes, loopback only`)
  console.log(`pass ${'target'.padEnd(18)} conn    req/s   p50 ms   p99 ms errors rss0MiB rss1MiB`)
  for (const r of rows) console.log(r)
  console.log(
    `server resident memory: ${rssStart.toFixed(0)} MiB at start; after each pass ${rssAfterPass.map((m) => m.toFixed(0)).join(', ')} MiB`,
  )
  console.log(`errors and non-2xx answers to these valid requests: ${badTotal}`)
  if (badTotal > 0) process.exitCode = 1
}

await main()
