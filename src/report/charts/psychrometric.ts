/**
 * @module report/charts/psychrometric
 * The site's hours on a psychrometric chart: dry bulb (x) against humidity ratio (y), with the curves of
 * constant relative humidity, the hours as a density of cells, and the region of air that dries the
 * product to its target shaded and hatched, all as the assessment gives them (analysis/psychrometric.ts). Cells carry `data-t`, `data-w`, `data-hours`; the region carries its boundary.
 */

import type { PsychrometricSummary, RegionPoint } from '../../analysis/psychrometric.ts'
import type { UnitFormatter } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { HIGH_CONTRAST, INK, sequentialColour } from '../palette.ts'
import { type Frame, linearScale, niceTicks, px, svgDocument, tickLabel, xAxis, yAxis } from './svg.ts'

export interface PsychrometricOptions {
  id: string
  title: string
  description: string
  /** The hours, the axes and the RH curves (analysis/psychrometric.ts). */
  summary: PsychrometricSummary
  /** Boundary of the drying region (humidity ratio at the product's equilibrium RH at target, by dry bulb). */
  region: RegionPoint[] | null
  /** Label of the region, e.g. "dries raisins to 15 %". */
  regionLabel: string
  units: UnitFormatter
}

const FRAME: Frame = { width: 640, height: 410, left: 56, right: 40, top: 50, bottom: 40 }
export function psychrometricChart(o: PsychrometricOptions): string {
  const f = FRAME
  const d = o.summary
  const [t0, t1] = d.dryBulbRangeC
  const wTop = d.humidityRatioMaxGPerKg
  const x = linearScale([t0, t1], [f.left, f.width - f.right])
  const y = linearScale([0, wTop], [f.height - f.bottom, f.top])
  const clipId = `${o.id}-clip`
  const hatchId = `${o.id}-hatch`
  const defs =
    `<clipPath id="${clipId}"><rect x="${f.left}" y="${f.top}" width="${f.width - f.left - f.right}" height="${f.height - f.top - f.bottom}"/></clipPath>` +
    `<pattern id="${hatchId}" patternUnits="userSpaceOnUse" width="7" height="7" patternTransform="rotate(45)"><rect width="7" height="7" fill="${HIGH_CONTRAST.blue}" fill-opacity="0.10"/><line x1="0" y1="0" x2="0" y2="7" stroke="${HIGH_CONTRAST.blue}" stroke-width="1.2" stroke-opacity="0.55"/></pattern>` +
    `<pattern id="${hatchId}-lines" patternUnits="userSpaceOnUse" width="7" height="7" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="7" stroke="${HIGH_CONTRAST.blue}" stroke-width="1" stroke-opacity="0.45"/></pattern>`
  const parts: string[] = []
  const labels: string[] = []
  const overlay: string[] = []
  // Drying region.
  if (o.region && o.region.length > 1) {
    const pts = o.region.map(
      (p) => `${px(x(p.dryBulbC))},${px(y(Math.min(p.humidityRatioGPerKg, wTop * 2)))}`,
    )
    const last = o.region[o.region.length - 1]
    const first = o.region[0]
    const poly = [...pts, `${px(x(last.dryBulbC))},${px(y(0))}`, `${px(x(first.dryBulbC))},${px(y(0))}`]
    parts.push(
      `<g class="drying-region" data-boundary="${escapeHtml(o.region.map((p) => `${p.dryBulbC}:${p.humidityRatioGPerKg}`).join(' '))}"><title>${escapeHtml(o.regionLabel)}</title><polygon points="${poly.join(' ')}" fill="url(#${hatchId})"/></g>`,
    )
    overlay.push(`<polygon points="${poly.join(' ')}" fill="url(#${hatchId}-lines)"/>`)
    overlay.push(
      `<polyline class="region-edge" points="${pts.join(' ')}" fill="none" stroke="${HIGH_CONTRAST.blue}" stroke-width="2.2"/>`,
    )
  }
  // Density cells: colour by share of the busiest cell, on a square-root scale so rare states still show.
  let maxCount = 0
  for (const c of d.cells) if (c.hours > maxCount) maxCount = c.hours
  const cw = Math.abs(x(t0 + d.binDryBulbC) - x(t0))
  const ch = Math.abs(y(0) - y(d.binHumidityRatioGPerKg))
  for (const c of d.cells) {
    const share = maxCount > 0 ? Math.sqrt(c.hours / maxCount) : 0
    const uu = o.units
    const tt = (v: number) => uu.temperature(v).value.toFixed(0)
    const ww = (v: number) => uu.humidityRatio(v).value.toFixed(uu.system === 'us' ? 0 : 1)
    const label = `${tt(c.dryBulbC)} to ${tt(c.dryBulbC + d.binDryBulbC)} ${uu.temperatureUnit}, ${ww(c.humidityRatioGPerKg)} to ${ww(c.humidityRatioGPerKg + d.binHumidityRatioGPerKg)} ${uu.humidityRatioUnit}: ${c.hours} h`
    parts.push(
      `<rect class="hours" data-t="${c.dryBulbC}" data-w="${c.humidityRatioGPerKg}" data-hours="${c.hours}" x="${px(x(c.dryBulbC))}" y="${px(y(c.humidityRatioGPerKg + d.binHumidityRatioGPerKg))}" width="${px(cw)}" height="${px(ch)}" fill="${sequentialColour(0.15 + 0.85 * share)}" fill-opacity="0.9"><title>${escapeHtml(label)}</title></rect>`,
    )
  }
  // RH curves, labelled where they leave the plot (right edge: beside it; top edge: if there is room).
  const curves: string[] = []
  let lastTopLabelX = Number.NEGATIVE_INFINITY
  d.rhCurves.forEach(({ rhPct: rh, humidityRatioGPerKg: curve }) => {
    const pts: string[] = []
    let exit: { x: number; y: number; side: 'right' | 'top' } = { x: x(t1), y: y(0), side: 'right' }
    curve.forEach((w, i) => {
      const t = d.rhCurveDryBulbC[i]
      pts.push(`${px(x(t))},${px(y(w))}`)
      exit = w > wTop ? { x: x(t), y: y(wTop), side: 'top' } : { x: x(t), y: y(w), side: 'right' }
    })
    const sat = rh === 100
    curves.push(
      `<polyline class="rh" data-rh="${rh}" points="${pts.join(' ')}" fill="none" stroke="${sat ? INK.text : INK.muted}" stroke-width="${sat ? 1.6 : 0.7}"${sat ? '' : ' stroke-dasharray="3 2"'}/>`,
    )
    if (exit.side === 'right') {
      labels.push(
        `<text x="${px(exit.x + 3)}" y="${px(exit.y)}" dy="0.32em" font-size="8.5" fill="${INK.muted}">${rh} %</text>`,
      )
    } else if (exit.x - lastTopLabelX > 26 || sat) {
      labels.push(
        `<text x="${px(exit.x)}" y="${px(exit.y - 3)}" text-anchor="middle" font-size="8.5" fill="${sat ? INK.text : INK.muted}">${rh} %</text>`,
      )
      lastTopLabelX = exit.x
    }
  })
  const tTicks = niceTicks(t0, t1, 8)
  const wTicks = niceTicks(0, wTop, 6)
  const u = o.units
  const body =
    yAxis(f, y, wTicks, `humidity ratio [${u.humidityRatioUnit}]`, (w) =>
      tickLabel(Number(u.humidityRatio(w).value.toFixed(1))),
    ) +
    xAxis(
      f,
      tTicks.map((t) => ({ x: x(t), label: tickLabel(Number(u.temperature(t).value.toFixed(1))) })),
      `dry bulb [${u.temperatureUnit}]`,
      true,
    ) +
    `<g clip-path="url(#${clipId})">${parts.join('')}${curves.join('')}${overlay.join('')}</g>${labels.join('')}` +
    `<g class="legend" font-size="10" fill="${INK.text}">` +
    `<rect x="${f.left}" y="4" width="14" height="10" fill="url(#${hatchId})" stroke="${HIGH_CONTRAST.blue}"/><text x="${f.left + 18}" y="12.5">${escapeHtml(o.regionLabel)}</text>` +
    `<rect x="${f.left}" y="20" width="14" height="10" fill="${sequentialColour(0.2)}"/><rect x="${f.left + 14}" y="20" width="14" height="10" fill="${sequentialColour(0.6)}"/><rect x="${f.left + 28}" y="20" width="14" height="10" fill="${sequentialColour(1)}"/><text x="${f.left + 46}" y="28.5">hours in each cell: few → many</text>` +
    `<line x1="${f.left + 230}" x2="${f.left + 250}" y1="25" y2="25" stroke="${INK.muted}" stroke-dasharray="3 2"/><text x="${f.left + 254}" y="28.5">relative humidity</text>` +
    `<line x1="${f.left + 350}" x2="${f.left + 370}" y1="25" y2="25" stroke="${INK.text}" stroke-width="1.6"/><text x="${f.left + 374}" y="28.5">saturation (100 %)</text></g>`
  return svgDocument({
    id: o.id,
    frame: f,
    title: o.title,
    description: o.description,
    body,
    defs,
    chart: 'psychrometric',
  })
}
