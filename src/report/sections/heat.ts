/**
 * @module report/sections/heat
 * Supplemental heat and fuel by start month: bars of the median heat per tonne with the spread, the
 * monthly heat table, and the fuel table (quantity and cost per tonne, in the display units).
 */
import type { AssessmentView, FuelView } from '../assessment-view.ts'
import { spreadBarsChart } from '../charts/spread-bars.ts'
import { MONTH_LONG, MONTH_SHORT } from '../charts/svg.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { HIGH_CONTRAST } from '../palette.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { asSpread, convertSpread, finite, round, type SectionContext } from './context.ts'

export function heatTable(a: AssessmentView, ctx: SectionContext): ReportTable | null {
  const u = ctx.units
  if (
    !a.monthly.some(
      (m) =>
        asSpread(m.supplementalHeatKwhPerTonne)?.median !== undefined &&
        asSpread(m.supplementalHeatKwhPerTonne) !== null,
    )
  )
    return null
  return {
    id: 'supplemental-heat-by-month',
    title: `Supplemental heat for batches started in each month [${u.energyPerMassUnit} of fresh product]`,
    columns: [
      'month',
      `median [${u.energyPerMassUnit}]`,
      `P10 [${u.energyPerMassUnit}]`,
      `P90 [${u.energyPerMassUnit}]`,
    ],
    rows: a.monthly.map((m) => {
      const s = convertSpread(asSpread(m.supplementalHeatKwhPerTonne), (v) => u.energyPerMass(v).value)
      return [MONTH_LONG[m.month - 1] ?? String(m.month), round(s?.median), round(s?.p10), round(s?.p90)]
    }),
    digits: [0, 0, 0, 0],
  }
}

export function fuelsOf(a: AssessmentView): FuelView[] {
  const h = a.supplementalHeat
  if (!h) return []
  return [...(h.fuels ?? []), ...(h.fuel ? [h.fuel] : [])]
}

export function fuelTable(a: AssessmentView, ctx: SectionContext): ReportTable | null {
  const fuels = fuelsOf(a)
  if (fuels.length === 0) return null
  const u = ctx.units
  return {
    id: 'fuel-per-tonne',
    title: `Fuel for the supplemental heat, per ${u.system === 'us' ? 'short ton' : 'tonne'} of fresh product (median year)`,
    columns: ['fuel', 'quantity', 'unit', 'price per unit', 'cost', 'price is'],
    digits: [0, 1, 0, 2, 0, 0],
    rows: fuels.map((f) => {
      const perMass = u.system === 'us' ? 907.18474 / 1000 : 1
      const q = asSpread(f.quantityPerTonne)?.median
      const qty = finite(q)
        ? u.fuel(q * perMass, f.unit)
        : { value: Number.NaN, unit: u.fuel(1, f.unit).unit }
      const price = finite(f.pricePerUnit) ? u.pricePerFuelUnit(f.pricePerUnit, f.unit).value : null
      const cost = asSpread(f.costPerTonne)?.median
      return [
        f.name,
        finite(qty.value) ? round(qty.value, 1) : null,
        qty.unit,
        finite(price) ? round(price, 3) : null,
        finite(cost) ? round(cost * perMass, 1) : null,
        f.examplePrice === false ? 'yours' : 'an example, not market data',
      ]
    }),
  }
}

export function heatAlt(a: AssessmentView, ctx: SectionContext): string {
  const u = ctx.units
  const rows = a.monthly
    .map((m) => ({ m: m.month, s: asSpread(m.supplementalHeatKwhPerTonne) }))
    .filter((r) => r.s && finite(r.s.median))
  if (rows.length === 0) return 'No supplemental heat was computed.'
  const min = rows.reduce((x, y) => ((y.s?.median as number) < (x.s?.median as number) ? y : x))
  const max = rows.reduce((x, y) => ((y.s?.median as number) > (x.s?.median as number) ? y : x))
  return (
    `Bars show the median supplemental heat per ${u.system === 'us' ? 'short ton' : 'tonne'} of fresh product for batches started in each month, whiskers P10 to P90. ` +
    `Least in ${MONTH_LONG[min.m - 1]} (${formatNumber(u.energyPerMass(min.s?.median as number).value)} ${u.energyPerMassUnit}), most in ${MONTH_LONG[max.m - 1]} (${formatNumber(u.energyPerMass(max.s?.median as number).value)} ${u.energyPerMassUnit}).`
  )
}

export function heatSection(a: AssessmentView, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-heat" data-section="heat"><h2>Supplemental heat and fuel</h2>`
  const table = heatTable(a, ctx)
  const fuel = fuelTable(a, ctx)
  if (!table) {
    return `${head}<p class="missing">No supplemental heat was computed for this method and season.</p>${fuel ? tableHtml(fuel) : ''}</section>`
  }
  const u = ctx.units
  const id = `${ctx.idPrefix}fig-heat`
  const alt = heatAlt(a, ctx)
  const svg = spreadBarsChart({
    id: `${id}-svg`,
    title: `Supplemental heat by start month, ${a.site.name}`,
    description: alt,
    bars: a.monthly.map((m) => {
      const s = convertSpread(asSpread(m.supplementalHeatKwhPerTonne), (v) => u.energyPerMass(v).value)
      return {
        key: String(m.month),
        label: MONTH_SHORT[m.month - 1] ?? String(m.month),
        median: round(s?.median),
        p10: round(s?.p10),
        p90: round(s?.p90),
      }
    }),
    yLabel: `heat per ${u.system === 'us' ? 'ton' : 'tonne'} [${u.energyPerMassUnit}]`,
    unit: u.energyPerMassUnit,
    colour: HIGH_CONTRAST.red,
  })
  return `${head}${figureHtml({
    id,
    number: ctx.nextFigure(),
    caption: 'Supplemental heat to reach the target by the deadline, by start month',
    svg,
    alt,
    table,
  })}${fuel ? `<div class="fuel">${tableHtml(fuel)}<p class="note">${escapeHtml('Prices marked as examples are placeholders in no particular currency; enter your own prices for a cost you can use.')}</p></div>` : ''}</section>`
}
