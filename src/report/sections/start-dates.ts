/**
 * @module report/sections/start-dates
 * Days to target against start date (median line, band to P90), the start-date table, and the best
 * start window (from the assessment when it names one, otherwise the longest run of start days with
 * the highest probability of finishing within the deadline).
 */
import type { AssessmentView, StartDateView } from '../assessment-view.ts'
import { lineBandChart } from '../charts/line-band.ts'
import { formatNumber } from '../display-units.ts'
import { figureHtml } from '../figure.ts'
import type { ReportTable } from '../tables.ts'
import { asSpread, finite, round, type SectionContext } from './context.ts'

export function startDatesTable(a: AssessmentView, ctx: SectionContext): ReportTable {
  const u = ctx.units
  const hasLow = a.startDates.some((s) => finite(s.daysToTarget.p10))
  const hasRewet = a.startDates.some((s) => finite(s.rewettingRisk))
  const hasHeat = a.startDates.some((s) => asSpread(s.supplementalHeatKwhPerTonne) !== null)
  const columns = ['start (MM-DD)', 'days to target, median']
  if (hasLow) columns.push('days to target, P10')
  columns.push(
    'days to target, P90',
    `probability within ${finite(a.deadlineDays) ? `${a.deadlineDays} days` : 'deadline'} [%]`,
  )
  if (hasRewet) columns.push('rewetting risk [%]')
  if (hasHeat) columns.push(`supplemental heat, median [${u.energyPerMassUnit}]`)
  return {
    id: 'start-dates',
    title: 'Batches by start date across years',
    columns,
    digits: [0, 1, ...(hasLow ? [1] : []), 1, 0, ...(hasRewet ? [0] : []), 0],
    rows: a.startDates.map((s) => {
      const r: (string | number | null)[] = [s.start, s.daysToTarget.median]
      if (hasLow) r.push(s.daysToTarget.p10 ?? null)
      r.push(
        s.daysToTarget.p90,
        finite(s.probabilityWithinDeadline) ? round(s.probabilityWithinDeadline * 100, 1) : null,
      )
      if (hasRewet) r.push(finite(s.rewettingRisk) ? round(s.rewettingRisk * 100, 1) : null)
      if (hasHeat) {
        const h = asSpread(s.supplementalHeatKwhPerTonne)?.median
        r.push(finite(h) ? round(u.energyPerMass(h).value, 1) : null)
      }
      return r
    }),
  }
}

export interface StartWindow {
  start: string
  end: string
  probability: number | null
  medianDays: number | null
  p90Days: number | null
}

/** The best start window: the assessment's first named window, else the best run of start days. */
export function bestStartWindow(a: AssessmentView): StartWindow | null {
  const rows = a.startDates
  if (rows.length === 0) return null
  const named = a.bestStartWindows?.[0]
  const inRange = (s: StartDateView, w: { start: string; end: string }) =>
    w.start <= w.end ? s.start >= w.start && s.start <= w.end : s.start >= w.start || s.start <= w.end
  let window: { start: string; end: string } | null = named ? { start: named.start, end: named.end } : null
  if (!window) {
    const score = (s: StartDateView) =>
      (finite(s.probabilityWithinDeadline) ? s.probabilityWithinDeadline : -1) * 1000 -
      (finite(s.daysToTarget.p90) ? s.daysToTarget.p90 : 999)
    const best = Math.max(...rows.map(score))
    if (!(best > -1000)) {
      const byMedian = rows.filter((s) => finite(s.daysToTarget.median))
      if (byMedian.length === 0) return null
    }
    // Longest run of start days whose probability is within 5 points of the best one.
    const bestP = Math.max(
      ...rows.map((s) => (finite(s.probabilityWithinDeadline) ? s.probabilityWithinDeadline : -1)),
    )
    let run: number[] = []
    let bestRun: number[] = []
    rows.forEach((s, i) => {
      const ok = finite(s.probabilityWithinDeadline)
        ? s.probabilityWithinDeadline >= bestP - 0.05
        : finite(s.daysToTarget.median)
      if (ok) run.push(i)
      else run = []
      if (run.length > bestRun.length) bestRun = [...run]
    })
    if (bestRun.length === 0) return null
    window = { start: rows[bestRun[0]].start, end: rows[bestRun[bestRun.length - 1]].start }
  }
  const inside = rows.filter((s) => inRange(s, window))
  const mean = (xs: (number | null | undefined)[]) => {
    const f = xs.filter(finite)
    return f.length ? f.reduce((x, y) => x + y, 0) / f.length : null
  }
  return {
    ...window,
    probability: mean(inside.map((s) => s.probabilityWithinDeadline)),
    medianDays: mean(inside.map((s) => s.daysToTarget.median)),
    p90Days: mean(inside.map((s) => s.daysToTarget.p90)),
  }
}

export function startDatesAlt(a: AssessmentView): string {
  const rows = a.startDates
  if (rows.length === 0) return 'No start dates were assessed.'
  const reached = rows.filter((s) => finite(s.daysToTarget.median))
  const fastest = reached.length
    ? reached.reduce((x, y) =>
        (y.daysToTarget.median as number) < (x.daysToTarget.median as number) ? y : x,
      )
    : null
  const notReached = rows.length - reached.length
  const w = bestStartWindow(a)
  return (
    `The line is the median number of days to reach the target for a batch started on each day (${rows[0].start} to ${rows[rows.length - 1].start}); the band reaches up to the P90 (9 of 10 years finish within it). ` +
    (fastest
      ? `Fastest start: ${fastest.start}, median ${formatNumber(fastest.daysToTarget.median, 1)} days, P90 ${formatNumber(fastest.daysToTarget.p90, 1)} days. `
      : '') +
    (notReached > 0 ? `${notReached} start days do not reach the target in the median year. ` : '') +
    (w && finite(w.probability)
      ? `Best window ${w.start} to ${w.end}: ${Math.round(w.probability * 100)} % of years finish within the deadline.`
      : '')
  )
}

export function startDatesSection(a: AssessmentView, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-starts" data-section="start-dates"><h2>When to start a batch</h2>`
  if (a.startDates.length === 0)
    return `${head}<p class="missing">No start dates were assessed.</p></section>`
  const id = `${ctx.idPrefix}fig-start-dates`
  const alt = startDatesAlt(a)
  const hasLow = a.startDates.some((s) => finite(s.daysToTarget.p10))
  const svg = lineBandChart({
    id: `${id}-svg`,
    title: `Days to target by start date, ${a.site.name}`,
    description: alt,
    points: a.startDates.map((s) => ({
      x: s.start,
      median: s.daysToTarget.median,
      low: s.daysToTarget.p10 ?? null,
      high: s.daysToTarget.p90,
    })),
    yLabel: 'days to target',
    xLabel: 'start date (MM-DD)',
    unit: 'days',
    lowLabel: hasLow ? 'P10' : undefined,
    highLabel: 'P90',
    reference: finite(a.deadlineDays)
      ? { value: a.deadlineDays, label: `deadline ${a.deadlineDays} days` }
      : undefined,
  })
  return `${head}${figureHtml({
    id,
    number: ctx.nextFigure(),
    caption: 'Days to reach the target moisture against the start date (median and spread across years)',
    svg,
    alt,
    table: startDatesTable(a, ctx),
  })}</section>`
}
