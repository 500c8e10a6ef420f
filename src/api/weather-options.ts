/**
 * @module api/weather-options
 * Weather-reader options from a request: the query string (short names, like the CLI flags) or an
 * `options` JSON object (the reader's own option names, `weatherReadOptionsSchema`). Both end in the
 * same validated `WeatherReadOptions`.
 */
import { z } from 'zod'
import {
  type MappingKey,
  parseMappingArgument,
  type WeatherReadOptions,
  weatherReadOptionsSchema,
} from '../weather/options.ts'
import { ApiProblem, zodIssuesToFields } from './problem.ts'
import { numberParam } from './schemas/params.ts'

/** Query-string form of the weather options (documented in OpenAPI with units). */
export const weatherQueryFields = {
  lat: numberParam('site latitude [° north]; overrides the file header').optional(),
  lon: numberParam('site longitude [° east]; overrides the file header').optional(),
  elevation: numberParam('site elevation [m]').optional(),
  utcOffset: numberParam('offset of local timestamps from UTC [h], e.g. -5').optional(),
  tz: z.string().min(1).optional().describe('IANA time zone of local timestamps, e.g. America/Chicago'),
  map: z
    .string()
    .optional()
    .describe(
      'column mapping variable=column[:unit]; several separated by ";" (e.g. dryBulbC=Temp:F;relativeHumidityPct=RH)',
    ),
  dateOrder: z.enum(['ymd', 'mdy', 'dmy']).optional().describe('day/month order of slash dates'),
  labels: z
    .enum(['hour-start', 'hour-end'])
    .optional()
    .describe('whether CSV timestamps label the start or the end of each hour'),
  windHeight: numberParam('height of the wind measurement [m]; default 10').optional(),
  siteName: z.string().max(200).optional().describe('site name for reports'),
}

export const weatherQuerySchema = z.strictObject(weatherQueryFields)

/** Weather options from query fields already validated by {@link weatherQuerySchema} (or a superset). */
export function weatherOptionsFromQuery(q: z.output<typeof weatherQuerySchema>): WeatherReadOptions {
  const mapping: Partial<Record<MappingKey, { column: string; unit?: string }>> = {}
  if (q.map) {
    for (const part of q.map.split(';').filter((p) => p.trim() !== '')) {
      try {
        const [key, m] = parseMappingArgument(part)
        mapping[key] = m
      } catch (e) {
        throw new ApiProblem(400, (e as Error).message, [{ path: 'map', message: (e as Error).message }])
      }
    }
  }
  const raw: Record<string, unknown> = {
    latitudeDeg: q.lat,
    longitudeDeg: q.lon,
    elevationM: q.elevation,
    utcOffsetHours: q.utcOffset,
    timeZone: q.tz,
    mapping: Object.keys(mapping).length > 0 ? mapping : undefined,
    dateOrder: q.dateOrder,
    timestampLabels: q.labels,
    windHeightM: q.windHeight,
    siteName: q.siteName,
  }
  for (const k of Object.keys(raw)) if (raw[k] === undefined) delete raw[k]
  return validWeatherOptions(raw, '')
}

/** Validate a weather-options object (JSON form); a 400 problem naming each bad field otherwise. */
export function validWeatherOptions(value: unknown, prefix: string): WeatherReadOptions {
  const r = weatherReadOptionsSchema.safeParse(value ?? {})
  if (!r.success) {
    const errors = zodIssuesToFields(r.error.issues, prefix)
    throw new ApiProblem(400, errors.map((e) => `${e.path}: ${e.message}`).join('; '), errors)
  }
  return r.data
}
