/**
 * @module worker
 * Cloudflare Workers entry: the same app as on Node. Limits come from wrangler.toml `[vars]`
 * (DRYHOURS_MAX_BODY_BYTES, DRYHOURS_MAX_ROWS, DRYHOURS_MAX_SITES, DRYHOURS_MAX_BATCH_HOURS,
 * DRYHOURS_CORS_ORIGINS); the plan's CPU limit bounds the time per request.
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
