/**
 * @module api/routes/inspect
 * POST /v1/inspect: what dryhours understood of a weather file (same object as `dryhours inspect --json`).
 */
import { Hono } from 'hono'
import { z } from 'zod'
import { inspectJson, rejectedRowsCsv } from '../../report/inspect-json.ts'
import type { WeatherReadOptions } from '../../weather/options.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import type { ApiConfig } from '../config.ts'
import { rethrowAsProblem } from '../errors.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import { checkedUploadText, readUpload } from '../upload.ts'
import { parseOrProblem } from '../validate.ts'
import { validWeatherOptions, weatherOptionsFromQuery, weatherQuerySchema } from '../weather-options.ts'
import { workControl } from '../work.ts'

/** The inspect query: the weather options, and `format=csv` for every rejected row as a download. */
export const inspectQuerySchema = weatherQuerySchema.extend({
  format: z
    .enum(['json', 'csv'])
    .optional()
    .describe('json (default), or csv: every rejected row (line, kind, message) as a download'),
})

export const inspectRouter = (config: ApiConfig) =>
  new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const upload = await readUpload(c, { defaultName: 'weather file' })
    let format: 'json' | 'csv' | undefined
    let options: WeatherReadOptions
    if (upload.options !== undefined) {
      format = parseOrProblem(inspectQuerySchema.pick({ format: true }).strict(), upload.query).format
      options = validWeatherOptions(upload.options, 'options')
    } else {
      const q = parseOrProblem(inspectQuerySchema, upload.query)
      format = q.format
      const { format: _f, ...weatherQuery } = q
      options = weatherOptionsFromQuery(weatherQuery)
    }
    if (upload.files.length !== 1) {
      throw new ApiProblem(400, `send exactly one weather file, got ${upload.files.length}`, [
        { path: 'file', message: 'one file part expected' },
      ])
    }
    const text = checkedUploadText(upload.files[0], config)
    work.checkpoint()
    let read: WeatherReadResult
    try {
      read = readWeather(text, options)
    } catch (e) {
      rethrowAsProblem(e)
    }
    work.checkpoint()
    if (format === 'csv') {
      return c.body(rejectedRowsCsv(read), 200, {
        'content-type': 'text/csv; charset=utf-8',
        'content-disposition': 'attachment; filename="dryhours-rejected-rows.csv"',
      })
    }
    return c.json(inspectJson(read))
  })

registerOperation({
  method: 'post',
  path: '/v1/inspect',
  summary: 'Inspect a weather file',
  description:
    'What dryhours understood of a weather file (delimited text or EPW): format, site, period, time basis, columns with units, coverage per month, row counts (read = used + repaired + rejected), every rejected row with its line (`rejectedRows`; `format=csv` downloads them) and the first 100 problems with line numbers and the count of each kind. ' +
    'Send the file as the body (text/csv, text/plain) with options in the query, or as multipart/form-data with a `file` part and an optional `options` JSON part (latitudeDeg, longitudeDeg, elevationM, utcOffsetHours | timeZone, mapping, dateOrder, timestampLabels, windHeightM, siteName). Same object as `dryhours inspect --json`.',
  query: inspectQuerySchema,
  requestBody: [
    { contentType: 'text/csv', description: 'the weather file' },
    { contentType: 'multipart/form-data', description: 'file part + optional options JSON part' },
  ],
  response: { contentType: 'application/json', description: 'what was understood of the file' },
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
