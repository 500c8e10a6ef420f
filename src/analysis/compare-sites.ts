/**
 * @module analysis/compare-sites
 * Sites with their own settings, for comparing them (`compare --sites`) or assessing each (`assess
 * --sites`): one site per row of a table (a CSV file on the command line, a JSON array in the API) with its
 * name, its weather file and any weather option of `weather/option-spec.ts` as further columns, named by
 * the API parameter (= the page's form field), the CLI flag without dashes or the reader's key: `lat`,
 * `lon`, `elevation`, `tz`, `siteTz`, `utcOffset`, `map`, `labels` … A multi-valued option (`map`,
 * `labels`) holds its values separated by `;`. An empty cell gives nothing. Every message names the site
 * and its file. Runtime-neutral: the entry points read the files.
 */
import Papa from 'papaparse'
import { optionSpec, WEATHER_OPTION_SPECS, type WeatherOptionSpec } from '../weather/option-spec.ts'
import {
  checkWeatherOptions,
  WeatherOptionError,
  WeatherOptionsInvalid,
  weatherOptionsFromTexts,
} from '../weather/option-texts.ts'
import type { WeatherReadOptions } from '../weather/options.ts'
import { snippet } from '../weather/snippet.ts'

/** One site: its name, its weather file (as written in the table) and its weather options. */
export interface SiteSpec {
  name: string
  file: string
  weather: WeatherReadOptions
  /** Where the site was written: `sites.csv line 3`, `sites[2]`. */
  where: string
}

/** Most sites one table may hold (a table is read whole; the API has its own, lower limit). */
export const MAX_SITES_IN_TABLE = 1000

/** A site table that cannot be used: the message names the site, its file and the column. */
export class SiteTableError extends RangeError {
  override name = 'SiteTableError'
}

/** The columns a sites table accepts besides `name` and `file`, in words for messages. */
export function siteColumnsText(): string {
  return WEATHER_OPTION_SPECS.map((s) => s.param).join(', ')
}

/** The weather option a column header names (API parameter, CLI flag or reader key), if any. */
function columnSpec(header: string): WeatherOptionSpec | undefined {
  const h = header.trim()
  return optionSpec(h) ?? optionSpec(h.replace(/^--/, ''))
}

/**
 * One site from its cells: `name` and `file` required, every other key a weather option. `where` says
 * where the site was written, for messages.
 */
export function siteFromCells(cells: Record<string, unknown>, where: string): SiteSpec {
  const text = (v: unknown): string | undefined =>
    v === undefined || v === null ? undefined : typeof v === 'string' ? v : String(v)
  const name = (text(cells.name) ?? '').trim()
  const file = (text(cells.file) ?? '').trim()
  const label =
    name === '' ? where : `${where} (site '${snippet(name)}'${file ? `, file ${snippet(file)}` : ''})`
  if (name === '') throw new SiteTableError(`${where}: the site has no name (column name)`)
  if (file === '') throw new SiteTableError(`${label}: the site has no weather file (column file)`)
  const byOption = new Map<WeatherOptionSpec, string>()
  for (const [key, value] of Object.entries(cells)) {
    if (key === 'name' || key === 'file') continue
    const spec = columnSpec(key)
    if (spec === undefined) {
      throw new SiteTableError(
        `${label}: unknown column '${snippet(key)}'; a site takes name, file and the weather options ${siteColumnsText()}`,
      )
    }
    if (byOption.has(spec)) throw new SiteTableError(`${label}: ${spec.param} is given twice`)
    const t = text(value)
    if (t !== undefined && t.trim() !== '') byOption.set(spec, t)
  }
  // a site's own name is its site name unless a column gives one
  if (!byOption.has(optionSpec('siteName') as WeatherOptionSpec))
    byOption.set(optionSpec('siteName') as WeatherOptionSpec, name)
  let weather: WeatherReadOptions
  try {
    const raw = weatherOptionsFromTexts((s) => {
      const v = byOption.get(s)
      return v === undefined ? undefined : [v]
    }, 'query')
    weather = checkWeatherOptions(raw, 'query')
  } catch (e) {
    if (e instanceof WeatherOptionError || e instanceof WeatherOptionsInvalid)
      throw new SiteTableError(`${label}: ${e.message}`)
    throw e
  }
  return { name, file, weather, where: label }
}

/** Names must differ: reports and output files are named after them. */
function checkDistinct(sites: SiteSpec[]): void {
  const seen = new Map<string, SiteSpec>()
  for (const s of sites) {
    const key = s.name.toLowerCase()
    const before = seen.get(key)
    if (before) throw new SiteTableError(`${s.where}: the name is used twice (also ${before.where})`)
    seen.set(key, s)
  }
}

/**
 * Sites from the text of a sites table (CSV with a header row; comma, semicolon or tab separated;
 * `#` lines are comments). `source` names the table in messages (its file name).
 */
export function parseSitesCsv(text: string, source: string): SiteSpec[] {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text
  const parsed = Papa.parse<string[]>(body, { skipEmptyLines: 'greedy', comments: '#' })
  const rows = parsed.data
  if (rows.length === 0) throw new SiteTableError(`${source}: no header row (name,file,lat,lon,…)`)
  const header = rows[0].map((h) => h.trim())
  for (const required of ['name', 'file']) {
    if (!header.includes(required)) {
      throw new SiteTableError(
        `${source}: the header must name the columns name and file (and any of ${siteColumnsText()}); it has ${header.map((h) => snippet(h)).join(', ')}`,
      )
    }
  }
  const twice = header.find((h, i) => header.indexOf(h) !== i)
  if (twice !== undefined) throw new SiteTableError(`${source}: the column ${snippet(twice)} is named twice`)
  if (rows.length - 1 > MAX_SITES_IN_TABLE)
    throw new SiteTableError(`${source}: at most ${MAX_SITES_IN_TABLE} sites, got ${rows.length - 1}`)
  if (rows.length === 1) throw new SiteTableError(`${source}: no site below the header`)
  // papaparse does not give line numbers: count the lines of the rows (no newline inside quotes in a sites table)
  const lines = dataLines(body)
  const sites = rows.slice(1).map((cells, k) => {
    const where = `${source} line ${lines[k] ?? k + 2}`
    if (cells.length !== header.length) {
      throw new SiteTableError(`${where}: ${cells.length} cells for ${header.length} columns`)
    }
    return siteFromCells(Object.fromEntries(header.map((h, i) => [h, cells[i]])), where)
  })
  checkDistinct(sites)
  return sites
}

/** 1-based line numbers of the data rows (after the header; blank and `#` lines skipped). */
function dataLines(text: string): number[] {
  const out: number[] = []
  let line = 0
  let header = false
  for (const l of text.split(/\r\n|\n|\r/)) {
    line++
    if (l.trim() === '' || l.trimStart().startsWith('#')) continue
    if (!header) {
      header = true
      continue
    }
    out.push(line)
  }
  return out
}

/** Sites from a JSON array (the API's `sites` part): each an object like a row of the table. */
export function sitesFromJson(value: unknown, source = 'sites'): SiteSpec[] {
  if (!Array.isArray(value)) {
    throw new SiteTableError(
      `${source} must be a JSON array of sites, each {"name", "file", …weather options}`,
    )
  }
  if (value.length > MAX_SITES_IN_TABLE)
    throw new SiteTableError(`${source}: at most ${MAX_SITES_IN_TABLE} sites, got ${value.length}`)
  const sites = value.map((cells, i) => {
    const where = `${source}[${i}]`
    if (typeof cells !== 'object' || cells === null || Array.isArray(cells))
      throw new SiteTableError(`${where} must be an object {"name", "file", …weather options}`)
    for (const [k, v] of Object.entries(cells)) {
      if (v !== null && typeof v === 'object')
        throw new SiteTableError(
          `${where}.${snippet(k)} must be a number or a text (several values separated by ;)`,
        )
    }
    return siteFromCells(cells as Record<string, unknown>, where)
  })
  checkDistinct(sites)
  return sites
}
