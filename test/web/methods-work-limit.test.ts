/**
 * Methods side by side under the batch-hour limit: the page (several methods ticked on the assess form) and the
 * API (a methods list on /v1/assess) ask the same estimate of the engine's planner (analysis/plan.ts
 * `estimateWork` over analysis/compare-methods.ts `methodOptionSets`), so the same request is accepted or refused
 * alike on both, also when the methods' own plans cost different amounts (a grain bin beside open air).
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { AssessOptions } from '../../src/analysis/assess.ts'
import { estimateBatchHours } from '../../src/analysis/plan.ts'
import { createApp } from '../../src/api/app.ts'
import { productById } from '../../src/product/catalogue.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

const coast = readFileSync('climate-demo/gullhaven-coast-2022-2024.epw')
const season = { seasonStart: '09-15', seasonEnd: '09-22' }

function pageForm(): FormData {
  const f = new FormData()
  const fields: [string, string][] = [
    ['product', 'shelled-corn'],
    ['method', 'open-air'],
    ['method', 'natural-air-bin'],
    ['binAirflows', '1'],
    ['seasonStart', season.seasonStart],
    ['seasonEnd', season.seasonEnd],
    ['format', 'json'],
  ]
  for (const [k, v] of fields) f.append(k, v)
  f.append('file', new File([coast as Uint8Array<ArrayBuffer>], 'coast.epw'))
  return f
}

const apiUrl = `/v1/assess?product=shelled-corn&method=open-air,natural-air-bin&airflow=1&start=${season.seasonStart}&end=${season.seasonEnd}&format=json`

/** The planner's cost of each method on its own, with its own defaults. */
function perMethod(): number[] {
  const hours = readWeather(new TextDecoder().decode(coast), {}).series.hours
  const shared = { product: productById('shelled-corn'), ...season }
  const methods: AssessOptions['method'][] = [
    { kind: 'open-air' } as AssessOptions['method'],
    { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1] } as AssessOptions['method'],
  ]
  return methods.map((method) => estimateBatchHours({ ...shared, method }, [hours]))
}

async function decisions(maxBatchHours: number) {
  const app = createApp({ maxBatchHours })
  const page = await app.request('/report', { method: 'POST', body: pageForm() })
  const api = await app.request(apiUrl, {
    method: 'POST',
    body: coast as Uint8Array<ArrayBuffer>,
    headers: { 'content-type': 'text/plain' },
  })
  return { page, api }
}

describe('the batch-hour limit of methods side by side', () => {
  const [openAir, bin] = perMethod()
  const total = openAir + bin

  it('the two methods cost different amounts by their own plans (so counting one of them twice is wrong)', () => {
    expect(openAir).toBeGreaterThan(0)
    expect(bin).toBeGreaterThan(0)
    expect(bin).not.toBe(openAir)
  })

  it('just over the limit: page and API both refuse, naming the limit in plain words', async () => {
    const { page, api } = await decisions(total - 1)
    expect(page.status).toBe(422)
    expect(api.status).toBe(422)
    const pageBody = (await page.json()) as { type: string; detail: string }
    const apiBody = (await api.json()) as { type: string; detail: string }
    for (const b of [pageBody, apiBody]) {
      expect(b.type).toMatch(/too-much-work$/)
      // both amounts in whole batch-hours (in millions they would read the same)
      const whole = (x: number) => String(x).replace(/\B(?=(\d{3})+$)/g, ',')
      expect(b.detail).toContain(`about ${whole(total)} batch-hours`)
      expect(b.detail).toContain(
        `more than this server's limit of ${whole(total - 1)} batch-hours per request`,
      )
      expect(b.detail).toContain('summed over 2 methods side by side')
      expect(b.detail).toContain('fewer methods side by side')
    }
    // each names the levers as its user knows them: the API by its query names, the page by its labels
    expect(apiBody.detail).toContain('(start)')
    expect(apiBody.detail).toContain('(stepDays)')
    expect(pageBody.detail).toContain('(“First start day”)')
    expect(pageBody.detail).toContain('(“Airflows to compare”)')
    expect(pageBody.detail).not.toMatch(/startStepDays|maxDays|stepDays/)
  }, 120_000)

  it('at the limit: page and API both accept and run both methods', async () => {
    const { page, api } = await decisions(total)
    expect(api.status).toBe(200)
    expect(page.status).toBe(200)
    const kinds = (c: { assessments: { method: { kind: string } }[] }) =>
      c.assessments.map((a) => a.method.kind)
    expect(kinds(await api.json())).toEqual(['open-air', 'natural-air-bin'])
    expect(kinds(await page.json())).toEqual(['open-air', 'natural-air-bin'])
  }, 180_000)
})
