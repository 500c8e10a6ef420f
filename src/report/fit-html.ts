/**
 * @module report/fit-html
 * A fit of drying kinetics to tray weighings, for the page: which columns were read, the moisture from the
 * first to the last weighing, the model chosen by AICc and every model's constants with their standard
 * errors, the fitted curve against the weighings (a chart with its table view), the drying periods, the
 * weighings left out, and the time to a target. Rendered from the fit alone.
 */
import type { WeighingsFit } from '../product/fit-weighings.ts'
import { lineBandChart } from './charts/line-band.ts'
import { formatNumber } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import { figureHtml } from './figure.ts'
import { type ReportTable, tableHtml } from './tables.ts'

const MODEL_WORDS: Record<string, string> = {
  lewis: 'Lewis (one exponential)',
  page: 'Page (exponential in a power of time)',
  diffusion: 'Fick diffusion (series solution)',
}

function sig(x: number, digits = 4): string {
  return Number.isFinite(x) ? x.toPrecision(digits) : '–'
}

/** Every model's constants, standard errors and goodness of fit. */
export function modelsTable(f: WeighingsFit): ReportTable {
  return {
    id: 'fit-models',
    title: `Models fitted by least squares, ranked by ${f.criterion}`,
    columns: ['model', 'constants (± standard error)', 'R²', 'RMSE [kg water per kg dry matter]', 'AICc'],
    digits: [0, 0, 4, 4, 1],
    rows: [...f.models]
      .sort((a, b) => a.aicc - b.aicc)
      .map((m) => [
        `${MODEL_WORDS[m.model] ?? m.model}${m.model === f.best.model ? ' (chosen)' : ''}${m.converged ? '' : ' (did not converge)'}`,
        Object.keys(m.params)
          .map((k) => `${k} = ${sig(m.params[k])} ± ${sig(m.standardErrors[k], 2)}`)
          .join(', '),
        m.r2,
        m.rmseDb,
        m.aicc,
      ]),
  }
}

/** Moisture [% wet basis] of a dry-basis ratio. */
const wb = (db: number): number => (100 * db) / (1 + db)

/** The fit as an `<article>` fragment; `weighings` are the readings used ([h, % wet basis]) for the chart. */
export function renderFitArticle(
  f: WeighingsFit,
  o: { fileName?: string; weighings?: [number, number][] } = {},
): string {
  const lastH = Math.max(1, ...(o.weighings ?? []).map(([t]) => t), f.target?.timeH ?? 0)
  const steps = 40
  const curve = Array.from({ length: steps + 1 }, (_, i) => (lastH * i) / steps)
  const points = curve.map((t) => ({
    x: formatNumber(t, 1),
    median: Math.round(wb(f.predictMoistureDb(t)) * 10) / 10,
    high: null,
  }))
  const alt = `The line is the ${MODEL_WORDS[f.best.model] ?? f.best.model} model's moisture from ${formatNumber(f.initialMoistureWbPct, 1)} % wet basis at the first weighing; it levels off toward ${formatNumber(f.equilibriumMoistureWbPct, 1)} %. ${f.readingsUsed} weighings were used.`
  const svg = lineBandChart({
    id: 'fig-fit-svg',
    title: 'Fitted drying curve',
    description: alt,
    points,
    yLabel: 'moisture [% wet basis]',
    xLabel: 'hours from the first weighing',
    unit: '% wb',
    highLabel: 'none',
    lineLabel: 'fitted model',
  })
  const curveTable: ReportTable = {
    id: 'fit-curve',
    title: 'The fitted curve',
    columns: ['hours', 'moisture [% wet basis]'],
    digits: [1, 1],
    rows: curve.map((t) => [t, Math.round(wb(f.predictMoistureDb(t)) * 10) / 10]),
  }
  const c = f.periods.constantRate
  const facts: [string, string][] = [
    [
      'Weighings',
      `${o.fileName ? `${o.fileName}: ` : ''}${f.readingsUsed} used${f.missingMassLines.length ? `, ${f.missingMassLines.length} without a mass (lines ${f.missingMassLines.slice(0, 10).join(', ')})` : ''}`,
    ],
    ['Columns', f.columnsRead ?? 'as given'],
    [
      'Moisture',
      `${formatNumber(f.initialMoistureWbPct, 1)} % → ${formatNumber(f.lastMoistureWbPct, 1)} % wet basis (dry mass ${formatNumber(f.dryMassG, 1)} g)`,
    ],
    ['Best model', `${MODEL_WORDS[f.best.model] ?? f.best.model}, by ${f.criterion}`],
    [
      'Levels off at',
      `${formatNumber(f.equilibriumMoistureWbPct, 1)} % wet basis (fitted equilibrium moisture)`,
    ],
  ]
  if (f.effectiveDiffusivityM2PerS)
    facts.push([
      'Diffusivity',
      `${sig(f.effectiveDiffusivityM2PerS.value, 3)} ± ${sig(f.effectiveDiffusivityM2PerS.standardError, 2)} m²/s (${f.shape}, ${f.thicknessMm} mm)`,
    ])
  facts.push([
    'Drying periods',
    c
      ? `constant rate for the first ${formatNumber(c.endH, 2)} h (${sig(c.rateDbPerH, 3)} kg water per kg dry matter and hour), then falling rate below ${sig(c.criticalMoistureDb, 3)} kg/kg`
      : 'falling rate from the first weighing (no constant-rate period seen)',
  ])
  if (f.target)
    facts.push([
      'Time to target',
      f.target.timeH === null
        ? `${formatNumber(f.target.moistureWbPct, 1)} % wet basis: ${f.target.note}`
        : `${formatNumber(f.target.moistureWbPct, 1)} % wet basis after ${formatNumber(f.target.timeH, 1)} h (${f.target.note})`,
    ])
  if (f.meanAirTempC !== null)
    facts.push([
      'Air',
      `mean ${formatNumber(f.meanAirTempC, 1)} °C${f.meanRhPct !== null ? `, ${formatNumber(f.meanRhPct, 0)} % relative humidity` : ''}`,
    ])
  const outliers = f.outliers.length
    ? `<p>${escapeHtml(`Left out as far off the curve: ${f.outliers.map((x) => `line ${x.line} (${formatNumber(x.timeH, 1)} h, ${formatNumber(x.massG, 1)} g)`).join(', ')}.`)}</p>`
    : ''
  const warnings = f.warnings.length
    ? `<div class="warnings" role="note"><h3>Warnings</h3><ul>${f.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul></div>`
    : ''
  return `<article class="dryhours-report fit" data-report="fit">
<header class="report-header" data-section="header"><p class="kicker">dryhours · drying kinetics from your weighings</p><h1 tabindex="-1">${escapeHtml(`The ${MODEL_WORDS[f.best.model] ?? f.best.model} model fits best`)}</h1><dl class="facts">${facts.map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`).join('')}</dl>${warnings}</header>
<section class="report-section" data-section="fit-curve"><h2>The curve</h2>${figureHtml({ id: 'fig-fit', number: 1, caption: 'Moisture against time, as the chosen model fits the weighings', svg, alt, table: curveTable })}${outliers}</section>
<section class="report-section" data-section="fit-models"><h2>Every model</h2>${tableHtml(modelsTable(f))}<p class="note">A lower AICc is better; the difference to the chosen model says how much worse a model fits for its number of constants.</p></section>
</article>`
}
