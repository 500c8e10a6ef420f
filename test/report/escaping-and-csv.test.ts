/**
 * Untrusted text (site name, file name, reader notes) renders as text in the HTML report and cannot
 * become a spreadsheet formula in the CSV (OWASP "CSV Injection": a cell starting with =, +, -, @, tab
 * or carriage return is prefixed with an apostrophe).
 */
import { beforeAll, describe, expect, it } from 'vitest'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { csvCell } from '../../src/report/escape.ts'
import { renderReportCsv } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { tableCsv } from '../../src/report/tables.ts'
import { type DemoCase, loadDemoCases } from './demo-cases.ts'
import { parseCsv } from './html-helpers.ts'

const SITE = '<script>alert("site")</script> "onerror=alert(1) =HYPERLINK("http://example.invalid","x")'
const FILE = '"><img src=x onerror=alert(2)>.csv'
let c: DemoCase
let evil: Assessment

beforeAll(() => {
  c = loadDemoCases(['tamarel-lowland-2021-2023-utc.csv'])[0]
  evil = { ...c.assessment, site: { ...c.assessment.site, name: SITE } }
}, 60_000)

describe('malicious names in the HTML report', () => {
  it('escape every character that could open markup or an attribute', () => {
    const h = renderReportHtml(evil, {
      info: { fileName: FILE, readerWarnings: ['<b>bold</b>'] },
    })
    expect(h).not.toContain('<script>alert')
    expect(h).not.toContain('<img src=x')
    expect(h).not.toContain('<b>bold</b>')
    // No real tag carries an event handler (escaped text has no '<', so it cannot open a tag).
    const tags = [...h.matchAll(/<[a-zA-Z][^>]*>/g)].map((m) => m[0])
    expect(tags.filter((t) => /\son[a-z]+=/i.test(t))).toEqual([])
    expect(h).toContain(
      '&lt;script&gt;alert(&quot;site&quot;)&lt;/script&gt; &quot;onerror=alert(1) =HYPERLINK(',
    )
    expect(h).toContain('&quot;&gt;&lt;img src=x onerror=alert(2)&gt;.csv')
    expect(h).toContain('&lt;b&gt;bold&lt;/b&gt;')
    // The title element and the SVG titles carry the name as text too.
    expect(h).toMatch(/<title>Drying summary: &lt;script&gt;/)
    expect(h).toMatch(/<title id="fig-monthly-svg-title">Usable drying hours per month, &lt;script&gt;/)
  })
})

describe('CSV formula injection', () => {
  it('prefixes text cells starting with = + - @ tab or CR with an apostrophe (OWASP CSV Injection)', () => {
    for (const bad of ['=1+1', '+1', '-1+2', '@SUM(A1)', '\t=1', '\r=1', '=HYPERLINK("http://x")']) {
      const out = csvCell(bad)
      const unquoted = out.startsWith('"') ? out.slice(1, -1).replace(/""/g, '"') : out
      expect(unquoted.startsWith("'"), JSON.stringify(bad)).toBe(true)
      expect(unquoted.slice(1)).toBe(bad)
    }
  })

  it('keeps numbers numeric, negative ones included', () => {
    expect(csvCell(-3.5)).toBe('-3.5')
    expect(csvCell(0)).toBe('0')
    expect(csvCell(Number.NaN)).toBe('')
    expect(csvCell(null)).toBe('')
  })

  it('neutralises the site name in the report CSV', () => {
    const rows = parseCsv(renderReportCsv(evil, { table: 'summary', info: { fileName: '=cmd|calc.csv' } }))
    const site = rows.find((r) => r[0] === 'Site')
    // Starts with '<': not a formula trigger, kept as it is (CSV is not HTML).
    expect(site?.[1]).toBe(SITE)
    const data = rows.find((r) => r[0] === 'Data')
    expect(data?.[1]).toContain('file =cmd|calc.csv')
    expect(data?.[1].startsWith('=')).toBe(false)
  })

  it('neutralises a name that starts with = (it becomes text, not a formula)', () => {
    const name = '=HYPERLINK("http://example.invalid","click")'
    const a = { ...c.assessment, site: { ...c.assessment.site, name } }
    const rows = parseCsv(renderReportCsv(a, { table: 'summary' }))
    expect(rows.find((r) => r[0] === 'Site')?.[1]).toBe(`'${name}`)
    // And a table row label starting with - is prefixed, its numbers are not.
    const csv = tableCsv({ id: 't', title: 't', columns: ['label', 'value'], rows: [['-x', -2]] })
    expect(parseCsv(csv)[1]).toEqual(["'-x", '-2'])
  })
})
