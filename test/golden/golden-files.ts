/**
 * The golden assessments (test/golden/cases.ts) computed now: their JSON, and for the cases marked
 * `rendered` the CSV tables and the HTML summary. `npm run golden:update` writes them to
 * test/fixtures/golden/; test/golden/golden.test.ts compares them with the committed files.
 */
import { createHash } from 'node:crypto'
import { assess } from '../../src/analysis/assess.ts'
import { compare } from '../../src/analysis/compare.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions, computeSolarColumns } from '../../src/drying/hourly-conditions.ts'
import { type DryingMethodInput, parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { renderReportCsv } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { demoSeries } from '../drying/demo-weather.ts'
import { GOLDEN_CASES, GOLDEN_COMPARISON, type GoldenCase } from './cases.ts'

export interface GoldenFile {
  /** File name under test/fixtures/golden/. */
  name: string
  text: string
}

/** Footer of the golden HTML reports (the core reads no clock; entry points pass their own). */
export const GOLDEN_REPORT_FOOTER = 'golden report'

const json = (value: unknown): string => `${JSON.stringify(value, null, 1)}\n`

/** The files of one case. */
export function goldenFilesOf(c: GoldenCase): GoldenFile[] {
  const series = demoSeries(c.site)
  const a = assess(series, c.options)
  const out: GoldenFile[] = [{ name: `${c.id}.json`, text: json(a) }]
  if (c.rendered) {
    out.push({ name: `${c.id}.csv`, text: renderReportCsv(a) })
    out.push({ name: `${c.id}.html`, text: renderReportHtml(a, { footer: GOLDEN_REPORT_FOOTER }) })
  }
  return out
}

/** The comparison's JSON. */
export function goldenComparisonFile(): GoldenFile {
  const g = GOLDEN_COMPARISON
  return { name: `${g.id}.json`, text: json(compare(g.sites.map(demoSeries), g.options)) }
}

export function allGoldenFiles(): GoldenFile[] {
  return [...GOLDEN_CASES.flatMap(goldenFilesOf), goldenComparisonFile(), hourlyColumnDigests()]
}

/**
 * A SHA-256 of every hourly column of the per-hour engine (all columns kept, verdict on) for each method
 * at the dry upland with the raisin profile: the assessment JSON is rounded for reading, these digests
 * catch a change in the last bit of any hour.
 */
export function hourlyColumnDigests(): GoldenFile {
  const series = demoSeries('dryUpland')
  const profile = productById('grapes-to-raisins')
  const response = tabulatedResponse(productResponse(profile))
  const solar = computeSolarColumns(series)
  const options = {
    targetDb: moistureDbFromWbPct(18),
    initialWbPct: 78.2,
    loadingKgPerM2: 12,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: 70,
    solar,
  }
  const digests: Record<string, Record<string, string>> = {}
  const methods: DryingMethodInput[] = [
    { kind: 'open-air' },
    { kind: 'open-air', coveredAtNight: false, coveredInRain: false },
    { kind: 'shade' },
    { kind: 'solar-cabinet' },
    { kind: 'heated' },
    { kind: 'heated', setPointC: 55 },
  ]
  for (const input of methods) {
    const method = parseDryingMethod(input)
    const c = computeHourlyConditions(series, method, response, options)
    const entry: Record<string, string> = {}
    for (const [name, value] of Object.entries(c).sort(([a], [b]) => a.localeCompare(b))) {
      if (ArrayBuffer.isView(value)) {
        const bytes = new Uint8Array(value.buffer, value.byteOffset, value.byteLength)
        entry[name] = createHash('sha256').update(bytes).digest('hex')
      } else if (typeof value === 'number' || typeof value === 'boolean') entry[name] = String(value)
    }
    // batches every 9 days through the file, with the heated backup, moisture after every hour
    const backup = computeHourlyConditions(series, parseDryingMethod({ kind: 'heated' }), response, {
      ...options,
      verdict: false,
    })
    const traces = createHash('sha256')
    const results = createHash('sha256')
    for (let start = 8; start + 24 * 40 < series.hours; start += 24 * 9) {
      const b = simulateBatch(
        c,
        response,
        {
          startIndex: start,
          maxHours: 24 * 40,
          initialDb: 78.2 / 21.8,
          targetDb: 18 / 82,
          recordTrace: true,
        },
        method.kind === 'heated' ? undefined : backup,
      )
      const t = b.trace as Float64Array
      traces.update(new Uint8Array(t.buffer, t.byteOffset, t.byteLength))
      const { trace: _t, productTrace: _p, usedBackup: _u, ...figures } = b
      results.update(JSON.stringify(figures))
    }
    entry['batch traces'] = traces.digest('hex')
    entry['batch results'] = results.digest('hex')
    digests[JSON.stringify(input)] = entry
  }
  return { name: 'hourly-column-digests.json', text: json(digests) }
}
