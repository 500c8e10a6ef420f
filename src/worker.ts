/**
 * @module worker
 * Cloudflare Workers entry: the same app as on Node. Limits come from wrangler.toml `[vars]`.
 */
import { createApp } from './api/app.ts'

interface Env {
  DRYHOURS_MAX_BODY_BYTES?: string
}

let cached: { key: string; app: ReturnType<typeof createApp> } | undefined

export default {
  fetch(request: Request, env: Env, ctx: unknown): Response | Promise<Response> {
    const key = env.DRYHOURS_MAX_BODY_BYTES ?? ''
    if (!cached || cached.key !== key) {
      const maxBodyBytes = Number(key)
      cached = {
        key,
        app: createApp(Number.isFinite(maxBodyBytes) && maxBodyBytes > 0 ? { maxBodyBytes } : {}),
      }
    }
    return cached.app.fetch(request, env, ctx as never)
  },
}
