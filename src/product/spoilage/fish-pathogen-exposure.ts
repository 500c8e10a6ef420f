/**
 * @module product/spoilage/fish-pathogen-exposure
 * Fresh (unsalted) fish spoils while wet by bacteria, and the hazard that matters is pathogen growth and toxin
 * formation. dryhours counts the fish's cumulative time-temperature exposure against the limits of the US FDA
 * seafood HACCP guidance, while the fish's water activity still allows a pathogen to grow:
 *
 * - US FDA (2020), *Fish and Fishery Products Hazards and Controls Guidance*, 4th edition (revision of March
 *   2020), Appendix 4 "Bacterial Pathogen Growth and Inactivation", summary of Table A-2, for raw, ready-to-eat
 *   products: "If at any time the product is held at internal temperatures above 70°F (21.1°C), exposure time
 *   (i.e., time at internal temperatures above 50°F (10°C) but below 135ºF (57.2ºC)) should be limited to 2 hours
 *   (3 hours if Staphylococcus aureus (S. aureus) is the only pathogen of concern), OR Alternatively, exposure
 *   time (…) should be limited to 4 hours, as long as no more than 2 of those hours are between 70°F (21.1°C) and
 *   135ºF (57.2ºC)". Read in a web page that reproduces the appendix (dated March 18, 2020:
 *   msu-prod.dotcms.cloud/resources/appendix-4-bacterial-pathogen-growth-and-inactivation); the FDA PDF itself
 *   and the table were not read, hence `transcribed`.
 * - The lowest water activity at which a pathogen grows: S. aureus, 0.83 (0.9 anaerobically), the lowest of the
 *   pathogens listed in ICMSF (1996) *Microorganisms in Foods 5: Characteristics of Microbial Pathogens*, as
 *   tabulated by the USDA ARS Pathogen Modeling Program, "Growth Factors for Selected Bacteria"
 *   (pmp.errc.ars.usda.gov/GrowthFactors.aspx). FDA Table A-1 gives the same 0.83 for S. aureus growth (from
 *   memory: Table A-1 itself was not read).
 *
 * The measure is the allowed exposure used, counted in 24ths (the limit is 24, so the measure reads as hours at
 * 4.4–10 °C): every hour with aw ≥ 0.83 adds 12 above 21.1 °C (up to 57.2 °C: 2 hours reach the limit), 6 above
 * 10 °C up to 21.1 °C (4 hours) and, from memory, 1 above 4.4 °C up to 10 °C (24 hours). Whole numbers keep the
 * sum exact, so a fish held in one band reaches the limit after exactly that band's hours. The sum keeps within
 * the FDA summary: it allows at most 2 hours above 21.1 °C and at most 4 hours above
 * 10 °C in all (2·h₂₁ + h₁₀ ≤ 4), where the summary allows 4 hours above 10 °C with up to 2 of them above
 * 21.1 °C. The FDA's own limit for fish never above 21.1 °C is longer (5 hours, from memory; not used: 4 hours is
 * the stricter read limit); the 4.4–10 °C band (24 hours above 40°F for product never above 50°F) is from memory
 * of the same summary. The FDA warns that bacterial growth is logarithmic and linear interpolation may not be
 * appropriate: the sum is used only inside the summary's own allowance, never to stretch it.
 *
 * Nothing accrues at or above 57.2 °C (the summary's upper end of exposure time; the highest maximum growth
 * temperature among ICMSF's pathogens in the same ARS table is 55 °C, B. cereus) or at aw below 0.83. Salted fish
 * held near the aw of saturated brine (about 0.75) is below every pathogen's limit but still moulds:
 * `spoilageModelFor` gives salted fish the mould-free-time model instead.
 */
import {
  checkHourStepper,
  checkStepInput,
  type SpoilageHourStepper,
  type SpoilageModel,
  type SpoilageState,
  type SpoilageStepInput,
} from './model.ts'

/** Lowest water activity at which a pathogen grows: S. aureus (ICMSF 1996, as tabulated by the USDA ARS Pathogen Modeling Program). */
export const FISH_PATHOGEN_MIN_AW = 0.83
/** Upper end of exposure time, 135 °F [°C]: FDA 2020, Appendix 4, summary of Table A-2 (as reproduced, see module). */
export const FISH_EXPOSURE_MAX_C = 57.2
/** 70 °F [°C]: above it the 2-hour limit (FDA 2020, Appendix 4, summary of Table A-2). */
export const FISH_HOT_C = 21.1
/** 50 °F [°C]: exposure time is time above it (FDA 2020, Appendix 4, summary of Table A-2). */
export const FISH_WARM_C = 10
/** 40 °F [°C]: the cold band's lower end, from memory of the same summary (its text was not read). */
export const FISH_COOL_C = 4.4
/** Hours allowed above 21.1 °C (FDA 2020, Appendix 4, summary of Table A-2: 2 hours; 3 if S. aureus is the only concern, not used). */
export const FISH_HOT_LIMIT_H = 2
/** Hours allowed above 10 °C in all (FDA 2020, Appendix 4, summary of Table A-2: 4 hours, no more than 2 above 21.1 °C). */
export const FISH_WARM_LIMIT_H = 4
/** Hours allowed above 4.4 °C for fish never above 10 °C: 24, from memory of the same summary (not read). */
export const FISH_COOL_LIMIT_H = 24

/** The measure at which the fish has spoiled: the allowed exposure, in 24ths (hours at 4.4–10 °C). */
export const FISH_EXPOSURE_LIMIT = FISH_COOL_LIMIT_H

/**
 * What one hour at `productTempC` and `waterActivity` adds to the measure, in 24ths of the allowed exposure:
 * 12 above 21.1 °C, 6 above 10 °C, 1 above 4.4 °C (all below 57.2 °C, with aw ≥ 0.83), else 0.
 */
export function fishExposurePerHour(productTempC: number, waterActivity: number): number {
  if (!(waterActivity >= FISH_PATHOGEN_MIN_AW) || !(productTempC < FISH_EXPOSURE_MAX_C)) return 0
  if (productTempC > FISH_HOT_C) return FISH_EXPOSURE_LIMIT / FISH_HOT_LIMIT_H
  if (productTempC > FISH_WARM_C) return FISH_EXPOSURE_LIMIT / FISH_WARM_LIMIT_H
  if (productTempC > FISH_COOL_C) return FISH_EXPOSURE_LIMIT / FISH_COOL_LIMIT_H
  return 0
}

/** The exposure model fed hour by hour through fields. */
class ExposureHours implements SpoilageHourStepper {
  productTempC = Number.NaN
  moistureWbPct = Number.NaN
  waterActivity = Number.NaN
  measure = 0
  hoursAtRisk = 0
  hours = 0
  stepHour(): void {
    checkHourStepper(this)
    const f = fishExposurePerHour(this.productTempC, this.waterActivity)
    if (f > 0) {
      this.measure += f
      this.hoursAtRisk += 1
    }
    this.hours += 1
  }
  state(): SpoilageState {
    return { measure: this.measure, hoursAtRisk: this.hoursAtRisk, hoursOutsideRange: 0, hours: this.hours }
  }
}

export const FISH_PATHOGEN_EXPOSURE: SpoilageModel = {
  id: 'fish-pathogen-exposure',
  name: 'Fish: cumulative exposure to pathogen growth (FDA seafood HACCP time-temperature limits)',
  appliesTo: ['fish'],
  source: {
    citation:
      'US FDA 2020, Fish and Fishery Products Hazards and Controls Guidance, 4th edition (March 2020 revision), Appendix 4 "Bacterial Pathogen Growth and Inactivation", summary of Table A-2 (raw, ready-to-eat products), as given in a web page reproducing the appendix (msu-prod.dotcms.cloud/resources/appendix-4-bacterial-pathogen-growth-and-inactivation; the FDA PDF not read); lowest water activity for growth (S. aureus 0.83): ICMSF 1996, Microorganisms in Foods 5, as tabulated in USDA ARS Pathogen Modeling Program, Growth Factors for Selected Bacteria',
    equation: `while aw ≥ ${FISH_PATHOGEN_MIN_AW}, each hour uses 1/${FISH_HOT_LIMIT_H} of the allowed exposure above ${FISH_HOT_C} °C and below ${FISH_EXPOSURE_MAX_C} °C, 1/${FISH_WARM_LIMIT_H} above ${FISH_WARM_C} °C up to ${FISH_HOT_C} °C (FDA: at most ${FISH_HOT_LIMIT_H} h above ${FISH_HOT_C} °C, at most ${FISH_WARM_LIMIT_H} h above ${FISH_WARM_C} °C with no more than ${FISH_HOT_LIMIT_H} of them above ${FISH_HOT_C} °C), 1/${FISH_COOL_LIMIT_H} above ${FISH_COOL_C} °C up to ${FISH_WARM_C} °C (from memory); spoiled when it is all used (measure in 24ths: 12, 6 and 1 per hour, limit ${FISH_EXPOSURE_LIMIT})`,
    confidence: 'transcribed',
    short: 'US FDA 2020 seafood HACCP guidance, App. 4, Table A-2 summary (as reproduced); ICMSF 1996',
  },
  // read as "<limit> <unit> <name>": "24 twenty-fourths of the allowed pathogen-growth exposure used (…)"
  measureName:
    'of the allowed pathogen-growth exposure used (an hour above 21.1 °C counts 12, above 10 °C 6, above 4.4 °C 1)',
  measureUnit: 'twenty-fourths',
  spoiledAt: FISH_EXPOSURE_LIMIT,
  spoiledAtSource:
    'FDA 2020, Appendix 4, summary of Table A-2: 2 h above 21.1 °C, 4 h above 10 °C in all (below 57.2 °C); 24 h above 4.4 °C from memory',
  atRiskWhen: `water activity ≥ ${FISH_PATHOGEN_MIN_AW} with the fish above ${FISH_COOL_C} °C and below ${FISH_EXPOSURE_MAX_C} °C`,
  validity:
    'limits for raw, ready-to-eat fish under ordinary circumstances, for the pathogens of greatest concern in seafood; the fish temperature is the engine’s product temperature (in a heated dryer the air temperature, though wet fish sits nearer the wet-bulb temperature); not a model of growth, and says nothing of histamine or of spoilage bacteria',
  cautions: [
    'Food safety: these are US FDA seafood HACCP time-temperature limits; follow your local food regulations and HACCP plan, and keep fresh fish at or below 4.4 °C (40 °F) until drying starts.',
    'Warm, fresh fish uses up these limits within hours, in the sun and in a dryer below about 57 °C alike (and wet fish stays nearer the wet-bulb temperature than the air until its surface dries): chill it until drying starts, salt or brine it first (below water activity 0.83 nothing is counted here; the fish-fillets-salted profile), or follow a drying process validated for your product.',
    'Histamine-forming fish (tuna, mackerel, sardines) can become unsafe without looking or smelling spoiled, and histamine is not destroyed by drying or cooking.',
    'Protect drying fish from flies (blowfly larvae), animals and rain.',
  ],
  step(state: SpoilageState, input: SpoilageStepInput): SpoilageState {
    checkStepInput(input)
    const f = fishExposurePerHour(input.productTempC, input.waterActivity)
    const h = f > 0 ? input.hours : 0
    return {
      measure: state.measure + f * input.hours,
      hoursAtRisk: state.hoursAtRisk + h,
      hoursOutsideRange: state.hoursOutsideRange,
      hours: state.hours + input.hours,
    }
  },
  hourStepper: () => new ExposureHours(),
}
