/**
 * @module report/charts/spread-bars
 * Bars of a median with whiskers for the spread (P10–P90) and, optionally, one small mark per year:
 * usable drying hours per month, supplemental heat per month. Every bar carries its numbers as data
 * attributes (`data-median`, `data-p10`, `data-p90`) so tests and scripts can read them back.
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

export interface SpreadBar {
  /** Category label on the x axis (e.g. "Jan"). */
  label: string
  /** Key written to `data-key` (e.g. the month number). */
  key: string
  median: number | null
  p10: number | null
  p90: number | null
  /** Individual years' values, drawn as small ticks when given. */
  byYear?: { year: number; value: number | null }[]
}

export interface SpreadBarsOptions {
  id: string
  title: string
  description: string
  bars: SpreadBar[]
  yLabel: string
  /** Unit text for tooltips. */
  unit: string
  /** Fill of the bars; defaults to the high-contrast blue. */
  colour?: string
  /** Decimals in tooltips. */
  digits?: number
  frame?: Partial<Frame>
}

const DEFAULT_FRAME: Frame = { width: 640, height: 280, left: 56, right: 12, top: 30, bottom: 40 }

function fmt(v: number | null, digits: number): string {
  return v === null || !Number.isFinite(v) ? '–' : v.toFixed(digits)
}

function attr(v: number | null): string {
  return v === null || !Number.isFinite(v) ? '' : String(v)
}

export function spreadBarsChart(o: SpreadBarsOptions): string {
  const f: Frame = { ...DEFAULT_FRAME, ...o.frame }
  const digits = o.digits ?? 0
  const colour = o.colour ?? HIGH_CONTRAST.blue
  let max = 0
  for (const b of o.bars) {
    for (const v of [b.median, b.p10, b.p90, ...(b.byYear ?? []).map((y) => y.value)]) {
      if (v !== null && Number.isFinite(v) && v > max) max = v
    }
  }
  const yMax = niceMax(max)
  const y = linearScale([0, yMax], [f.height - f.bottom, f.top])
  const n = Math.max(1, o.bars.length)
  const band = plotWidth(f) / n
  const barW = band * 0.62
  const parts: string[] = []
  o.bars.forEach((b, i) => {
    const cx = f.left + band * (i + 0.5)
    const tip = `${b.label}: median ${fmt(b.median, digits)} ${o.unit}, P10 ${fmt(b.p10, digits)}, P90 ${fmt(b.p90, digits)}`
    let g = `<g class="bar" data-key="${escapeHtml(b.key)}" data-median="${attr(b.median)}" data-p10="${attr(b.p10)}" data-p90="${attr(b.p90)}"><title>${escapeHtml(tip)}</title>`
    if (b.median !== null && Number.isFinite(b.median)) {
      const top = y(b.median)
      g += `<rect x="${px(cx - barW / 2)}" y="${px(top)}" width="${px(barW)}" height="${px(Math.max(0, y(0) - top))}" fill="${colour}"/>`
    } else {
      g += `<text x="${px(cx)}" y="${px(y(0) - 4)}" text-anchor="middle" font-size="9" fill="${INK.muted}">n/a</text>`
    }
    for (const yr of b.byYear ?? []) {
      if (yr.value === null || !Number.isFinite(yr.value)) continue
      g += `<line class="year" data-year="${yr.year}" data-value="${yr.value}" x1="${px(cx - barW / 2 + 2)}" x2="${px(cx + barW / 2 - 2)}" y1="${px(y(yr.value))}" y2="${px(y(yr.value))}" stroke="${HIGH_CONTRAST.white}" stroke-opacity="0.75" stroke-width="1"/>`
    }
    if (b.p10 !== null && b.p90 !== null && Number.isFinite(b.p10) && Number.isFinite(b.p90)) {
      const y10 = px(y(b.p10))
      const y90 = px(y(b.p90))
      const cap = barW * 0.28
      g += `<path class="whisker" d="M${px(cx)},${y10}V${y90}M${px(cx - cap)},${y10}H${px(cx + cap)}M${px(cx - cap)},${y90}H${px(cx + cap)}" stroke="${HIGH_CONTRAST.black}" stroke-width="1.4" fill="none"/>`
    }
    parts.push(`${g}</g>`)
  })
  const ticks = niceTicks(0, yMax)
  const legendItems = [
    { swatch: `<rect x="0" y="-1" width="14" height="10" fill="${colour}"/>`, label: 'median year' },
    {
      swatch: `<path d="M7,-2V10M3,-2H11M3,10H11" stroke="${HIGH_CONTRAST.black}" stroke-width="1.4" fill="none"/>`,
      label: 'P10 to P90 across years',
    },
  ]
  if (o.bars.some((b) => (b.byYear ?? []).length > 0)) {
    legendItems.push({
      swatch: `<rect x="0" y="-1" width="14" height="10" fill="${colour}"/><line x1="2" x2="12" y1="4" y2="4" stroke="#fff" stroke-width="1"/>`,
      label: 'one line per year',
    })
  }
  const body =
    yAxis(f, y, ticks, o.yLabel) +
    xAxis(
      f,
      o.bars.map((b, i) => ({ x: f.left + band * (i + 0.5), label: b.label })),
      '',
    ) +
    parts.join('') +
    legend(f.left, 12, legendItems)
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    chart: 'spread-bars',
  })
}
