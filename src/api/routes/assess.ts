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
import { compareMethods } from '../../analysis/compare-methods.ts'
import { type SiteSpec, SiteTableError, sitesFromJson } from '../../analysis/compare-sites.ts'
import { DRYING_METHOD_KINDS } from '../../drying/method.ts'
import { renderComparisonCsv } from '../../report/compare-csv.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import { renderMethodComparisonCsv, renderMethodComparisonHtml } from '../../report/methods-html.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import { type OptionSurface, renderOptionNames } from '../../weather/option-spec.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { overrideWarning } from '../../weather/site-overrides.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, rethrowAsProblem } from '../errors.ts'
import { EXAMPLE_BOUNDARY, exampleWeatherCsv, multipartExample } from '../example-weather.ts'
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
import { assessmentResponseSchema } from '../schemas/responses/assessment.ts'
import { comparisonResponseSchema, methodComparisonResponseSchema } from '../schemas/responses/comparison.ts'
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
  /** The `sites` part (compare): each site with its own settings. */
  sites?: unknown
}

async function parseRequest(c: Context): Promise<Parsed> {
  const upload = await readUpload(c, { defaultName: 'weather file' })
  if (upload.options !== undefined) {
    const output = parseOrProblem(outputQuerySchema, upload.query)
    return {
      request: assessRequestFromJson(upload.options),
      output,
      files: upload.files,
      sites: upload.sites,
    }
  }
  const fromQuery = assessRequestFromQuery(upload.query)
  return { request: fromQuery, output: fromQuery.query, files: upload.files, sites: upload.sites }
}

/**
 * Decode one weather file within the row and column limits and read it with `weather` (the request's
 * options, or a site's own); problems name `label` (the file, or the site and its file).
 */
export function readSite(
  file: UploadedFile,
  request: Pick<AssessRequest, 'weather' | 'surface'>,
  config: ApiConfig,
  label = file.name,
): WeatherReadResult {
  const text = checkedUploadText(file, config)
  try {
    const result = renderReadingMessages(readWeather(text, request.weather), request.surface)
    if (result.series.site.name.trim() === '') result.series.site.name = file.name
    return result
  } catch (e) {
    if (e instanceof WeatherInputError) throw weatherInputProblem(e, request.surface, label)
    rethrowAsProblem(e, { filePrefix: label })
  }
}

/** The options' replacements of what the file states about its site, as warnings for the request's surface. */
function overrideWarnings(read: WeatherReadResult, surface: OptionSurface): string[] {
  return (read.overrides ?? []).map((o) => renderOptionNames(overrideWarning(o), surface))
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
    const methodCount =
      request.methods === null
        ? 1
        : request.methods === 'all'
          ? DRYING_METHOD_KINDS.length
          : request.methods.length
    checkBatchHours(
      request.options,
      new Array(methodCount).fill(read.series.hours),
      config,
      request.optionPath,
    )
    const said = overrideWarnings(read, request.surface)
    const info = { fileName: files[0].name, readerWarnings: read.warnings }
    if (request.methods !== null) {
      const methods = request.methods
      const comparison = runEngine(
        () => compareMethods(read.series, { ...request.options, onProgress: work.checkpoint }, methods),
        request,
      )
      comparison.assessments = comparison.assessments.map((a) =>
        renderAssessmentWarnings(a, request.surface, said),
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

/**
 * The assessment's warnings with option names as the request gave them, after the warnings of the
 * reading that the answer must carry (`first`: options that replaced what the file states).
 */
function renderAssessmentWarnings(a: Assessment, surface: OptionSurface, first: string[] = []): Assessment {
  return { ...a, warnings: [...first, ...a.warnings.map((w) => renderOptionNames(w, surface))] }
}

interface ComparedRead {
  /** The site's name (its own, or the file name). */
  name: string | undefined
  file: UploadedFile
  read: WeatherReadResult
  /** Warnings of the reading the answer carries (a site's option replacing what its file states). */
  said: string[]
}

/** The sites of a `sites` part, each matched to its uploaded file and read with its own settings. */
function readSitesPart(
  sitesJson: unknown,
  request: AssessRequest,
  files: UploadedFile[],
  config: ApiConfig,
  checkpoint: () => void,
): ComparedRead[] {
  if (Object.keys(request.weather).length > 0) {
    const given = Object.keys(request.weather).join(', ')
    throw new ApiProblem(
      400,
      `weather options (${given}) cannot be given for all sites together with a sites part: give them per site`,
      [{ path: request.surface === 'json' ? 'options.weather' : given, message: 'per site with sites' }],
    )
  }
  let specs: SiteSpec[]
  try {
    specs = sitesFromJson(sitesJson)
  } catch (e) {
    if (e instanceof SiteTableError)
      throw new ApiProblem(400, e.message, [{ path: 'sites', message: e.message }])
    throw e
  }
  if (specs.length > config.maxSites) {
    throw new ApiProblem(
      413,
      `at most ${config.maxSites} sites per comparison, got ${specs.length}; compare them in groups`,
      [{ path: 'sites', message: `more than ${config.maxSites} sites` }],
    )
  }
  const used = new Set<UploadedFile>()
  const reads = specs.map((spec, i) => {
    const matches = files.filter((f) => f.name === spec.file)
    if (matches.length !== 1) {
      throw new ApiProblem(
        400,
        `${spec.where}: ${matches.length === 0 ? 'no uploaded file is named' : 'several uploaded files are named'} '${spec.file}' (uploaded: ${files.map((f) => f.name).join(', ') || 'none'})`,
        [{ path: `sites.${i}.file`, message: 'one uploaded file of that name expected' }],
      )
    }
    used.add(matches[0])
    checkpoint()
    const label = `site '${spec.name}' (${spec.file})`
    const read = readSite(matches[0], { weather: spec.weather, surface: 'query' }, config, label)
    return {
      name: spec.name,
      file: matches[0],
      read,
      said: overrideWarnings(read, 'query').map((w) => `site '${spec.name}': ${w}`),
    }
  })
  const unused = files.filter((f) => !used.has(f))
  if (unused.length > 0) {
    throw new ApiProblem(
      400,
      `uploaded files no site names: ${unused.map((f) => f.name).join(', ')}; every file part must be a site's file`,
      [{ path: 'sites', message: 'a file without a site' }],
    )
  }
  return reads
}

export function compareRouter(config: ApiConfig): Hono {
  return new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const { request, output, files, sites } = await parseRequest(c)
    if (files.length > config.maxSites) {
      throw new ApiProblem(
        413,
        `at most ${config.maxSites} sites per comparison, got ${files.length}; compare them in groups`,
        [{ path: 'site', message: `more than ${config.maxSites} files` }],
      )
    }
    if (files.length < 2) {
      throw new ApiProblem(
        400,
        `send at least two weather files (one multipart part per site), got ${files.length}`,
        [{ path: 'file', message: 'two or more file parts expected' }],
      )
    }
    if (request.methods !== null) {
      throw new ApiProblem(
        400,
        'a comparison of sites takes one method; compare methods on one site with /v1/assess',
        [{ path: request.surface === 'json' ? 'options.method' : 'method', message: 'one method expected' }],
      )
    }
    let reads: ComparedRead[]
    if (sites !== undefined) reads = readSitesPart(sites, request, files, config, work.checkpoint)
    else {
      reads = files.map((f) => {
        work.checkpoint()
        return { name: undefined, file: f, read: readSite(f, request, config), said: [] }
      })
      // an option for every file must not move a site that one of the files states
      for (const r of reads) {
        const o = r.read.overrides?.[0]
        if (o) {
          throw new ApiProblem(
            422,
            `${r.file.name}: ${renderOptionNames(overrideWarning(o), request.surface)}; an option applies to every file, so it would move this site: send a sites part with each site's own settings, or leave the option out`,
            undefined,
            'unusable-input',
          )
        }
      }
    }
    checkBatchHours(
      request.options,
      reads.map((r) => r.read.series.hours),
      config,
      request.optionPath,
    )
    const comparison = runEngine(
      () =>
        compare(
          reads.map((r) => r.read.series),
          {
            ...request.options,
            onProgress: work.checkpoint,
            criterion: request.criterion,
            labels: reads.map((r) => r.name ?? r.file.name),
            files: reads.map((r) => r.file.name),
          },
        ),
      request,
    )
    work.checkpoint()
    const rendered = {
      ...comparison,
      assessments: comparison.assessments.map((a, i) =>
        renderAssessmentWarnings(a, request.surface, reads[comparison.sites[i].given].said),
      ),
    }
    if (output.format === 'html') {
      return c.html(
        renderComparisonHtml(
          rendered.assessments.map((a, i) => ({
            assessment: a,
            options: { info: { fileName: comparison.sites[i].file ?? undefined } },
          })),
          { units: output.units, ranking: comparison },
        ),
      )
    }
    if (output.format === 'csv') {
      return csvResponse(
        c,
        csvTables(() => renderComparisonCsv(rendered, { units: output.units, table: output.table })),
      )
    }
    return c.json(rendered)
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
    description:
      'the comparison, sites best first (format=html: the side-by-side summary; format=csv: its tables)',
    schema: comparisonResponseSchema,
  },
  errors: [400, 413, 415, 422],
  examples: [
    {
      name: 'two sites, each with its own location (invented weather)',
      url: '/v1/compare',
      contentType: `multipart/form-data; boundary=${EXAMPLE_BOUNDARY}`,
      body: multipartExample([
        { name: 'site', fileName: 'north.csv', value: exampleWeatherCsv(4) },
        { name: 'site', fileName: 'south.csv', value: exampleWeatherCsv(4) },
        {
          name: 'sites',
          value: JSON.stringify([
            { name: 'North', file: 'north.csv', lat: 41.5, lon: -2.6, elevation: 900 },
            { name: 'South', file: 'south.csv', lat: 37.2, lon: -3.1, elevation: 300 },
          ]),
        },
        {
          name: 'options',
          value: JSON.stringify({
            product: 'grapes-to-raisins',
            method: 'open-air',
            deadlineDays: 3,
            maxDays: 3,
          }),
        },
      ]),
    },
  ],
})
