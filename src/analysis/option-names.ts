/**
 * @module analysis/option-names
 * The names of the options that are not weather options (those are in weather/option-spec.ts) as each
 * interface spells them: the CLI flag the core's messages use, the API's query parameter and JSON key, and
 * the page's field label. With the weather options' table this is the one table of option names: core
 * messages name an option by its CLI flag (`--drying-temp`), and `optionWords(message, surface)` rewrites the
 * message for the interface that will show it, so a page or API user never reads a CLI flag (and a CLI user
 * never an API key). The page's labels of these fields (web/page-fields.ts) come from here.
 */
import { type OptionSurface, renderOptionNames } from '../weather/option-spec.ts'

export interface OptionName {
  /** CLI flag, without the dashes (as core messages write it). */
  flag: string
  /** API query parameter. */
  param: string
  /** Key in the API's JSON options. */
  key: string
  /** The page's label of the field. */
  label: string
  /** The page's form field, where the page has one. */
  field?: string
}

/** Options of assess, compare, fit and the energy charts that core messages name. */
export const OTHER_OPTION_NAMES: readonly OptionName[] = [
  { flag: 'fuel', param: 'fuel', key: 'fuel', label: 'Fuel', field: 'fuel' },
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
  {
    flag: 'baseline',
    param: 'baseline',
    key: 'baseline',
    label: 'Batches in the baseline',
    field: 'baseline',
  },
  {
    flag: 'drying-temp',
    param: 'dryingTempC',
    key: 'dryingTempC',
    label: 'Drying-air temperature',
    field: 'dryingTempC',
  },
  { flag: 'product', param: 'product', key: 'product', label: 'Product', field: 'product' },
  { flag: 'method', param: 'method', key: 'method', label: 'Drying method', field: 'method' },
]

/**
 * The energy charts' own names where a flag means something else there: `energy-chart --utc-offset` is the
 * offset of the log's times (the API's `utcOffsetHours`, the page's log offset), not of a weather file's.
 */
export const ENERGY_OPTION_NAMES: readonly OptionName[] = [
  {
    flag: 'utc-offset',
    param: 'utcOffsetHours',
    key: 'utcOffsetHours',
    label: "UTC offset of the log's times",
    field: 'logUtcOffset',
  },
]

/** Where a message is shown: an assessment's answers, or the energy charts (whose names differ, above). */
export type OptionContext = 'assess' | 'energy'

const ENERGY_NAMES = [...ENERGY_OPTION_NAMES, ...OTHER_OPTION_NAMES]

/** A core message with every option (weather or other) named as `surface` names it. */
export function optionWords(
  message: string,
  surface: OptionSurface,
  context: OptionContext = 'assess',
): string {
  return renderOptionNames(message, surface, context === 'energy' ? ENERGY_NAMES : OTHER_OPTION_NAMES)
}

/** Each of `messages` with its options named as `surface` names them. */
export function optionWordsAll(
  messages: readonly string[],
  surface: OptionSurface,
  context: OptionContext = 'assess',
): string[] {
  return messages.map((m) => optionWords(m, surface, context))
}
