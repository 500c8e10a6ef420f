/**
 * @module report/charts/multi-line
 * Several series along one ordered x (e.g. one line per airflow against the start date). Each series has its own
 * colour, dash and marker shape (palette `siteStyle`), so the lines stay apart in greyscale and for colour-blind
 * readers. A null value (e.g. "not dry within the season") is drawn as an open chevron on the top edge in the
 * series' colour, never dropped. Each point is a `<g class="point">` with `data-series`, `data-x` and `data-value`.
 */
import { escapeHtml } from '../escape.ts'
import { INK, type SeriesStyle, siteStyle } from '../palette.ts'
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

export interface MultiLineOptions {
  id: string
  title: string
  description: string
  /** Labels of the x positions, in order. */
  x: string[]
  series: { name: string; values: (number | null)[] }[]
  yLabel: string
  xLabel: string
  unit: string
  digits?: number
  /** A horizontal reference line (e.g. a limit), with its label. */
  reference?: { value: number; label: string }
  /** What a null value means, for the legend and the tooltips (e.g. "not dry within the season"). */
  nullLabel: string
}

const finite = (v: number | null | undefined): v is number =>
  v !== null && v !== undefined && Number.isFinite(v)

/** A marker of `shape` centred at (x, y) with radius r, filled with `colour`. */
export function markerSvg(
  shape: SeriesStyle['marker'],
  x: number,
  y: number,
  r: number,
  colour: string,
): string {
  const X = px(x)
  const Y = px(y)
  switch (shape) {
    case 'circle':
      return `<circle cx="${X}" cy="${Y}" r="${px(r)}" fill="${colour}"/>`
    case 'square':
      return `<rect x="${px(x - r)}" y="${px(y - r)}" width="${px(2 * r)}" height="${px(2 * r)}" fill="${colour}"/>`
    case 'triangle':
      return `<path d="M${X},${px(y - r * 1.2)}L${px(x + r * 1.1)},${px(y + r * 0.8)}L${px(x - r * 1.1)},${px(y + r * 0.8)}Z" fill="${colour}"/>`
    case 'diamond':
      return `<path d="M${X},${px(y - r * 1.3)}L${px(x + r * 1.3)},${Y}L${X},${px(y + r * 1.3)}L${px(x - r * 1.3)},${Y}Z" fill="${colour}"/>`
    case 'cross':
      return `<path d="M${px(x - r)},${px(y - r)}L${px(x + r)},${px(y + r)}M${px(x + r)},${px(y - r)}L${px(x - r)},${px(y + r)}" stroke="${colour}" stroke-width="1.8"/>`
    case 'star':
      return `<path d="M${X},${px(y - r * 1.3)}L${px(x + r * 0.4)},${px(y - r * 0.4)}L${px(x + r * 1.3)},${Y}L${px(x + r * 0.4)},${px(y + r * 0.4)}L${X},${px(y + r * 1.3)}L${px(x - r * 0.4)},${px(y + r * 0.4)}L${px(x - r * 1.3)},${Y}L${px(x - r * 0.4)},${px(y - r * 0.4)}Z" fill="${colour}"/>`
  }
}

export function multiLineChart(o: MultiLineOptions): string {
  const legendRows = Math.ceil((o.series.length + 1) / 3)
  const f: Frame = {
    width: 640,
    height: 280 + legendRows * 16,
    left: 56,
    right: 14,
    top: 22 + legendRows * 16,
    bottom: 40,
  }
  const n = o.x.length
  const digits = o.digits ?? 1
  let max = o.reference?.value ?? 0
  for (const s of o.series) for (const v of s.values) if (finite(v) && v > max) max = v
  const yMax = niceMax(max * 1.05)
  const y = linearScale([0, yMax], [f.height - f.bottom, f.top])
  const x = (i: number) => f.left + (n <= 1 ? plotWidth(f) / 2 : (i / (n - 1)) * plotWidth(f))
  const styles = o.series.map((_, i) => siteStyle(i))
  const lines: string[] = []
  const marks: string[] = []
  o.series.forEach((s, si) => {
    const st = styles[si]
    let seg: string[] = []
    const flush = () => {
      if (seg.length > 1)
        lines.push(
          `<polyline class="series" data-series="${si}" points="${seg.join(' ')}" fill="none" stroke="${st.colour}" stroke-width="1.8"${st.dash ? ` stroke-dasharray="${st.dash}"` : ''}/>`,
        )
      seg = []
    }
    s.values.forEach((v, i) => {
      const label = o.x[i]
      const tip = `${s.name}, ${label}: ${finite(v) ? `${v.toFixed(digits)} ${o.unit}` : o.nullLabel}`
      let g = `<g class="point" data-series="${si}" data-x="${escapeHtml(label)}" data-value="${finite(v) ? v : ''}"><title>${escapeHtml(tip)}</title>`
      if (finite(v)) {
        seg.push(`${px(x(i))},${px(y(v))}`)
        g += markerSvg(st.marker, x(i), y(v), n > 40 ? 1.6 : 2.8, st.colour)
      } else {
        flush()
        // an open chevron pointing up on the top edge ("beyond the chart"), staggered per series
        const top = f.top + 3 + (si % 3) * 4
        g += `<path class="beyond" d="M${px(x(i) - 3.5)},${px(top + 3)}L${px(x(i))},${px(top - 1)}L${px(x(i) + 3.5)},${px(top + 3)}" fill="none" stroke="${st.colour}" stroke-width="1.6"/>`
      }
      marks.push(`${g}</g>`)
    })
    flush()
  })
  const every = Math.max(1, Math.ceil(n / 8))
  const xt = o.x.map((label, i) => ({ x: x(i), label, i })).filter((t) => t.i % every === 0)
  let ref = ''
  if (o.reference) {
    const ry = px(y(o.reference.value))
    ref = `<g class="reference" data-value="${o.reference.value}"><line x1="${f.left}" x2="${f.width - f.right}" y1="${ry}" y2="${ry}" stroke="${INK.text}" stroke-width="1.2" stroke-dasharray="2 3"/><text x="${f.width - f.right - 2}" y="${ry}" dy="-0.35em" text-anchor="end" font-size="9.5" fill="${INK.text}">${escapeHtml(o.reference.label)}</text></g>`
  }
  const items = o.series.map((s, i) => ({
    swatch: `<line x1="0" x2="14" y1="4" y2="4" stroke="${styles[i].colour}" stroke-width="1.8"${styles[i].dash ? ` stroke-dasharray="${styles[i].dash}"` : ''}/>${markerSvg(styles[i].marker, 7, 4, 2.6, styles[i].colour)}`,
    label: s.name.length > 34 ? `${s.name.slice(0, 33)}…` : s.name,
    width: 205,
  }))
  if (o.series.some((s) => s.values.some((v) => !finite(v)))) {
    items.push({
      swatch: `<path d="M3.5,7L7,3L10.5,7" fill="none" stroke="${INK.text}" stroke-width="1.6"/>`,
      label: o.nullLabel,
      width: 205,
    })
  }
  const legendParts: string[] = []
  for (let r = 0; r < legendRows; r++)
    legendParts.push(legend(f.left, 8 + r * 16, items.slice(r * 3, r * 3 + 3)))
  const body =
    yAxis(f, y, niceTicks(0, yMax), o.yLabel) +
    xAxis(f, xt, o.xLabel, true) +
    lines.join('') +
    marks.join('') +
    ref +
    legendParts.join('')
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    chart: 'multi-line',
  })
}
