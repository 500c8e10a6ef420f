/**
 * @module node/settings
 * The Node server's settings from the environment: the API limits (DRYHOURS_* variables, api/config.ts),
 * a 60 s time budget per request, the clock, the demo files, and the worker pool (DRYHOURS_WORKERS threads,
 * default the machine's available parallelism; DRYHOURS_QUEUE waiting requests, default 8 per thread;
 * DRYHOURS_WORKER_HEAP_MB of heap per thread, default the engine's).
 * Read the same way by the event-loop thread and by every worker thread.
 */
import { availableParallelism } from 'node:os'
import { getHeapStatistics } from 'node:v8'
import { type ApiConfig, ConfigError, configFromVariables } from '../api/config.ts'
import { climateDemoProvider } from './demo-provider.ts'

/** Time budget per request on Node unless DRYHOURS_TIME_BUDGET_MS says otherwise [ms] (our choice). */
export const NODE_TIME_BUDGET_MS = 60_000
/** Waiting requests per worker thread before the server answers 503 (our choice: 8 per thread). */
export const QUEUE_PER_THREAD = 8
/**
 * Heap of each worker thread [MiB] unless DRYHOURS_WORKER_HEAP_MB says otherwise: the JavaScript engine's own
 * default for this machine (V8 sizes it from the memory; 4,144 MiB on a 24 GB machine). A lower limit makes
 * V8 collect garbage more often: with 1,024 MiB a one-year assessment took 60–70 ms of CPU instead of 40–45 ms
 * (measured on the load test's request, Node 20). A 30-year hourly assessment peaked at 366 MB resident for
 * the whole process.
 */
export function defaultWorkerHeapMb(): number {
  return Math.round(getHeapStatistics().heap_size_limit / 1024 / 1024)
}

export interface PoolSettings {
  /** Worker threads (0: all work on the event-loop thread, as before the pool). */
  threads: number
  /** Requests that may wait for a thread; beyond it 503 with Retry-After. */
  queue: number
  /** Old-generation heap of each thread [MiB]. */
  heapMb: number
}

function wholeNumber(
  env: NodeJS.ProcessEnv,
  name: string,
  fallback: number,
  min: number,
  max = 1024,
): number {
  const raw = env[name]
  if (raw === undefined || raw.trim() === '') return fallback
  const n = Number(raw)
  if (!(Number.isInteger(n) && n >= min && n <= max)) {
    throw new ConfigError(`${name} must be a whole number from ${min} to ${max}, got '${raw}'`)
  }
  return n
}

/** Pool size from the environment; ConfigError naming the variable for a value that cannot be used. */
export function poolFromEnv(env: NodeJS.ProcessEnv): PoolSettings {
  const threads = wholeNumber(env, 'DRYHOURS_WORKERS', availableParallelism(), 0)
  const queue = wholeNumber(env, 'DRYHOURS_QUEUE', QUEUE_PER_THREAD * Math.max(1, threads), 0)
  const heapMb = wholeNumber(env, 'DRYHOURS_WORKER_HEAP_MB', defaultWorkerHeapMb(), 16, 65_536)
  return { threads, queue, heapMb }
}

/** API settings on Node: the environment over a 60 s budget, with the clock and the demo files. */
export function configFromEnv(env: NodeJS.ProcessEnv, withPool = true): Partial<ApiConfig> {
  const pool = withPool ? poolFromEnv(env) : undefined
  return {
    timeBudgetMs: NODE_TIME_BUDGET_MS,
    now: () => performance.now(),
    demo: climateDemoProvider(),
    ...(pool && pool.threads > 0
      ? { pool: { threads: pool.threads, queue: pool.queue, heapMb: pool.heapMb } }
      : {}),
    ...configFromVariables(env),
  }
}
