/**
 * @module product/weighing-columns
 * Which column of a grower's weighing log holds the time, the mass, the air temperature and the humidity, and in
 * which unit: header words as people write them (`time_h`, `t (h)`, `Hours`, `elapsed min`, `Weight (kg)`,
 * `mass lb`, `Zeit [min]`, `peso (g)`, `poids (kg)`, `HR (%)` …) in English, Spanish, French, German, Portuguese and
 * Italian. The choice is returned with the header text and column number so the caller can say which column it took.
 *
 * Unit factors (exact by definition): 1 lb = 0.45359237 kg and 1 oz = 1/16 lb = 28.349523125 g (International
 * Yard and Pound Agreement 1959, as given in NIST Special Publication 811, 2008, Appendix B.8); 1 min = 1/60 h;
 * 1 d = 24 h; °F → °C by (F − 32)·5/9.
 *
 * Matching is linear in the header length: each header is cut into lower-case words once and the words are
 * looked up in fixed sets (no backtracking patterns on user text).
 */

export type TimeUnit = 's' | 'min' | 'h' | 'd'
export type MassUnit = 'g' | 'kg' | 'lb' | 'oz'
export type TempUnit = 'C' | 'F'

export interface ColumnChoice<U> {
  /** 0-based index into the cells of a row. */
  index: number
  /** The header text as written in the file. */
  header: string
  unit: U
  /** How the unit was decided: written in the header, or assumed (the header gave none). */
  unitFrom: 'header' | 'default'
}

export interface WeighingColumns {
  /** Elapsed time (a number in `unit`) or a date-time column (`unit` is then 'h' and `dateTime` true). */
  time: ColumnChoice<TimeUnit> & { dateTime: boolean }
  mass: ColumnChoice<MassUnit>
  airTemp: ColumnChoice<TempUnit> | null
  rh: ColumnChoice<'%'> | null
  /** Other columns that could also have been the time or the mass (the first one found was used). */
  alsoMatched: { role: 'time' | 'mass' | 'air temperature' | 'relative humidity'; header: string }[]
}

/** Hours per unit. */
export const HOURS_PER: Record<TimeUnit, number> = { s: 1 / 3600, min: 1 / 60, h: 1, d: 24 }
/** Grams per unit (lb and oz exact, NIST SP 811 Appendix B.8). */
export const GRAMS_PER: Record<MassUnit, number> = { g: 1, kg: 1000, lb: 453.59237, oz: 28.349523125 }

const TIME_UNIT_WORDS: Record<string, TimeUnit> = {
  s: 's',
  sec: 's',
  secs: 's',
  second: 's',
  seconds: 's',
  segundos: 's',
  secondes: 's',
  sekunden: 's',
  secondi: 's',
  min: 'min',
  mins: 'min',
  minute: 'min',
  minutes: 'min',
  minuto: 'min',
  minutos: 'min',
  minuten: 'min',
  minuti: 'min',
  h: 'h',
  hr: 'h',
  hrs: 'h',
  hour: 'h',
  hours: 'h',
  hora: 'h',
  horas: 'h',
  heure: 'h',
  heures: 'h',
  std: 'h',
  stunde: 'h',
  stunden: 'h',
  ora: 'h',
  ore: 'h',
  d: 'd',
  day: 'd',
  days: 'd',
  dia: 'd',
  dias: 'd',
  jour: 'd',
  jours: 'd',
  tag: 'd',
  tage: 'd',
  giorno: 'd',
  giorni: 'd',
}
/** Words that name elapsed time without a unit (the unit then defaults to hours). */
const TIME_WORDS = new Set([
  't',
  'time',
  'elapsed',
  'duration',
  'tiempo',
  'duracion',
  'temps',
  'duree',
  'zeit',
  'dauer',
  'tempo',
  'durata',
  'duracao',
])
/** Words that name a clock time or date (ISO 8601 date-times are expected in the cells). */
const DATE_TIME_WORDS = new Set([
  'datetime',
  'timestamp',
  'date',
  'fecha',
  'datum',
  'data',
  'uhrzeit',
  'horodatage',
])
const MASS_UNIT_WORDS: Record<string, MassUnit> = {
  g: 'g',
  gr: 'g',
  gram: 'g',
  grams: 'g',
  gramm: 'g',
  gramos: 'g',
  grammes: 'g',
  gramas: 'g',
  grammi: 'g',
  kg: 'kg',
  kgs: 'kg',
  kilo: 'kg',
  kilos: 'kg',
  kilogram: 'kg',
  kilograms: 'kg',
  kilogramm: 'kg',
  kilogramos: 'kg',
  kilogrammes: 'kg',
  quilogramas: 'kg',
  chilogrammi: 'kg',
  lb: 'lb',
  lbs: 'lb',
  pound: 'lb',
  pounds: 'lb',
  oz: 'oz',
  ounce: 'oz',
  ounces: 'oz',
}
const MASS_WORDS = new Set([
  'm',
  'mass',
  'weight',
  'wt',
  'tray',
  'masa',
  'peso',
  'masse',
  'poids',
  'gewicht',
  'massa',
])
const TEMP_WORDS = new Set([
  'temp',
  'temperature',
  'air',
  'tair',
  'tdb',
  'temperatura',
  'temperatur',
  'lufttemperatur',
  'aire',
])
const TEMP_UNIT_WORDS: Record<string, TempUnit> = {
  c: 'C',
  degc: 'C',
  celsius: 'C',
  f: 'F',
  degf: 'F',
  fahrenheit: 'F',
}
/** Words that name the air's relative humidity (a bare `hr` is read as hours unless a `%` follows). */
const RH_WORDS = new Set([
  'rh',
  'humidity',
  'relative',
  'relativa',
  'feuchte',
  'luftfeuchte',
  'luftfeuchtigkeit',
  'rf',
  'ur',
])

/** Lower-case, accents removed, `°C`/`°F` kept as words, every other non-letter/digit a separator. */
function words(header: string): { list: string[]; hasPercent: boolean; hasDegree: boolean } {
  const plain = header
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
  const hasPercent = plain.includes('%')
  const hasDegree = plain.includes('°') || plain.includes('º')
  const list = plain
    .replace(/[°º]\s*c\b/g, ' degc ')
    .replace(/[°º]\s*f\b/g, ' degf ')
    .split(/[^a-z0-9]+/)
    .filter((w) => w.length > 0)
  // `time_h`, `mass_g`, `air_c`, `rh_pct` split into their parts above; `timeh`-style joins are not guessed.
  return { list, hasPercent, hasDegree }
}

type Guess =
  | { role: 'time'; unit: TimeUnit; unitFrom: 'header' | 'default'; dateTime: boolean; score: number }
  | { role: 'mass'; unit: MassUnit; unitFrom: 'header' | 'default'; score: number }
  | { role: 'airTemp'; unit: TempUnit; unitFrom: 'header' | 'default'; score: number }
  | { role: 'rh'; score: number }

function classify(header: string): Guess | null {
  const { list, hasPercent, hasDegree } = words(header)
  if (list.length === 0) return null
  const has = (set: Set<string>) => list.some((w) => set.has(w))
  const unitOf = <U>(table: Record<string, U>): U | undefined => {
    for (const w of list) if (Object.hasOwn(table, w)) return table[w]
    return undefined
  }
  // Relative humidity: `rh_pct`, `RH (%)`, `humedad relativa`, `Luftfeuchte`, and `HR (%)` (es/fr/pt/it).
  if (has(RH_WORDS) || (list.includes('hr') && hasPercent)) return { role: 'rh', score: 2 }
  // Air temperature: a temperature word, or `t`/`air` with a °C/°F unit (`t (°C)`, `air_c`).
  const tempUnit = unitOf(TEMP_UNIT_WORDS)
  if (has(TEMP_WORDS) || ((hasDegree || tempUnit) && list.includes('t'))) {
    return { role: 'airTemp', unit: tempUnit ?? 'C', unitFrom: tempUnit ? 'header' : 'default', score: 2 }
  }
  const massUnit = unitOf(MASS_UNIT_WORDS)
  if (has(MASS_WORDS) || (massUnit && list.length === 1)) {
    return {
      role: 'mass',
      unit: massUnit ?? 'g',
      unitFrom: massUnit ? 'header' : 'default',
      score: has(MASS_WORDS) && massUnit ? 3 : 2,
    }
  }
  if (has(DATE_TIME_WORDS)) return { role: 'time', unit: 'h', unitFrom: 'header', dateTime: true, score: 1 }
  const timeUnit = unitOf(TIME_UNIT_WORDS)
  const timeWord = has(TIME_WORDS)
  if (timeWord || (timeUnit && list.length <= 2)) {
    return {
      role: 'time',
      unit: timeUnit ?? 'h',
      unitFrom: timeUnit ? 'header' : 'default',
      dateTime: false,
      score: timeWord && timeUnit ? 3 : 2,
    }
  }
  return null
}

const ROLE_NAMES = {
  time: 'time',
  mass: 'mass',
  airTemp: 'air temperature',
  rh: 'relative humidity',
} as const

/**
 * Decide the columns from the header cells. RangeError naming what is missing and listing the headers when no
 * time or no mass column is recognised. When two columns fit a role, the one with both a name and a unit wins,
 * then the first; the others are listed in `alsoMatched`.
 */
export function recogniseColumns(headers: string[], line: number): WeighingColumns {
  const best: Partial<Record<Guess['role'], { guess: Guess; index: number }>> = {}
  const alsoMatched: WeighingColumns['alsoMatched'] = []
  headers.forEach((h, index) => {
    const g = classify(h)
    if (!g) return
    const cur = best[g.role]
    if (!cur || g.score > cur.guess.score) {
      if (cur) alsoMatched.push({ role: ROLE_NAMES[g.role], header: headers[cur.index].trim() })
      best[g.role] = { guess: g, index }
    } else {
      alsoMatched.push({ role: ROLE_NAMES[g.role], header: h.trim() })
    }
  })
  const list = headers.map((h) => `'${h.trim()}'`).join(', ')
  const time = best.time
  const mass = best.mass
  if (!mass) {
    throw new RangeError(
      `line ${line}: no mass column found among ${list}; name it e.g. mass_g, weight (kg), peso (g), poids (g) or Gewicht (g)`,
    )
  }
  if (!time) {
    throw new RangeError(
      `line ${line}: no time column found among ${list}; name it e.g. elapsed_h, time (min), hours, tiempo (h), Zeit (h), or give ISO 8601 date-times in a time or date column`,
    )
  }
  // A bare `HR` next to another time column is the French/Spanish/Portuguese/Italian relative humidity.
  if (!best.rh) {
    const j = headers.findIndex((h, i) => i !== time.index && words(h).list.join(' ') === 'hr')
    if (j >= 0) {
      best.rh = { guess: { role: 'rh', score: 1 }, index: j }
      const k = alsoMatched.findIndex((x) => x.header === headers[j].trim())
      if (k >= 0) alsoMatched.splice(k, 1)
    }
  }
  const t = time.guess as Extract<Guess, { role: 'time' }>
  const m = mass.guess as Extract<Guess, { role: 'mass' }>
  const a = best.airTemp?.guess as Extract<Guess, { role: 'airTemp' }> | undefined
  return {
    time: {
      index: time.index,
      header: headers[time.index].trim(),
      unit: t.unit,
      unitFrom: t.unitFrom,
      dateTime: t.dateTime,
    },
    mass: { index: mass.index, header: headers[mass.index].trim(), unit: m.unit, unitFrom: m.unitFrom },
    airTemp:
      a && best.airTemp
        ? {
            index: best.airTemp.index,
            header: headers[best.airTemp.index].trim(),
            unit: a.unit,
            unitFrom: a.unitFrom,
          }
        : null,
    rh: best.rh
      ? { index: best.rh.index, header: headers[best.rh.index].trim(), unit: '%', unitFrom: 'header' }
      : null,
    alsoMatched,
  }
}

/** One sentence for the user: which columns were read and in which unit. */
export function describeColumns(c: WeighingColumns): string {
  const unitNote = (from: 'header' | 'default') =>
    from === 'default' ? ', assumed: no unit in the header' : ''
  const parts = [
    c.time.dateTime
      ? `time from column ${c.time.index + 1} '${c.time.header}' (date-times)`
      : `time from column ${c.time.index + 1} '${c.time.header}' in ${c.time.unit}${unitNote(c.time.unitFrom)}`,
    `mass from column ${c.mass.index + 1} '${c.mass.header}' in ${c.mass.unit}${unitNote(c.mass.unitFrom)}`,
  ]
  if (c.airTemp)
    parts.push(
      `air temperature from column ${c.airTemp.index + 1} '${c.airTemp.header}' in °${c.airTemp.unit}${unitNote(c.airTemp.unitFrom)}`,
    )
  if (c.rh) parts.push(`relative humidity from column ${c.rh.index + 1} '${c.rh.header}' in %`)
  let s = `columns read: ${parts.join('; ')}`
  if (c.alsoMatched.length) {
    s += ` (also looked like a column to use, not read: ${c.alsoMatched.map((x) => `'${x.header}' as ${x.role}`).join(', ')})`
  }
  return s
}
