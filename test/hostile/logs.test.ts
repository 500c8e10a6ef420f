/**
 * Hostile batch logs (POST /v1/energy-chart) and weighings files (POST /v1/fit): empty, binary,
 * 10 MB of commas, hostile numbers, and a log far longer than any dryer keeps.
 */
import { describe, expect, it } from 'vitest'
import { expectProblem, garbageBytes, post } from './hostile-helpers.ts'

const LOG_HEADER = 'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh'
const WEIGHINGS = 'elapsed_h,mass_g\n0,1000\n1,780\n2,610\n3,490\n4,400\n6,290\n8,230\n10,200\n'

/** `n` invented daily batches from 2026-01-01; `energy(i)` gives the kWh of batch i. */
function batchLog(n: number, energy = (i: number) => 1000 + ((i * 37) % 300)): string {
  const rows = [LOG_HEADER]
  for (let i = 0; i < n; i++) {
    const start = new Date(Date.UTC(2026, 0, 1) + i * 86_400_000).toISOString().slice(0, 16)
    rows.push(`${start}Z,4,10000,9000,${energy(i)}`)
  }
  return `${rows.join('\n')}\n`
}

describe('hostile batch logs and weighings', () => {
  it.each([
    ['empty', ''],
    ['a header only', `${LOG_HEADER}\n`],
    [
      'NaN and 1e309 energies',
      `${LOG_HEADER}\n2026-09-01T08:00Z,4,10000,9000,NaN\n2026-09-02T08:00Z,4,10000,9000,1e309\n`,
    ],
  ])('energy-chart log %s: 422 naming the log', async (_name, body) => {
    const p = await expectProblem(await post('/v1/energy-chart', body, 'text/csv'), [422])
    expect(p.detail).toMatch(/^log: /)
  })

  it('energy-chart log with 10 MB of commas on one line: 413 naming the column limit', async () => {
    const body = `${LOG_HEADER}\n${'1,'.repeat(5 * 1024 * 1024)}`
    const p = await expectProblem(await post('/v1/energy-chart', body, 'text/csv'), [413])
    expect(p.detail).toMatch(/limit of 1000 columns/)
  })

  it('energy-chart: binary garbage is a 422', async () => {
    await expectProblem(await post('/v1/energy-chart', garbageBytes(8192), 'application/octet-stream'), [422])
  })

  it('energy-chart: a weather part with 10 MB of commas on one line is a 413 (the column limit of weather files)', async () => {
    const form = new FormData()
    form.append('log', new Blob([batchLog(10)]), 'log.csv')
    form.append('weather', new Blob([`time,temp_c,rh_pct\n${'1,'.repeat(5 * 1024 * 1024)}`]), 'weather.csv')
    const p = await expectProblem(await post('/v1/energy-chart', form), [413])
    expect(p.detail).toMatch(/columns/)
  })

  it('energy-chart: a 400-batch log is answered with one point per batch', async () => {
    const res = await post('/v1/energy-chart', batchLog(400), 'text/csv')
    expect(res.status).toBe(200)
    const body = (await res.json()) as { batches: unknown[] }
    expect(body.batches).toHaveLength(400)
  })

  // Long logs once overflowed the call stack (Math.min(...array)); they must give a result or a clear 4xx.
  it('energy-chart: 50,000 batches do not overflow the stack', {
    timeout: 60_000,
  }, async () => {
    // A saw-tooth energy (1000 + i mod 300 kWh) signals in most monitored batches.
    const res = await post(
      '/v1/energy-chart',
      batchLog(50_000, (i) => 1000 + (i % 300)),
      'text/csv',
    )
    const text = await res.text()
    expect(text).not.toMatch(/call stack/)
  })

  it.each([
    ['empty', ''],
    ['binary garbage', garbageBytes(4096)],
    ['10 MB of commas', `elapsed_h,mass_g\n${'1,'.repeat(5 * 1024 * 1024)}`],
    ['masses of 1e309 and NaN', 'elapsed_h,mass_g\n0,1e309\n1,NaN\n2,500\n'],
    ['time running backwards', 'elapsed_h,mass_g\n0,1000\n2,700\n1,800\n3,600\n'],
  ])('fit: weighings %s is a 4xx', async (_name, body) => {
    await expectProblem(await post('/v1/fit?dryMass=150', body, 'text/csv'))
  })

  it.each(['dryMass=-150', 'dryMass=1e309', 'dryMass=0x10', 'initialWb=150', 'dryMass=150&initialWb=80'])(
    'fit: %s is a 4xx naming the problem',
    async (q) => {
      await expectProblem(await post(`/v1/fit?${q}`, WEIGHINGS, 'text/csv'))
    },
  )
})
