/**
 * @module cli/assessment-text
 * The readable summary of an assessment that `dryhours assess` prints: the spoilage before dry, the monthly table, the start windows and
 * start-date table with the heat of a batch method (or the bin's answer), the warnings and cautions.
 */
import type { Assessment } from '../analysis/assessment.ts'
import { FUELS } from '../drying/fuels.ts'
import { HOUR_STATUS_NAMES } from '../drying/usable-hour.ts'
import { memoryFiguresLine } from '../product/memory-figures.ts'
import { binText } from './bin.ts'

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')
const f0 = (x: number | null): string => (x === null ? '–' : x.toFixed(0))
const f1 = (x: number | null): string => (x === null ? '–' : x.toFixed(1))
const pct = (x: number | null | undefined): string =>
  x === null || x === undefined ? '–' : (100 * x).toFixed(0)
/** A start row's batches with unknown outcome (they met hours without weather), when there are any. */
const unknownNote = (r: Assessment['startDates'][number]): string =>
  r.yearsUnknown > 0
    ? `  + ${r.yearsUnknown} year${r.yearsUnknown === 1 ? '' : 's'} unknown (${r.missingWeatherHours} h without weather)`
    : ''

/** The spoilage lines of the text summary: the model, its source and limit, and the season's share. */
export function spoilageText(a: Assessment): string[] {
  const s = a.spoilage
  if (!s) return []
  const limit =
    s.model.measureUnit === ''
      ? `${s.model.measureName} = ${s.model.limit}`
      : `${s.model.limit} ${s.model.measureUnit} ${s.model.measureName}`
  return [
    `Spoilage before dry: ${s.model.name}; source ${s.season.source} (${s.model.source.confidence}); spoiled at ${limit}`,
    s.model.waterActivity.of === 'surface'
      ? '  fed the water activity at the product surface (from the air at the product, its drying rate, rain and cover: JSON spoilage.model.waterActivity)'
      : '  fed the product’s water activity (its isotherm at its mean moisture)',
    `  season: ${s.season.batchesSpoiledBeforeDry} of ${s.season.batches} batches (${pct(s.season.probability)} %) spoiled before they were dry; hours at risk median ${f0(s.season.hoursAtRisk.median)} (P90 ${f0(s.season.hoursAtRisk.p90)})`,
    ...s.cautions.slice(0, 2).map((c) => `  ! ${c}`),
  ]
}

/** Start windows, the start-date table and the heat of a batch method. */
function batchesText(a: Assessment): string[] {
  const out: string[] = []
  out.push(`Best start windows (${a.bestStartWindowCriterion}):`)
  if (a.bestStartWindows.length === 0) out.push('  none')
  for (const w of a.bestStartWindows) {
    out.push(
      `  ${w.from} to ${w.to}: finishes within ${a.deadlineDays} days in ≥ ${(100 * w.minProbabilityWithinDeadline).toFixed(0)} % of years, median ${f1(w.medianDaysToTarget)} days`,
    )
  }
  out.push('')
  out.push(
    `Start dates (${a.season.start} to ${a.season.end}, batch starts ${a.season.startHourLocal}:00 local)`,
  )
  out.push(
    'start  years  days median  days P90  P(within deadline)  rewet h  heat kWh/t median (P90)  spoils first %  at-risk h',
  )
  const every = Math.max(1, Math.ceil(a.startDates.length / 20))
  a.startDates.forEach((r, i) => {
    if (i % every !== 0) return
    out.push(
      `${r.start}  ${String(r.years).padStart(5)}  ${f1(r.daysToTarget.median).padStart(11)}  ${f1(r.daysToTarget.p90).padStart(8)}  ${(100 * r.probabilityWithinDeadline).toFixed(0).padStart(17)} %  ${f0(r.rewettingHours.median).padStart(7)}  ${`${f0(r.supplementalHeat.medianKwhPerTonne)} (${f0(r.supplementalHeat.p90KwhPerTonne)})`.padEnd(25)}  ${pct(r.spoilage?.probability).padStart(14)}  ${f0(r.spoilage?.hoursAtRisk.median ?? null).padStart(9)}${unknownNote(r)}`,
    )
  })
  const h = a.heat
  out.push('')
  out.push(
    `Supplemental heat to finish within ${a.deadlineDays} days: median ${f0(h.heatToAirKwhPerTonne.median)} kWh/t into the air (P10 ${f0(h.heatToAirKwhPerTonne.p10)}, P90 ${f0(h.heatToAirKwhPerTonne.p90)}), ${f0(h.fuelHeatKwhPerTonne.median)} kWh/t of fuel at efficiency ${h.heaterEfficiency}; batch of ${h.batchKgFresh} kg: ${f0(h.heatToAirKwhPerBatch.median)} kWh`,
  )
  for (const fu of h.fuels) {
    const mark = fu.priceIsExample ? ' (example price)' : ''
    out.push(
      `  ${FUELS[fu.fuel].name.padEnd(36)} ${f1(fu.quantityPerTonne).padStart(8)} ${fu.unit}/t  cost ${f1(fu.costPerTonne)}/t at ${fu.pricePerUnit}/${fu.unit}${mark}`,
    )
  }
  const c = h.crossCheck
  out.push(
    `  cross-check: ${c.waterToRemoveKgPerTonne} kg water/t × ${c.heatOfEvaporationKjPerKg} kJ/kg ÷ efficiency = ${c.evaporationHeatFuelKwhPerTonne} kWh/t; heated every hour uses ${c.ratioHeatedEveryHour ?? '–'} × that`,
  )
  return out
}

/** The readable summary of an assessment. */
export function assessmentText(a: Assessment): string {
  const out: string[] = []
  const p = a.product
  out.push(
    `${a.site.name}: ${p.name}, ${a.method.kind}, ${p.initialMoistureWbPct} → ${p.targetMoistureWbPct} % wb`,
  )
  out.push(`dry means ${p.dryTarget.sentence}`)
  out.push(memoryFiguresLine(p.figuresFromMemory, p.figureCounts, p.id))
  out.push(
    `data ${a.coverage.firstHourUtc} to ${a.coverage.lastHourUtc}, years ${a.coverage.years.length > 0 ? a.coverage.years.join(', ') : 'none with a week of data'}; local time UTC${a.site.utcOffsetHours >= 0 ? '+' : ''}${a.site.utcOffsetHours}`,
  )
  const spoilageLines = spoilageText(a)
  if (spoilageLines.length > 0) {
    out.push('')
    out.push(...spoilageLines)
  }
  out.push('')
  out.push('Usable drying hours per month (median, P10–P90 across years; P10 = exceeded in 9 of 10 years)')
  out.push(
    'month  median  P10–P90   usable %  main reason not usable   heat kWh/t  days to target  spoils first %',
  )
  for (const m of a.monthly) {
    const reasons = HOUR_STATUS_NAMES.filter((r) => r !== 'usable')
      .map((r) => [r, m.medianHoursByReason[r]] as const)
      .sort((x, y) => y[1] - x[1])
    const main = reasons[0][1] > 0 ? `${reasons[0][0]} (${reasons[0][1]} h)` : '–'
    const range = `${f0(m.usableHours.p10)}–${f0(m.usableHours.p90)}`
    out.push(
      `${MONTHS[m.month - 1].padEnd(5)}  ${f0(m.usableHours.median).padStart(6)}  ${range.padEnd(9)} ${(m.usableFraction === null ? '–' : (100 * m.usableFraction).toFixed(0)).padStart(8)}  ${main.padEnd(24)} ${f0(m.supplementalHeatKwhPerTonne.median).padStart(10)}  ${f1(m.medianDaysToTarget).padStart(14)}  ${pct(m.spoilage?.probability).padStart(14)}`,
    )
  }
  out.push('')
  out.push(...(a.bin ? binText(a, a.bin) : batchesText(a)))
  if (a.warnings.length > 0) {
    out.push('')
    out.push('Warnings:')
    for (const w of a.warnings) out.push(`  - ${w}`)
  }
  const cautions = [...(a.bin?.cautions ?? []), ...p.cautions]
  if (cautions.length > 0) {
    out.push('')
    out.push('Cautions:')
    for (const w of cautions) out.push(`  - ${w}`)
  }
  out.push('')
  out.push(`${a.assumptions.length} assumptions (thresholds, defaults and their sources): see --json`)
  return `${out.join('\n')}\n`
}
