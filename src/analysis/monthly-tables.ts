/**
 * @module analysis/monthly-tables
 * Usable drying hours per month and year, hours per reason, and the hour-of-day × month usable fraction,
 * from the hourly verdicts of drying/hourly-conditions.ts.
 */
import type { HourlyConditions } from '../drying/hourly-conditions.ts'
import { HOUR_STATUS_NAMES, HourStatus, type HourStatusName } from '../drying/usable-hour.ts'
import { daysInMonth } from '../physics/calendar.ts'
import type { HourOfDayTable, MonthlyRow, YearValue } from './assessment.ts'
import type { LocalTimeColumns } from './local-time.ts'
import { quantileSorted, roundOrNull, spread } from './statistics.ts'

/** A month-year enters the across-year statistics when at least this share of its hours has data (assumption). */
export const MONTH_COVERAGE_REQUIRED = 0.8

const REASONS = HOUR_STATUS_NAMES.length

export interface MonthlyCounts {
  years: number[]
  /** usable[yearIndex * 12 + month − 1] */
  usable: Int32Array
  withData: Int32Array
  /** Daylight hours with data (sun above the night threshold), and the usable ones among them. */
  daylight: Int32Array
  usableDaylight: Int32Array
  /** reasons[(yearIndex * 12 + month − 1) * REASONS + code] */
  reasons: Int32Array
  deficitSum: Float64Array
  deficitHours: Int32Array
  evaporationSum: Float64Array
  evaporationHours: Int32Array
  hourUsable: Int32Array
  hourWithData: Int32Array
}

/** Count hours by (year, month), reason and hour of day in one pass. */
export function countMonthly(c: HourlyConditions, t: LocalTimeColumns): MonthlyCounts {
  const n = c.hours
  let minYear = Number.POSITIVE_INFINITY
  let maxYear = Number.NEGATIVE_INFINITY
  for (let i = 0; i < n; i++) {
    if (t.year[i] < minYear) minYear = t.year[i]
    if (t.year[i] > maxYear) maxYear = t.year[i]
  }
  const years: number[] = []
  for (let y = minYear; y <= maxYear; y++) years.push(y)
  const cells = years.length * 12
  const out: MonthlyCounts = {
    years,
    usable: new Int32Array(cells),
    withData: new Int32Array(cells),
    daylight: new Int32Array(cells),
    usableDaylight: new Int32Array(cells),
    reasons: new Int32Array(cells * REASONS),
    deficitSum: new Float64Array(cells),
    deficitHours: new Int32Array(cells),
    evaporationSum: new Float64Array(cells),
    evaporationHours: new Int32Array(cells),
    hourUsable: new Int32Array(12 * 24),
    hourWithData: new Int32Array(12 * 24),
  }
  // columns and counters in locals: one property load per column, not per hour
  const { year, month, hour } = t
  const { status, night, deficitToTargetGPerKg, evaporationKgPerM2H } = c
  const { reasons, withData, hourWithData, usable, hourUsable } = out
  const { deficitSum, deficitHours, evaporationSum, evaporationHours, daylight, usableDaylight } = out
  for (let i = 0; i < n; i++) {
    const cell = (year[i] - minYear) * 12 + month[i] - 1
    const s = status[i]
    reasons[cell * REASONS + s]++
    if (s === HourStatus.missingData) continue
    withData[cell]++
    const hourCell = (month[i] - 1) * 24 + hour[i]
    hourWithData[hourCell]++
    const day = night[i] === 0
    if (day) daylight[cell]++
    if (s === HourStatus.usable) {
      usable[cell]++
      hourUsable[hourCell]++
      if (day) usableDaylight[cell]++
    }
    const d = deficitToTargetGPerKg[i]
    if (night[i] === 0 && Number.isFinite(d)) {
      deficitSum[cell] += d
      deficitHours[cell]++
    }
    const e = evaporationKgPerM2H[i]
    if (Number.isFinite(e)) {
      evaporationSum[cell] += Math.max(e, 0)
      evaporationHours[cell]++
    }
  }
  return out
}

function emptyReasons(): Record<HourStatusName, number> {
  const r = {} as Record<HourStatusName, number>
  for (const name of HOUR_STATUS_NAMES) r[name] = 0
  return r
}

/** Monthly rows (without the heat columns, filled later by the start-date machinery). */
export function monthlyRows(counts: MonthlyCounts): MonthlyRow[] {
  const rows: MonthlyRow[] = []
  for (let month = 1; month <= 12; month++) {
    const byYear: YearValue[] = []
    const reasonValues: number[][] = HOUR_STATUS_NAMES.map(() => [])
    let usableAll = 0
    let dataAll = 0
    let usableDay = 0
    let dayAll = 0
    let defSum = 0
    let defHours = 0
    let evSum = 0
    let evHours = 0
    counts.years.forEach((year, yi) => {
      const cell = yi * 12 + month - 1
      const hoursInMonth = daysInMonth(year, month) * 24
      const withData = counts.withData[cell]
      if (withData < MONTH_COVERAGE_REQUIRED * hoursInMonth) return
      byYear.push({ year, hours: counts.usable[cell] })
      for (let r = 0; r < REASONS; r++) reasonValues[r].push(counts.reasons[cell * REASONS + r])
      usableAll += counts.usable[cell]
      dataAll += withData
      usableDay += counts.usableDaylight[cell]
      dayAll += counts.daylight[cell]
      defSum += counts.deficitSum[cell]
      defHours += counts.deficitHours[cell]
      evSum += counts.evaporationSum[cell]
      evHours += counts.evaporationHours[cell]
    })
    const s = spread(
      byYear.map((v) => v.hours),
      0,
    )
    const medianHoursByReason = emptyReasons()
    HOUR_STATUS_NAMES.forEach((name, r) => {
      const sorted = reasonValues[r].sort((a, b) => a - b)
      medianHoursByReason[name] = sorted.length > 0 ? Math.round(quantileSorted(sorted, 0.5)) : 0
    })
    rows.push({
      month,
      usableHours: {
        median: s.median,
        p10: byYear.length > 1 ? s.p10 : null,
        p90: byYear.length > 1 ? s.p90 : null,
        byYear,
      },
      usableFraction: dataAll > 0 ? roundOrNull(usableAll / dataAll, 3) : null,
      usableDaylightFraction: dayAll > 0 ? roundOrNull(usableDay / dayAll, 3) : null,
      usableNightHoursShare: usableAll > 0 ? roundOrNull((usableAll - usableDay) / usableAll, 3) : null,
      medianHoursByReason,
      meanDaytimeDeficitToTargetGPerKg: defHours > 0 ? roundOrNull(defSum / defHours, 2) : null,
      // per day with data, counting only the hours the product is exposed (covered hours add nothing)
      meanEvaporationKgPerM2Day: evHours > 0 ? roundOrNull(evSum / (dataAll / 24), 2) : null,
      supplementalHeatKwhPerTonne: { median: null, p10: null, p90: null },
      medianDaysToTarget: null,
      yearsWithData: byYear.length,
      spoilage: null,
    })
  }
  return rows
}

/** Hours per reason over the whole file. */
export function totalReasons(counts: MonthlyCounts): Record<HourStatusName, number> {
  const r = emptyReasons()
  for (let cell = 0; cell < counts.years.length * 12; cell++) {
    HOUR_STATUS_NAMES.forEach((name, code) => {
      r[name] += counts.reasons[cell * REASONS + code]
    })
  }
  return r
}

export function hourOfDayTable(counts: MonthlyCounts): HourOfDayTable {
  const usableFraction: (number | null)[][] = []
  for (let m = 0; m < 12; m++) {
    const row: (number | null)[] = []
    for (let h = 0; h < 24; h++) {
      const d = counts.hourWithData[m * 24 + h]
      row.push(d > 0 ? roundOrNull(counts.hourUsable[m * 24 + h] / d, 3) : null)
    }
    usableFraction.push(row)
  }
  return {
    hours: Array.from({ length: 24 }, (_, h) => h),
    months: Array.from({ length: 12 }, (_, m) => m + 1),
    usableFraction,
  }
}
