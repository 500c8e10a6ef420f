/**
 * The report of every demo site: every section and chart present, the numbers drawn equal the numbers
 * in the assessment JSON, each chart has a text alternative and a table view, and the document loads
 * nothing from outside (issue 7, "Report structure").
 */
import { beforeAll, describe, expect, it } from 'vitest'
import { renderReportCsv, reportTables } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { type DemoCase, loadDemoCases } from './demo-cases.ts'
import { byId, elements, num, parseCsv } from './html-helpers.ts'

let cases: DemoCase[] = []
const html = new Map<string, string>()

beforeAll(() => {
  cases = loadDemoCases()
  for (const c of cases) html.set(c.file, renderReportHtml(c.assessment, { info: { fileName: c.file } }))
}, 120_000)

// the two-page handout, then the appendix (the notes section only when there are warnings or notes)
const SECTIONS = [
  'header',
  'answer',
  'calendar',
  'start-table',
  'cautions',
  'monthly',
  'hour-of-day',
  'psychrometric',
  'start-dates',
  'spoilage',
  'heat',
  'limits',
]
const CHARTS: [string, string][] = [
  ['fig-monthly-svg', 'spread-bars'],
  ['fig-hour-of-day-svg', 'heat-map'],
  ['fig-psychro-svg', 'psychrometric'],
  ['fig-start-dates-svg', 'line-band'],
  ['fig-spoilage-svg', 'risk-bars'],
  ['fig-heat-svg', 'spread-bars'],
]

describe('report of each demo site', () => {
  it('was made for all five demo files', () => {
    expect(cases.map((c) => c.file)).toHaveLength(5)
  })

  it('has every section, in order', () => {
    for (const c of cases) {
      const h = html.get(c.file) as string
      const found = [...h.matchAll(/data-section="([^"]+)"/g)].map((m) => m[1]).filter((x) => x !== 'notes')
      expect(found, c.file).toEqual(SECTIONS)
      expect(h.indexOf('data-part="handout"')).toBeLessThan(h.indexOf('data-part="appendix"'))
    }
  })

  it('has every chart, each an accessible image with title and description, a text alternative and a table view', () => {
    for (const c of cases) {
      const h = html.get(c.file) as string
      for (const [id, kind] of CHARTS) {
        const svg = elements(h, 'svg', `id="${id}"`)
        expect(svg, `${c.file} ${id}`).toHaveLength(1)
        expect(svg[0]['data-chart']).toBe(kind)
        expect(svg[0].role).toBe('img')
        expect(svg[0]['aria-labelledby']).toBe(`${id}-title ${id}-desc`)
        const desc = h.match(new RegExp(`<desc id="${id}-desc">([^<]+)</desc>`))
        expect(desc?.[1].length ?? 0, `${c.file} ${id} desc`).toBeGreaterThan(60)
        const figId = id.replace(/-svg$/, '')
        const figure = byId(h, 'figure', figId)
        expect(figure).toMatch(
          new RegExp(
            `<p class="alt" id="${figId}-alt"><span class="alt-label">In words:</span> [^<]{60,}</p>`,
          ),
        )
        expect(figure).toMatch(
          /<details class="table-view"><summary>Table view of figure \d+<\/summary><table class="data( stack)?"/,
        )
      }
    }
  })

  it('draws the monthly usable hours exactly as the assessment has them', () => {
    for (const c of cases) {
      const bars = elements(byId(html.get(c.file) as string, 'svg', 'fig-monthly-svg'), 'g', 'class="bar"')
      expect(bars).toHaveLength(12)
      for (const m of c.assessment.monthly) {
        const b = bars.find((x) => x['data-key'] === String(m.month))
        expect(num(b?.['data-median']), `${c.file} month ${m.month}`).toBe(m.usableHours.median)
        expect(num(b?.['data-p10'])).toBe(m.usableHours.p10)
        expect(num(b?.['data-p90'])).toBe(m.usableHours.p90)
      }
      const years = elements(
        byId(html.get(c.file) as string, 'svg', 'fig-monthly-svg'),
        'line',
        'class="year"',
      )
      expect(years.length).toBe(c.assessment.monthly.reduce((n, m) => n + m.usableHours.byYear.length, 0))
    }
  })

  it('draws the hour-of-day map from the assessment table (288 cells)', () => {
    for (const c of cases) {
      const cells = elements(
        byId(html.get(c.file) as string, 'svg', 'fig-hour-of-day-svg'),
        'g',
        'class="cell"',
      )
      expect(cells).toHaveLength(288)
      const t = c.assessment.hourOfDay
      for (const cell of cells) {
        const m = Number(cell['data-month'])
        const h = Number(cell['data-hour'])
        expect(num(cell['data-fraction']), `${c.file} ${m}/${h}`).toBe(
          t.usableFraction[t.months.indexOf(m)][t.hours.indexOf(h)],
        )
      }
    }
  })

  it('draws days to target for every start date as in the assessment', () => {
    for (const c of cases) {
      const pts = elements(
        byId(html.get(c.file) as string, 'svg', 'fig-start-dates-svg'),
        'g',
        'class="point"',
      )
      expect(pts.map((p) => p['data-x'])).toEqual(c.assessment.startDates.map((s) => s.start))
      c.assessment.startDates.forEach((s, i) => {
        expect(num(pts[i]['data-median'])).toBe(s.daysToTarget.median)
        expect(num(pts[i]['data-high'])).toBe(s.daysToTarget.p90)
      })
      const ref = elements(
        byId(html.get(c.file) as string, 'svg', 'fig-start-dates-svg'),
        'g',
        'class="reference"',
      )
      expect(num(ref[0]?.['data-value'])).toBe(c.assessment.deadlineDays)
    }
  })

  it('draws the spoilage risk of every start date as in the assessment', () => {
    for (const c of cases) {
      const bars = elements(byId(html.get(c.file) as string, 'svg', 'fig-spoilage-svg'), 'g', 'class="bar"')
      expect(bars.map((b) => b['data-x'])).toEqual(c.assessment.startDates.map((s) => s.start))
      c.assessment.startDates.forEach((s, i) => {
        expect(num(bars[i]['data-probability']), `${c.file} ${s.start}`).toBe(s.spoilage?.probability ?? null)
        expect(num(bars[i]['data-hours-at-risk'])).toBe(s.spoilage?.hoursAtRisk.median ?? null)
      })
      const section = byId(html.get(c.file) as string, 'section', 'sec-spoilage')
      expect(section).toContain(c.assessment.spoilage?.model.name.replaceAll('&', '&amp;') ?? 'missing')
      expect(section).toMatch(/mycotoxins/)
    }
  })

  it('draws the supplemental heat per month as in the assessment (rounded to 0.1 kWh/t)', () => {
    for (const c of cases) {
      const bars = elements(byId(html.get(c.file) as string, 'svg', 'fig-heat-svg'), 'g', 'class="bar"')
      for (const m of c.assessment.monthly) {
        const b = bars.find((x) => x['data-key'] === String(m.month))
        const want = m.supplementalHeatKwhPerTonne.median
        expect(num(b?.['data-median']), `${c.file} month ${m.month}`).toBe(
          want === null ? null : Math.round(want * 10) / 10,
        )
      }
    }
  })

  it('puts every hour with dry bulb, humidity and pressure on the psychrometric chart once', () => {
    for (const c of cases) {
      const cells = elements(
        byId(html.get(c.file) as string, 'svg', 'fig-psychro-svg'),
        'rect',
        'class="hours"',
      )
      const plotted = cells.reduce((n, x) => n + Number(x['data-hours']), 0)
      let withData = 0
      for (let i = 0; i < c.series.hours; i++) {
        if (
          Number.isFinite(c.series.dryBulbC[i]) &&
          Number.isFinite(c.series.relativeHumidityPct[i]) &&
          Number.isFinite(c.series.pressureKpa[i])
        )
          withData++
      }
      // Cells far outside the plotted dry-bulb range (below the 0.1 % hour) are left out: at most 0.2 % of hours.
      expect(plotted, c.file).toBeLessThanOrEqual(withData)
      expect(plotted / withData, c.file).toBeGreaterThan(0.998)
      expect(elements(html.get(c.file) as string, 'g', 'class="drying-region"'), c.file).toHaveLength(1)
    }
  })

  it('shows the product cautions and the general safety cautions', () => {
    for (const c of cases) {
      const cautions = byId(html.get(c.file) as string, 'section', 'sec-cautions')
      for (const text of c.assessment.product.cautions.slice(0, 2)) {
        expect(cautions).toContain(text.replace(/&/g, '&amp;').replace(/'/g, '&#39;').replace(/"/g, '&quot;'))
      }
      expect(cautions).toMatch(/carbon monoxide/)
      expect(cautions).toMatch(/licensed trades/)
      expect(cautions).toMatch(/Mycotoxins/)
    }
  })

  it('says so when the file is a typical year', () => {
    const typical = cases.find((c) => c.file.includes('typical'))
    expect(typical?.assessment.site.typicalYear).toBe(true)
    expect(html.get(typical?.file ?? '')).toContain(
      'The file is a typical year: one value per month, no spread across years can be computed.',
    )
  })

  it('loads nothing from outside: no scripts, no external references', () => {
    for (const c of cases) {
      const h = html.get(c.file) as string
      expect(h).not.toMatch(/<script/i)
      expect(h).not.toMatch(/\ssrc=/i)
      expect(h).not.toMatch(/@import/i)
      // The only absolute URL is the SVG namespace name (an identifier, never fetched).
      const urls = [...h.matchAll(/https?:\/\/[^\s"'<)]+/g)].map((m) => m[0])
      expect(new Set(urls), c.file).toEqual(new Set(['http://www.w3.org/2000/svg']))
      for (const m of h.matchAll(/href="([^"]*)"/g)) expect(m[1].startsWith('#')).toBe(true)
      for (const m of h.matchAll(/url\(([^)]*)\)/g)) expect(m[1].startsWith('#')).toBe(true)
    }
  })

  it('exports every table as CSV with the same numbers as the JSON', () => {
    for (const c of cases) {
      const tables = reportTables(c.assessment, {})
      const ids = tables.map((t) => t.id)
      expect(ids.slice(0, 2)).toEqual(['summary', 'monthly-usable-hours'])
      for (const id of [
        'hour-of-day-usable-share',
        'psychrometric-hours',
        'start-dates',
        'supplemental-heat-by-month',
        'fuel',
        'assumptions',
      ]) {
        expect(ids, c.file).toContain(id)
      }
      const rows = parseCsv(renderReportCsv(c.assessment, { table: 'monthly-usable-hours' }))
      expect(rows[0][0]).toBe('month')
      c.assessment.monthly.forEach((m, i) => {
        expect(rows[i + 1][1] === '' ? null : Number(rows[i + 1][1])).toBe(m.usableHours.median)
        expect(rows[i + 1][2] === '' ? null : Number(rows[i + 1][2])).toBe(m.usableHours.p10)
      })
      const starts = parseCsv(renderReportCsv(c.assessment, { table: 'start-dates' }))
      expect(starts.slice(1).map((r) => r[0])).toEqual(c.assessment.startDates.map((s) => s.start))
      const all = renderReportCsv(c.assessment, {})
      for (const t of tables) expect(all).toContain(t.title.split(',')[0])
    }
  })
})
