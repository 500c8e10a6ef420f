/**
 * @module cli/methods-text
 * The readable text of a methods comparison (analysis/compare-methods.ts): the methods side by side, the
 * season calendar with the rule of every state, and the recommendation with its criterion.
 */
import type { CalendarState, MethodComparison } from '../analysis/compare-methods.ts'
import { binSentences, comparisonCautions } from '../report/methods-html.ts'

/** One letter per calendar state in the text calendar (the legend says which). */
export const STATE_LETTERS: Record<CalendarState, string> = {
  dries: 'D',
  marginal: 'm',
  'needs-heat': 'H',
  'spoils-first': 'S',
  'no-data': '.',
}

const STATE_WORDS: Record<CalendarState, string> = {
  dries: 'dries',
  marginal: 'marginal',
  'needs-heat': 'needs heat',
  'spoils-first': 'spoils first',
  'no-data': 'no data',
}

const f = (x: number | null, d = 1): string => (x === null ? '–' : x.toFixed(d))
const share = (x: number | null): string =>
  x === null ? '–' : x >= 1 ? 'every year' : x <= 0 ? 'no year' : `${Math.round(100 * x)} % of years`

export function methodComparisonText(c: MethodComparison): string {
  const out: string[] = []
  const cur = c.currency ?? ''
  const p = c.product
  out.push(
    `${c.site.name}: ${p.name}, ${p.initialMoistureWbPct} → ${p.targetMoistureWbPct} % wb, start dates ${c.season.start} to ${c.season.end}, deadline ${c.deadlineDays} days`,
  )
  if (c.site.typicalYear)
    out.push('typical-year file: shares of years are 0 or 100 % per start date (one constructed year)')
  out.push('')
  out.push(`Recommendation: ${c.recommendation.text}`)
  out.push(`  criterion: ${c.recommendation.criterion}`)
  out.push('')
  out.push('Methods side by side (over the season’s start dates)')
  const width = Math.max(6, ...c.methods.map((m) => m.kind.length))
  out.push(
    `${'method'.padEnd(width)}  days to target    finishes by the deadline  spoils first   heat kWh/t  fuel per t        cost per kg dried`,
  )
  out.push(
    `${''.padEnd(width)}  median (P90)      (mean share of years)     (share)        median      at the median     ${cur ? `[${cur}]` : ''}`,
  )
  for (const m of c.methods) {
    const fuel =
      m.fuel.quantityPerTonne === null ? '–' : `${f(m.fuel.quantityPerTonne)} ${m.fuel.unit} ${m.fuel.id}`
    const cost =
      m.costPerKgDried === null
        ? '–'
        : `${m.costPerKgDried.toFixed(3)}${cur ? ` ${cur}` : ''}${m.fuel.priceIsExample && m.costPerKgDried > 0 ? ' (example price)' : ''}`
    out.push(
      `${m.kind.padEnd(width)}  ${`${f(m.daysToTarget.median)} (${f(m.daysToTarget.p90)})`.padEnd(16)}  ${share(m.probabilityWithinDeadline).padEnd(24)}  ${(c.spoilageAssessed ? share(m.spoilageProbability) : 'not assessed').padEnd(13)}  ${f(m.heatToAirKwhPerTonne.median, 0).padStart(10)}  ${fuel.padEnd(16)}  ${cost}`,
    )
  }
  out.push(
    `Cost: ${c.costNote}; ${c.driedKgPerTonneFresh} kg dried per tonne fresh.${c.currency ? '' : ' No currency given (--currency): costs are in the unit of your prices.'}`,
  )
  if (!c.spoilageAssessed)
    out.push(
      'Spoilage: not assessed for this product and these methods (no spoilage model in the assessment).',
    )
  for (const b of binSentences(c)) out.push(`Grain in a bin: ${b}`)
  for (const n of c.notAssessed) out.push(`Not assessed: ${n.kind}: ${n.reason}`)
  out.push('')
  out.push('Season calendar: one cell per start week (7 days from the first start date)')
  const weeks = c.calendar.weekStarts
  out.push(`${'week of'.padEnd(width)}  ${weeks.map((w) => w.slice(3)).join(' ')}  (day of month)`)
  const months = weeks.map((w, i) =>
    i === 0 || w.slice(0, 2) !== weeks[i - 1].slice(0, 2) ? w.slice(0, 2) : '  ',
  )
  out.push(`${'month'.padEnd(width)}  ${months.join(' ')}`)
  for (const row of c.calendar.rows) {
    out.push(`${row.kind.padEnd(width)}  ${row.cells.map((s) => ` ${STATE_LETTERS[s]}`).join(' ')}`)
  }
  out.push('Legend:')
  for (const r of c.calendar.rules) out.push(`  ${STATE_LETTERS[r.state]} ${STATE_WORDS[r.state]}: ${r.rule}`)
  // a warning every method shares is said once
  const all = c.assessments.map((a) => new Set(a.warnings))
  const shared = c.assessments[0].warnings.filter((w) => all.every((set) => set.has(w)))
  const own = c.assessments.flatMap((a) =>
    a.warnings.filter((w) => !shared.includes(w)).map((w) => `${a.method.kind}: ${w}`),
  )
  if (shared.length + own.length > 0) {
    out.push('')
    out.push('Warnings:')
    for (const w of shared) out.push(`  ${w}`)
    for (const w of own) out.push(`  ${w}`)
  }
  const cautions = comparisonCautions(c)
  if (cautions.length > 0) {
    out.push('')
    out.push('Cautions:')
    for (const w of cautions) out.push(`  - ${w}`)
  }
  out.push('')
  out.push('Each method’s full assessment: --json (assessments), or --format html')
  return `${out.join('\n')}\n`
}
