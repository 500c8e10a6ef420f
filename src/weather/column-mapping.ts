/**
 * @module weather/column-mapping
 * The user's column mapping as text: a column named by its header (exact, then case-insensitive) or by
 * `#n`, and the `--map` argument to suggest for a column, quoted for a shell when it needs it.
 */
import { snippet } from './snippet.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** `#3` (1-based column number) → 2; −1 otherwise. Hand-written, linear. */
function columnNumber(text: string): number {
  if (text.length < 2 || text.length > 8 || text[0] !== '#') return -1
  let n = 0
  for (let k = 1; k < text.length; k++) {
    const c = text.charCodeAt(k)
    if (c < 48 || c > 57) return -1
    n = n * 10 + (c - 48)
  }
  return n - 1
}

export function findColumn(headers: string[], column: string, key: string): number {
  const ref = columnNumber(column)
  if (ref >= 0) {
    if (ref < headers.length) return ref
  } else {
    const exact = headers.findIndex((h) => h.trim() === column)
    if (exact >= 0) return exact
    const folded = headers.findIndex((h) => h.trim().toLowerCase() === column.toLowerCase())
    if (folded >= 0) return folded
  }
  throw new WeatherInputError(
    `mapping ${key}=${snippet(column)}: no such column; the columns are ${headers.map((h, i) => `#${i + 1} '${snippet(h)}'`).join(', ')}`,
    ['mapped column'],
  )
}

/** A `--map` argument for a column, quoted for a shell when the header has spaces or quotes. */
export function mapArgument(key: string, header: string, index: number): string {
  const plain = header !== '' && header.length <= 40
  const value = plain ? header : `#${index + 1}`
  const arg = `${key}=${value}`
  let safe = true
  for (let k = 0; k < arg.length && safe; k++) {
    const c = arg.charCodeAt(k)
    const ok =
      (c >= 48 && c <= 57) ||
      ((c | 32) >= 97 && (c | 32) <= 122) ||
      c === 95 ||
      c === 45 ||
      c === 61 ||
      c === 35 ||
      c === 46 ||
      c === 58
    if (!ok) safe = false
  }
  return `--map ${safe ? arg : `'${snippet(arg, 80).replaceAll("'", "'\\''")}'`}`
}
