import { parseArgs } from 'node:util'
import { type AssessOptions, assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import {
  compareMethods,
  METHOD_COMPARISON_SCHEMA,
  type MethodComparison,
  type MethodList,
} from '../../analysis/compare-methods.ts'
import { assessmentText } from '../../report/assessment-text.ts'
import { renderMethodComparisonCsv, renderMethodComparisonHtml } from '../../report/methods-html.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import {
  type IndexEntry,
  renderSitesIndexCsv,
  renderSitesIndexHtml,
  renderSitesIndexText,
  sitesIndexJson,
} from '../../report/sites-index.ts'
import { renderOptionNames } from '../../weather/option-spec.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import type { HourlySeries } from '../../weather/series.ts'
import { overrideWarning } from '../../weather/site-overrides.ts'
import { type CliCommand, type CliIo, UsageError } from '../command.ts'
import {
  ENGINE_OPTIONS_HELP,
  ENGINE_PARSE_OPTIONS,
  type EngineValues,
  engineOptions,
  methodListFromFlags,
  progressPrinter,
  readSeries,
} from '../engine-options.ts'
import { methodComparisonText } from '../methods-text.ts'
import {
  checkOutFree,
  distinctStems,
  FORMAT_EXTENSION,
  REPORT_OUTPUT_HELP,
  REPORT_OUTPUT_OPTIONS,
  type ReportOutputChoice,
  reportOutputChoice,
  writeFilesInto,
  writeReportOutput,
} from '../report-output.ts'
import { type CliSite, readSite, readSitesFile, refuseWeatherFlags, SITES_HELP } from '../sites.ts'

const help = `dryhours assess: can this site's weather dry this product, when, how fast, with how much heat

Usage:
  dryhours assess <file> --product <id|profile.json> --method <kind>[,<kind>…|all] [options]
                  [--json | --format text|json|html|csv] [--units si|us] [--out <file>] [--force]
  dryhours assess --sites <sites.csv> … [--format html|csv|json|text --out-dir <folder>] [--force]

Prints the usable drying hours per month (median and the P10–P90 range across years), the best
start windows, a start-date table and the supplemental heat and fuel; --json prints the full
assessment (monthly, hourOfDay, startDates, heat, assumptions, warnings, coverage).

With several methods (--method open-air,solar-cabinet,heated or --method all): the methods side by
side on the same file and season (days to target, the share of years finishing by the deadline,
spoilage where assessed, heat, fuel and the fuel cost per kg of dried product), a season calendar
(one row per method, one cell per start week: dries, marginal, needs heat, spoils first, each by a
stated rule) and a recommendation that states its criterion; --json gives the comparison with every
method's assessment.

With --sites: every site of the sites file with its own settings; --out-dir writes one summary per
site (named after the site) and an index page linking them. Nothing is overwritten without --force.

${ENGINE_OPTIONS_HELP}

${SITES_HELP}

${REPORT_OUTPUT_HELP}

Safety: dried food must reach a safe water activity; combustion heaters put CO and combustion
products in the air (prefer indirect heaters for food); gas and electrical work by licensed trades.`

/** The result of one site: one method's assessment, or several methods side by side. */
type SiteResult = Assessment | MethodComparison

function isMethods(r: SiteResult): r is MethodComparison {
  return r.schema === METHOD_COMPARISON_SCHEMA
}

/** The result in the chosen format (html and csv: the report's renderings, the same as from its JSON). */
function renderResult(r: SiteResult, o: ReportOutputChoice, file: string): string {
  const fileName = file.split(/[\\/]/).pop()
  const info = { fileName }
  if (o.format === 'json') return `${JSON.stringify(r)}\n`
  if (o.format === 'html')
    return isMethods(r)
      ? renderMethodComparisonHtml(r, { units: o.units, fileName })
      : renderReportHtml(r, { units: o.units, info, optionSurface: 'cli' })
  if (o.format === 'csv') {
    try {
      return isMethods(r)
        ? renderMethodComparisonCsv(r, { units: o.units, table: o.table })
        : renderReportCsv(r, { units: o.units, info, table: o.table, optionSurface: 'cli' })
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(`--table: ${e.message}`)
      throw e
    }
  }
  return isMethods(r) ? methodComparisonText(r) : assessmentText(r, { units: o.units })
}

/** Assess one series with one method, or compare the listed methods. */
function runSite(series: HourlySeries, options: AssessOptions, methods: MethodList): SiteResult {
  try {
    if (Array.isArray(methods) && methods.length === 1) return assess(series, options)
    return compareMethods(series, options, methods)
  } catch (e) {
    if (e instanceof RangeError) throw new UsageError(e.message)
    throw e
  }
}

/**
 * The reader's warnings that say an option replaced what the file states: on stderr, and first among the
 * result's warnings (so the JSON, and the HTML made from it, say it too).
 */
function sayOverrides(
  io: CliIo,
  read: WeatherReadResult,
  result: SiteResult,
  label: string,
  surface: 'cli' | 'query',
): void {
  const lines = (read.overrides ?? []).map(
    (o) => `${label}: ${renderOptionNames(overrideWarning(o), surface)}`,
  )
  for (const l of lines) io.stderr(`warning: ${l}\n`)
  if (lines.length === 0) return
  for (const x of isMethods(result) ? result.assessments : [result]) x.warnings.unshift(...lines)
}

/** `assess --sites`: every site with its own settings, one result each; files into --out-dir with an index. */
async function assessSites(
  sitesFile: string,
  values: EngineValues,
  output: ReportOutputChoice,
  io: CliIo,
): Promise<number> {
  refuseWeatherFlags(values)
  const sites = await readSitesFile(sitesFile, io)
  if ((output.format === 'html' || output.format === 'csv') && output.outDir === undefined) {
    throw new UsageError(
      `with --sites, --format ${output.format} writes one file per site: give --out-dir <folder>`,
    )
  }
  const options = await engineOptions(values, io)
  const methods = methodListFromFlags(values, options.product)
  const results: { site: CliSite; result: SiteResult }[] = []
  for (const site of sites) {
    const read = await readSite(site, io)
    if (!values.quiet) options.onProgress = progressPrinter(io, `assess ${site.name}`)
    let result: SiteResult
    try {
      result = runSite(read.series, options, methods)
    } catch (e) {
      if (e instanceof UsageError) throw new UsageError(`site '${site.name}' (${site.file}): ${e.message}`)
      throw e
    }
    sayOverrides(io, read, result, `site '${site.name}' (${site.file})`, 'query')
    results.push({ site, result })
  }
  if (output.outDir === undefined) {
    const text =
      output.format === 'json'
        ? `${JSON.stringify({
            schema: 'dryhours.site-assessments/1',
            sites: results.map((r) => ({ name: r.site.name, file: r.site.file, result: r.result })),
          })}\n`
        : results.map((r) => renderResult(r.result, output, r.site.path)).join('\n')
    await writeReportOutput(io, output, text)
    return 0
  }
  const ext = FORMAT_EXTENSION[output.format]
  const stems = distinctStems(results.map((r) => r.site.name))
  const entries: IndexEntry[] = results.map((r, i) => ({
    name: r.site.name,
    file: r.site.file,
    output: `${stems[i]}.${ext}`,
    result: r.result,
  }))
  const index =
    output.format === 'html'
      ? renderSitesIndexHtml(entries, `Drying summaries: ${sites.length} farms`)
      : output.format === 'csv'
        ? renderSitesIndexCsv(entries)
        : output.format === 'json'
          ? `${JSON.stringify(sitesIndexJson(entries))}\n`
          : renderSitesIndexText(entries)
  await writeFilesInto(
    io,
    output.outDir,
    [
      ...results.map((r, i) => ({
        name: entries[i].output,
        text: renderResult(r.result, output, r.site.path),
      })),
      { name: `index.${ext}`, text: index },
    ],
    output.force,
  )
  return 0
}

export const assessCommand: CliCommand = {
  name: 'assess',
  summary:
    'usable drying hours, start-date table, batch times and heat for one site, several methods or many farms',
  help,
  async run(args, io) {
    let parsed: { values: EngineValues; positionals: string[] }
    try {
      parsed = parseArgs({
        args,
        options: { ...ENGINE_PARSE_OPTIONS, ...REPORT_OUTPUT_OPTIONS, sites: { type: 'string' } },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const values = parsed.values
    const output = reportOutputChoice(values, ['text', 'json', 'html', 'csv'])
    await checkOutFree(io, output)
    const sitesFile = values.sites as string | undefined
    if (sitesFile !== undefined) {
      if (parsed.positionals.length > 0)
        throw new UsageError('give a weather file or --sites <sites.csv>, not both')
      return assessSites(sitesFile, values, output, io)
    }
    if (output.outDir !== undefined) throw new UsageError('--out-dir goes with --sites (one file per site)')
    if (parsed.positionals.length !== 1)
      throw new UsageError('give exactly one weather file (dryhours assess <file>), or --sites <sites.csv>')
    const file = parsed.positionals[0]
    const options = await engineOptions(values, io)
    const methods = methodListFromFlags(values, options.product)
    const read = await readSeries(file, values, io)
    if (!values.quiet) options.onProgress = progressPrinter(io, `assess ${file}`)
    const result = runSite(read.series, options, methods)
    sayOverrides(io, read, result, file, 'cli')
    await writeReportOutput(io, output, renderResult(result, output, file))
    return 0
  },
}
