/**
 * @module api/routes/assess
 * POST /v1/assess (one weather file) and POST /v1/compare (several): the seasonal assessment, as JSON
 * (same object as `dryhours assess --json`), CSV tables or the HTML summary.
 */
import { type Context, Hono } from 'hono'
import { z } from 'zod'
import { type AssessOptions, assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import { compare } from '../../analysis/compare.ts'
import { estimateBatchHours } from '../../analysis/plan.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import { type OptionSurface, renderOptionNames } from '../../weather/option-spec.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import type { HourlySeries } from '../../weather/series.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import type { ApiConfig } from '../config.ts'
import { exampleWeatherCsv } from '../example-weather.ts'
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

const outputQuerySchema = z.object({
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

export function readSite(file: UploadedFile, request: AssessRequest, config: ApiConfig): WeatherReadResult {
  const text = checkedUploadText(file, config)
  try {
    const result = renderReadingMessages(readWeather(text, request.weather), request.surface)
    if (result.series.site.name.trim() === '') result.series.site.name = file.name
    return result
  } catch (e) {
    if (e instanceof WeatherInputError) throw weatherInputProblem(e, request.surface, file.name)
    throw e
  }
}

class TimeBudgetExceeded extends Error {}

function checkWork(options: AssessOptions, seriesList: HourlySeries[], config: ApiConfig): void {
  // the engine's own planner (analysis/plan.ts): the same defaults the assessment will use
  const work = runEngine(
    () =>
      estimateBatchHours(
        options,
        seriesList.map((s) => s.hours),
      ),
    config,
  )
  if (work > config.maxBatchHours) {
    throw new ApiProblem(
      422,
      `this request would simulate about ${(work / 1e6).toFixed(1)} million batch-hours (start dates × years × maximum batch length), more than the limit of ${(config.maxBatchHours / 1e6).toFixed(1)} million: use a larger start-date step (startStepDays), a shorter season or maxDays, fewer years per file, or fewer sites per request`,
      [{ path: 'options', message: 'too much work for one request' }],
    )
  }
}

/** Run the engine; RangeError → 422; the wall-clock budget (when the entry point gives a clock) → 422. */
function runEngine<T>(fn: (onProgress?: () => void) => T, config?: ApiConfig, surface?: OptionSurface): T {
  const now = config?.now
  const budget = config?.timeBudgetMs ?? 0
  const started = now ? now() : 0
  const onProgress =
    now && budget > 0
      ? () => {
          if (now() - started > budget) throw new TimeBudgetExceeded()
        }
      : undefined
  try {
    return fn(onProgress)
  } catch (e) {
    if (e instanceof RangeError)
      throw new ApiProblem(422, surface ? renderOptionNames(e.message, surface) : e.message)
    if (e instanceof TimeBudgetExceeded) {
      throw new ApiProblem(
        422,
        `the assessment took longer than this server's budget of ${budget / 1000} s; use a larger start-date step, a shorter season or fewer years per file`,
      )
    }
    throw e
  }
}

function csvResponse(c: Context, text: string): Response {
  return c.body(text, 200, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': 'attachment; filename="dryhours-assessment.csv"',
  })
}

export function assessRouter(config: ApiConfig): Hono {
  return new Hono().post('/', async (c) => {
    const { request, output, files } = await parseRequest(c)
    if (files.length !== 1) {
      throw new ApiProblem(
        400,
        `send exactly one weather file, got ${files.length} (use /v1/compare for several)`,
        [{ path: 'file', message: 'one file part expected' }],
      )
    }
    const read = readSite(files[0], request, config)
    checkWork(request.options, [read.series], config)
    // the engine's messages name options as CLI flags: renamed for this request's surface
    const assessment: Assessment = renderAssessmentWarnings(
      runEngine(
        (onProgress) => assess(read.series, { ...request.options, onProgress }),
        config,
        request.surface,
      ),
      request.surface,
    )
    const info = { fileName: files[0].name, readerWarnings: read.warnings }
    if (output.format === 'html') {
      return c.html(renderReportHtml(assessment, { units: output.units, info }))
    }
    if (output.format === 'csv') {
      return csvResponse(
        c,
        runEngine(() => renderReportCsv(assessment, { units: output.units, info, table: output.table })),
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
      )
    }
    const reads = files.map((f) => readSite(f, request, config))
    checkWork(
      request.options,
      reads.map((r) => r.series),
      config,
    )
    const comparison = runEngine(
      (onProgress) =>
        compare(
          reads.map((r) => r.series),
          { ...request.options, onProgress, criterion: request.criterion, labels: files.map((f) => f.name) },
        ),
      config,
    )
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
    if (output.format === 'csv') {
      throw new ApiProblem(400, 'format=csv is offered per site: call /v1/assess for each file', [
        { path: 'format', message: 'csv not offered for comparisons' },
      ])
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
