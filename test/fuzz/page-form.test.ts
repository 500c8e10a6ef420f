/**
 * Fuzzing the page's form post (POST /report): generated form fields with a small weather file.
 * Every answer has status < 500; the script and download formats (json, csv, bundle) answer 4xx as
 * problem details; the page and html formats answer 4xx as an HTML page with the message.
 *
 * CI: fixed seed, small run counts. Longer local mode:
 *   DRYHOURS_FUZZ_RUNS=2000 npx vitest run test/fuzz
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { DRYING_METHOD_KINDS } from '../../src/drying/method.ts'
import { productIds } from '../../src/product/catalogue.ts'
import { numberText } from './arbitraries.ts'
import { fuzzApp, fuzzParams, fuzzTimeout } from './fuzz-support.ts'

function julyFile(): string {
  const rows = ['time,temp_c,rh_pct,ghi_wm2,wind_ms']
  for (let h = 0; h < 24 * 28; h++) {
    const hour = h % 24
    const phase = Math.sin(((hour - 9) / 24) * 2 * Math.PI)
    const ghi = hour >= 6 && hour <= 18 ? Math.round(900 * Math.sin(((hour - 6) / 12) * Math.PI)) : 0
    const stamp = new Date(Date.UTC(2024, 6, 1, h)).toISOString().slice(0, 16)
    rows.push(
      `${stamp}Z,${(24 + 10 * phase).toFixed(1)},${(45 - 20 * phase).toFixed(0)},${ghi},${(2 + Math.sin(h)).toFixed(1)}`,
    )
  }
  return `${rows.join('\n')}\n`
}
const JULY = julyFile()

const text = (plausible: fc.Arbitrary<string>) =>
  fc.oneof({ weight: 3, arbitrary: plausible }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) })

const formFields = fc.record(
  {
    product: text(fc.constantFrom(...productIds())),
    method: text(fc.constantFrom(...DRYING_METHOD_KINDS)),
    seasonStart: text(fc.constantFrom('07-01', '07-02', '13-40')),
    seasonEnd: text(fc.constantFrom('07-02', '07-03')),
    utcOffsetHours: text(numberText),
    deadlineDays: text(numberText),
    targetWbPct: text(numberText),
    latitudeDeg: text(numberText),
    fuelPrice: text(numberText),
    siteName: fc.string({ maxLength: 30 }),
    mapping: fc.string({ maxLength: 20 }),
    timeZone: text(fc.constantFrom('Europe/Madrid', 'UTC', 'Mars/Olympus')),
    format: fc.constantFrom('page', 'html', 'csv', 'json', 'bundle', 'pdf'),
  },
  { requiredKeys: ['product', 'method', 'format'] },
)

/** Forms the page accepts (so the report path is exercised), with any answer format and site name. */
const validForm = fc.record({
  product: fc.constantFrom('figs', 'apricot-halves', 'grapes-to-raisins'),
  method: fc.constantFrom('open-air', 'shade', 'heated'),
  seasonStart: fc.constant('07-01'),
  seasonEnd: fc.constantFrom('07-01', '07-02'),
  utcOffsetHours: fc.constantFrom('0', '1', '-5'),
  siteName: fc.string({ maxLength: 30 }),
  format: fc.constantFrom('page', 'html', 'csv', 'json', 'bundle'),
})

describe('fuzz: the page form', () => {
  it('generated form posts to /report', { timeout: fuzzTimeout(25) }, async () => {
    const seen = new Set<number>()
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(validForm, formFields),
        fc.string({ maxLength: 20 }),
        async (fields, fileName) => {
          const form = new FormData()
          for (const [k, v] of Object.entries(fields)) form.set(k, v)
          form.append('file', new File([JULY], fileName || 'july.csv', { type: 'text/csv' }))
          const res = await fuzzApp.request('/report', { method: 'POST', body: form })
          const body = await res.text()
          seen.add(res.status)
          expect(res.status).toBeLessThan(500)
          if (res.status >= 400) {
            const type = res.headers.get('content-type') ?? ''
            if (['csv', 'json', 'bundle'].includes(fields.format)) {
              expect(type).toBe('application/problem+json')
              expect((JSON.parse(body) as { status: number }).status).toBe(res.status)
            } else expect(type).toMatch(/^text\/html/)
          }
        },
      ),
      fuzzParams(25),
    )
    console.info(`POST /report statuses seen: ${[...seen].sort().join(', ')}`)
    expect(seen.has(200)).toBe(true)
  })
})
