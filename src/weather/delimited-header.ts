/**
 * @module weather/delimited-header
 * Where the table starts in delimited text: the header row is the row among the first lines that names
 * the most variables and time fields (or the line the user gives), with a units row under it, a header
 * split over two rows joined, label rows before the data skipped, and the delimiter whose header names
 * the most when a title line above uses another. Header cells split by an unquoted delimiter inside
 * brackets are joined again.
 */

import Papa from 'papaparse'
import type { DelimitedLayout, ReadDelimitedOptions } from './delimited.ts'
import { analyseHeader } from './header-parts.ts'
import { parseDecimal } from './numbers.ts'
import { escapeControlCharacters, snippet } from './snippet.ts'
import { createTimestampColumns } from './timestamp-columns.ts'
import { parseTimestampInto } from './timestamps.ts'
import { isUnitToken } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** Offset of the start of 0-based line `index` (the end of the text when it has fewer lines). */
function lineStart(text: string, index: number): number {
  let at = 0
  for (let k = 0; k < index; k++) {
    const next = text.indexOf('\n', at)
    if (next < 0) return text.length
    at = next + 1
  }
  return at
}

/** The delimiter of the first line of `text`: the most frequent of comma, semicolon and tab outside quotes. */
export function detectDelimiter(text: string): string {
  let end = text.indexOf('\n')
  const cr = text.indexOf('\r')
  if (end < 0 || (cr >= 0 && cr < end)) end = cr
  const line = end < 0 ? text : text.slice(0, end)
  let inQuotes = false
  const counts: Record<string, number> = { ',': 0, ';': 0, '\t': 0 }
  for (const ch of line) {
    if (ch === '"') inQuotes = !inQuotes
    else if (!inQuotes && ch in counts) counts[ch]++
  }
  let best = ','
  for (const d of [';', '\t']) if (counts[d] > counts[best]) best = d
  return best
}

export function isBlank(row: string[]): boolean {
  return row.length === 0 || (row.length === 1 && row[0].trim() === '')
}

/** Rows of the head searched for the header (the first 100 lines, blank ones included). */
export const HEADER_SEARCH_ROWS = 100

/** Distinct variables and time fields a row of headers names (its merit as the header row). */
function headerScore(row: string[], unitsRow?: string[]): number {
  const keys = new Set<string>()
  const limit = Math.min(row.length, 1000)
  for (let j = 0; j < limit; j++) {
    const cell = row[j]
    if (cell === undefined || cell.trim() === '') continue
    const m = analyseHeader(cell, unitsRow?.[j]).meaning
    if (m === null || m.kind === 'excluded') continue
    keys.add(m.kind === 'variable' ? m.variable : m.kind === 'time' ? m.field : `wind-${m.component}`)
  }
  return keys.size
}

/** A row with no number and no timestamp in it: a header, units or label row, not data. */
function isTextRow(row: string[]): boolean {
  if (isBlank(row)) return false
  const scratch = createTimestampColumns(1)
  const limit = Math.min(row.length, 1000)
  for (let j = 0; j < limit; j++) {
    const cell = row[j]
    if (cell === undefined) continue
    const t = cell.trim()
    if (t === '') continue
    // A cell holding a line break or a quote comes from broken quoting: a data row, not a label row.
    if (t.includes('\n') || t.includes('\r') || t.includes('"')) return false
    if (!Number.isNaN(parseDecimal(t, 0, t.length, 44))) return false
    if (t.length <= 40 && parseTimestampInto(scratch, 0, t)) return false
  }
  return true
}

/** A row whose non-empty cells are mostly unit tokens (at least two). */
function isUnitsRow(row: string[]): boolean {
  let units = 0
  let other = 0
  const limit = Math.min(row.length, 1000)
  for (let j = 0; j < limit; j++) {
    const t = row[j]?.trim() ?? ''
    if (t === '') continue
    if (isUnitToken(t)) units++
    else other++
  }
  return units >= 2 && units >= other
}

function joinRows(a: string[], b: string[]): string[] {
  const n = Math.max(a.length, b.length)
  const out: string[] = new Array(n)
  for (let j = 0; j < n; j++) out[j] = `${a[j] ?? ''} ${b[j] ?? ''}`.trim()
  return out
}

interface HeaderLayout {
  /** 0-based row of the (last) header row; data follow after `firstDataRow`. */
  headerIndex: number
  headers: string[]
  unitsRow?: string[]
  unitsIndex: number | null
  twoRowIndex: number | null
  /** 0-based first row that may hold data. */
  firstDataRow: number
  skipped: number
  score: number
}

/**
 * Find the header: the row among the first {@link HEADER_SEARCH_ROWS} that names the most distinct
 * variables and time fields (or the row given); then a units row under it, a second header row above
 * or below it (two-row headers are joined cell by cell when that names more), and label rows before
 * the data.
 */
function locateHeader(
  head: string[][],
  headerRow: number | undefined,
  layout: DelimitedLayout,
): HeaderLayout {
  let headerIndex = -1
  let bestScore = -1
  if (headerRow !== undefined) {
    if (headerRow >= head.length || isBlank(head[headerRow] ?? [])) {
      throw new WeatherInputError(
        `the header line ${headerRow + 1} given is ${headerRow >= head.length ? 'beyond the first lines read' : 'blank'}`,
        ['header'],
      )
    }
    headerIndex = headerRow
    bestScore = headerScore(head[headerRow])
  } else {
    const limit = Math.min(head.length, HEADER_SEARCH_ROWS)
    for (let r = 0; r < limit; r++) {
      if (isBlank(head[r])) continue
      const score = headerScore(head[r])
      if (score > bestScore) {
        bestScore = score
        headerIndex = r
      }
    }
  }
  if (headerIndex < 0) throw new WeatherInputError('the file has no rows with content', ['rows'])
  let headers = head[headerIndex]
  let twoRowIndex: number | null = null
  let unitsRow = layout.unitsRow
  let unitsIndex: number | null = null
  let next = headerIndex + 1
  const below = head[next]
  if (unitsRow === undefined && below !== undefined && isTextRow(below) && isUnitsRow(below)) {
    unitsRow = below
    unitsIndex = next
    next++
  } else if (headerRow === undefined) {
    // A header in two rows: join with the row above or below when that names more.
    const above = headerIndex > 0 ? head[headerIndex - 1] : undefined
    let best = bestScore
    if (above !== undefined && isTextRow(above)) {
      const joined = joinRows(above, headers)
      const score = headerScore(joined)
      if (score > best) {
        best = score
        twoRowIndex = headerIndex - 1
      }
    }
    if (below !== undefined && isTextRow(below)) {
      const joined = joinRows(headers, below)
      if (headerScore(joined) > best) twoRowIndex = headerIndex
    }
    if (twoRowIndex !== null) {
      headers = joinRows(head[twoRowIndex], head[twoRowIndex + 1])
      headerIndex = twoRowIndex + 1
      next = headerIndex + 1
      bestScore = Math.max(bestScore, best)
      const u = head[next]
      if (u !== undefined && isTextRow(u) && isUnitsRow(u)) {
        unitsRow = u
        unitsIndex = next
        next++
      }
    }
  }
  let skipped = 0
  if (layout.skipAfterHeader !== undefined) {
    next += layout.skipAfterHeader
    skipped = layout.skipAfterHeader
  } else {
    while (skipped < 3 && head[next] !== undefined && isTextRow(head[next])) {
      next++
      skipped++
    }
  }
  return {
    headerIndex,
    headers,
    unitsRow,
    unitsIndex,
    twoRowIndex,
    firstDataRow: next,
    skipped,
    score: bestScore,
  }
}

function firstNonSpace(text: string): number {
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (c !== 32 && c !== 9 && c !== 10 && c !== 13 && c !== 0xa0 && c !== 0xfeff) return k
  }
  return -1
}

/**
 * Rejoin header cells split by an unquoted delimiter inside brackets, e.g.
 * `time (local standard time, UTC+07:00)` written without quotes in a comma-separated file. One pass:
 * the bracket depth is carried from cell to cell, never recounted.
 */
export function mergeUnbalancedHeaders(cells: string[], delimiter: string, warnings: string[]): string[] {
  const out: string[] = []
  let open: string[] = []
  let depth = 0
  for (const cell of cells) {
    for (let k = 0; k < cell.length; k++) {
      const c = cell.charCodeAt(k)
      if (c === 40 || c === 91) depth++
      else if ((c === 41 || c === 93) && depth > 0) depth--
    }
    open.push(cell)
    if (depth > 0) continue
    if (open.length > 1) {
      const text = open.join(delimiter)
      warnings.push(
        `header '${snippet(text)}' contains the delimiter inside brackets without quotes: read as one column`,
      )
      out.push(text)
    } else out.push(cell)
    open = []
  }
  out.push(...open) // brackets never closed: the cells stay as they are
  return out
}

/** Rows in the head parsed by papaparse for header and decimal-comma detection. */
const HEAD_ROWS = 210

/** The header row found, with the delimiter and the parsed head it was found in. */
export interface FoundHeader {
  delimiter: string
  /** The first {@link HEAD_ROWS} rows, split by `delimiter`. */
  head: string[][]
  found: HeaderLayout
}

/**
 * The delimiter and the header (see the module): the layout's, the user's header line, or searched.
 * The head (header search, decimal-comma test) always goes through papaparse.
 */
export function findHeader(body: string, layout: ReadDelimitedOptions): FoundHeader {
  const headerLine = layout.headerLine
  const firstContent = firstNonSpace(body)
  if (firstContent < 0) throw new WeatherInputError('the file is empty', ['rows'])
  // The delimiter of the header line when the user names it, else of the first non-blank line.
  const delimiterLine =
    headerLine !== undefined ? lineStart(body, headerLine - 1) : body.lastIndexOf('\n', firstContent) + 1
  let delimiter = layout.delimiter ?? detectDelimiter(body.slice(delimiterLine))
  let head = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false, preview: HEAD_ROWS }).data
  let found: HeaderLayout
  if (layout.headerRow === -1) {
    const names = layout.columnNames ?? []
    found = {
      headerIndex: -1,
      headers: names,
      unitsRow: layout.unitsRow,
      unitsIndex: null,
      twoRowIndex: null,
      firstDataRow: 0,
      skipped: 0,
      score: 1,
    }
  } else {
    found = locateHeader(head, headerLine !== undefined ? headerLine - 1 : layout.headerRow, layout)
    // A title or metadata line above the header may hold another delimiter than the table ("Site: A,
    // shed 2" above a semicolon table): when the header is searched, the delimiter whose header row
    // names the most variables wins (the first line's on a tie).
    if (layout.delimiter === undefined && headerLine === undefined && layout.headerRow === undefined) {
      const headEnd = lineStart(body, HEAD_ROWS)
      for (const other of [',', ';', '\t']) {
        // a delimiter that never occurs in the head cannot split its header
        if (other === delimiter || body.lastIndexOf(other, headEnd) < 0) continue
        const otherHead = Papa.parse<string[]>(body, {
          delimiter: other,
          skipEmptyLines: false,
          preview: HEAD_ROWS,
        }).data
        const otherFound = locateHeader(otherHead, undefined, layout)
        if (otherFound.score > found.score) {
          delimiter = other
          head = otherHead
          found = otherFound
        }
      }
    }
  }
  return { delimiter, head, found }
}

/**
 * The header's names (cells split inside brackets joined, control characters escaped once, here, as
 * they are shown in messages and reports); a header that names nothing dryhours knows is an error
 * unless columns are mapped; warnings say which lines around the header were skipped or joined.
 */
export function headerNames(
  found: HeaderLayout,
  delimiter: string,
  layout: ReadDelimitedOptions,
  mapped: boolean,
  warnings: string[],
  notes: string[],
): string[] {
  const headerLine = layout.headerLine
  const headers = mergeUnbalancedHeaders(found.headers, delimiter, warnings).map((h) =>
    escapeControlCharacters(h.charCodeAt(0) === 0xfeff ? h.slice(1).trim() : h.trim()),
  )
  if (found.score <= 0 && !mapped) {
    if (headerLine !== undefined)
      throw new WeatherInputError(
        `the header on line ${headerLine} ('${snippet(headers.slice(0, 8).join(delimiter), 120)}') names no column dryhours knows; ` +
          'map the columns with --map timestamp=<column> --map dryBulb=<column> …',
        ['header'],
      )
    throw new WeatherInputError(
      `no header row with known column names in the first ${HEADER_SEARCH_ROWS} lines (first line: '${snippet(headers.slice(0, 8).join(delimiter), 120)}'); ` +
        'add a header row, name its line with --header-line <n>, or map columns with --map dryBulb=#2 --map timestamp=#1 …',
      ['header'],
    )
  }
  // how the file was understood: notes for the reader's account, not warnings
  const before = found.twoRowIndex ?? found.headerIndex
  if (before > 0 && layout.headerRow === undefined)
    notes.push(`lines 1–${before} before the header row were skipped`)
  if (found.twoRowIndex !== null)
    notes.push(
      `the header spans lines ${found.twoRowIndex + 1}–${found.twoRowIndex + 2}: their cells were joined`,
    )
  if (found.unitsIndex !== null) notes.push(`line ${found.unitsIndex + 1} gives the units of the columns`)
  if (found.skipped > 0 && layout.skipAfterHeader === undefined)
    notes.push(
      `${found.skipped} line${found.skipped === 1 ? '' : 's'} under the header without numbers ${found.skipped === 1 ? 'was' : 'were'} skipped`,
    )
  return headers
}
