/**
 * @module weather/columns
 * Which column of a delimited file holds which variable: header names and unit tokens are
 * recognised, an explicit mapping overrides them, and two equally good candidates for one variable
 * are an error naming the mapping to give.
 */

import type { ColumnMapping, MappingKey, TimeField } from './options.ts'
import { snippet } from './snippet.ts'
import { type UnitConversion, unitConversion, type WeatherVariable } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** A header split into its name and the unit written with it. */
export interface HeaderParts {
  /** Lower-case name with punctuation turned into single spaces. */
  name: string
  /** Unit text found in brackets or as a trailing token, or null. */
  unitText: string | null
  /** Measurement height [m] written in the header (e.g. `wind 2m`), or null. */
  heightM: number | null
}

/** Trailing tokens that are units when they end a header like `temp_f` or `wind_kmh`. */
const TRAILING_UNIT =
  /[\s_.-](c|degc|f|degf|k|pct|hpa|kpa|pa|mbar|mb|inhg|ms|mps|kmh|kph|mph|kn|kt|kts|knots|wm2|whm2|mm|in|cm)$/i

export function splitHeader(header: string): HeaderParts {
  let text = header.replace(/^\uFEFF/, '').trim()
  let unitText: string | null = null
  const bracket = /[([{]([^)\]}]*)[)\]}]\s*$/.exec(text)
  if (bracket) {
    unitText = bracket[1].trim()
    text = text.slice(0, bracket.index).trim()
  } else {
    const inUnit = /\s+in\s+(\S+)$/i.exec(text)
    if (inUnit) {
      unitText = inUnit[1]
      text = text.slice(0, inUnit.index)
    } else {
      const trailing = TRAILING_UNIT.exec(text)
      if (trailing) {
        unitText = trailing[1]
        text = text.slice(0, trailing.index)
      }
    }
  }
  const height = /(?:^|[\s_@-])(\d+(?:\.\d+)?)\s*m(?:$|[\s_)])/i.exec(text)
  const name = text
    .toLowerCase()
    .replace(/[^a-z0-9%]+/g, ' ')
    .trim()
  return { name, unitText: unitText === '' ? null : unitText, heightM: height ? Number(height[1]) : null }
}

/** What a header names: a variable, a time field, or a column to ignore (flags, directions …). */
export type HeaderMeaning =
  | { kind: 'variable'; variable: WeatherVariable }
  | { kind: 'time'; field: TimeField }
  | null

const IGNORE = /\b(source|src|uncert|uncertainty|flag|flags|qc|quality|dir|direction|gust|max|min|std|sd)\b/

/** Recognise a header name (already split by {@link splitHeader}). Order matters: dew before temperature. */
export function classifyHeader(name: string): HeaderMeaning {
  const n = ` ${name} `
  if (
    / (datetime|date time|timestamp|time stamp|valid|obs time|observation time|utc time|local time) /.test(n)
  )
    return { kind: 'time', field: 'timestamp' }
  if (/^ (date|day date|fecha|datum) $/.test(n)) return { kind: 'time', field: 'date' }
  if (/^ (time|hour minute|hh mm|heure|zeit) $/.test(n)) return { kind: 'time', field: 'time' }
  if (/^ (year|yr|yyyy) $/.test(n)) return { kind: 'time', field: 'year' }
  if (/^ (month|mo|mm|mon) $/.test(n)) return { kind: 'time', field: 'month' }
  if (/^ (day|dd|dy|day of month) $/.test(n)) return { kind: 'time', field: 'day' }
  if (/^ (hour|hr|hh) $/.test(n)) return { kind: 'time', field: 'hour' }
  if (/^ (minute|min|mi) $/.test(n)) return { kind: 'time', field: 'minute' }
  if (IGNORE.test(n)) return null
  if (/ (dew|tdp|td|dewpoint|dew point|dwpt|dwpf) /.test(n) || n.includes('dew')) {
    return { kind: 'variable', variable: 'dewPoint' }
  }
  if (/ (wet bulb|wetbulb|twb|tw) /.test(n) || n.includes('wet bulb') || n.includes('wetbulb')) {
    return { kind: 'variable', variable: 'wetBulb' }
  }
  if (
    / (rh|relh|hum|humidity|relative humidity|rel hum|rhum|hr) /.test(n) ||
    n.includes('humid') ||
    n.includes('feuchte') ||
    n.includes('humedad')
  ) {
    if (/ (abs|absolute|specific|ratio|mixing) /.test(n)) return null
    return { kind: 'variable', variable: 'relativeHumidity' }
  }
  if (/ (sea level|slp|msl|mslp|qnh) /.test(n)) return null
  if (
    / (temp|temperature|tdb|t2m|tair|air t|dry bulb|drybulb|dry|t|ta|tmp|tmpf|tmpc) /.test(n) ||
    n.includes('temp')
  ) {
    return { kind: 'variable', variable: 'dryBulb' }
  }
  if (
    / (press|pressure|pres|p|stn p|station pressure|ps|baro|barometer|bp) /.test(n) ||
    n.includes('press')
  ) {
    return { kind: 'variable', variable: 'pressure' }
  }
  if (/ (wind|ws|wspd|wind speed|windspeed|u10|ff|sknt|vel) /.test(n) || n.includes('wind')) {
    return { kind: 'variable', variable: 'wind' }
  }
  if (/ (dni|dhi|direct|diffuse|beam|extraterrestrial|etr|etrn|infrared|ir) /.test(n)) return null
  if (/ (ghi|global|solar|radiation|irradiance|srad|swdown|sw|rad|insolation|ghr|glob|sun) /.test(n)) {
    return { kind: 'variable', variable: 'ghi' }
  }
  if (/ (rain|precip|precipitation|prcp|pcp|rainfall|lprecip|p01i|ppt) /.test(n)) {
    return { kind: 'variable', variable: 'rain' }
  }
  if (/ (cloud|clouds|cloud cover|sky cover|totcld|tcc|cc) /.test(n))
    return { kind: 'variable', variable: 'cloudCover' }
  return null
}

/** A variable's chosen column. */
export interface ChosenColumn {
  variable: WeatherVariable
  index: number
  header: string
  /** Conversion from the file's unit; null = no unit given, decide from the values. */
  conversion: UnitConversion | null
  /** Whether the unit came from the header, the mapping, or neither. */
  unitSource: 'header' | 'mapping' | 'none'
  heightM: number | null
}

export interface ColumnPlan {
  variables: Partial<Record<WeatherVariable, ChosenColumn>>
  time: Partial<Record<TimeField, number>>
  /** Set when the header row names UTC (e.g. `time (UTC)`, `timestamp_utc`) without an offset. */
  headerSaysUtc: boolean
  /** Offset written in a time header such as `time (local standard time, UTC+07:00)` [h], or null. */
  headerUtcOffsetHours: number | null
  /** Columns recognised as nothing. */
  unused: string[]
}

function findColumn(headers: string[], column: string, key: string): number {
  const ref = /^#(\d+)$/.exec(column)
  if (ref) {
    const i = Number(ref[1]) - 1
    if (i >= 0 && i < headers.length) return i
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

/**
 * Decide the column of every variable and time field from the header row and the mapping.
 * Throws {@link WeatherInputError} when two columns fit one variable equally well, or a mapping
 * names a missing column or a unit that does not fit the variable.
 */
export function planColumns(
  headers: string[],
  mapping: Partial<Record<MappingKey, ColumnMapping>> = {},
): ColumnPlan {
  const plan: ColumnPlan = {
    variables: {},
    time: {},
    headerSaysUtc: false,
    headerUtcOffsetHours: null,
    unused: [],
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
      continue
    }
    const parts = splitHeader(headers[index])
    const unitText = m.unit ?? parts.unitText
    let conversion: UnitConversion | null = null
    if (unitText !== null) {
      conversion = unitConversion(key, unitText)
      if (conversion === null && m.unit !== undefined) {
        throw new WeatherInputError(
          `mapping ${key}=${snippet(m.column)}:${snippet(m.unit)}: '${snippet(m.unit)}' is not a unit of ${key}`,
          ['unit'],
        )
      }
    }
    plan.variables[key] = {
      variable: key,
      index,
      header: headers[index],
      conversion,
      unitSource: m.unit !== undefined ? 'mapping' : conversion ? 'header' : 'none',
      heightM: parts.heightM,
    }
  }
  const candidates = new Map<MappingKey, number[]>()
  headers.forEach((h, index) => {
    if (taken.has(index)) return
    const parts = splitHeader(h)
    const meaning = classifyHeader(parts.name)
    if (meaning?.kind === 'time') readHeaderTimeBasis(h, plan)
    if (meaning === null) {
      plan.unused.push(h)
      return
    }
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
    list.push(index)
    candidates.set(key, list)
  })
  for (const [key, list] of candidates) {
    if (list.length > 1) {
      const names = list.map((i) => `'${snippet(headers[i])}'`).join(' and ')
      throw new WeatherInputError(
        `${names} could both be ${key}: say which with --map ${key}=<column>[:unit] ` +
          `(e.g. --map ${key}=${snippet(headers[list[0]])}), and the other with --map <variable>=<column> if it is something else`,
        ['mapping'],
      )
    }
    const index = list[0]
    if (isTimeField(key)) {
      plan.time[key] = index
      continue
    }
    const parts = splitHeader(headers[index])
    const conversion = parts.unitText === null ? null : unitConversion(key, parts.unitText)
    plan.variables[key] = {
      variable: key,
      index,
      header: headers[index],
      conversion,
      unitSource: conversion ? 'header' : 'none',
      heightM: parts.heightM,
    }
  }
  return plan
}

/** `UTC+07:00`, `GMT-5`, `UTC−03:30` in a time header → offset; bare `UTC`/`GMT`/`Zulu` → UTC. */
function readHeaderTimeBasis(header: string, plan: ColumnPlan): void {
  const m = /\b(?:utc|gmt)\s*([+\-\u2212])\s*(\d{1,2})(?::?(\d{2}))?/i.exec(header)
  if (m) {
    const sign = m[1] === '+' ? 1 : -1
    const hours = Number(m[2]) + (m[3] === undefined ? 0 : Number(m[3]) / 60)
    if (hours <= 14) plan.headerUtcOffsetHours = sign * hours
    return
  }
  if (/\butc\b|\bgmt\b|\bzulu\b/i.test(header)) plan.headerSaysUtc = true
}

function isTimeField(key: MappingKey): key is TimeField {
  return ['timestamp', 'date', 'time', 'year', 'month', 'day', 'hour', 'minute'].includes(key)
}
