/**
 * @module weather/dialects/nsrdb-psm
 * NREL National Solar Radiation Database (NSRDB) PSM CSV: line 1 names the metadata (`Source,
 * Location ID, City, State, Country, Latitude, Longitude, Time Zone, Elevation, Local Time Zone,
 * <variable> Units, …`), line 2 gives their values, line 3 is the header `Year,Month,Day,Hour,Minute,
 * DHI,GHI,DNI,…,Temperature,Pressure,…`. Units come from the `… Units` metadata (°C, mbar, m/s,
 * W/m²); `Time Zone` is the timestamps' offset from UTC (0 when downloaded in UTC) and `Local Time
 * Zone` the site's standard offset. Values are instantaneous at the stamp (HH:30 in hourly files,
 * which describes the hour HH:00–HH+1:00). Clearsky GHI, DNI and DHI are not global horizontal
 * irradiance. (pvlib `iotools/psm3.py` docstring and NSRDB downloads, from memory.)
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

export const nsrdbPsm: WeatherDialect = {
  id: 'nsrdb-psm',
  title: 'NSRDB PSM CSV',
  detect(head: DialectHead): boolean {
    const first = head.lower[0] ?? ''
    return (
      first.startsWith('source,location id,') &&
      first.includes('time zone') &&
      (head.lower[2] ?? '').startsWith('year,month,day,hour')
    )
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const names = cellsOf(head.lower[0])
    const values = cellsOf(head.lines[1] ?? '')
    const meta = (name: string): string | undefined => values[names.indexOf(name)]
    const unit = (variable: string): string | undefined => meta(`${variable} units`)
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 2,
      columns: {
        only: true,
        columns: {
          year: { names: ['Year'] },
          month: { names: ['Month'] },
          day: { names: ['Day'] },
          hour: { names: ['Hour'] },
          minute: { names: ['Minute'] },
          dryBulb: { names: ['Temperature'], unit: unit('temperature') ?? 'C' },
          dewPoint: { names: ['Dew Point'], unit: unit('dew point') ?? 'C' },
          relativeHumidity: { names: ['Relative Humidity'], unit: unit('relative humidity') ?? '%' },
          pressure: { names: ['Pressure'], unit: unit('pressure') ?? 'mbar' },
          wind: { names: ['Wind Speed'], unit: unit('wind speed') ?? 'm/s' },
          ghi: { names: ['GHI'], unit: unit('ghi') ?? 'W/m2' },
        },
      },
    })
    // Instantaneous satellite-model values: an HH:30 value stands for the hour HH:00–HH+1:00.
    if (table.columns.ghi) table.columns.ghi.timing = { kind: 'instant' }
    table.labels = 'start'
    table.sampling = 'readings'
    const offset = numberOf(meta('time zone'))
    table.statements = stated({
      siteName:
        [meta('city'), meta('state'), meta('country')].filter((x) => x && x !== '-').join(', ') || undefined,
      latitudeDeg: numberOf(meta('latitude')),
      longitudeDeg: numberOf(meta('longitude')),
      elevationM: numberOf(meta('elevation')),
      timestampUtcOffsetHours: offset,
      siteUtcOffsetHours: numberOf(meta('local time zone')),
      dialect: 'nsrdb-psm',
    })
    ctx.notes.push(
      `NSRDB metadata: location ${meta('location id') ?? '?'}, timestamps at UTC${offset >= 0 ? '+' : ''}${offset} h; instantaneous values at the stamp (HH:30 describes HH:00–HH+1:00)`,
    )
    return { table, info }
  },
}
