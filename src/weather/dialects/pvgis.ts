/**
 * @module weather/dialects/pvgis
 * The European Commission JRC's PVGIS CSV exports.
 * - Typical year (`tmy`): `Latitude (decimal degrees): …`, `Longitude …`, `Elevation (m): …`, an
 *   `Irradiance Time Offset (h)` line, a `month,year` table of the year each month comes from, then
 *   `time(UTC),T2m,RH,G(h),Gb(n),Gd(h),IR(h),WS10m,WD10m,SP` with `time(UTC)` as `YYYYMMDD:HHMM`,
 *   and after a blank line a footer naming the variables: T2m °C, RH %, G(h) global horizontal
 *   W/m², WS10m m/s, SP surface pressure Pa (Gb(n) direct normal, Gd(h) diffuse, IR(h) longwave).
 * - Hourly series (`seriescalc`): tab-separated metadata lines, `Slope: … deg.`, then
 *   `time,G(i),H_sun,T2m,WS10m,Int` with stamps at HH:10 (the satellite's scan time) in UTC; G(i)
 *   is the irradiance on the plane of the slope, global horizontal only when the slope is 0.
 * Values are instantaneous: an hourly value describes the hour its stamp falls in. (Layout as the
 * service writes it, read in its footer lines; the scan-time meaning of the offset from memory.)
 */
import { readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  findLine,
  numberOf,
  stated,
  textUntilBlankLineAfter,
  type WeatherDialect,
} from './dialect.ts'

/** The number after the first ':' of the head line starting with `key` (lower case), NaN when none. */
function metaNumber(head: DialectHead, key: string): number {
  const i = findLine(head, (l) => l.startsWith(key))
  if (i < 0) return Number.NaN
  const line = head.lines[i]
  const colon = line.indexOf(':')
  if (colon < 0) return Number.NaN
  const rest = line.slice(colon + 1).trim()
  let end = 0
  while (end < rest.length && rest[end] !== ' ' && rest[end] !== '\t') end++
  return numberOf(rest.slice(0, end))
}

function readPvgis(
  text: string,
  head: DialectHead,
  ctx: DialectContext,
  typicalYear: boolean,
): DialectReading {
  const headerIndex = findLine(head, (l) => l.startsWith('time(utc),') || l.startsWith('time,'))
  const body = headerIndex < 0 ? text : textUntilBlankLineAfter(text, headerIndex)
  const slope = metaNumber(head, 'slope')
  const horizontal = !(Math.abs(slope) > 0)
  const { table, info } = readDelimited(body, ctx.mapping, ctx.log, ctx.warnings, {
    headerLine: ctx.headerLine,
    headerRow: headerIndex < 0 ? undefined : headerIndex,
    delimiter: ',',
    columns: {
      only: true,
      columns: {
        timestamp: { names: ['time(UTC)', 'time'] },
        dryBulb: { names: ['T2m'], unit: 'C' },
        relativeHumidity: { names: ['RH'], unit: '%' },
        pressure: { names: ['SP'], unit: 'Pa' },
        wind: { names: ['WS10m'], unit: 'm/s' },
        ghi: horizontal ? { names: ['G(h)', 'G(i)'], unit: 'W/m2' } : { names: ['G(h)'], unit: 'W/m2' },
      },
    },
  })
  if (!horizontal && !table.columns.ghi)
    ctx.notes.push(`G(i) is the irradiance on a plane tilted ${slope}°, not global horizontal: not used`)
  // Instantaneous satellite values (scan time HH:10): each stands for the hour it falls in.
  if (table.columns.ghi) table.columns.ghi.timing = { kind: 'instant' }
  table.labels = 'start'
  table.sampling = 'readings'
  table.statements = stated({
    latitudeDeg: metaNumber(head, 'latitude'),
    longitudeDeg: metaNumber(head, 'longitude'),
    elevationM: metaNumber(head, 'elevation'),
    timestampUtcOffsetHours: 0,
    windHeightM: table.columns.wind ? 10 : undefined,
    dialect: typicalYear ? 'pvgis-tmy' : 'pvgis-hourly',
  })
  ctx.notes.push(
    `PVGIS ${typicalYear ? 'typical year' : 'hourly series'}: times in UTC; instantaneous values, each describing the hour its stamp falls in; footer lines not read`,
  )
  return { table, info }
}

export const pvgisTmy: WeatherDialect = {
  id: 'pvgis-tmy',
  title: 'PVGIS typical-year CSV',
  detect(head: DialectHead): boolean {
    return (
      (head.lower[0] ?? '').startsWith('latitude (decimal degrees):') &&
      findLine(head, (l) => l.startsWith('time(utc),t2m')) >= 0
    )
  },
  read(text, head, ctx) {
    return readPvgis(text, head, ctx, true)
  },
}

export const pvgisHourly: WeatherDialect = {
  id: 'pvgis-hourly',
  title: 'PVGIS hourly series CSV',
  detect(head: DialectHead): boolean {
    return (
      (head.lower[0] ?? '').startsWith('latitude (decimal degrees):') &&
      findLine(head, (l) => l.startsWith('time,') && l.includes('t2m')) >= 0
    )
  },
  read(text, head, ctx) {
    return readPvgis(text, head, ctx, false)
  },
}
