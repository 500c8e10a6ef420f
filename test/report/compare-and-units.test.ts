/**
 * Sites side by side (grouped bars equal each assessment, ranking by the stated criterion, unique ids
 * when several reports share one document) and the report in US customary units.
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { rankAssessments } from '../../src/analysis/compare.ts'
import { renderComparisonHtml } from '../../src/report/compare-html.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { type DemoCase, loadDemoCases } from './demo-cases.ts'
import { byId, elements, num } from './html-helpers.ts'

let cases: DemoCase[] = []
beforeAll(() => {
  cases = loadDemoCases(['ardentine-upland-2021-2024-utc.csv', 'tamarel-lowland-2021-2023-utc.csv'])
}, 60_000)

describe('comparison of two demo sites', () => {
  it('draws one bar per site and month with the assessment medians', () => {
    const h = renderComparisonHtml(
      cases.map((c) => ({ assessment: c.assessment, options: {} })),
      { ranking: rankAssessments(cases.map((c) => c.assessment)) },
    )
    const bars = elements(byId(h, 'svg', 'cmp-fig-usable-svg'), 'g', 'class="bar"')
    expect(bars).toHaveLength(24)
    cases.forEach((c, si) => {
      for (const m of c.assessment.monthly) {
        const b = bars.find((x) => x['data-series'] === String(si) && x['data-category'] === String(m.month))
        expect(num(b?.['data-value'])).toBe(m.usableHours.median)
      }
    })
    // Each site's short summary follows (its full report is its own document): no id repeats.
    const ids = [...h.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1])
    expect(ids.length).toBeGreaterThan(15)
    expect(new Set(ids).size).toBe(ids.length)
    expect(h).toContain('data-report="comparison"')
    expect((h.match(/data-section="site"/g) ?? []).length).toBe(2)
    expect((h.match(/data-report="assessment"/g) ?? []).length).toBe(0)
    // the season calendar has one row per site, in rank order
    expect((byId(h, 'div', 'cmp-calendar').match(/class="cal-row"/g) ?? []).length).toBe(2)
  })

  it('ranks by the mean probability of finishing within the deadline (analysis ranking, in rank order)', () => {
    const ranking = rankAssessments(cases.map((c) => c.assessment))
    const mean = (c: DemoCase) => {
      const rows = c.assessment.startDates.filter((r) => r.years > 0)
      return rows.reduce((s, r) => s + r.probabilityWithinDeadline, 0) / rows.length
    }
    const ranks = [...ranking.sites].sort((x, y) => x.rank - y.rank)
    for (let i = 1; i < ranks.length; i++) {
      expect(ranks[i - 1].meanProbabilityWithinDeadline ?? -1).toBeGreaterThanOrEqual(
        ranks[i].meanProbabilityWithinDeadline ?? -1,
      )
    }
    const site0 = ranking.sites.find((r) => r.site === cases[0].assessment.site.name)
    expect(site0?.meanProbabilityWithinDeadline).toBeCloseTo(mean(cases[0]), 3)
  })
})

describe('comparison with the analysis ranking', () => {
  it('lists the sites in the given rank order with the given criterion', () => {
    const sites = cases.map((c) => ({ assessment: c.assessment }))
    const ranking = {
      criterionDescription: 'the criterion named by the caller',
      sites: [
        {
          rank: 2,
          site: 'Alpha',
          usableHoursInSeasonP10: 10,
          usableHoursInSeasonMedian: 12,
          meanProbabilityWithinDeadline: 0.5,
          medianHeatKwhPerTonne: 100,
          bestStartWindow: null,
          spoilageProbability: null,
          warnings: [],
        },
        {
          rank: 1,
          site: 'Beta',
          usableHoursInSeasonP10: 20,
          usableHoursInSeasonMedian: 22,
          meanProbabilityWithinDeadline: 0.9,
          medianHeatKwhPerTonne: 0,
          bestStartWindow: '07-01 to 07-31',
          spoilageProbability: null,
          warnings: [],
        },
      ],
    }
    const h = renderComparisonHtml(sites, { ranking })
    expect(h).toContain('Ranking criterion: the criterion named by the caller.')
    expect(h).toContain('Beta ranks first')
    const table = h.slice(h.indexOf('data-table="site-comparison"'))
    expect(table.indexOf('>Beta<')).toBeLessThan(table.indexOf('>Alpha<'))
    expect(table).toContain(
      '<th scope="row">1</th><td data-label="site">Beta</td><td class="num" data-label="finishing within the deadline, mean over start days [%]">90</td><td data-label="best start window">07-01 to 07-31</td>',
    )
  })
})

describe('US customary report', () => {
  it('labels and converts: °F axis, kWh per short ton bars, US units in the header', () => {
    const c = cases[0]
    const h = renderReportHtml(c.assessment, { units: 'us' })
    expect(h).toContain('data-units="us"')
    expect(h).toContain('dry bulb [°F]')
    expect(h).toContain('humidity ratio [gr/lb]')
    expect(h).toContain('US customary (°F, lb, short ton, gal, ft³)')
    // the psychrometric table and the cross-check are in US units too
    expect(h).toContain('dry bulb from [°F]')
    expect(h).toMatch(/Btu\/lb/)
    expect(h).not.toMatch(/\[°C\]|\[g\/kg\]|kWh\/t\b/)
    const bars = elements(byId(h, 'svg', 'fig-heat-svg'), 'g', 'class="bar"')
    for (const m of c.assessment.monthly) {
      const si = m.supplementalHeatKwhPerTonne.median
      const b = bars.find((x) => x['data-key'] === String(m.month))
      if (si === null) expect(num(b?.['data-median'])).toBeNull()
      else expect(num(b?.['data-median'])).toBeCloseTo(Math.round(si * 0.90718474 * 10) / 10, 6)
    }
    // Hours and days do not change with the unit system.
    const si = renderReportHtml(c.assessment, {})
    expect(elements(byId(h, 'svg', 'fig-monthly-svg'), 'g', 'class="bar"')).toEqual(
      elements(byId(si, 'svg', 'fig-monthly-svg'), 'g', 'class="bar"'),
    )
  })
})
