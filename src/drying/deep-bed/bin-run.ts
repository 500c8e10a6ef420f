/**
 * @module drying/deep-bed/bin-run
 * The natural-air bin model of `layer-model.ts` (equilibrium layers, water and enthalpy conserved), written for
 * speed: weather as columns, state in typed arrays, no allocation per hour, the grain's isotherm and sorption
 * heat read from precomputed tables (`grain-tables.ts`, error stated there), saturation pressure from the
 * physics table, and each layer's balance solved by a bracketed secant (Illinois) search started from that
 * layer's previous change instead of plain bisection. `simulateDeepBedReference` in `layer-model.ts` is the
 * same model with the exact functions and bisection; the tests hold the two together.
 *
 * One run: the bin is filled at `startIndex` (all layers at the initial moisture and temperature) and the fan
 * runs as `setup.fanControl` says, for `hours` hours or until the top layer (or every layer) is dry.
 */
import { SATURATION_MIN_C } from '../../physics/saturation.ts'
import { LIQUID_SATURATION_TABLE, SATURATION_TABLE_NODES_PER_K } from '../../physics/saturation-table.ts'
import { type SpoilageModel, type SpoilageState, spoilageAccumulator } from '../../product/spoilage/model.ts'
import {
  BIN_PACKING_FACTOR,
  bedPressureDropPa,
  DEFAULT_FAN_EFFICIENCY,
  fanPowerW,
} from './airflow-resistance.ts'
import { CONTINUOUS_FAN, checkFanControl, type FanControl } from './fan-control.ts'
import { type GrainTables, grainTables } from './grain-tables.ts'
import {
  type BinSetup,
  checkBinSetup,
  type DeepBedGrain,
  defaultSubsteps,
  WATER_CP_KJ_PER_KG_K,
} from './layer-model.ts'

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

/** ASHRAE HOF 2017 ch. 1: eq 30 (h = 1.006 t + W(2501 + 1.86 t)) and eq 20 (0.621945 = Mw/Mda). */
const CP_DRY_AIR = 1.006
const CP_VAPOUR = 1.86
const H_FG0 = 2501
const EPS = 0.621945
/** Gas constant of dry air [kJ/(kg·K)] (ASHRAE HOF 2017 ch. 1, 287.042 J/(kg·K)). */
const R_DRY_AIR = 0.287042

function wbPct(mDb: number): number {
  return (100 * mDb) / (1 + mDb)
}

const LIQUID = LIQUID_SATURATION_TABLE
const LIQUID_LAST = LIQUID.length / 2 - 2
const PWS_NODES_PER_K = SATURATION_TABLE_NODES_PER_K
const PWS_MIN_C = SATURATION_MIN_C

/**
 * Saturation pressure over liquid water [kPa] at tC from the physics table (cubic Hermite, error below 1e-9
 * relative; `saturation-table.ts`), read inline; writes dpws/dT [kPa/K] to `slope[0]`.
 */
function pwsKpa(tC: number, slope: Float64Array): number {
  const s = (tC - PWS_MIN_C) * PWS_NODES_PER_K
  let k = Math.floor(s)
  if (k < 0) k = 0
  else if (k > LIQUID_LAST) k = LIQUID_LAST
  const u = s - k
  const j = 2 * k
  const y0 = LIQUID[j]
  const m0 = LIQUID[j + 1]
  const y1 = LIQUID[j + 2]
  const m1 = LIQUID[j + 3]
  const c2 = 3 * (y1 - y0) - 2 * m0 - m1
  const c3 = 2 * (y0 - y1) + m0 + m1
  slope[0] = (m0 + u * (2 * c2 + 3 * c3 * u)) * PWS_NODES_PER_K
  return y0 + u * (m0 + u * (c2 + u * c3))
}

/** RH [%] over liquid water of air at tC with humidity ratio w, pressure p. */
function rhPct(tC: number, w: number, p: number, scratch: Float64Array): number {
  return (100 * ((p * w) / (EPS + w))) / pwsKpa(tC, scratch)
}

/** Smallest moisture a layer is taken to [kg/kg db] (as in the reference). */
const M_FLOOR_DB = 0.005
/**
 * The solver stops when Newton's next step is shorter than {@link NEWTON_STEP_TOL} [kg/kg db] (it takes that
 * step; the error left is about (g''/2g')·δ², below 1e-10 here), when the imbalance is below
 * {@link SOLVER_F_TOL} [% RH], or when the bracket is narrower than {@link SOLVER_X_TOL}: all below the
 * reference's bisection tolerance (1e-7).
 */
const NEWTON_STEP_TOL = 1e-6
const SOLVER_X_TOL = 1e-10
const SOLVER_F_TOL = 1e-9

/**
 * One layer's balance for one sub-step, as a function of the layer's new moisture m1: the air (dry mass ma,
 * entering at airT, airW) leaves in equilibrium with the grain (dry mass md, at m0, tg). Water and enthalpy
 * are conserved (see `layer-model.ts`); the exit state is linear (humidity) and linear-fractional (temperature)
 * in m1, and the imbalance g(m1) = exit RH − grain ERH at the exit temperature [% RH] falls with m1.
 *
 * For speed the per-hour constants are fields and the layer state is read from and written to typed arrays, so
 * no number crosses a call boundary boxed in the loop over layers.
 */
class LayerSolver {
  private readonly s = new Float64Array(1)
  private readonly e = new Float64Array(2)
  private readonly md: number
  private readonly mdCd: number
  private readonly mdCw: number
  private readonly cd: number
  // the ERH table, for reading it inline
  private readonly erhValues: Float64Array
  private readonly nM: number
  private readonly tMin: number
  private readonly mMin: number
  private readonly invDt: number
  private readonly invDm: number
  private readonly tSpan: number
  private readonly mSpan: number
  // per hour
  private p = 0
  private ma = 0
  private r = 0
  private dtH = 0

  constructor(
    private readonly tables: GrainTables,
    private readonly grain: DeepBedGrain,
    dryMatterPerLayerKgPerM2: number,
  ) {
    this.cd = grain.dryMatterCpKjPerKgK
    this.md = dryMatterPerLayerKgPerM2
    this.mdCd = this.md * this.cd
    this.mdCw = this.md * WATER_CP_KJ_PER_KG_K
    const t = tables.erh
    this.erhValues = t.values
    this.nM = t.nM
    this.tMin = t.tMin
    this.mMin = t.mMin
    this.invDt = t.invDt
    this.invDm = t.invDm
    this.tSpan = t.tSpan
    this.mSpan = t.mSpan
  }

  /** Sets the hour's pressure [kPa], dry air per sub-step [kg/m²] and sub-step [h]. */
  startHour(p: number, maPerSubstep: number, dtH: number): void {
    this.p = p
    this.ma = maPerSubstep
    this.r = this.md / maPerSubstep
    this.dtH = dtH
  }

  /**
   * Solves layer `i` for one sub-step with the air in `air` ([°C, kg/kg] entering): updates moisture[i] and
   * temp[i] and leaves the exit air in `air`. Newton's method on g(m1) from the layer's moisture, kept inside
   * the bracket the signs of g give (bisection when a step leaves it).
   *
   * Written as one function, the evaluation of g and its slope and the table reads inline: numbers passed to or
   * returned from a call the compiler does not inline are boxed, and this runs some ten million times per
   * assessment.
   */
  solve(i: number, moisture: Float64Array, temp: Float64Array, air: Float64Array): void {
    const airT = air[0]
    const airW = air[1]
    const m0 = moisture[i]
    const tg = temp[i]
    const md = this.md
    const ma = this.ma
    const r = this.r
    const p = this.p
    const mdCd = this.mdCd
    const mdCw = this.mdCw
    const eIn =
      ma * (CP_DRY_AIR * airT + airW * (H_FG0 + CP_VAPOUR * airT)) +
      md * (this.cd + WATER_CP_KJ_PER_KG_K * m0) * tg
    const mdq = md * this.tables.netSorptionHeatKjPerKg(tg, m0)
    // d(numerator)/dm1 and d(denominator)/dm1 of the exit temperature t1 = num/den
    const dNum = mdq + md * H_FG0
    const dDen = md * (WATER_CP_KJ_PER_KG_K - CP_VAPOUR)
    const values = this.erhValues
    const nM = this.nM
    // bracket [a, b] with g(a) > 0 > g(b), set after the first evaluation; an end not yet evaluated has g = NaN
    let a = m0
    let b = m0
    let ga = Number.NaN
    let gb = Number.NaN
    let g0 = 0
    let x = m0
    let next = m0
    let w1 = airW
    let t1 = tg
    let taken = false
    for (let it = 0; it < 100; it++) {
      // g(next) = exit RH − grain ERH at the exit temperature, and dg/dm1
      const dm = m0 - next
      w1 = airW + r * dm
      const den = ma * (CP_DRY_AIR + CP_VAPOUR * w1) + mdCd + mdCw * next
      t1 = (eIn - mdq * dm - ma * w1 * H_FG0) / den
      const dT = (dNum - t1 * dDen) / den
      const pws = pwsKpa(t1, this.s)
      const pv = (p * w1) / (EPS + w1)
      const rh = (100 * pv) / pws
      const dRh = ((100 * p * EPS) / ((EPS + w1) * (EPS + w1) * pws)) * -r - ((rh * this.s[0]) / pws) * dT
      let erh: number
      let erhDt: number
      let erhDm: number
      const sT = (t1 - this.tMin) * this.invDt
      const sM = (next - this.mMin) * this.invDm
      if (sT >= 0 && sT < this.tSpan && sM >= 0 && sM < this.mSpan) {
        const ci = sT | 0
        const cj = sM | 0
        const u = sT - ci
        const v = sM - cj
        const k = ci * nM + cj
        const k2 = k + nM
        const dLo = values[k + 1] - values[k]
        const dHi = values[k2 + 1] - values[k2]
        const lo = values[k] + v * dLo
        const hi = values[k2] + v * dHi
        erh = lo + u * (hi - lo)
        erhDt = (hi - lo) * this.invDt
        erhDm = (dLo + u * (dHi - dLo)) * this.invDm
      } else {
        erh = this.tables.erhPctWithSlopes(t1, next, this.e)
        erhDt = this.e[0]
        erhDm = this.e[1]
      }
      const g = rh - erh
      const slope = dRh - (erhDt * dT + erhDm)
      x = next
      if (it === 0) {
        g0 = g
        if (Math.abs(g) <= SOLVER_F_TOL) break
        if (g < 0) {
          // drying; the air can take up at most what saturation at the warmer of air and grain allows
          const pwsMax = pwsKpa(Math.max(airT, tg), this.s)
          const wSat = pwsMax < p ? (EPS * pwsMax) / (p - pwsMax) : airW + 1
          a = Math.max(M_FLOOR_DB, m0 - Math.max(1e-6, wSat - airW) / r)
          gb = g
        } else {
          // wetting: the air cannot give more water than it carries
          b = m0 + (airW / r) * 0.999999
          ga = g
        }
      } else {
        if (g > 0) {
          a = x
          ga = g
        } else {
          b = x
          gb = g
        }
        // converged, or pinned at an end of the bracket (the air's capacity: a = b)
        if (Math.abs(g) < SOLVER_F_TOL || b - a < SOLVER_X_TOL) break
      }
      next = slope < 0 ? x - g / slope : Number.NaN
      const inside = next > a && next < b
      if (inside && Math.abs(next - x) < NEWTON_STEP_TOL) {
        // Newton's next step is tiny: take it without reading the isotherm there
        x = next
        taken = true
        break
      }
      if (!inside) {
        // the Newton step leaves the bracket: try an unevaluated end first, else bisect
        if (Number.isNaN(ga)) next = a
        else if (Number.isNaN(gb)) next = b
        else next = 0.5 * (a + b)
      }
    }
    let m1 = x
    const thin = this.grain.thinLayerStep
    if (g0 < 0 && thin) {
      const rhIn = rhPct(airT, airW, p, this.s)
      const mRate = thin.call(this.grain, m0, airT, Math.min(rhIn, 99.5), this.dtH)
      if (mRate > m1) m1 = Math.min(mRate, m0)
    }
    if (taken || m1 !== x) {
      // exit state at m1 (linear in the humidity, linear-fractional in the temperature)
      const dm = m0 - m1
      w1 = airW + r * dm
      t1 = (eIn - mdq * dm - ma * w1 * H_FG0) / (ma * (CP_DRY_AIR + CP_VAPOUR * w1) + mdCd + mdCw * m1)
    }
    moisture[i] = m1
    temp[i] = t1
    air[0] = t1
    air[1] = w1
  }
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

function columnValue(col: ArrayLike<number> | number, i: number): number {
  return typeof col === 'number' ? col : col[i]
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
  const hoursToRun = wrap ? maxHours : Math.min(maxHours, n - start)
  const stopWhen = options.stopWhen ?? 'never'
  const profileEvery = options.profileEveryHours ?? 0

  const tables = grainTables(grain)
  const efficiency = setup.fanEfficiency ?? DEFAULT_FAN_EFFICIENCY
  const heatRise = setup.heatRiseK ?? 0
  const fanHeatToAir = setup.fanHeatToAir !== false
  const {
    grainTonnes: tonnes,
    airflowM3PerS: flowM3PerS,
    staticPressurePa: staticPa,
    fanPowerW: powerW,
  } = binFan(grain, setup)
  const m0 = setup.initialMoistureWbPct / (100 - setup.initialMoistureWbPct)
  const targetDb = setup.targetMoistureWbPct / (100 - setup.targetMoistureWbPct)
  const emcLimitDb =
    control.mode === 'air-emc-below' ? control.maxEmcWbPct / (100 - control.maxEmcWbPct) : Number.NaN
  const dryMatterPerLayer =
    (grain.bulkDensityKgPerM3 * (1 - setup.initialMoistureWbPct / 100) * setup.depthM) / nLayers
  const layerHeightM = setup.depthM / nLayers
  const moisture = new Float64Array(nLayers).fill(m0)
  const temp = new Float64Array(nLayers).fill(setup.initialGrainTempC)
  const air = new Float64Array(2)
  const scratch = new Float64Array(1)
  const solver = new LayerSolver(tables, grain, dryMatterPerLayer)
  const acc = spoilageAccumulator(spoilage)
  const top = nLayers - 1

  const record = options.recordHourly === true
  const hourly: BinHourlyColumns | null = record
    ? {
        plenumC: new Float64Array(hoursToRun),
        plenumRhPct: new Float64Array(hoursToRun),
        exitAirC: new Float64Array(hoursToRun),
        exitRhPct: new Float64Array(hoursToRun),
        topMoistureWbPct: new Float64Array(hoursToRun),
        meanMoistureWbPct: new Float64Array(hoursToRun),
        dryingFrontM: new Float64Array(hoursToRun),
        topDryMatterLossPct: new Float64Array(hoursToRun),
        fanOn: new Uint8Array(hoursToRun),
        heaterOn: new Uint8Array(hoursToRun),
      }
    : null
  const profiles: BinRunResult['profiles'] = []

  let hoursUntilTopDry: number | null = null
  let hoursUntilDry: number | null = null
  let hoursUntilTopSpoiled: number | null = null
  let fanHours = 0
  let missing = 0
  let heaterKwh = 0
  let fanRiseSum = 0
  let simulated = 0
  for (let h = 0; h < hoursToRun; h++) {
    let idx = start + h
    if (idx >= n) idx -= n * Math.floor(idx / n)
    const tOut = weather.dryBulbC[idx]
    const rhOut = weather.relativeHumidityPct[idx]
    const p = columnValue(weather.pressureKpa, idx)
    let plenumC = tOut
    let plenumRh = rhOut
    let exitC = Number.NaN
    let exitRh = Number.NaN
    let fanOn = false
    let heaterOn = false
    if (Number.isNaN(tOut) || Number.isNaN(rhOut) || Number.isNaN(p)) {
      missing++
    } else {
      switch (control.mode) {
        case 'continuous':
          fanOn = true
          break
        case 'rh-below':
          fanOn = rhOut <= control.maxRhPct
          break
        case 'air-emc-below':
          // EMC(T, RH) ≤ limit  ⇔  RH ≤ ERH(T, limit) (the isotherm rises with moisture)
          fanOn = rhOut <= tables.erhPct(tOut, emcLimitDb)
          break
      }
    }
    if (fanOn) {
      fanHours++
      const pv = (pwsKpa(tOut, scratch) * rhOut) / 100
      const wIn = (EPS * pv) / (p - pv)
      const vIn = (R_DRY_AIR * (tOut + 273.15) * (1 + 1.607858 * wIn)) / p
      const airKgPerS = flowM3PerS / vIn
      const rhoCp = ((1 + wIn) / vIn) * (1006 + 1860 * wIn)
      const fanRise = fanHeatToAir ? staticPa / (efficiency * rhoCp) : 0
      fanRiseSum += fanRise
      plenumC = tOut + fanRise
      const rhAfterFan = rhPct(plenumC, wIn, p, scratch)
      heaterOn =
        heatRise > 0 && (setup.heaterOnAboveRhPct === undefined || rhAfterFan > setup.heaterOnAboveRhPct)
      if (heaterOn) {
        plenumC += heatRise
        heaterKwh += airKgPerS * (CP_DRY_AIR + CP_VAPOUR * wIn) * heatRise // kJ/s over one hour = kWh
      }
      plenumRh = heaterOn ? rhPct(plenumC, wIn, p, scratch) : rhAfterFan
      const airKgPerM2H = (airKgPerS * 3600) / setup.floorAreaM2
      const substeps = setup.substepsPerHour ?? defaultSubsteps(airKgPerM2H, dryMatterPerLayer)
      solver.startHour(p, airKgPerM2H / substeps, 1 / substeps)
      for (let s = 0; s < substeps; s++) {
        air[0] = plenumC
        air[1] = wIn
        for (let i = 0; i < nLayers; i++) solver.solve(i, moisture, temp, air)
      }
      exitC = air[0]
      exitRh = Math.min(100, rhPct(air[0], air[1], p, scratch))
    }
    const topWb = wbPct(moisture[top])
    const aw = Math.min(1, tables.erhPct(temp[top], moisture[top]) / 100)
    acc.add(temp[top], topWb, aw, 1)
    simulated = h + 1
    const dml = acc.measure()
    if (hoursUntilTopSpoiled === null && dml >= spoilage.spoiledAt) hoursUntilTopSpoiled = h + 1
    let front = 0
    while (front < nLayers && moisture[front] <= targetDb) front++
    const topDry = moisture[top] <= targetDb
    if (hoursUntilTopDry === null && topDry) hoursUntilTopDry = h + 1
    if (hoursUntilDry === null && front === nLayers) hoursUntilDry = h + 1
    if (hourly) {
      let sum = 0
      for (let i = 0; i < nLayers; i++) sum += moisture[i]
      hourly.plenumC[h] = plenumC
      hourly.plenumRhPct[h] = plenumRh
      hourly.exitAirC[h] = exitC
      hourly.exitRhPct[h] = exitRh
      hourly.topMoistureWbPct[h] = topWb
      hourly.meanMoistureWbPct[h] = wbPct(sum / nLayers)
      hourly.dryingFrontM[h] = front * layerHeightM
      hourly.topDryMatterLossPct[h] = dml
      hourly.fanOn[h] = fanOn ? 1 : 0
      hourly.heaterOn[h] = heaterOn ? 1 : 0
    }
    if (profileEvery > 0 && (h + 1) % profileEvery === 0) {
      profiles.push({ hour: h + 1, moistureWbPct: Array.from(moisture, wbPct) })
    }
    if ((stopWhen === 'top-dry' && topDry) || (stopWhen === 'all-dry' && front === nLayers)) break
  }
  const finalMoistureWbPct = Array.from(moisture, wbPct)
  if (profiles.length === 0 || profiles[profiles.length - 1].hour !== simulated) {
    profiles.push({ hour: simulated, moistureWbPct: finalMoistureWbPct.slice() })
  }
  let waterKg = 0
  for (let i = 0; i < nLayers; i++) waterKg += (m0 - moisture[i]) * dryMatterPerLayer * setup.floorAreaM2
  const state = acc.state()
  return {
    hoursSimulated: simulated,
    fanHours,
    missingWeatherHours: missing,
    hoursUntilTopDry,
    hoursUntilDry,
    hoursUntilTopSpoiled,
    topDryMatterLossPct: state.measure,
    topSpoiled: state.measure >= spoilage.spoiledAt,
    topSpoilage: state,
    finalMoistureWbPct,
    finalGrainTempC: Array.from(temp),
    profiles,
    grainTonnes: tonnes,
    airflowM3PerS: flowM3PerS,
    staticPressurePa: staticPa,
    fanPowerW: powerW,
    fanHeatRiseK: fanHours > 0 ? fanRiseSum / fanHours : 0,
    fanEnergyKwhPerT: (powerW * fanHours) / 1000 / tonnes,
    heaterEnergyKwhPerT: heaterKwh / tonnes,
    waterRemovedKgPerT: waterKg / tonnes,
    hourly,
  }
}
