/**
 * @module drying/supplemental-heat
 * Heat needed to reach the target moisture by a deadline (docs/model.md §8): use the method's own (ambient or
 * solar) air in every hour it dries, and a backup forced-air dryer with heated intake air in every other
 * hour. If that still misses the deadline, heat every hour. The heater raises the intake air at constant
 * humidity ratio to the temperature at which it dries (target RH), so Q = ṁ·(h_heated − h_ambient),
 * divided by the heater efficiency for fuel.
 */
import { type BatchOptions, type BatchResult, simulateBatch } from './batch.ts'
import type { HourlyConditions } from './hourly-conditions.ts'
import { methodModel } from './methods/index.ts'
import type { ProductResponse } from './product-response.ts'

export type HeatStrategy = 'none-needed' | 'heat-when-ambient-fails' | 'heat-every-hour' | 'not-reachable'

export interface SupplementalHeatResult {
  /** The method alone, run to the maximum duration. */
  natural: BatchResult
  /** The run that meets the deadline with least heat (or the every-hour run when none does). */
  withHeat: BatchResult | null
  strategy: HeatStrategy
  /** Heat into the air to reach the target by the deadline [kWh per tonne fresh]; NaN when not reachable. */
  heatKwhPerTonne: number
}

/**
 * Supplemental heat for one start. `primary` are the method's conditions, `backup` the heated forced-air
 * conditions (for a heated method pass the same conditions as both: its own heater energy is then
 * the heat). `deadlineHours` ≤ `options.maxHours`.
 */
export function supplementalHeat(
  primary: HourlyConditions,
  backup: HourlyConditions,
  product: ProductResponse,
  options: BatchOptions,
  deadlineHours: number,
): SupplementalHeatResult {
  const natural = simulateBatch(primary, product, options)
  const primaryHeats = methodModel(primary.method.kind).heatsWithFuel
  if (natural.reached && natural.hoursToTarget <= deadlineHours) {
    return {
      natural,
      withHeat: null,
      strategy: 'none-needed',
      heatKwhPerTonne: primaryHeats ? natural.heaterKwhPerTonne : 0,
    }
  }
  // the spoilage clock runs along the method-alone batch only
  const byDeadline = { ...options, maxHours: deadlineHours, recordTrace: false, spoilage: undefined }
  if (!primaryHeats) {
    const hybrid = simulateBatch(primary, product, byDeadline, backup)
    if (hybrid.reached) {
      return {
        natural,
        withHeat: hybrid,
        strategy: 'heat-when-ambient-fails',
        heatKwhPerTonne: hybrid.heaterKwhPerTonne,
      }
    }
  }
  const all = simulateBatch(backup, product, byDeadline)
  if (all.reached)
    return { natural, withHeat: all, strategy: 'heat-every-hour', heatKwhPerTonne: all.heaterKwhPerTonne }
  return { natural, withHeat: all, strategy: 'not-reachable', heatKwhPerTonne: Number.NaN }
}
