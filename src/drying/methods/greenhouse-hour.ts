/**
 * @module drying/methods/greenhouse-hour
 * One hour of the greenhouse dryer (./greenhouse.ts): the inside air from the heat and water balances of the
 * enclosure (physics/greenhouse-air.ts) coupled to the product's surface balance in that air
 * (physics/wet-surface.ts through ./method-model.ts), solved by a damped fixed-point iteration:
 * 1. the product in the inside air (T_i, W_i): its wet-surface evaporation, and the water it gives in the first
 *    hour of a fresh batch by its own kinetics at that surface; the smaller of the two loads the air;
 * 2. the air: ΔT from Q_sun − λE = (k·A_c + ṁ(ΔT)·c_p)·ΔT, then W_i = W_o + E/ṁ (capped at saturation: the excess
 *    condenses on the cover);
 * 3. repeat until T_i moves less than 0.01 K and W_i less than 10⁻⁵ kg/kg.
 */
import { KELVIN_OFFSET, S_PER_HOUR } from '../../physics/constants.ts'
import { thinCoverTemperatureC } from '../../physics/cover-exchange.ts'
import {
  flatPlateHeatTransferCoefficientWm2K,
  latentHeatVaporizationMjPerKg,
  radiativeHeatTransferCoefficientWm2K,
} from '../../physics/evaporation.ts'
import {
  type EnclosureHeatBalance,
  enclosureAirRiseK,
  stackCoefficientM3PerSPerRootK,
  ventilatedHumidityRatio,
} from '../../physics/greenhouse-air.ts'
import {
  moistAirHeatCapacityKjPerKgK,
  moistAirSpecificVolumeM3PerKg,
  saturationHumidityRatio,
  vaporPressureFromHumidityRatio,
} from '../../physics/moist-air.ts'
import { saturationPressureLiquidPa } from '../../physics/saturation.ts'
import { resistanceOfHeatTransferCoefficientSPerM, WetSurface } from '../../physics/wet-surface.ts'
import { EMC_RH_CAP_PCT, type ProductResponse, stepMoistureRatio } from '../product-response.ts'
import { type MethodHour, wetSurfaceEvaporationInAir } from './method-model.ts'

/** What the hour's balance needs of the greenhouse, fixed for a series. */
export interface GreenhouseGeometry {
  /** Floor, cover and tray areas [m²], cross-section of the enclosure [m²]. */
  floorM2: number
  coverM2: number
  trayM2: number
  crossSectionM2: number
  /** Stated ventilation: dry air [kg/s] is this volume flow [m³/s] over the specific volume (0: stack only). */
  fixedVentilationM3PerS: number
  /** Stack openings: discharge coefficient, effective area of the low and high openings in series [m²], their height apart [m]. */
  dischargeCoefficient: number
  seriesOpeningM2: number
  ventHeightM: number
  /** Solar absorptance of the product and of the bare floor, share of the floor under trays. */
  productAbsorptivity: number
  floorAbsorptance: number
  /** Share of the sun absorbed on the floor that goes into the ground. */
  groundShare: number
  /** Long-wave emissivity of the product. */
  productEmissivity: number
  /** Share of the tray the product covers (layer geometry). */
  coverage: number
  /** Product dry matter per m² of tray [kg/m²] and its initial moisture [kg/kg db]. */
  dryMatterKgPerM2: number
  initialDb: number
}

const MAX_ITERATIONS = 40
const RELAXATION = 0.5
const T_TOLERANCE_K = 0.01
const W_TOLERANCE = 1e-5
/** Inside air held just below saturation (its vapour pressure must stay below the saturation one): our choice. */
const SATURATION_MARGIN = 0.999

/**
 * The per-hour solver (one per series; no allocation per hour). `solve` sets on `hour` the inside air (airC,
 * vaporPressureKpa, humidityRatio), the product's temperatures and wet-surface evaporation, and returns the dry-air
 * flow of the hour [kg/s].
 */
export class GreenhouseHour {
  readonly surface = new WetSurface()
  private readonly balance: EnclosureHeatBalance = {
    netHeatW: 0,
    coverLossWK: 0,
    fixedAirKgPerS: 0,
    stackAirKgPerSPerRootK: 0,
    cpJPerKgK: 1006,
  }
  private readonly step = new Float64Array(2)
  /** Evaporation that loaded the air in the last solved hour [kg/s]. */
  airLoadKgPerS = 0
  /** Sun absorbed inside and passed to the air in the last solved hour [W]. */
  sunToAirW = 0

  constructor(
    private readonly g: GreenhouseGeometry,
    private readonly product: ProductResponse,
  ) {
    this.surface.exact = true
  }

  /**
   * The product's balance in air at `airC` moving at `airSpeedMs` (vapour pressure and W already on `hour`), the
   * cover at its convective temperature; sets the product's temperatures and evaporation on `hour`.
   */
  private productInAir(hour: MethodHour, airC: number, airSpeedMs: number, transmittedWm2: number): void {
    const hIn = flatPlateHeatTransferCoefficientWm2K(airSpeedMs)
    const coverC = thinCoverTemperatureC(
      hIn,
      airC,
      flatPlateHeatTransferCoefficientWm2K(hour.windAt2mMs),
      hour.dryBulbC,
    )
    const s = this.surface
    s.radiativeConductanceWm2K = radiativeHeatTransferCoefficientWm2K(this.g.productEmissivity, coverC)
    const available =
      this.g.productAbsorptivity * transmittedWm2 - s.radiativeConductanceWm2K * (airC - coverC)
    const resistance = resistanceOfHeatTransferCoefficientSPerM(
      hIn,
      airC,
      hour.humidityRatio,
      hour.pressureKpa,
    )
    const conductance = wetSurfaceEvaporationInAir(hour, s, available, airC, resistance, this.g.coverage)
    // a surface that evaporates nothing: T_air + Q/(H + R)
    hour.productC = airC + available / conductance
  }

  /** Water [kg per m² of tray in the hour] a fresh batch gives in its first hour at the wet-surface temperature. */
  private freshBatchEvaporationKgPerM2H(hour: MethodHour): number {
    const t = hour.productWetC
    let rh = (100 * hour.vaporPressureKpa) / (saturationPressureLiquidPa(t) * 1e-3)
    if (!(rh <= EMC_RH_CAP_PCT)) rh = EMC_RH_CAP_PCT
    const me = this.product.emcDesorptionDb(t, rh)
    const m0 = this.g.initialDb
    if (!(m0 > me)) return 0
    this.product.stepParameters(t, rh, this.step)
    const mr = stepMoistureRatio(1, this.step[0], this.step[1], 1, this.product.thompsonTimeScale)
    return (m0 - me) * (1 - mr) * this.g.dryMatterKgPerM2
  }

  /** Set the inside humidity ratio `w` (and its vapour pressure) on `hour`. */
  private static setInsideHumidity(hour: MethodHour, w: number): void {
    hour.humidityRatio = w
    hour.vaporPressureKpa = vaporPressureFromHumidityRatio(w, hour.pressureKpa)
  }

  /**
   * The hour in sun: `transmittedWm2` through the cover onto the floor, the cover losing `coverLossWm2K` per m² and
   * kelvin. See the module note.
   */
  solve(hour: MethodHour, transmittedWm2: number, coverLossWm2K: number): number {
    const g = this.g
    const outC = hour.dryBulbC
    const outW = hour.humidityRatio
    const p = hour.pressureKpa
    const trayShare = g.trayM2 / g.floorM2
    const absorbed =
      transmittedWm2 * (trayShare * g.productAbsorptivity + (1 - trayShare) * g.floorAbsorptance)
    this.sunToAirW = absorbed * g.floorM2 * (1 - g.groundShare)
    const b = this.balance
    b.coverLossWK = coverLossWm2K * g.coverM2
    let tIn = outC
    let wIn = outW
    let flow = 0
    let evaluatedC = tIn
    let converged = false
    for (let k = 0; k < MAX_ITERATIONS && !converged; k++) {
      // never above saturation at the air temperature evaluated (the excess condenses on the cover)
      const wSatIn = SATURATION_MARGIN * saturationHumidityRatio(tIn, p)
      if (wIn > wSatIn) wIn = wSatIn
      GreenhouseHour.setInsideHumidity(hour, wIn)
      evaluatedC = tIn
      const v = moistAirSpecificVolumeM3PerKg(tIn, wIn, p)
      const rise = tIn - outC
      b.fixedAirKgPerS = g.fixedVentilationM3PerS / v
      // the stack coefficient at the mean temperature of the current iterate
      b.stackAirKgPerSPerRootK =
        stackCoefficientM3PerSPerRootK(
          g.dischargeCoefficient,
          g.seriesOpeningM2,
          g.ventHeightM,
          outC + KELVIN_OFFSET + rise / 2,
        ) / v
      flow = b.fixedAirKgPerS + b.stackAirKgPerSPerRootK * Math.sqrt(Math.abs(rise))
      this.productInAir(hour, tIn, (flow * v) / g.crossSectionM2, transmittedWm2)
      const perM2 = Math.min(Math.max(0, hour.evaporationKgPerM2H), this.freshBatchEvaporationKgPerM2H(hour))
      const evaporation = (perM2 * g.trayM2) / S_PER_HOUR
      b.netHeatW = this.sunToAirW - latentHeatVaporizationMjPerKg(hour.productWetC) * 1e6 * evaporation
      b.cpJPerKgK = 1000 * moistAirHeatCapacityKjPerKgK(wIn)
      const newRise = enclosureAirRiseK(b)
      const newFlow = b.fixedAirKgPerS + b.stackAirKgPerSPerRootK * Math.sqrt(Math.abs(newRise))
      const tNew = outC + newRise
      let wNew = newFlow > 0 ? ventilatedHumidityRatio(outW, evaporation, newFlow) : outW
      const wSat = SATURATION_MARGIN * saturationHumidityRatio(tNew, p)
      if (wNew > wSat) wNew = wSat
      this.airLoadKgPerS = evaporation
      converged = Math.abs(tNew - tIn) < T_TOLERANCE_K && Math.abs(wNew - wIn) < W_TOLERANCE
      if (!converged) {
        tIn += RELAXATION * (tNew - tIn)
        wIn += RELAXATION * (wNew - wIn)
      }
    }
    // the outputs on `hour` are those of the last state evaluated (within the tolerances of the balance when converged)
    hour.airC = evaluatedC
    return flow
  }
}
