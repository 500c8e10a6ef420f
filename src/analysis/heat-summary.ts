/**
 * @module analysis/heat-summary
 * The heat and fuel figures of an assessment: the spread of the supplemental heat over the season's
 * batches, per tonne and per batch, the fuel quantity and cost of every fuel at the median, and a
 * cross-check against the heat it takes to evaporate the water (latent heat of free water plus the
 * isotherm's heat of sorption, divided by the heater efficiency).
 */

import { FUEL_IDS, FUELS, fuelForHeat } from '../drying/fuels.ts'
import type { HourlyConditions } from '../drying/hourly-conditions.ts'
import { S_PER_HOUR } from '../physics/constants.ts'
import { heatOfSorption } from '../product/equilibrium.ts'
import { waterToRemoveKg } from '../product/moisture-basis.ts'
import type { ResolvedAssessOptions } from './assess-options.ts'
import type { FuelFigure, HeatSummary } from './assessment.ts'
import { HEATED_SAMPLE_BATCHES } from './plan.ts'
import { runStart, type StartContext, type StartOutcome } from './start-dates.ts'
import { quantileSorted, roundOrNull, spread } from './statistics.ts'

function meanOf(column: Float64Array): number {
  let sum = 0
  let count = 0
  for (let i = 0; i < column.length; i++) {
    const v = column[i]
    if (Number.isFinite(v)) {
      sum += v
      count++
    }
  }
  return count > 0 ? sum / count : Number.NaN
}

/** Heater heat [kWh/t] of up to `count` batches heated every hour, started evenly through the file. */
function heatedEveryHourSample(ctx: StartContext, count: number): number[] {
  const out: number[] = []
  const last = ctx.series.hours - (ctx.wrap ? 1 : ctx.maxHours)
  if (last <= 0) return out
  // other conditions than the context's: its record of the method's own batches does not answer for these
  const heated: StartContext = { ...ctx, primary: ctx.backup, spoilage: undefined }
  for (let k = 0; k < count; k++) {
    const index = Math.floor((k * last) / count)
    const o = runStart(heated, index)
    if (Number.isFinite(o.heatKwhPerTonne)) out.push(o.heatKwhPerTonne)
  }
  return out
}

function fuelFigures(run: ResolvedAssessOptions, medianKwhPerTonne: number | null): FuelFigure[] {
  const tonnes = run.batchKgFresh / 1000
  const eff = run.backupMethod.heaterEfficiency
  return FUEL_IDS.map((id) => {
    const price = run.fuelPrices?.[id]
    const use = medianKwhPerTonne === null ? null : fuelForHeat(medianKwhPerTonne, eff, id, price)
    return {
      fuel: id,
      name: FUELS[id].name,
      unit: FUELS[id].unit,
      quantityPerTonne: use ? roundOrNull(use.quantity, 2) : null,
      quantityPerBatch: use ? roundOrNull(use.quantity * tonnes, 2) : null,
      costPerTonne: use ? roundOrNull(use.cost, 2) : null,
      costPerBatch: use ? roundOrNull(use.cost * tonnes, 2) : null,
      pricePerUnit: price ?? FUELS[id].examplePricePerUnit,
      priceIsExample: price === undefined,
      heatingValueMjPerUnit: roundOrNull(FUELS[id].heatingValueMjPerUnit, 3) ?? 0,
      heatingValueSource: FUELS[id].source,
    }
  })
}

/** The heat figures of the season's batch outcomes, with the backup heater's conditions `backup`. */
export function heatSummary(
  outcomes: StartOutcome[],
  backup: HourlyConditions,
  run: ResolvedAssessOptions,
  ctx: StartContext,
  options: { heatedSample?: boolean } = {},
): HeatSummary {
  const heater = run.backupMethod
  const tonnes = run.batchKgFresh / 1000
  const eff = heater.heaterEfficiency
  const s = spread(
    outcomes.map((o) => o.heatKwhPerTonne),
    1,
  )
  const scale = (x: number | null, f: number): number | null => (x === null ? null : roundOrNull(x * f, 1))
  // Cross-check: water to remove × (λ + net sorption heat at the target) ÷ efficiency.
  const water = waterToRemoveKg(1000, run.initialWbPct, run.targetWbPct)
  const meanComputedC = meanOf(backup.airC)
  // no batch needed the backup heater: take its lowest air temperature for the latent heat
  const meanHeatedC = Number.isFinite(meanComputedC) ? meanComputedC : heater.minAirC
  const sorption = heatOfSorption(run.profile, Math.min(Math.max(meanHeatedC, 0), 90), run.targetDb)
  const evaporationFuelKwh = (water * sorption.totalKjPerKg) / S_PER_HOUR / eff
  const heatedOnly = options.heatedSample === false ? [] : heatedEveryHourSample(ctx, HEATED_SAMPLE_BATCHES)
  const ratio =
    heatedOnly.length > 0
      ? quantileSorted(
          heatedOnly.sort((a, b) => a - b),
          0.5,
        ) /
        eff /
        evaporationFuelKwh
      : Number.NaN
  return {
    heaterEfficiency: eff,
    airFlowKgPerSPerTonne: heater.airFlowKgPerSPerTonne,
    targetRhPct: heater.setPointC === undefined ? roundOrNull(heater.targetRhPct, 1) : null,
    setPointC: heater.setPointC ?? null,
    batchKgFresh: run.batchKgFresh,
    heatToAirKwhPerTonne: s,
    heatToAirKwhPerBatch: {
      median: scale(s.median, tonnes),
      p10: scale(s.p10, tonnes),
      p90: scale(s.p90, tonnes),
    },
    fuelHeatKwhPerTonne: {
      median: scale(s.median, 1 / eff),
      p10: scale(s.p10, 1 / eff),
      p90: scale(s.p90, 1 / eff),
    },
    fuels: fuelFigures(run, s.median),
    selectedFuel: run.fuel ?? heater.fuel,
    currency: run.currency,
    crossCheck: {
      waterToRemoveKgPerTonne: roundOrNull(water, 1) ?? 0,
      heatOfEvaporationKjPerKg: roundOrNull(sorption.totalKjPerKg, 0) ?? 0,
      heatOfEvaporationMethod: `latent heat of free water 2501 − 2.361·T (FAO-56 form) at the mean heated-air temperature ${meanHeatedC.toFixed(1)} °C, plus ${sorption.method}`,
      evaporationHeatFuelKwhPerTonne: roundOrNull(evaporationFuelKwh, 1) ?? 0,
      ratioHeatedEveryHour: roundOrNull(ratio, 2),
      note: 'A dryer heated every hour spends more than the evaporation heat because its exhaust leaves warm and unsaturated (ratio > 1); supplemental heat can be below it because ambient air does part of the drying.',
    },
  }
}
