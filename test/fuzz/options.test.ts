/**
 * Fuzzing the options: generated `options` JSON parts for POST /v1/assess and /v1/compare (valid
 * values, wrong types, out-of-range numbers and extra keys mixed), and generated query strings for
 * every GET route and the raw-body POST routes. Every answer has status < 500 and a problem-details
 * body for every 4xx.
 *
 * CI: fixed seed, small run counts. Longer local mode:
 *   DRYHOURS_FUZZ_RUNS=2000 npx vitest run test/fuzz
 * (and DRYHOURS_FUZZ_SEED=<n> for another seed).
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { DRYING_METHOD_KINDS, FUEL_IDS } from '../../src/drying/method.ts'
import { productById, productIds } from '../../src/product/catalogue.ts'
import { anyJson, numberText } from './arbitraries.ts'
import { expectSaneAnswer, fuzzParams, fuzzTimeout, get, post } from './fuzz-support.ts'

/** Four weeks of invented July weather (enough for a month of data and a 10-day batch). */
function julyFile(meanRh: number): string {
  const rows = ['time,temp_c,rh_pct,ghi_wm2,wind_ms,rain_mm']
  for (let h = 0; h < 24 * 28; h++) {
    const hour = h % 24
    const phase = Math.sin(((hour - 9) / 24) * 2 * Math.PI)
    const ghi = hour >= 6 && hour <= 18 ? Math.round(900 * Math.sin(((hour - 6) / 12) * Math.PI)) : 0
    const stamp = new Date(Date.UTC(2024, 6, 1, h)).toISOString().slice(0, 16)
    rows.push(
      `${stamp}Z,${(24 + 10 * phase).toFixed(1)},${(meanRh - 20 * phase).toFixed(0)},${ghi},${(2 + Math.sin(h)).toFixed(1)},${h % 97 === 0 ? 1.2 : 0}`,
    )
  }
  return `${rows.join('\n')}\n`
}
const JULY = julyFile(45)
const JULY_HUMID = julyFile(70)

/** Either a plausible value for the field or anything JSON can carry. */
const orAnything = <T>(plausible: fc.Arbitrary<T>) =>
  fc.oneof({ weight: 4, arbitrary: plausible as fc.Arbitrary<unknown> }, { weight: 1, arbitrary: anyJson })

const monthDay = fc
  .tuple(fc.integer({ min: 0, max: 13 }), fc.integer({ min: 0, max: 32 }))
  .map(([m, d]) => `${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`)

const methodValue = fc.oneof(
  fc.constantFrom(...DRYING_METHOD_KINDS),
  fc.record(
    {
      kind: orAnything(fc.constantFrom(...DRYING_METHOD_KINDS)),
      loadingKgPerM2: orAnything(fc.double({ min: -10, max: 300, noNaN: true })),
      setPointC: orAnything(fc.double({ min: -10, max: 150, noNaN: true })),
      heaterEfficiency: orAnything(fc.double({ min: -1, max: 2, noNaN: true })),
      coveredAtNight: orAnything(fc.boolean()),
      collectorAreaM2PerTonne: orAnything(fc.double({ min: 0, max: 20_000, noNaN: true })),
      airFlowKgPerSPerTonne: orAnything(fc.double({ min: 0, max: 60, noNaN: true })),
    },
    { requiredKeys: ['kind'] },
  ),
)

/** A profile variant of a catalogue product with random numbers, or a catalogue profile with a random isotherm. */
const productValue = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...productIds()) },
  {
    weight: 1,
    arbitrary: fc.record(
      {
        variantOf: fc.constantFrom('figs', 'wheat', 'apricot-halves'),
        id: fc.constantFrom('my-variant', 'Bad Id', ''),
        targetMoistureWbPct: fc.double({ min: -5, max: 120, noNaN: true }),
        initialMoistureWbPct: fc.double({ min: -5, max: 120, noNaN: true }),
        thicknessMm: fc.double({ min: -1, max: 2000, noNaN: true }),
        loadingKgPerM2: fc.double({ min: -1, max: 3000, noNaN: true }),
      },
      { requiredKeys: ['variantOf', 'id'] },
    ),
  },
  {
    weight: 1,
    arbitrary: fc
      .record({
        model: fc.constantFrom(
          'gab',
          'modified-henderson',
          'modified-chung-pfost',
          'modified-halsey',
          'modified-oswin',
        ),
        a: fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        b: fc.double({ min: -1e3, max: 1e3, noNaN: true }),
        c: fc.double({ min: -1e3, max: 1e3, noNaN: true }),
      })
      .map(({ model, a, b, c }) => {
        const p = structuredClone(productById('figs')) as unknown as {
          id: string
          isotherm: { desorption: { equation: unknown } }
        }
        p.id = 'fuzzed-isotherm'
        p.isotherm.desorption.equation =
          model === 'gab'
            ? { model, xm0: Math.abs(a) / 1e6 + 1e-3, c0: Math.abs(b) + 0.1, k0: Math.abs(c) / 500 }
            : { model, a, b, c }
        return p
      }),
  },
  { weight: 1, arbitrary: anyJson },
)

/** An options object: each field present or not, plausible or anything, plus stray keys. */
const optionsObject = fc
  .record(
    {
      product: productValue,
      method: methodValue,
      targetWbPct: orAnything(fc.double({ min: -10, max: 110, noNaN: true })),
      initialWbPct: orAnything(fc.double({ min: -10, max: 110, noNaN: true })),
      thicknessMm: orAnything(fc.double({ min: -1, max: 600, noNaN: true })),
      seasonStart: orAnything(fc.constantFrom('07-01', '07-02', '06-30')),
      seasonEnd: orAnything(fc.oneof(fc.constantFrom('07-02', '07-05', '06-29'), monthDay)),
      startStepDays: orAnything(fc.integer({ min: -1, max: 70 })),
      startHourLocal: orAnything(fc.integer({ min: -1, max: 25 })),
      deadlineDays: orAnything(fc.double({ min: -1, max: 400, noNaN: true })),
      maxDays: orAnything(fc.double({ min: 0, max: 400, noNaN: true })),
      batchKgFresh: orAnything(fc.double({ min: -1, max: 2e7, noNaN: true })),
      fuel: orAnything(fc.constantFrom(...FUEL_IDS)),
      fuelPrices: orAnything(
        fc.dictionary(fc.constantFrom(...FUEL_IDS, 'coal'), fc.double({ min: -1, max: 2e6, noNaN: true }), {
          maxKeys: 3,
        }),
      ),
      thresholds: orAnything(
        fc.record(
          {
            minProductTempC: fc.double({ min: -30, max: 50, noNaN: true }),
            minDeficitGPerKg: fc.double({ min: -1, max: 30, noNaN: true }),
          },
          { requiredKeys: [] },
        ),
      ),
      weather: orAnything(
        fc.record(
          {
            latitudeDeg: fc.double({ min: -100, max: 100, noNaN: true }),
            longitudeDeg: fc.double({ min: -200, max: 200, noNaN: true }),
            utcOffsetHours: fc.double({ min: -20, max: 20, noNaN: true }),
            siteName: fc.string({ maxLength: 30 }),
          },
          { requiredKeys: [] },
        ),
      ),
      criterion: orAnything(fc.constantFrom('probability', 'p10-hours', 'heat')),
      strayKey: fc.string({ maxLength: 8 }),
      stray: anyJson,
    },
    { requiredKeys: ['product', 'method', 'seasonStart', 'seasonEnd', 'maxDays', 'deadlineDays'] },
  )
  .map((o) => {
    const { strayKey, stray, ...rest } = o as Record<string, unknown>
    return typeof strayKey === 'string' && strayKey !== '' ? { ...rest, [strayKey]: stray } : rest
  })

/** Options the API accepts (valid ranges), so the property also exercises the engine and the renderers. */
const validOptions = fc.record(
  {
    product: fc.constantFrom(...productIds()),
    method: fc.oneof(
      fc.constantFrom(...DRYING_METHOD_KINDS.filter((k) => k !== 'solar-cabinet')),
      fc.record({
        kind: fc.constant('open-air'),
        loadingKgPerM2: fc.double({ min: 0.5, max: 200, noNaN: true }),
        coveredAtNight: fc.boolean(),
      }),
      fc.record({
        kind: fc.constant('heated'),
        setPointC: fc.double({ min: 30, max: 90, noNaN: true }),
        heaterEfficiency: fc.double({ min: 0.3, max: 1, noNaN: true }),
      }),
    ),
    seasonStart: fc.constant('07-01'),
    seasonEnd: fc.constantFrom('07-01', '07-02', '07-03'),
    maxDays: fc.integer({ min: 10, max: 20 }),
    deadlineDays: fc.integer({ min: 1, max: 10 }),
    batchKgFresh: fc.double({ min: 1, max: 1e7, noNaN: true }),
    fuel: fc.constantFrom(...FUEL_IDS),
    fuelPrices: fc.dictionary(fc.constantFrom(...FUEL_IDS), fc.double({ min: 0, max: 1e6, noNaN: true }), {
      maxKeys: 2,
    }),
    weather: fc.record({ siteName: fc.string({ maxLength: 30 }) }, { requiredKeys: [] }),
  },
  { requiredKeys: ['product', 'method', 'seasonStart', 'seasonEnd', 'maxDays', 'deadlineDays'] },
)

function multipart(options: unknown, files: string[]): FormData {
  const form = new FormData()
  for (const [i, f] of files.entries())
    form.append(files.length > 1 ? 'site' : 'file', new Blob([f]), `site-${i}.csv`)
  form.append('options', JSON.stringify(options))
  return form
}

describe('fuzz: options', () => {
  it('options JSON parts for /v1/assess (json, csv and html answers)', {
    timeout: fuzzTimeout(40),
  }, async () => {
    const seen = new Set<number>()
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(validOptions, optionsObject),
        fc.constantFrom('', '?format=csv', '?format=html'),
        fc.boolean(),
        async (options, format, humid) => {
          const res = await post(`/v1/assess${format}`, multipart(options, [humid ? JULY_HUMID : JULY]))
          seen.add(await expectSaneAnswer(res, '/v1/assess'))
        },
      ),
      fuzzParams(40),
    )
    expect(seen.has(200)).toBe(true)
    expect(seen.has(400)).toBe(true)
  })

  it('options JSON parts for /v1/compare with two sites', { timeout: fuzzTimeout(15) }, async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(validOptions, optionsObject), async (options) => {
        await expectSaneAnswer(
          await post('/v1/compare', multipart(options, [JULY, JULY_HUMID])),
          '/v1/compare',
        )
      }),
      fuzzParams(15),
    )
  })

  it('options parts that are any JSON text (or not JSON) for /v1/inspect and /v1/assess', {
    timeout: fuzzTimeout(40),
  }, async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.json(), fc.string({ maxLength: 40 })), async (raw) => {
        for (const route of ['/v1/inspect', '/v1/assess']) {
          const form = new FormData()
          form.append('file', new Blob([JULY]), 'july.csv')
          form.append('options', raw)
          await expectSaneAnswer(await post(route, form), route)
        }
      }),
      fuzzParams(40),
    )
  })
})

/** Query strings of known keys with hostile values, and unknown keys. */
function queryOf(keys: readonly string[]) {
  return fc
    .array(
      fc.tuple(
        fc.oneof(
          { weight: 5, arbitrary: fc.constantFrom(...keys) },
          { weight: 1, arbitrary: fc.string({ maxLength: 6 }) },
        ),
        fc.oneof(numberText, fc.string({ maxLength: 12 })),
      ),
      { maxLength: 6 },
    )
    .map((pairs) => new URLSearchParams(pairs).toString())
}

describe('fuzz: query strings', () => {
  it('GET /v1/air, /v1/equilibrium and /v1/products/:id', { timeout: fuzzTimeout(80) }, async () => {
    const air = queryOf(['tdb', 'rh', 'twb', 'tdp', 'w', 'elevation', 'pressure'])
    const eq = queryOf(['product', 'tdb', 'rh', 'moistureWb', 'direction'])
    await fc.assert(
      fc.asyncProperty(air, eq, fc.string({ maxLength: 20 }), async (qa, qe, id) => {
        await expectSaneAnswer(await get(`/v1/air?${qa}&tdb=20`), '/v1/air')
        await expectSaneAnswer(await get(`/v1/air?${qa}`), '/v1/air')
        await expectSaneAnswer(await get(`/v1/equilibrium?product=figs&${qe}`), '/v1/equilibrium')
        await expectSaneAnswer(await get(`/v1/products/${encodeURIComponent(id)}`), '/v1/products/:id')
      }),
      fuzzParams(80),
    )
  })

  it('query options of the raw-body POST routes (/v1/inspect, /v1/assess, /v1/fit, /v1/energy-chart)', {
    timeout: fuzzTimeout(30),
  }, async () => {
    const inspectQ = queryOf([
      'lat',
      'lon',
      'elevation',
      'utcOffset',
      'tz',
      'map',
      'dateOrder',
      'labels',
      'windHeight',
      'siteName',
    ])
    const assessQ = queryOf([
      'targetWb',
      'initialWb',
      'thickness',
      'stepDays',
      'batchKg',
      'fuel',
      'price',
      'format',
      'units',
      'table',
      'lat',
      'utcOffset',
    ])
    const fitQ = queryOf([
      'dryMass',
      'initialWb',
      'finalWb',
      'thickness',
      'shape',
      'targetWb',
      'product',
      'id',
    ])
    const energyQ = queryOf([
      'baseline',
      'fuel',
      'dryingTempC',
      'utcOffsetHours',
      'elevationM',
      'product',
      'format',
      'table',
    ])
    const weighings = 'elapsed_h,mass_g\n0,1000\n1,780\n2,610\n3,490\n4,400\n6,290\n8,230\n10,200\n'
    await fc.assert(
      fc.asyncProperty(inspectQ, assessQ, fitQ, energyQ, async (qi, qa, qf, qe) => {
        await expectSaneAnswer(await post(`/v1/inspect?${qi}`, JULY, 'text/csv'), '/v1/inspect')
        const coarse = 'product=figs&method=open-air&start=07-01&end=07-02&maxDays=10&deadlineDays=10'
        await expectSaneAnswer(await post(`/v1/assess?${coarse}&${qa}`, JULY, 'text/csv'), '/v1/assess')
        await expectSaneAnswer(await post(`/v1/fit?${qf}`, weighings, 'text/csv'), '/v1/fit')
        await expectSaneAnswer(
          await post(`/v1/energy-chart?${qe}`, weighings, 'text/csv'),
          '/v1/energy-chart',
        )
      }),
      fuzzParams(30),
    )
  })
})
