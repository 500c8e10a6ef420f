/**
 * @module report/charts/grouped-bars
 * Sites side by side: for each category (month, or a ranking criterion) one bar per site. Each site has
 * its own colour *and* fill pattern (see palette `siteStyle`), so the bars stay apart in greyscale and
 * for colour-blind readers. Bars carry `data-series` (site index), `data-category` and `data-value`.
 */
import { escapeHtml } from '../escape.ts'
import { HIGH_CONTRAST, patternDef, siteStyle, styleFill } from '../palette.ts'
import {
  type Frame,
  linearScale,
  niceMax,
  niceTicks,
  plotWidth,
  px,
  svgDocument,
  wrappedLegend,
  xAxis,
  yAxis,
} from './svg.ts'

export interface GroupedBarsOptions {
  id: string
  title: string
  description: string
  categories: { key: string; label: string }[]
  series: { name: string; values: (number | null)[]; low?: (number | null)[]; high?: (number | null)[] }[]
  yLabel: string
  unit: string
  digits?: number
}

const finite = (v: number | null | undefined): v is number =>
  v !== null && v !== undefined && Number.isFinite(v)

export function groupedBarsChart(o: GroupedBarsOptions): string {
  const items = o.series.map((s, i) => ({
    swatch: `<rect x="0" y="-1" width="14" height="10" fill="${styleFill(`${o.id}-p${i}`, siteStyle(i))}" stroke="${siteStyle(i).colour}"/>`,
    label: s.name.length > 60 ? `${s.name.slice(0, 59)}…` : s.name,
  }))
  const legendRows = wrappedLegend(0, 0, items, 640 - 56 - 12).rows
  const f: Frame = {
    width: 640,
    height: 270 + legendRows * 16,
    left: 56,
    right: 12,
    top: 18 + legendRows * 16,
    bottom: 34,
  }
  const digits = o.digits ?? 0
  let max = 0
  for (const s of o.series)
    for (const arr of [s.values, s.high ?? []]) for (const v of arr) if (finite(v) && v > max) max = v
  const yMax = niceMax(max)
  const y = linearScale([0, yMax], [f.height - f.bottom, f.top])
  const band = plotWidth(f) / Math.max(1, o.categories.length)
  const inner = band * 0.84
  const bw = inner / Math.max(1, o.series.length)
  const defs: string[] = []
  const styles = o.series.map((_, i) => siteStyle(i))
  styles.forEach((st, i) => {
    defs.push(patternDef(`${o.id}-p${i}`, st))
  })
  const bars: string[] = []
  o.categories.forEach((c, ci) => {
    o.series.forEach((s, si) => {
      const v = s.values[ci] ?? null
      const x0 = f.left + band * ci + (band - inner) / 2 + bw * si
      const tip = `${s.name}, ${c.label}: ${finite(v) ? v.toFixed(digits) : 'no data'} ${o.unit}`
      let g = `<g class="bar" data-series="${si}" data-category="${escapeHtml(c.key)}" data-value="${finite(v) ? v : ''}"><title>${escapeHtml(tip)}</title>`
      if (finite(v)) {
        g += `<rect x="${px(x0 + 0.5)}" y="${px(y(v))}" width="${px(Math.max(0.5, bw - 1))}" height="${px(Math.max(0, y(0) - y(v)))}" fill="${styleFill(`${o.id}-p${si}`, styles[si])}" stroke="${styles[si].colour}" stroke-width="0.8"/>`
      }
      const lo = s.low?.[ci]
      const hi = s.high?.[ci]
      if (finite(lo) && finite(hi)) {
        const cx = px(x0 + bw / 2)
        g += `<path class="whisker" d="M${cx},${px(y(lo))}V${px(y(hi))}" stroke="${HIGH_CONTRAST.black}" stroke-width="1"/>`
      }
      bars.push(`${g}</g>`)
    })
  })
  const legendParts = [wrappedLegend(f.left, 10, items, plotWidth(f)).svg]
  const body =
    yAxis(f, y, niceTicks(0, yMax), o.yLabel) +
    xAxis(
      f,
      o.categories.map((c, i) => ({ x: f.left + band * (i + 0.5), label: c.label })),
      '',
    ) +
    bars.join('') +
    legendParts.join('')
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    defs: defs.join(''),
    chart: 'grouped-bars',
  })
}
