import { parseArgs } from 'node:util'
import { inspectJson } from '../../report/inspect-json.ts'
import { hourlyExportCsv } from '../../weather/export.ts'
import { TIME_FIELDS } from '../../weather/options.ts'
import { readWeatherBytes } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { formatOffset } from '../../weather/time-basis.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import { type CliCommand, UsageError } from '../command.ts'
import { WEATHER_FLAGS_HELP, WEATHER_PARSE_OPTIONS, weatherOptionsFromCli } from '../weather-flags.ts'

const help = `dryhours inspect: what a weather file holds, as this program reads it

Usage:
  dryhours inspect <file> [weather options] [--json] [--export <out.csv>]

Reads delimited text (comma, semicolon or tab), the known export layouts (dialects) or EPW. Prints
the layout, site and its clock, period, time basis, the columns with their units and timing, how rows
became hours, coverage per month, rows read/used/repaired/rejected/superseded and the first problems
with line numbers.

  --json               the same as JSON, with per variable the hours, mean, min and max in SI
  --export <out.csv>   write the hourly series the engine will use: UTC hour starts (time_utc, ISO 8601
                       with Z), SI units, irradiance the mean over the hour, rain its total, empty =
                       missing, and each hour's flags; dryhours reads this file back unchanged

${WEATHER_FLAGS_HELP}

  --map variables: dryBulb, relativeHumidity, dewPoint, wetBulb, pressure, wind, ghi, rain,
  cloudCover, or a time field: ${TIME_FIELDS.join(', ')}.
  Units: C F K, % fraction, Pa hPa mbar kPa inHg, m/s km/h mph knots, W/m2 Wh/m2 MJ/m2 J/cm2, mm in.

Exit status 2 when the file cannot give a usable series; the message says what to supply.`

export { inspectJson }

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')

function text(r: WeatherReadResult, file: string): string {
  const s = r.series
  const site = s.site
  const out: string[] = []
  out.push(`${file}: ${r.format.toUpperCase()}${s.typicalYear ? ', typical year' : ''}`)
  const layout = r.dialect
    ? `${r.dialect.title} (${r.dialect.id})`
    : r.format === 'epw'
      ? 'EPW (fixed fields)'
      : 'no known layout recognised: read as generic delimited text'
  out.push(`dialect     ${layout}`)
  const where = [
    site.name && JSON.stringify(site.name),
    site.latitudeDeg !== null ? `${site.latitudeDeg}°N ${site.longitudeDeg}°E` : 'latitude/longitude unknown',
    site.elevationM !== null ? `${site.elevationM} m` : 'elevation unknown',
  ].filter(Boolean)
  out.push(`site        ${where.join(', ')}`)
  out.push(`site clock  ${siteClockText(site)}`)
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
  out.push(`hours from  ${hourlyText(r)}`)
  out.push(
    `rows        read ${r.rows.read}, used ${r.rows.used}, repaired ${r.rows.repaired}, rejected ${r.rows.rejected}${r.rows.superseded ? `, superseded ${r.rows.superseded}` : ''}`,
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
  for (const wText of r.warnings) out.push(`warning: ${wText}`)
  for (const n of r.notes) out.push(`note: ${n}`)
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

const SOURCE_WORDS: Record<string, string> = {
  option: 'given with --site-tz',
  file: 'stated by the file',
  timestamps: "the clock of the file's local time stamps",
  longitude: 'from the longitude, mean solar time to the hour',
}

function siteClockText(site: WeatherReadResult['series']['site']): string {
  if (site.utcOffsetHours === null) return 'unknown (local hours are UTC; give --site-tz)'
  const zone = site.timeZone ? `${site.timeZone}, standard time ` : ''
  return `${zone}UTC${formatOffset(site.utcOffsetHours)} (${SOURCE_WORDS[site.utcOffsetSource ?? 'file']})`
}

function hourlyText(r: WeatherReadResult): string {
  const h = r.hourly
  if (h.sampling === 'reports')
    return `weather reports, one per hour (${h.alignedReports} aligned to the hour; routine before special)`
  if (h.stepMinutes < 60)
    return `readings every ${h.stepMinutes} min averaged/summed; ${h.partialHours} hours with some readings missing`
  return `one row per hour${h.stepMinutes > 60 ? ` (rows ${h.stepMinutes} min apart)` : ''}`
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
          ...WEATHER_PARSE_OPTIONS,
          json: { type: 'boolean' },
          export: { type: 'string' },
        },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const values = parsed.values as Record<string, string | string[] | boolean | undefined>
    if (parsed.positionals.length !== 1)
      throw new UsageError('give exactly one weather file: dryhours inspect <file>')
    const file = parsed.positionals[0]
    const options = weatherOptionsFromCli(values)
    const bytes = await io.readFile(file)
    let result: WeatherReadResult
    try {
      result = readWeatherBytes(bytes, options)
    } catch (e) {
      if (e instanceof WeatherInputError) throw new UsageError(`${file}: ${e.message}`)
      throw e
    }
    const out = values.export as string | undefined
    if (out !== undefined) {
      if (out === '' || out === file)
        throw new UsageError('--export needs an output file other than the input')
      await io.writeFile(out, hourlyExportCsv(result.series))
    }
    io.stdout(values.json ? `${JSON.stringify(inspectJson(result))}\n` : text(result, file))
    if (out !== undefined && !values.json)
      io.stdout(`hourly series written to ${out} (${result.series.hours} hours, UTC)\n`)
    return 0
  },
}
