/**
 * @module report/report-html
 * The seasonal summary: one self-contained HTML document (inline CSS and SVG, no scripts, no external
 * assets) from an assessment, and from nothing else: the JSON of an assessment renders the same report.
 * The same function serves `dryhours assess --format html`, `POST /v1/assess?format=html` and the web page
 * (which embeds the `<article>` fragment).
 *
 * Layout: a two-page handout first (the facts, the answer, the season calendar, the start-date table, the
 * cautions; sized to two A4 or US Letter pages by `handout-fit.ts`), then the full report as an appendix
 * that starts on a page of its own (the only forced page break). `layout: 'handout'` renders the two pages
 * alone.
 */

import { optionWords } from '../analysis/option-names.ts'
import type { OptionSurface } from '../weather/option-spec.ts'
import { type Assessment, type ReportInputInfo, siteDisplayName } from './assessment-view.ts'
import { type UnitSystem, unitFormatter } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import { handoutPlan } from './handout-fit.ts'
import { type Paper, reportCss } from './report-css.ts'
import { binHandoutSection, binSection } from './sections/bin.ts'
import { calendarSection } from './sections/calendar.ts'
import { cautionsSection, limitsSection, notesSection } from './sections/cautions.ts'
import type { SectionContext } from './sections/context.ts'
import { heatSection } from './sections/heat.ts'
import { hourOfDaySection } from './sections/hour-of-day.ts'
import { monthlySection } from './sections/monthly.ts'
import { psychrometricSection } from './sections/psychrometric.ts'
import { spoilageSection } from './sections/spoilage.ts'
import { handoutStartTable, startDatesFigure, startDatesSection } from './sections/start-dates.ts'
import { answerHtml, headerHtml, methodName, warningList } from './sections/summary.ts'

export type ReportLayout = 'full' | 'handout'

export interface ReportOptions {
  /** Display units; SI by default. */
  units?: UnitSystem
  /** Paper for print (`@page size`); 'auto' lets the printer dialogue choose. */
  paper?: Paper
  /** Uploaded file name and a line on the data source, shown in the header. */
  info?: ReportInputInfo
  /** Prefix for element ids (several reports on one page). */
  idPrefix?: string
  /** Text for the footer, e.g. the program version and when the report was made (the core reads no clock). */
  footer?: string
  /** 'full' (default): the handout, then the full report as an appendix; 'handout': the two pages alone. */
  layout?: ReportLayout
  /**
   * How messages name options: as the interface the reader used does (`cli` flags, `json` or `query` API
   * names, `form` labels of the page). Default `form`: labels, which read as words.
   */
  optionSurface?: OptionSurface
}

export function sectionContext(a: Assessment, o: ReportOptions): SectionContext {
  let n = 0
  const info = o.info ?? {}
  const surface = o.optionSurface ?? 'form'
  return {
    info,
    siteName: siteDisplayName(a, info),
    units: unitFormatter(o.units ?? 'si'),
    idPrefix: o.idPrefix ?? '',
    nextFigure: () => ++n,
    optionWords: (m) => optionWords(m, surface),
  }
}

/** The two handout pages of one assessment (inside the article). */
export function handoutHtml(a: Assessment, ctx: SectionContext): string {
  const plan = handoutPlan(a, ctx)
  const start = `<section class="report-section" id="${ctx.idPrefix}sec-start-table" data-section="start-table"><h2>When to start a batch</h2>${handoutStartTable(a, ctx, plan.startRows)}${plan.startFigure ? startDatesFigure(a, ctx, { compact: true, idSuffix: '-handout' }) : ''}</section>`
  return `<div class="handout" data-part="handout" data-start-rows="${plan.startRows}" data-estimate-mm="${Math.round(plan.estimateMm)}">
${headerHtml(a, ctx)}
${answerHtml(a, ctx, plan.maxWarnings)}
${a.bin ? binHandoutSection(a, ctx) : `${calendarSection(a.seasonCalendar, methodName(a), ctx)}\n${start}`}
${cautionsSection(a, ctx)}
</div>`
}

/** The full report after the handout: every chart with its table view, the model's limits and the notes. */
export function appendixHtml(a: Assessment, ctx: SectionContext): string {
  return `<div class="appendix" data-part="appendix"><p class="appendix-title">Appendix: the full report for ${escapeHtml(ctx.siteName)}</p>
${monthlySection(a, ctx)}
${hourOfDaySection(a, ctx)}
${psychrometricSection(a, ctx)}
${a.bin ? binSection(a, ctx) : `${startDatesSection(a, ctx)}\n${spoilageSection(a, ctx)}\n${heatSection(a, ctx)}`}
${limitsSection(a, ctx)}
${notesSection(warningList(a, ctx), (ctx.info.readerNotes ?? []).map(ctx.optionWords), ctx)}
</div>`
}

/** The report as an `<article class="dryhours-report">` fragment (no `<html>`), for embedding. */
export function renderReportArticle(a: Assessment, o: ReportOptions = {}): string {
  const ctx = sectionContext(a, o)
  const layout = o.layout ?? 'full'
  return `<article class="dryhours-report" data-report="assessment" data-layout="${layout}" data-units="${ctx.units.system}">
${handoutHtml(a, ctx)}
${layout === 'full' ? appendixHtml(a, ctx) : ''}
<footer>${escapeHtml(o.footer ?? 'Made by dryhours from the weather file and the options shown above. Check the numbers against local experience before you build or buy.')}</footer>
</article>`
}

/** A complete HTML document with the report's stylesheet. */
export function htmlDocument(title: string, article: string, paper: Paper = 'auto'): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${reportCss(paper)}</style>
</head>
<body>
${article}
</body>
</html>
`
}

/** The complete, self-contained HTML report for one assessment. */
export function renderReportHtml(a: Assessment, o: ReportOptions = {}): string {
  return htmlDocument(
    `Drying summary: ${siteDisplayName(a, o.info)}, ${a.product.name}`,
    renderReportArticle(a, o),
    o.paper,
  )
}
