import { parseArgs } from 'node:util'
import { BatchLogError } from '../../analysis/energy/batch-log.ts'
import {
  analyzeEnergyLog,
  type EnergyChartAssessment,
  type EnergyChartOptions,
} from '../../analysis/energy/energy-chart.ts'
import { FUEL_IDS, type FuelId } from '../../drying/method.ts'
import { productById } from '../../product/catalogue.ts'
import { renderEnergyCsv } from '../../report/energy/energy-csv.ts'
import { renderEnergyHtml } from '../../report/energy/energy-html.ts'
import { rulesByPoint } from '../../report/energy/energy-tables.ts'
import { WEATHER_OPTION_SPECS } from '../../weather/option-spec.ts'
import { readWeatherBytes } from '../../weather/read-weather.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import { type CliCommand, numberOption, UsageError } from '../command.ts'
import { WEATHER_FLAGS_HELP, WEATHER_PARSE_OPTIONS, weatherOptionsFromCli } from '../weather-flags.ts'

const help = `dryhours energy-chart: is the heated dryer using more energy than it should?

Usage:
  dryhours energy-chart <log.csv> [--weather <file>] [--baseline <n>] [--json | --format text|json|html|csv]
                        [--out <file>] [options]

Reads a batch log (one row per batch) and charts the fuel heat per kg of water removed: individuals and
moving-range charts with limits from the first <n> batches (phase I) and the Western Electric run rules,
an EWMA chart, and the same charts on what is left after a regression on outside humidity ratio,
outside temperature and load. Prints the findings; --format html writes a page with the charts.

Log columns (header row; units in the names):
  start (ISO 8601 date-time), duration_h, fresh_mass_kg, and final_mass_kg or both
  initial_moisture_wb_pct and final_moisture_wb_pct, and energy_kwh or fuel_amount + fuel_unit
  (L, gal, m3, ft3, kg, lb, t, kWh, MJ, GJ) + fuel; optional batch_id, drying_temp_c,
  ambient_temp_c, ambient_rh_pct, ambient_pressure_kpa. Lines starting with # are comments.

Options:
  --weather <file>     hourly weather (CSV or EPW) for batches without ambient columns
  --baseline <n>       batches in the baseline (default: min(20, half the batches), at least 5)
  --fuel <id>          fuel of rows without a fuel column: ${FUEL_IDS.join(', ')}
  --drying-temp <°C>   drying-air temperature for the latent heat (default 60 °C; a row's drying_temp_c wins)
  --product <id>       add the product's heat of sorption (from its isotherm) to the ideal heat
  --utc-offset=<h>     offset of the log's (and the weather file's) local times from UTC, e.g. --utc-offset=-6
                       (a start time with its own offset, 2026-09-08T09:00-06:00, needs none)
  --elevation <m>      site elevation for the air pressure (default: the weather file's, else sea level)
  With --weather, every weather option below applies to that file.
  --json               the full assessment as JSON (same as --format json)
  --format <f>         text (default), json, html or csv; --table <id> picks one CSV table
                       (batches, limits, regression, rejected-rows)
  --out <file>         write to a file instead of standard output

${WEATHER_FLAGS_HELP}

Example (invented demo data):
  dryhours energy-chart climate-demo/energy/quillow-dryer-batches-2026.csv --format html --out energy.html

Safety: a rise in energy per kg of water can be a fault that is also a hazard (cracked heat exchanger,
blocked flue); combustion heaters put CO in the air; gas and electrical work by licensed trades.`

/** Two decimals without a negative zero. */
const f2 = (x: number) => (Number(x.toFixed(2)) === 0 ? '0.00' : x.toFixed(2))

/** The readable summary printed by default. */
export function energyChartText(a: EnergyChartAssessment): string {
  const out: string[] = [...a.summary, '']
  if (a.warnings.length > 0) out.push('Warnings:', ...a.warnings.map((w) => `  - ${w}`), '')
  const acc = a.accounting
  out.push(`Rows: ${acc.rowsRead} read, ${acc.rowsUsed} used, ${acc.rowsRejected} rejected`)
  for (const r of a.rejections) out.push(`  ${r.message}`)
  out.push('')
  const lim = (name: string, s: EnergyChartAssessment['raw']) =>
    `${name.padEnd(34)} centre ${f2(s.individuals.centerLine)}  σ̂ ${s.individuals.sigma.toFixed(3)}  limits ${f2(s.individuals.lowerControlLimit)} … ${f2(s.individuals.upperControlLimit)}  MR̄ ${s.individuals.meanMovingRange.toFixed(3)}  MR UCL ${s.individuals.movingRangeUpperLimit.toFixed(3)}`
  out.push('Control limits from the baseline [MJ/kg water]:')
  out.push(`  ${lim('specific energy', a.raw)}`)
  if (a.adjusted) out.push(`  ${lim('residual after weather and load', a.adjusted)}`)
  if (a.adjusted) {
    const r = a.adjusted.regression
    out.push(
      '',
      `Regression over the baseline (R² ${r.rSquared.toFixed(3)}, s ${r.residualStandardError.toFixed(3)} MJ/kg, ${r.observations} batches):`,
    )
    for (const c of r.coefficients) {
      out.push(
        `  ${c.name.padEnd(28)} ${c.estimate.toFixed(4).padStart(9)} ± ${c.standardError.toFixed(4)} (t ${c.tStatistic === null ? '–' : c.tStatistic.toFixed(1)})`,
      )
    }
  }
  out.push(
    '',
    'batch          start                  phase   MJ/kg  eff %  T °C  RH %  W g/kg  signals (raw | adjusted; ↑ more energy, ↓ less)',
  )
  const raw = rulesByPoint(a.raw)
  const adj = a.adjusted ? rulesByPoint(a.adjusted) : []
  const adjByBatch = new Map<number, number>()
  a.adjusted?.batchIndices.forEach((b, i) => {
    adjByBatch.set(b, i)
  })
  for (const b of a.batches) {
    const ai = adjByBatch.get(b.index)
    const signals = `${raw[b.index].join(' ') || '–'} | ${ai === undefined ? '–' : adj[ai].join(' ') || '–'}`
    const amb = b.ambient
    out.push(
      `${b.batchId.slice(0, 14).padEnd(14)} ${b.startText.slice(0, 22).padEnd(22)} ${(b.index < a.baselineCount ? 'base' : 'mon').padEnd(6)} ${f2(b.specificEnergyMjPerKg).padStart(6)} ${b.thermalEfficiencyPct.toFixed(1).padStart(6)} ${amb ? amb.dryBulbC.toFixed(1).padStart(5) : '    –'} ${amb ? amb.relativeHumidityPct.toFixed(0).padStart(5) : '    –'} ${amb ? amb.humidityRatioGPerKg.toFixed(2).padStart(7) : '      –'}  ${signals}`,
    )
  }
  if (a.assumptions.length > 0) out.push('', 'Assumptions:', ...a.assumptions.map((s) => `  - ${s}`))
  return `${out.join('\n')}\n`
}

export const energyChartCommand: CliCommand = {
  name: 'energy-chart',
  summary: 'control charts of a heated dryer’s energy per kg of water, adjusted for weather and load',
  help,
  async run(args, io) {
    let parsed: ReturnType<typeof parseArgs>
    try {
      parsed = parseArgs({
        args,
        options: {
          weather: { type: 'string' },
          baseline: { type: 'string' },
          fuel: { type: 'string' },
          'drying-temp': { type: 'string' },
          product: { type: 'string' },
          ...WEATHER_PARSE_OPTIONS,
          json: { type: 'boolean' },
          format: { type: 'string' },
          table: { type: 'string' },
          out: { type: 'string' },
        },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const values = parsed.values as Record<string, string | string[] | boolean | undefined>
    const str = (k: string) => values[k] as string | undefined
    if (parsed.positionals.length !== 1)
      throw new UsageError('give exactly one batch log file (dryhours energy-chart <log.csv>)')
    const logFile = parsed.positionals[0]
    const format = values.json ? 'json' : (str('format') ?? 'text')
    if (!['text', 'json', 'html', 'csv'].includes(format)) {
      throw new UsageError(`--format must be text, json, html or csv, got '${format}'`)
    }
    if (values.json && str('format') !== undefined && str('format') !== 'json') {
      throw new UsageError('give either --json or --format, not both')
    }
    const fuel = str('fuel')
    if (fuel !== undefined && !(FUEL_IDS as readonly string[]).includes(fuel)) {
      throw new UsageError(`--fuel must be one of ${FUEL_IDS.join(', ')}, got '${fuel}'`)
    }
    const baseline = numberOption('baseline', str('baseline'))
    const utcOffsetHours = numberOption('utc-offset', str('utc-offset'))
    const options: EnergyChartOptions = {
      baselineCount: baseline,
      fuel: fuel as FuelId | undefined,
      dryingTempC: numberOption('drying-temp', str('drying-temp')),
      utcOffsetHours,
      elevationM: numberOption('elevation', str('elevation')),
    }
    try {
      if (str('product') !== undefined) options.profile = productById(str('product') as string)
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const weatherFile = str('weather')
    const weatherOptions = weatherOptionsFromCli(values)
    if (weatherFile !== undefined) {
      try {
        options.weather = readWeatherBytes(await io.readFile(weatherFile), weatherOptions).series
      } catch (e) {
        if (e instanceof WeatherInputError || e instanceof RangeError)
          throw new UsageError(`${weatherFile}: ${e.message}`)
        throw e
      }
    } else {
      const fileOnly = WEATHER_OPTION_SPECS.filter(
        (s) => values[s.flag] !== undefined && s.flag !== 'utc-offset' && s.flag !== 'elevation',
      )
      if (fileOnly.length > 0)
        throw new UsageError(
          `${fileOnly.map((s) => `--${s.flag}`).join(', ')} appl${fileOnly.length === 1 ? 'ies' : 'y'} to the weather file: give --weather, or --utc-offset for the log`,
        )
    }
    const text = new TextDecoder('utf-8').decode(await io.readFile(logFile))
    let a: EnergyChartAssessment
    try {
      a = analyzeEnergyLog(text, options)
    } catch (e) {
      if (e instanceof BatchLogError || e instanceof RangeError)
        throw new UsageError(`${logFile}: ${e.message}`)
      throw e
    }
    let output: string
    try {
      output =
        format === 'json'
          ? `${JSON.stringify(a)}\n`
          : format === 'html'
            ? renderEnergyHtml(a, { logName: logFile.split(/[\\/]/).pop() })
            : format === 'csv'
              ? renderEnergyCsv(a, str('table'))
              : energyChartText(a)
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(`--table: ${e.message}`)
      throw e
    }
    const outFile = str('out')
    if (outFile !== undefined) {
      await io.writeFile(outFile, output)
      io.stderr(`wrote ${outFile}\n`)
    } else io.stdout(output)
    return 0
  },
}
