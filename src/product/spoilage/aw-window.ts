/**
 * @module product/spoilage/aw-window
 * The mould and ochratoxin window of coffee (and, by analogy, cocoa): hours the product spends at a water
 * activity where ochratoxin-producing aspergilli grow but the product is still far from dry.
 *
 * Coffee: "all coffee, cherry or parchment, must spend no more than four days between [water activity of]
 * 0.95 … and … 0.80" — the HACCP guidance of the FAO *Guidelines for the Prevention of Mould Formation in
 * Coffee* (FAO 2006), as quoted by Kornman, C. (2016), *Green Coffee Analytics, Part I: Total moisture content
 * and water activity* (confidence `transcribed`: the FAO text itself was not read). Codex CAC/RCP 69-2009 (Code of
 * practice for the prevention and reduction of ochratoxin A contamination in coffee, §1) names FAO 2006 as its
 * basis and the OTA producers in coffee (A. ochraceus group, A. niger group, A. carbonarius).
 *
 * Cocoa: Codex CAC/RCP 72-2013 (§2) names the same OTA producers (A. carbonarius, A. niger aggregate) for cocoa
 * beans; no cocoa-specific time limit was read, so the coffee window is applied by analogy (confidence `memory`
 * for the transfer, said so in the model's source).
 */
import {
  checkHourStepper,
  checkStepInput,
  type SpoilageHourStepper,
  type SpoilageModel,
  type SpoilageState,
  type SpoilageStepInput,
} from './model.ts'

export interface AwWindowSpec {
  id: string
  name: string
  appliesTo: string[]
  /** Lower and upper water activity of the window (inclusive). */
  awLow: number
  awHigh: number
  /** Hours in the window at which the batch counts as spoiled. */
  limitHours: number
  source: SpoilageModel['source']
  spoiledAtSource: string
  cautions: string[]
}

/** A window model fed hour by hour through fields. */
class WindowHours implements SpoilageHourStepper {
  productTempC = Number.NaN
  moistureWbPct = Number.NaN
  waterActivity = Number.NaN
  measure = 0
  hours = 0
  constructor(
    readonly awLow: number,
    readonly awHigh: number,
  ) {}
  stepHour(): void {
    checkHourStepper(this)
    if (this.waterActivity >= this.awLow && this.waterActivity <= this.awHigh) this.measure += 1
    this.hours += 1
  }
  state(): SpoilageState {
    return { measure: this.measure, hoursAtRisk: this.measure, hoursOutsideRange: 0, hours: this.hours }
  }
}

/** A window model: `measure` is the hours spent with awLow ≤ aw ≤ awHigh. */
export function awWindowModel(spec: AwWindowSpec): SpoilageModel {
  if (!(spec.awLow > 0 && spec.awLow < spec.awHigh && spec.awHigh <= 1)) {
    throw new RangeError(`aw window must satisfy 0 < awLow < awHigh ≤ 1, got ${spec.awLow}–${spec.awHigh}`)
  }
  if (!(spec.limitHours > 0)) throw new RangeError(`limitHours must be > 0, got ${spec.limitHours}`)
  return {
    id: spec.id,
    name: spec.name,
    appliesTo: spec.appliesTo,
    source: spec.source,
    measureName: `hours at water activity ${spec.awLow}–${spec.awHigh}`,
    measureUnit: 'h',
    spoiledAt: spec.limitHours,
    spoiledAtSource: spec.spoiledAtSource,
    atRiskWhen: `water activity between ${spec.awLow} and ${spec.awHigh}`,
    validity: 'a rule on water activity alone; temperature is not part of it',
    cautions: spec.cautions,
    step(state: SpoilageState, input: SpoilageStepInput): SpoilageState {
      checkStepInput(input)
      const inWindow = input.waterActivity >= spec.awLow && input.waterActivity <= spec.awHigh
      const h = inWindow ? input.hours : 0
      return {
        measure: state.measure + h,
        hoursAtRisk: state.hoursAtRisk + h,
        hoursOutsideRange: state.hoursOutsideRange,
        hours: state.hours + input.hours,
      }
    },
    hourStepper: () => new WindowHours(spec.awLow, spec.awHigh),
  }
}

const OTA_CAUTIONS = [
  'Ochratoxin A cannot be seen or smelled: where the window was exceeded, have lots tested before sale.',
  'Never dry on bare earth; keep drying layers thin and turn them; protect from rain and dew.',
]

/** Coffee (cherry or parchment): at most 96 h between aw 0.95 and 0.80. */
export const COFFEE_OTA_WINDOW: SpoilageModel = awWindowModel({
  id: 'coffee-ota-window',
  name: 'Coffee mould and ochratoxin window (aw 0.95–0.80 within four days)',
  appliesTo: ['coffee-parchment', 'beverage-crop'],
  awLow: 0.8,
  awHigh: 0.95,
  limitHours: 96,
  source: {
    citation:
      'FAO 2006, Guidelines for the Prevention of Mould Formation in Coffee (HACCP guidance), as quoted in Kornman, C. 2016, Green Coffee Analytics Part I: Total Moisture Content and Water Activity; basis of Codex CAC/RCP 69-2009',
    equation: '"all coffee, cherry or parchment, must spend no more than four days between 0.95 and 0.80" aw',
    confidence: 'transcribed',
    short: 'FAO 2006 as quoted by Kornman 2016',
  },
  spoiledAtSource: 'four days (96 h) between aw 0.95 and 0.80 (FAO 2006 as quoted)',
  cautions: OTA_CAUTIONS,
})

/** Cocoa beans after fermentation: the coffee window applied by analogy. */
export const COCOA_OTA_WINDOW: SpoilageModel = awWindowModel({
  id: 'cocoa-ota-window',
  name: 'Cocoa mould and ochratoxin window (coffee rule applied by analogy)',
  appliesTo: ['cocoa-beans'],
  awLow: 0.8,
  awHigh: 0.95,
  limitHours: 96,
  source: {
    citation:
      'Codex CAC/RCP 72-2013, Code of practice for the prevention and reduction of ochratoxin A contamination in cocoa, §2 (same OTA-producing aspergilli as in coffee); time limit taken over from FAO 2006 (coffee) by analogy, no cocoa-specific limit read',
    equation: 'hours between aw 0.95 and 0.80 ≤ 96 h (coffee rule, analogy)',
    confidence: 'memory',
    short: 'Codex CAC/RCP 72-2013; coffee limit by analogy',
  },
  spoiledAtSource: 'coffee rule (FAO 2006 as quoted) applied to cocoa by analogy: no cocoa-specific source',
  cautions: OTA_CAUTIONS,
})
