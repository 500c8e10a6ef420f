/**
 * @module report/sections/start-dates
 * Days to target against start date (median line, band to P90), the start-date table, and the best
 * start window (the assessment's first window; its criterion is stated in the assessment).
 */
import type { StartWindow } from '../../analysis/assessment.ts'
import type { Assessment } from '../assessment-view.ts'
import { lineBandChart } from '../charts/line-band.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { thinnedNote, yearsWords } from '../words.ts'
import { finite, round, type SectionContext } from './context.ts'
import { heatWord } from './heat.ts'

export function startDatesTable(a: Assessment, ctx: SectionContext): ReportTable {
  const u = ctx.units
  const heat = heatWord(a).toLowerCase()
  return {
    id: 'start-dates',
    title: `Batches by start date across years (start at ${String(a.season.startHourLocal).padStart(2, '0')}:00 on the site's clock)`,
    columns: [
      'start (MM-DD)',
      'years',
      'days to target, median',
      'days to target, 9 in 10 years within',
      `finished within ${a.deadlineDays} days [% of years]`,
      `finished within ${a.maxDays} days [% of years]`,
      'rewetting hours, median',
      'rain-exposed hours, median',
      `${heat}, median [${u.energyPerMassUnit}]`,
      `${heat}, 1 in 10 batches [${u.energyPerMassUnit}]`,
      'years not reachable even with heat',
      'spoiled before dry [%]',
      'hours at risk of spoilage, median',
      'years unknown (ran into hours without weather)',
      'hours without weather in those batches',
    ],
    digits: [0, 0, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0],
    rows: a.startDates.map((s) => [
      s.start,
      s.years,
      s.daysToTarget.median,
      s.daysToTarget.p90,
      round(s.probabilityWithinDeadline * 100, 1),
      round(s.probabilityWithinMaxDuration * 100, 1),
      s.rewettingHours.median,
      s.rainExposureHours.median,
      finite(s.supplementalHeat.medianKwhPerTonne)
        ? round(u.energyPerMass(s.supplementalHeat.medianKwhPerTonne).value, 1)
        : null,
      finite(s.supplementalHeat.p90KwhPerTonne)
        ? round(u.energyPerMass(s.supplementalHeat.p90KwhPerTonne).value, 1)
        : null,
      s.yearsNotReachable,
      finite(s.spoilage?.probability) ? round((s.spoilage?.probability as number) * 100, 1) : null,
      s.spoilage?.hoursAtRisk.median ?? null,
      s.yearsUnknown,
      s.missingWeatherHours,
    ]),
  }
}

export interface WindowSummary {
  from: string
  to: string
  days: number
  minProbability: number
  medianDays: number | null
  p90Days: number | null
  /** Highest share of years spoiled before dry among the window's start dates (null without spoilage figures). */
  maxSpoilageProbability: number | null
}

/** The assessment's best start window with the P90 days inside it (worst of the window's start days). */
export function bestStartWindow(a: Assessment): WindowSummary | null {
  const w: StartWindow | undefined = a.bestStartWindows[0]
  if (!w) return null
  const inside = a.startDates.filter((s) =>
    w.from <= w.to ? s.start >= w.from && s.start <= w.to : s.start >= w.from || s.start <= w.to,
  )
  const p90s = inside.map((s) => s.daysToTarget.p90).filter(finite)
  return {
    from: w.from,
    to: w.to,
    days: w.days,
    minProbability: w.minProbabilityWithinDeadline,
    medianDays: w.medianDaysToTarget,
    p90Days: p90s.length === inside.length && p90s.length > 0 ? Math.max(...p90s) : null,
    maxSpoilageProbability: (() => {
      const ps = inside.map((s) => s.spoilage?.probability).filter(finite)
      return ps.length > 0 ? Math.max(...ps) : null
    })(),
  }
}

export function startDatesAlt(a: Assessment): string {
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
    `The line is the median number of days to reach the target for a batch started on each day from ${rows[0].start} to ${rows[rows.length - 1].start}; the band reaches up to the P90 (9 of 10 years finish within it); the dotted line is the ${a.deadlineDays}-day deadline. ` +
    (fastest
      ? `Fastest start: ${fastest.start}, median ${formatNumber(fastest.daysToTarget.median, 1)} days, P90 ${formatNumber(fastest.daysToTarget.p90, 1)} days. `
      : '') +
    (notReached > 0
      ? `${notReached} of ${rows.length} start days do not reach the target within ${a.maxDays} days in the median year. `
      : '') +
    (w
      ? `Best window ${w.from} to ${w.to}: batches finish within the deadline ${w.minProbability >= 1 ? 'in every year' : `in at least ${yearsWords(w.minProbability)}`}.`
      : 'No start window finishes within the deadline in most years.')
  )
}

/** The days-to-target chart with its full table view; `compact` for the handout (a shorter chart, no note). */
export function startDatesFigure(
  a: Assessment,
  ctx: SectionContext,
  o: { compact?: boolean; idSuffix?: string } = {},
): string {
  const id = `${ctx.idPrefix}fig-start-dates${o.idSuffix ?? ''}`
  const alt = startDatesAlt(a)
  const svg = lineBandChart({
    id: `${id}-svg`,
    title: `Days to target by start date, ${ctx.siteName}`,
    description: alt,
    points: a.startDates.map((s) => ({
      x: s.start,
      median: s.daysToTarget.median,
      high: s.daysToTarget.p90,
    })),
    yLabel: 'days to target',
    xLabel: `start date (MM-DD), batches starting at ${String(a.season.startHourLocal).padStart(2, '0')}:00`,
    unit: 'days',
    highLabel: 'P90 (9 in 10 years finish within)',
    reference: { value: a.deadlineDays, label: `deadline ${a.deadlineDays} days` },
  })
  const crit = a.bestStartWindowCriterion
    ? `Best window criterion: ${a.bestStartWindowCriterion}.`
    : undefined
  return figureHtml({
    id,
    number: ctx.nextFigure(),
    caption:
      'Days to reach the target moisture against the start date (median, and the days 9 in 10 years stay within)',
    svg,
    alt,
    table: startDatesTable(a, ctx),
    note: o.compact ? undefined : crit,
    className: o.compact ? 'compact' : undefined,
  })
}

export function startDatesSection(a: Assessment, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-starts" data-section="start-dates"><h2>Days to dry by start date</h2>`
  if (a.startDates.length === 0)
    return `${head}<p class="missing">No start dates were assessed.</p></section>`
  return `${head}${startDatesFigure(a, ctx)}</section>`
}

/** Rows a handout's start-date table shows at most (the rest: every n-th row, said under the table). */
export const HANDOUT_START_ROWS = 18

/**
 * The handout's start-date table: start, days (median and 9 in 10 years), the share of years finishing by
 * the deadline in words, and the heat to finish in time; every n-th start date when the season has more
 * than `maxRows` (the note under it says so, and the appendix has all of them).
 */
export function handoutStartTable(a: Assessment, ctx: SectionContext, maxRows = HANDOUT_START_ROWS): string {
  const rows = a.startDates
  if (rows.length === 0) return '<p class="missing">No start dates were assessed.</p>'
  const step = Math.max(1, Math.ceil(rows.length / maxRows))
  const shown = rows.filter((_, i) => i % step === 0)
  const u = ctx.units
  const heat = heatWord(a).toLowerCase()
  // no known outcome: no data at all, or batches that met hours without weather (unknown, not slow)
  const noOutcome = (s: Assessment['startDates'][number]) =>
    (s.yearsUnknown ?? 0) > 0 ? 'unknown' : 'no data'
  const days = (s: Assessment['startDates'][number], v: number | null) =>
    finite(v) ? formatNumber(v, 1) : s.years > 0 ? `over ${a.maxDays}` : noOutcome(s)
  const table: ReportTable = {
    id: 'handout-start-dates',
    title: `A batch started on … (at ${String(a.season.startHourLocal).padStart(2, '0')}:00 on the site's clock)`,
    columns: [
      'start',
      'days to dry, median',
      'days, 9 in 10 years',
      `done within ${a.deadlineDays} days`,
      `${heat} to finish in time, median [${u.energyPerMassUnit}]`,
    ],
    digits: [0, 1, 1, 0, 0],
    rows: shown.map((s) => [
      s.start,
      days(s, s.daysToTarget.median),
      days(s, s.daysToTarget.p90),
      s.years > 0 ? yearsWords(s.probabilityWithinDeadline) : noOutcome(s),
      finite(s.supplementalHeat.medianKwhPerTonne)
        ? round(u.energyPerMass(s.supplementalHeat.medianKwhPerTonne).value, 0)
        : null,
    ]),
  }
  const note = thinnedNote(
    step,
    shown.length,
    rows.length,
    'start date',
    'the appendix (“When to start a batch”)',
  )
  return `${tableHtml(table, { className: 'data compact' })}${note ? `<p class="note thinned" data-thinned="${step}">${escapeHtml(note)}</p>` : ''}`
}
