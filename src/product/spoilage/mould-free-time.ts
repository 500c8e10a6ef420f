/**
 * @module product/spoilage/mould-free-time
 * Mould-free time of intermediate-moisture foods as a function of water activity and temperature: the
 * mould-free shelf-life (MFSL) equations of the UK Flour Milling and Baking Research Association (Seiler;
 * Cauvain & Seiler), log-linear in the equilibrium relative humidity ERH = 100·aw:
 *   27 °C: log10 MFSL[days] = 6.42 − 0.0647·ERH
 *     (read as eq. 3.34 in Adams, M.R. & Moss, M.O., *Food Microbiology*, Royal Society of Chemistry, ch. 3,
 *     "Factors affecting the growth and survival of micro-organisms in foods", a textbook that quotes it:
 *     `transcribed`);
 *   21 °C: log10 MFSL[days] = 7.91 − 0.081·ERH, validated for aw 0.74–0.90
 *     (as reproduced, with its validity range, from Cauvain & Seiler's cake work in a practitioners' forum:
 *     `transcribed`, from a weaker copy).
 * Under varying conditions the fraction of mould-free time used adds up, Σ Δt/MFSL(T, aw) (the same additive
 * use of a constant-condition time as the grain allowable-storage-time rule); mould is expected once it reaches 1.
 *
 * An isopleth-type model in (T, aw) for fruit, vegetables and herbs, measured on cakes: an approximation for
 * other sugar-rich intermediate-moisture foods. Along a batch it is fed the water activity at the product's
 * SURFACE, where mould germinates (`waterActivityOf: 'surface'`; the rule and its sources in
 * surface-water-activity.ts), not the piece's mean. The limits below are dryhours' choices:
 * - aw above 0.90 is held at 0.90 (no extrapolation beyond the data; for cut fruit at aw > 0.9 likely
 *   optimistic: wet surfaces also spoil by yeasts and bacteria);
 * - aw below 0.60 adds nothing (no microbial proliferation below aw 0.60: Beuchat, L.R. 1981, *Cereal Foods
 *   World* 26:345; from memory of that table, not re-read); between 0.60 and 0.74 the line is extrapolated;
 * - T is interpolated log-linearly between 21 and 27 °C, extrapolated on the same line up to 35 °C and held
 *   there above; below 21 °C the 21 °C value is used (overstates the risk of cool hours: safe side);
 * - hours with the product at or above 42.5 °C add nothing: at 42.5 °C growth of Aspergillus flavus was
 *   "severely restricted and aflatoxin production altogether inhibited" (Niles, Norman & Pimbley 1985, *Trans.
 *   Br. mycol. Soc.* 84(2):259–266, abstract read; eight strains on wheat and barley, aw 0.80–0.975), and
 *   A. carbonarius, the ochratoxin producer of grapes and raisins, did not grow at 40 °C at any aw from 0.85
 *   to 0.98 (Tassou, Panagou, Natskoulis & Magan 2007, *J. Appl. Microbiol.*, doi 10.1111/j.1365-2672.2007.03480.x,
 *   abstract read). Sun-warmed produce spends much of the day above it; without this cut-off the cake
 *   equations (which fall with temperature up to 35 °C) would count those hours as the most dangerous.
 */
import {
  checkHourStepper,
  checkStepInput,
  type SpoilageHourStepper,
  type SpoilageModel,
  type SpoilageState,
  type SpoilageStepInput,
} from './model.ts'

/** log10 MFSL [days] = intercept − slope·ERH at the two measured temperatures. */
export const MFSL_LINES = [
  { tempC: 21, intercept: 7.91, slopePerErhPct: 0.081 },
  { tempC: 27, intercept: 6.42, slopePerErhPct: 0.0647 },
] as const
export const MFSL_VALID_AW: readonly [number, number] = [0.74, 0.9]
export const MFSL_NO_GROWTH_BELOW_AW = 0.6
export const MFSL_TEMP_RANGE_C: readonly [number, number] = [21, 35]
/** Product temperature at and above which no mould growth is counted [°C] (Niles et al. 1985; Tassou et al. 2007). */
export const MFSL_NO_GROWTH_AT_OR_ABOVE_C = 42.5

/**
 * Mould-free time [days] at constant aw and product temperature; Infinity below aw 0.60 and at or above
 * {@link MFSL_NO_GROWTH_AT_OR_ABOVE_C}. `clamped` says
 * whether aw or T lay outside the equations' measured range (0.74–0.90, 21–27 °C).
 */
export function mouldFreeDays(tempC: number, waterActivity: number): { days: number; clamped: boolean } {
  return { days: mouldFreeDaysValue(tempC, waterActivity), clamped: mouldFreeClamped(tempC, waterActivity) }
}

/** The days of {@link mouldFreeDays} alone (no object: the hour loops call it). */
export function mouldFreeDaysValue(tempC: number, waterActivity: number): number {
  if (waterActivity < MFSL_NO_GROWTH_BELOW_AW || tempC >= MFSL_NO_GROWTH_AT_OR_ABOVE_C)
    return Number.POSITIVE_INFINITY
  const aw = Math.min(waterActivity, MFSL_VALID_AW[1])
  const t = Math.min(Math.max(tempC, MFSL_TEMP_RANGE_C[0]), MFSL_TEMP_RANGE_C[1])
  const erh = 100 * aw
  const [l21, l27] = MFSL_LINES
  const log21 = l21.intercept - l21.slopePerErhPct * erh
  const log27 = l27.intercept - l27.slopePerErhPct * erh
  const log = log21 + ((log27 - log21) * (t - l21.tempC)) / (l27.tempC - l21.tempC)
  return Math.exp(log * Math.LN10)
}

/**
 * Whether aw or T lay outside the equations' measured range (0.74–0.90, 21–27 °C); false where nothing is
 * counted (below aw 0.60, at or above 42.5 °C).
 */
export function mouldFreeClamped(tempC: number, waterActivity: number): boolean {
  if (waterActivity < MFSL_NO_GROWTH_BELOW_AW || tempC >= MFSL_NO_GROWTH_AT_OR_ABOVE_C) return false
  return waterActivity < MFSL_VALID_AW[0] || waterActivity > MFSL_VALID_AW[1] || tempC < 21 || tempC > 27
}

const [LINE_21, LINE_27] = MFSL_LINES
const LINE_SPAN_C = LINE_27.tempC - LINE_21.tempC
// the same constants as plain numbers for the hour loop (no array or object read per hour)
const L21_INTERCEPT = LINE_21.intercept
const L21_SLOPE = LINE_21.slopePerErhPct
const L21_T_C = LINE_21.tempC
const L27_INTERCEPT = LINE_27.intercept
const L27_SLOPE = LINE_27.slopePerErhPct
const VALID_AW_LOW = MFSL_VALID_AW[0]
const VALID_AW_HIGH = MFSL_VALID_AW[1]
const T_RANGE_LOW_C = MFSL_TEMP_RANGE_C[0]
const T_RANGE_HIGH_C = MFSL_TEMP_RANGE_C[1]

/** The mould-free model fed hour by hour through fields (same arithmetic as `step`). */
class MouldFreeHours implements SpoilageHourStepper {
  productTempC = Number.NaN
  moistureWbPct = Number.NaN
  waterActivity = Number.NaN
  measure = 0
  hoursAtRisk = 0
  hoursOutsideRange = 0
  hours = 0
  stepHour(): void {
    checkHourStepper(this)
    const tC = this.productTempC
    const aw = this.waterActivity
    this.hours += 1
    if (aw < MFSL_NO_GROWTH_BELOW_AW || tC >= MFSL_NO_GROWTH_AT_OR_ABOVE_C) return
    // mouldFreeDaysValue, written out: the fraction of mould-free time used in one hour
    const erh = 100 * Math.min(aw, VALID_AW_HIGH)
    const t = Math.min(Math.max(tC, T_RANGE_LOW_C), T_RANGE_HIGH_C)
    const log21 = L21_INTERCEPT - L21_SLOPE * erh
    const log27 = L27_INTERCEPT - L27_SLOPE * erh
    const log = log21 + ((log27 - log21) * (t - L21_T_C)) / LINE_SPAN_C
    this.measure += 1 / 24 / Math.exp(log * Math.LN10)
    if (aw < VALID_AW_LOW || aw > VALID_AW_HIGH || tC < 21 || tC > 27) this.hoursOutsideRange += 1
    if (aw >= VALID_AW_LOW) this.hoursAtRisk += 1
  }
  state(): SpoilageState {
    return {
      measure: this.measure,
      hoursAtRisk: this.hoursAtRisk,
      hoursOutsideRange: this.hoursOutsideRange,
      hours: this.hours,
    }
  }
}

export function mouldFreeTimeModel(appliesTo: string[] = ['fruit', 'vegetable', 'herb']): SpoilageModel {
  return {
    id: 'mould-free-time',
    name: 'Mould-free time of intermediate-moisture foods (Seiler; Cauvain & Seiler)',
    appliesTo,
    source: {
      citation:
        'Flour Milling and Baking Research Association (Seiler; Cauvain & Seiler) mould-free shelf-life equations for cakes: 27 °C form as given in Adams & Moss, Food Microbiology (RSC), ch. 3, eq. 3.34; 21 °C form and validity aw 0.74–0.90 as quoted from Cauvain & Seiler in a practitioners’ forum (the originals were not read)',
      equation:
        'log10 MFSL[d] = 6.42 − 0.0647·ERH (27 °C); 7.91 − 0.081·ERH (21 °C); fraction used = Σ Δt/MFSL(T, aw); nothing counted at or above 42.5 °C (Niles, Norman & Pimbley 1985; Tassou et al. 2007)',
      confidence: 'transcribed',
      short: 'Seiler; Cauvain & Seiler (cakes), as quoted',
    },
    waterActivityOf: 'surface',
    measureName: 'fraction of mould-free time used',
    measureUnit: '',
    spoiledAt: 1,
    spoiledAtSource: 'visible mould expected when the whole mould-free time is used (fraction 1)',
    atRiskWhen: `water activity at the product surface ≥ ${MFSL_VALID_AW[0]} and product below ${MFSL_NO_GROWTH_AT_OR_ABOVE_C} °C`,
    validity:
      'cakes at aw 0.74–0.90, 21–27 °C (measured); other foods, aw and temperatures by extrapolation; no growth counted at or above 42.5 °C',
    cautions: [
      'Measured on bakery products: for fruit, vegetables and herbs an approximation. It is fed the water activity at the product surface, worked out from the air, the drying rate, rain and cover (dryhours’ rule, stated with the model); a surface kept wet by juice from cuts, splits or crushed fruit, and insects, add risks it does not model.',
      'Mouldy dried fruit can carry mycotoxins (aflatoxins, ochratoxin A in raisins and figs): discard visibly mouldy lots; test where risk was high.',
    ],
    step(state: SpoilageState, input: SpoilageStepInput): SpoilageState {
      checkStepInput(input)
      const { days, clamped } = mouldFreeDays(input.productTempC, input.waterActivity)
      return {
        measure: state.measure + input.hours / 24 / days,
        hoursAtRisk:
          state.hoursAtRisk +
          (input.waterActivity >= MFSL_VALID_AW[0] && input.productTempC < MFSL_NO_GROWTH_AT_OR_ABOVE_C
            ? input.hours
            : 0),
        hoursOutsideRange: state.hoursOutsideRange + (clamped && Number.isFinite(days) ? input.hours : 0),
        hours: state.hours + input.hours,
      }
    },
    hourStepper: () => new MouldFreeHours(),
  }
}
