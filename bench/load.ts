/**
 * `npm run load`: load test of the Node server started as a user would (`dryhours serve`, its default worker
 * pool), on loopback only. A warm-up pass (not counted), then two passes; each runs /v1/assess on a one-year file with 1, 4 and 16 clients while
 * /healthz is probed every 25 ms, then a round of 4 clients with one of each hostile input (bench/load-hostile.ts)
 * sent in its middle. Prints every round, then the figures the server must meet, measured in this run:
 * throughput at 4 clients ≥ 1.7 × at 1 client; /healthz p99 < 100 ms while assessments run; 0 errors; resident
 * memory flat across the two passes; the hostile round's throughput within 20 % of the plain 4-client round.
 * Each round also prints the server's CPU time per answered assessment (all its threads, and the event-loop
 * thread's share): unlike throughput, it hardly moves when other work shares the machine.
 * Environment: LOAD_SECONDS (per round, default 8), LOAD_PASSES (default 2).
 */
import { type ChildProcess, spawn } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { availableParallelism, cpus } from 'node:os'
import autocannon from 'autocannon'
import { type HostileRequest, hostileRequests } from './load-hostile.ts'
import { loadTargets } from './load-targets.ts'

/** Seconds the server is left idle before its memory is read after a pass (V8 collects when allocation stops). */
const IDLE_BEFORE_RSS_S = 5

/** Resident memory after the server has been idle for {@link IDLE_BEFORE_RSS_S} seconds. */
async function idleRss(pid: number): Promise<number> {
  await new Promise((r) => setTimeout(r, IDLE_BEFORE_RSS_S * 1000))
  return rssMiB(pid)
}

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
  for (let i = 0; i < 600; i++) {
    const m = out.match(/listening on (http:\/\/127\.0\.0\.1:\d+)/)
    if (m) return { child, url: m[1] }
    await new Promise((r) => setTimeout(r, 50))
  }
  child.kill('SIGTERM')
  throw new Error('server did not start')
}

interface Work {
  threads: number
  starting: number
  running: number
  queued: number
}

/** Wait until the pool has loaded and is idle (the last round's requests answered). */
async function settle(url: string): Promise<Work> {
  const until = performance.now() + 60_000
  let work: Work = { threads: 0, starting: 1, running: 1, queued: 1 }
  while (performance.now() < until) {
    try {
      work = ((await (await fetch(`${url}/healthz`)).json()) as { work: Work }).work
      if (work.starting === 0 && work.running === 0 && work.queued === 0) return work
    } catch {
      // not answering yet
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  return work
}

/**
 * Probe /healthz every `everyMs` from a process of its own (bench/health-probe.mjs), so the load client's
 * work in this process does not delay the probe; the latencies [ms] and the failures when stopped.
 */
function probeHealth(url: string, everyMs = 25): { stop: () => Promise<{ ms: number[]; failed: number }> } {
  const child = spawn('node', ['bench/health-probe.mjs', url, String(everyMs)], {
    stdio: ['pipe', 'pipe', 'inherit'],
  })
  let out = ''
  child.stdout?.on('data', (d) => {
    out += String(d)
  })
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()))
  return {
    stop: async () => {
      child.stdin?.end()
      await exited
      return JSON.parse(out) as { ms: number[]; failed: number }
    },
  }
}

/**
 * CPU time used so far [s] (user + system, from /proc, Linux) by a process, or by one of its threads with
 * `tid` (the event-loop thread's id is the process id).
 */
function cpuSeconds(pid: number, tid?: number): number {
  const path = tid === undefined ? `/proc/${pid}/stat` : `/proc/${pid}/task/${tid}/stat`
  const fields = readFileSync(path, 'utf8').split(') ')[1].split(' ')
  // fields after the command: state is [0]; utime and stime are fields 14 and 15 of stat(5), here [11], [12]
  // (clock ticks; 100 per second on Linux)
  return (Number(fields[11]) + Number(fields[12])) / 100
}

function quantile(values: number[], q: number): number {
  if (values.length === 0) return Number.NaN
  const s = [...values].sort((a, b) => a - b)
  // Hyndman–Fan type 7, as src/analysis/statistics.ts
  const h = (s.length - 1) * q
  const lo = Math.floor(h)
  return s[lo] + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)] ?? s[lo]) - s[lo])
}

interface Round {
  pass: number
  name: string
  connections: number
  reqPerS: number
  p50: number
  p99: number
  errors: number
  healthP50: number
  healthP99: number
  healthFailed: number
  /** Cores the server kept busy: its CPU seconds per second of the round. */
  cores: number
  /** Server CPU per answered assessment [ms], all threads; and the event-loop thread's share of it. */
  cpuMsPerReq: number
  mainMsPerReq: number
  rss0: number
  rss1: number
}

interface HostileResult {
  name: string
  status: number
  ms: number
  ok: boolean
}

async function main(): Promise<void> {
  const [assessTarget] = (await loadTargets()).filter((t) => t.name === 'POST /v1/assess')
  const hostile: HostileRequest[] = hostileRequests()
  const { child, url } = await startServer()
  const pid = child.pid as number
  const durationS = Number(process.env.LOAD_SECONDS ?? 8)
  const passes = Number(process.env.LOAD_PASSES ?? 2)
  const rounds: Round[] = []
  const hostileResults: HostileResult[] = []
  const rssAfterPass: number[] = []
  let pool: Work = await settle(url)
  const rssStart = rssMiB(pid)
  let rssWarm = Number.NaN

  async function round(pass: number, connections: number, withHostile: boolean): Promise<void> {
    await settle(url)
    const rss0 = rssMiB(pid)
    const probe = probeHealth(url)
    const cpu0 = cpuSeconds(pid)
    const main0 = cpuSeconds(pid, pid)
    const t0 = performance.now()
    const load = autocannon({
      url: url + assessTarget.path,
      method: assessTarget.method,
      body: assessTarget.body,
      headers: { 'content-type': assessTarget.contentType as string },
      connections,
      duration: durationS,
    })
    if (withHostile) {
      await new Promise((r) => setTimeout(r, (durationS * 1000) / 2))
      const results = await Promise.all(
        hostile.map(async (h) => {
          const t0 = performance.now()
          let status = -1
          try {
            status = await h.send(url)
          } catch {
            status = -1
          }
          return { name: h.name, status, ms: performance.now() - t0, ok: h.expect.includes(status) }
        }),
      )
      if (pass === passes) hostileResults.push(...results)
      else hostileResults.push(...results.filter((r) => !r.ok))
    }
    const result = await load
    const cpuS = cpuSeconds(pid) - cpu0
    const mainS = cpuSeconds(pid, pid) - main0
    const cores = cpuS / ((performance.now() - t0) / 1000)
    const answered = Math.max(1, result.requests.total)
    const health = await probe.stop()
    rounds.push({
      pass,
      name: withHostile ? 'assess + hostile' : 'assess',
      connections,
      reqPerS: result.requests.average,
      p50: result.latency.p50,
      p99: result.latency.p99,
      errors: result.non2xx + result.errors + result.timeouts,
      healthP50: quantile(health.ms, 0.5),
      healthP99: quantile(health.ms, 0.99),
      healthFailed: health.failed,
      cores,
      cpuMsPerReq: (1000 * cpuS) / answered,
      mainMsPerReq: (1000 * mainS) / answered,
      rss0,
      rss1: rssMiB(pid),
    })
  }

  try {
    // Warm-up pass (not counted): every worker thread compiles the engine's hot code and the heaps and
    // allocators reach their working size, hostile inputs included, before the measured passes.
    for (const connections of [1, 4, 16]) await round(0, connections, false)
    await round(0, 4, true)
    await settle(url)
    rssWarm = await idleRss(pid)
    rounds.length = 0
    hostileResults.length = 0
    for (let pass = 1; pass <= passes; pass++) {
      for (const connections of [1, 4, 16]) await round(pass, connections, false)
      await round(pass, 4, true)
      pool = await settle(url)
      rssAfterPass.push(await idleRss(pid))
    }
  } finally {
    child.kill('SIGTERM')
  }

  const f1 = (x: number) => x.toFixed(1)
  console.log(
    `load test on ${url}: ${cpus().length} cores (${availableParallelism()} available), server pool of ${pool.threads} worker threads; ${durationS} s per round, ${passes} passes; loopback only`,
  )
  console.log(`POST /v1/assess on a one-year file: ${assessTarget.path}`)
  console.log(
    'pass round             conn  assess/s   p50 ms   p99 ms errors  healthz p50 ms  healthz p99 ms  server cores  CPU ms/assess  of it event loop  rss0 MiB  rss1 MiB',
  )
  for (const r of rounds) {
    console.log(
      [
        String(r.pass).padStart(4),
        r.name.padEnd(17),
        String(r.connections).padStart(4),
        f1(r.reqPerS).padStart(9),
        f1(r.p50).padStart(8),
        f1(r.p99).padStart(8),
        String(r.errors + r.healthFailed).padStart(6),
        f1(r.healthP50).padStart(15),
        f1(r.healthP99).padStart(15),
        r.cores.toFixed(2).padStart(13),
        f1(r.cpuMsPerReq).padStart(14),
        f1(r.mainMsPerReq).padStart(17),
        r.rss0.toFixed(0).padStart(9),
        r.rss1.toFixed(0).padStart(9),
      ].join(' '),
    )
  }
  console.log(
    `hostile inputs sent in the middle of the last pass's hostile round (status 0: the client left):`,
  )
  for (const h of hostileResults) {
    console.log(
      `  ${h.ok ? 'ok  ' : 'BAD '} ${String(h.status).padStart(3)} ${f1(h.ms).padStart(8)} ms  ${h.name}`,
    )
  }

  // The figures, from this run only.
  const last = rounds.filter((r) => r.pass === passes)
  const plain = (c: number) => last.find((r) => r.name === 'assess' && r.connections === c) as Round
  const hostileRound = last.find((r) => r.name === 'assess + hostile') as Round
  const scaling = plain(4).reqPerS / plain(1).reqPerS
  const healthP99 = Math.max(...rounds.map((r) => r.healthP99))
  const errors =
    rounds.reduce((s, r) => s + r.errors + r.healthFailed, 0) + hostileResults.filter((h) => !h.ok).length
  const growth =
    rssAfterPass.length > 1 ? rssAfterPass[rssAfterPass.length - 1] / rssAfterPass[0] : Number.NaN
  const hostileRatio = hostileRound.reqPerS / plain(4).reqPerS
  const verdicts: [string, string, boolean][] = [
    [
      'assessment throughput, 4 clients / 1 client',
      `${plain(4).reqPerS.toFixed(1)} / ${plain(1).reqPerS.toFixed(1)} = ${scaling.toFixed(2)}× (target ≥ 1.7×)`,
      scaling >= 1.7,
    ],
    [
      '/healthz p99 while assessments run (worst round)',
      `${healthP99.toFixed(1)} ms (target < 100 ms)`,
      healthP99 < 100,
    ],
    [
      'errors (failed or unexpected answers, assess + healthz + hostile)',
      `${errors} (target 0)`,
      errors === 0,
    ],
    [
      `server resident memory after each pass (idle ${IDLE_BEFORE_RSS_S} s)`,
      `${rssAfterPass.map((m) => m.toFixed(0)).join(', ')} MiB (start ${rssStart.toFixed(0)} MiB, after the warm-up pass ${rssWarm.toFixed(0)} MiB); last / first ${growth.toFixed(2)} (target ≤ 1.10)`,
      growth <= 1.1,
    ],
    [
      'throughput with the hostile inputs / without (4 clients, last pass)',
      `${hostileRound.reqPerS.toFixed(1)} / ${plain(4).reqPerS.toFixed(1)} = ${hostileRatio.toFixed(2)} (target ≥ 0.80)`,
      hostileRatio >= 0.8,
    ],
  ]
  for (let pass = 1; pass <= passes; pass++) {
    const at = (c: number) =>
      rounds.find((r) => r.pass === pass && r.name === 'assess' && r.connections === c)
    const one = at(1)
    const four = at(4)
    if (one && four) {
      console.log(
        `pass ${pass}: 4 clients / 1 client = ${(four.reqPerS / one.reqPerS).toFixed(2)}× with ${four.cores.toFixed(2)} / ${one.cores.toFixed(2)} server cores (the machine is shared: fewer than 2 cores means other work took them)`,
      )
    }
  }
  console.log('figures of this run (throughput ratios from the last pass):')
  for (const [what, value, ok] of verdicts) console.log(`  ${ok ? 'met    ' : 'NOT MET'}  ${what}: ${value}`)
  if (errors > 0) process.exitCode = 1
}

await main()
