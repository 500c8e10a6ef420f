/**
 * @module api/routes
 * Every resource router with its mount path. Add a resource by writing `routes/<name>.ts` and listing it here.
 */
import type { Hono } from 'hono'
import type { ApiConfig } from '../config.ts'
import { airRouter } from './air.ts'
import { docsRouter } from './docs.ts'
import { healthRouter } from './health.ts'
import { openApiRouter } from './openapi.ts'

export interface MountedRoute {
  path: string
  // biome-ignore lint/suspicious/noExplicitAny: routers differ in their typed schema
  router: Hono<any, any, any>
}

export function apiRoutes(_config: ApiConfig): MountedRoute[] {
  return [
    { path: '/healthz', router: healthRouter },
    { path: '/v1/air', router: airRouter },
    { path: '/openapi.json', router: openApiRouter },
    { path: '/docs', router: docsRouter },
  ]
}
