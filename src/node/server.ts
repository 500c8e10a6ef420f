/**
 * @module node/server
 * `npm start` / `dryhours serve`: the API (and the page) on 127.0.0.1:8787 (HOST, PORT), one log line per
 * request, clean shutdown on SIGINT/SIGTERM. Limits from the DRYHOURS_* variables (see api/config.ts and
 * node/settings.ts). Requests that take a file run on a pool of worker threads (node/pool.ts); the event-loop
 * thread reads bodies, answers the rest (/healthz among them) and writes the answers.
 */

import type { Server } from 'node:http'
import { pathToFileURL } from 'node:url'
import { type ServerType, serve } from '@hono/node-server'
import { createApp } from '../api/app.ts'
import { readLimited } from '../api/body.ts'
import { type ApiConfig, ConfigError, DEFAULT_API_CONFIG } from '../api/config.ts'
import { takesFile } from '../api/file-routes.ts'
import { ApiProblem, problemAnswer } from '../api/problem.ts'
import { timeBudgetProblem } from '../api/work.ts'
import { JobCancelled, JobOutOfMemory, JobOverran, PoolBusy, type WireRequest, WorkerPool } from './pool.ts'
import { configFromEnv, poolFromEnv, tuneServerHeaps } from './settings.ts'

export { configFromEnv } from './settings.ts'

/** How long past its budget a worker may run before it is terminated [ms] (our choice). */
const BUDGET_GRACE_MS = 5_000

export interface RunningServer {
  url: string
  close: () => Promise<void>
  /** The worker pool, when the server has one. */
  pool?: WorkerPool
}

/** The server could not listen (port in use, address not available, permission): the user's settings. */
export class ListenError extends Error {
  override name = 'ListenError'
}

const LISTEN_ERRORS: Record<string, string> = {
  EADDRINUSE: 'is already in use (another server is listening there); choose another port with --port',
  EACCES: 'needs more privileges (ports below 1024 are reserved); choose a port from 1024 up',
  EADDRNOTAVAIL: 'is not an address of this machine; use 127.0.0.1, 0.0.0.0 or one of its addresses',
  ENOTFOUND: 'is not a known host name',
}

const HOP_BY_HOP = new Set(['connection', 'keep-alive', 'transfer-encoding', 'content-length', 'upgrade'])

/** The request as it crosses to a worker: its body read here, within the byte limit. */
async function wireRequest(req: Request, config: ApiConfig): Promise<WireRequest | Response> {
  const declared = Number(req.headers.get('content-length') ?? Number.NaN)
  if (declared > config.maxBodyBytes) {
    return problemAnswer(
      413,
      `request body is larger than the limit of ${config.maxBodyBytes} bytes; split the file by years or sites`,
    )
  }
  let body: ArrayBuffer | null = null
  if (req.body) {
    try {
      const bytes = await readLimited(
        req.body,
        config.maxBodyBytes,
        'request body',
        Number.isFinite(declared) ? declared : undefined,
      )
      body = bytes.buffer
    } catch (e) {
      if (e instanceof ApiProblem) return problemAnswer(e.status, e.message, { type: e.type })
      return problemAnswer(400, 'the request body could not be read completely (connection closed?)', {
        type: 'unreadable-body',
      })
    }
  }
  // hop-by-hop headers stay here; the worker gets the body whole, with its length
  const headers = [...req.headers].filter(([k]) => !HOP_BY_HOP.has(k))
  if (body) headers.push(['content-length', String(body.byteLength)])
  return { method: req.method, url: req.url, headers, body }
}

async function onPool(pool: WorkerPool, req: Request, config: ApiConfig): Promise<Response> {
  const wire = await wireRequest(req, config)
  if (wire instanceof Response) return wire
  try {
    const res = await pool.run(wire, req.signal)
    return new Response(res.status === 204 ? null : res.body, { status: res.status, headers: res.headers })
  } catch (e) {
    if (e instanceof PoolBusy) {
      return problemAnswer(
        503,
        `every worker is busy and ${pool.stats().queueLimit} requests are waiting; try again in ${e.retryAfterS} s`,
        { type: 'busy', headers: { 'retry-after': String(e.retryAfterS) } },
      )
    }
    if (e instanceof JobCancelled) {
      return problemAnswer(499, 'the client closed the request; the work was stopped', {
        type: 'client-closed',
      })
    }
    if (e instanceof JobOutOfMemory) {
      return problemAnswer(
        422,
        `the request needed more memory than a worker thread may use (${pool.heapMb} MiB); send a smaller file or fewer sites`,
        { type: 'resource-limit' },
      )
    }
    if (e instanceof JobOverran) {
      const p = timeBudgetProblem(config.timeBudgetMs)
      return problemAnswer(p.status, p.message, { type: p.type })
    }
    console.error(
      `dryhours: internal error on ${req.method} ${new URL(req.url).pathname}: ${(e as Error).message}`,
    )
    return problemAnswer(500, 'internal error; the request was not processed (the server logged it)')
  }
}

export async function startServer(
  options: { host?: string; port?: number; log?: (line: string) => void } = {},
): Promise<RunningServer> {
  const host = options.host ?? process.env.HOST ?? '127.0.0.1'
  const port = options.port ?? portFromEnv(process.env.PORT)
  const log = options.log ?? ((line: string) => process.stdout.write(`${line}\n`))
  const settings = poolFromEnv(process.env)
  const base = configFromEnv(process.env)
  tuneServerHeaps()
  // The defaults under the environment's settings (the same merge as createApp's).
  const config: ApiConfig = { ...DEFAULT_API_CONFIG, ...base }
  const pool =
    settings.threads > 0
      ? new WorkerPool({
          threads: settings.threads,
          queue: settings.queue,
          budgetMs: config.timeBudgetMs,
          graceMs: BUDGET_GRACE_MS,
          heapMb: settings.heapMb,
          script: new URL('./pool-worker.mjs', import.meta.url),
          log,
        })
      : undefined
  const api = createApp({ ...base, ...(pool ? { workStats: () => pool.stats() } : {}) })
  const fetch = async (req: Request): Promise<Response> => {
    const started = performance.now()
    const path = new URL(req.url).pathname
    const res = pool && takesFile(req.method, path) ? await onPool(pool, req, config) : await api.fetch(req)
    log(
      `${new Date().toISOString()} ${req.method} ${path} ${res.status} ${(performance.now() - started).toFixed(1)}ms`,
    )
    return res
  }
  const closePool = async () => {
    await pool?.close()
  }
  return new Promise((resolve, reject) => {
    const server: ServerType = serve({ fetch, hostname: host, port }, (info) => {
      const url = `http://${host}:${info.port}`
      // Receiving a request counts against the same budget as computing it.
      if (config.timeBudgetMs > 0) (server as Server).requestTimeout = config.timeBudgetMs
      resolve({
        url,
        pool,
        close: () =>
          new Promise<void>((done) => {
            server.close(() => void closePool().then(done))
            // Idle keep-alive sockets would hold the close open.
            ;(server as unknown as { closeAllConnections?: () => void }).closeAllConnections?.()
          }),
      })
    })
    server.once('error', (e: NodeJS.ErrnoException) => {
      void closePool()
      const why = LISTEN_ERRORS[e.code ?? '']
      reject(why ? new ListenError(`${host}:${port} ${why}`) : e)
    })
  })
}

/** PORT from the environment: a whole number from 0 to 65535, else a ConfigError naming it. */
function portFromEnv(raw: string | undefined): number {
  if (raw === undefined || raw.trim() === '') return 8787
  const n = Number(raw)
  if (!(Number.isInteger(n) && n >= 0 && n <= 65535))
    throw new ConfigError(`PORT must be a whole number from 0 to 65535, got '${raw}'`)
  return n
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  let running: RunningServer
  try {
    running = await startServer()
  } catch (e) {
    if (e instanceof ListenError || e instanceof ConfigError) {
      process.stderr.write(`dryhours: ${e.message}\n`)
      process.exit(2)
    }
    throw e
  }
  process.stdout.write(`dryhours listening on ${running.url} (API docs at ${running.url}/docs)\n`)
  const stop = async (signal: string) => {
    process.stdout.write(`dryhours: ${signal} received, shutting down\n`)
    await running.close()
    process.exit(0)
  }
  process.once('SIGINT', () => void stop('SIGINT'))
  process.once('SIGTERM', () => void stop('SIGTERM'))
}
