/**
 * @module product/weighings
 * A grower's tray weighings: parse the CSV text (the CLI reads the file) and turn masses into dry-basis
 * moisture from the dry mass, the initial moisture or the final moisture.
 *
 * CSV: comma, semicolon or tab separated, `#` comment lines, a header row, columns in any order. The header words
 * may be written as people write them, in English, Spanish, French, German, Portuguese or Italian
 * (`weighing-columns.ts`): a time column (`elapsed_h`, `time (min)`, `Hours`, `t (h)`, `tiempo (h)`, `Zeit [min]`,
 * or ISO 8601 local date-times such as `2026-07-01T08:00` in a `time`/`date` column), a mass column (`mass_g`,
 * `Weight (kg)`, `lb`, `peso (g)`, `poids (kg)`, `Gewicht (g)` …; an empty cell is a missed weighing, kept as a
 * gap) and optionally the air temperature (`air_c`, `temp (°F)` …) and relative humidity (`rh_pct`, `HR (%)` …).
 * With `;` or tab separators a decimal comma (`1234,5`) is read as a decimal point.
 */
import { MS_PER_HOUR } from '../physics/constants.ts'
import { moistureDbFromWbPct } from './moisture-basis.ts'
import { GRAMS_PER, HOURS_PER, recogniseColumns, type WeighingColumns } from './weighing-columns.ts'

export interface Weighing {
  /** 1-based line in the file. */
  line: number
  timeH: number
  massG: number | null
  airTempC: number | null
  rhPct: number | null
}

/** Parsed weighings with the columns they were read from. */
export interface WeighingsTable {
  rows: Weighing[]
  columns: WeighingColumns
}

const ISO_LOCAL = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?$/

function parseIsoLocalH(s: string, line: number): number {
  const m = ISO_LOCAL.exec(s.trim())
  if (!m) throw new RangeError(`line ${line}: time '${s}' is not an ISO 8601 date-time like 2026-07-01T08:00`)
  const [, y, mo, d, h, mi, se] = m
  const ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, se ? +se : 0)
  if (!Number.isFinite(ms)) throw new RangeError(`line ${line}: time '${s}' is not a valid date`)
  return ms / MS_PER_HOUR
}

function num(
  field: string,
  s: string | undefined,
  line: number,
  min: number,
  max: number,
  decimalComma: boolean,
): number | null {
  if (s === undefined || s.trim() === '') return null
  const text = decimalComma ? s.trim().replace(',', '.') : s.trim()
  const v = Number(text)
  if (!Number.isFinite(v)) throw new RangeError(`line ${line}: ${field} '${s.trim()}' is not a number`)
  if (!(v >= min && v <= max)) throw new RangeError(`line ${line}: ${field} ${v} is outside ${min}–${max}`)
  return v
}

function separatorOf(headerLine: string): string {
  const count = (c: string) => headerLine.split(c).length - 1
  const tabs = count('\t')
  const semis = count(';')
  const commas = count(',')
  if (tabs > 0 && tabs >= semis && tabs >= commas) return '\t'
  if (semis > 0 && semis >= commas) return ';'
  return ','
}

/** Parse weighings CSV text. RangeError with the line number for any bad row or an unrecognised header. */
export function parseWeighingsCsv(text: string): WeighingsTable {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/)
  let columns: WeighingColumns | null = null
  let sep = ','
  let decimalComma = false
  let dateTime = false
  const rows: Weighing[] = []
  lines.forEach((raw, i) => {
    const line = i + 1
    const s = raw.trim()
    if (s === '' || s.startsWith('#')) return
    if (!columns) {
      sep = separatorOf(s)
      decimalComma = sep !== ','
      columns = recogniseColumns(s.split(sep), line)
      dateTime = columns.time.dateTime
      return
    }
    const c = columns as WeighingColumns
    const cells = s.split(sep)
    const cell = (index: number): string | undefined => cells[index]
    const timeText = (cell(c.time.index) ?? '').trim()
    if (timeText === '') throw new RangeError(`line ${line}: time is empty`)
    // a `time` column without a unit may hold date-times: decided on its first data row
    if (rows.length === 0 && !dateTime && c.time.unitFrom === 'default' && ISO_LOCAL.test(timeText)) {
      dateTime = true
      c.time.dateTime = true
    }
    let timeH: number
    if (dateTime) {
      timeH = parseIsoLocalH(timeText, line)
    } else {
      const t = num(c.time.header, timeText, line, 0, (24 * 366) / HOURS_PER[c.time.unit], decimalComma)
      timeH = (t as number) * HOURS_PER[c.time.unit]
    }
    const mass = num(c.mass.header, cell(c.mass.index), line, 0, 1e7, decimalComma)
    const massG = mass === null ? null : mass * GRAMS_PER[c.mass.unit]
    if (massG !== null && !(massG > 0))
      throw new RangeError(`line ${line}: ${c.mass.header} must be > 0, got ${mass}`)
    let airTempC: number | null = null
    if (c.airTemp) {
      const v = num(c.airTemp.header, cell(c.airTemp.index), line, -40, 300, decimalComma)
      airTempC = v === null ? null : c.airTemp.unit === 'F' ? ((v - 32) * 5) / 9 : v
      if (airTempC !== null && !(airTempC >= -40 && airTempC <= 150)) {
        throw new RangeError(`line ${line}: ${c.airTemp.header} ${v} is outside −40–150 °C`)
      }
    }
    const rhPct = c.rh ? num(c.rh.header, cell(c.rh.index), line, 0, 100, decimalComma) : null
    rows.push({ line, timeH, massG, airTempC, rhPct })
  })
  if (!columns || rows.length === 0) throw new RangeError('no weighings found (the file has no data rows)')
  const t0 = rows[0].timeH
  for (let i = 0; i < rows.length; i++) {
    rows[i].timeH -= t0
    if (i > 0 && !(rows[i].timeH > rows[i - 1].timeH)) {
      throw new RangeError(`line ${rows[i].line}: time must increase from one weighing to the next`)
    }
  }
  return { rows, columns }
}

/** How the dry matter is known: exactly one of these. */
export type MoistureReference = { dryMassG: number } | { initialWbPct: number } | { finalWbPct: number }

export interface MoisturePoint {
  line: number
  timeH: number
  massG: number
  moistureDb: number
}

/** Dry mass [g] from the reference and the weighings; RangeError when it cannot be had. */
export function dryMassG(weighings: Weighing[], ref: MoistureReference): number {
  const weighed = weighings.filter((w) => w.massG !== null)
  if (weighed.length === 0) throw new RangeError('no weighing has a mass')
  if ('dryMassG' in ref) {
    if (!(ref.dryMassG > 0)) throw new RangeError(`dry mass must be > 0 g, got ${ref.dryMassG}`)
    // a loop, not Math.min(...array): spreading 130,000 weighings overflows the call stack
    let minMass = Number.POSITIVE_INFINITY
    for (const w of weighed) if ((w.massG as number) < minMass) minMass = w.massG as number
    if (!(ref.dryMassG < minMass)) {
      throw new RangeError(`dry mass ${ref.dryMassG} g must be below every weighing (smallest ${minMass} g)`)
    }
    return ref.dryMassG
  }
  if ('initialWbPct' in ref) {
    const first = weighings[0]
    if (first.massG === null)
      throw new RangeError(`--initial-wb needs the first weighing, but line ${first.line} has no mass`)
    moistureDbFromWbPct(ref.initialWbPct)
    return first.massG * (1 - ref.initialWbPct / 100)
  }
  const last = weighings[weighings.length - 1]
  if (last.massG === null) {
    throw new RangeError(
      `--final-wb needs the final weighing, but the last reading (line ${last.line}) has no mass; give --dry-mass or --initial-wb instead`,
    )
  }
  moistureDbFromWbPct(ref.finalWbPct)
  return last.massG * (1 - ref.finalWbPct / 100)
}

/** Weighed points as dry-basis moisture; readings without a mass are left out (reported by the caller). */
export function moisturePoints(weighings: Weighing[], dryMass: number): MoisturePoint[] {
  return weighings
    .filter((w) => w.massG !== null)
    .map((w) => ({
      line: w.line,
      timeH: w.timeH,
      massG: w.massG as number,
      moistureDb: ((w.massG as number) - dryMass) / dryMass,
    }))
}
