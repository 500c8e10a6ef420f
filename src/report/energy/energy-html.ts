/**
 * @module report/energy/energy-html
 * The energy control-chart page: one self-contained HTML document (inline CSS and SVG, no scripts) with
 * the findings in sentences (the answer first), then for each view (measured over expected energy from the
 * dryer's physics, the weather-and-load residual, the raw specific energy) its individuals, moving-range,
 * EWMA and CUSUM charts, with the batches in weather outside the baseline's range marked, the fits, the
 * limits and every batch. Same stylesheet and figure format as the seasonal summary
 * (src/report/report-html.ts). All user text is escaped.
 */
import type { ChartSet, EnergyChartAssessment } from '../../analysis/energy/energy-chart.ts'
import { ewmaSteadyHalfWidth } from '../../analysis/energy/ewma-chart.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { htmlDocument } from '../report-html.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { controlChartSvg } from './control-chart-svg.ts'
import {
  batchTable,
  limitsTable,
  physicsTable,
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

interface ViewWords {
  key: string
  name: string
  yLabel: string
  /** Unit of the charted values, as printed. */
  unit: string
  /** Decimals of the charted values in the text. */
  digits: number
}

/** What the four charts of one view share. */
interface ViewCharts {
  set: ChartSet
  what: ViewWords
  prefix: string
  /** Batch id of each charted point. */
  labels: string[]
  /** Whether each charted batch ran in weather outside the baseline's range. */
  outside: boolean[]
  /** Rules signalled at each point. */
  rules: string[][]
  /** Decimals of the charted values. */
  d: number
  baseline: number
  /** The estimated start of a change, marked on the individuals and CUSUM charts. */
  marker: { index: number; label: string } | undefined
  ind: ChartSet['individuals']
}

/** The individuals, moving-range, EWMA and CUSUM figures of one view. */
function chartFigures(
  set: ChartSet,
  a: EnergyChartAssessment,
  what: ViewWords,
  prefix: string,
  next: () => number,
): string {
  const change = set.finding.estimatedChangeStart
  const markerIndex = change ? set.batchIndices.indexOf(change.batchIndex) : -1
  const v: ViewCharts = {
    set,
    what,
    prefix,
    labels: set.batchIndices.map((b) => a.batches[b].batchId),
    outside: set.batchIndices.map((b) => a.outsideBaselineWeather[b]),
    rules: rulesByPoint(set),
    d: what.digits,
    baseline: set.individuals.baselineCount,
    marker: markerIndex >= 0 ? { index: markerIndex, label: `change ≈ ${change!.batchId}` } : undefined,
    ind: set.individuals,
  }
  return [
    individualsFigure(v, next()),
    movingRangeFigure(v, next()),
    ewmaFigure(v, next()),
    cusumFigure(v, next()),
  ].join('\n')
}

/** The individuals chart with its limits from the baseline. */
function individualsFigure(v: ViewCharts, number: number): string {
  const { set, what, prefix, labels, outside, rules, d, baseline, marker, ind } = v
  const rise = set.finding.firstRiseSignal
  const signalText = rise
    ? `The first signal of more energy after the baseline is batch ${rise.batchId} (${rise.rules.join(', ')}), ${rise.batchesAfterBaseline} batches after the baseline.`
    : 'No signal of more energy after the baseline.'
  const outsideCount = outside.filter(Boolean).length
  const outsideText =
    outsideCount > 0
      ? ` ${outsideCount} batches (open squares) ran in weather outside the baseline's range.`
      : ''
  return figureHtml({
    id: `${prefix}${what.key}-individuals`,
    number,
    caption: `${what.name}: individuals chart, limits from the first ${baseline} batches`,
    svg: controlChartSvg({
      id: `${prefix}${what.key}-individuals-svg`,
      title: `${what.name}, individuals chart`,
      description: `Centre ${fixed(ind.centerLine, d + 1)}, limits ${fixed(ind.lowerControlLimit, d + 1)} to ${fixed(ind.upperControlLimit, d + 1)} ${what.unit}. ${signalText}${outsideText}`,
      points: ind.values.map((v, i) => ({
        label: labels[i],
        value: v,
        rules: rules[i].filter((r) => !r.startsWith('EWMA') && !r.startsWith('CUSUM')),
        outside: outside[i],
      })),
      baselineCount: baseline,
      centerLine: ind.centerLine,
      upper: ind.upperControlLimit,
      lower: ind.lowerControlLimit,
      zoneSigma: ind.sigma,
      yLabel: what.yLabel,
      unit: what.unit,
      marker,
    }),
    alt: `${what.name} for ${ind.values.length} batches against a centre of ${fixed(ind.centerLine, d)} ${what.unit} and 3σ limits ${fixed(ind.lowerControlLimit, d)} to ${fixed(ind.upperControlLimit, d)} ${what.unit} (σ̂ = MR̄/1.128 = ${fixed(ind.sigma, d + 1)}). ${signalText}${outsideText}`,
    table: {
      id: `${what.key}-individuals`,
      title: `${what.name} by batch`,
      columns: [
        'batch',
        `value [${what.unit}]`,
        `moving range [${what.unit}]`,
        'outside baseline weather',
        'signals',
      ],
      rows: ind.values.map((v, i) => [
        labels[i],
        v,
        ind.movingRanges[i],
        outside[i] ? 'yes' : '',
        rules[i].join(' '),
      ]),
      digits: [0, d + 1, d + 1, 0, 0],
    },
    note: 'Dotted lines: 1σ and 2σ zones of the Western Electric rules (WE1 one point beyond 3σ; WE2 two of three beyond 2σ; WE3 four of five beyond 1σ; WE4 eight in a row on one side). ↑ more energy than the baseline, ↓ less. Grey area: the baseline (phase I) the limits come from. Open squares: batches in weather outside the baseline’s range.',
  })
}

/** The moving-range chart of consecutive batches. */
function movingRangeFigure(v: ViewCharts, number: number): string {
  const { what, prefix, labels, d, baseline, ind } = v
  const mrValues = ind.movingRanges.slice(1) as number[]
  const mrSignals = new Set(ind.movingRangeSignals)
  return figureHtml({
    id: `${prefix}${what.key}-moving-range`,
    number,
    caption: `${what.name}: moving range of consecutive batches`,
    svg: controlChartSvg({
      id: `${prefix}${what.key}-moving-range-svg`,
      title: `${what.name}, moving-range chart`,
      description: `Mean moving range ${fixed(ind.meanMovingRange, d + 1)}, upper limit D4·MR̄ = ${fixed(ind.movingRangeUpperLimit, d + 1)} ${what.unit}; ${ind.movingRangeSignals.length} moving ranges above it.`,
      points: mrValues.map((v, i) => ({
        label: labels[i + 1],
        value: v,
        rules: mrSignals.has(i + 1) ? ['MR above D4·MR̄'] : [],
      })),
      baselineCount: baseline - 1,
      centerLine: ind.meanMovingRange,
      upper: ind.movingRangeUpperLimit,
      lower: null,
      zoneSigma: null,
      yLabel: `moving range [${what.unit}]`,
      unit: what.unit,
    }),
    alt: `Moving ranges of ${what.name.toLowerCase()}: mean ${fixed(ind.meanMovingRange, d + 1)} ${what.unit} over the baseline, upper limit ${fixed(ind.movingRangeUpperLimit, d + 1)} (D4 = 3.267, D3 = 0); ${ind.movingRangeSignals.length} points above it.`,
    table: {
      id: `${what.key}-moving-range`,
      title: `Moving ranges of ${what.name.toLowerCase()}`,
      columns: ['batch', `moving range [${what.unit}]`],
      rows: mrValues.map((v, i) => [labels[i + 1], v]),
      digits: [0, d + 1],
    },
  })
}

/** The EWMA chart for small sustained shifts. */
function ewmaFigure(v: ViewCharts, number: number): string {
  const { set, what, prefix, labels, outside, d, baseline } = v
  const e = set.ewma
  const ewmaFirst = e.firstMonitoringSignal
  const ewmaRules = new Map<number, string[]>()
  for (const sig of e.signals)
    ewmaRules.set(sig.index, [...(ewmaRules.get(sig.index) ?? []), signalLabel('EWMA', sig.side)])
  return figureHtml({
    id: `${prefix}${what.key}-ewma`,
    number,
    caption: `${what.name}: EWMA chart (λ = ${e.lambda}, L = ${e.limitWidthL}) for small sustained shifts`,
    svg: controlChartSvg({
      id: `${prefix}${what.key}-ewma-svg`,
      title: `${what.name}, EWMA chart`,
      description: `EWMA with target ${fixed(e.centerLine, d + 1)} ${what.unit}; ${ewmaFirst === null ? 'no signal after the baseline' : `first signal after the baseline at batch ${labels[ewmaFirst]}`}.`,
      points: e.ewma.map((v, i) => ({
        label: labels[i],
        value: v,
        rules: ewmaRules.get(i) ?? [],
        outside: outside[i],
      })),
      baselineCount: baseline,
      centerLine: e.centerLine,
      upper: e.upperLimits,
      lower: e.lowerLimits,
      zoneSigma: null,
      yLabel: `EWMA of ${what.yLabel}`,
      unit: what.unit,
    }),
    alt: `Exponentially weighted moving average of ${what.name.toLowerCase()} against ${fixed(e.centerLine, d)} ${what.unit} with limits that widen to ±${fixed(ewmaSteadyHalfWidth(e), d + 1)}; ${ewmaFirst === null ? 'no signal after the baseline' : `first signal after the baseline at batch ${labels[ewmaFirst]} (${e.signals.find((s) => s.index === ewmaFirst)?.side === 'above' ? 'more' : 'less'} energy)`}.`,
    table: {
      id: `${what.key}-ewma`,
      title: `EWMA of ${what.name.toLowerCase()}`,
      columns: ['batch', `EWMA [${what.unit}]`, 'lower limit', 'upper limit'],
      rows: e.ewma.map((v, i) => [labels[i], v, e.lowerLimits[i], e.upperLimits[i]]),
      digits: [0, d + 1, d + 1, d + 1],
    },
  })
}

/** The tabular CUSUM, upper and lower sums. */
function cusumFigure(v: ViewCharts, number: number): string {
  const { set, what, prefix, labels, outside, d, baseline, marker, ind } = v
  const c = set.cusum
  const f = set.finding
  const cusumUp = new Set(c.signals.filter((s) => s.side === 'above').map((s) => s.index))
  const cusumDown = new Set(c.signals.filter((s) => s.side === 'below').map((s) => s.index))
  const cusumText = `${f.cusumRise ? `the upper sum first crosses h at batch ${f.cusumRise.batchId} (more energy)` : 'the upper sum stays below h after the baseline'}; ${f.cusumFall ? `the lower sum first crosses h at batch ${f.cusumFall.batchId} (less energy)` : 'the lower sum stays below h'}.`
  return figureHtml({
    id: `${prefix}${what.key}-cusum`,
    number,
    caption: `${what.name}: CUSUM (k = ${c.k}, h = ${c.h}, in σ units), restarted at the first monitored batch`,
    svg: controlChartSvg({
      id: `${prefix}${what.key}-cusum-svg`,
      title: `${what.name}, CUSUM chart`,
      description: `Upper sum C⁺ above zero and lower sum C⁻ drawn below zero, decision interval ±${c.h} σ; ${cusumText}`,
      points: c.upper.map((v, i) => ({
        // C⁺ (more energy) is the main series.
        label: labels[i],
        value: v,
        rules: cusumUp.has(i) ? [signalLabel('CUSUM', 'above')] : [],
        outside: outside[i],
      })),
      second: {
        values: c.lower.map((v) => (v === 0 ? 0 : -v)),
        label: '−C⁻ (less energy)',
        rules: c.lower.map((_, i) => (cusumDown.has(i) ? [signalLabel('CUSUM', 'below')] : [])),
      },
      baselineCount: baseline,
      centerLine: 0,
      upper: c.h,
      lower: -c.h,
      zoneSigma: null,
      yLabel: 'CUSUM [σ]',
      unit: 'σ',
      marker,
    }),
    alt: `Tabular CUSUM of ${what.name.toLowerCase()} standardized by the baseline's centre ${fixed(ind.centerLine, d)} ${what.unit} and σ̂ ${fixed(ind.sigma, d + 1)} ${what.unit}, k = ${c.k}, h = ${c.h}: ${cusumText}`,
    table: {
      id: `${what.key}-cusum`,
      title: `CUSUM of ${what.name.toLowerCase()}`,
      columns: ['batch', 'C⁺ [σ]', 'C⁻ [σ]', 'outside baseline weather'],
      rows: c.upper.map((v, i) => [labels[i], v, c.lower[i], outside[i] ? 'yes' : '']),
      digits: [0, 2, 2, 0],
    },
    note: 'C⁺ adds up how far each batch lies above the baseline centre, less k = 0.5 σ, and never drops below zero; it signals when it passes h = 5 σ. C⁻ does the same for batches below. On a steady dryer with a known baseline this gives a false signal about once in 465 batches; a step of 3σ is found after about 2.6 batches on average.',
  })
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
  const physicsFit = physicsTable(a)
  const used = (view: 'physics' | 'regression' | 'raw') =>
    a.answer.view === view ? '<p class="used"><strong>The answer uses this view.</strong></p>' : ''
  const physicsSection = a.physics
    ? `<section class="physics"><h2>Against the dryer's own physics</h2>${used('physics')}
<p>For every batch the heat an ideal dryer needs to warm this batch's outside air to the drying temperature and carry its water away, from the moist-air relations; the dryer's overall efficiency and a fixed loss per batch are fitted over the baseline. The charts show the measured energy as a percentage of that expectation (100 % = as in the baseline); its deviation from 100 % is standardized by the batch's leverage, so that a batch far from the baseline's weather counts for a little less.</p>
${physicsFit ? `<div class="table-scroll">${tableHtml(physicsFit)}</div>` : ''}
${chartFigures(a.physics, a, { key: 'physics', name: 'Energy against expected', yLabel: 'measured / expected [%]', unit: '%', digits: 1 }, prefix, next)}
</section>`
    : `<section class="physics"><h2>Against the dryer's own physics</h2><p class="missing">Not drawn: ${escapeHtml(a.physicsUnavailableReason ?? 'no outside air for the batches')}.</p></section>`
  const adjusted = a.adjusted
    ? `<section class="adjusted"><h2>After taking out weather and load by regression</h2>${used('regression')}
<p>Specific energy regressed on outside humidity ratio, outside temperature and load over the baseline; the charts below show the residual, what the weather and the load do not explain, standardized by its leverage h (baseline e/√(1 − h), later batches e/√(1 + h)) so that a batch far from the baseline's weather counts for less. A straight line through the baseline's weather: trust it less where the batches are marked as outside that weather.</p>
${regression ? `<div class="table-scroll">${tableHtml(regression)}</div>` : ''}
${chartFigures(a.adjusted, a, { key: 'residual', name: 'Standardized residual', yLabel: 'standardized residual [MJ/kg water]', unit: 'MJ/kg', digits: 2 }, prefix, next)}
</section>`
    : `<section class="adjusted"><h2>After taking out weather and load by regression</h2><p class="missing">Not drawn: ${escapeHtml(a.adjustedUnavailableReason ?? 'no outside air for the batches')}.</p></section>`
  const rawFigures = chartFigures(
    a.raw,
    a,
    {
      key: 'specific-energy',
      name: 'Specific energy',
      yLabel: 'specific energy [MJ/kg water]',
      unit: 'MJ/kg',
      digits: 2,
    },
    prefix,
    next,
  )
  return `<article class="dryhours-report" data-report="energy-chart">
<header class="report-header" data-section="header"><p class="kicker">dryhours · heated-dryer energy</p><h1>Is the dryer using more energy than it should?</h1>
<dl class="facts">${facts.map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`).join('')}</dl></header>
<section class="answer"><h2>What the charts found</h2><ul class="sentences">${a.summary.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>${
    a.warnings.length > 0
      ? `<div class="warnings"><h3>Check these batches</h3><ul>${a.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>`
      : ''
  }</section>
${physicsSection}
${adjusted}
<section class="raw"><h2>Specific energy, batch by batch</h2>${used('raw')}
<p>Fuel heat (higher heating value) per kg of water removed. Outside air and load move this number from batch to batch, so the limits are wide and a change in the weather looks like a change in the dryer.</p>
${rawFigures}
</section>
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
