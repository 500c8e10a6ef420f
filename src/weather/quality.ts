/**
 * @module weather/quality
 * Quality control of the hour columns in series units: range, step (spike), stuck-sensor,
 * dew point / wet bulb above dry bulb, RH above 100 %, negative irradiance. A failed value becomes
 * NaN (or is clamped, for small overshoots) and is logged with the line of its row.
 */
import type { ProblemKind, ProblemLog } from './problem-log.ts'
import { QualityFlag } from './series.ts'
import type { WeatherVariable } from './units.ts'

/** The hour grid the checks work on. */
export interface HourGrid {
  hours: number
  /** Row index placed in each hour, −1 when none. */
  slotRow: Int32Array
  /** 1-based line per row. */
  lines: Int32Array
  /** Per-hour QualityFlag bits. */
  quality: Uint8Array
  /** 1 where a value of the hour's row was changed (rejected, clamped or filled). */
  changed: Uint8Array
}

/**
 * Valid ranges in series units. Dry bulb, dew point, RH, pressure and wind: EPW data dictionary
 * field ranges (EnergyPlus Auxiliary Programs, "Data Field Descriptions"), as summarised in the
 * project's weather-file reference §3. Irradiance: 1500 W/m² as an hourly mean is above the solar
 * constant (1361 W/m², Kopp & Lean 2011) with margin. Rain: 305 mm in one hour exceeds the world
 * record (WMO archive, about 305 mm in 42 min, Holt, Missouri 1947; from memory). Cloud: 0–100 %.
 */
export const VALID_RANGE: Record<WeatherVariable, [number, number]> = {
  dryBulb: [-70, 70],
  dewPoint: [-70, 70],
  wetBulb: [-70, 70],
  relativeHumidity: [0, 110],
  pressure: [31, 120],
  wind: [0, 40],
  /** Negative irradiance down to −15 W/m² is set to zero (sensor offset at night). Common practice, no source. */
  ghi: [-15, 1500],
  rain: [0, 305],
  cloudCover: [0, 100],
}

/**
 * Largest credible change from one hour to the next before a value that jumps away and back is
 * called a spike. Common practice, no source (values chosen well above ordinary weather: a cold
 * front rarely drops the temperature 10 °C within an hour).
 */
export const SPIKE_LIMIT: Partial<Record<WeatherVariable, number>> = {
  dryBulb: 10,
  dewPoint: 10,
  wetBulb: 10,
  relativeHumidity: 60,
  pressure: 1.5,
  wind: 20,
}

/**
 * Number of consecutive identical readings after which a sensor is called stuck; the whole run is
 * rejected. Calm wind (0), RH at or above {@link WET_RH_PLATEAU_PCT} (fog, drizzle, rain) and zero
 * rain or irradiance are ordinary and never count. Common practice, no source.
 */
export const STUCK_RUN_HOURS: Partial<Record<WeatherVariable, number>> = {
  dryBulb: 12,
  dewPoint: 12,
  wetBulb: 12,
  relativeHumidity: 12,
  pressure: 24,
  wind: 12,
}

/**
 * RH at or above this [%] may sit unchanged for many hours in fog, drizzle or rain (sensors plateau
 * near saturation, and many exports round RH to whole percent), so such runs are not called stuck.
 * Common practice, no source.
 */
export const WET_RH_PLATEAU_PCT = 90

/** RH up to this value [%] is clamped to 100 %, above it rejected. Common practice, no source (EnergyPlus clamps and warns past 101 %). */
export const RH_CLAMP_MAX_PCT = 103
/** Dew point or wet bulb up to this far [K] above dry bulb is set to the dry bulb, beyond rejected. Common practice, no source. */
export const HUMIDITY_ABOVE_DRY_BULB_TOLERANCE_K = 0.5

function reject(
  grid: HourGrid,
  log: ProblemLog,
  s: number,
  variable: WeatherVariable,
  kind: ProblemKind,
  message: string,
): void {
  grid.quality[s] |= QualityFlag.rejectedValue
  const row = grid.slotRow[s]
  if (row >= 0) grid.changed[s] = 1
  log.add(row >= 0 ? grid.lines[row] : null, variable, kind, message)
}

export function rangeCheck(
  grid: HourGrid,
  log: ProblemLog,
  variable: WeatherVariable,
  values: Float64Array,
  unit: string,
): void {
  const [lo, hi] = VALID_RANGE[variable]
  for (let s = 0; s < values.length; s++) {
    const v = values[s]
    if (Number.isNaN(v)) continue
    if (variable === 'relativeHumidity' && v > 100) {
      if (v <= RH_CLAMP_MAX_PCT) {
        values[s] = 100
        if (grid.slotRow[s] >= 0) grid.changed[s] = 1
        log.add(lineOf(grid, s), variable, 'rh-above-100', `relative humidity ${v} % set to 100 %`)
      } else {
        values[s] = Number.NaN
        reject(
          grid,
          log,
          s,
          variable,
          'rh-above-100',
          `relative humidity ${v} % is above 100 % (accepted up to ${RH_CLAMP_MAX_PCT} %, clamped): rejected`,
        )
      }
      continue
    }
    if (variable === 'ghi' && v < 0) {
      values[s] = v >= lo ? 0 : Number.NaN
      if (v >= lo) {
        if (grid.slotRow[s] >= 0) grid.changed[s] = 1
        log.add(lineOf(grid, s), variable, 'negative-irradiance', `irradiance ${round(v)} W/m² set to 0`)
      } else
        reject(
          grid,
          log,
          s,
          variable,
          'negative-irradiance',
          `irradiance ${round(v)} W/m² is below ${lo} W/m²: rejected`,
        )
      continue
    }
    if (v < lo || v > hi) {
      values[s] = Number.NaN
      reject(
        grid,
        log,
        s,
        variable,
        'out-of-range',
        `${variable} ${round(v)} ${unit} is outside ${lo}…${hi} ${unit}: rejected`,
      )
    }
  }
}

/**
 * The range check of {@link rangeCheck} on readings before they are combined into hours: each value
 * outside its range is set to NaN (RH up to {@link RH_CLAMP_MAX_PCT} clamped to 100 %, irradiance
 * down to −15 W/m² set to 0) and logged with its own line. `rowChanged[i]` is set to 1 for a changed
 * reading and 2 for a rejected one.
 */
export function rangeCheckReadings(
  lines: Int32Array,
  log: ProblemLog,
  variable: WeatherVariable,
  values: Float64Array,
  unit: string,
  rowChanged: Uint8Array,
): number {
  const [lo, hi] = VALID_RANGE[variable]
  // RH is judged against 100 % (clamped up to RH_CLAMP_MAX_PCT), irradiance below 0 is set to 0
  const top = variable === 'relativeHumidity' ? 100 : hi
  const bottom = variable === 'ghi' ? 0 : lo
  let rejected = 0
  for (let i = 0; i < values.length; i++) {
    const v = values[i]
    if (!(v < bottom || v > top)) continue // in range, or NaN
    rejected += judgeReading(lines, log, variable, values, unit, rowChanged, i, lo, hi)
  }
  return rejected
}

/** One reading outside its range: clamped, set to 0, or rejected (logged with its line). Returns 1 when rejected. */
function judgeReading(
  lines: Int32Array,
  log: ProblemLog,
  variable: WeatherVariable,
  values: Float64Array,
  unit: string,
  rowChanged: Uint8Array,
  i: number,
  lo: number,
  hi: number,
): number {
  const v = values[i]
  if (variable === 'relativeHumidity' && v > 100) {
    if (v <= RH_CLAMP_MAX_PCT) {
      values[i] = 100
      if (rowChanged[i] === 0) rowChanged[i] = 1
      log.add(lines[i], variable, 'rh-above-100', `relative humidity ${v} % set to 100 %`)
      return 0
    }
    values[i] = Number.NaN
    rowChanged[i] = 2
    log.add(
      lines[i],
      variable,
      'rh-above-100',
      `relative humidity ${v} % is above 100 % (accepted up to ${RH_CLAMP_MAX_PCT} %, clamped): rejected`,
    )
    return 1
  }
  if (variable === 'ghi' && v < 0 && v >= lo) {
    values[i] = 0
    if (rowChanged[i] === 0) rowChanged[i] = 1
    log.add(lines[i], variable, 'negative-irradiance', `irradiance ${round(v)} W/m² set to 0`)
    return 0
  }
  if (!(v < lo || v > hi)) return 0
  values[i] = Number.NaN
  rowChanged[i] = 2
  log.add(
    lines[i],
    variable,
    'out-of-range',
    `${variable} ${round(v)} ${unit} is outside ${lo}…${hi} ${unit}: rejected`,
  )
  return 1
}

function lineOf(grid: HourGrid, s: number): number | null {
  const row = grid.slotRow[s]
  return row >= 0 ? grid.lines[row] : null
}

function round(v: number): number {
  return Math.round(v * 100) / 100
}

/** Reject single-hour spikes: a value that differs from both neighbours by more than the limit, in opposite directions. */
export function spikeCheck(
  grid: HourGrid,
  log: ProblemLog,
  variable: WeatherVariable,
  values: Float64Array,
  unit: string,
): void {
  const limit = SPIKE_LIMIT[variable]
  if (limit === undefined) return
  const spikes: number[] = []
  for (let s = 1; s < values.length - 1; s++) {
    const a = values[s - 1]
    const v = values[s]
    const b = values[s + 1]
    if (Number.isNaN(a) || Number.isNaN(v) || Number.isNaN(b)) continue
    const up = v - a
    const down = v - b
    if (Math.abs(up) > limit && Math.abs(down) > limit && Math.sign(up) === Math.sign(down)) spikes.push(s)
  }
  for (const s of spikes) {
    const v = values[s]
    values[s] = Number.NaN
    reject(
      grid,
      log,
      s,
      variable,
      'step',
      `${variable} ${round(v)} ${unit} jumps more than ${limit} ${unit} from both neighbouring hours: rejected as a spike`,
    )
  }
}

/**
 * Reject runs of identical readings at least {@link STUCK_RUN_HOURS} long. Hours marked in `exempt`
 * (values the file itself says were supplied, not measured) end a run and are never judged.
 */
export function stuckCheck(
  grid: HourGrid,
  log: ProblemLog,
  variable: WeatherVariable,
  values: Float64Array,
  unit: string,
  exempt?: Uint8Array,
): void {
  const minRun = STUCK_RUN_HOURS[variable]
  if (minRun === undefined) return
  const isWind = variable === 'wind'
  const isRh = variable === 'relativeHumidity'
  const free = exempt ?? NO_EXEMPTIONS
  const checkExempt = exempt !== undefined
  let start = 0
  const n = values.length
  for (let s = 1; s <= n; s++) {
    if (s < n && values[s] === values[start] && !(checkExempt && (free[s] === 1 || free[start] === 1)))
      continue
    const length = s - start
    if (length >= minRun) {
      const v = values[start]
      const ordinary =
        Number.isNaN(v) ||
        (checkExempt && free[start] === 1) ||
        (isWind && v === 0) ||
        (isRh && v >= WET_RH_PLATEAU_PCT)
      if (!ordinary) {
        for (let k = start; k < s; k++) {
          values[k] = Number.NaN
          reject(
            grid,
            log,
            k,
            variable,
            'stuck-sensor',
            `${variable} reads ${round(v)} ${unit} for ${length} hours in a row: stuck sensor, rejected`,
          )
        }
      }
    }
    start = s
  }
}

const NO_EXEMPTIONS = new Uint8Array(0)

/** Dew point or wet bulb above the dry bulb: small excess set to the dry bulb, larger rejected. */
export function humidityBelowDryBulbCheck(
  grid: HourGrid,
  log: ProblemLog,
  variable: 'dewPoint' | 'wetBulb',
  values: Float64Array,
  dryBulbC: Float64Array,
): void {
  const kind: ProblemKind = variable === 'dewPoint' ? 'dew-point-above-dry-bulb' : 'wet-bulb-above-dry-bulb'
  for (let s = 0; s < values.length; s++) {
    const v = values[s]
    const t = dryBulbC[s]
    if (!(v > t)) continue
    if (v - t <= HUMIDITY_ABOVE_DRY_BULB_TOLERANCE_K) {
      values[s] = t
      if (grid.slotRow[s] >= 0) grid.changed[s] = 1
      log.add(
        lineOf(grid, s),
        variable,
        kind,
        `${variable} ${round(v)} °C above dry bulb ${round(t)} °C: set to the dry bulb`,
      )
    } else {
      values[s] = Number.NaN
      reject(
        grid,
        log,
        s,
        variable,
        kind,
        `${variable} ${round(v)} °C is above the dry bulb ${round(t)} °C: rejected`,
      )
    }
  }
}
