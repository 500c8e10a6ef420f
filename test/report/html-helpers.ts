/** Small extractors for the report's own, regular markup (no DOM library in the project). */

/** Attributes of every element with tag `tag` whose attributes include `needle` (e.g. `class="bar"`). */
export function elements(html: string, tag: string, needle: string): Record<string, string>[] {
  const re = new RegExp(`<${tag}\\s([^>]*)>`, 'g')
  const out: Record<string, string>[] = []
  for (const m of html.matchAll(re)) {
    if (!m[1].includes(needle)) continue
    const attrs: Record<string, string> = {}
    for (const a of m[1].matchAll(/([a-zA-Z_:][-a-zA-Z0-9_:.]*)="([^"]*)"/g)) attrs[a[1]] = a[2]
    out.push(attrs)
  }
  return out
}

/** The substring of `html` from the element with `id="id"` to the end of its closing `</tag>`. */
export function byId(html: string, tag: string, id: string): string {
  const start = html.indexOf(`<${tag} `, html.lastIndexOf('<', html.indexOf(`id="${id}"`)))
  if (start < 0 || html.indexOf(`id="${id}"`) < 0) return ''
  // Count nesting of the same tag.
  let depth = 0
  const re = new RegExp(`<(/?)${tag}[\\s>]`, 'g')
  re.lastIndex = start
  for (let m = re.exec(html); m; m = re.exec(html)) {
    depth += m[1] ? -1 : 1
    if (depth === 0) return html.slice(start, html.indexOf('>', m.index) + 1)
  }
  return html.slice(start)
}

/** Number from a data attribute; '' → null. */
export function num(v: string | undefined): number | null {
  return v === undefined || v === '' ? null : Number(v)
}

/** Minimal RFC 4180 CSV parser (quoted fields, doubled quotes, CRLF). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = []
  let row: string[] = []
  let cell = ''
  let quoted = false
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"'
        i++
      } else if (ch === '"') quoted = false
      else cell += ch
    } else if (ch === '"') quoted = true
    else if (ch === ',') {
      row.push(cell)
      cell = ''
    } else if (ch === '\r' && text[i + 1] === '\n') {
      row.push(cell)
      rows.push(row)
      row = []
      cell = ''
      i++
    } else cell += ch
  }
  if (cell !== '' || row.length) {
    row.push(cell)
    rows.push(row)
  }
  return rows
}
