/** Small helpers for building weather CSV text in tests. */

/** ISO-like local stamps 'YYYY-MM-DD HH:MM' for `hours` consecutive UTC hours shifted by `offsetHours`. */
export function hourStamps(startIsoUtc: string, hours: number, offsetHours = 0): string[] {
  const start = Date.parse(startIsoUtc)
  const out: string[] = []
  for (let i = 0; i < hours; i++) {
    out.push(new Date(start + (i + offsetHours) * 3_600_000).toISOString().slice(0, 16).replace('T', ' '))
  }
  return out
}

/** A CSV with a header and one row per entry of `rows` (cells joined by `sep`). */
export function csv(header: string[], rows: (string | number)[][], sep = ',', eol = '\n'): string {
  return [header.join(sep), ...rows.map((r) => r.join(sep))].join(eol) + eol
}
