/**
 * @module drying/deep-bed/bin-bed
 * The state of one bin run for `simulateDeepBed` (bin-run.ts): the layers' moisture and temperature in typed
 * arrays, the air of the hour as it enters the grain (outside air warmed by the fan and motor and, when it runs,
 * the heater), one hour of air blown up through the layers in sub-steps (`layer-solver.ts`), and the run's
 * counters; the optional hourly record.
 */
import { S_PER_HOUR } from '../../physics/constants.ts'
import {
  moistAirHeatCapacityKjPerKgK,
  moistAirSpecificVolumeM3PerKg,
  moistAirVolumetricHeatCapacityJPerM3K,
} from '../../physics/moist-air.ts'
import { moistureWbPctFromDb } from '../../product/moisture-basis.ts'
import { DEFAULT_FAN_EFFICIENCY, fanHeatRiseK } from './airflow-resistance.ts'
import type { BinHourlyColumns } from './bin-run.ts'
import { type GrainTables, grainTables } from './grain-tables.ts'
import { type BinSetup, binFan, type DeepBedGrain, defaultSubsteps } from './layer-model.ts'
import { LayerSolver, tableHumidityRatio, tableRhPct } from './layer-solver.ts'

/**
 * The bed of one run and what it has done so far: layer moisture [kg/kg db] and temperature [°C] (bottom first),
 * the solver, the fan's figures, and the run's counters. One object per run; nothing is allocated per hour.
 */
export class Bed {
  readonly moisture: Float64Array
  readonly temp: Float64Array
  readonly air = new Float64Array(2)
  readonly solver: LayerSolver
  readonly tables: GrainTables
  readonly m0: number
  readonly targetDb: number
  readonly dryMatterPerLayer: number
  readonly layerHeightM: number
  readonly top: number
  readonly fan: ReturnType<typeof binFan>
  readonly efficiency: number
  readonly heatRiseK: number
  readonly fanHeatToAir: boolean
  // the hour's inlet air (set by blow(), or to the outside air with the fan off)
  plenumC = Number.NaN
  plenumRhPct = Number.NaN
  exitC = Number.NaN
  exitRhPct = Number.NaN
  heaterOn = false
  // counters
  fanHours = 0
  heaterKwh = 0
  fanRiseSumK = 0

  constructor(
    grain: DeepBedGrain,
    readonly setup: BinSetup,
    readonly nLayers: number,
  ) {
    this.tables = grainTables(grain)
    this.fan = binFan(grain, setup)
    this.efficiency = setup.fanEfficiency ?? DEFAULT_FAN_EFFICIENCY
    this.heatRiseK = setup.heatRiseK ?? 0
    this.fanHeatToAir = setup.fanHeatToAir !== false
    this.m0 = setup.initialMoistureWbPct / (100 - setup.initialMoistureWbPct)
    this.targetDb = setup.targetMoistureWbPct / (100 - setup.targetMoistureWbPct)
    this.dryMatterPerLayer =
      (grain.bulkDensityKgPerM3 * (1 - setup.initialMoistureWbPct / 100) * setup.depthM) / nLayers
    this.layerHeightM = setup.depthM / nLayers
    this.moisture = new Float64Array(nLayers).fill(this.m0)
    this.temp = new Float64Array(nLayers).fill(setup.initialGrainTempC)
    this.solver = new LayerSolver(this.tables, grain, this.dryMatterPerLayer)
    this.top = nLayers - 1
  }

  /** An hour with the fan off: no air moves, the grain keeps its state. */
  still(tOut: number, rhOut: number): void {
    this.plenumC = tOut
    this.plenumRhPct = rhOut
    this.exitC = Number.NaN
    this.exitRhPct = Number.NaN
    this.heaterOn = false
  }

  /**
   * An hour with the fan on: the outside air (tOut [°C], rhOut [%], p [kPa]) warmed by the fan and motor
   * (ΔT = ΔP/(ρ·c_p·η), airflow-resistance.ts) and by the heater when it runs, then blown up through the layers
   * in sub-steps.
   */
  blow(tOut: number, rhOut: number, p: number): void {
    const setup = this.setup
    this.fanHours++
    const wIn = tableHumidityRatio(tOut, rhOut, p)
    const airKgPerS = this.fan.airflowM3PerS / moistAirSpecificVolumeM3PerKg(tOut, wIn, p)
    const rhoCp = moistAirVolumetricHeatCapacityJPerM3K(tOut, wIn, p)
    const fanRise = this.fanHeatToAir ? fanHeatRiseK(this.fan.staticPressurePa, this.efficiency, rhoCp) : 0
    this.fanRiseSumK += fanRise
    let plenumC = tOut + fanRise
    const rhAfterFan = tableRhPct(plenumC, wIn, p)
    this.heaterOn =
      this.heatRiseK > 0 && (setup.heaterOnAboveRhPct === undefined || rhAfterFan > setup.heaterOnAboveRhPct)
    if (this.heaterOn) {
      plenumC += this.heatRiseK
      // kJ/s over one hour = kWh
      this.heaterKwh += airKgPerS * moistAirHeatCapacityKjPerKgK(wIn) * this.heatRiseK
    }
    this.plenumC = plenumC
    this.plenumRhPct = this.heaterOn ? tableRhPct(plenumC, wIn, p) : rhAfterFan
    const airKgPerM2H = (airKgPerS * S_PER_HOUR) / setup.floorAreaM2
    const substeps = setup.substepsPerHour ?? defaultSubsteps(airKgPerM2H, this.dryMatterPerLayer)
    this.solver.startHour(p, airKgPerM2H / substeps, 1 / substeps)
    const { air, solver, moisture, temp, nLayers } = this
    for (let s = 0; s < substeps; s++) {
      air[0] = plenumC
      air[1] = wIn
      for (let i = 0; i < nLayers; i++) solver.solve(i, moisture, temp, air)
    }
    this.exitC = air[0]
    this.exitRhPct = Math.min(100, tableRhPct(air[0], air[1], p))
  }

  /** Layers from the floor up that are at or below the target, counted until the first wet one. */
  dryLayersFromFloor(): number {
    let front = 0
    while (front < this.nLayers && this.moisture[front] <= this.targetDb) front++
    return front
  }

  /** Water removed so far [kg], over the whole floor. */
  waterRemovedKg(): number {
    let waterKg = 0
    for (let i = 0; i < this.nLayers; i++) waterKg += (this.m0 - this.moisture[i]) * this.dryMatterPerLayer
    return waterKg * this.setup.floorAreaM2
  }
}

export function hourlyColumns(hours: number): BinHourlyColumns {
  return {
    plenumC: new Float64Array(hours),
    plenumRhPct: new Float64Array(hours),
    exitAirC: new Float64Array(hours),
    exitRhPct: new Float64Array(hours),
    topMoistureWbPct: new Float64Array(hours),
    meanMoistureWbPct: new Float64Array(hours),
    dryingFrontM: new Float64Array(hours),
    topDryMatterLossPct: new Float64Array(hours),
    fanOn: new Uint8Array(hours),
    heaterOn: new Uint8Array(hours),
  }
}

export function recordHour(
  hourly: BinHourlyColumns,
  h: number,
  bed: Bed,
  front: number,
  dml: number,
  fanOn: boolean,
): void {
  let sum = 0
  for (let i = 0; i < bed.nLayers; i++) sum += bed.moisture[i]
  hourly.plenumC[h] = bed.plenumC
  hourly.plenumRhPct[h] = bed.plenumRhPct
  hourly.exitAirC[h] = bed.exitC
  hourly.exitRhPct[h] = bed.exitRhPct
  hourly.topMoistureWbPct[h] = moistureWbPctFromDb(bed.moisture[bed.top])
  hourly.meanMoistureWbPct[h] = moistureWbPctFromDb(sum / bed.nLayers)
  hourly.dryingFrontM[h] = front * bed.layerHeightM
  hourly.topDryMatterLossPct[h] = dml
  hourly.fanOn[h] = fanOn ? 1 : 0
  hourly.heaterOn[h] = bed.heaterOn ? 1 : 0
}
