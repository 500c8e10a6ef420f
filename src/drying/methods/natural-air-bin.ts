/**
 * @module drying/methods/natural-air-bin
 * Natural-air (and low-temperature) drying of grain in a bin: outside air blown up through a deep bed of grain by
 * a fan, optionally warmed a few kelvin by a heater. Unlike the other methods, a bin is not a batch of product in
 * one air state: the air dries the bottom first and leaves each layer in equilibrium with it, so a drying front
 * moves up and the top layer waits, wet and warm, for it. The assessment therefore runs the deep-bed model of
 * `drying/deep-bed/` for every start (harvest) date, candidate airflow and year (analysis/bin-stage.ts) instead of
 * thin-layer batches; its JSON is `assessment.bin`.
 *
 * What the hourly view (usable hours per month, hour of day, the psychrometric chart) assumes:
 * - the air at the grain is the air entering the bin: outside air warmed by the fan and motor,
 *   ΔT = ΔP/(ρ·c_p·η) (all fan and motor power ends in the air; `deep-bed/airflow-resistance.ts`), at the static
 *   pressure of the smallest listed airflow (the least warming: the conservative view), plus the heater's rise
 *   in the hours it runs; heating at constant humidity ratio (ASHRAE HOF 2017 ch. 1 eqs 20, 26 and 30);
 * - a usable hour is one in which that air can dry grain toward the target (the same verdict as for every
 *   method); the fan control is not applied to this view (an EMC controller runs the fan in such hours);
 * - its constant-rate limit is the deficit to saturation × the air flow (as for every forced-air method; the
 *   deep-bed model does not use it).
 * Energy input: the heater's heat into the air (kWh per tonne); fan electricity is reported by the bin stage.
 */
import { z } from 'zod'
import { relativeHumidityPctAt } from '../../physics/air-processes.ts'
import {
  moistAirHeatCapacityKjPerKgK,
  moistAirSpecificVolumeM3PerKg,
  moistAirVolumetricHeatCapacityJPerM3K,
  STANDARD_PRESSURE_KPA,
} from '../../physics/moist-air.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { AIRFLOW_RESISTANCE, DEFAULT_FAN_EFFICIENCY, fanHeatRiseK } from '../deep-bed/airflow-resistance.ts'
import type { FanControl } from '../deep-bed/fan-control.ts'
import { deepBedGrainFromProfile } from '../deep-bed/grain-from-profile.ts'
import { type BinSetup, binFan } from '../deep-bed/layer-model.ts'
import type { MethodHour, MethodModel } from './method-model.ts'

/**
 * Candidate airflows when none are given [m³/min per tonne as loaded]: 0.5 to 3, about 0.45 to 2.7 cfm/bu for
 * shelled corn, the span of natural-air drying recommendations for grain of 16–22 % (our choice of steps; the
 * extension guides quoted in docs/spoilage-and-bins.md work at 1–1.25 cfm/bu for corn near 20 %).
 */
export const DEFAULT_BIN_AIRFLOWS_M3_PER_MIN_PER_T = [0.5, 1, 1.5, 2, 3] as const
/** Bin diameter when neither a diameter nor a floor area is given [m]: 9.1 m (30 ft), an assumption (a common farm bin). */
export const DEFAULT_BIN_DIAMETER_M = 9.144
/** Grain depth when none is given [m]: 4 m (about 13 ft), an assumption. */
export const DEFAULT_BIN_DEPTH_M = 4
/** Humidistat set point when the fan control is `rh-below` and none is given [%]: 70 %, an assumption. */
export const DEFAULT_FAN_MAX_RH_PCT = 70

const airflow = z.number().gt(0).max(50)

export const naturalAirBinSchema = z.object({
  kind: z.literal('natural-air-bin'),
  /** Grain depth [m]. */
  depthM: z.number().gt(0).max(30).default(DEFAULT_BIN_DEPTH_M).describe('grain depth in the bin [m]'),
  /** Round bin diameter [m]; or give `floorAreaM2`; default 9.1 m (30 ft) when neither is given. */
  binDiameterM: z.number().gt(0).max(50).optional().describe('bin diameter [m] (round bin)'),
  /** Floor area [m²] instead of a diameter. */
  floorAreaM2: z.number().gt(0).lt(2000).optional().describe('floor area of the bin [m²]'),
  /** Candidate airflows [m³/min per tonne of grain as loaded]: one, or several to compare. */
  airflowsM3PerMinPerTonne: z
    .array(airflow)
    .min(1)
    .max(8)
    .default([...DEFAULT_BIN_AIRFLOWS_M3_PER_MIN_PER_T])
    .describe('airflows to compare [m³/min per tonne of grain as loaded], 1 to 8 values'),
  /** Supplemental heat: rise of the air temperature by a heater [K]. */
  heatRiseK: z.number().min(0).max(30).default(0).describe('temperature rise from a heater [K]; 0 = none'),
  /** Run the heater only when the fan-warmed air is more humid than this [%]; default every fan hour. */
  heaterOnAboveRhPct: z
    .number()
    .gt(0)
    .max(100)
    .optional()
    .describe('heater runs only when the air after the fan is above this RH [%]'),
  /** Whether the fan and motor heat ends up in the air (motor in the air stream); default true. */
  fanHeatToAir: z.boolean().default(true).describe('fan and motor heat warms the air [true/false]'),
  /** Fan and motor total efficiency (air power over electrical power). */
  fanEfficiency: z
    .number()
    .gt(0)
    .max(1)
    .default(DEFAULT_FAN_EFFICIENCY)
    .describe('fan and motor total efficiency [0–1]'),
  /** When the fan runs: every hour, only when the air's EMC is low enough, or only below an RH. */
  fanControl: z
    .enum(['continuous', 'air-emc-below', 'rh-below'])
    .default('continuous')
    .describe('continuous, air-emc-below (EMC controller) or rh-below (humidistat)'),
  /** EMC controller set point [% wb]; default the target moisture. */
  fanMaxEmcWbPct: z
    .number()
    .gt(5)
    .lt(40)
    .optional()
    .describe('air-emc-below: the fan runs when the air’s EMC is at or below this [% wb]'),
  /** Humidistat set point [%]; default 70 %. */
  fanMaxRhPct: z
    .number()
    .gt(0)
    .max(100)
    .optional()
    .describe('rh-below: the fan runs when the outside RH is at or below this [%]'),
  /** Layers of the model; the top layer is 1/layers of the depth (thinner top layers come out wetter). */
  layers: z.number().int().min(5).max(60).default(20).describe('layers of the deep-bed model [count]'),
  /** The top layer's dry-matter loss limit [%]; 0.5 % is the allowable-storage-time convention. */
  dryMatterLossLimitPct: z.number().gt(0).max(5).default(0.5).describe('top-layer dry-matter loss limit [%]'),
})

export type NaturalAirBinMethod = z.output<typeof naturalAirBinSchema>

/** Floor area of the bin [m²]: the given area, or π d²/4 of the given (or default) diameter. */
export function binFloorAreaM2(m: NaturalAirBinMethod): number {
  if (m.floorAreaM2 !== undefined) return m.floorAreaM2
  const d = m.binDiameterM ?? DEFAULT_BIN_DIAMETER_M
  return (Math.PI * d * d) / 4
}

/** The method's fan control in the deep-bed model's form. */
export function binFanControl(m: NaturalAirBinMethod, targetWbPct: number): FanControl {
  switch (m.fanControl) {
    case 'continuous':
      return { mode: 'continuous' }
    case 'air-emc-below':
      return { mode: 'air-emc-below', maxEmcWbPct: m.fanMaxEmcWbPct ?? targetWbPct }
    case 'rh-below':
      return { mode: 'rh-below', maxRhPct: m.fanMaxRhPct ?? DEFAULT_FAN_MAX_RH_PCT }
  }
}

/** The bin of the deep-bed model for this method, product and moistures (without airflow and grain temperature). */
export function binSetupOf(
  m: NaturalAirBinMethod,
  initialWbPct: number,
  targetWbPct: number,
): Omit<BinSetup, 'airflowM3PerMinPerT' | 'initialGrainTempC'> {
  return {
    floorAreaM2: binFloorAreaM2(m),
    depthM: m.depthM,
    layers: m.layers,
    initialMoistureWbPct: initialWbPct,
    targetMoistureWbPct: targetWbPct,
    fanEfficiency: m.fanEfficiency,
    fanHeatToAir: m.fanHeatToAir,
    heatRiseK: m.heatRiseK,
    heaterOnAboveRhPct: m.heaterOnAboveRhPct,
    fanControl: binFanControl(m, targetWbPct),
  }
}

/** The grains the bin model has airflow resistance for (ASAE D272 form), by profile id. */
export const BIN_GRAIN_IDS: readonly string[] = Object.keys(AIRFLOW_RESISTANCE)

/** Whether a profile (or the profile it is a variant of) is a grain the bin model can take. */
export function isBinGrain(profile: Pick<ProductProfile, 'id' | 'variantOf'>): boolean {
  return BIN_GRAIN_IDS.includes(profile.variantOf ?? profile.id)
}

/** Sorted, distinct candidate airflows. */
export function binAirflows(m: NaturalAirBinMethod): number[] {
  return [...new Set(m.airflowsM3PerMinPerTonne)].sort((a, b) => a - b)
}

/** Dry air per m³ at 20 °C and 101.325 kPa [m³/kg] (ASHRAE HOF 2017 ch. 1 eq 26), to turn airflow into mass. */
const STANDARD_AIR_M3_PER_KG = moistAirSpecificVolumeM3PerKg(20, 0, STANDARD_PRESSURE_KPA)

export const naturalAirBin: MethodModel<typeof naturalAirBinSchema> = {
  kind: 'natural-air-bin',
  label: 'natural-air bin drying (outside air blown through a deep bed of grain)',
  title: 'Natural-air bin',
  hint: 'grain in a bin, a fan blowing outside air up through it (optionally a few degrees of heat)',
  schema: naturalAirBinSchema,
  exposure: 'forced-air',
  batches: 'deep-bed',
  productFits: (profile) =>
    isBinGrain(profile)
      ? null
      : `the natural-air-bin method dries grain in a bin, and ${profile.name} (${profile.id}) is not one of the grains it knows the airflow resistance of: ${BIN_GRAIN_IDS.join(', ')} (or a variant of one)`,
  airFlowKgPerSPerTonne: (m) => binAirflows(m)[0] / 60 / STANDARD_AIR_M3_PER_KG,
  heatsWithFuel: false,
  rainMatters: () => false,
  needs: { sun: false, sunAzimuth: false, coordinates: false },
  assumptions: (m) => [
    {
      name: 'bin',
      value: `grain ${m.depthM} m deep on ${binFloorAreaM2(m).toFixed(1)} m² (${m.floorAreaM2 !== undefined ? 'given floor area' : `diameter ${(m.binDiameterM ?? DEFAULT_BIN_DIAMETER_M).toFixed(2)} m${m.binDiameterM === undefined ? ', assumed' : ''}`}), ${m.layers} layers in the model`,
      source: 'method setting (depth default 4 m and diameter 9.1 m are assumptions)',
    },
    {
      name: 'air into the bin (hourly view)',
      value: `outside air warmed by the fan and motor${m.fanHeatToAir ? '' : ' (not: fan heat off)'} at the smallest airflow, ${binAirflows(m)[0]} m³/min per t${m.heatRiseK > 0 ? `, plus ${m.heatRiseK} K from the heater${m.heaterOnAboveRhPct !== undefined ? ` when above ${m.heaterOnAboveRhPct} % RH` : ''}` : ''}`,
      source:
        'ΔT = ΔP/(ρ·c_p·η), static pressure from ASAE D272 (Hukill–Ives form of Shedd’s data) with packing factor 1.5',
    },
  ],
  prepare(m, { profile, initialWbPct, targetWbPct }) {
    const grain = deepBedGrainFromProfile(profile)
    const q = binAirflows(m)[0]
    const fan = binFan(grain, {
      ...binSetupOf(m, initialWbPct, targetWbPct),
      airflowM3PerMinPerT: q,
      initialGrainTempC: 10,
    })
    const staticPa = fan.staticPressurePa
    const heatRise = m.heatRiseK
    const heaterAbove = m.heaterOnAboveRhPct
    return (hour: MethodHour): void => {
      const t = hour.dryBulbC
      const w = hour.humidityRatio
      const p = hour.pressureKpa
      const rhoCp = moistAirVolumetricHeatCapacityJPerM3K(t, w, p)
      let airC = m.fanHeatToAir ? t + fanHeatRiseK(staticPa, m.fanEfficiency, rhoCp) : t
      if (heatRise > 0 && (heaterAbove === undefined || relativeHumidityPctAt(airC, w, p) > heaterAbove)) {
        airC += heatRise
        // dry air per tonne [kg/s] × c_p × ΔT = kW per tonne, over one hour = kWh per tonne
        const airKgPerSPerT = q / 60 / moistAirSpecificVolumeM3PerKg(t, w, p)
        hour.heaterKwhPerTonne = airKgPerSPerT * moistAirHeatCapacityKjPerKgK(w) * heatRise
      }
      hour.airC = airC
      hour.productC = airC
    }
  },
}
