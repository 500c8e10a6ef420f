/**
 * @module weather/option-spec
 * One definition of the weather-reading options for every interface: each option's reader key, CLI
 * flag, API query parameter (also the page's form field), form label and description (how its text is
 * read: option-texts.ts). The CLI flags, the API's zod query fields and the page's form fields are
 * derived from this table, and messages name an option in the words of the interface that received it:
 * the core writes CLI words (`--map dryBulb=…`, `--lat`) and {@link renderOptionNames} turns them into
 * API parameters (`map=dryBulb=…`) or form labels.
 */
import { MAPPING_KEYS } from './options.ts'

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
 * (“Column mapping, one per line”: dryBulb=<column>). Only known flags are rewritten; `more` (the other
 * options, analysis/option-names.ts) is asked first, so a route's own meaning of a flag wins. One pass over
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
    const s = more.find((x) => x.flag === flag) ?? WEATHER_OPTION_SPECS.find((x) => x.flag === flag)
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
