/**
 * @module weather/dialects/spreadsheet
 * Spreadsheets saved as CSV by hand-kept stations and loggers, recognised by the language of their
 * header words (German, Spanish, French, Portuguese or Italian), and English sheets with a row of
 * units under the header (as a spreadsheet program saves them). They are read by the generic reader
 * (header words of every language, decimal commas, units in brackets or in the units row); the
 * dialect names the layout and states one convention: in sub-hourly sheets, wind, irradiance and
 * precipitation are means or totals over the interval that ENDS at the row's time (the usual logger
 * convention; instants such as temperature and humidity are read at the time). Hourly sheets keep
 * the generic start-of-hour labels unless `--labels end` is given.
 */
import { readDelimited } from '../delimited.ts'
import { headerWords } from '../header-words.ts'
import type { RawTable } from '../raw-table.ts'
import { isUnitToken } from '../units.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** Words that mark a language (header words, accents removed); from common usage. */
const LANGUAGE_WORDS: Record<string, readonly string[]> = {
  de: [
    'datum',
    'uhrzeit',
    'zeit',
    'temperatur',
    'lufttemperatur',
    'feuchte',
    'luftfeuchte',
    'taupunkt',
    'luftdruck',
    'windgeschw',
    'windgeschwindigkeit',
    'windrichtung',
    'globalstrahlung',
    'niederschlag',
    'stunde',
  ],
  es: [
    'fecha',
    'humedad',
    'presion',
    'viento',
    'velocidad',
    'radiacion',
    'precipitacion',
    'direccion',
    'lluvia',
    'rocio',
  ],
  fr: ['heure', 'humidite', 'pression', 'vent', 'rayonnement', 'precipitations', 'moyen', 'rosee', 'pluie'],
  pt: [
    'umidade',
    'humidade',
    'orvalho',
    'pressao',
    'velocidade',
    'radiacao',
    'precipitacao',
    'direcao',
    'chuva',
    'atmosferica',
  ],
  it: [
    'ora',
    'umidita',
    'pressione',
    'velocita',
    'direzione',
    'radiazione',
    'pioggia',
    'rugiada',
    'solare',
    'aria',
  ],
}

const LANGUAGE_NAMES: Record<string, string> = {
  de: 'German',
  es: 'Spanish',
  fr: 'French',
  pt: 'Portuguese',
  it: 'Italian',
}

/** The first line with at least three cells, split on its most frequent delimiter. */
function headerCells(head: DialectHead): { index: number; cells: string[]; delimiter: string } | null {
  for (let i = 0; i < Math.min(head.lines.length, 20); i++) {
    const line = head.lines[i]
    for (const d of [';', '\t', ',']) {
      const cells = line.split(d)
      if (cells.length >= 3) return { index: i, cells, delimiter: d }
    }
  }
  return null
}

/** The language whose marker words the header holds most (at least three), or null. */
export function headerLanguage(head: DialectHead): string | null {
  const found = headerCells(head)
  if (found === null) return null
  const words = new Set(found.cells.flatMap((c) => headerWords(c)))
  let best: string | null = null
  let bestCount = 2
  for (const [language, markers] of Object.entries(LANGUAGE_WORDS)) {
    let count = 0
    for (const m of markers) if (words.has(m)) count++
    if (count > bestCount) {
      best = language
      bestCount = count
    }
  }
  return best
}

/** Smallest positive step between the times of the first rows on one day [min]; NaN when unknown. */
function stepMinutes(table: RawTable): number {
  let best = Number.POSITIVE_INFINITY
  const t = table.time
  for (let i = 1; i < Math.min(table.rows, 50); i++) {
    if (t.year[i] !== t.year[i - 1] || t.first[i] !== t.first[i - 1] || t.second[i] !== t.second[i - 1])
      continue
    const d = t.minuteOfDay[i] - t.minuteOfDay[i - 1]
    if (d > 0 && d < best) best = d
  }
  return Number.isFinite(best) ? best : Number.NaN
}

function endLabelSubHourly(table: RawTable, notes: string[]): void {
  const step = stepMinutes(table)
  if (!(step < 60)) return
  for (const variable of ['wind', 'ghi', 'rain'] as const) {
    const col = table.columns[variable]
    if (!col || col.timing) continue
    col.timing = {
      kind: variable === 'rain' ? 'interval-total' : 'interval-mean',
      label: 'end',
      intervalMinutes: step,
    }
  }
  notes.push(
    `readings every ${step} min: wind, irradiance and precipitation read as means or totals over the ${step} minutes ending at each time (give --labels start if they begin there)`,
  )
}

export const spreadsheet: WeatherDialect = {
  id: 'spreadsheet',
  title: 'Spreadsheet CSV with headers in German, Spanish, French, Portuguese or Italian',
  detect(head: DialectHead): boolean {
    return headerLanguage(head) !== null
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const language = headerLanguage(head) ?? 'xx'
    const reading = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, { headerLine: ctx.headerLine })
    const table = reading.table
    endLabelSubHourly(table, ctx.notes)
    const id = `spreadsheet-${language}`
    table.dialect = { id, title: `Spreadsheet CSV (${LANGUAGE_NAMES[language] ?? language} headers)` }
    table.statements = { ...table.statements, ...stated({ dialect: id }), timestampsInSiteClock: true }
    return reading
  },
}

export const excelUnitsRow: WeatherDialect = {
  id: 'excel-units-row',
  title: 'Spreadsheet CSV with a units row under the header',
  detect(head: DialectHead): boolean {
    const found = headerCells(head)
    if (found === null) return false
    const below = (head.lines[found.index + 1] ?? '').split(found.delimiter)
    let units = 0
    let numbers = 0
    for (const cell of below) {
      const t = cell.trim()
      if (t === '') continue
      if (isUnitToken(t)) units++
      else if (!Number.isNaN(Number(t.replace(',', '.')))) numbers++
    }
    return units >= 3 && numbers === 0
  },
  read(text: string, _head: DialectHead, ctx: DialectContext): DialectReading {
    const reading = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, { headerLine: ctx.headerLine })
    endLabelSubHourly(reading.table, ctx.notes)
    reading.table.statements = {
      ...reading.table.statements,
      ...stated({ dialect: 'excel-units-row' }),
      timestampsInSiteClock: true,
    }
    return reading
  },
}
