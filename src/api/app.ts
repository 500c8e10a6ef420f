/**
 * @module api/app
 * The dryhours HTTP API: one runtime-neutral Hono app for Node and Cloudflare Workers. One small router
 * per resource, mounted with `app.route`; zod at the edge; RFC 9457 problem details for every error.
 */
import { Hono } from 'hono'
import { bodyLimit } from 'hono/body-limit'
import { cors } from 'hono/cors'
import { HTTPException } from 'hono/http-exception'
import { secureHeaders } from 'hono/secure-headers'
import { type ApiConfig, DEFAULT_API_CONFIG } from './config.ts'
import { ApiProblem, problemResponse } from './problem.ts'
import { apiRoutes } from './routes/index.ts'

export function createApp(overrides: Partial<ApiConfig> = {}): Hono {
  const config: ApiConfig = { ...DEFAULT_API_CONFIG, ...overrides }
  const app = new Hono()

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

  for (const { path, router } of apiRoutes(config)) app.route(path, router)

  app.notFound((c) =>
    problemResponse(c, 404, `no route for ${c.req.method} ${new URL(c.req.url).pathname}; see /docs`),
  )
  app.onError((err, c) => {
    if (err instanceof ApiProblem) return problemResponse(c, err.status, err.message, err.errors)
    if (err instanceof HTTPException) return problemResponse(c, err.status, err.message || 'request rejected')
    if (err instanceof RangeError) return problemResponse(c, 400, err.message)
    // Internal error: no stack trace or internals in the answer.
    console.error(
      `dryhours: internal error on ${c.req.method} ${new URL(c.req.url).pathname}: ${err.message}`,
    )
    return problemResponse(c, 500, 'internal error; the request was not processed')
  })
  return app
}
