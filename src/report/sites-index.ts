/**
 * @module report/sites-index
 * The index of many farms' summaries (`dryhours assess --sites sites.csv --out-dir reports/`): one row per
 * farm with its file, its years, a one-line answer taken from its assessment (or its methods comparison)
 * and the name of its own summary, as an HTML page that links them, a CSV table or JSON. Nothing is
 * computed here: every figure is read from the farm's result.
 */
import type { Assessment } from '../analysis/assessment.ts'
import type { MethodComparison } from '../analysis/compare-methods.ts'
import { escapeHtml } from './escape.ts'
import { htmlDocument } from './report-html.ts'
import { type ReportTable, tableCsv } from './tables.ts'

export const SITES_INDEX_SCHEMA = 'dryhours.sites-index/1'

/** One farm of the index. */
export interface IndexEntry {
  name: string
  /** Its weather file, as the sites file wrote it. */
  file: string
  /** The name of its summary in the same folder. */
  output: string
  result: Assessment | MethodComparison
}

function isMethods(r: Assessment | MethodComparison): r is MethodComparison {
  return r.schema === 'dryhours.method-comparison/1'
}

const shareText = (p: number): string =>
  p >= 1 ? 'every year' : p <= 0 ? 'no year' : `${Math.round(100 * p)} % of years`

/** The one-line answer of a farm, from its result. */
export function farmHeadline(r: Assessment | MethodComparison): string {
  if (isMethods(r)) return r.recommendation.text
  const w = r.bestStartWindows[0]
  if (!w)
    return `No start date from ${r.season.start} to ${r.season.end} finishes within ${r.deadlineDays} days by ${r.methodLabel}.`
  return `Best start window ${w.from} to ${w.to}: finishes within ${r.deadlineDays} days in ${w.minProbabilityWithinDeadline >= 1 ? 'every year' : `at least ${shareText(w.minProbabilityWithinDeadline)}`}, median ${w.medianDaysToTarget ?? '–'} days (${r.methodLabel}).`
}

function years(r: Assessment | MethodComparison): string {
  if (r.site.typicalYear) return 'typical year'
  const a = isMethods(r) ? r.assessments[0] : r
  const y = a.coverage.years
  return y.length === 0 ? 'none' : y.length === 1 ? String(y[0]) : `${y[0]}–${y[y.length - 1]} (${y.length})`
}

/** The index as a table (HTML view and CSV). */
export function sitesIndexTable(entries: IndexEntry[]): ReportTable {
  return {
    id: 'sites-index',
    title: 'Summaries by farm',
    columns: ['farm', 'weather file', 'years', 'answer', 'summary'],
    rows: entries.map((e) => [e.name, e.file, years(e.result), farmHeadline(e.result), e.output]),
  }
}

/** The index page: a table with a link to every farm's summary. */
export function renderSitesIndexHtml(entries: IndexEntry[], title: string): string {
  const t = sitesIndexTable(entries)
  const rows = entries
    .map(
      (e, i) =>
        `<tr><th scope="row"><a href="${escapeHtml(encodeURI(e.output))}">${escapeHtml(e.name)}</a></th><td>${escapeHtml(e.file)}</td><td>${escapeHtml(String(t.rows[i][2]))}</td><td>${escapeHtml(String(t.rows[i][3]))}</td></tr>`,
    )
    .join('')
  const first = entries[0]?.result
  const about = first
    ? `${first.product.name}; start dates ${first.season.start} to ${first.season.end}; deadline ${first.deadlineDays} days.`
    : ''
  const article = `<article class="dryhours-report sites-index" data-report="sites-index">
<header class="report-header"><p class="kicker">dryhours · summaries by farm</p><h1>${escapeHtml(title)}</h1><p>${escapeHtml(about)} ${entries.length} farm${entries.length === 1 ? '' : 's'}; each name opens its summary.</p></header>
<section class="report-section"><table class="data" data-table="sites-index"><caption>${escapeHtml(t.title)}</caption><thead><tr><th scope="col">farm</th><th scope="col">weather file</th><th scope="col">years</th><th scope="col">answer</th></tr></thead><tbody>${rows}</tbody></table></section>
</article>`
  return htmlDocument(title, article)
}

/** The index as CSV. */
export function renderSitesIndexCsv(entries: IndexEntry[]): string {
  return tableCsv(sitesIndexTable(entries))
}

/** The index as JSON: every farm's name, file, summary file and answer. */
export function sitesIndexJson(entries: IndexEntry[]): Record<string, unknown> {
  return {
    schema: SITES_INDEX_SCHEMA,
    sites: entries.map((e) => ({
      name: e.name,
      file: e.file,
      output: e.output,
      typicalYear: e.result.site.typicalYear,
      answer: farmHeadline(e.result),
    })),
  }
}

/** The index as plain text. */
export function renderSitesIndexText(entries: IndexEntry[]): string {
  return `${entries.map((e) => `${e.name} (${e.file}) → ${e.output}\n  ${farmHeadline(e.result)}`).join('\n')}\n`
}
