/**
 * @module weather/snippet
 * File text shown in messages: control characters made visible and long text cut, so that a hostile
 * header or cell cannot drive the terminal (escape sequences), break a one-line message (line
 * breaks) or flood it.
 */

/** Longest piece of file text quoted in a message [characters] (common practice, no source). */
export const SNIPPET_MAX_CHARS = 60

/**
 * Characters shown as `\uXXXX`: C0 controls U+0000–U+001F (tab included), DEL U+007F and C1 controls
 * U+0080–U+009F (Unicode 15.0 §23.1 "Control Codes"; ECMA-48 5th ed. 1991 for their terminal meaning),
 * the line and paragraph separators U+2028/U+2029, and the bidirectional embedding, override and
 * isolate controls U+202A–U+202E and U+2066–U+2069 (Unicode Standard Annex #9), which reorder what
 * a reader sees. All from memory.
 */
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/
const UNSAFE_ALL = new RegExp(UNSAFE.source, 'g')

/** `text` with every unsafe character written as `\uXXXX` (no length limit). */
export function escapeControlCharacters(text: string): string {
  if (!UNSAFE.test(text)) return text
  return text.replace(UNSAFE_ALL, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`)
}

/**
 * File text for a message: at most `maxChars` characters of `text` (then '…'; a surrogate pair is
 * never split), unsafe characters escaped by {@link escapeControlCharacters}.
 */
export function snippet(text: string, maxChars = SNIPPET_MAX_CHARS): string {
  if (text.length <= maxChars) return escapeControlCharacters(text)
  let end = maxChars
  const last = text.charCodeAt(end - 1)
  if (last >= 0xd800 && last <= 0xdbff) end-- // high surrogate: keep the pair together
  return `${escapeControlCharacters(text.slice(0, end))}…`
}
