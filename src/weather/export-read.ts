/**
 * @module weather/export-read
 * dryhours' own hourly export (`weather/export.ts`) read back unchanged: recognised by its exact
 * header, UTC hour starts, SI values, and the `flags` column carried into the hours' quality flags.
 * Its values already passed the checks when it was made, so spike and stuck-sensor checks are not
 * repeated (a gap filled between two equal values would otherwise look like a stuck run).
 */

import { HOURLY_EXPORT_HEADER, parseFlagWords } from './export.ts'
import type { ProblemLog } from './problem-log.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import { snippet } from './snippet.ts'
import { createTimestampColumns } from './timestamp-columns.ts'
import { parseTimestampInto } from './timestamps.ts'
import { siUnit, type WeatherVariable } from './units.ts'

/** The export's columns after `time_utc`, in order, and what each is. */
const EXPORT_COLUMNS: readonly (WeatherVariable | 'flags')[] = [
  'dryBulb',
  'relativeHumidity',
  'dewPoint',
  'pressure',
  'wind',
  'ghi',
  'rain',
  'flags',
]

/** True when the text starts with the export's exact header line. */
export function looksLikeHourlyExport(text: string): boolean {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  if (!body.startsWith(HOURLY_EXPORT_HEADER)) return false
  const next = body.charCodeAt(HOURLY_EXPORT_HEADER.length)
  return Number.isNaN(next) || next === 10 || next === 13
}

/** The export's text as a RawTable (UTC, hour starts, SI, flags per row). */
export function readHourlyExportTable(text: string, log: ProblemLog): RawTable {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const physical = body.split(/\r\n|\n|\r/)
  const rowsLines: number[] = []
  for (let k = 1; k < physical.length; k++) if (physical[k].trim() !== '') rowsLines.push(k)
  const n = rowsLines.length
  const time = createTimestampColumns(n)
  const timeErrors: (string | undefined)[] = new Array(n)
  const lines = new Int32Array(n)
  const values = EXPORT_COLUMNS.map(() => new Float64Array(n).fill(Number.NaN))
  const missing = new Int32Array(EXPORT_COLUMNS.length)
  const rowFlags = new Uint8Array(n)
  for (let i = 0; i < n; i++) {
    const k = rowsLines[i]
    lines[i] = k + 1
    const cells = physical[k].split(',')
    if (!parseTimestampInto(time, i, cells[0] ?? ''))
      timeErrors[i] = `cannot read the timestamp '${snippet(cells[0] ?? '')}'`
    for (let c = 0; c < EXPORT_COLUMNS.length; c++) {
      const cell = cells[c + 1] ?? ''
      if (EXPORT_COLUMNS[c] === 'flags') {
        const { bits, unknown } = parseFlagWords(cell)
        rowFlags[i] = bits
        if (unknown.length > 0)
          log.add(lines[i], null, 'unparseable-number', `unknown flag '${snippet(unknown[0])}': ignored`)
        continue
      }
      const text = cell.trim()
      const v = text === '' ? Number.NaN : Number(text)
      if (Number.isNaN(v)) {
        missing[c]++
        if (text !== '')
          log.add(
            lines[i],
            EXPORT_COLUMNS[c],
            'unparseable-number',
            `'${snippet(text)}' is not a number: read as missing`,
          )
      } else values[c][i] = v
    }
  }
  const columns: Partial<Record<WeatherVariable, RawColumn>> = {}
  const headers = HOURLY_EXPORT_HEADER.split(',').slice(1)
  EXPORT_COLUMNS.forEach((variable, c) => {
    if (variable === 'flags' || missing[c] === n) return
    columns[variable] = {
      values: values[c],
      source: headers[c],
      conversion: siUnit(variable),
      unitSource: 'format',
      missingCount: missing[c],
      missingCodeCount: 0,
      timing:
        variable === 'ghi'
          ? { kind: 'interval-mean', label: 'start', intervalMinutes: 60 }
          : variable === 'rain'
            ? { kind: 'interval-total', label: 'start', intervalMinutes: 60 }
            : { kind: 'instant', label: 'start' },
    }
  })
  return {
    format: 'csv',
    rows: n,
    lines,
    time,
    timeErrors,
    columns,
    timing: {},
    labels: 'start',
    sampling: 'readings',
    rowFlags,
    checked: true,
    statements: { timestampUtcOffsetHours: 0, dialect: 'dryhours-hourly-export' },
    unusedColumns: ['flags'],
  }
}
