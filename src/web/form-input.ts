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

/** A bad value in a named form field: the page names the field by its label and marks it. */
export class FormFieldError extends RangeError {
  override name = 'FormFieldError'
  constructor(
    readonly field: string,
    readonly detail: string,
  ) {
    super(`${field}: ${detail}`)
  }
}

/** The drying methods the form offers: every method of the registry (drying/methods/). */
export const METHOD_KINDS = DRYING_METHOD_KINDS
export const RESULT_FORMATS = ['page', 'handout', 'html', 'csv', 'json', 'bundle'] as const
export type ResultFormat = (typeof RESULT_FORMATS)[number]

export interface WeatherFile {
  name: string
  bytes: Uint8Array
}

/** One site of the sites table: its file and its own weather options (name, position, clocks). */
export interface SiteInput {
  /** Row number in the form (1-based), for messages. */
  row: number
  file: WeatherFile
  weatherOptions: Record<string, unknown>
}

export interface FormInput {
  /** assess: one file (or demo) by one or several methods; compare: the sites table. */
  task: 'assess' | 'compare'
  files: WeatherFile[]
  /** The sites of the sites table (task compare). */
  sites: SiteInput[]
  /** The methods chosen (task assess: one for the full report, several side by side). */
  methods: string[]
  /** Each chosen method with its fields, in the order of `methods`. */
  methodInputs: AssessOptions['method'][]
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

export function numberField(
  form: FormData,
  name: string,
  lo: number,
  hi: number,
  unit: string,
): number | undefined {
  const t = text(form, name)
  if (t === undefined) return undefined
  const n = Number(t.replace(',', '.'))
  if (!(Number.isFinite(n) && n >= lo && n <= hi)) {
    throw new FormFieldError(name, `must be a number from ${lo} to ${hi} ${unit}, got ${JSON.stringify(t)}`)
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
      throw new FormFieldError(
        name,
        `each value must be a number from ${lo} to ${hi} ${unit}, got ${JSON.stringify(p)}`,
      )
    }
    return n
  })
}

export function choice<T extends string>(
  form: FormData,
  name: string,
  options: readonly T[],
  fallback: T,
): T {
  const t = text(form, name)
  if (t === undefined) return fallback
  if (!(options as readonly string[]).includes(t)) {
    throw new FormFieldError(name, `must be one of ${options.join(', ')}, got ${JSON.stringify(t)}`)
  }
  return t as T
}

function monthDay(form: FormData, name: string): string | undefined {
  const t = text(form, name)
  if (t === undefined) return undefined
  if (!/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/.test(t)) {
    throw new FormFieldError(name, `must be a day as MM-DD (e.g. 06-15), got ${JSON.stringify(t)}`)
  }
  return t
}

export { text as formText }

export async function fileParts(form: FormData, name: string): Promise<WeatherFile[]> {
  const out: WeatherFile[] = []
  for (const v of form.getAll(name) as FormValue[]) {
    if (typeof v === 'string') continue
    if (v.size === 0 && v.name === '') continue
    out.push({ name: v.name || 'upload', bytes: new Uint8Array(await v.arrayBuffer()) })
  }
  return out
}

/** The weather options of the form's fields (`param` of each option, or `prefix` + param for a site row). */
export function weatherFormOptions(
  form: FormData,
  prefix = '',
  names: Record<string, string> = {},
): Record<string, unknown> {
  try {
    return checkWeatherOptions(
      weatherOptionsFromTexts((s) => {
        const t = text(form, `${prefix}${names[s.param] ?? s.param}`)
        return t === undefined ? undefined : [t]
      }, 'form'),
      'form',
    ) as Record<string, unknown>
  } catch (e) {
    if (e instanceof WeatherOptionError || e instanceof WeatherOptionsInvalid)
      throw new RangeError(prefix ? `Site ${prefix.slice(4, -1)}: ${e.message}` : e.message)
    throw e
  }
}

/** The product: an uploaded profile, else the catalogue choice. */
async function productOf(form: FormData): Promise<ProductProfile> {
  const profileFiles = (form.getAll('profile') as FormValue[]).filter(
    (v): v is File => typeof v !== 'string' && v.size > 0,
  )
  if (profileFiles.length > 0) {
    let json: unknown
    try {
      json = JSON.parse(await profileFiles[0].text())
    } catch (e) {
      throw new FormFieldError(
        'profile',
        `the uploaded product profile is not valid JSON (${(e as Error).message})`,
      )
    }
    try {
      return parseUserProfile(json)
    } catch (e) {
      throw new FormFieldError('profile', (e as Error).message)
    }
  }
  const id = text(form, 'product')
  if (id === undefined)
    throw new FormFieldError('product', 'choose a product from the catalogue or upload a profile')
  try {
    return productById(id)
  } catch (e) {
    throw new FormFieldError('product', (e as Error).message)
  }
}

/** The methods chosen (checkboxes on the assess form, one radio on the compare form), each with its fields. */
function methodsOf(form: FormData): { kinds: string[]; inputs: AssessOptions['method'][] } {
  const chosen = (form.getAll('method') as FormValue[]).filter((v): v is string => typeof v === 'string')
  const kinds = chosen.length > 0 ? [...new Set(chosen)] : ['open-air']
  for (const k of kinds)
    if (!(METHOD_KINDS as readonly string[]).includes(k))
      throw new FormFieldError(
        'method',
        `must be one of ${METHOD_KINDS.join(', ')}, got ${JSON.stringify(k)}`,
      )
  const loading = numberField(form, 'loadingKgPerM2', 0.1, 200, 'kg/m²')
  const area = numberField(form, 'collectorAreaM2PerTonne', 1, 10_000, 'm²/t')
  const setPoint = numberField(form, 'setPointC', 0, 120, '°C')
  const efficiency = numberField(form, 'heaterEfficiencyPct', 1, 100, '%')
  const fuel =
    text(form, 'fuel') === undefined ? undefined : choice<FuelId>(form, 'fuel', FUEL_IDS, 'propane')
  const bin = kinds.includes('natural-air-bin') ? binFields(form) : {}
  const inputs = kinds.map((kind) => {
    const method: Record<string, unknown> = { kind }
    if (
      loading !== undefined &&
      (kind === 'open-air' || kind === 'shade' || kind === 'tunnel' || kind === 'greenhouse')
    )
      method.loadingKgPerM2 = loading
    if (area !== undefined && kind === 'solar-cabinet') method.collectorAreaM2PerTonne = area
    if (setPoint !== undefined && kind === 'heated') method.setPointC = setPoint
    if (kind === 'heated') {
      if (efficiency !== undefined) method.heaterEfficiency = efficiency / 100
      if (fuel !== undefined) method.fuel = fuel
    }
    if (kind === 'natural-air-bin') Object.assign(method, bin)
    return method as AssessOptions['method']
  })
  return { kinds, inputs }
}

/** The natural-air bin's fields: the airflows to compare, the bin's depth and diameter, the heater's rise. */
function binFields(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  const airflows = numberListField(form, 'binAirflows', 0.01, 50, 'm³/min per t')
  if (airflows !== undefined) out.airflowsM3PerMinPerTonne = airflows
  const depth = numberField(form, 'binDepthM', 0.1, 30, 'm')
  if (depth !== undefined) out.depthM = depth
  const diameter = numberField(form, 'binDiameterM', 0.5, 50, 'm')
  if (diameter !== undefined) out.binDiameterM = diameter
  const rise = numberField(form, 'heatRiseK', 0, 30, 'K')
  if (rise !== undefined) out.heatRiseK = rise
  return out
}

/** The options every method shares: product moisture, season, deadline, the backup heater and prices. */
function sharedOptions(form: FormData): Omit<FormInput['assess'], 'method'> {
  const assess: Omit<FormInput['assess'], 'method'> = {}
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
  const fuel =
    text(form, 'fuel') === undefined ? undefined : choice<FuelId>(form, 'fuel', FUEL_IDS, 'propane')
  if (fuel !== undefined) assess.fuel = fuel
  const efficiency = numberField(form, 'heaterEfficiencyPct', 1, 100, '%')
  if (efficiency !== undefined) assess.backupHeater = { heaterEfficiency: efficiency / 100 }
  const price = numberField(form, 'fuelPrice', 0, 1e6, 'per fuel unit')
  if (price !== undefined) assess.fuelPrices = { [fuel ?? 'propane']: price }
  return assess
}

/** The fields of a site row and the weather option each one gives. */
const SITE_OPTION_PARAMS: Record<string, string> = { siteName: 'name' }

/** The sites table of the compare form: every row with a file; a row with values but no file is an error. */
async function sitesOf(form: FormData, maxSites: number): Promise<SiteInput[]> {
  const sites: SiteInput[] = []
  let rows = 0
  for (const key of form.keys()) {
    const m = /^site(\d{1,4})\.file$/.exec(key)
    if (m && (await fileParts(form, key)).length > 0) rows = Math.max(rows, Number(m[1]))
  }
  if (rows > maxSites)
    throw new FormFieldError(
      `site${rows}.file`,
      `at most ${maxSites} sites can be compared at once on this server`,
    )
  for (let i = 1; i <= maxSites; i++) {
    const prefix = `site${i}.`
    const files = await fileParts(form, `${prefix}file`)
    const filled = [...form.keys()].some(
      (k) => k.startsWith(prefix) && k !== `${prefix}file` && text(form, k) !== undefined,
    )
    if (files.length === 0) {
      if (filled)
        throw new FormFieldError(`${prefix}file`, 'choose this site’s weather file (or clear the row)')
      continue
    }
    sites.push({
      row: i,
      file: files[0],
      weatherOptions: weatherFormOptions(form, prefix, SITE_OPTION_PARAMS),
    })
  }
  if (sites.length < 2)
    throw new FormFieldError(
      'site1.file',
      `give at least two sites, each with its weather file (got ${sites.length})`,
    )
  return sites
}

/**
 * Parse the page form of the assess or compare task. `demoIds` are the demo file names the server can
 * supply (none on a bare app); `maxSites` is the server's limit of files per comparison.
 */
export async function parseForm(
  form: FormData,
  demoIds: readonly string[] = [],
  maxSites = MAX_SITES,
): Promise<FormInput> {
  const taskValues = (form.getAll('task') as FormValue[]).filter((v): v is string => typeof v === 'string')
  const task = taskValues[taskValues.length - 1] === 'compare' ? 'compare' : 'assess'
  const sites = task === 'compare' ? await sitesOf(form, maxSites) : []
  const files = task === 'compare' ? [] : await fileParts(form, 'file')
  const demoRaw = task === 'compare' ? undefined : text(form, 'demo')
  const demo = demoRaw && demoIds.includes(demoRaw) ? demoRaw : null
  if (demoRaw && !demo) {
    throw new FormFieldError(
      'demo',
      `unknown demo file ${JSON.stringify(demoRaw)}${demoIds.length ? `; choose one of ${demoIds.join(', ')}` : ' (this server offers no demo files)'}`,
    )
  }
  if (task === 'assess' && files.length === 0 && !demo)
    throw new FormFieldError('file', 'choose a weather file (CSV or EPW) to upload, or a demo site')
  if (files.length + (demo ? 1 : 0) > 1)
    throw new FormFieldError('file', 'one weather file here; to compare sites, use “Compare sites”')
  // The weather options: the same table (and reading) as the CLI flags and the API parameters.
  const weatherOptions = task === 'compare' ? {} : weatherFormOptions(form)
  const product = await productOf(form)
  const { kinds, inputs } = methodsOf(form)
  if (task === 'compare' && kinds.length > 1)
    throw new FormFieldError('method', 'choose one method to compare the sites by')
  return {
    task,
    files,
    sites,
    methods: kinds,
    methodInputs: inputs,
    demo,
    weatherOptions,
    product,
    assess: { method: inputs[0], ...sharedOptions(form) },
    units: choice<UnitSystem>(form, 'units', ['si', 'us'], 'si'),
    format: choice(form, 'format', RESULT_FORMATS, 'page'),
  }
}
