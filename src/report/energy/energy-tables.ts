/**
 * @module report/energy/energy-tables
 * The tables of the energy control-chart report, built once for the HTML table views and the CSV
 * download: batches, control limits, regression coefficients and rejected rows.
 */
import type { ChartSet, EnergyChartAssessment } from '../../analysis/energy/energy-chart.ts'
import type { Cell, ReportTable } from '../tables.ts'

/** Signal label: the rule and an arrow for its side (↑ more energy than the baseline, ↓ less). */
export function signalLabel(rule: string, side: 'above' | 'below'): string {
  return `${rule}${side === 'above' ? '↑' : '↓'}`
}

/** Rules (and EWMA) that fired on each charted point, by point index, e.g. ['WE1↑', 'EWMA↑']. */
export function rulesByPoint(set: ChartSet): string[][] {
  const out: string[][] = set.batchIndices.map(() => [])
  const add = (i: number, label: string) => {
    if (!out[i].includes(label)) out[i].push(label)
  }
  for (const s of set.individuals.signals) add(s.index, signalLabel(s.rule, s.side))
  for (const s of set.ewma.signals) add(s.index, signalLabel('EWMA', s.side))
  return out
}

/** Rules by batch index (not point index) of a chart set. */
function rulesByBatch(set: ChartSet | null, batches: number): (string | null)[] {
  const out: (string | null)[] = new Array(batches).fill(null)
  if (!set) return out
  rulesByPoint(set).forEach((rules, point) => {
    out[set.batchIndices[point]] = rules.join(' ')
  })
  return out
}

export function batchTable(a: EnergyChartAssessment): ReportTable {
  const raw = rulesByBatch(a.raw, a.batches.length)
  const adj = rulesByBatch(a.adjusted, a.batches.length)
  const residual: (number | null)[] = new Array(a.batches.length).fill(null)
  const standardized: (number | null)[] = new Array(a.batches.length).fill(null)
  const leverage: (number | null)[] = new Array(a.batches.length).fill(null)
  a.adjusted?.batchIndices.forEach((b, i) => {
    residual[b] = a.adjusted!.residuals[i]
    standardized[b] = a.adjusted!.standardizedResiduals[i]
    leverage[b] = a.adjusted!.leverages[i]
  })
  const rows: Cell[][] = a.batches.map((b) => [
    b.batchId,
    b.startText,
    b.index < a.baselineCount ? 'baseline' : 'monitoring',
    b.freshMassKg,
    b.waterRemovedKg,
    b.energyMj,
    b.specificEnergyMjPerKg,
    b.thermalEfficiencyPct,
    b.dryingTempC,
    b.ambient?.dryBulbC ?? null,
    b.ambient?.relativeHumidityPct ?? null,
    b.ambient?.humidityRatioGPerKg ?? null,
    b.ambient?.source ?? null,
    raw[b.index],
    residual[b.index],
    leverage[b.index],
    standardized[b.index],
    adj[b.index],
  ])
  return {
    id: 'batches',
    title: 'Batches',
    columns: [
      'batch',
      'start',
      'phase',
      'fresh mass [kg]',
      'water removed [kg]',
      'energy [MJ]',
      'specific energy [MJ/kg water]',
      'thermal efficiency [%]',
      'drying temperature [°C]',
      'outside temperature [°C]',
      'outside RH [%]',
      'outside humidity ratio [g/kg]',
      'outside air from',
      'signals, specific energy chart',
      'residual [MJ/kg water]',
      'leverage h',
      'standardized residual [MJ/kg water]',
      'signals, adjusted chart',
    ],
    rows,
    digits: [0, 0, 0, 0, 0, 0, 2, 1, 0, 1, 0, 2, 0, 0, 3, 3, 3, 0],
  }
}

export function limitsTable(a: EnergyChartAssessment): ReportTable {
  const row = (name: string, set: ChartSet): Cell[] => [
    name,
    set.individuals.centerLine,
    set.individuals.sigma,
    set.individuals.lowerControlLimit,
    set.individuals.upperControlLimit,
    set.individuals.meanMovingRange,
    set.individuals.movingRangeUpperLimit,
    set.finding.firstRiseSignal?.batchId ?? null,
    set.finding.estimatedChangeStart?.batchId ?? null,
  ]
  const rows = [row('specific energy [MJ/kg water]', a.raw)]
  if (a.adjusted) rows.push(row('residual after weather and load [MJ/kg water]', a.adjusted))
  return {
    id: 'limits',
    title: 'Control limits from the baseline',
    columns: [
      'chart',
      'centre',
      'σ̂ = MR̄/d2',
      'LCL',
      'UCL',
      'MR̄',
      'MR UCL = D4·MR̄',
      'first signal of more energy',
      'estimated start of the change',
    ],
    rows,
    digits: [0, 3, 3, 3, 3, 3, 3, 0, 0],
  }
}

const REGRESSOR_LABELS: Record<string, string> = {
  intercept: 'intercept [MJ/kg water]',
  ambientHumidityRatioGPerKg: 'outside humidity ratio [MJ/kg water per g/kg]',
  ambientTempC: 'outside temperature [MJ/kg water per K]',
  freshMassT: 'load [MJ/kg water per t fresh]',
}

export function regressionTable(a: EnergyChartAssessment): ReportTable | null {
  if (!a.adjusted) return null
  const r = a.adjusted.regression
  return {
    id: 'regression',
    title: `Regression over the baseline: R² = ${r.rSquared.toFixed(3)}, adjusted R² = ${r.adjustedRSquared.toFixed(3)}, s = ${r.residualStandardError.toFixed(3)} MJ/kg, ${r.observations} batches, ${r.degreesOfFreedom} degrees of freedom`,
    columns: ['term', 'estimate', 'standard error', 't'],
    rows: r.coefficients.map((c) => [
      REGRESSOR_LABELS[c.name] ?? c.name,
      c.estimate,
      c.standardError,
      c.tStatistic,
    ]),
    digits: [0, 4, 4, 1],
  }
}

export function rejectionsTable(a: EnergyChartAssessment): ReportTable {
  return {
    id: 'rejected-rows',
    title: `Rows not used (${a.accounting.rowsRejected} of ${a.accounting.rowsRead})`,
    columns: ['line', 'field', 'value', 'reason'],
    rows: a.rejections.map((r) => [String(r.line), r.field, r.value, r.message]),
  }
}

/** Every table of the report, in page order. */
export function energyTables(a: EnergyChartAssessment): ReportTable[] {
  const regression = regressionTable(a)
  return [batchTable(a), limitsTable(a), ...(regression ? [regression] : []), rejectionsTable(a)]
}
