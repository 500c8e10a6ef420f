/**
 * @module web/form-input
 * The page's form (multipart/form-data or urlencoded) → validated inputs for the weather reader and the
 * assessment. Every field is optional except a weather file (or demo id) and a product; a bad value gives
 * a RangeError naming the form field, the value and what is accepted.
 */
import type { AssessOptions } from '../analysis/assess.ts'
import { ASSESS_RANGES } from '../analysis/plan.ts'
import { DRYING_METHOD_KINDS, FUEL_IDS, type FuelId } from '../drying/method.ts'
import { productById } from '../product/catalogue.ts'
import type { ProductProfile } from '../product/profile.ts'
import { parseUserProfile } from '../product/profile-schema.ts'
import type { UnitSystem } from '../report/display-units.ts'
import {
  checkWeatherOptions,
  WeatherOptionError,
  WeatherOptionsInvalid,
  weatherOptionsFromTexts,
} from '../weather/option-texts.ts'

/** Most weather files one comparison takes, unless the server says otherwise (the API's `maxSites`). */
export const MAX_SITES = 8

/** The drying methods the form offers: every method of the registry (drying/methods/). */
export const METHOD_KINDS = DRYING_METHOD_KINDS
export const RESULT_FORMATS = ['page', 'html', 'csv', 'json', 'bundle'] as const
export type ResultFormat = (typeof RESULT_FORMATS)[number]

export interface WeatherFile {
  name: string
  bytes: Uint8Array
}

export interface FormInput {
  files: WeatherFile[]
  /** Demo site file name chosen instead of (or beside) uploads. */
  demo: string | null
  weatherOptions: Record<string, unknown>
  product: ProductProfile
  assess: Omit<AssessOptions, 'product' | 'onProgress'>
  units: UnitSystem
  format: ResultFormat
}

type FormValue = string | File

function text(form: FormData, name: string): string | undefined {
  const v = form.get(name) as FormValue | null
  if (v === null || typeof v !== 'string') return undefined
  const t = v.trim()
  return t === '' ? undefined : t
}

function numberField(form: FormData, name: string, lo: number, hi: number, unit: string): number | undefined {
  const t = text(form, name)
  if (t === undefined) return undefined
  const n = Number(t.replace(',', '.'))
  if (!(Number.isFinite(n) && n >= lo && n <= hi)) {
    throw new RangeError(`${name}: must be a number from ${lo} to ${hi} ${unit}, got ${JSON.stringify(t)}`)
  }
  return n
}

/**
 * A list of numbers (e.g. airflows "0.5 1 2"): separated by spaces or semicolons, or by commas when the numbers
 * use decimal points; decimal commas are read as points otherwise.
 */
function numberListField(
  form: FormData,
  name: string,
  lo: number,
  hi: number,
  unit: string,
): number[] | undefined {
  const t = text(form, name)
  if (t === undefined) return undefined
  const parts = t.split(t.includes('.') ? /[;,\s]+/ : /[;\s]+/).filter((p) => p !== '')
  return parts.map((p) => {
    const n = Number(p.replace(',', '.'))
    if (!(Number.isFinite(n) && n >= lo && n <= hi)) {
      throw new RangeError(
        `${name}: each value must be a number from ${lo} to ${hi} ${unit}, got ${JSON.stringify(p)}`,
      )
    }
    return n
  })
}

function choice<T extends string>(form: FormData, name: string, options: readonly T[], fallback: T): T {
  const t = text(form, name)
  if (t === undefined) return fallback
  if (!(options as readonly string[]).includes(t)) {
    throw new RangeError(`${name}: must be one of ${options.join(', ')}, got ${JSON.stringify(t)}`)
  }
  return t as T
}

function monthDay(form: FormData, name: string): string | undefined {
  const t = text(form, name)
  if (t === undefined) return undefined
  if (!/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/.test(t)) {
    throw new RangeError(`${name}: must be a day as MM-DD (e.g. 06-15), got ${JSON.stringify(t)}`)
  }
  return t
}

async function fileParts(form: FormData, name: string): Promise<WeatherFile[]> {
  const out: WeatherFile[] = []
  for (const v of form.getAll(name) as FormValue[]) {
    if (typeof v === 'string') continue
    if (v.size === 0 && v.name === '') continue
    out.push({ name: v.name || 'upload', bytes: new Uint8Array(await v.arrayBuffer()) })
  }
  return out
}

/**
 * Parse the page form. `demoIds` are the demo file names the server can supply (none on a bare app);
 * `maxSites` is the server's limit of files per comparison.
 */
export async function parseForm(
  form: FormData,
  demoIds: readonly string[] = [],
  maxSites = MAX_SITES,
): Promise<FormInput> {
  const files = await fileParts(form, 'file')
  const demoRaw = text(form, 'demo')
  const demo = demoRaw && demoIds.includes(demoRaw) ? demoRaw : null
  if (demoRaw && !demo) {
    throw new RangeError(
      `demo: unknown demo file ${JSON.stringify(demoRaw)}${demoIds.length ? `; choose one of ${demoIds.join(', ')}` : ' (this server offers no demo files)'}`,
    )
  }
  if (files.length === 0 && !demo)
    throw new RangeError('file: choose a weather file (CSV or EPW) to upload, or a demo site')
  if (files.length + (demo ? 1 : 0) > maxSites) {
    throw new RangeError(
      `file: at most ${maxSites} weather files can be compared at once, got ${files.length + (demo ? 1 : 0)}`,
    )
  }

  // The weather options: the same table (and reading) as the CLI flags and the API parameters;
  // a bad value names the field by its label.
  let weatherOptions: Record<string, unknown>
  try {
    weatherOptions = checkWeatherOptions(
      weatherOptionsFromTexts((s) => {
        const t = text(form, s.param)
        return t === undefined ? undefined : [t]
      }, 'form'),
      'form',
    ) as Record<string, unknown>
  } catch (e) {
    if (e instanceof WeatherOptionError || e instanceof WeatherOptionsInvalid) throw new RangeError(e.message)
    throw e
  }

  let product: ProductProfile
  const profileFiles = (form.getAll('profile') as FormValue[]).filter(
    (v): v is File => typeof v !== 'string' && v.size > 0,
  )
  if (profileFiles.length > 0) {
    let json: unknown
    try {
      json = JSON.parse(await profileFiles[0].text())
    } catch (e) {
      throw new RangeError(
        `profile: the uploaded product profile is not valid JSON (${(e as Error).message})`,
      )
    }
    try {
      product = parseUserProfile(json)
    } catch (e) {
      throw new RangeError(`profile: ${(e as Error).message}`)
    }
  } else {
    const id = text(form, 'product')
    if (id === undefined)
      throw new RangeError('product: choose a product from the catalogue or upload a profile')
    try {
      product = productById(id)
    } catch (e) {
      throw new RangeError(`product: ${(e as Error).message}`)
    }
  }

  const kind = choice(form, 'method', METHOD_KINDS, 'open-air')
  const method: Record<string, unknown> = { kind }
  const loading = numberField(form, 'loadingKgPerM2', 0.1, 200, 'kg/m²')
  if (loading !== undefined && (kind === 'open-air' || kind === 'shade' || kind === 'tunnel'))
    method.loadingKgPerM2 = loading
  const area = numberField(form, 'collectorAreaM2PerTonne', 1, 10_000, 'm²/t')
  if (area !== undefined && kind === 'solar-cabinet') method.collectorAreaM2PerTonne = area
  const setPoint = numberField(form, 'setPointC', 0, 120, '°C')
  if (setPoint !== undefined && kind === 'heated') method.setPointC = setPoint
  if (kind === 'natural-air-bin') {
    const airflows = numberListField(form, 'binAirflows', 0.01, 50, 'm³/min per t')
    if (airflows !== undefined) method.airflowsM3PerMinPerTonne = airflows
    const depth = numberField(form, 'binDepthM', 0.1, 30, 'm')
    if (depth !== undefined) method.depthM = depth
    const diameter = numberField(form, 'binDiameterM', 0.5, 50, 'm')
    if (diameter !== undefined) method.binDiameterM = diameter
    const rise = numberField(form, 'heatRiseK', 0, 30, 'K')
    if (rise !== undefined) method.heatRiseK = rise
  }
  const efficiency = numberField(form, 'heaterEfficiencyPct', 1, 100, '%')
  const fuel =
    text(form, 'fuel') === undefined ? undefined : choice<FuelId>(form, 'fuel', FUEL_IDS, 'propane')
  if (kind === 'heated') {
    if (efficiency !== undefined) method.heaterEfficiency = efficiency / 100
    if (fuel !== undefined) method.fuel = fuel
  }
  const assess: FormInput['assess'] = { method: method as AssessOptions['method'] }
  const target = numberField(form, 'targetWbPct', ...ASSESS_RANGES.targetWbPct, '% wet basis')
  if (target !== undefined) assess.targetWbPct = target
  const initial = numberField(form, 'initialWbPct', ...ASSESS_RANGES.initialWbPct, '% wet basis')
  if (initial !== undefined) assess.initialWbPct = initial
  const seasonStart = monthDay(form, 'seasonStart')
  const seasonEnd = monthDay(form, 'seasonEnd')
  if (seasonStart !== undefined) assess.seasonStart = seasonStart
  if (seasonEnd !== undefined) assess.seasonEnd = seasonEnd
  const deadline = numberField(form, 'deadlineDays', ...ASSESS_RANGES.deadlineDays, 'days')
  if (deadline !== undefined) assess.deadlineDays = deadline
  if (fuel !== undefined) assess.fuel = fuel
  if (kind !== 'heated' && efficiency !== undefined)
    assess.backupHeater = { heaterEfficiency: efficiency / 100 }
  const price = numberField(form, 'fuelPrice', 0, 1e6, 'per fuel unit')
  if (price !== undefined) assess.fuelPrices = { [fuel ?? 'propane']: price }

  return {
    files,
    demo,
    weatherOptions,
    product,
    assess,
    units: choice<UnitSystem>(form, 'units', ['si', 'us'], 'si'),
    format: choice(form, 'format', RESULT_FORMATS, 'page'),
  }
}
