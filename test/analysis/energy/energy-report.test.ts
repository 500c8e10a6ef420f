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
  it('draws six charts (I, MR, EWMA for raw and adjusted), each an accessible image with a text alternative', () => {
    const svgs = html.match(/<svg [^>]*data-chart="control"[^>]*>/g) ?? []
    expect(svgs).toHaveLength(6)
    for (const s of svgs) expect(s).toMatch(/role="img" aria-labelledby="[^"]+-title [^"]+-desc"/)
    expect((html.match(/<p class="alt"/g) ?? []).length).toBe(6)
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
      /table must be one of batches, limits, regression, rejected-rows/,
    )
  })
  it('neutralises spreadsheet formulas in user text (OWASP CSV injection)', () => {
    const b = analyzeEnergyLog(demo.replace('Q26-001,', '=HYPERLINK("x"),'))
    expect(renderEnergyCsv(b, 'batches')).toContain(`"'=HYPERLINK(""x"")"`)
  })
})
