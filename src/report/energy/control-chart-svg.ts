/**
 * @module report/energy/control-chart-svg
 * One control chart as inline SVG in the report's visual language (palette, axes and accessible wrapper
 * of src/report/charts/svg.ts): points joined in batch order, the centre line, control limits (dashed),
 * optional 1σ/2σ zone lines (dotted, faint), a shaded phase I (baseline) area, and signal points drawn
 * as red diamonds (shape + colour, never colour alone) with the rule in their tooltip. Batches whose
 * weather lies outside the baseline's range get an open square around their mark (shape, not colour).
 * Every point is a `<g class="point">` with `data-batch`, `data-value`, `data-rules` and, for those
 * batches, `data-outside="true"`. An optional second series (the lower CUSUM, drawn below zero) is a dashed
 * line with open circles.
 */
import {
  type Frame,
  legend,
  linearScale,
  niceTicks,
  plotWidth,
  px,
  svgDocument,
  xAxis,
  yAxis,
} from '../charts/svg.ts'
import { escapeHtml } from '../escape.ts'
import { HIGH_CONTRAST, INK } from '../palette.ts'

export interface ControlChartPoint {
  /** Batch label (x tick text and tooltip). */
  label: string
  value: number
  /** Rules that fired on this point, e.g. ['WE1', 'WE4']; empty when in control. */
  rules: string[]
  /** The batch ran in weather outside the baseline's range. */
  outside?: boolean
}

export interface ControlChartSvgOptions {
  id: string
  title: string
  description: string
  points: ControlChartPoint[]
  baselineCount: number
  centerLine: number
  /** Constant limits, or one per point (EWMA). */
  upper: number | number[]
  /** Lower limit; null for a chart without one drawn. */
  lower: number | number[] | null
  /** σ for the 1σ and 2σ zone lines (individuals charts), or null. */
  zoneSigma: number | null
  yLabel: string
  unit: string
  /** Optional vertical marker (e.g. the estimated start of a change), by point index. */
  marker?: { index: number; label: string }
  /** Optional second series (same x), e.g. the lower CUSUM drawn as −C⁻. */
  second?: { values: number[]; label: string; rules: string[][] }
}

const FRAME: Frame = { width: 680, height: 260, left: 58, right: 14, top: 30, bottom: 40 }

export function controlChartSvg(o: ControlChartSvgOptions): string {
  const f = FRAME
  const n = o.points.length
  const values = o.points.map((p) => p.value)
  const { lo, hi, ticks } = valueAxis(o, values)
  const y = linearScale([lo, hi], [f.height - f.bottom, f.top])
  const x = (i: number) => f.left + (n <= 1 ? plotWidth(f) / 2 : ((i + 0.5) / n) * plotWidth(f))
  const parts = [
    ...phaseParts(o, x),
    ...referenceLineParts(o, x, y),
    ...seriesParts(o, values, x, y),
    ...markerParts(o, x),
    ...pointParts(o, x, y),
  ]
  const every = Math.max(1, Math.ceil(n / 8))
  const xt = o.points.map((p, i) => ({ x: x(i), label: p.label, i })).filter((t) => t.i % every === 0)
  const body =
    parts[0] +
    yAxis(f, y, ticks, o.yLabel) +
    xAxis(f, xt, 'batch', false) +
    parts.slice(1).join('') +
    legend(f.left, 12, legendItems(o))
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    chart: 'control',
  })
}

type Scale = (v: number) => number

/** The value axis: every value, limit and the centre, padded by 6 % and widened to whole ticks. */
function valueAxis(o: ControlChartSvgOptions, values: number[]): { lo: number; hi: number; ticks: number[] } {
  const limitValues = [
    ...values,
    ...(o.second?.values ?? []),
    o.centerLine,
    ...(Array.isArray(o.upper) ? o.upper : [o.upper]),
    ...(o.lower === null ? [] : Array.isArray(o.lower) ? o.lower : [o.lower]),
  ].filter(Number.isFinite)
  let lo = limitValues.reduce((m, v) => Math.min(v, m), Number.POSITIVE_INFINITY)
  let hi = limitValues.reduce((m, v) => Math.max(v, m), Number.NEGATIVE_INFINITY)
  const pad = (hi - lo) * 0.06 || 1
  lo -= pad
  hi += pad
  const ticks = niceTicks(lo, hi)
  lo = Math.min(lo, ticks[0])
  hi = Math.max(hi, ticks[ticks.length - 1])
  return { lo, hi, ticks }
}

/** The baseline (phase I) band and the two phase labels; the band comes first (drawn under the axes). */
function phaseParts(o: ControlChartSvgOptions, x: Scale): string[] {
  const f = FRAME
  const n = o.points.length
  const x0 = f.left
  const x1 = f.width - f.right
  const split =
    n > 0 ? px((x(Math.max(0, o.baselineCount - 1)) + x(Math.min(n - 1, o.baselineCount))) / 2) : px(x0)
  const parts: string[] = []
  parts.push(
    `<rect class="phase-one" x="${x0}" y="${f.top}" width="${px(Number(split) - x0)}" height="${f.height - f.bottom - f.top}" fill="${INK.grid}" fill-opacity="0.35"/>`,
    `<text x="${px((x0 + Number(split)) / 2)}" y="${f.top + 10}" text-anchor="middle" font-size="9.5" fill="${INK.muted}">baseline (phase I)</text>`,
    `<text x="${px((Number(split) + x1) / 2)}" y="${f.top + 10}" text-anchor="middle" font-size="9.5" fill="${INK.muted}">monitoring (phase II)</text>`,
  )
  return parts
}

/** The zones (±1σ, ±2σ), the centre line and the control limits (fixed or per point). */
function referenceLineParts(o: ControlChartSvgOptions, x: Scale, y: Scale): string[] {
  const f = FRAME
  const x0 = f.left
  const x1 = f.width - f.right
  const parts: string[] = []
  const hline = (v: number, cls: string, dash: string, colour: string, width = 1) =>
    `<line class="${cls}" data-value="${v}" x1="${x0}" x2="${x1}" y1="${px(y(v))}" y2="${px(y(v))}" stroke="${colour}" stroke-width="${width}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`
  if (o.zoneSigma !== null) {
    for (const k of [-2, -1, 1, 2])
      parts.push(hline(o.centerLine + k * o.zoneSigma, `zone zone-${k}`, '1 3', INK.muted, 0.7))
  }
  parts.push(hline(o.centerLine, 'center-line', '', INK.text, 1.2))
  const limitPath = (v: number | number[], cls: string) => {
    if (!Array.isArray(v)) return hline(v, cls, '6 3', HIGH_CONTRAST.red, 1.3)
    const d = v.map((lv, i) => `${i === 0 ? 'M' : 'L'}${px(x(i))},${px(y(lv))}`).join('')
    return `<path class="${cls}" d="${d}" fill="none" stroke="${HIGH_CONTRAST.red}" stroke-width="1.3" stroke-dasharray="6 3"/>`
  }
  parts.push(limitPath(o.upper, 'upper-limit'))
  if (o.lower !== null) parts.push(limitPath(o.lower, 'lower-limit'))
  return parts
}

/** The series' line, and the second series (line and points) when there is one. */
function seriesParts(o: ControlChartSvgOptions, values: number[], x: Scale, y: Scale): string[] {
  const n = o.points.length
  const parts: string[] = []
  if (n > 1) {
    parts.push(
      `<polyline class="series" points="${values.map((v, i) => `${px(x(i))},${px(y(v))}`).join(' ')}" fill="none" stroke="${HIGH_CONTRAST.blue}" stroke-width="1.2"/>`,
    )
  }
  if (o.second && n > 1) {
    const sv = o.second.values
    parts.push(
      `<polyline class="series series-second" points="${sv.map((v, i) => `${px(x(i))},${px(y(v))}`).join(' ')}" fill="none" stroke="${HIGH_CONTRAST.blue}" stroke-width="1" stroke-dasharray="3 2"/>`,
    )
    sv.forEach((v, i) => {
      const rules = o.second!.rules[i] ?? []
      const tip = `batch ${o.points[i].label}: ${o.second!.label} ${v.toFixed(3)}${rules.length ? `; signal ${rules.join(', ')}` : ''}`
      const mark =
        rules.length > 0
          ? `<path d="M${px(x(i))},${px(y(v) - 4.5)}l4.5,4.5l-4.5,4.5l-4.5,-4.5z" fill="${HIGH_CONTRAST.red}" stroke="${INK.text}" stroke-width="0.6"/>`
          : `<circle cx="${px(x(i))}" cy="${px(y(v))}" r="2" fill="${HIGH_CONTRAST.white}" stroke="${HIGH_CONTRAST.blue}" stroke-width="0.9"/>`
      parts.push(
        `<g class="point point-second" data-batch="${escapeHtml(o.points[i].label)}" data-value="${v}" data-rules="${escapeHtml(rules.join(' '))}"><title>${escapeHtml(tip)}</title>${mark}</g>`,
      )
    })
  }
  return parts
}

/** The estimated start of a change, as a vertical line with its label. */
function markerParts(o: ControlChartSvgOptions, x: Scale): string[] {
  const f = FRAME
  const n = o.points.length
  const parts: string[] = []
  if (o.marker && o.marker.index >= 0 && o.marker.index < n) {
    const mx = px(x(o.marker.index))
    parts.push(
      `<g class="change-marker" data-index="${o.marker.index}"><line x1="${mx}" x2="${mx}" y1="${f.top + 14}" y2="${f.height - f.bottom}" stroke="${HIGH_CONTRAST.yellow}" stroke-width="2"/><text x="${mx}" y="${f.top + 22}" dx="3" font-size="9.5" fill="${INK.text}">${escapeHtml(o.marker.label)}</text></g>`,
    )
  }
  return parts
}

/** Every point with its tooltip, signal mark and the ring of a batch outside the baseline's weather. */
function pointParts(o: ControlChartSvgOptions, x: Scale, y: Scale): string[] {
  const parts: string[] = []
  o.points.forEach((p, i) => {
    const cx = px(x(i))
    const cy = px(y(p.value))
    const tip = `batch ${p.label}: ${p.value.toFixed(3)} ${o.unit}${p.rules.length ? `; signal ${p.rules.join(', ')}` : ''}`
    const mark =
      p.rules.length > 0
        ? `<path d="M${cx},${px(y(p.value) - 4.5)}l4.5,4.5l-4.5,4.5l-4.5,-4.5z" fill="${HIGH_CONTRAST.red}" stroke="${INK.text}" stroke-width="0.6"/>`
        : `<circle cx="${cx}" cy="${cy}" r="2.2" fill="${HIGH_CONTRAST.blue}"/>`
    const ring = p.outside
      ? `<rect x="${px(Number(cx) - 5.5)}" y="${px(Number(cy) - 5.5)}" width="11" height="11" fill="none" stroke="${INK.text}" stroke-width="0.8"/>`
      : ''
    parts.push(
      `<g class="point" data-batch="${escapeHtml(p.label)}" data-value="${p.value}" data-rules="${escapeHtml(p.rules.join(' '))}"${p.outside ? ' data-outside="true"' : ''}><title>${escapeHtml(p.outside ? `${tip}; weather outside the baseline's range` : tip)}</title>${mark}${ring}</g>`,
    )
  })
  return parts
}

/** The legend's entries, the second series and the weather ring only when present. */
function legendItems(o: ControlChartSvgOptions): { swatch: string; label: string }[] {
  return [
    { swatch: `<circle cx="7" cy="4" r="2.2" fill="${HIGH_CONTRAST.blue}"/>`, label: 'batch' },
    {
      swatch: `<path d="M7,-0.5l4.5,4.5l-4.5,4.5l-4.5,-4.5z" fill="${HIGH_CONTRAST.red}" stroke="${INK.text}" stroke-width="0.6"/>`,
      label: 'signal',
    },
    {
      swatch: `<line x1="0" x2="14" y1="4" y2="4" stroke="${INK.text}" stroke-width="1.2"/>`,
      label: 'centre',
    },
    {
      swatch: `<line x1="0" x2="14" y1="4" y2="4" stroke="${HIGH_CONTRAST.red}" stroke-width="1.3" stroke-dasharray="6 3"/>`,
      label: 'control limit',
    },
    ...(o.second
      ? [
          {
            swatch: `<line x1="0" x2="14" y1="4" y2="4" stroke="${HIGH_CONTRAST.blue}" stroke-width="1" stroke-dasharray="3 2"/><circle cx="7" cy="4" r="2" fill="${HIGH_CONTRAST.white}" stroke="${HIGH_CONTRAST.blue}" stroke-width="0.9"/>`,
            label: o.second.label,
          },
        ]
      : []),
    ...(o.points.some((p) => p.outside)
      ? [
          {
            swatch: `<rect x="1.5" y="-1.5" width="11" height="11" fill="none" stroke="${INK.text}" stroke-width="0.8"/>`,
            label: 'outside baseline weather',
          },
        ]
      : []),
  ]
}
