/**
 * @module weather/dialects/dwd
 * Hourly station products of the German weather service (DWD Climate Data Center, `produkt_*_stunde_*.txt`):
 * `STATIONS_ID;MESS_DATUM;QN_x;<values>;eor`, values padded with spaces, `-999` missing, MESS_DATUM
 * `YYYYMMDDHH` in UTC. Products: `tu` (TT_TU air temperature °C, RF_TU relative humidity %), `td`
 * (TT, TD dew point °C), `ff` (F wind speed m/s, mean of the last 10 minutes; D direction), `p0`
 * (P reduced to sea level — not used — and P0 station pressure hPa), `rr` (R1 precipitation mm over the
 * hour ending at MESS_DATUM; RS_IND and WRTR are codes), `st` (FG_LBERG global radiation J/cm² over
 * the hour of true local solar time ending at MESS_DATUM_WOZ, whose UTC instant is MESS_DATUM
 * `YYYYMMDDHH:MM`; FD_LBERG diffuse, ATMO_LBERG longwave, SD_LBERG sunshine minutes), `n` (V_N total
 * cloud cover in eighths, −1 not determinable). Station coordinates are in a separate metadata file.
 * Several products of one station in one text (the files one after another, each with its own
 * header line) are merged by time, the solar product's sums first shared out onto UTC hours. (DWD CDC
 * product descriptions, from memory.)
 */
import { MS_PER_HOUR } from '../../physics/constants.ts'
import type { ColumnPreset } from '../column-preset.ts'
import { readDelimited } from '../delimited.ts'
import { WeatherInputError } from '../weather-input-error.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** Product of a header (its value columns), e.g. 'tu'; null when unknown. */
function productOf(columns: string[]): string | null {
  const has = (c: string) => columns.includes(c)
  if (has('tt_tu')) return 'tu'
  if (has('td') && has('tt')) return 'td'
  if (has('p0')) return 'p0'
  if (has('r1')) return 'rr'
  if (has('fg_lberg')) return 'st'
  if (has('v_n')) return 'n'
  if (has('f') && has('d')) return 'ff'
  return null
}

const PRESET: ColumnPreset = {
  only: true,
  columns: {
    timestamp: { names: ['MESS_DATUM'] },
    dryBulb: { names: ['TT_TU', 'TT'], unit: 'C' },
    relativeHumidity: { names: ['RF_TU'], unit: '%' },
    dewPoint: { names: ['TD'], unit: 'C' },
    wind: { names: ['F', 'FF'], unit: 'm/s' },
    pressure: { names: ['P0'], unit: 'hPa' },
    rain: { names: ['R1'], unit: 'mm' },
    ghi: { names: ['FG_LBERG'], unit: 'J/cm2' },
    cloudCover: { names: ['V_N'], unit: 'oktas' },
  },
}

const TITLES: Record<string, string> = {
  tu: 'air temperature and humidity',
  td: 'dew point',
  ff: 'wind',
  p0: 'pressure',
  rr: 'precipitation',
  st: 'solar radiation',
  n: 'cloud cover',
}

interface Block {
  product: string | null
  header: string[]
  /** [1-based line, cells] per row. */
  rows: [number, string[]][]
}

function splitBlocks(text: string): Block[] {
  const blocks: Block[] = []
  let line = 0
  let k = 0
  while (k <= text.length) {
    let end = text.indexOf('\n', k)
    if (end < 0) end = text.length
    line++
    const raw = text.slice(k, end).replace('\r', '')
    if (raw.trim() !== '') {
      const cells = raw.split(';').map((c) => c.trim())
      if (cells[0].toUpperCase() === 'STATIONS_ID') {
        const header = cells.map((c) => c.toLowerCase())
        blocks.push({ product: productOf(header), header: cells, rows: [] })
      } else blocks.at(-1)?.rows.push([line, cells])
    }
    if (end === text.length) break
    k = end + 1
  }
  return blocks
}

/** UTC instant of a MESS_DATUM `YYYYMMDDHH` or `YYYYMMDDHH:MM`; NaN when it is neither. */
function messDatumMs(text: string): number {
  if (text.length !== 10 && !(text.length === 13 && text[10] === ':')) return Number.NaN
  const digits = text.length === 10 ? text : text.slice(0, 10) + text.slice(11)
  for (let i = 0; i < digits.length; i++) {
    const c = digits.charCodeAt(i)
    if (c < 48 || c > 57) return Number.NaN
  }
  const n = (a: number, b: number) => Number(digits.slice(a, b))
  return Date.UTC(n(0, 4), n(4, 6) - 1, n(6, 8), n(8, 10), digits.length === 12 ? n(10, 12) : 0)
}

/** `YYYYMMDDHH` of a UTC instant on the hour. */
function messDatumText(ms: number): string {
  const d = new Date(ms)
  const p = (v: number) => String(v).padStart(2, '0')
  return `${d.getUTCFullYear()}${p(d.getUTCMonth() + 1)}${p(d.getUTCDate())}${p(d.getUTCHours())}`
}

/** Columns of the solar product that are not sums over its hour (the zenith angle, the solar-time stamp). */
const NOT_SUMS = new Set(['ZENIT', 'MESS_DATUM_WOZ'])

/**
 * Rows of a product stamped off the hour (the solar product: sums over hours of true local solar time
 * ending at a UTC instant such as 23:26) as sums over UTC hours, keyed by the END of the UTC hour like
 * R1: each solar hour's sum is shared between the two UTC hours it overlaps in proportion to the
 * overlap (the sum taken as even over its hour). A UTC hour is given only when both pieces are there.
 */
function onUtcHours(
  b: Block,
  at: number,
  skip: (name: string) => boolean,
): Map<string, { line: number; station: string; values: Map<string, string> }> {
  const sums = new Map<number, { line: number; station: string; cover: number; sum: Map<string, number> }>()
  for (const [line, cells] of b.rows) {
    const end = messDatumMs(cells[at] ?? '')
    if (Number.isNaN(end)) continue
    const start = end - MS_PER_HOUR
    for (let h = Math.floor(start / MS_PER_HOUR) * MS_PER_HOUR; h < end; h += MS_PER_HOUR) {
      const share = (Math.min(end, h + MS_PER_HOUR) - Math.max(start, h)) / MS_PER_HOUR
      if (share <= 0) continue
      let hour = sums.get(h)
      if (!hour) {
        hour = { line, station: cells[0] ?? '', cover: 0, sum: new Map() }
        sums.set(h, hour)
      }
      hour.cover += share
      hour.line = line
      b.header.forEach((name, j) => {
        if (skip(name) || NOT_SUMS.has(name.toUpperCase())) return
        const v = Number(cells[j])
        const before = hour.sum.get(name) ?? 0
        // a missing piece (-999 or empty) leaves the UTC hour missing
        hour.sum.set(
          name,
          cells[j] === undefined || cells[j] === '' || v === -999 ? Number.NaN : before + v * share,
        )
      })
    }
  }
  const out = new Map<string, { line: number; station: string; values: Map<string, string> }>()
  for (const [h, hour] of sums) {
    if (hour.cover < 1 - 1e-9) continue
    const values = new Map<string, string>()
    for (const [name, v] of hour.sum)
      values.set(name, Number.isNaN(v) ? '-999' : String(Math.round(v * 1000) / 1000))
    out.set(messDatumText(h + MS_PER_HOUR), { line: hour.line, station: hour.station, values })
  }
  return out
}

/**
 * One text for several products: the union of their value columns, one row per time (rows of one
 * time merged), and the first file line of each row. A product stamped off the hour (solar) is first
 * put on UTC hours ({@link onUtcHours}); merging it by its own stamps would interleave rows 26 minutes
 * apart and break every hour of the other products.
 */
function mergeBlocks(blocks: Block[]): { text: string; lines: number[]; shifted: boolean } {
  const skip = (name: string) => {
    const n = name.toUpperCase()
    return n === 'STATIONS_ID' || n === 'MESS_DATUM' || n === 'EOR' || n.startsWith('QN')
  }
  const columns: string[] = []
  let shifted = false
  const byTime = new Map<string, { line: number; station: string; values: Map<string, string> }>()
  for (const b of blocks) {
    const at = b.header.findIndex((h) => h.toUpperCase() === 'MESS_DATUM')
    const offHour = b.rows.some(([, cells]) => (cells[at] ?? '').length === 13)
    if (offHour) shifted = true
    for (const h of b.header)
      if (!skip(h) && !(offHour && NOT_SUMS.has(h.toUpperCase())) && !columns.includes(h)) columns.push(h)
    const rows: [string, number, string, (h: string) => string | undefined][] = []
    if (offHour) {
      for (const [time, r] of onUtcHours(b, at, skip))
        rows.push([time, r.line, r.station, (h) => r.values.get(h)])
    } else {
      for (const [line, cells] of b.rows)
        rows.push([cells[at] ?? '', line, cells[0] ?? '', (h) => cells[b.header.indexOf(h)]])
    }
    for (const [time, line, station, value] of rows) {
      let row = byTime.get(time)
      if (!row) {
        row = { line, station, values: new Map() }
        byTime.set(time, row)
      }
      for (const h of b.header) {
        const v = value(h)
        if (!skip(h) && v !== undefined && !(offHour && NOT_SUMS.has(h.toUpperCase()))) row.values.set(h, v)
      }
    }
  }
  const times = [...byTime.keys()].sort()
  const out = [`STATIONS_ID;MESS_DATUM;${columns.join(';')};eor`]
  const lines: number[] = []
  for (const time of times) {
    const row = byTime.get(time)!
    out.push(`${row.station};${time};${columns.map((c) => row.values.get(c) ?? '-999').join(';')};eor`)
    lines.push(row.line)
  }
  return { text: `${out.join('\n')}\n`, lines, shifted }
}

export const dwdHourly: WeatherDialect = {
  id: 'dwd-hourly',
  title: 'German weather service (DWD) hourly station product',
  detect(head: DialectHead): boolean {
    return (head.lower[0] ?? '').startsWith('stations_id;mess_datum;')
  },
  read(text: string, _head: DialectHead, ctx: DialectContext): DialectReading {
    const blocks = splitBlocks(text)
    const products = blocks.map((b) => b.product ?? '?')
    const merged = blocks.length > 1 ? mergeBlocks(blocks) : null
    const { table, info } = readDelimited(merged?.text ?? text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: merged ? undefined : ctx.headerLine,
      headerRow: 0,
      delimiter: ';',
      missingCodes: [-999],
      decoders: { cloudCover: (t) => (Number(t) >= 0 && Number(t) <= 8 ? Number(t) : Number.NaN) },
      columns: PRESET,
    })
    if (merged) for (let i = 0; i < table.rows; i++) table.lines[i] = merged.lines[i] ?? table.lines[i]
    if (table.columns.rain)
      table.columns.rain.timing = { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
    if (table.columns.ghi)
      table.columns.ghi.timing = { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
    table.labels = 'start'
    table.sampling = 'readings'
    const id = `dwd-hourly-${products.join('+')}`
    table.dialect = {
      id,
      title: `DWD hourly station product${products.length > 1 ? 's' : ''} (${products.map((p) => TITLES[p] ?? p).join(', ')})`,
    }
    table.statements = stated({
      timestampUtcOffsetHours: 0,
      windHeightM: table.columns.wind ? 10 : undefined,
      dialect: id,
    })
    ctx.notes.push(
      `DWD product${products.length > 1 ? 's' : ''} ${products.join(', ')}: times in UTC, -999 missing, P (sea level) not used` +
        (blocks.length > 1 ? `; ${blocks.length} products merged by MESS_DATUM` : '') +
        (merged?.shifted
          ? '; solar sums over hours of true local solar time shared between the UTC hours they overlap'
          : '') +
        '; the station coordinates are not in the file (give --lat, --lon, --elevation)',
    )
    if (!table.columns.dryBulb || (!table.columns.relativeHumidity && !table.columns.dewPoint))
      throw new WeatherInputError(
        `the DWD product${products.length > 1 ? 's' : ''} ${products.join(', ')} ${products.length > 1 ? 'have' : 'has'} no air temperature or humidity: ` +
          'put the station\'s "tu" product (produkt_tu_stunde_…) and this one in one file, one after the other, to read them together',
        ['dry bulb', 'humidity'],
      )
    return { table, info: merged ? null : info }
  },
}
