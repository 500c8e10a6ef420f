/**
 * @module drying/deep-bed/layer-model
 * Natural-air and low-temperature drying of grain in a bin: the bed is cut into layers and, for each time
 * step, the air passes up through them in turn. In each layer the air and grain exchange heat and water until
 * the air leaves in equilibrium with the grain (equal temperature; exit RH = the grain's equilibrium RH), with
 * water and energy conserved: the equilibrium deep-bed model used for low-airflow bin drying (Hukill's
 * equilibrium approach; reviewed by Sharp, J.R. 1982, "A review of low temperature drying simulation models",
 * *J. Agric. Eng. Res.* 27:169–190 — from memory, not read). Optionally the drying of a layer is limited by a
 * thin-layer rate passed in (the layer cannot dry faster than a thin layer in the air reaching it), as in the
 * Thompson, Peart & Foster (1968) layer model (*Trans. ASAE* 11:582, "Mathematical simulation of corn drying —
 * a new model"). Rewetting is always taken to equilibrium (the safe side for spoilage).
 *
 * Per layer and step (per m² of floor): air of dry mass m_a at (T0, W0) meets grain of dry matter m_d at
 * (Tg, M0). Unknowns M1 and T1 (grain and exit air):
 *   water:    W1 = W0 + (m_d/m_a)·(M0 − M1)
 *   energy:   m_a·h(T0, W0) + m_d·(c_d + c_w·M0)·Tg = m_a·h(T1, W1) + m_d·(c_d + c_w·M1)·T1 + m_d·(M0 − M1)·q_net
 *   balance:  100·p_v(W1)/p_ws(T1) = ERH_grain(T1, M1)
 * with h the moist-air enthalpy (ASHRAE), c_w = 4.186 kJ/(kg·K) for water in the grain, q_net the net heat of
 * sorption (passed in; 0 = free water). The balance is monotonic in M1 (solved by bisection in the reference,
 * by bracketed Newton steps in the fast form).
 *
 * Grain-specific inputs (isotherm, thin-layer rate, specific heat, bulk density, airflow resistance) are passed
 * in: this module holds no product constants.
 *
 * This file holds the model's types, the checks of a bin setup and the fan's figures (`binFan`); the reference
 * implementation is in `reference-model.ts` (`layerExchange`, `simulateDeepBedReference`: the exact isotherm at
 * every evaluation and bisection, simple and slow). Runs use the fast form in `bin-run.ts` (`simulateDeepBed`),
 * which the tests hold to the reference.
 *
 * Humidity: the outside RH is over liquid water at every temperature (weather-station practice), and so is the
 * grain's water activity (relative to pure liquid water at the same temperature); below 0 °C both stay over
 * liquid water.
 */
import {
  type AirflowResistanceConstants,
  BIN_PACKING_FACTOR,
  bedPressureDropPa,
  DEFAULT_FAN_EFFICIENCY,
  fanPowerW,
} from './airflow-resistance.ts'
import type { FanControl } from './fan-control.ts'

export interface DeepBedGrain {
  /** Equilibrium RH [%] of the grain at tC [°C] and moisture [kg/kg db]; ≤ 100. */
  erhPct(tC: number, moistureDb: number): number
  /** Net heat of sorption [kJ/kg water] above free water at tC and moisture; 0 if not known. */
  netSorptionHeatKjPerKg?(tC: number, moistureDb: number): number
  /**
   * Optional thin-layer rate: moisture [kg/kg db] after dtH hours in air at tC, rhPct, starting from
   * moistureDb. When given, a layer dries no faster than this.
   */
  thinLayerStep?(moistureDb: number, tC: number, rhPct: number, dtH: number): number
  /** Specific heat of the dry matter [kJ/(kg·K)]. */
  dryMatterCpKjPerKgK: number
  /** Bulk density of the grain as loaded [kg/m³] (wet basis, at the initial moisture). */
  bulkDensityKgPerM3: number
  airflowResistance: AirflowResistanceConstants
}

export interface BinSetup {
  /** Floor area of the bin [m²]. */
  floorAreaM2: number
  /** Grain depth [m]. */
  depthM: number
  /** Number of layers (default 20). */
  layers?: number
  /** Initial moisture [% wb] and temperature [°C] of the grain. */
  initialMoistureWbPct: number
  initialGrainTempC: number
  /** Airflow [m³/min per tonne of grain as loaded]. */
  airflowM3PerMinPerT: number
  /** Fan and motor total efficiency (0–1]; default {@link DEFAULT_FAN_EFFICIENCY} (see its source). */
  fanEfficiency?: number
  /** Whether the fan and motor heat ends up in the air (fan ahead of the plenum, motor in the airstream); default true. */
  fanHeatToAir?: boolean
  /** Resistance factor on the loose-fill curve (default 1.5, packed bin, ASAE D272 note). */
  resistanceFactor?: number
  /** Supplemental heat: temperature rise of the inlet air [K] (default 0). */
  heatRiseK?: number
  /** Run the heater only when the (fan-warmed) inlet air is more humid than this [%]; default: always. */
  heaterOnAboveRhPct?: number
  /** Target moisture [% wb]: a layer at or below it counts as dry. */
  targetMoistureWbPct: number
  /** Sub-steps per hour (default {@link defaultSubsteps}). */
  substepsPerHour?: number
  /** When the fan runs (default continuous); see `fan-control.ts`. */
  fanControl?: FanControl
}

/**
 * Default sub-steps per hour: enough that each layer meets at most its own dry mass of air per sub-step
 * (a numerical choice of dryhours). Measured against half that air per sub-step over 2–8 m beds, 0.5–4 cfm/bu
 * and 0 or 5 K of heat under a varying invented weather: hours until the top layer is dry within 0.3 %, top-layer
 * dry-matter loss within 0.6 % (checked in `test/drying/deep-bed/bin-run.test.ts`).
 */
export function defaultSubsteps(airKgPerM2H: number, dryMatterPerLayerKgPerM2: number): number {
  return Math.max(1, Math.ceil(airKgPerM2H / dryMatterPerLayerKgPerM2))
}

/** Checks a bin setup; throws a RangeError naming the field. Returns the number of layers. */
export function checkBinSetup(setup: BinSetup): number {
  const nLayers = setup.layers ?? 20
  if (!(Number.isInteger(nLayers) && nLayers >= 1 && nLayers <= 200)) {
    throw new RangeError(`layers must be an integer from 1 to 200, got ${nLayers}`)
  }
  if (!(setup.floorAreaM2 > 0 && setup.floorAreaM2 < 5000)) {
    throw new RangeError(`floorAreaM2 must be between 0 and 5000 m², got ${setup.floorAreaM2}`)
  }
  if (!(setup.depthM > 0 && setup.depthM <= 60)) {
    throw new RangeError(`depthM must be between 0 and 60 m, got ${setup.depthM}`)
  }
  if (!(setup.airflowM3PerMinPerT > 0 && setup.airflowM3PerMinPerT <= 50)) {
    throw new RangeError(`airflow must be between 0 and 50 m³/min per t, got ${setup.airflowM3PerMinPerT}`)
  }
  if (!(setup.initialMoistureWbPct > 5 && setup.initialMoistureWbPct < 50)) {
    throw new RangeError(`initial moisture must be between 5 and 50 % wb, got ${setup.initialMoistureWbPct}`)
  }
  if (!(setup.targetMoistureWbPct > 5 && setup.targetMoistureWbPct < setup.initialMoistureWbPct)) {
    throw new RangeError(
      `target moisture must be above 5 % wb and below the initial ${setup.initialMoistureWbPct} %, got ${setup.targetMoistureWbPct}`,
    )
  }
  if (!(setup.initialGrainTempC >= -30 && setup.initialGrainTempC <= 50)) {
    throw new RangeError(`initialGrainTempC must be between -30 and 50 °C, got ${setup.initialGrainTempC}`)
  }
  const heatRise = setup.heatRiseK ?? 0
  if (!(heatRise >= 0 && heatRise <= 30)) {
    throw new RangeError(`heatRiseK must be between 0 and 30 K, got ${heatRise}`)
  }
  if (
    setup.substepsPerHour !== undefined &&
    !(Number.isInteger(setup.substepsPerHour) && setup.substepsPerHour >= 1 && setup.substepsPerHour <= 1000)
  ) {
    throw new RangeError(
      `substepsPerHour must be a whole number from 1 to 1000, got ${setup.substepsPerHour}`,
    )
  }
  return nLayers
}

/** Grain mass, airflow, static pressure and fan power of a bin (no weather needed). */
export function binFan(
  grain: DeepBedGrain,
  setup: BinSetup,
): { grainTonnes: number; airflowM3PerS: number; staticPressurePa: number; fanPowerW: number } {
  const grainTonnes = (setup.floorAreaM2 * setup.depthM * grain.bulkDensityKgPerM3) / 1000
  const airflowM3PerS = (setup.airflowM3PerMinPerT * grainTonnes) / 60
  const staticPressurePa = bedPressureDropPa(
    grain.airflowResistance,
    airflowM3PerS / setup.floorAreaM2,
    setup.depthM,
    setup.resistanceFactor ?? BIN_PACKING_FACTOR,
  )
  const fanPowerWatts = fanPowerW(
    airflowM3PerS,
    staticPressurePa,
    setup.fanEfficiency ?? DEFAULT_FAN_EFFICIENCY,
  )
  return { grainTonnes, airflowM3PerS, staticPressurePa, fanPowerW: fanPowerWatts }
}
