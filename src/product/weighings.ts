/**
 * @module product/weighings
 * A grower's tray weighings: parse the CSV text (the CLI reads the file) and turn masses into dry-basis
 * moisture from the dry mass, the initial moisture or the final moisture.
 *
 * CSV (comma or semicolon, `#` comment lines, header required, column order free):
 *   elapsed_h | time   — hours since the first weighing, or ISO 8601 local date-times (`2026-07-01T08:00`)
 *   mass_g             — tray contents [g]; empty = weighing missing (the row is kept as a gap)
 *   air_c, rh_pct      — optional air temperature [°C] and RH [%] at the weighing
 */
import { moistureDbFromWbPct } from './moisture-basis.ts'

export interface Weighing {
  /** 1-based line in the file. */
  line: number
  timeH: number
  massG: number | null
  airTempC: number | null
  rhPct: number | null
}

function parseIsoLocalH(s: string, line: number): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?$/.exec(s.trim())
  if (!m) throw new RangeError(`line ${line}: time '${s}' is not an ISO 8601 date-time like 2026-07-01T08:00`)
  const [, y, mo, d, h, mi, se] = m
  const ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, se ? +se : 0)
  if (!Number.isFinite(ms)) throw new RangeError(`line ${line}: time '${s}' is not a valid date`)
  return ms / 3_600_000
}

function num(field: string, s: string | undefined, line: number, min: number, max: number): number | null {
  if (s === undefined || s.trim() === '') return null
  const v = Number(s.trim())
  if (!Number.isFinite(v)) throw new RangeError(`line ${line}: ${field} '${s}' is not a number`)
  if (!(v >= min && v <= max)) throw new RangeError(`line ${line}: ${field} ${v} is outside ${min}–${max}`)
  return v
}

/** Parse weighings CSV text. RangeError with the line number for any bad row. */
export function parseWeighingsCsv(text: string): Weighing[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/)
  let header: string[] | null = null
  let sep = ','
  const rows: Weighing[] = []
  lines.forEach((raw, i) => {
    const line = i + 1
    const s = raw.trim()
    if (s === '' || s.startsWith('#')) return
    if (!header) {
      sep = s.includes(';') && !s.includes(',') ? ';' : ','
      header = s.split(sep).map((h) => h.trim().toLowerCase())
      if (!header.includes('mass_g'))
        throw new RangeError(`line ${line}: header needs a mass_g column, got '${s}'`)
      if (!header.includes('elapsed_h') && !header.includes('time')) {
        throw new RangeError(`line ${line}: header needs an elapsed_h or a time column, got '${s}'`)
      }
      return
    }
    const cells = s.split(sep)
    const get = (name: string): string | undefined => {
      const j = (header as string[]).indexOf(name)
      return j >= 0 ? cells[j] : undefined
    }
    const h = header as string[]
    const timeH = h.includes('elapsed_h')
      ? num('elapsed_h', get('elapsed_h'), line, 0, 24 * 366)
      : parseIsoLocalH(get('time') ?? '', line)
    if (timeH === null) throw new RangeError(`line ${line}: time is empty`)
    const massG = num('mass_g', get('mass_g'), line, 0, 1e7)
    if (massG !== null && !(massG > 0)) throw new RangeError(`line ${line}: mass_g must be > 0, got ${massG}`)
    rows.push({
      line,
      timeH,
      massG,
      airTempC: num('air_c', get('air_c'), line, -40, 150),
      rhPct: num('rh_pct', get('rh_pct'), line, 0, 100),
    })
  })
  if (rows.length === 0) throw new RangeError('no weighings found (the file has no data rows)')
  const t0 = rows[0].timeH
  for (let i = 0; i < rows.length; i++) {
    rows[i].timeH -= t0
    if (i > 0 && !(rows[i].timeH > rows[i - 1].timeH)) {
      throw new RangeError(`line ${rows[i].line}: time must increase from one weighing to the next`)
    }
  }
  return rows
}

/** How the dry matter is known: exactly one of these. */
export type MoistureReference = { dryMassG: number } | { initialWbPct: number } | { finalWbPct: number }

export interface MoisturePoint {
  line: number
  timeH: number
  massG: number
  moistureDb: number
}

/** Dry mass [g] from the reference and the weighings; RangeError when it cannot be had. */
export function dryMassG(weighings: Weighing[], ref: MoistureReference): number {
  const weighed = weighings.filter((w) => w.massG !== null)
  if (weighed.length === 0) throw new RangeError('no weighing has a mass')
  if ('dryMassG' in ref) {
    if (!(ref.dryMassG > 0)) throw new RangeError(`dry mass must be > 0 g, got ${ref.dryMassG}`)
    // a loop, not Math.min(...array): spreading 130,000 weighings overflows the call stack
    let minMass = Number.POSITIVE_INFINITY
    for (const w of weighed) if ((w.massG as number) < minMass) minMass = w.massG as number
    if (!(ref.dryMassG < minMass)) {
      throw new RangeError(`dry mass ${ref.dryMassG} g must be below every weighing (smallest ${minMass} g)`)
    }
    return ref.dryMassG
  }
  if ('initialWbPct' in ref) {
    const first = weighings[0]
    if (first.massG === null)
      throw new RangeError(`--initial-wb needs the first weighing, but line ${first.line} has no mass`)
    moistureDbFromWbPct(ref.initialWbPct)
    return first.massG * (1 - ref.initialWbPct / 100)
  }
  const last = weighings[weighings.length - 1]
  if (last.massG === null) {
    throw new RangeError(
      `--final-wb needs the final weighing, but the last reading (line ${last.line}) has no mass; give --dry-mass or --initial-wb instead`,
    )
  }
  moistureDbFromWbPct(ref.finalWbPct)
  return last.massG * (1 - ref.finalWbPct / 100)
}

/** Weighed points as dry-basis moisture; readings without a mass are left out (reported by the caller). */
export function moisturePoints(weighings: Weighing[], dryMass: number): MoisturePoint[] {
  return weighings
    .filter((w) => w.massG !== null)
    .map((w) => ({
      line: w.line,
      timeH: w.timeH,
      massG: w.massG as number,
      moistureDb: ((w.massG as number) - dryMass) / dryMass,
    }))
}
