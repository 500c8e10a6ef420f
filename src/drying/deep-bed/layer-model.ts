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
 */
import {
  moistAirEnthalpyKjPerKg,
  moistAirSpecificVolumeM3PerKg,
  saturationHumidityRatio,
  vaporPressureFromHumidityRatio,
} from '../../physics/moist-air.ts'
import { saturationVaporPressureKpa } from '../../physics/saturation.ts'
import { initialSpoilageState, type SpoilageModel, type SpoilageState } from '../../product/spoilage/model.ts'
import {
  type AirflowResistanceConstants,
  BIN_PACKING_FACTOR,
  bedPressureDropPa,
  fanHeatRiseK,
  fanPowerW,
} from './airflow-resistance.ts'

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
  /** Fan and motor total efficiency (0–1]; default 0.5 (an assumption, not a measured fan). */
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
  /** Sub-steps per hour (default: enough that each layer sees at most half its own dry mass of air per sub-step). */
  substepsPerHour?: number
  /** Record the moisture profile every this many hours (default 24; 0 = only the end). */
  profileEveryHours?: number
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

export interface DeepBedResult {
  hours: DeepBedHour[]
  /** Moisture per layer [% wb], bottom first, every `profileEveryHours` and at the end. */
  profiles: { hour: number; moistureWbPct: number[] }[]
  finalMoistureWbPct: number[]
  /** First hour (1-based count) at which every layer was at or below the target; null if never. */
  hoursUntilDry: number | null
  topDryMatterLossPct: number
  topSpoiled: boolean
  topSpoilage: SpoilageState
  grainTonnes: number
  airflowM3PerS: number
  staticPressurePa: number
  fanPowerW: number
  fanHeatRiseK: number
  fanEnergyKwhPerT: number
  heaterEnergyKwhPerT: number
  /** Water removed [kg per tonne as loaded]. */
  waterRemovedKgPerT: number
}

function wbPct(mDb: number): number {
  return (100 * mDb) / (1 + mDb)
}

function rhFromW(tC: number, w: number, pressureKpa: number): number {
  if (tC < -60) return w > 0 ? 1e6 : 0 // far below any drying state: saturated (keeps the bisection bracketed)
  return (100 * vaporPressureFromHumidityRatio(w, pressureKpa)) / saturationVaporPressureKpa(tC)
}

function humidityRatio(tC: number, rhPct: number, pressureKpa: number): number {
  const pv = (saturationVaporPressureKpa(tC) * rhPct) / 100
  return (0.621945 * pv) / (pressureKpa - pv)
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
      const pickup = Math.max(
        1e-6,
        saturationHumidityRatio(Math.max(air.tC, layer.tempC), air.pressureKpa) - air.w,
      )
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

/**
 * Simulates the bin hour by hour under `weather` (one inlet air state per hour). The fan runs every hour.
 * `spoilage` is the grain spoilage model stepped on the top layer (water activity = its ERH/100).
 */
export function simulateDeepBed(
  grain: DeepBedGrain,
  setup: BinSetup,
  weather: readonly InletAir[],
  spoilage: SpoilageModel,
): DeepBedResult {
  const nLayers = setup.layers ?? 20
  if (!(Number.isInteger(nLayers) && nLayers >= 1 && nLayers <= 200)) {
    throw new RangeError(`layers must be an integer from 1 to 200, got ${nLayers}`)
  }
  if (!(setup.floorAreaM2 > 0 && setup.floorAreaM2 < 5000)) {
    throw new RangeError(`floorAreaM2 must be between 0 and 5000 m², got ${setup.floorAreaM2}`)
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
  const efficiency = setup.fanEfficiency ?? 0.5
  const heatRise = setup.heatRiseK ?? 0
  if (!(heatRise >= 0 && heatRise <= 30))
    throw new RangeError(`heatRiseK must be between 0 and 30 K, got ${heatRise}`)
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
  const profiles: DeepBedResult['profiles'] = []
  const profileEvery = setup.profileEveryHours ?? 24
  let hoursUntilDry: number | null = null
  let heaterKwh = 0
  let fanRise = 0
  for (let h = 0; h < weather.length; h++) {
    const w = weather[h]
    const wIn = humidityRatio(w.dryBulbC, w.rhPct, w.pressureKpa)
    const vIn = moistAirSpecificVolumeM3PerKg(w.dryBulbC, wIn, w.pressureKpa)
    const airKgPerS = flowM3PerS / vIn // dry air
    const rhoCp = ((1 + wIn) / vIn) * (1006 + 1860 * wIn)
    fanRise = setup.fanHeatToAir === false ? 0 : fanHeatRiseK(staticPa, efficiency, rhoCp)
    let tPlenum = w.dryBulbC + fanRise
    const rhAfterFan = rhFromW(tPlenum, wIn, w.pressureKpa)
    const heaterOn =
      heatRise > 0 && (setup.heaterOnAboveRhPct === undefined || rhAfterFan > setup.heaterOnAboveRhPct)
    if (heaterOn) {
      tPlenum += heatRise
      heaterKwh += (airKgPerS * (1.006 + 1.86 * wIn) * heatRise * 3600) / 3600
    }
    const airKgPerM2H = (airKgPerS * 3600) / setup.floorAreaM2
    const substeps = setup.substepsPerHour ?? Math.max(1, Math.ceil(airKgPerM2H / (0.5 * dryMatterPerLayer)))
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
    if (profileEvery > 0 && (h + 1) % profileEvery === 0) {
      profiles.push({ hour: h + 1, moistureWbPct: Array.from(moisture, wbPct) })
    }
  }
  const finalMoistureWbPct = Array.from(moisture, wbPct)
  if (profiles.length === 0 || profiles[profiles.length - 1].hour !== weather.length) {
    profiles.push({ hour: weather.length, moistureWbPct: finalMoistureWbPct })
  }
  let waterKg = 0
  for (let i = 0; i < nLayers; i++) waterKg += (m0 - moisture[i]) * dryMatterPerLayer * setup.floorAreaM2
  return {
    hours,
    profiles,
    finalMoistureWbPct,
    hoursUntilDry,
    topDryMatterLossPct: topSpoilage.measure,
    topSpoiled: topSpoilage.measure >= spoilage.spoiledAt,
    topSpoilage,
    grainTonnes: tonnes,
    airflowM3PerS: flowM3PerS,
    staticPressurePa: staticPa,
    fanPowerW: powerW,
    fanHeatRiseK: fanRise,
    fanEnergyKwhPerT: (powerW * weather.length) / 1000 / tonnes,
    heaterEnergyKwhPerT: heaterKwh / tonnes,
    waterRemovedKgPerT: waterKg / tonnes,
  }
}
