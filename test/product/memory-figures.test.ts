/**
 * The answer says which of the product's figures rest on memory (issue 15 item 5): the list in the assessment JSON,
 * its counts, and the line the CLI, the report and the comparison print, checked against the catalogue's own
 * levels (product/profile-numbers.ts) — the project's data, not an outside value.
 */
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { rankAssessments } from '../../src/analysis/compare.ts'
import { comparisonText } from '../../src/cli/commands/compare.ts'
import { productById } from '../../src/product/catalogue.ts'
import {
  figureCounts,
  figuresFromMemory,
  memoryFiguresLine,
  NO_MEMORY_FIGURES,
} from '../../src/product/memory-figures.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import { NUMBER_GROUPS, profileNumbers } from '../../src/product/profile-numbers.ts'
import { assessmentText } from '../../src/report/assessment-text.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { demoSeries } from '../drying/demo-weather.ts'

/** A copy of the profile with every `memory` level raised to `published` (no source changed: a test double). */
function withoutMemory(p: ProductProfile): ProductProfile {
  const raise = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(raise)
    if (typeof v !== 'object' || v === null) return v
    return Object.fromEntries(
      Object.entries(v).map(([k, x]) => [k, k === 'confidence' && x === 'memory' ? 'published' : raise(x)]),
    )
  }
  return raise(p) as ProductProfile
}

describe('figures from memory, from the profile levels', () => {
  for (const id of ['grapes-to-raisins', 'hops']) {
    it(`${id}: exactly the memory numbers of profile-numbers, with their values, units and kinds`, () => {
      const p = productById(id)
      const memory = profileNumbers(p).filter((n) => n.confidence === 'memory')
      const figures = figuresFromMemory(p)
      expect(figures.map((f) => f.path)).toEqual(memory.map((n) => n.path))
      expect(figures.map((f) => [f.name, f.value, f.unit, f.kind])).toEqual(
        memory.map((n) => [n.label, n.value, n.unit, n.group]),
      )
      const counts = figureCounts(p)
      for (const g of NUMBER_GROUPS) {
        expect(counts[g].fromMemory).toBe(memory.filter((n) => n.group === g).length)
        expect(counts[g].figures).toBe(profileNumbers(p).filter((n) => n.group === g).length)
      }
    })
  }
  it('grapes: the recalled GAB constants C0 and K0 are listed, the published monolayer Xm0 is not', () => {
    const p = productById('grapes-to-raisins')
    const paths = figuresFromMemory(p).map((f) => f.path)
    expect(paths).toContain('isotherm.desorption.equation.c0')
    expect(paths).toContain('isotherm.desorption.equation.k0')
    expect(profileNumbers(p).find((n) => n.path === 'isotherm.desorption.equation.xm0')?.confidence).not.toBe(
      'memory',
    )
    expect(paths).not.toContain('isotherm.desorption.equation.xm0')
  })
  it('hops: every isotherm and kinetics constant is recalled, and the line names the isotherm constants', () => {
    const p = productById('hops')
    const line = memoryFiguresLine(figuresFromMemory(p), figureCounts(p), p.id)
    expect(line).toMatch(/^Figures recalled, not read in a publication \(\d+ of \d+\): /)
    expect(line).toContain('isotherm: Xm0, C0, K0')
    expect(line).toContain('dryhours products hops')
  })
  it('a product without memory figures lists none and says so', () => {
    const p = withoutMemory(productById('figs'))
    expect(figuresFromMemory(p)).toEqual([])
    expect(NUMBER_GROUPS.every((g) => figureCounts(p)[g].fromMemory === 0)).toBe(true)
    expect(memoryFiguresLine([], figureCounts(p), p.id)).toBe(NO_MEMORY_FIGURES)
  })
  it('figures the user replaced are not listed', () => {
    const p = productById('hops')
    const all = figuresFromMemory(p).map((f) => f.path)
    expect(all).toContain('defaultThicknessMm')
    const used = figuresFromMemory(p, {
      initialMoisture: false,
      targetMoisture: false,
      thickness: false,
      loading: false,
    }).map((f) => f.path)
    expect(used).not.toContain('defaultThicknessMm')
    expect(used).not.toContain('defaultLoadingKgPerM2')
    expect(used).toContain('isotherm.desorption.equation.xm0')
  })
})

describe('the answer says which figures rest on memory', () => {
  const options = {
    method: { kind: 'open-air' } as const,
    seasonStart: '08-01',
    seasonEnd: '08-15',
    startStepDays: 14,
    deadlineDays: 10,
    maxDays: 30,
  }
  let hops: Assessment | undefined
  const hopsAssessment = () => {
    hops ??= assess(demoSeries('typicalUpland'), { ...options, product: productById('hops'), thicknessMm: 3 })
    return hops
  }
  it('JSON: product.figuresFromMemory and figureCounts, without the thickness the user gave', () => {
    const a = hopsAssessment()
    const p = productById('hops')
    const paths = a.product.figuresFromMemory.map((f) => f.path)
    expect(paths).not.toContain('defaultThicknessMm')
    expect(paths).toEqual(
      figuresFromMemory(p)
        .map((f) => f.path)
        .filter((x) => x !== 'defaultThicknessMm' && x !== 'targetMoistureWbPct'),
    )
    expect(a.product.figureCounts.isotherm.fromMemory).toBe(a.product.figureCounts.isotherm.figures)
  })
  it('CLI text, HTML report and comparison print the line', () => {
    const a = hopsAssessment()
    const line = memoryFiguresLine(a.product.figuresFromMemory, a.product.figureCounts, 'hops')
    expect(assessmentText(a)).toContain(line)
    expect(renderReportHtml(a)).toContain('<dt>Recalled figures</dt>')
    expect(renderReportHtml(a)).toContain('isotherm: Xm0, C0, K0')
    const c = rankAssessments([a, a], 'probability-within-deadline')
    expect(comparisonText(c)).toContain(line)
  })
  it('a profile without memory figures: empty list, and the report says none rests on memory', () => {
    const a = assess(demoSeries('typicalUpland'), { ...options, product: withoutMemory(productById('figs')) })
    expect(a.product.figuresFromMemory).toEqual([])
    expect(assessmentText(a)).toContain(NO_MEMORY_FIGURES)
    expect(renderReportHtml(a)).toContain('No product figure used here rests on memory')
  })
})
