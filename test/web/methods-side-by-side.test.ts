/**
 * The grower's job on the page: one file by several methods side by side (checkboxes on the assess form). The
 * page answers with the same comparison as `dryhours assess --method a,b` (analysis/compare-methods.ts): the
 * same methods, the same figures per method, the season calendar and the recommendation.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { MethodComparison } from '../../src/analysis/compare-methods.ts'
import { createApp } from '../../src/api/app.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

const app = createApp()
const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')

describe('methods side by side on the page', () => {
  it('POST /report with two methods ticked answers the methods comparison, as the CLI does', async () => {
    const f = new FormData()
    const fields: [string, string][] = [
      ['product', 'grapes-to-raisins'],
      ['method', 'open-air'],
      ['method', 'heated'],
      ['seasonStart', '07-01'],
      ['seasonEnd', '07-21'],
      ['utcOffset', '0'],
      ['siteTz', 'Europe/Madrid'],
      ['format', 'bundle'],
    ]
    for (const [k, v] of fields) f.append(k, v)
    f.append('file', new File([upland as Uint8Array<ArrayBuffer>], 'upland.csv', { type: 'text/csv' }))
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string; json: string; handout: string; document: string }
    const page = JSON.parse(b.json) as MethodComparison
    // the printed summary: the comparison and the cautions, each method's own report only in the full document
    expect(b.handout).toContain('data-section="recommendation"')
    expect(b.handout).toContain('data-section="cautions"')
    expect(b.handout).not.toContain('data-report="assessment"')
    expect(b.document.split('data-report="assessment"')).toHaveLength(3)
    expect(page.assessments.map((a) => a.method.kind)).toEqual(['open-air', 'heated'])
    expect(b.article).toContain('open air')
    expect(b.article).toContain('heated')

    const out: string[] = []
    const io: CliIo = {
      stdout: (t) => out.push(t),
      stderr: () => {},
      readFile: async (path) => new Uint8Array(readFileSync(path)),
      writeFile: async () => {},
    }
    const code = await runCli(
      [
        'assess',
        'climate-demo/ardentine-upland-2021-2024-utc.csv',
        '--product',
        'grapes-to-raisins',
        '--method',
        'open-air,heated',
        '--start',
        '07-01',
        '--end',
        '07-21',
        '--utc-offset',
        '0',
        '--site-tz',
        'Europe/Madrid',
        '--format',
        'json',
      ],
      io,
    )
    expect(code).toBe(0)
    const cli = JSON.parse(out.join('')) as MethodComparison
    const days = (c: MethodComparison) =>
      c.assessments.map((a) => a.startDates.map((s) => s.daysToTarget.median))
    expect(days(page)).toEqual(days(cli))
    expect(page.recommendation).toEqual(cli.recommendation)
  }, 180_000)
})
