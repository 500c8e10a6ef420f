/**
 * Site names and file names carrying HTML, script and spreadsheet formulas. They come back escaped in
 * format=html answers, neutralised with a leading apostrophe in format=csv answers (the OWASP "CSV
 * injection" advice: prefix cells starting with = + - @ so a spreadsheet shows them as text), and
 * unchanged in JSON.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  app,
  COARSE,
  expectInspect,
  expectProblem,
  inventedDays,
  multipart,
  post,
} from './hostile-helpers.ts'

const FILE = inventedDays(28)

const HTML_NAMES = [
  '<script>alert(1)</script>',
  '<img src=x "onerror=alert(2)>',
  '"><svg onload=alert(3)>',
  "' onmouseover='alert(4)",
]
const FORMULAS = ['=HYPERLINK("http://evil.example","click")', "+cmd|' /C calc'!A0", '-1+2', '@SUM(1+1)']

function escapeHtml(s: string): string {
  return s
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;')
}

/** Raw markup that must never appear unescaped in an HTML answer. */
function expectNoRawMarkup(html: string): void {
  // Booleans rather than string matchers, so a failure does not print the whole report.
  expect(/<script>alert/.test(html)).toBe(false)
  expect(/<img src=x/.test(html)).toBe(false)
  expect(/<svg onload/.test(html)).toBe(false)
  expect(/\sonerror=alert/.test(html)).toBe(false)
  expect(/\sonmouseover='alert/.test(html)).toBe(false)
  // The page may carry only its own same-origin script.
  for (const m of html.matchAll(/<script([^>]*)>/g)) expect(m[1]).toMatch(/src="\/app\.js"/)
}

/** Cells of a CSV text (RFC 4180 quoting). */
function csvCells(text: string): string[] {
  const cells: string[] = []
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
    else if (ch === ',' || ch === '\n' || ch === '\r') {
      cells.push(cell)
      cell = ''
    } else cell += ch
  }
  cells.push(cell)
  return cells
}

/** A cell a spreadsheet would run as a formula: starts with = + @ or with - not followed by a number. */
function isFormula(cell: string): boolean {
  if (/^[=+@\t\r]/.test(cell)) return true
  return cell.startsWith('-') && !/^-\d+(\.\d+)?(e[-+]?\d+)?$/i.test(cell)
}

async function assessAs(format: string, fileName: string, siteName?: string): Promise<Response> {
  const options = { ...COARSE, ...(siteName !== undefined ? { weather: { siteName } } : {}) }
  return post(`/v1/assess${format ? `?format=${format}` : ''}`, multipart(FILE, fileName, options))
}

describe('HTML and script in names', () => {
  it.each(HTML_NAMES)('file name %s is escaped in the HTML report', async (name) => {
    const res = await assessAs('html', `${name}.csv`)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/html/)
    const html = await res.text()
    expectNoRawMarkup(html)
    // Escaped the usual way (& < > " ' as entities): the name is shown, not run.
    expect(html.includes(escapeHtml(name))).toBe(true)
  })

  it.each(HTML_NAMES)('site name %s is escaped in the HTML report', async (name) => {
    const res = await assessAs('html', 'site.csv', name)
    expect(res.status).toBe(200)
    expectNoRawMarkup(await res.text())
  })

  it('HTML answers carry nosniff and a CSP without inline script', async () => {
    const res = await assessAs('html', '<script>alert(1)</script>.csv')
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('content-security-policy')).toMatch(/script-src 'self'/)
  })

  it('names come back unchanged in JSON (served as application/json, with nosniff)', async () => {
    const name = HTML_NAMES[0] + FORMULAS[0]
    const res = await assessAs('', 'site.csv', name)
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^application\/json/)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    const body = (await res.json()) as { site: { name: string } }
    expect(body.site.name).toBe(name)
    const fromFile = (await (await assessAs('', `${name}.csv`)).json()) as { site: { name: string } }
    expect(fromFile.site.name).toBe(`${name}.csv`)
  })

  it('an EPW whose LOCATION city is a script: plain in inspect JSON, escaped in the HTML report', async () => {
    const epw = readFileSync('climate-demo/ardentine-upland-typical-year.epw', 'utf8')
    const evil = epw.replace(/^LOCATION,[^,]*/, 'LOCATION,<script>alert(1)</script>')
    const inspect = await expectInspect(await post('/v1/inspect', evil, 'text/plain'))
    expect(inspect.site.name.startsWith('<script>alert(1)</script>')).toBe(true)
    const res = await post('/v1/assess?format=html', multipart(evil, 'typical.epw', COARSE))
    expect(res.status).toBe(200)
    expectNoRawMarkup(await res.text())
  }, 60_000)

  it('compare: two sites with script file names, escaped in the side-by-side HTML', async () => {
    const form = new FormData()
    form.append('site', new Blob([FILE]), '<script>alert(1)</script>.csv')
    form.append('site', new Blob([inventedDays(28, 22, 55)]), '<img src=x "onerror=alert(2)>.csv')
    form.append('options', JSON.stringify(COARSE))
    const res = await post('/v1/compare?format=html', form)
    expect(res.status).toBe(200)
    expectNoRawMarkup(await res.text())
  })

  it('the page (POST /report, no JavaScript) escapes a script file name in the report it shows', async () => {
    const form = new FormData()
    form.set('product', 'figs')
    form.set('method', 'open-air')
    form.set('seasonStart', '07-01')
    form.set('seasonEnd', '07-02')
    form.set('utcOffsetHours', '0')
    form.append('file', new File([FILE], '<script>alert(1)</script>.csv', { type: 'text/csv' }))
    const res = await app.request('/report', { method: 'POST', body: form })
    expect([200, 422]).toContain(res.status)
    expectNoRawMarkup(await res.text())
  }, 60_000)
})

describe('spreadsheet formulas in names', () => {
  it.each(FORMULAS)(
    'site name %s: every CSV cell is neutralised, the name kept after an apostrophe',
    async (name) => {
      const res = await assessAs('csv', 'site.csv', name)
      expect(res.status).toBe(200)
      expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
      const cells = csvCells(await res.text())
      expect(cells.filter(isFormula)).toEqual([])
      expect(cells).toContain(`'${name}`)
    },
  )

  it.each(FORMULAS)('file name %s.csv: no CSV cell can run as a formula', async (name) => {
    const res = await assessAs('csv', `${name}.csv`)
    expect(res.status).toBe(200)
    const cells = csvCells(await res.text())
    expect(cells.filter(isFormula)).toEqual([])
    expect(cells).toContain(`'${name}.csv`)
  })

  it.each(FORMULAS)('site name %s is plain in JSON', async (name) => {
    const body = (await (await assessAs('', 'site.csv', name)).json()) as { site: { name: string } }
    expect(body.site.name).toBe(name)
  })

  it('a site name over 200 characters in the query is a 400 naming siteName', async () => {
    const p = await expectProblem(
      await post(`/v1/inspect?siteName=${'x'.repeat(201)}`, FILE, 'text/csv'),
      [400],
    )
    expect(p.errors?.[0]?.path).toBe('siteName')
  })
})
