/**
 * @module drying/deep-bed/fan-control
 * When the bin fan runs. Growers ask whether to run natural-air fans all the time or only when the air can
 * dry; the three answers dryhours models:
 * - `continuous`: the fan runs every hour until the grain is dry (the usual extension advice for natural-air
 *   drying of wet grain, because the drying front must reach the top before the top layer spoils);
 * - `air-emc-below`: the fan runs only in hours when the outside air's equilibrium moisture content for this
 *   grain (its isotherm at the outside temperature and RH) is at or below a set value, as an EMC controller does;
 * - `rh-below`: the fan runs only in hours when the outside RH is at or below a set value (a humidistat).
 * The controller reads the outside air, before fan heat (so the fan's own warming, which lowers the RH reaching
 * the grain, does not switch it). When the fan is off no air moves: the grain keeps its moisture and temperature
 * (heat exchange through the bin wall and roof is not modelled), the top layer's spoilage clock keeps running,
 * and neither fan nor heater uses energy.
 */

export type FanControl =
  | { mode: 'continuous' }
  | {
      mode: 'air-emc-below'
      /** Run when the outside air's EMC for this grain is at or below this [% wb]. */
      maxEmcWbPct: number
    }
  | {
      mode: 'rh-below'
      /** Run when the outside RH is at or below this [%]. */
      maxRhPct: number
    }

export const CONTINUOUS_FAN: FanControl = { mode: 'continuous' }

/** Checks a fan control; throws a RangeError naming the field. */
export function checkFanControl(control: FanControl): void {
  switch (control.mode) {
    case 'continuous':
      return
    case 'air-emc-below':
      if (!(control.maxEmcWbPct > 5 && control.maxEmcWbPct < 40)) {
        throw new RangeError(
          `fanControl.maxEmcWbPct must be between 5 and 40 % wb, got ${control.maxEmcWbPct}`,
        )
      }
      return
    case 'rh-below':
      if (!(control.maxRhPct > 0 && control.maxRhPct <= 100)) {
        throw new RangeError(`fanControl.maxRhPct must be in (0, 100] %, got ${control.maxRhPct}`)
      }
      return
    default:
      throw new RangeError(
        `fanControl.mode must be 'continuous', 'air-emc-below' or 'rh-below', got ${(control as { mode: unknown }).mode}`,
      )
  }
}

/** The control in words, for assumptions lists. */
export function describeFanControl(control: FanControl): string {
  switch (control.mode) {
    case 'continuous':
      return 'fan runs every hour until the top layer is dry'
    case 'air-emc-below':
      return `fan runs only when the outside air's equilibrium moisture for this grain is at or below ${control.maxEmcWbPct} % wb`
    case 'rh-below':
      return `fan runs only when the outside relative humidity is at or below ${control.maxRhPct} %`
  }
}
