/**
 * @module api/file-routes
 * The routes that take a file and run the engine.
 */

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
