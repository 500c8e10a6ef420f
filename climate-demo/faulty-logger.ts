/**
 * @module climate-demo/faulty-logger
 * A deliberately faulty logger file for the quality-control demo: one local-standard-time year of a
 * site in SI units, then damaged in known ways, with a manifest of every fault and its final line
 * numbers so that a quality-control test can check that each one is found. Pure: returns text.
 */
import { fixed, hourIndexAt, SI_HEADER, siFields } from './csv-formats.ts'
import type { DemoSite } from './sites.ts'
import type { DemoHours } from './weather-model.ts'

const HOUR_MS = 3_600_000
/** Value columns in file order (after the time column). */
const VARIABLES = ['dryBulb', 'dewPoint', 'relativeHumidity', 'pressure', 'wind', 'ghi', 'rain'] as const
type Variable = (typeof VARIABLES)[number]

export type FaultKind =
  | 'missing-code'
  | 'stuck-sensor'
  | 'negative-irradiance'
  | 'short-gap'
  | 'long-gap'
  | 'duplicate-row'
  | 'duplicate-timestamp'
  | 'out-of-order'

export interface InjectedFault {
  kind: FaultKind
  variable: Variable | null
  /** Local timestamps (as written in the file) the fault concerns; for gaps, the missing hours. */
  times: string[]
  /** Final 1-based line numbers in the file (header = line 1); empty for gaps (rows absent). */
  lines: number[]
  note: string
}

export interface FaultyFile {
  text: string
  faults: InjectedFault[]
  /** Rows written (without header). */
  rows: number
}

const pad2 = (n: number): string => String(n).padStart(2, '0')

function localLabel(utcMs: number, offsetHours: number): string {
  const d = new Date(utcMs + offsetHours * HOUR_MS)
  return `${d.getUTCFullYear()}-${pad2(d.getUTCMonth() + 1)}-${pad2(d.getUTCDate())} ${pad2(d.getUTCHours())}:00`
}

/** Local time label `YYYY-MM-DD HH:00` → UTC ms, for the site's standard offset. */
function labelToUtc(label: string, offsetHours: number): number {
  const [date, time] = label.split(' ')
  const [y, m, d] = date.split('-').map(Number)
  return Date.UTC(y, m - 1, d, Number(time.slice(0, 2))) - offsetHours * HOUR_MS
}

function hourLabels(first: string, count: number, offsetHours: number): string[] {
  const t0 = labelToUtc(first, offsetHours)
  return Array.from({ length: count }, (_, i) => localLabel(t0 + i * HOUR_MS, offsetHours))
}

/**
 * The faulty file for local standard year `year` of `site`: timestamps `YYYY-MM-DD HH:MM` in local
 * standard time (UTC offset in the header), SI units, then the faults listed in the returned manifest.
 */
export function faultyLoggerCsv(site: DemoSite, hours: DemoHours, year: number): FaultyFile {
  const off = site.utcOffsetHours
  const from = Date.UTC(year, 0, 1) - off * HOUR_MS
  const to = Date.UTC(year + 1, 0, 1) - off * HOUR_MS
  const rows: string[][] = []
  for (let k = hourIndexAt(hours, from); k < hourIndexAt(hours, to); k++) {
    rows.push([localLabel(hours.firstStartUtcMs + k * HOUR_MS, off), ...siFields(hours, k)])
  }
  const at = (label: string): string[] => {
    const row = rows.find((r) => r[0] === label)
    if (!row) throw new RangeError(`no row ${label} in the faulty-file year ${year}`)
    return row
  }
  const col = (v: Variable): number => VARIABLES.indexOf(v) + 1
  const y = String(year)
  const faults: Omit<InjectedFault, 'lines'>[] = []
  const setCode = (label: string, v: Variable, code: string, note: string) => {
    at(label)[col(v)] = code
    faults.push({ kind: 'missing-code', variable: v, times: [label], note })
  }
  setCode(`${y}-01-15 14:00`, 'dryBulb', '-9999', 'missing code -9999 in dry bulb')
  setCode(`${y}-01-20 03:00`, 'dewPoint', '999.9', 'missing code 999.9 in dew point')
  setCode(`${y}-04-02 12:00`, 'relativeHumidity', '-9999', 'missing code -9999 in RH')
  setCode(`${y}-07-07 07:00`, 'pressure', '-9999', 'missing code -9999 in pressure')
  setCode(`${y}-10-10 16:00`, 'wind', '999.9', 'missing code 999.9 in wind speed')
  setCode(`${y}-11-05 11:00`, 'ghi', '-9999', 'missing code -9999 in irradiance (daytime)')

  const stuck = hourLabels(`${y}-03-20 06:00`, 30, off)
  const stuckValue = at(stuck[0])[col('relativeHumidity')]
  for (const label of stuck) at(label)[col('relativeHumidity')] = stuckValue
  faults.push({
    kind: 'stuck-sensor',
    variable: 'relativeHumidity',
    times: stuck,
    note: `RH stuck at ${stuckValue} % for 30 h; the dew-point column is left as generated, so the two disagree`,
  })

  at(`${y}-02-14 02:00`)[col('ghi')] = fixed(-4, 0)
  faults.push({
    kind: 'negative-irradiance',
    variable: 'ghi',
    times: [`${y}-02-14 02:00`],
    note: 'GHI −4 W/m² at night (sensor offset)',
  })

  const remove = (labels: string[]) => {
    for (const label of labels) rows.splice(rows.indexOf(at(label)), 1)
  }
  const gaps: [string, number, FaultKind, string][] = [
    [`${y}-02-10 03:00`, 2, 'short-gap', '2 h gap at night (fillable by interpolation)'],
    [
      `${y}-05-05 13:00`,
      3,
      'short-gap',
      '3 h gap in the afternoon (irradiance needs clear-sky-scaled filling)',
    ],
    [`${y}-08-14 00:00`, 60, 'long-gap', '60 h gap (logger down; must stay missing)'],
  ]
  for (const [first, count, kind, note] of gaps) {
    const labels = hourLabels(first, count, off)
    remove(labels)
    faults.push({ kind, variable: null, times: labels, note })
  }

  const dupLabel = `${y}-06-01 10:00`
  const dup = at(dupLabel)
  rows.splice(rows.indexOf(dup) + 1, 0, [...dup])
  faults.push({
    kind: 'duplicate-row',
    variable: null,
    times: [dupLabel],
    note: 'the same row written twice',
  })
  const conflictLabel = `${y}-12-03 08:00`
  const conflict = [...at(conflictLabel)]
  conflict[col('dryBulb')] = fixed(Number(conflict[col('dryBulb')]) + 0.6, 1)
  rows.splice(rows.indexOf(at(conflictLabel)) + 1, 0, conflict)
  faults.push({
    kind: 'duplicate-timestamp',
    variable: 'dryBulb',
    times: [conflictLabel],
    note: 'the hour written twice with different dry bulb (second reading 0.6 K warmer)',
  })

  const lateLabel = `${y}-09-12 07:00`
  const late = at(lateLabel)
  rows.splice(rows.indexOf(late), 1)
  rows.splice(rows.indexOf(at(`${y}-09-12 09:00`)) + 1, 0, late)
  faults.push({
    kind: 'out-of-order',
    variable: null,
    times: [lateLabel],
    note: '07:00 row written after 09:00',
  })

  // No comma inside the cell, so the header splits into exactly one cell per column.
  const header = SI_HEADER.replace(
    'time (UTC)',
    `time (local standard time UTC${off >= 0 ? '+' : '-'}${pad2(Math.abs(off))}:00)`,
  )
  const lineOf = new Map<string, number[]>()
  rows.forEach((r, i) => {
    const list = lineOf.get(r[0]) ?? []
    list.push(i + 2)
    lineOf.set(r[0], list)
  })
  const withLines: InjectedFault[] = faults.map((f) => ({
    ...f,
    lines: f.kind.endsWith('gap') ? [] : f.times.flatMap((t) => lineOf.get(t) ?? []),
  }))
  const text = [header, ...rows.map((r) => r.join(','))].join('\n') + '\n'
  return { text, faults: withLines, rows: rows.length }
}
