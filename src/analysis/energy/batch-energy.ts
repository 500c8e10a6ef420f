/**
 * @module analysis/energy/batch-energy
 * What each batch did: water removed, specific energy (MJ of fuel heat per kg of water removed) and
 * thermal efficiency against the ideal heat, water × latent heat of free water at the drying temperature
 * (λ = 2.501 − 0.002361·T MJ/kg, FAO-56 Annex 3 eq 3-1) plus, when a product profile is given, the extra
 * heat of sorption from its isotherm (./sorption-heat.ts).
 */
import { latentHeatVaporizationMjPerKg } from '../../physics/evaporation.ts'
import type { ProductProfile } from '../../product/profile.ts'
import type { BatchRecord } from './batch-log.ts'
import { batchSorptionHeatMj } from './sorption-heat.ts'

export interface BatchAmbientValues {
  dryBulbC: number
  relativeHumidityPct: number
  humidityRatioGPerKg: number
  /** Air pressure the humidity ratio was computed at [kPa] (log, weather file, elevation or sea level). */
  pressureKpa: number
  source: 'log' | 'weather'
}

export interface BatchEnergy {
  /** 0-based position in time order. */
  index: number
  line: number
  batchId: string
  startText: string
  /** UTC start [ms]. */
  startUtcMs: number
  durationH: number
  freshMassKg: number
  waterRemovedKg: number
  energyMj: number
  specificEnergyMjPerKg: number
  dryingTempC: number
  latentHeatMjPerKg: number
  /** Heat of sorption [MJ] from the profile's isotherm, or null (no profile, no moistures, or out of its range). */
  sorptionHeatMj: number | null
  /** Water × latent heat (+ sorption heat) [MJ]. */
  idealHeatMj: number
  /** idealHeatMj / energyMj × 100. */
  thermalEfficiencyPct: number
  ambient: BatchAmbientValues | null
}

export interface BatchEnergyContext {
  dryingTempC: number
  profile?: ProductProfile
}

/** Initial and final moisture (wet basis, %) of a batch where the log allows, else null. */
function moisturesWbPct(b: BatchRecord): { initial: number; final: number } | null {
  if (b.initialMoistureWbPct === null) return null
  if (b.finalMoistureWbPct !== null) return { initial: b.initialMoistureWbPct, final: b.finalMoistureWbPct }
  if (b.finalMassKg === null) return null
  const dry = b.freshMassKg * (1 - b.initialMoistureWbPct / 100)
  const final = 100 * (1 - dry / b.finalMassKg)
  return final > 0 ? { initial: b.initialMoistureWbPct, final } : null
}

/** Water removed [kg]: fresh − final mass when weighed, else m·(w0 − w1)/(1 − w1). */
export function waterRemovedKg(b: BatchRecord): number {
  if (b.finalMassKg !== null) return b.freshMassKg - b.finalMassKg
  const w0 = (b.initialMoistureWbPct as number) / 100
  const w1 = (b.finalMoistureWbPct as number) / 100
  return (b.freshMassKg * (w0 - w1)) / (1 - w1)
}

/**
 * Derive one batch. Example: 10,000 kg fresh to 9,000 kg with 4,000 MJ of propane at 60 °C → 1,000 kg water,
 * 4.00 MJ/kg, ideal 1,000 × 2.3593 = 2,359 MJ, efficiency 59.0 %.
 */
export function batchEnergy(
  b: BatchRecord,
  index: number,
  startUtcMs: number,
  ambient: BatchAmbientValues | null,
  context: BatchEnergyContext,
): BatchEnergy {
  const water = waterRemovedKg(b)
  const dryingTempC = b.dryingTempC ?? context.dryingTempC
  const latent = latentHeatVaporizationMjPerKg(dryingTempC)
  let sorption: number | null = null
  const m = moisturesWbPct(b)
  if (context.profile && m) {
    try {
      const dry = b.freshMassKg * (1 - m.initial / 100)
      const toDb = (wb: number) => wb / (100 - wb)
      sorption = batchSorptionHeatMj(
        context.profile.isotherm.desorption.equation,
        dryingTempC,
        dry,
        toDb(m.initial),
        toDb(m.final),
      )
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      sorption = null
    }
  }
  const ideal = water * latent + (sorption ?? 0)
  return {
    index,
    line: b.line,
    batchId: b.batchId,
    startText: b.startText,
    startUtcMs,
    durationH: b.durationH,
    freshMassKg: b.freshMassKg,
    waterRemovedKg: water,
    energyMj: b.energyMj,
    specificEnergyMjPerKg: b.energyMj / water,
    dryingTempC,
    latentHeatMjPerKg: latent,
    sorptionHeatMj: sorption,
    idealHeatMj: ideal,
    thermalEfficiencyPct: (100 * ideal) / b.energyMj,
    ambient,
  }
}
