/**
 * @module drying/deep-bed/bin-summary
 * What a bin assessment reports (`assessBinDrying`, bin-assessment.ts): one year's run, the runs of a start date
 * and airflow summarised across years (median and 90th percentile, Hyndman–Fan type 7 as everywhere in
 * dryhours: `math/quantile.ts`), the airflow candidates' static pressure and fan power, and per start month the
 * smallest candidate airflow that is safe in the required share of years at every start date of that month.
 */
import { quantileOf } from '../../math/quantile.ts'

export interface BinYearRun {
  /** Calendar year of the start date (local time); with a typical year, the file's year. */
  year: number
  /** Days from filling until the top layer was at or below the target; null: not within the season. */
  daysUntilTopDry: number | null
  /** Top layer's spoilage measure at the end of the run (dry-matter loss [%] for grain). */
  topDryMatterLossPct: number
  /** The top layer reached the spoilage limit during the run. */
  topLimitExceeded: boolean
  /** Days from filling until it did; null if it did not. */
  daysUntilTopSpoiled: number | null
  fanHours: number
  fanEnergyKwhPerT: number
  heaterEnergyKwhPerT: number
  waterRemovedKgPerT: number
  /** Hours of the run with missing weather (fan off then). */
  missingWeatherHours: number
  /** Initial grain temperature used [°C]. */
  initialGrainTempC: number
  /** Safe by the rule of the assessment. */
  safe: boolean
}

export interface BinStartResult {
  /** `MM-DD`. */
  startDate: string
  month: number
  airflowM3PerMinPerT: number
  years: number
  yearsDryWithinSeason: number
  yearsLimitExceeded: number
  yearsSafe: number
  shareOfYearsSafe: number
  /** Across years; null when the percentile falls on a year not dry within the season. */
  medianDaysUntilTopDry: number | null
  p90DaysUntilTopDry: number | null
  medianTopDryMatterLossPct: number
  p90TopDryMatterLossPct: number
  medianFanEnergyKwhPerT: number
  p90FanEnergyKwhPerT: number
  runs: BinYearRun[]
}

export interface BinAirflowFacts {
  airflowM3PerMinPerT: number
  staticPressurePa: number
  /** Fan electrical power per tonne as loaded [kW/t]. */
  fanPowerKwPerT: number
}

export interface BinMonthAirflow {
  month: number
  startDates: string[]
  /** Smallest candidate meeting the rule at every start date of the month; null when none does. */
  minimumAirflowM3PerMinPerT: number | null
  /** Share of safe years at that airflow (the lowest over the month's start dates); at the largest candidate when none met the rule. */
  shareOfYearsSafe: number
  years: number
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null
}

/** Per start date and airflow: the years' runs summarised (median and P90 across years). */
export function summariseStart(label: string, month: number, q: number, runs: BinYearRun[]): BinStartResult {
  const days = runs.map((y) => y.daysUntilTopDry ?? Number.POSITIVE_INFINITY)
  const dml = runs.map((y) => y.topDryMatterLossPct)
  const fan = runs.map((y) => y.fanEnergyKwhPerT)
  const yearsSafe = runs.filter((y) => y.safe).length
  return {
    startDate: label,
    month,
    airflowM3PerMinPerT: q,
    years: runs.length,
    yearsDryWithinSeason: runs.filter((y) => y.daysUntilTopDry !== null).length,
    yearsLimitExceeded: runs.filter((y) => y.topLimitExceeded).length,
    yearsSafe,
    shareOfYearsSafe: runs.length > 0 ? yearsSafe / runs.length : 0,
    medianDaysUntilTopDry: finiteOrNull(quantileOf(days, 0.5)),
    p90DaysUntilTopDry: finiteOrNull(quantileOf(days, 0.9)),
    medianTopDryMatterLossPct: quantileOf(dml, 0.5),
    p90TopDryMatterLossPct: quantileOf(dml, 0.9),
    medianFanEnergyKwhPerT: quantileOf(fan, 0.5),
    p90FanEnergyKwhPerT: quantileOf(fan, 0.9),
    runs,
  }
}

/**
 * Per start month the smallest candidate airflow that is safe in the required share of years at every start date of
 * that month (null when none is).
 */
export function minimumAirflowByMonth(
  starts: readonly BinStartResult[],
  airflows: readonly number[],
  share: number,
): BinMonthAirflow[] {
  const months = [...new Set(starts.map((s) => s.month))].sort((a, b) => a - b)
  return months.map((month) => {
    const ofMonth = starts.filter((s) => s.month === month)
    const dates = [...new Set(ofMonth.map((s) => s.startDate))]
    let chosen: number | null = null
    let shareAt = 0
    let years = 0
    for (const q of airflows) {
      const rows = ofMonth.filter((s) => s.airflowM3PerMinPerT === q)
      const counted = rows.filter((s) => s.years > 0)
      const lowest = counted.length > 0 ? Math.min(...counted.map((s) => s.shareOfYearsSafe)) : 0
      shareAt = lowest
      years = counted.length > 0 ? Math.min(...counted.map((s) => s.years)) : 0
      if (counted.length === rows.length && counted.length > 0 && lowest >= share) {
        chosen = q
        break
      }
    }
    return { month, startDates: dates, minimumAirflowM3PerMinPerT: chosen, shareOfYearsSafe: shareAt, years }
  })
}
