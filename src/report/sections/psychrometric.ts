/**
 * @module report/sections/psychrometric
 * The site's hours on a psychrometric chart with the air that dries the product shaded, drawn from the
 * assessment's `psychrometric` block (analysis/psychrometric.ts); says so when an assessment lacks it.
 */

import type { PsychroDensity } from '../../analysis/psychrometric.ts'
import type { Assessment } from '../assessment-view.ts'
import { psychrometricChart } from '../charts/psychrometric.ts'
import { formatNumber } from '../display-units.ts'
import { figureHtml } from '../figure.ts'
import type { ReportTable } from '../tables.ts'
import { finite, round, type SectionContext } from './context.ts'

/** 1 kPa in inches of mercury (conventional, 0 °C): 1 inHg = 3.386 389 kPa (NIST SP 811, 2008, B.8; from memory, consistent with 1 standard atmosphere = 101.325 kPa = 29.921 inHg). */
const KPA_TO_IN_HG = 1 / 3.386389

export function psychroTable(d: PsychroDensity, ctx?: Pick<SectionContext, 'units'>): ReportTable {
  const u = ctx?.units
  const t = (c: number) => (u ? round(u.temperature(c).value, 1) : c)
  const w = (g: number) => (u ? round(u.humidityRatio(g).value, 2) : g)
  const tUnit = u?.temperatureUnit ?? '°C'
  const wUnit = u?.humidityRatioUnit ?? 'g/kg'
  return {
    id: 'psychrometric-hours',
    title: 'Hours by dry bulb and humidity ratio (bins)',
    columns: [
      `dry bulb from [${tUnit}]`,
      `dry bulb to [${tUnit}]`,
      `humidity ratio from [${wUnit}]`,
      `humidity ratio to [${wUnit}]`,
      'hours',
    ],
    digits: [0, 1, 2, 2, 0],
    rows: d.cells.map((c) => [
      String(t(c.dryBulbC)),
      t(c.dryBulbC + d.binDryBulbC),
      w(c.humidityRatioGPerKg),
      w(c.humidityRatioGPerKg + d.binHumidityRatioGPerKg),
      c.hours,
    ]),
  }
}

export function psychrometricSection(a: Assessment, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-psychro" data-section="psychrometric"><h2>The air on a psychrometric chart</h2>`
  const d = a.psychrometric
  if (!d) {
    return `${head}<p class="missing">The psychrometric chart needs the hours of the weather file, which this assessment does not carry (it was made by an older version); assess the file again to draw it.</p></section>`
  }
  const target = a.product.targetMoistureWbPct
  const region = finite(target) ? d.region : null
  const regionLabel = finite(target)
    ? `air that dries ${a.product.name} to ${formatNumber(target, 1)} % wb`
    : 'drying region not available (no target moisture)'
  const share = region ? d.shareOfHoursInRegion : null
  const limit = a.product.maxProductTempC
  const alt =
    `${formatNumber(d.hoursCounted)} hours plotted by dry bulb and humidity ratio at about ${ctx.units.system === 'us' ? `${formatNumber(d.pressureKpa * KPA_TO_IN_HG, 2)} inHg` : `${formatNumber(d.pressureKpa, 1)} kPa`}; dashed curves are relative humidity 10 to 90 %, the solid curve saturation. ` +
    (region
      ? `The hatched region below the blue curve is air whose relative humidity is below the product's equilibrium RH at the target moisture` +
        (limit !== null
          ? `, up to its temperature limit of ${formatNumber(ctx.units.temperature(limit).value, 0)} ${ctx.units.temperatureUnit}`
          : '') +
        `; ${share !== null ? `${Math.round(share * 100)} % of the hours fall in it (before sun, rain and night rules).` : ''}`
      : 'The drying region is not drawn: the product isotherm is not available to the report.')
  const svg = psychrometricChart({
    id: `${ctx.idPrefix}fig-psychro-svg`,
    title: `Hours of ${ctx.siteName} on a psychrometric chart`,
    description: alt,
    summary: d,
    region,
    regionLabel,
    units: ctx.units,
  })
  return `${head}${figureHtml({
    id: `${ctx.idPrefix}fig-psychro`,
    number: ctx.nextFigure(),
    caption:
      'Every hour of the file by dry bulb and humidity ratio, with the air that dries the product to its target',
    svg,
    alt,
    table: psychroTable(d, ctx),
    note: 'The region uses the air as it is; sun on the product (open air) or heating (solar cabinet, heated air) moves an hour to the right, toward drier relative humidity.',
  })}</section>`
}
