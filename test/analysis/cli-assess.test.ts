import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { type CliIo, UsageError } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { renderReportCsv } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'

function fakeIo() {
  const out: string[] = []
  const err: string[] = []
  const written = new Map<string, string>()
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    // as src/node/cli.ts: a file that cannot be read is a usage error naming the path
    readFile: async (p) => {
      try {
        return new Uint8Array(await readFile(p))
      } catch (e) {
        throw new UsageError(`cannot read '${p}': ${(e as NodeJS.ErrnoException).code}`)
      }
    },
    writeFile: async (p, data) => {
      written.set(p, typeof data === 'string' ? data : new TextDecoder().decode(data))
    },
  }
  return { io, out, err, written }
}

const typical = 'climate-demo/ardentine-upland-typical-year.epw'

describe('dryhours assess', () => {
  it('--json prints the full assessment with the documented keys; progress goes to stderr', async () => {
    const { io, out, err } = fakeIo()
    const code = await runCli(
      [
        'assess',
        typical,
        '--product',
        'apricot-halves',
        '--method',
        'open-air',
        '--start',
        '07-01',
        '--end',
        '07-31',
        '--step-days',
        '10',
        '--deadline-days',
        '14',
        '--json',
      ],
      io,
    )
    expect(code).toBe(0)
    const a = JSON.parse(out.join(''))
    for (const k of ['site', 'product', 'method', 'monthly', 'startDates', 'assumptions', 'warnings'])
      expect(a).toHaveProperty(k)
    expect(a.monthly[0]).toHaveProperty('usableHours.byYear')
    expect(a.monthly[0]).toHaveProperty('supplementalHeatKwhPerTonne')
    expect(a.startDates[0]).toHaveProperty('daysToTarget.median')
    expect(a.startDates[0]).toHaveProperty('probabilityWithinDeadline')
    expect(a.method).toMatchObject({ kind: 'open-air', absorptivity: 0.7 })
    expect(err.join('')).toMatch(/start-dates/)
  })
  it('prints a readable summary with the monthly table, start windows and fuel', async () => {
    const { io, out } = fakeIo()
    const code = await runCli(
      [
        'assess',
        typical,
        '--product',
        'grapes-to-raisins',
        '--method',
        'heated',
        '--set-point',
        '55',
        '--start',
        '08-01',
        '--end',
        '08-15',
        '--step-days',
        '7',
        '--price',
        'propane=0.9',
        '--quiet',
      ],
      io,
    )
    expect(code).toBe(0)
    const text = out.join('')
    expect(text).toMatch(/Usable drying hours per month/)
    expect(text).toMatch(/Best start windows/)
    expect(text).toMatch(/propane \(LPG\).*at 0\.90 per L\n/)
    // plain words: no engine identifiers, shares of years in words, the clock named
    expect(text).not.toMatch(/nightWithoutDrying|tooHumid|≥ 100 %/)
    expect(text).toMatch(/finishes within \d+ days in (every year|at least \d+ % of years)/)
    expect(text).toMatch(/times on /)
    expect(text).toMatch(/wood pellets.*\(example price\)/)
  })
  it('bad input: exit 2 and one line naming what is wrong', async () => {
    const cases: [string[], RegExp][] = [
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'kiln'],
        /--method must be one of open-air, shade, solar-cabinet, tunnel, heated/,
      ],
      [['assess', typical, '--product', 'no-such', '--method', 'shade'], /unknown product 'no-such'/],
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'open-air', '--absorptivity', '3'],
        /absorptivity/,
      ],
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'shade', '--start', '13-01'],
        /season start must be a date MM-DD/,
      ],
      [['assess', 'missing.csv', '--product', 'apricot-halves', '--method', 'shade'], /missing\.csv/],
    ]
    for (const [args, message] of cases) {
      const { io, err } = fakeIo()
      expect(await runCli([...args, '--quiet'], io)).toBe(2)
      expect(err.join('')).toMatch(message)
      expect(err.join('').trim().split('\n')).toHaveLength(1)
    }
  })
})

describe('dryhours compare', () => {
  it('ranks two files side by side and states the criterion', async () => {
    const { io, out } = fakeIo()
    const code = await runCli(
      [
        'compare',
        typical,
        'climate-demo/gullhaven-coast-2022-2024.epw',
        '--product',
        'grapes-to-raisins',
        '--method',
        'open-air',
        '--start',
        '07-15',
        '--end',
        '08-15',
        '--step-days',
        '15',
        '--criterion',
        'usable-hours-p10',
        '--quiet',
      ],
      io,
    )
    expect(code).toBe(0)
    const text = out.join('')
    expect(text).toMatch(/ranked by usable-hours-p10: usable drying hours in the season per year, P10/)
    const lines = text.split('\n').filter((l) => /^\s+[12]\s/.test(l))
    expect(lines[0]).toMatch(/Ardentine/)
    expect(lines[1]).toMatch(/Gullhaven/)
  })
  it('needs at least two files', async () => {
    const { io, err } = fakeIo()
    expect(await runCli(['compare', typical, '--product', 'figs', '--method', 'shade'], io)).toBe(2)
    expect(err.join('')).toMatch(/at least two weather files/)
  })
})

describe('dryhours assess --format html|csv: the report of the same assessment as --json', () => {
  const args = ['assess', typical, '--product', 'apricot-halves', '--method', 'shade', '--start', '07-01']
  const more = ['--end', '07-21', '--step-days', '10', '--quiet']
  it('--format html --out writes the summary that renders from the --json output (README command)', async () => {
    const json = fakeIo()
    expect(await runCli([...args, ...more, '--json'], json.io)).toBe(0)
    const a = JSON.parse(json.out.join('')) as Assessment
    const html = fakeIo()
    expect(await runCli([...args, ...more, '--format', 'html', '--out', 'summary.html'], html.io)).toBe(0)
    expect(html.out.join('')).toBe('')
    expect(html.err.join('')).toMatch(/wrote summary\.html/)
    const info = { fileName: 'ardentine-upland-typical-year.epw' }
    expect(html.written.get('summary.html')).toBe(renderReportHtml(a, { info }))
    const csv = fakeIo()
    expect(
      await runCli(
        [...args, ...more, '--format', 'csv', '--table', 'monthly-usable-hours', '--units', 'us'],
        csv.io,
      ),
    ).toBe(0)
    expect(csv.out.join('')).toBe(renderReportCsv(a, { units: 'us', info, table: 'monthly-usable-hours' }))
  })
  it('refuses an unknown format, units or table with exit 2 and a line naming what is accepted', async () => {
    for (const [extra, message] of [
      [['--format', 'pdf'], /--format must be one of text, json, html, csv/],
      [['--units', 'imperial'], /--units must be si or us/],
      [['--format', 'csv', '--table', 'nope'], /--table: table must be one of all, summary/],
    ] as const) {
      const f = fakeIo()
      expect(await runCli([...args, ...more, ...extra], f.io)).toBe(2)
      expect(f.err.join('')).toMatch(message)
    }
  })
})

describe('dryhours assess --param: any parameter of the method by its API name', () => {
  const base = ['assess', typical, '--product', 'apricot-halves', '--start', '07-01', '--end', '07-11']
  const tail = ['--step-days', '10', '--quiet', '--json']
  it('sets numbers and booleans of the chosen method (open-air surface per tray area, uncovered at night)', async () => {
    const f = fakeIo()
    const extra = [
      '--method',
      'open-air',
      '--param',
      'surfaceAreaPerTrayArea=1.2',
      '--param',
      'coveredAtNight=false',
    ]
    expect(await runCli([...base, ...extra, ...tail], f.io)).toBe(0)
    expect(JSON.parse(f.out.join('')).method).toMatchObject({
      surfaceAreaPerTrayArea: 1.2,
      coveredAtNight: false,
    })
  })
  it('refuses a name the method does not have, listing the ones it has (exit 2)', async () => {
    const f = fakeIo()
    expect(await runCli([...base, '--method', 'shade', '--param', 'tiltDeg=30', ...tail], f.io)).toBe(2)
    expect(f.err.join('')).toMatch(
      /--param tiltDeg: not a parameter of shade; its parameters are loadingKgPerM2, windFraction/,
    )
  })
})
