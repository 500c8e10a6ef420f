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
import { HOURS_PER_DAY, MS_PER_HOUR } from '../../physics/constants.ts'
import { grainDryMatterLossModel } from '../../product/spoilage/grain-dml.ts'
import type { SpoilageModel } from '../../product/spoilage/model.ts'
import { type BinWeather, simulateDeepBed } from './bin-run.ts'
import {
  type BinAirflowFacts,
  type BinMonthAirflow,
  type BinStartResult,
  type BinYearRun,
  minimumAirflowByMonth,
  summariseStart,
} from './bin-summary.ts'
import { describeFanControl } from './fan-control.ts'
import { type BinSetup, binFan, checkBinSetup, type DeepBedGrain } from './layer-model.ts'

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
  /**
   * The site's clock, when it keeps daylight saving: the UTC instant [ms] of a local date and hour. Start dates
   * then begin at `startHourLocal` on that clock; without it, on standard time (`utcOffsetHours`).
   */
  toUtcMs?: (year: number, month: number, day: number, hour: number) => number
  /** Local hour the bin is filled and the fan starts (0–23); default 12. */
  startHourLocal?: number
  /** Share of years that must be safe; default 0.9 (9 of 10 years). */
  requiredShareOfYears?: number
  /** Count a top layer not dry by the end of the season as safe if below the limit; default false. */
  countNotDryAsSafe?: boolean
  /** Called after each start date × airflow with the runs made so far (progress; may throw to cancel). */
  onRun?: (runsDone: number) => void
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

const pad = (x: number): string => String(x).padStart(2, '0')

function checkStartDates(dates: readonly BinStartDate[]): void {
  if (dates.length === 0) throw new RangeError('startDates must list at least one date')
  for (const d of dates) {
    const days = new Date(Date.UTC(2000, d.month, 0)).getUTCDate()
    const valid =
      Number.isInteger(d.month) &&
      d.month >= 1 &&
      d.month <= 12 &&
      Number.isInteger(d.day) &&
      d.day >= 1 &&
      d.day <= days
    if (!valid)
      throw new RangeError(`start date ${d.month}-${d.day} is not a date (month 1–12, day of that month)`)
  }
}

function checkInput(input: BinAssessmentInput): void {
  checkStartDates(input.startDates)
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
  if (n < HOURS_PER_DAY) throw new RangeError(`the weather must hold at least 24 hours, got ${n}`)
}

/** Mean of the non-missing outside temperatures of the first 24 hours from `start` (wrapping); NaN if none. */
function meanFirstDayC(weather: BinWeather, start: number, n: number): number {
  let sum = 0
  let count = 0
  for (let h = 0; h < HOURS_PER_DAY; h++) {
    const t = weather.dryBulbC[(start + h) % n]
    if (!Number.isNaN(t)) {
      sum += t
      count++
    }
  }
  return count > 0 ? sum / count : Number.NaN
}

/** The hours of the file an assessment works on, and the years its start dates fall in. */
interface Calendar {
  n: number
  t0: number
  wrap: boolean
  offsetMs: number
  toUtcMs: ((year: number, month: number, day: number, hour: number) => number) | undefined
  startHour: number
  seasonHours: number
  firstYear: number
  lastYear: number
}

function calendarOf(input: BinAssessmentInput): Calendar {
  const { weather } = input
  const n = weather.startUtcMs.length
  const t0 = weather.startUtcMs[0]
  const wrap = weather.typicalYear
  const offsetMs = (input.utcOffsetHours ?? 0) * MS_PER_HOUR
  const firstYear = new Date(t0 + offsetMs).getUTCFullYear()
  return {
    n,
    t0,
    wrap,
    offsetMs,
    toUtcMs: input.toUtcMs,
    startHour: input.startHourLocal ?? 12,
    seasonHours: input.seasonDays * HOURS_PER_DAY,
    firstYear,
    lastYear: wrap ? firstYear : new Date(weather.startUtcMs[n - 1] + offsetMs).getUTCFullYear(),
  }
}

/**
 * The first hour of a season starting on `date` in every year the file covers; `leftOut` counts the years whose
 * season the file only partly covers (and 29 February, which most years lack).
 */
function startIndices(
  date: BinStartDate,
  cal: Calendar,
): { runs: { year: number; index: number }[]; leftOut: number } {
  const runs: { year: number; index: number }[] = []
  let leftOut = 0
  for (let year = cal.firstYear; year <= cal.lastYear; year++) {
    if (date.month === 2 && date.day === 29) {
      leftOut++
      continue
    }
    const utcMs = cal.toUtcMs
      ? cal.toUtcMs(year, date.month, date.day, cal.startHour)
      : Date.UTC(year, date.month - 1, date.day, cal.startHour) - cal.offsetMs
    let index = Math.round((utcMs - cal.t0) / MS_PER_HOUR)
    if (cal.wrap) index = ((index % cal.n) + cal.n) % cal.n
    if (index < 0 || index >= cal.n || (!cal.wrap && index + cal.seasonHours > cal.n)) {
      // a year the file only partly covers: left out silently only when it is before or after the file
      if (index + cal.seasonHours > 0 && index < cal.n) leftOut++
      continue
    }
    runs.push({ year, index })
  }
  return { runs, leftOut }
}

/** One bin run per year from the given start hours at airflow `q`; a year without weather on its first day is left out. */
function runYears(
  input: BinAssessmentInput,
  spoilage: SpoilageModel,
  cal: Calendar,
  starts: { year: number; index: number }[],
  q: number,
): { runs: BinYearRun[]; leftOut: number } {
  const runs: BinYearRun[] = []
  let leftOut = 0
  for (const { year, index } of starts) {
    const initialC = input.bin.initialGrainTempC ?? meanFirstDayC(input.weather, index, cal.n)
    if (Number.isNaN(initialC)) {
      leftOut++
      continue
    }
    const r = simulateDeepBed(
      input.grain,
      { ...input.bin, airflowM3PerMinPerT: q, initialGrainTempC: initialC },
      input.weather,
      spoilage,
      { startIndex: index, hours: cal.seasonHours, wrap: cal.wrap, stopWhen: 'top-dry' },
    )
    const dry = r.hoursUntilTopDry !== null
    runs.push({
      year,
      daysUntilTopDry: r.hoursUntilTopDry === null ? null : r.hoursUntilTopDry / HOURS_PER_DAY,
      topDryMatterLossPct: r.topDryMatterLossPct,
      topLimitExceeded: r.topSpoiled,
      daysUntilTopSpoiled: r.hoursUntilTopSpoiled === null ? null : r.hoursUntilTopSpoiled / HOURS_PER_DAY,
      fanHours: r.fanHours,
      fanEnergyKwhPerT: r.fanEnergyKwhPerT,
      heaterEnergyKwhPerT: r.heaterEnergyKwhPerT,
      waterRemovedKgPerT: r.waterRemovedKgPerT,
      missingWeatherHours: r.missingWeatherHours,
      initialGrainTempC: initialC,
      safe: !r.topSpoiled && (dry || input.countNotDryAsSafe === true),
    })
  }
  return { runs, leftOut }
}

function ruleText(input: BinAssessmentInput, spoilage: SpoilageModel, share: number, wrap: boolean): string {
  const notDry = input.countNotDryAsSafe
    ? 'a top layer still wet at the end of the season counts as safe if below the limit'
    : 'a top layer not dry by the end of the season counts as not safe'
  const yearsText = wrap
    ? 'in the typical year (one year only: the file cannot tell how often this fails)'
    : `in at least ${Math.round(share * 100)} % of the years (counted; ${share === 0.9 ? '9 of 10 years' : 'share of years'})`
  return `safe: the top layer reaches ${input.bin.targetMoistureWbPct} % wb within ${input.seasonDays} days with its ${spoilage.measureName} below ${spoilage.spoiledAt} ${spoilage.measureUnit}; ${notDry}; a month's minimum airflow is the smallest candidate safe ${yearsText} at every start date of that month`
}

/**
 * Runs the bin for every start date × airflow × year and summarises; see the module comment for the rules.
 * Work grows with years × start dates × airflows × season length × layers; the caller bounds it
 * (analysis/plan.ts counts it for an assessment).
 */
export function assessBinDrying(input: BinAssessmentInput): BinAssessment {
  checkInput(input)
  const spoilage = input.spoilage ?? grainDryMatterLossModel()
  const share = input.requiredShareOfYears ?? 0.9
  const cal = calendarOf(input)
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
    const indices = startIndices(date, cal)
    leftOut += indices.leftOut * airflows.length
    for (const q of airflows) {
      const years = runYears(input, spoilage, cal, indices.runs, q)
      leftOut += years.leftOut
      runs += years.runs.length
      for (const r of years.runs) yearsSeen.add(r.year)
      starts.push(summariseStart(label, date.month, q, years.runs))
      input.onRun?.(runs)
    }
  }
  return {
    typicalYear: cal.wrap,
    years: [...yearsSeen].sort((a, b) => a - b),
    seasonDays: input.seasonDays,
    requiredShareOfYears: share,
    spoilageLimit: spoilage.spoiledAt,
    spoilageModelId: spoilage.id,
    rule: ruleText(input, spoilage, share, cal.wrap),
    fanControl: describeFanControl(input.bin.fanControl ?? { mode: 'continuous' }),
    airflows: airflows.map((q): BinAirflowFacts => {
      const f = binFan(input.grain, { ...input.bin, airflowM3PerMinPerT: q, initialGrainTempC: 10 })
      return {
        airflowM3PerMinPerT: q,
        staticPressurePa: f.staticPressurePa,
        fanPowerKwPerT: f.fanPowerW / 1000 / f.grainTonnes,
      }
    }),
    starts,
    minimumAirflowByMonth: minimumAirflowByMonth(starts, airflows, share),
    runsLeftOut: leftOut,
    runs,
  }
}
