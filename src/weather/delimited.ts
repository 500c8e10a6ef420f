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
  const parsed = Papa.parse<string[]>(body, { delimiter, skipEmptyLines: false })
  const data = parsed.data
  // Header: the row among the first ten non-blank rows that names the most known columns.
  let headerIndex = -1
  let bestScore = -1
  let seen = 0
  for (let r = 0; r < data.length && seen < 10; r++) {
    if (isBlank(data[r])) continue
    seen++
    const score = recognised(data[r])
    if (score > bestScore) {
      bestScore = score
      headerIndex = r
    }
  }
  if (headerIndex < 0) throw new WeatherInputError('the file has no rows with content', ['rows'])
  const headers = mergeUnbalancedHeaders(data[headerIndex], delimiter, warnings).map((h) => h.replace(/^\uFEFF/, '').trim())
  if (bestScore <= 0 && Object.keys(mapping).length === 0) {
    throw new WeatherInputError(
      `no header row with known column names in the first lines (first line: ${JSON.stringify(headers.slice(0, 8).join(delimiter)).slice(0, 120)}); ` +
        'add a header row or map columns with --map dryBulb=#2 --map timestamp=#1 …',
      ['header'],
    )
  }
  if (headerIndex > 0) warnings.push(`lines 1–${headerIndex} before the header row were skipped`)
  const plan = planColumns(headers, mapping)
  let decimalComma = false
  if (delimiter !== ',') {
    for (let r = headerIndex + 1; r < Math.min(data.length, headerIndex + 200) && !decimalComma; r++) {
      for (const f of data[r]) if (/^\s*[-+]?\d+,\d+\s*$/.test(f)) decimalComma = true
    }
  }

  const rowIndex: number[] = []
  for (let r = headerIndex + 1; r < data.length; r++) if (!isBlank(data[r])) rowIndex.push(r)
  const n = rowIndex.length
  const lines = new Int32Array(n)
  for (let i = 0; i < n; i++) lines[i] = rowIndex[i] + 1
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
      `no timestamp column found (columns: ${headers.map((h) => `'${h}'`).join(', ')}); map it with --map timestamp=<column>, ` +
        'or --map date=<column> --map time=<column>, or --map year=… --map month=… --map day=… --map hour=…',
      ['timestamps'],
    )
  }
  if (t.timestamp === undefined && t.date === undefined && t.time !== undefined) {
    t.timestamp = t.time // a lone 'time' column holds date and time
    t.time = undefined
  }
  const scratch = new Float64Array(1)
  for (let i = 0; i < n; i++) {
    const row = data[rowIndex[i]]
    if (t.timestamp !== undefined || (t.date !== undefined && t.year === undefined)) {
      const dateText = row[t.timestamp ?? t.date!] ?? ''
      const timeText =
        t.timestamp === undefined ? (t.time !== undefined ? (row[t.time] ?? '') : undefined) : undefined
      let ok = parseTimestampInto(time, i, dateText, timeText)
      if (!ok && t.timestamp !== undefined && t.time !== undefined)
        ok = parseTimestampInto(time, i, dateText, row[t.time] ?? '')
      if (!ok)
        timeErrors[i] =
          `cannot read the timestamp '${truncate(timeText === undefined ? dateText : `${dateText} ${timeText}`)}'`
      continue
    }
    const part = (index: number | undefined, fallback: number): number => {
      if (index === undefined) return fallback
      parseField(row[index], false, scratch, 0)
      return scratch[0]
    }
    const year = part(t.year, Number.NaN)
    const month = part(t.month, Number.NaN)
    const day = part(t.day, Number.NaN)
    let minutes = Number.NaN
    if (t.hour !== undefined) minutes = part(t.hour, Number.NaN) * 60 + part(t.minute, 0)
    else if (t.time !== undefined) minutes = parseTimeOfDay(row[t.time] ?? '')
    const integral =
      Number.isInteger(year) && Number.isInteger(month) && Number.isInteger(day) && Number.isInteger(minutes)
    if (!integral || minutes < 0 || minutes > 1440) {
      timeErrors[i] =
        `cannot read the date and hour from the year/month/day/hour columns (${[t.year, t.month, t.day, t.hour].map((k) => (k === undefined ? '' : (row[k] ?? ''))).join(' ')})`
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
    const values = new Float64Array(n)
    let missing = 0
    const index = chosen.index
    for (let i = 0; i < n; i++) {
      const code = parseField(data[rowIndex[i]][index], decimalComma, values, i)
      if (code === FIELD_MISSING) missing++
      else if (code === FIELD_UNREADABLE) {
        missing++
        log.add(
          lines[i],
          variable,
          'unparseable-number',
          `'${truncate(data[rowIndex[i]][index] ?? '')}' in column '${chosen.header}' is not a number: read as missing`,
        )
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
    if (open !== '') warnings.push(`header '${text}' contains the delimiter inside brackets without quotes: read as one column`)
    out.push(text)
    open = ''
  }
  if (open !== '') out.push(...open.split(delimiter))
  return out
}

function truncate(s: string): string {
  return s.length > 40 ? `${s.slice(0, 40)}…` : s
}
