/**
 * @module weather/timestamps
 * Timestamp text to wall-clock components: ISO 8601 with or without an offset, `YYYY-MM-DD HH:MM`,
 * `YYYY/MM/DD HH:MM`, `MM/DD/YYYY HH:MM` and `DD/MM/YYYY HH:MM` (order declared or detected), a
 * separate time column (`HH:MM`, `H:MM`, `HHMM`, `HH`), 12-hour clocks with AM/PM, and 24:00 for
 * midnight at the end of a day. Components go into columns so the date order can be decided after
 * every row has been seen.
 */

/** Parsed components of all rows; NaN where a row's timestamp could not be read. */
export interface TimestampColumns {
  year: Float64Array
  /** First date number of a slash date whose year is last (month or day, per the date order). */
  first: Float64Array
  /** Second date number. */
  second: Float64Array
  /** Minutes after the day's midnight, 0…1440 (1440 = 24:00). */
  minuteOfDay: Float64Array
  /** Offset written in the text [min east of UTC], NaN when none. */
  offsetMin: Float64Array
  /** 1 when the row's date was year-first (first = month, second = day regardless of order). */
  yearFirst: Uint8Array
}

export function createTimestampColumns(n: number): TimestampColumns {
  return {
    year: new Float64Array(n).fill(Number.NaN),
    first: new Float64Array(n).fill(Number.NaN),
    second: new Float64Array(n).fill(Number.NaN),
    minuteOfDay: new Float64Array(n).fill(Number.NaN),
    offsetMin: new Float64Array(n).fill(Number.NaN),
    yearFirst: new Uint8Array(n),
  }
}

const DATE_TIME =
  /^\s*(\d{1,4})[-/.](\d{1,2})[-/.](\d{1,4})(?:[T\s]\s*(\d{1,2})(?::?(\d{2}))?(?::(\d{2})(?:[.,]\d+)?)?\s*([aApP][mM])?)?\s*(Z|UTC|GMT|[+-]\d{2}(?::?\d{2})?)?\s*$/

const TIME_ONLY = /^\s*(\d{1,2})(?::?(\d{2}))?(?::(\d{2}))?\s*([aApP][mM])?\s*$/

/** Minutes after midnight for hour, minute and an optional am/pm marker; NaN when out of range. */
function minutesOf(h: number, m: number, ampm: string | undefined): number {
  let hour = h
  if (ampm !== undefined) {
    if (hour < 1 || hour > 12) return Number.NaN
    const pm = ampm[0] === 'p' || ampm[0] === 'P'
    hour = (hour % 12) + (pm ? 12 : 0)
  }
  if (!(m >= 0 && m < 60) || !(hour >= 0 && hour <= 24) || (hour === 24 && m !== 0)) return Number.NaN
  return hour * 60 + m
}

function offsetMinutes(text: string | undefined): number {
  if (text === undefined) return Number.NaN
  if (text === 'Z' || text === 'UTC' || text === 'GMT') return 0
  const sign = text[0] === '-' ? -1 : 1
  const digits = text.slice(1).replace(':', '')
  const h = Number(digits.slice(0, 2))
  const m = digits.length > 2 ? Number(digits.slice(2, 4)) : 0
  if (h > 14 || m >= 60) return Number.NaN
  return sign * (h * 60 + m)
}

/**
 * Parse a date-time (or date-only, when `timeText` is given) into row `i` of `out`. `timeText`
 * comes from a separate time column. Returns false when the text is not a timestamp.
 */
export function parseTimestampInto(
  out: TimestampColumns,
  i: number,
  text: string,
  timeText?: string,
): boolean {
  if (timeText === undefined && parseIsoFast(out, i, text)) return true
  const m = DATE_TIME.exec(text)
  if (m === null) return false
  const a = Number(m[1])
  const b = Number(m[2])
  const c = Number(m[3])
  if (m[1].length === 4) {
    out.year[i] = a
    out.first[i] = b
    out.second[i] = c
    out.yearFirst[i] = 1
  } else if (m[3].length === 4) {
    out.year[i] = c
    out.first[i] = a
    out.second[i] = b
  } else {
    return false
  }
  let minutes: number
  if (timeText !== undefined) {
    if (m[4] !== undefined) return false
    minutes = parseTimeOfDay(timeText)
  } else if (m[4] === undefined) {
    minutes = Number.NaN
  } else {
    minutes = minutesOf(Number(m[4]), m[5] === undefined ? 0 : Number(m[5]), m[7])
  }
  if (!Number.isFinite(minutes)) return false
  out.minuteOfDay[i] = minutes
  out.offsetMin[i] = offsetMinutes(m[8])
  return true
}

function digit(text: string, k: number): number {
  const c = text.charCodeAt(k) - 48
  return c >= 0 && c <= 9 ? c : Number.NaN
}

/**
 * The common shapes `YYYY-MM-DDTHH:MM`, `YYYY-MM-DD HH:MM`, optionally `:SS`, then nothing or `Z`,
 * read by character codes (a 30-year file has 263,000 of them). Returns false for anything else,
 * which the general pattern then reads.
 */
function parseIsoFast(out: TimestampColumns, i: number, text: string): boolean {
  const n = text.length
  if (n < 16 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45 || text.charCodeAt(13) !== 58)
    return false
  const sep = text.charCodeAt(10)
  if (sep !== 84 && sep !== 32) return false
  let k = 16
  if (n >= 19 && text.charCodeAt(16) === 58) {
    if (Number.isNaN(digit(text, 17) + digit(text, 18))) return false
    k = 19
  }
  let offset = Number.NaN
  if (k === n) offset = Number.NaN
  else if (k === n - 1 && text.charCodeAt(k) === 90) offset = 0
  else return false
  const year = digit(text, 0) * 1000 + digit(text, 1) * 100 + digit(text, 2) * 10 + digit(text, 3)
  const month = digit(text, 5) * 10 + digit(text, 6)
  const day = digit(text, 8) * 10 + digit(text, 9)
  const hour = digit(text, 11) * 10 + digit(text, 12)
  const minute = digit(text, 14) * 10 + digit(text, 15)
  const minutes = minutesOf(hour, minute, undefined)
  if (Number.isNaN(year + month + day) || Number.isNaN(minutes)) return false
  out.year[i] = year
  out.first[i] = month
  out.second[i] = day
  out.yearFirst[i] = 1
  out.minuteOfDay[i] = minutes
  out.offsetMin[i] = offset
  return true
}

/** Minutes after midnight from `HH:MM`, `H:MM`, `HHMM` (4 digits) or `HH`; NaN when not a time. */
export function parseTimeOfDay(text: string): number {
  const t = TIME_ONLY.exec(text)
  if (t === null) return Number.NaN
  if (t[2] === undefined && t[1].length > 2) return Number.NaN
  if (t[2] === undefined && /^\s*\d{3,4}\s*$/.test(text)) {
    const v = Number(text)
    return minutesOf(Math.floor(v / 100), v % 100, undefined)
  }
  return minutesOf(Number(t[1]), t[2] === undefined ? 0 : Number(t[2]), t[4])
}

export type DateOrder = 'ymd' | 'mdy' | 'dmy'

/**
 * The order of slash dates with the year last: `mdy` if some first number exceeds 12 is impossible,
 * `dmy` if some first number exceeds 12; null when every date fits both (ambiguous) or none has the
 * year last. Throws RangeError when both a first and a second number exceed 12 (not one order).
 */
export function detectDateOrder(ts: TimestampColumns): DateOrder | 'ambiguous' | null {
  let anyYearLast = false
  let firstOver12 = false
  let secondOver12 = false
  for (let i = 0; i < ts.year.length; i++) {
    if (ts.yearFirst[i] === 1 || Number.isNaN(ts.year[i])) continue
    anyYearLast = true
    if (ts.first[i] > 12) firstOver12 = true
    if (ts.second[i] > 12) secondOver12 = true
  }
  if (!anyYearLast) return null
  if (firstOver12 && secondOver12) {
    throw new RangeError(
      'dates mix day-first and month-first order (both first and second numbers exceed 12)',
    )
  }
  if (firstOver12) return 'dmy'
  if (secondOver12) return 'mdy'
  return 'ambiguous'
}

/** Days from 1970-01-01 to the civil date (proleptic Gregorian); Hinnant (2013), "chrono-Compatible Low-Level Date Algorithms", days_from_civil. */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year
  const era = Math.floor(y / 400)
  const yoe = y - era * 400
  const mp = (month + 9) % 12
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy
  return era * 146097 + doe - 719468
}

/** Days in a month of the Gregorian calendar. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31
}

/**
 * Wall-clock milliseconds (the local date and time read as if it were UTC) of row `i`, using
 * `order` for year-last dates; NaN when the date is not a calendar date (e.g. 30 February).
 */
export function wallClockMs(ts: TimestampColumns, i: number, order: 'mdy' | 'dmy', year: number): number {
  const yearFirst = ts.yearFirst[i] === 1
  const month = yearFirst || order === 'mdy' ? ts.first[i] : ts.second[i]
  const day = yearFirst || order === 'mdy' ? ts.second[i] : ts.first[i]
  if (!(month >= 1 && month <= 12) || !(day >= 1) || day > daysInMonth(year, month)) return Number.NaN
  if (!(year >= 1800 && year <= 2200)) return Number.NaN
  return daysFromCivil(year, month, day) * 86_400_000 + ts.minuteOfDay[i] * 60_000
}

/** Month (1–12) and day of row `i` under `order`. */
export function monthDayOf(ts: TimestampColumns, i: number, order: 'mdy' | 'dmy'): [number, number] {
  const yearFirst = ts.yearFirst[i] === 1
  return yearFirst || order === 'mdy' ? [ts.first[i], ts.second[i]] : [ts.second[i], ts.first[i]]
}
