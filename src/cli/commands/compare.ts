import { parseArgs } from 'node:util'
import { COMPARE_CRITERIA, type CompareCriterion, type Comparison, compare } from '../../analysis/compare.ts'
import { memoryFiguresLine } from '../../product/memory-figures.ts'
import { renderComparisonHtml } from '../../report/compare-html.ts'
import { type CliCommand, UsageError } from '../command.ts'
import {
  REPORT_OUTPUT_HELP,
  REPORT_OUTPUT_OPTIONS,
  reportOutputChoice,
  writeReportOutput,
} from '../report-output.ts'
import {
  ENGINE_OPTIONS_HELP,
  ENGINE_PARSE_OPTIONS,
  type EngineValues,
  engineOptions,
  progressPrinter,
  readSeries,
} from './assess.ts'

const help = `dryhours compare: several sites, one product and method, ranked side by side

Usage:
  dryhours compare <file> <file> [<file> …] --product <id|profile.json> --method <kind>
                   [--criterion ${COMPARE_CRITERIA.join('|')}] [options]
                   [--json | --format text|json|html] [--units si|us] [--out <file>]

Criteria (default probability-within-deadline):
  probability-within-deadline  mean share of years finishing within the deadline, season start dates
  usable-hours-p10             usable hours in the season, exceeded in 9 of 10 years
  heat-per-tonne               median supplemental heat to finish by the deadline (lower is better)
Ties are broken by the other criteria in this order.
Weather options (--lat, --lon, --utc-offset, --tz, --site-tz, --map, --labels …) apply to EVERY file:
give them only when all files share them, or use files that carry their own site (EPW, dialects).

${ENGINE_OPTIONS_HELP}

${REPORT_OUTPUT_HELP}`

const f = (x: number | null, d = 0): string => (x === null ? '–' : x.toFixed(d))

export function comparisonText(c: Comparison): string {
  const out: string[] = []
  out.push(
    `${c.product.name}, ${c.method.kind}, season ${c.season.start} to ${c.season.end}, ${c.assessments[0]?.bin ? `${c.assessments[0].bin.seasonDays} days in the bin for the top layer to dry` : `deadline ${c.deadlineDays} days`}`,
  )
  out.push(`ranked by ${c.criterion}: ${c.criterionDescription}`)
  out.push(memoryFiguresLine(c.product.figuresFromMemory, c.product.figureCounts, c.product.id))
  out.push('')
  const width = Math.max(4, ...c.sites.map((s) => s.site.length))
  out.push(
    `rank  ${'site'.padEnd(width)}  P(within deadline)  usable h P10 (median)  heat kWh/t  spoils first  best start window`,
  )
  for (const s of c.sites) {
    out.push(
      `${String(s.rank).padStart(4)}  ${s.site.padEnd(width)}  ${(s.meanProbabilityWithinDeadline === null ? '–' : `${(100 * s.meanProbabilityWithinDeadline).toFixed(0)} %`).padStart(18)}  ${`${f(s.usableHoursInSeasonP10)} (${f(s.usableHoursInSeasonMedian)})`.padStart(21)}  ${f(s.medianHeatKwhPerTonne).padStart(10)}  ${(s.spoilageProbability === null || s.spoilageProbability === undefined ? '–' : `${(100 * s.spoilageProbability).toFixed(0)} %`).padStart(12)}  ${s.bestStartWindow ?? '–'}`,
    )
  }
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

export const compareCommand: CliCommand = {
  name: 'compare',
  summary: 'rank several sites for one product and method by a stated criterion',
  help,
  async run(args, io) {
    let parsed: { values: EngineValues; positionals: string[] }
    try {
      parsed = parseArgs({
        args,
        options: { ...ENGINE_PARSE_OPTIONS, ...REPORT_OUTPUT_OPTIONS, criterion: { type: 'string' } },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const files = parsed.positionals
    if (files.length < 2)
      throw new UsageError('give at least two weather files: dryhours compare <file> <file> …')
    const values = parsed.values
    const output = reportOutputChoice(values, ['text', 'json', 'html'])
    const criterion = values.criterion as string | undefined
    if (criterion !== undefined && !(COMPARE_CRITERIA as readonly string[]).includes(criterion)) {
      throw new UsageError(`--criterion must be one of ${COMPARE_CRITERIA.join(', ')}, got '${criterion}'`)
    }
    let result: Comparison
    try {
      const options = await engineOptions(values, io)
      const series = []
      for (const file of files) series.push(await readSeries(file, values, io))
      if (!values.quiet) options.onProgress = progressPrinter(io, 'compare')
      result = compare(series, { ...options, criterion: criterion as CompareCriterion | undefined })
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    const text =
      output.format === 'json'
        ? `${JSON.stringify(result)}\n`
        : output.format === 'html'
          ? renderComparisonHtml(
              result.assessments.map((assessment, i) => ({
                assessment,
                options: { info: { fileName: files[i].split(/[\\/]/).pop() } },
              })),
              { units: output.units, ranking: result },
            )
          : comparisonText(result)
    await writeReportOutput(io, output, text)
    return 0
  },
}
