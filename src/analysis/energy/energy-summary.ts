/**
 * @module analysis/energy/energy-summary
 * The findings of an energy control-chart assessment in plain sentences: the answer first (did the
 * dryer's energy use per kg of water rise, from which batch, by how much), then one sentence per chart.
 */
import type { BatchEnergy } from './batch-energy.ts'
import type { ChartSet, ChartSignal, EnergyChartAssessment } from './energy-chart.ts'

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
  const shift =
    f.shiftAfterChange === null
      ? ''
      : `, with a mean of ${f.shiftAfterChange >= 0 ? '+' : ''}${f.shiftAfterChange.toFixed(2)} MJ/kg against the baseline from there to the last batch`
  const change = f.estimatedChangeStart
    ? ` The rise most likely began with batch ${f.estimatedChangeStart.batchId} (${f.estimatedChangeStart.startText})${shift}.`
    : ''
  parts.push(`${name}: first signal of MORE energy per kg water at ${text(f.firstRiseSignal)}.${change}`)
  return parts.join(' ')
}

export function summaryLines(
  batches: BatchEnergy[],
  baselineCount: number,
  raw: ChartSet,
  adjusted: EnergyChartAssessment['adjusted'],
  reason: string | null,
): string[] {
  const base = batches.slice(0, baselineCount)
  const meanEff = base.reduce((s, b) => s + b.thermalEfficiencyPct, 0) / base.length
  const lines = [
    `${batches.length} batches; baseline ${baselineCount} batches at ${raw.individuals.centerLine.toFixed(2)} MJ per kg water ` +
      `(σ̂ ${raw.individuals.sigma.toFixed(2)}), mean thermal efficiency ${meanEff.toFixed(1)} %.`,
    describe('Specific energy chart', raw),
  ]
  if (adjusted) {
    lines.push(
      `Weather and load explain R² = ${adjusted.regression.rSquared.toFixed(2)} of the baseline's specific energy; residual σ̂ ${adjusted.individuals.sigma.toFixed(2)} MJ/kg.`,
      describe('Weather- and load-adjusted chart', adjusted),
    )
  } else lines.push(`Weather- and load-adjusted chart not drawn: ${reason}.`)
  lines.unshift(conclusion(raw, adjusted))
  return lines
}

/** The one-sentence answer: when the dryer's energy use rose, from the best chart available. */
function conclusion(raw: ChartSet, adjusted: EnergyChartAssessment['adjusted']): string {
  const set = adjusted ?? raw
  const which = adjusted ? 'after taking out weather and load' : 'on the raw chart (no weather adjustment)'
  const f = set.finding
  if (
    !f.firstRiseSignal ||
    !f.estimatedChangeStart ||
    f.shiftAfterChange === null ||
    !(f.shiftAfterChange > 0)
  ) {
    return `Answer: no sign that the dryer uses more energy per kg of water than in the baseline (${which}).`
  }
  const pct = (100 * f.shiftAfterChange) / raw.individuals.centerLine
  return (
    `Answer: the dryer's energy use per kg of water rose by about ${f.shiftAfterChange.toFixed(2)} MJ/kg ` +
    `(${pct.toFixed(0)} % of the baseline mean) from batch ${f.estimatedChangeStart.batchId} (${f.estimatedChangeStart.startText}) on, ` +
    `${which}; first signalled at batch ${f.firstRiseSignal.batchId}. Look at the dryer: burner, heat exchanger, seals, airflow.`
  )
}
