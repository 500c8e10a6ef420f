/**
 * @module weather/dialects/noaa-isd
 * NOAA NCEI Integrated Surface Data (ISD) "global-hourly" CSV: quoted columns `STATION`, `DATE`
 * (UTC, `YYYY-MM-DDTHH:MM:SS`), `LATITUDE`, `LONGITUDE`, `ELEVATION`, `NAME`, `REPORT_TYPE`, …, then
 * one column per ISD group, each a comma-joined encoded value (NOAA NCEI, "Federal Climate Complex
 * Data Documentation for Integrated Surface Data", ISD format document, mandatory and additional
 * data sections, read through the project's search):
 * - `TMP`, `DEW`: °C × 10 with a sign, `+9999` missing, then a quality code;
 * - `WND`: direction, quality, type code, speed m/s × 10 (`9999` missing), quality;
 * - `SLP`: sea-level pressure hPa × 10 (not station pressure: not used);
 * - `MA1`: altimeter setting hPa × 10, quality, STATION pressure hPa × 10 (`99999` missing), quality;
 * - `AA1`: period in hours, liquid precipitation mm × 10 (`9999` missing), condition (2 = trace), quality;
 * - `GF1`: total sky cover in oktas (`00`–`08`; `09` obscured, `10` partial obscuration, `99` missing).
 * Quality codes 2, 3, 6 and 7 (suspect or erroneous) make the value missing. `REPORT_TYPE` FM-15
 * (METAR) and FM-12 (SYNOP) are routine, FM-16 (SPECI) special; SOD and SOM are daily and monthly
 * summaries, not observations, and are left out.
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

/** ISD quality codes that mark a value suspect or erroneous (ISD format document). */
const BAD_QUALITY = new Set(['2', '3', '6', '7'])

/** Field `part` of an encoded group, divided by `scale`; NaN when missing (`missing`) or of bad quality. */
export function isdField(
  text: string,
  part: number,
  qualityPart: number,
  missing: number,
  scale: number,
): number {
  const parts = text.split(',')
  const raw = parts[part]
  if (raw === undefined || raw.trim() === '') return Number.NaN
  if (qualityPart >= 0 && BAD_QUALITY.has((parts[qualityPart] ?? '').trim())) return Number.NaN
  const value = numberOf(raw)
  if (!Number.isFinite(value) || Math.abs(value) === missing) return Number.NaN
  return value / scale
}

/** Liquid precipitation of an `AA1` group when it covers one hour [mm]; NaN otherwise. */
export function isdHourlyPrecipitation(text: string): number {
  const parts = text.split(',')
  if ((parts[0] ?? '').trim() !== '01') return Number.NaN
  return isdField(text, 1, 3, 9999, 10)
}

/** Total sky cover of a `GF1` group [oktas]; NaN when obscured or missing. */
export function isdSkyCover(text: string): number {
  const code = numberOf(text.split(',')[0])
  return code >= 0 && code <= 8 ? code : Number.NaN
}

const ROUTINE = new Set(['FM-15', 'FM-12', 'SY-MT', 'SAO', 'SY-SA', 'SY-AE', 'AUST'])

export const noaaIsd: WeatherDialect = {
  id: 'noaa-isd',
  title: 'NOAA ISD global-hourly CSV',
  detect(head: DialectHead): boolean {
    const first = head.lower[0] ?? ''
    return (
      first.startsWith('"station","date"') &&
      first.includes('"report_type"') &&
      (first.includes('"tmp"') || first.includes('"wnd"'))
    )
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 0,
      decoders: {
        dryBulb: (t) => isdField(t, 0, 1, 9999, 10),
        dewPoint: (t) => isdField(t, 0, 1, 9999, 10),
        wind: (t) => isdField(t, 3, 4, 9999, 10),
        pressure: (t) => isdField(t, 2, 3, 99999, 10),
        rain: isdHourlyPrecipitation,
        cloudCover: isdSkyCover,
      },
      dropRows: NOAA_SUMMARY_ROWS,
      reportKind: noaaReportKind(ROUTINE),
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['DATE'] },
          dryBulb: { names: ['TMP'], unit: 'C' },
          dewPoint: { names: ['DEW'], unit: 'C' },
          wind: { names: ['WND'], unit: 'm/s' },
          pressure: { names: ['MA1'], unit: 'hPa' },
          rain: { names: ['AA1'], unit: 'mm' },
          cloudCover: { names: ['GF1'], unit: 'oktas' },
        },
      },
    })
    noaaReportTiming(table)
    const { site, at } = noaaStation(head)
    table.statements = stated({
      ...site,
      timestampUtcOffsetHours: 0,
      windHeightM: 10,
      dialect: 'noaa-isd',
    })
    ctx.notes.push(
      `ISD station ${snippet(at('station') ?? '')}: times in UTC; TMP/DEW/WND/MA1/AA1 decoded (scale 10, quality codes 2, 3, 6, 7 rejected); ` +
        'station pressure from MA1 (SLP is sea-level pressure, not used); AA1 read only when it covers one hour',
    )
    return { table, info }
  },
}
