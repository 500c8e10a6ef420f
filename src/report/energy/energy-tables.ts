/**
 * @module report/energy/energy-tables
 * The tables of the energy control-chart report, built once for the HTML table views and the CSV
 * download: batches, control limits, the physics fit and the views compared, regression coefficients and
 * rejected rows.
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
  for (const s of set.cusum.signals) add(s.index, signalLabel('CUSUM', s.side))
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
  const phys = rulesByBatch(a.physics, a.batches.length)
  const nulls = () => new Array<number | null>(a.batches.length).fill(null)
  const residual = nulls()
  const standardized = nulls()
  const leverage = nulls()
  const ideal = nulls()
  const expected = nulls()
  const ratio = nulls()
  a.adjusted?.batchIndices.forEach((b, i) => {
    residual[b] = a.adjusted!.residuals[i]
    standardized[b] = a.adjusted!.standardizedResiduals[i]
    leverage[b] = a.adjusted!.leverages[i]
  })
  a.physics?.batchIndices.forEach((b, i) => {
    ideal[b] = a.physics!.idealHeatMjPerKg[i]
    expected[b] = a.physics!.expectedSpecificEnergyMjPerKg[i]
    ratio[b] = a.physics!.ratioPct[i]
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
    a.outsideBaselineWeather[b.index] ? 'yes' : '',
    ideal[b.index],
    expected[b.index],
    ratio[b.index],
    phys[b.index],
    residual[b.index],
    leverage[b.index],
    standardized[b.index],
    adj[b.index],
    raw[b.index],
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
      'outside baseline weather',
      'ideal heat [MJ/kg water]',
      'expected energy [MJ/kg water]',
      'measured / expected [%]',
      'signals, physics chart',
      'residual [MJ/kg water]',
      'leverage h',
      'standardized residual [MJ/kg water]',
      'signals, regression chart',
      'signals, specific energy chart',
    ],
    rows,
    digits: [0, 0, 0, 0, 0, 0, 2, 1, 0, 1, 0, 2, 0, 0, 3, 3, 1, 0, 3, 3, 3, 0, 0],
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
    set.finding.cusumRise?.batchId ?? null,
    set.finding.changePoint?.batchId ?? null,
    set.finding.changePoint ? 100 * set.finding.changePoint.probability : null,
    set.finding.changePoint
      ? `${set.finding.changePoint.intervalFrom.batchId} – ${set.finding.changePoint.intervalTo.batchId}`
      : null,
  ]
  const rows: Cell[][] = []
  if (a.physics) rows.push(row('measured / expected energy [%]', a.physics))
  if (a.adjusted) rows.push(row('residual after weather and load [MJ/kg water]', a.adjusted))
  rows.push(row('specific energy [MJ/kg water]', a.raw))
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
      'first signal of more energy (any rule)',
      'first CUSUM signal of more energy',
      'most likely start of the change',
      'probability of that start [%]',
      'batches holding ≥ 90 % of the probability',
    ],
    rows,
    digits: [0, 3, 3, 3, 3, 3, 3, 0, 0, 0, 0, 0],
  }
}

/** The physics fit and the two views compared by cross-validated error, or null without the physics view. */
export function physicsTable(a: EnergyChartAssessment): ReportTable | null {
  const p = a.physics
  if (!p) return null
  const f = p.fit
  const rows: Cell[][] = [
    ['overall efficiency [%]', 100 * f.efficiency, 100 * f.efficiencyStandardError],
    [
      `fixed loss per batch [MJ]${f.fixedLossHeldAtZero ? ' (held at 0)' : ''}`,
      f.fixedLossMj,
      f.fixedLossStandardError,
    ],
    ['cross-validated error, physics view [MJ/kg water]', f.crossValidatedError, null],
    ['cross-validated error, regression view [MJ/kg water]', a.adjusted?.crossValidatedError ?? null, null],
  ]
  return {
    id: 'physics',
    title: `Physics fit over the ${f.observations} baseline batches; the answer uses the ${a.answer.view} view`,
    columns: ['quantity', 'estimate', 'standard error'],
    rows,
    digits: [0, 3, 3],
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
  const physics = physicsTable(a)
  return [
    batchTable(a),
    limitsTable(a),
    ...(physics ? [physics] : []),
    ...(regression ? [regression] : []),
    rejectionsTable(a),
  ]
}
