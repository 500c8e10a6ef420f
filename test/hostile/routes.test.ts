/**
 * Hostile requests to the routes themselves: wrong methods, unknown paths carrying markup or path
 * traversal, NUL bytes and out-of-range values in query parameters, repeated keys.
 */
import { describe, expect, it } from 'vitest'
import { app, expectProblem } from './hostile-helpers.ts'

describe('hostile requests', () => {
  it.each([
    ['GET', '/nope<script>'],
    ['POST', '/v1/nothing-here'],
  ])('%s %s: 404 problem naming the method and path', async (method, path) => {
    const p = await expectProblem(await app.request(path, { method }), [404])
    expect(p.detail).toMatch(new RegExp(`^no route for ${method} `))
    expect(p.detail.includes('<script>')).toBe(false)
  })

  it('a product id with path traversal or markup is a 404 that lists the known ids', async () => {
    for (const id of ['..%2F..%2Fetc%2Fpasswd', '%3Cscript%3Ealert(1)%3C%2Fscript%3E']) {
      const p = await expectProblem(await app.request(`/v1/products/${id}`), [404])
      expect(p.detail).toMatch(/known ids: .*figs/)
    }
  })

  it.each([
    '/v1/air?tdb=%00&rh=50',
    '/v1/air?tdb=1000&rh=50',
    '/v1/air?tdb=-300&rh=50',
    '/v1/air?tdb=20&rh=50&pressure=1e-9',
    '/v1/air?tdb=20&w=1e300',
    '/v1/air?tdb=20&tdp=30',
    '/v1/air?tdb=20&twb=25',
    '/v1/air?tdb=20&rh=50&rh2=1',
    '/v1/equilibrium?product=figs&tdb=25&rh=100',
    '/v1/equilibrium?product=figs&tdb=25&rh=0',
    '/v1/equilibrium?product=figs&tdb=1000&rh=50',
  ])('%s: 400 with a message', async (url) => {
    await expectProblem(await app.request(url), [400])
  })

  it('repeated query keys: the last value is used (documented in src/api/validate.ts)', async () => {
    const res = await app.request('/v1/air?tdb=20&rh=50&rh=60')
    expect(res.status).toBe(200)
    expect(((await res.json()) as { relativeHumidityPct: number }).relativeHumidityPct).toBe(60)
  })
})
