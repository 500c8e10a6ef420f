/**
 * @module drying/mass-balance
 * Air-side check of a forced-air batch: from the moisture trace, the water each hour's air must have
 * taken up, the outlet air state reached adiabatically (constant enthalpy, ASHRAE HOF 2017 ch. 1 eq 30),
 * and the water that outlet state holds recomputed from its temperature and RH through the moist-air
 * relations. The sum over the batch must equal the water the product lost, and no outlet may exceed
 * saturation (evaporation ≤ deficit × air mass).
 */
import { adiabaticEndDryBulbC, humidityRatioFromRh, relativeHumidityPctAt } from '../physics/air-processes.ts'
import { S_PER_HOUR } from '../physics/constants.ts'
import type { BatchResult } from './batch.ts'
import type { HourlyConditions } from './hourly-conditions.ts'

export interface AirLedger {
  /** Water the product lost to the air [kg per tonne fresh] (drying hours only). */
  waterFromProductKgPerTonne: number
  /** Water the outlet air carries above the inlet, from the outlet states [kg per tonne fresh]. */
  waterCarriedByAirKgPerTonne: number
  /** Highest outlet RH of the batch [%]; ≤ 100 when evaporation never exceeded what the air can carry. */
  maxOutletRhPct: number
}

/**
 * Ledger of a batch simulated with `recordTrace` over `conditions` (forced air: airFlowKgPerSPerTonne > 0),
 * starting at `startIndex` with `initialDb` and dry matter `dryMatterKgPerTonne` per tonne fresh.
 */
export function forcedAirLedger(
  conditions: HourlyConditions,
  pressureKpa: Float64Array,
  batch: BatchResult,
  startIndex: number,
  initialDb: number,
  dryMatterKgPerTonne: number,
): AirLedger {
  if (!batch.trace) throw new RangeError('the batch must be simulated with recordTrace: true')
  const airKgPerH = conditions.airFlowKgPerSPerTonne * S_PER_HOUR
  if (!(airKgPerH > 0)) throw new RangeError('the air ledger needs a forced-air method (air flow > 0)')
  let fromProduct = 0
  let carried = 0
  let maxRh = 0
  let m = initialDb
  for (let h = 0; h < batch.hoursSimulated; h++) {
    const i = startIndex + h
    const next = batch.trace[h]
    const lost = (m - next) * dryMatterKgPerTonne
    m = next
    if (!(lost > 0)) continue
    fromProduct += lost
    const wIn = conditions.humidityRatio[i]
    const tIn = conditions.airC[i]
    const p = pressureKpa[i]
    const wOut = wIn + lost / airKgPerH
    const tOut = adiabaticEndDryBulbC(tIn, wIn, lost / airKgPerH)
    const rhOut = relativeHumidityPctAt(tOut, wOut, p)
    if (rhOut > maxRh) maxRh = rhOut
    const wFromState = humidityRatioFromRh(tOut, rhOut, p)
    carried += (wFromState - wIn) * airKgPerH
  }
  return {
    waterFromProductKgPerTonne: fromProduct,
    waterCarriedByAirKgPerTonne: carried,
    maxOutletRhPct: maxRh,
  }
}
