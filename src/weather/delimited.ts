/**
 * @module weather/delimited
 * Delimited text (comma, semicolon or tab; quotes; BOM; CRLF/CR; decimal commas with semicolons or
 * tabs) to a {@link RawTable}, through papaparse. The header row is found among the first lines
 * (files may start with a site line), columns are planned by {@link planColumns}.
 */
import Papa from 'papaparse'
import { type ColumnPlan, classifyHeader, planColumns, splitHeader } from './columns.ts'
import { FIELD_MISSING, FIELD_UNREADABLE, parseField } from './numbers.ts'
import type { ColumnMapping, MappingKey } from './options.ts'
import type { ProblemLog } from './problem-log.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import { escapeControlCharacters, snippet } from './snippet.ts'
import { createTimestampColumns, type DateOrder, parseTimeOfDay, parseTimestampInto } from './timestamps.ts'
import type { WeatherVariable } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

export interface DelimitedInfo {
  delimiter: string
  decimalComma: boolean
  headerLine: number
  /** Date order declared by a header such as `Date (MM/DD/YYYY)`. */
  headerDateOrder: DateOrder | null
  /** Wind measurement height written in the wind header [m]. */
  windHeightM: number | null
  plan: ColumnPlan
}

/** The delimiter of the first non-blank line: the most frequent of comma, semicolon and tab outside quotes. */
export function detectDelimiter(text: string): string {
  const end = text.search(/\r|\n/)
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

function recognised(row: string[]): number {
  let k = 0
  for (const h of row) if (classifyHeader(splitHeader(h).name) !== null) k++
  return k
}

export function readDelimited(
  text: string,
  mapping: Partial<Record<MappingKey, ColumnMapping>>,
  log: ProblemLog,
  warnings: string[],
): { table: RawTable; info: DelimitedInfo } {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const firstContent = body.search(/\S/)
  if (firstContent < 0) throw new WeatherInputError('the file is empty', ['rows'])
  const delimiter = detectDelimiter(body.slice(body.lastIndexOf('\n', firstContent) + 1))
  // The head (header search, decimal-comma test) always goes through papaparse; the body too when it
  // holds quotes. Quote-free bodies are split by a scanner that keeps only the needed columns
  // (papaparse's own fastMode also splits quote-free text without quote handling).
  const head = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false, preview: HEAD_ROWS }).data
  let headerIndex = -1
  let bestScore = -1
  let seen = 0
  for (let r = 0; r < head.length && seen < 10; r++) {
    if (isBlank(head[r])) continue
    seen++
    const score = recognised(head[r])
    if (score > bestScore) {
      bestScore = score
      headerIndex = r
    }
  }
  if (headerIndex < 0) throw new WeatherInputError('the file has no rows with content', ['rows'])
  // Header names are shown in messages and reports: control characters escaped once, here.
  const headers = mergeUnbalancedHeaders(head[headerIndex], delimiter, warnings).map((h) =>
    escapeControlCharacters(h.replace(/^\uFEFF/, '').trim()),
  )
  if (bestScore <= 0 && Object.keys(mapping).length === 0) {
    throw new WeatherInputError(
      `no header row with known column names in the first lines (first line: '${snippet(headers.slice(0, 8).join(delimiter), 120)}'); ` +
        'add a header row or map columns with --map dryBulb=#2 --map timestamp=#1 …',
      ['header'],
    )
  }
  if (headerIndex > 0) warnings.push(`lines 1–${headerIndex} before the header row were skipped`)
  const plan = planColumns(headers, mapping)
  let decimalComma = false
  if (delimiter !== ',') {
    for (let r = headerIndex + 1; r < head.length && !decimalComma; r++) {
      for (const f of head[r]) if (/^\s*[-+]?\d+,\d+\s*$/.test(f)) decimalComma = true
    }
  }
  const needed = [...Object.values(plan.time), ...Object.values(plan.variables).map((c) => c!.index)]
  const numericColumns = Object.values(plan.variables).map((c) => c!.index)
  const body_ = body.includes('"')
    ? papaparseBody(body, delimiter, headerIndex, needed)
    : scanBody(body, delimiter, headerIndex, Object.values(plan.time), numericColumns, decimalComma)
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
    (t.year === undefined || t.month === undefined || t.day === undefined)
  ) {
    throw new WeatherInputError(
      `no timestamp column found (columns: ${headers.map((h) => `'${snippet(h)}'`).join(', ')}); map it with --map timestamp=<column>, ` +
        'or --map date=<column> --map time=<column>, or --map year=… --map month=… --map day=… --map hour=…',
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
  for (let i = 0; i < n; i++) {
    if (quoteBroken?.has(i)) {
      log.add(lines[i], null, 'unbalanced-quote', quoteBroken.get(i)!)
      continue
    }
    if (t.timestamp !== undefined || (t.date !== undefined && t.year === undefined)) {
      const dateText = cell(i, t.timestamp ?? t.date!) ?? ''
      const timeText =
        t.timestamp === undefined ? (t.time !== undefined ? (cell(i, t.time) ?? '') : undefined) : undefined
      let ok = parseTimestampInto(time, i, dateText, timeText)
      if (!ok && t.timestamp !== undefined && t.time !== undefined)
        ok = parseTimestampInto(time, i, dateText, cell(i, t.time) ?? '')
      if (!ok)
        timeErrors[i] =
          `cannot read the timestamp '${snippet(timeText === undefined ? dateText : `${dateText} ${timeText}`)}'`
      continue
    }
    const part = (index: number | undefined, fallback: number): number => {
      if (index === undefined) return fallback
      parseField(cell(i, index), false, scratch, 0)
      return scratch[0]
    }
    const year = part(t.year, Number.NaN)
    const month = part(t.month, Number.NaN)
    const day = part(t.day, Number.NaN)
    let minutes = Number.NaN
    if (t.hour !== undefined) minutes = part(t.hour, Number.NaN) * 60 + part(t.minute, 0)
    else if (t.time !== undefined) minutes = parseTimeOfDay(cell(i, t.time) ?? '')
    const integral =
      Number.isInteger(year) && Number.isInteger(month) && Number.isInteger(day) && Number.isInteger(minutes)
    if (!integral || minutes < 0 || minutes > 1440) {
      timeErrors[i] =
        `cannot read the date and hour from the year/month/day/hour columns (${snippet([t.year, t.month, t.day, t.hour].map((k) => (k === undefined ? '' : (cell(i, k) ?? ''))).join(' '))})`
      continue
    }
    time.year[i] = year
    time.first[i] = month
    time.second[i] = day
    time.yearFirst[i] = 1
    time.minuteOfDay[i] = minutes
  }

  const columns: Partial<Record<WeatherVariable, RawColumn>> = {}
  for (const [variable, chosen] of Object.entries(plan.variables) as [
    WeatherVariable,
    NonNullable<ColumnPlan['variables'][WeatherVariable]>,
  ][]) {
    const scanned = body_.numbers?.[chosen.index]
    const values = scanned?.values ?? new Float64Array(n)
    let missing = scanned?.blank ?? 0
    const unreadable = (i: number, text: string | undefined): void => {
      missing++
      log.add(
        lines[i],
        variable,
        'unparseable-number',
        `'${snippet(text ?? '')}' in column '${snippet(chosen.header)}' is not a number: read as missing`,
      )
    }
    if (scanned) {
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
    columns[variable] = {
      values,
      source: chosen.header,
      conversion: chosen.conversion,
      unitSource: chosen.unitSource,
      missingCount: missing,
      missingCodeCount: 0,
    }
  }
  let headerDateOrder: DateOrder | null = null
  const dateHeader = t.timestamp ?? t.date
  if (dateHeader !== undefined) {
    const unit = splitHeader(headers[dateHeader]).unitText?.toLowerCase() ?? ''
    if (/^mm.dd.yy/.test(unit)) headerDateOrder = 'mdy'
    else if (/^dd.mm.yy/.test(unit)) headerDateOrder = 'dmy'
  }
  return {
    table: {
      format: 'csv',
      rows: n,
      lines,
      time,
      timeErrors,
      columns,
      timing: {},
      unusedColumns: plan.unused,
      plan,
    },
    info: {
      delimiter,
      decimalComma,
      headerLine: headerIndex + 1,
      headerDateOrder,
      windHeightM: plan.variables.wind?.heightM ?? null,
      plan,
    },
  }
}

/**
 * Rejoin header cells split by an unquoted delimiter inside brackets, e.g.
 * `time (local standard time, UTC+07:00)` written without quotes in a comma-separated file.
 */
export function mergeUnbalancedHeaders(cells: string[], delimiter: string, warnings: string[]): string[] {
  const out: string[] = []
  let open = ''
  for (const cell of cells) {
    const text = open === '' ? cell : `${open}${delimiter}${cell}`
    const depth = (text.match(/[([]/g)?.length ?? 0) - (text.match(/[)\]]/g)?.length ?? 0)
    if (depth > 0) {
      open = text
      continue
    }
    if (open !== '')
      warnings.push(
        `header '${snippet(text)}' contains the delimiter inside brackets without quotes: read as one column`,
      )
    out.push(text)
    open = ''
  }
  if (open !== '') out.push(...open.split(delimiter))
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
        let stop = body.indexOf(delimiter, start)
        if (stop < 0 || stop > end) stop = end
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
