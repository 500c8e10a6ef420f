import { parseArgs } from 'node:util'
import { type AssessOptions, assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import {
  compareMethods,
  METHOD_COMPARISON_SCHEMA,
  type MethodComparison,
  type MethodList,
} from '../../analysis/compare-methods.ts'
import { FUELS } from '../../drying/fuels.ts'
import { HOUR_STATUS_NAMES } from '../../drying/usable-hour.ts'
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
import { binText } from '../bin.ts'
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

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')
const f0 = (x: number | null): string => (x === null ? '–' : x.toFixed(0))
const f1 = (x: number | null): string => (x === null ? '–' : x.toFixed(1))

/** Start windows, the start-date table and the heat of a batch method. */
function batchesText(a: Assessment): string[] {
  const out: string[] = []
  out.push(`Best start windows (${a.bestStartWindowCriterion}):`)
  if (a.bestStartWindows.length === 0) out.push('  none')
  for (const w of a.bestStartWindows) {
    out.push(
      `  ${w.from} to ${w.to}: finishes within ${a.deadlineDays} days in ≥ ${(100 * w.minProbabilityWithinDeadline).toFixed(0)} % of years, median ${f1(w.medianDaysToTarget)} days`,
    )
  }
  out.push('')
  out.push(
    `Start dates (${a.season.start} to ${a.season.end}, batch starts ${a.season.startHourLocal}:00 local)`,
  )
  out.push('start  years  days median  days P90  P(within deadline)  rewet h  heat kWh/t median (P90)')
  const every = Math.max(1, Math.ceil(a.startDates.length / 20))
  a.startDates.forEach((r, i) => {
    if (i % every !== 0) return
    out.push(
      `${r.start}  ${String(r.years).padStart(5)}  ${f1(r.daysToTarget.median).padStart(11)}  ${f1(r.daysToTarget.p90).padStart(8)}  ${(100 * r.probabilityWithinDeadline).toFixed(0).padStart(17)} %  ${f0(r.rewettingHours.median).padStart(7)}  ${f0(r.supplementalHeat.medianKwhPerTonne)} (${f0(r.supplementalHeat.p90KwhPerTonne)})`,
    )
  })
  const h = a.heat
  out.push('')
  out.push(
    `Supplemental heat to finish within ${a.deadlineDays} days: median ${f0(h.heatToAirKwhPerTonne.median)} kWh/t into the air (P10 ${f0(h.heatToAirKwhPerTonne.p10)}, P90 ${f0(h.heatToAirKwhPerTonne.p90)}), ${f0(h.fuelHeatKwhPerTonne.median)} kWh/t of fuel at efficiency ${h.heaterEfficiency}; batch of ${h.batchKgFresh} kg: ${f0(h.heatToAirKwhPerBatch.median)} kWh`,
  )
  const cur = h.currency ? ` ${h.currency}` : ''
  for (const fu of h.fuels) {
    const mark = fu.priceIsExample ? ' (example price)' : ''
    out.push(
      `  ${FUELS[fu.fuel].name.padEnd(36)} ${f1(fu.quantityPerTonne).padStart(8)} ${fu.unit}/t  cost ${f1(fu.costPerTonne)}${cur}/t at ${fu.pricePerUnit}${cur}/${fu.unit}${mark}`,
    )
  }
  const c = h.crossCheck
  out.push(
    `  cross-check: ${c.waterToRemoveKgPerTonne} kg water/t × ${c.heatOfEvaporationKjPerKg} kJ/kg ÷ efficiency = ${c.evaporationHeatFuelKwhPerTonne} kWh/t; heated every hour uses ${c.ratioHeatedEveryHour ?? '–'} × that`,
  )
  return out
}

/** The readable summary of an assessment. */
export function assessmentText(a: Assessment): string {
  const out: string[] = []
  const p = a.product
  out.push(
    `${a.site.name}: ${p.name}, ${a.method.kind}, ${p.initialMoistureWbPct} → ${p.targetMoistureWbPct} % wb`,
  )
  out.push(
    `data ${a.coverage.firstHourUtc} to ${a.coverage.lastHourUtc}, years ${a.coverage.years.length > 0 ? a.coverage.years.join(', ') : 'none with a week of data'}; local time UTC${a.site.utcOffsetHours >= 0 ? '+' : ''}${a.site.utcOffsetHours}`,
  )
  out.push('')
  out.push('Usable drying hours per month (median, P10–P90 across years; P10 = exceeded in 9 of 10 years)')
  out.push('month  median  P10–P90   usable %  main reason not usable   heat kWh/t  days to target')
  for (const m of a.monthly) {
    const reasons = HOUR_STATUS_NAMES.filter((r) => r !== 'usable')
      .map((r) => [r, m.medianHoursByReason[r]] as const)
      .sort((x, y) => y[1] - x[1])
    const main = reasons[0][1] > 0 ? `${reasons[0][0]} (${reasons[0][1]} h)` : '–'
    const range = `${f0(m.usableHours.p10)}–${f0(m.usableHours.p90)}`
    out.push(
      `${MONTHS[m.month - 1].padEnd(5)}  ${f0(m.usableHours.median).padStart(6)}  ${range.padEnd(9)} ${(m.usableFraction === null ? '–' : (100 * m.usableFraction).toFixed(0)).padStart(8)}  ${main.padEnd(24)} ${f0(m.supplementalHeatKwhPerTonne.median).padStart(10)}  ${f1(m.medianDaysToTarget).padStart(14)}`,
    )
  }
  out.push('')
  out.push(...(a.bin ? binText(a, a.bin) : batchesText(a)))
  if (a.warnings.length > 0) {
    out.push('')
    out.push('Warnings:')
    for (const w of a.warnings) out.push(`  - ${w}`)
  }
  const cautions = [...(a.bin?.cautions ?? []), ...p.cautions]
  if (cautions.length > 0) {
    out.push('')
    out.push('Cautions:')
    for (const w of cautions) out.push(`  - ${w}`)
  }
  out.push('')
  out.push(`${a.assumptions.length} assumptions (thresholds, defaults and their sources): see --json`)
  return `${out.join('\n')}\n`
}

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
      : renderReportHtml(r, { units: o.units, info })
  if (o.format === 'csv') {
    try {
      return isMethods(r)
        ? renderMethodComparisonCsv(r, { units: o.units, table: o.table })
        : renderReportCsv(r, { units: o.units, info, table: o.table })
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(`--table: ${e.message}`)
      throw e
    }
  }
  return isMethods(r) ? methodComparisonText(r) : assessmentText(r)
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
