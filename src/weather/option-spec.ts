/**
 * @module weather/option-spec
 * One definition of the weather-reading options for every interface: each option's reader key, CLI
 * flag, API query parameter (also the page's form field), form label, description and how its text
 * is read. The CLI flags, the API's zod query fields and the page's form fields are derived from this
 * table, and messages name an option in the words of the interface that received it: the core writes
 * CLI words (`--map dryBulb=…`, `--lat`) and {@link renderOptionNames} turns them into API parameters
 * (`map=dryBulb=…`) or form labels.
 */
import {
  MAPPING_KEYS,
  type MappingKey,
  parseMappingArgument,
  type WeatherReadOptions,
  weatherReadOptionsSchema,
} from './options.ts'
import type { IntervalLabel } from './raw-table.ts'
import { snippet } from './snippet.ts'
import { WEATHER_VARIABLES, type WeatherVariable } from './units.ts'

/** Where options come from, and so how messages name them. */
export type OptionSurface = 'cli' | 'query' | 'json' | 'form'

export interface WeatherOptionSpec {
  /** Key in the reader's options (`weatherReadOptionsSchema`, the API's JSON `options`). */
  key: string
  /** CLI flag, without the dashes. */
  flag: string
  /** API query parameter and page form field. */
  param: string
  /** The page's label for the field. */
  label: string
  /** What the option says, with its unit. */
  description: string
  /** Value placeholder in help texts. */
  value: string
  /** May be given several times (CLI: repeat the flag; API and page: one per line or separated by ';'). */
  multiple: boolean
  /** The page's group: the site and clock, or the file's columns and layout. */
  group: 'site' | 'columns'
}

const spec = (
  key: string,
  flag: string,
  param: string,
  label: string,
  value: string,
  description: string,
  group: WeatherOptionSpec['group'],
  multiple = false,
): WeatherOptionSpec => ({ key, flag, param, label, value, description, multiple, group })

/** Every weather option, in the order help texts list them. */
export const WEATHER_OPTION_SPECS: readonly WeatherOptionSpec[] = [
  spec('siteName', 'site-name', 'siteName', 'Site name', '<text>', 'site name for reports', 'site'),
  spec(
    'latitudeDeg',
    'lat',
    'lat',
    'Latitude [° N]',
    '<°N>',
    'site latitude [° north]; overrides the file',
    'site',
  ),
  spec(
    'longitudeDeg',
    'lon',
    'lon',
    'Longitude [° E]',
    '<°E>',
    'site longitude [° east, west negative]; overrides the file',
    'site',
  ),
  spec('elevationM', 'elevation', 'elevation', 'Elevation [m]', '<m>', 'site elevation [m]', 'site'),
  spec(
    'utcOffsetHours',
    'utc-offset',
    'utcOffset',
    "UTC offset of the file's time stamps [h]",
    '<h>',
    "offset of the FILE's time stamps from UTC [h] (standard time, e.g. -5; 0 for UTC)",
    'site',
  ),
  spec(
    'timeZone',
    'tz',
    'tz',
    "Time zone of the file's time stamps",
    '<zone>',
    "IANA zone of the FILE's time stamps when they follow daylight saving (e.g. America/Chicago)",
    'site',
  ),
  spec(
    'siteTimeZone',
    'site-tz',
    'siteTz',
    "Site's time zone",
    '<zone>',
    "IANA zone of the SITE's clock (local hours, months, batch start times) when the file does not say it",
    'site',
  ),
  spec(
    'mapping',
    'map',
    'map',
    'Column mapping, one per line',
    '<variable>=<column>[:<unit>]',
    'take a variable (or time field) from a column: header name or #n, unit optional; column none ignores a detected one',
    'columns',
    true,
  ),
  spec(
    'labels',
    'labels',
    'labels',
    'Time stamp labels, one per line',
    'start|end|<variable>=start|end[:<minutes>]',
    'whether time stamps label the start or the end of the interval each row describes; per variable with its interval, e.g. ghi=end:60 for radiation over the preceding hour',
    'columns',
    true,
  ),
  spec(
    'dateOrder',
    'date-order',
    'dateOrder',
    'Date order',
    'mdy|dmy|ymd',
    'day/month order of dates like 03/04/2020',
    'columns',
  ),
  spec(
    'headerLine',
    'header-line',
    'headerLine',
    'Header line',
    '<n>',
    'line number (1-based) of the header row when it is not found',
    'columns',
  ),
  spec(
    'sampling',
    'sampling',
    'sampling',
    'Rows are',
    'readings|reports',
    'readings (averaged and summed into hours) or weather reports (one per hour, routine before special); detected when absent',
    'columns',
  ),
  spec(
    'windHeightM',
    'wind-height',
    'windHeight',
    'Wind measured at [m]',
    '<m>',
    'height of the wind measurement [m]; default 10',
    'columns',
  ),
]

/** The spec of a reader key, CLI flag or API parameter. */
export function optionSpec(name: string): WeatherOptionSpec | undefined {
  return WEATHER_OPTION_SPECS.find((s) => s.key === name || s.flag === name || s.param === name)
}

/** An option's name on a surface: `--utc-offset`, `utcOffset`, `utcOffsetHours`, or the form label in quotes. */
export function optionName(s: WeatherOptionSpec, surface: OptionSurface): string {
  if (surface === 'cli') return `--${s.flag}`
  if (surface === 'query') return s.param
  if (surface === 'json') return s.key
  return `“${s.label}”`
}

/** A bad option value: the message names the option as the surface calls it. */
export class WeatherOptionError extends RangeError {
  override name = 'WeatherOptionError'
  constructor(
    readonly spec: WeatherOptionSpec,
    readonly surface: OptionSurface,
    detail: string,
  ) {
    super(`${optionName(spec, surface)}: ${detail}`)
  }
}

/** The parts of a multi-valued text: one per line, or separated by ';' (API query, form textarea). */
export function splitMultiple(text: string): string[] {
  return text
    .split(/\r\n|\n|\r|;/)
    .map((t) => t.trim())
    .filter((t) => t !== '')
}

function number(text: string): number {
  const t = text.trim().replace(/^\+/, '')
  const n = Number(t.replace(',', '.'))
  if (t === '' || !Number.isFinite(n) || /^-?0[xbo]/i.test(t))
    throw new RangeError(`must be a number, got '${snippet(text)}'`)
  return n
}

/** `-5`, `+5:30`, `UTC-8`, `GMT+01:00` → hours. */
function offsetHours(text: string): number {
  let t = text.trim()
  const upper = t.toUpperCase()
  if (upper.startsWith('UTC') || upper.startsWith('GMT')) t = t.slice(3)
  const m = /^([+-]?)(\d{1,2}):(\d{2})$/.exec(t)
  if (m) return (m[1] === '-' ? -1 : 1) * (Number(m[2]) + Number(m[3]) / 60)
  if (t === '') return 0
  try {
    return number(t)
  } catch {
    throw new RangeError(`must be a number of hours such as -5 or +5:30, got '${snippet(text)}'`)
  }
}

function oneOf<T extends string>(text: string, values: readonly T[]): T {
  const t = text.trim() as T
  if (!values.includes(t)) throw new RangeError(`must be one of ${values.join(', ')}, got '${snippet(text)}'`)
  return t
}

/**
 * One `labels` item: `start` or `end` for the whole file, or `variable=start|end[:minutes]` for one
 * variable (its interval length in minutes, e.g. `ghi=end:60` for radiation over the preceding hour).
 */
export function parseLabelsItem(
  text: string,
): { file: IntervalLabel } | { variable: WeatherVariable; label: IntervalLabel; intervalMinutes?: number } {
  const t = text.trim()
  const eq = t.indexOf('=')
  if (eq < 0) return { file: oneOf(t, ['start', 'end'] as const) }
  const variable = t.slice(0, eq).trim() as WeatherVariable
  if (!WEATHER_VARIABLES.includes(variable)) {
    throw new RangeError(
      `unknown variable '${snippet(variable)}' in '${snippet(t)}'; accepted: ${WEATHER_VARIABLES.join(', ')}`,
    )
  }
  const [labelText, minutesText] = t.slice(eq + 1).split(':')
  const label = oneOf(labelText, ['start', 'end'] as const)
  if (minutesText === undefined) return { variable, label }
  const minutes = number(minutesText)
  if (!(Number.isInteger(minutes) && minutes >= 1 && minutes <= 1440)) {
    throw new RangeError(`interval in '${snippet(t)}' must be whole minutes from 1 to 1440`)
  }
  return { variable, label, intervalMinutes: minutes }
}

/**
 * Reader options (the object `weatherReadOptionsSchema` validates) from the option texts of an
 * interface: `texts(spec)` gives the texts given for that option (several for multi-valued ones), or
 * undefined. A value that cannot be read throws {@link WeatherOptionError} naming the option as
 * `surface` calls it; ranges are checked by the schema afterwards ({@link schemaIssueMessage}).
 */
export function weatherOptionsFromTexts(
  texts: (spec: WeatherOptionSpec) => string[] | undefined,
  surface: OptionSurface,
): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const s of WEATHER_OPTION_SPECS) {
    const given = texts(s)
    if (given === undefined || given.length === 0) continue
    // an empty value given on purpose (`--lat ''`, `lat=`) is an error, not an absent option
    const items = s.multiple ? given.flatMap(splitMultiple) : [given[given.length - 1]]
    if (items.length === 0) continue
    try {
      readInto(out, s, items)
    } catch (e) {
      if (e instanceof RangeError) throw new WeatherOptionError(s, surface, e.message)
      throw e
    }
  }
  return out
}

function readInto(out: Record<string, unknown>, s: WeatherOptionSpec, items: string[]): void {
  const text = items[0]
  switch (s.key) {
    case 'latitudeDeg':
    case 'longitudeDeg':
    case 'elevationM':
    case 'windHeightM':
      out[s.key] = number(text)
      return
    case 'headerLine':
      out[s.key] = number(text)
      return
    case 'utcOffsetHours':
      out[s.key] = offsetHours(text)
      return
    case 'dateOrder':
      out[s.key] = oneOf(text, ['ymd', 'mdy', 'dmy'] as const)
      return
    case 'sampling':
      out[s.key] = oneOf(text, ['readings', 'reports'] as const)
      return
    case 'mapping': {
      const mapping: Partial<Record<MappingKey, unknown>> = {}
      for (const item of items) {
        const [key, m] = parseMappingArgument(item)
        mapping[key] = m
      }
      out.mapping = mapping
      return
    }
    case 'labels': {
      const perVariable: Record<string, unknown> = {}
      for (const item of items) {
        const read = parseLabelsItem(item)
        if ('file' in read) out.labels = read.file
        else
          perVariable[read.variable] =
            read.intervalMinutes === undefined
              ? { label: read.label }
              : { label: read.label, intervalMinutes: read.intervalMinutes }
      }
      if (Object.keys(perVariable).length > 0) out.variableLabels = perVariable
      return
    }
    default:
      if (text.trim() === '') throw new RangeError('must not be empty')
      out[s.key] = text.trim()
  }
}

/** The spec a schema path (`latitudeDeg`, `variableLabels.ghi`, `mapping.dryBulb.column`) belongs to. */
export function specOfPath(path: readonly PropertyKey[]): WeatherOptionSpec | undefined {
  const head = String(path[0] ?? '')
  if (head === 'variableLabels') return optionSpec('labels')
  return optionSpec(head)
}

/** A schema issue as a message naming the option on `surface`. */
export function schemaIssueMessage(
  path: readonly PropertyKey[],
  message: string,
  surface: OptionSurface,
): string {
  const s = specOfPath(path)
  if (s === undefined) return `${path.join('.') || '(options)'}: ${message}`
  const rest = path.slice(1).join('.')
  return `${optionName(s, surface)}${rest ? ` (${rest})` : ''}: ${message}`
}

/** Options that failed the schema: every issue, each naming its option on the surface. */
export class WeatherOptionsInvalid extends RangeError {
  override name = 'WeatherOptionsInvalid'
  constructor(readonly issues: { option: string; message: string }[]) {
    super(issues.map((i) => i.message).join('; '))
  }
}

/**
 * Validate reader options with the shared schema; every issue at once, each message naming its
 * option as `surface` calls it (e.g. `--lat: Too big: expected number to be <=90`).
 */
export function checkWeatherOptions(raw: unknown, surface: OptionSurface): WeatherReadOptions {
  const r = weatherReadOptionsSchema.safeParse(raw ?? {})
  if (r.success) return r.data
  throw new WeatherOptionsInvalid(
    r.error.issues.map((issue) => {
      const s = specOfPath(issue.path)
      return {
        option: s === undefined ? issue.path.join('.') : optionName(s, surface),
        message: schemaIssueMessage(issue.path, issue.message, surface),
      }
    }),
  )
}

/** Help lines for the CLI: `--flag <value>` then the description, wrapped to about 100 columns. */
export function cliWeatherHelp(indent = '  '): string {
  const column = 24
  const width = 100
  const lines: string[] = []
  for (const s of WEATHER_OPTION_SPECS) {
    const head = `${indent}--${s.flag} ${s.value}`
    const words = `${s.description}${s.multiple ? ' (repeatable)' : ''}`.split(' ')
    let line = head.length < column ? head.padEnd(column) : ''
    if (line === '') lines.push(head)
    let started = false
    for (const w of words) {
      if (line === '') line = ' '.repeat(column)
      if (started && line.length + 1 + w.length > width) {
        lines.push(line)
        line = ' '.repeat(column)
        started = false
      }
      line += started ? ` ${w}` : w
      started = true
    }
    lines.push(line)
  }
  return lines.join('\n')
}

/** node:util parseArgs option definitions for every weather flag. */
export function cliWeatherParseOptions(): Record<string, { type: 'string'; multiple?: boolean }> {
  const out: Record<string, { type: 'string'; multiple?: boolean }> = {}
  for (const s of WEATHER_OPTION_SPECS)
    out[s.flag] = s.multiple ? { type: 'string', multiple: true } : { type: 'string' }
  return out
}

/** Whether `text` could be the value written after a flag in a message (not a plain word). */
function looksLikeValue(text: string): boolean {
  if (text === '') return false
  const c = text.charCodeAt(0)
  if (text[0] === '<' || text[0] === '#' || (c >= 48 && c <= 57)) return true
  if (
    (text[0] === '-' || text[0] === '+') &&
    text.length > 1 &&
    text.charCodeAt(1) >= 48 &&
    text.charCodeAt(1) <= 57
  )
    return true
  if (text.includes('=') || text.includes('/')) return true
  return ['mdy', 'dmy', 'ymd', 'start', 'end', 'readings', 'reports'].includes(text)
}

/**
 * A message written with CLI option names (`--map dryBulb=<column>`, `--lat`, `--utc-offset 0`)
 * rewritten for another surface: API query parameters (`map=dryBulb=<column>`, `lat`, `utcOffset=0`),
 * JSON option keys (`mapping: dryBulb=<column>`, `latitudeDeg`) or the page's field labels
 * (“Column mapping, one per line”: dryBulb=<column>). Only known flags are rewritten. One pass over
 * the text, no pattern matching (linear in its length).
 */
export function renderOptionNames(
  message: string,
  surface: OptionSurface,
  more: readonly Pick<WeatherOptionSpec, 'flag' | 'param' | 'key' | 'label'>[] = [],
): string {
  if (surface === 'cli' || !message.includes('--')) return message
  let out = ''
  let k = 0
  const n = message.length
  while (k < n) {
    const at = message.indexOf('--', k)
    if (at < 0) {
      out += message.slice(k)
      break
    }
    out += message.slice(k, at)
    let end = at + 2
    while (end < n && isFlagChar(message.charCodeAt(end))) end++
    const flag = message.slice(at + 2, end)
    const s = WEATHER_OPTION_SPECS.find((x) => x.flag === flag) ?? more.find((x) => x.flag === flag)
    const before = at === 0 ? 32 : message.charCodeAt(at - 1)
    if (
      s === undefined ||
      end === at + 2 ||
      !(before === 32 || before === 40 || before === 39 || before === 10)
    ) {
      out += message.slice(at, end)
      k = end
      continue
    }
    // the value, when the next word looks like one
    let value = ''
    let next = end
    if (message.charCodeAt(end) === 32) {
      let stop = end + 1
      if (message[stop] === '<') {
        const close = message.indexOf('>', stop)
        stop = close < 0 ? n : close + 1
        while (stop < n && !isWordEnd(message.charCodeAt(stop))) stop++
      } else while (stop < n && !isWordEnd(message.charCodeAt(stop))) stop++
      const word = message.slice(end + 1, stop)
      if (looksLikeValue(word)) {
        value = word
        next = stop
      }
    }
    out += renderOne(s, surface, value)
    k = next
  }
  return out
}

function isFlagChar(c: number): boolean {
  return (c >= 97 && c <= 122) || c === 45
}

/** A word ends at a space, a comma, a semicolon or a closing bracket. */
function isWordEnd(c: number): boolean {
  return c === 32 || c === 44 || c === 59 || c === 41 || c === 10
}

function renderOne(
  s: Pick<WeatherOptionSpec, 'param' | 'key' | 'label'>,
  surface: OptionSurface,
  value: string,
): string {
  if (surface === 'query') return value === '' ? s.param : `${s.param}=${value}`
  if (surface === 'json') return value === '' ? s.key : `${s.key}: ${value}`
  return value === '' ? `“${s.label}”` : `“${s.label}”: ${value}`
}

/** The mapping keys accepted, for help texts. */
export const MAPPING_KEY_LIST = MAPPING_KEYS.join(', ')
