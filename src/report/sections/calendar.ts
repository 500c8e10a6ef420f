/**
 * @module report/sections/calendar
 * The season at a glance: one row per method (or site), one box per start week, each in the state the
 * assessment gives it (analysis/season-calendar.ts). The state is told three ways: a colour (Paul Tol's
 * muted scheme), a letter in the box, and the words for screen readers and the legend. The boxes wrap,
 * so the calendar fits a phone and prints within the page width.
 */
import type { CalendarState, SeasonCalendar } from '../../analysis/season-calendar.ts'
import { CALENDAR_STATES } from '../../analysis/season-calendar.ts'
import { escapeHtml } from '../escape.ts'
import { MUTED, NO_DATA_GREY } from '../palette.ts'
import { CALENDAR_WORDS } from '../words.ts'
import type { SectionContext } from './context.ts'

/**
 * Box colours of the states, from Tol's muted scheme (Tol 2021, fig. 4): green for "dries", sand for
 * "marginal", rose for "needs heat", indigo for "spoils first"; pale grey for no data. Ink: white on the
 * dark ones, black on the light ones.
 */
export const CALENDAR_COLOURS: Record<CalendarState, { fill: string; ink: string }> = {
  dries: { fill: MUTED[3], ink: '#FFFFFF' },
  marginal: { fill: MUTED[5], ink: '#1A1A1A' },
  'needs-heat': { fill: MUTED[6], ink: '#1A1A1A' },
  'spoils-first': { fill: MUTED[0], ink: '#FFFFFF' },
  'no-data': { fill: NO_DATA_GREY, ink: '#1A1A1A' },
}

export interface CalendarRow {
  /** What the row is: a method, or a site. */
  label: string
  calendar: SeasonCalendar
}

/** Runs of the same state in words: "07-01 to 08-12: dries in time; 08-13 to 08-19: marginal". */
export function calendarRuns(c: SeasonCalendar): string {
  const runs: { from: string; to: string; state: CalendarState }[] = []
  for (const cell of c.cells) {
    const last = runs[runs.length - 1]
    if (last && last.state === cell.state) last.to = cell.to
    else runs.push({ from: cell.from, to: cell.to, state: cell.state })
  }
  return runs
    .map((r) => `${r.from === r.to ? r.from : `${r.from} to ${r.to}`}: ${CALENDAR_WORDS[r.state].words}`)
    .join('; ')
}

function cellHtml(cell: SeasonCalendar['cells'][number]): string {
  const w = CALENDAR_WORDS[cell.state]
  const when = cell.from === cell.to ? cell.from : `${cell.from} to ${cell.to}`
  return `<li class="cal-cell" data-state="${cell.state}" data-from="${cell.from}" data-to="${cell.to}" title="${escapeHtml(`${when}: ${w.words}`)}"><span class="cal-mark" aria-hidden="true">${escapeHtml(w.mark)}</span><span class="cal-date">${cell.from}</span><span class="sr"> ${escapeHtml(cell.from === cell.to ? '' : `to ${cell.to}`)}: ${escapeHtml(w.words)}</span></li>`
}

/** The legend: only the states that occur, each with its box, letter and words. */
function legendHtml(rows: CalendarRow[]): string {
  const used = new Set(rows.flatMap((r) => r.calendar.cells.map((c) => c.state)))
  return `<ul class="cal-legend" aria-label="Legend">${CALENDAR_STATES.filter((s) => used.has(s))
    .map(
      (s) =>
        `<li><span class="cal-cell cal-key" data-state="${s}" aria-hidden="true"><span class="cal-mark">${escapeHtml(CALENDAR_WORDS[s].mark)}</span></span>${escapeHtml(CALENDAR_WORDS[s].words)}</li>`,
    )
    .join('')}</ul>`
}

/** The calendar block (rows, legend, runs in words, criterion) without a section heading. */
export function calendarBlock(rows: CalendarRow[], id: string): string {
  const body = rows
    .map(
      (r) =>
        `<div class="cal-row"><p class="cal-label" id="${id}-${rowKey(r.label)}">${escapeHtml(r.label)}</p><ol class="cal-cells" aria-labelledby="${id}-${rowKey(r.label)}">${r.calendar.cells.map(cellHtml).join('')}</ol></div>`,
    )
    .join('')
  const words = rows
    .map((r) => `${rows.length > 1 ? `${r.label}: ` : ''}${calendarRuns(r.calendar)}.`)
    .join(' ')
  const used = new Set(rows.flatMap((r) => r.calendar.cells.map((c) => c.state)))
  const rules = (rows[0]?.calendar.rules ?? [])
    .filter((r) => used.has(r.state))
    .map((r) => `${CALENDAR_WORDS[r.state].words}: ${r.rule}`)
    .join('; ')
  return `<div class="calendar" id="${id}" data-calendar="${rows.length}">${body}${legendHtml(rows)}<p class="alt"><span class="alt-label">In words:</span> ${escapeHtml(words)}</p><p class="note">${escapeHtml(`Each box is a week of start days, labelled with its first day. ${rules}.`)}</p></div>`
}

function rowKey(label: string): string {
  let out = ''
  for (const ch of label.toLowerCase()) out += (ch >= 'a' && ch <= 'z') || (ch >= '0' && ch <= '9') ? ch : '-'
  return out.slice(0, 40)
}

/** The season calendar section of one assessment. */
export function calendarSection(
  calendar: SeasonCalendar | undefined,
  label: string,
  ctx: SectionContext,
): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-calendar" data-section="calendar"><h2>The season at a glance</h2>`
  if (!calendar || calendar.cells.length === 0)
    return `${head}<p class="missing">No start dates were assessed, so there is no season calendar.</p></section>`
  return `${head}${calendarBlock([{ label, calendar }], `${ctx.idPrefix}calendar`)}</section>`
}

/** CSS of the calendar boxes (part of the report stylesheet). */
export function calendarCss(): string {
  const states = CALENDAR_STATES.map(
    (s) =>
      `.dryhours-report .cal-cell[data-state="${s}"]{background:${CALENDAR_COLOURS[s].fill};color:${CALENDAR_COLOURS[s].ink}}`,
  ).join('\n')
  return `
.dryhours-report .calendar{margin:.3rem 0 .6rem}
.dryhours-report .cal-row{display:flex;gap:.5rem;align-items:flex-start;margin:.25rem 0}
.dryhours-report .cal-label{margin:.1em 0 0;font-weight:600;font-size:.85em;flex:0 0 9em;overflow-wrap:anywhere}
.dryhours-report .cal-cells{list-style:none;margin:0;padding:0;display:flex;flex-wrap:wrap;gap:2px;flex:1 1 auto;min-width:0;font-size:.78em}
.dryhours-report .cal-cell{display:inline-flex;flex-direction:column;align-items:center;justify-content:center;width:3.9em;height:3em;border-radius:3px;line-height:1.05;-webkit-print-color-adjust:exact;print-color-adjust:exact}
.dryhours-report .cal-mark{font-weight:700;font-size:1.15em}
.dryhours-report .cal-legend{list-style:none;padding:0;margin:.35em 0 .2em;display:flex;flex-wrap:wrap;gap:.2em 1em;font-size:.85em}
.dryhours-report .cal-legend li{display:inline-flex;align-items:center;gap:.3em}
.dryhours-report .cal-key{width:1.8em;height:1.5em;font-size:.9em}
.dryhours-report .sr{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0);white-space:nowrap}
@media (max-width:40rem){.dryhours-report .cal-row{flex-direction:column;gap:.15rem}.dryhours-report .cal-label{flex-basis:auto}}
${states}`
}
