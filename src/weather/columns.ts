/**
 * @module weather/columns
 * Which column of a delimited file holds which variable: header names and unit tokens are
 * recognised, an explicit mapping overrides them, and two equally good candidates for one variable
 * are an error naming the mapping to give.
 */

import { classifyWords, type HeaderMeaning, headerWords } from './header-words.ts'
import { type ColumnMapping, type MappingKey, TIME_FIELDS, type TimeField } from './options.ts'
import { snippet } from './snippet.ts'
import {
  acceptedUnits,
  isUnitToken,
  normalizeUnitToken,
  type UnitConversion,
  unitConversion,
  type WeatherVariable,
} from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

export type { HeaderMeaning } from './header-words.ts'

/** A header split into its words, the unit texts written with it and a measurement height. */
export interface HeaderParts {
  /** Lower-case words (accents removed) outside brackets, joined by single spaces. */
  name: string
  words: string[]
  /** The first unit candidate, or null. */
  unitText: string | null
  /**
   * Texts that may be the unit, best first: bracket contents (last bracket first), the text after the
   * last comma (`Temp, °F`), `… in <unit>`, the last word (`temp_f`), a degree sign (`°F`, `℉`).
   */
  unitCandidates: string[]
  /** Measurement height [m] written in the header (e.g. `wind 2m`, `temperature_2m`), or null. */
  heightM: number | null
}

/** Longest header read [characters]: longer headers are cut (no weather header is that long). */
const MAX_HEADER_TEXT = 200

function isOpener(c: number): boolean {
  return c === 40 || c === 91 || c === 123
}
function isCloser(c: number): boolean {
  return c === 41 || c === 93 || c === 125
}

/**
 * Split a header into words, unit candidates and height, in one pass over at most
 * {@link MAX_HEADER_TEXT} characters (no regular expression).
 */
export function splitHeader(header: string): HeaderParts {
  let text = header.charCodeAt(0) === 0xfeff ? header.slice(1) : header
  if (text.length > MAX_HEADER_TEXT) text = text.slice(0, MAX_HEADER_TEXT)
  let outside = ''
  let group = ''
  const groups: string[] = []
  let depth = 0
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (isOpener(c)) {
      if (depth > 0) group += text[k]
      else group = ''
      depth++
    } else if (isCloser(c)) {
      if (depth === 0) outside += ' '
      else if (--depth === 0) {
        groups.push(group.trim())
        outside += ' '
      } else group += text[k]
    } else if (depth > 0) group += text[k]
    else outside += text[k]
  }
  if (depth > 0) outside += ` ${group}` // an unclosed bracket: its text is part of the name
  const candidates: string[] = []
  for (let g = groups.length - 1; g >= 0; g--) if (groups[g] !== '') candidates.push(groups[g])
  const comma = outside.lastIndexOf(',')
  if (comma >= 0) {
    const tail = outside.slice(comma + 1).trim()
    if (tail !== '' && (isUnitToken(tail) || headerTimeBasis(tail).kind !== 'none')) {
      candidates.push(tail)
      outside = outside.slice(0, comma)
    }
  }
  let words = headerWords(outside)
  if (words.length >= 3 && words[words.length - 2] === 'in' && isUnitToken(words[words.length - 1])) {
    candidates.push(words[words.length - 1])
    words = words.slice(0, -2)
  }
  const degree = degreeSign(outside)
  if (degree !== null) candidates.push(degree)
  return {
    name: words.join(' '),
    words,
    unitText: candidates[0] ?? null,
    unitCandidates: candidates,
    heightM: heightIn(outside),
  }
}

/** `°F`, `°C`, `℉`, `℃` anywhere in the text → 'F' or 'C'; null when none. */
function degreeSign(text: string): string | null {
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (c === 0x2109) return 'F'
    if (c === 0x2103) return 'C'
    if (c === 0xb0 || c === 0xba) {
      let j = k + 1
      while (j < text.length && text.charCodeAt(j) === 32) j++
      const next = text.charCodeAt(j) | 32
      const after = text.charCodeAt(j + 1) | 32
      if ((next === 102 || next === 99) && !(after >= 97 && after <= 122)) return next === 102 ? 'F' : 'C'
    }
  }
  return null
}

/** A height such as `2m`, `2 m`, `10.5m` after a separator (`wind 2m`, `temperature_2m`); null when none. */
function heightIn(text: string): number | null {
  let k = 0
  while (k < text.length) {
    const c = text.charCodeAt(k)
    const previous = k === 0 ? 32 : text.charCodeAt(k - 1)
    const boundary = !(
      (previous >= 48 && previous <= 57) ||
      ((previous | 32) >= 97 && (previous | 32) <= 122) ||
      previous === 46
    )
    if (c >= 48 && c <= 57 && boundary) {
      const from = k
      while (
        k < text.length &&
        ((text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) || text.charCodeAt(k) === 46)
      )
        k++
      const number = Number(text.slice(from, k))
      let j = k
      while (j < text.length && text.charCodeAt(j) === 32) j++
      const m = text.charCodeAt(j) | 32
      const after = j + 1 < text.length ? text.charCodeAt(j + 1) | 32 : 32
      if (
        m === 109 &&
        !(after >= 97 && after <= 122) &&
        Number.isFinite(number) &&
        number > 0 &&
        number <= 300
      )
        return number
      continue
    }
    k++
  }
  return null
}

/**
 * Units carried by the name itself (short names of airport and station exports, e.g. IEM ASOS
 * `tmpf`, `dwpf`, `sknt`, `p01i`). From the exports' documentation, from memory.
 */
const NAME_UNITS: Record<string, string> = {
  tmpf: 'F',
  dwpf: 'F',
  tmpc: 'C',
  dwpc: 'C',
  sknt: 'kn',
  relh: '%',
  p01i: 'in',
  p01m: 'mm',
}

/** Unit words that may end a one-word name (`tempf`, `windspeedmph`, `baromabsin`), longest first. */
const NAME_SUFFIXES = ['inhg', 'mph', 'kmh', 'kph', 'hpa', 'kts', 'mm', 'in', 'ms', 'f', 'c']

/** What a header names (see {@link analyseHeader} for its units too). */
export function classifyHeader(header: string): HeaderMeaning {
  return analyseHeader(header).meaning
}

/** A header's meaning and the unit texts to try for it, best first. */
export interface HeaderAnalysis {
  meaning: HeaderMeaning
  parts: HeaderParts
  /** Unit texts in order of preference (units row, brackets, name). */
  units: string[]
}

/** Classify a header (and its cell in a units row, when the file has one). */
export function analyseHeader(header: string, unitsRowCell?: string): HeaderAnalysis {
  const parts = splitHeader(header)
  const units = unitsRowCell !== undefined && unitsRowCell.trim() !== '' ? [unitsRowCell.trim()] : []
  units.push(...parts.unitCandidates)
  const words = parts.words
  const percent = units.some((u) => normalizeUnitToken(u) === '%')
  if (words.length >= 2) {
    const last = words[words.length - 1]
    if (isUnitToken(last)) {
      const stripped = classifyWords(words.slice(0, -1), percent || last === '%')
      if (stripped?.kind === 'variable' && unitConversion(stripped.variable, last) !== null)
        return { meaning: stripped, parts, units: [...units, last] }
    }
  }
  let meaning = classifyWords(words, percent)
  if (words.length === 1 && meaning?.kind !== 'excluded' && meaning?.kind !== 'time') {
    const w = words[0]
    const named = NAME_UNITS[w]
    if (named !== undefined && meaning !== null) units.push(named)
    else {
      // A unit word at the end of a one-word name (`tempf`, `windspeedmph`, `baromabsin`).
      for (const suffix of NAME_SUFFIXES) {
        if (w.length <= suffix.length + 2 || !w.endsWith(suffix)) continue
        const stem = classifyWords([w.slice(0, -suffix.length)], percent)
        if (stem === null) continue
        if (stem.kind !== 'variable') {
          if (meaning === null) meaning = stem
          break
        }
        // Station exports write inches of mercury as a bare 'in' after a pressure name (`baromabsin`).
        const unit = stem.variable === 'pressure' && suffix === 'in' ? 'inHg' : suffix
        if (unitConversion(stem.variable, unit) === null) continue
        meaning = stem
        units.push(unit)
        break
      }
    }
  }
  return { meaning, parts, units }
}

/** A variable's chosen column. */
export interface ChosenColumn {
  variable: WeatherVariable
  index: number
  header: string
  /** Conversion from the file's unit; null = no unit given, decide from the values. */
  conversion: UnitConversion | null
  /** Whether the unit came from the header (or a units row), the mapping, the format's layout, or neither. */
  unitSource: 'header' | 'mapping' | 'format' | 'none'
  heightM: number | null
}

export interface ColumnPlan {
  variables: Partial<Record<WeatherVariable, ChosenColumn>>
  time: Partial<Record<TimeField, number>>
  /**
   * East and north wind components (`u10`, `v10`), used for the wind speed √(u² + v²) when the file
   * has both and no speed column.
   */
  windComponents?: { u: ChosenColumn; v: ChosenColumn }
  /** Set when the header row names UTC (e.g. `time (UTC)`, `timestamp_utc`) without an offset. */
  headerSaysUtc: boolean
  /** Offset written in a time header such as `time (local standard time, UTC+07:00)` [h], or null. */
  headerUtcOffsetHours: number | null
  /** How the time header's zone was read, in words (e.g. `'Hour (PST)': PST is UTC−8`), or null. */
  headerTimeNote: string | null
  /** Columns recognised as nothing. */
  unused: string[]
  /** What was decided about columns that look like a variable but are not used as it. */
  notes: string[]
}

/** `#3` (1-based column number) → 2; −1 otherwise. Hand-written, linear. */
function columnNumber(text: string): number {
  if (text.length < 2 || text.length > 8 || text[0] !== '#') return -1
  let n = 0
  for (let k = 1; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (c < 48 || c > 57) return -1
    n = n * 10 + (c - 48)
  }
  return n - 1
}

function findColumn(headers: string[], column: string, key: string): number {
  const ref = columnNumber(column)
  if (ref >= 0) {
    if (ref < headers.length) return ref
  } else {
    const exact = headers.findIndex((h) => h.trim() === column)
    if (exact >= 0) return exact
    const folded = headers.findIndex((h) => h.trim().toLowerCase() === column.toLowerCase())
    if (folded >= 0) return folded
  }
  throw new WeatherInputError(
    `mapping ${key}=${snippet(column)}: no such column; the columns are ${headers.map((h, i) => `#${i + 1} '${snippet(h)}'`).join(', ')}`,
    ['mapped column'],
  )
}

/** A `--map` argument for a column, quoted for a shell when the header has spaces or quotes. */
export function mapArgument(key: string, header: string, index: number): string {
  const plain = header !== '' && header.length <= 40
  const value = plain ? header : `#${index + 1}`
  const arg = `${key}=${value}`
  let safe = true
  for (let k = 0; k < arg.length && safe; k++) {
    const c = arg.charCodeAt(k)
    const ok =
      (c >= 48 && c <= 57) ||
      ((c | 32) >= 97 && (c | 32) <= 122) ||
      c === 95 ||
      c === 45 ||
      c === 61 ||
      c === 35 ||
      c === 46 ||
      c === 58
    if (!ok) safe = false
  }
  return `--map ${safe ? arg : `'${snippet(arg, 80).replaceAll("'", "'\\''")}'`}`
}

function chooseUnit(
  variable: WeatherVariable,
  units: string[],
): { conversion: UnitConversion | null; unitText: string | null } {
  for (const text of units) {
    const conversion = unitConversion(variable, text)
    if (conversion !== null) return { conversion, unitText: text }
  }
  return { conversion: null, unitText: units[0] ?? null }
}

/** A format's own choice of column for a variable or time field: header names to look for, and the unit. */
export interface ColumnSpec {
  /** Header names (case-insensitive, compared without a bracketed unit), first found wins. */
  names: readonly string[]
  /** The unit the format documents for the column (over anything the header says). */
  unit?: string
}

/** Header text without a bracketed unit, lower case: `temperature_2m (°C)` → `temperature_2m`. */
function bareHeader(header: string): string {
  let end = header.length
  for (let k = 0; k < header.length; k++) {
    const c = header.charCodeAt(k)
    if (c === 40 || c === 91) {
      end = k
      break
    }
  }
  return header.slice(0, end).trim().toLowerCase()
}

/** Index of the first header named by `names` (see {@link ColumnSpec}); −1 when none. */
export function findNamedColumn(headers: readonly string[], names: readonly string[]): number {
  for (const name of names) {
    const wanted = name.toLowerCase()
    const i = headers.findIndex((h) => bareHeader(h) === wanted || h.trim().toLowerCase() === wanted)
    if (i >= 0) return i
  }
  return -1
}

/** A format's column choices: `columns` per variable or time field; `only` = use no other column. */
export interface ColumnPreset {
  columns: Partial<Record<MappingKey | 'windU' | 'windV', ColumnSpec>>
  only?: boolean
}

/**
 * Decide the column of every variable and time field from the header row (and a units row, when
 * the file has one) and the mapping. Throws {@link WeatherInputError} naming every ambiguity at once
 * (two columns that fit one variable equally well, with the `--map` to give), a mapping that names a
 * missing column, or a unit that does not fit its variable.
 */
export function planColumns(
  headers: string[],
  mapping: Partial<Record<MappingKey, ColumnMapping>> = {},
  unitsRow?: string[],
  preset?: ColumnPreset,
): ColumnPlan {
  const plan: ColumnPlan = {
    variables: {},
    time: {},
    headerSaysUtc: false,
    headerUtcOffsetHours: null,
    headerTimeNote: null,
    unused: [],
    notes: [],
  }
  const taken = new Set<number>()
  const ignored = new Set<MappingKey>()
  for (const [key, m] of Object.entries(mapping) as [MappingKey, ColumnMapping][]) {
    if (m.column.toLowerCase() === 'none') {
      ignored.add(key)
      continue
    }
    const index = findColumn(headers, m.column, key)
    taken.add(index)
    if (isTimeField(key)) {
      plan.time[key] = index
      if (key === 'timestamp' || key === 'date' || key === 'time' || key === 'hour')
        readTimeHeader(headers[index], plan)
      continue
    }
    const analysis = analyseHeader(headers[index], unitsRow?.[index])
    let conversion: UnitConversion | null = null
    if (m.unit !== undefined) {
      conversion = unitConversion(key, m.unit)
      if (conversion === null) {
        throw new WeatherInputError(
          `mapping ${key}=${snippet(m.column)}:${snippet(m.unit)}: '${snippet(m.unit)}' is not a unit of ${key} (units: ${acceptedUnits(key).join(', ')})`,
          ['unit'],
        )
      }
    } else conversion = chooseUnit(key, analysis.units).conversion
    plan.variables[key] = {
      variable: key,
      index,
      header: headers[index],
      conversion,
      unitSource: m.unit !== undefined ? 'mapping' : conversion ? 'header' : 'none',
      heightM: analysis.parts.heightM,
    }
  }
  if (preset !== undefined) {
    for (const [key, spec] of Object.entries(preset.columns) as [
      MappingKey | 'windU' | 'windV',
      ColumnSpec,
    ][]) {
      if (key === 'windU' || key === 'windV') continue
      if (key in mapping || ignored.has(key)) continue
      const index = findNamedColumn(headers, spec.names)
      if (index < 0 || taken.has(index)) continue
      taken.add(index)
      if (isTimeField(key)) {
        plan.time[key] = index
        readTimeHeader(headers[index], plan)
        continue
      }
      const analysis = analyseHeader(headers[index], unitsRow?.[index])
      const conversion =
        spec.unit !== undefined ? unitConversion(key, spec.unit) : chooseUnit(key, analysis.units).conversion
      plan.variables[key] = {
        variable: key,
        index,
        header: headers[index],
        conversion,
        unitSource: spec.unit !== undefined ? 'format' : conversion ? 'header' : 'none',
        heightM: analysis.parts.heightM,
      }
    }
    const u = preset.columns.windU
    const v = preset.columns.windV
    if (u && v && !plan.variables.wind && !('wind' in mapping)) {
      const ui = findNamedColumn(headers, u.names)
      const vi = findNamedColumn(headers, v.names)
      if (ui >= 0 && vi >= 0) {
        const component = (index: number, spec: ColumnSpec): ChosenColumn => ({
          variable: 'wind',
          index,
          header: headers[index],
          conversion: spec.unit !== undefined ? unitConversion('wind', spec.unit) : null,
          unitSource: spec.unit !== undefined ? 'format' : 'none',
          heightM: componentHeight(bareHeader(headers[index])),
        })
        plan.windComponents = { u: component(ui, u), v: component(vi, v) }
        taken.add(ui)
        taken.add(vi)
        plan.notes.push(
          `wind speed from the components '${snippet(headers[ui])}' and '${snippet(headers[vi])}' as √(u² + v²)`,
        )
      }
    }
    if (preset.only) {
      headers.forEach((h, index) => {
        if (!taken.has(index)) plan.unused.push(h)
      })
      return plan
    }
  }
  const candidates = new Map<
    MappingKey,
    { index: number; strength: number; units: string[]; heightM: number | null }[]
  >()
  const components: Record<'u' | 'v', { index: number; units: string[]; heightM: number | null }[]> = {
    u: [],
    v: [],
  }
  headers.forEach((h, index) => {
    if (taken.has(index)) return
    const analysis = analyseHeader(h, unitsRow?.[index])
    const meaning = analysis.meaning
    if (meaning === null) {
      plan.unused.push(h)
      return
    }
    if (meaning.kind === 'excluded') {
      plan.unused.push(h)
      plan.notes.push(`column '${snippet(h)}' is ${meaning.reason}: not used`)
      return
    }
    if (meaning.kind === 'wind-component') {
      if (ignored.has('wind') || plan.variables.wind) plan.unused.push(h)
      else
        components[meaning.component].push({
          index,
          units: analysis.units,
          heightM: analysis.parts.heightM ?? componentHeight(analysis.parts.name),
        })
      return
    }
    if (meaning.kind === 'time') readTimeHeader(h, plan)
    const key = meaning.kind === 'variable' ? meaning.variable : meaning.field
    if (
      ignored.has(key) ||
      plan.variables[key as WeatherVariable] ||
      plan.time[key as TimeField] !== undefined
    ) {
      plan.unused.push(h)
      return
    }
    const list = candidates.get(key) ?? []
    list.push({
      index,
      strength: meaning.kind === 'variable' ? meaning.strength : 2,
      units: analysis.units,
      heightM: analysis.parts.heightM,
    })
    candidates.set(key, list)
  })
  const ambiguities: string[] = []
  const ambiguous: string[] = []
  for (const [key, all] of candidates) {
    const best = Math.max(...all.map((c) => c.strength))
    const list = all.filter((c) => c.strength === best)
    for (const c of all) if (c.strength < best) plan.unused.push(headers[c.index])
    if (list.length > 1) {
      const names = list.map((c) => `'${snippet(headers[c.index])}'`).join(', ')
      ambiguities.push(
        `${key} could be any of ${names}: give ${mapArgument(key, headers[list[0].index], list[0].index)} (or the column you mean)`,
      )
      ambiguous.push(key)
      continue
    }
    const chosen = list[0]
    if (isTimeField(key)) {
      plan.time[key] = chosen.index
      continue
    }
    const { conversion } = chooseUnit(key, chosen.units)
    plan.variables[key] = {
      variable: key,
      index: chosen.index,
      header: headers[chosen.index],
      conversion,
      unitSource: conversion ? 'header' : 'none',
      heightM: chosen.heightM,
    }
  }
  if (ambiguities.length > 0) {
    throw new WeatherInputError(
      `${ambiguities.length === 1 ? 'a variable fits' : `${ambiguities.length} variables fit`} more than one column; ` +
        `say which with --map (map a column to 'none' to ignore it): ${ambiguities.map((a, i) => (ambiguities.length > 1 ? `(${i + 1}) ${a}` : a)).join('; ')}`,
      ambiguous.map((k) => `mapping of ${k}`),
    )
  }
  if (components.u.length > 0 || components.v.length > 0) {
    const names = [...components.u, ...components.v]
      .map((c) => `'${snippet(headers[c.index])}'`)
      .join(' and ')
    if (plan.variables.wind) {
      plan.notes.push(`${names}: wind components, not used (the file has a wind speed column)`)
      for (const c of [...components.u, ...components.v]) plan.unused.push(headers[c.index])
    } else if (components.u.length === 1 && components.v.length === 1) {
      const make = (c: { index: number; units: string[]; heightM: number | null }): ChosenColumn => {
        const { conversion } = chooseUnit('wind', c.units)
        return {
          variable: 'wind',
          index: c.index,
          header: headers[c.index],
          conversion,
          unitSource: conversion ? 'header' : 'none',
          heightM: c.heightM,
        }
      }
      plan.windComponents = { u: make(components.u[0]), v: make(components.v[0]) }
      plan.notes.push(`wind speed from the components ${names} as √(u² + v²)`)
    } else {
      plan.notes.push(
        `${names}: wind components that do not make one east-north pair: not used as a wind speed (give --map wind=<speed column>)`,
      )
      for (const c of [...components.u, ...components.v]) plan.unused.push(headers[c.index])
    }
  }
  return plan
}

/** Measurement height of a component named like `u10`, `v100` [m]; null otherwise. */
function componentHeight(name: string): number | null {
  if (name.length < 2 || name.length > 5) return null
  const n = Number(name.slice(1).replace('m', ''))
  return Number.isInteger(n) && n > 0 ? n : null
}

/** What a time header says about the clock of its timestamps. */
export type HeaderTimeBasis =
  | { kind: 'none' }
  | { kind: 'utc' }
  | { kind: 'offset'; hours: number; note: string }

/**
 * Standard-time zone abbreviations and their offsets from UTC [h] (IANA time zone database
 * abbreviations; from memory). Only standard-time names: a header that names a daylight-saving
 * abbreviation (PDT, CEST …) gives no fixed offset and the user is asked for the zone.
 */
const STANDARD_ZONE_ABBREVIATIONS: Record<string, number> = {
  est: -5,
  cst: -6,
  mst: -7,
  pst: -8,
  akst: -9,
  hst: -10,
  cet: 1,
  mez: 1,
  eet: 2,
  wet: 0,
  jst: 9,
  awst: 8,
  acst: 9.5,
  aest: 10,
  nzst: 12,
  sast: 2,
}

/**
 * The clock named in a time header, read in one pass: `UTC`, `GMT`, `Z`, `Zulu`, `UTC+07:00`,
 * `GMT-05:00`, `UTC−3`, or a standard-time abbreviation such as `PST`.
 */
export function headerTimeBasis(header: string): HeaderTimeBasis {
  const text = header.length > MAX_HEADER_TEXT ? header.slice(0, MAX_HEADER_TEXT) : header
  const lower = text.toLowerCase()
  let k = 0
  let sawUtc = false
  let abbreviation: string | null = null
  while (k < lower.length) {
    const c = lower.charCodeAt(k)
    if (!(c >= 97 && c <= 122)) {
      k++
      continue
    }
    const from = k
    while (k < lower.length && lower.charCodeAt(k) >= 97 && lower.charCodeAt(k) <= 122) k++
    const word = lower.slice(from, k)
    if (word === 'utc' || word === 'gmt') {
      let j = k
      while (j < lower.length && lower.charCodeAt(j) === 32) j++
      const sign = lower.charCodeAt(j)
      if (sign === 43 || sign === 45 || sign === 0x2212) {
        j++
        while (j < lower.length && lower.charCodeAt(j) === 32) j++
        let digits = 0
        let hours = 0
        while (j < lower.length && digits < 4 && lower.charCodeAt(j) >= 48 && lower.charCodeAt(j) <= 57) {
          hours = hours * 10 + (lower.charCodeAt(j) - 48)
          digits++
          j++
        }
        let minutes = 0
        if (digits === 4) {
          minutes = hours % 100
          hours = Math.floor(hours / 100)
        } else if (digits >= 1 && digits <= 2 && lower.charCodeAt(j) === 58) {
          const m1 = lower.charCodeAt(j + 1) - 48
          const m2 = lower.charCodeAt(j + 2) - 48
          if (m1 >= 0 && m1 <= 5 && m2 >= 0 && m2 <= 9) minutes = m1 * 10 + m2
        }
        if (digits > 0 && digits !== 3 && hours <= 14 && minutes < 60) {
          const value = (sign === 43 ? 1 : -1) * (hours + minutes / 60)
          return { kind: 'offset', hours: value, note: `the time header names UTC${formatHours(value)}` }
        }
      }
      sawUtc = true
    } else if (word === 'z' || word === 'zulu') sawUtc = true
    else if (abbreviation === null && word in STANDARD_ZONE_ABBREVIATIONS) abbreviation = word
  }
  if (sawUtc) return { kind: 'utc' }
  if (abbreviation !== null) {
    const hours = STANDARD_ZONE_ABBREVIATIONS[abbreviation]
    return {
      kind: 'offset',
      hours,
      note: `the time header names ${abbreviation.toUpperCase()}, read as the fixed standard-time offset UTC${formatHours(hours)} all year`,
    }
  }
  return { kind: 'none' }
}

function formatHours(hours: number): string {
  const sign = hours < 0 ? '−' : '+'
  const abs = Math.abs(hours)
  const h = Math.floor(abs)
  const m = Math.round((abs - h) * 60)
  return `${sign}${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`
}

function readTimeHeader(header: string, plan: ColumnPlan): void {
  const basis = headerTimeBasis(header)
  if (basis.kind === 'utc') plan.headerSaysUtc = true
  else if (basis.kind === 'offset' && plan.headerUtcOffsetHours === null) {
    plan.headerUtcOffsetHours = basis.hours
    plan.headerTimeNote = `'${snippet(header)}': ${basis.note}`
  }
}

function isTimeField(key: MappingKey): key is TimeField {
  return (TIME_FIELDS as readonly string[]).includes(key)
}
