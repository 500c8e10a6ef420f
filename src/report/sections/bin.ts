/**
 * @module report/sections/bin
 * Natural-air bin drying (`assessment.bin`): the minimum airflow per start month, the top layer's dry-matter loss
 * and the days until it is dry per start date and airflow (one line per airflow, the limit drawn), the fan at each
 * airflow, and the answer's sentences. US customary display: cfm per bushel, bushels, inches of water, feet.
 */
import type { BinAssessment, BinStartAirflow } from '../../analysis/assessment-bin.ts'
import type { Assessment } from '../assessment-view.ts'
import { multiLineChart } from '../charts/multi-line.ts'
import { MONTH_LONG } from '../charts/svg.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { finite, perMassWords, round, type SectionContext } from './context.ts'

const FOOT_M = 0.3048

/** An airflow in the display units: m³/min per t, or cfm per bushel in US units. */
export function airflowWords(ctx: SectionContext, si: number | null, cfm: number | null): string {
  if (si === null || cfm === null) return '–'
  return ctx.units.system === 'us'
    ? `${formatNumber(cfm, 2)} cfm/bu (${formatNumber(si, 2)} m³/min per t)`
    : `${formatNumber(si, 2)} m³/min per t (${formatNumber(cfm, 2)} cfm/bu)`
}

function airflowLabel(
  ctx: SectionContext,
  s: { airflowM3PerMinPerTonne: number; airflowCfmPerBushel: number },
) {
  return ctx.units.system === 'us'
    ? `${formatNumber(s.airflowCfmPerBushel, 2)} cfm/bu`
    : `${formatNumber(s.airflowM3PerMinPerTonne, 2)} m³/min per t`
}

function startDates(b: BinAssessment): string[] {
  return [...new Set(b.startDates.map((s) => s.startDate))]
}

function byAirflow(b: BinAssessment): BinStartAirflow[][] {
  return b.airflows.map((q) =>
    b.startDates.filter((s) => s.airflowM3PerMinPerTonne === q.airflowM3PerMinPerTonne),
  )
}

/** One chart series per airflow: `value` of each start date (null where there is no row). */
function airflowSeries(
  b: BinAssessment,
  ctx: SectionContext,
  value: (s: BinStartAirflow) => number | null,
): { name: string; values: (number | null)[] }[] {
  const dates = startDates(b)
  return byAirflow(b).map((g, i) => ({
    name: airflowLabel(ctx, b.airflows[i]),
    values: dates.map((d) => {
      const row = g.find((s) => s.startDate === d)
      return row ? value(row) : null
    }),
  }))
}

function energy(ctx: SectionContext, kwhPerTonne: number | null): number | null {
  return finite(kwhPerTonne) ? round(ctx.units.energyPerMass(kwhPerTonne).value, 1) : null
}

export function binMinimumAirflowTable(b: BinAssessment, ctx: SectionContext): ReportTable {
  const us = ctx.units.system === 'us'
  return {
    id: 'bin-minimum-airflow',
    title: `Smallest airflow that keeps the top layer safe in ${b.typicalYear ? 'the typical year' : `${Math.round(b.requiredShareOfYears * 10)} of 10 years`}, per start month`,
    columns: [
      'start month',
      'start dates',
      us ? 'minimum airflow [cfm/bu]' : 'minimum airflow [m³/min per t]',
      us ? 'minimum airflow [m³/min per t]' : 'minimum airflow [cfm/bu]',
      'share of years safe at it [%]',
      'years',
    ],
    digits: [0, 0, 2, 2, 0, 0],
    rows: b.minimumAirflowByMonth.map((m) => [
      MONTH_LONG[m.month - 1],
      m.startDates.join(' '),
      us ? m.minimumAirflowCfmPerBushel : m.minimumAirflowM3PerMinPerTonne,
      us ? m.minimumAirflowM3PerMinPerTonne : m.minimumAirflowCfmPerBushel,
      round(100 * m.shareOfYearsSafe, 0),
      m.years,
    ]),
  }
}

export function binStartDatesTable(b: BinAssessment, ctx: SectionContext): ReportTable {
  const us = ctx.units.system === 'us'
  const eu = ctx.units.energyPerMassUnit
  return {
    id: 'bin-start-dates',
    title: 'Bin runs by start date and airflow, across years',
    columns: [
      'start (MM-DD)',
      us ? 'airflow [cfm/bu]' : 'airflow [m³/min per t]',
      'years',
      'days until the top layer is dry, median',
      'days until the top layer is dry, P90',
      'top-layer dry-matter loss, median [%]',
      'top-layer dry-matter loss, P90 [%]',
      `P90 below the ${b.spoilage.dryMatterLossLimitPct} % limit`,
      'years safe',
      `fan energy, median [${eu}]`,
      `heater energy, median [${eu}]`,
    ],
    digits: [0, 2, 0, 1, 1, 2, 2, 0, 0, 1, 1],
    rows: b.startDates.map((s) => [
      s.startDate,
      us ? s.airflowCfmPerBushel : s.airflowM3PerMinPerTonne,
      s.years,
      s.daysUntilTopLayerDry.median,
      s.daysUntilTopLayerDry.p90,
      s.topLayerDryMatterLossPct.median,
      s.topLayerDryMatterLossPct.p90,
      s.passesDryMatterLossLimitP90 ? 'yes' : 'no',
      s.yearsSafe,
      energy(ctx, s.fanEnergyKwhPerTonne.median),
      energy(ctx, s.heaterEnergyKwhPerTonne.median),
    ]),
  }
}

export function binFanTable(b: BinAssessment, ctx: SectionContext): ReportTable {
  const us = ctx.units.system === 'us'
  const perMass = ctx.units.energyPerMass(1).value // kWh per t → per display mass unit
  return {
    id: 'bin-fans',
    title: 'The fan at each airflow (static pressure from ASAE D272, packed bin)',
    columns: [
      us ? 'airflow [cfm/bu]' : 'airflow [m³/min per t]',
      us ? 'air through the bin [cfm]' : 'air through the bin [m³/min]',
      us ? 'static pressure [in. w.c.]' : 'static pressure [Pa]',
      'fan power [kW]',
      `fan power [kW ${perMassWords(ctx)}]`,
    ],
    digits: [2, 0, us ? 2 : 0, 1, 3],
    rows: b.airflows.map((q) => [
      us ? q.airflowCfmPerBushel : q.airflowM3PerMinPerTonne,
      us ? round(q.airflowM3PerMin / 0.028316846592, 0) : q.airflowM3PerMin,
      us ? q.staticPressureInchesWater : q.staticPressurePa,
      q.fanPowerKw,
      round(q.fanPowerKwPerTonne * perMass, 4),
    ]),
  }
}

function daysTable(b: BinAssessment, ctx: SectionContext): ReportTable {
  const groups = byAirflow(b)
  return {
    id: 'bin-days-until-top-dry',
    title: `Days until the top layer is dry, median across years (– = not within ${b.seasonDays} days)`,
    columns: ['start (MM-DD)', ...b.airflows.map((q) => airflowLabel(ctx, q))],
    digits: [0, ...b.airflows.map(() => 1)],
    rows: startDates(b).map((d) => [
      d,
      ...groups.map((g) => g.find((s) => s.startDate === d)?.daysUntilTopLayerDry.median ?? null),
    ]),
  }
}

/** The sentences of the answer for a bin. */
export function binAnswerSentences(a: Assessment, b: BinAssessment, ctx: SectionContext): string[] {
  const out: string[] = []
  const target = `${formatNumber(a.product.targetMoistureWbPct, 1)} %`
  const limit = `${formatNumber(b.spoilage.dryMatterLossLimitPct, 1)} %`
  const often = b.typicalYear
    ? 'in this typical year'
    : `in ${Math.round(b.requiredShareOfYears * 10)} of 10 years`
  const size =
    ctx.units.system === 'us'
      ? `${formatNumber(b.bin.bushels)} bu, ${formatNumber(b.bin.depthM / FOOT_M, 0)} ft deep`
      : `${formatNumber(b.bin.grainTonnes)} t, ${formatNumber(b.bin.depthM, 1)} m deep`
  for (const m of b.minimumAirflowByMonth) {
    const month = MONTH_LONG[m.month - 1]
    if (m.minimumAirflowM3PerMinPerTonne === null) {
      const top = b.airflows[b.airflows.length - 1]
      out.push(
        `Grain of ${formatNumber(a.product.initialMoistureWbPct, 1)} % put in the bin (${size}) in ${month}: none of the airflows compared, up to ${airflowWords(ctx, top.airflowM3PerMinPerTonne, top.airflowCfmPerBushel)}, gets the top layer to ${target} with its dry-matter loss below ${limit} ${often}; at the largest, ${formatNumber(100 * m.shareOfYearsSafe, 0)} % of years are safe.`,
      )
      continue
    }
    const rows = b.startDates.filter(
      (s) => s.month === m.month && s.airflowM3PerMinPerTonne === m.minimumAirflowM3PerMinPerTonne,
    )
    const days = rows.map((s) => s.daysUntilTopLayerDry.median).filter(finite)
    const fan = rows.map((s) => s.fanEnergyKwhPerTonne.median).filter(finite)
    const e = ctx.units.energyPerMass(fan.length ? Math.max(...fan) : Number.NaN)
    out.push(
      `Grain of ${formatNumber(a.product.initialMoistureWbPct, 1)} % put in the bin (${size}) in ${month} needs at least ${airflowWords(ctx, m.minimumAirflowM3PerMinPerTonne, m.minimumAirflowCfmPerBushel)}: the top layer then reaches ${target} with its dry-matter loss below ${limit} ${often}` +
        (days.length
          ? `, after ${formatNumber(Math.min(...days), 0)}–${formatNumber(Math.max(...days), 0)} days in the median year`
          : '') +
        (fan.length ? `, using up to ${formatNumber(e.value, 0)} ${e.unit} of fan electricity.` : '.'),
    )
  }
  out.push(
    'More air dries the top layer sooner and keeps it safer, but the fan power rises much faster than the airflow (static pressure grows with it); a deeper bin needs more of both.',
  )
  return out
}

/** The bin's part of the two-page handout: the smallest airflow per start month and the fan at each airflow. */
export function binHandoutSection(a: Assessment, ctx: SectionContext): string {
  const b = a.bin
  if (!b) return ''
  const tables = [binMinimumAirflowTable(b, ctx), binFanTable(b, ctx)]
    .map((t) => `<div class="table-wrap">${tableHtml(t)}</div>`)
    .join('')
  return `<section class="report-section" id="${ctx.idPrefix}sec-bin-handout" data-section="bin-airflow"><h2>Airflow for each start month</h2>${tables}</section>`
}

/** The full bin section of the appendix: its tables, the two charts by start date and airflow, the model's limits. */
export function binSection(a: Assessment, ctx: SectionContext): string {
  const b = a.bin
  if (!b) return ''
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-bin" data-section="bin"><h2>Natural-air bin drying</h2>`
  const us = ctx.units.system === 'us'
  const intro = `<p>${escapeHtml(
    `${us ? `${formatNumber(b.bin.depthM / FOOT_M, 1)} ft` : `${formatNumber(b.bin.depthM, 1)} m`} of ${a.product.name} on ${us ? `${formatNumber(b.bin.floorAreaM2 / (FOOT_M * FOOT_M), 0)} ft²` : `${formatNumber(b.bin.floorAreaM2, 1)} m²`} (${formatNumber(b.bin.grainTonnes)} t, ${formatNumber(b.bin.bushels)} bu); ${b.bin.fanControl}; ${b.bin.heatRiseK > 0 ? `a heater adds ${formatNumber(b.bin.heatRiseK, 1)} K` : 'no heater'}. Rule: ${b.rule}.`,
  )}</p>`
  const dates = startDates(b)
  const groups = byAirflow(b)
  const limit = b.spoilage.dryMatterLossLimitPct
  const dmlAlt = `One line per airflow: the top layer's dry-matter loss in the worst year of ten (P90 across years) for grain put in the bin on each start date, with the ${limit} % limit. ${groups
    .map((g, i) => {
      const worst = g.map((s) => s.topLayerDryMatterLossPct.p90).filter(finite)
      return `${airflowLabel(ctx, b.airflows[i])}: ${worst.length ? `${formatNumber(Math.min(...worst), 2)} to ${formatNumber(Math.max(...worst), 2)} %` : 'no runs'}`
    })
    .join('; ')}.`
  const dmlId = `${ctx.idPrefix}fig-bin-dml`
  const dmlFigure = figureHtml({
    id: dmlId,
    number: ctx.nextFigure(),
    caption: 'Top-layer dry-matter loss by start date and airflow (P90 across years) against the limit',
    svg: multiLineChart({
      id: `${dmlId}-svg`,
      title: `Top-layer dry-matter loss by start date, ${ctx.siteName}`,
      description: dmlAlt,
      x: dates,
      series: airflowSeries(b, ctx, (s) => s.topLayerDryMatterLossPct.p90),
      yLabel: 'dry-matter loss [%]',
      xLabel: 'start date (MM-DD)',
      unit: '%',
      digits: 2,
      reference: { value: limit, label: `limit ${limit} %` },
      nullLabel: 'no runs',
    }),
    alt: dmlAlt,
    table: binStartDatesTable(b, ctx),
    note: 'The top layer dries last: it waits, wet and warm, for the drying front. Years in which it was not dry by the end of the season count as not safe even below the limit.',
  })
  const days = daysTable(b, ctx)
  const neverDry = days.rows.filter((r) => r.slice(1).every((v) => v === null)).length
  const daysAlt = `One line per airflow: the median number of days until the top layer reaches ${a.product.targetMoistureWbPct} % for grain put in the bin on each start date; a chevron on the top edge means not within ${b.seasonDays} days in the median year.${neverDry > 0 ? ` ${neverDry} of ${days.rows.length} start dates are not dry within the season at any airflow.` : ''}`
  const daysId = `${ctx.idPrefix}fig-bin-days`
  const daysFigure = figureHtml({
    id: daysId,
    number: ctx.nextFigure(),
    caption: 'Days until the top layer is dry, by start date and airflow (median across years)',
    svg: multiLineChart({
      id: `${daysId}-svg`,
      title: `Days until the top layer is dry, ${ctx.siteName}`,
      description: daysAlt,
      x: dates,
      series: airflowSeries(b, ctx, (s) => s.daysUntilTopLayerDry.median),
      yLabel: 'days',
      xLabel: 'start date (MM-DD)',
      unit: 'days',
      digits: 1,
      reference: { value: b.seasonDays, label: `season ${b.seasonDays} days` },
      nullLabel: `not dry within ${b.seasonDays} days`,
    }),
    alt: daysAlt,
    table: days,
  })
  const tables = [binMinimumAirflowTable(b, ctx), binFanTable(b, ctx)]
    .map((t) => `<div class="table-wrap">${tableHtml(t)}</div>`)
    .join('')
  const limits = `<h3>Limits of the bin model</h3><ul>${b.model.limits.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>`
  return `${head}${intro}${tables}${dmlFigure}${daysFigure}${limits}</section>`
}
