/**
 * @module weather/dialects/dialect
 * A format dialect: one known export layout (a data service's CSV, a logger's table, a station
 * console's export). It recognises its layout from the first lines, then reads the file into a
 * {@link RawTable} that states what the layout documents: which column is which variable in which
 * unit, the missing codes, the timestamps' clock, how each value relates to its time (instant or
 * the preceding hour), and the site's metadata from the file's header block. Dialects are tried in
 * order before the generic reader; the first that recognises the file reads it.
 */
import type { DelimitedInfo } from '../delimited.ts'
import type { ColumnMapping, MappingKey } from '../options.ts'
import type { ProblemLog } from '../problem-log.ts'
import type { FileStatements, RawTable } from '../raw-table.ts'

/** The first lines of a file, for cheap recognition. */
export interface DialectHead {
  /** Up to {@link HEAD_LINES} lines (line ends removed, a leading byte order mark dropped). */
  lines: string[]
  /** The same lines in lower case. */
  lower: string[]
}

/** Lines looked at to recognise a dialect. */
export const HEAD_LINES = 100
/** Characters looked at to recognise a dialect (a long first line is cut). */
export const HEAD_CHARS = 64_000

/** The head of `text`: at most {@link HEAD_LINES} lines from its first {@link HEAD_CHARS} characters. */
export function dialectHead(text: string): DialectHead {
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0
  const end = Math.min(text.length, start + HEAD_CHARS)
  const lines: string[] = []
  let from = start
  for (let k = start; k < end && lines.length < HEAD_LINES; k++) {
    const c = text.charCodeAt(k)
    if (c === 10 || c === 13) {
      lines.push(text.slice(from, k))
      if (c === 13 && text.charCodeAt(k + 1) === 10) k++
      from = k + 1
    }
  }
  if (lines.length < HEAD_LINES && from < end) lines.push(text.slice(from, end))
  return { lines, lower: lines.map((l) => l.toLowerCase()) }
}

/** What a dialect's reader gets besides the text. */
export interface DialectContext {
  mapping: Partial<Record<MappingKey, ColumnMapping>>
  log: ProblemLog
  warnings: string[]
  /** How the layout was read (its conventions, columns left out): notes, not problems. */
  notes: string[]
  headerLine?: number
  /** The user gave the timestamps' clock (`--utc-offset` or `--tz`). */
  clockGiven: boolean
}

/** A dialect's reading of a file. */
export interface DialectReading {
  table: RawTable
  /** Present when the file was read as delimited text. */
  info: DelimitedInfo | null
}

export interface WeatherDialect {
  /** Stable id (kebab-case), shown by `inspect` and in JSON. */
  id: string
  /** Plain name of the layout. */
  title: string
  /** True when the first lines are in this layout. Must be cheap: it runs on every file. */
  detect(head: DialectHead): boolean
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading
}

/** Index of the first head line for which `test` holds, −1 when none. */
export function findLine(head: DialectHead, test: (lower: string, line: string) => boolean): number {
  for (let i = 0; i < head.lines.length; i++) if (test(head.lower[i], head.lines[i])) return i
  return -1
}

/** A number in `text`, or NaN (no units, no thousands separators). */
export function numberOf(text: string | undefined): number {
  if (text === undefined) return Number.NaN
  const t = text.trim()
  if (t === '') return Number.NaN
  const x = Number(t)
  return Number.isFinite(x) ? x : Number.NaN
}

/** Split one simple line (no quotes needed) on `delimiter`, cells trimmed and unquoted. */
export function cellsOf(line: string, delimiter = ','): string[] {
  return line.split(delimiter).map((c) => {
    const t = c.trim()
    return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1) : t
  })
}

/**
 * Cells of a CSV line with double-quoted fields (RFC 4180: `""` inside quotes is a quote), read in
 * one pass.
 */
export function quotedCells(line: string, delimiter = ','): string[] {
  const out: string[] = []
  let cell = ''
  let quoted = false
  const d = delimiter.charCodeAt(0)
  for (let k = 0; k < line.length; k++) {
    const c = line.charCodeAt(k)
    if (quoted) {
      if (c === 34) {
        if (line.charCodeAt(k + 1) === 34) {
          cell += '"'
          k++
        } else quoted = false
      } else cell += line[k]
    } else if (c === 34) quoted = true
    else if (c === d) {
      out.push(cell)
      cell = ''
    } else cell += line[k]
  }
  out.push(cell)
  return out
}

/** The text up to (not including) the first blank line after line `fromLine` (0-based); the whole text when none. */
export function textUntilBlankLineAfter(text: string, fromLine: number): string {
  let line = 0
  let k = 0
  while (k < text.length) {
    let end = text.indexOf('\n', k)
    if (end < 0) end = text.length
    const content = text.slice(k, end).trim()
    if (line > fromLine && content === '') return text.slice(0, k)
    line++
    k = end + 1
  }
  return text
}

/** True when `name` is an IANA zone known to Intl. */
export function isIanaZone(name: string): boolean {
  if (name === '' || name.length > 64) return false
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name })
    return true
  } catch {
    return false
  }
}

/** `statements` without the entries that are undefined, NaN or empty (what the file did not say). */
export function stated(statements: FileStatements): FileStatements {
  const out: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(statements)) {
    if (v === undefined || v === '' || (typeof v === 'number' && !Number.isFinite(v))) continue
    out[k] = v
  }
  return out as FileStatements
}
