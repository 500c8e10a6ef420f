/**
 * @module web/page-fields
 * The building blocks of the page's forms: a labelled field and select, the weather options from their shared
 * table (weather/option-spec.ts) with the page's placeholders and hints, the searchable list of IANA time
 * zones, the product catalogue grouped by category, the demo files and the file's questions, and the label
 * of every field for messages. Every value echoed back is escaped.
 */
import { ENERGY_OPTION_NAMES, OTHER_OPTION_NAMES } from '../analysis/option-names.ts'
import { canonicalProductId, PRODUCT_CATALOGUE } from '../product/catalogue.ts'
import type { ProductCategory } from '../product/profile.ts'
import { escapeHtml } from '../report/escape.ts'
import { WEATHER_OPTION_SPECS } from '../weather/option-spec.ts'
import type { DemoFile } from './demo-files.ts'

const CATEGORY_NAMES: Record<ProductCategory, string> = {
  grain: 'Grain',
  oilseed: 'Oilseeds',
  fruit: 'Fruit',
  vegetable: 'Vegetables',
  herb: 'Herbs',
  fish: 'Fish',
  'beverage-crop': 'Coffee, cocoa and tea',
}

/** The labels of the page's own fields (the options' that messages name come from their shared tables), for messages. */
export const FIELD_LABELS: Record<string, string> = {
  file: 'Weather file',
  demo: 'Demo site',
  profile: 'Your own product profile',
  targetWbPct: 'Target moisture',
  initialWbPct: 'Initial moisture',
  seasonStart: 'First start day',
  seasonEnd: 'Last start day',
  deadlineDays: 'Finish within',
  loadingKgPerM2: 'Loading',
  collectorAreaM2PerTonne: 'Collector area',
  setPointC: 'Air set point',
  binAirflows: 'Airflows to compare',
  binDepthM: 'Grain depth',
  binDiameterM: 'Bin diameter',
  heatRiseK: 'Heater rise',
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
  startHourLocal: 'Start hour',
  stepDays: 'Start every',
  ...Object.fromEntries(WEATHER_OPTION_SPECS.map((s) => [s.param, s.label])),
  // the labels of the options that core messages name, from the one table of option names
  ...Object.fromEntries(
    [...OTHER_OPTION_NAMES, ...ENERGY_OPTION_NAMES].flatMap((o) => (o.field ? [[o.field, o.label]] : [])),
  ),
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

/** The label of a form field (a site's field `site2.lat` reads “Site 2: Latitude”). */
export function fieldLabel(name: string): string {
  const site = /^site(\d+)\.(\w+)$/.exec(name)
  if (site)
    return `Site ${site[1]}: ${site[2] === 'file' ? 'Weather file (CSV or EPW)' : (SITE_FIELDS.find((f) => f.name === site[2])?.label ?? site[2])}`
  return FIELD_LABELS[name] ?? name
}

export function attr(v: string | undefined): string {
  return escapeHtml(v ?? '')
}

export interface FieldOptions {
  hint?: string
  placeholder?: string
  inputmode?: string
  type?: string
  pattern?: string
  methods?: string
  list?: string
  wide?: boolean
}

export function field(
  name: string,
  label: string,
  values: Record<string, string>,
  o: FieldOptions = {},
): string {
  const id = `f-${name.replace('.', '-')}`
  const classes = ['field', o.methods ? 'method-only' : '', o.wide ? 'wide' : ''].filter(Boolean).join(' ')
  const described = o.hint ? ` aria-describedby="${id}-hint"` : ''
  return `<div class="${classes}"${o.methods ? ` data-methods="${o.methods}"` : ''}><label for="${id}">${escapeHtml(label)}</label><input id="${id}" name="${name}" type="${o.type ?? 'text'}"${o.inputmode ? ` inputmode="${o.inputmode}"` : ''}${o.placeholder ? ` placeholder="${attr(o.placeholder)}"` : ''}${o.pattern ? ` pattern="${attr(o.pattern)}"` : ''}${o.list ? ` list="${o.list}" autocomplete="off" spellcheck="false"` : ''} value="${attr(values[name])}"${described}>${o.hint ? `<small id="${id}-hint">${escapeHtml(o.hint)}</small>` : ''}</div>`
}

export function select(
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
export function weatherFields(group: 'site' | 'columns', values: Record<string, string>): string {
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

export function timeZoneList(): string {
  return `<datalist id="tz-names">${timeZoneNames()
    .map((z) => `<option value="${escapeHtml(z)}"></option>`)
    .join('')}</datalist>`
}

export function productOptions(asked: string | undefined, none?: string): string {
  // An older id still accepted (a saved link) selects the profile it now names.
  const selected = asked === undefined ? undefined : canonicalProductId(asked)
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

export function legend(n: number, text: string): string {
  return `<legend><span class="n" aria-hidden="true">${n}</span> ${escapeHtml(text)}</legend>`
}

export function demoBlock(demo: readonly DemoFile[], v: Record<string, string>): string {
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

export function fileQuestions(v: Record<string, string>, open: boolean): string {
  return `<details id="file-questions" class="questions"${open ? ' open' : ''}><summary>Site, time zone and columns${open ? ' (needed for this file)' : ' (only if the file does not say)'}</summary>
<div class="grid">
${weatherFields('site', v)}
</div>
<div class="grid">
${weatherFields('columns', v)}
</div>
</details>`
}
