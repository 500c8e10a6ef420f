/**
 * @module worker
 * Cloudflare Workers entry: the same app as on Node. Limits come from wrangler.toml `[vars]` (the DRYHOURS_*
 * variables of api/config.ts); the plan's CPU limit bounds the time per request. Each request runs in the
 * platform's isolate: there is no worker pool here (that is Node's, src/node/pool.ts).
 */
import { createApp } from './api/app.ts'
import { configFromVariables } from './api/config.ts'

let cached: { key: string; app: ReturnType<typeof createApp> } | undefined

export default {
  fetch(
    request: Request,
    env: Record<string, string | undefined>,
    ctx: unknown,
  ): Response | Promise<Response> {
    const key = JSON.stringify(env ?? {})
    if (!cached || cached.key !== key) cached = { key, app: createApp(configFromVariables(env ?? {})) }
    return cached.app.fetch(request, env, ctx as never)
  },
}
