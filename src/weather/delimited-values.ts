/**
 * @module weather/delimited-values
 * The value columns of delimited text as raw columns in the file's units: plain decimals the scanner
 * parsed, other cells read by {@link parseField} (decimal commas, missing words; anything else logged as
 * not a number), encoded cells through the layout's decoders, values whose quality flag rejects them
 * and the layout's missing codes made missing; the wind speed from east and north components.
 */
import type { ChosenColumn, ColumnPlan } from './columns.ts'
import type { BodyCells } from './delimited-body.ts'
import { FIELD_MISSING, FIELD_UNREADABLE, parseField } from './numbers.ts'
import type { ProblemLog } from './problem-log.ts'
import type { RawColumn } from './raw-table.ts'
import { snippet } from './snippet.ts'
import type { WeatherVariable } from './units.ts'

/** How the cells of value columns are read. */
export interface ValueReading {
  body: BodyCells
  headers: string[]
  decimalComma: boolean
  /** Decoders by column index (encoded cells). */
  decoders: Map<number, (text: string) => number>
  /** Flag column by value column index. */
  flagOf: Map<number, number>
  qualityFlags?: { reject: (flag: string) => boolean; describe: string }
  missingCodes: readonly number[]
  log: ProblemLog
  warnings: string[]
}

/** Every chosen value column, and the wind speed √(u² + v²) when the file has components and no speed. */
export function readValueColumns(
  plan: ColumnPlan,
  r: ValueReading,
): Partial<Record<WeatherVariable, RawColumn>> {
  const columns: Partial<Record<WeatherVariable, RawColumn>> = {}
  for (const chosen of Object.values(plan.variables)) columns[chosen!.variable] = readColumn(r, chosen!)
  if (plan.windComponents && !columns.wind) {
    const u = readColumn(r, plan.windComponents.u)
    const v = readColumn(r, plan.windComponents.v)
    const uScale = u.conversion?.scale ?? 1
    const vScale = v.conversion?.scale ?? 1
    const n = r.body.lines.length
    const speed = new Float64Array(n)
    let missing = 0
    for (let i = 0; i < n; i++) {
      const x = u.values[i] * uScale
      const y = v.values[i] * vScale
      speed[i] = Math.sqrt(x * x + y * y)
      if (Number.isNaN(speed[i])) missing++
    }
    columns.wind = {
      values: speed,
      source: `√(${plan.windComponents.u.header}² + ${plan.windComponents.v.header}²)`,
      conversion: { unit: 'm/s', scale: 1, offset: 0 },
      unitSource: u.conversion !== null || v.conversion !== null ? 'header' : 'none',
      missingCount: missing,
      missingCodeCount: 0,
    }
    if (u.conversion === null && v.conversion === null)
      r.warnings.push('the wind components have no unit: read as m/s')
  }
  return columns
}

/** One value column (see the module). */
function readColumn(r: ValueReading, chosen: ChosenColumn): RawColumn {
  const { body, decimalComma, decoders, flagOf, missingCodes, log, warnings } = r
  const { lines, cells } = body
  const n = lines.length
  const scanned = body.numbers?.[chosen.index]
  const values = scanned?.values ?? new Float64Array(n)
  let missing = scanned?.blank ?? 0
  let codes = 0
  const unreadable = (i: number, text: string | undefined): void => {
    missing++
    log.add(
      lines[i],
      chosen.variable,
      'unparseable-number',
      `'${snippet(text ?? '')}' in column '${snippet(chosen.header)}' is not a number: read as missing`,
    )
  }
  const decode = decoders.get(chosen.index)
  if (decode !== undefined) {
    const column = cells[chosen.index]
    for (let i = 0; i < n; i++) {
      const text = column?.[i]
      const v = text === undefined ? Number.NaN : decode(text)
      values[i] = v
      if (Number.isNaN(v)) missing++
    }
  } else if (scanned) {
    for (const [i, text] of scanned.other) {
      const code = parseField(text, decimalComma, values, i)
      if (code === FIELD_MISSING) missing++
      else if (code === FIELD_UNREADABLE) unreadable(i, text)
    }
  } else {
    const column = cells[chosen.index]
    for (let i = 0; i < n; i++) {
      const code = parseField(column?.[i], decimalComma, values, i)
      if (code === FIELD_MISSING) missing++
      else if (code === FIELD_UNREADABLE) unreadable(i, column?.[i])
    }
  }
  const flagColumn = flagOf.get(chosen.index)
  if (flagColumn !== undefined && r.qualityFlags) {
    let flagged = 0
    for (let i = 0; i < n; i++) {
      if (Number.isNaN(values[i])) continue
      if (r.qualityFlags.reject(cells[flagColumn]?.[i] ?? '')) {
        values[i] = Number.NaN
        flagged++
      }
    }
    missing += flagged
    if (flagged > 0)
      warnings.push(
        `column '${snippet(chosen.header)}': ${flagged} values flagged ${r.qualityFlags.describe} in '${snippet(r.headers[flagColumn])}': read as missing`,
      )
  }
  if (missingCodes.length > 0) {
    for (let i = 0; i < n; i++) {
      if (missingCodes.includes(values[i])) {
        values[i] = Number.NaN
        codes++
      }
    }
  }
  return {
    values,
    source: chosen.header,
    conversion: chosen.conversion,
    unitSource: chosen.unitSource,
    missingCount: missing + codes,
    missingCodeCount: codes,
  }
}
