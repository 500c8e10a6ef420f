import { Hono } from 'hono'
import type { ApiConfig } from '../config.ts'

/** GET /healthz: liveness, no work done; on Node also the worker pool's state (`work`). */
export const healthRouter = (config: ApiConfig) =>
  new Hono().get('/', (c) =>
    c.json({ ok: true, service: 'dryhours', ...(config.workStats ? { work: config.workStats() } : {}) }),
  )
