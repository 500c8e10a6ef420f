/**
 * @module weather/dialects/meteostat
 * Meteostat hourly CSV, as downloaded with a header (`time,temp,dwpt,rhum,prcp,snow,wdir,wspd,wpgt,
 * pres,tsun,coco`) or as a bulk file without one (`date,hour,temp,…`, 13 columns). Times are UTC;
 * temp and dwpt °C, rhum %, prcp mm over the hour ENDING at the stamp, wspd km/h, wpgt the peak gust,
 * pres the pressure reduced to SEA LEVEL (hPa; not station pressure, so not used), tsun sunshine
 * minutes, coco a weather condition code. (Meteostat documentation of its bulk hourly data, from
 * memory.)
 */

import type { ColumnPreset } from '../column-preset.ts'
import { type DelimitedLayout, readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** Columns of a bulk file without a header, in order (Meteostat bulk hourly data, from memory). */
const BULK_COLUMNS = [
  'date',
  'hour',
  'temp',
  'dwpt',
  'rhum',
  'prcp',
  'snow',
  'wdir',
  'wspd',
  'wpgt',
  'pres',
  'tsun',
  'coco',
]

const PRESET: ColumnPreset = {
  only: true,
  columns: {
    timestamp: { names: ['time'] },
    date: { names: ['date'] },
    hour: { names: ['hour'] },
    dryBulb: { names: ['temp'], unit: 'C' },
    dewPoint: { names: ['dwpt'], unit: 'C' },
    relativeHumidity: { names: ['rhum'], unit: '%' },
    rain: { names: ['prcp'], unit: 'mm' },
    wind: { names: ['wspd'], unit: 'km/h' },
  },
}

function finish(reading: DialectReading, ctx: DialectContext, id: string): DialectReading {
  const table = reading.table
  if (table.columns.rain)
    table.columns.rain.timing = { kind: 'interval-total', label: 'end', intervalMinutes: 60 }
  table.labels = 'start'
  table.sampling = 'readings'
  table.statements = stated({ timestampUtcOffsetHours: 0, windHeightM: 10, dialect: id })
  ctx.notes.push(
    'Meteostat: times in UTC; wspd in km/h; prcp over the hour ending at each time; pres is reduced to sea level and not used as station pressure; tsun (sunshine minutes) not used',
  )
  return reading
}

/** `YYYY-MM-DD,H,` at the start of a line (a bulk row), read by character codes. */
function looksLikeBulkRow(line: string): boolean {
  if (line.length < 13) return false
  for (const k of [0, 1, 2, 3, 5, 6, 8, 9]) {
    const c = line.charCodeAt(k)
    if (c < 48 || c > 57) return false
  }
  if (line[4] !== '-' || line[7] !== '-' || line[10] !== ',') return false
  let k = 11
  while (k < line.length && line.charCodeAt(k) >= 48 && line.charCodeAt(k) <= 57) k++
  return k > 11 && k <= 13 && line[k] === ','
}

export const meteostat: WeatherDialect = {
  id: 'meteostat',
  title: 'Meteostat hourly CSV',
  detect(head: DialectHead): boolean {
    const first = head.lower[0] ?? ''
    return first.startsWith('time,temp,dwpt,rhum') || first.startsWith('date,hour,temp,dwpt')
  },
  read(text, _head, ctx) {
    const layout: DelimitedLayout = { headerRow: 0, columns: PRESET }
    return finish(
      readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, { ...layout, headerLine: ctx.headerLine }),
      ctx,
      'meteostat',
    )
  },
}

export const meteostatBulk: WeatherDialect = {
  id: 'meteostat-bulk',
  title: 'Meteostat bulk hourly CSV (no header row)',
  detect(head: DialectHead): boolean {
    const first = head.lines[0] ?? ''
    return looksLikeBulkRow(first) && first.split(',').length === BULK_COLUMNS.length
  },
  read(text, _head, ctx) {
    ctx.notes.push(`no header row: columns read as Meteostat's ${BULK_COLUMNS.join(',')}`)
    return finish(
      readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
        headerRow: -1,
        columnNames: BULK_COLUMNS,
        columns: PRESET,
      }),
      ctx,
      'meteostat-bulk',
    )
  },
}
