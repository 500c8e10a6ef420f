/**
 * @module report/charts/risk-bars
 * Spoilage risk by start date: one bar per start date, its height the share of years in which the batch
 * spoiled before it was dry [%]. Bars at or above the half-way line are red and hatched, bars below it
 * yellow and plain (colour and pattern say the same, so greyscale prints and colour-blind readers keep it);
 * start dates without a batch are marked with a cross on the axis. Each bar is a `<g class="bar">` with
 * `data-x`, `data-probability` [0–1] and `data-hours-at-risk` (median).
 */
import { escapeHtml } from '../escape.ts'
import { HIGH_CONTRAST, INK, patternDef, type SeriesStyle } from '../palette.ts'
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
} from './svg.ts'

export interface RiskPoint {
  /** Label of the start date (e.g. "06-15"). */
  x: string
  /** Share of years spoiled before dry [0–1]; null when no batch ran. */
  probability: number | null
  /** Median hours at risk (for the tooltip and data attribute). */
  hoursAtRisk: number | null
}

export interface RiskBarsOptions {
  id: string
  title: string
  description: string
  points: RiskPoint[]
  xLabel: string
  /** Label every n-th x position (default: about 8 labels). */
  labelEvery?: number
}

const FRAME: Frame = { width: 640, height: 250, left: 56, right: 14, top: 30, bottom: 40 }
/** The line between "most years" and "fewer years". */
const HALF = 0.5

const HIGH_STYLE: SeriesStyle = { colour: HIGH_CONTRAST.red, pattern: 'diagonal', dash: '', marker: 'square' }

const finite = (v: number | null | undefined): v is number =>
  v !== null && v !== undefined && Number.isFinite(v)

export function riskBarsChart(o: RiskBarsOptions): string {
  const f = FRAME
  const n = o.points.length
  const y = linearScale([0, 100], [f.height - f.bottom, f.top])
  const step = plotWidth(f) / Math.max(1, n)
  const barW = Math.max(1, step * 0.8)
  const x = (i: number) => f.left + step * (i + 0.5)
  const hatchId = `${o.id}-hatch`
  const bars = o.points.map((p, i) => {
    const tip = `start ${p.x}: ${finite(p.probability) ? `spoils before dry in ${Math.round(p.probability * 100)} % of years` : 'no batch'}${finite(p.hoursAtRisk) ? `; ${p.hoursAtRisk} h at risk (median)` : ''}`
    let g = `<g class="bar" data-x="${escapeHtml(p.x)}" data-probability="${finite(p.probability) ? p.probability : ''}" data-hours-at-risk="${finite(p.hoursAtRisk) ? p.hoursAtRisk : ''}"><title>${escapeHtml(tip)}</title>`
    if (finite(p.probability)) {
      const top = y(100 * p.probability)
      const h = f.height - f.bottom - top
      const high = p.probability >= HALF
      g += `<rect x="${px(x(i) - barW / 2)}" y="${px(top)}" width="${px(barW)}" height="${px(Math.max(h, 0))}" fill="${high ? `url(#${hatchId})` : HIGH_CONTRAST.yellow}" stroke="${high ? HIGH_CONTRAST.red : 'none'}" stroke-width="0.6"/>`
    } else {
      const yb = f.height - f.bottom
      g += `<path d="M${px(x(i) - 3)},${px(yb - 9)}l6,6m0,-6l-6,6" stroke="${INK.muted}" stroke-width="1.4"/>`
    }
    return `${g}</g>`
  })
  const every = o.labelEvery ?? Math.max(1, Math.ceil(n / 8))
  const xt = o.points.map((p, i) => ({ x: x(i), label: p.x, i })).filter((t) => t.i % every === 0)
  const ry = px(y(100 * HALF))
  const ref = `<g class="reference" data-value="${100 * HALF}"><line x1="${f.left}" x2="${f.width - f.right}" y1="${ry}" y2="${ry}" stroke="${INK.text}" stroke-width="1" stroke-dasharray="2 3"/><text x="${f.width - f.right - 2}" y="${ry}" dy="-0.35em" text-anchor="end" font-size="9.5" fill="${INK.text}" stroke="${HIGH_CONTRAST.white}" stroke-width="3" paint-order="stroke">half of the years</text></g>`
  const items = [
    {
      swatch: `<rect x="0" y="-1" width="14" height="10" fill="url(#${hatchId})" stroke="${HIGH_CONTRAST.red}" stroke-width="0.6"/>`,
      label: 'spoils first in half of the years or more (hatched)',
    },
    {
      swatch: `<rect x="0" y="-1" width="14" height="10" fill="${HIGH_CONTRAST.yellow}"/>`,
      label: 'in fewer years (plain)',
    },
  ]
  if (o.points.some((p) => !finite(p.probability))) {
    items.push({
      swatch: `<path d="M4,1l6,6m0,-6l-6,6" stroke="${INK.muted}" stroke-width="1.4"/>`,
      label: 'no batch',
    })
  }
  const body =
    yAxis(f, y, niceTicks(0, 100), 'years spoiled before dry [%]') +
    xAxis(f, xt, o.xLabel) +
    bars.join('') +
    ref +
    legend(f.left, 12, items)
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    defs: patternDef(hatchId, HIGH_STYLE),
    chart: 'risk-bars',
  })
}
