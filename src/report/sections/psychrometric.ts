/**
 * @module report/sections/psychrometric
 * The site's hours on a psychrometric chart with the air that dries the product shaded. Needs the weather
 * series (for the hours) and the product profile (for the region); says so when either is missing.
 */
import type { Assessment } from '../assessment-view.ts'
import { psychrometricChart } from '../charts/psychrometric.ts'
import { formatNumber } from '../display-units.ts'
import { figureHtml } from '../figure.ts'
import {
  dryingRegionBoundary,
  type PsychroDensity,
  psychroDensity,
  type RegionPoint,
} from '../psychro-data.ts'
import type { ReportTable } from '../tables.ts'
import { finite, type SectionContext } from './context.ts'

/** Share of binned hours whose cell lies (by its centre) under the drying-region boundary. */
export function shareInRegion(d: PsychroDensity, region: RegionPoint[] | null): number | null {
  if (!region || region.length < 2 || d.hoursCounted === 0) return null
  let inside = 0
  for (const c of d.cells) {
    const t = c.dryBulbC + d.binDryBulbC / 2
    const w = c.humidityRatioGPerKg + d.binHumidityRatioGPerKg / 2
    if (t < region[0].dryBulbC || t > region[region.length - 1].dryBulbC) continue
    let k = 0
    while (k < region.length - 2 && region[k + 1].dryBulbC < t) k++
    const a = region[k]
    const b = region[k + 1]
    const wb =
      a.humidityRatioGPerKg +
      ((t - a.dryBulbC) / (b.dryBulbC - a.dryBulbC || 1)) * (b.humidityRatioGPerKg - a.humidityRatioGPerKg)
    if (w <= wb) inside += c.hours
  }
  return inside / d.hoursCounted
}

export function psychroTable(d: PsychroDensity): ReportTable {
  return {
    id: 'psychrometric-hours',
    title: 'Hours by dry bulb and humidity ratio (bin lower edges)',
    columns: [
      'dry bulb from [°C]',
      'dry bulb to [°C]',
      'humidity ratio from [g/kg]',
      'humidity ratio to [g/kg]',
      'hours',
    ],
    rows: d.cells.map((c) => [
      String(c.dryBulbC),
      c.dryBulbC + d.binDryBulbC,
      c.humidityRatioGPerKg,
      c.humidityRatioGPerKg + d.binHumidityRatioGPerKg,
      c.hours,
    ]),
  }
}

export function psychrometricSection(a: Assessment, ctx: SectionContext): string {
  const head = `<section class="report-section" id="${ctx.idPrefix}sec-psychro" data-section="psychrometric"><h2>The air on a psychrometric chart</h2>`
  if (!ctx.series) {
    return `${head}<p class="missing">The psychrometric chart needs the hourly weather; it is drawn when the report is made from the weather file (page, CLI or API with the file).</p></section>`
  }
  const d = psychroDensity(ctx.series, { utcOffsetHours: a.site.utcOffsetHours })
  const target = a.product.targetMoistureWbPct
  const region =
    ctx.profile && finite(target)
      ? dryingRegionBoundary(ctx.profile, target, d.pressureKpa, d.dryBulbRangeC)
      : null
  const regionLabel = finite(target)
    ? `air that dries ${a.product.name} to ${formatNumber(target, 1)} % wb`
    : 'drying region not available (no target moisture)'
  const share = shareInRegion(d, region)
  const alt =
    `${formatNumber(d.hoursCounted)} hours plotted by dry bulb and humidity ratio at about ${formatNumber(d.pressureKpa, 1)} kPa; dashed curves are relative humidity 10 to 90 %, the solid curve saturation. ` +
    (region
      ? `The hatched region below the blue curve is air whose relative humidity is below the product's equilibrium RH at the target moisture` +
        (ctx.profile?.maxProductTempC
          ? `, up to its temperature limit of ${formatNumber(ctx.profile.maxProductTempC.value, 0)} °C`
          : '') +
        `; ${share !== null ? `${Math.round(share * 100)} % of the hours fall in it (before sun, rain and night rules).` : ''}`
      : 'The drying region is not drawn: the product isotherm is not available to the report.')
  const svg = psychrometricChart({
    id: `${ctx.idPrefix}fig-psychro-svg`,
    title: `Hours of ${ctx.siteName} on a psychrometric chart`,
    description: alt,
    pressureKpa: d.pressureKpa,
    density: d,
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
    table: psychroTable(d),
    note: 'The region uses the air as it is; sun on the product (open air) or heating (solar cabinet, heated air) moves an hour to the right, toward drier relative humidity.',
  })}</section>`
}
