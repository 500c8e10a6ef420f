/**
 * @module weather/columns
 * Which column of a delimited file holds which variable: header names and unit tokens are
 * recognised, an explicit mapping overrides them, and two equally good candidates for one variable
 * are an error naming the mapping to give.
 */
import { findColumn, mapArgument } from './column-mapping.ts'
import { bareHeader, type ColumnPreset, type ColumnSpec, findNamedColumn } from './column-preset.ts'
import { analyseHeader } from './header-parts.ts'
import { headerTimeBasis } from './header-time.ts'
import { type ColumnMapping, type MappingKey, TIME_FIELDS, type TimeField } from './options.ts'
import { snippet } from './snippet.ts'
import { acceptedUnits, type UnitConversion, unitConversion, type WeatherVariable } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

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

/**
 * Decide the column of every variable and time field from the header row (and a units row, when
 * the file has one) and the mapping. Throws {@link WeatherInputError} naming every ambiguity at once
 * (two columns that fit one variable equally well, with the `--map` to give), a mapping that names a
 * missing column, or a unit that does not fit its variable. In order: the user's mapping, the format's
 * preset, then what the headers say.
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
  const ctx: PlanContext = { headers, unitsRow, plan, taken, ignored }
  mappedColumns(ctx, mapping)
  if (preset !== undefined) {
    presetColumns(ctx, mapping, preset)
    if (preset.only) {
      headers.forEach((h, index) => {
        if (!taken.has(index)) plan.unused.push(h)
      })
      return plan
    }
  }
  const components = detectedColumns(ctx)
  if (components.u.length > 0 || components.v.length > 0) windFromComponents(ctx, components)
  return plan
}

/** What the stages of {@link planColumns} share. */
interface PlanContext {
  headers: string[]
  unitsRow: string[] | undefined
  plan: ColumnPlan
  /** Columns already given to a variable or time field. */
  taken: Set<number>
  /** Keys the user mapped to `none`. */
  ignored: Set<MappingKey>
}

/** A wind component column found by its header. */
interface ComponentCandidate {
  index: number
  units: string[]
  heightM: number | null
}

/** The user's mapping: columns by name or number, units checked against their variable. */
function mappedColumns(ctx: PlanContext, mapping: Partial<Record<MappingKey, ColumnMapping>>): void {
  const { headers, unitsRow, plan, taken, ignored } = ctx
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
}

/** The format's own columns (by header names, with its documented units) for what the user did not map. */
function presetColumns(
  ctx: PlanContext,
  mapping: Partial<Record<MappingKey, ColumnMapping>>,
  preset: ColumnPreset,
): void {
  const { headers, unitsRow, plan, taken, ignored } = ctx
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
}

/**
 * The remaining columns by what their headers say: per variable or time field the strongest
 * candidate (two equally strong ones are an ambiguity, all reported at once); wind components are
 * returned for {@link windFromComponents}.
 */
function detectedColumns(ctx: PlanContext): Record<'u' | 'v', ComponentCandidate[]> {
  const { headers, unitsRow, plan, taken, ignored } = ctx
  const candidates = new Map<
    MappingKey,
    { index: number; strength: number; units: string[]; heightM: number | null }[]
  >()
  const components: Record<'u' | 'v', ComponentCandidate[]> = { u: [], v: [] }
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
  return components
}

/** A wind speed √(u² + v²) from one east and one north component, when the file has no speed column. */
function windFromComponents(ctx: PlanContext, components: Record<'u' | 'v', ComponentCandidate[]>): void {
  const { headers, plan } = ctx
  const names = [...components.u, ...components.v].map((c) => `'${snippet(headers[c.index])}'`).join(' and ')
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

/** Measurement height of a component named like `u10`, `v100` [m]; null otherwise. */
function componentHeight(name: string): number | null {
  if (name.length < 2 || name.length > 5) return null
  const n = Number(name.slice(1).replace('m', ''))
  return Number.isInteger(n) && n > 0 ? n : null
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
