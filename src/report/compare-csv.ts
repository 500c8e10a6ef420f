/**
 * @module report/compare-csv
 * A comparison of sites as CSV: the ranking (the same table as the HTML), the ranking's criterion,
 * tie-break and caveats, then every site's own report tables, best site first. `table` picks one table of
 * the ranking (`site-comparison`, `ranking-rules`).
 */
import type { Comparison } from '../analysis/compare.ts'
import { comparisonTable } from './compare-html.ts'
import type { UnitSystem } from './display-units.ts'
import { reportTables } from './report-csv.ts'
import { type ReportTable, tableCsv, tablesCsv } from './tables.ts'

/** The criterion, the tie-break, and per site whether it is a typical year and what placed it. */
export function rankingRulesTable(c: Comparison): ReportTable {
  return {
    id: 'ranking-rules',
    title: 'How the sites were ranked',
    columns: ['item', 'value'],
    rows: [
      ['criterion', `${c.criterion}: ${c.criterionDescription}`],
      ['tie-break', c.tieBreak],
      ...c.caveats.map((x) => ['caveat', x]),
      ...c.sites.map((s) => [
        `rank ${s.rank}: ${s.site}`,
        `${s.file ?? ''}${s.typicalYear ? '; typical year' : `; ${s.years} year${s.years === 1 ? '' : 's'}`}${s.decidedBy ? `; placed below the site above by ${s.decidedBy}` : ''}`,
      ]),
    ],
  }
}

export function renderComparisonCsv(c: Comparison, o: { units?: UnitSystem; table?: string } = {}): string {
  const own = [comparisonTable(c, o.units), rankingRulesTable(c)]
  if (o.table !== undefined && o.table !== 'all') {
    const t = own.find((x) => x.id === o.table)
    if (!t) {
      throw new RangeError(
        `table must be one of ${['all', ...own.map((x) => x.id)].join(', ')}; got ${JSON.stringify(o.table)}`,
      )
    }
    return tableCsv(t)
  }
  const perSite = c.assessments.flatMap((a, i) =>
    reportTables(a, { units: o.units, info: { fileName: c.sites[i].file ?? undefined } }).map((t) => ({
      ...t,
      title: `${c.sites[i].site}: ${t.title}`,
    })),
  )
  return tablesCsv([...own, ...perSite])
}
