/**
 * @module drying/methods/heated
 * Heated air: a forced-air dryer whose intake air is heated. What it assumes:
 * - the ambient air is heated at constant humidity ratio, either to a fixed set point or to the lowest
 *   temperature that brings its RH down to a target (the dew point of pw/φ, ASHRAE HOF 2017 ch. 1
 *   eqs 6 and 20), never below a stated lowest air temperature, never above the product's temperature
 *   limit (unless the air is already warmer) and never above 100 °C;
 * - the product is at the heated-air temperature;
 * - the heat into the air is ṁ·(h(T_heated, W) − h(T_ambient, W)) (eq 30), and fuel is that heat divided
 *   by the heater efficiency (drying/fuels.ts gives heating values with their sources);
 * - its constant-rate limit is the deficit to saturation × the air flow.
 * The same method, with the defaults of its schema and the adjustments of analysis/assess.ts, is the
 * backup heater of every other method.
 */
import { z } from 'zod'
import { heatedDryBulbForTargetRhC, sensibleHeatingKw } from '../../physics/air-processes.ts'
import { FUEL_IDS } from '../fuels.ts'
import type { MethodHour, MethodModel } from './method-model.ts'

/** Highest heated-air temperature [°C]: the moist-air relations used are stated up to 100 °C (ASHRAE HOF 2017 ch. 1). */
export const HEATED_AIR_MAX_C = 100

export const heatedSchema = z.object({
  kind: z.literal('heated'),
  /** Fixed air temperature [°C]; when absent, the air is heated only as far as `targetRhPct` requires. */
  setPointC: z.number().min(0).max(120).optional(),
  /** RH the heater aims for when no set point is given [%]; 40 % is an assumption for fruit and grain. */
  targetRhPct: z.number().gt(1).lt(100).default(40),
  /**
   * Lowest temperature of the heated air when heating to a target RH [°C]: in cold weather the target RH
   * alone would give air too cold to dry. 20 °C is an assumption (no source). Ignored with a set point.
   */
  minAirC: z.number().min(-10).max(100).default(20),
  /** Dry-air flow per tonne of fresh product [kg s⁻¹ t⁻¹]; 0.5 is an assumption for tray/bin batch dryers. */
  airFlowKgPerSPerTonne: z.number().gt(0).max(50).default(0.5),
  /**
   * Fraction of fuel heat that reaches the air. 0.80 is mid-range for indirect-fired heaters (60–85 %,
   * from memory); direct-fired propane heaters come nearer 0.92 (from memory).
   */
  heaterEfficiency: z.number().gt(0).max(1).default(0.8),
  fuel: z.enum(FUEL_IDS).default('propane'),
})

export type HeatedMethod = z.output<typeof heatedSchema>

/**
 * What the user must be told when the heated air asked for passes the product's temperature limit (or the
 * 100 °C of the moist-air relations): the engine holds the air at the limit, so the figures are for that air,
 * not for the set point given. `role` names the heater in the sentence ('heated air', 'backup heater').
 */
export function heatedLimitWarnings(m: HeatedMethod, maxProductTempC: number | null, role: string): string[] {
  const out: string[] = []
  const limit = maxProductTempC === null ? HEATED_AIR_MAX_C : Math.min(maxProductTempC, HEATED_AIR_MAX_C)
  const why =
    maxProductTempC !== null && maxProductTempC <= HEATED_AIR_MAX_C
      ? `the product's temperature limit of ${limit} °C`
      : `${HEATED_AIR_MAX_C} °C, the upper end of the moist-air relations used`
  if (m.setPointC !== undefined && m.setPointC > limit) {
    out.push(
      `the ${role} set point ${m.setPointC} °C is above ${why}: the air is held at ${limit} °C (unless the outside air is warmer), and every figure is for that air; set the dryer no higher`,
    )
  } else if (m.setPointC === undefined && m.minAirC > limit) {
    out.push(
      `the ${role}'s lowest air temperature ${m.minAirC} °C is above ${why}: the air is held at ${limit} °C, and every figure is for that air`,
    )
  }
  return out
}

export const heated: MethodModel<typeof heatedSchema> = {
  kind: 'heated',
  label: 'heated air',
  title: 'Heated air',
  hint: 'a fan and a heater (fuel or electricity)',
  schema: heatedSchema,
  exposure: 'forced-air',
  airFlowKgPerSPerTonne: (m) => m.airFlowKgPerSPerTonne,
  heatsWithFuel: true,
  energyInputs: { heater: true, solar: false },
  rainMatters: () => false,
  needs: { sun: false, sunAzimuth: false, coordinates: false },
  assumptions: () => [],
  prepare(m, { maxProductTempC }) {
    const maxT = maxProductTempC
    return (hour: MethodHour): void => {
      const t = hour.dryBulbC
      let tHeat =
        m.setPointC !== undefined
          ? Math.max(t, m.setPointC)
          : Math.max(
              heatedDryBulbForTargetRhC(t, hour.humidityRatio, hour.pressureKpa, m.targetRhPct),
              m.minAirC,
            )
      if (maxT !== null && tHeat > maxT) tHeat = Math.max(t, maxT)
      if (tHeat > HEATED_AIR_MAX_C) tHeat = HEATED_AIR_MAX_C
      hour.airC = tHeat
      hour.productC = tHeat
      // kW over one hour = kWh
      hour.heaterKwhPerTonne = sensibleHeatingKw(m.airFlowKgPerSPerTonne, hour.humidityRatio, t, tHeat)
    }
  },
}
