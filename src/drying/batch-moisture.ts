/**
 * @module drying/batch-moisture
 * The product's moisture through one hour of a batch, and the batch's running totals (docs/model.md §7):
 * - drying (M above the desorption equilibrium): thin-layer step by equivalent time
 *   (drying/product-response.ts), never removing more than the hour's constant-rate limit (wet-surface
 *   evaporation for exposed products, humidity-ratio deficit × air mass for forced air);
 * - rewetting (M below the adsorption equilibrium): M → Me_ads − (Me_ads − M)·exp(−f·k·1 h), f the profile's
 *   rewetting rate factor (Lewis form; stated simplification);
 * - rain on an exposed product: rewetting toward the equilibrium at 99.5 % RH, counted as rain exposure;
 *   that water comes from rain, not from the air;
 * - paused (covered, fans off) and missing hours: no change.
 */
import type { HourlyConditions } from './hourly-conditions.ts'
import { HourMode } from './methods/method-model.ts'
import {
  EMC_RH_CAP_PCT,
  firstOrderRateConstant,
  type ProductResponse,
  stepMoistureRatio,
} from './product-response.ts'

/** One batch's moisture and totals; `stepHour(c, i)` applies hour `i` of the conditions `c`. */
export class BatchMoisture {
  /** Moisture [kg/kg db]. */
  moistureDb: number
  rewettingHours = 0
  rainExposureHours = 0
  missingHours = 0
  /** [kWh per tonne fresh] */
  heaterKwhPerTonne = 0
  /** [kWh per tonne fresh] */
  solarKwhPerTonne = 0
  /** Water the air carried off net of water it gave back [kg per kg dry matter]. */
  waterToAirDb = 0
  /** Water taken up from rain [kg per kg dry matter]. */
  waterFromRainDb = 0
  private readonly timeScale: number

  constructor(
    private readonly product: ProductResponse,
    private readonly initialDb: number,
  ) {
    this.moistureDb = initialDb
    this.timeScale = product.thompsonTimeScale
  }

  stepHour(c: HourlyConditions, i: number): void {
    const mode = c.mode[i]
    if (mode === HourMode.missing) {
      this.missingHours++
      return
    }
    if (mode === HourMode.paused) return
    this.heaterKwhPerTonne += c.heaterKwhPerTonne[i]
    this.solarKwhPerTonne += c.solarKwhPerTonne[i]
    if (mode === HourMode.rainExposed) this.rainHour(c, i)
    else this.airHour(c, i)
  }

  /** Rain-wetted surface: toward the equilibrium at the highest RH evaluated. */
  private rainHour(c: HourlyConditions, i: number): void {
    this.rainExposureHours++
    const m = this.moistureDb
    const meWet = this.product.emcAdsorptionDb(c.productC[i], EMC_RH_CAP_PCT)
    if (meWet > m) {
      const next = meWet - (meWet - m) * c.rewetDecayPerHour[i]
      this.waterFromRainDb += next - m
      this.moistureDb = next
    }
  }

  /** Drying toward the desorption equilibrium, or rewetting toward the adsorption one. */
  private airHour(c: HourlyConditions, i: number): void {
    const m = this.moistureDb
    const meDes = c.emcDesorptionDb[i]
    const meAds = c.emcAdsorptionDb[i]
    if (m > meDes) {
      let drop = m - this.dryingStep(c, i, m, meDes)
      const cap = c.capDbPerH[i]
      if (drop > cap) drop = cap
      if (drop > 0) {
        this.moistureDb = m - drop
        this.waterToAirDb += drop
      }
    } else if (m < meAds) {
      this.rewettingHours++
      const next = meAds - (meAds - m) * c.rewetDecayPerHour[i]
      this.waterToAirDb -= next - m
      this.moistureDb = next
    }
  }

  /** Moisture after an hour of thin-layer drying from `m` toward `meDes`, before the constant-rate cap. */
  private dryingStep(c: HourlyConditions, i: number, m: number, meDes: number): number {
    const decay = c.decayPerHour[i]
    // first order: equivalent-time stepping reduces to M' = Me + (M − Me)·exp(−k)
    if (!Number.isNaN(decay)) return meDes + (m - meDes) * decay
    const m0 = this.initialDb
    if (m0 > meDes) {
      const mr = (m - meDes) / (m0 - meDes)
      return meDes + stepMoistureRatio(mr, c.rateK[i], c.rateN[i], 1, this.timeScale) * (m0 - meDes)
    }
    return meDes + (m - meDes) * Math.exp(-firstOrderRateConstant(c.rateK[i], c.rateN[i], this.timeScale))
  }
}
