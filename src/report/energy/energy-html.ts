/**
 * @module report/energy/energy-html
 * The energy control-chart page: one self-contained HTML document (inline CSS and SVG, no scripts) with
 * the findings in sentences, the individuals, moving-range and EWMA charts of specific energy and of the
 * weather-and-load residual, the regression, the limits and every batch. Same stylesheet and figure
 * format as the seasonal summary (src/report/report-html.ts). All user text is escaped.
 */
import type { ChartSet, EnergyChartAssessment } from '../../analysis/energy/energy-chart.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { htmlDocument } from '../report-html.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { controlChartSvg } from './control-chart-svg.ts'
import {
  batchTable,
  limitsTable,
  regressionTable,
  rejectionsTable,
  rulesByPoint,
  signalLabel,
} from './energy-tables.ts'

export interface EnergyReportOptions {
  /** Name of the log (file name), shown in the header. Untrusted: escaped. */
  logName?: string
  /** Prefix for element ids. */
  idPrefix?: string
  footer?: string
}

const CAUTIONS = [
  'Combustion heaters: direct-fired burners put carbon monoxide and other combustion products in the drying air; prefer indirect (heat-exchanger) heaters for food, and have burners, gas lines and electrical work installed and serviced by licensed trades under local codes.',
  'A rise in energy per kg of water can mean a fault that is also a hazard (a cracked heat exchanger, a blocked flue, dust on hot surfaces): inspect before you keep drying.',
  'Slow or stalled drying of grain raises mould and mycotoxin risk: check the moisture of every batch, not only its fuel.',
]

function chartFigures(
  set: ChartSet,
  a: EnergyChartAssessment,
  what: { key: string; name: string; yLabel: string },
  prefix: string,
  next: () => number,
): string {
  const labels = set.batchIndices.map((b) => a.batches[b].batchId)
  const rules = rulesByPoint(set)
  const ind = set.individuals
  const change = set.finding.estimatedChangeStart
  const markerIndex = change ? set.batchIndices.indexOf(change.batchIndex) : -1
  const marker = markerIndex >= 0 ? { index: markerIndex, label: `change ≈ ${change!.batchId}` } : undefined
  const rise = set.finding.firstRiseSignal
  const signalText = rise
    ? `The first signal of more energy after the baseline is batch ${rise.batchId} (${rise.rules.join(', ')}), ${rise.batchesAfterBaseline} batches after the baseline.`
    : 'No signal of more energy after the baseline.'
  const baseline = ind.baselineCount
  const figures: string[] = []
  const nInd = next()
  figures.push(
    figureHtml({
      id: `${prefix}${what.key}-individuals`,
      number: nInd,
      caption: `${what.name}: individuals chart, limits from the first ${baseline} batches`,
      svg: controlChartSvg({
        id: `${prefix}${what.key}-individuals-svg`,
        title: `${what.name}, individuals chart`,
        description: `Centre ${fixed(ind.centerLine, 3)}, limits ${fixed(ind.lowerControlLimit, 3)} to ${fixed(ind.upperControlLimit, 3)} MJ/kg. ${signalText}`,
        points: ind.values.map((v, i) => ({
          label: labels[i],
          value: v,
          rules: rules[i].filter((r) => r !== 'EWMA'),
        })),
        baselineCount: baseline,
        centerLine: ind.centerLine,
        upper: ind.upperControlLimit,
        lower: ind.lowerControlLimit,
        zoneSigma: ind.sigma,
        yLabel: what.yLabel,
        unit: 'MJ/kg',
        marker,
      }),
      alt: `${what.name} for ${ind.values.length} batches against a centre of ${fixed(ind.centerLine, 2)} MJ/kg and 3σ limits ${fixed(ind.lowerControlLimit, 2)} to ${fixed(ind.upperControlLimit, 2)} MJ/kg (σ̂ = MR̄/1.128 = ${fixed(ind.sigma, 3)}). ${signalText}`,
      table: {
        id: `${what.key}-individuals`,
        title: `${what.name} by batch`,
        columns: ['batch', 'value [MJ/kg]', 'moving range [MJ/kg]', 'signals'],
        rows: ind.values.map((v, i) => [labels[i], v, ind.movingRanges[i], rules[i].join(' ')]),
        digits: [0, 3, 3, 0],
      },
      note: 'Dotted lines: 1σ and 2σ zones of the Western Electric rules (WE1 one point beyond 3σ; WE2 two of three beyond 2σ; WE3 four of five beyond 1σ; WE4 eight in a row on one side). ↑ more energy than the baseline, ↓ less. Grey area: the baseline (phase I) the limits come from.',
    }),
  )
  const mrValues = ind.movingRanges.slice(1) as number[]
  figures.push(
    figureHtml({
      id: `${prefix}${what.key}-moving-range`,
      number: next(),
      caption: `${what.name}: moving range of consecutive batches`,
      svg: controlChartSvg({
        id: `${prefix}${what.key}-moving-range-svg`,
        title: `${what.name}, moving-range chart`,
        description: `Mean moving range ${fixed(ind.meanMovingRange, 3)}, upper limit D4·MR̄ = ${fixed(ind.movingRangeUpperLimit, 3)} MJ/kg; ${ind.movingRangeSignals.length} moving ranges above it.`,
        points: mrValues.map((v, i) => ({
          label: labels[i + 1],
          value: v,
          rules: ind.movingRangeSignals.includes(i + 1) ? ['MR above D4·MR̄'] : [],
        })),
        baselineCount: baseline - 1,
        centerLine: ind.meanMovingRange,
        upper: ind.movingRangeUpperLimit,
        lower: null,
        zoneSigma: null,
        yLabel: 'moving range [MJ/kg water]',
        unit: 'MJ/kg',
      }),
      alt: `Moving ranges of ${what.name.toLowerCase()}: mean ${fixed(ind.meanMovingRange, 3)} MJ/kg over the baseline, upper limit ${fixed(ind.movingRangeUpperLimit, 3)} (D4 = 3.267, D3 = 0); ${ind.movingRangeSignals.length} points above it.`,
      table: {
        id: `${what.key}-moving-range`,
        title: `Moving ranges of ${what.name.toLowerCase()}`,
        columns: ['batch', 'moving range [MJ/kg]'],
        rows: mrValues.map((v, i) => [labels[i + 1], v]),
        digits: [0, 3],
      },
    }),
  )
  const e = set.ewma
  const ewmaFirst = e.firstMonitoringSignal
  figures.push(
    figureHtml({
      id: `${prefix}${what.key}-ewma`,
      number: next(),
      caption: `${what.name}: EWMA chart (λ = ${e.lambda}, L = ${e.limitWidthL}) for small sustained shifts`,
      svg: controlChartSvg({
        id: `${prefix}${what.key}-ewma-svg`,
        title: `${what.name}, EWMA chart`,
        description: `EWMA with target ${fixed(e.centerLine, 3)} MJ/kg; ${ewmaFirst === null ? 'no signal after the baseline' : `first signal after the baseline at batch ${labels[ewmaFirst]}`}.`,
        points: e.ewma.map((v, i) => ({
          label: labels[i],
          value: v,
          rules: e.signals.filter((s) => s.index === i).map((s) => signalLabel('EWMA', s.side)),
        })),
        baselineCount: baseline,
        centerLine: e.centerLine,
        upper: e.upperLimits,
        lower: e.lowerLimits,
        zoneSigma: null,
        yLabel: `EWMA of ${what.yLabel}`,
        unit: 'MJ/kg',
      }),
      alt: `Exponentially weighted moving average of ${what.name.toLowerCase()} against ${fixed(e.centerLine, 2)} MJ/kg with limits that widen to ±${(e.limitWidthL * e.sigma * Math.sqrt(e.lambda / (2 - e.lambda))).toFixed(3)}; ${ewmaFirst === null ? 'no signal after the baseline' : `first signal after the baseline at batch ${labels[ewmaFirst]} (${e.signals.find((s) => s.index === ewmaFirst)?.side === 'above' ? 'more' : 'less'} energy)`}.`,
      table: {
        id: `${what.key}-ewma`,
        title: `EWMA of ${what.name.toLowerCase()}`,
        columns: ['batch', 'EWMA [MJ/kg]', 'lower limit', 'upper limit'],
        rows: e.ewma.map((v, i) => [labels[i], v, e.lowerLimits[i], e.upperLimits[i]]),
        digits: [0, 3, 3, 3],
      },
    }),
  )
  return figures.join('\n')
}

/** Fixed decimals without a negative zero (−0.00 reads as a value). */
const fixed = (x: number, digits: number) => {
  const t = x.toFixed(digits)
  return Number(t) === 0 ? (0).toFixed(digits) : t
}

function tableSection(t: ReportTable, open = false): string {
  return `<details class="table-view"${open ? ' open' : ''}><summary>${escapeHtml(t.title)}</summary><div class="table-scroll">${tableHtml(t)}</div></details>`
}

/** The report as an `<article>` fragment. */
export function renderEnergyArticle(a: EnergyChartAssessment, o: EnergyReportOptions = {}): string {
  const prefix = o.idPrefix ?? ''
  let n = 0
  const next = () => ++n
  const acc = a.accounting
  const facts: [string, string][] = [
    ['Log', o.logName ?? 'batch log'],
    ['Rows', `${acc.rowsRead} read, ${acc.rowsUsed} used, ${acc.rowsRejected} rejected`],
    [
      'Batches',
      `${a.batches.length} (${a.batches[0].startText} to ${a.batches[a.batches.length - 1].startText})`,
    ],
    [
      'Baseline',
      `first ${a.baselineCount} batches (phase I); the rest are monitored against its limits (phase II)`,
    ],
  ]
  const regression = regressionTable(a)
  const rawFigures = chartFigures(
    a.raw,
    a,
    { key: 'specific-energy', name: 'Specific energy', yLabel: 'specific energy [MJ/kg water]' },
    prefix,
    next,
  )
  const adjusted = a.adjusted
    ? `<section class="adjusted"><h2>After taking out weather and load</h2>
<p>Specific energy regressed on outside humidity ratio, outside temperature and load over the baseline; the charts below show the residual, what the weather and the load do not explain, standardized by its leverage h (baseline e/√(1 − h), later batches e/√(1 + h)) so that a batch far from the baseline's weather counts for less.</p>
${regression ? `<div class="table-scroll">${tableHtml(regression)}</div>` : ''}
${chartFigures(a.adjusted, a, { key: 'residual', name: 'Standardized residual', yLabel: 'standardized residual [MJ/kg water]' }, prefix, next)}
</section>`
    : `<section class="adjusted"><h2>After taking out weather and load</h2><p class="missing">Not drawn: ${escapeHtml(a.adjustedUnavailableReason ?? 'no outside air for the batches')}.</p></section>`
  return `<article class="dryhours-report" data-report="energy-chart">
<header class="report-header" data-section="header"><p class="kicker">dryhours · heated-dryer energy</p><h1>Is the dryer using more energy than it should?</h1>
<dl class="facts">${facts.map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`).join('')}</dl></header>
<section class="answer"><h2>What the charts found</h2><ul class="sentences">${a.summary.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>${
    a.warnings.length > 0
      ? `<div class="warnings"><h3>Check these batches</h3><ul>${a.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>`
      : ''
  }</section>
<section class="raw"><h2>Specific energy, batch by batch</h2>
<p>Fuel heat (higher heating value) per kg of water removed. Outside air and load move this number from batch to batch, so the limits are wide.</p>
${rawFigures}
</section>
${adjusted}
<section class="tables"><h2>Numbers</h2>
${tableSection(limitsTable(a), true)}
${tableSection(batchTable(a))}
${tableSection(rejectionsTable(a), a.rejections.length > 0)}
</section>
<section class="limits"><h2>Method, sources and assumptions</h2><ul>${[...a.sources, ...a.assumptions].map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul></section>
<section class="cautions"><h2>Safety</h2><ul>${CAUTIONS.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul></section>
<footer>${escapeHtml(o.footer ?? 'Made by dryhours from the batch log shown above. A chart signal is a reason to look at the dryer, not a diagnosis.')}</footer>
</article>`
}

/** A complete HTML document. */
export function renderEnergyHtml(a: EnergyChartAssessment, o: EnergyReportOptions = {}): string {
  return htmlDocument(
    `Dryer energy control charts${o.logName ? ` — ${o.logName}` : ''}`,
    renderEnergyArticle(a, o),
  )
}
