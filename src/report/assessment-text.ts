/**
 * @module report/assessment-text
 * The readable text of an assessment for a terminal (`dryhours assess` without `--json`): the same words as
 * the HTML report (reasons in words, "every year", the site's clock named, the daylight share, costs with
 * their currency, heat called "heat" when it is all the heat) in the chosen display units, in columns.
 * A table that shows only some rows says so.
 */
import type { Assessment } from '../analysis/assessment.ts'
import { binText } from './bin-text.ts'
import {
  formatNumber,
  formatPrice,
  KJ_PER_KG_PER_BTU_PER_LB,
  type UnitSystem,
  unitFormatter,
} from './display-units.ts'
import { sectionContext } from './report-html.ts'
import { calendarRuns } from './sections/calendar.ts'
import { currencyOf, finite, perMassFactor, perMassWords } from './sections/context.ts'
import { fuelName, fuelRows, heatIsAllTheHeat, heatWord } from './sections/heat.ts'
import { mainReasonWords } from './sections/monthly.ts'
import { methodName, productMemoryLine, siteClock, startTimeWords, stopsAtNight } from './sections/summary.ts'
import { clockWords, thinnedNote, yearsWords } from './words.ts'

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')

/** A share [0–1] as a whole percent, '–' when unknown. */
const pct = (x: number | null | undefined): string => (finite(x) ? (100 * x).toFixed(0) : '–')

/** A start row's batches with unknown outcome (they met hours without weather), when there are any. */
const unknownNote = (r: Assessment['startDates'][number]): string =>
  r.yearsUnknown > 0
    ? `  + ${r.yearsUnknown} year${r.yearsUnknown === 1 ? '' : 's'} unknown (${r.missingWeatherHours} h without weather)`
    : ''

/** Start dates the text table shows at most (every n-th above it, said above the table). */
export const TEXT_START_ROWS = 20

export interface TextOptions {
  units?: UnitSystem
  /** Notes on how the weather file was read (shown apart from the warnings). */
  readerNotes?: string[]
  /** Where the full table is, for the note above a thinned table. */
  fullTableHint?: string
}

/** What every part of the text shares: the assessment, its report context and the number formats. */
interface TextContext {
  a: Assessment
  o: TextOptions
  u: ReturnType<typeof unitFormatter>
  ctx: ReturnType<typeof sectionContext>
  f0: (x: number | null | undefined) => string
  f1: (x: number | null | undefined) => string
  /** An energy per tonne [kWh/t] in the display unit, no unit written. */
  e: (kwhPerTonne: number | null | undefined) => string
}

/** The readable summary of an assessment, for a terminal. */
export function assessmentText(a: Assessment, o: TextOptions = {}): string {
  const u = unitFormatter(o.units ?? 'si')
  const f0 = (x: number | null | undefined): string => formatNumber(x ?? null, 0)
  const t: TextContext = {
    a,
    o,
    u,
    ctx: sectionContext(a, { units: o.units, optionSurface: 'cli' }),
    f0,
    f1: (x) => formatNumber(x ?? null, 1),
    e: (kwhPerTonne) => (finite(kwhPerTonne) ? f0(u.energyPerMass(kwhPerTonne).value) : '–'),
  }
  const spoilage = spoilageText(t)
  const out = [...headText(t), ...spoilage, ...(spoilage.length > 0 ? [''] : []), ...monthlyText(t), '']
  if (a.bin) out.push(...binText(a, a.bin))
  else out.push(...startsText(t), '', ...heatText(t))
  out.push(...closingText(t))
  return `${out.join('\n')}\n`
}

/** The site, product, method, the weather's years and the clock times are on. */
function headText({ a, ctx }: TextContext): string[] {
  const p = a.product
  return [
    `${ctx.siteName}: ${p.name}, ${methodName(a)}, ${p.initialMoistureWbPct} → ${p.targetMoistureWbPct} % wet basis`,
    `dry means ${p.dryTarget.sentence}`,
    productMemoryLine(p),
    `weather ${a.coverage.firstHourUtc.slice(0, 10)} to ${a.coverage.lastHourUtc.slice(0, 10)} (UTC), ${a.site.typicalYear ? 'a typical year' : `years ${a.coverage.years.length > 0 ? a.coverage.years.join(', ') : 'none with a week of data'}`}`,
    `times on ${clockWords(siteClock(a))}`,
    '',
  ]
}

/** Spoiling before dry: the model, its source and limit, the season's share of batches and the first cautions. */
function spoilageText({ a, f0 }: TextContext): string[] {
  const s = a.spoilage
  if (!s) return []
  const limit =
    s.model.measureUnit === ''
      ? `${s.model.measureName} = ${s.model.limit}`
      : `${s.model.limit} ${s.model.measureUnit} ${s.model.measureName}`
  const share = finite(s.season.probability) ? ` (${Math.round(100 * s.season.probability)} %)` : ''
  return [
    `Spoilage before dry: ${s.model.name}, after ${s.season.source} (${s.model.source.confidence}); a batch counts as spoiled at ${limit}`,
    s.model.waterActivity.of === 'surface'
      ? '  fed the water activity at the product surface (from the air at the product, its drying rate, rain and cover; the JSON gives the rule)'
      : '  fed the product’s water activity (its isotherm at its mean moisture)',
    `  this season: ${s.season.batchesSpoiledBeforeDry} of ${s.season.batches} batches${share} spoiled before they were dry; hours at risk per batch ${f0(s.season.hoursAtRisk.median)} in the median batch (1 in 10 batches: ${f0(s.season.hoursAtRisk.p90)} or more)`,
    ...s.cautions.slice(0, 2).map((c) => `  ! ${c}`),
    '',
  ]
}

/** Usable drying hours per month, with the share of daylight hours for methods that stop at night. */
function monthlyText({ a, u, f0, f1, e }: TextContext): string[] {
  const out: string[] = []
  const daylight = stopsAtNight(a) && a.monthly.some((m) => finite(m.usableDaylightFraction))
  const spoils = a.spoilage !== null && a.spoilage !== undefined
  out.push('Usable drying hours per month (median, P10–P90 across years; P10 = reached in 9 of 10 years)')
  const shareHead = daylight ? '% of daylight h' : '% of all hours'
  const heatHead = `${heatWord(a).toLowerCase()} ${u.energyPerMassUnit}`
  out.push(
    `month  median  P10–P90   ${shareHead.padStart(15)}  ${'main reason an hour does not dry'.padEnd(40)} ${heatHead.padStart(26)}  days to dry${spoils ? '  spoils first %' : ''}`,
  )
  for (const m of a.monthly) {
    const share = daylight ? m.usableDaylightFraction : m.usableFraction
    const range = `${f0(m.usableHours.p10)}–${f0(m.usableHours.p90)}`
    out.push(
      `${MONTHS[m.month - 1].padEnd(5)}  ${f0(m.usableHours.median).padStart(6)}  ${range.padEnd(9)} ${(finite(share) ? (100 * share).toFixed(0) : '–').padStart(15)}  ${mainReasonWords(m).padEnd(40)} ${e(m.supplementalHeatKwhPerTonne.median).padStart(26)}  ${f1(m.medianDaysToTarget).padStart(11)}${spoils ? pct(m.spoilage?.probability).padStart(16) : ''}`,
    )
  }
  return out
}

/** The season calendar in a line, the best start windows and the start-date table (thinned, said so). */
function startsText({ a, o, u, f0, f1, e }: TextContext): string[] {
  const out: string[] = []
  if (a.seasonCalendar?.cells.length) {
    out.push(`The season at a glance (start weeks): ${calendarRuns(a.seasonCalendar)}.`)
    out.push('')
  }
  out.push(`Best start windows (${a.bestStartWindowCriterion}):`)
  if (a.bestStartWindows.length === 0) out.push('  none')
  for (const w of a.bestStartWindows) {
    out.push(
      `  ${w.from} to ${w.to}: finishes within ${a.deadlineDays} days ${w.minProbabilityWithinDeadline >= 1 ? 'in every year' : `in at least ${yearsWords(w.minProbabilityWithinDeadline)}`}, median ${f1(w.medianDaysToTarget)} days`,
    )
  }
  out.push('')
  const spoils = a.spoilage !== null && a.spoilage !== undefined
  out.push(`Start dates ${a.season.start} to ${a.season.end}, batches start at ${startTimeWords(a)}`)
  const step = Math.max(1, Math.ceil(a.startDates.length / TEXT_START_ROWS))
  const shown = a.startDates.filter((_, i) => i % step === 0)
  const note = thinnedNote(
    step,
    shown.length,
    a.startDates.length,
    'start date',
    o.fullTableHint ?? 'the JSON or CSV output',
  )
  if (note) out.push(note)
  out.push(
    `start  years  days median  days, 9 in 10 years  within ${a.deadlineDays} days       rewetting h  ${`${heatWord(a).toLowerCase()} ${u.energyPerMassUnit} median (1 in 10)`.padEnd(34)}${spoils ? '  spoils first %  hours at risk' : ''}`,
  )
  for (const r of shown) {
    out.push(
      `${r.start}  ${String(r.years).padStart(5)}  ${f1(r.daysToTarget.median).padStart(11)}  ${f1(r.daysToTarget.p90).padStart(19)}  ${(r.years > 0 ? yearsWords(r.probabilityWithinDeadline) : 'no data').padEnd(18)}  ${f0(r.rewettingHours.median).padStart(11)}  ${`${e(r.supplementalHeat.medianKwhPerTonne)} (${e(r.supplementalHeat.p90KwhPerTonne)})`.padEnd(34)}${spoils ? `  ${pct(r.spoilage?.probability).padStart(14)}  ${f0(r.spoilage?.hoursAtRisk.median).padStart(13)}` : ''}${unknownNote(r)}`,
    )
  }
  return out
}

/** Heat to finish within the deadline, the fuels with their costs, and the cross-check. */
function heatText({ a, u, ctx, f0, f1, e }: TextContext): string[] {
  const out: string[] = []
  const h = a.heat
  const mass = perMassWords(ctx)
  out.push(
    heatIsAllTheHeat(a)
      ? `Heat to finish within ${a.deadlineDays} days (the dryer's heater: all the heat the batch gets):`
      : `Supplemental heat to finish within ${a.deadlineDays} days (a backup heater for what the air does not do):`,
  )
  out.push(
    `  median ${e(h.heatToAirKwhPerTonne.median)} ${u.energyPerMassUnit} into the air (P10 ${e(h.heatToAirKwhPerTonne.p10)}, P90 ${e(h.heatToAirKwhPerTonne.p90)}), ${e(h.fuelHeatKwhPerTonne.median)} ${u.energyPerMassUnit} of fuel heat at ${Math.round(h.heaterEfficiency * 100)} % heater efficiency; a batch of ${formatNumber(u.mass(h.batchKgFresh).value, 0)} ${u.mass(1).unit}: ${f0(h.heatToAirKwhPerBatch.median)} kWh`,
  )
  const currency = currencyOf(a)
  const allExample = h.fuels.every((x) => x.priceIsExample)
  const money = currency ?? (allExample ? 'example-price units, no currency' : "your prices' currency")
  out.push(`  fuel ${mass} of fresh product (prices and costs in ${money}):`)
  for (const r of fuelRows(a, ctx)) {
    const mark = r.fuel.priceIsExample ? ' (example price)' : ''
    out.push(
      `  ${fuelName(r.fuel).padEnd(36)} ${f1(r.quantity).padStart(8)} ${r.unit.padEnd(3)}  cost ${f1(r.cost)} at ${formatPrice(r.price)} per ${r.unit}${mark}`,
    )
  }
  const c = h.crossCheck
  const water =
    u.system === 'us'
      ? (c.waterToRemoveKgPerTonne / 0.45359237) * perMassFactor(ctx)
      : c.waterToRemoveKgPerTonne
  out.push(
    `  cross-check: ${f1(water)} ${u.system === 'us' ? 'lb' : 'kg'} of water ${mass} × ${u.system === 'us' ? `${f0(c.heatOfEvaporationKjPerKg / KJ_PER_KG_PER_BTU_PER_LB)} Btu/lb` : `${c.heatOfEvaporationKjPerKg} kJ/kg`} ÷ efficiency = ${e(c.evaporationHeatFuelKwhPerTonne)} ${u.energyPerMassUnit}; heated every hour uses ${c.ratioHeatedEveryHour ?? '–'} × that`,
  )
  return out
}

/** Warnings, the reader's notes apart from them, the cautions (the bin's first) and where the assumptions are. */
function closingText({ a, o }: TextContext): string[] {
  const out: string[] = []
  const list = (title: string, items: readonly string[]) => {
    if (items.length === 0) return
    out.push('', title)
    for (const x of items) out.push(`  - ${x}`)
  }
  list('Warnings:', a.warnings)
  list('Notes on how the weather file was read:', o.readerNotes ?? [])
  list('Cautions:', [...(a.bin?.cautions ?? []), ...a.product.cautions])
  out.push('')
  out.push(
    `${a.assumptions.length} assumptions (thresholds, defaults and their sources) are listed in the JSON and the HTML report`,
  )
  return out
}
