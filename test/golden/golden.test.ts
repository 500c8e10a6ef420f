/**
 * The engine gives the committed golden results again, byte for byte (see cases.ts). A failure here after
 * a refactor means results moved; after a change meant to move them, run `npm run golden:update` and say
 * why in the commit message.
 */
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { renderReportCsv } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { GOLDEN_CASES, GOLDEN_COMPARISON, GOLDEN_DIR } from './cases.ts'
import {
  GOLDEN_REPORT_FOOTER,
  goldenComparisonFile,
  goldenFilesOf,
  hourlyColumnDigests,
} from './golden-files.ts'

const committed = (name: string): string => readFileSync(join(GOLDEN_DIR, name), 'utf8')

describe('golden assessments (test/fixtures/golden/)', () => {
  for (const c of GOLDEN_CASES) {
    it(c.id, () => {
      for (const f of goldenFilesOf(c)) expect(f.text, f.name).toBe(committed(f.name))
    })
  }
  it(GOLDEN_COMPARISON.id, () => {
    const f = goldenComparisonFile()
    expect(f.text).toBe(committed(f.name))
  })
  it('hourly columns of every method, bit for bit (SHA-256 per column)', () => {
    const f = hourlyColumnDigests()
    expect(JSON.parse(f.text)).toEqual(JSON.parse(committed(f.name)))
  })
  it('the HTML and CSV reports are rebuilt from the committed JSON alone (no weather, no profile)', () => {
    const rendered = GOLDEN_CASES.filter((c) => c.rendered)
    expect(rendered.length).toBeGreaterThanOrEqual(3)
    for (const c of rendered) {
      const a = JSON.parse(committed(`${c.id}.json`)) as Assessment
      expect(renderReportCsv(a), c.id).toBe(committed(`${c.id}.csv`))
      expect(renderReportHtml(a, { footer: GOLDEN_REPORT_FOOTER }), c.id).toBe(committed(`${c.id}.html`))
    }
  })
  it('every committed golden file belongs to a case', () => {
    const ids = [...GOLDEN_CASES.map((c) => c.id), GOLDEN_COMPARISON.id, 'hourly-column-digests']
    for (const name of readdirSync(GOLDEN_DIR)) {
      expect(ids, name).toContain(name.replace(/\.(json|csv|html)$/, ''))
    }
  })
})
