import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'

const app = createApp()

async function problem(res: Response) {
  expect(res.headers.get('content-type')).toBe('application/problem+json')
  const body = (await res.json()) as {
    status: number
    title: string
    detail: string
    errors?: { path: string }[]
  }
  expect(body.status).toBe(res.status)
  expect(typeof body.detail).toBe('string')
  expect(body.detail).not.toMatch(/at .*\.ts:\d+/) // no stack trace
  return body
}

describe('GET /v1/air', () => {
  it('answers ASHRAE HOF 2017 ch. 1 Example 1 (40 °C db, 20 °C wb): RH ≈ 14 %, h ≈ 56.7 kJ/kg', async () => {
    const res = await app.request('/v1/air?tdb=40&twb=20')
    expect(res.status).toBe(200)
    const body = (await res.json()) as Record<string, number>
    expect(Object.keys(body)).toEqual([
      'dryBulbC',
      'wetBulbC',
      'dewPointC',
      'frostPointC',
      'relativeHumidityPct',
      'humidityRatioGPerKg',
      'enthalpyKjPerKg',
      'specificVolumeM3PerKg',
      'densityKgPerM3',
      'vaporPressureKpa',
      'saturationVaporPressureKpa',
      'pressureKpa',
    ])
    expect(Math.abs(body.relativeHumidityPct - 14)).toBeLessThan(0.5)
    expect(Math.abs(body.enthalpyKjPerKg - 56.7)).toBeLessThan(0.05)
    expect(body.pressureKpa).toBe(101.325)
  })

  it('uses the standard atmosphere for an elevation (ASHRAE HOF 2017 ch. 1 Table 1: 1000 m → 89.875 kPa)', async () => {
    const body = (await (await app.request('/v1/air?tdb=20&rh=50&elevation=1000')).json()) as Record<
      string,
      number
    >
    expect(Math.abs(body.pressureKpa - 89.875)).toBeLessThan(0.001)
  })

  it.each([
    ['/v1/air?rh=50', 'tdb'],
    ['/v1/air?tdb=abc&rh=50', 'tdb'],
    ['/v1/air?tdb=20', 'rh'],
    ['/v1/air?tdb=20&rh=50&twb=10', 'rh'],
    ['/v1/air?tdb=20&rh=50&pressure=90&elevation=100', 'pressure'],
    ['/v1/air?tdb=20&rh=50&bogus=1', 'bogus'],
  ])('%s is a 400 naming %s', async (url, field) => {
    const res = await app.request(url)
    expect(res.status).toBe(400)
    const body = await problem(res)
    expect(JSON.stringify(body.errors)).toContain(field)
  })

  it.each([
    ['/v1/air?tdb=20&rh=120', 'relative humidity'],
    ['/v1/air?tdb=20&twb=25', 'wet bulb'],
    ['/v1/air?tdb=20&tdp=25', 'dew point'],
    ['/v1/air?tdb=20&rh=50&pressure=101325', 'pressure'],
  ])('%s is a 400 whose detail names the %s', async (url, words) => {
    const res = await app.request(url)
    expect(res.status).toBe(400)
    expect((await problem(res)).detail).toContain(words)
  })
})

describe('service routes', () => {
  it('GET /healthz', async () => {
    const res = await app.request('/healthz')
    expect(await res.json()).toEqual({ ok: true, service: 'dryhours' })
  })
  it('unknown routes are a 404 problem', async () => {
    const res = await app.request('/v2/nothing')
    expect(res.status).toBe(404)
    await problem(res)
  })
  it('a body over the configured limit is a 413 problem, with or without content-length', async () => {
    const small = createApp({ maxBodyBytes: 1000 })
    const res = await small.request('/v1/air?tdb=20&rh=50', { method: 'POST', body: 'x'.repeat(5000) })
    expect(res.status).toBe(413)
    await problem(res)
    const stream = new ReadableStream({
      start(controller) {
        controller.enqueue(new TextEncoder().encode('y'.repeat(3000)))
        controller.close()
      },
    })
    const res2 = await small.request('/v1/air', {
      method: 'POST',
      body: stream,
      duplex: 'half',
    } as RequestInit)
    expect(res2.status).toBe(413)
  })
  it('sends security headers (CSP with frame-ancestors, nosniff)', async () => {
    const res = await app.request('/docs')
    expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'")
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('access-control-allow-origin')).toBeNull()
  })
})
