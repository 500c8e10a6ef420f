/**
 * @module product/catalogue-pretreated
 * Pretreated variants derived from catalogue profiles by published factors (product/pretreatment-variants.ts).
 * The dipped grapes stay in catalogue-fruit.ts, where users have always found them.
 */
import { appleSlices, figs } from './catalogue-fruit.ts'
import { tomatoHalves } from './catalogue-vegetables.ts'
import { derivePretreatedVariant } from './pretreatment-variants.ts'
import type { ProductProfile } from './profile.ts'

export const figsPeeled: ProductProfile = {
  ...derivePretreatedVariant(figs, 'figs-peeled'),
  cautions: [
    ...figs.cautions,
    'Peeled figs are sticky and bruise easily: dry them on clean mesh, away from dust.',
  ],
}

export const tomatoHalvesDipped: ProductProfile = {
  ...derivePretreatedVariant(tomatoHalves, 'tomato-halves-dipped'),
  cautions: [
    ...tomatoHalves.cautions,
    'Use food-grade ethyl oleate and potassium carbonate at the stated strength.',
  ],
}

export const appleSlicesOsmotic: ProductProfile = {
  ...derivePretreatedVariant(appleSlices, 'apple-slices-osmotic'),
  cautions: [
    ...appleSlices.cautions,
    'Osmotically pre-dried fruit is sticky and sugar-rich: store it sealed.',
  ],
}

export const PRETREATED_PROFILES: readonly ProductProfile[] = [
  figsPeeled,
  tomatoHalvesDipped,
  appleSlicesOsmotic,
]
