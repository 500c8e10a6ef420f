/**
 * @module report/sections/hour-of-day
 * The hour-of-day × month map of the usable share of hours, with its table (hours as rows).
 */
import type { Assessment } from '../assessment-view.ts'
import { heatMapChart } from '../charts/heat-map.ts'
import { MONTH_LONG, MONTH_SHORT } from '../charts/svg.ts'
import { figureHtml } from '../figure.ts'
import type { ReportTable } from '../tables.ts'
import { clockShort } from '../words.ts'
import { finite, round, type SectionContext } from './context.ts'
import { siteClock } from './summary.ts'

/** `fractions[month-1][hour]` (12 × 24, null where no data); null when the assessment has none. */
export function hourOfDayFractions(a: Assessment): (number | null)[][] | null {
  const h = a.hourOfDay
  if (!h || !Array.isArray(h.usableFraction) || h.usableFraction.length === 0) return null
  const out: (number | null)[][] = Array.from({ length: 12 }, () => Array<number | null>(24).fill(null))
  h.usableFraction.forEach((row, i) => {
    const month = h.months?.[i] ?? i + 1
    if (month >= 1 && month <= 12 && Array.isArray(row)) {
      for (let hr = 0; hr < 24; hr++) {
        const hourIndex = h.hours ? h.hours.indexOf(hr) : hr
        const v = hourIndex >= 0 ? row[hourIndex] : null
        out[month - 1][hr] = finite(v) ? v : null
      }
    }
  })
  return out
}

export function hourOfDayTable(fr: (number | null)[][], clock = "the site's clock"): ReportTable {
  return {
    id: 'hour-of-day-usable-share',
    title: `Share of usable drying hours by hour (${clock}) and month [%]`,
    columns: ['hour', ...MONTH_SHORT],
    rows: Array.from({ length: 24 }, (_, h) => [
      `${String(h).padStart(2, '0')}:00`,
      ...fr.map((m) => (finite(m[h]) ? round(m[h] * 100, 1) : null)),
    ]),
  }
}

export function hourOfDayAlt(fr: (number | null)[][]): string {
  let best = { m: -1, h: -1, v: -1 }
  const windows: string[] = []
  fr.forEach((row, m) => {
    row.forEach((v, h) => {
      if (finite(v) && v > best.v) best = { m, h, v }
    })
    const usable = row.map((v, h) => (finite(v) && v >= 0.5 ? h : -1)).filter((h) => h >= 0)
    if (usable.length > 0)
      windows.push(
        `${MONTH_SHORT[m]} ${String(usable[0]).padStart(2, '0')}–${String(usable[usable.length - 1] + 1).padStart(2, '0')} h`,
      )
  })
  if (best.m < 0) return 'No hour-of-day data.'
  return (
    `Each cell is the share of hours at that hour of the site's clock in that month that dry the product (darker = more; the number is the percentage, blank = 0 %). ` +
    `Highest: ${MONTH_LONG[best.m]} at ${String(best.h).padStart(2, '0')}:00, ${Math.round(best.v * 100)} %. ` +
    (windows.length
      ? `Hours usable at least half of the time: ${windows.join(', ')}.`
      : 'No hour is usable at least half of the time in any month.')
  )
}

export function hourOfDaySection(a: Assessment, ctx: SectionContext): string {
  const fr = hourOfDayFractions(a)
  if (!fr) {
    return `<section class="report-section" id="${ctx.idPrefix}sec-hours" data-section="hour-of-day"><h2>Hours of the day</h2><p class="missing">The assessment has no hour-of-day table.</p></section>`
  }
  const id = `${ctx.idPrefix}fig-hour-of-day`
  const alt = hourOfDayAlt(fr)
  const svg = heatMapChart({
    id: `${id}-svg`,
    title: `Usable share by hour of day and month, ${ctx.siteName}`,
    description: alt,
    fractions: fr,
    hourLabel: `hour on the site's clock (${clockShort(siteClock(a))})`,
  })
  return `<section class="report-section" id="${ctx.idPrefix}sec-hours" data-section="hour-of-day"><h2>Hours of the day</h2>${figureHtml(
    {
      id,
      number: ctx.nextFigure(),
      caption: 'Share of usable drying hours by hour of day and month (all years together)',
      svg,
      alt,
      table: hourOfDayTable(fr, clockShort(siteClock(a))),
    },
  )}</section>`
}
