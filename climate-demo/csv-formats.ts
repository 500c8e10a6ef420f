/**
 * @module climate-demo/csv-formats
 * Delimited-text renderings of generated demo hours: a UTC multi-year file in SI units and a local-clock
 * logger export with daylight saving in US customary units. Pure functions returning text.
 * In every file a row's timestamp is the START of the hour it describes; dry bulb, dew point, RH,
 * pressure and wind are values for that hour (model evaluated at mid-hour), GHI is the hour mean [W/m²]
 * and rain the hour total.
 */
import type { DemoSite } from './sites.ts'
import type { DemoHours } from './weather-model.ts'

const HOUR_MS = 3_600_000
/** 1 mph = 0.44704 m/s exactly (NIST SP 811, 2008, appendix B). */
const METRES_PER_SECOND_PER_MPH = 0.44704
/** 1 inHg (at 0 °C) = 3.386389 kPa (NIST SP 811, 2008, appendix B.8). */
const KPA_PER_INCH_MERCURY = 3.386389
/** 1 inch = 25.4 mm exactly. */
const MM_PER_INCH = 25.4

/** `x` with `decimals` decimals, never "-0.0". */
export function fixed(x: number, decimals: number): string {
  const text = x.toFixed(decimals)
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text
}

const pad2 = (n: number): string => String(n).padStart(2, '0')

/** `YYYY-MM-DDTHH:MMZ` of `utcMs`. */
export function isoUtcMinute(utcMs: number): string {
  const d = new Date(utcMs)
  return `${d.getUTCFullYear()}-${pad2(d.getUTCMonth() + 1)}-${pad2(d.getUTCDate())}T${pad2(d.getUTCHours())}:${pad2(d.getUTCMinutes())}Z`
}

/** Index of the hour starting at `utcMs` in `hours`, with a clear error when it is outside. */
export function hourIndexAt(hours: DemoHours, utcMs: number): number {
  const k = (utcMs - hours.firstStartUtcMs) / HOUR_MS
  if (!Number.isInteger(k) || k < 0 || k > hours.hours) {
    throw new RangeError(`time ${new Date(utcMs).toISOString()} is outside the generated hours`)
  }
  return k
}

/** Header of the SI files; units in parentheses. */
export const SI_HEADER =
  'time (UTC),dry bulb (°C),dew point (°C),relative humidity (%),station pressure (kPa),' +
  'wind speed at 10 m (m/s),global horizontal irradiance (W/m²),rain (mm)'

/** SI value fields of hour `k`, in {@link SI_HEADER} order after the time. */
export function siFields(hours: DemoHours, k: number): string[] {
  return [
    fixed(hours.dryBulbC[k], 1),
    fixed(hours.dewPointC[k], 1),
    fixed(hours.relativeHumidityPct[k], 1),
    fixed(hours.pressureKpa[k], 2),
    fixed(hours.windMs[k], 1),
    fixed(hours.ghiWm2[k], 0),
    fixed(hours.rainMm[k], 1),
  ]
}

/** UTC CSV (ISO 8601 with Z, SI units) of the hours starting in [fromUtcMs, toUtcMs). */
export function utcSiCsv(hours: DemoHours, fromUtcMs: number, toUtcMs: number): string {
  const lines = [SI_HEADER]
  for (let k = hourIndexAt(hours, fromUtcMs); k < hourIndexAt(hours, toUtcMs); k++) {
    lines.push(`${isoUtcMinute(hours.firstStartUtcMs + k * HOUR_MS)},${siFields(hours, k).join(',')}`)
  }
  return lines.join('\n') + '\n'
}

/** Header of the US-customary logger export; units in parentheses. */
export const IMPERIAL_HEADER =
  'Date Time (local),Temperature (°F),Dew Point (°F),Humidity (%),Station Pressure (inHg),' +
  'Wind Speed (mph),Solar Radiation (W/m²),Rain (in)'

/** Wall-clock formatter `YYYY-MM-DD HH:MM` in IANA zone `timeZone` (daylight saving as the zone has it). */
export function wallClockFormatter(timeZone: string): (utcMs: number) => string {
  const format = new Intl.DateTimeFormat('en-US', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  })
  return (utcMs: number) => {
    const part: Record<string, string> = {}
    for (const p of format.formatToParts(new Date(utcMs))) part[p.type] = p.value
    return `${part.year}-${part.month}-${part.day} ${part.hour}:${part.minute}`
  }
}

/**
 * Logger-style export on the site's local clock WITH daylight saving, as a logger writes it: the spring
 * hour that the clock skips has no row, the autumn hour that repeats appears twice with the same label.
 * °F, mph, inHg, inches; W/m² for irradiance. Hours starting in [fromUtcMs, toUtcMs).
 */
export function localDstImperialCsv(
  site: DemoSite,
  hours: DemoHours,
  fromUtcMs: number,
  toUtcMs: number,
): string {
  const wallClock = wallClockFormatter(site.timeZone)
  const lines = [IMPERIAL_HEADER]
  for (let k = hourIndexAt(hours, fromUtcMs); k < hourIndexAt(hours, toUtcMs); k++) {
    lines.push(
      [
        wallClock(hours.firstStartUtcMs + k * HOUR_MS),
        fixed((hours.dryBulbC[k] * 9) / 5 + 32, 1),
        fixed((hours.dewPointC[k] * 9) / 5 + 32, 1),
        fixed(hours.relativeHumidityPct[k], 0),
        fixed(hours.pressureKpa[k] / KPA_PER_INCH_MERCURY, 3),
        fixed(hours.windMs[k] / METRES_PER_SECOND_PER_MPH, 1),
        fixed(hours.ghiWm2[k], 0),
        fixed(hours.rainMm[k] / MM_PER_INCH, 2),
      ].join(','),
    )
  }
  return lines.join('\n') + '\n'
}
