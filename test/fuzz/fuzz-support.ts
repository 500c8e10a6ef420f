/**
 * Shared pieces of the fuzz tests: run counts and seed (fixed in CI, longer by environment variable),
 * the app under test, and the checks every answer must pass.
 *
 * CI (default): a fixed seed and small run counts, the whole folder well under a minute.
 * Longer local mode: `DRYHOURS_FUZZ_RUNS=2000 npx vitest run test/fuzz` runs every property 2000 times;
 * `DRYHOURS_FUZZ_SEED=<n>` picks another seed (a failure prints its seed and path to replay it).
 */
import { expect } from 'vitest'
import { createApp } from '../../src/api/app.ts'

const envRuns = Number(process.env.DRYHOURS_FUZZ_RUNS)
const envSeed = Number(process.env.DRYHOURS_FUZZ_SEED)

/** Fixed seed in CI so a red run can be replayed. */
export const FUZZ_SEED = Number.isInteger(envSeed) ? envSeed : 20_261_201

/** Runs of one property: `ci` unless DRYHOURS_FUZZ_RUNS is set. */
export function fuzzRuns(ci: number): number {
  return Number.isInteger(envRuns) && envRuns > 0 ? envRuns : ci
}

/** fast-check parameters for one property. */
export function fuzzParams(ci: number): { seed: number; numRuns: number; endOnFailure: boolean } {
  return { seed: FUZZ_SEED, numRuns: fuzzRuns(ci), endOnFailure: true }
}

/** Per-test timeout that grows with the run count (the loaded 2-core CI machine: about 150 ms a run). */
export function fuzzTimeout(ci: number): number {
  return Math.max(60_000, fuzzRuns(ci) * 400)
}

/**
 * The app under test. The batch-hours limit is lowered from the default 6 million to 300,000 so that a
 * generated season of daily starts with long batches is refused (422) instead of running for seconds;
 * the refusal path is part of what is fuzzed.
 */
export const fuzzApp = createApp({ maxBatchHours: 300_000 })

export function post(url: string, body: BodyInit, type?: string): Promise<Response> {
  return Promise.resolve(
    fuzzApp.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined }),
  )
}

export function get(url: string): Promise<Response> {
  return Promise.resolve(fuzzApp.request(url))
}

/**
 * Every answer: status < 500; a 4xx is RFC 9457 problem details (content type, status echoed, a detail,
 * no stack trace); a 200 of /v1/inspect keeps the row accounting (read = used + repaired + rejected).
 * Returns the status.
 */
export async function expectSaneAnswer(res: Response, route: string): Promise<number> {
  const text = await res.text()
  if (res.status >= 500) throw new Error(`${route}: status ${res.status}: ${text.slice(0, 300)}`)
  if (res.status >= 400) {
    expect(res.headers.get('content-type')).toBe('application/problem+json')
    const body = JSON.parse(text) as { status: number; detail: unknown; title: unknown }
    expect(body.status).toBe(res.status)
    expect(typeof body.detail).toBe('string')
    expect(typeof body.title).toBe('string')
    expect(/\sat\s/.test(text) && /\.ts:\d/.test(text)).toBe(false)
  } else if (route === '/v1/inspect') {
    expect(res.status).toBe(200)
    const body = JSON.parse(text) as {
      rows: { read: number; used: number; repaired: number; rejected: number; superseded: number }
    }
    expect(body.rows.used + body.rows.repaired + body.rows.rejected + body.rows.superseded).toBe(
      body.rows.read,
    )
    for (const v of Object.values(body.rows)) expect(Number.isInteger(v) && v >= 0).toBe(true)
  }
  return res.status
}
