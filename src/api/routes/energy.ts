/**
 * @module api/routes/energy
 * POST /v1/energy-chart: a dryer batch log in, energy control charts out (same science and keys as
 * `dryhours energy-chart --json`). The log comes as a `text/csv` (or text/plain) body with options in
 * the query string, or as `multipart/form-data` with a `log` part, an optional `weather` part (hourly
 * weather, CSV or EPW) and an optional `options` JSON part (same keys as the query). Errors are problem
 * details: 400 bad parameters, 415 other body types, 422 a log or weather file that cannot be used.
 */
import { Hono } from 'hono'
import { z } from 'zod'
import { BatchLogError } from '../../analysis/energy/batch-log.ts'
import { analyzeEnergyLog, type EnergyChartOptions } from '../../analysis/energy/energy-chart.ts'
import { energyChartWords } from '../../analysis/energy/energy-words.ts'
import { optionWords } from '../../analysis/option-names.ts'
import { FUEL_IDS } from '../../drying/method.ts'
import { productById } from '../../product/catalogue.ts'
import { ENERGY_TABLE_IDS, renderEnergyCsv } from '../../report/energy/energy-csv.ts'
import { renderEnergyHtml } from '../../report/energy/energy-html.ts'
import { readWeather } from '../../weather/read-weather.ts'
import { charsetOf, checkedCharset } from '../body.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, problemFor, rethrowAsProblem } from '../errors.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem, type ProblemField } from '../problem.ts'
import { numberParam } from '../schemas/params.ts'
import { energyChartResponseSchema } from '../schemas/responses/energy.ts'
import { checkedUploadText, parseOptionsJson, queryParams, readUpload, type UploadedFile } from '../upload.ts'
import { parseOrProblem } from '../validate.ts'
import { weatherOptionsFromQuery, weatherQueryFields } from '../weather-options.ts'
import { workControl } from '../work.ts'

/** Options of the request (query string, or the `options` part with the same keys as strings or numbers). */
export const energyChartQuerySchema = z.strictObject({
  baseline: numberParam(
    'batches in the baseline (phase I), at least 5; default min(20, half the batches)',
  ).optional(),
  fuel: z.enum(FUEL_IDS).describe('fuel of rows with fuel_amount but no fuel column').optional(),
  dryingTempC: numberParam('drying-air temperature [°C] for the latent heat, default 60').optional(),
  utcOffsetHours: numberParam(
    "offset of the log's local times from UTC [h], -12 to 14; also the weather file's when utcOffset and tz are not given",
  )
    .pipe(z.number().min(-12).max(14))
    .optional(),
  timeZone: z
    .string()
    .min(1)
    .describe("IANA time zone of the weather file's time stamps (older name of tz)")
    .optional(),
  elevationM: numberParam('site elevation [m] for the air pressure, -500 to 9000')
    .pipe(z.number().min(-500).max(9000))
    .optional(),
  ...weatherQueryFields,
  product: z
    .string()
    .min(1)
    .describe('catalogue product id: adds its heat of sorption to the ideal heat')
    .optional(),
  format: z.enum(['json', 'html', 'csv']).describe('answer format, default json').optional(),
  table: z.enum(ENERGY_TABLE_IDS).describe('CSV only: one table instead of all').optional(),
})

/** Options given as JSON numbers are accepted too: turn them into the strings the schema reads. */
function asQueryStrings(options: unknown): Record<string, string> {
  if (options === undefined) return {}
  if (typeof options !== 'object' || options === null || Array.isArray(options)) {
    throw new ApiProblem(400, 'the options part must be a JSON object', [
      { path: 'options', message: 'not an object' },
    ])
  }
  const out: Record<string, string> = Object.create(null)
  for (const [k, v] of Object.entries(options)) out[k] = typeof v === 'string' ? v : JSON.stringify(v)
  return out
}

interface EnergyUpload {
  log: UploadedFile
  weather?: UploadedFile
  options: Record<string, string>
}

async function readEnergyUpload(c: Parameters<typeof readUpload>[0]): Promise<EnergyUpload> {
  const type = (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase()
  const query = queryParams(c.req.url)
  if (type !== 'multipart/form-data') {
    const upload = await readUpload(c, { defaultName: 'batch-log.csv' }) // raw body, or 415
    return { log: { ...upload.files[0], field: 'log' }, options: query }
  }
  let form: FormData
  try {
    form = await c.req.formData()
  } catch {
    throw new ApiProblem(
      400,
      'the multipart body could not be parsed (check the boundary and the parts)',
      undefined,
      'unreadable-body',
    )
  }
  const fileOf = async (v: FormDataEntryValue, field: string, name: string): Promise<UploadedFile> =>
    typeof v === 'string'
      ? { name, field, bytes: new TextEncoder().encode(v), charset: 'utf-8' }
      : {
          name: v.name || name,
          field,
          bytes: new Uint8Array(await v.arrayBuffer()),
          charset: checkedCharset(charsetOf(v.type), field),
        }
  const log = form.get('log')
  if (log === null) {
    throw new ApiProblem(400, 'the multipart body needs a `log` part with the batch log CSV', [
      { path: 'log', message: 'missing' },
    ])
  }
  for (const field of new Set(form.keys())) {
    if (!['log', 'weather', 'options'].includes(field)) {
      throw new ApiProblem(400, `unknown part '${field.slice(0, 40)}': send log, weather and options`, [
        { path: field.slice(0, 40), message: 'unknown part' },
      ])
    }
  }
  const weather = form.get('weather')
  const optionsPart = form.get('options')
  let options: Record<string, string> = Object.create(null)
  if (optionsPart !== null) {
    const text = typeof optionsPart === 'string' ? optionsPart : await optionsPart.text()
    options = asQueryStrings(parseOptionsJson(text))
  }
  const merged: Record<string, string> = Object.create(null)
  Object.assign(merged, query)
  for (const [k, v] of Object.entries(options)) merged[k] = v
  return {
    log: await fileOf(log, 'log', 'batch-log.csv'),
    weather: weather === null ? undefined : await fileOf(weather, 'weather', 'weather'),
    options: merged,
  }
}

export const energyRouter = (config: ApiConfig) =>
  new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const upload = await readEnergyUpload(c)
    const q = parseOrProblem(energyChartQuerySchema, upload.options)
    const options: EnergyChartOptions = {
      baselineCount: q.baseline,
      fuel: q.fuel,
      dryingTempC: q.dryingTempC,
      utcOffsetHours: q.utcOffsetHours,
      elevationM: q.elevationM,
    }
    if (q.product !== undefined) {
      try {
        options.profile = productById(q.product)
      } catch (e) {
        throw new ApiProblem(400, (e as Error).message, [{ path: 'product', message: 'unknown product id' }])
      }
    }
    // The log's row and column limits before it is parsed (without them 200,000 batches took 35 s).
    const logText = checkedUploadText(upload.log, config, 'log')
    if (upload.weather) {
      // the weather options of every route (utcOffset, tz, siteTz, map, labels …); the log's offset and
      // the older names apply to the weather file when the new ones are not given
      const w: Record<string, unknown> = { ...weatherOptionsFromQuery(q) }
      if (w.utcOffsetHours === undefined && w.timeZone === undefined) {
        if (q.utcOffsetHours !== undefined) w.utcOffsetHours = q.utcOffsetHours
        else if (q.timeZone !== undefined) w.timeZone = q.timeZone
      }
      if (w.elevationM === undefined && q.elevationM !== undefined) w.elevationM = q.elevationM
      // Same row and column limits as the weather files of /v1/assess.
      const weatherText = checkedUploadText(upload.weather, config, 'weather')
      work.checkpoint()
      try {
        options.weather = readWeather(weatherText, w).series
      } catch (e) {
        const p = problemFor(e, { filePrefix: 'weather' })
        if (p === null) throw e
        // the reader names options as CLI flags: renamed as this request gives them
        const message = optionWords(p.message, 'query')
        throw new ApiProblem(
          p.status,
          message,
          p.errors ?? [{ path: 'weather', message: message.replace(/^weather: /, '') }],
          p.type,
        )
      }
    }
    work.checkpoint()
    let assessment: ReturnType<typeof analyzeEnergyLog>
    try {
      assessment = analyzeEnergyLog(logText, options)
    } catch (e) {
      if (e instanceof BatchLogError) {
        // Every rejected row with its line (the log is at most maxLogRows rows long).
        const errors: ProblemField[] = e.rejections.map((r) => ({
          path: `line ${r.line}`,
          message: r.message,
        }))
        throw new ApiProblem(
          422,
          `log: ${optionWords(e.message, 'query', 'energy')}`,
          errors.length > 0 ? errors : [{ path: 'log', message: e.message }],
        )
      }
      if (e instanceof RangeError && !isRuntimeFault(e)) {
        // the option the engine names in its message, else the options as a whole
        const path = /^baseline/.test(e.message)
          ? 'baseline'
          : /^drying temperature/.test(e.message)
            ? 'dryingTempC'
            : 'options'
        const message = optionWords(e.message, 'query', 'energy')
        throw new ApiProblem(400, `${path}: ${message}`, [{ path, message }])
      }
      rethrowAsProblem(e)
    }
    work.checkpoint()
    // the engine's messages name options as CLI flags: renamed as this request names them (query and options
    // part have the same keys)
    assessment = energyChartWords(assessment, 'query')
    if (q.format === 'html') return c.html(renderEnergyHtml(assessment, { logName: upload.log.name }))
    if (q.format === 'csv') {
      return c.body(renderEnergyCsv(assessment, q.table), 200, { 'content-type': 'text/csv; charset=utf-8' })
    }
    return c.json(assessment)
  })

registerOperation({
  method: 'post',
  path: '/v1/energy-chart',
  summary: 'Energy control charts of a heated dryer',
  description:
    'A batch log (CSV, one row per batch: start, duration_h, fresh_mass_kg, final_mass_kg or initial/final_moisture_wb_pct, ' +
    'energy_kwh or fuel_amount + fuel_unit + fuel; optional ambient_temp_c, ambient_rh_pct, drying_temp_c) → specific energy ' +
    '[MJ per kg water] and thermal efficiency per batch, and three views (measured over expected energy from the dryer physics, ' +
    'the residual of a regression on outside humidity ratio, temperature and load, the raw specific energy), each with ' +
    'individuals/moving-range charts with Western Electric rules, an EWMA and a CUSUM chart with limits from a baseline; the answer ' +
    '(summary[0]) names the batch where the rise most likely began and how likely. ' +
    'Send the log as a text/csv body (options in the query) or as multipart/form-data with parts `log`, optional `weather` ' +
    '(hourly weather for batches without ambient columns) and optional `options` (JSON, same keys). Same keys as ' +
    '`dryhours energy-chart --json`.',
  query: energyChartQuerySchema,
  requestBody: [
    { contentType: 'text/csv', description: 'the batch log' },
    {
      contentType: 'multipart/form-data',
      description:
        'parts: log (batch log CSV, required), weather (hourly weather CSV or EPW, optional), options (JSON, optional)',
    },
  ],
  response: {
    contentType: 'application/json',
    description: 'the energy-chart assessment (format=html: the page; format=csv: the tables)',
    schema: energyChartResponseSchema,
  },
  errors: [400, 413, 415, 422],
  examples: [
    {
      name: 'eight batches, baseline of six (invented numbers)',
      url: '/v1/energy-chart?baseline=6',
      contentType: 'text/csv',
      body:
        'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh,ambient_temp_c,ambient_rh_pct\n' +
        '2026-09-01T08:00-06:00,4,10000,9000,1150,18,60\n' +
        '2026-09-02T08:00-06:00,4,9000,8150,1010,16,70\n' +
        '2026-09-03T08:00-06:00,4,12000,10900,1290,21,55\n' +
        '2026-09-04T08:00-06:00,4,8000,7250,930,14,80\n' +
        '2026-09-05T08:00-06:00,4,11000,9950,1180,19,50\n' +
        '2026-09-06T08:00-06:00,4,9500,8600,1080,12,75\n' +
        '2026-09-07T08:00-06:00,4,10500,9500,1330,17,65\n' +
        '2026-09-08T08:00-06:00,4,10000,9050,1310,15,60\n',
    },
  ],
})
