/**
 * @module api/routes/assess
 * POST /v1/assess (one weather file): the seasonal assessment, or with several methods the methods side
 * by side, as JSON (same objects as `dryhours assess --json`), CSV tables or the HTML summary.
 */
import { Hono } from 'hono'
import { z } from 'zod'
import { assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import { compareMethods, methodOptionSets } from '../../analysis/compare-methods.ts'
import { renderMethodComparisonCsv, renderMethodComparisonHtml } from '../../report/methods-html.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import type { ApiConfig } from '../config.ts'
import { exampleWeatherCsv } from '../example-weather.ts'
import { checkBatchHours } from '../limits.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import { assessQuerySchema } from '../schemas/assess.ts'
import { assessmentResponseSchema } from '../schemas/responses/assessment.ts'
import { methodComparisonResponseSchema } from '../schemas/responses/comparison.ts'
import { workControl } from '../work.ts'
import {
  csvResponse,
  csvTables,
  optionsDescription,
  overrideWarnings,
  parseRequest,
  readSite,
  renderAssessmentWarnings,
  renderMethodComparisonWords,
  runEngine,
} from './assess-request.ts'

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
    // side by side: the work of every method that will run
    checkBatchHours(
      methodOptionSets(request.options, request.methods),
      [read.series.hours],
      config,
      request.optionPath,
    )
    const said = overrideWarnings(read, request.surface)
    const info = { fileName: files[0].name, readerWarnings: read.warnings }
    if (request.methods !== null) {
      const methods = request.methods
      // the engine's messages name options as CLI flags: renamed for this request's surface
      const comparison = renderMethodComparisonWords(
        runEngine(
          () => compareMethods(read.series, { ...request.options, onProgress: work.checkpoint }, methods),
          request,
        ),
        request.surface,
        said,
      )
      work.checkpoint()
      if (output.format === 'html')
        return c.html(
          renderMethodComparisonHtml(comparison, { units: output.units, fileName: files[0].name }),
        )
      if (output.format === 'csv') {
        return csvResponse(
          c,
          csvTables(() =>
            renderMethodComparisonCsv(comparison, { units: output.units, table: output.table }),
          ),
        )
      }
      return c.json(comparison)
    }
    // the engine's messages name options as CLI flags: renamed for this request's surface
    const assessment: Assessment = renderAssessmentWarnings(
      runEngine(() => assess(read.series, { ...request.options, onProgress: work.checkpoint }), request),
      request.surface,
      said,
    )
    work.checkpoint()
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
    description:
      'the assessment; with several methods, the methods side by side (format=csv: tables; format=html: the summary)',
    schema: () => z.union([assessmentResponseSchema(), methodComparisonResponseSchema()]),
  },
  errors: [400, 404, 413, 415, 422],
  examples: [
    {
      name: 'methods side by side: open air, solar cabinet and heated air, prices in EUR (invented weather)',
      url: '/v1/assess?product=grapes-to-raisins&method=open-air,solar-cabinet,heated&lat=38.3&lon=-2.6&elevation=1050&deadlineDays=3&maxDays=3&currency=EUR&price=propane=0.8',
      contentType: 'text/csv',
      body: exampleWeatherCsv(4),
    },
    {
      name: 'raisins in the open air, four days of hourly weather (invented)',
      url: '/v1/assess?product=grapes-to-raisins&method=open-air&lat=38.3&lon=-2.6&elevation=1050&deadlineDays=3&maxDays=3',
      contentType: 'text/csv',
      body: exampleWeatherCsv(4),
    },
  ],
})
