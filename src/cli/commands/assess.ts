import { parseArgs } from 'node:util'
import { type AssessOptions, type AssessProgress, assess } from '../../analysis/assess.ts'
import type { Assessment } from '../../analysis/assessment.ts'
import { ASSESS_DEFAULTS } from '../../analysis/plan.ts'
import { DRYING_METHOD_KINDS, FUEL_IDS, type FuelId } from '../../drying/method.ts'
import { methodModel } from '../../drying/methods/index.ts'
import { productById } from '../../product/catalogue.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { parseUserProfile } from '../../product/profile-schema.ts'
import { assessmentText } from '../../report/assessment-text.ts'
import { renderReportCsv } from '../../report/report-csv.ts'
import { renderReportHtml } from '../../report/report-html.ts'
import { readWeatherBytes } from '../../weather/read-weather.ts'
import type { HourlySeries } from '../../weather/series.ts'
import { WeatherInputError } from '../../weather/weather-input-error.ts'
import { BIN_FLAGS_HELP, BIN_PARSE_OPTIONS, setBinOptions } from '../bin.ts'
import { type CliCommand, type CliIo, numberOption, UsageError } from '../command.ts'
import {
  REPORT_OUTPUT_HELP,
  REPORT_OUTPUT_OPTIONS,
  type ReportOutputChoice,
  reportOutputChoice,
  writeReportOutput,
} from '../report-output.ts'
import { WEATHER_FLAGS_HELP, WEATHER_PARSE_OPTIONS, weatherOptionsFromCli } from '../weather-flags.ts'

export const ENGINE_OPTIONS_HELP = `Product and method:
  --product <id|file.json>  catalogue id (dryhours products) or a profile JSON file
  --method <kind>           ${DRYING_METHOD_KINDS.join(' | ')}
  --target-wb <%>  --initial-wb <%>  --thickness <mm>
  --storage-temp <°C>  store temperature at which the dried product's water activity is judged (default 25);
                 without --target-wb the target is the moisture of the product's safe water activity there
  open-air:       --absorptivity <0–1> --loading <kg/m²> --uncovered-night --uncovered-rain
  shade:          --loading <kg/m²>
  solar-cabinet:  --collector-area <m²/t> --tilt <°> --azimuth <° from N> --air-flow <kg/s per m²>
  tunnel:         --loading <kg/m²> --air-flow <kg/s at full flow>; --param collectorLengthM=, dryingLengthM=, widthM=,
                  fans=pv|constant, nightPractice=closed|open, cover=polyethylene|glass
  heated:         --set-point <°C> | --target-rh <%>; --air-flow <kg/s per t> --efficiency <0–1> --fuel <id>
${BIN_FLAGS_HELP}
  any method:     --param <name>=<value> (repeatable) sets any parameter of the method by the name of the
                  API's JSON options (e.g. --param surfaceAreaPerTrayArea=1.2); docs/model.md §4 lists them
Season and batches:
  --start <MM-DD> --end <MM-DD>  start dates (default the whole year, every ${ASSESS_DEFAULTS.stepDaysWholeYear} days;
                 every ${ASSESS_DEFAULTS.stepDaysWithSeason} day when a season is given)
  --step-days <n>  --start-hour <0–23> (default ${ASSESS_DEFAULTS.startHourLocal})
  --deadline-days <n> (default ${ASSESS_DEFAULTS.deadlineDays})
  --max-days <n> (default ${ASSESS_DEFAULTS.maxDays}, or the deadline when longer)
  --batch-kg <kg> (default ${ASSESS_DEFAULTS.batchKgFresh})
Usable-hour thresholds (stated in the assumptions):
  --min-temp <°C> (default 5; use 0 or lower for grain)  --min-deficit <g/kg> (default 0.2)
  --rain-mm <mm/h> (default 0.2)  --night-cooling <K> (default 2)
Heat and fuel:
  --fuel <${FUEL_IDS.join('|')}>  --price <fuel>=<price per unit> (repeatable; defaults are examples)
${WEATHER_FLAGS_HELP}
  --quiet  no progress on stderr`

const help = `dryhours assess: can this site's weather dry this product, when, how fast, with how much heat

Usage:
  dryhours assess <file> --product <id|profile.json> --method <kind> [options]
                  [--json | --format text|json|html|csv] [--units si|us] [--out <file>]

Prints the usable drying hours per month (median and the P10–P90 range across years), the best
start windows, a start-date table and the supplemental heat and fuel; --json prints the full
assessment (monthly, hourOfDay, startDates, heat, assumptions, warnings, coverage).

${ENGINE_OPTIONS_HELP}

${REPORT_OUTPUT_HELP}

Safety: dried food must reach a safe water activity; combustion heaters put CO and combustion
products in the air (prefer indirect heaters for food); gas and electrical work by licensed trades.`

export const ENGINE_PARSE_OPTIONS = {
  product: { type: 'string' },
  method: { type: 'string' },
  'target-wb': { type: 'string' },
  'storage-temp': { type: 'string' },
  'initial-wb': { type: 'string' },
  thickness: { type: 'string' },
  absorptivity: { type: 'string' },
  loading: { type: 'string' },
  'uncovered-night': { type: 'boolean' },
  'uncovered-rain': { type: 'boolean' },
  'collector-area': { type: 'string' },
  tilt: { type: 'string' },
  azimuth: { type: 'string' },
  'air-flow': { type: 'string' },
  'set-point': { type: 'string' },
  'target-rh': { type: 'string' },
  efficiency: { type: 'string' },
  fuel: { type: 'string' },
  price: { type: 'string', multiple: true },
  param: { type: 'string', multiple: true },
  start: { type: 'string' },
  end: { type: 'string' },
  'step-days': { type: 'string' },
  'start-hour': { type: 'string' },
  'deadline-days': { type: 'string' },
  'max-days': { type: 'string' },
  'batch-kg': { type: 'string' },
  'min-temp': { type: 'string' },
  'min-deficit': { type: 'string' },
  'rain-mm': { type: 'string' },
  'night-cooling': { type: 'string' },
  ...BIN_PARSE_OPTIONS,
  ...WEATHER_PARSE_OPTIONS,
  json: { type: 'boolean' },
  quiet: { type: 'boolean' },
} as const

export type EngineValues = Record<string, string | string[] | boolean | undefined>

async function loadProduct(value: string | undefined, io: CliIo): Promise<ProductProfile> {
  if (value === undefined)
    throw new UsageError('--product <id|profile.json> is required (list: dryhours products)')
  if (!value.toLowerCase().endsWith('.json')) return productById(value)
  const bytes = await io.readFile(value)
  let json: unknown
  try {
    json = JSON.parse(new TextDecoder().decode(bytes))
  } catch (e) {
    throw new UsageError(`${value}: not valid JSON (${(e as Error).message})`)
  }
  return parseUserProfile(json)
}

/**
 * `--param name=value` into `method`: any parameter of the method's schema (drying/methods/<kind>.ts), so a
 * method needs no flags of its own here. Values: true/false, a number, or text. Unknown names are refused.
 */
function setMethodParams(method: Record<string, unknown>, params: string[]): void {
  const shape = methodModel(String(method.kind)).schema.shape as Record<string, unknown>
  const names = Object.keys(shape).filter((k) => k !== 'kind')
  for (const p of params) {
    const m = /^([A-Za-z][A-Za-z0-9]*)=(.*)$/.exec(p)
    if (!m) throw new UsageError(`--param must be <name>=<value>, got '${p}'`)
    if (!names.includes(m[1])) {
      throw new UsageError(
        `--param ${m[1]}: not a parameter of ${method.kind}; its parameters are ${names.join(', ')}`,
      )
    }
    const text = m[2]
    method[m[1]] =
      text === 'true'
        ? true
        : text === 'false'
          ? false
          : /^[-+0-9.]/.test(text)
            ? numberOption(`param ${m[1]}`, text)
            : text
  }
}

/** Build the assess options from parsed CLI values (method options, season, heat, prices). */
export async function engineOptions(values: EngineValues, io: CliIo): Promise<AssessOptions> {
  const str = (k: string): string | undefined => values[k] as string | undefined
  const num = (k: string): number | undefined => numberOption(k, str(k))
  const kind = str('method')
  if (kind === undefined) throw new UsageError(`--method is required: ${DRYING_METHOD_KINDS.join(', ')}`)
  if (!(DRYING_METHOD_KINDS as readonly string[]).includes(kind)) {
    throw new UsageError(`--method must be one of ${DRYING_METHOD_KINDS.join(', ')}, got '${kind}'`)
  }
  const product = await loadProduct(str('product'), io)
  const method: Record<string, unknown> = { kind }
  const set = (key: string, v: unknown): void => {
    if (v !== undefined) method[key] = v
  }
  const fuel = str('fuel') as FuelId | undefined
  if (fuel !== undefined && !(FUEL_IDS as readonly string[]).includes(fuel)) {
    throw new UsageError(`--fuel must be one of ${FUEL_IDS.join(', ')}, got '${fuel}'`)
  }
  const backupHeater: Record<string, unknown> = {}
  if (kind === 'open-air') {
    set('absorptivity', num('absorptivity'))
    set('loadingKgPerM2', num('loading'))
    if (values['uncovered-night']) method.coveredAtNight = false
    if (values['uncovered-rain']) method.coveredInRain = false
  } else if (kind === 'shade') {
    set('loadingKgPerM2', num('loading'))
  } else if (kind === 'solar-cabinet') {
    set('collectorAreaM2PerTonne', num('collector-area'))
    set('tiltDeg', num('tilt'))
    set('azimuthDeg', num('azimuth'))
    set('airFlowKgPerSPerM2', num('air-flow'))
  } else if (kind === 'tunnel') {
    set('loadingKgPerM2', num('loading'))
    set('airFlowKgPerS', num('air-flow'))
  } else if (kind === 'heated') {
    set('setPointC', num('set-point'))
    set('targetRhPct', num('target-rh'))
    set('airFlowKgPerSPerTonne', num('air-flow'))
    set('heaterEfficiency', num('efficiency'))
    set('fuel', fuel)
  }
  setBinOptions(method, values, product)
  if (kind !== 'heated') {
    if (num('efficiency') !== undefined) backupHeater.heaterEfficiency = num('efficiency')
    if (fuel !== undefined) backupHeater.fuel = fuel
    if (num('target-rh') !== undefined) backupHeater.targetRhPct = num('target-rh')
    if (num('set-point') !== undefined) backupHeater.setPointC = num('set-point')
  }
  setMethodParams(method, (values.param as string[] | undefined) ?? [])
  const fuelPrices: Partial<Record<FuelId, number>> = {}
  for (const p of (values.price as string[] | undefined) ?? []) {
    const m = /^([a-z-]+)=(.+)$/.exec(p)
    if (!m || !(FUEL_IDS as readonly string[]).includes(m[1])) {
      throw new UsageError(`--price must be <fuel>=<price>, fuel one of ${FUEL_IDS.join(', ')}; got '${p}'`)
    }
    const price = numberOption('price', m[2]) as number
    fuelPrices[m[1] as FuelId] = price
  }
  const thresholds: Record<string, number> = {}
  const setThreshold = (key: string, option: string): void => {
    const v = num(option)
    if (v !== undefined) thresholds[key] = v
  }
  setThreshold('minProductTempC', 'min-temp')
  setThreshold('minDeficitGPerKg', 'min-deficit')
  setThreshold('rainMm', 'rain-mm')
  setThreshold('nightSurfaceCoolingK', 'night-cooling')
  return {
    product,
    method: method as AssessOptions['method'],
    thresholds,
    targetWbPct: num('target-wb'),
    storageTempC: num('storage-temp'),
    initialWbPct: num('initial-wb'),
    thicknessMm: num('thickness'),
    seasonStart: str('start'),
    seasonEnd: str('end'),
    startStepDays: num('step-days'),
    startHourLocal: num('start-hour'),
    deadlineDays: num('deadline-days'),
    maxDays: num('max-days'),
    batchKgFresh: num('batch-kg'),
    backupHeater,
    fuel,
    fuelPrices,
  }
}

/** Read a weather file through io with the CLI's weather options. */
export async function readSeries(file: string, values: EngineValues, io: CliIo): Promise<HourlySeries> {
  const options = weatherOptionsFromCli(values)
  const bytes = await io.readFile(file)
  try {
    const series = readWeatherBytes(bytes, options).series
    if (series.site.name.trim() === '') series.site.name = file.split(/[\\/]/).pop() ?? file
    return series
  } catch (e) {
    if (e instanceof WeatherInputError || e instanceof RangeError)
      throw new UsageError(`${file}: ${e.message}`)
    throw e
  }
}

/** A progress printer for stderr: one line per stage step, at most every 10 %. */
export function progressPrinter(io: CliIo, label: string): (p: AssessProgress) => void {
  let lastStage = ''
  let lastTenth = -1
  return (p) => {
    const tenth = Math.floor((10 * p.done) / Math.max(1, p.total))
    if (p.stage === lastStage && tenth === lastTenth) return
    lastStage = p.stage
    lastTenth = tenth
    io.stderr(`${label}: ${p.stage} ${p.done}/${p.total}\n`)
  }
}

/** The assessment in the chosen format (html and csv: the report's renderings). */
function renderAssessment(a: Assessment, o: ReportOutputChoice, file: string): string {
  const info = { fileName: file.split(/[\\/]/).pop() }
  if (o.format === 'json') return `${JSON.stringify(a)}\n`
  if (o.format === 'html') return renderReportHtml(a, { units: o.units, info, optionSurface: 'cli' })
  if (o.format === 'csv') {
    try {
      return renderReportCsv(a, { units: o.units, info, table: o.table, optionSurface: 'cli' })
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(`--table: ${e.message}`)
      throw e
    }
  }
  return assessmentText(a, { units: o.units })
}

export const assessCommand: CliCommand = {
  name: 'assess',
  summary: 'usable drying hours, start-date table, batch times and supplemental heat for one site',
  help,
  async run(args, io) {
    let parsed: { values: EngineValues; positionals: string[] }
    try {
      parsed = parseArgs({
        args,
        options: { ...ENGINE_PARSE_OPTIONS, ...REPORT_OUTPUT_OPTIONS },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    if (parsed.positionals.length !== 1)
      throw new UsageError('give exactly one weather file: dryhours assess <file>')
    const file = parsed.positionals[0]
    const values = parsed.values
    const output = reportOutputChoice(values, ['text', 'json', 'html', 'csv'])
    let assessment: Assessment
    try {
      const options = await engineOptions(values, io)
      const series = await readSeries(file, values, io)
      if (!values.quiet) options.onProgress = progressPrinter(io, `assess ${file}`)
      assessment = assess(series, options)
    } catch (e) {
      if (e instanceof RangeError) throw new UsageError(e.message)
      throw e
    }
    await writeReportOutput(io, output, renderAssessment(assessment, output, file))
    return 0
  },
}
