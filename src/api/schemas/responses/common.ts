/**
 * @module api/schemas/responses/common
 * Building blocks of the response schemas (GET /openapi.json): every number is described with its unit in
 * brackets (`[°C]`, `[kWh per tonne fresh]`, `[0–1]`, `[count]`), every object is strict, so the test that
 * validates real answers against these schemas (test/api/openapi-responses.test.ts) fails when an answer
 * gains or loses a field that is not documented.
 */
import { z } from 'zod'

/** `f` called once, on first use, and its result kept. */
export function once<T>(f: () => T): () => T {
  let value: T | undefined
  let done = false
  return () => {
    if (!done) {
      value = f()
      done = true
    }
    return value as T
  }
}

/** A number with its description and unit, e.g. `num('dry bulb [°C]')`. */
export const num = (description: string) => z.number().describe(description)
/** A number or null (a figure that could not be computed: the answer's warnings say why). */
export const numOrNull = (description: string) => z.number().nullable().describe(description)
/** A whole number [count]. */
export const count = (description: string) => z.number().int().describe(`${description} [count]`)
/** A text. */
export const text = (description: string) => z.string().describe(description)
/** A list of texts. */
export const texts = (description: string) => z.array(z.string()).describe(description)
/** A month-day 'MM-DD'. */
export const monthDay = (description: string) => z.string().describe(`${description} ['MM-DD']`)

/** Median and P10/P90 across years or batches (Hyndman–Fan type 7), null where not computable. */
export const spreadSchema = (unit: string, of = 'across years') =>
  z
    .strictObject({
      median: numOrNull(`median ${of} [${unit}]`),
      p10: numOrNull(`10th percentile ${of} [${unit}]`),
      p90: numOrNull(`90th percentile ${of} [${unit}]`),
    })
    .describe(`median, P10 and P90 ${of} [${unit}]`)

/** Median and P90 [unit], null where not reached or not computable. */
export const medianP90 = (unit: string, of = 'across years') =>
  z.strictObject({
    median: numOrNull(`median ${of} [${unit}]`),
    p90: numOrNull(`90th percentile ${of} [${unit}]`),
  })

/**
 * The unit of a parameter from the end of its name (the project's convention: units in every name).
 * Names without a unit suffix are listed with theirs; an unknown one gets no brackets (and the response
 * test then names it).
 */
const UNIT_SUFFIXES: [string, string][] = [
  ['KgPerS', 'kg of air per second'],
  ['M3PerMinPerTonne', 'm³/min per tonne as loaded'],
  ['KgPerSPerTonne', 'kg of air per second per tonne of fresh product'],
  ['KgPerSPerM2', 'kg of air per second per m² of collector'],
  ['M2PerTonne', 'm² per tonne of fresh product'],
  ['KgPerM2', 'kg per m²'],
  ['GPerKg', 'g/kg dry air'],
  ['Wm2K', 'W m⁻² K⁻¹'],
  ['AreaM2', 'm²'],
  ['Wm2', 'W/m²'],
  ['Ms', 'm/s'],
  ['Pct', '%'],
  ['Deg', '°'],
  ['Mm', 'mm'],
  ['C', '°C'],
  ['K', 'K'],
  ['M', 'm'],
]
const UNITLESS: Record<string, string> = {
  absorptivity: '0–1',
  heaterEfficiency: '0–1',
  windFraction: '0–1',
  groundAlbedo: '0–1',
  frTauAlpha: '0–1',
  surfaceAreaPerTrayArea: 'm² of product surface per m² of tray',
  fanEfficiency: '0–1',
  emissivity: '0–1',
  coverRefractiveIndex: 'dimensionless',
  coverExtinctionThickness: 'extinction coefficient × thickness, dimensionless',
  absorberAbsorptance: '0–1',
  collectorEfficiencyFactor: '0–1',
  productAbsorptivity: '0–1',
  floorAbsorptance: '0–1',
  groundShare: '0–1',
  ventShareOfFloor: 'm² of openings per m² of floor',
  dischargeCoefficient: 'dimensionless',
  airChangesPerHour: 'volumes of the enclosure per hour',
  layers: 'count',
}

export function unitOfName(name: string): string | null {
  if (UNITLESS[name]) return UNITLESS[name]
  for (const [suffix, unit] of UNIT_SUFFIXES) {
    // suffixes begin with a capital: they start a word of the camel-case name (setPointC)
    if (name.length > suffix.length && name.endsWith(suffix)) return unit
  }
  return null
}

/**
 * A response schema of an object of parameters (a drying method, the thresholds) from its zod schema:
 * every number described with the unit its name carries.
 */
export function parametersSchema(shape: Record<string, z.ZodType>, what: string): z.ZodObject {
  const out: Record<string, z.ZodType> = {}
  for (const [name, field] of Object.entries(shape)) {
    const def = (field as { def?: { type?: string; innerType?: { def?: { type?: string } } } }).def
    const type = def?.type === 'default' || def?.type === 'optional' ? def.innerType?.def?.type : def?.type
    const optional = def?.type === 'optional'
    const unit = unitOfName(name)
    let s: z.ZodType
    const inner = def?.type === 'default' || def?.type === 'optional' ? def.innerType : def
    const element = (inner as { element?: { def?: { type?: string } } } | undefined)?.element?.def?.type
    if (type === 'number') s = z.number().describe(`${what} parameter ${name}${unit ? ` [${unit}]` : ''}`)
    else if (type === 'array' && element === 'number')
      s = z.array(z.number()).describe(`${what} parameter ${name}${unit ? ` [${unit}]` : ''}`)
    else if (type === 'boolean') s = z.boolean().describe(`${what} parameter ${name} (true or false)`)
    else if (type === 'literal') s = (field as z.ZodType).describe(`${what} kind`)
    else s = z.string().describe(`${what} parameter ${name}`)
    out[name] = optional ? s.optional() : s
  }
  return z.strictObject(out)
}

/** A share [0–1], null where not computable. */
export const share = (what: string) => numOrNull(`${what} [0–1]`)
