/**
 * @module weather/row-accounting
 * What became of every row: used, repaired, rejected (with its line and why) or superseded; rows out
 * of time order and repeated times logged; hours without any row counted.
 */
import type { ProblemLog } from './problem-log.ts'
import type { HourGrid } from './quality.ts'
import { type RawTable, ReportKind } from './raw-table.ts'
import type { RejectedRow, WeatherReadResult } from './result.ts'
import type { RowPlan } from './row-plan.ts'
import { QualityFlag } from './series.ts'

/** Rows placed after a later row (file order), reported once each. */
export function logOrder(raw: RawTable, plan: RowPlan, log: ProblemLog): void {
  let maxSeen = Number.NEGATIVE_INFINITY
  for (let i = 0; i < raw.rows; i++) {
    const t = plan.timeMs[i]
    if (Number.isNaN(t) || plan.duplicateOf[i] >= 0) continue
    if (t < maxSeen)
      log.add(
        raw.lines[i],
        null,
        'out-of-order',
        `time ${new Date(t).toISOString().slice(0, 16)}Z comes after a later one; placed at its time`,
      )
    else maxSeen = t
  }
}

/** Rows repeating the exact time of an earlier row: rejected, the first kept, both lines named. */
export function logDuplicates(raw: RawTable, plan: RowPlan, quality: Uint8Array, log: ProblemLog): void {
  for (let i = 0; i < raw.rows; i++) {
    const other = plan.duplicateOf[i]
    if (other < 0) continue
    const h = plan.rowHour[i]
    if (h >= 0) quality[h] |= QualityFlag.duplicateTimestamp
    const same = sameValues(raw, other, i)
    log.add(
      raw.lines[i],
      null,
      'duplicate-timestamp',
      `time ${new Date(plan.timeMs[i]).toISOString().slice(0, 16)}Z already given on line ${raw.lines[other]}${same ? ' with the same values' : ' with different values'}: row rejected, first kept`,
    )
  }
}

/** Rows read, used, repaired, rejected and superseded; rejected rows of hours without core values are logged. */
export function countRows(
  raw: RawTable,
  plan: RowPlan,
  series: { quality: Uint8Array; dryBulbC: Float64Array },
  grid: HourGrid,
  rowChanged: Uint8Array,
  rowPlaced: Uint8Array,
  log: ProblemLog,
): { rows: WeatherReadResult['rows']; rejectedRows: RejectedRow[] } {
  /** Every rejected row with its line and why (uncapped, unlike the problem list). */
  const rejectedRows: RejectedRow[] = []
  let used = 0
  let repaired = 0
  let rejected = 0
  let superseded = 0
  const loggedHour = new Uint8Array(plan.hours)
  for (let i = 0; i < raw.rows; i++) {
    const h = plan.rowHour[i]
    if (raw.reportKind?.[i] === ReportKind.summary) {
      superseded++
      continue
    }
    if (h < 0 || plan.duplicateOf[i] >= 0) {
      rejected++
      const line = raw.lines[i]
      rejectedRows.push({
        line,
        kind: h < 0 ? (log.rowKinds.get(line) ?? 'bad-timestamp') : 'duplicate-timestamp',
      })
      continue
    }
    if (plan.sampling === 'reports' && rowPlaced[i] === 0) {
      superseded++
      continue
    }
    if (series.quality[h] & QualityFlag.missingCore) {
      rejected++
      rejectedRows.push({ line: raw.lines[i], kind: 'core-missing' })
      if (loggedHour[h] === 0) {
        loggedHour[h] = 1
        const what = Number.isNaN(series.dryBulbC[h]) ? 'dry bulb' : 'humidity'
        log.add(
          raw.lines[i],
          what === 'dry bulb' ? 'dryBulb' : 'relativeHumidity',
          'core-missing',
          `no ${what} for this hour (missing and not fillable): row rejected, hour excluded`,
        )
      }
      continue
    }
    if (rowChanged[i] !== 0 || grid.changed[h]) repaired++
    else used++
  }
  return { rows: { read: raw.rows, used, repaired, rejected, superseded }, rejectedRows }
}

export function countHoursWithoutRow(plan: RowPlan): number {
  const has = new Uint8Array(plan.hours)
  for (let i = 0; i < plan.rowHour.length; i++) {
    const h = plan.rowHour[i]
    if (h >= 0) has[h] = 1
  }
  let count = 0
  for (let h = 0; h < plan.hours; h++) if (!has[h]) count++
  return count
}

export function missingCoreHours(series: { quality: Uint8Array }): Uint8Array {
  const out = new Uint8Array(series.quality.length)
  for (let s = 0; s < out.length; s++) out[s] = series.quality[s] & QualityFlag.missingCore ? 1 : 0
  return out
}

function sameValues(raw: RawTable, a: number, b: number): boolean {
  for (const col of Object.values(raw.columns)) {
    const x = col!.values[a]
    const y = col!.values[b]
    if (!(x === y || (Number.isNaN(x) && Number.isNaN(y)))) return false
  }
  return true
}
