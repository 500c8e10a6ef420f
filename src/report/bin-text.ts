/**
 * @module report/bin-text
 * The text of a natural-air bin answer (`assessment.bin`) for a terminal: the fan at each airflow, the minimum
 * airflow per start month, and per start date and airflow the days until the top layer is dry, its dry-matter
 * loss against the limit and the fan energy per tonne.
 */
import type { Assessment } from '../analysis/assessment.ts'
import type { BinAssessment } from '../analysis/assessment-bin.ts'
import { m3PerMinPerTonneFromCfmPerBu } from '../drying/deep-bed/airflow-resistance.ts'

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')
const f = (x: number | null | undefined, d: number): string =>
  x === null || x === undefined || !Number.isFinite(x) ? '–' : x.toFixed(d)

function airflowText(q: number | null, b: BinAssessment): string {
  if (q === null) return 'none of the airflows'
  const cfm = q / m3PerMinPerTonneFromCfmPerBu(1, b.grain.bushelKg)
  return `${f(q, 2)} m³/min per t (${f(cfm, 2)} cfm/bu)`
}

/** The bin part of `dryhours assess` text. */
export function binText(a: Assessment, b: BinAssessment): string[] {
  const out: string[] = []
  const bin = b.bin
  const limit = b.spoilage.dryMatterLossLimitPct
  const yearsWord = b.typicalYear
    ? 'the typical year'
    : `${Math.round(b.requiredShareOfYears * 10)} of 10 years`
  out.push(
    `Natural-air bin: ${f(bin.depthM, 1)} m (${f(bin.depthM / 0.3048, 1)} ft) of grain on ${f(bin.floorAreaM2, 1)} m², ${f(bin.grainTonnes, 0)} t (${f(bin.bushels, 0)} bu at ${f(b.grain.bushelKg / 0.45359237, 0)} lb/bu); ${bin.fanControl}; ${bin.heatRiseK > 0 ? `heater +${bin.heatRiseK} K${bin.heaterOnAboveRhPct !== null ? ` above ${bin.heaterOnAboveRhPct} % RH` : ''}` : 'no heater'}`,
  )
  out.push(
    `Safe = the top layer (1/${bin.layers} of the depth) reaches ${a.product.targetMoistureWbPct} % wb within ${b.seasonDays} days with its dry-matter loss below ${limit} %`,
  )
  out.push('')
  out.push('airflow m³/min/t  cfm/bu  static pressure Pa (in. w.c.)  fan kW  kW/t')
  for (const q of b.airflows) {
    out.push(
      `${f(q.airflowM3PerMinPerTonne, 2).padStart(16)}  ${f(q.airflowCfmPerBushel, 2).padStart(6)}  ${`${f(q.staticPressurePa, 0)} (${f(q.staticPressureInchesWater, 2)})`.padStart(28)}  ${f(q.fanPowerKw, 1).padStart(6)}  ${f(q.fanPowerKwPerTonne, 3)}`,
    )
  }
  out.push('')
  out.push(`Minimum airflow per start month (safe in ${yearsWord} at every start date of the month):`)
  for (const m of b.minimumAirflowByMonth) {
    out.push(
      `  ${MONTHS[m.month - 1]}: ${airflowText(m.minimumAirflowM3PerMinPerTonne, b)}${m.minimumAirflowM3PerMinPerTonne === null ? ` (best: safe in ${f(100 * m.shareOfYearsSafe, 0)} % of years)` : ''}`,
    )
  }
  out.push('')
  out.push(
    `start  m³/min/t  days top dry median (P90)  top DML % median (P90)  P90 < ${limit} %  safe years  fan kWh/t median`,
  )
  for (const s of b.startDates) {
    const days = `${f(s.daysUntilTopLayerDry.median, 1)} (${f(s.daysUntilTopLayerDry.p90, 1)})`
    const dml = `${f(s.topLayerDryMatterLossPct.median, 2)} (${f(s.topLayerDryMatterLossPct.p90, 2)})`
    out.push(
      `${s.startDate}  ${f(s.airflowM3PerMinPerTonne, 2).padStart(8)}  ${days.padStart(25)}  ${dml.padStart(22)}  ${(s.passesDryMatterLossLimitP90 ? 'yes' : 'no').padStart(10)}  ${`${s.yearsSafe}/${s.years}`.padStart(10)}  ${f(s.fanEnergyKwhPerTonne.median, 1).padStart(16)}`,
    )
  }
  out.push(`  – = the top layer is not dry within ${b.seasonDays} days in that share of years`)
  return out
}
