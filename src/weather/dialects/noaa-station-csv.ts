/**
 * @module weather/dialects/noaa-station-csv
 * What NOAA NCEI's station CSVs (ISD global-hourly, Local Climatological Data) share: the `REPORT_TYPE`
 * column, whose SOD and SOM rows are daily and monthly summaries (left out) and whose codes tell
 * routine reports from specials (FM-16, SPECI); and the station's `NAME`, `LATITUDE`, `LONGITUDE`,
 * `ELEVATION` repeated on every row, read from the first; one routine report an hour plus specials, with
 * precipitation over the hour before each report. (NCEI CSV layout, from memory.)
 */
import type { DelimitedLayout } from '../delimited.ts'
import type { RawTable } from '../raw-table.ts'
import { type DialectHead, numberOf, quotedCells } from './dialect.ts'

/** Summary-of-day and summary-of-month rows: not observations. */
export const NOAA_SUMMARY_ROWS: NonNullable<DelimitedLayout['dropRows']> = {
  names: ['REPORT_TYPE'],
  drop: (t) => t.trim() === 'SOD' || t.trim() === 'SOM',
  reason: 'summary-of-day or summary-of-month rows (REPORT_TYPE SOD/SOM, not observations)',
}

/** Report kind from `REPORT_TYPE`: 1 routine (one of `routine`), 2 special (FM-16), 0 unknown. */
export function noaaReportKind(routine: ReadonlySet<string>): NonNullable<DelimitedLayout['reportKind']> {
  return {
    names: ['REPORT_TYPE'],
    kind: (t) => (routine.has(t.trim()) ? 1 : t.trim() === 'FM-16' ? 2 : 0),
  }
}

/** The station columns of the first data row, and that row's cell by (lower-case) column name. */
export function noaaStation(head: DialectHead): {
  site: { siteName?: string; latitudeDeg: number; longitudeDeg: number; elevationM: number }
  at: (name: string) => string | undefined
} {
  const names = quotedCells(head.lower[0]).map((n) => n.trim())
  const first = quotedCells(head.lines[1] ?? '')
  const at = (name: string): string | undefined => first[names.indexOf(name)]
  return {
    site: {
      siteName: at('name')?.trim(),
      latitudeDeg: numberOf(at('latitude')),
      longitudeDeg: numberOf(at('longitude')),
      elevationM: numberOf(at('elevation')),
    },
    at,
  }
}

/** Weather reports (one per hour plus specials), labelled at their start; precipitation over the hour before each report. */
export function noaaReportTiming(table: RawTable): void {
  if (table.columns.rain)
    table.columns.rain.timing = { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
  table.labels = 'start'
  table.sampling = 'reports'
}
