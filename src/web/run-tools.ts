/**
 * @module web/run-tools
 * The page's other jobs beside assessing: how a weather file is understood (inspect), drying kinetics from
 * weighings (fit), and the energy charts of a batch log. Each parses its form, runs the same core function
 * as the CLI and the API, and renders an article; a bad value names the form field. Runtime-neutral.
 */

import { BatchLogError } from '../analysis/energy/batch-log.ts'
import { analyzeEnergyLog, type EnergyChartOptions } from '../analysis/energy/energy-chart.ts'
import { energyChartWords } from '../analysis/energy/energy-words.ts'
import { optionWords } from '../analysis/option-names.ts'
import { FUEL_IDS, type FuelId } from '../drying/method.ts'
import { productById } from '../product/catalogue.ts'
import { fitWeighings } from '../product/fit-weighings.ts'
import type { ProductProfile, Shape } from '../product/profile.ts'
import { type MoistureReference, parseWeighingsCsv } from '../product/weighings.ts'
import type { UnitSystem } from '../report/display-units.ts'
import { renderEnergyArticle } from '../report/energy/energy-html.ts'
import { renderFitArticle } from '../report/fit-html.ts'
import { fitJson } from '../report/fit-json.ts'
import { renderInspectArticle } from '../report/inspect-html.ts'
import { inspectJson } from '../report/inspect-json.ts'
import { renderOptionNames } from '../weather/option-spec.ts'
import { readWeatherBytes } from '../weather/read-weather.ts'
import { WeatherInputError } from '../weather/weather-input-error.ts'
import type { DemoProvider } from './demo-files.ts'
import {
  choice,
  FormFieldError,
  fileParts,
  formText,
  numberField,
  type WeatherFile,
  weatherFormOptions,
} from './form-input.ts'
import { FormQuestion } from './run-form.ts'

/** What a tool answers: the article for the page and the JSON for a download. */
export interface ToolResult {
  article: string
  json: string
  title: string
}

/** What a tool needs from the server: the demo files and a check of each uploaded file's size and rows. */
export interface ToolContext {
  demo?: DemoProvider
  demoIds: readonly string[]
  /** Throws when the file is beyond the server's limits (rows, columns, charset); `kind` names its limit. */
  checkUpload: (file: WeatherFile, field: string, kind?: 'weighings' | 'log' | 'weather') => void
  onProgress?: () => void
}

function units(form: FormData): UnitSystem {
  return choice<UnitSystem>(form, 'units', ['si', 'us'], 'si')
}

async function oneFile(
  form: FormData,
  field: string,
  what: string,
  required: boolean,
): Promise<WeatherFile | null> {
  const files = await fileParts(form, field)
  if (files.length === 0) {
    if (required) throw new FormFieldError(field, `choose ${what} to upload`)
    return null
  }
  return files[0]
}

function productOrNull(form: FormData): ProductProfile | undefined {
  const id = formText(form, 'product')
  if (id === undefined) return undefined
  try {
    return productById(id)
  } catch (e) {
    throw new FormFieldError('product', (e as Error).message)
  }
}

/** How the weather file is understood (the form of /inspect, or "check the file first" on /). */
export async function runInspect(form: FormData, ctx: ToolContext): Promise<ToolResult> {
  let file = await oneFile(form, 'file', 'a weather file', false)
  let options: Record<string, unknown> = {}
  const demoId = formText(form, 'demo')
  if (!file && demoId && ctx.demo && ctx.demoIds.includes(demoId)) {
    const bytes = await ctx.demo.read(demoId)
    const entry = ctx.demo.list().find((d) => d.file === demoId)
    if (bytes && entry) {
      file = { name: entry.file, bytes }
      options = { ...entry.readOptions }
    }
  }
  if (!file) throw new FormFieldError('file', 'choose a weather file (CSV or EPW) to upload, or a demo site')
  ctx.checkUpload(file, 'file', 'weather')
  options = { ...options, ...weatherFormOptions(form) }
  let read: ReturnType<typeof readWeatherBytes>
  try {
    read = readWeatherBytes(file.bytes, options)
  } catch (e) {
    if (e instanceof WeatherInputError)
      throw new FormQuestion(
        `${file.name}: ${renderOptionNames(e.message, 'form')} (under “Site, time zone and columns”)`,
        file.name,
        e.missing,
      )
    if (e instanceof RangeError) throw new RangeError(`${file.name}: ${e.message}`)
    throw e
  }
  ctx.onProgress?.()
  return {
    article: renderInspectArticle(read, { fileName: file.name, units: units(form), optionSurface: 'form' }),
    json: JSON.stringify(inspectJson(read), null, 2),
    title: `${file.name} as understood`,
  }
}

/** Drying kinetics from weighings (the form of /fit). */
export async function runFit(form: FormData, ctx: ToolContext): Promise<ToolResult> {
  const file = (await oneFile(form, 'weighings', 'the weighings file (CSV)', true)) as WeatherFile
  ctx.checkUpload(file, 'weighings', 'weighings')
  const ref = choice(form, 'reference', ['dryMass', 'initialWb', 'finalWb'] as const, 'dryMass')
  const value =
    ref === 'dryMass'
      ? numberField(form, 'referenceValue', 0.001, 1e7, 'g')
      : numberField(form, 'referenceValue', 0, 99, '% wet basis')
  if (value === undefined)
    throw new FormFieldError(
      'referenceValue',
      'give the dry mass or one moisture, so the weighings become moistures',
    )
  const reference: MoistureReference =
    ref === 'dryMass'
      ? { dryMassG: value }
      : ref === 'initialWb'
        ? { initialWbPct: value }
        : { finalWbPct: value }
  const base = productOrNull(form)
  const shapeText = formText(form, 'shape')
  const shape =
    shapeText === undefined
      ? (base?.kinetics.shape ?? 'slab')
      : choice<Shape>(form, 'shape', ['slab', 'cylinder', 'sphere'], 'slab')
  const thicknessMm = numberField(form, 'thicknessMm', 0.1, 500, 'mm')
  const targetWbPct = numberField(form, 'targetWbPct', 0, 99, '% wet basis')
  const text = new TextDecoder().decode(file.bytes)
  try {
    const weighings = parseWeighingsCsv(text)
    const fit = fitWeighings(weighings, { reference, thicknessMm, shape, targetWbPct })
    ctx.onProgress?.()
    return {
      article: renderFitArticle(fit, { fileName: file.name }),
      json: JSON.stringify(fitJson(fit), null, 2),
      title: `fit of ${file.name}`,
    }
  } catch (e) {
    if (e instanceof RangeError) throw new RangeError(`${file.name}: ${optionWords(e.message, 'form')}`)
    throw e
  }
}

/** Energy charts of a batch log (the form of /energy). */
export async function runEnergy(form: FormData, ctx: ToolContext): Promise<ToolResult> {
  const log = (await oneFile(form, 'log', 'the batch log (CSV)', true)) as WeatherFile
  ctx.checkUpload(log, 'log', 'log')
  const weather = await oneFile(form, 'weather', 'a weather file', false)
  const options: EnergyChartOptions = {
    baselineCount: numberField(form, 'baseline', 5, 10_000, 'batches'),
    dryingTempC: numberField(form, 'dryingTempC', 0, 100, '°C'),
    utcOffsetHours: numberField(form, 'logUtcOffset', -12, 14, 'h'),
    profile: productOrNull(form),
  }
  const fuel =
    formText(form, 'fuel') === undefined ? undefined : choice<FuelId>(form, 'fuel', FUEL_IDS, 'propane')
  if (fuel !== undefined) options.fuel = fuel
  if (weather) {
    ctx.checkUpload(weather, 'weather', 'weather')
    const w: Record<string, unknown> = {}
    if (options.utcOffsetHours !== undefined) w.utcOffsetHours = options.utcOffsetHours
    try {
      options.weather = readWeatherBytes(weather.bytes, w).series
    } catch (e) {
      if (e instanceof WeatherInputError || (e instanceof RangeError && !(e instanceof FormFieldError)))
        // this form's only clock field is the log's offset, which also reads the weather file
        throw new FormFieldError('weather', `${weather.name}: ${optionWords(e.message, 'form', 'energy')}`)
      throw e
    }
  }
  const text = new TextDecoder().decode(log.bytes)
  try {
    // the engine's messages name options as CLI flags: the page names them by its labels
    const assessment = energyChartWords(analyzeEnergyLog(text, options), 'form')
    ctx.onProgress?.()
    return {
      article: renderEnergyArticle(assessment, { logName: log.name }),
      json: JSON.stringify(assessment, null, 2),
      title: `energy charts of ${log.name}`,
    }
  } catch (e) {
    if (e instanceof BatchLogError) {
      const lines = e.rejections
        .slice(0, 5)
        .map((r) => `line ${r.line}: ${r.message}`)
        .join('; ')
      throw new FormFieldError(
        'log',
        `${log.name}: ${optionWords(e.message, 'form', 'energy')}${lines ? ` (${lines})` : ''}`,
      )
    }
    if (e instanceof RangeError)
      throw new RangeError(`${log.name}: ${optionWords(e.message, 'form', 'energy')}`)
    throw e
  }
}
