import { Hono } from 'hono'

/** GET /healthz: liveness, no work done. */
export const healthRouter = new Hono().get('/', (c) => c.json({ ok: true, service: 'dryhours' }))
