/**
 * @module weather/options
 * The options of every weather reader, as one zod schema shared by the CLI and the HTTP API: the
 * site, the time basis of local timestamps, an explicit column mapping and the date order.
 */

import { z } from 'zod'
import { snippet } from './snippet.ts'
import { WEATHER_VARIABLES, type WeatherVariable } from './units.ts'

/** Columns that carry time rather than a weather variable; mapping keys like the variables. */
export const TIME_FIELDS = [
  'timestamp',
  'date',
  'time',
  'year',
  'month',
  'day',
  'hour',
  'minute',
  'dayOfYear',
] as const
export type TimeField = (typeof TIME_FIELDS)[number]
export type MappingKey = WeatherVariable | TimeField

export const MAPPING_KEYS: readonly MappingKey[] = [...WEATHER_VARIABLES, ...TIME_FIELDS]

/** One mapping entry: the column (header name, or `#n` for the n-th column, 1-based) and its unit. */
export const columnMappingSchema = z.object({
  /** Header name as written in the file, or `#3` for the third column. `none` ignores a detected column. */
  column: z.string().min(1),
  /** Unit token (°C, F, hPa, mph, Wh/m2, in, fraction …); omitted = detected or the series unit. */
  unit: z.string().min(1).optional(),
})
export type ColumnMapping = z.infer<typeof columnMappingSchema>

function isIanaZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name })
    return true
  } catch {
    return false
  }
}

export const weatherReadOptionsSchema = z
  .object({
    /** Site latitude [° north], −90…90. Overrides the file header. */
    latitudeDeg: z.number().min(-90).max(90).optional(),
    /** Site longitude [° east], −180…180. Overrides the file header. */
    longitudeDeg: z.number().min(-180).max(180).optional(),
    /** Site elevation [m], −500…9000 (range of the standard-atmosphere formula used). */
    elevationM: z.number().min(-500).max(9000).optional(),
    /** Fixed offset of the file's timestamps from UTC [h], −12…14 (e.g. −5 for US Eastern standard time; 0 for UTC). Describes the file, not the site. */
    utcOffsetHours: z.number().min(-12).max(14).optional(),
    /** IANA zone of the file's timestamps (daylight saving applied), e.g. `America/Chicago`. Describes the file, not the site. */
    timeZone: z
      .string()
      .refine(isIanaZone, { message: 'not an IANA time-zone name known to Intl' })
      .optional(),
    /** Variable or time field → column (and unit); overrides detection. */
    mapping: z
      .partialRecord(z.enum(MAPPING_KEYS as [MappingKey, ...MappingKey[]]), columnMappingSchema)
      .optional(),
    /** Order of day and month in slash or dot dates like 03/04/2020; detected when unambiguous. */
    dateOrder: z.enum(['ymd', 'mdy', 'dmy']).optional(),
    /**
     * Where a delimited file's timestamps sit in the interval each row describes: `start` (10:00 =
     * 10:00–11:00) or `end` (10:00 = 09:00–10:00); detected when absent (hours 01–24 → end). EPW is
     * always `end` (EPW data dictionary).
     */
    labels: z.enum(['start', 'end']).optional(),
    /**
     * Per variable: its own label and interval, e.g. irradiance and rain over the preceding hour
     * (`{ ghi: { label: 'end', intervalMinutes: 60 } }`) in a file whose other values are instants.
     */
    variableLabels: z
      .partialRecord(
        z.enum(WEATHER_VARIABLES as [WeatherVariable, ...WeatherVariable[]]),
        z.strictObject({
          label: z.enum(['start', 'end']),
          /** Interval length [min], 1…1440; omitted = the spacing of the rows. */
          intervalMinutes: z.number().int().min(1).max(1440).optional(),
        }),
      )
      .optional(),
    /** How rows become hours: `readings` (averaged/summed) or `reports` (one per hour, routine first); detected when absent. */
    sampling: z.enum(['readings', 'reports']).optional(),
    /** 1-based line of the header row of a delimited file, when the search would not find it. */
    headerLine: z.number().int().min(1).max(100_000).optional(),
    /**
     * IANA zone of the SITE's clock (for local hours, months and start times), when the file does not
     * say it: independent of the timestamps' basis (`utcOffsetHours`/`timeZone` describe the file).
     */
    siteTimeZone: z
      .string()
      .refine(isIanaZone, { message: 'not an IANA time-zone name known to Intl' })
      .optional(),
    /** Height of the wind measurement above ground [m], 0.5…200; default 10 m (WMO standard) or the header. */
    windHeightM: z.number().min(0.5).max(200).optional(),
    /** Site name for reports (else from the header or empty). */
    siteName: z.string().max(200).optional(),
    /** Force a format instead of detecting it. */
    format: z.enum(['auto', 'csv', 'epw']).optional(),
  })
  .strict()
  .refine((o) => o.utcOffsetHours === undefined || o.timeZone === undefined, {
    message: 'give either utcOffsetHours or timeZone, not both',
    path: ['timeZone'],
  })

export type WeatherReadOptions = z.infer<typeof weatherReadOptionsSchema>

/**
 * Parse one `variable=column[:unit]` mapping argument (CLI `--map`, query strings). The unit is the
 * text after the last ':' (time fields take no unit, so `time=Time (HH:MM)` works; column names may contain ':' when a unit is given). Throws RangeError
 * naming the argument and the accepted keys.
 */
export function parseMappingArgument(arg: string): [MappingKey, ColumnMapping] {
  const eq = arg.indexOf('=')
  if (eq <= 0 || eq === arg.length - 1) {
    throw new RangeError(`mapping '${snippet(arg)}' must look like variable=column or variable=column:unit`)
  }
  const key = arg.slice(0, eq).trim() as MappingKey
  if (!MAPPING_KEYS.includes(key)) {
    throw new RangeError(
      `mapping '${snippet(arg)}': unknown variable '${snippet(key)}'; accepted: ${MAPPING_KEYS.join(', ')}`,
    )
  }
  const rest = arg.slice(eq + 1)
  const colon = rest.lastIndexOf(':')
  const isTimeField = (TIME_FIELDS as readonly string[]).includes(key)
  if (!isTimeField && colon > 0 && colon < rest.length - 1) {
    return [key, { column: rest.slice(0, colon).trim(), unit: rest.slice(colon + 1).trim() }]
  }
  return [key, { column: rest.trim() }]
}
