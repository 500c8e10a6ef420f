import { parseArgs } from 'node:util'
import { COMPARE_CRITERIA, type CompareCriterion, type Comparison, compare } from '../../analysis/compare.ts'
import { memoryFiguresLine } from '../../product/memory-figures.ts'
import { renderComparisonCsv } from '../../report/compare-csv.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import { renderOptionNames } from '../../weather/option-spec.ts'
import type { WeatherReadResult } from '../../weather/result.ts'
import { overrideWarning } from '../../weather/site-overrides.ts'
import { type CliCommand, UsageError } from '../command.ts'
import {
  ENGINE_OPTIONS_HELP,
  ENGINE_PARSE_OPTIONS,
  type EngineValues,
  engineOptions,
  methodKinds,
  progressPrinter,
  readSeries,
} from '../engine-options.ts'
import {
  checkOutFree,
  REPORT_OUTPUT_HELP,
  REPORT_OUTPUT_OPTIONS,
  reportOutputChoice,
  writeReportOutput,
} from '../report-output.ts'
import { readSite, readSitesFile, refuseWeatherFlags, SITES_HELP } from '../sites.ts'

const help = `dryhours compare: several sites, one product and method, ranked side by side

Usage:
  dryhours compare <file> <file> [<file> …] --product <id|profile.json> --method <kind>
                   [--criterion ${COMPARE_CRITERIA.join('|')}] [options]
                   [--json | --format text|json|html|csv] [--units si|us] [--out <file>] [--force]
  dryhours compare --sites <sites.csv> --product <id|profile.json> --method <kind> [options]

Criteria (default probability-within-deadline):
  probability-within-deadline  mean share of years finishing within the deadline, season start dates
  usable-hours-p10             usable hours in the season, exceeded in 9 of 10 years
  heat-per-tonne               median supplemental heat to finish by the deadline (lower is better)
Ties are broken by the other criteria in this order, then by the order the sites were given; each
site says which criterion placed it. Typical-year files are marked, with a caveat when they are
ranked against multi-year files. JSON lists the sites best first.

Weather options (--lat, --lon, --utc-offset, --tz, --site-tz, --map, --labels …) given as flags apply
to EVERY file; a flag that would replace what one of the files states about its site (an EPW's
location, say) is refused: give each site its own settings with --sites.

${SITES_HELP}

${ENGINE_OPTIONS_HELP}

${REPORT_OUTPUT_HELP}`

const f = (x: number | null, d = 0): string => (x === null ? '–' : x.toFixed(d))

export function comparisonText(c: Comparison): string {
  const out: string[] = []
  out.push(
    `${c.product.name}, ${c.method.kind}, season ${c.season.start} to ${c.season.end}, ${c.assessments[0]?.bin ? `${c.assessments[0].bin.seasonDays} days in the bin for the top layer to dry` : `deadline ${c.deadlineDays} days`}`,
  )
  out.push(`ranked by ${c.criterion}: ${c.criterionDescription}`)
  out.push(`ties: ${c.tieBreak}`)
  out.push(memoryFiguresLine(c.product.figuresFromMemory, c.product.figureCounts, c.product.id))
  out.push('')
  const label = (s: Comparison['sites'][number]) => `${s.site}${s.typicalYear ? ' (typical year)' : ''}`
  const width = Math.max(4, ...c.sites.map((s) => label(s).length))
  out.push(
    `rank  ${'site'.padEnd(width)}  P(within deadline)  usable h P10 (median)  heat kWh/t  spoils first  best start window  placed by`,
  )
  for (const s of c.sites) {
    out.push(
      `${String(s.rank).padStart(4)}  ${label(s).padEnd(width)}  ${(s.meanProbabilityWithinDeadline === null ? '–' : `${(100 * s.meanProbabilityWithinDeadline).toFixed(0)} %`).padStart(18)}  ${`${f(s.usableHoursInSeasonP10)} (${f(s.usableHoursInSeasonMedian)})`.padStart(21)}  ${f(s.medianHeatKwhPerTonne).padStart(10)}  ${(s.spoilageProbability === null || s.spoilageProbability === undefined ? '–' : `${(100 * s.spoilageProbability).toFixed(0)} %`).padStart(12)}  ${(s.bestStartWindow ?? '–').padEnd(17)}  ${s.decidedBy ?? ''}`,
    )
  }
  for (const caveat of c.caveats) out.push(`Caveat: ${caveat}`)
  if (c.assessments.some((a) => a.bin)) {
    out.push('')
    out.push(
      'Natural-air bin: P(within deadline) above is the share of years the top layer dries below the DML limit.',
    )
    out.push('Airflow that serves every start month (the largest monthly minimum):')
    for (const s of c.sites) {
      const q = s.binSeasonMinimumAirflowM3PerMinPerTonne
      out.push(
        `  ${s.site}: ${q === undefined ? '–' : q === null ? 'none of the airflows compared' : `${q} m³/min per t`}`,
      )
    }
  }
  const warned = c.sites.filter((s) => s.warnings.length > 0)
  if (warned.length > 0) {
    out.push('')
    for (const s of warned) for (const w of s.warnings) out.push(`  ${s.site}: ${w}`)
  }
  return `${out.join('\n')}\n`
}

/**
 * Flags that apply to every file must not move a site one of the files states: refuse, naming the file,
 * the option and both values.
 */
function refuseOverrides(reads: { file: string; read: WeatherReadResult }[]): void {
  if (reads.length < 2) return
  for (const { file, read } of reads) {
    const o = read.overrides?.[0]
    if (o) {
      throw new UsageError(
        `${file}: ${overrideWarning(o)}; a weather flag applies to every file, so it would move this site: give each site its own settings in a sites file (--sites), or leave the flag out`,
      )
    }
  }
}

export const compareCommand: CliCommand = {
  name: 'compare',
  summary: 'rank several sites (each with its own settings) for one product and method by a stated criterion',
  help,
  async run(args, io) {
    let parsed: { values: EngineValues; positionals: string[] }
    try {
      parsed = parseArgs({
        args,
        options: {
          ...ENGINE_PARSE_OPTIONS,
          ...REPORT_OUTPUT_OPTIONS,
          criterion: { type: 'string' },
          sites: { type: 'string' },
        },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const values = parsed.values
    const sitesFile = values.sites as string | undefined
    const files = parsed.positionals
    if (sitesFile !== undefined && files.length > 0)
      throw new UsageError('give weather files or --sites <sites.csv>, not both')
    if (sitesFile === undefined && files.length < 2)
      throw new UsageError(
        'give at least two weather files (dryhours compare <file> <file> …), or --sites <sites.csv>',
      )
    const output = reportOutputChoice(values, ['text', 'json', 'html', 'csv'])
    await checkOutFree(io, output)
    if (output.outDir !== undefined)
      throw new UsageError('--out-dir goes with assess --sites; compare writes one file (--out)')
    const criterion = values.criterion as string | undefined
    if (criterion !== undefined && !(COMPARE_CRITERIA as readonly string[]).includes(criterion)) {
      throw new UsageError(`--criterion must be one of ${COMPARE_CRITERIA.join(', ')}, got '${criterion}'`)
    }
    const kinds = methodKinds(values)
    if (kinds === 'all' || kinds.length > 1)
      throw new UsageError('compare takes one --method; compare methods on one site with assess --method a,b')
    const options = await engineOptions(values, io)
    const reads: { name: string; file: string; read: WeatherReadResult }[] = []
    if (sitesFile !== undefined) {
      refuseWeatherFlags(values)
      const sites = await readSitesFile(sitesFile, io)
      if (sites.length < 2) throw new UsageError(`${sitesFile}: give at least two sites to compare`)
      for (const site of sites) {
        const read = await readSite(site, io)
        // a site's own setting is meant for its file: said, not refused
        for (const o of read.overrides ?? [])
          io.stderr(
            `warning: site '${site.name}' (${site.file}): ${renderOptionNames(overrideWarning(o), 'query')}\n`,
          )
        reads.push({ name: site.name, file: site.file, read })
      }
    } else {
      for (const file of files) {
        const read = await readSeries(file, values, io)
        reads.push({ name: read.series.site.name, file, read })
      }
      refuseOverrides(reads)
    }
    let result: Comparison
    try {
      if (!values.quiet) options.onProgress = progressPrinter(io, 'compare')
      result = compare(
        reads.map((r) => r.read.series),
        {
          ...options,
          criterion: criterion as CompareCriterion | undefined,
          labels: sitesFile !== undefined ? reads.map((r) => r.name) : undefined,
          files: reads.map((r) => r.file),
        },
      )
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    const fileName = (file: string | null) => (file ?? '').split(/[\\/]/).pop()
    const text =
      output.format === 'json'
        ? `${JSON.stringify(result)}\n`
        : output.format === 'html'
          ? renderComparisonHtml(
              result.assessments.map((assessment, i) => ({
                assessment,
                options: { info: { fileName: fileName(result.sites[i].file) } },
              })),
              { units: output.units, ranking: result },
            )
          : output.format === 'csv'
            ? csvOrUsage(() => renderComparisonCsv(result, { units: output.units, table: output.table }))
            : comparisonText(result)
    await writeReportOutput(io, output, text)
    return 0
  },
}

function csvOrUsage(render: () => string): string {
  try {
    return render()
  } catch (e) {
    if (e instanceof RangeError) throw new UsageError(`--table: ${e.message}`)
    throw e
  }
}
