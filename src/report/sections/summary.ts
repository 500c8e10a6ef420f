/**
 * @module report/sections/summary
 * The header (site, data, clock, product, method, season) and the answer in plain sentences, with the
 * warnings that bear on it. Words, not identifiers; shares of years as "every year"; times on the site's
 * clock; costs with their currency (or what they are in when there is none).
 */
import { memoryFiguresLine } from '../../product/memory-figures.ts'
import type { Assessment } from '../assessment-view.ts'
import { MONTH_LONG } from '../charts/svg.ts'
import { formatNumber } from '../display-units.ts'
import { escapeHtml } from '../escape.ts'
import { clockShort, clockWords, yearsWords } from '../words.ts'
import { binAnswerSentences } from './bin.ts'
import { finite, moneyWords, perMassFactor, perMassWords, type SectionContext } from './context.ts'
import { fuelName, heatIsAllTheHeat } from './heat.ts'
import { monthList, suitableMonths } from './monthly.ts'
import { inTenYears } from './spoilage.ts'
import { bestStartWindow } from './start-dates.ts'

/** The method in words: the assessment's label (its kind for assessments without one). */
export function methodName(a: Pick<Assessment, 'method' | 'methodLabel'>): string {
  return a.methodLabel ?? a.method.kind
}

function coord(v: number | null | undefined, pos: string, neg: string): string {
  return finite(v) ? `${formatNumber(Math.abs(v), 2)}° ${v >= 0 ? pos : neg}` : 'unknown'
}

/** The site's clock of an assessment made before it carried one (no `timeZone`: standard time). */
export function siteClock(
  a: Assessment,
): Pick<Assessment['site'], 'timeZone' | 'utcOffsetHours' | 'utcOffsetSource'> {
  return {
    timeZone: a.site.timeZone ?? null,
    utcOffsetHours: a.site.utcOffsetHours,
    utcOffsetSource: a.site.utcOffsetSource,
  }
}

/** "08:00 Europe/Madrid time": the batches' start hour on the site's clock, named. */
export function startTimeWords(a: Assessment): string {
  return `${String(a.season.startHourLocal).padStart(2, '0')}:00 ${clockShort(siteClock(a))}`
}

/** Which of the product's figures rest on memory, in one line (product/memory-figures.ts). */
export function productMemoryLine(p: Assessment['product']): string {
  return memoryFiguresLine(p.figuresFromMemory, p.figureCounts, p.id)
}

/** Rows of the header as label/value pairs (plain text; escaped when rendered). */
export function headerRows(a: Assessment, ctx: SectionContext): [string, string][] {
  const s = a.site
  const u = ctx.units
  const rows: [string, string][] = [['Site', ctx.siteName]]
  if (finite(s.latitudeDeg) || finite(s.longitudeDeg) || finite(s.elevationM)) {
    const elev = finite(s.elevationM)
      ? u.system === 'us'
        ? `${formatNumber(s.elevationM / 0.3048)} ft`
        : `${formatNumber(s.elevationM)} m`
      : 'unknown'
    rows.push([
      'Location',
      `${coord(s.latitudeDeg, 'N', 'S')}, ${coord(s.longitudeDeg, 'E', 'W')}, elevation ${elev}`,
    ])
  }
  const data = [ctx.info.dataSource, ctx.info.fileName ? `file ${ctx.info.fileName}` : null]
    .filter(Boolean)
    .join('; ')
  if (data) rows.push(['Data', data])
  const c = a.coverage
  const years = Math.max(0, ...a.monthly.map((m) => m.yearsWithData))
  rows.push([
    'Period',
    s.typicalYear
      ? 'a typical year (months taken from different years)'
      : `${c.firstHourUtc.slice(0, 10)} to ${c.lastHourUtc.slice(0, 10)}, ${years} year${years === 1 ? '' : 's'} of data per month`,
  ])
  const withData = c.hours - c.missingHours
  rows.push([
    'Coverage',
    `${formatNumber(c.hours > 0 ? (100 * withData) / c.hours : null, 1)} % of ${formatNumber(c.hours)} hours with data${c.hasRainData ? '' : '; no rain data'}`,
  ])
  rows.push(['Clock', clockWords(siteClock(a))])
  rows.push(['Product', a.product.name])
  rows.push([
    'Moisture',
    `from ${formatNumber(a.product.initialMoistureWbPct, 1)} % to ${formatNumber(a.product.targetMoistureWbPct, 1)} % wet basis`,
  ])
  rows.push(['Dry means', a.product.dryTarget.sentence])
  rows.push(['Recalled figures', productMemoryLine(a.product)])
  rows.push(['Method', methodName(a)])
  const every = a.season.stepDays === 1 ? 'day' : `${a.season.stepDays} days`
  rows.push([
    'Season',
    a.bin
      ? `the bin filled on dates from ${a.season.start} to ${a.season.end}, every ${every}, the fan starting at ${startTimeWords(a)}`
      : `batches start ${a.season.start} to ${a.season.end}, every ${every}, at ${startTimeWords(a)}`,
  ])
  if (a.bin) rows.push(['Season in the bin', `${a.bin.seasonDays} days for the top layer to dry`])
  else
    rows.push([
      'Deadline',
      `${a.deadlineDays} days per batch (a batch still drying after ${a.maxDays} days counts as failed)`,
    ])
  rows.push([
    'Units',
    u.system === 'us' ? 'US customary (°F, lb, short ton, gal, ft³)' : 'SI (°C, kg, tonne, L, m³)',
  ])
  return rows
}

export function headerHtml(a: Assessment, ctx: SectionContext): string {
  const rows = headerRows(a, ctx)
    .map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`)
    .join('')
  return `<header class="report-header" data-section="header"><p class="kicker">dryhours · seasonal drying summary</p><h1>Can ${escapeHtml(ctx.siteName)} dry ${escapeHtml(a.product.name)}?</h1><dl class="facts">${rows}</dl></header>`
}

/** Whether the method stops drying at night (its usable hours are all daylight hours). */
export function stopsAtNight(a: Assessment): boolean {
  const night = a.monthly.map((m) => m.usableNightHoursShare).filter(finite)
  if (night.length > 0) return night.every((x) => x === 0)
  return (a.hoursByReason?.nightWithoutDrying ?? 0) > 0
}

/**
 * The usable share of a month in words, saying which hours it counts: of its daylight hours for a method
 * that stops at night, of all its hours otherwise. Null when the assessment has no such figure.
 */
export function usableShareWords(a: Assessment, m: Assessment['monthly'][number]): string | null {
  if (stopsAtNight(a) && finite(m.usableDaylightFraction))
    return `${Math.round(m.usableDaylightFraction * 100)} % of its daylight hours`
  if (finite(m.usableFraction)) return `${Math.round(m.usableFraction * 100)} % of all its hours`
  return null
}

/** The answer in plain sentences, most important first. */
export function answerSentences(a: Assessment, ctx: SectionContext): string[] {
  if (a.bin) return [...binAnswerSentences(a, a.bin, ctx), ...usableHourSentences(a)]
  const out: string[] = []
  const u = ctx.units
  const method = methodName(a)
  const suit = suitableMonths(a)
  const typical = a.site.typicalYear
  const target = `${formatNumber(a.product.targetMoistureWbPct, 1)} %`
  const median = typical ? 'in this typical year' : 'in the median year'
  if (suit.length > 0) {
    const days = suit.map((m) => a.monthly.find((r) => r.month === m)?.medianDaysToTarget).filter(finite)
    out.push(
      `By ${method}, batches of ${a.product.name} started in ${monthList(suit)} reach ${target} within the ${a.deadlineDays}-day deadline ${median} (${formatNumber(Math.min(...days), 1)} to ${formatNumber(Math.max(...days), 1)} days).`,
    )
  } else {
    out.push(
      `By ${method}, no month's batches of ${a.product.name} reach ${target} within ${a.deadlineDays} days ${median}.`,
    )
  }
  out.push(...spoilageSentences(a))
  if (!heatIsAllTheHeat(a)) out.push(...usableHourSentences(a))
  const w = bestStartWindow(a)
  if (w) {
    out.push(
      `The best start window is ${w.from} to ${w.to}: batches reach ${target} in about ${formatNumber(w.medianDays, 1)} days in a median year` +
        (finite(w.p90Days) ? ` and within ${formatNumber(w.p90Days, 1)} days in 9 of 10 years` : '') +
        `; they finish within ${a.deadlineDays} days ${w.minProbability >= 1 ? 'in every year' : `in at least ${yearsWords(w.minProbability)}`}` +
        (finite(w.maxSpoilageProbability) && w.maxSpoilageProbability > 0
          ? typical
            ? ', but batches in it spoil before they are dry.'
            : `, but batches in it spoil before they are dry in up to ${inTenYears(w.maxSpoilageProbability)}.`
          : '.'),
    )
  } else if (a.startDates.length > 0) {
    const best = a.startDates.reduce((x, y) =>
      y.probabilityWithinDeadline > x.probabilityWithinDeadline ? y : x,
    )
    out.push(
      `No start day finishes within ${a.deadlineDays} days in most years${best.probabilityWithinDeadline > 0 ? `; the best, ${best.start}, does in ${yearsWords(best.probabilityWithinDeadline)}` : ''}.`,
    )
  }
  const heat = a.heat.heatToAirKwhPerTonne
  const fuelHeat = a.heat.fuelHeatKwhPerTonne
  if (finite(heat.median)) {
    const fuel = a.heat.fuels.find((f) => f.fuel === a.heat.selectedFuel)
    const cost = fuel && finite(fuel.costPerTonne) ? fuel.costPerTonne * perMassFactor(ctx) : null
    const costText =
      fuel && finite(cost)
        ? `, costing about ${moneyWords(cost, a, fuel.priceIsExample, 0)} ${perMassWords(ctx)} in ${fuelName(fuel)}${fuel.priceIsExample ? ' at an example price' : ''}`
        : ''
    const e = (v: number | null) =>
      `${formatNumber(finite(v) ? u.energyPerMass(v).value : null)} ${u.energyPerMassUnit}`
    if (heatIsAllTheHeat(a)) {
      out.push(
        `The dryer's heater supplies all the heat: about ${e(heat.median)} into the air for a median batch to finish by the deadline (1 in 10 batches: ${e(heat.p90)}), ${e(fuelHeat.median)} of fuel heat${costText}.`,
      )
    } else if (heat.median === 0 && (!finite(heat.p90) || heat.p90 === 0)) {
      out.push(
        'Batches started in this season need no supplemental heat to finish by the deadline in 9 of 10 cases.',
      )
    } else if (heat.median === 0) {
      out.push(
        `Most batches in this season need no supplemental heat to finish by the deadline; 1 in 10 needs ${e(heat.p90)} or more added to the air (${e(fuelHeat.p90)} of fuel heat).`,
      )
    } else {
      out.push(
        `To finish by the deadline, a backup heater adds about ${e(heat.median)} to the air in a median batch (1 in 10 batches: ${e(heat.p90)}), ${e(fuelHeat.median)} of fuel heat${costText}.`,
      )
    }
  }
  if (a.method.kind === 'open-air' || a.method.kind === 'shade') {
    out.push(
      'A solar cabinet heats the air before it reaches the product, which lowers its relative humidity: assess the same file with the solar-cabinet method (or the methods side by side) to see how many hours and days it gains.',
    )
  }
  return out
}

/** Tenths of a share for words: at least 1 when above 0, at most 9 when below 1. */
function tenths(p: number): number {
  const k = Math.round(10 * p)
  return p > 0 && k === 0 ? 1 : p < 1 && k === 10 ? 9 : k
}

/** "7 of 10 years" or "7 to 10 of 10 years" for a range of shares. */
function tenYearsRange(lo: number, hi: number): string {
  const a = tenths(lo)
  const b = tenths(hi)
  return a === b ? inTenYears(hi) : `${a} to ${b} of 10 years`
}

/**
 * The spoilage answer: months whose batches dry but spoil first in most years (with their days to target),
 * and the months of lowest risk. From `monthly[].spoilage` (batches of the 1st and 16th); nothing without a
 * spoilage model.
 */
export function spoilageSentences(a: Assessment): string[] {
  const s = a.spoilage
  if (!s) return []
  const rows = a.monthly.filter((m) => m.spoilage && m.spoilage.batches > 0 && finite(m.spoilage.probability))
  if (rows.length === 0) return []
  const p = (m: (typeof rows)[number]) => m.spoilage?.probability as number
  const model = `spoilage model after ${s.season.source}`
  const typical = a.site.typicalYear
  const share = (ms: typeof rows) => {
    if (typical) {
      const spoiled = ms.reduce((n, m) => n + (m.spoilage?.batchesSpoiledBeforeDry ?? 0), 0)
      const all = ms.reduce((n, m) => n + (m.spoilage?.batches ?? 0), 0)
      return `${spoiled} of ${all} batches of this typical year`
    }
    return tenYearsRange(Math.min(...ms.map(p)), Math.max(...ms.map(p)))
  }
  if (rows.every((m) => p(m) === 0)) {
    return [
      `No batch spoiled before it was dry in ${typical ? 'this typical year' : 'any year of the file'} by the spoilage model (${model}).`,
    ]
  }
  const out: string[] = []
  const suit = new Set(suitableMonths(a))
  const risky = rows.filter((m) => p(m) >= 0.5)
  const riskyDrying = risky.filter((m) => suit.has(m.month))
  if (riskyDrying.length > 0) {
    const days = riskyDrying.map((m) => m.medianDaysToTarget).filter(finite)
    const dayText =
      days.length === 0
        ? ''
        : Math.min(...days) === Math.max(...days)
          ? ` in ${formatNumber(days[0], 1)} days`
          : ` in ${formatNumber(Math.min(...days), 1)} to ${formatNumber(Math.max(...days), 1)} days`
    out.push(
      `But batches started in ${monthList(riskyDrying.map((m) => m.month))} dry${dayText} and spoil first in ${share(riskyDrying)} (${model}).`,
    )
  } else if (risky.length > 0) {
    out.push(
      `Batches started in ${monthList(risky.map((m) => m.month))} spoil before they are dry in ${share(risky)} (${model}).`,
    )
  }
  const low = rows.filter((m) => p(m) <= 0.1)
  if (low.length > 0 && low.length < rows.length) {
    out.push(
      `Lowest spoilage risk: batches started in ${monthList(low.map((m) => m.month))} (spoiled first in ${typical ? share(low) : `at most ${tenYearsRange(Math.max(...low.map(p)), Math.max(...low.map(p)))}`}).`,
    )
  } else if (low.length === 0) {
    const best = rows.reduce((x, y) => (p(y) < p(x) ? y : x))
    out.push(
      `No month is free of spoilage risk: even batches started in ${MONTH_LONG[best.month - 1]} spoil first in ${share([best])}.`,
    )
  }
  return out
}

/** The month in which the air dries the product most hours (the air entering the bin, for a bin). */
function usableHourSentences(a: Assessment): string[] {
  const typical = a.site.typicalYear
  const median = typical ? 'in this typical year' : 'in the median year'
  const top = a.monthly.reduce(
    (x, y) => ((y.usableHours.median ?? -1) > (x.usableHours.median ?? -1) ? y : x),
    a.monthly[0],
  )
  if (!top || !finite(top.usableHours.median)) return []
  const subject = a.bin
    ? 'The air blown into the bin can dry the grain toward the target'
    : 'The air dries the product'
  const share = usableShareWords(a, top)
  return [
    `${subject} most hours in ${MONTH_LONG[top.month - 1]}: ${formatNumber(top.usableHours.median)} hours ${median}${share ? ` (${share})` : ''}` +
      (typical || !finite(top.usableHours.p10)
        ? '.'
        : `, and at least ${formatNumber(top.usableHours.p10)} in 9 of 10 years.`),
  ]
}

/** The warnings that bear on the answer: the assessment's, then the weather file's (option names for the surface). */
export function warningList(a: Assessment, ctx: SectionContext): string[] {
  return [...a.warnings, ...(ctx.info.readerWarnings ?? []).map((w) => `weather file: ${w}`)].map(
    ctx.optionWords,
  )
}

/** The answer section; `maxWarnings` shortens the warning list (the handout), saying where the rest are. */
export function answerHtml(
  a: Assessment,
  ctx: SectionContext,
  maxWarnings = Number.POSITIVE_INFINITY,
): string {
  const items = answerSentences(a, ctx)
    .map((s) => `<li>${escapeHtml(s)}</li>`)
    .join('')
  const all = warningList(a, ctx)
  const shown = all.slice(0, maxWarnings)
  const more = all.length - shown.length
  const warnings = all.length
    ? `<div class="warnings" role="note" data-warnings="${all.length}"><h3>Warnings</h3><ul>${shown.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul>${more > 0 ? `<p class="note">${more} more warning${more === 1 ? '' : 's'} in the appendix (“Warnings and notes”).</p>` : ''}</div>`
    : ''
  return `<section class="report-section answer" id="${ctx.idPrefix}sec-answer" data-section="answer"><h2>The answer</h2><ul class="sentences">${items}</ul>${warnings}</section>`
}
