/**
 * @module drying/deep-bed/bin-run
 * The natural-air bin model of `layer-model.ts` (equilibrium layers, water and enthalpy conserved), written for
 * speed: weather as columns, state in typed arrays, no allocation per hour, the grain's isotherm and sorption
 * heat read from precomputed tables (`grain-tables.ts`, error stated there), saturation pressure from the
 * physics table, and each layer's balance solved by Newton's method inside a bracket (`layer-solver.ts`).
 * `simulateDeepBedReference` in `layer-model.ts` is the same model with the exact functions and bisection; the
 * tests hold the two together.
 *
 * One run: the bin is filled at `startIndex` (all layers at the initial moisture and temperature) and the fan
 * runs as `setup.fanControl` says, for `hours` hours or until the top layer (or every layer) is dry.
 */
import { moistureWbPctFromDb } from '../../product/moisture-basis.ts'
import { type SpoilageModel, type SpoilageState, spoilageHourStepper } from '../../product/spoilage/model.ts'
import { Bed, hourlyColumns, recordHour } from './bin-bed.ts'
import { CONTINUOUS_FAN, checkFanControl, type FanControl } from './fan-control.ts'
import type { GrainTables } from './grain-tables.ts'
import { type BinSetup, checkBinSetup, type DeepBedGrain } from './layer-model.ts'

/** Hourly inlet weather as columns (an `HourlySeries` fits): NaN marks a missing hour. */
export interface BinWeather {
  /** Outside dry bulb [°C]. */
  dryBulbC: ArrayLike<number>
  /** Outside RH [%], over liquid water at every temperature (the weather-station convention). */
  relativeHumidityPct: ArrayLike<number>
  /** Station pressure [kPa], a column or one value. */
  pressureKpa: ArrayLike<number> | number
}

export interface BinRunOptions {
  /** First hour (index into the columns); default 0. */
  startIndex?: number
  /** Hours to simulate at most; default: to the end of the columns. */
  hours?: number
  /** Continue from the start of the columns past their end (a typical year); default false. */
  wrap?: boolean
  /** Stop once the top layer is dry (`top-dry`), every layer is dry (`all-dry`), or never; default `never`. */
  stopWhen?: 'never' | 'top-dry' | 'all-dry'
  /** Keep hourly columns in the result; default false. */
  recordHourly?: boolean
  /** Keep the moisture profile every this many hours; default 0 (only the final profile). */
  profileEveryHours?: number
}

/** Per-hour record (only with `recordHourly`), one entry per simulated hour. */
export interface BinHourlyColumns {
  /** Air entering the grain after fan heat and heater [°C, %]; the outside air when the fan was off. */
  plenumC: Float64Array
  plenumRhPct: Float64Array
  /** Air leaving the top [°C, %]; NaN when the fan was off. */
  exitAirC: Float64Array
  exitRhPct: Float64Array
  topMoistureWbPct: Float64Array
  meanMoistureWbPct: Float64Array
  /** Height above the floor [m] up to which every layer is at or below the target. */
  dryingFrontM: Float64Array
  topDryMatterLossPct: Float64Array
  /** 1 when the fan (heater) ran that hour. */
  fanOn: Uint8Array
  heaterOn: Uint8Array
}

export interface BinRunResult {
  /** Hours simulated (stops early with `stopWhen`). */
  hoursSimulated: number
  /** Hours the fan ran. */
  fanHours: number
  /** Hours with missing weather (fan off, grain unchanged, spoilage clock running). */
  missingWeatherHours: number
  /** Hours from filling until the top layer was at or below the target (1-based count); null if not. */
  hoursUntilTopDry: number | null
  /** Hours until every layer was at or below the target; null if not. */
  hoursUntilDry: number | null
  /** Hours until the top layer's spoilage measure reached the model's limit; null if not. */
  hoursUntilTopSpoiled: number | null
  topDryMatterLossPct: number
  topSpoiled: boolean
  topSpoilage: SpoilageState
  /** Moisture [% wb] and temperature [°C] per layer at the end, bottom first. */
  finalMoistureWbPct: number[]
  finalGrainTempC: number[]
  profiles: { hour: number; moistureWbPct: number[] }[]
  grainTonnes: number
  airflowM3PerS: number
  staticPressurePa: number
  fanPowerW: number
  /** Mean warming of the air by fan and motor over the fan hours [K] (0 if none). */
  fanHeatRiseK: number
  fanEnergyKwhPerT: number
  heaterEnergyKwhPerT: number
  /** Water removed [kg per tonne as loaded]. */
  waterRemovedKgPerT: number
  hourly: BinHourlyColumns | null
}

function columnValue(col: ArrayLike<number> | number, i: number): number {
  return typeof col === 'number' ? col : col[i]
}

/** The options of one run, checked, with their defaults. */
interface RunPlan {
  nLayers: number
  control: FanControl
  /** Hours in the weather columns. */
  n: number
  start: number
  wrap: boolean
  hoursToRun: number
  stopWhen: 'never' | 'top-dry' | 'all-dry'
  profileEvery: number
}

function planRun(setup: BinSetup, weather: BinWeather, options: BinRunOptions): RunPlan {
  const nLayers = checkBinSetup(setup)
  const control: FanControl = setup.fanControl ?? CONTINUOUS_FAN
  checkFanControl(control)
  const n = weather.dryBulbC.length
  if (
    weather.relativeHumidityPct.length !== n ||
    (typeof weather.pressureKpa !== 'number' && weather.pressureKpa.length !== n)
  ) {
    throw new RangeError('weather columns must all have the same length')
  }
  const start = options.startIndex ?? 0
  if (!(Number.isInteger(start) && start >= 0 && start < n)) {
    throw new RangeError(`startIndex must be a whole number from 0 to ${n - 1}, got ${start}`)
  }
  const wrap = options.wrap ?? false
  const maxHours = options.hours ?? (wrap ? n : n - start)
  if (!(Number.isInteger(maxHours) && maxHours >= 1)) {
    throw new RangeError(`hours must be a whole number ≥ 1, got ${maxHours}`)
  }
  return {
    nLayers,
    control,
    n,
    start,
    wrap,
    hoursToRun: wrap ? maxHours : Math.min(maxHours, n - start),
    stopWhen: options.stopWhen ?? 'never',
    profileEvery: options.profileEveryHours ?? 0,
  }
}

/** Whether the fan runs in an hour of outside air tOut [°C], rhOut [%] (the controller reads the outside air). */
function fanRuns(control: FanControl, tables: GrainTables, tOut: number, rhOut: number): boolean {
  switch (control.mode) {
    case 'continuous':
      return true
    case 'rh-below':
      return rhOut <= control.maxRhPct
    case 'air-emc-below':
      // EMC(T, RH) ≤ limit  ⇔  RH ≤ ERH(T, limit) (the isotherm rises with moisture)
      return rhOut <= tables.erhPct(tOut, control.maxEmcWbPct / (100 - control.maxEmcWbPct))
  }
}

/** When the run reached its milestones (1-based hour counts; null: not reached). */
interface Milestones {
  simulated: number
  missing: number
  topDry: number | null
  allDry: number | null
  topSpoiled: number | null
}

/**
 * Simulates one bin from `options.startIndex` under `weather`; the top layer's spoilage is stepped with
 * `spoilage` (water activity = its ERH/100). Fast form of the model; see the module comment.
 */
export function simulateDeepBed(
  grain: DeepBedGrain,
  setup: BinSetup,
  weather: BinWeather,
  spoilage: SpoilageModel,
  options: BinRunOptions = {},
): BinRunResult {
  const plan = planRun(setup, weather, options)
  const bed = new Bed(grain, setup, plan.nLayers)
  const { moisture, temp, top, tables } = bed
  const acc = spoilageHourStepper(spoilage)
  const hourly = options.recordHourly === true ? hourlyColumns(plan.hoursToRun) : null
  const profiles: BinRunResult['profiles'] = []
  const at: Milestones = { simulated: 0, missing: 0, topDry: null, allDry: null, topSpoiled: null }
  for (let h = 0; h < plan.hoursToRun; h++) {
    let idx = plan.start + h
    if (idx >= plan.n) idx -= plan.n * Math.floor(idx / plan.n)
    const tOut = weather.dryBulbC[idx]
    const rhOut = weather.relativeHumidityPct[idx]
    const p = columnValue(weather.pressureKpa, idx)
    const missing = Number.isNaN(tOut) || Number.isNaN(rhOut) || Number.isNaN(p)
    if (missing) at.missing++
    const fanOn = !missing && fanRuns(plan.control, tables, tOut, rhOut)
    if (fanOn) bed.blow(tOut, rhOut, p)
    else bed.still(tOut, rhOut)
    const aw = Math.min(1, tables.erhPct(temp[top], moisture[top]) / 100)
    acc.productTempC = temp[top]
    acc.moistureWbPct = moistureWbPctFromDb(moisture[top])
    acc.waterActivity = aw
    acc.stepHour()
    at.simulated = h + 1
    const dml = acc.measure
    if (at.topSpoiled === null && dml >= spoilage.spoiledAt) at.topSpoiled = h + 1
    const front = bed.dryLayersFromFloor()
    const topDry = moisture[top] <= bed.targetDb
    if (at.topDry === null && topDry) at.topDry = h + 1
    if (at.allDry === null && front === plan.nLayers) at.allDry = h + 1
    if (hourly) recordHour(hourly, h, bed, front, dml, fanOn)
    if (plan.profileEvery > 0 && (h + 1) % plan.profileEvery === 0) {
      profiles.push({ hour: h + 1, moistureWbPct: Array.from(moisture, moistureWbPctFromDb) })
    }
    if ((plan.stopWhen === 'top-dry' && topDry) || (plan.stopWhen === 'all-dry' && front === plan.nLayers)) {
      break
    }
  }
  return runResult(bed, spoilage, acc.state(), at, profiles, hourly)
}

function runResult(
  bed: Bed,
  spoilage: SpoilageModel,
  state: SpoilageState,
  at: Milestones,
  profiles: BinRunResult['profiles'],
  hourly: BinHourlyColumns | null,
): BinRunResult {
  const finalMoistureWbPct = Array.from(bed.moisture, moistureWbPctFromDb)
  if (profiles.length === 0 || profiles[profiles.length - 1].hour !== at.simulated) {
    profiles.push({ hour: at.simulated, moistureWbPct: finalMoistureWbPct.slice() })
  }
  const { fan } = bed
  const tonnes = fan.grainTonnes
  return {
    hoursSimulated: at.simulated,
    fanHours: bed.fanHours,
    missingWeatherHours: at.missing,
    hoursUntilTopDry: at.topDry,
    hoursUntilDry: at.allDry,
    hoursUntilTopSpoiled: at.topSpoiled,
    topDryMatterLossPct: state.measure,
    topSpoiled: state.measure >= spoilage.spoiledAt,
    topSpoilage: state,
    finalMoistureWbPct,
    finalGrainTempC: Array.from(bed.temp),
    profiles,
    grainTonnes: tonnes,
    airflowM3PerS: fan.airflowM3PerS,
    staticPressurePa: fan.staticPressurePa,
    fanPowerW: fan.fanPowerW,
    fanHeatRiseK: bed.fanHours > 0 ? bed.fanRiseSumK / bed.fanHours : 0,
    fanEnergyKwhPerT: (fan.fanPowerW * bed.fanHours) / 1000 / tonnes,
    heaterEnergyKwhPerT: bed.heaterKwh / tonnes,
    waterRemovedKgPerT: bed.waterRemovedKg() / tonnes,
    hourly,
  }
}
