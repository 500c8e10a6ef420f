/**
 * @module weather/header-words
 * What a column header names, from its words: English, German, Spanish, French, Portuguese and
 * Italian names of every variable and time field, the short names of common exports (`tmpf`,
 * `sknt`, `t2m`, `TT_TU`), and the columns that look like a variable but are not it (sea-level
 * pressure, altimeter setting and vapour pressure are not station pressure; a wind component is
 * not a speed; indoor, maximum, gust, direction and flag columns are not the outdoor value). Every
 * test is a lookup on a short list of words, so a header of any length is classified in time
 * linear in its length. The word lists are common usage, from memory.
 */
import type { TimeField } from './options.ts'
import type { WeatherVariable } from './units.ts'

/** What a header names. `strength` 1 marks a weaker name (a second choice when a stronger one exists). */
export type HeaderMeaning =
  | { kind: 'variable'; variable: WeatherVariable; strength: 1 | 2 }
  | { kind: 'time'; field: TimeField }
  | { kind: 'wind-component'; component: 'u' | 'v' }
  | { kind: 'excluded'; reason: string }
  | null

/** Longest header considered [characters]; longer text is cut before it is read. */
export const MAX_HEADER_CHARS = 200

/**
 * A header's words: lower case, accents removed, `ß` → `ss`, anything but letters, digits and `%`
 * a separator. At most {@link MAX_HEADER_CHARS} characters are read.
 */
export function headerWords(text: string): string[] {
  const cut = text.length > MAX_HEADER_CHARS ? text.slice(0, MAX_HEADER_CHARS) : text
  const decomposed = cut.normalize('NFD')
  const words: string[] = []
  let word = ''
  let previousLower = false
  for (let k = 0; k < decomposed.length; k++) {
    const c = decomposed.charCodeAt(k)
    const upper = c >= 65 && c <= 90
    const lower = c >= 97 && c <= 122
    if (upper || lower || (c >= 48 && c <= 57) || c === 37) {
      // camelCase: a capital after a small letter starts a word (`HourlyDryBulbTemperature`)
      if (upper && previousLower && word !== '') {
        words.push(word)
        word = ''
      }
      word += upper ? String.fromCharCode(c + 32) : decomposed[k]
      previousLower = lower
    } else if (c >= 0x300 && c <= 0x36f) {
      // a combining accent: dropped
    } else {
      if (c === 0xdf) {
        word += 'ss'
        continue
      }
      if (word !== '') words.push(word)
      word = ''
      previousLower = false
    }
  }
  if (word !== '') words.push(word)
  return words
}

/** A set of single words from a space-separated list. */
const set = (words: string): ReadonlySet<string> => new Set(words.split(' '))
/** A set of names from a comma-separated list (names may have several words). */
const names = (list: string): ReadonlySet<string> => new Set(list.split(',').map((n) => n.trim()))

/** Whole names (words joined by one space) of time fields. */
const TIME_NAMES: Record<TimeField, ReadonlySet<string>> = {
  timestamp: new Set([
    'datetime',
    'date time',
    'date and time',
    'timestamp',
    'time stamp',
    'valid',
    'valid time',
    'obs time',
    'observation time',
    'utc time',
    'time utc',
    'local time',
    'time local',
    'datetime utc',
    'date utc',
    'dateutc',
    'date time utc',
    'period end',
    'period start',
    'zeitstempel',
    'mess datum',
    'messdatum',
    'datum zeit',
    'datum uhrzeit',
    'fecha hora',
    'fecha y hora',
    'date heure',
    'date et heure',
    'horodatage',
    'data hora',
    'data e hora',
    'data ora',
    'data e ora',
  ]),
  date: names('date, day date, fecha, datum, data, date local'),
  time: names('hour minute, hh mm, heure, zeit, uhrzeit, time, time of day, hora, hora local, orario'),
  year: names('year, yr, yyyy, jahr, ano, annee, anno'),
  month: names('month, mo, mm, mon, monat, mes, mois, mese'),
  day: names('day, dd, dy, day of month, tag, dia, jour, giorno'),
  hour: names('hour, hr, hh, stunde, ora, hour of day'),
  minute: names('minute, min, mi, minuto, minuten'),
  dayOfYear: names('doy, day of year, jday, julian day, dayofyear, jul'),
}

/**
 * Words that make a column something other than the measured value: statistics other than the mean,
 * flags and quality codes, directions, gusts, indoor readings, derived comfort indices, counters.
 */
const NOT_A_VALUE = set(
  'source src uncert uncertainty flag flags qc qa qual quality qn dir direction drct richtung direccion ' +
    'gust gusts racha rafale boe raffica max min maximum minimum hi high low lo std sd stdev stddev ' +
    'chill windchill index feels feelslike apparent heatindex humidex thw thsw run samp tx recept arc ' +
    'count battery batt volt voltage signal rssi record rn event coupler detached attached uv ' +
    'evapotranspiration et0 eto probability type code codes snow snowfall snowdepth schnee nieve neige ' +
    'neve soil boden suelo leaf panel ptemp water visibility vis ceiling cig density emc feel windgust ' +
    'daily monthly yearly weekly normal normals departure duration short equipment mid',
)

/** Parts of compound words that make a column a direction (`Windrichtung`, `WindDirection`). */
const DIRECTION_PARTS = ['richtung', 'direction', 'direccion', 'direcao', 'direzione']

/** Words of indoor readings (a station's console or base unit). */
const INDOOR = set(
  'indoor inside innen innentemperatur interior interieur interno inner tempin humidityin intemp inhumi',
)

function anyWord(words: string[], list: ReadonlySet<string>): boolean {
  for (const w of words) if (list.has(w)) return true
  return false
}

function anyPart(words: string[], parts: readonly string[]): boolean {
  for (const w of words) for (const p of parts) if (w.includes(p)) return true
  return false
}

function phrase(words: string[], ...sequence: string[]): boolean {
  outer: for (let k = 0; k + sequence.length <= words.length; k++) {
    for (let j = 0; j < sequence.length; j++) if (words[k + j] !== sequence[j]) continue outer
    return true
  }
  return false
}

const DEW = set('dew dewpoint tdp td dwpt dwpf dwpc d2m t2mdew dewp tau')
const DEW_PARTS = ['dewpoint', 'taupunkt', 'rocio', 'rosee', 'orvalho', 'rugiada', 'dewpt']
const WET_BULB = set('wetbulb twb tw')
const WET_BULB_PARTS = ['wetbulb', 'feuchttemp', 'feuchtkugel']
const RH = set('rh relh rhum hum humidity hr rh2m ur rf rlf luftfeuchte')
const RH_PARTS = ['humid', 'feuchte', 'humedad', 'umidade', 'humidade', 'umidita', 'feuchtigkeit']
const NOT_RH = set('abs absolute specific ratio mixing spezifische absolut especifica specifique qv2m')
const SEA_LEVEL = set('slp msl mslp pmsl qnh qff sealevel meeresspiegel nn reduced reduziert baromrel')
/** With a pressure word: relative (reduced) pressure, or "sea" in French, Spanish, Portuguese, Italian. */
const SEA_WORDS = set('rel relative relativ relativa mer mar mare')
const ALTIMETER = set('altimeter alti altimetro altimetre altim')
const VAPOUR = set('vapor vapour vap dampf dampfdruck vapeur vapore vp vpd deficit ea')
const PRESSURE_OTHER = set('tendency change tend trend')
const TEMP = set(
  'temp temperature tdb t2m tair airt airtc dry drybulb t ta tmp tmpf tmpc tt temperatura lufttemperatur',
)
const TEMP_PARTS = ['temp']
const PRESSURE = set(
  'press pressure pres p ps stnp baro barometer barometric bp druck luftdruck presion pressao pressione p0 pstn',
)
const PRESSURE_PARTS = ['press', 'druck', 'presion', 'pressao', 'barom']
const WIND = set('wind ws wspd windspeed ff sknt vel viento vent vento wspd10 ws10m ws2m wind10m')
const WIND_PARTS = ['wind', 'viento', 'vento', 'windgeschw']
const DIRECT = set(
  'dni dhi direct diffuse diff beam extraterrestrial terrestrial etr etrn infrared ir clearsky clrsky clear ' +
    'longwave lw net par toa tilted tilt poa gti sunshine dauer sonnenschein tsun sd insolacion hours',
)
const GHI = set(
  'ghi global solar radiation irradiance srad swdown sw rad ghr glob ssrd shortwave slrw slrkw sr strahlung ' +
    'globalstrahlung radiacion rayonnement radiacao radiazione irradiancia irradiation solarradiation gs slr',
)
const GHI_WEAK = set('energy insolation sun')
const SUN_GEOMETRY = set('zenith azimuth angle altitude height elevation h hsun')
const RAIN = set(
  'rain precip precipitation prcp pcp rainfall lprecip p01i p01m ppt prectotcorr prectot tp niederschlag ' +
    'precipitacion lluvia pluie precipitations chuva precipitacao pioggia precipitazione rr regen',
)
const RAIN_PARTS = ['niederschlag', 'precip', 'rainfall']
const NOT_RAIN = set('rate event storm intensity last24 24h')
const CLOUD = set('cloud clouds cloudcover tcc totcld bewolkung nubosidad nebulosite nebulosidade nuvolosita')

function variable(v: WeatherVariable, strength: 1 | 2 = 2): HeaderMeaning {
  return { kind: 'variable', variable: v, strength }
}

/**
 * Recognise a header from its words ({@link headerWords} of the name without its unit). Order
 * matters: time fields, then exclusions, then dew point and wet bulb before humidity and dry bulb.
 */
export function classifyWords(words: string[], unitIsPercent = false): HeaderMeaning {
  if (words.length === 0 || words.length > 24) return null
  const name = words.join(' ')
  // 'HR' is the hour in some exports and relative humidity (humedad/humidité relative) in others.
  if (name === 'hr' && unitIsPercent) return variable('relativeHumidity')
  for (const field of Object.keys(TIME_NAMES) as TimeField[]) {
    if (TIME_NAMES[field].has(name)) return { kind: 'time', field }
  }
  if (
    phrase(words, 'date', 'time') ||
    anyWord(words, set('datetime timestamp zeitstempel horodatage')) ||
    (words.includes('valid') && words.length <= 3) ||
    phrase(words, 'mess', 'datum')
  )
    return { kind: 'time', field: 'timestamp' }
  // Wind components before the exclusions ('v' and 'u' are single letters).
  const first = words[0]
  if (
    ['u10', 'u100', 'uwnd', 'u10m', 'u2m'].includes(name) ||
    (anyWord(words, set('u zonal')) && anyPart(words, ['wind', 'component', 'comp']))
  )
    return { kind: 'wind-component', component: 'u' }
  if (
    ['v10', 'v100', 'vwnd', 'v10m', 'v2m'].includes(name) ||
    (anyWord(words, set('v meridional')) && anyPart(words, ['wind', 'component', 'comp']))
  )
    return { kind: 'wind-component', component: 'v' }
  if (anyWord(words, INDOOR) || (first === 'in' && words.length > 1) || name.endsWith(' in'))
    return { kind: 'excluded', reason: 'an indoor reading' }
  if (anyWord(words, NOT_A_VALUE) || anyPart(words, DIRECTION_PARTS)) return null
  if (anyWord(words, DEW) || phrase(words, 'dew', 'point') || anyPart(words, DEW_PARTS))
    return variable('dewPoint')
  if (
    anyWord(words, WET_BULB) ||
    phrase(words, 'wet', 'bulb') ||
    phrase(words, 'bulbo', 'humedo') ||
    phrase(words, 'bulbo', 'umido') ||
    phrase(words, 'bulbe', 'humide') ||
    anyPart(words, WET_BULB_PARTS)
  )
    return variable('wetBulb')
  if (anyWord(words, RH) || anyPart(words, RH_PARTS)) {
    if (anyWord(words, NOT_RH))
      return { kind: 'excluded', reason: 'absolute or specific humidity, not relative humidity' }
    return variable('relativeHumidity')
  }
  const pressureLike = anyWord(words, PRESSURE) || anyPart(words, PRESSURE_PARTS)
  if (
    anyWord(words, SEA_LEVEL) ||
    anyPart(words, ['sealevel', 'meeresspiegel']) ||
    phrase(words, 'sea', 'level') ||
    phrase(words, 'nivel', 'del', 'mar') ||
    phrase(words, 'niveau', 'de', 'la', 'mer') ||
    phrase(words, 'niveau', 'mer') ||
    phrase(words, 'nivel', 'do', 'mar') ||
    phrase(words, 'livello', 'del', 'mare') ||
    (pressureLike && anyWord(words, SEA_WORDS))
  )
    return { kind: 'excluded', reason: 'sea-level (reduced) pressure, not station pressure' }
  if (anyWord(words, ALTIMETER) || anyPart(words, ['altimeter']) || phrase(words, 'alt', 'setting'))
    return { kind: 'excluded', reason: 'an altimeter setting, not station pressure' }
  if (anyWord(words, VAPOUR) || anyPart(words, ['dampfdruck']))
    return { kind: 'excluded', reason: 'vapour pressure, not station pressure' }
  if (pressureLike && anyWord(words, PRESSURE_OTHER)) return null
  if (
    anyWord(words, TEMP) ||
    anyPart(words, TEMP_PARTS) ||
    phrase(words, 'dry', 'bulb') ||
    phrase(words, 'air', 't') ||
    phrase(words, 'air', 'tc')
  )
    return variable('dryBulb', words.includes('instant') ? 1 : 2)
  if (pressureLike) return variable('pressure')
  if (anyWord(words, WIND) || anyPart(words, WIND_PARTS)) return variable('wind')
  if (anyWord(words, DIRECT)) return null
  // Sun position (`Solar Zenith Angle`, `H_sun` sun height) is geometry, not irradiance.
  if (anyWord(words, SUN_GEOMETRY)) return null
  if (anyWord(words, GHI) || anyPart(words, ['strahlung', 'radiat', 'irradi']))
    return variable('ghi', words.includes('instant') || words.includes('energy') ? 1 : 2)
  if (anyWord(words, GHI_WEAK) && words.length > 1) return variable('ghi', 1)
  if (anyWord(words, RAIN) || anyPart(words, RAIN_PARTS)) {
    if (anyWord(words, NOT_RAIN)) return null
    return variable('rain')
  }
  if (
    anyWord(words, CLOUD) ||
    phrase(words, 'sky', 'cover') ||
    phrase(words, 'cloud', 'cover') ||
    name === 'cc'
  )
    return variable('cloudCover')
  return null
}
