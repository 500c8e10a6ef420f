/**
 * @module report/charts/svg
 * Small SVG building blocks shared by the charts: linear scales with round ticks, axes, the accessible
 * `<svg>` wrapper (role, title, description) and coordinate formatting. Output is plain strings; every
 * text that may come from a user goes through `escapeHtml`.
 */
import { integerPower } from '../../physics/power.ts'
import { escapeHtml } from '../escape.ts'
import { INK } from '../palette.ts'

/** Chart geometry: outer size and the plot area margins [px of the viewBox]. */
export interface Frame {
  width: number
  height: number
  left: number
  right: number
  top: number
  bottom: number
}

export const plotWidth = (f: Frame): number => f.width - f.left - f.right
export const plotHeight = (f: Frame): number => f.height - f.top - f.bottom

/** A coordinate rounded to 0.1 px (keeps documents small and diffs stable). */
export function px(v: number): string {
  const r = Math.round(v * 10) / 10
  return Object.is(r, -0) ? '0' : String(r)
}

export interface LinearScale {
  (v: number): number
  domain: [number, number]
  range: [number, number]
}

/** Linear map from `domain` to `range`; a zero-width domain maps everything to the range start. */
export function linearScale(domain: [number, number], range: [number, number]): LinearScale {
  const [d0, d1] = domain
  const [r0, r1] = range
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0)
  const f = ((v: number) => r0 + (v - d0) * k) as LinearScale
  f.domain = domain
  f.range = range
  return f
}

/**
 * About `count` round ticks (1, 2 or 5 × 10ⁿ steps) covering [min, max]; the classic "nice numbers"
 * labelling (Heckbert 1990, "Nice numbers for graph labels", Graphics Gems I, pp. 61–63).
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(Number.isFinite(min) && Number.isFinite(max))) return [0]
  if (max < min) [min, max] = [max, min]
  if (max === min) return [min]
  const raw = (max - min) / Math.max(1, count)
  const mag = integerPower(10, Math.floor(Math.log10(raw)))
  const norm = raw / mag
  const step = (norm < 1.5 ? 1 : norm < 3 ? 2 : norm < 7 ? 5 : 10) * mag
  const start = Math.ceil(min / step - 1e-9) * step
  const ticks: number[] = []
  for (let v = start; v <= max + step * 1e-9; v += step) ticks.push(Math.round(v / step) * step)
  return ticks.map((t) => Number(t.toPrecision(12)))
}

/** The domain [0 or min, max] extended to the next nice tick above the largest value. */
export function niceMax(max: number, count = 5): number {
  if (!(max > 0)) return 1
  const ticks = niceTicks(0, max, count)
  const last = ticks[ticks.length - 1]
  if (last >= max) return last
  const step = ticks.length > 1 ? ticks[1] - ticks[0] : max
  return last + step
}

/** Tick label text: integers without decimals, otherwise up to 2 significant decimals. */
export function tickLabel(v: number): string {
  if (Number.isInteger(v)) return String(v)
  return String(Number(v.toFixed(2)))
}

/** Left (y) axis with grid lines across the plot. */
export function yAxis(
  f: Frame,
  scale: LinearScale,
  ticks: number[],
  label: string,
  format = tickLabel,
): string {
  const x0 = f.left
  const x1 = f.width - f.right
  const parts = ticks.map((t) => {
    const y = px(scale(t))
    return `<line x1="${x0}" x2="${x1}" y1="${y}" y2="${y}" stroke="${INK.grid}" stroke-width="0.6"/><text x="${x0 - 5}" y="${y}" dy="0.32em" text-anchor="end">${escapeHtml(format(t))}</text>`
  })
  const cy = px(f.top + plotHeight(f) / 2)
  return `<g class="axis y" font-size="10" fill="${INK.axis}">${parts.join('')}<line x1="${x0}" x2="${x0}" y1="${f.top}" y2="${f.height - f.bottom}" stroke="${INK.axis}"/><text transform="translate(12 ${cy}) rotate(-90)" text-anchor="middle" font-size="10.5">${escapeHtml(label)}</text></g>`
}

/** Bottom (x) axis with labelled ticks at given positions. */
export function xAxis(f: Frame, ticks: { x: number; label: string }[], label: string, grid = false): string {
  const y0 = f.height - f.bottom
  const parts = ticks.map(
    (t) =>
      `${grid ? `<line x1="${px(t.x)}" x2="${px(t.x)}" y1="${f.top}" y2="${y0}" stroke="${INK.grid}" stroke-width="0.6"/>` : ''}<line x1="${px(t.x)}" x2="${px(t.x)}" y1="${y0}" y2="${y0 + 4}" stroke="${INK.axis}"/><text x="${px(t.x)}" y="${y0 + 14}" text-anchor="middle">${escapeHtml(t.label)}</text>`,
  )
  const cx = px(f.left + plotWidth(f) / 2)
  return `<g class="axis x" font-size="10" fill="${INK.axis}">${parts.join('')}<line x1="${f.left}" x2="${f.width - f.right}" y1="${y0}" y2="${y0}" stroke="${INK.axis}"/><text x="${cx}" y="${f.height - 4}" text-anchor="middle" font-size="10.5">${escapeHtml(label)}</text></g>`
}

/**
 * The accessible `<svg>` element: `role="img"`, a `<title>` and a `<desc>` referenced by
 * `aria-labelledby`, a viewBox so it scales to the column width, and optional `<defs>`.
 */
export function svgDocument(o: {
  id: string
  frame: Frame
  title: string
  description: string
  body: string
  defs?: string
  chart: string
}): string {
  const id = escapeHtml(o.id)
  return `<svg xmlns="http://www.w3.org/2000/svg" class="chart" data-chart="${escapeHtml(o.chart)}" id="${id}" viewBox="0 0 ${o.frame.width} ${o.frame.height}" role="img" aria-labelledby="${id}-title ${id}-desc" font-family="inherit"><title id="${id}-title">${escapeHtml(o.title)}</title><desc id="${id}-desc">${escapeHtml(o.description)}</desc>${o.defs ? `<defs>${o.defs}</defs>` : ''}${o.body}</svg>`
}

/** Month abbreviations used on axes (English). */
export const MONTH_SHORT = [
  'Jan',
  'Feb',
  'Mar',
  'Apr',
  'May',
  'Jun',
  'Jul',
  'Aug',
  'Sep',
  'Oct',
  'Nov',
  'Dec',
]
export const MONTH_LONG = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
]

/** A legend row: swatch + label items laid out left to right from (x, y). */
/** Estimated width of a legend label at font size 10 [px of the viewBox]: 5.6 px a character, generous for sans-serif. */
export const legendLabelWidth = (label: string): number => label.length * 5.6

/**
 * A legend whose items wrap onto as many rows as the width needs (each item: 18 px swatch, its label,
 * 14 px gap), so that long names never run past the chart's edge. Returns the rows used.
 */
export function wrappedLegend(
  x: number,
  y: number,
  items: { swatch: string; label: string }[],
  maxWidth: number,
  rowHeight = 16,
): { svg: string; rows: number } {
  const rows: { swatch: string; label: string; width: number }[][] = [[]]
  let used = 0
  for (const it of items) {
    const width = 18 + legendLabelWidth(it.label) + 14
    if (used > 0 && used + width > maxWidth) {
      rows.push([])
      used = 0
    }
    rows[rows.length - 1].push({ ...it, width })
    used += width
  }
  return { svg: rows.map((r, i) => legend(x, y + i * rowHeight, r)).join(''), rows: rows.length }
}

export function legend(
  x: number,
  y: number,
  items: { swatch: string; label: string; width?: number }[],
): string {
  let cx = x
  const parts = items.map((it) => {
    const w = it.width ?? 18 + it.label.length * 5.6 + 14
    const out = `<g transform="translate(${px(cx)} ${px(y)})">${it.swatch}<text x="18" y="4" dy="0.32em" font-size="10" fill="${INK.text}">${escapeHtml(it.label)}</text></g>`
    cx += w
    return out
  })
  return `<g class="legend">${parts.join('')}</g>`
}
