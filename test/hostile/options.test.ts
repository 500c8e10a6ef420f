/**
 * Hostile options: the multipart `options` JSON part with extra, missing or wrongly typed fields,
 * negative or absurd prices and loadings, and inline product profiles whose isotherm has no solution
 * at the air state.
 */
import { describe, expect, it } from 'vitest'
import { productById } from '../../src/product/catalogue.ts'
import { COARSE, COARSE_QUERY, expectProblem, inventedDays, multipart, post } from './hostile-helpers.ts'

/** Four weeks of July: enough data in the month to count as a year, and longer than season + maxDays. */
const DRY = inventedDays(28)
/** Humid days: RH 75–95 %, beyond K·aw = 1 for a GAB isotherm with K = 1.5. */
const HUMID = inventedDays(28, 20, 85, 10)
/** Desert days: RH 5–15 %, below where a Chung–Pfost isotherm with A = 100, C = 30 has a solution. */
const DESERT = inventedDays(28, 30, 10, 5)

const assess = (options: unknown, file = DRY, query = '') =>
  post(`/v1/assess${query}`, multipart(file, 'site.csv', options))

describe('options JSON part', () => {
  it('the coarse options are accepted (the baseline for the cases below)', async () => {
    // figs part-dried on the tree (40 % wb, as in the fig calibration run, test/experiments/cases.ts)
    const res = await assess({ ...COARSE, initialWbPct: 40 })
    expect(res.status).toBe(200)
    const body = (await res.json()) as { startDates: { daysToTarget: { median: number | null } }[] }
    expect(body.startDates.length).toBe(2)
    // Part-dried figs in hot dry air (24 ± 10 °C, 25–65 % RH) reach the target inside the 10 days.
    expect(body.startDates[0].daysToTarget.median).toBeGreaterThan(0)
  })

  it.each([
    ['an extra top-level field', { ...COARSE, colour: 'red' }, 'options.colour'],
    ['an extra weather field', { ...COARSE, weather: { lat: 5 } }, 'options.weather.lat'],
    [
      'an extra method parameter (misspelt loading)',
      { ...COARSE, method: { kind: 'open-air', loadingKgPerm2: 5 } },
      'options.method.loadingKgPerm2',
    ],
    [
      'an extra threshold',
      { ...COARSE, thresholds: { minProductTemp: 1 } },
      'options.thresholds.minProductTemp',
    ],
    [
      'an extra backup-heater field',
      { ...COARSE, backupHeater: { efficiency: 0.9 } },
      'options.backupHeater.efficiency',
    ],
    [
      'an unknown fuel price',
      { ...COARSE, fuelPrices: { unobtainium: 1 } },
      'options.fuelPrices.unobtainium',
    ],
  ])('%s: 400 naming the field', async (_name, options, path) => {
    const p = await expectProblem(await assess(options), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each([
    ['no product', { method: 'open-air' }, 'options.product'],
    ['no method', { product: 'figs' }, 'options.method'],
    ['an empty object', {}, 'options.product'],
  ])('%s: 400 naming the missing field', async (_name, options, path) => {
    const p = await expectProblem(await assess(options), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each([
    ['maxDays as a string', { ...COARSE, maxDays: '10' }, 'options.maxDays'],
    ['startStepDays not whole', { ...COARSE, startStepDays: 2.5 }, 'options.startStepDays'],
    ['seasonStart not MM-DD', { ...COARSE, seasonStart: '7/1' }, 'options.seasonStart'],
    [
      'method loading as text',
      { ...COARSE, method: { kind: 'open-air', loadingKgPerM2: 'lots' } },
      'options.method.loadingKgPerM2',
    ],
    ['method kind unknown', { ...COARSE, method: 'microwave' }, 'options.method'],
    ['product a number', { ...COARSE, product: 42 }, 'options.product'],
    [
      'weather latitude as text',
      { ...COARSE, weather: { latitudeDeg: 'north' } },
      'options.weather.latitudeDeg',
    ],
  ])('%s: 400 naming the field', async (_name, options, path) => {
    const p = await expectProblem(await assess(options), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each([
    ['an array', '[1,2]'],
    ['null', 'null'],
    ['a string', '"figs"'],
    ['a number', '42'],
    ['not JSON', '{product: figs'],
    ['empty', ''],
    ['deeply nested', `${'['.repeat(5000)}${']'.repeat(5000)}`],
  ])('options part that is %s: 400', async (_name, raw) => {
    await expectProblem(await post('/v1/assess', multipart(DRY, 'site.csv', undefined, raw)), [400])
  })

  it('an unknown product id: 400 listing the known ids', async () => {
    const p = await expectProblem(await assess({ ...COARSE, product: 'unobtainium' }), [400])
    expect(p.detail).toMatch(/figs/)
  })

  it('an unknown query parameter with a raw body: 400 naming it', async () => {
    const p = await expectProblem(await post(`${COARSE_QUERY}&colour=red`, DRY, 'text/csv'), [400])
    expect(p.detail).toMatch(/colour/)
  })
})

describe('prices and loadings', () => {
  it.each([
    ['a negative price', { fuelPrices: { propane: -1 } }, 'options.fuelPrices.propane'],
    ['an absurd price (1e300)', { fuelPrices: { propane: 1e300 } }, 'options.fuelPrices.propane'],
    [
      'a negative loading',
      { method: { kind: 'open-air', loadingKgPerM2: -5 } },
      'options.method.loadingKgPerM2',
    ],
    [
      'an absurd loading (1e9 kg/m²)',
      { method: { kind: 'open-air', loadingKgPerM2: 1e9 } },
      'options.method.loadingKgPerM2',
    ],
    ['a zero loading', { method: { kind: 'shade', loadingKgPerM2: 0 } }, 'options.method.loadingKgPerM2'],
    [
      'a zero heater efficiency',
      { method: { kind: 'heated', heaterEfficiency: 0 } },
      'options.method.heaterEfficiency',
    ],
    ['a negative batch', { batchKgFresh: -1000 }, 'options.batchKgFresh'],
    ['an absurd batch (1e12 kg)', { batchKgFresh: 1e12 }, 'options.batchKgFresh'],
  ])('%s: 400 naming the field', async (_name, extra, path) => {
    const p = await expectProblem(await assess({ ...COARSE, ...extra }), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each(['propane=-1', 'propane=1e309', 'propane=NaN', 'propane=0x10', 'unobtainium=1', 'propane'])(
    'query price %s: 400 naming price',
    async (price) => {
      const p = await expectProblem(
        await post(`${COARSE_QUERY}&price=${encodeURIComponent(price)}`, DRY, 'text/csv'),
        [400],
      )
      expect(p.errors?.[0]?.path).toBe('price')
    },
  )

  it('the largest accepted price (1e6 per unit) gives finite costs', async () => {
    const res = await assess({ ...COARSE, method: 'heated', fuelPrices: { propane: 1e6 } })
    expect(res.status).toBe(200)
    const text = await res.text()
    expect(text).not.toMatch(/Infinity|NaN/)
  })
})

describe('a profile whose isotherm has no solution at the air state', () => {
  const figs = productById('figs')
  const withIsotherm = (equation: unknown) => {
    const p = structuredClone(figs) as unknown as {
      id: string
      isotherm: { desorption: { equation: unknown } }
    }
    p.id = 'hostile-profile'
    p.isotherm.desorption.equation = equation
    return p
  }
  interface StartRow {
    probabilityWithinDeadline: number
    daysToTarget: { median: number | null }
  }

  it('GAB with K = 1.5 (diverges above RH 66.7 %) in humid air (RH 75–95 %): 422, or 200 where no start date reaches the target', async () => {
    const profile = withIsotherm({ model: 'gab', xm0: 0.1, c0: 3, k0: 1.5 })
    for (const query of ['', '?format=html', '?format=csv']) {
      const res = await assess({ ...COARSE, product: profile }, HUMID, query)
      if (res.status !== 200) {
        await expectProblem(res, [422])
        continue
      }
      if (query !== '') {
        expect(await res.text()).not.toMatch(/NaN/)
        continue
      }
      const body = (await res.json()) as { startDates: StartRow[] }
      for (const s of body.startDates) {
        expect(s.probabilityWithinDeadline).toBe(0)
        expect(s.daysToTarget.median).toBeNull()
      }
    }
  })

  it('Chung–Pfost with no positive moisture below RH 13.5 % in desert air (RH 5–15 %): 422 naming the model, or 200 without NaN', async () => {
    // rhMin = 100·exp(−A/(T + C)) = 100·exp(−100/50) ≈ 13.5 % at 20 °C (ASABE D245.6 form of the model).
    const profile = withIsotherm({ model: 'modified-chung-pfost', a: 100, b: 0.2, c: 30 })
    for (const query of ['', '?format=html', '?format=csv']) {
      const res = await assess({ ...COARSE, product: profile }, DESERT, query)
      if (res.status === 200) expect(await res.text()).not.toMatch(/NaN/)
      else expect((await expectProblem(res, [422])).detail).toMatch(/Chung/)
    }
  })

  it.each([
    ['Henderson with T + C ≤ 0', { model: 'modified-henderson', a: -1, b: -1000, c: -5 }, /Henderson/],
    ['Oswin with A + B·T ≤ 0', { model: 'modified-oswin', a: 0, b: 0, c: 0 }, /Oswin/],
    ['Chung–Pfost with T + C ≤ 0', { model: 'modified-chung-pfost', a: -100, b: -100, c: -100 }, /Chung/],
  ])('%s: 422 naming the model', async (_name, eq, model) => {
    for (const query of ['', '?format=html', '?format=csv']) {
      const p = await expectProblem(await assess({ ...COARSE, product: withIsotherm(eq) }, DRY, query), [422])
      expect(p.detail).toMatch(model)
    }
  })

  it('Halsey giving a target RH of 0: a 4xx (the message names the target RH)', async () => {
    const p = await expectProblem(
      await assess({ ...COARSE, product: withIsotherm({ model: 'modified-halsey', a: -10, b: 1, c: 2 }) }),
      [422],
    )
    expect(p.detail).toMatch(/target RH/)
  })

  it('a profile with non-numbers for constants: 400 naming the field', async () => {
    const p = await expectProblem(
      await assess({ ...COARSE, product: withIsotherm({ model: 'gab', xm0: 'x', c0: 3, k0: 1 }) }),
      [400],
    )
    expect(p.detail).toMatch(/isotherm\.desorption\.equation/)
  })
})
