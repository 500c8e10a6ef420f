/**
 * @module report/sections/heat
 * Supplemental heat and fuel by start month: bars of the median heat per tonne with the spread, the
 * monthly heat table, and the fuel table (quantity and cost per tonne, in the display units).
 */
import type { FuelFigure } from '../../analysis/assessment.ts'
import type { Assessment } from '../assessment-view.ts'
import { spreadBarsChart } from '../charts/spread-bars.ts'
import { MONTH_LONG, MONTH_SHORT } from '../charts/svg.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { HIGH_CONTRAST } from '../palette.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import { convertSpread, finite, perMassFactor, perMassWords, round, type SectionContext } from './context.ts'

/** The fuel in words (the assessment's own name; the id for assessments without one). */
export function fuelName(f: FuelFigure): string {
  return f.name ?? f.fuel
}

export function heatTable(a: Assessment, ctx: SectionContext): ReportTable {
  const u = ctx.units
  const unit = u.energyPerMassUnit
  return {
    id: 'supplemental-heat-by-month',
    title: `Supplemental heat into the air for batches started on the 1st and 16th of each month [${unit} of fresh product]`,
    columns: ['month', `median [${unit}]`, `P10 [${unit}]`, `P90 [${unit}]`],
    rows: a.monthly.map((m) => {
      const s = convertSpread(m.supplementalHeatKwhPerTonne, (v) => u.energyPerMass(v).value)
      return [MONTH_LONG[m.month - 1] ?? String(m.month), round(s?.median), round(s?.p10), round(s?.p90)]
    }),
  }
}

/** Fuel quantity and cost per display mass unit (tonne or short ton) at the median heat. */
export function fuelRows(
  a: Assessment,
  ctx: SectionContext,
): { fuel: FuelFigure; quantity: number | null; unit: string; price: number; cost: number | null }[] {
  const u = ctx.units
  const f = perMassFactor(ctx)
  return a.heat.fuels.map((fuel) => {
    const q = finite(fuel.quantityPerTonne) ? u.fuel(fuel.quantityPerTonne * f, fuel.unit) : null
    return {
      fuel,
      quantity: q ? q.value : null,
      unit: q ? q.unit : u.fuel(1, fuel.unit).unit,
      price: u.pricePerFuelUnit(fuel.pricePerUnit, fuel.unit).value,
      cost: finite(fuel.costPerTonne) ? fuel.costPerTonne * f : null,
    }
  })
}

export function fuelTable(a: Assessment, ctx: SectionContext): ReportTable {
  return {
    id: 'fuel',
    title: `Fuel for the median supplemental heat, ${perMassWords(ctx)} of fresh product (heater efficiency ${Math.round(a.heat.heaterEfficiency * 100)} %)`,
    columns: ['fuel', 'quantity', 'unit', 'price per unit', 'cost', 'price is', 'heating value source'],
    digits: [0, 1, 0, 2, 1, 0, 0],
    rows: fuelRows(a, ctx).map((r) => [
      `${fuelName(r.fuel)}${r.fuel.fuel === a.heat.selectedFuel ? ' (selected)' : ''}`,
      round(r.quantity, 2),
      r.unit,
      round(r.price, 3),
      round(r.cost, 2),
      r.fuel.priceIsExample ? 'an example, not market data' : 'yours',
      r.fuel.heatingValueSource,
    ]),
  }
}

export function heatAlt(a: Assessment, ctx: SectionContext): string {
  const u = ctx.units
  const rows = a.monthly.filter((m) => finite(m.supplementalHeatKwhPerTonne.median))
  if (rows.length === 0) return 'No supplemental heat figure could be computed for any month.'
  const none = a.monthly.filter((m) => !finite(m.supplementalHeatKwhPerTonne.median))
  const min = rows.reduce((x, y) =>
    (y.supplementalHeatKwhPerTonne.median as number) < (x.supplementalHeatKwhPerTonne.median as number)
      ? y
      : x,
  )
  const max = rows.reduce((x, y) =>
    (y.supplementalHeatKwhPerTonne.median as number) > (x.supplementalHeatKwhPerTonne.median as number)
      ? y
      : x,
  )
  const v = (m: typeof min) =>
    formatNumber(u.energyPerMass(m.supplementalHeatKwhPerTonne.median as number).value)
  return (
    `Bars show the median heat a dryer must add to the air ${perMassWords(ctx)} of fresh product to finish by the ${a.deadlineDays}-day deadline, for batches started in each month; whiskers P10 to P90 across years. ` +
    `Least in ${MONTH_LONG[min.month - 1]} (${v(min)} ${u.energyPerMassUnit}), most in ${MONTH_LONG[max.month - 1]} (${v(max)} ${u.energyPerMassUnit}).` +
    (none.length
      ? ` No figure for ${none.map((m) => MONTH_LONG[m.month - 1]).join(', ')} (marked n/a): the assessment could not compute one, e.g. because the batch cannot reach the target in time even with heat.`
      : '')
  )
}

export function heatSection(a: Assessment, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-heat" data-section="heat"><h2>Supplemental heat and fuel</h2>`
  const u = ctx.units
  const id = `${ctx.idPrefix}fig-heat`
  const alt = heatAlt(a, ctx)
  const svg = spreadBarsChart({
    id: `${id}-svg`,
    title: `Supplemental heat by start month, ${ctx.siteName}`,
    description: alt,
    bars: a.monthly.map((m) => {
      const s = convertSpread(m.supplementalHeatKwhPerTonne, (v) => u.energyPerMass(v).value)
      return {
        key: String(m.month),
        label: MONTH_SHORT[m.month - 1] ?? String(m.month),
        median: round(s?.median),
        p10: round(s?.p10),
        p90: round(s?.p90),
      }
    }),
    yLabel: `heat into the air [${u.energyPerMassUnit}]`,
    unit: u.energyPerMassUnit,
    colour: HIGH_CONTRAST.red,
  })
  const cc = a.heat.crossCheck
  const check = `Cross-check: removing ${formatNumber(u.system === 'us' ? (cc.waterToRemoveKgPerTonne / 0.45359237) * perMassFactor(ctx) : cc.waterToRemoveKgPerTonne)} ${u.system === 'us' ? 'lb' : 'kg'} of water ${perMassWords(ctx)} at ${formatNumber(cc.heatOfEvaporationKjPerKg)} kJ/kg through a heater of ${Math.round(a.heat.heaterEfficiency * 100)} % efficiency takes at least ${formatNumber(u.energyPerMass(cc.evaporationHeatFuelKwhPerTonne).value)} ${u.energyPerMassUnit} of fuel heat when every hour is heated. ${cc.note}`
  return `${head}${figureHtml({
    id,
    number: ctx.nextFigure(),
    caption: 'Supplemental heat to reach the target by the deadline, by start month',
    svg,
    alt,
    table: heatTable(a, ctx),
  })}<div class="fuel">${tableHtml(fuelTable(a, ctx))}<p class="note">${escapeHtml('Prices marked as examples are placeholders in no particular currency; enter your own prices for a cost you can use.')}</p><p class="note">${escapeHtml(check)}</p></div></section>`
}
