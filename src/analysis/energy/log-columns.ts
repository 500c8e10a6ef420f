/**
 * @module analysis/energy/log-columns
 * The columns of a dryer batch log (a dryhours format: one row per batch, a header row naming the columns,
 * the unit in each name), header normalisation, and the quantity units accepted for fuel.
 */

/** Column names after normalisation (lower case, spaces and hyphens as `_`), and what each holds. */
export const BATCH_LOG_COLUMNS = {
  batch_id: 'batch label (optional; the line number otherwise)',
  start:
    'start date-time, ISO 8601 (2026-09-03T07:30 or 2026-09-03 07:30, local time unless it ends in Z or ±hh:mm)',
  duration_h: 'burner/fan run time of the batch [h]',
  fresh_mass_kg: 'mass loaded [kg]',
  final_mass_kg: 'mass unloaded [kg] (or give both moisture columns)',
  initial_moisture_wb_pct: 'moisture at loading [% wet basis]',
  final_moisture_wb_pct: 'moisture at unloading [% wet basis]',
  energy_kwh: 'heat bought for the batch [kWh] (fuel heat or electricity); or fuel_amount with fuel_unit',
  fuel_amount: 'fuel used, in fuel_unit',
  fuel_unit: 'L, gal (US), m3, ft3, kg, lb, t, kWh, MJ or GJ',
  fuel: 'fuel id (propane, natural-gas, heating-oil, wood-pellets, electricity); else the --fuel option',
  drying_temp_c: 'drying-air temperature [°C] (latent heat is taken at it); else the option',
  ambient_temp_c: 'mean outside air temperature over the batch [°C]; else from the weather file',
  ambient_rh_pct: 'mean outside relative humidity over the batch [%]; else from the weather file',
  ambient_pressure_kpa: 'station pressure [kPa]; else from the site elevation or sea level',
} as const

export type BatchLogColumn = keyof typeof BATCH_LOG_COLUMNS

/** Normalise a header cell: trim, lower case, runs of spaces/hyphens/dots → `_`, `%` → `pct`. */
export function normaliseHeader(cell: string): string {
  const snake = cell
    .trim()
    .toLowerCase()
    .replace(/%/g, 'pct')
    .replace(/[\s\-.]+/g, '_')
  // Leading and trailing underscores trimmed by index: a pattern like /_+$/ would backtrack through
  // every run of underscores (quadratic time on a hostile header).
  let from = 0
  let to = snake.length
  while (from < to && snake.charCodeAt(from) === 95) from++
  while (to > from && snake.charCodeAt(to - 1) === 95) to--
  return snake.slice(from, to)
}

/** What a fuel quantity unit measures, and its size in the base unit of that dimension (L, kg or MJ). */
export interface QuantityUnit {
  dimension: 'volume' | 'mass' | 'energy'
  /** Size in L (volume), kg (mass) or MJ (energy). */
  sizeInBase: number
}

/** Unit tokens accepted in `fuel_unit` (lower-cased). Conversion factors: NIST SP 811 (2008), appendix B. */
export const QUANTITY_UNITS: Record<string, QuantityUnit> = {
  l: { dimension: 'volume', sizeInBase: 1 },
  litre: { dimension: 'volume', sizeInBase: 1 },
  liter: { dimension: 'volume', sizeInBase: 1 },
  /** US gallon = 3.785411784 L (NIST SP 811). */
  gal: { dimension: 'volume', sizeInBase: 3.785411784 },
  m3: { dimension: 'volume', sizeInBase: 1000 },
  'm³': { dimension: 'volume', sizeInBase: 1000 },
  /** ft³ = 28.316846592 L (NIST SP 811). */
  ft3: { dimension: 'volume', sizeInBase: 28.316846592 },
  kg: { dimension: 'mass', sizeInBase: 1 },
  /** Pound (avoirdupois) = 0.45359237 kg (NIST SP 811). */
  lb: { dimension: 'mass', sizeInBase: 0.45359237 },
  t: { dimension: 'mass', sizeInBase: 1000 },
  /** kWh = 3.6 MJ (definition). */
  kwh: { dimension: 'energy', sizeInBase: 3.6 },
  mj: { dimension: 'energy', sizeInBase: 1 },
  gj: { dimension: 'energy', sizeInBase: 1000 },
}

/** The sale units of the fuels table, in the same base units. */
export const FUEL_SALE_UNITS: Record<'L' | 'm³' | 'kg' | 'kWh', QuantityUnit> = {
  L: QUANTITY_UNITS.l,
  'm³': QUANTITY_UNITS.m3,
  kg: QUANTITY_UNITS.kg,
  kWh: QUANTITY_UNITS.kwh,
}

/**
 * Split one delimited line into cells (RFC 4180 quoting: `"a,b"` and `""` inside quotes). Quoted fields
 * may not span lines in a batch log.
 */
export function splitDelimitedLine(line: string, delimiter: string): string[] {
  const cells: string[] = []
  let cell = ''
  let quoted = false
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"'
        i++
      } else if (ch === '"') quoted = false
      else cell += ch
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true
      cell = ''
    } else if (ch === delimiter) {
      cells.push(cell)
      cell = ''
    } else cell += ch
  }
  cells.push(cell)
  return cells.map((c) => c.trim())
}
