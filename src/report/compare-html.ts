/**
 * @module report/compare-html
 * Several sites side by side for one product and method: the ranking by its stated criterion, the season
 * calendar with one row per site, grouped bars (usable hours and supplemental heat by month) with their
 * tables, then a short summary of each site (its facts, its answer, a thinned start-date table) and the
 * cautions once. Each site's full report is its own document (`assess`); the comparison stays a few pages
 * (three sites: at most 8 A4 pages, checked by the browser tests). The ranking is the analysis one
 * (analysis/compare.ts); nothing is computed here.
 */
import type { Comparison } from '../analysis/compare.ts'
import type { Assessment } from './assessment-view.ts'
import { siteDisplayName } from './assessment-view.ts'
import { groupedBarsChart } from './charts/grouped-bars.ts'
import { MONTH_SHORT } from './charts/svg.ts'
import { formatNumber, type UnitSystem, unitFormatter } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import { figureHtml } from './figure.ts'
import { htmlDocument, type ReportOptions, sectionContext } from './report-html.ts'
import { calendarBlock } from './sections/calendar.ts'
import { cautionsHtml } from './sections/cautions.ts'
import { finite, round } from './sections/context.ts'
import { handoutStartTable } from './sections/start-dates.ts'
import {
  answerSentences,
  headerRows,
  methodName,
  productMemoryLine,
  warningList,
} from './sections/summary.ts'
import type { ReportTable } from './tables.ts'
import { tableHtml } from './tables.ts'

export interface ComparedSite {
  assessment: Assessment
  /** Per-site report options (file name, data source). */
  options?: Omit<ReportOptions, 'units' | 'paper' | 'idPrefix'>
}

/** The analysis ranking (`compare()` of analysis/), when the sites were compared there. */
export type Ranking = Pick<Comparison, 'criterionDescription' | 'sites'> &
  Partial<Pick<Comparison, 'tieBreak' | 'caveats'>>

export interface RankRow {
  name: string
  meanProbabilityWithinDeadline: number | null
  bestWindow: string | null
  usableHoursSeasonP10: number | null
  medianHeatKwhPerTonne: number | null
  /** Share of the season's batches spoiled before dry (null when not known). */
  spoilageProbability: number | null
}

/** Rows in the rank order of the analysis ranking (analysis/compare.ts). */
export function rankRows(ranking: Ranking): { criterion: string; rows: RankRow[]; usableTitle: string } {
  return {
    criterion: ranking.criterionDescription,
    usableTitle: 'usable hours in the season, P10 across years [h]',
    rows: [...ranking.sites]
      .sort((x, y) => x.rank - y.rank)
      .map((r) => ({
        name: r.typicalYear ? `${r.site} (typical year)` : r.site,
        meanProbabilityWithinDeadline: r.meanProbabilityWithinDeadline,
        bestWindow: r.bestStartWindow,
        usableHoursSeasonP10: r.usableHoursInSeasonP10,
        medianHeatKwhPerTonne: r.medianHeatKwhPerTonne,
        spoilageProbability: r.spoilageProbability ?? null,
      })),
  }
}

export function comparisonTable(ranking: Ranking, units: 'si' | 'us' = 'si'): ReportTable {
  const u = unitFormatter(units)
  const { rows, usableTitle } = rankRows(ranking)
  return {
    id: 'site-comparison',
    title: 'Sites ranked',
    columns: [
      'rank',
      'site',
      'finishing within the deadline, mean over start days [%]',
      'best start window',
      usableTitle,
      `supplemental heat, median [${u.energyPerMassUnit}]`,
      'batches spoiled before dry [%]',
    ],
    digits: [0, 0, 0, 0, 0, 0, 0],
    rows: rows.map((r, i) => [
      String(i + 1),
      r.name,
      finite(r.meanProbabilityWithinDeadline) ? round(r.meanProbabilityWithinDeadline * 100, 1) : null,
      r.bestWindow ?? 'none',
      r.usableHoursSeasonP10,
      finite(r.medianHeatKwhPerTonne) ? round(u.energyPerMass(r.medianHeatKwhPerTonne).value, 1) : null,
      finite(r.spoilageProbability) ? round(r.spoilageProbability * 100, 1) : null,
    ]),
  }
}

function monthlyCompareTable(
  id: string,
  title: string,
  sites: ComparedSite[],
  names: string[],
  value: (a: Assessment, m: number) => number | null,
): ReportTable {
  return {
    id,
    title,
    columns: ['month', ...names],
    digits: [0, ...names.map(() => 1)],
    rows: MONTH_SHORT.map((label, m) => [label, ...sites.map((s) => value(s.assessment, m + 1))]),
  }
}

/** Start dates a site's summary shows at most in a comparison (every n-th above it, said under the table). */
export const COMPARISON_START_ROWS = 12

/** Facts of a site worth repeating in a comparison (the rest are the same for every site). */
const SITE_FACTS = new Set(['Location', 'Data', 'Period', 'Coverage', 'Clock'])

/** One site's short summary in a comparison: facts, answer, warnings, a thinned start-date table. */
function siteSummary(site: ComparedSite, index: number, o: ComparisonOptions): string {
  const a = site.assessment
  const ctx = sectionContext(a, {
    ...site.options,
    units: o.units,
    idPrefix: `s${index + 1}-`,
    optionSurface: o.optionSurface,
  })
  const facts = headerRows(a, ctx)
    .filter(([k]) => SITE_FACTS.has(k))
    .map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`)
    .join('')
  const answer = answerSentences(a, ctx)
    .filter((x) => !x.startsWith('A solar cabinet heats the air'))
    .map((x) => `<li>${escapeHtml(x)}</li>`)
    .join('')
  const warnings = warningList(a, ctx)
  return `<section class="report-section site-summary" id="s${index + 1}-sec-site" data-section="site" data-site="${index + 1}"><h2>${escapeHtml(`${index + 1}. ${ctx.siteName}`)}</h2><dl class="facts">${facts}</dl><ul class="sentences">${answer}</ul>${warnings.length ? `<div class="warnings" role="note"><h3>Warnings</h3><ul>${warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>` : ''}${handoutStartTable(a, ctx, COMPARISON_START_ROWS).replace('the appendix (“When to start a batch”)', 'the site’s own report')}</section>`
}

export interface ComparisonOptions extends Pick<ReportOptions, 'units' | 'paper' | 'optionSurface'> {
  /** The analysis ranking (analysis/compare.ts `compare` or `rankAssessments`). */
  ranking: Ranking
}

/** The answer: the first site, by what criterion, and a caution when the sites were not assessed alike. */
function rankingSentences(
  sites: ComparedSite[],
  ranked: ReturnType<typeof rankRows>,
  ranking: Ranking,
): string[] {
  const first = sites[0].assessment
  const best = ranked.rows[0]
  const sentences = [
    `${best.name} ranks first for ${first.product.name} by ${methodName(first)}` +
      (finite(best.meanProbabilityWithinDeadline)
        ? first.bin
          ? `: on average ${Math.round(best.meanProbabilityWithinDeadline * 100)} % of years dry the bin's top layer below the dry-matter loss limit within ${first.bin.seasonDays} days, across the season's start days and the airflows compared.`
          : `: on average ${Math.round(best.meanProbabilityWithinDeadline * 100)} % of years finish a batch within ${first.deadlineDays} days across the season's start days.`
        : '.'),
    `Ranking criterion: ${ranked.criterion}.`,
    ...(ranking.tieBreak ? [`Ties: ${ranking.tieBreak}.`] : []),
    ...(ranking.caveats ?? []).map((c) => `Caveat: ${c}.`),
  ]
  const differs = (key: (a: Assessment) => string) => new Set(sites.map((x) => key(x.assessment))).size > 1
  if (
    differs((a) => a.product.id) ||
    differs((a) => a.method.kind) ||
    differs((a) => `${a.season.start}/${a.season.end}/${a.deadlineDays}`)
  ) {
    sentences.push(
      'Caution: the sites were assessed for different products, methods, seasons or deadlines, so the ranking is not like for like.',
    )
  }
  return sentences
}

const CATEGORIES = MONTH_SHORT.map((label, i) => ({ key: String(i + 1), label }))
const monthOf = (a: Assessment, m: number) => a.monthly.find((r) => r.month === m)

/** Usable drying hours per month, sites side by side (median, P10–P90), with its table. */
function usableFigure(sites: ComparedSite[], names: string[], number: number): string {
  const usableAlt =
    `Median usable drying hours per month for ${names.length} sites (${names.join(', ')}); whiskers P10 to P90. ` +
    names
      .map((n, i) => {
        const best = sites[i].assessment.monthly.reduce((x, y) =>
          (y.usableHours.median ?? -1) > (x.usableHours.median ?? -1) ? y : x,
        )
        return `${n}: most in ${MONTH_SHORT[best.month - 1]} (${formatNumber(best.usableHours.median)} h)`
      })
      .join('; ') +
    '.'
  return figureHtml({
    id: 'cmp-fig-usable',
    number,
    caption: 'Usable drying hours per month, sites side by side (median, P10–P90)',
    svg: groupedBarsChart({
      id: 'cmp-fig-usable-svg',
      title: 'Usable drying hours per month by site',
      description: usableAlt,
      categories: CATEGORIES,
      series: sites.map((s, i) => ({
        name: names[i],
        values: CATEGORIES.map((c) => monthOf(s.assessment, Number(c.key))?.usableHours.median ?? null),
        low: CATEGORIES.map((c) => monthOf(s.assessment, Number(c.key))?.usableHours.p10 ?? null),
        high: CATEGORIES.map((c) => monthOf(s.assessment, Number(c.key))?.usableHours.p90 ?? null),
      })),
      yLabel: 'usable drying hours [h]',
      unit: 'h',
    }),
    alt: usableAlt,
    table: monthlyCompareTable(
      'compare-usable-hours',
      'Median usable drying hours per month by site [h]',
      sites,
      names,
      (a, m) => monthOf(a, m)?.usableHours.median ?? null,
    ),
  })
}

/** Supplemental heat by start month, sites side by side (median), with its table. */
function heatFigure(
  sites: ComparedSite[],
  names: string[],
  ranks: ReturnType<typeof rankRows>['rows'],
  units: UnitSystem,
  number: number,
): string {
  const u = unitFormatter(units)
  const heatAlt =
    `Median supplemental heat per ${units === 'us' ? 'short ton' : 'tonne'} for batches started in each month, by site. ` +
    ranks
      .map(
        (r) =>
          `${r.name}: median over the season ${formatNumber(finite(r.medianHeatKwhPerTonne) ? u.energyPerMass(r.medianHeatKwhPerTonne).value : null)} ${u.energyPerMassUnit}`,
      )
      .join('; ') +
    '.'
  const heatValue = (a: Assessment, m: number) => {
    const v = monthOf(a, m)?.supplementalHeatKwhPerTonne.median
    return finite(v) ? round(u.energyPerMass(v).value, 1) : null
  }
  return figureHtml({
    id: 'cmp-fig-heat',
    number,
    caption: 'Supplemental heat by start month, sites side by side (median)',
    svg: groupedBarsChart({
      id: 'cmp-fig-heat-svg',
      title: 'Supplemental heat by start month and site',
      description: heatAlt,
      categories: CATEGORIES,
      series: sites.map((s, i) => ({
        name: names[i],
        values: CATEGORIES.map((c) => heatValue(s.assessment, Number(c.key))),
      })),
      yLabel: `heat into the air [${u.energyPerMassUnit}]`,
      unit: u.energyPerMassUnit,
    }),
    alt: heatAlt,
    table: monthlyCompareTable(
      'compare-heat',
      `Median supplemental heat by start month and site [${u.energyPerMassUnit}]`,
      sites,
      names,
      heatValue,
    ),
  })
}

/** The season calendar: one row per site, in rank order (sites without start weeks, such as bins, left out). */
function comparisonCalendar(
  sites: ComparedSite[],
  names: string[],
  ranks: ReturnType<typeof rankRows>['rows'],
): string {
  const byName = new Map(sites.map((x, i) => [names[i], x]))
  const calendarRows = ranks
    .map((r) => ({ label: r.name, site: byName.get(r.name) }))
    .filter((r) => r.site?.assessment.seasonCalendar?.cells.length)
    .map((r) => ({ label: r.label, calendar: (r.site as ComparedSite).assessment.seasonCalendar }))
  return calendarRows.length
    ? `<section class="report-section" data-section="calendar"><h2>The season at a glance, site by site</h2>${calendarBlock(calendarRows, 'cmp-calendar')}</section>`
    : ''
}

export function renderComparisonArticle(sites: ComparedSite[], o: ComparisonOptions): string {
  if (sites.length === 0) throw new RangeError('a comparison needs at least one site')
  const units = o.units ?? 'si'
  const names = sites.map((s) => siteDisplayName(s.assessment, s.options?.info))
  const first = sites[0].assessment
  const ranked = rankRows(o.ranking)
  const sentences = rankingSentences(sites, ranked, o.ranking)
  const usable = usableFigure(sites, names, 1)
  const heat = heatFigure(sites, names, ranked.rows, units, 2)
  const perSite = sites.map((x, i) => siteSummary(x, i, o)).join('\n')
  return `<article class="dryhours-report comparison" data-report="comparison" data-units="${units}">
<header class="report-header" data-section="header"><p class="kicker">dryhours · sites side by side</p><h1>Where does ${escapeHtml(first.product.name)} dry best?</h1>
<dl class="facts"><div class="kv"><dt>Product</dt><dd>${escapeHtml(first.product.name)}</dd></div><div class="kv"><dt>Method</dt><dd>${escapeHtml(methodName(first))}</dd></div><div class="kv"><dt>Sites</dt><dd>${escapeHtml(names.join(', '))}</dd></div><div class="kv"><dt>Season</dt><dd>${escapeHtml(`${first.bin ? 'the bin filled on dates from' : 'batches start'} ${first.season.start} to ${first.season.end}`)}</dd></div><div class="kv"><dt>${first.bin ? 'Season in the bin' : 'Deadline'}</dt><dd>${first.bin ? `${first.bin.seasonDays} days for the top layer to dry` : `${first.deadlineDays} days`}</dd></div><div class="kv"><dt>Recalled figures</dt><dd>${escapeHtml(productMemoryLine(first.product))}</dd></div></dl></header>
<section class="report-section answer" data-section="ranking"><h2>The answer</h2><ul class="sentences">${sentences.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>${tableHtml(comparisonTable(o.ranking, units))}</section>
${comparisonCalendar(sites, names, ranked.rows)}
${perSite}
<section class="report-section" data-section="compare-monthly"><h2>Sites side by side, month by month</h2>${usable}${heat}</section>
${cautionsHtml(
  sites.flatMap((x) => [...(x.assessment.bin?.cautions ?? []), ...x.assessment.product.cautions]),
  'cmp-',
)}
<footer>Made by dryhours from the weather files and the options shown above. Each site's full report (charts, every start date, the assumptions) is its own document. Check the numbers against local experience before you build or buy.</footer>
</article>`
}

export function renderComparisonHtml(sites: ComparedSite[], o: ComparisonOptions): string {
  const names = sites.map((s) => siteDisplayName(s.assessment, s.options?.info))
  return htmlDocument(`Drying comparison: ${names.join(', ')}`, renderComparisonArticle(sites, o), o.paper)
}
