/**
 * @module web/page-html
 * The page: one form per job, each on its own address so it works as a plain multipart post without
 * JavaScript (POST /report answers with the page and the result above the form) and /app.js enhances it
 * (upload progress, the result inline, downloads):
 * - `/` assess a site (one method for the full report, several side by side), with "check the file first";
 * - `/compare` sites side by side, each site with its own file, location and clock;
 * - `/inspect` how a weather file is understood; `/fit` drying speed from weighings; `/energy` energy charts.
 * Questions about the file (time zone, site, column mapping) sit in a section that opens when the reader
 * needs them; the time zones are a searchable list of IANA names. Every value echoed back is escaped.
 */

import { ASSESS_DEFAULTS } from '../analysis/plan.ts'
import { FUELS } from '../drying/fuels.ts'
import { FUEL_IDS } from '../drying/method.ts'
import { METHOD_MODELS } from '../drying/methods/index.ts'
import { PRODUCT_CATALOGUE } from '../product/catalogue.ts'
import type { ProductCategory } from '../product/profile.ts'
import { escapeHtml } from '../report/escape.ts'
import { WEATHER_OPTION_SPECS } from '../weather/option-spec.ts'
import type { DemoFile } from './demo-files.ts'
import { MAX_SITES } from './form-input.ts'

export type PageTask = 'assess' | 'compare' | 'inspect' | 'fit' | 'energy'

export interface TaskInfo {
  path: string
  /** The link text in the navigation. */
  nav: string
  /** The page's heading. */
  title: string
  /** Who it is for and what it answers, in one sentence. */
  intro: string
}

export const PAGE_TASKS: Record<PageTask, TaskInfo> = {
  assess: {
    path: '/',
    nav: 'Assess a site',
    title: 'Can this weather dry this crop?',
    intro:
      'One weather file and one product: choose one drying method for the full report, or several to see them side by side. The report starts with a two-page summary to print and hand out.',
  },
  compare: {
    path: '/compare',
    nav: 'Compare sites',
    title: 'Which site dries best?',
    intro:
      'One weather file per candidate site, each with its own location and clock, assessed for the same product, method and season and ranked by a stated rule.',
  },
  inspect: {
    path: '/inspect',
    nav: 'Check a weather file',
    title: 'How does dryhours read this weather file?',
    intro:
      'Before you assess: which columns and units were taken, the clock of the time stamps, each variable at a glance, months with little data, and every problem with its line.',
  },
  fit: {
    path: '/fit',
    nav: 'Fit from weighings',
    title: 'How fast does your product dry?',
    intro:
      'Weigh a tray as it dries and upload the weighings: dryhours fits the drying curve (Lewis, Page, diffusion) and says which fits best.',
  },
  energy: {
    path: '/energy',
    nav: 'Energy charts',
    title: 'Is the dryer using more energy than it should?',
    intro:
      'A log of batches (fuel used, water removed) on control charts that allow for the weather, with the batch where a change most likely began.',
  },
}

export const TASK_IDS = Object.keys(PAGE_TASKS) as PageTask[]

export interface PageState {
  /** Which job the page shows (default: assess). */
  task?: PageTask
  demo?: readonly DemoFile[]
  /** The server's limit of files per comparison (default {@link MAX_SITES}). */
  maxSites?: number
  /** Form values to show again (after an error or with a result). */
  values?: Record<string, string>
  /** Values given several times (the methods chosen). */
  multi?: Record<string, string[]>
  /** A message for the user, the field it concerns, and whether the file questions should be open. */
  error?: { message: string; askFileQuestions: boolean; field?: string }
  /** The result article to show above the form (no-JavaScript result). */
  result?: string
}

const CATEGORY_NAMES: Record<ProductCategory, string> = {
  grain: 'Grain',
  oilseed: 'Oilseeds',
  fruit: 'Fruit',
  vegetable: 'Vegetables',
  herb: 'Herbs',
  fish: 'Fish',
  'beverage-crop': 'Coffee, cocoa and tea',
}

/** The drying methods of the registry (drying/methods/), in its order: kind, name, one line. */
const METHODS: [string, string, string][] = METHOD_MODELS.map((m) => [m.kind, m.title, m.hint])

/** The labels of the page's own fields (the weather options' come from their shared table), for messages. */
export const FIELD_LABELS: Record<string, string> = {
  file: 'Weather file',
  demo: 'Demo site',
  product: 'Product',
  profile: 'Your own product profile',
  targetWbPct: 'Target moisture',
  initialWbPct: 'Initial moisture',
  method: 'Drying method',
  seasonStart: 'First start day',
  seasonEnd: 'Last start day',
  deadlineDays: 'Finish within',
  loadingKgPerM2: 'Loading',
  collectorAreaM2PerTonne: 'Collector area',
  setPointC: 'Air set point',
  fuel: 'Fuel',
  fuelPrice: 'Your price per fuel unit',
  currency: 'Currency',
  heaterEfficiencyPct: 'Heater efficiency',
  units: 'Units',
  format: 'Answer as',
  log: 'Batch log',
  weather: 'Weather file',
  weighings: 'Weighings file',
  reference: 'Moisture reference',
  referenceValue: 'Its value',
  thicknessMm: 'Thickness',
  shape: 'Shape',
  baseline: 'Batches in the baseline',
  dryingTempC: 'Drying-air temperature',
  logUtcOffset: "UTC offset of the log's times",
  startHourLocal: 'Start hour',
  stepDays: 'Start every',
  ...Object.fromEntries(WEATHER_OPTION_SPECS.map((s) => [s.param, s.label])),
}

/** The label of a form field (a site's field `site2.lat` reads “Site 2: Latitude”). */
export function fieldLabel(name: string): string {
  const site = /^site(\d+)\.(\w+)$/.exec(name)
  if (site)
    return `Site ${site[1]}: ${site[2] === 'file' ? 'Weather file (CSV or EPW)' : (SITE_FIELDS.find((f) => f.name === site[2])?.label ?? site[2])}`
  return FIELD_LABELS[name] ?? name
}

function attr(v: string | undefined): string {
  return escapeHtml(v ?? '')
}

interface FieldOptions {
  hint?: string
  placeholder?: string
  inputmode?: string
  type?: string
  pattern?: string
  methods?: string
  list?: string
  wide?: boolean
}

function field(name: string, label: string, values: Record<string, string>, o: FieldOptions = {}): string {
  const id = `f-${name.replace('.', '-')}`
  const classes = ['field', o.methods ? 'method-only' : '', o.wide ? 'wide' : ''].filter(Boolean).join(' ')
  const described = o.hint ? ` aria-describedby="${id}-hint"` : ''
  return `<div class="${classes}"${o.methods ? ` data-methods="${o.methods}"` : ''}><label for="${id}">${escapeHtml(label)}</label><input id="${id}" name="${name}" type="${o.type ?? 'text'}"${o.inputmode ? ` inputmode="${o.inputmode}"` : ''}${o.placeholder ? ` placeholder="${attr(o.placeholder)}"` : ''}${o.pattern ? ` pattern="${attr(o.pattern)}"` : ''}${o.list ? ` list="${o.list}" autocomplete="off" spellcheck="false"` : ''} value="${attr(values[name])}"${described}>${o.hint ? `<small id="${id}-hint">${escapeHtml(o.hint)}</small>` : ''}</div>`
}

function select(
  name: string,
  label: string,
  values: Record<string, string>,
  options: [string, string][],
  o: { hint?: string } = {},
): string {
  const id = `f-${name.replace('.', '-')}`
  return `<div class="field"><label for="${id}">${escapeHtml(label)}</label><select id="${id}" name="${name}"${o.hint ? ` aria-describedby="${id}-hint"` : ''}>${options
    .map(
      ([v, text]) =>
        `<option value="${attr(v)}"${(values[name] ?? '') === v ? ' selected' : ''}>${escapeHtml(text)}</option>`,
    )
    .join('')}</select>${o.hint ? `<small id="${id}-hint">${escapeHtml(o.hint)}</small>` : ''}</div>`
}

/** Page-only presentation of the weather options (placeholders, hints); names and labels come from the shared table. */
const WEATHER_FIELD_HINTS: Record<
  string,
  { placeholder?: string; hint?: string; inputmode?: string; choices?: string[]; zone?: boolean }
> = {
  siteName: { placeholder: 'e.g. north field' },
  lat: { inputmode: 'decimal', placeholder: 'e.g. 38.3' },
  lon: { inputmode: 'decimal', placeholder: 'e.g. -2.6 (west is negative)' },
  elevation: { inputmode: 'decimal' },
  utcOffset: {
    inputmode: 'decimal',
    placeholder: 'e.g. -6',
    hint: '0 for UTC; or give the time zone instead',
  },
  tz: {
    placeholder: 'type to search, e.g. America/Chicago',
    hint: 'when the time stamps follow daylight saving',
    zone: true,
  },
  siteTz: {
    placeholder: 'type to search, e.g. Europe/Madrid',
    hint: "the site's own clock, for local hours and start times",
    zone: true,
  },
  map: {
    placeholder: 'dryBulb=Temp:F\nrelativeHumidity=RH',
    hint: 'variable=column or variable=column:unit, only for columns that are not recognised',
  },
  labels: {
    placeholder: 'end\nghi=end:60',
    hint: 'start or end of the interval a time stamp labels; per variable, e.g. rain=end:60 for rain over the preceding hour',
  },
  dateOrder: { choices: ['', 'mdy', 'dmy', 'ymd'] },
  headerLine: { inputmode: 'numeric' },
  sampling: { choices: ['', 'readings', 'reports'] },
  windHeight: { inputmode: 'decimal', placeholder: '10' },
}

/** The weather option fields of one group, from the shared option table (weather/option-spec.ts). */
function weatherFields(group: 'site' | 'columns', values: Record<string, string>): string {
  return WEATHER_OPTION_SPECS.filter((s) => s.group === group)
    .map((s) => {
      const h = WEATHER_FIELD_HINTS[s.param] ?? {}
      const id = `f-${s.param}`
      const hint = h.hint ? `<small id="${id}-hint">${escapeHtml(h.hint)}</small>` : ''
      const described = h.hint ? ` aria-describedby="${id}-hint"` : ''
      if (s.multiple)
        return `<div class="field"><label for="${id}">${escapeHtml(s.label)}</label><textarea id="${id}" name="${s.param}" rows="2"${h.placeholder ? ` placeholder="${attr(h.placeholder).replaceAll('\n', '&#10;')}"` : ''}${described}>${escapeHtml(values[s.param] ?? '')}</textarea>${hint}</div>`
      if (h.choices)
        return `<div class="field"><label for="${id}">${escapeHtml(s.label)}</label><select id="${id}" name="${s.param}">${h.choices
          .map(
            (c) =>
              `<option value="${c}"${(values[s.param] ?? '') === c ? ' selected' : ''}>${c === '' ? '(detect)' : c}</option>`,
          )
          .join('')}</select></div>`
      return field(s.param, s.label, values, {
        placeholder: h.placeholder,
        hint: h.hint,
        inputmode: h.inputmode,
        list: h.zone ? 'tz-names' : undefined,
      })
    })
    .join('\n')
}

/** IANA time-zone names the server knows (the same `Intl` the reader checks a zone with), sorted. */
export function timeZoneNames(): string[] {
  const intl = Intl as unknown as { supportedValuesOf?: (key: string) => string[] }
  const names = typeof intl.supportedValuesOf === 'function' ? intl.supportedValuesOf('timeZone') : []
  return [...new Set(['UTC', ...names])].sort()
}

function timeZoneList(): string {
  return `<datalist id="tz-names">${timeZoneNames()
    .map((z) => `<option value="${escapeHtml(z)}"></option>`)
    .join('')}</datalist>`
}

function productOptions(selected: string | undefined, none?: string): string {
  const groups = new Map<ProductCategory, string[]>()
  for (const p of PRODUCT_CATALOGUE) {
    const list = groups.get(p.category) ?? []
    list.push(
      `<option value="${attr(p.id)}"${p.id === selected ? ' selected' : ''}>${escapeHtml(p.name)}</option>`,
    )
    groups.set(p.category, list)
  }
  return (
    (none !== undefined ? `<option value="">${escapeHtml(none)}</option>` : '') +
    [...groups.entries()]
      .map(
        ([c, opts]) => `<optgroup label="${escapeHtml(CATEGORY_NAMES[c] ?? c)}">${opts.join('')}</optgroup>`,
      )
      .join('')
  )
}

function legend(n: number, text: string): string {
  return `<legend><span class="n" aria-hidden="true">${n}</span> ${escapeHtml(text)}</legend>`
}

function demoBlock(demo: readonly DemoFile[], v: Record<string, string>): string {
  return demo.length
    ? `<div class="field"><label for="f-demo">…or a demo site</label><select id="f-demo" name="demo" aria-describedby="f-demo-hint"><option value="">(none)</option>${demo
        .map(
          (d) =>
            `<option value="${attr(d.file)}"${v.demo === d.file ? ' selected' : ''}>${escapeHtml(d.label)}</option>`,
        )
        .join(
          '',
        )}</select><small id="f-demo-hint">Invented sites with generated weather, for trying the page.</small></div>`
    : `<p class="hint">No demo files on this server: the repository's <code>climate-demo/</code> folder holds some to upload.</p>`
}

function fileQuestions(v: Record<string, string>, open: boolean): string {
  return `<details id="file-questions" class="questions"${open ? ' open' : ''}><summary>Site, time zone and columns${open ? ' (needed for this file)' : ' (only if the file does not say)'}</summary>
<div class="grid">
${weatherFields('site', v)}
</div>
<div class="grid">
${weatherFields('columns', v)}
</div>
</details>`
}

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
  return `${field('loadingKgPerM2', 'Loading [kg fresh per m²] (open air, shade)', v, { inputmode: 'decimal', methods: 'open-air shade' })}
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

function assessForm(state: PageState, v: Record<string, string>): string {
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

/** The per-site fields of the sites table (each site also takes the shared options of the form). */
export const SITE_FIELDS: {
  name: string
  label: string
  placeholder?: string
  inputmode?: string
  zone?: boolean
}[] = [
  { name: 'name', label: 'Site name', placeholder: 'e.g. north farm' },
  { name: 'lat', label: 'Latitude [°]', placeholder: 'e.g. 38.3', inputmode: 'decimal' },
  { name: 'lon', label: 'Longitude [°, west negative]', placeholder: 'e.g. -2.6', inputmode: 'decimal' },
  { name: 'elevation', label: 'Elevation [m]', inputmode: 'decimal' },
  { name: 'siteTz', label: "Site's time zone", placeholder: 'type to search', zone: true },
  {
    name: 'tz',
    label: "Time zone of the file's time stamps",
    placeholder: 'if they follow daylight saving',
    zone: true,
  },
]

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

function compareForm(state: PageState, v: Record<string, string>): string {
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

function inspectForm(state: PageState, v: Record<string, string>): string {
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

function fitForm(state: PageState, v: Record<string, string>): string {
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

function energyForm(state: PageState, v: Record<string, string>): string {
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

export function renderPage(state: PageState = {}): string {
  const task = state.task ?? 'assess'
  const info = PAGE_TASKS[task]
  const v = state.values ?? {}
  const formHtml =
    task === 'compare'
      ? compareForm(state, v)
      : task === 'inspect'
        ? inspectForm(state, v)
        : task === 'fit'
          ? fitForm(state, v)
          : task === 'energy'
            ? energyForm(state, v)
            : assessForm(state, v)
  // the field a message is about: marked for screen readers (and outlined) where the form has it
  const bad = state.error?.field
  const form =
    bad && /^[A-Za-z0-9.]+$/.test(bad)
      ? formHtml.replace(
          new RegExp(`( name="${bad.replace('.', '\\.')}")(?![^>]*aria-invalid)`),
          '$1 aria-invalid="true"',
        )
      : formHtml
  const nav = TASK_IDS.map(
    (t) =>
      `<li><a href="${PAGE_TASKS[t].path}"${t === task ? ' aria-current="page"' : ''}>${escapeHtml(PAGE_TASKS[t].nav)}</a></li>`,
  ).join('')
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<title>dryhours – ${escapeHtml(info.nav.toLowerCase())}</title>
<link rel="icon" href="data:,">
<link rel="stylesheet" href="/app.css">
<script src="/app.js" defer></script>
</head>
<body data-task="${task}">
<a class="skip" href="#main">Skip to the form</a>
<header class="masthead"><div class="wrap"><p class="brand">dryhours</p><p class="tagline">Can this site’s weather dry this crop, when, how fast, and with how much heat?</p>
<nav aria-label="What to do"><ul>${nav}<li><a href="/docs">API</a></li></ul></nav></div></header>
<main id="main" class="wrap" tabindex="-1">
<h1 id="page-title" class="page-title">${escapeHtml(info.title)}</h1>
<p class="intro">${escapeHtml(info.intro)}</p>
${state.result ? `<div id="result-first" class="result">${state.result}<p class="again no-print"><a href="#${task === 'assess' ? 'assess' : task}-form">Change the inputs and send again ↓</a></p></div>` : ''}
${form}
<div id="downloads" class="downloads" hidden></div>
<div id="result" class="result" tabindex="-1" aria-label="Result"></div>
${timeZoneList()}
</main>
<footer class="wrap page-foot">dryhours: open methods, named sources. Results are estimates from the weather file; see the cautions in each report.</footer>
</body>
</html>
`
}
