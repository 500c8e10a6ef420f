/**
 * @module report/figure
 * A chart as a numbered figure: caption, the SVG, its text alternative (a sentence that states what the
 * chart shows, also read by screen readers through the SVG's `<desc>`), and a table view of the same
 * numbers in a `<details>` element that works without JavaScript.
 */
import { escapeHtml } from './escape.ts'
import { type ReportTable, tableHtml } from './tables.ts'

export interface FigureInput {
  id: string
  number: number
  caption: string
  svg: string
  /** Text alternative: what the chart shows, in words and numbers. */
  alt: string
  table: ReportTable
  note?: string
  /** Extra class on the figure (`compact`: a shorter chart in the handout). */
  className?: string
}

export function figureHtml(f: FigureInput): string {
  const id = escapeHtml(f.id)
  return `<figure class="chart-figure${f.className ? ` ${escapeHtml(f.className)}` : ''}" id="${id}" data-figure="${id}">
<figcaption><span class="fig-no">Figure ${f.number}.</span> ${escapeHtml(f.caption)}</figcaption>
${f.svg}
<p class="alt" id="${id}-alt"><span class="alt-label">In words:</span> ${escapeHtml(f.alt)}</p>
${f.note ? `<p class="note">${escapeHtml(f.note)}</p>` : ''}<details class="table-view"><summary>Table view of figure ${f.number}</summary>${tableHtml(f.table)}</details>
</figure>`
}
