/**
 * @module weather/unusable-input
 * The errors for a table that cannot give a series: no dry-bulb or humidity column (all reasons at
 * once), or not one hour with both, with how the values were lost and what to check.
 */
import type { ProblemLog } from './problem-log.ts'
import type { RawTable } from './raw-table.ts'
import type { ColumnReport, HourlyAggregation } from './result.ts'
import { snippet } from './snippet.ts'
import { WeatherInputError } from './weather-input-error.ts'

/**
 * The error for a file with rows but not one hour that has both dry bulb and humidity: which of the
 * two is missing, how the values were lost (counts of problems by kind) and what to check.
 */
export function noUsableHour(
  series: { hours: number; dryBulbC: Float64Array; relativeHumidityPct: Float64Array },
  columns: ColumnReport[],
  log: ProblemLog,
  aggregation: HourlyAggregation,
): WeatherInputError {
  let withDry = 0
  let withHumidity = 0
  for (let s = 0; s < series.hours; s++) {
    if (!Number.isNaN(series.dryBulbC[s])) withDry++
    if (!Number.isNaN(series.relativeHumidityPct[s])) withHumidity++
  }
  const lacking: string[] = []
  const humiditySources = columns
    .filter((c) => c.variable === 'relativeHumidity' || c.variable === 'dewPoint' || c.variable === 'wetBulb')
    .map((c) => `'${snippet(c.source)}'`)
  const drySource = columns.find((c) => c.variable === 'dryBulb')?.source ?? ''
  if (withDry === 0) lacking.push(`no hour has a dry bulb (column '${snippet(drySource)}')`)
  if (withHumidity === 0) lacking.push(`no hour has a humidity (column ${humiditySources.join(', ')})`)
  if (lacking.length === 0)
    lacking.push(`${withDry} hours have a dry bulb and ${withHumidity} a humidity, but never the same hour`)
  const counts = Object.entries(log.counts)
    .sort((a, b) => (b[1] ?? 0) - (a[1] ?? 0))
    .slice(0, 4)
    .map(([k, v]) => `${k} ${v}`)
  const below = Object.entries(aggregation.hoursBelowCoverage).map(
    ([v, k]) => `${v} ${k} hours with too few readings`,
  )
  const why = [...counts, ...below]
  return new WeatherInputError(
    `no usable hour in the file: ${lacking.join('; ')}${why.length > 0 ? ` (problems: ${why.join(', ')})` : ''}; ` +
      'check that the columns hold numbers in the stated units, or map the right ones with --map',
    ['usable hours'],
  )
}

/** Errors for absent dry bulb or humidity columns (checked before anything else is computed). */
export function missingCoreColumns(raw: RawTable): WeatherInputError[] {
  const out: WeatherInputError[] = []
  if (!raw.columns.dryBulb) {
    out.push(
      new WeatherInputError(
        `no dry-bulb temperature column found (columns: ${allColumnsText(raw)}); map one with --map dryBulb=<column>[:C|F|K]`,
        ['dry bulb'],
      ),
    )
  }
  if (!raw.columns.relativeHumidity && !raw.columns.dewPoint && !raw.columns.wetBulb) {
    out.push(
      new WeatherInputError(
        `no humidity column (relative humidity, dew point or wet bulb) found; the columns are ${allColumnsText(raw)}: ` +
          'give one with --map relativeHumidity=<column>[:%|fraction], --map dewPoint=<column>[:C|F] or --map wetBulb=<column>[:C|F]',
        ['humidity'],
      ),
    )
  }
  return out
}

export function mergeErrors(errors: WeatherInputError[]): WeatherInputError {
  if (errors.length === 1) return errors[0]
  return new WeatherInputError(
    errors.map((e, i) => `(${i + 1}) ${e.message}`).join('; '),
    errors.flatMap((e) => e.missing),
  )
}

function allColumnsText(raw: RawTable): string {
  const used = Object.values(raw.columns).map((c) => `'${snippet(c!.source)}'`)
  return [...used, ...raw.unusedColumns.map((c) => `'${snippet(c)}'`)].join(', ') || 'none'
}
