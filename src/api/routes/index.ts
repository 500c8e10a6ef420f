/**
 * @module api/routes
 * Every resource router with its mount path. Add a resource by writing `routes/<name>.ts` and listing it here.
 */
import type { Hono } from 'hono'
import type { ApiConfig } from '../config.ts'
import { airRouter } from './air.ts'
import { assessRouter } from './assess.ts'
import { compareRouter } from './compare.ts'
import { docsRouter } from './docs.ts'
import { energyRouter } from './energy.ts'
import { healthRouter } from './health.ts'
import { inspectRouter } from './inspect.ts'
import { openApiRouter } from './openapi.ts'
import { pageRouter } from './page.ts'
import { equilibriumRouter, fitRouter, productsRouter } from './products.ts'

export interface MountedRoute {
  path: string
  // biome-ignore lint/suspicious/noExplicitAny: routers differ in their typed schema
  router: Hono<any, any, any>
}

export function apiRoutes(_config: ApiConfig): MountedRoute[] {
  return [
    { path: '/healthz', router: healthRouter(_config) },
    { path: '/v1/air', router: airRouter },
    { path: '/v1/energy-chart', router: energyRouter(_config) },
    { path: '/v1/inspect', router: inspectRouter(_config) },
    { path: '/v1/products', router: productsRouter },
    { path: '/v1/assess', router: assessRouter(_config) },
    { path: '/v1/compare', router: compareRouter(_config) },
    { path: '/v1/equilibrium', router: equilibriumRouter },
    { path: '/v1/fit', router: fitRouter(_config) },
    { path: '/openapi.json', router: openApiRouter(_config) },
    { path: '/docs', router: docsRouter(_config) },
    { path: '/', router: pageRouter(_config) },
  ]
}
