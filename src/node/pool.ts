/**
 * @module node/pool
 * A pool of worker threads that run the app's file-taking requests (assess, compare, inspect, fit, energy
 * charts, the page's report) off the event-loop thread, so every core works and /healthz answers while
 * they compute. Each worker runs the same app (src/api/app.ts) on the request it is given.
 *
 * - Bounded queue: beyond `queue` waiting requests, {@link run} throws {@link PoolBusy} (the server answers
 *   503 with Retry-After).
 * - Cancellation: when the request's signal aborts (the client went away), a waiting request leaves the
 *   queue at once; a running one sees a flag in shared memory at its next checkpoint (api/work.ts) and stops.
 * - Hard stop: a worker that overruns the time budget by `graceMs` (e.g. inside a long file read, between
 *   checkpoints) is terminated and replaced; the request gets the time-budget problem.
 */
import { Worker } from 'node:worker_threads'

/** A request as it crosses to a worker (structured-clone and transfer friendly). */
export interface WireRequest {
  method: string
  url: string
  headers: [string, string][]
  body: ArrayBuffer | null
}

export interface WireResponse {
  status: number
  headers: [string, string][]
  body: ArrayBuffer
}

/** Messages from a worker. */
export type WorkerMessage = { ready: true } | ({ id: number } & WireResponse)

/** The queue is full: answer 503 and ask the client to come back after `retryAfterS`. */
export class PoolBusy extends Error {
  override name = 'PoolBusy'
  constructor(readonly retryAfterS: number) {
    super('every worker is busy and the queue is full')
  }
}

/** The request was cancelled (its client went away) before it finished. */
export class JobCancelled extends Error {
  override name = 'JobCancelled'
}

/** A worker overran the budget and was stopped. */
export class JobOverran extends Error {
  override name = 'JobOverran'
}

/** A worker died while running the request (a crash, not a problem of the request). */
export class WorkerDied extends Error {
  override name = 'WorkerDied'
}

/** A worker ran out of its heap on the request (the request needed more memory than a thread may have). */
export class JobOutOfMemory extends Error {
  override name = 'JobOutOfMemory'
}

export interface PoolOptions {
  threads: number
  queue: number
  /** The request's time budget [ms] (0 = none); the worker's own clock answers it at its checkpoints. */
  budgetMs: number
  /** How long past the budget a worker may run before it is terminated [ms]. */
  graceMs: number
  /** The worker script (a module URL). */
  script: URL
  /** Old-generation heap of each worker thread [MiB]: a request that needs more stops only its thread. */
  heapMb: number
  log?: (line: string) => void
}

export type PoolStats = {
  threads: number
  /** Threads still loading the app. */
  starting: number
  running: number
  queued: number
  queueLimit: number
  completed: number
  cancelled: number
  refused: number
  restarted: number
}

interface Job {
  id: number
  request: WireRequest
  resolve: (r: WireResponse) => void
  reject: (e: Error) => void
  signal?: AbortSignal
  onAbort?: () => void
  slot?: Slot
  timer?: ReturnType<typeof setTimeout>
  cancelled: boolean
}

interface Slot {
  worker: Worker
  /** The error the thread died of, when it died of one. */
  error?: Error
  /** Int32 flag in shared memory: 1 = stop the current request (read by the worker's checkpoints). */
  flag: Int32Array
  ready: boolean
  job: Job | null
}

export class WorkerPool {
  private readonly slots: Slot[] = []
  private readonly waiting: Job[] = []
  private nextId = 1
  private closing = false
  /** Mean duration of recent requests [ms] (exponential average), for Retry-After. */
  private meanMs = 1000
  private readonly counts = { completed: 0, cancelled: 0, refused: 0, restarted: 0 }

  constructor(private readonly options: PoolOptions) {
    for (let i = 0; i < options.threads; i++) this.slots.push(this.spawn())
  }

  get heapMb(): number {
    return this.options.heapMb
  }

  /** Resolves once every worker has loaded the app. */
  async ready(): Promise<void> {
    while (this.slots.some((s) => !s.ready)) await new Promise((r) => setTimeout(r, 20))
  }

  stats(): PoolStats {
    return {
      threads: this.slots.length,
      starting: this.slots.filter((s) => !s.ready).length,
      running: this.slots.filter((s) => s.job !== null).length,
      queued: this.waiting.length,
      queueLimit: this.options.queue,
      ...this.counts,
    }
  }

  /** Run a request on a worker; rejects with PoolBusy, JobCancelled, JobOverran or WorkerDied. */
  run(request: WireRequest, signal?: AbortSignal): Promise<WireResponse> {
    if (signal?.aborted) return Promise.reject(new JobCancelled('client closed the request'))
    const idle = this.slots.find((s) => s.ready && s.job === null)
    // a thread still loading takes the first waiting request as soon as it is ready
    const starting = this.slots.filter((s) => !s.ready).length
    if (!idle && this.waiting.length >= this.options.queue + starting) {
      this.counts.refused++
      return Promise.reject(new PoolBusy(this.retryAfterS()))
    }
    return new Promise<WireResponse>((resolve, reject) => {
      const job: Job = { id: this.nextId++, request, resolve, reject, signal, cancelled: false }
      if (signal) {
        job.onAbort = () => this.cancel(job)
        signal.addEventListener('abort', job.onAbort, { once: true })
      }
      if (idle) this.start(idle, job)
      else this.waiting.push(job)
    })
  }

  async close(): Promise<void> {
    this.closing = true
    for (const job of this.waiting.splice(0)) this.finish(job, new JobCancelled('server shutting down'))
    await Promise.all(this.slots.map((s) => s.worker.terminate()))
  }

  /** Seconds until a place is likely free: the queue ahead divided among the threads. */
  private retryAfterS(): number {
    const ahead = this.waiting.length + this.slots.length
    return Math.min(60, Math.max(1, Math.ceil((ahead * this.meanMs) / this.slots.length / 1000)))
  }

  private spawn(): Slot {
    const flag = new Int32Array(new SharedArrayBuffer(4))
    const worker = new Worker(this.options.script, {
      workerData: { flag: flag.buffer },
      resourceLimits: { maxOldGenerationSizeMb: this.options.heapMb },
    })
    const slot: Slot = { worker, flag, ready: false, job: null }
    worker.on('message', (m: WorkerMessage) => {
      if ('ready' in m) {
        slot.ready = true
        this.next(slot)
        return
      }
      const job = slot.job
      if (!job || job.id !== m.id) return
      slot.job = null
      this.finish(job, { status: m.status, headers: m.headers, body: m.body })
      this.next(slot)
    })
    worker.on('error', (e) => {
      slot.error = e
      this.options.log?.(`dryhours: a worker thread stopped: ${e.message}`)
    })
    // 'error' may follow 'exit' (a thread stopped at its heap limit): replace it once both have been seen
    worker.on('exit', () => setImmediate(() => this.replace(slot)))
    return slot
  }

  /** A worker exited (crash or terminate): fail its request and put a fresh worker in its place. */
  private replace(slot: Slot): void {
    const i = this.slots.indexOf(slot)
    if (i < 0 || this.closing) return
    const job = slot.job
    slot.job = null
    const oom =
      (slot.error as NodeJS.ErrnoException | undefined)?.code === 'ERR_WORKER_OUT_OF_MEMORY' ||
      /memory limit/.test(slot.error?.message ?? '')
    if (job) {
      const why = job.cancelled
        ? new JobCancelled('client closed the request')
        : oom
          ? new JobOutOfMemory()
          : new WorkerDied()
      this.finish(job, why)
    }
    this.counts.restarted++
    if (slot.ready) {
      this.slots[i] = this.spawn()
      return
    }
    // died while loading (a heap too small for the app?): try again after a second, not in a hot loop
    this.options.log?.('dryhours: a worker thread died while loading; starting another in 1 s')
    setTimeout(() => {
      if (!this.closing && this.slots[i] === slot) this.slots[i] = this.spawn()
    }, 1000)
  }

  private start(slot: Slot, job: Job): void {
    slot.job = job
    job.slot = slot
    Atomics.store(slot.flag, 0, 0)
    const started = performance.now()
    const { budgetMs, graceMs } = this.options
    if (budgetMs > 0) {
      job.timer = setTimeout(() => {
        if (slot.job !== job) return
        this.options.log?.(`dryhours: a request overran the ${budgetMs} ms budget; its worker was stopped`)
        slot.job = null
        this.finish(job, new JobOverran())
        this.slots.splice(this.slots.indexOf(slot), 1, this.spawn())
        this.counts.restarted++
        void slot.worker.terminate()
      }, budgetMs + graceMs)
    }
    job.resolve = ((resolve) => (r: WireResponse) => {
      this.meanMs = 0.8 * this.meanMs + 0.2 * (performance.now() - started)
      resolve(r)
    })(job.resolve)
    const body = job.request.body
    slot.worker.postMessage({ id: job.id, request: job.request }, body ? [body] : [])
  }

  private next(slot: Slot): void {
    if (slot.job !== null || !slot.ready) return
    const job = this.waiting.shift()
    if (job) this.start(slot, job)
  }

  private cancel(job: Job): void {
    if (job.cancelled) return
    job.cancelled = true
    this.counts.cancelled++
    const w = this.waiting.indexOf(job)
    if (w >= 0) {
      this.waiting.splice(w, 1)
      this.finish(job, new JobCancelled('client closed the request'))
      return
    }
    // Running: the worker stops at its next checkpoint and answers; the answer goes nowhere.
    if (job.slot && job.slot.job === job) Atomics.store(job.slot.flag, 0, 1)
  }

  private finish(job: Job, result: WireResponse | Error): void {
    if (job.timer) clearTimeout(job.timer)
    if (job.signal && job.onAbort) job.signal.removeEventListener('abort', job.onAbort)
    if (result instanceof Error) {
      job.reject(result)
      return
    }
    if (!job.cancelled) this.counts.completed++
    job.resolve(result)
  }
}
