/**
 * @module web/page-forms
 * The page's five forms (assess a site, compare sites, check a weather file, fit from weighings, energy charts)
 * and their steps: product, methods and season, heater and prices, report; the compare form's sites table.
 */
import { ASSESS_DEFAULTS } from '../analysis/plan.ts'
import { FUELS } from '../drying/fuels.ts'
import { FUEL_IDS } from '../drying/method.ts'
import { METHOD_MODELS } from '../drying/methods/index.ts'
import { escapeHtml } from '../report/escape.ts'
import { WEATHER_OPTION_SPECS } from '../weather/option-spec.ts'
import { MAX_SITES } from './form-input.ts'
import {
  demoBlock,
  field,
  fileQuestions,
  legend,
  productOptions,
  SITE_FIELDS,
  select,
} from './page-fields.ts'
import type { PageState, PageTask } from './page-html.ts'

/** The drying methods of the registry (drying/methods/), in its order: kind, name, one line. */
const METHODS: [string, string, string][] = METHOD_MODELS.map((m) => [m.kind, m.title, m.hint])

function productStep(n: number, v: Record<string, string>): string {
  return `<fieldset class="step">${legend(n, 'Product')}
<div class="grid">
<div class="field wide"><label for="f-product">From the catalogue</label><select id="f-product" name="product">${productOptions(v.product ?? 'grapes-to-raisins')}</select></div>
<div class="field"><label for="f-profile">…or your own profile (JSON)</label><input id="f-profile" name="profile" type="file" accept=".json,application/json" aria-describedby="f-profile-hint"><small id="f-profile-hint">for example the profile a fit from weighings saves</small></div>
${field('targetWbPct', 'Target moisture [% wet basis]', v, { inputmode: 'decimal', placeholder: "the product's" })}
${field('initialWbPct', 'Initial moisture [% wet basis]', v, { inputmode: 'decimal', placeholder: "the product's" })}
</div>
</fieldset>`
}

function seasonFields(v: Record<string, string>): string {
  return `${field('seasonStart', 'First start day (MM-DD)', v, { placeholder: '06-15', pattern: '\\d{2}-\\d{2}' })}
${field('seasonEnd', 'Last start day (MM-DD)', v, { placeholder: '09-15', pattern: '\\d{2}-\\d{2}' })}
${field('deadlineDays', 'Finish within [days]', v, { inputmode: 'decimal', placeholder: String(ASSESS_DEFAULTS.deadlineDays) })}`
}

function methodParameterFields(v: Record<string, string>): string {
  return `${field('loadingKgPerM2', 'Loading [kg fresh per m²] (open air, shade, solar tunnel, greenhouse)', v, { inputmode: 'decimal', methods: 'open-air shade tunnel greenhouse' })}
${field('collectorAreaM2PerTonne', 'Collector area [m² per tonne] (solar cabinet)', v, { inputmode: 'decimal', placeholder: '100', methods: 'solar-cabinet' })}
${field('setPointC', 'Air set point [°C] (heated; empty = just enough)', v, { inputmode: 'decimal', methods: 'heated' })}
${field('binAirflows', 'Airflows to compare [m³/min per tonne] (bin)', v, { placeholder: '0.5 1 1.5 2 3', methods: 'natural-air-bin', hint: 'one, or several separated by spaces; 1 m³/min per t is about 0.9 cfm/bu of corn' })}
${field('binDepthM', 'Grain depth [m] (bin)', v, { inputmode: 'decimal', placeholder: '4', methods: 'natural-air-bin' })}
${field('binDiameterM', 'Bin diameter [m] (bin)', v, { inputmode: 'decimal', placeholder: '9.1', methods: 'natural-air-bin' })}
${field('heatRiseK', 'Heater rise [K] (bin; empty = no heater)', v, { inputmode: 'decimal', methods: 'natural-air-bin' })}`
}

function heaterStep(n: number, v: Record<string, string>, title: string): string {
  const fuelOptions = FUEL_IDS.map(
    (id) =>
      `<option value="${id}"${v.fuel === id ? ' selected' : ''}>${escapeHtml(FUELS[id].name)} (per ${escapeHtml(FUELS[id].unit)})</option>`,
  ).join('')
  return `<fieldset class="step">${legend(n, title)}
<div class="grid">
<div class="field"><label for="f-fuel">Fuel</label><select id="f-fuel" name="fuel"><option value="">(heater default: propane)</option>${fuelOptions}</select></div>
${field('fuelPrice', 'Your price per fuel unit', v, { inputmode: 'decimal', hint: 'empty = an example price, marked as such' })}
${field('currency', 'Currency of your price', v, { placeholder: 'e.g. EUR, USD, KES', hint: 'shown with every cost' })}
${field('heaterEfficiencyPct', 'Heater efficiency [%]', v, { inputmode: 'decimal', placeholder: '80' })}
</div>
</fieldset>`
}

function reportStep(
  n: number,
  v: Record<string, string>,
  handout: boolean,
  submit: string,
  extra = '',
): string {
  const units = v.units ?? 'si'
  const format = v.format ?? 'page'
  const formats: [string, string][] = [
    ['page', 'this page'],
    ...(handout ? ([['handout', 'two-page summary to print (HTML file)']] as [string, string][]) : []),
    ['html', 'full report (HTML file)'],
    ['csv', 'its tables (CSV file)'],
    ['json', 'the numbers (JSON file)'],
  ]
  return `<fieldset class="step last">${legend(n, 'Report')}
<div class="grid">
<fieldset class="field radios"><legend class="label">Units</legend><label class="inline"><input type="radio" name="units" value="si"${units === 'si' ? ' checked' : ''}> SI (°C, kg, L)</label><label class="inline"><input type="radio" name="units" value="us"${units === 'us' ? ' checked' : ''}> US (°F, lb, gal)</label></fieldset>
<div class="field"><label for="f-format">Answer as</label><select id="f-format" name="format">${formats
    .map(([k, t]) => `<option value="${k}"${format === k ? ' selected' : ''}>${escapeHtml(t)}</option>`)
    .join('')}</select></div>
</div>
${actions(submit, extra)}
</fieldset>`
}

function actions(submit: string, extra = ''): string {
  return `<div class="actions"><button type="submit" id="submit">${escapeHtml(submit)}</button>${extra}<span class="hint">A few seconds per year of hourly data.</span></div>
<div id="status" class="status" role="status" aria-live="polite" hidden><progress id="progress" max="100" aria-label="Progress"></progress><span id="status-text"></span></div>`
}

function errorBox(state: PageState): string {
  return state.error
    ? `<div class="error" id="form-error" role="alert" tabindex="-1"><strong>Please check:</strong> ${escapeHtml(state.error.message)}<br><small>Browsers do not keep a chosen file across pages: choose the file again before you send the form.</small></div>`
    : '<div class="error" id="form-error" role="alert" tabindex="-1" hidden></div>'
}

function formOpen(task: PageTask): string {
  return `<form id="${task === 'assess' ? 'assess' : task}-form" class="card task-form" data-task="${task}" method="post" action="/report" enctype="multipart/form-data" novalidate aria-labelledby="page-title">
<input type="hidden" name="task" value="${task}">`
}

export function assessForm(state: PageState, v: Record<string, string>): string {
  const chosen = state.multi?.method ?? [v.method ?? 'open-air']
  const methodBoxes = METHODS.map(
    ([k, label, hint]) =>
      `<label class="choice"><input type="checkbox" name="method" value="${k}"${chosen.includes(k) ? ' checked' : ''}><span><strong>${escapeHtml(label)}</strong><small>${escapeHtml(hint)}</small></span></label>`,
  ).join('')
  return `${formOpen('assess')}
${errorBox(state)}
<fieldset class="step">${legend(1, 'Weather')}
<div class="field"><label for="f-file">Hourly weather file (CSV or EPW)</label><input id="f-file" name="file" type="file" accept=".csv,.txt,.tsv,.epw,text/csv,text/plain" aria-describedby="f-file-hint"><small id="f-file-hint">Dry bulb and a humidity column at least; time stamps hourly or finer. To compare several sites, use “Compare sites”.</small></div>
${demoBlock(state.demo ?? [], v)}
${fileQuestions(v, state.error?.askFileQuestions === true)}
</fieldset>
${productStep(2, v)}
<fieldset class="step">${legend(3, 'Drying methods and season')}
<fieldset class="choices-group"><legend class="label" id="methods-legend">Methods: one for the full report, two or more side by side</legend><div class="choices">${methodBoxes}</div></fieldset>
<div class="grid">
${seasonFields(v)}
${methodParameterFields(v)}
</div>
</fieldset>
${heaterStep(4, v, 'Heater, fuel and prices (for the heat the air does not give)')}
${reportStep(5, v, true, 'Assess', '<button type="submit" class="secondary" id="check-first" name="task" value="inspect" formnovalidate>Check the file first</button>')}
</form>`
}

function siteRow(i: number, v: Record<string, string>, required: boolean): string {
  const p = `site${i}`
  const fields = SITE_FIELDS.map((f) =>
    field(`${p}.${f.name}`, f.label, v, {
      placeholder: f.placeholder,
      inputmode: f.inputmode,
      list: f.zone ? 'tz-names' : undefined,
    }),
  ).join('')
  return `<fieldset class="site" data-site="${i}"><legend>Site ${i}${required ? '' : ' (optional)'}</legend><div class="site-grid"><div class="field wide"><label for="f-${p}-file">Weather file (CSV or EPW)</label><input id="f-${p}-file" name="${p}.file" type="file" accept=".csv,.txt,.tsv,.epw,text/csv,text/plain"></div>${fields}</div></fieldset>`
}

export function compareForm(state: PageState, v: Record<string, string>): string {
  const max = state.maxSites ?? MAX_SITES
  let rows = 3
  for (let i = 4; i <= max; i++) if (Object.keys(v).some((k) => k.startsWith(`site${i}.`))) rows = i
  rows = Math.min(rows, max)
  const method = v.method ?? 'open-air'
  const radios = METHODS.map(
    ([k, label, hint]) =>
      `<label class="choice"><input type="radio" name="method" value="${k}"${method === k ? ' checked' : ''}><span><strong>${escapeHtml(label)}</strong><small>${escapeHtml(hint)}</small></span></label>`,
  ).join('')
  return `${formOpen('compare')}
${errorBox(state)}
<fieldset class="step">${legend(1, 'Sites')}
<p class="hint" id="sites-hint">Two to ${max} sites. A file that states its own location or clock (an EPW file, a service's export) keeps it; fill in what the file does not say.</p>
<div id="sites" class="sites" data-max="${max}">${Array.from({ length: rows }, (_, k) => siteRow(k + 1, v, k < 2)).join('')}</div>
<p class="no-js-hide"><button type="button" class="secondary" id="add-site">Add a site</button></p>
</fieldset>
${productStep(2, v)}
<fieldset class="step">${legend(3, 'Method and season (the same for every site)')}
<fieldset class="choices-group"><legend class="label">Method</legend><div class="choices">${radios}</div></fieldset>
<div class="grid">
${seasonFields(v)}
${methodParameterFields(v)}
</div>
</fieldset>
${heaterStep(4, v, 'Heater, fuel and prices')}
${reportStep(5, v, false, 'Compare the sites')}
</form>`
}

export function inspectForm(state: PageState, v: Record<string, string>): string {
  return `${formOpen('inspect')}
${errorBox(state)}
<fieldset class="step">${legend(1, 'Weather file')}
<div class="field"><label for="f-file">Hourly weather file (CSV or EPW)</label><input id="f-file" name="file" type="file" accept=".csv,.txt,.tsv,.epw,text/csv,text/plain"></div>
${demoBlock(state.demo ?? [], v)}
${fileQuestions(v, state.error?.askFileQuestions === true || Object.keys(v).some((k) => WEATHER_OPTION_SPECS.some((s) => s.param === k && v[k] !== '')))}
</fieldset>
<fieldset class="step last">${legend(2, 'Show')}
<fieldset class="field radios"><legend class="label">Units</legend><label class="inline"><input type="radio" name="units" value="si"${(v.units ?? 'si') === 'si' ? ' checked' : ''}> SI</label><label class="inline"><input type="radio" name="units" value="us"${v.units === 'us' ? ' checked' : ''}> US</label></fieldset>
${actions('Check the file')}
</fieldset>
</form>`
}

export function fitForm(state: PageState, v: Record<string, string>): string {
  const ref = v.reference ?? 'dryMass'
  const refs: [string, string][] = [
    ['dryMass', 'dry mass of the tray contents [g]'],
    ['initialWb', 'moisture at the first weighing [% wet basis]'],
    ['finalWb', 'moisture at the last weighing [% wet basis]'],
  ]
  return `${formOpen('fit')}
${errorBox(state)}
<fieldset class="step">${legend(1, 'Weighings')}
<div class="field"><label for="f-weighings">Weighings (CSV: a time column and a mass column)</label><input id="f-weighings" name="weighings" type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" aria-describedby="f-weighings-hint"><small id="f-weighings-hint">e.g. elapsed_h,mass_g or time (min), Weight (kg); an empty mass is a missed weighing</small></div>
<fieldset class="field radios wide"><legend class="label">What you know about the moisture</legend>${refs
    .map(
      ([k, t]) =>
        `<label class="inline"><input type="radio" name="reference" value="${k}"${ref === k ? ' checked' : ''}> ${escapeHtml(t)}</label>`,
    )
    .join('')}</fieldset>
<div class="grid">
${field('referenceValue', 'Its value', v, { inputmode: 'decimal', placeholder: 'e.g. 150' })}
${field('thicknessMm', 'Thickness or diameter [mm] (for the diffusion model)', v, { inputmode: 'decimal' })}
${select('shape', 'Shape', v, [
  ['', '(the product’s, or slab)'],
  ['slab', 'slab (slices)'],
  ['cylinder', 'cylinder'],
  ['sphere', 'sphere'],
])}
${field('targetWbPct', 'Target moisture [% wet basis] (for the time to reach it)', v, { inputmode: 'decimal' })}
<div class="field wide"><label for="f-product">Product whose isotherm a saved profile keeps (optional)</label><select id="f-product" name="product">${productOptions(v.product, '(none)')}</select></div>
</div>
</fieldset>
<fieldset class="step last">${legend(2, 'Fit')}
${actions('Fit the weighings')}
</fieldset>
</form>`
}

export function energyForm(state: PageState, v: Record<string, string>): string {
  const fuelOptions: [string, string][] = [
    ['', '(the log’s fuel column)'],
    ...FUEL_IDS.map((id) => [id, FUELS[id].name] as [string, string]),
  ]
  return `${formOpen('energy')}
${errorBox(state)}
<fieldset class="step">${legend(1, 'Batch log')}
<div class="field"><label for="f-log">Batch log (CSV: one row per batch)</label><input id="f-log" name="log" type="file" accept=".csv,.txt,text/csv,text/plain" aria-describedby="f-log-hint"><small id="f-log-hint">start, duration, fresh and final mass or moistures, fuel used; outside temperature and humidity or a weather file</small></div>
<div class="field"><label for="f-weather">Weather file for the batches without outside air (optional)</label><input id="f-weather" name="weather" type="file" accept=".csv,.txt,.tsv,.epw,text/csv,text/plain"></div>
<div class="grid">
${field('baseline', 'Batches in the baseline', v, { inputmode: 'numeric', placeholder: 'half, at most 20' })}
${select('fuel', 'Fuel of rows without one', v, fuelOptions)}
${field('dryingTempC', 'Drying-air temperature [°C] of rows without one', v, { inputmode: 'decimal', placeholder: '60' })}
${field('logUtcOffset', "UTC offset of the log's times [h]", v, { inputmode: 'decimal', placeholder: 'e.g. -6' })}
<div class="field wide"><label for="f-product">Product (adds its heat of sorption; optional)</label><select id="f-product" name="product">${productOptions(v.product, '(none)')}</select></div>
</div>
</fieldset>
<fieldset class="step last">${legend(2, 'Charts')}
${actions('Draw the charts')}
</fieldset>
</form>`
}
