/**
 * @module web/page-html
 * The page at `/`: one form that works as a plain multipart post without JavaScript (POST /report answers
 * with this page and the report below it) and that /app.js enhances (upload progress, the report inline,
 * downloads). Questions about the file (time zone, site, column mapping) sit in a section that opens
 * when the reader needs them. Every value echoed back into the form is escaped.
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

export interface PageState {
  demo?: readonly DemoFile[]
  /** The server's limit of files per comparison (default {@link MAX_SITES}). */
  maxSites?: number
  /** Form values to show again (after an error or with a result). */
  values?: Record<string, string>
  /** A message for the user, and whether the file questions should be open. */
  error?: { message: string; askFileQuestions: boolean }
  /** The report article to show below the form (no-JavaScript result). */
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

function attr(v: string | undefined): string {
  return escapeHtml(v ?? '')
}

function field(
  name: string,
  label: string,
  values: Record<string, string>,
  o: {
    hint?: string
    placeholder?: string
    inputmode?: string
    type?: string
    pattern?: string
    methods?: string
  } = {},
): string {
  const id = `f-${name}`
  return `<div class="field${o.methods ? ' method-only' : ''}"${o.methods ? ` data-methods="${o.methods}"` : ''}><label for="${id}">${escapeHtml(label)}</label><input id="${id}" name="${name}" type="${o.type ?? 'text'}"${o.inputmode ? ` inputmode="${o.inputmode}"` : ''}${o.placeholder ? ` placeholder="${attr(o.placeholder)}"` : ''}${o.pattern ? ` pattern="${attr(o.pattern)}"` : ''} value="${attr(values[name])}"${o.hint ? ` aria-describedby="${id}-hint"` : ''}>${o.hint ? `<small id="${id}-hint">${escapeHtml(o.hint)}</small>` : ''}</div>`
}

/** Page-only presentation of the weather options (placeholders, hints); names and labels come from the shared table. */
const WEATHER_FIELD_HINTS: Record<
  string,
  { placeholder?: string; hint?: string; inputmode?: string; choices?: string[] }
> = {
  siteName: { placeholder: 'e.g. north field' },
  lat: { inputmode: 'decimal' },
  lon: { inputmode: 'decimal' },
  elevation: { inputmode: 'decimal' },
  utcOffset: {
    inputmode: 'decimal',
    placeholder: 'e.g. -6',
    hint: '0 for UTC; or give the time zone instead',
  },
  tz: { placeholder: 'e.g. America/Chicago', hint: 'IANA name, when the time stamps follow daylight saving' },
  siteTz: { placeholder: 'e.g. Europe/Madrid', hint: 'when the file is in UTC and does not say where' },
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
      })
    })
    .join('\n')
}

function productOptions(selected: string | undefined): string {
  const groups = new Map<ProductCategory, string[]>()
  for (const p of PRODUCT_CATALOGUE) {
    const list = groups.get(p.category) ?? []
    list.push(
      `<option value="${attr(p.id)}"${p.id === selected ? ' selected' : ''}>${escapeHtml(p.name)}</option>`,
    )
    groups.set(p.category, list)
  }
  return [...groups.entries()]
    .map(([c, opts]) => `<optgroup label="${escapeHtml(CATEGORY_NAMES[c] ?? c)}">${opts.join('')}</optgroup>`)
    .join('')
}

export function renderPage(state: PageState = {}): string {
  const v = state.values ?? {}
  const demo = state.demo ?? []
  const method = v.method ?? 'open-air'
  const units = v.units ?? 'si'
  const product = v.product ?? 'grapes-to-raisins'
  const ask = state.error?.askFileQuestions === true
  const demoBlock = demo.length
    ? `<div class="field"><label for="f-demo">…or a demo site</label><select id="f-demo" name="demo"><option value="">(none)</option>${demo
        .map(
          (d) =>
            `<option value="${attr(d.file)}"${v.demo === d.file ? ' selected' : ''}>${escapeHtml(d.label)}</option>`,
        )
        .join('')}</select><small>Invented sites with generated weather, for trying the page.</small></div>`
    : `<p class="hint">No demo files on this server: the repository's <code>climate-demo/</code> folder holds some to upload.</p>`
  const methodRadios = METHODS.map(
    ([k, label, hint]) =>
      `<label class="choice"><input type="radio" name="method" value="${k}"${method === k ? ' checked' : ''}><span><strong>${escapeHtml(label)}</strong><small>${escapeHtml(hint)}</small></span></label>`,
  ).join('')
  const fuelOptions = FUEL_IDS.map(
    (id) =>
      `<option value="${id}"${v.fuel === id ? ' selected' : ''}>${escapeHtml(FUELS[id].name)} (per ${escapeHtml(FUELS[id].unit)})</option>`,
  ).join('')
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<title>dryhours – can this weather dry this crop?</title>
<link rel="icon" href="data:,">
<link rel="stylesheet" href="/app.css">
<script src="/app.js" defer></script>
</head>
<body>
<a class="skip" href="#main">Skip to the form</a>
<header class="masthead"><div class="wrap"><p class="brand">dryhours</p><p class="tagline">Can this site’s weather dry this crop, when, how fast, and with how much heat?</p><nav><a href="/docs">API</a></nav></div></header>
<main id="main" class="wrap">
${state.result ? `<div id="result-first" class="result">${state.result}<p class="again no-print"><a href="#assess-form">Change the inputs and assess again ↓</a></p></div>` : ''}
<form id="assess-form" class="card" method="post" action="/report" enctype="multipart/form-data" novalidate>
${state.error ? `<div class="error" id="form-error" role="alert"><strong>Please check:</strong> ${escapeHtml(state.error.message)}<br><small>Browsers do not keep a chosen file across pages: choose the weather file again before you assess.</small></div>` : '<div class="error" id="form-error" role="alert" hidden></div>'}
<fieldset class="step"><legend><span class="n">1</span> Weather</legend>
<div class="field"><label for="f-file">Hourly weather file (CSV or EPW)</label><input id="f-file" name="file" type="file" accept=".csv,.txt,.tsv,.epw,text/csv,text/plain" multiple aria-describedby="f-file-hint"><small id="f-file-hint">One file for a report; up to ${state.maxSites ?? MAX_SITES} files to compare sites. Dry bulb and a humidity column at least; time stamps hourly.</small></div>
${demoBlock}
<details id="file-questions" class="questions"${ask ? ' open' : ''}><summary>Site, time zone and columns${ask ? ' (needed for this file)' : ' (only if the file does not say)'}</summary>
<div class="grid">
${weatherFields('site', v)}
</div>
<div class="grid">
${weatherFields('columns', v)}
</div>
</details>
</fieldset>
<fieldset class="step"><legend><span class="n">2</span> Product</legend>
<div class="grid">
<div class="field wide"><label for="f-product">From the catalogue</label><select id="f-product" name="product">${productOptions(product)}</select></div>
<div class="field"><label for="f-profile">…or your own profile (JSON)</label><input id="f-profile" name="profile" type="file" accept=".json,application/json"></div>
${field('targetWbPct', 'Target moisture [% wet basis]', v, { inputmode: 'decimal', placeholder: "the product's" })}
${field('initialWbPct', 'Initial moisture [% wet basis]', v, { inputmode: 'decimal', placeholder: "the product's" })}
</div>
</fieldset>
<fieldset class="step"><legend><span class="n">3</span> Method and season</legend>
<div class="choices" role="radiogroup">${methodRadios}</div>
<div class="grid">
${field('seasonStart', 'First start day (MM-DD)', v, { placeholder: '06-15', pattern: '\\d{2}-\\d{2}' })}
${field('seasonEnd', 'Last start day (MM-DD)', v, { placeholder: '09-15', pattern: '\\d{2}-\\d{2}' })}
${field('deadlineDays', 'Finish within [days]', v, { inputmode: 'decimal', placeholder: String(ASSESS_DEFAULTS.deadlineDays) })}
${field('loadingKgPerM2', 'Loading [kg fresh per m²] (open air, shade, solar tunnel)', v, { inputmode: 'decimal', methods: 'open-air shade tunnel' })}
${field('collectorAreaM2PerTonne', 'Collector area [m² per tonne] (solar cabinet)', v, { inputmode: 'decimal', placeholder: '100', methods: 'solar-cabinet' })}
${field('setPointC', 'Air set point [°C] (heated; empty = just enough)', v, { inputmode: 'decimal', methods: 'heated' })}
${field('binAirflows', 'Airflows to compare [m³/min per tonne] (bin)', v, { placeholder: '0.5 1 1.5 2 3', methods: 'natural-air-bin', hint: 'one, or several separated by spaces; 1 m³/min per t is about 0.9 cfm/bu of corn' })}
${field('binDepthM', 'Grain depth [m] (bin)', v, { inputmode: 'decimal', placeholder: '4', methods: 'natural-air-bin' })}
${field('binDiameterM', 'Bin diameter [m] (bin)', v, { inputmode: 'decimal', placeholder: '9.1', methods: 'natural-air-bin' })}
${field('heatRiseK', 'Heater rise [K] (bin; empty = no heater)', v, { inputmode: 'decimal', methods: 'natural-air-bin' })}
</div>
<details class="questions"><summary>Heater and fuel for supplemental heat</summary><div class="grid">
<div class="field"><label for="f-fuel">Fuel</label><select id="f-fuel" name="fuel"><option value="">(heater default: propane)</option>${fuelOptions}</select></div>
${field('fuelPrice', 'Your price per fuel unit', v, { inputmode: 'decimal', hint: 'empty = an example price, marked as such' })}
${field('heaterEfficiencyPct', 'Heater efficiency [%]', v, { inputmode: 'decimal', placeholder: '80' })}
</div></details>
</fieldset>
<fieldset class="step last"><legend><span class="n">4</span> Report</legend>
<div class="grid">
<div class="field"><span class="label">Units</span><label class="inline"><input type="radio" name="units" value="si"${units === 'si' ? ' checked' : ''}> SI (°C, kg, L)</label><label class="inline"><input type="radio" name="units" value="us"${units === 'us' ? ' checked' : ''}> US (°F, lb, gal)</label></div>
<div class="field"><label for="f-format">Answer as</label><select id="f-format" name="format"><option value="page"${(v.format ?? 'page') === 'page' ? ' selected' : ''}>this page</option><option value="html"${v.format === 'html' ? ' selected' : ''}>HTML file (download)</option><option value="csv"${v.format === 'csv' ? ' selected' : ''}>CSV tables (download)</option><option value="json"${v.format === 'json' ? ' selected' : ''}>JSON (download)</option></select></div>
</div>
<div class="actions"><button type="submit" id="submit">Assess</button><span class="hint">A few seconds per year of hourly data.</span></div>
<div id="status" class="status" aria-live="polite" hidden><progress id="progress" max="100"></progress><span id="status-text"></span></div>
</fieldset>
</form>
<div id="downloads" class="downloads" hidden></div>
<div id="result" class="result"></div>
</main>
<footer class="wrap page-foot">dryhours: open methods, named sources. Results are estimates from the weather file; see the cautions in each report.</footer>
</body>
</html>
`
}
