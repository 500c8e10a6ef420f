/**
 * @module drying/usable-hour
 * The usable-hour verdict: an hour is a usable drying hour for a product and target when the air at the
 * product would carry the product toward (not away from) its target moisture. Each hour that is not
 * usable carries one reason, tested in the order of {@link HourStatus}: missing data, night without
 * drying (product covered or fans off), rain, product too cold, product above its temperature limit, dew
 * risk on an uncovered product at night, and too humid (the equilibrium RH of the product at its target
 * is reached, or the humidity-ratio deficit to it is below the stated threshold). The thresholds and their
 * origin are in ./thresholds.ts; the model is described in docs/model.md.
 */
import type { DryingThresholds } from './thresholds.ts'

/** Why an hour is not a usable drying hour (0 = usable). The order is the order in which they are tested. */
export const HourStatus = {
  usable: 0,
  missingData: 1,
  nightWithoutDrying: 2,
  rain: 3,
  tooCold: 4,
  aboveProductTempLimit: 5,
  dewRisk: 6,
  tooHumid: 7,
} as const
export type HourStatusCode = (typeof HourStatus)[keyof typeof HourStatus]

/** JSON names of the status codes, index = code. */
export const HOUR_STATUS_NAMES = [
  'usable',
  'missingData',
  'nightWithoutDrying',
  'rain',
  'tooCold',
  'aboveProductTempLimit',
  'dewRisk',
  'tooHumid',
] as const
export type HourStatusName = (typeof HOUR_STATUS_NAMES)[number]

/** Each reason in a grower's words, short enough for a table cell (every display uses these, never the JSON names). */
export const HOUR_STATUS_WORDS: Record<HourStatusName, string> = {
  usable: 'dries',
  missingData: 'no weather data',
  nightWithoutDrying: 'night: covered or fans off',
  rain: 'rain',
  tooCold: 'too cold to dry',
  aboveProductTempLimit: 'too hot for the product',
  dewRisk: 'dew on the product',
  tooHumid: 'air too humid',
}

/** Plain-language description of each reason, for the assumptions and the readable summary. */
export const HOUR_STATUS_MEANINGS: Record<HourStatusName, string> = {
  usable: 'the air at the product moves it toward its target moisture',
  missingData: 'dry bulb, humidity or pressure missing in the weather file',
  nightWithoutDrying: 'night (or no collector heat) and the method stops drying: product covered or fans off',
  rain: 'rain on an exposed product, or product covered because of rain',
  tooCold: 'product temperature below the minimum drying temperature',
  aboveProductTempLimit: "product temperature above the product's quality limit",
  dewRisk: 'exposed product at night with its radiatively cooled surface at or below the dew point',
  tooHumid:
    'equilibrium moisture at the air state is at or above the target, or the deficit is below the stated threshold',
}

/** What the verdict reads of one hour: one object per series, set by the hourly driver every hour. */
export class HourVerdict {
  /** No drying because of night or no collector heat (covered product, fans off). */
  pausedByNight = false
  /** Product covered because of rain. */
  coveredForRain = false
  /** Rain falls on the uncovered product. */
  rainExposed = false
  /** Exposed product uncovered at night. */
  uncoveredNight = false
  /** Product temperature [°C]. */
  productC = Number.NaN
  /** RH at the product surface [%] (the air's vapour pressure over saturation at the product temperature). */
  surfaceRhPct = Number.NaN
  /** Equilibrium RH of the product at its target moisture and temperature [%]. */
  targetErhPct = Number.NaN
  /** Humidity-ratio deficit to that equilibrium RH along the adiabatic path [g/kg]. */
  deficitToTargetGPerKg = Number.NaN
}

/** Reason of an hour in which the method does not expose the product to the air at all (paused). */
export function pausedHourStatus(pausedByNight: boolean): HourStatusCode {
  return pausedByNight ? HourStatus.nightWithoutDrying : HourStatus.rain
}

/** The verdict of an hour with data in which the product meets the air. */
export function usableHourStatus(
  h: HourVerdict,
  thresholds: DryingThresholds,
  maxProductTempC: number | null,
): HourStatusCode {
  if (h.pausedByNight) return HourStatus.nightWithoutDrying
  if (h.coveredForRain || h.rainExposed) return HourStatus.rain
  if (h.productC < thresholds.minProductTempC) return HourStatus.tooCold
  if (maxProductTempC !== null && h.productC > maxProductTempC) return HourStatus.aboveProductTempLimit
  if (h.uncoveredNight && h.surfaceRhPct >= 100) return HourStatus.dewRisk
  if (h.surfaceRhPct >= h.targetErhPct || h.deficitToTargetGPerKg < thresholds.minDeficitGPerKg) {
    return HourStatus.tooHumid
  }
  return HourStatus.usable
}
