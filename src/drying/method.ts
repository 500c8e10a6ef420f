/**
 * @module drying/method
 * The drying methods as one tagged union with validated parameters and stated defaults, built from the
 * registry (drying/methods/index.ts; one module per method). `parseDryingMethod` fills every default and
 * throws a RangeError naming the field, the value and the accepted range.
 */
import { z } from 'zod'
import { METHOD_MODELS, type MethodModels } from './methods/index.ts'

export { FUEL_IDS, type FuelId } from './fuels.ts'
export type { GreenhouseMethod } from './methods/greenhouse.ts'
export { type HeatedMethod, heatedSchema } from './methods/heated.ts'
export type { NaturalAirBinMethod } from './methods/natural-air-bin.ts'
export type { OpenAirMethod } from './methods/open-air.ts'
export type { ShadeMethod } from './methods/shade.ts'
export type { SolarCabinetMethod } from './methods/solar-cabinet.ts'
export type { TunnelMethod } from './methods/tunnel.ts'

type MethodSchema = MethodModels[number]['schema']

/** The union of every registered method's schema, told apart by `kind`. */
export const dryingMethodSchema = z.discriminatedUnion(
  'kind',
  METHOD_MODELS.map((m) => m.schema) as unknown as [MethodSchema, ...MethodSchema[]],
)

export type DryingMethod = z.output<MethodSchema>
export type DryingMethodInput = z.input<MethodSchema>
export type DryingMethodKind = DryingMethod['kind']
export const DRYING_METHOD_KINDS: readonly DryingMethodKind[] = METHOD_MODELS.map(
  (m) => m.kind as DryingMethodKind,
)

/**
 * Validate a method and fill its defaults. Throws a RangeError naming the field and what is accepted,
 * e.g. `method.absorptivity: absorptivity must be between 0 and 1 (got 1.4)`.
 */
export function parseDryingMethod(input: unknown): DryingMethod {
  const result = dryingMethodSchema.safeParse(input)
  if (result.success) return result.data as DryingMethod
  const issue = result.error.issues[0]
  const path = issue.path.length > 0 ? `method.${issue.path.join('.')}` : 'method'
  const got =
    issue.path.length > 0 && typeof input === 'object' && input !== null
      ? (input as Record<string, unknown>)[String(issue.path[0])]
      : input
  const gotText = got === undefined ? '' : ` (got ${JSON.stringify(got)})`
  const hint =
    issue.path[0] === 'kind' || issue.path.length === 0 ? `; kinds: ${DRYING_METHOD_KINDS.join(', ')}` : ''
  throw new RangeError(`${path}: ${issue.message}${gotText}${hint}`)
}
