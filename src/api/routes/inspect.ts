/**
 * @module api/routes/inspect
 * POST /v1/inspect: what dryhours understood of a weather file (same object as `dryhours inspect --json`).
 */
import { Hono } from 'hono'
import { z } from 'zod'
import { inspectJson, rejectedRowsCsv } from '../../report/inspect-json.ts'
import { hourlyExportCsv } from '../../weather/export.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import type { ApiConfig } from '../config.ts'
import { rethrowAsProblem } from '../errors.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import { inspectResponseSchema } from '../schemas/responses/inspect.ts'
import { checkedUploadText, readUpload } from '../upload.ts'
import { parseOrProblem } from '../validate.ts'
import {
  renderReadingMessages,
  surfaceOf,
  validWeatherOptions,
  weatherInputProblem,
  weatherOptionsFromQuery,
  weatherQuerySchema,
} from '../weather-options.ts'
import { workControl } from '../work.ts'

/** The query of POST /v1/inspect: the weather options and the answer's format. */
export const inspectQuerySchema = weatherQuerySchema.extend({
  format: z
    .enum(['json', 'csv', 'rejected'])
    .optional()
    .describe(
      'json (default): what was understood of the file; csv: the hourly series the engine uses (UTC hour starts, SI, flags), as `dryhours inspect --export`; rejected: every rejected row (line, kind, message) as a CSV download',
    ),
})

export const inspectRouter = (config: ApiConfig) =>
  new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const upload = await readUpload(c, { defaultName: 'weather file' })
    const surface = surfaceOf(upload.options !== undefined)
    const query = parseOrProblem(inspectQuerySchema, upload.query)
    const { format, ...weatherQuery } = query
    const options =
      upload.options !== undefined
        ? validWeatherOptions(upload.options, 'options')
        : weatherOptionsFromQuery(weatherQuery)
    if (upload.files.length !== 1) {
      throw new ApiProblem(400, `send exactly one weather file, got ${upload.files.length}`, [
        { path: 'file', message: 'one file part expected' },
      ])
    }
    const text = checkedUploadText(upload.files[0], config)
    work.checkpoint()
    let result: WeatherReadResult
    try {
      result = readWeather(text, options)
    } catch (e) {
      if (e instanceof WeatherInputError) throw weatherInputProblem(e, surface)
      rethrowAsProblem(e)
    }
    work.checkpoint()
    if (format === 'rejected') {
      return c.body(rejectedRowsCsv(renderReadingMessages(result, surface)), 200, {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': 'attachment; filename="dryhours-rejected-rows.csv"',
      })
    }
    if (format === 'csv')
      return c.body(hourlyExportCsv(result.series), 200, { 'content-type': 'text/csv; charset=utf-8' })
    return c.json(inspectJson(renderReadingMessages(result, surface)))
  })

registerOperation({
  method: 'post',
  path: '/v1/inspect',
  summary: 'Inspect a weather file',
  description:
    'What dryhours understood of a weather file (delimited text or EPW): format, site, period, time basis, columns with units, coverage per month, row counts (read = used + repaired + rejected + superseded), every rejected row with its line (`rejectedRows`; `format=rejected` downloads them as CSV), how rows became hours and the first problems with line numbers. ' +
    'Send the file as the body (text/csv, text/plain) with options in the query (the same options as the CLI flags: lat, lon, elevation, utcOffset | tz for the file, siteTz for the site, map, labels, dateOrder, headerLine, sampling, windHeight, siteName), or as multipart/form-data with a `file` part and an optional `options` JSON part (the reader keys: latitudeDeg, longitudeDeg, elevationM, utcOffsetHours | timeZone, siteTimeZone, mapping, labels, variableLabels, dateOrder, headerLine, sampling, windHeightM, siteName). Same object as `dryhours inspect --json`, with per variable the hours, mean, min and max in SI; `format=csv` answers with the hourly series the engine uses (as `dryhours inspect --export`).',
  query: inspectQuerySchema,
  requestBody: [
    { contentType: 'text/csv', description: 'the weather file' },
    { contentType: 'multipart/form-data', description: 'file part + optional options JSON part' },
  ],
  response: {
    contentType: 'application/json',
    description: 'what was understood of the file (format=csv: the hourly series as text/csv)',
    schema: inspectResponseSchema,
  },
  errors: [400, 413, 415, 422],
  examples: [
    {
      name: 'a three-hour UTC file',
      url: '/v1/inspect?lat=38.3&lon=-2.6&elevation=1050',
      contentType: 'text/csv',
      body: 'time,temp_c,rh_pct\n2024-07-01T10:00Z,30.1,25\n2024-07-01T11:00Z,31.5,22\n2024-07-01T12:00Z,32.8,20\n',
    },
  ],
})
