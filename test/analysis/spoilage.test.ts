/**
 * Spoilage in the assessment (analysis/spoilage.ts): the JSON figures per start date, per month and over
 * the season, what the demo climates show, and that the engine's drying figures do not depend on it.
 */
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { productById } from '../../src/product/catalogue.ts'
import { assessmentText } from '../../src/report/assessment-text.ts'
import { sectionContext } from '../../src/report/report-html.ts'
import { answerSentences } from '../../src/report/sections/summary.ts'
import { demoSeries } from '../drying/demo-weather.ts'

const apricots = productById('apricot-halves')
const season = { seasonStart: '07-01', seasonEnd: '08-31', startStepDays: 4 } as const

describe('spoilage along the batches of an assessment', () => {
  const dry = assess(demoSeries('dryUpland'), { product: apricots, method: { kind: 'open-air' }, ...season })
  const humid = assess(demoSeries('humidValley'), {
    product: apricots,
    method: { kind: 'open-air' },
    ...season,
  })
  const tropical = assess(demoSeries('tropical'), {
    product: apricots,
    method: { kind: 'open-air' },
    ...season,
  })

  it('shows higher spoilage risk for open-air fruit at the humid sites than at the dry one (same season)', () => {
    const d = dry.spoilage?.season
    expect(d?.modelId).toBe('mould-free-time')
    // Measured with the mould model fed the water activity at the product surface (July–August starts every 4
    // days): batches spoiled before dry 9 of 64 at the dry upland (probability 0.141; share of the mould-free
    // time used median 0.77), 46 of 48 at the humid lake valley (0.958; 1.77) and 48 of 48 at the tropical
    // lowland in its wet season (1; 2.66). Fed the whole piece's water activity, every batch at every site
    // spoiled, so only the share used told the sites apart.
    for (const wet of [humid, tropical]) {
      const h = wet.spoilage?.season
      expect(h?.probability as number).toBeGreaterThan(2 * (d?.probability as number))
      expect(h?.shareOfLimitUsed.median as number).toBeGreaterThan(
        1.5 * (d?.shareOfLimitUsed.median as number),
      )
      expect(h?.shareOfLimitUsed.p90 as number).toBeGreaterThan(d?.shareOfLimitUsed.p90 as number)
      expect(h?.hoursAtRisk.median as number).toBeGreaterThan(1.5 * (d?.hoursAtRisk.median as number))
    }
    // the dry upland's summer is the season growers there sun-dry fruit in: most batches dry first
    expect(d?.probability as number).toBeLessThan(0.5)
  })

  it('counts per start date and month what it sums over the season', () => {
    for (const a of [dry, humid]) {
      const s = a.spoilage
      expect(s).not.toBeNull()
      let batches = 0
      let spoiled = 0
      for (const r of a.startDates) {
        expect(r.spoilage?.batches).toBe(r.years)
        expect(r.spoilage?.modelId).toBe(s?.model.id)
        expect(r.spoilage?.source).toBe('Seiler; Cauvain & Seiler (cakes), as quoted')
        batches += r.spoilage?.batches ?? 0
        spoiled += r.spoilage?.batchesSpoiledBeforeDry ?? 0
        if (r.spoilage && r.spoilage.batches > 0)
          expect(r.spoilage.probability).toBeCloseTo(
            r.spoilage.batchesSpoiledBeforeDry / r.spoilage.batches,
            3,
          )
      }
      expect(s?.season.batches).toBe(batches)
      expect(s?.season.batchesSpoiledBeforeDry).toBe(spoiled)
      for (const m of a.monthly) expect(m.spoilage?.modelId).toBe('mould-free-time')
      expect(s?.cautions.some((c) => /mycotoxins/.test(c))).toBe(true)
      expect(s?.model.source.citation).toMatch(/Adams & Moss/)
    }
  })

  it('leaves every drying figure as it was when the models are switched off', () => {
    const off = assess(demoSeries('dryUpland'), {
      product: apricots,
      method: { kind: 'open-air' },
      ...season,
      spoilage: false,
    })
    expect(off.spoilage).toBeNull()
    expect(off.startDates.every((r) => r.spoilage === null)).toBe(true)
    const strip = (a: typeof off) => a.startDates.map(({ spoilage: _s, ...rest }) => rest)
    expect(strip(off)).toEqual(strip(dry))
  })

  it('puts the risk into the answer and the CLI text', () => {
    const ctx = sectionContext(humid, {})
    const text = answerSentences(humid, ctx).join(' ')
    expect(text).toMatch(/spoil first in \d+( to \d+)? of 10 years|spoil before they are dry/)
    const cli = assessmentText(humid)
    expect(cli).toMatch(/Spoilage before dry: Mould-free time/)
    expect(cli).toMatch(/spoils first %/)
  })

  it('uses the grain model for grain and the OTA window for coffee', () => {
    const corn = assess(demoSeries('dryUpland'), {
      product: productById('shelled-corn'),
      method: { kind: 'open-air' },
      seasonStart: '09-01',
      seasonEnd: '09-30',
      startStepDays: 10,
    })
    expect(corn.spoilage?.model.id).toBe('grain-dry-matter-loss')
    expect(corn.spoilage?.model.limit).toBe(0.5)
    const coffee = assess(demoSeries('tropical'), {
      product: productById('coffee-parchment'),
      method: { kind: 'open-air' },
      seasonStart: '01-01',
      seasonEnd: '01-31',
      startStepDays: 10,
    })
    expect(coffee.spoilage?.model.id).toBe('coffee-ota-window')
    expect(coffee.spoilage?.model.limit).toBe(96)
  })
})
