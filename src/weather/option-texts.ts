/**
 * @module weather/option-texts
 * Weather options as the interfaces receive them, as text (CLI flags, API query parameters, the page's
 * form fields), read into the reader's options: numbers, offsets such as `+5:30`, one-of words, column
 * mappings and labels; then checked with the shared schema, every problem naming the option as the
 * interface that received it calls it.
 */
import {
  type OptionSurface,
  optionName,
  optionSpec,
  WEATHER_OPTION_SPECS,
  type WeatherOptionSpec,
} from './option-spec.ts'
import {
  type MappingKey,
  parseMappingArgument,
  type WeatherReadOptions,
  weatherReadOptionsSchema,
} from './options.ts'
import type { IntervalLabel } from './raw-table.ts'
import { snippet } from './snippet.ts'
import { WEATHER_VARIABLES, type WeatherVariable } from './units.ts'

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
