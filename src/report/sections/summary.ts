/**
 * @module report/sections/summary
 * The header (site, data, coverage, product, method, target) and the answer in plain sentences.
 */
import type { AssessmentView } from '../assessment-view.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { asSpread, finite, type SectionContext } from './context.ts'
import { fuelsOf } from './heat.ts'
import { monthList, SUITABLE_MONTH_P10_HOURS, suitableMonths } from './monthly.ts'
import { bestStartWindow } from './start-dates.ts'

const METHOD_NAMES: Record<string, string> = {
  'open-air': 'open air (racks or mats in the sun)',
  shade: 'shade (ventilated shelter)',
  'solar-cabinet': 'solar cabinet (air heated by a solar collector)',
  heated: 'heated air',
}

export function methodName(kind: string): string {
  return METHOD_NAMES[kind] ?? kind
}

function coord(v: number | null | undefined, pos: string, neg: string): string {
  return finite(v) ? `${formatNumber(Math.abs(v), 2)}° ${v >= 0 ? pos : neg}` : 'unknown'
}

/** Rows of the header as label/value pairs (plain text; escaped when rendered). */
export function headerRows(a: AssessmentView, ctx: SectionContext): [string, string][] {
  const s = a.site
  const u = ctx.units
  const rows: [string, string][] = [['Site', s.name]]
  if (finite(s.latitudeDeg) || finite(s.longitudeDeg) || finite(s.elevationM)) {
    const elev = finite(s.elevationM)
      ? u.system === 'us'
        ? `${formatNumber(s.elevationM / 0.3048)} ft`
        : `${formatNumber(s.elevationM)} m`
      : 'unknown'
    rows.push([
      'Location',
      `${coord(s.latitudeDeg, 'N', 'S')}, ${coord(s.longitudeDeg, 'E', 'W')}, elevation ${elev}`,
    ])
  }
  if (s.fileName || s.source)
    rows.push(['Data', [s.source, s.fileName ? `file ${s.fileName}` : null].filter(Boolean).join(', ')])
  const p = a.period
  if (p) {
    const years = p.years ?? []
    const span = p.start && p.end ? `${p.start.slice(0, 10)} to ${p.end.slice(0, 10)}` : ''
    rows.push([
      'Period',
      p.typicalYear
        ? `typical year${span ? ` (${span})` : ''}`
        : `${span}${years.length ? `, ${years.length} year${years.length === 1 ? '' : 's'}` : ''}`,
    ])
  }
  const c = a.coverage
  if (c && finite(c.fraction)) {
    rows.push([
      'Coverage',
      `${formatNumber(c.fraction * 100, 1)} % of hours usable for the assessment${finite(c.hoursTotal) ? ` (${formatNumber(c.hoursUsable ?? null)} of ${formatNumber(c.hoursTotal)} h)` : ''}`,
    ])
  }
  const t = a.product.targetMoistureWbPct
  const i = a.product.initialMoistureWbPct
  rows.push(['Product', `${a.product.name} (${a.product.id})`])
  rows.push([
    'Moisture',
    `${finite(i) ? `from ${formatNumber(i, 1)} % ` : ''}${finite(t) ? `to ${formatNumber(t, 1)} %` : ''} wet basis`,
  ])
  rows.push(['Method', methodName(a.method.kind)])
  if (a.season?.start && a.season.end)
    rows.push(['Season', `start days ${a.season.start} to ${a.season.end}`])
  if (finite(a.deadlineDays)) rows.push(['Deadline', `${a.deadlineDays} days per batch`])
  rows.push(['Units', u.system === 'us' ? 'US customary (°F, lb, gal)' : 'SI'])
  return rows
}

export function headerHtml(a: AssessmentView, ctx: SectionContext): string {
  const rows = headerRows(a, ctx)
    .map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`)
    .join('')
  return `<header class="report-header" data-section="header"><p class="kicker">dryhours seasonal drying summary</p><h1>Can ${escapeHtml(a.site.name)} dry ${escapeHtml(a.product.name)}?</h1><dl class="facts">${rows}</dl></header>`
}

/** The answer in plain sentences, most important first. */
export function answerSentences(a: AssessmentView, ctx: SectionContext): string[] {
  const out: string[] = []
  const u = ctx.units
  const method = methodName(a.method.kind)
  const suit = suitableMonths(a)
  const typical = a.period?.typicalYear === true
  if (a.monthly.length > 0) {
    out.push(
      suit.length > 0
        ? `${typical ? 'In this typical year' : 'In 9 of 10 years'}, ${monthList(suit)} give${suit.length === 1 ? 's' : ''} at least ${SUITABLE_MONTH_P10_HOURS} usable drying hours for ${a.product.name} by ${method}.`
        : `No month gives ${SUITABLE_MONTH_P10_HOURS} usable drying hours ${typical ? 'in this typical year' : 'in 9 of 10 years'} for ${a.product.name} by ${method}.`,
    )
  }
  const w = bestStartWindow(a)
  const target = a.product.targetMoistureWbPct
  if (w) {
    const pct = finite(w.probability)
      ? `${Math.round(w.probability * 100)} % of years finish within ${finite(a.deadlineDays) ? `${a.deadlineDays} days` : 'the deadline'}`
      : ''
    out.push(
      `The best start window is ${w.start} to ${w.end}: batches reach ${finite(target) ? `${formatNumber(target, 1)} %` : 'the target'} in about ${formatNumber(w.medianDays, 1)} days in a median year and within ${formatNumber(w.p90Days, 1)} days in 9 of 10 years${pct ? `; ${pct}` : ''}.`,
    )
  } else if (a.startDates.length > 0) {
    out.push('No start date in the season reaches the target in the median year.')
  }
  const heat = asSpread(a.supplementalHeat?.kwhPerTonne)
  if (heat && finite(heat.median)) {
    const fuel = fuelsOf(a)[0]
    const cost = fuel ? asSpread(fuel.costPerTonne)?.median : null
    const perMass = u.system === 'us' ? 0.90718474 : 1
    out.push(
      `To finish by the deadline, a heated dryer needs about ${formatNumber(u.energyPerMass(heat.median).value)} ${u.energyPerMassUnit} of supplemental heat in a median year (P90 ${formatNumber(finite(heat.p90) ? u.energyPerMass(heat.p90).value : null)} ${u.energyPerMassUnit})` +
        (fuel && finite(cost)
          ? `, about ${formatNumber(cost * perMass, 0)} per ${u.system === 'us' ? 'ton' : 'tonne'} in ${fuel.name}${fuel.examplePrice === false ? '' : ' at the example price'}`
          : '') +
        '.',
    )
  }
  if (a.method.kind === 'open-air' || a.method.kind === 'shade') {
    out.push(
      'A solar cabinet heats the air before it reaches the product, which lowers its relative humidity: assess the same file with the solar-cabinet method to see how many hours and days it gains.',
    )
  }
  return out
}

export function answerHtml(a: AssessmentView, ctx: SectionContext): string {
  const items = answerSentences(a, ctx)
    .map((s) => `<li>${escapeHtml(s)}</li>`)
    .join('')
  const warnings = a.warnings.length
    ? `<div class="warnings" role="note"><h3>Warnings</h3><ul>${a.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>`
    : ''
  return `<section class="report-section answer" id="${ctx.idPrefix}sec-answer" data-section="answer"><h2>The answer</h2><ul class="sentences">${items}</ul>${warnings}</section>`
}
