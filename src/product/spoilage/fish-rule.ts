/**
 * @module product/spoilage/fish-rule
 * Fish: no mould-germination model fits unsalted fish, whose spoilage while wet is bacterial. dryhours uses a
 * stated conservative rule, common practice, no source: at most 24 hours above water activity 0.91 (the level
 * above which most bacteria grow; Beuchat 1981, *Cereal Foods World* 26:345, from memory of that table) while the
 * fish is at 10 °C or warmer. Salted fish held near the aw of saturated brine (about 0.75) stays below the
 * bacterial level but still moulds: `spoilageModelFor` gives salted fish the mould-free-time model instead.
 */
import {
  checkHourStepper,
  checkStepInput,
  type SpoilageHourStepper,
  type SpoilageModel,
  type SpoilageState,
  type SpoilageStepInput,
} from './model.ts'

export const FISH_BACTERIAL_AW = 0.91
export const FISH_WARM_C = 10
export const FISH_LIMIT_HOURS = 24

/** The fish rule fed hour by hour through fields. */
class WetWarmHours implements SpoilageHourStepper {
  productTempC = Number.NaN
  moistureWbPct = Number.NaN
  waterActivity = Number.NaN
  measure = 0
  hours = 0
  stepHour(): void {
    checkHourStepper(this)
    if (this.waterActivity >= FISH_BACTERIAL_AW && this.productTempC >= FISH_WARM_C) this.measure += 1
    this.hours += 1
  }
  state(): SpoilageState {
    return { measure: this.measure, hoursAtRisk: this.measure, hoursOutsideRange: 0, hours: this.hours }
  }
}

export const FISH_WET_WARM_RULE: SpoilageModel = {
  id: 'fish-wet-warm-hours',
  name: 'Fish: hours wet and warm (common practice, no source)',
  appliesTo: ['fish'],
  source: {
    citation: 'common practice, no source',
    equation: `hours with aw ≥ ${FISH_BACTERIAL_AW} and product ≥ ${FISH_WARM_C} °C ≤ ${FISH_LIMIT_HOURS} h`,
    confidence: 'memory',
    short: 'common practice, no source',
  },
  measureName: `hours at aw ≥ ${FISH_BACTERIAL_AW} and ≥ ${FISH_WARM_C} °C`,
  measureUnit: 'h',
  spoiledAt: FISH_LIMIT_HOURS,
  spoiledAtSource: 'common practice, no source',
  atRiskWhen: `water activity ≥ ${FISH_BACTERIAL_AW} at ${FISH_WARM_C} °C or warmer`,
  validity: 'a rule of thumb; not a model of bacterial growth',
  cautions: [
    'Fish spoils by bacteria while wet; histamine-forming fish (tuna, mackerel, sardines) can become unsafe without looking spoiled: keep fresh fish cold until drying starts.',
    'Protect drying fish from flies (blowfly larvae) and rain.',
  ],
  step(state: SpoilageState, input: SpoilageStepInput): SpoilageState {
    checkStepInput(input)
    const atRisk = input.waterActivity >= FISH_BACTERIAL_AW && input.productTempC >= FISH_WARM_C
    const h = atRisk ? input.hours : 0
    return {
      measure: state.measure + h,
      hoursAtRisk: state.hoursAtRisk + h,
      hoursOutsideRange: state.hoursOutsideRange,
      hours: state.hours + input.hours,
    }
  },
  hourStepper: () => new WetWarmHours(),
}
