/**
 * @module weather/export
 * The hourly series the engine uses, as plain CSV in UTC: one row per hour of the series, `time_utc`
 * the ISO 8601 start of the hour the row describes (with `Z`), irradiance the mean over that hour,
 * rain the total over it, empty where missing, and the hour's quality flags in words. dryhours reads
 * this file back unchanged (the flags too); the core builds the text, the CLI writes the file.
 */
import { dewPointFromVaporPressureC } from '../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../physics/saturation.ts'
import { type HourlySeries, QualityFlag } from './series.ts'

/** The export's header, exactly. */
export const HOURLY_EXPORT_HEADER =
  'time_utc,dry_bulb_c,relative_humidity_pct,dew_point_c,pressure_kpa,wind_speed_ms,ghi_wm2,rain_mm,flags'

/** Words for the {@link QualityFlag} bits in the `flags` column (space-separated), in bit order. */
export const FLAG_WORDS: readonly (readonly [number, string])[] = [
  [QualityFlag.missingCore, 'missing-core'],
  [QualityFlag.filled, 'filled'],
  [QualityFlag.rejectedValue, 'rejected-value'],
  [QualityFlag.irradianceFilled, 'ghi-filled'],
  [QualityFlag.pressureFromElevation, 'pressure-standard'],
  [QualityFlag.duplicateTimestamp, 'duplicate-timestamp'],
  [QualityFlag.irradianceEstimated, 'ghi-estimated'],
  [QualityFlag.partialHour, 'partial-hour'],
]

/** Decimals written per column: finer than any sensor resolves (0.01 °C, 0.01 %, 1 Pa, 0.01 m/s, 0.1 W/m², 0.01 mm). */
const DECIMALS = { temperature: 2, rh: 2, pressure: 3, wind: 2, ghi: 1, rain: 2 } as const

/** The words of a flag byte, space-separated ('' when none). */
export function flagWords(bits: number): string {
  let out = ''
  for (const [bit, word] of FLAG_WORDS) if (bits & bit) out = out === '' ? word : `${out} ${word}`
  return out
}

/** The flag byte of a `flags` cell; unknown words are returned in `unknown`. */
export function parseFlagWords(text: string): { bits: number; unknown: string[] } {
  let bits = 0
  const unknown: string[] = []
  for (const word of text.trim().split(/\s+/)) {
    if (word === '') continue
    const found = FLAG_WORDS.find(([, w]) => w === word)
    if (found) bits |= found[0]
    else unknown.push(word)
  }
  return { bits, unknown }
}

/** `x` with `decimals` places, trailing zeros dropped, '' for NaN, never '-0'. */
export function formatFixed(x: number, decimals: number): string {
  if (!Number.isFinite(x)) return ''
  let text = x.toFixed(decimals)
  if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '')
  return text === '-0' ? '0' : text
}

/** ISO 8601 UTC instant with seconds and `Z`: 2021-07-01T13:00:00Z. */
export function isoUtcSeconds(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 19)}Z`
}

/**
 * Dew point over liquid water [°C] of an hour from its dry bulb [°C] and RH [%] over liquid water
 * (WMO practice; ASHRAE HOF 2017 ch. 1 eq 6 through {@link saturationVaporPressureLiquidKpa}); NaN
 * when either is missing or RH is 0.
 */
export function dewPointOfHourC(dryBulbC: number, relativeHumidityPct: number): number {
  if (!(relativeHumidityPct > 0) || !Number.isFinite(dryBulbC)) return Number.NaN
  const e = (Math.min(relativeHumidityPct, 100) / 100) * saturationVaporPressureLiquidKpa(dryBulbC)
  try {
    return dewPointFromVaporPressureC(e)
  } catch {
    return Number.NaN
  }
}

/**
 * The series as export CSV text (header, then one line per hour, LF line ends). Rows for hours
 * whose dry bulb or humidity is missing keep whatever else the hour has.
 */
export function hourlyExportCsv(series: HourlySeries): string {
  const lines: string[] = [HOURLY_EXPORT_HEADER]
  for (let s = 0; s < series.hours; s++) {
    // the dew point from the values as written, so that reading the file back gives the same text
    const tText = formatFixed(series.dryBulbC[s], DECIMALS.temperature)
    const rhText = formatFixed(series.relativeHumidityPct[s], DECIMALS.rh)
    const dew = tText === '' || rhText === '' ? Number.NaN : dewPointOfHourC(Number(tText), Number(rhText))
    lines.push(
      [
        isoUtcSeconds(series.startUtcMs[s]),
        tText,
        rhText,
        formatFixed(dew, DECIMALS.temperature),
        formatFixed(series.pressureKpa[s], DECIMALS.pressure),
        formatFixed(series.windMs[s], DECIMALS.wind),
        formatFixed(series.ghiWm2[s], DECIMALS.ghi),
        formatFixed(series.rainMm[s], DECIMALS.rain),
        flagWords(series.quality[s]),
      ].join(','),
    )
  }
  return `${lines.join('\n')}\n`
}

/** Hours, mean, minimum and maximum of one variable in SI (the values the engine uses). */
export interface VariableSummary {
  variable: string
  unit: string
  /** Hours with a value. */
  hours: number
  mean: number | null
  min: number | null
  max: number | null
}

/** Per-variable summary of a series, for `inspect --json` and a glance at plausibility. */
export function summarizeSeries(series: HourlySeries): VariableSummary[] {
  const columns: [string, string, Float64Array][] = [
    ['dryBulb', '°C', series.dryBulbC],
    ['relativeHumidity', '%', series.relativeHumidityPct],
    ['pressure', 'kPa', series.pressureKpa],
    ['wind', 'm/s', series.windMs],
    ['ghi', 'W/m²', series.ghiWm2],
    ['rain', 'mm', series.rainMm],
  ]
  if (series.cloudCoverPct) columns.push(['cloudCover', '%', series.cloudCoverPct])
  return columns.map(([variable, unit, values]) => {
    let n = 0
    let sum = 0
    let min = Number.POSITIVE_INFINITY
    let max = Number.NEGATIVE_INFINITY
    for (let s = 0; s < values.length; s++) {
      const v = values[s]
      if (Number.isNaN(v)) continue
      n++
      sum += v
      if (v < min) min = v
      if (v > max) max = v
    }
    const r = (x: number): number => Math.round(x * 1000) / 1000
    return {
      variable,
      unit,
      hours: n,
      mean: n > 0 ? r(sum / n) : null,
      min: n > 0 ? r(min) : null,
      max: n > 0 ? r(max) : null,
    }
  })
}
