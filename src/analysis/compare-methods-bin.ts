/**
 * @module analysis/compare-methods-bin
 * Grain in a bin (natural-air-bin) among the methods side by side. A bin is not a batch: its answer
 * (`assessment.bin`) is per start date × airflow × year, and it is "in time" when its top layer dries
 * before it passes the dry-matter-loss limit within the season in the bin, not within the batch deadline
 * (the other methods' deadline keeps batches from spoiling; the bin's own spoilage model does that here).
 * Its row in the comparison therefore reads:
 * - at one airflow: the smallest candidate that is safe in the required share of years at every start
 *   month (the airflow `compare` reports as serving every start month), or the largest candidate when none
 *   is (said so);
 * - "finishes in time" = the share of years safe (top layer dry within the season, dry-matter loss below
 *   the limit); "spoils first" = the share of years the top layer passes the limit;
 * - days to target = days until the top layer is dry; heat = the heater's heat into the air, its fuel at the
 *   heater efficiency and fuel of the assessment; the fan's electricity is given too and, the fan being the
 *   bin's dryer, its cost at the electricity price is part of the bin's cost (the other methods' costs count
 *   fuel for heat only: their fans are small beside their heat).
 */
import { FUELS, fuelForHeat } from '../drying/fuels.ts'
import type { Assessment } from './assessment.ts'
import type { BinAssessment, BinStartAirflow } from './assessment-bin.ts'
import { meanOrNull, medianNotReached, roundOrNull, spread } from './statistics.ts'

/** What the comparison says of a bin besides the figures every method has. */
export interface MethodBinFigures {
  /** The airflow the figures are at [m³/min per tonne as loaded]. */
  airflowM3PerMinPerTonne: number
  airflowCfmPerBushel: number
  /** How that airflow was chosen, in words. */
  airflowRule: string
  /** Fan electricity at that airflow, median over the season's start dates [kWh per tonne]. */
  fanEnergyKwhPerTonne: number | null
  /** Cost of that electricity [currency per tonne], part of the method's cost. */
  fanCostPerTonne: number | null
  /** The electricity price [currency per kWh] and whether it is an example. */
  electricityPricePerKwh: number
  electricityPriceIsExample: boolean
  /** What "in time" and "spoils first" mean for a bin, in words. */
  meaning: string
}

export const BIN_MEANING =
  'grain in a bin: "finishes in time" is the share of years the top layer dries within the season in the bin before its dry-matter loss passes the limit (not within the batch deadline); "spoils first" is the share of years the top layer passes that limit'

/**
 * The airflow that serves every start month of a bin: the largest of the months' minimum airflows
 * [m³/min per t]; null when some month has none among the airflows compared.
 */
export function binSeasonAirflow(bin: BinAssessment): number | null {
  const months = bin.minimumAirflowByMonth
  if (months.length === 0 || months.some((m) => m.minimumAirflowM3PerMinPerTonne === null)) return null
  return Math.max(...months.map((m) => m.minimumAirflowM3PerMinPerTonne as number))
}

/** The airflow of a bin's row in the comparison, and the rule that chose it. */
export function binComparisonAirflow(bin: BinAssessment): { airflow: number; rule: string } {
  const candidates = bin.airflows.map((a) => a.airflowM3PerMinPerTonne)
  const airflow = binSeasonAirflow(bin)
  if (airflow !== null) {
    return {
      airflow,
      rule: `the smallest airflow compared (${candidates.join(', ')} m³/min per t) that is safe in at least ${Math.round(100 * bin.requiredShareOfYears)} % of years at every start month`,
    }
  }
  return {
    airflow: Math.max(...candidates),
    rule: `no airflow compared (${candidates.join(', ')} m³/min per t) is safe in ${Math.round(100 * bin.requiredShareOfYears)} % of years at every start month: the figures are at the largest`,
  }
}

/** The start dates of a bin at `airflow` that have years. */
export function binRowsAt(bin: BinAssessment, airflow: number): BinStartAirflow[] {
  return bin.startDates.filter((s) => s.airflowM3PerMinPerTonne === airflow && s.years > 0)
}

/** Share of years the top layer passed the dry-matter-loss limit at one start date [0–1]. */
export function binSpoiledShare(s: BinStartAirflow): number {
  return s.years > 0 ? s.yearsDryMatterLossLimitExceeded / s.years : 0
}

/** The figures of a bin assessment in the terms of every method (see the module's comment). */
export function binMethodFigures(a: Assessment & { bin: BinAssessment }) {
  const { airflow, rule } = binComparisonAirflow(a.bin)
  const rows = binRowsAt(a.bin, airflow)
  const heat = spread(
    rows.flatMap((s) => s.byYear.map((y) => y.heaterEnergyKwhPerTonne)),
    1,
  )
  const fuelId = a.heat.selectedFuel
  const given = a.heat.fuels.find((f) => f.fuel === fuelId)
  const price = given && !given.priceIsExample ? given.pricePerUnit : undefined
  const use = heat.median === null ? null : fuelForHeat(heat.median, a.heat.heaterEfficiency, fuelId, price)
  const safe = meanOrNull(rows.map((s) => s.shareOfYearsSafe))
  const spoiled = meanOrNull(rows.map(binSpoiledShare))
  const fan = a.bin.airflows.find((f) => f.airflowM3PerMinPerTonne === airflow)
  const fanKwh = medianNotReached(rows.map((s) => s.fanEnergyKwhPerTonne.median))
  const power = a.heat.fuels.find((f) => f.fuel === 'electricity')
  const powerPrice = power && !power.priceIsExample ? power.pricePerUnit : undefined
  const fanUse = fanKwh === null ? null : fuelForHeat(fanKwh, 1, 'electricity', powerPrice)
  const bin: MethodBinFigures = {
    airflowM3PerMinPerTonne: airflow,
    airflowCfmPerBushel: fan?.airflowCfmPerBushel ?? rows[0]?.airflowCfmPerBushel ?? 0,
    airflowRule: rule,
    fanEnergyKwhPerTonne: fanKwh,
    fanCostPerTonne: fanUse ? roundOrNull(fanUse.cost, 2) : null,
    electricityPricePerKwh: powerPrice ?? FUELS.electricity.examplePricePerUnit,
    electricityPriceIsExample: powerPrice === undefined,
    meaning: BIN_MEANING,
  }
  const heatCost = use ? use.cost : heat.median === null ? null : 0
  return {
    daysToTarget: {
      median: medianNotReached(rows.map((s) => s.daysUntilTopLayerDry.median)),
      p90: medianNotReached(rows.map((s) => s.daysUntilTopLayerDry.p90)),
    },
    probabilityWithinDeadline: safe === null ? null : roundOrNull(safe, 3),
    spoilageProbability: spoiled === null ? null : roundOrNull(spoiled, 3),
    heatToAirKwhPerTonne: heat,
    fuelHeatKwhPerTonne: heat.median === null ? null : roundOrNull(heat.median / a.heat.heaterEfficiency, 1),
    fuel: {
      id: fuelId,
      name: FUELS[fuelId].name,
      unit: FUELS[fuelId].unit,
      quantityPerTonne: use ? roundOrNull(use.quantity, 2) : null,
      pricePerUnit: price ?? FUELS[fuelId].examplePricePerUnit,
      priceIsExample: price === undefined,
    },
    costPerTonneFresh: heatCost === null || fanUse === null ? null : roundOrNull(heatCost + fanUse.cost, 2),
    bin,
  }
}
