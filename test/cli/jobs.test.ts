// The three jobs from the command line, with the demo files: a grower's methods side by side, a co-op's
// sites with their own settings, an advisor's summaries for many farms. Files go to a temporary folder.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { nodeIo } from '../../src/node/cli.ts'

const dir = mkdtempSync(join(tmpdir(), 'dryhours-jobs-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))

function io() {
  const out: string[] = []
  const err: string[] = []
  const cli: CliIo = { ...nodeIo, stdout: (t) => out.push(t), stderr: (t) => err.push(t) }
  return { cli, out: () => out.join(''), err: () => err.join('') }
}

const season = ['--start', '07-01', '--end', '08-12', '--step-days', '7', '--quiet']

describe('the grower: methods side by side', () => {
  it('assess --method open-air,solar-cabinet,heated --json: every method’s assessment and the comparison', async () => {
    const f = io()
    const code = await runCli(
      [
        'assess',
        'climate-demo/ardentine-upland-2021-2024-utc.csv',
        '--product',
        'grapes-to-raisins',
        '--method',
        'open-air,solar-cabinet,heated',
        '--lat',
        '38.3',
        '--lon',
        '-2.6',
        '--elevation',
        '1050',
        '--site-tz',
        'Europe/Madrid',
        '--utc-offset',
        '0',
        '--currency',
        'EUR',
        '--price',
        'propane=0.8',
        '--set-point',
        '55',
        ...season,
        '--json',
      ],
      f.cli,
    )
    expect(code, f.err()).toBe(0)
    const c = JSON.parse(f.out())
    expect(c.schema).toBe('dryhours.method-comparison/1')
    expect(c.assessments.map((a: { method: { kind: string } }) => a.method.kind)).toEqual([
      'open-air',
      'solar-cabinet',
      'heated',
    ])
    // a method-specific flag goes to its own method; the backup heater of the others takes it too
    expect(c.assessments[2].method.setPointC).toBe(55)
    expect(c.assessments[0].heat.setPointC).toBe(55)
    expect(c.currency).toBe('EUR')
    expect(c.calendar.rows).toHaveLength(3)
    expect(c.recommendation.criterion).toMatch(/lowest fuel cost per kg of dried product/)
  })

  it('the text names the recommendation, its criterion, the calendar and its legend', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'assess',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'all',
          ...season,
        ],
        f.cli,
      ),
      f.err(),
    ).toBe(0)
    const t = f.out()
    expect(t).toMatch(/^Recommendation: /m)
    expect(t).toMatch(/criterion: the lowest fuel cost per kg of dried product/)
    expect(t).toContain('Season calendar')
    expect(t).toMatch(/ D dries: .*80 % of years/)
    expect(t).toContain('typical-year file')
    for (const k of ['open-air', 'shade', 'solar-cabinet', 'heated'])
      expect(t).toMatch(new RegExp(`^${k} `, 'm'))
  })

  it('--format html and csv: the comparison and each method’s report; --table picks one table', async () => {
    const html = join(dir, 'methods.html')
    const f = io()
    expect(
      await runCli(
        [
          'assess',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'shade,heated',
          ...season,
          '--format',
          'html',
          '--out',
          html,
        ],
        f.cli,
      ),
      f.err(),
    ).toBe(0)
    const h = readFileSync(html, 'utf8')
    expect(h).toContain('data-report="methods"')
    expect(h.match(/data-report="assessment"/g)).toHaveLength(2)
    expect(h).toContain('data-table="season-calendar"')
    const g = io()
    expect(
      await runCli(
        [
          'assess',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'shade,heated',
          ...season,
          '--format',
          'csv',
          '--table',
          'season-calendar',
        ],
        g.cli,
      ),
      g.err(),
    ).toBe(0)
    expect(g.out().split('\r\n')[0]).toBe(
      'method,week of 07-01,week of 07-08,week of 07-15,week of 07-22,week of 07-29,week of 08-05,week of 08-12',
    )
  })

  it('refuses a method listed twice and a --param no listed method has', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'assess',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'shade,shade',
        ],
        f.cli,
      ),
    ).toBe(2)
    expect(f.err()).toMatch(/lists shade twice/)
    const g = io()
    expect(
      await runCli(
        [
          'assess',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'shade,heated',
          '--param',
          'tiltDeg=30',
        ],
        g.cli,
      ),
    ).toBe(2)
    expect(g.err()).toMatch(/--param tiltDeg: not a parameter of shade or heated; shade takes/)
  })
})

describe('the grower with grain: a natural-air bin beside heated air', () => {
  it('assess --method natural-air-bin,heated with --airflow: the bin at the airflow serving every start month, its fan, its cautions', async () => {
    const f = io()
    const args = [
      'assess',
      'climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv',
      '--tz',
      'America/Chicago',
      '--product',
      'shelled-corn',
      '--method',
      'natural-air-bin,heated',
      '--initial-wb',
      '20',
      '--target-wb',
      '15.5',
      '--start',
      '09-15',
      '--end',
      '10-15',
      '--step-days',
      '7',
      '--airflow',
      '1,2,3',
      '--currency',
      'USD',
      '--price',
      'electricity=0.12',
      '--quiet',
    ]
    expect(await runCli([...args, '--json'], f.cli), f.err()).toBe(0)
    const c = JSON.parse(f.out())
    expect(c.methods.map((m: { kind: string }) => m.kind)).toEqual(['natural-air-bin', 'heated'])
    const bin = c.methods[0].bin
    // the bin flags went to the bin, the heated method has none
    expect(
      c.assessments[0].bin.airflows.map(
        (a: { airflowM3PerMinPerTonne: number }) => a.airflowM3PerMinPerTonne,
      ),
    ).toEqual([1, 2, 3])
    expect(c.assessments[1].bin).toBeUndefined()
    expect([1, 2, 3]).toContain(bin.airflowM3PerMinPerTonne)
    expect(bin.electricityPricePerKwh).toBe(0.12)
    expect(c.methods[1].bin).toBeNull()
    const t = io()
    expect(await runCli(args, t.cli), t.err()).toBe(0)
    expect(t.out()).toMatch(/^Grain in a bin: natural-air bin .* figures at \d/m)
    expect(t.out()).toMatch(/the fan uses [\d.]+ kWh per tonne, [\d.]+ USD per tonne at 0\.12 USD per kWh/)
    // the grain-bin cautions (engulfment, electrical work) come with the comparison
    expect(t.out()).toMatch(/Cautions:[\s\S]*licensed electricians[\s\S]*engulfs/)
  })

  it('--method all with fruit lists the bin as not assessed with its reason; bin flags without the bin are refused', async () => {
    const f = io()
    const code = await runCli(
      [
        'assess',
        'climate-demo/ardentine-upland-typical-year.epw',
        '--product',
        'apricot-halves',
        '--method',
        'all',
        ...season,
        '--json',
      ],
      f.cli,
    )
    expect(code, f.err()).toBe(0)
    const c = JSON.parse(f.out())
    const bin = c.notAssessed.find((n: { kind: string }) => n.kind === 'natural-air-bin')
    expect(bin?.reason).toMatch(/grain/)
    const g = io()
    const refused = await runCli(
      [
        'assess',
        'climate-demo/ardentine-upland-typical-year.epw',
        '--product',
        'apricot-halves',
        '--method',
        'shade,heated',
        '--airflow',
        '2',
        ...season,
      ],
      g.cli,
    )
    expect(refused).toBe(2)
    expect(g.err()).toMatch(/--airflow goes with --method natural-air-bin/)
  })
})

describe('the co-op: sites with their own settings', () => {
  it('compare --sites: ranked best first, criterion and tie-break stated, per-site settings used', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'compare',
          '--sites',
          'climate-demo/verrowmark-sites.csv',
          '--product',
          'apricot-halves',
          '--method',
          'open-air',
          ...season,
          '--json',
        ],
        f.cli,
      ),
      f.err(),
    ).toBe(0)
    const c = JSON.parse(f.out())
    expect(c.sites.map((s: { rank: number }) => s.rank)).toEqual([1, 2, 3, 4])
    expect(c.sites.map((s: { site: string }) => s.site).sort()).toEqual([
      'Ardentine Ridge',
      'Gullhaven Point',
      'Quillow Landing',
      'Tamarel Estate',
    ])
    expect(c.tieBreak).toMatch(/then by the order they were given/)
    c.sites.forEach((s: { site: string; file: string }, i: number) => {
      expect(c.assessments[i].site.name).toBe(s.site)
    })
    const quillow = c.assessments.find((a: { site: { name: string } }) => a.site.name === 'Quillow Landing')
    expect(quillow.site.latitudeDeg).toBe(43.6)
    const gull = c.assessments.find((a: { site: { name: string } }) => a.site.name === 'Gullhaven Point')
    expect(gull.site.latitudeDeg).toBe(57.3) // the EPW's own location
  })

  it('a flag for every file that would move a site its file states is refused, naming the file and both values', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'compare',
          'climate-demo/gullhaven-coast-2022-2024.epw',
          'climate-demo/ardentine-upland-typical-year.epw',
          '--product',
          'apricot-halves',
          '--method',
          'open-air',
          '--lat',
          '40',
          ...season,
        ],
        f.cli,
      ),
    ).toBe(2)
    expect(f.err()).toMatch(
      /gullhaven-coast-2022-2024\.epw: --lat 40 replaces the latitude the file states \(57\.3° N\).*--sites/,
    )
  })

  it('a site whose row overrides its file is warned of, naming the site, the option and both values', async () => {
    const sites = join(dir, 'sites-override.csv')
    const demo = join(process.cwd(), 'climate-demo')
    writeFileSync(
      sites,
      `name,file,lat\nCoast,${join(demo, 'gullhaven-coast-2022-2024.epw')},50\nRidge,${join(demo, 'ardentine-upland-typical-year.epw')},\n`,
    )
    const f = io()
    expect(
      await runCli(
        ['compare', '--sites', sites, '--product', 'apricot-halves', '--method', 'open-air', ...season],
        f.cli,
      ),
      f.err(),
    ).toBe(0)
    expect(f.err()).toContain("warning: site 'Coast' (")
    expect(f.err()).toContain('lat=50 replaces the latitude the file states (57.3° N)')
    expect(f.out()).toMatch(/Caveat: Ridge is a typical year/)
    expect(f.out()).toContain('Ridge (typical year)')
  })

  it('errors name the site and its file', async () => {
    const sites = join(dir, 'sites-bad.csv')
    writeFileSync(sites, 'name,file,lat\nNowhere,no-such-file.csv,10\nOther,also-missing.csv,\n')
    const f = io()
    expect(
      await runCli(
        ['compare', '--sites', sites, '--product', 'apricot-halves', '--method', 'open-air', ...season],
        f.cli,
      ),
    ).toBe(2)
    expect(f.err()).toMatch(
      /site 'Nowhere' \(.*sites-bad\.csv line 2, file .*no-such-file\.csv\): cannot read/,
    )
    const g = io()
    expect(
      await runCli(
        [
          'compare',
          '--sites',
          'climate-demo/verrowmark-sites.csv',
          '--lat',
          '3',
          '--product',
          'apricot-halves',
          '--method',
          'open-air',
        ],
        g.cli,
      ),
    ).toBe(2)
    expect(g.err()).toMatch(/--lat cannot be given with --sites/)
  })

  it('compare --format csv: the ranking, how it was ranked, then each site’s tables', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'compare',
          '--sites',
          'climate-demo/verrowmark-sites.csv',
          '--product',
          'apricot-halves',
          '--method',
          'open-air',
          ...season,
          '--format',
          'csv',
          '--table',
          'ranking-rules',
        ],
        f.cli,
      ),
      f.err(),
    ).toBe(0)
    expect(f.out()).toMatch(/^item,value\r\ncriterion,"probability-within-deadline: /)
    expect(f.out()).toContain(
      'tie-break,"sites equal on probability-within-deadline are ordered by usable-hours-p10',
    )
  })
})

describe('the advisor: summaries for many farms', () => {
  it('assess --sites --format html --out-dir: one summary per farm and an index linking them; nothing overwritten', async () => {
    const out = join(dir, 'reports')
    const args = [
      'assess',
      '--sites',
      'climate-demo/verrowmark-sites.csv',
      '--product',
      'apricot-halves',
      '--method',
      'open-air',
      ...season,
      '--format',
      'html',
      '--out-dir',
      out,
    ]
    const f = io()
    expect(await runCli(args, f.cli), f.err()).toBe(0)
    expect(readdirSync(out).sort()).toEqual([
      'ardentine-ridge.html',
      'gullhaven-point.html',
      'index.html',
      'quillow-landing.html',
      'tamarel-estate.html',
    ])
    const index = readFileSync(join(out, 'index.html'), 'utf8')
    for (const name of ['ardentine-ridge', 'gullhaven-point', 'quillow-landing', 'tamarel-estate'])
      expect(index).toContain(`href="${name}.html"`)
    expect(readFileSync(join(out, 'quillow-landing.html'), 'utf8')).toContain('Quillow Landing')
    // a second run refuses before writing anything; --force replaces
    writeFileSync(join(out, 'index.html'), 'mine')
    const g = io()
    expect(await runCli(args, g.cli)).toBe(2)
    expect(g.err()).toMatch(/already exist.*--force/)
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toBe('mine')
    const h = io()
    expect(await runCli([...args, '--force'], h.cli), h.err()).toBe(0)
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('data-report="sites-index"')
  })

  it('--out refuses an existing file without --force, on assess and compare alike', async () => {
    const file = join(dir, 'exists.json')
    writeFileSync(file, '{}')
    for (const cmd of [
      [
        'assess',
        'climate-demo/ardentine-upland-typical-year.epw',
        '--product',
        'apricot-halves',
        '--method',
        'shade',
      ],
      [
        'compare',
        '--sites',
        'climate-demo/verrowmark-sites.csv',
        '--product',
        'apricot-halves',
        '--method',
        'shade',
      ],
    ]) {
      const f = io()
      expect(await runCli([...cmd, ...season, '--json', '--out', file], f.cli)).toBe(2)
      expect(f.err()).toMatch(/already exists: give --force/)
      expect(readFileSync(file, 'utf8')).toBe('{}')
    }
  })

  it('with --sites, html and csv need --out-dir; json without it is one document of every site', async () => {
    const f = io()
    expect(
      await runCli(
        [
          'assess',
          '--sites',
          'climate-demo/verrowmark-sites.csv',
          '--product',
          'apricot-halves',
          '--method',
          'shade',
          ...season,
          '--format',
          'html',
        ],
        f.cli,
      ),
    ).toBe(2)
    expect(f.err()).toMatch(/give --out-dir/)
    const g = io()
    expect(
      await runCli(
        [
          'assess',
          '--sites',
          'climate-demo/verrowmark-sites.csv',
          '--product',
          'apricot-halves',
          '--method',
          'shade',
          ...season,
          '--json',
        ],
        g.cli,
      ),
      g.err(),
    ).toBe(0)
    const all = JSON.parse(g.out())
    expect(all.sites.map((s: { name: string }) => s.name)).toEqual([
      'Ardentine Ridge',
      'Quillow Landing',
      'Gullhaven Point',
      'Tamarel Estate',
    ])
  })
})
