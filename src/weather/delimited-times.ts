/**
 * @module weather/delimited-times
 * The time of every data row of delimited text, from the columns the plan chose: one timestamp column,
 * a date column with a time or an hour (and minute) column, or year, month (or day of year), day and
 * hour columns. Cells go into {@link TimestampColumns} (timestamps.ts); a row that cannot be read keeps
 * its reason for the row account, a row rejected for a stray quote is logged.
 */

import { monthDayOfYear } from '../physics/calendar.ts'
import type { BodyCells } from './delimited-body.ts'
import { parseField } from './numbers.ts'
import type { TimeField } from './options.ts'
import type { ProblemLog } from './problem-log.ts'
import { snippet } from './snippet.ts'
import { createTimestampColumns, type TimestampColumns } from './timestamp-columns.ts'
import { parseTimeOfDay, parseTimestampInto } from './timestamps.ts'
import { WeatherInputError } from './weather-input-error.ts'

/**
 * Read the time of every row of `body` from the time columns `t` (a lone `time` column is taken as the
 * timestamp, in `t` itself). Throws {@link WeatherInputError} when the plan has no time columns.
 */
export function readRowTimes(
  body: BodyCells,
  t: Partial<Record<TimeField, number>>,
  headers: string[],
  log: ProblemLog,
  warnings: string[],
): { time: TimestampColumns; timeErrors: (string | undefined)[] } {
  const { lines, cells } = body
  const n = lines.length
  const cell = (i: number, col: number): string | undefined => cells[col]?.[i]
  const time = createTimestampColumns(n)
  const timeErrors: (string | undefined)[] = new Array(n)
  if (
    t.timestamp === undefined &&
    t.date === undefined &&
    t.time === undefined &&
    (t.year === undefined || ((t.month === undefined || t.day === undefined) && t.dayOfYear === undefined))
  ) {
    throw new WeatherInputError(
      `no timestamp column found (columns: ${headers.map((h) => `'${snippet(h)}'`).join(', ')}); map it with --map timestamp=<column>, ` +
        'or --map date=<column> --map time=<column> (or hour=<column>), or --map year=… --map month=… --map day=… --map hour=…',
      ['timestamps'],
    )
  }
  if (t.timestamp === undefined && t.date === undefined && t.time !== undefined) {
    t.timestamp = t.time // a lone 'time' column holds date and time
    t.time = undefined
  }
  const scratch = new Float64Array(1)
  const quoteBroken = body.unbalancedQuote
  if (quoteBroken && quoteBroken.size > 0) {
    const first = lines[quoteBroken.keys().next().value ?? 0] // keys in row order
    warnings.push(
      `${quoteBroken.size} line${quoteBroken.size === 1 ? ' has' : 's have'} an unbalanced double quote (first: line ${first}): ` +
        'rejected, the other lines read one by one',
    )
  }
  // Clock text of the row from a time, or an hour (and minute) column.
  const clockText = (i: number): string | undefined => {
    if (t.time !== undefined) return cell(i, t.time) ?? ''
    if (t.hour !== undefined) {
      const hour = cell(i, t.hour) ?? ''
      if (t.minute === undefined) return hour
      const minute = (cell(i, t.minute) ?? '').trim()
      return `${hour.trim()}:${minute.length === 1 ? `0${minute}` : minute}`
    }
    return undefined
  }
  const useDateColumn =
    t.timestamp !== undefined || (t.date !== undefined && (t.year === undefined || t.month === undefined))
  for (let i = 0; i < n; i++) {
    if (quoteBroken?.has(i)) {
      log.add(lines[i], null, 'unbalanced-quote', quoteBroken.get(i)!)
      continue
    }
    if (useDateColumn) {
      const dateText = cell(i, t.timestamp ?? t.date!) ?? ''
      const clock = clockText(i)
      let ok = parseTimestampInto(time, i, dateText, t.timestamp === undefined ? clock : undefined)
      if (!ok && t.timestamp !== undefined && clock !== undefined)
        ok = parseTimestampInto(time, i, dateText, clock)
      if (!ok)
        timeErrors[i] =
          `cannot read the timestamp '${snippet(clock === undefined ? dateText : `${dateText} ${clock}`)}'`
      continue
    }
    const part = (index: number | undefined, fallback: number): number => {
      if (index === undefined) return fallback
      parseField(cell(i, index), false, scratch, 0)
      return scratch[0]
    }
    const year = part(t.year, Number.NaN)
    let month = part(t.month, Number.NaN)
    let day = part(t.day, Number.NaN)
    if ((t.month === undefined || t.day === undefined) && t.dayOfYear !== undefined) {
      const doy = part(t.dayOfYear, Number.NaN)
      const md = monthDayOfYear(year, doy)
      month = md[0]
      day = md[1]
    }
    const clock = clockText(i)
    const minutes = clock === undefined ? Number.NaN : parseTimeOfDay(clock)
    const integral = Number.isInteger(year) && Number.isInteger(month) && Number.isInteger(day)
    if (!integral || !(minutes >= 0 && minutes <= 1440)) {
      timeErrors[i] =
        `cannot read the date and hour from the year/month/day/hour columns (${snippet([t.year, t.month ?? t.dayOfYear, t.day, t.hour].map((k) => (k === undefined ? '' : (cell(i, k) ?? ''))).join(' '))})`
      continue
    }
    time.year[i] = year
    time.first[i] = month
    time.second[i] = day
    time.yearFirst[i] = 1
    time.minuteOfDay[i] = minutes
  }
  if (time.twoDigitYears > 0)
    warnings.push(
      `${time.twoDigitYears} dates have two-digit years: 69–99 read as 1969–1999, 00–68 as 2000–2068`,
    )
  return { time, timeErrors }
}
