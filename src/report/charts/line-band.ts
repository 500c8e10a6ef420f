/**
 * @module report/charts/line-band
 * A median line with a shaded band to an upper (and optionally lower) percentile along an ordered x:
 * days to target against start date. Points whose value is null (the batch did not reach the target
 * within the longest allowed time) are marked with a cross on the top edge, never silently dropped.
 * Each point is a `<g class="point">` with `data-x`, `data-median`, `data-low`, `data-high`.
 */
import { escapeHtml } from '../escape.ts'
import { HIGH_CONTRAST, INK } from '../palette.ts'
import {
  type Frame,
  legend,
  linearScale,
  niceMax,
  niceTicks,
  plotWidth,
  px,
  svgDocument,
  xAxis,
  yAxis,
} from './svg.ts'

export interface BandPoint {
  /** Label of the x position (e.g. "06-15"). */
  x: string
  median: number | null
  /** Lower edge of the band (e.g. P10); the median is used when absent. */
  low?: number | null
  /** Upper edge of the band (e.g. P90). */
  high: number | null
}

export interface LineBandOptions {
  id: string
  title: string
  description: string
  points: BandPoint[]
  yLabel: string
  xLabel: string
  unit: string
  lowLabel?: string
  highLabel: string
  /** Legend label of the line (default "median"). */
  lineLabel?: string
  /** A horizontal reference line (e.g. the deadline), with its label. */
  reference?: { value: number; label: string }
  /** Label every n-th x position (default: about 8 labels). */
  labelEvery?: number
}

const FRAME: Frame = { width: 640, height: 280, left: 56, right: 14, top: 30, bottom: 40 }

const finite = (v: number | null | undefined): v is number =>
  v !== null && v !== undefined && Number.isFinite(v)

export function lineBandChart(o: LineBandOptions): string {
  const f = FRAME
  const n = o.points.length
  let max = o.reference?.value ?? 0
  for (const p of o.points) for (const v of [p.median, p.low, p.high]) if (finite(v) && v > max) max = v
  const yMax = niceMax(max * 1.05)
  const y = linearScale([0, yMax], [f.height - f.bottom, f.top])
  const x = (i: number) => f.left + (n <= 1 ? plotWidth(f) / 2 : (i / (n - 1)) * plotWidth(f))
  // Band: contiguous runs of points with a finite lower and upper edge.
  const bands: string[] = []
  let run: number[] = []
  const flush = () => {
    if (run.length > 1) {
      const top = run.map((i) => `${px(x(i))},${px(y(o.points[i].high as number))}`)
      const bottom = run
        .slice()
        .reverse()
        .map(
          (i) =>
            `${px(x(i))},${px(y((finite(o.points[i].low) ? o.points[i].low : o.points[i].median) as number))}`,
        )
      bands.push(
        `<polygon class="band" points="${[...top, ...bottom].join(' ')}" fill="${HIGH_CONTRAST.yellow}" fill-opacity="0.45"/>`,
      )
    }
    run = []
  }
  o.points.forEach((p, i) => {
    const low = finite(p.low) ? p.low : p.median
    if (finite(p.high) && finite(low)) run.push(i)
    else flush()
  })
  flush()
  // Median line in runs.
  const lines: string[] = []
  let seg: string[] = []
  const flushLine = () => {
    if (seg.length > 1)
      lines.push(
        `<polyline class="median" points="${seg.join(' ')}" fill="none" stroke="${HIGH_CONTRAST.blue}" stroke-width="2"/>`,
      )
    seg = []
  }
  const highLines: string[] = []
  let hseg: string[] = []
  const flushHigh = () => {
    if (hseg.length > 1)
      highLines.push(
        `<polyline class="high" points="${hseg.join(' ')}" fill="none" stroke="${HIGH_CONTRAST.red}" stroke-width="1.4" stroke-dasharray="5 3"/>`,
      )
    hseg = []
  }
  const marks: string[] = []
  o.points.forEach((p, i) => {
    if (finite(p.median)) seg.push(`${px(x(i))},${px(y(p.median))}`)
    else flushLine()
    if (finite(p.high)) hseg.push(`${px(x(i))},${px(y(p.high))}`)
    else flushHigh()
    const tip = `start ${p.x}: median ${finite(p.median) ? p.median.toFixed(1) : 'not reached'} ${o.unit}; ${o.highLabel} ${finite(p.high) ? p.high.toFixed(1) : 'not reached'}`
    let g = `<g class="point" data-x="${escapeHtml(p.x)}" data-median="${finite(p.median) ? p.median : ''}" data-low="${finite(p.low) ? p.low : ''}" data-high="${finite(p.high) ? p.high : ''}"><title>${escapeHtml(tip)}</title>`
    if (finite(p.median))
      g += `<circle cx="${px(x(i))}" cy="${px(y(p.median))}" r="${n > 60 ? 1.2 : 2.2}" fill="${HIGH_CONTRAST.blue}"/>`
    else
      g += `<path d="M${px(x(i) - 3)},${px(f.top - 3)}l6,6m0,-6l-6,6" stroke="${HIGH_CONTRAST.red}" stroke-width="1.6"/>`
    marks.push(`${g}</g>`)
  })
  flushLine()
  flushHigh()
  const every = o.labelEvery ?? Math.max(1, Math.ceil(n / 8))
  const xt = o.points.map((p, i) => ({ x: x(i), label: p.x, i })).filter((t) => t.i % every === 0)
  let ref = ''
  if (o.reference) {
    const ry = px(y(o.reference.value))
    ref = `<g class="reference" data-value="${o.reference.value}"><line x1="${f.left}" x2="${f.width - f.right}" y1="${ry}" y2="${ry}" stroke="${INK.text}" stroke-width="1" stroke-dasharray="2 3"/><text x="${f.width - f.right - 2}" y="${ry}" dy="-0.35em" text-anchor="end" font-size="9.5" fill="${INK.text}">${escapeHtml(o.reference.label)}</text></g>`
  }
  const items = [
    {
      swatch: `<line x1="0" x2="14" y1="4" y2="4" stroke="${HIGH_CONTRAST.blue}" stroke-width="2"/>`,
      label: o.lineLabel ?? 'median',
    },
  ]
  if (o.points.some((p) => finite(p.high))) {
    items.push({
      swatch: `<rect x="0" y="-1" width="14" height="10" fill="${HIGH_CONTRAST.yellow}" fill-opacity="0.45"/><line x1="0" x2="14" y1="-1" y2="-1" stroke="${HIGH_CONTRAST.red}" stroke-dasharray="5 3"/>`,
      label: `${o.lowLabel ? `${o.lowLabel} to ` : 'median to '}${o.highLabel}`,
    })
  }
  if (o.points.some((p) => !finite(p.median))) {
    items.push({
      swatch: `<path d="M4,1l6,6m0,-6l-6,6" stroke="${HIGH_CONTRAST.red}" stroke-width="1.6"/>`,
      label: 'not reached',
    })
  }
  const body =
    yAxis(f, y, niceTicks(0, yMax), o.yLabel) +
    xAxis(f, xt, o.xLabel, true) +
    bands.join('') +
    highLines.join('') +
    lines.join('') +
    marks.join('') +
    ref +
    legend(f.left, 12, items)
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    chart: 'line-band',
  })
}
