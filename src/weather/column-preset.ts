/**
 * @module weather/column-preset
 * A format's own column choices, for dialects that know their layout: per variable or time field the
 * header names to look for and the documented unit, found case-insensitively with or without a bracketed
 * unit.
 */
import type { MappingKey } from './options.ts'

/** A format's own choice of column for a variable or time field: header names to look for, and the unit. */
export interface ColumnSpec {
  /** Header names (case-insensitive, compared without a bracketed unit), first found wins. */
  names: readonly string[]
  /** The unit the format documents for the column (over anything the header says). */
  unit?: string
}

/** Header text without a bracketed unit, lower case: `temperature_2m (°C)` → `temperature_2m`. */
export function bareHeader(header: string): string {
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
