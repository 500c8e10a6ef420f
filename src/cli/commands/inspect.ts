import { parseArgs } from 'node:util'
import { inspectJson } from '../../report/inspect-json.ts'
import { type ColumnMapping, type MappingKey, parseMappingArgument } from '../../weather/options.ts'
import { readWeatherBytes } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import { type CliCommand, numberOption, UsageError } from '../command.ts'

const help = `dryhours inspect: what a weather file holds, as this program reads it

Usage:
  dryhours inspect <file> [--lat <°N> --lon <°E> --elevation <m>]
                   [--utc-offset <h> | --tz <IANA zone>] [--map variable=column[:unit] …]
                   [--date-order mdy|dmy] [--labels hour-start|hour-end] [--wind-height <m>] [--json]

Reads delimited text (comma, semicolon or tab) or EPW. Prints the format, site, period, time basis,
the columns with their units, coverage per month, rows read/used/repaired/rejected and the first
problems with line numbers.

  --utc-offset  offset of the file's clock from UTC in hours (standard time, e.g. -5); 0 for UTC
  --tz          IANA zone when the file's clock follows daylight saving (e.g. Europe/Madrid)
  --map         take a variable from a column: dryBulb, relativeHumidity, dewPoint, wetBulb,
                pressure, wind, ghi, rain, cloudCover, or a time field timestamp, date, time,
                year, month, day, hour, minute. Column by header name or #n (1-based); unit
                optional (C F K, % fraction, Pa hPa mbar kPa inHg, m/s km/h mph knots,
                W/m2 Wh/m2 MJ/m2 J/cm2, mm in); column 'none' ignores a detected column.
  --labels      whether CSV timestamps label the start (default) or the end of each hour

Exit status 2 when the file cannot give a usable series; the message says what to supply.`

export { inspectJson }

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')

function text(r: WeatherReadResult, file: string): string {
  const s = r.series
  const site = s.site
  const out: string[] = []
  out.push(`${file}: ${r.format.toUpperCase()}${s.typicalYear ? ', typical year' : ''}`)
  const where = [
    site.name && JSON.stringify(site.name),
    site.latitudeDeg !== null ? `${site.latitudeDeg}°N ${site.longitudeDeg}°E` : 'latitude/longitude unknown',
    site.elevationM !== null ? `${site.elevationM} m` : 'elevation unknown',
  ].filter(Boolean)
  out.push(`site        ${where.join(', ')}`)
  out.push(
    `period      ${r.period.start} to ${r.period.end} (UTC), ${s.hours} hours, years ${r.years.join(', ')}`,
  )
  if (r.sourceYears.length > 0) out.push(`            months taken from ${r.sourceYears.join(', ')}`)
  out.push(`time basis  ${r.timeBasis}`)
  for (const e of r.dstEvents) {
    out.push(
      `            ${e.kind === 'spring-gap' ? 'clocks forward' : 'clocks back'} at ${e.atUtc}: ${e.rows} row(s) in the ${e.kind === 'spring-gap' ? 'missing' : 'doubled'} hour`,
    )
  }
  out.push('columns')
  const w = Math.max(...r.columns.map((c) => c.variable.length))
  for (const c of r.columns) {
    out.push(
      `  ${c.variable.padEnd(w)}  ${c.source}  [${c.unit}, ${c.unitFrom}; ${c.timing}]${c.missing ? `  ${c.missing} missing` : ''}`,
    )
  }
  out.push(
    `rows        read ${r.rows.read}, used ${r.rows.used}, repaired ${r.rows.repaired}, rejected ${r.rows.rejected}`,
  )
  if (r.rejectedRows.length > 0) out.push(`rejected    ${lineRanges(r.rejectedRows.map((x) => x.line))}`)
  out.push(
    `hours       ${r.hoursWithoutRow} without a row, ${r.hoursMissingCore} without dry bulb or humidity (excluded)`,
  )
  out.push('coverage    % of hours with dry bulb and humidity')
  const byYear = new Map<number, string[]>()
  for (const c of r.coverage) {
    const row = byYear.get(c.year) ?? new Array(12).fill('    .')
    row[c.month - 1] = String(Math.floor(c.percent)).padStart(5)
    byYear.set(c.year, row)
  }
  out.push(`      ${MONTHS.map((m) => m.padStart(5)).join('')}`)
  for (const [year, row] of byYear) out.push(`  ${year}${row.join('')}`)
  for (const wText of r.warnings) out.push(`note: ${wText}`)
  const counts = Object.entries(r.problemCounts)
  if (counts.length > 0) {
    out.push(`problems    ${counts.map(([k, v]) => `${k} ${v}`).join(', ')}`)
    for (const p of r.problems.slice(0, 20)) {
      out.push(
        `  ${p.line === null ? '(no row)' : `line ${p.line}`}: ${p.variable ? `${p.variable}: ` : ''}${p.message}`,
      )
    }
    if (r.problems.length > 20)
      out.push(
        `  … ${Object.values(r.problemCounts).reduce((a, b) => a + (b ?? 0), 0) - 20} more (--json lists 100)`,
      )
  } else out.push('problems    none')
  return `${out.join('\n')}\n`
}

/** Lines as ranges (`lines 12, 40–52, 90`), the first 30 ranges, then how to get every one. */
export function lineRanges(lines: number[], shown = 30): string {
  const ranges: string[] = []
  for (let i = 0; i < lines.length; ) {
    let j = i
    while (j + 1 < lines.length && lines[j + 1] === lines[j] + 1) j++
    ranges.push(j > i ? `${lines[i]}–${lines[j]}` : String(lines[i]))
    i = j + 1
  }
  const head = ranges.slice(0, shown).join(', ')
  return ranges.length > shown
    ? `lines ${head} … (${lines.length} rows; --json lists every one in rejectedRows)`
    : `lines ${head}`
}

export const inspectCommand: CliCommand = {
  name: 'inspect',
  summary: 'what a weather file holds: format, site, period, time basis, columns, coverage, problems',
  help,
  async run(args, io) {
    let parsed: ReturnType<typeof parseArgs>
    try {
      parsed = parseArgs({
        args,
        options: {
          lat: { type: 'string' },
          lon: { type: 'string' },
          elevation: { type: 'string' },
          'utc-offset': { type: 'string' },
          tz: { type: 'string' },
          map: { type: 'string', multiple: true },
          'date-order': { type: 'string' },
          labels: { type: 'string' },
          'wind-height': { type: 'string' },
          json: { type: 'boolean' },
        },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const values = parsed.values as Record<string, string | string[] | boolean | undefined>
    const str = (k: string): string | undefined => values[k] as string | undefined
    if (parsed.positionals.length !== 1)
      throw new UsageError('give exactly one weather file: dryhours inspect <file>')
    const file = parsed.positionals[0]
    const mapping: Partial<Record<MappingKey, ColumnMapping>> = {}
    for (const arg of (values.map as string[] | undefined) ?? []) {
      try {
        const [key, m] = parseMappingArgument(arg)
        mapping[key] = m
      } catch (e) {
        throw new UsageError(`--map ${(e as Error).message}`)
      }
    }
    const options: Record<string, unknown> = {
      latitudeDeg: numberOption('lat', str('lat')),
      longitudeDeg: numberOption('lon', str('lon')),
      elevationM: numberOption('elevation', str('elevation')),
      utcOffsetHours: numberOption('utc-offset', str('utc-offset')),
      timeZone: str('tz'),
      mapping: Object.keys(mapping).length > 0 ? mapping : undefined,
      dateOrder: str('date-order'),
      timestampLabels: str('labels'),
      windHeightM: numberOption('wind-height', str('wind-height')),
    }
    for (const k of Object.keys(options)) if (options[k] === undefined) delete options[k]
    const bytes = await io.readFile(file)
    let result: WeatherReadResult
    try {
      result = readWeatherBytes(bytes, options)
    } catch (e) {
      if (e instanceof WeatherInputError) throw new UsageError(`${file}: ${e.message}`)
      throw e
    }
    io.stdout(values.json ? `${JSON.stringify(inspectJson(result))}\n` : text(result, file))
    return 0
  },
}
