/**
 * @module drying/deep-bed/reference-model
 * The reference implementation of the equilibrium layer model of `layer-model.ts`: every layer and sub-step
 * solved by bisection with the grain's exact isotherm and sorption heat, objects per layer and hour, the fan
 * running every hour. Simple and slow: for the tests and the benchmark, which hold the fast form
 * (`simulateDeepBed` in `bin-run.ts`) to it. Moist-air relations from the physics layer (ASHRAE HOF 2017 ch. 1,
 * eqs 20, 26 and 30; saturation over liquid water by Hyland–Wexler, eq 6).
 */
import { humidityRatioFromRh, relativeHumidityPctAt } from '../../physics/air-processes.ts'
import { S_PER_HOUR } from '../../physics/constants.ts'
import {
  CP_LIQUID_WATER_KJ_PER_KG_K,
  humidityRatioFromVaporPressure,
  moistAirEnthalpyKjPerKg,
  moistAirHeatCapacityKjPerKgK,
  moistAirSpecificVolumeM3PerKg,
  moistAirVolumetricHeatCapacityJPerM3K,
  VAPOR_ENTHALPY_0C_KJ_PER_KG,
} from '../../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../physics/saturation.ts'
import { moistureWbPctFromDb } from '../../product/moisture-basis.ts'
import { initialSpoilageState, type SpoilageModel, type SpoilageState } from '../../product/spoilage/model.ts'
import { DEFAULT_FAN_EFFICIENCY, fanHeatRiseK } from './airflow-resistance.ts'
import { type BinSetup, binFan, checkBinSetup, type DeepBedGrain, defaultSubsteps } from './layer-model.ts'

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

function rhFromW(tC: number, w: number, pressureKpa: number): number {
  if (tC < -60) return w > 0 ? 1e6 : 0 // far below any drying state: saturated (keeps the bisection bracketed)
  return relativeHumidityPctAt(tC, w, pressureKpa)
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
    md * (grain.dryMatterCpKjPerKgK + CP_LIQUID_WATER_KJ_PER_KG_K * m0) * layer.tempC
  const q = grain.netSorptionHeatKjPerKg ? grain.netSorptionHeatKjPerKg(layer.tempC, m0) : 0
  const outlet = (m1: number) => {
    const w1 = air.w + (md / ma) * (m0 - m1)
    const t1 =
      (eIn - md * (m0 - m1) * q - ma * w1 * VAPOR_ENTHALPY_0C_KJ_PER_KG) /
      (ma * moistAirHeatCapacityKjPerKgK(w1) +
        md * (grain.dryMatterCpKjPerKgK + CP_LIQUID_WATER_KJ_PER_KG_K * m1))
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

/** The air of one hour as it enters the grain (reference implementation). */
interface ReferenceInlet {
  plenumC: number
  w: number
  airKgPerS: number
  heaterOn: boolean
  heaterKwh: number
}

function referenceInlet(
  w: InletAir,
  setup: BinSetup,
  fan: ReturnType<typeof binFan>,
  efficiency: number,
): ReferenceInlet {
  const heatRise = setup.heatRiseK ?? 0
  const wIn = humidityRatioFromRh(w.dryBulbC, w.rhPct, w.pressureKpa)
  const airKgPerS = fan.airflowM3PerS / moistAirSpecificVolumeM3PerKg(w.dryBulbC, wIn, w.pressureKpa) // dry air
  const rhoCp = moistAirVolumetricHeatCapacityJPerM3K(w.dryBulbC, wIn, w.pressureKpa)
  const fanRise = setup.fanHeatToAir === false ? 0 : fanHeatRiseK(fan.staticPressurePa, efficiency, rhoCp)
  const tFan = w.dryBulbC + fanRise
  const rhAfterFan = rhFromW(tFan, wIn, w.pressureKpa)
  const heaterOn =
    heatRise > 0 && (setup.heaterOnAboveRhPct === undefined || rhAfterFan > setup.heaterOnAboveRhPct)
  return {
    plenumC: heaterOn ? tFan + heatRise : tFan,
    w: wIn,
    airKgPerS,
    heaterOn,
    // kJ/s over one hour = kWh
    heaterKwh: heaterOn ? airKgPerS * moistAirHeatCapacityKjPerKgK(wIn) * heatRise : 0,
  }
}

/** One hour of air through every layer, in sub-steps (reference implementation); returns the exit air. */
function referenceSweep(
  grain: DeepBedGrain,
  setup: BinSetup,
  inlet: ReferenceInlet,
  pressureKpa: number,
  layers: { moisture: Float64Array; temp: Float64Array; dryMatterPerLayer: number },
): { exitC: number; exitW: number } {
  const { moisture, temp, dryMatterPerLayer } = layers
  const airKgPerM2H = (inlet.airKgPerS * S_PER_HOUR) / setup.floorAreaM2
  const substeps = setup.substepsPerHour ?? defaultSubsteps(airKgPerM2H, dryMatterPerLayer)
  const dt = 1 / substeps
  let exitC = inlet.plenumC
  let exitW = inlet.w
  for (let s = 0; s < substeps; s++) {
    let airT = inlet.plenumC
    let airW = inlet.w
    for (let i = 0; i < moisture.length; i++) {
      const r = layerExchange(
        grain,
        { tC: airT, w: airW, pressureKpa },
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
  return { exitC, exitW }
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
  const fan = binFan(grain, setup)
  const tonnes = fan.grainTonnes
  const m0 = setup.initialMoistureWbPct / (100 - setup.initialMoistureWbPct)
  const targetDb = setup.targetMoistureWbPct / (100 - setup.targetMoistureWbPct)
  const dryMatterPerLayer =
    (grain.bulkDensityKgPerM3 * (1 - setup.initialMoistureWbPct / 100) * setup.depthM) / nLayers
  const layers = {
    moisture: new Float64Array(nLayers).fill(m0),
    temp: new Float64Array(nLayers).fill(setup.initialGrainTempC),
    dryMatterPerLayer,
  }
  const { moisture, temp } = layers
  const top = nLayers - 1
  let topSpoilage = initialSpoilageState()
  const hours: DeepBedHour[] = []
  let hoursUntilDry: number | null = null
  let hoursUntilTopDry: number | null = null
  let heaterKwh = 0
  for (let h = 0; h < weather.length; h++) {
    const w = weather[h]
    const inlet = referenceInlet(w, setup, fan, efficiency)
    heaterKwh += inlet.heaterKwh
    const { exitC, exitW } = referenceSweep(grain, setup, inlet, w.pressureKpa, layers)
    topSpoilage = spoilage.step(topSpoilage, {
      productTempC: temp[top],
      moistureWbPct: moistureWbPctFromDb(moisture[top]),
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
      plenumC: inlet.plenumC,
      plenumRhPct: rhFromW(inlet.plenumC, inlet.w, w.pressureKpa),
      exitAirC: exitC,
      exitRhPct: Math.min(100, rhFromW(exitC, exitW, w.pressureKpa)),
      topMoistureWbPct: moistureWbPctFromDb(moisture[top]),
      meanMoistureWbPct: moistureWbPctFromDb(sum / nLayers),
      dryingFrontM: (front * setup.depthM) / nLayers,
      topDryMatterLossPct: topSpoilage.measure,
      heaterOn: inlet.heaterOn,
    })
  }
  let waterKg = 0
  for (let i = 0; i < nLayers; i++) waterKg += (m0 - moisture[i]) * dryMatterPerLayer * setup.floorAreaM2
  return {
    hours,
    finalMoistureWbPct: Array.from(moisture, moistureWbPctFromDb),
    hoursUntilTopDry,
    hoursUntilDry,
    topDryMatterLossPct: topSpoilage.measure,
    topSpoiled: topSpoilage.measure >= spoilage.spoiledAt,
    topSpoilage,
    grainTonnes: tonnes,
    airflowM3PerS: fan.airflowM3PerS,
    staticPressurePa: fan.staticPressurePa,
    fanPowerW: fan.fanPowerW,
    fanEnergyKwhPerT: (fan.fanPowerW * weather.length) / 1000 / tonnes,
    heaterEnergyKwhPerT: heaterKwh / tonnes,
    waterRemovedKgPerT: waterKg / tonnes,
  }
}
