/**
 * The natural-air bin method end to end: the assessment's `bin` block on the demo climates (invented weather: these
 * are consistency checks of the method, not checks against the world — those are in test/drying/deep-bed/), the
 * planner's count of bin work and the API's refusal above the budget, the CLI text, the report section, its CSV
 * tables and its US display.
 */
import { readFileSync } from 'node:fs'
import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import type { Assessment } from '../../src/analysis/assessment.ts'
import type { BinStartAirflow } from '../../src/analysis/assessment-bin.ts'
import { rankAssessments } from '../../src/analysis/compare.ts'
import {
  AssessOptionError,
  assessmentCost,
  BIN_LAYER_HOUR_IN_BATCH_HOURS,
  estimateBatchHours,
  planAssessment,
} from '../../src/analysis/plan.ts'
import { createApp } from '../../src/api/app.ts'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import {
  BUSHEL_WEIGHT_KG,
  m3PerMinPerTonneFromCfmPerBu,
  PA_PER_INCH_OF_WATER,
} from '../../src/drying/deep-bed/airflow-resistance.ts'
import { productById } from '../../src/product/catalogue.ts'
import { formatNumber } from '../../src/report/display-units.ts'
import { renderReportCsv } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { demoSeries } from '../drying/demo-weather.ts'

const corn = productById('shelled-corn')
const wheat = productById('wheat')

/** Corn harvested into a bin in the humid valley, Sep 15 – Oct 15, three airflows (as the golden case). */
const valleyOptions = {
  product: corn,
  method: { kind: 'natural-air-bin' as const, airflowsM3PerMinPerTonne: [1, 2, 3] },
  initialWbPct: 20,
  targetWbPct: 15.5,
  seasonStart: '09-15',
  seasonEnd: '10-15',
}
let valleyCache: Assessment | undefined
function valley(): Assessment {
  valleyCache ??= assess(demoSeries('humidValley'), valleyOptions)
  return valleyCache
}

/** Wheat harvested into a bin in the dry upland in July, two airflows. */
let uplandCache: Assessment | undefined
function upland(): Assessment {
  uplandCache ??= assess(demoSeries('dryUpland'), {
    product: wheat,
    method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [0.5, 1, 2], depthM: 3 },
    initialWbPct: 18,
    targetWbPct: 13,
    seasonStart: '07-01',
    seasonEnd: '07-29',
    maxDays: 40,
  })
  return uplandCache
}

const days = (s: BinStartAirflow) => s.daysUntilTopLayerDry.median ?? Number.POSITIVE_INFINITY

function byStart(a: Assessment): Map<string, BinStartAirflow[]> {
  const m = new Map<string, BinStartAirflow[]>()
  for (const s of a.bin?.startDates ?? []) m.set(s.startDate, [...(m.get(s.startDate) ?? []), s])
  for (const rows of m.values()) rows.sort((x, y) => x.airflowM3PerMinPerTonne - y.airflowM3PerMinPerTonne)
  return m
}

describe('natural-air bin on the demo climates', () => {
  for (const [name, get] of [
    ['humid valley, corn', valley],
    ['dry upland, wheat', upland],
  ] as const) {
    it(`${name}: more airflow gives fewer days until the top layer is dry and a lower top-layer DML`, () => {
      const a = get()
      expect(a.bin).toBeDefined()
      const starts = byStart(a)
      expect(starts.size).toBeGreaterThanOrEqual(5)
      let finite = 0
      for (const [date, rows] of starts) {
        expect(rows.length, date).toBeGreaterThanOrEqual(2)
        for (let i = 1; i < rows.length; i++) {
          const lo = rows[i - 1]
          const hi = rows[i]
          expect(days(hi), `${date}: days at ${hi.airflowM3PerMinPerTonne}`).toBeLessThanOrEqual(days(lo))
          if (Number.isFinite(days(lo))) expect(days(hi)).toBeLessThan(days(lo))
          expect(hi.topLayerDryMatterLossPct.median as number).toBeLessThan(
            lo.topLayerDryMatterLossPct.median as number,
          )
          expect(hi.topLayerDryMatterLossPct.p90 as number).toBeLessThan(
            lo.topLayerDryMatterLossPct.p90 as number,
          )
          // more air costs more fan power: static pressure and power per tonne rise with the airflow
          expect(hi.fanEnergyKwhPerTonne.median as number).toBeGreaterThan(0)
        }
        finite += rows.filter((r) => r.daysUntilTopLayerDry.median !== null).length
      }
      expect(finite).toBeGreaterThan(3)
      const fans = a.bin?.airflows ?? []
      for (let i = 1; i < fans.length; i++) {
        expect(fans[i].staticPressurePa).toBeGreaterThan(fans[i - 1].staticPressurePa)
        expect(fans[i].fanPowerKwPerTonne).toBeGreaterThan(fans[i - 1].fanPowerKwPerTonne)
      }
    })
  }

  it('JSON: the quantities spelt out, the minimum airflow per start month consistent with the start-date rows', () => {
    const b = valley().bin
    if (!b) throw new Error('no bin')
    expect(valley().startDates).toEqual([])
    expect(b.spoilage.dryMatterLossLimitPct).toBe(0.5)
    expect(b.minimumAirflowByMonth.map((m) => m.month)).toEqual([9, 10])
    for (const m of b.minimumAirflowByMonth) {
      const rows = b.startDates.filter((s) => s.month === m.month)
      const ok = (q: number) =>
        rows.filter((s) => s.airflowM3PerMinPerTonne === q).every((s) => s.meetsRequiredShare)
      const candidates = b.airflows.map((q) => q.airflowM3PerMinPerTonne)
      const expected = candidates.find(ok) ?? null
      expect(m.minimumAirflowM3PerMinPerTonne).toBe(expected)
      if (expected !== null)
        expect(m.minimumAirflowCfmPerBushel).toBeCloseTo(
          expected / m3PerMinPerTonneFromCfmPerBu(1, BUSHEL_WEIGHT_KG['shelled-corn']),
          2,
        )
    }
    for (const s of b.startDates) {
      expect(s.yearsSafe).toBe(s.byYear.filter((y) => y.safe).length)
      expect(s.passesDryMatterLossLimitP90).toBe((s.topLayerDryMatterLossPct.p90 as number) < 0.5)
      for (const y of s.byYear) {
        expect(y.passesDryMatterLossLimit).toBe(y.topLayerDryMatterLossPct < 0.5)
        expect(y.safe).toBe(y.passesDryMatterLossLimit && y.daysUntilTopLayerDry !== null)
      }
    }
    // 1 cfm/bu of corn is 1.1 m³/min per t (56 lb bushel): the conversion the JSON and the text use
    expect(m3PerMinPerTonneFromCfmPerBu(1, BUSHEL_WEIGHT_KG['shelled-corn'])).toBeCloseTo(1.115, 3)
    for (const f of b.airflows)
      expect(f.staticPressureInchesWater).toBeCloseTo(f.staticPressurePa / PA_PER_INCH_OF_WATER, 1)
    expect(b.cautions.join(' ')).toMatch(/licensed electricians/)
    expect(b.cautions.join(' ')).toMatch(/engulf/)
    expect(b.cautions.join(' ')).toMatch(/mycotoxins/)
  })

  it('a typical-year file gives one year per run and says so in the rule', () => {
    const a = assess(demoSeries('typicalUpland'), {
      product: wheat,
      method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1] },
      initialWbPct: 17,
      targetWbPct: 13,
      seasonStart: '07-01',
      seasonEnd: '07-15',
      maxDays: 30,
    })
    const b = a.bin
    if (!b) throw new Error('no bin')
    expect(b.typicalYear).toBe(true)
    expect(b.startDates.every((s) => s.years === 1)).toBe(true)
    expect(b.rule).toMatch(/typical year/)
  })
})

describe('planner and limits', () => {
  it('counts a bin as years × starts × airflows × season hours × layers, in batch-hour equivalents', () => {
    const plan = planAssessment(valleyOptions)
    expect(plan.bin).toEqual({ airflows: 3, layers: 20 })
    expect(plan.startDays.length).toBe(5) // every 7 days from 09-15 to 10-15
    const hours = demoSeries('humidValley').hours
    const cost = assessmentCost(plan, hours)
    expect(cost.binRuns).toBe(5 * 3 * cost.years)
    expect(cost.binLayerHours).toBe(cost.binRuns * 60 * 24 * 20)
    expect(cost.batchHours).toBe(cost.binLayerHours * BIN_LAYER_HOUR_IN_BATCH_HOURS)
    expect(cost.batches).toBe(0)
    // the count grows with each factor
    const more = estimateBatchHours(
      {
        ...valleyOptions,
        method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1, 2, 3, 4], layers: 40 },
      },
      [hours],
    )
    expect(more).toBe((cost.batchHours * 4 * 2) / 3)
    // a batch method does not count bin work
    expect(
      assessmentCost(planAssessment({ ...valleyOptions, method: { kind: 'heated' } }), hours).binRuns,
    ).toBe(0)
  })

  it('refuses fruit in a grain bin, naming the method', () => {
    let error: unknown
    try {
      planAssessment({ product: productById('apricot-halves'), method: { kind: 'natural-air-bin' } })
    } catch (e) {
      error = e
    }
    expect(error).toBeInstanceOf(AssessOptionError)
    expect((error as AssessOptionError).option).toBe('method')
    expect((error as Error).message).toMatch(/grain in a bin.*shelled-corn/)
  })

  it('the API refuses a bin request above the work budget with 422, naming its levers; a smaller one runs', async () => {
    const file = await readFile('climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv')
    const small = createApp({ maxBatchHours: 5_000_000 })
    const big = await small.request(
      '/v1/assess?product=shelled-corn&method=natural-air-bin&tz=America/Chicago&airflow=0.5,1,1.5,2,3&start=09-01&end=10-31',
      { method: 'POST', body: file, headers: { 'content-type': 'text/csv' } },
    )
    expect(big.status).toBe(422)
    const problem = (await big.json()) as { type: string; detail: string; errors: { path: string }[] }
    expect(problem.type).toMatch(/too-much-work/)
    expect(problem.detail).toMatch(/airflows/)
    expect(problem.errors.map((e) => e.path)).toContain('airflow')
    const ok = await small.request(
      '/v1/assess?product=shelled-corn&method=natural-air-bin&tz=America/Chicago&airflow=1,3&start=09-15&end=09-29&initialWb=20&targetWb=15.5&binDepth=3',
      { method: 'POST', body: file, headers: { 'content-type': 'text/csv' } },
    )
    expect(ok.status).toBe(200)
    const a = (await ok.json()) as Assessment
    expect(a.bin?.airflows.map((q) => q.airflowM3PerMinPerTonne)).toEqual([1, 3])
    expect(a.bin?.bin.depthM).toBe(3)
    // a bin field with another method is refused
    const wrong = await small.request('/v1/assess?product=shelled-corn&method=heated&airflow=1', {
      method: 'POST',
      body: file,
      headers: { 'content-type': 'text/csv' },
    })
    expect(wrong.status).toBe(400)
  })
})

function fakeIo() {
  const out: string[] = []
  const err: string[] = []
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async (p) => new Uint8Array(await readFile(p)),
    writeFile: async () => {},
  }
  return { io, out, err }
}

describe('the CLI, the report and the comparison', () => {
  // the README's command (section "Grain in a bin"): the contract that it runs and answers as documented
  const readme = readFileSync('README.md', 'utf8')
  const section = readme.slice(readme.indexOf('### Grain in a bin'))
  const line = section.split('\n').find((l) => l.startsWith('npx dryhours assess '))
  if (!line) throw new Error('README: no bin command')
  const args = [...line.slice('npx dryhours '.length).split(' '), '--quiet']

  it('the text answer carries the minimum airflow per start month and the per-start rows, and equals the JSON', async () => {
    const { io, out } = fakeIo()
    expect(await runCli(args, io)).toBe(0)
    const text = out.join('')
    expect(text).toMatch(/Minimum airflow per start month/)
    const b = valley().bin
    if (!b) throw new Error('no bin')
    for (const m of b.minimumAirflowByMonth) {
      const line = text.split('\n').find((l) => l.startsWith(`  ${m.month === 9 ? 'Sep' : 'Oct'}:`))
      expect(line).toBeDefined()
      if (m.minimumAirflowM3PerMinPerTonne === null) expect(line).toMatch(/none of the airflows/)
      else expect(line).toContain(`${m.minimumAirflowM3PerMinPerTonne.toFixed(2)} m³/min per t`)
    }
    for (const s of b.startDates)
      expect(text).toContain(`${s.startDate}  ${s.airflowM3PerMinPerTonne.toFixed(2).padStart(8)}`)
    expect(text).toMatch(/engulf/)
    // --airflow-cfm-bu converts with the bushel weight; a bin flag with another method is a usage error
    const cfm = fakeIo()
    const at = args.indexOf('--airflow')
    const cfmArgs = [
      ...args.slice(0, at),
      '--airflow-cfm-bu',
      '1',
      ...args.slice(at + 2),
      '--end',
      '09-15',
      '--json',
    ]
    expect(await runCli(cfmArgs, cfm.io)).toBe(0)
    const a = JSON.parse(cfm.out.join('')) as Assessment
    expect(a.bin?.airflows[0].airflowCfmPerBushel).toBeCloseTo(1, 2)
    const wrong = fakeIo()
    expect(
      await runCli(
        ['assess', args[1], '--product', 'shelled-corn', '--method', 'heated', '--bin-depth', '3'],
        wrong.io,
      ),
    ).toBe(2)
    expect(wrong.err.join('')).toMatch(/--bin-depth goes with --method natural-air-bin/)
  })

  it('the report: the minimum-airflow table, the charts with their numbers, the limit, cautions; US units', () => {
    const a = valley()
    const b = a.bin
    if (!b) throw new Error('no bin')
    const html = renderReportHtml(a)
    expect(html).toContain('data-section="bin"')
    expect(html).not.toContain('data-section="start-dates"')
    expect(html).toContain('data-table="bin-minimum-airflow"')
    expect(html).toMatch(/Grain of 20\.0 % put in the bin/)
    // the DML chart's points are the JSON's P90 values, one series per airflow; the limit is drawn
    const dml = html.slice(
      html.indexOf('id="fig-bin-dml-svg"'),
      html.indexOf('</svg>', html.indexOf('id="fig-bin-dml-svg"')),
    )
    expect(dml).toContain('data-value="0.5"')
    for (const [si, q] of b.airflows.entries()) {
      for (const s of b.startDates.filter((x) => x.airflowM3PerMinPerTonne === q.airflowM3PerMinPerTonne)) {
        expect(dml).toContain(
          `data-series="${si}" data-x="${s.startDate}" data-value="${s.topLayerDryMatterLossPct.p90 ?? ''}"`,
        )
      }
    }
    expect(html).toMatch(/licensed electricians/)
    const us = renderReportHtml(a, { units: 'us' })
    expect(us).toMatch(/cfm\/bu/)
    expect(us).toMatch(/in\. w\.c\./)
    expect(us).toContain(`${formatNumber(b.bin.bushels)} bu`)
    const csv = renderReportCsv(a, { table: 'bin-minimum-airflow' })
    expect(csv.split('\r\n')[0]).toMatch(/start month/)
    expect(csv).toMatch(/September/)
  })

  it('compare ranks bins by the mean share of safe years and gives each site the airflow for the season', () => {
    const c = rankAssessments([valley(), upland()], 'probability-within-deadline', ['valley', 'upland'])
    expect(c.criterionDescription).toMatch(/top layer of the bin/)
    for (const s of c.sites) expect(s).toHaveProperty('binSeasonMinimumAirflowM3PerMinPerTonne')
    const meanShare = (a: Assessment) =>
      (a.bin?.startDates ?? []).reduce((x, r) => x + r.shareOfYearsSafe, 0) / (a.bin?.startDates.length ?? 1)
    const expected = meanShare(upland()) >= meanShare(valley()) ? 'upland' : 'valley'
    expect(c.sites[0].site).toBe(expected)
  })
})
