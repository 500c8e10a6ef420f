/**
 * @module node/pool-worker
 * One worker thread of the pool (node/pool.ts): the same app as the event-loop thread, with the same
 * settings, answering one request at a time. The stop flag in shared memory (set by the pool when the
 * client goes away) is read by the app's checkpoints through `env.dryhoursWork.cancelled()`.
 */
import { readlinkSync } from 'node:fs'
import { getPriority, setPriority } from 'node:os'
import { parentPort, workerData } from 'node:worker_threads'
import { createApp } from '../api/app.ts'
import { problemAnswer } from '../api/problem.ts'
import type { WorkEnv } from '../api/work.ts'
import type { WireRequest, WorkerMessage } from './pool.ts'
import { configFromEnv } from './settings.ts'

if (!parentPort) throw new Error('node/pool-worker runs as a worker thread of node/pool.ts')

/**
 * Nice value added to a worker thread (our choice): the event-loop thread, which answers /healthz and
 * moves every request's bytes, then wins the CPU over the computing threads when both want it.
 */
const WORKER_NICE = 5

/** On Linux the nice value is a per-thread attribute (setpriority(2), NOTES): lower this thread's only. */
function lowerOwnPriority(): void {
  try {
    const tid = Number(readlinkSync('/proc/thread-self').split('/').pop())
    if (Number.isInteger(tid) && tid > 0) setPriority(tid, Math.min(19, getPriority(tid) + WORKER_NICE))
  } catch {
    // not Linux, or not allowed: the thread keeps the process's priority
  }
}
lowerOwnPriority()
const port = parentPort
const flag = new Int32Array((workerData as { flag: SharedArrayBuffer }).flag)
const app = createApp(configFromEnv(process.env, false))
const env: WorkEnv = { dryhoursWork: { cancelled: () => Atomics.load(flag, 0) !== 0 } }

async function answer(request: WireRequest): Promise<Response> {
  const req = new Request(request.url, {
    method: request.method,
    headers: request.headers,
    body: request.body,
  })
  try {
    return await app.fetch(req, env)
  } catch (e) {
    console.error(`dryhours: internal error in a worker thread: ${(e as Error).message}`)
    return problemAnswer(500, 'internal error; the request was not processed (the server logged it)')
  }
}

port.on('message', async (m: { id: number; request: WireRequest }) => {
  const res = await answer(m.request)
  const body = await res.arrayBuffer()
  const reply: WorkerMessage = { id: m.id, status: res.status, headers: [...res.headers], body }
  port.postMessage(reply, [body])
})
port.postMessage({ ready: true } satisfies WorkerMessage)
