/**
 * @module drying/deep-bed/bin-assessment
 * Natural-air bin drying over years of a site's weather: for every start (harvest) date, airflow and year, one
 * bin run from filling until the top layer is dry or the season ends; per start date and airflow the days until
 * the top layer is dry, the top layer's dry-matter loss and whether it passed the limit, and the fan energy per
 * tonne, summarised across years; and per start month the smallest airflow of the candidates that gets the top
 * layer dry, below the spoilage limit, in at least 9 of 10 years.
 *
 * Rules (dryhours' choices, stated in `rule` of the result):
 * - A year counts as safe when the top layer reached the target moisture within the season and its spoilage
 *   measure (dry-matter loss for grain) stayed below the model's limit until then. With
 *   `countNotDryAsSafe: true` a top layer still wet at the end of the season counts as safe if it is below the limit
 *   then (the spoilage clock of cold, wet grain runs slowly; what happens after the season is not modelled).
 * - "9 of 10 years" is counted: the share of years that are safe must be at least `requiredShareOfYears` (0.9).
 *   The 90th percentile of the top layer's dry-matter loss across years (Hyndman–Fan type 7, the project's
 *   convention in `analysis/statistics.ts`) is reported as well; with 10 years it is 0.9 × the second-worst plus
 *   0.1 × the worst year, so a very bad tenth year can lift it over the limit while 9 of 10 years stay below it.
 * - A start month's minimum airflow must meet the rule at every start date of that month in the list.
 * - Runs that do not fit in the file (the season running past its end) are left out and counted in
 *   `runsLeftOut`; with a typical-year file, runs wrap from its end to its start and there is one year only, so the
 *   rule reads "in the typical year" and cannot say anything about 9 of 10 years.
 * - The grain goes in at the mean outside temperature of its first 24 hours (an assumption) unless given.
 */
import { quantileSorted } from '../../analysis/statistics.ts'
import { grainDryMatterLossModel } from '../../product/spoilage/grain-dml.ts'
import type { SpoilageModel } from '../../product/spoilage/model.ts'
import { type BinWeather, binFan, simulateDeepBed } from './bin-run.ts'
import { describeFanControl } from './fan-control.ts'
import { type BinSetup, checkBinSetup, type DeepBedGrain } from './layer-model.ts'

/** A start (filling) date, month 1–12 and day of month, the same every year. */
export interface BinStartDate {
  month: number
  day: number
}

/** Weather for an assessment: columns plus the UTC start of each hour (an `HourlySeries` fits). */
export interface BinAssessmentWeather extends BinWeather {
  /** UTC start of each hour [ms], strictly increasing by one hour. */
  startUtcMs: ArrayLike<number>
  /** A typical (synthetic) year: runs wrap from its end to its start, one year only. */
  typicalYear: boolean
}

export interface BinAssessmentInput {
  weather: BinAssessmentWeather
  grain: DeepBedGrain
  /** The bin; airflow comes from `airflowsM3PerMinPerT`, and the initial grain temperature defaults as above. */
  bin: Omit<BinSetup, 'airflowM3PerMinPerT' | 'initialGrainTempC'> & { initialGrainTempC?: number }
  startDates: readonly BinStartDate[]
  /** Candidate airflows [m³/min per tonne as loaded]. */
  airflowsM3PerMinPerT: readonly number[]
  /** Longest run [days]: a top layer not dry by then is "not dry within the season". */
  seasonDays: number
  /** Spoilage model of the top layer (default: grain dry-matter loss, 0.5 % limit). */
  spoilage?: SpoilageModel
  /** Offset of local standard time from UTC [h] for the start dates; default 0. */
  utcOffsetHours?: number
  /** Local hour the bin is filled and the fan starts (0–23); default 12. */
  startHourLocal?: number
  /** Share of years that must be safe; default 0.9 (9 of 10 years). */
  requiredShareOfYears?: number
  /** Count a top layer not dry by the end of the season as safe if below the limit; default false. */
  countNotDryAsSafe?: boolean
}

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

export interface BinAssessment {
  typicalYear: boolean
  /** Years with at least one run. */
  years: number[]
  seasonDays: number
  requiredShareOfYears: number
  spoilageLimit: number
  spoilageModelId: string
  /** The rule in words. */
  rule: string
  fanControl: string
  airflows: BinAirflowFacts[]
  starts: BinStartResult[]
  minimumAirflowByMonth: BinMonthAirflow[]
  /** Runs left out because the season did not fit in the file (or the start date does not exist, 29 Feb). */
  runsLeftOut: number
  /** Bin runs made. */
  runs: number
}

const HOUR_MS = 3_600_000
const pad = (x: number): string => String(x).padStart(2, '0')

function checkInput(input: BinAssessmentInput): void {
  if (input.startDates.length === 0) throw new RangeError('startDates must list at least one date')
  for (const d of input.startDates) {
    const days = new Date(Date.UTC(2000, d.month, 0)).getUTCDate()
    if (
      !(
        Number.isInteger(d.month) &&
        d.month >= 1 &&
        d.month <= 12 &&
        Number.isInteger(d.day) &&
        d.day >= 1 &&
        d.day <= days
      )
    ) {
      throw new RangeError(`start date ${d.month}-${d.day} is not a date (month 1–12, day of that month)`)
    }
  }
  if (input.airflowsM3PerMinPerT.length === 0)
    throw new RangeError('airflowsM3PerMinPerT must list at least one airflow')
  for (const q of input.airflowsM3PerMinPerT) {
    if (!(q > 0 && q <= 50)) throw new RangeError(`airflow must be between 0 and 50 m³/min per t, got ${q}`)
  }
  if (!(Number.isInteger(input.seasonDays) && input.seasonDays >= 1 && input.seasonDays <= 366)) {
    throw new RangeError(`seasonDays must be a whole number from 1 to 366, got ${input.seasonDays}`)
  }
  const share = input.requiredShareOfYears ?? 0.9
  if (!(share > 0 && share <= 1)) throw new RangeError(`requiredShareOfYears must be in (0, 1], got ${share}`)
  const hour = input.startHourLocal ?? 12
  if (!(Number.isInteger(hour) && hour >= 0 && hour <= 23)) {
    throw new RangeError(`startHourLocal must be a whole hour from 0 to 23, got ${hour}`)
  }
  const offset = input.utcOffsetHours ?? 0
  if (!(offset >= -14 && offset <= 14))
    throw new RangeError(`utcOffsetHours must be between -14 and 14, got ${offset}`)
  const n = input.weather.startUtcMs.length
  if (n < 24) throw new RangeError(`the weather must hold at least 24 hours, got ${n}`)
}

/** Mean of the non-missing outside temperatures of the first 24 hours from `start` (wrapping); NaN if none. */
function meanFirstDayC(weather: BinWeather, start: number, n: number): number {
  let sum = 0
  let count = 0
  for (let h = 0; h < 24; h++) {
    const t = weather.dryBulbC[(start + h) % n]
    if (!Number.isNaN(t)) {
      sum += t
      count++
    }
  }
  return count > 0 ? sum / count : Number.NaN
}

function sortedQuantile(values: number[], q: number): number {
  return quantileSorted(
    [...values].sort((a, b) => a - b),
    q,
  )
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null
}

/**
 * Runs the bin for every start date × airflow × year and summarises; see the module comment for the rules.
 * Work grows with years × start dates × airflows × season length; the caller bounds it.
 */
export function assessBinDrying(input: BinAssessmentInput): BinAssessment {
  checkInput(input)
  const { weather, grain } = input
  const spoilage = input.spoilage ?? grainDryMatterLossModel()
  const share = input.requiredShareOfYears ?? 0.9
  const offsetMs = (input.utcOffsetHours ?? 0) * HOUR_MS
  const startHour = input.startHourLocal ?? 12
  const seasonHours = input.seasonDays * 24
  const n = weather.startUtcMs.length
  const t0 = weather.startUtcMs[0]
  const wrap = weather.typicalYear
  const firstYear = new Date(t0 + offsetMs).getUTCFullYear()
  const lastYear = wrap ? firstYear : new Date(weather.startUtcMs[n - 1] + offsetMs).getUTCFullYear()
  // check the bin once with a representative airflow and temperature (names the field on bad input)
  checkBinSetup({
    ...input.bin,
    airflowM3PerMinPerT: input.airflowsM3PerMinPerT[0],
    initialGrainTempC: input.bin.initialGrainTempC ?? 10,
  })

  const airflows = [...input.airflowsM3PerMinPerT].sort((a, b) => a - b)
  const starts: BinStartResult[] = []
  const yearsSeen = new Set<number>()
  let leftOut = 0
  let runs = 0

  for (const date of input.startDates) {
    const label = `${pad(date.month)}-${pad(date.day)}`
    // start index per year
    const indices: { year: number; index: number }[] = []
    for (let year = firstYear; year <= lastYear; year++) {
      if (date.month === 2 && date.day === 29) {
        leftOut += airflows.length
        continue
      }
      let index = Math.round((Date.UTC(year, date.month - 1, date.day, startHour) - offsetMs - t0) / HOUR_MS)
      if (wrap) index = ((index % n) + n) % n
      if (index < 0 || index >= n || (!wrap && index + seasonHours > n)) {
        // a year the file only partly covers: left out silently only when it is before or after the file
        if (index + seasonHours > 0 && index < n) leftOut += airflows.length
        continue
      }
      indices.push({ year, index })
    }
    for (const q of airflows) {
      const yearRuns: BinYearRun[] = []
      for (const { year, index } of indices) {
        const initialC = input.bin.initialGrainTempC ?? meanFirstDayC(weather, index, n)
        if (Number.isNaN(initialC)) {
          leftOut++
          continue
        }
        const r = simulateDeepBed(
          grain,
          { ...input.bin, airflowM3PerMinPerT: q, initialGrainTempC: initialC },
          weather,
          spoilage,
          { startIndex: index, hours: seasonHours, wrap, stopWhen: 'top-dry' },
        )
        runs++
        yearsSeen.add(year)
        const dry = r.hoursUntilTopDry !== null
        const exceeded = r.topSpoiled
        yearRuns.push({
          year,
          daysUntilTopDry: dry ? (r.hoursUntilTopDry as number) / 24 : null,
          topDryMatterLossPct: r.topDryMatterLossPct,
          topLimitExceeded: exceeded,
          daysUntilTopSpoiled: r.hoursUntilTopSpoiled === null ? null : r.hoursUntilTopSpoiled / 24,
          fanHours: r.fanHours,
          fanEnergyKwhPerT: r.fanEnergyKwhPerT,
          heaterEnergyKwhPerT: r.heaterEnergyKwhPerT,
          waterRemovedKgPerT: r.waterRemovedKgPerT,
          missingWeatherHours: r.missingWeatherHours,
          initialGrainTempC: initialC,
          safe: !exceeded && (dry || input.countNotDryAsSafe === true),
        })
      }
      const days = yearRuns.map((y) => y.daysUntilTopDry ?? Number.POSITIVE_INFINITY)
      const dml = yearRuns.map((y) => y.topDryMatterLossPct)
      const fan = yearRuns.map((y) => y.fanEnergyKwhPerT)
      const yearsSafe = yearRuns.filter((y) => y.safe).length
      starts.push({
        startDate: label,
        month: date.month,
        airflowM3PerMinPerT: q,
        years: yearRuns.length,
        yearsDryWithinSeason: yearRuns.filter((y) => y.daysUntilTopDry !== null).length,
        yearsLimitExceeded: yearRuns.filter((y) => y.topLimitExceeded).length,
        yearsSafe,
        shareOfYearsSafe: yearRuns.length > 0 ? yearsSafe / yearRuns.length : 0,
        medianDaysUntilTopDry: finiteOrNull(sortedQuantile(days, 0.5)),
        p90DaysUntilTopDry: finiteOrNull(sortedQuantile(days, 0.9)),
        medianTopDryMatterLossPct: sortedQuantile(dml, 0.5),
        p90TopDryMatterLossPct: sortedQuantile(dml, 0.9),
        medianFanEnergyKwhPerT: sortedQuantile(fan, 0.5),
        p90FanEnergyKwhPerT: sortedQuantile(fan, 0.9),
        runs: yearRuns,
      })
    }
  }

  const months = [...new Set(input.startDates.map((d) => d.month))].sort((a, b) => a - b)
  const minimumAirflowByMonth: BinMonthAirflow[] = months.map((month) => {
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

  const limit = spoilage.spoiledAt
  const notDry = input.countNotDryAsSafe
    ? 'a top layer still wet at the end of the season counts as safe if below the limit'
    : 'a top layer not dry by the end of the season counts as not safe'
  const yearsText = wrap
    ? 'in the typical year (one year only: the file cannot tell how often this fails)'
    : `in at least ${Math.round(share * 100)} % of the years (counted; ${share === 0.9 ? '9 of 10 years' : 'share of years'})`
  return {
    typicalYear: wrap,
    years: [...yearsSeen].sort((a, b) => a - b),
    seasonDays: input.seasonDays,
    requiredShareOfYears: share,
    spoilageLimit: limit,
    spoilageModelId: spoilage.id,
    rule: `safe: the top layer reaches ${input.bin.targetMoistureWbPct} % wb within ${input.seasonDays} days with its ${spoilage.measureName} below ${limit} ${spoilage.measureUnit}; ${notDry}; a month's minimum airflow is the smallest candidate safe ${yearsText} at every start date of that month`,
    fanControl: describeFanControl(input.bin.fanControl ?? { mode: 'continuous' }),
    airflows: airflows.map((q): BinAirflowFacts => {
      const f = binFan(grain, { ...input.bin, airflowM3PerMinPerT: q, initialGrainTempC: 10 })
      return {
        airflowM3PerMinPerT: q,
        staticPressurePa: f.staticPressurePa,
        fanPowerKwPerT: f.fanPowerW / 1000 / f.grainTonnes,
      }
    }),
    starts,
    minimumAirflowByMonth,
    runsLeftOut: leftOut,
    runs,
  }
}
