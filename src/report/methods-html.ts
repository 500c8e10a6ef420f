/**
 * @module report/methods-html
 * Several drying methods on one site side by side (analysis/compare-methods.ts): the recommendation with
 * its criterion, the methods table, the season calendar (a table: one row per method, one cell per start
 * week, each cell the state in words) with the rule of every state, then each method's own report. The
 * tables serve the HTML and the CSV alike; nothing is computed here.
 */
import type { CalendarState, MethodComparison } from '../analysis/compare-methods.ts'
import { type UnitSystem, unitFormatter } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import type { Paper } from './report-css.ts'
import { htmlDocument, renderReportArticle } from './report-html.ts'
import { cautionsHtml } from './sections/cautions.ts'
import { finite, round } from './sections/context.ts'
import { type ReportTable, tableCsv, tableHtml, tablesCsv } from './tables.ts'

/** A calendar state in words (the cell text; the rule of each is in the comparison). */
export const CALENDAR_STATE_WORDS: Record<CalendarState, string> = {
  dries: 'dries',
  marginal: 'marginal',
  'needs-heat': 'needs heat',
  'spoils-first': 'spoils first',
  'no-data': 'no data',
}

const share = (x: number | null): number | null => (x === null ? null : round(100 * x, 0))

/** What a comparison says of each grain bin among its methods, one sentence per bin. */
export function binSentences(c: MethodComparison, units: UnitSystem = 'si'): string[] {
  const cur = c.currency ? ` ${c.currency}` : ''
  return c.methods.flatMap((m) => {
    const b = m.bin
    if (b === null) return []
    const airflow =
      units === 'us'
        ? `${b.airflowCfmPerBushel} cfm per bushel (${b.airflowM3PerMinPerTonne} m³/min per t)`
        : `${b.airflowM3PerMinPerTonne} m³/min per t (${b.airflowCfmPerBushel} cfm/bu)`
    const fan =
      b.fanEnergyKwhPerTonne === null
        ? 'fan electricity not computed'
        : `the fan uses ${b.fanEnergyKwhPerTonne} kWh per tonne${b.fanCostPerTonne === null ? '' : `, ${b.fanCostPerTonne}${cur} per tonne at ${b.electricityPricePerKwh}${cur} per kWh${b.electricityPriceIsExample ? ' (example price)' : ''}`}`
    return [`${m.label}: figures at ${airflow}, ${b.airflowRule}; ${fan}; ${b.meaning}.`]
  })
}

/** The cautions of every method compared (grain-bin safety, the product's food safety), each once. */
export function comparisonCautions(c: MethodComparison): string[] {
  return [...new Set(c.assessments.flatMap((a) => [...(a.bin?.cautions ?? []), ...a.product.cautions]))]
}

/** The methods side by side, one row per method. */
export function methodsTable(c: MethodComparison, units: UnitSystem = 'si'): ReportTable {
  const u = unitFormatter(units)
  const cur = c.currency ? ` ${c.currency}` : ''
  const perKg = units === 'us' ? 'lb' : 'kg'
  // per lb of dried product: the cost per kg ÷ lb per kg
  const costPerMass = (v: number | null) => (v === null ? null : v / u.mass(1).value)
  return {
    id: 'methods',
    title: `Methods side by side, start dates ${c.season.start} to ${c.season.end}, deadline ${c.deadlineDays} days`,
    columns: [
      'method',
      'days to target, median [days]',
      'days to target, P90 [days]',
      'finishes within the deadline, mean share of years [%]',
      c.spoilageAssessed ? 'spoils before it is dry, mean share of years [%]' : 'spoilage (not assessed)',
      `heat into the air to finish by the deadline, median [${u.energyPerMassUnit}]`,
      'fuel',
      `fuel at the median heat [unit per ${units === 'us' ? 'short ton' : 'tonne'}]`,
      `fuel cost per ${perKg} of dried product [${c.currency ?? 'your price unit'}]`,
      'price',
    ],
    digits: [0, 1, 1, 0, 0, 0, 0, 1, 3, 0],
    rows: c.methods.map((m) => [
      m.label,
      m.daysToTarget.median,
      m.daysToTarget.p90,
      share(m.probabilityWithinDeadline),
      c.spoilageAssessed ? share(m.spoilageProbability) : 'not assessed',
      finite(m.heatToAirKwhPerTonne.median)
        ? round(u.energyPerMass(m.heatToAirKwhPerTonne.median).value, 0)
        : null,
      `${m.fuel.name} [${u.fuel(1, m.fuel.unit).unit}]`,
      m.fuel.quantityPerTonne === null
        ? null
        : // per short ton in US units: the per-tonne figure × short tons per tonne (energyPerMass of 1 per tonne)
          round(u.fuel(m.fuel.quantityPerTonne, m.fuel.unit).value * u.energyPerMass(1).value, 1),
      costPerMass(m.costPerKgDried) === null ? null : round(costPerMass(m.costPerKgDried) as number, 3),
      `${m.fuel.pricePerUnit}${cur} per ${m.fuel.unit}${m.fuel.priceIsExample ? ' (example)' : ''}`,
    ]),
  }
}

/** The season calendar: one row per method, one column per start week, the state in words. */
export function calendarTable(c: MethodComparison): ReportTable {
  return {
    id: 'season-calendar',
    title: 'Season calendar: the state of batches started in each week (7 days from the first start date)',
    columns: ['method', ...c.calendar.weekStarts.map((w) => `week of ${w}`)],
    rows: c.calendar.rows.map((r) => [r.label, ...r.cells.map((s) => CALENDAR_STATE_WORDS[s])]),
  }
}

/** The rule of every calendar state. */
export function calendarRulesTable(c: MethodComparison): ReportTable {
  return {
    id: 'calendar-rules',
    title: 'What each state of the calendar means',
    columns: ['state', 'rule'],
    rows: c.calendar.rules.map((r) => [CALENDAR_STATE_WORDS[r.state], r.rule]),
  }
}

export interface MethodsReportOptions {
  units?: UnitSystem
  paper?: Paper
  /** Uploaded file name, shown with the site. */
  fileName?: string
  footer?: string
}

/** The comparison's tables for CSV (all in one file, or one by id). */
export function renderMethodComparisonCsv(
  c: MethodComparison,
  o: { units?: UnitSystem; table?: string } = {},
): string {
  const tables = [methodsTable(c, o.units), calendarTable(c), calendarRulesTable(c)]
  if (o.table === undefined || o.table === 'all') return tablesCsv(tables)
  const t = tables.find((x) => x.id === o.table)
  if (!t) {
    throw new RangeError(
      `table must be one of ${['all', ...tables.map((x) => x.id)].join(', ')}; got ${JSON.stringify(o.table)}`,
    )
  }
  return tableCsv(t)
}

/** The comparison as an `<article>` followed by each method's report. */
export function renderMethodComparisonArticle(c: MethodComparison, o: MethodsReportOptions = {}): string {
  const perMethod = c.assessments
    .map((a, i) =>
      renderReportArticle(a, {
        units: o.units ?? 'si',
        idPrefix: `m${i + 1}-`,
        info: { fileName: o.fileName },
        footer: o.footer,
      }),
    )
    .join('\n')
  return `${comparisonArticle(c, o)}\n${perMethod}`
}

/**
 * The comparison's own `<article>` (the answer, the methods table, the season calendar), with the cautions of
 * every method when it stands alone (the printed summary); `after` closes it.
 */
function comparisonArticle(c: MethodComparison, o: MethodsReportOptions, after = ''): string {
  const units = o.units ?? 'si'
  const site = c.site.name.trim() || o.fileName || 'unnamed site'
  const facts: [string, string][] = [
    ['Site', site],
    [
      'Product',
      `${c.product.name}, ${c.product.initialMoistureWbPct} → ${c.product.targetMoistureWbPct} % wb`,
    ],
    [
      'Start dates',
      `${c.season.start} to ${c.season.end}, every ${c.season.stepDays} day${c.season.stepDays === 1 ? '' : 's'}`,
    ],
    ['Deadline', `${c.deadlineDays} days per batch`],
    ['Methods', c.methods.map((m) => m.label).join('; ')],
  ]
  const notes = [
    `Costs: ${c.costNote}; ${c.driedKgPerTonneFresh} kg of dried product per tonne of fresh product.${c.currency ? '' : ' No currency was named: costs are in the unit of the prices.'}`,
    c.spoilageAssessed
      ? 'Spoilage: the share of years in which a batch spoils before it is dry, from the assessment’s spoilage model.'
      : 'Spoilage was not assessed (no spoilage model in these assessments): the calendar cannot show “spoils first”.',
    ...(c.site.typicalYear
      ? [
          'The weather file is a typical year (one constructed year): each share of years is 0 or 100 % per start date.',
        ]
      : []),
    ...binSentences(c, units),
    ...c.notAssessed.map((n) => `Not assessed: ${n.kind}: ${n.reason}`),
  ]
  return `<article class="dryhours-report methods" data-report="methods" data-units="${units}">
<header class="report-header" data-section="header"><p class="kicker">dryhours · methods side by side</p><h1>How should ${escapeHtml(c.product.name)} be dried at ${escapeHtml(site)}?</h1>
<dl class="facts">${facts.map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`).join('')}</dl></header>
<section class="report-section answer" data-section="recommendation"><h2>The answer</h2><p class="recommendation" data-method="${escapeHtml(c.recommendation.kind ?? '')}">${escapeHtml(c.recommendation.text)}</p><p class="criterion">Criterion: ${escapeHtml(c.recommendation.criterion)}.</p>${tableHtml(methodsTable(c, units))}<ul class="notes">${notes.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul></section>
<section class="report-section" data-section="season-calendar"><h2>Season calendar</h2>${tableHtml(calendarTable(c), { className: 'data calendar' })}${tableHtml(calendarRulesTable(c))}</section>${after}
</article>`
}

/**
 * The printed summary of a methods comparison: the comparison alone with the cautions of every method; each
 * method's own report is in the full document ({@link renderMethodComparisonHtml}).
 */
export function renderMethodComparisonHandout(c: MethodComparison, o: MethodsReportOptions = {}): string {
  const site = c.site.name.trim() || o.fileName || 'unnamed site'
  const cautions = cautionsHtml(comparisonCautions(c))
  const more = `<p class="note">Each method's own report (charts, every start date, the assumptions) is in the full document.</p>`
  return htmlDocument(
    `Drying methods side by side: ${site} – ${c.product.name} (summary)`,
    comparisonArticle(c, o, `${cautions}${more}`),
    o.paper,
  )
}

/** The complete HTML document of a methods comparison. */
export function renderMethodComparisonHtml(c: MethodComparison, o: MethodsReportOptions = {}): string {
  const site = c.site.name.trim() || o.fileName || 'unnamed site'
  return htmlDocument(
    `Drying methods side by side: ${site} – ${c.product.name}`,
    renderMethodComparisonArticle(c, o),
    o.paper,
  )
}
