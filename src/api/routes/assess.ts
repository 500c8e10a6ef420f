/**
 * @module api/routes/assess
 * POST /v1/assess (one weather file) and POST /v1/compare (several): the seasonal assessment, as JSON
 * (same object as `dryhours assess --json`), CSV tables or the HTML summary.
 */
import { type Context, Hono } from 'hono'
import { z } from 'zod'
import { assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import { compare } from '../../analysis/compare.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import { type OptionSurface, renderOptionNames } from '../../weather/option-spec.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, rethrowAsProblem } from '../errors.ts'
import { exampleWeatherCsv } from '../example-weather.ts'
import { checkBatchHours } from '../limits.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import {
  type AssessRequest,
  assessOptionsJsonSchema,
  assessQuerySchema,
  assessRequestFromJson,
  assessRequestFromQuery,
} from '../schemas/assess.ts'
import { checkedUploadText, readUpload, type UploadedFile } from '../upload.ts'
import { parseOrProblem } from '../validate.ts'
import { renderReadingMessages, weatherInputProblem } from '../weather-options.ts'
import { workControl } from '../work.ts'

const outputQuerySchema = z.strictObject({
  format: z.enum(['json', 'csv', 'html']).optional(),
  units: z.enum(['si', 'us']).optional(),
  table: z.string().optional(),
})

interface Parsed {
  request: AssessRequest
  output: z.output<typeof outputQuerySchema>
  files: UploadedFile[]
}

async function parseRequest(c: Context): Promise<Parsed> {
  const upload = await readUpload(c, { defaultName: 'weather file' })
  if (upload.options !== undefined) {
    const output = parseOrProblem(outputQuerySchema, upload.query)
    return { request: assessRequestFromJson(upload.options), output, files: upload.files }
  }
  const fromQuery = assessRequestFromQuery(upload.query)
  return { request: fromQuery, output: fromQuery.query, files: upload.files }
}

/** Decode one weather file within the row and column limits and read it; problems name the file. */
export function readSite(file: UploadedFile, request: AssessRequest, config: ApiConfig): WeatherReadResult {
  const text = checkedUploadText(file, config)
  try {
    const result = renderReadingMessages(readWeather(text, request.weather), request.surface)
    if (result.series.site.name.trim() === '') result.series.site.name = file.name
    return result
  } catch (e) {
    if (e instanceof WeatherInputError) throw weatherInputProblem(e, request.surface, file.name)
    rethrowAsProblem(e, { filePrefix: file.name })
  }
}

/**
 * Run the engine; its errors become problems: options named by their field path in this request, the
 * engine's option names in messages renamed for the request's surface, engine faults never quoted.
 */
function runEngine<T>(fn: () => T, request: AssessRequest): T {
  try {
    return fn()
  } catch (e) {
    if (e instanceof RangeError && !isRuntimeFault(e)) {
      e.message = renderOptionNames(e.message, request.surface)
    }
    rethrowAsProblem(e, { optionPath: request.optionPath })
  }
}

function csvResponse(c: Context, text: string): Response {
  return c.body(text, 200, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': 'attachment; filename="dryhours-assessment.csv"',
  })
}

function csvTables(render: () => string): string {
  try {
    return render()
  } catch (e) {
    if (e instanceof RangeError && !isRuntimeFault(e))
      throw new ApiProblem(400, e.message, [{ path: 'table', message: e.message }])
    rethrowAsProblem(e)
  }
}

export function assessRouter(config: ApiConfig): Hono {
  return new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const { request, output, files } = await parseRequest(c)
    if (files.length !== 1) {
      throw new ApiProblem(
        400,
        `send exactly one weather file, got ${files.length} (use /v1/compare for several)`,
        [{ path: 'file', message: 'one file part expected' }],
      )
    }
    work.checkpoint()
    const read = readSite(files[0], request, config)
    work.checkpoint()
    checkBatchHours(request.options, [read.series.hours], config, request.optionPath)
    // the engine's messages name options as CLI flags: renamed for this request's surface
    const assessment: Assessment = renderAssessmentWarnings(
      runEngine(() => assess(read.series, { ...request.options, onProgress: work.checkpoint }), request),
      request.surface,
    )
    work.checkpoint()
    const info = { fileName: files[0].name, readerWarnings: read.warnings }
    if (output.format === 'html') {
      return c.html(renderReportHtml(assessment, { units: output.units, info }))
    }
    if (output.format === 'csv') {
      return csvResponse(
        c,
        csvTables(() =>
          renderReportCsv(assessment, {
            units: output.units,
            info,
            table: output.table,
          }),
        ),
      )
    }
    return c.json(assessment)
  })
}

/** The assessment's warnings with option names as the request gave them. */
function renderAssessmentWarnings(a: Assessment, surface: OptionSurface): Assessment {
  return { ...a, warnings: a.warnings.map((w) => renderOptionNames(w, surface)) }
}

export function compareRouter(config: ApiConfig): Hono {
  return new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const { request, output, files } = await parseRequest(c)
    if (files.length < 2) {
      throw new ApiProblem(
        400,
        `send at least two weather files (one multipart part per site), got ${files.length}`,
        [{ path: 'file', message: 'two or more file parts expected' }],
      )
    }
    if (files.length > config.maxSites) {
      throw new ApiProblem(
        413,
        `at most ${config.maxSites} sites per comparison, got ${files.length}; compare them in groups`,
        [{ path: 'site', message: `more than ${config.maxSites} files` }],
      )
    }
    if (output.format === 'csv') {
      throw new ApiProblem(400, 'format=csv is offered per site: call /v1/assess for each file', [
        { path: 'format', message: 'csv not offered for comparisons' },
      ])
    }
    const reads = files.map((f) => {
      work.checkpoint()
      return readSite(f, request, config)
    })
    checkBatchHours(
      request.options,
      reads.map((r) => r.series.hours),
      config,
      request.optionPath,
    )
    const comparison = runEngine(
      () =>
        compare(
          reads.map((r) => r.series),
          {
            ...request.options,
            onProgress: work.checkpoint,
            criterion: request.criterion,
            labels: files.map((f) => f.name),
          },
        ),
      request,
    )
    work.checkpoint()
    if (output.format === 'html') {
      return c.html(
        renderComparisonHtml(
          comparison.assessments.map((a, i) => ({
            assessment: a,
            options: { info: { fileName: files[i].name } },
          })),
          { units: output.units, ranking: comparison },
        ),
      )
    }
    return c.json({
      ...comparison,
      assessments: comparison.assessments.map((a) => renderAssessmentWarnings(a, request.surface)),
    })
  })
}

const optionsDescription =
  'Send the weather file as the body (text/csv, text/plain; EPW too) with the common options in the query, or as multipart/form-data with file part(s) and an `options` JSON part (full control: ' +
  Object.keys(assessOptionsJsonSchema.shape).join(', ') +
  '). `format` and `units` are always query parameters.'

registerOperation({
  method: 'post',
  path: '/v1/assess',
  summary: 'Seasonal drying assessment of one site',
  description: `Usable drying hours per month (median, P10, P90 across years), hour-of-day × month usable fraction, start-date table (days to target, probability within the deadline, rewetting), supplemental heat and fuel, assumptions and warnings. Same object as \`dryhours assess --json\`. ${optionsDescription}`,
  query: assessQuerySchema,
  requestBody: [
    { contentType: 'text/csv', description: 'the weather file (delimited text or EPW)' },
    { contentType: 'multipart/form-data', description: 'file part + options JSON part' },
  ],
  response: {
    contentType: 'application/json',
    description: 'the assessment (format=csv: tables; format=html: the summary)',
  },
  errors: [400, 404, 413, 415, 422],
  examples: [
    {
      name: 'raisins in the open air, four days of hourly weather (invented)',
      url: '/v1/assess?product=grapes-to-raisins&method=open-air&lat=38.3&lon=-2.6&elevation=1050&deadlineDays=3&maxDays=3',
      contentType: 'text/csv',
      body: exampleWeatherCsv(4),
    },
  ],
})
registerOperation({
  method: 'post',
  path: '/v1/compare',
  summary: 'Compare candidate sites',
  description: `Several weather files (multipart, one part per site), one product and method: each site's assessment and a ranking by a stated criterion (probability of finishing within the deadline, usable hours at P10, or heat per tonne). ${optionsDescription}`,
  query: outputQuerySchema,
  requestBody: [
    { contentType: 'multipart/form-data', description: 'one file part per site + options JSON part' },
  ],
  response: {
    contentType: 'application/json',
    description: 'the comparison (format=html: the side-by-side summary)',
  },
  errors: [400, 413, 415, 422],
  examples: [],
})
