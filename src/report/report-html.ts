/**
 * @module report/report-html
 * The seasonal summary: one self-contained HTML document (inline CSS and SVG, no scripts, no external
 * assets) from an assessment, and from nothing else: the JSON of an assessment renders the same report.
 * The same function serves `dryhours assess --format html`,
 * `POST /v1/assess?format=html` and the web page (which embeds the `<article>` fragment).
 */

import { type Assessment, type ReportInputInfo, siteDisplayName } from './assessment-view.ts'
import { type UnitSystem, unitFormatter } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import { type Paper, reportCss } from './report-css.ts'
import { binSection } from './sections/bin.ts'
import { cautionsSection } from './sections/cautions.ts'
import type { SectionContext } from './sections/context.ts'
import { heatSection } from './sections/heat.ts'
import { hourOfDaySection } from './sections/hour-of-day.ts'
import { monthlySection } from './sections/monthly.ts'
import { psychrometricSection } from './sections/psychrometric.ts'
import { spoilageSection } from './sections/spoilage.ts'
import { startDatesSection } from './sections/start-dates.ts'
import { answerHtml, headerHtml } from './sections/summary.ts'

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
}

export function sectionContext(a: Assessment, o: ReportOptions): SectionContext {
  let n = 0
  const info = o.info ?? {}
  return {
    info,
    siteName: siteDisplayName(a, info),
    units: unitFormatter(o.units ?? 'si'),
    idPrefix: o.idPrefix ?? '',
    nextFigure: () => ++n,
  }
}

/** The report as an `<article class="dryhours-report">` fragment (no `<html>`), for embedding. */
export function renderReportArticle(a: Assessment, o: ReportOptions = {}): string {
  const ctx = sectionContext(a, o)
  return `<article class="dryhours-report" data-report="assessment" data-units="${ctx.units.system}">
${headerHtml(a, ctx)}
${answerHtml(a, ctx)}
${monthlySection(a, ctx)}
${hourOfDaySection(a, ctx)}
${psychrometricSection(a, ctx)}
${a.bin ? binSection(a, ctx) : `${startDatesSection(a, ctx)}\n${spoilageSection(a, ctx)}\n${heatSection(a, ctx)}`}
${cautionsSection(a, ctx)}
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
