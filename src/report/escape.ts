/**
 * @module report/escape
 * Escaping for untrusted text (site names, file names, column headers) in HTML and CSV output.
 */

/** Escape text for HTML element content and double- or single-quoted attribute values. */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;')
}

/**
 * One CSV cell (RFC 4180 quoting) with spreadsheet formula injection neutralised: a text cell starting
 * with `=`, `+`, `-`, `@`, tab or carriage return gets a leading apostrophe (OWASP "CSV Injection"
 * guidance). Numbers are written as numbers, so negative values stay numeric.
 */
export function csvCell(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return ''
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : ''
  if (typeof value === 'boolean') return value ? 'true' : 'false'
  let text = value
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text
}

/** Rows of cells → CSV text with CRLF line ends (RFC 4180). */
export function csvTable(header: string[], rows: (string | number | boolean | null | undefined)[][]): string {
  return [header, ...rows].map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n'
}
