/**
 * @module weather/month-words
 * Month names and their abbreviations in the six languages of the header words, to month numbers.
 */

/**
 * Month-word prefixes (lower case, accents removed) in English, German, Spanish, French, Portuguese
 * and Italian; from memory. The longest prefix wins (`juil` July before `jul`, `juin` June).
 */
const MONTH_WORDS: readonly [string, number][] = [
  ['jan', 1],
  ['ene', 1],
  ['gen', 1],
  ['feb', 2],
  ['fev', 2],
  ['mar', 3],
  ['mrz', 3],
  ['apr', 4],
  ['abr', 4],
  ['avr', 4],
  ['may', 5],
  ['mai', 5],
  ['mag', 5],
  ['jun', 6],
  ['juin', 6],
  ['giu', 6],
  ['jul', 7],
  ['juil', 7],
  ['lug', 7],
  ['aug', 8],
  ['ago', 8],
  ['aou', 8],
  ['sep', 9],
  ['set', 9],
  ['oct', 10],
  ['okt', 10],
  ['out', 10],
  ['ott', 10],
  ['nov', 11],
  ['dec', 12],
  ['dez', 12],
  ['dic', 12],
]

/** Month 1–12 of a month word (`Jan`, `janvier`, `März`, `dic`), 0 when it is none. */
export function monthOfWord(word: string): number {
  if (word.length < 3 || word.length > 10) return 0
  let w = ''
  for (const ch of word.normalize('NFD').toLowerCase()) {
    const c = ch.charCodeAt(0)
    if (c >= 97 && c <= 122) w += ch
    else if (c < 0x300 || c > 0x36f) return 0 // combining accents dropped, anything else is not a month word
  }
  let best = 0
  let bestLength = 0
  for (const [prefix, month] of MONTH_WORDS) {
    if (prefix.length > bestLength && w.startsWith(prefix)) {
      best = month
      bestLength = prefix.length
    }
  }
  return best
}
