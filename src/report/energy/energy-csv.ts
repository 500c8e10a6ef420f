/**
 * @module report/energy/energy-csv
 * The energy report as CSV: one table (`batches`, `limits`, `physics`, `regression`, `rejected-rows`) or all of them in
 * one file, RFC 4180 with spreadsheet formula injection neutralised (src/report/escape.ts).
 */
import type { EnergyChartAssessment } from '../../analysis/energy/energy-chart.ts'
import { tableCsv, tablesCsv } from '../tables.ts'
import { energyTables } from './energy-tables.ts'

export const ENERGY_TABLE_IDS = ['batches', 'limits', 'physics', 'regression', 'rejected-rows'] as const

/** CSV of one table by id, or every table (default `batches` only when `table` is 'batches'). */
export function renderEnergyCsv(a: EnergyChartAssessment, table?: string): string {
  const tables = energyTables(a)
  if (table === undefined) return tablesCsv(tables)
  const t = tables.find((x) => x.id === table)
  if (!t) {
    throw new RangeError(`table must be one of ${tables.map((x) => x.id).join(', ')}, got '${table}'`)
  }
  return tableCsv(t)
}
