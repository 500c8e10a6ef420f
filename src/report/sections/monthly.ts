/**
 * @module report/sections/monthly
 * Usable drying hours per month: median with the P10–P90 spread across years (figure), the monthly
 * table and the year × month table.
 */

import { HOUR_STATUS_NAMES } from '../../drying/usable-hour.ts'
import type { Assessment } from '../assessment-view.ts'
import { spreadBarsChart } from '../charts/spread-bars.ts'
import { MONTH_LONG, MONTH_SHORT } from '../charts/svg.ts'
import { figureHtml } from '../figure.ts'
import type { ReportTable } from '../tables.ts'
import { REASON_WORDS } from '../words.ts'
import { finite, type SectionContext } from './context.ts'
import { stopsAtNight } from './summary.ts'

/** The reason most of a month's hours that do not dry fail, in words ("night: covered or fans off (293 h)"). */
export function mainReasonWords(m: Assessment['monthly'][number]): string {
  const reasons = HOUR_STATUS_NAMES.filter((r) => r !== 'usable')
    .map((r) => [r, m.medianHoursByReason?.[r] ?? 0] as const)
    .sort((x, y) => y[1] - x[1])
  return reasons[0] && reasons[0][1] > 0
    ? `${REASON_WORDS[reasons[0][0]]} (${reasons[0][1]} h)`
    : 'none: every hour dries'
}

export function monthlyTable(a: Assessment): ReportTable {
  const daylight = stopsAtNight(a) && a.monthly.some((m) => finite(m.usableDaylightFraction))
  return {
    id: 'monthly-usable-hours',
    title: 'Usable drying hours per month across years',
    columns: [
      'month',
      'median [h]',
      'P10, exceeded in 9 of 10 years [h]',
      'P90, exceeded in 1 of 10 years [h]',
      'years with data',
      daylight ? 'usable share of daylight hours [%]' : 'usable share of all hours, day and night [%]',
      'main reason an hour does not dry (median hours)',
      'median days to target, batches started in the month',
      'spoiled before dry, batches started in the month [%]',
    ],
    rows: a.monthly.map((m) => {
      const share = daylight ? m.usableDaylightFraction : m.usableFraction
      return [
        MONTH_LONG[m.month - 1] ?? String(m.month),
        m.usableHours.median,
        m.usableHours.p10,
        m.usableHours.p90,
        m.yearsWithData,
        finite(share) ? Math.round(share * 1000) / 10 : null,
        mainReasonWords(m),
        m.medianDaysToTarget,
        finite(m.spoilage?.probability) ? Math.round((m.spoilage?.probability as number) * 1000) / 10 : null,
      ]
    }),
    digits: [0, 0, 0, 0, 0, 1, 0, 1, 0],
  }
}

export function usableHoursByYearTable(a: Assessment): ReportTable | null {
  const years = new Set<number>()
  for (const m of a.monthly) for (const y of m.usableHours.byYear) years.add(y.year)
  if (years.size === 0) return null
  const sorted = [...years].sort((x, y) => x - y)
  return {
    id: 'usable-hours-by-year',
    title: 'Usable drying hours by year and month [h]',
    columns: ['year', ...a.monthly.map((m) => MONTH_SHORT[m.month - 1] ?? String(m.month))],
    rows: sorted.map((yr) => [
      String(yr),
      ...a.monthly.map((m) => m.usableHours.byYear.find((y) => y.year === yr)?.hours ?? null),
    ]),
  }
}

function monthList(months: number[]): string {
  if (months.length === 0) return 'none'
  // Collapse runs: Jun, Jul, Aug → June to August.
  const runs: number[][] = []
  for (const m of months) {
    const last = runs[runs.length - 1]
    if (last && last[last.length - 1] === m - 1) last.push(m)
    else runs.push([m])
  }
  return runs
    .map((r) =>
      r.length >= 3
        ? `${MONTH_LONG[r[0] - 1]} to ${MONTH_LONG[r[r.length - 1] - 1]}`
        : r.map((m) => MONTH_LONG[m - 1]).join(', '),
    )
    .join('; ')
}

/**
 * Months that suit the method: batches started in the month (on the 1st and 16th) reach the target
 * within the deadline in the median year (`medianDaysToTarget` ≤ `deadlineDays`).
 */
export function suitableMonths(a: Assessment): number[] {
  return a.monthly
    .filter((m) => finite(m.medianDaysToTarget) && m.medianDaysToTarget <= a.deadlineDays)
    .map((m) => m.month)
}

export function monthlyAlt(a: Assessment): string {
  const withMedian = a.monthly.filter((m) => finite(m.usableHours.median))
  if (withMedian.length === 0) return 'No month has usable drying hours data.'
  const best = withMedian.reduce((x, y) =>
    (y.usableHours.median as number) > (x.usableHours.median as number) ? y : x,
  )
  const worst = withMedian.reduce((x, y) =>
    (y.usableHours.median as number) < (x.usableHours.median as number) ? y : x,
  )
  const bm = best.usableHours
  return (
    `Bars show the median usable drying hours of each month, whiskers the P10 to P90 range across years. ` +
    `Most in ${MONTH_LONG[best.month - 1]}: median ${Math.round(bm.median as number)} h` +
    (finite(bm.p10) && finite(bm.p90) ? ` (P10 ${Math.round(bm.p10)} h, P90 ${Math.round(bm.p90)} h)` : '') +
    `; fewest in ${MONTH_LONG[worst.month - 1]}: median ${Math.round(worst.usableHours.median as number)} h. ` +
    `Months whose batches reach the target within ${a.deadlineDays} days in the median year: ${monthList(suitableMonths(a))}.`
  )
}

export function monthlySection(a: Assessment, ctx: SectionContext): string {
  const id = `${ctx.idPrefix}fig-monthly`
  const svg = spreadBarsChart({
    id: `${id}-svg`,
    title: `Usable drying hours per month, ${ctx.siteName}`,
    description: monthlyAlt(a),
    bars: a.monthly.map((m) => ({
      key: String(m.month),
      label: MONTH_SHORT[m.month - 1] ?? String(m.month),
      median: m.usableHours.median,
      p10: m.usableHours.p10,
      p90: m.usableHours.p90,
      byYear: m.usableHours.byYear.map((y) => ({ year: y.year, value: y.hours })),
    })),
    yLabel: 'usable drying hours [h]',
    unit: 'h',
  })
  const typical = a.site.typicalYear
  return `<section class="report-section" id="${ctx.idPrefix}sec-monthly" data-section="monthly"><h2>When the air dries</h2>${figureHtml(
    {
      id,
      number: ctx.nextFigure(),
      caption: 'Usable drying hours per month (median, P10–P90 across years)',
      svg,
      alt: monthlyAlt(a),
      table: monthlyTable(a),
      note: typical
        ? 'The file is a typical year: one value per month, no spread across years can be computed.'
        : 'P10 is the number of hours reached or exceeded in 9 of 10 years (a bad year); P90 in 1 of 10 years (a good year).',
    },
  )}</section>`
}

export { monthList }
