/**
 * @module weather/dialects/noaa-lcd
 * NOAA NCEI Local Climatological Data (LCD) CSV: quoted `STATION`, `DATE`, `LATITUDE`, `LONGITUDE`,
 * `ELEVATION`, `NAME`, `REPORT_TYPE`, `SOURCE`, then `Hourly…` columns in US units:
 * `HourlyDryBulbTemperature` and `HourlyDewPointTemperature` °F, `HourlyRelativeHumidity` %,
 * `HourlyStationPressure` inHg (`HourlySeaLevelPressure` and `HourlyAltimeterSetting` are not
 * station pressure), `HourlyWindSpeed` mph, `HourlyPrecipitation` inches since the previous routine
 * report with `T` for a trace, `HourlySkyConditions` layers such as `BKN:06 120` (cover in oktas,
 * then height). A value may carry an `s` (suspect) or `*` suffix; `M` is missing. `DATE` is local
 * STANDARD time all year (no daylight saving) and the file does not say which zone: the UTC offset
 * must be given. SOD/SOM rows are daily and monthly summaries and are left out. (LCD documentation,
 * from memory; layout as in the service's CSV downloads.)
 */
import { readDelimited } from '../delimited.ts'
import { snippet } from '../snippet.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  numberOf,
  stated,
  type WeatherDialect,
} from './dialect.ts'
import { NOAA_SUMMARY_ROWS, noaaReportKind, noaaReportTiming, noaaStation } from './noaa-station-csv.ts'

/** An LCD value: `s` (suspect) and `*` suffixes dropped, `M` missing, `T` (trace) → 0 where allowed. */
export function lcdValue(text: string, traceIsZero = false): number {
  let t = text.trim()
  if (t === '' || t === 'M') return Number.NaN
  if (t === 'T') return traceIsZero ? 0 : Number.NaN
  while (t.length > 0 && (t.endsWith('s') || t.endsWith('*'))) t = t.slice(0, -1)
  return numberOf(t)
}

/** Total sky cover from `HourlySkyConditions` layers (`FEW:01 40 BKN:06 120`): the largest okta, NaN when none. */
export function lcdSkyCover(text: string): number {
  let best = Number.NaN
  let k = text.indexOf(':')
  while (k >= 0) {
    const d1 = text.charCodeAt(k + 1) - 48
    const d2 = text.charCodeAt(k + 2) - 48
    if (d1 >= 0 && d1 <= 9 && d2 >= 0 && d2 <= 9) {
      const oktas = d1 * 10 + d2
      if (oktas <= 8 && !(oktas <= best)) best = oktas
    }
    k = text.indexOf(':', k + 1)
  }
  return best
}

const ROUTINE = new Set(['FM-15', 'FM-12', 'SY-MT', 'SAO'])

export const noaaLcd: WeatherDialect = {
  id: 'noaa-lcd',
  title: 'NOAA Local Climatological Data (LCD) CSV',
  detect(head: DialectHead): boolean {
    const first = head.lower[0] ?? ''
    return first.includes('"station"') && first.includes('hourlydrybulbtemperature')
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 0,
      decoders: {
        dryBulb: (t) => lcdValue(t),
        dewPoint: (t) => lcdValue(t),
        relativeHumidity: (t) => lcdValue(t),
        pressure: (t) => lcdValue(t),
        wind: (t) => lcdValue(t),
        rain: (t) => lcdValue(t, true),
        cloudCover: lcdSkyCover,
      },
      dropRows: NOAA_SUMMARY_ROWS,
      reportKind: noaaReportKind(ROUTINE),
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['DATE'] },
          dryBulb: { names: ['HourlyDryBulbTemperature'], unit: 'F' },
          dewPoint: { names: ['HourlyDewPointTemperature'], unit: 'F' },
          relativeHumidity: { names: ['HourlyRelativeHumidity'], unit: '%' },
          pressure: { names: ['HourlyStationPressure'], unit: 'inHg' },
          wind: { names: ['HourlyWindSpeed'], unit: 'mph' },
          rain: { names: ['HourlyPrecipitation'], unit: 'in' },
          cloudCover: { names: ['HourlySkyConditions'], unit: 'oktas' },
        },
      },
    })
    noaaReportTiming(table)
    const { site, at } = noaaStation(head)
    table.statements = stated({
      ...site,
      windHeightM: 10,
      dialect: 'noaa-lcd',
    })
    ctx.warnings.push(
      `LCD station ${snippet(at('station') ?? '')}: times are local standard time all year (no daylight saving); ` +
        'the file does not name the zone, so give its standard offset with --utc-offset (not --tz, which would apply daylight saving)',
    )
    return { table, info }
  },
}
