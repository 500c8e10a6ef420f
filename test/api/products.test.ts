import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { PRODUCT_CATALOGUE } from '../../src/product/catalogue.ts'

const app = createApp()

async function expectProblem(res: Response, status: number) {
  expect(res.status).toBe(status)
  expect(res.headers.get('content-type')).toBe('application/problem+json')
  const body = (await res.json()) as { status: number; detail: string }
  expect(body.status).toBe(status)
  return body
}

describe('GET /v1/products', () => {
  it('lists every catalogue profile', async () => {
    const body = (await (await app.request('/v1/products')).json()) as { id: string }[]
    expect(body.map((p) => p.id)).toEqual(PRODUCT_CATALOGUE.map((p) => p.id))
    expect(body.length).toBeGreaterThanOrEqual(15)
  })
  it('shows one profile with sources, and 404 for an unknown id', async () => {
    const res = await app.request('/v1/products/grapes-to-raisins')
    const p = (await res.json()) as { id: string; targetMoistureWbPct: { source: string } }
    expect(p.id).toBe('grapes-to-raisins')
    expect(p.targetMoistureWbPct.source.length).toBeGreaterThan(5)
    await expectProblem(await app.request('/v1/products/no-such-fruit'), 404)
  })
  it('an older id still accepted gives the profile it now names (chili-peppers-unblanched → chili-peppers)', async () => {
    const res = await app.request('/v1/products/chili-peppers-unblanched')
    expect(res.status).toBe(200)
    const p = (await res.json()) as { id: string; name: string }
    expect(p.id).toBe('chili-peppers')
    expect(p.name).toMatch(/unblanched/)
  })
})

describe('GET /v1/equilibrium', () => {
  it('shelled corn at 15.6 °C and 80 % RH → about 16.1 % wb (ASABE D245 modified Chung–Pfost; extension EMC tables)', async () => {
    const body = (await (
      await app.request('/v1/equilibrium?product=shelled-corn&tdb=15.6&rh=80')
    ).json()) as {
      equilibriumMoistureWbPct: number
      model: string
    }
    expect(Math.abs(body.equilibriumMoistureWbPct - 16.1)).toBeLessThan(0.3)
    expect(body.model).toBe('modified-chung-pfost')
  })
  it('inverts to the equilibrium RH at a moisture: round trip within 0.01 % RH', async () => {
    const a = (await (await app.request('/v1/equilibrium?product=wheat&tdb=25&rh=60')).json()) as {
      equilibriumMoistureWbPct: number
    }
    const b = (await (
      await app.request(`/v1/equilibrium?product=wheat&tdb=25&moistureWb=${a.equilibriumMoistureWbPct}`)
    ).json()) as { equilibriumRelativeHumidityPct: number }
    expect(Math.abs(b.equilibriumRelativeHumidityPct - 60)).toBeLessThan(0.01)
  })
  it.each([
    ['/v1/equilibrium?product=wheat&tdb=25', 400],
    ['/v1/equilibrium?product=wheat&tdb=25&rh=60&moistureWb=12', 400],
    ['/v1/equilibrium?product=wheat&tdb=hot&rh=60', 400],
    ['/v1/equilibrium?product=wheat&tdb=25&rh=0', 400],
    ['/v1/equilibrium?product=nothing&tdb=25&rh=60', 404],
  ])('%s → %i problem', async (url, status) => {
    await expectProblem(await app.request(url), status)
  })
})

describe('POST /v1/fit', () => {
  // Invented weighings (a falling exponential toward about 200 g), for the request plumbing only.
  const csv = 'elapsed_h,mass_g\n0,1000\n1,780\n2,610\n3,490\n4,400\n6,290\n8,230\n10,200\n'
  it('fits a raw CSV body and returns a profile for the named product', async () => {
    const res = await app.request('/v1/fit?dryMass=150&thickness=5&targetWb=20&product=apple-slices', {
      method: 'POST',
      headers: { 'content-type': 'text/csv' },
      body: csv,
    })
    expect(res.status).toBe(200)
    const body = (await res.json()) as { best: { model: string; r2: number }; profile: { id: string } }
    expect(['lewis', 'page', 'diffusion']).toContain(body.best.model)
    expect(body.profile.id).toBe('apple-slices-calibrated')
  })
  it('accepts multipart with an options part', async () => {
    const form = new FormData()
    form.append('file', new Blob([csv], { type: 'text/csv' }), 'tray.csv')
    form.append('options', JSON.stringify({ dryMass: '150' }))
    const res = await app.request('/v1/fit', { method: 'POST', body: form })
    expect(res.status).toBe(200)
  })
  it('415 for JSON, 400 without a reference mass, 422 for a file with too few weighings', async () => {
    await expectProblem(
      await app.request('/v1/fit?dryMass=150', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: '{}',
      }),
      415,
    )
    await expectProblem(
      await app.request('/v1/fit', { method: 'POST', headers: { 'content-type': 'text/csv' }, body: csv }),
      400,
    )
    await expectProblem(
      await app.request('/v1/fit?dryMass=150', {
        method: 'POST',
        headers: { 'content-type': 'text/csv' },
        body: 'elapsed_h,mass_g\n0,1000\n1,800\n',
      }),
      422,
    )
  })
})
