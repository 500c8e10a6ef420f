/**
 * @module weather/text-cursor
 * A left-to-right reader over one cell of text for the hand-written scanners (timestamps): digits,
 * words and single characters, each looked at once, so any text is read in time linear in its length.
 */
/** Character codes the scanners compare with. */
export const TAB = 9
export const SPACE = 32
export const PLUS = 43
export const COMMA = 44
export const DASH = 45
export const DOT = 46
export const SLASH = 47
export const COLON = 58
export const MINUS_SIGN = 0x2212

export function isSpace(c: number): boolean {
  return c === SPACE || c === TAB || c === 0xa0
}

export function isDigit(c: number): boolean {
  return c >= 48 && c <= 57
}

export function isLetter(c: number): boolean {
  return (
    (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || (c >= 0xc0 && c <= 0x24f && c !== 0xd7 && c !== 0xf7)
  )
}

/**
 * A left-to-right reader over one cell. Each step looks at each character at most once and never
 * goes back further than the start of the step, so any text is read in time linear in its length.
 */
export class Cursor {
  k = 0
  constructor(readonly text: string) {}
  get atEnd(): boolean {
    return this.k >= this.text.length
  }
  peek(): number {
    return this.k < this.text.length ? this.text.charCodeAt(this.k) : -1
  }
  skipSpaces(): number {
    const from = this.k
    while (this.k < this.text.length && isSpace(this.text.charCodeAt(this.k))) this.k++
    return this.k - from
  }
  /** A run of digits: its value (first 15 digits) and its length (0 when none). */
  digits(): { value: number; length: number } {
    let value = 0
    const from = this.k
    while (this.k < this.text.length && isDigit(this.text.charCodeAt(this.k))) {
      if (this.k - from < 15) value = value * 10 + (this.text.charCodeAt(this.k) - 48)
      this.k++
    }
    return { value, length: this.k - from }
  }
  /** A run of letters (ASCII and Latin-1/Extended-A) and combining accents. */
  word(): string {
    const from = this.k
    for (; this.k < this.text.length; this.k++) {
      const c = this.text.charCodeAt(this.k)
      if (!isLetter(c) && !(c >= 0x300 && c <= 0x36f)) break
    }
    return this.text.slice(from, this.k)
  }
  eat(c: number): boolean {
    if (this.peek() !== c) return false
    this.k++
    return true
  }
}
