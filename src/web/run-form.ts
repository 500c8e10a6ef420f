/**
 * @module web/run-form
 * What POST /report does with a parsed form: read each weather file, assess it, and render one report
 * (one site) or a comparison (several). Runtime-neutral; the demo provider is the only I/O and is passed in.
 */
import { type AssessOptions, assess } from '../analysis/assess.ts'
import type { Assessment } from '../analysis/assessment.ts'
import { compare, rankAssessments } from '../analysis/compare.ts'
import { compareMethods, methodOptionSets } from '../analysis/compare-methods.ts'
import { optionWordsAll } from '../analysis/option-names.ts'
import { AssessOptionError } from '../analysis/plan.ts'
import { isRuntimeFault } from '../api/errors.ts'
import {
  type ComparedSite,
  comparisonTable,
  type Ranking,
  renderComparisonArticle,
  renderComparisonHtml,
} from '../report/compare-html.ts'
import {
  renderMethodComparisonArticle,
  renderMethodComparisonCsv,
  renderMethodComparisonHandout,
  renderMethodComparisonHtml,
} from '../report/methods-html.ts'
import { renderReportCsv } from '../report/report-csv.ts'
import { renderReportArticle, renderReportHtml } from '../report/report-html.ts'
import { tablesCsv } from '../report/tables.ts'
import { renderOptionNames } from '../weather/option-spec.ts'
import { readWeatherBytes } from '../weather/read-weather.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import type { HourlySeries } from '../weather/series.ts'
import { WeatherInputError } from '../weather/weather-input-error.ts'
import type { DemoProvider } from './demo-files.ts'
import type { FormInput } from './form-input.ts'

/** A weather file that needs answers the form can give (time zone, column mapping …). */
export class FormQuestion extends Error {
  override name = 'FormQuestion'
  constructor(
    message: string,
    readonly fileName: string,
    readonly missing: string[],
  ) {
    super(message)
  }
}

export interface AssessedSite {
  fileName: string
  series: HourlySeries
  assessment: Assessment
  readWarnings: string[]
  /** How the reader understood the file (notes, not problems), option names as the page's labels. */
  readNotes: string[]
  dataSource: string
}

export interface FormResult {
  sites: AssessedSite[]
  /** The `<article>` fragment(s) for inline display. */
  article: string
  /** The complete standalone HTML document. */
  document: string
  /** The two-page summary alone (sites compared: the same as `document`, which is already short; methods side by side: the comparison without each method's report). */
  handout: string
  csv: string
  /** The assessment (one site) or the list of assessments (comparison), JSON text. */
  json: string
  title: string
}

async function inputs(
  input: FormInput,
  demo?: DemoProvider,
): Promise<{ name: string; bytes: Uint8Array; options: Record<string, unknown>; row?: number }[]> {
  const out: { name: string; bytes: Uint8Array; options: Record<string, unknown>; row?: number }[] = []
  if (input.demo && demo) {
    const entry = demo.list().find((d) => d.file === input.demo)
    const bytes = await demo.read(input.demo)
    if (!entry || !bytes)
      throw new RangeError(
        `demo: the demo file ${JSON.stringify(input.demo)} is not available on this server`,
      )
    out.push({ name: entry.file, bytes, options: { ...entry.readOptions, ...input.weatherOptions } })
  }
  for (const f of input.files)
    out.push({ name: f.name, bytes: f.bytes, options: { ...input.weatherOptions } })
  // the sites table: each site with its own options (a site name typed in its row names it)
  for (const site of input.sites)
    out.push({
      name: site.file.name,
      bytes: site.file.bytes,
      options: { ...site.weatherOptions },
      row: site.row,
    })
  return out
}

/** What the server adds to a form's work: its limits and its time budget. */
export interface FormWorkHooks {
  /**
   * Called before the engine runs, with the option sets it will run (one, or one per method side by side:
   * analysis/compare-methods.ts `methodOptionSets`) and the hours of each series: the batch-hour limit.
   */
  beforeAssess?: (optionSets: AssessOptions[], seriesHours: number[]) => void
  /** The engine's progress callback (the time budget and cancellation check). */
  onProgress?: () => void
}

type FormFile = Awaited<ReturnType<typeof inputs>>[number]
type NamedRead = { name: string; read: WeatherReadResult }

/** Read every file of the form; a reader's question names the file (and its row of the sites table). */
function readFiles(files: FormFile[]): NamedRead[] {
  const reads: NamedRead[] = []
  for (const f of files) {
    const options = f.options
    if (options.siteName === undefined) delete options.siteName
    // a site of the sites table is named by its row in messages
    const where = f.row !== undefined ? `Site ${f.row} (${f.name})` : f.name
    let read: WeatherReadResult
    try {
      read = readWeatherBytes(f.bytes, options)
    } catch (e) {
      if (e instanceof WeatherInputError) {
        // the reader names options as CLI flags; on the page they are the fields' labels
        throw new FormQuestion(
          `${where}: ${renderOptionNames(e.message, 'form')}${f.row !== undefined ? ' (in its row of the sites table)' : ' (under “Site, time zone and columns”)'}`,
          f.name,
          e.missing,
        )
      }
      if (e instanceof RangeError && !isRuntimeFault(e)) throw new RangeError(`${where}: ${e.message}`)
      throw e
    }
    if (!read.series.site.name && files.length > 1) read.series.site.name = f.name.replace(/\.[^.]+$/, '')
    reads.push({ name: f.name, read })
  }
  return reads
}

/** One site assessed, or several compared and ranked (analysis/compare.ts). */
function runEngine(
  reads: NamedRead[],
  input: FormInput,
  hooks: FormWorkHooks,
): { assessments: Assessment[]; ranking?: Ranking } {
  try {
    if (reads.length === 1) {
      return {
        assessments: [
          assess(reads[0].read.series, {
            ...input.assess,
            product: input.product,
            onProgress: hooks.onProgress,
          }),
        ],
      }
    }
    const c = compare(
      reads.map((r) => r.read.series),
      {
        ...input.assess,
        product: input.product,
        onProgress: hooks.onProgress,
        labels: reads.map((r) => r.read.series.site.name || r.name),
      },
    )
    // the comparison lists its sites best first; the reads keep the order given
    return {
      assessments: reads.map((_, i) => c.assessments[c.sites.findIndex((x) => x.given === i)]),
      ranking: c,
    }
  } catch (e) {
    // an option the planner refused keeps its class (it names the form field); engine faults pass as they are
    if (e instanceof RangeError && !(e instanceof AssessOptionError) && !isRuntimeFault(e))
      throw new RangeError(`${reads.length === 1 ? `${reads[0].name}: ` : ''}${e.message}`)
    throw e
  }
}

/** The report's facts about the file a site was read from. */
function siteInfo(s: AssessedSite) {
  return {
    fileName: s.fileName,
    dataSource: s.dataSource,
    readerWarnings: s.readWarnings,
    readerNotes: s.readNotes,
  }
}

/** One site: the page's article, the full report, the two-page handout, CSV and JSON. */
function siteResult(sites: AssessedSite[], units: FormInput['units']): FormResult {
  const s = sites[0]
  const opts = { units, info: siteInfo(s) }
  return {
    sites,
    article: renderReportArticle(s.assessment, opts),
    document: renderReportHtml(s.assessment, opts),
    handout: renderReportHtml(s.assessment, { ...opts, layout: 'handout' }),
    csv: renderReportCsv(s.assessment, opts),
    json: JSON.stringify(s.assessment, null, 2),
    title: `${s.assessment.site.name || s.fileName} – ${s.assessment.product.name}`,
  }
}

/** Several sites: the comparison (its printout is the handout too), CSV of the ranking and every site, JSON. */
function comparisonResult(sites: AssessedSite[], ranking: Ranking, units: FormInput['units']): FormResult {
  const compared: ComparedSite[] = sites.map((s) => ({
    assessment: s.assessment,
    options: { info: siteInfo(s) },
  }))
  return {
    sites,
    article: renderComparisonArticle(compared, { units, ranking }),
    document: renderComparisonHtml(compared, { units, ranking }),
    handout: renderComparisonHtml(compared, { units, ranking }),
    csv:
      tablesCsv([comparisonTable(ranking, units)]) +
      '\r\n' +
      sites.map((s) => renderReportCsv(s.assessment, { units, info: { fileName: s.fileName } })).join('\r\n'),
    json: JSON.stringify(
      sites.map((s) => s.assessment),
      null,
      2,
    ),
    title: `comparison of ${sites.length} sites – ${sites[0].assessment.product.name}`,
  }
}

export async function runForm(
  input: FormInput,
  demo?: DemoProvider,
  hooks: FormWorkHooks = {},
): Promise<FormResult> {
  const files = await inputs(input, demo)
  const reads = readFiles(files)
  if (input.task === 'assess' && input.methodInputs.length > 1) return methodsResult(reads[0], input, hooks)
  hooks.beforeAssess?.(
    methodOptionSets({ ...input.assess, product: input.product }, null),
    reads.map((r) => r.read.series.hours),
  )
  const { assessments, ranking } = runEngine(reads, input, hooks)
  const sites = reads.map((r, i) => assessedSite(r, assessments[i]))
  if (sites.length === 1) return siteResult(sites, input.units)
  // several sites are always compared (and ranked) by analysis/compare.ts above
  return comparisonResult(sites, ranking ?? rankAssessments(sites.map((s) => s.assessment)), input.units)
}

/**
 * One file by several methods side by side (analysis/compare-methods.ts, as `assess --method a,b` and the API's
 * methods list): the comparison's article, its document (also the printout), CSV and JSON.
 */
function methodsResult(site: NamedRead, input: FormInput, hooks: FormWorkHooks): FormResult {
  const { method: _one, ...shared } = input.assess
  // the work of every method, each with its own plan (a bin's start step and airflows), as the API counts it
  hooks.beforeAssess?.(methodOptionSets({ ...shared, product: input.product }, input.methodInputs), [
    site.read.series.hours,
  ])
  const c = compareMethods(
    site.read.series,
    { ...shared, product: input.product, onProgress: hooks.onProgress },
    input.methodInputs,
  )
  const fileName = site.name
  const opts = { units: input.units, fileName }
  const sites = c.assessments.map((a) => assessedSite(site, a))
  return {
    sites,
    article: renderMethodComparisonArticle(c, opts),
    document: renderMethodComparisonHtml(c, opts),
    handout: renderMethodComparisonHandout(c, opts),
    csv: renderMethodComparisonCsv(c, { units: input.units }),
    json: JSON.stringify(c, null, 2),
    title: `${c.site.name || fileName} – ${c.product.name}: methods side by side`,
  }
}

/** A site as the page shows it: the engine's and the reader's messages name options by the form's labels. */
function assessedSite({ name, read }: NamedRead, assessment: Assessment): AssessedSite {
  assessment.warnings = optionWordsAll(assessment.warnings, 'form')
  return {
    fileName: name,
    series: read.series,
    assessment,
    readWarnings: optionWordsAll(read.warnings, 'form'),
    readNotes: optionWordsAll(read.notes, 'form'),
    dataSource: `${read.format.toUpperCase()}, ${read.rows.read} rows read, ${read.rows.used} used, ${read.rows.repaired} repaired, ${read.rows.rejected} rejected`,
  }
}
