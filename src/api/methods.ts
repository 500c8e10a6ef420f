/**
 * @module api/methods
 * The methods a path takes, from the app's own route table: a known path asked with another method is a
 * 405 with `Allow` (RFC 9110 §15.5.6), not a 404.
 */

/** Whether a route pattern (`/v1/products/:id`, `/docs`, `/v1/*`) matches a request path. */
function matches(pattern: string, path: string): boolean {
  const p = pattern.split('/').filter((s) => s !== '')
  const s = path.split('/').filter((x) => x !== '')
  for (let i = 0; i < p.length; i++) {
    if (p[i] === '*') return true
    if (i >= s.length) return false
    if (p[i].startsWith(':')) continue
    if (p[i] !== s[i]) return false
  }
  return p.length === s.length
}

/** Methods with a handler for `path` (GET implies HEAD, which Hono answers from the GET handler); sorted. */
export function allowedMethods(
  routes: ReadonlyArray<{ method: string; path: string }>,
  path: string,
): string[] {
  const out = new Set<string>()
  for (const r of routes) {
    if (r.method === 'ALL' || r.path.includes('*')) continue
    if (!matches(r.path, path)) continue
    out.add(r.method)
    if (r.method === 'GET') out.add('HEAD')
  }
  return [...out].sort()
}
