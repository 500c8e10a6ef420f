/**
 * @module weather/problem-log
 * Problems found while reading a weather file, each with its line number, variable and kind, and a
 * count per kind that stays complete when the detailed list is capped (a 30-year file with a bad
 * sensor can hold 100,000 problems).
 */

/** What went wrong with a row or a value. */
export type ProblemKind =
  | 'bad-timestamp'
  | 'duplicate-timestamp'
  | 'out-of-order'
  | 'dst-gap'
  | 'dst-doubled-hour'
  | 'missing-code'
  | 'unparseable-number'
  | 'out-of-range'
  | 'step'
  | 'stuck-sensor'
  | 'dew-point-above-dry-bulb'
  | 'wet-bulb-above-dry-bulb'
  | 'rh-above-100'
  | 'negative-irradiance'
  | 'irradiance-at-night'
  | 'gap-filled'
  | 'core-missing'
  | 'too-few-readings'
  | 'interval-too-long'
  | 'short-row'
  | 'unbalanced-quote'

export interface WeatherProblem {
  /** 1-based line of the file, or null for an hour with no row. */
  line: number | null
  /** Variable concerned, or null for the whole row. */
  variable: string | null
  kind: ProblemKind
  message: string
}

/** Default cap on the detailed problem list. */
export const DEFAULT_PROBLEM_LIMIT = 5000

export class ProblemLog {
  readonly problems: WeatherProblem[] = []
  readonly counts: Partial<Record<ProblemKind, number>> = {}
  /** First whole-row problem (variable null) of each line, uncapped: why a rejected row was rejected. */
  readonly rowKinds = new Map<number, ProblemKind>()
  omitted = 0
  constructor(readonly limit = DEFAULT_PROBLEM_LIMIT) {}
  add(line: number | null, variable: string | null, kind: ProblemKind, message: string): void {
    this.counts[kind] = (this.counts[kind] ?? 0) + 1
    if (variable === null && line !== null && !this.rowKinds.has(line)) this.rowKinds.set(line, kind)
    if (this.problems.length < this.limit) this.problems.push({ line, variable, kind, message })
    else this.omitted++
  }
}
