/**
 * @module report/tables
 * One table type for every table of the report, rendered both as an HTML table (the "table view" beside
 * each chart) and as CSV (RFC 4180, formula injection neutralised by `csvCell`). Building each table once
 * keeps the numbers in the page, the chart and the download identical.
 */
import { formatNumber } from './display-units.ts'
import { csvTable, escapeHtml } from './escape.ts'

export type Cell = string | number | null

export interface ReportTable {
  /** Stable id (also the CSV file-name stem): `monthly`, `hour-of-day`, `start-dates`, … */
  id: string
  title: string
  columns: string[]
  rows: Cell[][]
  /** Decimals per column for the HTML view (CSV keeps full precision). Default 0 for numbers. */
  digits?: number[]
}

/** Tables with more columns than this stack their cells under labels on a narrow screen (no sideways scrolling). */
export const STACK_ABOVE_COLUMNS = 4

export function tableHtml(t: ReportTable, options: { className?: string } = {}): string {
  const head = t.columns.map((c) => `<th scope="col">${escapeHtml(c)}</th>`).join('')
  const labels = t.columns.map((c) => escapeHtml(c))
  const body = t.rows
    .map(
      (r) =>
        `<tr>${r
          .map((cell, i) => {
            if (typeof cell === 'number' || cell === null) {
              return `<td class="num" data-label="${labels[i]}">${escapeHtml(formatNumber(cell, t.digits?.[i] ?? 0))}</td>`
            }
            return i === 0
              ? `<th scope="row">${escapeHtml(cell)}</th>`
              : `<td data-label="${labels[i]}">${escapeHtml(cell)}</td>`
          })
          .join('')}</tr>`,
    )
    .join('')
  const cls = `${options.className ?? 'data'}${t.columns.length > STACK_ABOVE_COLUMNS ? ' stack' : ''}`
  return `<table class="${cls}" data-table="${escapeHtml(t.id)}"><caption>${escapeHtml(t.title)}</caption><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`
}

/** One table as CSV (CRLF line ends, numbers unrounded, text cells injection-safe). */
export function tableCsv(t: ReportTable): string {
  return csvTable(t.columns, t.rows)
}

/**
 * Several tables in one CSV file: each preceded by a one-cell title row and separated by an empty line.
 * Spreadsheets open it as one sheet; use {@link tableCsv} for one table per file.
 */
export function tablesCsv(tables: ReportTable[]): string {
  return tables.map((t) => csvTable([t.title], []) + tableCsv(t)).join('\r\n')
}
