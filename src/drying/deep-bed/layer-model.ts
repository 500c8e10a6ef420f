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
 * sorption (passed in; 0 = free water). The balance is solved for M1 by bisection (it is monotonic in M1).
 *
 * Grain-specific inputs (isotherm, thin-layer rate, specific heat, bulk density, airflow resistance) are passed
 * in: this module holds no product constants.
 *
 * This file holds the model's types, the checks of a bin setup, and the reference implementation
 * (`layerExchange`, `simulateDeepBedReference`: the exact isotherm at every evaluation and bisection, simple and
 * slow). Runs use the fast form in `bin-run.ts` (`simulateDeepBed`), which the tests hold to this one.
 *
 * Humidity: the outside RH is over liquid water at every temperature (weather-station practice), and so is the
 * grain's water activity (relative to pure liquid water at the same temperature); below 0 °C both stay over
 * liquid water.
 */
import {
  humidityRatioFromVaporPressure,
  moistAirEnthalpyKjPerKg,
  moistAirSpecificVolumeM3PerKg,
  vaporPressureFromHumidityRatio,
} from '../../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../physics/saturation.ts'
import { initialSpoilageState, type SpoilageModel, type SpoilageState } from '../../product/spoilage/model.ts'
import {
  type AirflowResistanceConstants,
  BIN_PACKING_FACTOR,
  bedPressureDropPa,
  DEFAULT_FAN_EFFICIENCY,
  fanHeatRiseK,
  fanPowerW,
} from './airflow-resistance.ts'
import type { FanControl } from './fan-control.ts'

/** Specific heat of liquid water [kJ/(kg·K)] (about 4.18 at 20–40 °C; rounded). */
export const WATER_CP_KJ_PER_KG_K = 4.186

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

export interface InletAir {
  dryBulbC: number
  rhPct: number
  pressureKpa: number
}

export interface DeepBedHour {
  hour: number
  /** Air entering the grain after fan heat and heater [°C, %]. */
  plenumC: number
  plenumRhPct: number
  exitAirC: number
  exitRhPct: number
  topMoistureWbPct: number
  meanMoistureWbPct: number
  /** Height above the floor [m] up to which every layer is at or below the target moisture. */
  dryingFrontM: number
  topDryMatterLossPct: number
  heaterOn: boolean
}

function wbPct(mDb: number): number {
  return (100 * mDb) / (1 + mDb)
}

function rhFromW(tC: number, w: number, pressureKpa: number): number {
  if (tC < -60) return w > 0 ? 1e6 : 0 // far below any drying state: saturated (keeps the bisection bracketed)
  return (100 * vaporPressureFromHumidityRatio(w, pressureKpa)) / saturationVaporPressureLiquidKpa(tC)
}

function humidityRatio(tC: number, rhPct: number, pressureKpa: number): number {
  return humidityRatioFromVaporPressure((saturationVaporPressureLiquidKpa(tC) * rhPct) / 100, pressureKpa)
}

/** Exchange in one layer for one sub-step. Returns the layer's new moisture and temperature and the exit air. */
export function layerExchange(
  grain: DeepBedGrain,
  air: { tC: number; w: number; pressureKpa: number },
  layer: { moistureDb: number; tempC: number },
  airKgPerM2: number,
  dryMatterKgPerM2: number,
  dtH: number,
): { moistureDb: number; tempC: number; exitC: number; exitW: number } {
  const ma = airKgPerM2
  const md = dryMatterKgPerM2
  const m0 = layer.moistureDb
  const eIn =
    ma * moistAirEnthalpyKjPerKg(air.tC, air.w) +
    md * (grain.dryMatterCpKjPerKgK + WATER_CP_KJ_PER_KG_K * m0) * layer.tempC
  const q = grain.netSorptionHeatKjPerKg ? grain.netSorptionHeatKjPerKg(layer.tempC, m0) : 0
  const outlet = (m1: number) => {
    const w1 = air.w + (md / ma) * (m0 - m1)
    const t1 =
      (eIn - md * (m0 - m1) * q - ma * w1 * 2501) /
      (ma * (1.006 + 1.86 * w1) + md * (grain.dryMatterCpKjPerKgK + WATER_CP_KJ_PER_KG_K * m1))
    return { w1, t1 }
  }
  const imbalance = (m1: number) => {
    const { w1, t1 } = outlet(m1)
    return rhFromW(t1, w1, air.pressureKpa) - grain.erhPct(t1, m1)
  }
  const g0 = imbalance(m0)
  let m1 = m0
  if (g0 !== 0) {
    // drying: M1 in [lo, m0]; wetting: M1 in [m0, hi] with W1 ≥ 0
    let lo: number
    let hi: number
    if (g0 < 0) {
      // the air cannot take up more than saturation at the warmer of air and grain allows
      const pwsMax = saturationVaporPressureLiquidKpa(Math.max(air.tC, layer.tempC))
      const wSat =
        pwsMax < air.pressureKpa ? humidityRatioFromVaporPressure(pwsMax, air.pressureKpa) : air.w + 1
      const pickup = Math.max(1e-6, wSat - air.w)
      lo = Math.max(0.005, m0 - (ma / md) * pickup)
      hi = m0
    } else {
      lo = m0
      hi = m0 + (ma / md) * air.w * 0.999999
    }
    for (let i = 0; i < 50; i++) {
      const mid = 0.5 * (lo + hi)
      if (imbalance(mid) > 0) lo = mid
      else hi = mid
      if (hi - lo < 1e-7) break
    }
    m1 = 0.5 * (lo + hi)
    if (g0 < 0 && grain.thinLayerStep) {
      const rhIn = rhFromW(air.tC, air.w, air.pressureKpa)
      const mRate = grain.thinLayerStep(m0, air.tC, Math.min(rhIn, 99.5), dtH)
      if (mRate > m1) m1 = Math.min(mRate, m0)
    }
  }
  const { w1, t1 } = outlet(m1)
  return { moistureDb: m1, tempC: t1, exitC: t1, exitW: w1 }
}

/** What the reference implementation returns. */
export interface DeepBedReferenceResult {
  hours: DeepBedHour[]
  finalMoistureWbPct: number[]
  /** First hour (1-based count) at which the top layer (every layer) was at or below the target; null if never. */
  hoursUntilTopDry: number | null
  hoursUntilDry: number | null
  topDryMatterLossPct: number
  topSpoiled: boolean
  topSpoilage: SpoilageState
  grainTonnes: number
  airflowM3PerS: number
  staticPressurePa: number
  fanPowerW: number
  fanEnergyKwhPerT: number
  heaterEnergyKwhPerT: number
  /** Water removed [kg per tonne as loaded]. */
  waterRemovedKgPerT: number
}

/**
 * Reference implementation: simulates the bin hour by hour under `weather` (one inlet air state per hour), the
 * fan running every hour, with the grain's exact functions and bisection in every layer. For tests and the
 * benchmark; runs use `simulateDeepBed` (`bin-run.ts`). `spoilage` is stepped on the top layer (water activity =
 * its ERH/100).
 */
export function simulateDeepBedReference(
  grain: DeepBedGrain,
  setup: BinSetup,
  weather: readonly InletAir[],
  spoilage: SpoilageModel,
): DeepBedReferenceResult {
  const nLayers = checkBinSetup(setup)
  if (setup.fanControl && setup.fanControl.mode !== 'continuous') {
    throw new RangeError('the reference implementation runs the fan continuously only')
  }
  const efficiency = setup.fanEfficiency ?? DEFAULT_FAN_EFFICIENCY
  const heatRise = setup.heatRiseK ?? 0
  const grainKg = setup.floorAreaM2 * setup.depthM * grain.bulkDensityKgPerM3
  const tonnes = grainKg / 1000
  const flowM3PerS = (setup.airflowM3PerMinPerT * tonnes) / 60
  const qSuperficial = flowM3PerS / setup.floorAreaM2
  const staticPa = bedPressureDropPa(
    grain.airflowResistance,
    qSuperficial,
    setup.depthM,
    setup.resistanceFactor ?? BIN_PACKING_FACTOR,
  )
  const powerW = fanPowerW(flowM3PerS, staticPa, efficiency)
  const m0 = setup.initialMoistureWbPct / (100 - setup.initialMoistureWbPct)
  const targetDb = setup.targetMoistureWbPct / (100 - setup.targetMoistureWbPct)
  const dryMatterPerLayer =
    (grain.bulkDensityKgPerM3 * (1 - setup.initialMoistureWbPct / 100) * setup.depthM) / nLayers
  const moisture = new Float64Array(nLayers).fill(m0)
  const temp = new Float64Array(nLayers).fill(setup.initialGrainTempC)
  const layerHeightM = setup.depthM / nLayers
  let topSpoilage = initialSpoilageState()
  const hours: DeepBedHour[] = []
  let hoursUntilDry: number | null = null
  let hoursUntilTopDry: number | null = null
  let heaterKwh = 0
  for (let h = 0; h < weather.length; h++) {
    const w = weather[h]
    const wIn = humidityRatio(w.dryBulbC, w.rhPct, w.pressureKpa)
    const vIn = moistAirSpecificVolumeM3PerKg(w.dryBulbC, wIn, w.pressureKpa)
    const airKgPerS = flowM3PerS / vIn // dry air
    const rhoCp = ((1 + wIn) / vIn) * (1006 + 1860 * wIn)
    const fanRise = setup.fanHeatToAir === false ? 0 : fanHeatRiseK(staticPa, efficiency, rhoCp)
    let tPlenum = w.dryBulbC + fanRise
    const rhAfterFan = rhFromW(tPlenum, wIn, w.pressureKpa)
    const heaterOn =
      heatRise > 0 && (setup.heaterOnAboveRhPct === undefined || rhAfterFan > setup.heaterOnAboveRhPct)
    if (heaterOn) {
      tPlenum += heatRise
      heaterKwh += airKgPerS * (1.006 + 1.86 * wIn) * heatRise // kJ/s over one hour = kWh
    }
    const airKgPerM2H = (airKgPerS * 3600) / setup.floorAreaM2
    const substeps = setup.substepsPerHour ?? defaultSubsteps(airKgPerM2H, dryMatterPerLayer)
    const dt = 1 / substeps
    let exitC = tPlenum
    let exitW = wIn
    for (let s = 0; s < substeps; s++) {
      let airT = tPlenum
      let airW = wIn
      for (let i = 0; i < nLayers; i++) {
        const r = layerExchange(
          grain,
          { tC: airT, w: airW, pressureKpa: w.pressureKpa },
          { moistureDb: moisture[i], tempC: temp[i] },
          airKgPerM2H * dt,
          dryMatterPerLayer,
          dt,
        )
        moisture[i] = r.moistureDb
        temp[i] = r.tempC
        airT = r.exitC
        airW = r.exitW
      }
      exitC = airT
      exitW = airW
    }
    const top = nLayers - 1
    topSpoilage = spoilage.step(topSpoilage, {
      productTempC: temp[top],
      moistureWbPct: wbPct(moisture[top]),
      waterActivity: Math.min(1, grain.erhPct(temp[top], moisture[top]) / 100),
      hours: 1,
    })
    let front = 0
    while (front < nLayers && moisture[front] <= targetDb) front++
    let sum = 0
    for (let i = 0; i < nLayers; i++) sum += moisture[i]
    if (hoursUntilDry === null && front === nLayers) hoursUntilDry = h + 1
    if (hoursUntilTopDry === null && moisture[top] <= targetDb) hoursUntilTopDry = h + 1
    hours.push({
      hour: h,
      plenumC: tPlenum,
      plenumRhPct: rhFromW(tPlenum, wIn, w.pressureKpa),
      exitAirC: exitC,
      exitRhPct: Math.min(100, rhFromW(exitC, exitW, w.pressureKpa)),
      topMoistureWbPct: wbPct(moisture[top]),
      meanMoistureWbPct: wbPct(sum / nLayers),
      dryingFrontM: front * layerHeightM,
      topDryMatterLossPct: topSpoilage.measure,
      heaterOn,
    })
  }
  let waterKg = 0
  for (let i = 0; i < nLayers; i++) waterKg += (m0 - moisture[i]) * dryMatterPerLayer * setup.floorAreaM2
  return {
    hours,
    finalMoistureWbPct: Array.from(moisture, wbPct),
    hoursUntilTopDry,
    hoursUntilDry,
    topDryMatterLossPct: topSpoilage.measure,
    topSpoiled: topSpoilage.measure >= spoilage.spoiledAt,
    topSpoilage,
    grainTonnes: tonnes,
    airflowM3PerS: flowM3PerS,
    staticPressurePa: staticPa,
    fanPowerW: powerW,
    fanEnergyKwhPerT: (powerW * weather.length) / 1000 / tonnes,
    heaterEnergyKwhPerT: heaterKwh / tonnes,
    waterRemovedKgPerT: waterKg / tonnes,
  }
}
