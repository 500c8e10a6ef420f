/**
 * @module weather/dialects/iem-asos
 * Iowa Environmental Mesonet (IEM) ASOS/AWOS download (`asos.py`): optional `#DEBUG` lines, then
 * `station,valid,[lon,lat],[elevation],…` with short names whose units are part of the name:
 * `tmpf`/`dwpf` °F, `relh` %, `sknt` knots, `p01i` inches, `alti` altimeter setting (inHg, not
 * station pressure), `mslp` sea-level pressure (hPa). `valid` is UTC unless another zone was chosen
 * on download; `M` is missing and a trace of precipitation is `0.0001` (or `T`). Routine reports
 * come near :53, specials in between; `p01i` is the precipitation since the previous hourly reset,
 * which makes it the hour's total in a routine report and a running amount in 1- and 5-minute
 * data (akrherz/iem `cgi-bin/request/asos.py` and the IEM column notes, read through the project's
 * search; report minutes from memory).
 */
import { readDelimited } from '../delimited.ts'
import {
  cellsOf,
  type DialectContext,
  type DialectHead,
  type DialectReading,
  findLine,
  numberOf,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** `T` (trace) → 0; `M` → missing; numbers as written. */
function precipitation(text: string): number {
  const t = text.trim()
  if (t === 'T' || t === 't') return 0
  const x = numberOf(t)
  return x > 0 && x < 0.001 ? 0 : x // 0.0001 marks a trace
}

/** Minutes between the first two data rows' times (`YYYY-MM-DD HH:MM`), NaN when unknown. */
function headSpacingMinutes(head: DialectHead, headerIndex: number, validColumn: number): number {
  const times: number[] = []
  for (let i = headerIndex + 1; i < head.lines.length && times.length < 6; i++) {
    const v = cellsOf(head.lines[i])[validColumn] ?? ''
    if (v.length < 16) continue
    const ms = Date.parse(`${v.slice(0, 10)}T${v.slice(11, 16)}:00Z`)
    if (Number.isFinite(ms)) times.push(ms)
  }
  let best = Number.POSITIVE_INFINITY
  for (let k = 1; k < times.length; k++) {
    const d = (times[k] - times[k - 1]) / 60_000
    if (d > 0 && d < best) best = d
  }
  return Number.isFinite(best) ? best : Number.NaN
}

export const iemAsos: WeatherDialect = {
  id: 'iem-asos',
  title: 'IEM ASOS/AWOS download',
  detect(head: DialectHead): boolean {
    const i = findLine(head, (l) => l.startsWith('station,valid'))
    if (i < 0) return false
    const names = cellsOf(head.lower[i])
    return names.some((n) => ['tmpf', 'tmpc', 'dwpf', 'relh', 'sknt', 'p01i', 'alti'].includes(n))
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const headerIndex = findLine(head, (l) => l.startsWith('station,valid'))
    const names = cellsOf(head.lower[headerIndex])
    const spacing = headSpacingMinutes(head, headerIndex, names.indexOf('valid'))
    const subHourly = spacing > 0 && spacing < 30
    const reportType = names.indexOf('report_type')
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: headerIndex,
      decoders: { rain: precipitation },
      reportKind:
        reportType >= 0
          ? { names: ['report_type'], kind: (t) => (t.trim() === '3' ? 1 : t.trim() === '4' ? 2 : 0) }
          : undefined,
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['valid'] },
          dryBulb: { names: ['tmpf', 'tmpc'] },
          dewPoint: { names: ['dwpf', 'dwpc'] },
          relativeHumidity: { names: ['relh'], unit: '%' },
          wind: { names: ['sknt'], unit: 'knots' },
          rain: { names: ['p01i', 'p01m'] },
          cloudCover: { names: [] },
        },
      },
    })
    if (table.columns.rain) {
      table.columns.rain.timing = subHourly
        ? { kind: 'running-total' }
        : { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
    }
    table.labels = 'start'
    table.sampling = subHourly ? 'readings' : 'reports'
    // Site from the lon/lat/elevation columns (first data row), when downloaded with them.
    const first = cellsOf(head.lines[headerIndex + 1] ?? '')
    const at = (name: string): number => numberOf(first[names.indexOf(name)])
    table.statements = stated({
      siteName: first[names.indexOf('station')],
      latitudeDeg: names.includes('lat') ? at('lat') : undefined,
      longitudeDeg: names.includes('lon') ? at('lon') : undefined,
      elevationM: names.includes('elevation') ? at('elevation') : undefined,
      timestampUtcOffsetHours: ctx.clockGiven ? undefined : 0,
      windHeightM: 10,
      dialect: 'iem-asos',
    })
    if (!ctx.clockGiven)
      ctx.warnings.push(
        'IEM ASOS times read as UTC (the download default); give --utc-offset or --tz if another zone was chosen',
      )
    ctx.notes.push(
      subHourly
        ? `readings every ${spacing} min; p01i is a running amount since the hourly reset`
        : 'hourly reports (routine near :53, specials between); p01i is the precipitation since the previous routine report',
    )
    return { table, info }
  },
}
