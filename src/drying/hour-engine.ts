/**
 * @module drying/hour-engine
 * The state of the hourly driver (drying/hourly-conditions.ts) for one series, method and product: everything
 * the hour computation reads, and the few numbers it carries from hour to hour.
 */
import { AdiabaticPath } from '../physics/air-processes.ts'
import type { HourlySeries } from '../weather/series.ts'
import type { HourColumns, HourlyConditionsOptions } from './hour-columns.ts'
import { MethodHour, type MethodHourFunction, type MethodModel } from './methods/method-model.ts'
import type { ProductResponse } from './product-response.ts'
import { HourVerdict } from './usable-hour.ts'

/**
 * Everything the hour computation reads and the few numbers it carries from hour to hour, in one object
 * (fields, not captured `let` variables, which V8 would box).
 */
export class Engine {
  readonly hour = new MethodHour()
  readonly path = new AdiabaticPath()
  readonly verdictInput = new HourVerdict()
  /** [EMC desorption, EMC adsorption, k, n] of the hour (product-response.ts HOUR_* slots). */
  readonly response = new Float64Array(4)
  /** The same at the wet-surface temperature (exposed methods). */
  readonly responseWet = new Float64Array(4)
  readonly step = new Float64Array(2)
  /** Cooling along the adiabatic path in the previous hour [K], to saturation and to the target ERH: the solver's start. */
  depressionToSaturationK = 0
  depressionToTargetK = 0
  /** The last heated or damped air temperature evaluated [°C] and its exp(ln pws) [Pa] (often held hour after hour). */
  heldAirC = Number.NaN
  heldSaturationPa = Number.NaN
  assumedIrradianceHours = 0
  assumedWindHours = 0
  readonly exposed: boolean
  /** The product's temperature follows its surface balance (exposed methods and the tunnel). */
  readonly surfaceBalance: boolean
  constructor(
    readonly series: HourlySeries,
    readonly columns: HourColumns,
    readonly methodHour: MethodHourFunction,
    readonly model: MethodModel,
    readonly product: ProductResponse,
    readonly options: HourlyConditionsOptions,
    readonly altitudeDeg: Float64Array,
    /** FAO-56 eq 47 is linear in the wind: its height factor, computed once. */
    readonly windTo2m: number,
    readonly hasCoords: boolean,
    readonly sharedSaturation: boolean,
    readonly verdict: boolean,
    readonly exposedCapFactor: number,
    readonly forcedCapFactor: number,
  ) {
    this.exposed = model.exposure === 'exposed'
    this.surfaceBalance = this.exposed || model.surfaceBalance === true
  }
}
