import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { analyzeEnergyLog } from '../../../src/analysis/energy/energy-chart.ts'
import { renderEnergyCsv } from '../../../src/report/energy/energy-csv.ts'
import { renderEnergyHtml } from '../../../src/report/energy/energy-html.ts'

const demo = readFileSync(
  new URL('../../../climate-demo/energy/quillow-dryer-batches-2026.csv', import.meta.url),
  'utf8',
)
const a = analyzeEnergyLog(demo)

describe('energy report page', () => {
  const html = renderEnergyHtml(a, { logName: 'demo.csv' })
  it('is self-contained: no scripts, no external resources', () => {
    expect(html).not.toMatch(/<script/i)
    expect(html).not.toMatch(/(src|href)="https?:/i)
    expect(html.startsWith('<!doctype html>')).toBe(true)
  })
  it('draws twelve charts (I, MR, EWMA, CUSUM for the physics, regression and raw views), each accessible', () => {
    const svgs = html.match(/<svg [^>]*data-chart="control"[^>]*>/g) ?? []
    expect(svgs).toHaveLength(12)
    for (const s of svgs) expect(s).toMatch(/role="img" aria-labelledby="[^"]+-title [^"]+-desc"/)
    expect((html.match(/<p class="alt"/g) ?? []).length).toBe(12)
    for (const key of ['physics', 'residual', 'specific-energy'])
      expect(html).toContain(`id="${key}-cusum-svg"`)
  })
  it('says which view the answer uses, on that view', () => {
    expect(a.answer.view).toBe('regression')
    const adjusted = html.slice(html.indexOf('<section class="adjusted">'))
    expect(adjusted.slice(0, 200)).toContain('The answer uses this view.')
    expect((html.match(/The answer uses this view\./g) ?? []).length).toBe(1)
  })
  it('marks the batches in weather outside the baseline’s range, the same ones as the assessment', () => {
    const physics = html.slice(html.indexOf('id="physics-individuals-svg"'))
    const svg = physics.slice(0, physics.indexOf('</svg>'))
    const marked = [...svg.matchAll(/data-batch="([^"]+)"[^>]*data-outside="true"/g)].map((m) => m[1])
    const expected = a.batches.filter((b) => a.outsideBaselineWeather[b.index]).map((b) => b.batchId)
    expect(marked).toEqual(expected)
    expect(marked.length).toBeGreaterThan(0)
    expect(svg).toContain('outside baseline weather')
  })
  it('the CUSUM chart carries its sums and the signals of both sides', () => {
    const part = html.slice(html.indexOf('id="residual-cusum-svg"'))
    const svg = part.slice(0, part.indexOf('</svg>'))
    const c = a.adjusted!.cusum
    const upper = [...svg.matchAll(/<g class="point" data-batch="[^"]+" data-value="([^"]+)"/g)].map((m) =>
      Number(m[1]),
    )
    expect(upper).toEqual(c.upper)
    const lower = [
      ...svg.matchAll(/<g class="point point-second" data-batch="[^"]+" data-value="([^"]+)"/g),
    ].map((m) => Number(m[1]))
    expect(lower).toEqual(c.lower.map((v) => (v === 0 ? 0 : -v)))
    expect(svg).toMatch(/data-batch="Q26-042" data-value="[^"]+" data-rules="CUSUM↑"/)
  })
  it('marks every signalled batch on the charts with its rules and side', () => {
    // Residual individuals chart: the first signal after the change (Q26-042) carries a rule above.
    const residual = html.slice(html.indexOf('id="residual-individuals-svg"'))
    expect(residual).toMatch(/data-batch="Q26-042" data-value="[^"]+" data-rules="[^"]*WE\d↑/)
    const signalled = a.adjusted!.individuals.signals.filter((s) => s.index >= 20)
    const points = residual.slice(0, residual.indexOf('</svg>')).match(/data-rules="[^"]+"/g) ?? []
    expect(points.length).toBe(new Set(signalled.map((s) => s.index)).size)
  })
  it('escapes user text (batch ids, file names) everywhere', () => {
    const log = demo.replace('Q26-001,', '<img src=x onerror=alert(1)>,')
    const page = renderEnergyHtml(analyzeEnergyLog(log), { logName: '"><script>.csv' })
    expect(page).not.toContain('<img src=x')
    expect(page).toContain('&lt;img src=x onerror=alert(1)&gt;')
    expect(page).not.toContain('"><script>')
  })
  it('says why the adjusted chart is missing when the log has no outside air', () => {
    const stripped = demo
      .split('\n')
      .map((l) => (l.startsWith('#') || l === '' ? l : l.split(',').slice(0, 11).join(',')))
      .join('\n')
    const b = analyzeEnergyLog(stripped)
    expect(b.adjusted).toBeNull()
    expect(b.adjustedUnavailableReason).toMatch(/20 baseline batches have no outside temperature and RH/)
    expect(renderEnergyHtml(b)).toContain('Not drawn: 20 baseline batches have no outside temperature and RH')
  })
})

describe('energy CSV', () => {
  it('one table per id, RFC 4180 line ends, a row per batch', () => {
    const csv = renderEnergyCsv(a, 'batches')
    const lines = csv.trimEnd().split('\r\n')
    expect(lines).toHaveLength(1 + 64)
    expect(lines[0]).toMatch(
      /^batch,start,phase,fresh mass \[kg\],water removed \[kg\],energy \[MJ\],specific energy/,
    )
    expect(lines[41]).toMatch(/^Q26-041,/)
    expect(() => renderEnergyCsv(a, 'nope')).toThrow(
      /table must be one of batches, limits, physics, regression, rejected-rows/,
    )
  })
  it('neutralises spreadsheet formulas in user text (OWASP CSV injection)', () => {
    const b = analyzeEnergyLog(demo.replace('Q26-001,', '=HYPERLINK("x"),'))
    expect(renderEnergyCsv(b, 'batches')).toContain(`"'=HYPERLINK(""x"")"`)
  })
})
