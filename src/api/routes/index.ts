/**
 * @module api/routes
 * Every resource router with its mount path. Add a resource by writing `routes/<name>.ts` and listing it here.
 */
import type { Hono } from 'hono'
import type { ApiConfig } from '../config.ts'
import { airRouter } from './air.ts'
import { assessRouter, compareRouter } from './assess.ts'
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

/**
 * Requests that take a file and run the engine: on Node they run on the worker pool (node/pool.ts), the rest
 * (health, air, products, docs, the page itself) on the event-loop thread.
 */
export const FILE_ROUTES: readonly string[] = [
  '/v1/assess',
  '/v1/compare',
  '/v1/inspect',
  '/v1/fit',
  '/v1/energy-chart',
  '/report',
]

/** Whether a request is one of the {@link FILE_ROUTES} (a POST to one of their paths). */
export function takesFile(method: string, pathname: string): boolean {
  return method === 'POST' && FILE_ROUTES.includes(pathname)
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
    { path: '/openapi.json', router: openApiRouter },
    { path: '/docs', router: docsRouter },
    { path: '/', router: pageRouter(_config) },
  ]
}
