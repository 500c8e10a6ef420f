/**
 * @module analysis/option-names
 * The names of the options that are not weather options (those are in weather/option-spec.ts) as each
 * interface spells them: the CLI flag the core's messages use, the API's query parameter and JSON key, and
 * the page's field label. `optionWords(message, surface)` rewrites a core message for the interface that
 * will show it, so a page or API user never reads a CLI flag (and a CLI user never an API key).
 */
import { type OptionSurface, renderOptionNames } from '../weather/option-spec.ts'

export interface OptionName {
  /** CLI flag, without the dashes (as core messages write it). */
  flag: string
  /** API query parameter (and the page's form field). */
  param: string
  /** Key in the API's JSON options. */
  key: string
  /** The page's label of the field. */
  label: string
}

/** Options of assess, compare, fit and the energy charts that core messages name. */
export const OTHER_OPTION_NAMES: readonly OptionName[] = [
  { flag: 'fuel', param: 'fuel', key: 'fuel', label: 'Fuel' },
  { flag: 'dry-mass', param: 'dryMass', key: 'dryMass', label: 'Dry mass of the tray contents [g]' },
  {
    flag: 'initial-wb',
    param: 'initialWb',
    key: 'initialWb',
    label: 'Moisture at the first weighing [% wet basis]',
  },
  {
    flag: 'final-wb',
    param: 'finalWb',
    key: 'finalWb',
    label: 'Moisture at the last weighing [% wet basis]',
  },
  { flag: 'baseline', param: 'baseline', key: 'baseline', label: 'Batches in the baseline' },
  { flag: 'product', param: 'product', key: 'product', label: 'Product' },
  { flag: 'method', param: 'method', key: 'method', label: 'Method' },
]

/** A core message with every option (weather or other) named as `surface` names it. */
export function optionWords(message: string, surface: OptionSurface): string {
  return renderOptionNames(message, surface, OTHER_OPTION_NAMES)
}
