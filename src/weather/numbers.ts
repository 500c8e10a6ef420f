/**
 * @module weather/numbers
 * Field text to numbers: blanks and missing-value words (NA, null, M, ---, …) become NaN, decimal
 * commas are accepted when the file uses them, and anything else unreadable is reported.
 */

/** Words that mean "no value" in station exports. Common practice, no source. */
const MISSING_WORDS = new Set([
  'na',
  'n/a',
  'nan',
  'null',
  'none',
  'm',
  '-',
  '--',
  '---',
  'missing',
  '*',
  '**',
  '***',
  '#n/a',
  'nd',
  'x',
])

/** Result codes of {@link parseField}. */
export const FIELD_OK = 0
export const FIELD_MISSING = 1
export const FIELD_UNREADABLE = 2

/** Parse `text` into `out[i]`; returns FIELD_OK, FIELD_MISSING (blank or a missing word) or FIELD_UNREADABLE. */
export function parseField(
  text: string | undefined,
  decimalComma: boolean,
  out: Float64Array,
  i: number,
): number {
  if (text === undefined || text.length === 0) {
    out[i] = Number.NaN
    return FIELD_MISSING
  }
  let s = text
  if (decimalComma && s.indexOf(',') >= 0) s = s.replace(',', '.')
  const x = +s
  if (!Number.isNaN(x)) {
    if (x === 0 && s.trim() === '') {
      out[i] = Number.NaN
      return FIELD_MISSING
    }
    if (x === Number.POSITIVE_INFINITY || x === Number.NEGATIVE_INFINITY || hasRadixPrefix(s, x)) {
      out[i] = Number.NaN
      return FIELD_UNREADABLE
    }
    out[i] = x
    return FIELD_OK
  }
  out[i] = Number.NaN
  const t = s.trim().toLowerCase()
  if (MISSING_WORDS.has(t)) return FIELD_MISSING
  const v = numberBeforeUnit(t)
  if (!Number.isNaN(v)) {
    out[i] = v
    return FIELD_OK
  }
  return FIELD_UNREADABLE
}

/**
 * `12.5 °c`, `25%`, `3mm` (lower case, trimmed): the number before a unit word of letters, `%` or `°`;
 * NaN for anything else, including radix literals (`0x1f`). One pass over the text.
 */
export function numberBeforeUnit(t: string): number {
  let k = 0
  if (t[k] === '-' || t[k] === '+') k++
  const digitsFrom = k
  while (k < t.length && t.charCodeAt(k) >= 48 && t.charCodeAt(k) <= 57) k++
  if (k === digitsFrom) return Number.NaN
  if (t[digitsFrom] === '0' && k === digitsFrom + 1 && (t[k] === 'x' || t[k] === 'b' || t[k] === 'o'))
    return Number.NaN
  if (t[k] === '.') {
    const fractionFrom = ++k
    while (k < t.length && t.charCodeAt(k) >= 48 && t.charCodeAt(k) <= 57) k++
    if (k === fractionFrom) return Number.NaN
  }
  const numberEnd = k
  while (k < t.length && t.charCodeAt(k) === 32) k++
  const unitFrom = k
  for (; k < t.length; k++) {
    const c = t.charCodeAt(k)
    if (!((c >= 97 && c <= 122) || c === 37 || c === 0xb0)) return Number.NaN
  }
  return k > unitFrom ? Number.parseFloat(t.slice(0, numberEnd)) : Number.NaN
}

/**
 * True when `s` is a hex, binary or octal literal ('0x10', '0b11', '0o17'), which `+s` reads as an
 * integer but no weather export writes: such a field is a code, not a measurement. Only integers can
 * come from these literals, so the scan is skipped for every other value (the fast path).
 */
function hasRadixPrefix(s: string, x: number): boolean {
  if (x !== Math.floor(x) || s.length < 3) return false
  const first = s.charCodeAt(0)
  // A leading digit 1-9, sign or point cannot start a radix literal; '0' or white space (which `+s`
  // skips, including no-break spaces) needs a closer look.
  const t = first === 48 ? s : first > 32 && first < 128 ? '' : s.trim()
  if (t.length < 3 || t.charCodeAt(0) !== 48) return false
  const c = t.charCodeAt(1) | 32 // lower case
  return c === 120 || c === 98 || c === 111 // 'x', 'b', 'o'
}

/** `12,5`, ` -3,25 `: a number with a decimal comma (and nothing else). */
export function isDecimalCommaNumber(text: string): boolean {
  let k = 0
  while (k < text.length && text.charCodeAt(k) === 32) k++
  if (text[k] === '-' || text[k] === '+') k++
  const intStart = k
  while (k < text.length && text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) k++
  if (k === intStart || text[k] !== ',') return false
  k++
  const fracStart = k
  while (k < text.length && text.charCodeAt(k) >= 48 && text.charCodeAt(k) <= 57) k++
  if (k === fracStart) return false
  while (k < text.length && text.charCodeAt(k) === 32) k++
  return k === text.length
}

const POW10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15]

/** `[-+]?digits[.digits]` between from and to (spaces allowed around), at most 15 digits; NaN otherwise. */
export function parseDecimal(text: string, from: number, to: number, comma: number): number {
  let k = from
  while (k < to && text.charCodeAt(k) === 32) k++
  let end = to
  while (end > k && text.charCodeAt(end - 1) === 32) end--
  if (k >= end) return Number.NaN
  let negative = false
  let ch = text.charCodeAt(k)
  if (ch === 45 || ch === 43) {
    negative = ch === 45
    k++
  }
  let mantissa = 0
  let digits = 0
  let fraction = -1
  for (; k < end; k++) {
    ch = text.charCodeAt(k)
    if (ch >= 48 && ch <= 57) {
      mantissa = mantissa * 10 + (ch - 48)
      digits++
      if (fraction >= 0) fraction++
    } else if ((ch === 46 || ch === comma) && fraction < 0) fraction = 0
    else return Number.NaN
  }
  if (digits === 0 || digits > 15) return Number.NaN
  const value = fraction > 0 ? mantissa / POW10[fraction] : mantissa
  return negative ? -value : value
}
