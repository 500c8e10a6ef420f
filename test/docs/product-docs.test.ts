import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { productIds } from '../../src/product/catalogue.ts'
import {
  loadExperiments,
  loadPretreatments,
  readyToRun,
  renderExperimentsDoc,
  renderProductSourcesDoc,
} from './product-docs.ts'

const read = (path: string) => readFileSync(new URL(`../../${path}`, import.meta.url), 'utf8')

describe('docs/product-sources.md and docs/experiments.md say what the catalogue and fixtures say', () => {
  it('the committed docs equal a fresh rendering (regenerate with npm run docs:products)', () => {
    expect(read('docs/product-sources.md')).toBe(renderProductSourcesDoc())
    expect(read('docs/experiments.md')).toBe(renderExperimentsDoc())
  })
})

describe('experiment fixtures', () => {
  const experiments = loadExperiments()
  it('every file parses, its id is its file name and names a catalogue product', () => {
    expect(experiments.length).toBeGreaterThanOrEqual(15)
    const ids = new Set(productIds())
    for (const e of experiments) {
      if (e.product.catalogueId !== null) expect(ids.has(e.product.catalogueId), e.id).toBe(true)
      expect(new Set(e.runs.map((r) => r.id)).size, e.id).toBe(e.runs.length)
    }
  })
  it('calibration and validation are kept apart: both exist, and every calibration or validation run has a published time', () => {
    const runs = experiments.flatMap((e) => e.runs)
    expect(runs.some((r) => r.role === 'calibration')).toBe(true)
    expect(runs.filter((r) => r.role === 'validation').length).toBeGreaterThan(
      runs.filter((r) => r.role === 'calibration').length,
    )
    for (const r of runs.filter((x) => x.role !== 'context')) expect(r.timeH, r.id).not.toBeNull()
  })
  it('the grape berry sizes and times of Doymaz 2012 (abstract): 17.2 and 22.0 mm, 176 and 228 h', () => {
    const d = experiments.find((e) => e.id === 'doymaz-2012-grapes-open-sun')
    const [seedless, seeded] = d?.runs ?? []
    expect([seedless.sizeMm, seedless.timeH, seeded.sizeMm, seeded.timeH]).toEqual([17.2, 176, 22.0, 228])
    expect(seedless.role).toBe('calibration')
    expect(seeded.role).toBe('validation')
    // time ∝ d^x: x = ln(228/176)/ln(22.0/17.2) ≈ 1.05, the skin-limited scaling the issue names
    expect(Math.log(228 / 176) / Math.log(22.0 / 17.2)).toBeCloseTo(1.05, 2)
  })
  it('the runs ready for the engine (time and both moistures read) include grapes, chilli and tomato', () => {
    const ready = experiments.flatMap((e) => e.runs.filter(readyToRun).map(() => `${e.product.catalogueId}`))
    for (const id of ['grapes-to-raisins', 'chili-peppers', 'tomato-halves']) expect(ready).toContain(id)
  })
})

describe('pretreatment fixtures', () => {
  it('every entry names catalogue products and a published factor lies in a sane range', () => {
    const ids = new Set(productIds())
    for (const t of loadPretreatments()) {
      for (const id of t.catalogueIds) expect(ids.has(id), t.id).toBe(true)
      if (t.effect.factor) {
        expect(t.effect.factor.min).toBeGreaterThan(0)
        expect(t.effect.factor.min).toBeLessThanOrEqual(t.effect.factor.max)
        expect(t.effect.factor.max).toBeLessThan(3)
      }
    }
  })
  it('sweet-cherry dip: 19.5–22.6 % shorter drying (Doymaz & Ismail 2011) is a time factor of 0.774–0.805', () => {
    const t = loadPretreatments().find((x) => x.id === 'dip-ethyl-oleate-sweet-cherry')
    expect(t?.effect.factor).toEqual({ min: 0.774, max: 0.805 })
  })
})
