/**
 * @module weather/delimited
 * Delimited text (comma, semicolon or tab; quotes; BOM; CRLF/CR; decimal commas with semicolons or
 * tabs) to a {@link RawTable}: the header found among the first lines (delimited-header.ts; files may
 * start with a site line), columns planned by {@link planColumns}, the rows split (delimited-body.ts),
 * their times (delimited-times.ts) and values (delimited-values.ts) read.
 */

import { type ColumnPreset, findNamedColumn } from './column-preset.ts'
import { type ColumnPlan, planColumns } from './columns.ts'
import { dropBodyRows, papaparseBody, scanBody } from './delimited-body.ts'
import { findHeader, headerNames } from './delimited-header.ts'
import { readRowTimes } from './delimited-times.ts'
import { readValueColumns } from './delimited-values.ts'
import { splitHeader } from './header-parts.ts'
import { isDecimalCommaNumber } from './numbers.ts'
import type { ColumnMapping, MappingKey } from './options.ts'
import type { ProblemLog } from './problem-log.ts'
import type { RawTable } from './raw-table.ts'
import type { DateOrder } from './timestamp-columns.ts'
import type { WeatherVariable } from './units.ts'

export interface DelimitedInfo {
  delimiter: string
  decimalComma: boolean
  headerLine: number
  /** Line of a units row under the header (1-based), or null. */
  unitsLine: number | null
  /** Lines under the header that are neither units nor data (e.g. a logger's processing row), skipped. */
  skippedAfterHeader: number
  /** The header was two rows joined cell by cell (first line of the two, 1-based), or null. */
  twoRowHeaderLine: number | null
  /** Date order declared by a header such as `Date (MM/DD/YYYY)`. */
  headerDateOrder: DateOrder | null
  /** Wind measurement height written in the wind header [m]. */
  windHeightM: number | null
  plan: ColumnPlan
}

/**
 * How a format dialect lays its delimited text out, when it knows better than detection. Every
 * field is optional; what is not given is detected as for any delimited file.
 */
export interface DelimitedLayout {
  delimiter?: string
  /** 0-based row of the header; −1 = no header row (then `columnNames` names the columns). */
  headerRow?: number
  /** Column names of a file without a header row. */
  columnNames?: string[]
  /** Units per column (replacing a units row), e.g. from a metadata block. */
  unitsRow?: string[]
  /** Rows after the header (and units row) that are not data. */
  skipAfterHeader?: number
  /** The format's own column choices (under the user's mapping). */
  columns?: ColumnPreset
  /** Cell decoders per variable: cell text → value in the column's unit, NaN = missing. */
  decoders?: Partial<Record<WeatherVariable, (text: string) => number>>
  /** Extra numbers that mean "missing" in every value column (e.g. −999 of NASA POWER). */
  missingCodes?: readonly number[]
  /** Rows to leave out (e.g. daily summary rows): the column (by header names) and a test on its text. */
  dropRows?: { names: readonly string[]; drop: (text: string) => boolean; reason: string }
  /** Report kind per row (routine or special) from a column (by header names). */
  reportKind?: { names: readonly string[]; kind: (text: string) => number }
  /**
   * Quality-flag columns: the column `offset` places after each value column holds its flag, and
   * `reject(flag)` says when the value is not to be used (it is then missing, counted in a warning).
   */
  qualityFlags?: { offset: number; reject: (flag: string) => boolean; describe: string }
}

/** Options of {@link readDelimited}: the format's layout and the user's header line. */
export interface ReadDelimitedOptions extends DelimitedLayout {
  /** 1-based line of the header row, as the user gives it (`--header-line`). */
  headerLine?: number
}

export function readDelimited(
  text: string,
  mapping: Partial<Record<MappingKey, ColumnMapping>>,
  log: ProblemLog,
  warnings: string[],
  layout: ReadDelimitedOptions = {},
): { table: RawTable; info: DelimitedInfo } {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const { delimiter, head, found } = findHeader(body, layout)
  // how the file was understood: notes for the reader's account, not warnings
  const notes: string[] = []
  const headers = headerNames(found, delimiter, layout, Object.keys(mapping).length > 0, warnings, notes)
  const plan = planColumns(headers, mapping, found.unitsRow, layout.columns)
  notes.push(...plan.notes)
  let decimalComma = false
  if (delimiter !== ',') {
    for (let r = found.firstDataRow; r < head.length && !decimalComma; r++) {
      for (const f of head[r]) if (isDecimalCommaNumber(f)) decimalComma = true
    }
  }
  const needs = neededColumns(plan, headers, mapping, layout)
  const skipThrough = found.firstDataRow - 1
  let cells = body.includes('"')
    ? papaparseBody(body, delimiter, skipThrough, [...needs.textColumns, ...needs.numericColumns])
    : scanBody(body, delimiter, skipThrough, needs.textColumns, needs.numericColumns, decimalComma)
  const dropColumn = needs.dropColumn
  if (dropColumn >= 0 && layout.dropRows) {
    const before = cells.lines.length
    const rows = cells
    cells = dropBodyRows(rows, (i) => layout.dropRows!.drop(rows.cells[dropColumn]?.[i] ?? ''))
    const dropped = before - cells.lines.length
    if (dropped > 0) warnings.push(`${dropped} ${layout.dropRows.reason}: left out`)
  }
  const n = cells.lines.length
  const { time, timeErrors } = readRowTimes(cells, plan.time, headers, log, warnings)
  const columns = readValueColumns(plan, {
    body: cells,
    headers,
    decimalComma,
    decoders: needs.decoders,
    flagOf: needs.flagOf,
    qualityFlags: layout.qualityFlags,
    missingCodes: layout.missingCodes ?? [],
    log,
    warnings,
  })
  if (plan.headerTimeNote !== null) notes.push(plan.headerTimeNote)
  let reportKind: Uint8Array | undefined
  if (needs.kindColumn >= 0 && layout.reportKind) {
    reportKind = new Uint8Array(n)
    const kinds = cells.cells[needs.kindColumn]
    for (let i = 0; i < n; i++) reportKind[i] = layout.reportKind.kind(kinds?.[i] ?? '')
  }
  return {
    table: {
      format: 'csv',
      notes,
      rows: n,
      lines: cells.lines,
      time,
      timeErrors,
      columns,
      timing: {},
      reportKind,
      unusedColumns: plan.unused,
      plan,
    },
    info: {
      delimiter,
      decimalComma,
      headerLine: found.headerIndex + 1,
      unitsLine: found.unitsIndex === null ? null : found.unitsIndex + 1,
      skippedAfterHeader: found.skipped,
      twoRowHeaderLine: found.twoRowIndex === null ? null : found.twoRowIndex + 1,
      headerDateOrder: headerDateOrder(plan, headers),
      windHeightM: plan.variables.wind?.heightM ?? plan.windComponents?.u.heightM ?? null,
      plan,
    },
  }
}

/** The columns the body must keep: time, flag, drop and kind columns as text, value columns as numbers unless decoded. */
interface NeededColumns {
  textColumns: number[]
  numericColumns: number[]
  decoders: Map<number, (text: string) => number>
  flagOf: Map<number, number>
  dropColumn: number
  kindColumn: number
}

function neededColumns(
  plan: ColumnPlan,
  headers: string[],
  mapping: Partial<Record<MappingKey, ColumnMapping>>,
  layout: DelimitedLayout,
): NeededColumns {
  const decoders = new Map<number, (text: string) => number>()
  for (const [variable, decode] of Object.entries(layout.decoders ?? {}) as [
    WeatherVariable,
    (text: string) => number,
  ][]) {
    const chosen = plan.variables[variable]
    if (chosen && !(variable in mapping)) decoders.set(chosen.index, decode)
  }
  const valueColumns = Object.values(plan.variables).map((c) => c!.index)
  if (plan.windComponents) valueColumns.push(plan.windComponents.u.index, plan.windComponents.v.index)
  const textColumns = [...Object.values(plan.time)]
  const flagOf = new Map<number, number>()
  if (layout.qualityFlags) {
    for (const c of valueColumns) {
      const f = c + layout.qualityFlags.offset
      if (f >= 0 && f < headers.length) {
        flagOf.set(c, f)
        if (!textColumns.includes(f)) textColumns.push(f)
      }
    }
  }
  const dropColumn = layout.dropRows ? findNamedColumn(headers, layout.dropRows.names) : -1
  const kindColumn = layout.reportKind ? findNamedColumn(headers, layout.reportKind.names) : -1
  for (const c of [dropColumn, kindColumn]) if (c >= 0 && !textColumns.includes(c)) textColumns.push(c)
  const numericColumns: number[] = []
  for (const c of valueColumns) {
    if (decoders.has(c)) {
      if (!textColumns.includes(c)) textColumns.push(c)
    } else if (!numericColumns.includes(c)) numericColumns.push(c)
  }
  return { textColumns, numericColumns, decoders, flagOf, dropColumn, kindColumn }
}

/** The date order a date header declares, as in `Date (MM/DD/YYYY)`; null when it does not. */
function headerDateOrder(plan: ColumnPlan, headers: string[]): DateOrder | null {
  const dateHeader = plan.time.timestamp ?? plan.time.date
  if (dateHeader === undefined) return null
  const unit = (splitHeader(headers[dateHeader]).unitText ?? '').toLowerCase()
  if (unit.startsWith('mm') && unit.slice(3, 5) === 'dd') return 'mdy'
  if (unit.startsWith('dd') && unit.slice(3, 5) === 'mm') return 'dmy'
  return null
}
