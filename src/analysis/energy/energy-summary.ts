/**
 * @module analysis/energy/energy-summary
 * The findings of an energy control-chart assessment in plain sentences: the answer first (did the
 * dryer's energy use per kg of water rise, from which batch, how sure, by how much, on which view), then
 * whether the signal stands without the batches in weather the baseline never saw, why that view, and one
 * sentence per chart.
 */
import type { ChartSet, ChartSignal } from './chart-set.ts'
import type { EnergyChartAssessment } from './energy-chart.ts'

type Partial = Omit<EnergyChartAssessment, 'summary'>

const VIEW_NAMES = {
  physics: 'physics-normalised view',
  regression: 'regression (weather and load) view',
  raw: 'raw specific-energy chart (no weather adjustment)',
} as const

/** A probability in words: whole per cent, but never "100 %" for what is only nearly certain. */
const pct = (x: number) => (x >= 0.995 ? 'over 99 %' : `${Math.round(100 * x)} %`)
const signed = (x: number, digits: number) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}`

function describe(name: string, set: ChartSet): string {
  const f = set.finding
  const parts: string[] = []
  if (f.baselineSignals > 0) {
    parts.push(
      `${name}: ${f.baselineSignals} baseline batches already break a run rule, so this chart's limits are not from an in-control baseline.`,
    )
  }
  const text = (s: ChartSignal) =>
    `batch ${s.batchId} (${s.startText}), ${s.batchesAfterBaseline} batches after the baseline, rule ${s.rules.join(' + ')}`
  if (!f.firstSignal) {
    parts.push(`${name}: no signal after the baseline; the dryer looks in control on this chart.`)
    return parts.join(' ')
  }
  if (f.firstSignal.side === 'below') {
    parts.push(`${name}: first signal, of LESS energy than the baseline, at ${text(f.firstSignal)}.`)
  }
  if (!f.firstRiseSignal) {
    parts.push(`${name}: no signal of more energy use after the baseline.`)
    return parts.join(' ')
  }
  const cusum = f.cusumRise
    ? ` The CUSUM signals the rise at batch ${f.cusumRise.batchId}.`
    : ' The CUSUM does not.'
  parts.push(`${name}: first signal of MORE energy per kg water at ${text(f.firstRiseSignal)}.${cusum}`)
  return parts.join(' ')
}

/** Size of the rise from the estimated change to the end: relative and in MJ per kg of water. */
function riseSize(
  a: Partial,
  set: ChartSet,
  view: 'physics' | 'regression' | 'raw',
): { rel: number; mj: number } {
  const change = set.finding.estimatedChangeStart!
  const from = set.batchIndices.indexOf(change.batchIndex)
  const points = set.batchIndices.slice(from)
  const mean = (xs: number[]) => xs.reduce((s, v) => s + v, 0) / xs.length
  if (view === 'physics') {
    const p = a.physics!
    const c = p.individuals.centerLine / 100
    const mj = mean(
      points.map(
        (b, j) => a.batches[b].specificEnergyMjPerKg - c * p.expectedSpecificEnergyMjPerKg[from + j],
      ),
    )
    return { rel: (set.finding.shiftAfterChange as number) / p.individuals.centerLine, mj }
  }
  if (view === 'regression') {
    const r = a.adjusted!
    const mj = set.finding.shiftAfterChange as number
    return { rel: mj / mean(r.fitted.slice(from)), mj }
  }
  const mj = set.finding.shiftAfterChange as number
  return { rel: mj / set.individuals.centerLine, mj }
}

function chosenSet(a: Partial): ChartSet {
  return a.answer.view === 'physics' ? a.physics! : a.answer.view === 'regression' ? a.adjusted! : a.raw
}

/** The one-sentence answer: when the dryer's energy use rose, how sure, by how much, on which view. */
function conclusion(a: Partial): string {
  const set = chosenSet(a)
  const f = set.finding
  const which = VIEW_NAMES[a.answer.view]
  const cp = f.changePoint
  if (!f.cusumRise || !cp || f.shiftAfterChange === null || !(f.shiftAfterChange > 0)) {
    const fall = f.cusumFall
      ? ` The CUSUM signals LESS energy than expected from batch ${f.cusumFall.batchId} (${f.cusumFall.startText}): check the energy and mass figures, or what changed for the better.`
      : ''
    return `Answer: no sign that the dryer uses more energy per kg of water than expected (${which}, CUSUM).${fall}`
  }
  const size = riseSize(a, set, a.answer.view)
  const interval =
    cp.intervalFrom.batchIndex === cp.intervalTo.batchIndex
      ? ''
      : `; ${pct(cp.intervalProbability)} sure it began between batches ${cp.intervalFrom.batchId} and ${cp.intervalTo.batchId}`
  return (
    `Answer: the dryer uses more energy per kg of water than expected from batch ${cp.batchId} (${cp.startText}) on ` +
    `(${pct(cp.probability)} likely the first such batch${interval}), about ${signed(100 * size.rel, 0)} % ` +
    `(${signed(size.mj, 2)} MJ/kg), on the ${which}; the CUSUM signalled at batch ${f.cusumRise.batchId}. ` +
    'Look at the dryer: burner, heat exchanger, seals, airflow.'
  )
}

function robustnessLine(a: Partial): string | null {
  const r = a.answer.robustness
  const range = a.baselineWeather
  if (!range || r.monitored === 0) return null
  const where =
    `outside ${range.tempC[0].toFixed(1)}–${range.tempC[1].toFixed(1)} °C or ` +
    `${range.humidityRatioGPerKg[0].toFixed(1)}–${range.humidityRatioGPerKg[1].toFixed(1)} g/kg`
  const count = `${r.outside} of ${r.monitored} monitored batches ran in weather the baseline never saw (${where})`
  switch (r.verdict) {
    case 'no-signal':
      return `${count}; they are marked on the charts.`
    case 'stands':
      return `${count}; the rise signal stands without them (CUSUM signal at batch ${r.firstSignalBatchId}).`
    case 'does-not-stand':
      return `${count}; without them the CUSUM does not signal a rise (${r.insideFromChange} batches inside that weather remain from the change on), so the signal rests on those batches: read it with care.`
    case 'cannot-check':
      return `${count}${r.outside === r.monitored ? ', every one of them' : ', all those from the change on'}, so the signal cannot be checked without them; it rests on the ${VIEW_NAMES[a.answer.view]} carrying across weather.`
  }
}

export function summaryLines(a: Partial): string[] {
  const base = a.batches.slice(0, a.baselineCount)
  const meanEff = base.reduce((s, b) => s + b.thermalEfficiencyPct, 0) / base.length
  const lines = [conclusion(a)]
  const robust = robustnessLine(a)
  if (robust) lines.push(robust)
  lines.push(
    `The answer uses the ${VIEW_NAMES[a.answer.view]}: ${a.answer.reason}.`,
    `${a.batches.length} batches; baseline ${a.baselineCount} batches at ${a.raw.individuals.centerLine.toFixed(2)} MJ per kg water ` +
      `(σ̂ ${a.raw.individuals.sigma.toFixed(2)}), mean thermal efficiency ${meanEff.toFixed(1)} %.`,
  )
  if (a.physics) {
    const fit = a.physics.fit
    lines.push(
      `Physics view: overall efficiency ${(100 * fit.efficiency).toFixed(1)} % (± ${(100 * fit.efficiencyStandardError).toFixed(1)}) against an ideal dryer whose exhaust leaves saturated, ` +
        `fixed loss ${fit.fixedLossMj.toFixed(0)} MJ per batch${fit.fixedLossHeldAtZero ? ' (held at 0: the free fit made it negative)' : ''}; ` +
        `measured/expected σ̂ ${a.physics.individuals.sigma.toFixed(1)} %.`,
      describe('Physics-normalised chart', a.physics),
    )
  } else lines.push(`Physics view not drawn: ${a.physicsUnavailableReason}.`)
  if (a.adjusted) {
    lines.push(
      `Weather and load explain R² = ${a.adjusted.regression.rSquared.toFixed(2)} of the baseline's specific energy; residual σ̂ ${a.adjusted.individuals.sigma.toFixed(2)} MJ/kg.`,
      describe('Regression (weather- and load-adjusted) chart', a.adjusted),
    )
  } else lines.push(`Regression view not drawn: ${a.adjustedUnavailableReason}.`)
  lines.push(describe('Specific energy chart', a.raw))
  const d = a.cusumDesign
  const sigma = chosenSet(a).individuals.sigma
  const unit = chosenSet(a).unit === '% of expected' ? ' %' : ' MJ/kg'
  lines.push(
    `The CUSUM (k = ${d.k}, h = ${d.h}) signals a steady dryer about once in ${Math.round(d.inControlArl)} batches when the baseline's mean and σ are known ` +
      `(more often with a short baseline) and finds a rise of 3σ (here ${(3 * sigma).toFixed(unit === ' %' ? 1 : 2)}${unit}) after ${d.arlAtShiftSigma[2].arl.toFixed(1)} batches on average.`,
  )
  return lines
}
