/**
 * @module weather/result
 * What every reader returns: the series plus an account of how the file was understood.
 */

import type { ProblemKind, WeatherProblem } from './problem-log.ts'
import type { HourlySeries, ValueTiming } from './series.ts'
import type { DstEvent } from './time-basis.ts'

/** One variable taken from the file (or supplied), with the column and unit it came from. */
export interface ColumnReport {
  variable: string
  /** Header text, EPW field name, or e.g. `standard atmosphere at 250 m` for a supplied value. */
  source: string
  /** Unit as read (before conversion to the series unit). */
  unit: string
  /** Where the unit came from. */
  unitFrom: 'header' | 'mapping' | 'format' | 'detected' | 'assumed' | 'supplied'
  timing: ValueTiming
  /** Values read as missing (blank, NA, missing codes). */
  missing: number
}

export interface RowCounts {
  /** Data rows in the file (header and blank lines excluded). */
  read: number
  /** Rows placed in the series as read. */
  used: number
  /** Rows placed with at least one value rejected, clamped or filled. */
  repaired: number
  /** Rows not usable: bad or duplicate timestamp, or no dry bulb / humidity after filling. */
  rejected: number
}

/** A row of the file that was not used, with its line and the kind of problem that rejected it. */
export interface RejectedRow {
  line: number
  kind: ProblemKind
}

export interface MonthCoverage {
  year: number
  month: number
  /** Hours of the calendar month (site standard time) with dry bulb and humidity, as a percentage. */
  percent: number
}

export interface WeatherReadResult {
  series: HourlySeries
  format: 'csv' | 'epw'
  rows: RowCounts
  /** Every rejected row (uncapped, in file order), so each can be found in the file. */
  rejectedRows: RejectedRow[]
  columns: ColumnReport[]
  /** First problems (capped), each with its line; `problemCounts` counts all. */
  problems: WeatherProblem[]
  problemCounts: Partial<Record<ProblemKind, number>>
  /** Problems beyond the cap that are counted but not listed. */
  problemsOmitted: number
  warnings: string[]
  period: { start: string; end: string }
  /** How the timestamps became UTC. */
  timeBasis: string
  dstEvents: DstEvent[]
  coverage: MonthCoverage[]
  /** Hours of the series with no row in the file. */
  hoursWithoutRow: number
  /** Hours whose dry bulb or humidity are missing after filling (flag missingCore). */
  hoursMissingCore: number
  /** Distinct calendar years covered (site standard time). */
  years: number[]
  /** Source years of a typical-year file. */
  sourceYears: number[]
}
