/**
 * @module weather/units
 * Unit tokens found in weather-file headers and mappings, their conversion to the series' SI units,
 * and a plausibility check of a column's values against its unit. Conversion happens once, here.
 */

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

/**
 * Unit tokens (lower case, spaces, '°', '²', '^' and '/' variants removed by {@link normalizeUnitToken}).
 * Factors: °F → °C (t − 32)/1.8 and K → °C t − 273.15 (definitions, NIST SP 811 (2008) App. B);
 * 1 inHg = 3.38639 kPa (NIST SP 811 App. B.8, at 0 °C); 1 mmHg = 0.133322 kPa (NIST SP 811);
 * 1 mph = 0.44704 m/s, 1 knot = 1852/3600 m/s, 1 in = 25.4 mm (exact definitions, NIST SP 811);
 * 1 langley = 41,840 J/m² (NIST SP 811 App. B.8: 1 cal_th/cm²); hourly amounts divided by 3600 s give
 * the mean irradiance over the hour; 1 okta = 1/8 of the sky (WMO-No. 8), 1 tenth = 10 %.
 */
const TOKENS: Record<Family, Record<string, UnitConversion>> = {
  temperature: {
    c: u('°C', 1),
    degc: u('°C', 1),
    celsius: u('°C', 1),
    f: u('°F', 1 / 1.8, -32 / 1.8),
    degf: u('°F', 1 / 1.8, -32 / 1.8),
    fahrenheit: u('°F', 1 / 1.8, -32 / 1.8),
    k: u('K', 1, -273.15),
    kelvin: u('K', 1, -273.15),
  },
  humidity: {
    '%': u('%', 1),
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
    mb: u('mbar', 0.1),
    kpa: u('kPa', 1),
    inhg: u('inHg', 3.38639),
    mmhg: u('mmHg', 0.133322),
  },
  speed: {
    ms: u('m/s', 1),
    mps: u('m/s', 1),
    'm/s': u('m/s', 1),
    kmh: u('km/h', 1 / 3.6),
    kph: u('km/h', 1 / 3.6),
    'km/h': u('km/h', 1 / 3.6),
    mph: u('mph', 0.44704),
    kn: u('knots', 1852 / 3600),
    kt: u('knots', 1852 / 3600),
    kts: u('knots', 1852 / 3600),
    knots: u('knots', 1852 / 3600),
  },
  irradiance: {
    wm2: u('W/m²', 1),
    'w/m2': u('W/m²', 1),
    whm2: u('Wh/m² per hour', 1),
    'wh/m2': u('Wh/m² per hour', 1),
    kjm2: u('kJ/m² per hour', 1000 / 3600),
    'kj/m2': u('kJ/m² per hour', 1000 / 3600),
    mjm2: u('MJ/m² per hour', 1e6 / 3600),
    'mj/m2': u('MJ/m² per hour', 1e6 / 3600),
    jcm2: u('J/cm² per hour', 1e4 / 3600),
    'j/cm2': u('J/cm² per hour', 1e4 / 3600),
    ly: u('langley per hour', 41840 / 3600),
    langley: u('langley per hour', 41840 / 3600),
  },
  depth: {
    mm: u('mm', 1),
    cm: u('cm', 10),
    in: u('in', 25.4),
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
    fraction: u('fraction', 100),
  },
}

/** Lower-case a unit token and strip decoration: `"(°F)"` → `f`, `"W m-2"` → `wm2`, `"m s^-1"` → `ms`. */
export function normalizeUnitToken(raw: string): string {
  let t = raw.trim().toLowerCase()
  t = t.replace(/^[([{]+|[)\]}]+$/g, '')
  t = t.replace(/°|º|deg\s+/g, (m) => (m.startsWith('deg') ? 'deg' : ''))
  t = t.replace(/²/g, '2').replace(/\^/g, '').replace(/\*\*/g, '')
  t = t.replace(/m-2/g, 'm2').replace(/s-1/g, '/s').replace(/h-1/g, '/h')
  t = t.replace(/\s+/g, '')
  if (t === 'degc' || t === 'degreesc' || t === 'degreec') return 'c'
  if (t === 'degf' || t === 'degreesf' || t === 'degreef') return 'f'
  if (t === 'm/s' || t === 'm//s') return 'ms'
  if (t === 'km/h' || t === 'km//h') return 'kmh'
  return t.replace(/\/+$/, '')
}

/** The conversion of `token` for `variable`, or null when the token is not a unit of that variable. */
export function unitConversion(variable: WeatherVariable, token: string): UnitConversion | null {
  const table = TOKENS[FAMILY[variable]]
  const t = normalizeUnitToken(token)
  return table[t] ?? table[t.replace(/\//g, '')] ?? null
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
  const sorted = finite.subarray(0, k).sort()
  return sorted[Math.floor(k / 2)]
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
