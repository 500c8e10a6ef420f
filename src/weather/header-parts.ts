/**
 * @module weather/header-parts
 * What a column header says: its words (outside brackets), the unit texts written with it (brackets, after
 * a comma, `in <unit>`, a last word, a degree sign, a unit inside a one-word name such as `tempf`) and a
 * measurement height, read in one pass without regular expressions; then its meaning (header-words.ts).
 */

import { headerTimeBasis, MAX_HEADER_TEXT } from './header-time.ts'
import { classifyWords, type HeaderMeaning, headerWords } from './header-words.ts'
import { isUnitToken, normalizeUnitToken, unitConversion } from './units.ts'

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
