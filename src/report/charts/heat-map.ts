/**
 * @module report/charts/heat-map
 * Hour of day (rows) × month (columns) map of a fraction 0–1, e.g. the share of hours that are usable
 * drying hours. Cells carry `data-month`, `data-hour`, `data-fraction`; the scale is the sequential
 * palette (light = low), which prints as a grey ramp, and every cell has a tooltip with its value.
 */
import { escapeHtml } from '../escape.ts'
import { INK, inkOnSequential, sequentialColour, YL_OR_BR } from '../palette.ts'
import { type Frame, MONTH_SHORT, px, svgDocument } from './svg.ts'

export interface HeatMapOptions {
  id: string
  title: string
  description: string
  /** `fractions[m][h]`: month index 0–11, local hour 0–23, fraction 0–1 or null (no data). */
  fractions: (number | null)[][]
  /** Label of the hour axis, e.g. "local standard time". */
  hourLabel: string
  /** Write the percentage inside each cell (legible at A4 width for 12 × 24 cells). */
  cellText?: boolean
}

const FRAME: Frame = { width: 640, height: 430, left: 60, right: 14, top: 14, bottom: 58 }

export function heatMapChart(o: HeatMapOptions): string {
  const f = FRAME
  const months = o.fractions.length
  const cw = (f.width - f.left - f.right) / Math.max(1, months)
  const ch = (f.height - f.top - f.bottom) / 24
  const parts: string[] = []
  for (let m = 0; m < months; m++) {
    for (let h = 0; h < 24; h++) {
      const v = o.fractions[m]?.[h] ?? null
      const x = f.left + m * cw
      const y = f.top + h * ch
      const pct = v === null || !Number.isFinite(v) ? 'no data' : `${Math.round(v * 100)} %`
      const label = `${MONTH_SHORT[m] ?? m + 1}, ${String(h).padStart(2, '0')}:00–${String(h + 1).padStart(2, '0')}:00: ${pct}`
      let cell = `<g class="cell" data-month="${m + 1}" data-hour="${h}" data-fraction="${v === null || !Number.isFinite(v) ? '' : v}"><title>${escapeHtml(label)}</title><rect x="${px(x)}" y="${px(y)}" width="${px(cw)}" height="${px(ch)}" fill="${sequentialColour(v)}" stroke="#fff" stroke-width="0.5"/>`
      if (o.cellText !== false && v !== null && Number.isFinite(v) && v >= 0.005) {
        cell += `<text x="${px(x + cw / 2)}" y="${px(y + ch / 2)}" dy="0.32em" text-anchor="middle" font-size="7.5" fill="${inkOnSequential(v)}">${Math.round(v * 100)}</text>`
      }
      parts.push(`${cell}</g>`)
    }
  }
  const axis: string[] = []
  for (let h = 0; h < 24; h += 3) {
    axis.push(
      `<text x="${f.left - 5}" y="${px(f.top + (h + 0.5) * ch)}" dy="0.32em" text-anchor="end">${String(h).padStart(2, '0')}:00</text>`,
    )
  }
  for (let m = 0; m < months; m++) {
    axis.push(
      `<text x="${px(f.left + (m + 0.5) * cw)}" y="${px(f.top + 24 * ch + 12)}" text-anchor="middle">${MONTH_SHORT[m] ?? m + 1}</text>`,
    )
  }
  axis.push(
    `<text transform="translate(12 ${px(f.top + 12 * ch)}) rotate(-90)" text-anchor="middle" font-size="10.5">${escapeHtml(o.hourLabel)}</text>`,
  )
  // Colour key: the nine classes, 0 to 100 %.
  const kx = f.left
  const ky = f.height - 24
  const kw = 26
  const key = YL_OR_BR.map(
    (c, i) =>
      `<rect x="${kx + 96 + i * kw}" y="${ky}" width="${kw}" height="10" fill="${c}" stroke="${INK.grid}" stroke-width="0.5"/>`,
  ).join('')
  const keyLabels = [0, 3, 6, 9]
    .map(
      (i) =>
        `<text x="${kx + 96 + i * kw}" y="${ky + 20}" text-anchor="middle" font-size="9">${Math.round((i / 9) * 100)} %</text>`,
    )
    .join('')
  const keyTitle = `<text x="${kx}" y="${ky + 8}" font-size="10">usable share:</text>`
  const body = `<g font-size="10" fill="${INK.axis}">${axis.join('')}</g>${parts.join('')}<g class="key" fill="${INK.axis}">${keyTitle}${key}${keyLabels}<rect x="${kx + 96 + 9 * kw + 16}" y="${ky}" width="${kw}" height="10" fill="#DDDDDD"/><text x="${kx + 96 + 10 * kw + 20}" y="${ky + 8}" font-size="9">no data</text></g>`
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    chart: 'heat-map',
  })
}
