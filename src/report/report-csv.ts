/**
 * @module report/report-csv
 * Every table of the report as CSV: the same `ReportTable`s the HTML table views show, so the download and
 * the page agree. Text cells are neutralised against spreadsheet formula injection (`csvCell`).
 */

import type { OptionSurface } from '../weather/option-spec.ts'
import type { Assessment, ReportInputInfo } from './assessment-view.ts'
import type { UnitSystem } from './display-units.ts'
import { sectionContext } from './report-html.ts'
import { binFanTable, binMinimumAirflowTable, binStartDatesTable } from './sections/bin.ts'
import { fuelTable, heatTable } from './sections/heat.ts'
import { hourOfDayFractions, hourOfDayTable } from './sections/hour-of-day.ts'
import { monthlyTable, usableHoursByYearTable } from './sections/monthly.ts'
import { psychroTable } from './sections/psychrometric.ts'
import { spoilageTable } from './sections/spoilage.ts'
import { startDatesTable } from './sections/start-dates.ts'
import { headerRows, siteClock, warningList } from './sections/summary.ts'
import { type ReportTable, tableCsv, tablesCsv } from './tables.ts'
import { clockShort } from './words.ts'

export interface CsvOptions {
  units?: UnitSystem
  info?: ReportInputInfo
  /** How messages name options (see ReportOptions.optionSurface). */
  optionSurface?: OptionSurface
}

/** All tables of the report, in report order; the first is the header (site, product, method …). */
export function reportTables(a: Assessment, o: CsvOptions = {}): ReportTable[] {
  const ctx = sectionContext(a, o)
  const out: ReportTable[] = [
    { id: 'summary', title: 'Assessment', columns: ['item', 'value'], rows: headerRows(a, ctx) },
    monthlyTable(a),
  ]
  const byYear = usableHoursByYearTable(a)
  if (byYear) out.push(byYear)
  const fr = hourOfDayFractions(a)
  if (fr) out.push(hourOfDayTable(fr, clockShort(siteClock(a))))
  if (a.psychrometric) out.push(psychroTable(a.psychrometric, ctx))
  if (a.startDates.length) out.push(startDatesTable(a, ctx))
  if (a.startDates.length && a.spoilage) out.push(spoilageTable(a))
  if (a.bin)
    out.push(binMinimumAirflowTable(a.bin, ctx), binStartDatesTable(a.bin, ctx), binFanTable(a.bin, ctx))
  else out.push(heatTable(a, ctx), fuelTable(a, ctx))
  if (a.assumptions.length) {
    out.push({
      id: 'assumptions',
      title: 'Assumptions',
      columns: ['name', 'value', 'source'],
      rows: a.assumptions.map((x) => [x.name, x.value, x.source]),
    })
  }
  const warnings = warningList(a, ctx)
  if (warnings.length)
    out.push({ id: 'warnings', title: 'Warnings', columns: ['warning'], rows: warnings.map((s) => [s]) })
  const notes = (o.info?.readerNotes ?? []).map(ctx.optionWords)
  if (notes.length)
    out.push({
      id: 'notes',
      title: 'How the weather file was read',
      columns: ['note'],
      rows: notes.map((s) => [s]),
    })
  return out
}

export const REPORT_TABLE_IDS = [
  'summary',
  'monthly-usable-hours',
  'usable-hours-by-year',
  'hour-of-day-usable-share',
  'psychrometric-hours',
  'start-dates',
  'spoilage-by-start-date',
  'bin-minimum-airflow',
  'bin-start-dates',
  'bin-fans',
  'supplemental-heat-by-month',
  'fuel',
  'assumptions',
  'warnings',
  'notes',
] as const

/**
 * The report's tables as CSV: all tables in one file (titled blocks), or only the table `tableId`.
 * Throws a RangeError naming the accepted ids when `tableId` is not a table of this report.
 */
export function renderReportCsv(a: Assessment, o: CsvOptions & { table?: string } = {}): string {
  const tables = reportTables(a, o)
  if (o.table === undefined || o.table === 'all') return tablesCsv(tables)
  const t = tables.find((x) => x.id === o.table)
  if (!t) {
    throw new RangeError(
      `table must be one of ${['all', ...tables.map((x) => x.id)].join(', ')}; got ${JSON.stringify(o.table)}`,
    )
  }
  return tableCsv(t)
}
