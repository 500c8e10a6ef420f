/**
 * @module analysis/energy/energy-words
 * An energy chart's messages (summary, assumptions, warnings) with the options named as the interface that
 * shows them names them (analysis/option-names.ts): the core writes CLI flags (`set --baseline`), the API its
 * keys (`baseline`, `dryingTempC`, `utcOffsetHours`), the page its labels.
 */

import type { OptionSurface } from '../../weather/option-spec.ts'
import { optionWordsAll } from '../option-names.ts'
import type { EnergyChartAssessment } from './energy-chart.ts'

export function energyChartWords(a: EnergyChartAssessment, surface: OptionSurface): EnergyChartAssessment {
  if (surface === 'cli') return a
  return {
    ...a,
    summary: optionWordsAll(a.summary, surface, 'energy'),
    assumptions: optionWordsAll(a.assumptions, surface, 'energy'),
    warnings: optionWordsAll(a.warnings, surface, 'energy'),
  }
}
