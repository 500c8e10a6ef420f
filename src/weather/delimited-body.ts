/**
 * @module weather/delimited-body
 * The data rows of delimited text, after the header, as the columns a reader needs: quote-free text
 * split by a one-pass scanner that parses plain decimals on the way, quoted text through papaparse, and
 * text with a quote left open read line by line so one stray quote costs one row. Summary rows can be
 * dropped afterwards.
 */
import Papa from 'papaparse'
import { isBlank } from './delimited-header.ts'
import { parseDecimal } from './numbers.ts'
import { snippet } from './snippet.ts'

/** The body without the rows for which `drop(row)` is true (summary rows of some exports). */
export function dropBodyRows(body: BodyCells, drop: (row: number) => boolean): BodyCells {
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

interface ScannedNumbers {
  /** Parsed plain decimals; NaN where the field was blank or needs {@link parseField}. */
  values: Float64Array
  /** Blank or absent fields. */
  blank: number
  /** [row, text] of fields that are not plain decimals. */
  other: [number, string][]
}

export interface BodyCells {
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
export function papaparseBody(
  body: string,
  delimiter: string,
  headerIndex: number,
  needed: number[],
): BodyCells {
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
export function scanBody(
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
          const v = parseDecimal(body, start, stop, comma)
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
