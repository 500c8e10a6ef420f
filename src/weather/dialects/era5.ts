/**
 * @module weather/dialects/era5
 * ERA5-style CSV (the Copernicus Climate Data Store's point time series, or a reanalysis grid
 * written out with the ECMWF short names): `valid_time` (or `time`) in UTC, `t2m` and `d2m` in K,
 * `sp` surface pressure in Pa, `u10`/`v10` wind components in m/s (the speed is √(u² + v²)),
 * `ssrd` surface solar radiation downwards in J/m² and `tp` total precipitation in metres of water,
 * both accumulated over the hour ENDING at the stamp (ERA5 hourly data, ECMWF documentation, from
 * memory). ERA5-Land accumulates instead from 00 UTC through the day: recognised when an hourly
 * `ssrd` exceeds what one hour can hold, and then read as a running total.
 */
import { readDelimited } from '../delimited.ts'
import {
  cellsOf,
  type DialectContext,
  type DialectHead,
  type DialectReading,
  numberOf,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/**
 * Most solar energy one hour can bring to a horizontal surface [J/m²]: the solar constant
 * 1361 W/m² (Kopp & Lean 2011) for 3600 s, rounded up.
 */
const MAX_HOURLY_SSRD_JM2 = 5e6

const SHORT_NAMES = ['t2m', 'd2m', 'u10', 'v10', 'sp', 'ssrd', 'tp']

export const era5: WeatherDialect = {
  id: 'era5',
  title: 'ERA5-style CSV (ECMWF short names)',
  detect(head: DialectHead): boolean {
    const i = head.lower.findIndex(
      (l) => l.includes('t2m') && (l.includes('valid_time') || l.startsWith('time')),
    )
    if (i < 0) return false
    const names = cellsOf(head.lower[i])
    return names.filter((n) => SHORT_NAMES.includes(n)).length >= 3
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const headerIndex = head.lower.findIndex(
      (l) => l.includes('t2m') && (l.includes('valid_time') || l.startsWith('time')),
    )
    const names = cellsOf(head.lower[headerIndex])
    const ssrdColumn = names.indexOf('ssrd')
    let runningTotal = false
    for (let i = headerIndex + 1; i < head.lines.length && ssrdColumn >= 0; i++) {
      if (numberOf(cellsOf(head.lines[i])[ssrdColumn]) > MAX_HOURLY_SSRD_JM2) runningTotal = true
    }
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: headerIndex,
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['valid_time', 'time', 'date'] },
          dryBulb: { names: ['t2m'], unit: 'K' },
          dewPoint: { names: ['d2m'], unit: 'K' },
          pressure: { names: ['sp'], unit: 'Pa' },
          windU: { names: ['u10'], unit: 'm/s' },
          windV: { names: ['v10'], unit: 'm/s' },
          wind: { names: ['si10', 'ws10'], unit: 'm/s' },
          ghi: { names: ['ssrd'], unit: 'J/m2' },
          rain: { names: ['tp'], unit: 'm' },
          cloudCover: { names: ['tcc'], unit: 'fraction' },
        },
      },
    })
    for (const variable of ['ghi', 'rain'] as const) {
      const col = table.columns[variable]
      if (!col) continue
      col.timing = runningTotal
        ? { kind: 'running-total' }
        : { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
    }
    table.labels = 'start'
    table.sampling = 'readings'
    const first = cellsOf(head.lines[headerIndex + 1] ?? '')
    table.statements = stated({
      latitudeDeg: numberOf(first[names.indexOf('latitude')]),
      longitudeDeg: numberOf(first[names.indexOf('longitude')]),
      timestampUtcOffsetHours: 0,
      windHeightM: 10,
      dialect: 'era5',
    })
    ctx.notes.push(
      `ERA5-style columns: times in UTC; t2m/d2m in K, sp in Pa, tp in m; ssrd and tp ${runningTotal ? 'accumulated from 00 UTC (ERA5-Land): differenced hour by hour' : 'accumulated over the hour ending at each time'}; coordinates are the grid point's`,
    )
    return { table, info }
  },
}
