/**
 * @module analysis/energy/physics-view
 * The physics-normalised view: for every batch with outside air, the ideal heat per kg of water from the
 * psychrometric state (./dryer-physics.ts), the dryer's efficiency and fixed loss fitted over the baseline
 * (./physics-fit.ts), and the chart of measured over expected energy in % (100 % = as the baseline dryer
 * would have done in this batch's weather with this load). As in the regression view, what is charted is
 * the ratio's deviation from 100 % standardized by the batch's leverage h: divided by √(1 − h) in the
 * baseline (whose batches shaped the fit) and by √(1 + h) after it (the fit's own error grows as the
 * weather moves away from the baseline's; Montgomery, Peck & Vining, *Introduction to Linear Regression
 * Analysis*, ch. 3–4). Near the baseline's weather h is small (about 0.05 for 20 batches) and the charted
 * value is the plain ratio within a few tenths of a per cent.
 */
import type { BatchEnergy } from './batch-energy.ts'
import { type ChartSet, chartSet } from './chart-set.ts'
import { idealDryerHeat } from './dryer-physics.ts'
import { expectedSpecificEnergy, fitPhysics, type PhysicsFit, physicsLeverage } from './physics-fit.ts'

export interface PhysicsView extends ChartSet {
  fit: PhysicsFit
  /** Ideal heat φ [MJ/kg water] of each charted batch. */
  idealHeatMjPerKg: number[]
  /** Wet bulb of the heated air [°C] of each charted batch. */
  heatedWetBulbC: number[]
  /** Expected fuel heat per kg of water ê = φ/η + L/m_w [MJ/kg] of each charted batch. */
  expectedSpecificEnergyMjPerKg: number[]
  /** Measured over expected energy [%] of each charted batch, before standardization. */
  ratioPct: number[]
  /** Leverage h of each charted batch under the physics fit. */
  leverages: number[]
}

/** Smallest baseline the physics fit accepts (two parameters and some spread). */
export const MIN_PHYSICS_BASELINE = 5

/**
 * The physics view, or the reason it cannot be drawn. Batches without outside air, or whose drying air is
 * not warmer than outside, are left off (and counted in the reason when they are in the baseline).
 */
export function physicsView(
  batches: BatchEnergy[],
  baselineCount: number,
): { view: PhysicsView; leftOff: string[] } | { view: null; reason: string } {
  const charted: { b: BatchEnergy; phi: number; wetBulb: number }[] = []
  const leftOff: string[] = []
  for (const b of batches) {
    if (!b.ambient) continue
    try {
      const ideal = idealDryerHeat({
        outsideTempC: b.ambient.dryBulbC,
        outsideHumidityRatioKgPerKg: b.ambient.humidityRatioGPerKg / 1000,
        dryingTempC: b.dryingTempC,
        pressureKpa: b.ambient.pressureKpa,
        sorptionHeatMjPerKgWater: b.sorptionHeatMj === null ? 0 : b.sorptionHeatMj / b.waterRemovedKg,
      })
      charted.push({ b, phi: ideal.idealHeatMjPerKgWater, wetBulb: ideal.heatedWetBulbC })
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      leftOff.push(`batch ${b.batchId} (line ${b.line}): ${e.message}`)
    }
  }
  const base = charted.filter((c) => c.b.index < baselineCount)
  if (base.length < baselineCount) {
    const missing = baselineCount - base.length
    const noAir = batches.filter((b) => b.index < baselineCount && !b.ambient).length
    return {
      view: null,
      reason:
        noAir > 0
          ? `${noAir} baseline batches have no outside temperature and RH (add ambient_temp_c and ambient_rh_pct, or a weather file covering them)`
          : `${missing} baseline batches cannot be modelled: ${leftOff[0] ?? ''}`,
    }
  }
  if (base.length < MIN_PHYSICS_BASELINE) {
    return { view: null, reason: `the physics fit needs at least ${MIN_PHYSICS_BASELINE} baseline batches` }
  }
  try {
    const fit = fitPhysics(
      base.map((c) => c.phi),
      base.map((c) => c.b.waterRemovedKg),
      base.map((c) => c.b.specificEnergyMjPerKg),
    )
    const expected = charted.map((c) => expectedSpecificEnergy(fit, c.phi, c.b.waterRemovedKg))
    const ratioPct = charted.map((c, i) => (100 * c.b.specificEnergyMjPerKg) / expected[i])
    const leverages = charted.map((c) => physicsLeverage(fit, c.phi, c.b.waterRemovedKg))
    const standardized = ratioPct.map(
      (r, i) =>
        100 +
        (r - 100) /
          Math.sqrt(charted[i].b.index < baselineCount ? Math.max(1e-9, 1 - leverages[i]) : 1 + leverages[i]),
    )
    const set = chartSet(
      standardized,
      charted.map((c) => c.b.index),
      base.length,
      batches,
      baselineCount,
      '% of expected',
    )
    return {
      view: {
        ...set,
        fit,
        idealHeatMjPerKg: charted.map((c) => c.phi),
        heatedWetBulbC: charted.map((c) => c.wetBulb),
        expectedSpecificEnergyMjPerKg: expected,
        ratioPct,
        leverages,
      },
      leftOff,
    }
  } catch (e) {
    if (!(e instanceof RangeError)) throw e
    return { view: null, reason: e.message }
  }
}
