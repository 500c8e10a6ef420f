/**
 * @module product/catalogue
 * The built-in product catalogue and lookup by id.
 */
import { FRUIT_PROFILES } from './catalogue-fruit.ts'
import { GRAIN_PROFILES } from './catalogue-grains.ts'
import { OTHER_PROFILES } from './catalogue-other.ts'
import { PRETREATED_PROFILES } from './catalogue-pretreated.ts'
import { VEGETABLE_PROFILES } from './catalogue-vegetables.ts'
import type { ProductProfile } from './profile.ts'

export const PRODUCT_CATALOGUE: readonly ProductProfile[] = [
  ...GRAIN_PROFILES,
  ...FRUIT_PROFILES,
  ...VEGETABLE_PROFILES,
  ...OTHER_PROFILES,
  ...PRETREATED_PROFILES,
]

export function productIds(): string[] {
  return PRODUCT_CATALOGUE.map((p) => p.id)
}

/** The catalogue profile with this id; RangeError listing the ids when unknown. */
export function productById(id: string): ProductProfile {
  const p = PRODUCT_CATALOGUE.find((x) => x.id === id)
  if (!p) throw new RangeError(`unknown product '${id}'; known products: ${productIds().join(', ')}`)
  return p
}
