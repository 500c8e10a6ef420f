/**
 * @module product/catalogue
 * The built-in product catalogue and lookup by id, with the older ids it still accepts.
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

/**
 * An id the catalogue once gave a profile that now has another: still accepted, and it means what it meant
 * (the same profile, the same numbers), so a saved sites file, profile or link gives the same answer.
 */
export interface ProductAlias {
  alias: string
  id: string
  note: string
}

export const PRODUCT_ALIASES: readonly ProductAlias[] = [
  {
    alias: 'chili-peppers-unblanched',
    id: 'chili-peppers',
    note: 'unblanched chillies, now the plain chili-peppers (the same profile); blanched chillies, which chili-peppers named before, are now chili-peppers-blanched',
  },
]

export function productIds(): string[] {
  return PRODUCT_CATALOGUE.map((p) => p.id)
}

/** The current id for `id`: itself, or the profile an older id (PRODUCT_ALIASES) now names. */
export function canonicalProductId(id: string): string {
  return PRODUCT_ALIASES.find((a) => a.alias === id)?.id ?? id
}

/**
 * The catalogue profile with this id (or an older id still accepted, PRODUCT_ALIASES); RangeError listing the
 * ids when unknown.
 */
export function productById(id: string): ProductProfile {
  const current = canonicalProductId(id)
  const p = PRODUCT_CATALOGUE.find((x) => x.id === current)
  if (!p) throw new RangeError(`unknown product '${id}'; known products: ${productIds().join(', ')}`)
  return p
}
