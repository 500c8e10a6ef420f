/**
 * @module report/sections/spoilage
 * Will it spoil before it is dry? The spoilage model of the assessment (its source, its limit), the share
 * of years in which a batch spoiled before it was dry by start date (a chart and its table), the season's
 * figures and the cautions that go with them. Nothing here is computed: the numbers are the assessment's
 * `spoilage` and `startDates[].spoilage`.
 */
import type { Assessment } from '../assessment-view.ts'
import { riskBarsChart } from '../charts/risk-bars.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import type { ReportTable } from '../tables.ts'
import { finite, round, type SectionContext } from './context.ts'

/** Percent of a share, rounded to a whole number ("–" when unknown). */
export function percentText(p: number | null | undefined): string {
  return finite(p) ? `${Math.round(100 * p)} %` : '–'
}

/**
 * "7 of 10 years" from a share (rounded to tenths), the way growers say it; a share above 0 that rounds to
 * none reads "fewer than 1 in 10 years", one below 1 that rounds to all "more than 9 of 10 years".
 */
export function inTenYears(p: number): string {
  const k = Math.round(10 * p)
  if (k === 0 && p > 0) return 'fewer than 1 in 10 years'
  if (k === 10 && p < 1) return 'more than 9 of 10 years'
  return `${k} of 10 years`
}

/** The model's limit in words, e.g. "0.5 % dry-matter loss" or "the whole mould-free time". */
export function limitText(s: NonNullable<Assessment['spoilage']>): string {
  const m = s.model
  if (m.measureUnit === '') return `${m.measureName} reaching ${formatNumber(m.limit, 2)}`
  return `${formatNumber(m.limit, 2)} ${m.measureUnit} ${m.measureName}`
}

export function spoilageTable(a: Assessment): ReportTable {
  return {
    id: 'spoilage-by-start-date',
    title: 'Spoilage before the product is dry, by start date',
    columns: [
      'start (MM-DD)',
      'batches (years)',
      'spoiled before dry',
      'spoiled before dry [%]',
      'hours at risk, median [h]',
      'hours at risk, P90 [h]',
      'share of the limit used, median',
      'share of the limit used, P90',
    ],
    digits: [0, 0, 0, 0, 0, 0, 2, 2],
    rows: a.startDates.map((s) => [
      s.start,
      s.spoilage?.batches ?? null,
      s.spoilage?.batchesSpoiledBeforeDry ?? null,
      finite(s.spoilage?.probability) ? round(100 * (s.spoilage?.probability as number), 1) : null,
      s.spoilage?.hoursAtRisk.median ?? null,
      s.spoilage?.hoursAtRisk.p90 ?? null,
      s.spoilage?.shareOfLimitUsed.median ?? null,
      s.spoilage?.shareOfLimitUsed.p90 ?? null,
    ]),
  }
}

/** The figure's text alternative: where the risk is high and where it is low. */
export function spoilageAlt(a: Assessment): string {
  const rows = a.startDates.filter((s) => finite(s.spoilage?.probability))
  if (rows.length === 0) return 'No start date had a complete batch, so no spoilage risk was computed.'
  const high = rows.filter((s) => (s.spoilage?.probability as number) >= 0.5)
  const none = rows.filter((s) => s.spoilage?.probability === 0)
  const worst = rows.reduce((x, y) =>
    (y.spoilage?.probability as number) > (x.spoilage?.probability as number) ? y : x,
  )
  return (
    `Bars show, for each start date from ${rows[0].start} to ${rows[rows.length - 1].start}, the share of years in which the batch spoiled before it was dry. ` +
    `${high.length} of ${rows.length} start dates spoil first in half of the years or more; ${none.length} never did in the years of the file. ` +
    `Highest: ${worst.start}, ${percentText(worst.spoilage?.probability)} of years.`
  )
}

export function spoilageSection(a: Assessment, ctx: SectionContext): string {
  const s = a.spoilage
  if (!s) return ''
  const head = `<section class="report-section spoilage" id="${ctx.idPrefix}sec-spoilage" data-section="spoilage"><h2>Will it spoil before it is dry?</h2>`
  const season = s.season
  const intro = `<p>Model: <strong>${escapeHtml(s.model.name)}</strong> (${escapeHtml(s.model.source.citation)}; confidence ${escapeHtml(s.model.source.confidence)}). A batch counts as spoiled at ${escapeHtml(limitText(s))} (${escapeHtml(s.model.limitSource)}); hours at risk: ${escapeHtml(s.model.atRiskWhen)}. Over the season's start dates, ${escapeHtml(percentText(season.probability))} of batches (${season.batchesSpoiledBeforeDry} of ${season.batches}) spoiled before they were dry.</p>`
  const cautions = `<ul class="spoilage-cautions">${s.cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`
  if (a.startDates.length === 0) return `${head}${intro}${cautions}</section>`
  const id = `${ctx.idPrefix}fig-spoilage`
  const alt = spoilageAlt(a)
  const svg = riskBarsChart({
    id: `${id}-svg`,
    title: `Spoilage before dry by start date, ${ctx.siteName}`,
    description: alt,
    points: a.startDates.map((r) => ({
      x: r.start,
      probability: r.spoilage?.probability ?? null,
      hoursAtRisk: r.spoilage?.hoursAtRisk.median ?? null,
    })),
    xLabel: 'start date (MM-DD)',
  })
  return `${head}${intro}${figureHtml({
    id,
    number: ctx.nextFigure(),
    caption: 'Share of years in which a batch spoils before it is dry, by start date',
    svg,
    alt,
    table: spoilageTable(a),
    note: `How the model is stepped: ${s.rule} Water activity fed to the model: ${s.model.waterActivity.rule} (${s.model.waterActivity.source}).`,
  })}${cautions}</section>`
}
