/**
 * @module weather/read-weather
 * The public entry: weather file text (or bytes) and options → a complete hourly series and an
 * account of how the file was read. Pure: no file access, no clock.
 */

import { assemble } from './assemble.ts'
import { type DelimitedInfo, readDelimited } from './delimited.ts'
import { detectDialect, dialectHead } from './dialects/index.ts'
import { looksLikeEpw, readEpw } from './epw.ts'
import { looksLikeHourlyExport, readHourlyExportTable } from './export-read.ts'
import { type WeatherReadOptions, weatherReadOptionsSchema } from './options.ts'
import { ProblemLog } from './problem-log.ts'
import type { WeatherReadResult } from './result.ts'
import type { SiteInfo } from './series.ts'
import { escapeControlCharacters } from './snippet.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** Default wind measurement height [m]: WMO standard 10 m (WMO-No. 8, 2018, Vol. I ch. 5). */
export const DEFAULT_WIND_HEIGHT_M = 10

/** Validate options with the shared schema; a WeatherInputError names the option and the accepted range. */
export function parseWeatherOptions(options: unknown): WeatherReadOptions {
  const parsed = weatherReadOptionsSchema.safeParse(options ?? {})
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    throw new WeatherInputError(`option ${issue.path.join('.') || '(options)'}: ${issue.message}`, [
      issue.path.join('.'),
    ])
  }
  return parsed.data
}

/**
 * Read a weather file's text. Format from `options.format` or detected (EPW when the first line
 * starts with LOCATION). Throws {@link WeatherInputError} when the file cannot give a usable series
 * (no rows, no timestamps, no time zone for local times, no dry bulb or humidity, ambiguous columns).
 */
export function readWeather(
  text: string,
  options: WeatherReadOptions | Record<string, unknown> = {},
): WeatherReadResult {
  const opts = parseWeatherOptions(options)
  const log = new ProblemLog()
  const warnings: string[] = []
  const format =
    opts.format === undefined || opts.format === 'auto' ? (looksLikeEpw(text) ? 'epw' : 'csv') : opts.format
  if (looksLikeHourlyExport(text) && format === 'csv') return readOwnExport(text, opts, log, warnings)
  if (format === 'epw') return readEpwFile(text, opts, log, warnings)
  return readTableFile(text, opts, log, warnings)
}

/** An EPW file: fixed fields, local standard time at the header's offset, hour-ending labels. */
function readEpwFile(
  text: string,
  opts: WeatherReadOptions,
  log: ProblemLog,
  warnings: string[],
): WeatherReadResult {
  const { table, header } = readEpw(text, log, warnings)
  if (opts.mapping !== undefined) warnings.push('the column mapping is ignored for EPW files (fixed fields)')
  if (opts.timeZone !== undefined)
    warnings.push(
      `EPW files are in local standard time (header: UTC${header.utcOffsetHours >= 0 ? '+' : ''}${header.utcOffsetHours}); --tz ${opts.timeZone} is ignored`,
    )
  if (opts.labels === 'start')
    warnings.push(
      'EPW timestamps label the end of each hour (EPW data dictionary); --labels start is ignored',
    )
  const offset = opts.utcOffsetHours ?? header.utcOffsetHours
  if (opts.utcOffsetHours !== undefined && opts.utcOffsetHours !== header.utcOffsetHours) {
    warnings.push(
      `the given UTC offset ${opts.utcOffsetHours} h overrides the EPW header's ${header.utcOffsetHours} h`,
    )
  }
  const site: SiteInfo = {
    name:
      opts.siteName ??
      escapeControlCharacters(
        [header.city, header.region, header.country].filter((s) => s !== '' && s !== '-').join(', '),
      ),
    latitudeDeg: opts.latitudeDeg ?? header.latitudeDeg,
    longitudeDeg: opts.longitudeDeg ?? header.longitudeDeg,
    elevationM: opts.elevationM ?? clampElevation(header.elevationM),
    timeZone: null,
    utcOffsetHours: null,
    windHeightM: opts.windHeightM ?? DEFAULT_WIND_HEIGHT_M,
  }
  return assemble(table, {
    site,
    time: {
      labels: 'end',
      fixedOffsetHours: offset,
      zone: null,
      headerSaysUtc: false,
    },
    log,
    warnings,
    elevationKnown: true,
    variableTiming: opts.variableLabels,
    sampling: opts.sampling,
    siteClock: { optionZone: opts.siteTimeZone, fileOffsetHours: offset },
  })
}

/**
 * Delimited text, through a known layout (a dialect) or the generic reader; what the file states
 * about its clock and site applies where the user's options say nothing.
 */
function readTableFile(
  text: string,
  opts: WeatherReadOptions,
  log: ProblemLog,
  warnings: string[],
): WeatherReadResult {
  const clockGiven = opts.utcOffsetHours !== undefined || opts.timeZone !== undefined
  const head = dialectHead(text)
  const dialect = opts.format === undefined || opts.format === 'auto' ? detectDialect(head) : null
  const notes: string[] = []
  const reading = dialect
    ? dialect.read(text, head, {
        mapping: opts.mapping ?? {},
        log,
        warnings,
        notes,
        headerLine: opts.headerLine,
        clockGiven,
      })
    : readDelimited(text, opts.mapping ?? {}, log, warnings, { headerLine: opts.headerLine })
  const table = reading.table
  const info = reading.info
  // the layout's conventions, then how the table itself was read
  notes.push(...(table.notes ?? []))
  if (dialect) table.dialect ??= { id: dialect.id, title: dialect.title }
  // What the file states about its clock and site; the user's options win.
  const said = table.statements ?? {}
  const headerOffset = said.timestampUtcOffsetHours ?? info?.plan.headerUtcOffsetHours ?? null
  if (
    headerOffset !== null &&
    said.timestampUtcOffsetHours === undefined &&
    opts.utcOffsetHours === undefined &&
    opts.timeZone === undefined
  ) {
    warnings.push(
      `the time header gives the offset UTC${headerOffset >= 0 ? '+' : ''}${headerOffset} h: used for the timestamps`,
    )
  }
  let fileZone = clockGiven ? undefined : said.timestampTimeZone
  if (
    fileZone === undefined &&
    !clockGiven &&
    headerOffset === null &&
    said.timestampsInSiteClock &&
    opts.siteTimeZone !== undefined
  ) {
    fileZone = opts.siteTimeZone
    warnings.push(
      `the file does not say which clock its times keep; read in the site's zone ${opts.siteTimeZone} (--site-tz), daylight saving applied: give --utc-offset or --tz if it keeps another`,
    )
  }
  const fixedOffset =
    opts.utcOffsetHours ?? (opts.timeZone === undefined && fileZone === undefined ? headerOffset : null)
  const windHeightM = info?.windHeightM ?? said.windHeightM ?? null
  const site: SiteInfo = {
    name: opts.siteName ?? said.siteName ?? '',
    latitudeDeg: opts.latitudeDeg ?? said.latitudeDeg ?? null,
    longitudeDeg: opts.longitudeDeg ?? said.longitudeDeg ?? null,
    elevationM: opts.elevationM ?? said.elevationM ?? null,
    timeZone: null,
    utcOffsetHours: null,
    windHeightM: opts.windHeightM ?? windHeightM ?? DEFAULT_WIND_HEIGHT_M,
  }
  if (opts.windHeightM === undefined && windHeightM === null && table.columns.wind) {
    warnings.push(
      `wind height not given: assumed ${DEFAULT_WIND_HEIGHT_M} m (WMO standard); give --wind-height <m> if it differs`,
    )
  }
  const result = assemble(table, {
    site,
    time: {
      declaredOrder: opts.dateOrder ?? info?.headerDateOrder ?? undefined,
      labels: opts.labels ?? null,
      fixedOffsetHours: fixedOffset,
      zone: opts.timeZone ?? fileZone ?? null,
      headerSaysUtc: info?.plan.headerSaysUtc ?? false,
    },
    log,
    warnings,
    notes,
    elevationKnown: site.elevationM !== null,
    variableTiming: opts.variableLabels,
    sampling: opts.sampling,
    siteClock: {
      optionZone: opts.siteTimeZone,
      fileZone: said.siteTimeZone ?? null,
      fileOffsetHours: said.siteUtcOffsetHours ?? null,
    },
  })
  if (table.dialect) result.dialect = table.dialect
  if (info) describeCsv(result, info, table.dialect?.title)
  return result
}

/** dryhours' own hourly export: UTC hour starts, SI, flags carried over. */
function readOwnExport(
  text: string,
  opts: WeatherReadOptions,
  log: ProblemLog,
  warnings: string[],
): WeatherReadResult {
  const table = readHourlyExportTable(text, log)
  const site: SiteInfo = {
    name: opts.siteName ?? '',
    latitudeDeg: opts.latitudeDeg ?? null,
    longitudeDeg: opts.longitudeDeg ?? null,
    elevationM: opts.elevationM ?? null,
    timeZone: null,
    utcOffsetHours: null,
    windHeightM: opts.windHeightM ?? DEFAULT_WIND_HEIGHT_M,
  }
  const result = assemble(table, {
    site,
    time: { labels: 'start', fixedOffsetHours: null, zone: null, headerSaysUtc: true },
    log,
    warnings,
    elevationKnown: opts.elevationM !== undefined,
    siteClock: { optionZone: opts.siteTimeZone },
  })
  result.notes.unshift("dryhours' own hourly export: UTC hour starts, values and flags read as written")
  return result
}

function describeCsv(result: WeatherReadResult, info: DelimitedInfo, dialect: string | undefined): void {
  const name = info.delimiter === '\t' ? 'tab' : info.delimiter === ';' ? 'semicolon' : 'comma'
  result.notes.unshift(
    `${dialect ? `${dialect}: ` : ''}${name}-separated, ${info.headerLine > 0 ? `header on line ${info.headerLine}` : 'no header row'}${info.decimalComma ? ', decimal commas' : ''}`,
  )
}

function clampElevation(m: number): number {
  return Math.max(-500, Math.min(9000, m))
}

/**
 * Text of a weather file's bytes. A byte order mark decides: FF FE is UTF-16 LE, FE FF UTF-16 BE,
 * EF BB BF UTF-8 (Unicode 15.0 §23.8, Table 23-5 "Unicode Encoding Form Signatures", from memory);
 * without one, UTF-8, or ISO-8859-1 when the bytes are not valid UTF-8 (older station and
 * typical-year exports use it). The mark itself is not part of the text.
 */
export function decodeWeatherBytes(bytes: Uint8Array): string {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe)
    return new TextDecoder('utf-16le').decode(bytes.subarray(2))
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff)
    return new TextDecoder('utf-16be').decode(bytes.subarray(2))
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf)
    return new TextDecoder('utf-8').decode(bytes.subarray(3))
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  } catch {
    return new TextDecoder('iso-8859-1').decode(bytes)
  }
}

/** Read a weather file's bytes (decoded by {@link decodeWeatherBytes}) with {@link readWeather}. */
export function readWeatherBytes(
  bytes: Uint8Array,
  options: WeatherReadOptions | Record<string, unknown> = {},
): WeatherReadResult {
  return readWeather(decodeWeatherBytes(bytes), options)
}
