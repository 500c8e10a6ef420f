/**
 * @module weather/units
 * Unit tokens found in weather-file headers and mappings, their conversion to the series' SI units,
 * and a plausibility check of a column's values against its unit. Conversion happens once, here.
 */

import { orderStatistic } from '../math/quantile.ts'
import { S_PER_DAY, S_PER_HOUR } from '../physics/constants.ts'
import { snippet } from './snippet.ts'

/** The variables a reader can take from a file. */
export type WeatherVariable =
  | 'dryBulb'
  | 'relativeHumidity'
  | 'dewPoint'
  | 'wetBulb'
  | 'pressure'
  | 'wind'
  | 'ghi'
  | 'rain'
  | 'cloudCover'

export const WEATHER_VARIABLES: readonly WeatherVariable[] = [
  'dryBulb',
  'relativeHumidity',
  'dewPoint',
  'wetBulb',
  'pressure',
  'wind',
  'ghi',
  'rain',
  'cloudCover',
]

/** The SI unit each variable is stored in. */
export const SERIES_UNIT: Record<WeatherVariable, string> = {
  dryBulb: '°C',
  relativeHumidity: '%',
  dewPoint: '°C',
  wetBulb: '°C',
  pressure: 'kPa',
  wind: 'm/s',
  ghi: 'W/m²',
  rain: 'mm',
  cloudCover: '%',
}

/** A linear conversion to the series unit: si = value * scale + offset. */
export interface UnitConversion {
  /** Canonical display name of the input unit. */
  unit: string
  scale: number
  offset: number
  /**
   * An amount over the row's interval (energy per m²: Wh/m², J/m², MJ/m², langley): `scale` turns an
   * hour's amount into the hour's mean irradiance; other intervals rescale by 60/interval minutes.
   */
  amount?: true
}

type Family = 'temperature' | 'humidity' | 'pressure' | 'speed' | 'irradiance' | 'depth' | 'cover'

const FAMILY: Record<WeatherVariable, Family> = {
  dryBulb: 'temperature',
  dewPoint: 'temperature',
  wetBulb: 'temperature',
  relativeHumidity: 'humidity',
  pressure: 'pressure',
  wind: 'speed',
  ghi: 'irradiance',
  rain: 'depth',
  cloudCover: 'cover',
}

const u = (unit: string, scale: number, offset = 0): UnitConversion => ({ unit, scale, offset })
/** An amount per hour (see {@link UnitConversion.amount}). */
const perHour = (unit: string, scale: number): UnitConversion => ({ unit, scale, offset: 0, amount: true })

/**
 * Unit tokens (lower case, brackets, spaces, '°', '^' and '*' removed, '²' → 2, `m-2` → m2, `s-1` → /s,
 * by {@link normalizeUnitToken}). Factors, all from NIST SP 811 (Thompson & Taylor 2008, "Guide for
 * the Use of the International System of Units", App. B.8 and B.9; from memory): °F → °C (t − 32)/1.8
 * and K → °C t − 273.15 (definitions); 1 inHg (conventional) = 3.386 389 kPa; 1 mmHg = 0.133 322 kPa;
 * 1 mph = 0.447 04 m/s, 1 knot = 1852/3600 m/s, 1 km/h = 1/3.6 m/s, 1 in = 25.4 mm (exact); 1 langley =
 * 41 840 J/m² (1 cal_th/cm², exact), so 1 langley per day = 41 840 / 86 400 = 0.4843 W/m² as a day's mean
 * rate; 1 kWh = 3.6 MJ (exact). An amount of energy per m² over an hour
 * divided by 3600 s is the mean irradiance over that hour; a precipitation amount of 1 kg/m² is 1 mm of
 * water (density 1000 kg/m³) and 1 m of ERA5-style total precipitation is 1000 mm. 1 okta = 1/8 of the
 * sky (WMO-No. 8), 1 tenth = 10 %.
 */
const TOKENS: Record<Family, Record<string, UnitConversion>> = {
  temperature: {
    c: u('°C', 1),
    degc: u('°C', 1),
    degreec: u('°C', 1),
    degreesc: u('°C', 1),
    celsius: u('°C', 1),
    degreescelsius: u('°C', 1),
    gradc: u('°C', 1),
    f: u('°F', 1 / 1.8, -32 / 1.8),
    degf: u('°F', 1 / 1.8, -32 / 1.8),
    degreef: u('°F', 1 / 1.8, -32 / 1.8),
    degreesf: u('°F', 1 / 1.8, -32 / 1.8),
    fahrenheit: u('°F', 1 / 1.8, -32 / 1.8),
    degreesfahrenheit: u('°F', 1 / 1.8, -32 / 1.8),
    k: u('K', 1, -273.15),
    kelvin: u('K', 1, -273.15),
  },
  humidity: {
    '%': u('%', 1),
    '%rh': u('%', 1),
    rh: u('%', 1),
    pct: u('%', 1),
    percent: u('%', 1),
    fraction: u('fraction', 100),
    frac: u('fraction', 100),
    '01': u('fraction', 100),
  },
  pressure: {
    pa: u('Pa', 0.001),
    hpa: u('hPa', 0.1),
    mbar: u('mbar', 0.1),
    mbars: u('mbar', 0.1),
    mb: u('mbar', 0.1),
    millibar: u('mbar', 0.1),
    millibars: u('mbar', 0.1),
    kpa: u('kPa', 1),
    inhg: u('inHg', 3.386389),
    inchhg: u('inHg', 3.386389),
    inchesofmercury: u('inHg', 3.386389),
    mmhg: u('mmHg', 0.133322),
  },
  speed: {
    ms: u('m/s', 1),
    mps: u('m/s', 1),
    'm/s': u('m/s', 1),
    'meters/second': u('m/s', 1),
    'metres/second': u('m/s', 1),
    meterspersecond: u('m/s', 1),
    metrespersecond: u('m/s', 1),
    kmh: u('km/h', 1 / 3.6),
    kph: u('km/h', 1 / 3.6),
    'km/h': u('km/h', 1 / 3.6),
    'km/hr': u('km/h', 1 / 3.6),
    mph: u('mph', 0.44704),
    'mi/h': u('mph', 0.44704),
    'mi/hr': u('mph', 0.44704),
    kn: u('knots', 1852 / S_PER_HOUR),
    kt: u('knots', 1852 / S_PER_HOUR),
    kts: u('knots', 1852 / S_PER_HOUR),
    knot: u('knots', 1852 / S_PER_HOUR),
    knots: u('knots', 1852 / S_PER_HOUR),
  },
  irradiance: {
    wm2: u('W/m²', 1),
    'w/m2': u('W/m²', 1),
    kwm2: u('kW/m²', 1000),
    'kw/m2': u('kW/m²', 1000),
    whm2: perHour('Wh/m² per hour', 1),
    'wh/m2': perHour('Wh/m² per hour', 1),
    kwhm2: perHour('kWh/m² per hour', 1000),
    'kwh/m2': perHour('kWh/m² per hour', 1000),
    jm2: perHour('J/m² per hour', 1 / S_PER_HOUR),
    'j/m2': perHour('J/m² per hour', 1 / S_PER_HOUR),
    kjm2: perHour('kJ/m² per hour', 1000 / S_PER_HOUR),
    'kj/m2': perHour('kJ/m² per hour', 1000 / S_PER_HOUR),
    mjm2: perHour('MJ/m² per hour', 1e6 / S_PER_HOUR),
    'mj/m2': perHour('MJ/m² per hour', 1e6 / S_PER_HOUR),
    jcm2: perHour('J/cm² per hour', 1e4 / S_PER_HOUR),
    'j/cm2': perHour('J/cm² per hour', 1e4 / S_PER_HOUR),
    'ly/day': u('langley/day', 41840 / S_PER_DAY),
    'ly/d': u('langley/day', 41840 / S_PER_DAY),
    'langley/day': u('langley/day', 41840 / S_PER_DAY),
    'langleys/day': u('langley/day', 41840 / S_PER_DAY),
    'w/sqm': u('W/m²', 1),
    'w/sq.m': u('W/m²', 1),
    ly: perHour('langley per hour', 41840 / S_PER_HOUR),
    langley: perHour('langley per hour', 41840 / S_PER_HOUR),
    langleys: perHour('langley per hour', 41840 / S_PER_HOUR),
  },
  depth: {
    mm: u('mm', 1),
    'mm/h': u('mm', 1),
    'mm/hr': u('mm', 1),
    kgm2: u('kg/m² (mm)', 1),
    'kg/m2': u('kg/m² (mm)', 1),
    cm: u('cm', 10),
    m: u('m', 1000),
    in: u('in', 25.4),
    'in/h': u('in', 25.4),
    'in/hr': u('in', 25.4),
    inch: u('in', 25.4),
    inches: u('in', 25.4),
  },
  cover: {
    '%': u('%', 1),
    pct: u('%', 1),
    percent: u('%', 1),
    tenths: u('tenths', 10),
    oktas: u('oktas', 100 / 8),
    okta: u('oktas', 100 / 8),
    eighths: u('oktas', 100 / 8),
    '1/8': u('oktas', 100 / 8),
    fraction: u('fraction', 100),
    '01': u('fraction', 100),
  },
}

/** Longest unit token considered [characters]; anything longer is not a unit (keeps every call short). */
const MAX_UNIT_CHARS = 40

/**
 * Lower-case a unit token and strip decoration, by one pass over its characters: `"(°F)"` → `f`,
 * `"℉"` → `f`, `"W m-2"` → `wm2`, `"m s^-1"` → `m/s`, `"J m**-2"` → `jm2`; '' for text longer than
 * {@link MAX_UNIT_CHARS}.
 */
export function normalizeUnitToken(raw: string): string {
  if (raw.length > MAX_UNIT_CHARS) return ''
  let t = ''
  for (const ch of raw.toLowerCase()) {
    switch (ch) {
      case '(':
      case ')':
      case '[':
      case ']':
      case '{':
      case '}':
      case ' ':
      case '\t':
      case '\u00a0':
      case '°':
      case 'º':
      case '^':
      case '*':
      case '_':
        break
      case '℉':
        t += 'f'
        break
      case '℃':
        t += 'c'
        break
      case '²':
        t += '2'
        break
      case '·':
      case '⋅':
        break
      default:
        t += ch
    }
  }
  t = t.replaceAll('m-2', 'm2').replaceAll('s-1', '/s').replaceAll('h-1', '/h').replaceAll('//', '/')
  if (t.startsWith('deg') && (t === 'degc' || t === 'degf' || t.startsWith('degree'))) {
    if (t.endsWith('c') || t.endsWith('celsius')) return 'c'
    if (t.endsWith('f') || t.endsWith('fahrenheit')) return 'f'
  }
  if (t === 'm/s') return 'ms'
  if (t === 'km/h') return 'kmh'
  while (t.endsWith('/')) t = t.slice(0, -1)
  return t
}

/** The conversion of `token` for `variable`, or null when the token is not a unit of that variable. */
export function unitConversion(variable: WeatherVariable, token: string): UnitConversion | null {
  const table = TOKENS[FAMILY[variable]]
  const t = normalizeUnitToken(token)
  if (t === '') return null
  return table[t] ?? table[t.replaceAll('/', '')] ?? null
}

/** Whether `token` is a unit of any variable (for units rows and trailing tokens). */
export function isUnitToken(token: string): boolean {
  const t = normalizeUnitToken(token)
  if (t === '') return false
  for (const family of Object.values(TOKENS)) if (family[t] ?? family[t.replaceAll('/', '')]) return true
  return false
}

/** Every accepted unit token for `variable`, for error messages. */
export function acceptedUnits(variable: WeatherVariable): string[] {
  return [...new Set(Object.values(TOKENS[FAMILY[variable]]).map((c) => c.unit))]
}

/** The identity conversion (the value is already in the series unit). */
export function siUnit(variable: WeatherVariable): UnitConversion {
  const si = SERIES_UNIT[variable]
  return u(si, 1)
}

/** Values sampled for {@link finiteMedian} on long columns (enough for a plausibility test). */
export const MEDIAN_SAMPLE = 20_001

/**
 * Median of the finite values of `values` (NaN when there are none); on columns longer than
 * {@link MEDIAN_SAMPLE}, the median of evenly spaced samples (used only to judge units).
 */
export function finiteMedian(values: Float64Array): number {
  const step = Math.max(1, Math.floor(values.length / MEDIAN_SAMPLE))
  const finite = new Float64Array(Math.ceil(values.length / step))
  let k = 0
  for (let i = 0; i < values.length; i += step) if (Number.isFinite(values[i])) finite[k++] = values[i]
  if (k === 0) return Number.NaN
  // the value the sorted samples hold at k/2, by selection (sorting them cost ~7 % of a server worker's time)
  return orderStatistic(finite.subarray(0, k), Math.floor(k / 2))
}

/** Range of plausible column medians in the series unit, per variable. Common practice, no source. */
const PLAUSIBLE_MEDIAN: Record<WeatherVariable, [number, number]> = {
  dryBulb: [-45, 42],
  dewPoint: [-50, 32],
  wetBulb: [-45, 35],
  relativeHumidity: [3, 100],
  pressure: [50, 108],
  wind: [0, 20],
  ghi: [0, 600],
  rain: [0, 20],
  cloudCover: [0, 100],
}

/**
 * A warning text when the median of the converted column (`siValues`, series unit) contradicts the
 * unit it was read in, naming the column and the likely unit; null when plausible.
 */
export function implausibleUnitWarning(
  variable: WeatherVariable,
  column: string,
  conversion: UnitConversion,
  siValues: Float64Array,
): string | null {
  const median = finiteMedian(siValues)
  if (!Number.isFinite(median)) return null
  const [lo, hi] = PLAUSIBLE_MEDIAN[variable]
  if (median >= lo && median <= hi) return null
  const raw = (median - conversion.offset) / conversion.scale
  return (
    `column '${snippet(column)}' read as ${variable} in ${conversion.unit} has a median of ${round3(raw)} ${conversion.unit} ` +
    `(${round3(median)} ${SERIES_UNIT[variable]}), outside the plausible ${lo}–${hi} ${SERIES_UNIT[variable]}: ` +
    `check the unit and give it with --map ${variable}=${snippet(column)}:<unit> (units: ${acceptedUnits(variable).join(', ')})`
  )
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000
}

/**
 * Guess the unit of a column whose header names none, from the raw values' median: pressure by
 * magnitude (kPa / hPa / Pa / inHg), relative humidity as a fraction when every value is at most 1.
 * Returns null when the default (series unit) fits. Common practice, no source.
 */
export function guessUnitFromValues(variable: WeatherVariable, raw: Float64Array): UnitConversion | null {
  if (variable === 'pressure') {
    const m = finiteMedian(raw)
    if (m >= 300 && m <= 1200) return TOKENS.pressure.hpa
    if (m >= 30_000 && m <= 120_000) return TOKENS.pressure.pa
    if (m >= 8 && m <= 32.5) return TOKENS.pressure.inhg
    return null
  }
  if (variable === 'relativeHumidity') {
    let max = Number.NEGATIVE_INFINITY
    let count = 0
    for (const v of raw) {
      if (Number.isFinite(v)) {
        if (v > max) max = v
        count++
      }
    }
    if (count >= 3 && max <= 1.0001 && max > 0) return TOKENS.humidity.fraction
    return null
  }
  return null
}
