/**
 * @module weather/dialects/open-meteo
 * Open-Meteo hourly CSV (historical and forecast APIs, `format=csv`): a metadata block
 * `latitude,longitude,elevation,utc_offset_seconds,timezone,timezone_abbreviation` with one value row,
 * a blank line, then `time,<variable> (<unit>),…` with `time` as `YYYY-MM-DDTHH:MM` in UTC shifted
 * by the one fixed `utc_offset_seconds`; missing values are `NaN`. Instants (temperature,
 * humidity, dew point, pressure, wind, cloud cover) are at the time; `shortwave_radiation` is the
 * mean and `precipitation` the sum over the preceding hour (the service's variable documentation,
 * from memory). A daily block after a second blank line is not read.
 */
import { S_PER_HOUR } from '../../physics/constants.ts'
import { readDelimited } from '../delimited.ts'
import { snippet } from '../snippet.ts'
import {
  cellsOf,
  type DialectContext,
  type DialectHead,
  type DialectReading,
  isIanaZone,
  numberOf,
  stated,
  textUntilBlankLineAfter,
  type WeatherDialect,
} from './dialect.ts'

const PRECEDING_HOUR = { label: 'end', intervalMinutes: 60 } as const

export const openMeteo: WeatherDialect = {
  id: 'open-meteo',
  title: 'Open-Meteo hourly CSV',
  detect(head: DialectHead): boolean {
    const first = head.lower[0] ?? ''
    return first.startsWith('latitude,longitude,') && first.includes('utc_offset_seconds')
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const names = cellsOf(head.lower[0])
    const values = cellsOf(head.lines[1] ?? '')
    const meta = (name: string): string | undefined => values[names.indexOf(name)]
    const headerIndex = head.lower.findIndex((l, i) => i > 1 && l.startsWith('time'))
    // Hourly block only: a daily block follows after a blank line.
    const body = headerIndex < 0 ? text : textUntilBlankLineAfter(text, headerIndex)
    const { table, info } = readDelimited(body, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: headerIndex < 0 ? undefined : headerIndex,
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['time'] },
          dryBulb: { names: ['temperature_2m'] },
          relativeHumidity: { names: ['relative_humidity_2m', 'relativehumidity_2m'] },
          dewPoint: { names: ['dew_point_2m', 'dewpoint_2m'] },
          pressure: { names: ['surface_pressure'] },
          wind: { names: ['wind_speed_10m', 'windspeed_10m'] },
          ghi: { names: ['shortwave_radiation', 'global_horizontal_irradiance'] },
          rain: { names: ['precipitation'] },
          cloudCover: { names: ['cloud_cover', 'cloudcover'] },
        },
      },
    })
    if (table.columns.ghi) table.columns.ghi.timing = { kind: 'interval-mean', ...PRECEDING_HOUR }
    if (table.columns.rain) table.columns.rain.timing = { kind: 'interval-total', ...PRECEDING_HOUR }
    table.labels = 'start'
    table.sampling = 'readings'
    const offsetSeconds = numberOf(meta('utc_offset_seconds'))
    const zone = meta('timezone') ?? ''
    table.statements = stated({
      latitudeDeg: numberOf(meta('latitude')),
      longitudeDeg: numberOf(meta('longitude')),
      elevationM: numberOf(meta('elevation')),
      dialect: 'open-meteo',
      windHeightM: table.columns.wind ? 10 : undefined,
      timestampUtcOffsetHours: offsetSeconds / S_PER_HOUR,
      siteTimeZone: isIanaZone(zone) && zone !== 'GMT' && zone !== 'UTC' ? zone : undefined,
    })
    ctx.notes.push(
      `Open-Meteo metadata: grid cell at ${meta('latitude')}, ${meta('longitude')}, ${meta('elevation')} m; ` +
        `times at the fixed offset of ${Number.isFinite(offsetSeconds) ? offsetSeconds / S_PER_HOUR : '?'} h (${snippet(zone)}); ` +
        'radiation and precipitation cover the hour before each time',
    )
    return { table, info }
  },
}
