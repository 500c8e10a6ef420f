/**
 * @module report/inspect-html
 * What dryhours understood of a weather file, for a person to check before assessing: how it was read
 * (layout, time stamps, the site and its clock, rows), each column with its unit, a summary of every
 * variable in the display units, months with little data, the problems with their lines, then the warnings
 * and, apart from them, the notes. Rendered from the reader's result alone; every file text is escaped.
 */

import { optionWords } from '../analysis/option-names.ts'
import { summarizeSeries } from '../weather/export.ts'
import type { OptionSurface } from '../weather/option-spec.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import { MONTH_SHORT } from './charts/svg.ts'
import { formatNumber, type UnitSystem, unitFormatter } from './display-units.ts'
import { escapeHtml } from './escape.ts'
import { type ReportTable, tableHtml } from './tables.ts'
import { clockWords } from './words.ts'

/** 1 mile per hour = 0.44704 m/s exactly (NIST SP 811, 2008, B.8). */
const MPH_M_PER_S = 0.44704
/** 1 inch = 25.4 mm exactly (NIST SP 811, 2008, B.8). */
const INCH_MM = 25.4
/** 1 inHg (conventional) = 3.386 389 kPa (NIST SP 811, 2008, B.8; from memory, consistent with 101.325 kPa = 29.921 inHg). */
const IN_HG_KPA = 3.386389

/** The weather variables in words. */
export const VARIABLE_WORDS: Record<string, string> = {
  dryBulb: 'air temperature (dry bulb)',
  relativeHumidity: 'relative humidity',
  dewPoint: 'dew point',
  wetBulb: 'wet bulb',
  pressure: 'station pressure',
  wind: 'wind speed',
  windDirection: 'wind direction',
  ghi: 'sun on level ground (global horizontal irradiance)',
  rain: 'rain',
  cloudCover: 'cloud cover',
  timestamp: 'time stamp',
  date: 'date',
  time: 'time of day',
}

/** Problem kinds in words. */
export const PROBLEM_WORDS: Record<string, string> = {
  'bad-timestamp': 'time stamp not readable',
  'duplicate-timestamp': 'the same time twice',
  'out-of-order': 'time out of order',
  'dst-gap': 'a time the clock skips (daylight saving starts)',
  'dst-doubled-hour': 'an hour the clock shows twice (daylight saving ends)',
  'missing-code': 'missing-value code',
  'unparseable-number': 'not a number',
  'out-of-range': 'value out of range',
  step: 'jump too large from one hour to the next',
  'stuck-sensor': 'sensor stuck on one value',
  'dew-point-above-dry-bulb': 'dew point above the air temperature',
  'wet-bulb-above-dry-bulb': 'wet bulb above the air temperature',
  'rh-above-100': 'relative humidity above 100 %',
  'negative-irradiance': 'negative sunshine',
  'irradiance-at-night': 'sunshine at night',
  'gap-filled': 'short gap filled',
  'core-missing': 'no temperature or humidity for the hour',
  'too-few-readings': 'too few readings in the hour',
  'interval-too-long': 'value over more than an hour',
  'short-row': 'row with too few cells',
  'unbalanced-quote': 'unbalanced quote',
}

const TIMING_WORDS: Record<string, string> = {
  instant: 'a reading at the time stamp',
  'interval-mean': 'a mean over the interval',
  'interval-total': 'a total over the interval',
}

const UNIT_FROM_WORDS: Record<string, string> = {
  header: 'the header',
  mapping: 'your column mapping',
  format: 'the file format',
  detected: 'the values',
  assumed: 'assumed',
  supplied: 'supplied by dryhours',
}

export interface InspectHtmlOptions {
  fileName?: string
  units?: UnitSystem
  /** How messages name options (flags, API names or the page's labels). */
  optionSurface?: OptionSurface
  idPrefix?: string
}

/** A variable's SI summary value in the display units. */
function display(
  variable: string,
  si: number | null,
  units: UnitSystem,
): { value: number | null; unit: string } {
  const u = unitFormatter(units)
  const conv = (f: (v: number) => number, unit: string) => ({ value: si === null ? null : f(si), unit })
  if (units === 'si')
    return conv(
      (v) => v,
      {
        dryBulb: '°C',
        relativeHumidity: '%',
        pressure: 'kPa',
        wind: 'm/s',
        ghi: 'W/m²',
        rain: 'mm',
        cloudCover: '%',
      }[variable] ?? '',
    )
  switch (variable) {
    case 'dryBulb':
      return conv((v) => u.temperature(v).value, '°F')
    case 'pressure':
      return conv((v) => v / IN_HG_KPA, 'inHg')
    case 'wind':
      return conv((v) => v / MPH_M_PER_S, 'mph')
    case 'rain':
      return conv((v) => v / INCH_MM, 'in')
    case 'ghi':
      return conv((v) => v, 'W/m²')
    default:
      return conv((v) => v, '%')
  }
}

/** The summary of every variable (hours with a value, mean, lowest, highest) in the display units. */
export function variableTable(r: WeatherReadResult, units: UnitSystem): ReportTable {
  const rows = summarizeSeries(r.series).map((v) => {
    const mean = display(v.variable, v.mean, units)
    const digits = v.variable === 'pressure' && units === 'us' ? 2 : 1
    const k = digits === 2 ? 100 : 10
    const f = (x: number | null) => (x === null ? null : Math.round(x * k) / k)
    return [
      VARIABLE_WORDS[v.variable] ?? v.variable,
      mean.unit,
      v.hours,
      f(mean.value),
      f(display(v.variable, v.min, units).value),
      f(display(v.variable, v.max, units).value),
    ]
  })
  return {
    id: 'variables',
    title: `Each variable over the ${formatNumber(r.series.hours)} hours of the series`,
    columns: ['variable', 'unit', 'hours with a value', 'mean', 'lowest', 'highest'],
    digits: [0, 0, 0, 1, 1, 1],
    rows,
  }
}

function columnTable(r: WeatherReadResult): ReportTable {
  return {
    id: 'columns',
    title: 'The columns used',
    columns: ['variable', 'taken from', 'unit', 'unit from', 'each value is', 'values missing'],
    rows: r.columns.map((c) => [
      VARIABLE_WORDS[c.variable] ?? c.variable,
      c.source,
      c.unit,
      UNIT_FROM_WORDS[c.unitFrom] ?? c.unitFrom,
      TIMING_WORDS[c.timing] ?? c.timing,
      c.missing,
    ]),
  }
}

/** Months below 80 % of their hours with temperature and humidity (they leave the across-year statistics). */
function thinMonths(r: WeatherReadResult): string[] {
  return r.coverage
    .filter((m) => m.percent < 80)
    .map((m) => `${MONTH_SHORT[m.month - 1]} ${m.year} (${formatNumber(m.percent, 0)} %)`)
}

/** The inspection as an `<article>` fragment (the page shows it; the same words as `dryhours inspect`). */
export function renderInspectArticle(r: WeatherReadResult, o: InspectHtmlOptions = {}): string {
  const units = o.units ?? 'si'
  const words = (m: string) => optionWords(m, o.optionSurface ?? 'form')
  const p = o.idPrefix ?? ''
  const s = r.series
  const site = s.site
  const clock = clockWords({
    timeZone: site.timeZone,
    utcOffsetHours: site.utcOffsetHours ?? 0,
    utcOffsetSource: site.utcOffsetSource ?? (site.utcOffsetHours === null ? 'assumed-utc' : 'file'),
  })
  const place =
    site.latitudeDeg !== null && site.longitudeDeg !== null
      ? `${formatNumber(Math.abs(site.latitudeDeg), 2)}° ${site.latitudeDeg >= 0 ? 'N' : 'S'}, ${formatNumber(Math.abs(site.longitudeDeg), 2)}° ${site.longitudeDeg >= 0 ? 'E' : 'W'}${site.elevationM !== null ? `, elevation ${units === 'us' ? `${formatNumber(site.elevationM / 0.3048)} ft` : `${formatNumber(site.elevationM)} m`}` : ''}`
      : 'not known (give the latitude and longitude: the sun and the night need them)'
  const facts: [string, string][] = [
    ['File', o.fileName ?? 'uploaded file'],
    [
      'Read as',
      `${r.dialect ? `${r.dialect.title}, ` : ''}${r.format === 'epw' ? 'EPW weather file' : 'delimited text'}`,
    ],
    ['Site', site.name || 'no name in the file'],
    ['Location', place],
    ['Time stamps', r.timeBasis],
    ['Site clock', clock],
    [
      'Period',
      `${r.period.start.slice(0, 10)} to ${r.period.end.slice(0, 10)}${s.typicalYear ? ', a typical year' : `, ${r.years.length} calendar year${r.years.length === 1 ? '' : 's'}`}`,
    ],
    [
      'Rows',
      `${formatNumber(r.rows.read)} read: ${formatNumber(r.rows.used)} used as they are, ${formatNumber(r.rows.repaired)} repaired, ${formatNumber(r.rows.rejected)} rejected${r.rows.superseded ? `, ${formatNumber(r.rows.superseded)} superseded by a better report for the hour` : ''}`,
    ],
    [
      'Hours',
      `${formatNumber(s.hours)} in the series; ${formatNumber(r.hoursMissingCore)} without temperature or humidity; ${formatNumber(r.hoursWithoutRow)} with no row in the file`,
    ],
  ]
  const factsHtml = facts
    .map(([k, v]) => `<div class="kv"><dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd></div>`)
    .join('')
  const thin = thinMonths(r)
  const counts = Object.entries(r.problemCounts).filter(([, n]) => (n ?? 0) > 0) as [string, number][]
  const problemsTable: ReportTable = {
    id: 'problems',
    title: `The first problems, with their lines (${formatNumber(Math.min(r.problems.length, 25))} of ${formatNumber(counts.reduce((a, [, n]) => a + n, 0))})`,
    columns: ['line', 'variable', 'problem', 'what was done'],
    rows: r.problems
      .slice(0, 25)
      .map((q) => [
        q.line === null ? 'no row' : String(q.line),
        q.variable ? (VARIABLE_WORDS[q.variable] ?? q.variable) : 'the whole row',
        PROBLEM_WORDS[q.kind] ?? q.kind,
        words(q.message),
      ]),
  }
  const problems = counts.length
    ? `<ul class="counts">${counts.map(([k, n]) => `<li>${escapeHtml(PROBLEM_WORDS[k] ?? k)}: ${formatNumber(n)}</li>`).join('')}</ul>${tableHtml(problemsTable)}`
    : '<p>No problems found.</p>'
  const list = (xs: string[]) => `<ul>${xs.map((x) => `<li>${escapeHtml(words(x))}</li>`).join('')}</ul>`
  return `<article class="dryhours-report inspect" data-report="inspect" data-units="${units}">
<header class="report-header" data-section="header"><p class="kicker">dryhours · the weather file as understood</p><h1 tabindex="-1">${escapeHtml(o.fileName ?? 'The weather file')}</h1><dl class="facts">${factsHtml}</dl></header>
<section class="report-section" id="${p}sec-columns" data-section="columns"><h2>Columns and units</h2>${tableHtml(columnTable(r))}${r.hourly.rule ? `<p class="note">${escapeHtml(`How rows became hours: ${r.hourly.rule}`)}</p>` : ''}</section>
<section class="report-section" id="${p}sec-variables" data-section="variables"><h2>Each variable</h2>${tableHtml(variableTable(r, units))}<p class="note">Check that the lowest and highest values are plausible for the site: a wrong unit shows here first.</p></section>
<section class="report-section" id="${p}sec-coverage" data-section="coverage"><h2>Months with little data</h2>${thin.length ? `<p>${escapeHtml(`Months with temperature and humidity in fewer than 80 % of their hours (left out of the spread across years): ${thin.join(', ')}.`)}</p>` : '<p>Every month has temperature and humidity in at least 80 % of its hours.</p>'}</section>
<section class="report-section" id="${p}sec-problems" data-section="problems"><h2>Problems</h2>${problems}</section>
<section class="report-section" id="${p}sec-warnings" data-section="warnings"><h2>Warnings</h2>${r.warnings.length ? list(r.warnings) : '<p>No warnings.</p>'}</section>
<section class="report-section" id="${p}sec-notes" data-section="notes"><h2>Notes on how the file was read</h2>${r.notes.length ? list(r.notes) : '<p>Nothing to note.</p>'}</section>
</article>`
}
