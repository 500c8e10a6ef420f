/**
 * @module analysis/energy/batch-log
 * Read a dryer batch log (CSV, one batch per row; columns in ./log-columns.ts) into validated batch
 * records. Every row is accounted for: used, or rejected with its line number, the field, the value and
 * the accepted range. Energy is converted once, here, to MJ of fuel heat (heating values from
 * src/drying/fuels.ts, higher heating value basis).
 */
import { FUELS } from '../../drying/fuels.ts'
import { FUEL_IDS, type FuelId } from '../../drying/method.ts'
import {
  BATCH_LOG_COLUMNS,
  type BatchLogColumn,
  FUEL_SALE_UNITS,
  normaliseHeader,
  QUANTITY_UNITS,
  splitDelimitedLine,
} from './log-columns.ts'

/** A batch log that cannot be used at all (no header, a required column missing, no usable row). */
export class BatchLogError extends Error {
  override name = 'BatchLogError'
  constructor(
    message: string,
    readonly rejections: BatchRowRejection[] = [],
  ) {
    super(message)
  }
}

export interface BatchLogOptions {
  /** Fuel of rows that give `fuel_amount` without a `fuel` column. */
  fuel?: FuelId
}

export interface BatchRecord {
  /** 1-based line of the row in the file. */
  line: number
  batchId: string
  /** Start as written. */
  startText: string
  /** Start as local wall-clock time, encoded as if it were UTC [ms]. */
  startLocalMs: number
  /** Offset written in the timestamp [h] (Z = 0), or null for a local time without one. */
  startOffsetHours: number | null
  durationH: number
  freshMassKg: number
  finalMassKg: number | null
  initialMoistureWbPct: number | null
  finalMoistureWbPct: number | null
  /** Heat bought for the batch [MJ], fuel higher heating value or electricity. */
  energyMj: number
  /** How the energy was given, e.g. `energy_kwh` or `fuel_amount 61.2 L propane`. */
  energyBasis: string
  dryingTempC: number | null
  ambientTempC: number | null
  ambientRhPct: number | null
  ambientPressureKpa: number | null
}

export interface BatchRowRejection {
  line: number
  /** Column at fault, or `row`. */
  field: string
  value: string
  message: string
}

export interface BatchLogAccounting {
  /** Data rows (lines after the header that are neither blank nor `#` comments). */
  rowsRead: number
  rowsUsed: number
  rowsRejected: number
  /** Blank and comment lines skipped. */
  linesSkipped: number
  /** Header cells that are not batch-log columns (ignored). */
  ignoredColumns: string[]
}

export interface BatchLog {
  batches: BatchRecord[]
  accounting: BatchLogAccounting
  rejections: BatchRowRejection[]
}

const TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?\s*(Z|[+-]\d{2}:?\d{2})?$/i

/** Parse an ISO 8601 local or offset date-time; null when it is not one. */
export function parseBatchStart(text: string): { localMs: number; offsetHours: number | null } | null {
  const m = TIMESTAMP.exec(text.trim())
  if (!m) return null
  const [y, mo, d, h, mi, s] = [1, 2, 3, 4, 5, 6].map((i) => Number(m[i] ?? 0))
  const localMs = Date.UTC(y, mo - 1, d, h, mi, s)
  const check = new Date(localMs)
  if (check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== d || h > 23 || mi > 59 || s > 59) return null
  let offsetHours: number | null = null
  if (m[7]) {
    if (m[7].toUpperCase() === 'Z') offsetHours = 0
    else {
      const digits = m[7].replace(':', '')
      const sign = digits[0] === '-' ? -1 : 1
      offsetHours = sign * (Number(digits.slice(1, 3)) + Number(digits.slice(3, 5)) / 60)
    }
  }
  return { localMs, offsetHours }
}

/** Accepted range of each numeric column (inclusive unless `open`). */
const RANGES: Partial<
  Record<BatchLogColumn, { min: number; max: number; open?: 'min' | 'max' | 'both'; unit: string }>
> = {
  duration_h: { min: 0, max: 720, open: 'min', unit: 'h' },
  fresh_mass_kg: { min: 0, max: 1e7, open: 'min', unit: 'kg' },
  final_mass_kg: { min: 0, max: 1e7, open: 'min', unit: 'kg' },
  initial_moisture_wb_pct: { min: 0, max: 100, open: 'both', unit: '% w.b.' },
  final_moisture_wb_pct: { min: 0, max: 100, open: 'max', unit: '% w.b.' },
  energy_kwh: { min: 0, max: 1e9, open: 'min', unit: 'kWh' },
  fuel_amount: { min: 0, max: 1e9, open: 'min', unit: 'fuel unit' },
  drying_temp_c: { min: 0, max: 150, unit: '°C' },
  ambient_temp_c: { min: -50, max: 60, unit: '°C' },
  ambient_rh_pct: { min: 0, max: 100, open: 'min', unit: '%' },
  ambient_pressure_kpa: { min: 30, max: 110, unit: 'kPa' },
}

class RowProblem extends Error {
  constructor(
    readonly field: string,
    readonly value: string,
    message: string,
  ) {
    super(message)
  }
}

function numberCell(
  cells: Map<BatchLogColumn, string>,
  column: BatchLogColumn,
  decimalComma: boolean,
): number | null {
  const raw = cells.get(column)
  if (raw === undefined || raw === '') return null
  const text = decimalComma ? raw.replace(',', '.') : raw
  const value = Number(text)
  const range = RANGES[column]
  if (!Number.isFinite(value) || text.trim() === '') {
    throw new RowProblem(column, raw, `${column} must be a number, got '${raw}'`)
  }
  if (range) {
    const lowOk = range.open === 'min' || range.open === 'both' ? value > range.min : value >= range.min
    const highOpen = range.open === 'max' || range.open === 'both'
    const highOk = highOpen ? value < range.max : value <= range.max
    if (!lowOk || !highOk) {
      const lo = range.open === 'min' || range.open === 'both' ? '>' : '≥'
      const hi = highOpen ? '<' : '≤'
      throw new RowProblem(
        column,
        raw,
        `${column} must be ${lo} ${range.min} and ${hi} ${range.max} ${range.unit}, got ${raw}`,
      )
    }
  }
  return value
}

function energyOfRow(
  cells: Map<BatchLogColumn, string>,
  decimalComma: boolean,
  options: BatchLogOptions,
): { energyMj: number; basis: string } {
  const kwh = numberCell(cells, 'energy_kwh', decimalComma)
  const amount = numberCell(cells, 'fuel_amount', decimalComma)
  if (kwh !== null && amount !== null) {
    throw new RowProblem(
      'energy_kwh',
      cells.get('energy_kwh') ?? '',
      'give either energy_kwh or fuel_amount, not both',
    )
  }
  if (kwh !== null) return { energyMj: kwh * 3.6, basis: 'energy_kwh' }
  if (amount === null) {
    throw new RowProblem(
      'energy_kwh',
      '',
      'the batch needs its energy: energy_kwh, or fuel_amount with fuel_unit',
    )
  }
  const unitText = cells.get('fuel_unit') ?? ''
  const unit = QUANTITY_UNITS[unitText.trim().toLowerCase()]
  if (!unit) {
    throw new RowProblem(
      'fuel_unit',
      unitText,
      `fuel_unit must be one of ${Object.keys(QUANTITY_UNITS).join(', ')}, got '${unitText}'`,
    )
  }
  if (unit.dimension === 'energy')
    return { energyMj: amount * unit.sizeInBase, basis: `fuel_amount ${amount} ${unitText}` }
  const fuelText = (cells.get('fuel') ?? '').trim().toLowerCase()
  const fuelId = (fuelText || options.fuel) as FuelId | undefined
  if (!fuelId || !(FUEL_IDS as readonly string[]).includes(fuelId)) {
    throw new RowProblem(
      'fuel',
      fuelText,
      `fuel must be one of ${FUEL_IDS.join(', ')} (column or --fuel option), got '${fuelText || '(none)'}'`,
    )
  }
  const fuel = FUELS[fuelId]
  const sale = FUEL_SALE_UNITS[fuel.unit]
  if (sale.dimension !== unit.dimension) {
    throw new RowProblem(
      'fuel_unit',
      unitText,
      `${fuel.name} is measured by ${sale.dimension} (${fuel.unit}), got '${unitText}'`,
    )
  }
  const saleUnits = (amount * unit.sizeInBase) / sale.sizeInBase
  return {
    energyMj: saleUnits * fuel.heatingValueMjPerUnit,
    basis: `fuel_amount ${amount} ${unitText} ${fuelId}`,
  }
}

function recordOfRow(
  line: number,
  cells: Map<BatchLogColumn, string>,
  decimalComma: boolean,
  options: BatchLogOptions,
): BatchRecord {
  const startText = cells.get('start') ?? ''
  const start = parseBatchStart(startText)
  if (!start)
    throw new RowProblem(
      'start',
      startText,
      `start must be an ISO 8601 date-time such as 2026-09-03T07:30, got '${startText}'`,
    )
  const num = (c: BatchLogColumn) => numberCell(cells, c, decimalComma)
  const durationH = num('duration_h')
  if (durationH === null) throw new RowProblem('duration_h', '', 'duration_h is required (> 0 h)')
  const freshMassKg = num('fresh_mass_kg')
  if (freshMassKg === null) throw new RowProblem('fresh_mass_kg', '', 'fresh_mass_kg is required (> 0 kg)')
  const finalMassKg = num('final_mass_kg')
  const initialMoistureWbPct = num('initial_moisture_wb_pct')
  const finalMoistureWbPct = num('final_moisture_wb_pct')
  if (finalMassKg !== null && finalMassKg >= freshMassKg) {
    throw new RowProblem(
      'final_mass_kg',
      String(finalMassKg),
      `final_mass_kg must be below fresh_mass_kg (${freshMassKg}), got ${finalMassKg}`,
    )
  }
  if (finalMassKg === null && (initialMoistureWbPct === null || finalMoistureWbPct === null)) {
    throw new RowProblem(
      'final_mass_kg',
      '',
      'give final_mass_kg, or both initial_moisture_wb_pct and final_moisture_wb_pct',
    )
  }
  if (
    initialMoistureWbPct !== null &&
    finalMoistureWbPct !== null &&
    finalMoistureWbPct >= initialMoistureWbPct
  ) {
    throw new RowProblem(
      'final_moisture_wb_pct',
      String(finalMoistureWbPct),
      `final_moisture_wb_pct must be below initial_moisture_wb_pct (${initialMoistureWbPct}), got ${finalMoistureWbPct}`,
    )
  }
  const { energyMj, basis } = energyOfRow(cells, decimalComma, options)
  const ambientTempC = num('ambient_temp_c')
  const ambientRhPct = num('ambient_rh_pct')
  if ((ambientTempC === null) !== (ambientRhPct === null)) {
    const missing = ambientTempC === null ? 'ambient_temp_c' : 'ambient_rh_pct'
    throw new RowProblem(
      missing,
      '',
      'give ambient_temp_c and ambient_rh_pct together (or neither, to join them from a weather file)',
    )
  }
  return {
    line,
    batchId: cells.get('batch_id') || `line ${line}`,
    startText,
    startLocalMs: start.localMs,
    startOffsetHours: start.offsetHours,
    durationH,
    freshMassKg,
    finalMassKg,
    initialMoistureWbPct,
    finalMoistureWbPct,
    energyMj,
    energyBasis: basis,
    dryingTempC: num('drying_temp_c'),
    ambientTempC,
    ambientRhPct,
    ambientPressureKpa: num('ambient_pressure_kpa'),
  }
}

/**
 * Read a batch log. Throws {@link BatchLogError} when the file has no header with `start`, `duration_h`
 * and `fresh_mass_kg`, or no usable row; bad rows are rejected one by one with their line number.
 */
export function readBatchLog(text: string, options: BatchLogOptions = {}): BatchLog {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/)
  const headerIndex = lines.findIndex((l) => l.trim() !== '' && !l.trimStart().startsWith('#'))
  if (headerIndex < 0)
    throw new BatchLogError('the batch log is empty: expected a header row and one row per batch')
  const headerLine = lines[headerIndex]
  const delimiter =
    headerLine.includes(';') && !headerLine.includes(',')
      ? ';'
      : headerLine.includes('\t') && !headerLine.includes(',')
        ? '\t'
        : ','
  const decimalComma = delimiter !== ','
  const header = splitDelimitedLine(headerLine, delimiter).map(normaliseHeader)
  const known = new Set(Object.keys(BATCH_LOG_COLUMNS))
  const missing = (['start', 'duration_h', 'fresh_mass_kg'] as const).filter((c) => !header.includes(c))
  if (missing.length > 0) {
    throw new BatchLogError(
      `line ${headerIndex + 1}: the header lacks ${missing.join(', ')}; a batch log needs columns start, duration_h, ` +
        `fresh_mass_kg, final_mass_kg (or initial_moisture_wb_pct and final_moisture_wb_pct) and energy_kwh (or fuel_amount and fuel_unit)`,
    )
  }
  const hasEnergy = header.includes('energy_kwh') || header.includes('fuel_amount')
  if (!hasEnergy)
    throw new BatchLogError(
      `line ${headerIndex + 1}: the header lacks energy_kwh or fuel_amount (with fuel_unit)`,
    )
  const ignoredColumns = header.filter((h) => h !== '' && !known.has(h))
  const batches: BatchRecord[] = []
  const rejections: BatchRowRejection[] = []
  let rowsRead = 0
  let linesSkipped = 0
  for (let i = headerIndex + 1; i < lines.length; i++) {
    const raw = lines[i]
    if (raw.trim() === '' || raw.trimStart().startsWith('#')) {
      if (i < lines.length - 1 || raw.trim() !== '') linesSkipped++
      continue
    }
    rowsRead++
    const line = i + 1
    const cellsList = splitDelimitedLine(raw, delimiter)
    if (cellsList.length > header.length) {
      rejections.push({
        line,
        field: 'row',
        value: raw.slice(0, 80),
        message: `row has ${cellsList.length} cells, the header ${header.length}`,
      })
      continue
    }
    const cells = new Map<BatchLogColumn, string>()
    header.forEach((h, j) => {
      if (known.has(h)) cells.set(h as BatchLogColumn, cellsList[j] ?? '')
    })
    try {
      batches.push(recordOfRow(line, cells, decimalComma, options))
    } catch (e) {
      if (!(e instanceof RowProblem)) throw e
      rejections.push({ line, field: e.field, value: e.value, message: `line ${line}: ${e.message}` })
    }
  }
  if (batches.length === 0) {
    const first = rejections[0]
    throw new BatchLogError(
      rowsRead === 0
        ? 'the batch log has a header but no batch rows'
        : `no usable batch in ${rowsRead} row${rowsRead === 1 ? '' : 's'}; first problem: ${first.message}`,
      rejections,
    )
  }
  return {
    batches,
    accounting: {
      rowsRead,
      rowsUsed: batches.length,
      rowsRejected: rejections.length,
      linesSkipped,
      ignoredColumns,
    },
    rejections,
  }
}
