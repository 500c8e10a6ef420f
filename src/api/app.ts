/**
 * @module api/app
 * The dryhours HTTP API: one runtime-neutral Hono app for Node and Cloudflare Workers. One small router
 * per resource, mounted with `app.route`; zod at the edge; RFC 9457 problem details with a stable type for
 * every error (never engine text); 405 with `Allow` for a known path and the wrong method; gzip and deflate
 * bodies decoded within the byte limit.
 */
import { Hono } from 'hono'
import { bodyLimit } from 'hono/body-limit'
import { cors } from 'hono/cors'
import { secureHeaders } from 'hono/secure-headers'
import { decodeContentEncoding } from './body.ts'
import { type ApiConfig, DEFAULT_API_CONFIG } from './config.ts'
import { problemFor } from './errors.ts'
import { allowedMethods } from './methods.ts'
import { problemResponse } from './problem.ts'
import { apiRoutes } from './routes/index.ts'
import { markWorkStart } from './work.ts'

export function createApp(overrides: Partial<ApiConfig> = {}): Hono {
  const config: ApiConfig = { ...DEFAULT_API_CONFIG, ...overrides }
  const app = new Hono()

  app.use('*', async (c, next) => {
    markWorkStart(c, config)
    await next()
  })
  app.use(
    '*',
    secureHeaders({
      contentSecurityPolicy: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:'],
        frameAncestors: ["'none'"],
        formAction: ["'self'"],
        baseUri: ["'none'"],
        objectSrc: ["'none'"],
      },
      xFrameOptions: 'DENY',
    }),
  )
  if (config.corsOrigins.length > 0) app.use('/v1/*', cors({ origin: config.corsOrigins }))
  app.use(
    '*',
    bodyLimit({
      maxSize: config.maxBodyBytes,
      onError: (c) =>
        problemResponse(
          c,
          413,
          `request body is larger than the limit of ${config.maxBodyBytes} bytes; split the file by years or sites, or raise DRYHOURS_MAX_BODY_BYTES on your own server`,
        ),
    }),
  )
  app.use('*', async (c, next) => {
    await decodeContentEncoding(c, config.maxBodyBytes)
    await next()
  })

  for (const { path, router } of apiRoutes(config)) app.route(path, router)

  app.notFound((c) => {
    const path = new URL(c.req.url).pathname
    const allow = allowedMethods(app.routes, path)
    if (allow.length > 0 && !allow.includes(c.req.method)) {
      return problemResponse(
        c,
        405,
        `${c.req.method.slice(0, 20)} is not allowed on ${path.slice(0, 100)}; it takes ${allow.join(', ')}`,
        undefined,
        'method-not-allowed',
        { allow: allow.join(', ') },
      )
    }
    return problemResponse(
      c,
      404,
      `no route for ${c.req.method.slice(0, 20)} ${path.slice(0, 200)}; see /docs`,
    )
  })
  app.onError((err, c) => {
    const problem = problemFor(err, { rangeStatus: 400 })
    if (problem) {
      return problemResponse(
        c,
        problem.status,
        problem.message,
        problem.errors,
        problem.type,
        problem.headers,
      )
    }
    // Internal error: no stack trace or engine text in the answer; the message goes to the server log.
    console.error(
      `dryhours: internal error on ${c.req.method} ${new URL(c.req.url).pathname}: ${(err as Error).message}`,
    )
    return problemResponse(c, 500, 'internal error; the request was not processed (the server logged it)')
  })
  return app
}
