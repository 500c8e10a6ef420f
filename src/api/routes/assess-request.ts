/**
 * @module api/routes/assess-request
 * What POST /v1/assess and POST /v1/compare share: reading the request (query or options part, the files,
 * the sites part), reading a weather file within the limits, running the engine with its errors as
 * problems, the warnings of the answer in the request's own names, and CSV answers.
 */
import type { Context } from 'hono'
import { z } from 'zod'
import type { Assessment } from '../../analysis/assessment.ts'
import type { MethodComparison } from '../../analysis/compare-methods.ts'
import { optionWords } from '../../analysis/option-names.ts'
import type { OptionSurface } from '../../weather/option-spec.ts'
import { readWeather } from '../../weather/read-weather.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { overrideWarning } from '../../weather/site-overrides.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, rethrowAsProblem } from '../errors.ts'
import { ApiProblem } from '../problem.ts'
import {
  type AssessRequest,
  assessOptionsJsonSchema,
  assessRequestFromJson,
  assessRequestFromQuery,
} from '../schemas/assess.ts'
import { checkedUploadText, readUpload, type UploadedFile } from '../upload.ts'
import { parseOrProblem } from '../validate.ts'
import { renderReadingMessages, weatherInputProblem } from '../weather-options.ts'

export const outputQuerySchema = z.strictObject({
  format: z.enum(['json', 'csv', 'html']).optional(),
  units: z.enum(['si', 'us']).optional(),
  table: z.string().optional(),
})

export interface Parsed {
  request: AssessRequest
  output: z.output<typeof outputQuerySchema>
  files: UploadedFile[]
  /** The `sites` part (compare): each site with its own settings. */
  sites?: unknown
}

export async function parseRequest(c: Context): Promise<Parsed> {
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
export function overrideWarnings(read: WeatherReadResult, surface: OptionSurface): string[] {
  return (read.overrides ?? []).map((o) => optionWords(overrideWarning(o), surface))
}

/**
 * Run the engine; its errors become problems: options named by their field path in this request, the
 * engine's option names in messages renamed for the request's surface, engine faults never quoted.
 */
export function runEngine<T>(fn: () => T, request: AssessRequest): T {
  try {
    return fn()
  } catch (e) {
    if (e instanceof RangeError && !isRuntimeFault(e)) {
      e.message = optionWords(e.message, request.surface)
    }
    rethrowAsProblem(e, { optionPath: request.optionPath })
  }
}

export function csvResponse(c: Context, text: string): Response {
  return c.body(text, 200, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': 'attachment; filename="dryhours-assessment.csv"',
  })
}

export function csvTables(render: () => string): string {
  try {
    return render()
  } catch (e) {
    if (e instanceof RangeError && !isRuntimeFault(e))
      throw new ApiProblem(400, e.message, [{ path: 'table', message: e.message }])
    rethrowAsProblem(e)
  }
}

/**
 * The assessment's warnings with option names as the request gave them, after the warnings of the
 * reading that the answer must carry (`first`: options that replaced what the file states).
 */
export function renderAssessmentWarnings(
  a: Assessment,
  surface: OptionSurface,
  first: string[] = [],
): Assessment {
  return { ...a, warnings: [...first, ...a.warnings.map((w) => optionWords(w, surface))] }
}

/**
 * Methods side by side with option names as the request gave them: every method's assessment (its warnings
 * after `first`) and the reasons of the methods not assessed.
 */
export function renderMethodComparisonWords(
  c: MethodComparison,
  surface: OptionSurface,
  first: string[] = [],
): MethodComparison {
  return {
    ...c,
    assessments: c.assessments.map((a) => renderAssessmentWarnings(a, surface, first)),
    notAssessed: c.notAssessed.map((n) => ({ ...n, reason: optionWords(n.reason, surface) })),
  }
}

export const optionsDescription =
  'Send the weather file as the body (text/csv, text/plain; EPW too) with the common options in the query, or as multipart/form-data with file part(s) and an `options` JSON part (full control: ' +
  Object.keys(assessOptionsJsonSchema.shape).join(', ') +
  '). `format` and `units` are always query parameters.'
