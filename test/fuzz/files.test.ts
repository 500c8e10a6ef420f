/**
 * Fuzzing the file routes with generated files: CSV-ish text, mutated demo snippets and random bytes,
 * sent to POST /v1/inspect (and a few to POST /v1/assess with coarse options). Every answer has
 * status < 500, a problem-details body for every 4xx, and for every 200 of /v1/inspect the row
 * accounting read = used + repaired + rejected.
 *
 * CI: fixed seed, small run counts. Longer local mode:
 *   DRYHOURS_FUZZ_RUNS=2000 npx vitest run test/fuzz
 * (and DRYHOURS_FUZZ_SEED=<n> for another seed).
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { csvishText, mutatedDemoText, randomBytes } from './arbitraries.ts'
import { expectSaneAnswer, fuzzParams, fuzzTimeout, post } from './fuzz-support.ts'

const COARSE_QUERY =
  '/v1/assess?product=figs&method=open-air&start=07-01&end=07-02&stepDays=1&maxDays=10&deadlineDays=10'

describe('fuzz: weather files', () => {
  it('CSV-ish text to /v1/inspect (raw body)', { timeout: fuzzTimeout(60) }, async () => {
    const seen = new Set<number>()
    await fc.assert(
      fc.asyncProperty(csvishText, async (text) => {
        seen.add(await expectSaneAnswer(await post('/v1/inspect', text, 'text/csv'), '/v1/inspect'))
      }),
      fuzzParams(60),
    )
    // The generator reaches both outcomes: some files are read, some refused.
    expect(seen.has(200)).toBe(true)
    expect(seen.has(422)).toBe(true)
  })

  it('mutated demo snippets to /v1/inspect (multipart)', { timeout: fuzzTimeout(60) }, async () => {
    const seen = new Set<number>()
    await fc.assert(
      fc.asyncProperty(mutatedDemoText, fc.constantFrom('a.csv', 'b.epw', 'c.txt'), async (text, name) => {
        const form = new FormData()
        form.append('file', new Blob([text]), name)
        seen.add(await expectSaneAnswer(await post('/v1/inspect', form), '/v1/inspect'))
      }),
      fuzzParams(60),
    )
    expect(seen.has(200)).toBe(true)
  })

  it('random bytes (some behind a BOM) to /v1/inspect', { timeout: fuzzTimeout(60) }, async () => {
    await fc.assert(
      fc.asyncProperty(randomBytes, async (bytes) => {
        await expectSaneAnswer(await post('/v1/inspect', bytes, 'application/octet-stream'), '/v1/inspect')
      }),
      fuzzParams(60),
    )
  })

  it('CSV-ish text and mutated snippets to /v1/assess (coarse season)', {
    timeout: fuzzTimeout(25),
  }, async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(csvishText, mutatedDemoText), async (text) => {
        await expectSaneAnswer(await post(COARSE_QUERY, text, 'text/csv'), '/v1/assess')
      }),
      fuzzParams(25),
    )
  })

  it('random bytes as a weighings file (/v1/fit) and a batch log (/v1/energy-chart)', {
    timeout: fuzzTimeout(30),
  }, async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          randomBytes,
          csvishText.map((t) => new TextEncoder().encode(t)),
        ),
        async (bytes) => {
          await expectSaneAnswer(await post('/v1/fit?dryMass=150', bytes, 'text/csv'), '/v1/fit')
          await expectSaneAnswer(await post('/v1/energy-chart', bytes, 'text/csv'), '/v1/energy-chart')
        },
      ),
      fuzzParams(30),
    )
  })
})
