/**
 * @module weather/raw-table
 * What a format reader hands to the shared assembly: one entry per data row, in file order, with
 * its line number, its timestamp components and its raw values in the file's units.
 */
import type { ColumnPlan } from './columns.ts'
import type { ValueTiming } from './series.ts'
import type { TimestampColumns } from './timestamps.ts'
import type { UnitConversion, WeatherVariable } from './units.ts'

/** Instant or interval mean/total, per variable. */
export type ValueTimingOf = Partial<Record<WeatherVariable, ValueTiming>>

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
}

export interface RawTable {
  format: 'csv' | 'epw'
  rows: number
  /** 1-based file line of each row. */
  lines: Int32Array
  time: TimestampColumns
  /** Rows whose timestamp text was unreadable: reason per row ('' = fine). */
  timeErrors: (string | undefined)[]
  columns: Partial<Record<WeatherVariable, RawColumn>>
  timing: ValueTimingOf
  /** Columns seen but not used (header text). */
  unusedColumns: string[]
  plan?: ColumnPlan
}
