/**
 * @module weather/dialects/console-export
 * Text exports of home weather-station console software: tab-separated, a header in two rows
 * (`Temp`/`Out`, `Out`/`Hum`, `Dew`/`Pt.`, `Wind`/`Speed`, `Solar`/`Rad.`, …), dates like `3/8/23`
 * and 12-hour times like `12:30a`, one row per archive interval with Time at its END: temperature,
 * humidity, wind speed and solar radiation are means over the interval, Rain the total. `Bar` is the
 * barometer reduced to sea level (not used), `In Temp`/`In Hum` are indoor, `Hi`/`Low` extremes. The
 * units follow the console's set-up and are not written: a barometer near 30 means inches of
 * mercury and the US set (°F, mph, in); near 1000 the metric set (°C, m/s, mm). The clock is the
 * station's local time. (Layout of such exports, from memory; brand names kept generic.)
 */
import { readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  findLine,
  numberOf,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** The two header rows joined cell by cell, in lower case. */
function joinedHeader(head: DialectHead, second: number): string[] {
  const a = (head.lines[second - 1] ?? '').split('\t')
  const b = (head.lines[second] ?? '').split('\t')
  const n = Math.max(a.length, b.length)
  const out: string[] = []
  for (let j = 0; j < n; j++) out.push(`${(a[j] ?? '').trim()} ${(b[j] ?? '').trim()}`.trim().toLowerCase())
  return out
}

export const consoleExport: WeatherDialect = {
  id: 'console-export',
  title: 'Weather-station console export (tab-separated, two header rows)',
  detect(head: DialectHead): boolean {
    const second = findLine(head, (l) => l.startsWith('date\ttime\t'))
    if (second < 1) return false
    const names = joinedHeader(head, second)
    return names.includes('temp out') && names.includes('out hum') && names.some((n) => n.startsWith('bar'))
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const second = findLine(head, (l) => l.startsWith('date\ttime\t'))
    const names = joinedHeader(head, second)
    const firstRow = (head.lines[second + 1] ?? '').split('\t')
    const bar = numberOf(firstRow[names.findIndex((n) => n.startsWith('bar'))])
    const us = !(bar > 500)
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      delimiter: '\t',
      columns: {
        only: true,
        columns: {
          date: { names: ['Date'] },
          time: { names: ['Time'] },
          dryBulb: { names: ['Temp Out'], unit: us ? 'F' : 'C' },
          relativeHumidity: { names: ['Out Hum'], unit: '%' },
          dewPoint: { names: ['Dew Pt.'], unit: us ? 'F' : 'C' },
          wind: { names: ['Wind Speed'], unit: us ? 'mph' : 'm/s' },
          ghi: { names: ['Solar Rad.'], unit: 'W/m2' },
          rain: { names: ['Rain'], unit: us ? 'in' : 'mm' },
        },
      },
    })
    for (const variable of ['dryBulb', 'relativeHumidity', 'dewPoint', 'wind', 'ghi'] as const) {
      const col = table.columns[variable]
      if (col) col.timing = { kind: 'interval-mean', label: 'end' }
    }
    if (table.columns.rain) table.columns.rain.timing = { kind: 'interval-total', label: 'end' }
    table.labels = 'end'
    table.sampling = 'readings'
    table.statements = stated({ dialect: 'console-export', timestampsInSiteClock: true })
    ctx.notes.push(
      `console export: ${us ? 'barometer in inches of mercury, so US units (°F, mph, in)' : 'barometer in hPa, so metric units (°C, m/s, mm)'}; ` +
        'each row ends its archive interval (means and totals over the interval before it); Bar is reduced to sea level and not used; ' +
        "the clock is the station's local time, not stated in the file",
    )
    return { table, info }
  },
}
