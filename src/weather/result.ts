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
  /** Weather reports not used because a better report stood for the same hour (routine before special, nearest the hour). */
  superseded: number
}

/** How rows became hours (`weather/hourly-aggregate.ts`). */
export interface HourlyAggregation {
  /** `readings`: averaged and summed into hours; `reports`: one report per hour. */
  sampling: 'readings' | 'reports'
  /** Most common spacing of the rows [min]. */
  stepMinutes: number
  /** Minute after the hour most reports carry (reports only). */
  reportMinute: number | null
  /** Reports moved to the nearest hour. */
  alignedReports: number
  /** Hours built from more than one row (the largest count over the variables). */
  hoursFromSeveralRows: number
  /** Hours kept although some of their readings were missing (flag partialHour). */
  partialHours: number
  /** Per variable, hours whose readings covered too little of the hour: left missing. */
  hoursBelowCoverage: Partial<Record<string, number>>
  /** Reports not used (a better one stood for the hour). */
  supersededRows: number
  /** The rule applied, in words, with its source. */
  rule: string
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
  /** The known layout the file was read as (e.g. `{ id: 'open-meteo', title: 'Open-Meteo hourly CSV' }`), when one recognised it. */
  dialect?: { id: string; title: string }
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
  /**
   * Notes, apart from the warnings: how the file was understood (delimiter, header, the layout's conventions,
   * columns left out) and what was supplied rather than read (estimated irradiance, a constant pressure).
   */
  notes: string[]
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
  /** How rows became hours. */
  hourly: HourlyAggregation
}
