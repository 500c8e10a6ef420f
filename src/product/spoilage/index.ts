/**
 * @module product/spoilage
 * Spoilage during drying, one published model (or stated rule) per product family, and the choice of model
 * for a product profile. See `model.ts` for the shared shape and `docs/spoilage-and-bins.md` for limits.
 */
import type { ProductProfile } from '../profile.ts'
import { COCOA_OTA_WINDOW, COFFEE_OTA_WINDOW } from './aw-window.ts'
import { FISH_PATHOGEN_EXPOSURE } from './fish-pathogen-exposure.ts'
import { grainDryMatterLossModel } from './grain-dml.ts'
import type { SpoilageModel } from './model.ts'
import { mouldFreeTimeModel } from './mould-free-time.ts'

export * from './aw-window.ts'
export * from './fish-pathogen-exposure.ts'
export * from './grain-dml.ts'
export * from './model.ts'
export * from './mould-free-time.ts'
export * from './surface-water-activity.ts'

/** Every model, for listing (the grain model with its default damage and threshold). */
export function spoilageModels(): SpoilageModel[] {
  return [
    grainDryMatterLossModel(),
    COFFEE_OTA_WINDOW,
    COCOA_OTA_WINDOW,
    mouldFreeTimeModel(),
    FISH_PATHOGEN_EXPOSURE,
  ]
}

/**
 * The spoilage model for a product: by id first (coffee, cocoa), then by category. Hops and other products
 * without a family of their own get the mould-free-time model.
 */
export function spoilageModelFor(
  profile: Pick<ProductProfile, 'id' | 'category' | 'variantOf'>,
): SpoilageModel {
  const ids = [profile.id, profile.variantOf].filter((x): x is string => typeof x === 'string')
  if (ids.some((id) => id.startsWith('coffee'))) return COFFEE_OTA_WINDOW
  if (ids.some((id) => id.startsWith('cocoa'))) return COCOA_OTA_WINDOW
  if (profile.category === 'fish' && ids.some((id) => id.includes('salted')))
    return mouldFreeTimeModel(['fish-salted'])
  switch (profile.category) {
    case 'grain':
    case 'oilseed':
      return grainDryMatterLossModel()
    case 'fish':
      return FISH_PATHOGEN_EXPOSURE
    default:
      return mouldFreeTimeModel()
  }
}
