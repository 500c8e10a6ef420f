/**
 * @module report/sections/heat
 * Supplemental heat and fuel by start month: bars of the median heat per tonne with the spread, the
 * monthly heat table, and the fuel table (quantity and cost per tonne, in the display units).
 */
import type { FuelFigure } from '../../analysis/assessment.ts'
import type { Assessment } from '../assessment-view.ts'
import { spreadBarsChart } from '../charts/spread-bars.ts'
import { MONTH_LONG, MONTH_SHORT } from '../charts/svg.ts'
import { formatNumber, formatPrice, KJ_PER_KG_PER_BTU_PER_LB } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { figureHtml } from '../figure.ts'
import { HIGH_CONTRAST } from '../palette.ts'
import { type ReportTable, tableHtml } from '../tables.ts'
import {
  convertSpread,
  currencyOf,
  finite,
  perMassFactor,
  perMassWords,
  round,
  type SectionContext,
} from './context.ts'

/** The fuel in words (the assessment's own name; the id for assessments without one). */
export function fuelName(f: FuelFigure): string {
  return f.name ?? f.fuel
}

/** The heated method's heat is all the heat the batch gets (there is no other source to supplement). */
export function heatIsAllTheHeat(a: Pick<Assessment, 'method'>): boolean {
  return a.method.kind === 'heated'
}

/** "Heat" for the heated method (all of it), "Supplemental heat" for the others. */
export function heatWord(a: Pick<Assessment, 'method'>): string {
  return heatIsAllTheHeat(a) ? 'Heat' : 'Supplemental heat'
}

export function heatTable(a: Assessment, ctx: SectionContext): ReportTable {
  const u = ctx.units
  const unit = u.energyPerMassUnit
  return {
    id: 'supplemental-heat-by-month',
    title: `${heatWord(a)} into the air for batches started on the 1st and 16th of each month [${unit} of fresh product]`,
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

/** What the prices and costs are in: the currency, or words saying there is none. */
export function priceUnitWords(a: Assessment): string {
  const c = currencyOf(a)
  if (c) return c
  return a.heat.fuels.every((f) => f.priceIsExample)
    ? 'example-price units, no currency'
    : "your prices' currency"
}

export function fuelTable(a: Assessment, ctx: SectionContext): ReportTable {
  const money = priceUnitWords(a)
  return {
    id: 'fuel',
    title: `Fuel for the median ${heatWord(a).toLowerCase()}, ${perMassWords(ctx)} of fresh product (heater efficiency ${Math.round(a.heat.heaterEfficiency * 100)} %; prices and costs in ${money})`,
    columns: [
      'fuel',
      'quantity',
      'unit',
      `price per unit [${money}]`,
      `cost [${money}]`,
      'price is',
      'heating value source',
    ],
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

/** The fuel table for reading (quantity with its unit, no source column: the sources follow as a note). */
export function fuelTableShort(a: Assessment, ctx: SectionContext): ReportTable {
  const money = priceUnitWords(a)
  return {
    id: 'fuel',
    title: `Fuel for the median ${heatWord(a).toLowerCase()}, ${perMassWords(ctx)} of fresh product (heater efficiency ${Math.round(a.heat.heaterEfficiency * 100)} %; prices and costs in ${money})`,
    columns: ['fuel', 'quantity', 'price per unit', 'cost', 'price is'],
    digits: [0, 0, 0, 1, 0],
    rows: fuelRows(a, ctx).map((r) => [
      `${fuelName(r.fuel)}${r.fuel.fuel === a.heat.selectedFuel ? ' (selected)' : ''}`,
      r.quantity === null ? '–' : `${formatNumber(r.quantity, 1)} ${r.unit}`,
      `${formatPrice(r.price)} per ${r.unit}`,
      round(r.cost, 1),
      r.fuel.priceIsExample ? 'an example' : 'yours',
    ]),
  }
}

export function heatAlt(a: Assessment, ctx: SectionContext): string {
  const u = ctx.units
  const rows = a.monthly.filter((m) => finite(m.supplementalHeatKwhPerTonne.median))
  if (rows.length === 0) return `No ${heatWord(a).toLowerCase()} figure could be computed for any month.`
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
  const heading = heatIsAllTheHeat(a)
    ? "Heat and fuel (the dryer's heater: all the heat)"
    : 'Supplemental heat and fuel (a backup heater for what the air does not do)'
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-heat" data-section="heat"><h2>${escapeHtml(heading)}</h2>`
  const u = ctx.units
  const id = `${ctx.idPrefix}fig-heat`
  const alt = heatAlt(a, ctx)
  const svg = spreadBarsChart({
    id: `${id}-svg`,
    title: `${heatWord(a)} by start month, ${ctx.siteName}`,
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
  const check = `Cross-check: removing ${formatNumber(u.system === 'us' ? (cc.waterToRemoveKgPerTonne / 0.45359237) * perMassFactor(ctx) : cc.waterToRemoveKgPerTonne)} ${u.system === 'us' ? 'lb' : 'kg'} of water ${perMassWords(ctx)} at ${u.system === 'us' ? `${formatNumber(cc.heatOfEvaporationKjPerKg / KJ_PER_KG_PER_BTU_PER_LB)} Btu/lb` : `${formatNumber(cc.heatOfEvaporationKjPerKg)} kJ/kg`} through a heater of ${Math.round(a.heat.heaterEfficiency * 100)} % efficiency takes at least ${formatNumber(u.energyPerMass(cc.evaporationHeatFuelKwhPerTonne).value)} ${u.energyPerMassUnit} of fuel heat when every hour is heated. ${cc.note}`
  return `${head}${figureHtml({
    id,
    number: ctx.nextFigure(),
    caption: `${heatWord(a)} to reach the target by the deadline, by start month`,
    svg,
    alt,
    table: heatTable(a, ctx),
  })}<div class="fuel">${tableHtml(fuelTableShort(a, ctx))}<p class="note">${escapeHtml(`Heating values: ${a.heat.fuels.map((f) => `${fuelName(f)}, ${f.heatingValueSource}`).join('; ')}.`)}</p><p class="note">${escapeHtml(currencyOf(a) ? `Prices and costs in ${currencyOf(a)}.` : 'Prices marked as examples are placeholders in no currency; enter your own prices and currency for a cost you can use.')}</p><p class="note">${escapeHtml(check)}</p></div></section>`
}
