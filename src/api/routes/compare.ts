/**
 * @module api/routes/compare
 * POST /v1/compare (several weather files, each site with its own settings in a `sites` part, or the
 * same options for every file): the sites ranked by a stated criterion, as JSON (same object as
 * `dryhours compare --json`), CSV tables or the HTML summary.
 */
import { Hono } from 'hono'
import { compare } from '../../analysis/compare.ts'
import { type SiteSpec, SiteTableError, sitesFromJson } from '../../analysis/compare-sites.ts'
import { optionWords } from '../../analysis/option-names.ts'
import { renderComparisonCsv } from '../../report/compare-csv.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { overrideWarning } from '../../weather/site-overrides.ts'
import type { ApiConfig } from '../config.ts'
import { EXAMPLE_BOUNDARY, exampleWeatherCsv, multipartExample } from '../example-weather.ts'
import { checkBatchHours } from '../limits.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import type { AssessRequest } from '../schemas/assess.ts'
import { comparisonResponseSchema } from '../schemas/responses/comparison.ts'
import type { UploadedFile } from '../upload.ts'
import { workControl } from '../work.ts'
import {
  csvResponse,
  csvTables,
  optionsDescription,
  outputQuerySchema,
  overrideWarnings,
  parseRequest,
  readSite,
  renderAssessmentWarnings,
  runEngine,
} from './assess-request.ts'

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
            `${r.file.name}: ${optionWords(overrideWarning(o), request.surface)}; an option applies to every file, so it would move this site: send a sites part with each site's own settings, or leave the option out`,
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
    const assessments = comparison.assessments.map((a, i) =>
      renderAssessmentWarnings(a, request.surface, reads[comparison.sites[i].given].said),
    )
    // the ranking's sites carry their assessment's warnings: in the same words
    const rendered = {
      ...comparison,
      sites: comparison.sites.map((s) => ({
        ...s,
        warnings: s.warnings.map((w) => optionWords(w, request.surface)),
      })),
      assessments,
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
