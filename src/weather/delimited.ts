/**
 * @module weather/delimited
 * Delimited text (comma, semicolon or tab; quotes; BOM; CRLF/CR; decimal commas with semicolons or
 * tabs) to a {@link RawTable}, through papaparse. The header row is found among the first lines
 * (files may start with a site line), columns are planned by {@link planColumns}.
 */
import Papa from 'papaparse'
import {
  analyseHeader,
  type ChosenColumn,
  type ColumnPlan,
  type ColumnPreset,
  findNamedColumn,
  planColumns,
  splitHeader,
} from './columns.ts'
import { FIELD_MISSING, FIELD_UNREADABLE, parseField } from './numbers.ts'
import type { ColumnMapping, MappingKey } from './options.ts'
import type { ProblemLog } from './problem-log.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import { escapeControlCharacters, snippet } from './snippet.ts'
import {
  createTimestampColumns,
  type DateOrder,
  daysInMonth,
  parseTimeOfDay,
  parseTimestampInto,
} from './timestamps.ts'
import { isUnitToken, type WeatherVariable } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

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

function isBlank(row: string[]): boolean {
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
    if (!Number.isNaN(parseDecimal(t, 0, t.length, 0, 44))) return false
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

export function readDelimited(
  text: string,
  mapping: Partial<Record<MappingKey, ColumnMapping>>,
  log: ProblemLog,
  warnings: string[],
  layout: ReadDelimitedOptions = {},
): { table: RawTable; info: DelimitedInfo } {
  const headerLine = layout.headerLine
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const firstContent = firstNonSpace(body)
  if (firstContent < 0) throw new WeatherInputError('the file is empty', ['rows'])
  // The delimiter of the header line when the user names it, else of the first non-blank line.
  const delimiterLine =
    headerLine !== undefined ? lineStart(body, headerLine - 1) : body.lastIndexOf('\n', firstContent) + 1
  let delimiter = layout.delimiter ?? detectDelimiter(body.slice(delimiterLine))
  // The head (header search, decimal-comma test) always goes through papaparse; the body too when it
  // holds quotes. Quote-free bodies are split by a scanner that keeps only the needed columns
  // (papaparse's own fastMode also splits quote-free text without quote handling).
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
  const headerIndex = found.headerIndex
  // Header names are shown in messages and reports: control characters escaped once, here.
  const headers = mergeUnbalancedHeaders(found.headers, delimiter, warnings).map((h) =>
    escapeControlCharacters(h.charCodeAt(0) === 0xfeff ? h.slice(1).trim() : h.trim()),
  )
  if (found.score <= 0 && Object.keys(mapping).length === 0) {
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
  const notes: string[] = []
  const before = found.twoRowIndex ?? headerIndex
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
  const plan = planColumns(headers, mapping, found.unitsRow, layout.columns)
  notes.push(...plan.notes)
  let decimalComma = false
  if (delimiter !== ',') {
    for (let r = found.firstDataRow; r < head.length && !decimalComma; r++) {
      for (const f of head[r]) if (isDecimalCommaNumber(f)) decimalComma = true
    }
  }
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
  const needed = [...textColumns, ...numericColumns]
  const skipThrough = found.firstDataRow - 1
  let body_ = body.includes('"')
    ? papaparseBody(body, delimiter, skipThrough, needed)
    : scanBody(body, delimiter, skipThrough, textColumns, numericColumns, decimalComma)
  if (dropColumn >= 0 && layout.dropRows) {
    const before = body_.lines.length
    body_ = dropBodyRows(body_, (i) => layout.dropRows!.drop(body_.cells[dropColumn]?.[i] ?? ''))
    const dropped = before - body_.lines.length
    if (dropped > 0) warnings.push(`${dropped} ${layout.dropRows.reason}: left out`)
  }
  const { lines, cells } = body_
  const n = lines.length
  const cell = (i: number, col: number): string | undefined => cells[col]?.[i]
  const time = createTimestampColumns(n)
  const timeErrors: (string | undefined)[] = new Array(n)
  const t = plan.time
  if (
    t.timestamp === undefined &&
    t.date === undefined &&
    t.time === undefined &&
    (t.year === undefined || ((t.month === undefined || t.day === undefined) && t.dayOfYear === undefined))
  ) {
    throw new WeatherInputError(
      `no timestamp column found (columns: ${headers.map((h) => `'${snippet(h)}'`).join(', ')}); map it with --map timestamp=<column>, ` +
        'or --map date=<column> --map time=<column> (or hour=<column>), or --map year=… --map month=… --map day=… --map hour=…',
      ['timestamps'],
    )
  }
  if (t.timestamp === undefined && t.date === undefined && t.time !== undefined) {
    t.timestamp = t.time // a lone 'time' column holds date and time
    t.time = undefined
  }
  const scratch = new Float64Array(1)
  const quoteBroken = body_.unbalancedQuote
  if (quoteBroken && quoteBroken.size > 0) {
    const first = lines[quoteBroken.keys().next().value ?? 0] // keys in row order
    warnings.push(
      `${quoteBroken.size} line${quoteBroken.size === 1 ? ' has' : 's have'} an unbalanced double quote (first: line ${first}): ` +
        'rejected, the other lines read one by one',
    )
  }
  // Clock text of the row from a time, or an hour (and minute) column.
  const clockText = (i: number): string | undefined => {
    if (t.time !== undefined) return cell(i, t.time) ?? ''
    if (t.hour !== undefined) {
      const hour = cell(i, t.hour) ?? ''
      if (t.minute === undefined) return hour
      const minute = (cell(i, t.minute) ?? '').trim()
      return `${hour.trim()}:${minute.length === 1 ? `0${minute}` : minute}`
    }
    return undefined
  }
  const useDateColumn =
    t.timestamp !== undefined || (t.date !== undefined && (t.year === undefined || t.month === undefined))
  for (let i = 0; i < n; i++) {
    if (quoteBroken?.has(i)) {
      log.add(lines[i], null, 'unbalanced-quote', quoteBroken.get(i)!)
      continue
    }
    if (useDateColumn) {
      const dateText = cell(i, t.timestamp ?? t.date!) ?? ''
      const clock = clockText(i)
      let ok = parseTimestampInto(time, i, dateText, t.timestamp === undefined ? clock : undefined)
      if (!ok && t.timestamp !== undefined && clock !== undefined)
        ok = parseTimestampInto(time, i, dateText, clock)
      if (!ok)
        timeErrors[i] =
          `cannot read the timestamp '${snippet(clock === undefined ? dateText : `${dateText} ${clock}`)}'`
      continue
    }
    const part = (index: number | undefined, fallback: number): number => {
      if (index === undefined) return fallback
      parseField(cell(i, index), false, scratch, 0)
      return scratch[0]
    }
    const year = part(t.year, Number.NaN)
    let month = part(t.month, Number.NaN)
    let day = part(t.day, Number.NaN)
    if ((t.month === undefined || t.day === undefined) && t.dayOfYear !== undefined) {
      const doy = part(t.dayOfYear, Number.NaN)
      const md = monthDayOfYear(year, doy)
      month = md[0]
      day = md[1]
    }
    const clock = clockText(i)
    const minutes = clock === undefined ? Number.NaN : parseTimeOfDay(clock)
    const integral = Number.isInteger(year) && Number.isInteger(month) && Number.isInteger(day)
    if (!integral || !(minutes >= 0 && minutes <= 1440)) {
      timeErrors[i] =
        `cannot read the date and hour from the year/month/day/hour columns (${snippet([t.year, t.month ?? t.dayOfYear, t.day, t.hour].map((k) => (k === undefined ? '' : (cell(i, k) ?? ''))).join(' '))})`
      continue
    }
    time.year[i] = year
    time.first[i] = month
    time.second[i] = day
    time.yearFirst[i] = 1
    time.minuteOfDay[i] = minutes
  }
  if (time.twoDigitYears > 0)
    warnings.push(
      `${time.twoDigitYears} dates have two-digit years: 69–99 read as 1969–1999, 00–68 as 2000–2068`,
    )

  const missingCodes = layout.missingCodes ?? []
  const readColumn = (chosen: ChosenColumn): RawColumn => {
    const scanned = body_.numbers?.[chosen.index]
    const values = scanned?.values ?? new Float64Array(n)
    let missing = scanned?.blank ?? 0
    let codes = 0
    const unreadable = (i: number, text: string | undefined): void => {
      missing++
      log.add(
        lines[i],
        chosen.variable,
        'unparseable-number',
        `'${snippet(text ?? '')}' in column '${snippet(chosen.header)}' is not a number: read as missing`,
      )
    }
    const decode = decoders.get(chosen.index)
    if (decode !== undefined) {
      const column = cells[chosen.index]
      for (let i = 0; i < n; i++) {
        const text = column?.[i]
        const v = text === undefined ? Number.NaN : decode(text)
        values[i] = v
        if (Number.isNaN(v)) missing++
      }
    } else if (scanned) {
      for (const [i, text] of scanned.other) {
        const code = parseField(text, decimalComma, values, i)
        if (code === FIELD_MISSING) missing++
        else if (code === FIELD_UNREADABLE) unreadable(i, text)
      }
    } else {
      const column = cells[chosen.index]
      for (let i = 0; i < n; i++) {
        const code = parseField(column?.[i], decimalComma, values, i)
        if (code === FIELD_MISSING) missing++
        else if (code === FIELD_UNREADABLE) unreadable(i, column?.[i])
      }
    }
    const flagColumn = flagOf.get(chosen.index)
    if (flagColumn !== undefined && layout.qualityFlags) {
      let flagged = 0
      for (let i = 0; i < n; i++) {
        if (Number.isNaN(values[i])) continue
        if (layout.qualityFlags.reject(cells[flagColumn]?.[i] ?? '')) {
          values[i] = Number.NaN
          flagged++
        }
      }
      missing += flagged
      if (flagged > 0)
        warnings.push(
          `column '${snippet(chosen.header)}': ${flagged} values flagged ${layout.qualityFlags.describe} in '${snippet(headers[flagColumn])}': read as missing`,
        )
    }
    if (missingCodes.length > 0) {
      for (let i = 0; i < n; i++) {
        if (missingCodes.includes(values[i])) {
          values[i] = Number.NaN
          codes++
        }
      }
    }
    return {
      values,
      source: chosen.header,
      conversion: chosen.conversion,
      unitSource: chosen.unitSource,
      missingCount: missing + codes,
      missingCodeCount: codes,
    }
  }
  const columns: Partial<Record<WeatherVariable, RawColumn>> = {}
  for (const chosen of Object.values(plan.variables)) columns[chosen!.variable] = readColumn(chosen!)
  if (plan.windComponents && !columns.wind) {
    const u = readColumn(plan.windComponents.u)
    const v = readColumn(plan.windComponents.v)
    const uScale = u.conversion?.scale ?? 1
    const vScale = v.conversion?.scale ?? 1
    const speed = new Float64Array(n)
    let missing = 0
    for (let i = 0; i < n; i++) {
      const x = u.values[i] * uScale
      const y = v.values[i] * vScale
      speed[i] = Math.sqrt(x * x + y * y)
      if (Number.isNaN(speed[i])) missing++
    }
    columns.wind = {
      values: speed,
      source: `√(${plan.windComponents.u.header}² + ${plan.windComponents.v.header}²)`,
      conversion: { unit: 'm/s', scale: 1, offset: 0 },
      unitSource: u.conversion !== null || v.conversion !== null ? 'header' : 'none',
      missingCount: missing,
      missingCodeCount: 0,
    }
    if (u.conversion === null && v.conversion === null)
      warnings.push('the wind components have no unit: read as m/s')
  }
  let headerDateOrder: DateOrder | null = null
  const dateHeader = t.timestamp ?? t.date
  if (dateHeader !== undefined) {
    const unit = (splitHeader(headers[dateHeader]).unitText ?? '').toLowerCase()
    if (unit.startsWith('mm') && unit.slice(3, 5) === 'dd') headerDateOrder = 'mdy'
    else if (unit.startsWith('dd') && unit.slice(3, 5) === 'mm') headerDateOrder = 'dmy'
  }
  if (plan.headerTimeNote !== null) notes.push(plan.headerTimeNote)
  let reportKind: Uint8Array | undefined
  if (kindColumn >= 0 && layout.reportKind) {
    reportKind = new Uint8Array(n)
    for (let i = 0; i < n; i++) reportKind[i] = layout.reportKind.kind(cell(i, kindColumn) ?? '')
  }
  return {
    table: {
      format: 'csv',
      notes,
      rows: n,
      lines,
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
      headerLine: headerIndex + 1,
      unitsLine: found.unitsIndex === null ? null : found.unitsIndex + 1,
      skippedAfterHeader: found.skipped,
      twoRowHeaderLine: found.twoRowIndex === null ? null : found.twoRowIndex + 1,
      headerDateOrder,
      windHeightM: plan.variables.wind?.heightM ?? plan.windComponents?.u.heightM ?? null,
      plan,
    },
  }
}

/** The body without the rows for which `drop(row)` is true (summary rows of some exports). */
function dropBodyRows(body: BodyCells, drop: (row: number) => boolean): BodyCells {
  const n = body.lines.length
  const keep: number[] = []
  for (let i = 0; i < n; i++) if (!drop(i)) keep.push(i)
  if (keep.length === n) return body
  const newIndex = new Int32Array(n).fill(-1)
  keep.forEach((old, i) => {
    newIndex[old] = i
  })
  const cells: (string | undefined)[][] = []
  body.cells.forEach((column, c) => {
    if (column !== undefined) cells[c] = keep.map((old) => column[old])
  })
  let numbers: ScannedNumbers[] | undefined
  if (body.numbers) {
    numbers = []
    body.numbers.forEach((scanned, c) => {
      if (scanned === undefined) return
      const values = new Float64Array(keep.length)
      for (let i = 0; i < keep.length; i++) values[i] = scanned.values[keep[i]]
      const other: [number, string][] = []
      for (const [row, text] of scanned.other) if (newIndex[row] >= 0) other.push([newIndex[row], text])
      let blank = 0
      for (let i = 0; i < keep.length; i++) if (Number.isNaN(values[i])) blank++
      numbers![c] = { values, blank: blank - other.length, other }
    })
  }
  let unbalancedQuote: Map<number, string> | undefined
  if (body.unbalancedQuote) {
    unbalancedQuote = new Map()
    for (const [row, message] of body.unbalancedQuote)
      if (newIndex[row] >= 0) unbalancedQuote.set(newIndex[row], message)
  }
  return { lines: Int32Array.from(keep.map((old) => body.lines[old])), cells, numbers, unbalancedQuote }
}

/** Month and day of day-of-year `doy` (1 = 1 January) in `year`; NaN when out of range. */
function monthDayOfYear(year: number, doy: number): [number, number] {
  if (!Number.isInteger(doy) || !Number.isInteger(year) || doy < 1) return [Number.NaN, Number.NaN]
  let left = doy
  for (let m = 1; m <= 12; m++) {
    const days = daysInMonth(year, m)
    if (left <= days) return [m, left]
    left -= days
  }
  return [Number.NaN, Number.NaN]
}

function firstNonSpace(text: string): number {
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (c !== 32 && c !== 9 && c !== 10 && c !== 13 && c !== 0xa0 && c !== 0xfeff) return k
  }
  return -1
}

/** `12,5`, ` -3,25 `: a number with a decimal comma (and nothing else). */
function isDecimalCommaNumber(text: string): boolean {
  let k = 0
  while (k < text.length && text.charCodeAt(k) === 32) k++
  if (text[k] === '-' || text[k] === '+') k++
  const intStart = k
  while (k < text.length && text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) k++
  if (k === intStart || text[k] !== ',') return false
  k++
  const fracStart = k
  while (k < text.length && text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) k++
  if (k === fracStart) return false
  while (k < text.length && text.charCodeAt(k) === 32) k++
  return k === text.length
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

interface ScannedNumbers {
  /** Parsed plain decimals; NaN where the field was blank or needs {@link parseField}. */
  values: Float64Array
  /** Blank or absent fields. */
  blank: number
  /** [row, text] of fields that are not plain decimals. */
  other: [number, string][]
}

interface BodyCells {
  /** 1-based line of each non-blank data row. */
  lines: Int32Array
  /** Text of each needed column per row (sparse by column index). */
  cells: (string | undefined)[][]
  /** Numeric columns parsed by the scanner (sparse by column index), when it ran. */
  numbers?: ScannedNumbers[]
  /** Rows rejected for an unbalanced double quote, with the problem message (row index → message). */
  unbalancedQuote?: Map<number, string>
}

/**
 * The body through papaparse (quoted text): rows after the header, blank rows skipped. When a quote
 * is left open (papaparse reports a quote error, or a time or value field holds a line break, which
 * no weather export writes), the body is read line by line instead ({@link lineByLineBody}).
 */
function papaparseBody(body: string, delimiter: string, headerIndex: number, needed: number[]): BodyCells {
  const parsed = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false })
  const data = parsed.data
  if (parsed.errors.some((e) => e.type === 'Quotes') || fieldHoldsLineBreak(data, headerIndex, needed))
    return lineByLineBody(body, delimiter, headerIndex, needed)
  const rows: number[] = []
  // Physical line of each record: a quoted field holding line breaks spans several lines.
  const startLine: number[] = new Array(data.length)
  let line = 1
  for (let r = 0; r < data.length; r++) {
    startLine[r] = line
    line += 1 + lineBreaksIn(data[r])
    if (r > headerIndex && !isBlank(data[r])) rows.push(r)
  }
  const lines = new Int32Array(rows.length)
  const cells: (string | undefined)[][] = []
  for (const col of needed) cells[col] = new Array(rows.length)
  for (let i = 0; i < rows.length; i++) {
    const row = data[rows[i]]
    lines[i] = startLine[rows[i]]
    for (const col of needed) cells[col][i] = row[col]
  }
  return { lines, cells }
}

/** Line breaks (CRLF, LF or CR, each counted once) inside the fields of one record. */
function lineBreaksIn(record: string[]): number {
  let count = 0
  for (const f of record) {
    if (f.indexOf('\n') < 0 && f.indexOf('\r') < 0) continue
    for (let k = 0; k < f.length; k++) {
      const ch = f.charCodeAt(k)
      if (ch === 10 || (ch === 13 && f.charCodeAt(k + 1) !== 10)) count++
    }
  }
  return count
}

function fieldHoldsLineBreak(data: string[][], headerIndex: number, needed: number[]): boolean {
  for (let r = headerIndex + 1; r < data.length; r++) {
    const row = data[r]
    for (const col of needed) {
      const f = row[col]
      if (f !== undefined && (f.includes('\n') || f.includes('\r'))) return true
    }
  }
  return false
}

/**
 * The body read one physical line at a time (line ends as papaparse guesses them): a line with an
 * odd number of double quotes (RFC 4180 §2 rules 5–7: quotes come in pairs) is rejected with an
 * 'unbalanced-quote' problem, every other line is parsed on its own, so one stray quote costs one
 * row, not the rest of the file. Quoted fields spanning lines are not rejoined here.
 */
function lineByLineBody(body: string, delimiter: string, headerIndex: number, needed: number[]): BodyCells {
  const newline = body.includes('\r\n') ? '\r\n' : body.includes('\n') ? '\n' : '\r'
  const physical = body.split(newline)
  const lineList: number[] = []
  const cells: (string | undefined)[][] = []
  for (const col of needed) cells[col] = []
  const unbalancedQuote = new Map<number, string>()
  for (let k = headerIndex + 1; k < physical.length; k++) {
    const text = physical[k]
    if (text.trim() === '') continue
    const i = lineList.length
    lineList.push(k + 1)
    let quotes = 0
    for (let p = text.indexOf('"'); p >= 0; p = text.indexOf('"', p + 1)) quotes++
    if (quotes % 2 === 1) {
      unbalancedQuote.set(
        i,
        `unbalanced double quote in '${snippet(text)}': row rejected (quotes must come in pairs)`,
      )
      for (const col of needed) cells[col][i] = undefined
      continue
    }
    const row =
      quotes === 0 ? text.split(delimiter) : (Papa.parse<string[]>(text, { delimiter }).data[0] ?? [])
    for (const col of needed) cells[col][i] = row[col]
  }
  return { lines: Int32Array.from(lineList), cells, unbalancedQuote }
}

/**
 * The body of quote-free text split directly: line ends as papaparse guesses them (CRLF, LF or CR);
 * only the needed columns are kept, numbers parsed from the characters (plain decimals: the same
 * double as `Number`, since m/10^k of integers below 2^53 is correctly rounded), anything else
 * (blank, missing words, exponents, units) passed on as text. Line numbers are exact: without
 * quotes no field can hold a line break.
 */
function scanBody(
  body: string,
  delimiter: string,
  headerIndex: number,
  textCols: number[],
  numericCols: number[],
  decimalComma: boolean,
): BodyCells {
  const newline = body.includes('\r\n') ? '\r\n' : body.includes('\n') ? '\n' : '\r'
  const all = [...textCols, ...numericCols]
  const maxCol = all.length === 0 ? -1 : Math.max(...all)
  // 0 unused, 1 text, 2 number
  const kind = new Uint8Array(maxCol + 1)
  for (const c of textCols) kind[c] = 1
  for (const c of numericCols) kind[c] = 2
  let capacity = 1
  for (let k = body.indexOf(newline); k >= 0; k = body.indexOf(newline, k + newline.length)) capacity++
  const cells: (string | undefined)[][] = []
  for (const c of textCols) cells[c] = []
  const numbers: ScannedNumbers[] = []
  for (const c of numericCols)
    numbers[c] = { values: new Float64Array(capacity).fill(Number.NaN), blank: 0, other: [] }
  const lineList = new Int32Array(capacity)
  const delim = delimiter.charCodeAt(0)
  // The next delimiter at or after the scan position: searched again only once passed, so the
  // searches together read the text once (a line without delimiters cannot send each search to the
  // end of the file).
  let nextDelimiter = body.indexOf(delimiter)
  const comma = decimalComma ? 44 : -1
  let rows = 0
  let pos = 0
  let line = 0
  const length = body.length
  while (pos <= length) {
    let end = body.indexOf(newline, pos)
    if (end < 0) end = length
    if (line > headerIndex && !blankSpan(body, pos, end)) {
      lineList[rows] = line + 1
      let start = pos
      let col = 0
      for (; col <= maxCol; col++) {
        if (nextDelimiter >= 0 && nextDelimiter < start) nextDelimiter = body.indexOf(delimiter, start)
        const stop = nextDelimiter < 0 || nextDelimiter > end ? end : nextDelimiter
        const k = kind[col]
        if (k === 1) cells[col][rows] = body.slice(start, stop)
        else if (k === 2) {
          const target = numbers[col]
          const v = parseDecimal(body, start, stop, delim, comma)
          if (!Number.isNaN(v)) target.values[rows] = v
          else if (blankSpan(body, start, stop)) target.blank++
          else target.other.push([rows, body.slice(start, stop)])
        }
        if (stop === end) {
          col++
          break
        }
        start = stop + 1
      }
      for (; col <= maxCol; col++) {
        if (kind[col] === 1) cells[col][rows] = undefined
        else if (kind[col] === 2) numbers[col].blank++
      }
      rows++
    }
    line++
    if (end === length) break
    pos = end + newline.length
  }
  for (const c of numericCols) numbers[c].values = numbers[c].values.subarray(0, rows)
  return { lines: lineList.slice(0, rows), cells, numbers }
}

function blankSpan(text: string, from: number, to: number): boolean {
  for (let k = from; k < to; k++) {
    const ch = text.charCodeAt(k)
    if (ch !== 32 && ch !== 9 && ch !== 13 && ch !== 10) return false
  }
  return true
}

const POW10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15]

/** `[-+]?digits[.digits]` between from and to (spaces allowed around), at most 15 digits; NaN otherwise. */
function parseDecimal(text: string, from: number, to: number, _delim: number, comma: number): number {
  let k = from
  while (k < to && text.charCodeAt(k) === 32) k++
  let end = to
  while (end > k && text.charCodeAt(end - 1) === 32) end--
  if (k >= end) return Number.NaN
  let negative = false
  let ch = text.charCodeAt(k)
  if (ch === 45 || ch === 43) {
    negative = ch === 45
    k++
  }
  let mantissa = 0
  let digits = 0
  let fraction = -1
  for (; k < end; k++) {
    ch = text.charCodeAt(k)
    if (ch >= 48 && ch <= 57) {
      mantissa = mantissa * 10 + (ch - 48)
      digits++
      if (fraction >= 0) fraction++
    } else if ((ch === 46 || ch === comma) && fraction < 0) fraction = 0
    else return Number.NaN
  }
  if (digits === 0 || digits > 15) return Number.NaN
  const value = fraction > 0 ? mantissa / POW10[fraction] : mantissa
  return negative ? -value : value
}
