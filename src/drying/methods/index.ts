/**
 * @module drying/methods
 * The registry of drying methods. To add one: write `drying/methods/<kind>.ts` exporting a
 * {@link MethodModel} (its zod schema with `kind: z.literal('<kind>')`, what it assumes, and `prepare`,
 * which returns the per-hour function setting the air at the product, the product temperature and the
 * energy put in), and add it to {@link METHOD_MODELS} below. The schema union, the kinds accepted by the
 * CLI, the API and the page, the assumptions of an assessment and the hourly engine all follow from
 * this list.
 */
import { greenhouse } from './greenhouse.ts'
import { heated } from './heated.ts'
import type { MethodModel } from './method-model.ts'
import { naturalAirBin } from './natural-air-bin.ts'
import { openAir } from './open-air.ts'
import { shade } from './shade.ts'
import { solarCabinet } from './solar-cabinet.ts'
import { tunnel } from './tunnel.ts'

/** Every drying method, in the order the CLI, the API and the page list them. */
export const METHOD_MODELS = [
  openAir,
  shade,
  solarCabinet,
  tunnel,
  heated,
  naturalAirBin,
  greenhouse,
] as const

export type MethodModels = typeof METHOD_MODELS

/** The model of the method `kind`. Throws RangeError naming the kinds when there is none. */
export function methodModel(kind: string): MethodModel {
  const m = (METHOD_MODELS as readonly MethodModel[]).find((x) => x.kind === kind)
  if (!m) {
    throw new RangeError(
      `unknown drying method '${kind}'; kinds: ${METHOD_MODELS.map((x) => x.kind).join(', ')}`,
    )
  }
  return m
}

/**
 * The loading [kg fresh per m²] a method states, for exposed methods and methods sized by a drying area
 * (`usesLoading`) that give one (`loadingKgPerM2`); undefined otherwise (the product profile's default
 * loading then applies).
 */
export function methodLoadingKgPerM2(method: { kind: string; loadingKgPerM2?: number }): number | undefined {
  const model = methodModel(method.kind)
  return model.exposure === 'exposed' || model.usesLoading === true ? method.loadingKgPerM2 : undefined
}
