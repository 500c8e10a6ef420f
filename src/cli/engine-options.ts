/**
 * @module cli/engine-options
 * The engine's options as CLI flags, shared by `assess` and `compare`: product, method(s) and their
 * parameters, season and batches, thresholds, heat, fuel, prices and currency; reading a weather file with
 * the weather flags; the progress printer.
 */
import type { AssessOptions, AssessProgress } from '../analysis/assess.ts'
import type { MethodList } from '../analysis/compare-methods.ts'
import { ASSESS_DEFAULTS } from '../analysis/plan.ts'
import { DRYING_METHOD_KINDS, FUEL_IDS, type FuelId } from '../drying/method.ts'
import { methodModel } from '../drying/methods/index.ts'
import { productById } from '../product/catalogue.ts'
import type { ProductProfile } from '../product/profile.ts'
import { parseUserProfile } from '../product/profile-schema.ts'
import type { WeatherReadOptions } from '../weather/options.ts'
import { readWeatherBytes } from '../weather/read-weather.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import { WeatherInputError } from '../weather/weather-input-error.ts'
import { BIN_FLAGS_HELP, BIN_PARSE_OPTIONS, setBinOptions } from './bin.ts'
import { type CliIo, numberOption, UsageError } from './command.ts'
import { WEATHER_FLAGS_HELP, WEATHER_PARSE_OPTIONS, weatherOptionsFromCli } from './weather-flags.ts'

export const ENGINE_OPTIONS_HELP = `Product and method:
  --product <id|file.json>  catalogue id (dryhours products) or a profile JSON file
  --method <kind>[,<kind>…]  ${DRYING_METHOD_KINDS.join(' | ')}; several separated by commas, or all,
                            to compare methods side by side (assess only)
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
  greenhouse:     --loading <kg/m²>; --param lengthM=, widthM=, trayAreaM2=, ventShareOfFloor= (or ventAreaM2=),
                  airChangesPerHour=, cover=polyethylene|glass, nightPractice=open|closed
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
  --currency <code>  the currency of your prices (e.g. EUR, US$), shown with every cost
${WEATHER_FLAGS_HELP}
  --quiet  no progress on stderr`

export const ENGINE_PARSE_OPTIONS = {
  product: { type: 'string' },
  method: { type: 'string' },
  'target-wb': { type: 'string' },
  'initial-wb': { type: 'string' },
  thickness: { type: 'string' },
  'storage-temp': { type: 'string' },
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
  currency: { type: 'string' },
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
 * `--param name=value` into the methods that have that parameter (drying/methods/<kind>.ts), so a method
 * needs no flags of its own here. Values: true/false, a number, or text. A name no method has is refused.
 */
function setMethodParams(methods: Record<string, unknown>[], params: string[]): void {
  const namesOf = (m: Record<string, unknown>) =>
    Object.keys(methodModel(String(m.kind)).schema.shape as Record<string, unknown>).filter(
      (k) => k !== 'kind',
    )
  for (const p of params) {
    const m = /^([A-Za-z][A-Za-z0-9]*)=(.*)$/.exec(p)
    if (!m) throw new UsageError(`--param must be <name>=<value>, got '${p}'`)
    const takers = methods.filter((method) => namesOf(method).includes(m[1]))
    if (takers.length === 0) {
      throw new UsageError(
        methods.length === 1
          ? `--param ${m[1]}: not a parameter of ${methods[0].kind}; its parameters are ${namesOf(methods[0]).join(', ')}`
          : `--param ${m[1]}: not a parameter of ${methods.map((x) => x.kind).join(' or ')}; ${methods.map((x) => `${x.kind} takes ${namesOf(x).join(', ')}`).join('; ')}`,
      )
    }
    const text = m[2]
    const value =
      text === 'true'
        ? true
        : text === 'false'
          ? false
          : /^[-+0-9.]/.test(text)
            ? numberOption(`param ${m[1]}`, text)
            : text
    for (const method of takers) method[m[1]] = value
  }
}

/** The kinds given with `--method`: one, a comma-separated list, or `all`. */
export function methodKinds(values: EngineValues): string[] | 'all' {
  const text = values.method as string | undefined
  if (text === undefined)
    throw new UsageError(`--method is required: ${DRYING_METHOD_KINDS.join(', ')} (several: a,b or all)`)
  if (text.trim() === 'all') return 'all'
  const kinds = text.split(',').map((k) => k.trim())
  for (const kind of kinds) {
    if (!(DRYING_METHOD_KINDS as readonly string[]).includes(kind)) {
      throw new UsageError(
        `--method must be one of ${DRYING_METHOD_KINDS.join(', ')} (several separated by commas, or all), got '${kind}'`,
      )
    }
  }
  const twice = kinds.find((k, i) => kinds.indexOf(k) !== i)
  if (twice !== undefined) throw new UsageError(`--method lists ${twice} twice`)
  return kinds
}

/** One method with the parameters its flags set (the method-specific flags go to their own kind). */
function methodFromFlags(kind: string, values: EngineValues): Record<string, unknown> {
  const num = (k: string): number | undefined => numberOption(k, values[k] as string | undefined)
  const method: Record<string, unknown> = { kind }
  const set = (key: string, v: unknown): void => {
    if (v !== undefined) method[key] = v
  }
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
  } else if (kind === 'greenhouse') {
    set('loadingKgPerM2', num('loading'))
  } else if (kind === 'heated') {
    set('setPointC', num('set-point'))
    set('targetRhPct', num('target-rh'))
    set('airFlowKgPerSPerTonne', num('air-flow'))
    set('heaterEfficiency', num('efficiency'))
    set('fuel', values.fuel)
  }
  return method
}

/**
 * The methods of `--method` with their flags and `--param`s. A `--param` goes to every listed method that
 * has that parameter; one that none of them has is refused. The bin flags go to natural-air-bin and are
 * refused when it is not among the methods (`product`: its bushel weight converts cfm per bushel).
 */
export function methodsFromFlags(values: EngineValues, product: ProductProfile): Record<string, unknown>[] {
  const kinds = methodKinds(values)
  const list = (kinds === 'all' ? [...DRYING_METHOD_KINDS] : kinds).map((k) => methodFromFlags(k, values))
  const bin = list.find((m) => m.kind === 'natural-air-bin')
  // with another method only, setBinOptions refuses the bin flags, naming the first given
  setBinOptions(bin ?? list[0], values, product)
  setMethodParams(list, (values.param as string[] | undefined) ?? [])
  return list
}

/** `--method` as the engine's method list: every method (`all`, with their flags), or the methods listed. */
export function methodListFromFlags(values: EngineValues, product: ProductProfile): MethodList {
  const methods = methodsFromFlags(values, product) as AssessOptions['method'][]
  return methodKinds(values) === 'all' ? { all: methods } : methods
}

/** Build the assess options from parsed CLI values (the first method, season, heat, prices). */
export async function engineOptions(values: EngineValues, io: CliIo): Promise<AssessOptions> {
  const str = (k: string): string | undefined => values[k] as string | undefined
  const num = (k: string): number | undefined => numberOption(k, str(k))
  const fuel = str('fuel') as FuelId | undefined
  if (fuel !== undefined && !(FUEL_IDS as readonly string[]).includes(fuel)) {
    throw new UsageError(`--fuel must be one of ${FUEL_IDS.join(', ')}, got '${fuel}'`)
  }
  methodKinds(values) // --method is checked before the product is read
  let product: ProductProfile
  try {
    product = await loadProduct(str('product'), io)
  } catch (e) {
    if (e instanceof RangeError) throw new UsageError(e.message)
    throw e
  }
  const methods = methodsFromFlags(values, product)
  const method = methods[0]
  const backupHeater: Record<string, unknown> = {}
  if (methods.some((m) => m.kind !== 'heated')) {
    if (num('efficiency') !== undefined) backupHeater.heaterEfficiency = num('efficiency')
    if (fuel !== undefined) backupHeater.fuel = fuel
    if (num('target-rh') !== undefined) backupHeater.targetRhPct = num('target-rh')
    if (num('set-point') !== undefined) backupHeater.setPointC = num('set-point')
  }

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
    initialWbPct: num('initial-wb'),
    thicknessMm: num('thickness'),
    storageTempC: num('storage-temp'),
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
    currency: str('currency'),
  }
}

/** A weather file read through io with the given reader options; problems name the file. */
export async function readSeriesWith(
  file: string,
  options: WeatherReadOptions,
  io: CliIo,
  label = file,
): Promise<WeatherReadResult> {
  const bytes = await io.readFile(file)
  try {
    const read = readWeatherBytes(bytes, options)
    if (read.series.site.name.trim() === '') read.series.site.name = file.split(/[\\/]/).pop() ?? file
    return read
  } catch (e) {
    if (e instanceof WeatherInputError || e instanceof RangeError)
      throw new UsageError(`${label}: ${e.message}`)
    throw e
  }
}

/** Read a weather file through io with the CLI's weather flags. */
export async function readSeries(file: string, values: EngineValues, io: CliIo): Promise<WeatherReadResult> {
  return readSeriesWith(file, weatherOptionsFromCli(values), io)
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
