/**
 * @module api/schemas/assess
 * Options of POST /v1/assess and POST /v1/compare, in two forms that end in the same `AssessOptions`:
 * a JSON object (the `options` part of a multipart request; full control, the engine's own option names)
 * and a flat query string (the common options, short names like the CLI flags).
 */
import { z } from 'zod'
import type { AssessOptions, assess } from '../../analysis/assess.ts'
import { COMPARE_CRITERIA, type CompareCriterion } from '../../analysis/compare.ts'
import type { MethodList } from '../../analysis/compare-methods.ts'
import { ASSESS_DEFAULTS, planAssessment, ASSESS_RANGES as R } from '../../analysis/plan.ts'
import {
  DRYING_METHOD_KINDS,
  dryingMethodSchema,
  FUEL_IDS,
  type FuelId,
  heatedSchema,
} from '../../drying/method.ts'
import { dryingThresholdsSchema } from '../../drying/thresholds.ts'
import { productById, productIds } from '../../product/catalogue.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { parseUserProfile } from '../../product/profile-schema.ts'
import type { OptionSurface } from '../../weather/option-spec.ts'
import { type WeatherReadOptions, weatherReadOptionsSchema } from '../../weather/options.ts'
import { rethrowAsProblem } from '../errors.ts'
import { ApiProblem } from '../problem.ts'
import { parseOrProblem } from '../validate.ts'
import { weatherOptionsFromQuery, weatherQueryFields } from '../weather-options.ts'
import { numberListParam, numberParam } from './params.ts'

const monthDay = z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'must be MM-DD, e.g. 07-15')

const kinds = DRYING_METHOD_KINDS as unknown as [string, ...string[]]

/** JSON form (multipart `options` part). */
export const assessOptionsJsonSchema = z.strictObject({
  product: z
    .union([z.string().min(1), z.record(z.string(), z.unknown())])
    .describe('catalogue product id, or an inline profile / profile variant (see GET /v1/products/{id})'),
  method: z
    .union([
      z.enum(kinds),
      z.literal('all'),
      z.record(z.string(), z.unknown()),
      z
        .array(z.union([z.enum(kinds), z.record(z.string(), z.unknown())]))
        .min(1)
        .max(DRYING_METHOD_KINDS.length),
    ])
    .describe(
      `drying method kind, or an object {kind, …parameters} (${DRYING_METHOD_KINDS.join(', ')}; natural-air-bin: depthM [m], binDiameterM [m] or floorAreaM2 [m²], airflowsM3PerMinPerTonne [m³/min per t], heatRiseK [K], fanControl, fanEfficiency [0–1], layers, dryMatterLossLimitPct [%]; greenhouse: lengthM, widthM [m], trayAreaM2 [m²], ventShareOfFloor or ventAreaM2 [m²], airChangesPerHour [h⁻¹], cover, nightPractice, loadingKgPerM2); /v1/assess also takes a list of them, or "all", to compare methods side by side`,
    ),
  targetWbPct: z
    .number()
    .min(R.targetWbPct[0])
    .max(R.targetWbPct[1])
    .optional()
    .describe(
      'target moisture, wet basis [%]; default the moisture of the product’s safe water activity at the storage temperature (or the profile’s figure when drier)',
    ),
  storageTempC: z
    .number()
    .min(R.storageTempC[0])
    .max(R.storageTempC[1])
    .optional()
    .describe(
      'temperature of the store at which the dried product’s water activity is judged [°C]; default 25',
    ),
  initialWbPct: z
    .number()
    .min(R.initialWbPct[0])
    .max(R.initialWbPct[1])
    .optional()
    .describe('initial moisture, wet basis [%]; default the profile’s'),
  thicknessMm: z
    .number()
    .gt(R.thicknessMm[0])
    .lt(R.thicknessMm[1])
    .optional()
    .describe('product thickness [mm]; default the profile’s'),
  seasonStart: monthDay.optional().describe('first start date of the season [MM-DD]'),
  seasonEnd: monthDay.optional().describe('last start date of the season [MM-DD]'),
  startStepDays: z
    .number()
    .int()
    .min(R.startStepDays[0])
    .max(R.startStepDays[1])
    .optional()
    .describe(
      `days between start dates [days]; default ${ASSESS_DEFAULTS.stepDaysWithSeason} with a season, else ${ASSESS_DEFAULTS.stepDaysWholeYear}`,
    ),
  startHourLocal: z
    .number()
    .int()
    .min(R.startHourLocal[0])
    .max(R.startHourLocal[1])
    .optional()
    .describe(`local standard hour at which batches start; default ${ASSESS_DEFAULTS.startHourLocal}`),
  deadlineDays: z
    .number()
    .min(R.deadlineDays[0])
    .max(R.deadlineDays[1])
    .optional()
    .describe(`window to reach the target [days]; default ${ASSESS_DEFAULTS.deadlineDays}`),
  maxDays: z
    .number()
    .positive()
    .max(R.maxDays[1])
    .optional()
    .describe(
      `a batch fails after this many days [days], at least the deadline; default ${ASSESS_DEFAULTS.maxDays}, or the deadline when longer`,
    ),
  batchKgFresh: z
    .number()
    .min(R.batchKgFresh[0])
    .max(R.batchKgFresh[1])
    .optional()
    .describe(`batch size [kg fresh product]; default ${ASSESS_DEFAULTS.batchKgFresh}`),
  thresholds: dryingThresholdsSchema
    .partial()
    .strict()
    .optional()
    .describe('usable-hour thresholds (see assumptions in the answer)'),
  backupHeater: heatedSchema
    .omit({ kind: true })
    .partial()
    .strict()
    .optional()
    .describe('heater for the supplemental heat figures'),
  fuel: z.enum(FUEL_IDS).optional().describe('fuel for the heat and cost figures'),
  fuelPrices: z
    .partialRecord(z.enum(FUEL_IDS), z.number().min(0).max(1e6))
    .optional()
    .describe('price per fuel unit (currency of your choice); missing prices use marked examples'),
  currency: z
    .string()
    .optional()
    .describe('the currency of your prices (e.g. EUR, US$; 1–12 characters), shown with every cost'),
  weather: weatherReadOptionsSchema.optional().describe('weather-reader options (site, time basis, mapping)'),
  criterion: z.enum(COMPARE_CRITERIA).optional().describe('compare only: ranking criterion'),
})

/** Query form (raw file body). */
export const assessQuerySchema = z.strictObject({
  product: z.string().min(1).describe('catalogue product id (GET /v1/products)'),
  method: z
    .string()
    .min(1)
    .describe(
      `${DRYING_METHOD_KINDS.join(', ')} (defaults for its parameters); /v1/assess also takes several separated by commas, or all, to compare methods side by side`,
    ),
  targetWb: numberParam('target moisture, wet basis [%]').optional(),
  storageTemp: numberParam('storage temperature for the water activity of the dried product [°C]').optional(),
  initialWb: numberParam('initial moisture, wet basis [%]').optional(),
  thickness: numberParam('product thickness [mm]').optional(),
  start: monthDay.optional().describe('first start date of the season [MM-DD]'),
  end: monthDay.optional().describe('last start date of the season [MM-DD]'),
  stepDays: numberParam('days between start dates [days]').optional(),
  deadlineDays: numberParam('window to reach the target [days]').optional(),
  maxDays: numberParam('a batch fails after this many days [days]').optional(),
  batchKg: numberParam('batch size [kg fresh]').optional(),
  airflow: numberListParam(
    'natural-air-bin: airflows to compare [m³/min per tonne of grain], e.g. 0.5,1,2 (default 0.5,1,1.5,2,3)',
  ).optional(),
  binDepth: numberParam('natural-air-bin: grain depth [m] (default 4)').optional(),
  binDiameter: numberParam('natural-air-bin: bin diameter [m] (default 9.1)').optional(),
  floorArea: numberParam('natural-air-bin: floor area [m²], instead of a diameter').optional(),
  heatRise: numberParam('natural-air-bin: temperature rise from a heater [K] (default 0)').optional(),
  fanControl: z
    .enum(['continuous', 'air-emc-below', 'rh-below'])
    .optional()
    .describe('natural-air-bin: when the fan runs (default continuous)'),
  fuel: z.enum(FUEL_IDS).optional().describe('fuel for the heat and cost figures'),
  price: z.string().optional().describe('fuel prices per unit, e.g. propane=0.9;electricity=0.25'),
  currency: z.string().optional().describe('the currency of your prices (e.g. EUR), shown with every cost'),
  format: z.enum(['json', 'csv', 'html']).optional().describe('answer format; default json'),
  units: z.enum(['si', 'us']).optional().describe('display units of html and csv answers; default si'),
  table: z.string().optional().describe('csv only: one table by id instead of all'),
  ...weatherQueryFields,
})

export type AssessQuery = z.output<typeof assessQuerySchema>

export interface AssessRequest {
  /** The options, with the first (or only) method. */
  options: AssessOptions
  /** Several methods to compare side by side (a list or `all`); null for one method. */
  methods: MethodList | null
  weather: WeatherReadOptions
  criterion?: CompareCriterion
  /** Where the weather options came from, so that messages name them as the request did. */
  surface: OptionSurface
  /** Field path of an engine option in this request (`options.maxDays`, or the query name `maxDays`). */
  optionPath: (option: string) => string
}

/** Query names of the engine's options (the rest keep their names). */
const QUERY_NAMES: Record<string, string> = {
  targetWbPct: 'targetWb',
  storageTempC: 'storageTemp',
  initialWbPct: 'initialWb',
  thicknessMm: 'thickness',
  seasonStart: 'start',
  seasonEnd: 'end',
  startStepDays: 'stepDays',
  batchKgFresh: 'batchKg',
  'method.airflowsM3PerMinPerTonne': 'airflow',
}

/** The natural-air bin's query fields as method parameters; refused with another method. */
function binQueryParams(q: AssessQuery, kinds: string | string[]): Record<string, unknown> {
  const params: Record<string, unknown> = {
    airflowsM3PerMinPerTonne: q.airflow,
    depthM: q.binDepth,
    binDiameterM: q.binDiameter,
    floorAreaM2: q.floorArea,
    heatRiseK: q.heatRise,
    fanControl: q.fanControl,
  }
  const given = Object.entries(params).filter(([, v]) => v !== undefined)
  const withBin = kinds === 'all' || [kinds].flat().includes('natural-air-bin')
  if (given.length > 0 && !withBin) {
    const names: Record<string, string> = {
      airflowsM3PerMinPerTonne: 'airflow',
      depthM: 'binDepth',
      binDiameterM: 'binDiameter',
      floorAreaM2: 'floorArea',
      heatRiseK: 'heatRise',
      fanControl: 'fanControl',
    }
    const name = names[given[0][0]]
    throw new ApiProblem(400, `${name} goes with method=natural-air-bin`, [
      { path: name, message: 'only for method=natural-air-bin' },
    ])
  }
  return Object.fromEntries(given)
}

/** Check the options with the engine's planner now, before any file is read: 400 naming the field. */
function planned(request: AssessRequest): AssessRequest {
  try {
    planAssessment(request.options)
  } catch (e) {
    rethrowAsProblem(e, { optionPath: request.optionPath, rangeStatus: 400 })
  }
  return request
}

function resolveProduct(value: string | Record<string, unknown>, path: string): ProductProfile {
  if (typeof value === 'string') {
    try {
      return productById(value)
    } catch {
      throw new ApiProblem(400, `no product '${value}'; known ids: ${productIds().join(', ')}`, [
        { path, message: 'unknown product id' },
      ])
    }
  }
  try {
    return parseUserProfile(value)
  } catch (e) {
    throw new ApiProblem(400, (e as Error).message, [{ path, message: (e as Error).message }])
  }
}

function resolveMethod(value: string | Record<string, unknown>, path: string): AssessOptions['method'] {
  const input = typeof value === 'string' ? { kind: value } : value
  const r = dryingMethodSchema.safeParse(input)
  const errors = r.success
    ? []
    : r.error.issues.map((i) => ({ path: [path, ...i.path.map(String)].join('.'), message: i.message }))
  // A misspelt parameter must not fall back silently to its default: unknown keys are refused.
  const option = dryingMethodSchema.options.find((o) => o.shape.kind.value === input.kind)
  if (option) {
    for (const key of Object.keys(input)) {
      if (!(key in option.shape))
        errors.push({ path: `${path}.${key}`, message: `unrecognized key for ${input.kind}` })
    }
  }
  if (!r.success || errors.length > 0) {
    throw new ApiProblem(400, errors.map((e) => `${e.path}: ${e.message}`).join('; '), errors)
  }
  return r.data
}

/** The method(s) of a request: one, or a list / `all` to compare side by side. */
function resolveMethods(
  value: string | Record<string, unknown> | (string | Record<string, unknown>)[],
  path: string,
  allWith: (string | Record<string, unknown>)[] = [],
): { first: AssessOptions['method']; methods: MethodList | null } {
  if (value === 'all') {
    const first = resolveMethod(DRYING_METHOD_KINDS[0], path)
    if (allWith.length === 0) return { first, methods: 'all' }
    return { first, methods: { all: allWith.map((m) => resolveMethod(m, path)) } }
  }
  if (!Array.isArray(value)) return { first: resolveMethod(value, path), methods: null }
  const list = value.map((m, i) => resolveMethod(m, `${path}.${i}`))
  const kinds = list.map((m) => m.kind)
  const twice = kinds.findIndex((k, i) => kinds.indexOf(k) !== i)
  if (twice >= 0)
    throw new ApiProblem(400, `${path}: ${kinds[twice]} is listed twice`, [
      { path: `${path}.${twice}`, message: 'method listed twice' },
    ])
  return { first: list[0], methods: list.length > 1 ? list : null }
}

/** The `method` query parameter: one kind, several separated by commas, or `all`. */
function methodsFromQuery(text: string): string | string[] {
  if (text.trim() === 'all') return 'all'
  const kinds = text.split(',').map((k) => k.trim())
  for (const k of kinds) {
    if (!(DRYING_METHOD_KINDS as readonly string[]).includes(k)) {
      throw new ApiProblem(
        400,
        `method must be one of ${DRYING_METHOD_KINDS.join(', ')} (several separated by commas, or all); got '${k.slice(0, 40)}'`,
        [{ path: 'method', message: 'unknown method' }],
      )
    }
  }
  return kinds.length === 1 ? kinds[0] : kinds
}

/** From the JSON form (already an object), with field paths prefixed by `prefix`. */
export function assessRequestFromJson(value: unknown, prefix = 'options'): AssessRequest {
  const o = parseOrProblem(assessOptionsJsonSchema, value, prefix)
  const { product, method, weather, criterion, ...rest } = o
  const m = resolveMethods(method, `${prefix}.method`)
  return planned({
    options: {
      ...rest,
      product: resolveProduct(product, `${prefix}.product`),
      method: m.first,
    },
    methods: m.methods,
    weather: weather ?? {},
    criterion,
    surface: 'json',
    optionPath: (option) => `${prefix}.${option}`,
  })
}

/** From the query form. */
export function assessRequestFromQuery(
  query: Record<string, string>,
): AssessRequest & { query: AssessQuery } {
  const q = parseOrProblem(assessQuerySchema, query)
  const fuelPrices: Partial<Record<FuelId, number>> = {}
  for (const part of (q.price ?? '').split(';').filter((p) => p.trim() !== '')) {
    const m = /^\s*([a-z-]+)\s*=\s*([0-9.eE+-]+)\s*$/.exec(part)
    const price = m ? Number(m[2]) : Number.NaN
    if (!m || !(FUEL_IDS as readonly string[]).includes(m[1]) || !(price >= 0 && price <= 1e6)) {
      throw new ApiProblem(
        400,
        `price '${part}' must be <fuel>=<price ≥ 0> with fuel one of ${FUEL_IDS.join(', ')}`,
        [{ path: 'price', message: 'bad fuel price' }],
      )
    }
    fuelPrices[m[1] as FuelId] = price
  }
  const weather = weatherOptionsFromQuery(q)
  const kinds = methodsFromQuery(q.method)
  const bin = binQueryParams(q, kinds)
  // the bin's parameters go to natural-air-bin, alone, in a list, or among all methods
  const withParams = (k: string): string | Record<string, unknown> =>
    k === 'natural-air-bin' && Object.keys(bin).length > 0 ? { kind: k, ...bin } : k
  const m =
    kinds === 'all'
      ? resolveMethods('all', 'method', Object.keys(bin).length > 0 ? [withParams('natural-air-bin')] : [])
      : resolveMethods(Array.isArray(kinds) ? kinds.map(withParams) : withParams(kinds), 'method')
  const request = planned({
    methods: m.methods,
    surface: 'query',
    weather,
    optionPath: (option) => QUERY_NAMES[option] ?? option,
    options: {
      product: resolveProduct(q.product, 'product'),
      method: m.first,
      targetWbPct: q.targetWb,
      storageTempC: q.storageTemp,
      initialWbPct: q.initialWb,
      thicknessMm: q.thickness,
      seasonStart: q.start,
      seasonEnd: q.end,
      startStepDays: q.stepDays,
      deadlineDays: q.deadlineDays,
      maxDays: q.maxDays,
      batchKgFresh: q.batchKg,
      fuel: q.fuel,
      fuelPrices,
      currency: q.currency,
    },
  })
  return { ...request, query: q }
}

/** Type of the engine entry, for the routes. */
export type AssessFunction = typeof assess
