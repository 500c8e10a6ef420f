/**
 * @module weather/dialects/ag-network
 * Hourly files of state agricultural weather networks (the layout of California's CIMIS hourly
 * reports): `Stn Id,Stn Name,CIMIS Region,Date,Hour (PST),Jul,ETo (in),qc,Precip (in),qc,Sol Rad
 * (Ly/day),qc,Vap Pres (mBars),qc,Air Temp (F),qc,Rel Hum (%),qc,Dew Point (F),qc,Wind Speed (mph),qc,
 * …`. `Hour (PST)` runs 0100–2400 in local STANDARD time all year and labels the END of the hour the
 * values describe (means; totals for precipitation and ETo); 2400 closes its date. Each value is
 * followed by its quality flag: blank good, `Y` moderately out of range (kept), `M` missing, `R` far
 * out of range, `N` not collected, `S` not in service (those read as missing). Solar radiation in
 * langleys per day is a rate (× 41 840 / 86 400 for W/m²); metric files write `W/sq.m`, `C`, `mm`,
 * `m/s`, `kPa`. Vapour pressure is not station pressure; ETo is not rain. Humidity is taken from the
 * dew point, written to tenths of a degree, rather than from RH in whole percent (the finer of the
 * two). (CIMIS report layout and flag legend, from memory.)
 */
import { readDelimited } from '../delimited.ts'
import {
  cellsOf,
  type DialectContext,
  type DialectHead,
  type DialectReading,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** Flags that make a value unusable (see the module). */
const REJECTED_FLAGS = new Set(['M', 'R', 'N', 'S', 'I'])

export const agNetwork: WeatherDialect = {
  id: 'ag-network-hourly',
  title: 'Agricultural weather network hourly report',
  detect(head: DialectHead): boolean {
    const names = cellsOf(head.lower[0] ?? '')
    return names.includes('stn id') && names.some((n) => n.startsWith('hour (')) && names.includes('qc')
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 0,
      qualityFlags: {
        offset: 1,
        reject: (flag) => REJECTED_FLAGS.has(flag.trim().toUpperCase()),
        describe: 'M, R, N, S or I (missing or out of range)',
      },
      columns: {
        only: true,
        columns: {
          date: { names: ['Date'] },
          hour: { names: ['Hour'] },
          dryBulb: { names: ['Air Temp'] },
          dewPoint: { names: ['Dew Point'] },
          wind: { names: ['Wind Speed'] },
          ghi: { names: ['Sol Rad'] },
          rain: { names: ['Precip'] },
        },
      },
    })
    for (const variable of ['dryBulb', 'dewPoint', 'wind', 'ghi'] as const) {
      const col = table.columns[variable]
      if (col) col.timing = { kind: 'interval-mean', label: 'end', intervalMinutes: 60 }
    }
    if (table.columns.rain)
      table.columns.rain.timing = { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
    table.labels = 'end'
    table.sampling = 'readings'
    const first = cellsOf(head.lines[1] ?? '')
    const names = cellsOf(head.lower[0] ?? '')
    table.statements = stated({ siteName: first[names.indexOf('stn name')], dialect: 'ag-network-hourly' })
    ctx.notes.push(
      'agricultural network report: hours 0100–2400 end the hour they describe, in local standard time all year; ' +
        'values flagged M, R, N, S or I read as missing (Y kept); humidity from the dew point (tenths of a degree) rather than the whole-percent RH; ' +
        'vapour pressure and ETo not used; the station location is not in the file',
    )
    return { table, info }
  },
}
