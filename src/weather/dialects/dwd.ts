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
 * header line) are merged by time. (DWD CDC product descriptions, from memory.)
 */
import type { ColumnPreset } from '../columns.ts'
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

/**
 * One text for several products: the union of their value columns, one row per time (rows of one
 * time merged), and the first file line of each row.
 */
function mergeBlocks(blocks: Block[]): { text: string; lines: number[] } {
  const skip = (name: string) => {
    const n = name.toUpperCase()
    return n === 'STATIONS_ID' || n === 'MESS_DATUM' || n === 'EOR' || n.startsWith('QN')
  }
  const columns: string[] = []
  for (const b of blocks) for (const h of b.header) if (!skip(h) && !columns.includes(h)) columns.push(h)
  const byTime = new Map<string, { line: number; station: string; values: Map<string, string> }>()
  for (const b of blocks) {
    const at = b.header.findIndex((h) => h.toUpperCase() === 'MESS_DATUM')
    for (const [line, cells] of b.rows) {
      const time = cells[at] ?? ''
      let row = byTime.get(time)
      if (!row) {
        row = { line, station: cells[0] ?? '', values: new Map() }
        byTime.set(time, row)
      }
      b.header.forEach((h, j) => {
        if (!skip(h) && cells[j] !== undefined) row!.values.set(h, cells[j])
      })
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
  return { text: `${out.join('\n')}\n`, lines }
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
    ctx.warnings.push(
      `DWD product${products.length > 1 ? 's' : ''} ${products.join(', ')}: times in UTC, -999 missing, P (sea level) not used` +
        (blocks.length > 1 ? `; ${blocks.length} products merged by MESS_DATUM` : '') +
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
