/**
 * @module weather/raw-table
 * What a format reader hands to the shared assembly: one entry per data row, in file order, with
 * its line number, its timestamp components and its raw values in the file's units, plus what the
 * reader knows of how each value relates to its row's time (instant or interval, label at the
 * interval's start or end, interval length) and what the file says about its site and clock.
 * Readers state; `assemble()` turns rows into hours.
 */
import type { ColumnPlan } from './columns.ts'
import type { ValueTiming } from './series.ts'
import type { TimestampColumns } from './timestamp-columns.ts'
import type { UnitConversion, WeatherVariable } from './units.ts'

/**
 * How a value relates to the time of its row.
 * - `instant`: the reading at that time (temperature, humidity, pressure, wind of most exports).
 * - `interval-mean`: the mean over an interval (irradiance in W/m² of most services).
 * - `interval-total`: the amount over an interval (rain in mm; irradiation in Wh/m² or J/m²).
 * - `running-total`: an amount accumulated since some reset (a gauge's "rain today", ERA5-Land's
 *   accumulations since 00 UTC): the increment from the previous row is the interval's total, and a
 *   fall means the counter was reset (the value itself is then the increment).
 */
export type ValueKind = ValueTiming | 'running-total'

/** Where a row's time sits in the interval its values describe. */
export type IntervalLabel = 'start' | 'end'

/** How one variable's values relate to their rows' times. */
export interface ColumnTiming {
  kind: ValueKind
  /**
   * Where the row's time sits in the interval the value covers (`end`: the value covers the time
   * before the label, e.g. "precipitation over the preceding hour"). For instants it says which
   * hour a reading exactly on the hour stands for: `start` = the hour it begins, `end` = the hour it
   * ends (EPW, TMY3). Omitted = the table's {@link RawTable.labels} (or the user's `labels` option).
   */
  label?: IntervalLabel
  /**
   * Length of the interval [min] when the source states it (60 for "the preceding hour"). Omitted =
   * the spacing of the rows (the most common step between consecutive timestamps).
   */
  intervalMinutes?: number
}

/** What a table's timing entry may be: a kind alone (label and interval from the table) or in full. */
export type TimingEntry = ValueTiming | ColumnTiming

/** Instant or interval mean/total per variable (kind alone, or with label and interval). */
export type ValueTimingOf = Partial<Record<WeatherVariable, TimingEntry>>

/** One variable's raw column. */
export interface RawColumn {
  /** Raw values in the file's unit, NaN where missing. */
  values: Float64Array
  /** Header text (CSV) or field name (EPW). */
  source: string
  /** Conversion to the series unit; null = decide from the values. */
  conversion: UnitConversion | null
  unitSource: 'header' | 'mapping' | 'format' | 'none'
  /** Count of values read as missing (empty, text like NA, or a missing code). */
  missingCount: number
  /** Count of missing codes (sentinels such as −9999 or the EPW field codes). */
  missingCodeCount: number
  /**
   * How the values relate to their rows' times; overrides `RawTable.timing[variable]`. Omitted:
   * the table's entry, else the variable's usual kind (instant; irradiance interval-mean; rain
   * interval-total).
   */
  timing?: ColumnTiming
}

/**
 * How rows become hours.
 * - `readings`: regular readings (hourly or sub-hourly): instants averaged, totals summed, each hour
 *   kept only when enough of it is covered.
 * - `reports`: weather reports taken near each hour plus specials in between (METAR/SYNOP, NOAA
 *   ISD, IEM ASOS, LCD): one report per hour, the routine one before a special, the one nearest the
 *   hour; a routine report a few minutes before the hour stands for that hour (12:53 → 13:00).
 * Omitted: detected from the timestamps (mostly one row per hour at one minute past or before the
 * hour, with extra rows in some hours → reports).
 */
export type RowSampling = 'readings' | 'reports'

/** Per-row report kind in {@link RawTable.reportKind}. */
export const ReportKind = {
  unknown: 0,
  routine: 1,
  special: 2,
  /** A summary row (daily or monthly summary in an hourly export): not an observation, dropped. */
  summary: 3,
} as const

/** What the file itself states about its site and its clock (dialect metadata, header blocks). */
export interface FileStatements {
  siteName?: string
  latitudeDeg?: number
  longitudeDeg?: number
  elevationM?: number
  /** The timestamps' fixed offset from UTC [h]: 0 when the file says its times are UTC. */
  timestampUtcOffsetHours?: number
  /** IANA zone of the timestamps (daylight saving applied). */
  timestampTimeZone?: string
  /**
   * The timestamps are in the site's local civil time (a home station's console or app, a hand-kept
   * sheet) but the file does not name the zone: the user's `--site-tz` then also reads the timestamps.
   */
  timestampsInSiteClock?: boolean
  /** The site's own IANA zone, when the file names it (it may differ from the timestamps' basis). */
  siteTimeZone?: string
  /** The site's standard-time offset from UTC [h] (EPW header, `utc_offset_seconds`). */
  siteUtcOffsetHours?: number
  /** Wind measurement height [m]. */
  windHeightM?: number
  /** The layout recognised (dialect id), for reports. */
  dialect?: string
}

export interface RawTable {
  format: 'csv' | 'epw'
  /** How the reader understood the file (delimiter, header, conventions, columns left out): notes, not problems. */
  notes?: string[]
  rows: number
  /** 1-based file line of each row. */
  lines: Int32Array
  time: TimestampColumns
  /** Rows whose timestamp text was unreadable: reason per row ('' = fine). */
  timeErrors: (string | undefined)[]
  columns: Partial<Record<WeatherVariable, RawColumn>>
  timing: ValueTimingOf
  /**
   * Where row times sit in their intervals for every variable without its own label: `start`
   * (default for delimited files: 10:00 = 10:00–11:00) or `end` (EPW, TMY3: 01:00 = 00:00–01:00).
   * The user's `labels` option overrides it; omitted and not given = detected (hours 01–24 → end).
   */
  labels?: IntervalLabel
  /** How rows become hours; omitted = detected. */
  sampling?: RowSampling
  /** Per row: {@link ReportKind} (routine, special or unknown), for `reports` sampling. */
  reportKind?: Uint8Array
  /** What the file says about its site and clock. */
  statements?: FileStatements
  /** The known layout (format dialect) the file was read as, when one recognised it. */
  dialect?: { id: string; title: string }
  /**
   * Quality flags the file itself declares per row (`QualityFlag` bits; dryhours' own hourly export
   * carries them in its `flags` column), merged into the hours' flags. A value marked as supplied
   * (standard-atmosphere pressure, estimated irradiance) is not judged as a sensor reading.
   */
  rowFlags?: Uint8Array
  /**
   * The values already passed dryhours' checks (its own export): spike and stuck-sensor checks are
   * not repeated, so reading the export back changes nothing.
   */
  checked?: boolean
  /** Columns seen but not used (header text). */
  unusedColumns: string[]
  plan?: ColumnPlan
}

/** The full timing of `variable` in `table`: the column's own, the table's entry, else the usual kind. */
export function columnTiming(
  table: RawTable,
  variable: WeatherVariable,
  usual: ValueTiming,
): { kind: ValueKind; label: IntervalLabel | undefined; intervalMinutes: number | undefined } {
  const own = table.columns[variable]?.timing
  const entry = own ?? table.timing[variable]
  if (entry === undefined) return { kind: usual, label: undefined, intervalMinutes: undefined }
  if (typeof entry === 'string') return { kind: entry, label: undefined, intervalMinutes: undefined }
  return { kind: entry.kind, label: entry.label, intervalMinutes: entry.intervalMinutes }
}
