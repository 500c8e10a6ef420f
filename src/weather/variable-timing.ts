/**
 * @module weather/variable-timing
 * How each variable's values relate to their rows' times: the reader's timing (instant, interval mean or
 * total, running total), the user's label and interval over it, the usual kind of each variable, and
 * how far interval values reach beyond the rows' own hours.
 */
import { MS_PER_HOUR } from '../physics/constants.ts'
import { columnTiming, type IntervalLabel, type RawTable, type ValueKind } from './raw-table.ts'
import { intervalReach, type RowPlan } from './row-plan.ts'
import type { ValueTiming } from './series.ts'
import { WEATHER_VARIABLES, type WeatherVariable } from './units.ts'

/** The user's statement of how one variable relates to its row times (label, interval). */
export interface VariableTimingOverride {
  label?: IntervalLabel
  intervalMinutes?: number
}

const DEFAULT_TIMING: Record<WeatherVariable, ValueTiming> = {
  dryBulb: 'instant',
  relativeHumidity: 'instant',
  dewPoint: 'instant',
  wetBulb: 'instant',
  pressure: 'instant',
  wind: 'instant',
  ghi: 'interval-mean',
  rain: 'interval-total',
  cloudCover: 'instant',
}

/** The hours interval variables reach beyond the rows' own hours, or null when none. */
export function gridReach(
  raw: RawTable,
  plan: RowPlan,
  fileLabels: IntervalLabel,
  overrides: Partial<Record<WeatherVariable, VariableTimingOverride>> | undefined,
): [number, number] | null {
  if (plan.hours === 0) return null
  const last = plan.firstHourMs + (plan.hours - 1) * MS_PER_HOUR
  let lo = plan.firstHourMs
  let hi = last
  for (const variable of WEATHER_VARIABLES) {
    if (raw.columns[variable] === undefined) continue
    const rule = variableRule(raw, variable, plan, fileLabels, overrides?.[variable])
    if (rule.kind === 'instant' || rule.intervalMinutes > 60) continue
    const r = intervalReach(plan, rule.label, rule.intervalMinutes)
    if (r === null) continue
    lo = Math.min(lo, r[0])
    hi = Math.max(hi, r[1])
  }
  return lo < plan.firstHourMs || hi > last ? [lo, hi] : null
}

/** The timing of a variable: the user's label and interval over the reader's, defaults filled in. */
export function variableRule(
  raw: RawTable,
  variable: WeatherVariable,
  plan: RowPlan,
  fileLabels: IntervalLabel,
  override: VariableTimingOverride | undefined,
): { kind: ValueKind; label: IntervalLabel; intervalMinutes: number } {
  const read = readTiming(raw, variable)
  // a running total's increment covers the time since the previous row: it always ends at its stamp
  const label = read.kind === 'running-total' ? 'end' : (override?.label ?? read.label ?? fileLabels)
  const intervalMinutes =
    override?.intervalMinutes ?? read.intervalMinutes ?? (plan.sampling === 'reports' ? 60 : plan.stepMinutes)
  return { kind: read.kind, label, intervalMinutes }
}

/** A running total is reported as the interval totals it is turned into. */
export function reportedKind(kind: ValueKind): ValueTiming {
  return kind === 'running-total' ? 'interval-total' : kind
}

/** The timing the reader gives a variable, or the variable's usual kind. */
export function readTiming(raw: RawTable, variable: WeatherVariable): ReturnType<typeof columnTiming> {
  return columnTiming(raw, variable, DEFAULT_TIMING[variable])
}
