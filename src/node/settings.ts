/**
 * @module node/settings
 * The Node server's settings from the environment: the API limits (DRYHOURS_* variables, api/config.ts),
 * a 60 s time budget per request, the clock, the demo files, and the worker pool (DRYHOURS_WORKERS threads,
 * default the machine's available parallelism; DRYHOURS_QUEUE waiting requests, default 8 per thread;
 * DRYHOURS_WORKER_HEAP_MB of heap per thread, default the engine's).
 * Read the same way by the event-loop thread and by every worker thread.
 */
import { availableParallelism } from 'node:os'
import { getHeapStatistics, setFlagsFromString } from 'node:v8'
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

/**
 * Heap growing factor of the server's JavaScript heaps, as V8's `--heap-growing-percent` (our choice: a
 * heap may grow to 3 × its live size before a full collection). Why: V8 counts ArrayBuffer bytes allocated
 * since the last full collection against the old-generation limit, and on a small heap it leaves only
 * ~8 MB of room above the live size (its minimum growing step). Every request moves a file of a few hundred
 * kilobytes through ArrayBuffers (the event-loop thread) and fills hour columns in typed arrays (the worker
 * threads), so with V8's own factor both kinds of thread ran a full collection every ~10 one-year
 * assessments, and each one discarded the optimised code of the engine's per-request closures, which the
 * compiler threads then rebuilt (measured with `--trace-gc --trace-opt` on the load test's request, Node 20:
 * event-loop thread 19 → 0 full collections per 200 assessments, worker threads 3–23 → 2, optimising
 * compilations 184–441 → ~155). A 28-year assessment peaked at 503 MB resident with V8's factor and
 * 524 MB with this one.
 */
export const SERVER_HEAP_GROWING_PERCENT = 200

/**
 * Apply {@link SERVER_HEAP_GROWING_PERCENT} to this process. V8 reads the factor each time it sets a heap's
 * next limit, so it takes effect on the event-loop thread from its next full collection and on every
 * worker thread; Node allows this flag only from the command line or here.
 */
export function tuneServerHeaps(): void {
  setFlagsFromString(`--heap-growing-percent=${SERVER_HEAP_GROWING_PERCENT}`)
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
