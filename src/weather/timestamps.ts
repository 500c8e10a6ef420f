/**
 * @module weather/timestamps
 * Timestamp text to wall-clock components, read by a hand-written scanner in time linear in the
 * text (no regular expression): ISO 8601 with or without an offset (`Z`, `+01:00`, `-0500`, `UTC`),
 * `YYYY-MM-DD HH:MM`, `YYYY/MM/DD HH:MM`, `MM/DD/YYYY HH:MM` and `DD/MM/YYYY HH:MM` (order declared or
 * detected), `DD.MM.YYYY` (always day first), two-digit years (`1/2/21`), month words (`01-Jan-2021`,
 * `3 mars 2021` in six languages), compact dates (`20210101`, `2021010113`, `202101011330`,
 * `20090101:0010`, `2021010113:26`), a separate time or hour column (`HH:MM`, `H:MM`, `HHMM`, `HH`, `0100`–`2400`),
 * 12-hour clocks (`1:00 PM`, `1:00a`, `12:30p`, `p.m.`), and 24:00 for midnight at the end of a day.
 * Components go into {@link TimestampColumns} (timestamp-columns.ts) so the date order can be decided
 * after every row has been seen.
 */
import { monthOfWord } from './month-words.ts'
import {
  COLON,
  COMMA,
  Cursor,
  DASH,
  DOT,
  isDigit,
  isLetter,
  MINUS_SIGN,
  PLUS,
  SLASH,
  SPACE,
} from './text-cursor.ts'
import type { TimestampColumns } from './timestamp-columns.ts'

/**
 * Two-digit years: 69–99 are 1969–1999, 00–68 are 2000–2068 (The Open Group, Single UNIX
 * Specification v2 (1997), strptime() `%y`).
 */
export const TWO_DIGIT_YEAR_PIVOT = 69

/** Calendar part of a timestamp. */
interface DatePart {
  year: number
  first: number
  second: number
  /** first = month and second = day whatever the date order. */
  ordered: boolean
  twoDigitYear: boolean
  /** Minutes of day carried by a compact date (`2021010113`), else NaN. */
  minutes: number
}

function fullYear(value: number, length: number): number {
  if (length === 4) return value
  return value >= TWO_DIGIT_YEAR_PIVOT ? 1900 + value : 2000 + value
}

/** Value of `n` digits of `text` from `at` (known to be digits). */
function digitsAt(text: string, at: number, n: number): number {
  let v = 0
  for (let j = 0; j < n; j++) v = v * 10 + (text.charCodeAt(at + j) - 48)
  return v
}

/**
 * `YYYY-MM-DD`, `YYYY/M/D`, `M/D/YYYY`, `D.M.YY`, `1-Jan-2021`, `3 mars 2021`, `Jan 3 2021`,
 * `20210101`, `2021010113`, `202101011330`, `20210101133000`; null when none of these.
 */
function readDate(c: Cursor): DatePart | null {
  if (isLetter(c.peek())) {
    // `Jan 3 2021`, `Jan 3, 2021`
    const month = monthOfWord(c.word())
    if (month === 0) return null
    c.eat(DOT)
    if (c.skipSpaces() === 0 && !c.eat(DASH)) return null
    const d = c.digits()
    if (d.length < 1 || d.length > 2) return null
    c.eat(COMMA)
    if (c.skipSpaces() === 0 && !c.eat(DASH)) return null
    const y = c.digits()
    if (y.length !== 4) return null
    return {
      year: y.value,
      first: month,
      second: d.value,
      ordered: true,
      twoDigitYear: false,
      minutes: Number.NaN,
    }
  }
  const at = c.k
  const a = c.digits()
  if (a.length === 8 || a.length === 10 || a.length === 12 || a.length === 14) {
    const t = c.text
    let minutes = Number.NaN
    if (a.length >= 10) {
      minutes = minutesOf(digitsAt(t, at + 8, 2), a.length >= 12 ? digitsAt(t, at + 10, 2) : 0, undefined)
      if (a.length === 14) {
        const s = digitsAt(t, at + 12, 2)
        if (s >= 60) return null
        minutes += s / 60
      }
      if (!Number.isFinite(minutes)) return null
      // `2023070923:26`: an hour then `:MM` (the German weather service's solar product).
      if (
        a.length === 10 &&
        c.peek() === COLON &&
        isDigit(t.charCodeAt(c.k + 1)) &&
        isDigit(t.charCodeAt(c.k + 2))
      ) {
        const m = digitsAt(t, c.k + 1, 2)
        if (!isDigit(t.charCodeAt(c.k + 3)) && m < 60) {
          minutes += m
          c.k += 3
        }
      }
    }
    return {
      year: digitsAt(t, at, 4),
      first: digitsAt(t, at + 4, 2),
      second: digitsAt(t, at + 6, 2),
      ordered: true,
      twoDigitYear: false,
      minutes,
    }
  }
  if (a.length === 0 || a.length === 3 || a.length > 4) return null
  const sep = c.peek()
  if (sep !== DASH && sep !== SLASH && sep !== DOT && sep !== SPACE) return null
  c.k++
  if (a.length === 4) {
    if (sep === SPACE) return null
    const b = c.digits()
    if (b.length < 1 || b.length > 2 || !c.eat(sep)) return null
    const d = c.digits()
    if (d.length < 1 || d.length > 2) return null
    return {
      year: a.value,
      first: b.value,
      second: d.value,
      ordered: true,
      twoDigitYear: false,
      minutes: Number.NaN,
    }
  }
  // Day or month first, year last.
  let month = 0
  const b = c.digits()
  if (b.length === 0) {
    month = monthOfWord(c.word())
    if (month === 0) return null
    c.eat(DOT)
  } else if (b.length > 2 || sep === SPACE) return null
  if (!c.eat(sep)) return null
  const y = c.digits()
  if (y.length !== 2 && y.length !== 4) return null
  const year = fullYear(y.value, y.length)
  const twoDigitYear = y.length === 2
  if (month > 0)
    return { year, first: month, second: a.value, ordered: true, twoDigitYear, minutes: Number.NaN }
  // Dotted dates are day.month.year wherever they are written (common practice, no source).
  if (sep === DOT)
    return { year, first: b.value, second: a.value, ordered: true, twoDigitYear, minutes: Number.NaN }
  return { year, first: a.value, second: b.value, ordered: false, twoDigitYear, minutes: Number.NaN }
}

/**
 * A clock time: `HH:MM`, `HH:MM:SS(.fff)`, `HHMM`, `HMM`, and a bare hour `H` when `bareHour`; each
 * optionally followed by `a`/`p`, `am`/`pm` or `a.m.`/`p.m.`. Minutes after midnight (seconds as a
 * fraction), NaN when not a clock time.
 */
function readClock(c: Cursor, bareHour: boolean): number {
  const h = c.digits()
  if (h.length === 0 || h.length > 4) return Number.NaN
  let hour = h.value
  let minute = 0
  let second = 0
  if (h.length >= 3) {
    hour = Math.floor(h.value / 100)
    minute = h.value % 100
  } else if (c.eat(COLON)) {
    const m = c.digits()
    if (m.length !== 2) return Number.NaN
    minute = m.value
    if (c.eat(COLON)) {
      const s = c.digits()
      if (s.length !== 2) return Number.NaN
      second = s.value
      if (c.peek() === DOT || c.peek() === COMMA) {
        c.k++
        if (c.digits().length === 0) return Number.NaN
      }
    }
  } else if (!bareHour) return Number.NaN
  const beforeMarker = c.k
  c.skipSpaces()
  let ampm: 'am' | 'pm' | undefined
  const letter = c.peek() | 32
  if (letter === 97 || letter === 112) {
    c.k++
    if (c.eat(DOT)) {
      if ((c.peek() | 32) === 109) {
        c.k++
        c.eat(DOT)
      }
    } else if ((c.peek() | 32) === 109) c.k++
    if (!isLetter(c.peek())) ampm = letter === 97 ? 'am' : 'pm'
  }
  if (ampm === undefined) c.k = beforeMarker
  if (second >= 60) return Number.NaN
  const minutes = minutesOf(hour, minute, ampm)
  return minutes + second / 60
}

/**
 * `Z`, `UTC`, `GMT`, `UTC+2`, `+01:00`, `-0500`, `+01`, `−03:30` after the clock: minutes east of
 * UTC; NaN when there is none; null when the text is something else.
 */
function readZone(c: Cursor): number | null {
  c.skipSpaces()
  if (c.atEnd) return Number.NaN
  let named = false
  if (isLetter(c.peek())) {
    const w = c.word().toUpperCase()
    if (w !== 'Z' && w !== 'UTC' && w !== 'GMT') return null
    named = true
    c.skipSpaces()
    if (c.atEnd) return 0
  }
  const sign = c.peek()
  if (sign !== PLUS && sign !== DASH && sign !== MINUS_SIGN) return null
  c.k++
  const h = c.digits()
  let hours: number
  let minutes = 0
  if (h.length === 4 && !named) {
    hours = Math.floor(h.value / 100)
    minutes = h.value % 100
  } else if (h.length === 1 || h.length === 2) {
    hours = h.value
    if (c.eat(COLON)) {
      const m = c.digits()
      if (m.length !== 2) return null
      minutes = m.value
    }
  } else return null
  if (hours > 14 || minutes >= 60) return null
  return (sign === PLUS ? 1 : -1) * (hours * 60 + minutes)
}

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

/**
 * Parse a date-time (or date-only, when `timeText` is given) into row `i` of `out`. `timeText`
 * comes from a separate time or hour column. Returns false when the text is not a timestamp.
 */
export function parseTimestampInto(
  out: TimestampColumns,
  i: number,
  text: string,
  timeText?: string,
): boolean {
  if (timeText === undefined && parseIsoFast(out, i, text)) return true
  const c = new Cursor(text)
  c.skipSpaces()
  const date = readDate(c)
  if (date === null) return false
  let minutes = date.minutes
  let offset = Number.NaN
  if (timeText !== undefined) {
    c.skipSpaces()
    if (!c.atEnd || !Number.isNaN(minutes)) return false
    minutes = parseTimeOfDay(timeText)
  } else {
    // Between date and clock: 'T', spaces, ':' (`20090101:0010`), or a comma and spaces.
    const spaces = c.skipSpaces()
    const next = c.peek()
    let clock = false
    if (next === 84 || next === 116) {
      c.k++
      clock = true
    } else if (next === COLON && spaces === 0) {
      c.k++
      clock = true
    } else if (next === COMMA) {
      c.k++
      c.skipSpaces()
      clock = true
    } else if (spaces > 0 && isDigit(next)) clock = true
    if (clock) {
      if (!Number.isNaN(minutes)) return false
      minutes = readClock(c, false)
      if (Number.isNaN(minutes)) return false
    }
    const zone = readZone(c)
    if (zone === null) return false
    offset = zone
    c.skipSpaces()
    if (!c.atEnd) return false
  }
  if (!Number.isFinite(minutes)) return false
  out.year[i] = date.year
  out.first[i] = date.first
  out.second[i] = date.second
  out.yearFirst[i] = date.ordered ? 1 : 0
  out.minuteOfDay[i] = minutes
  out.offsetMin[i] = offset
  if (date.twoDigitYear) out.twoDigitYears++
  return true
}

/**
 * The common shapes `YYYY-MM-DDTHH:MM`, `YYYY-MM-DD HH:MM`, optionally `:SS`, then nothing or `Z`,
 * read by fixed character positions (a 30-year file has 263,000 of them). Returns false for anything
 * else, which the scanner then reads.
 */
function parseIsoFast(out: TimestampColumns, i: number, text: string): boolean {
  return parseIsoFastAt(out, i, text, 0, text.length)
}

/**
 * {@link parseIsoFast} on `text[from, to)`, so a reader can parse a cell in place without cutting it
 * out of the file's text.
 */
export function parseIsoFastAt(
  out: TimestampColumns,
  i: number,
  text: string,
  from: number,
  to: number,
): boolean {
  const n = to - from
  if (
    n < 16 ||
    text.charCodeAt(from + 4) !== 45 ||
    text.charCodeAt(from + 7) !== 45 ||
    text.charCodeAt(from + 13) !== 58
  )
    return false
  const sep = text.charCodeAt(from + 10)
  if (sep !== 84 && sep !== 32) return false
  let k = 16
  let seconds = 0
  if (n >= 19 && text.charCodeAt(from + 16) === 58) {
    seconds = digitAt(text, from + 17) * 10 + digitAt(text, from + 18)
    if (!(seconds < 60)) return false
    k = 19
  }
  let offset = Number.NaN
  if (k === n) offset = Number.NaN
  else if (k === n - 1 && text.charCodeAt(from + k) === 90) offset = 0
  else return false
  const year =
    digitAt(text, from) * 1000 +
    digitAt(text, from + 1) * 100 +
    digitAt(text, from + 2) * 10 +
    digitAt(text, from + 3)
  const month = digitAt(text, from + 5) * 10 + digitAt(text, from + 6)
  const day = digitAt(text, from + 8) * 10 + digitAt(text, from + 9)
  const hour = digitAt(text, from + 11) * 10 + digitAt(text, from + 12)
  const minute = digitAt(text, from + 14) * 10 + digitAt(text, from + 15)
  const minutes = minutesOf(hour, minute, undefined)
  if (Number.isNaN(year + month + day) || Number.isNaN(minutes)) return false
  out.year[i] = year
  out.first[i] = month
  out.second[i] = day
  out.yearFirst[i] = 1
  out.minuteOfDay[i] = seconds === 0 ? minutes : minutes + seconds / 60
  out.offsetMin[i] = offset
  return true
}

function digitAt(text: string, k: number): number {
  const c = text.charCodeAt(k) - 48
  return c >= 0 && c <= 9 ? c : Number.NaN
}

/**
 * Minutes after midnight of a time or hour cell: `HH:MM(:SS)`, `H:MM`, `HHMM` and `HMM` (`0100`–`2400`),
 * a bare hour `HH` (0–24), each with an optional am/pm marker (`1:00a`, `12:30p`, `1 PM`); NaN when
 * the cell is not a time.
 */
export function parseTimeOfDay(text: string): number {
  const c = new Cursor(text)
  c.skipSpaces()
  const minutes = readClock(c, true)
  c.skipSpaces()
  return c.atEnd ? minutes : Number.NaN
}
