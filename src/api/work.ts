/**
 * @module api/work
 * The time budget and the cancellation of one request's work. A request's clock starts when it enters the
 * app, so the budget covers decoding and reading the files as well as the engine and the rendering. Long
 * loops call `checkpoint()` (the engine's progress callback, and between stages); it throws
 * {@link WorkStopped} when the budget is spent or the client has gone away.
 *
 * The clock comes from the entry point (`ApiConfig.now`: the core reads no clock). Cancellation comes from
 * the request's abort signal or, on Node, from the worker pool through `env.dryhoursWork.cancelled()`, which
 * reads a flag the pool sets from the event-loop thread while the worker computes.
 */
import type { Context } from 'hono'
import type { ApiConfig } from './config.ts'
import { ApiProblem } from './problem.ts'

/** What an entry point may pass in the Hono `env` of a request for its work. */
export interface WorkEnv {
  dryhoursWork?: {
    /** True once the client has gone away (or the pool has given up on the request). */
    cancelled: () => boolean
  }
}

export class WorkStopped extends Error {
  override name = 'WorkStopped'
  constructor(
    readonly reason: 'time-budget' | 'client-closed',
    readonly budgetMs = 0,
  ) {
    super(reason)
  }

  problem(): ApiProblem {
    if (this.reason === 'client-closed') {
      return new ApiProblem(
        499,
        'the client closed the request; the work was stopped',
        undefined,
        'client-closed',
      )
    }
    return timeBudgetProblem(this.budgetMs)
  }
}

export function timeBudgetProblem(budgetMs: number): ApiProblem {
  return new ApiProblem(
    422,
    `reading and computing this request took longer than this server's budget of ${budgetMs / 1000} s; use a larger start-date step, a shorter season or fewer years per file`,
    undefined,
    'time-budget',
  )
}

const STARTED = 'dryhoursWorkStartedMs'

/** Middleware body: note when the request entered the app (the start of its time budget). */
export function markWorkStart(c: Context, config: ApiConfig): void {
  if (config.now) c.set(STARTED as never, config.now() as never)
}

export interface WorkControl {
  /** Throws {@link WorkStopped} when the budget is spent or the client is gone; cheap enough per step. */
  checkpoint: () => void
}

export function workControl(c: Context, config: ApiConfig): WorkControl {
  const now = config.now
  const budget = config.timeBudgetMs
  const started = (c.get(STARTED as never) as number | undefined) ?? now?.() ?? 0
  const env = c.env as WorkEnv | undefined
  const cancelled = env?.dryhoursWork?.cancelled
  const signal = c.req.raw.signal as AbortSignal | undefined
  return {
    checkpoint: () => {
      if (cancelled?.() || signal?.aborted) throw new WorkStopped('client-closed')
      if (now && budget > 0 && now() - started > budget) throw new WorkStopped('time-budget', budget)
    },
  }
}
