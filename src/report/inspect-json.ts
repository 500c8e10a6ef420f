/**
 * @module report/inspect-json
 * The JSON of `dryhours inspect --json` and POST /v1/inspect: what was understood of a weather file.
 */
import { summarizeSeries } from '../weather/export.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import { csvTable } from './escape.ts'

/**
 * The JSON of `dryhours inspect --json`: format, dialect (the known layout recognised, or null), rows,
 * period, hours, years, typicalYear, columns, site (with its clock and where that came from), how rows
 * became hours (`hourly`), per variable the hours, mean, min and max in SI (`variables`), coverage, every
 * rejected row with its line (`rejectedRows`, uncapped), the first 100 problems with their counts, time
 * basis, warnings and the assumption notes.
 */
export function inspectJson(r: WeatherReadResult): Record<string, unknown> {
  const s = r.series
  return {
    format: r.format,
    dialect: r.dialect ?? null,
    rows: r.rows,
    period: r.period,
    hours: s.hours,
    years: r.years,
    typicalYear: s.typicalYear,
    sourceYears: r.sourceYears,
    timeBasis: r.timeBasis,
    dstEvents: r.dstEvents,
    columns: r.columns.map((c) => ({
      variable: c.variable,
      source: c.source,
      unit: c.unit,
      unitFrom: c.unitFrom,
      timing: c.timing,
      missing: c.missing,
    })),
    site: s.site,
    hourly: r.hourly,
    variables: summarizeSeries(s),
    coverage: r.coverage,
    hoursWithoutRow: r.hoursWithoutRow,
    hoursMissingCore: r.hoursMissingCore,
    problemCounts: r.problemCounts,
    rejectedRows: r.rejectedRows,
    problems: r.problems.slice(0, 100),
    problemsListed: Math.min(100, r.problems.length),
    problemsTotal: Object.values(r.problemCounts).reduce((a, b) => a + (b ?? 0), 0),
    warnings: r.warnings,
    notes: r.notes,
  }
}

/**
 * Every rejected row as CSV (line, kind, and the problem's message where it is among the listed problems):
 * the download of `POST /v1/inspect?format=rejected`.
 */
export function rejectedRowsCsv(r: WeatherReadResult): string {
  const messages = new Map<string, string>()
  for (const p of r.problems) {
    const key = `${p.line}:${p.kind}`
    if (p.line !== null && !messages.has(key)) messages.set(key, p.message)
  }
  return csvTable(
    ['line', 'kind', 'message'],
    r.rejectedRows.map((row) => [row.line, row.kind, messages.get(`${row.line}:${row.kind}`) ?? '']),
  )
}
