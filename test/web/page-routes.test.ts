/**
 * The page routes through `app.request()`: the form page and its same-origin script and stylesheet under
 * the app's CSP, and POST /report in each answer format, with errors as a page (no JavaScript) or as
 * problem details (script and downloads).
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { Script } from 'node:vm'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { downloadStem } from '../../src/api/routes/page.ts'
import { APP_JS } from '../../src/web/app-js.ts'
import { demoFilesFromCatalogue } from '../../src/web/demo-files.ts'
import { renderPage } from '../../src/web/page-html.ts'

const app = createApp()
const DEMO = join(import.meta.dirname, '../../climate-demo')
const tamarel = readFileSync(join(DEMO, 'tamarel-lowland-2021-2023-utc.csv'))
const quillow = readFileSync(join(DEMO, 'quillow-valley-2021-2023-local-dst-imperial.csv'))

function form(fields: Record<string, string>, files: { name: string; bytes: Uint8Array }[] = []): FormData {
  const f = new FormData()
  for (const [k, v] of Object.entries(fields)) f.set(k, v)
  for (const file of files)
    f.append('file', new File([file.bytes as Uint8Array<ArrayBuffer>], file.name, { type: 'text/csv' }))
  return f
}

const BASE = {
  product: 'coffee-parchment',
  method: 'open-air',
  seasonStart: '12-01',
  seasonEnd: '01-15',
  utcOffset: '7',
}

describe('GET /', () => {
  it('serves the form under a CSP that allows only same-origin scripts; no inline script', async () => {
    const res = await app.request('/')
    expect(res.status).toBe(200)
    const csp = res.headers.get('content-security-policy') ?? ''
    expect(csp).toContain("script-src 'self'")
    const html = await res.text()
    expect(html).toContain(
      '<form id="assess-form" class="card" method="post" action="/report" enctype="multipart/form-data"',
    )
    const scripts = [...html.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)]
    expect(scripts).toHaveLength(1)
    expect(scripts[0][1]).toContain('src="/app.js"')
    expect(scripts[0][2]).toBe('')
    expect(html).not.toMatch(/\son[a-z]+="/) // no inline event handlers
    expect(html).not.toMatch(/https?:\/\//) // no external assets
  })

  it('serves /app.js as JavaScript that compiles, and /app.css as CSS', async () => {
    const js = await app.request('/app.js')
    expect(js.headers.get('content-type')).toMatch(/^text\/javascript/)
    const body = await js.text()
    expect(body).toBe(APP_JS)
    expect(() => new Script(body)).not.toThrow()
    expect(body).not.toMatch(/\beval\(|new Function/)
    const css = await app.request('/app.css')
    expect(css.headers.get('content-type')).toMatch(/^text\/css/)
    expect(await css.text()).toContain('.dryhours-report')
  })

  it('lists demo files only when the server provides them, with the options each needs', () => {
    const list = demoFilesFromCatalogue(JSON.parse(readFileSync(join(DEMO, 'sites.json'), 'utf8')))
    const q = list.find((d) => d.file.startsWith('quillow'))
    expect(q?.readOptions?.timeZone).toBe('America/Chicago')
    const t = list.find((d) => d.file === 'tamarel-lowland-2021-2023-utc.csv')
    // the file's time stamps are UTC; the site keeps its own zone (climate-demo/sites.json)
    expect(t?.readOptions).toMatchObject({
      utcOffsetHours: 0,
      siteTimeZone: 'Asia/Bangkok',
      latitudeDeg: 11.9,
      longitudeDeg: 104.6,
    })
    expect(renderPage({ demo: list })).toContain('<select id="f-demo" name="demo">')
    expect(renderPage({})).not.toContain('name="demo"')
  })
})

describe('POST /report', () => {
  it('answers the plain form post with the page and the report (no JavaScript needed)', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form(BASE, [{ name: 'tamarel.csv', bytes: tamarel }]),
    })
    expect(res.status).toBe(200)
    const html = await res.text()
    expect(html).toContain('<form id="assess-form"')
    expect(html).toContain('data-report="assessment"')
    expect(html).toContain('data-chart="psychrometric"')
    expect(html).toContain('value="12-01"') // the form keeps what was typed
  }, 30_000)

  it('answers format=bundle with the article, the document, CSV and JSON for the script', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ ...BASE, format: 'bundle', units: 'us' }, [{ name: 'tamarel.csv', bytes: tamarel }]),
    })
    expect(res.status).toBe(200)
    const b = (await res.json()) as {
      article: string
      document: string
      csv: string
      json: string
      title: string
    }
    expect(b.article.startsWith('<article class="dryhours-report"')).toBe(true)
    expect(b.article).toContain('data-units="us"')
    expect(b.document.startsWith('<!doctype html>')).toBe(true)
    expect(b.csv).toContain('Usable drying hours per month across years')
    const a = JSON.parse(b.json) as { schema: string; product: { id: string } }
    expect(a.schema).toBe('dryhours.assessment/1')
    expect(a.product.id).toBe('coffee-parchment')
  }, 30_000)

  it('answers format=csv as a download with an ASCII file name', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ ...BASE, format: 'csv', siteName: 'Hill <b>"5"</b>' }, [
        { name: 'x.csv', bytes: tamarel },
      ]),
    })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/)
    expect(res.headers.get('content-disposition')).toMatch(
      /^attachment; filename="dryhours-hill-b-5-b-coffee-[a-z-]+\.csv"$/,
    )
    expect(downloadStem('Ünïcode — “site”')).toBe('dryhours-unicode-site')
  }, 30_000)

  it('asks for the time zone when a local-time file needs it: the page opens the file questions', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ product: 'shelled-corn' }, [{ name: 'quillow.csv', bytes: quillow }]),
    })
    expect(res.status).toBe(422)
    const html = await res.text()
    expect(html).toContain('<details id="file-questions" class="questions" open>')
    expect(html).toMatch(
      /role="alert"><strong>Please check:<\/strong> quillow\.csv: the timestamps carry no UTC offset/,
    )
    // the reader's --utc-offset and --tz are named by the form's labels
    expect(html).toContain('“UTC offset of the file&#39;s time stamps [h]”')
    expect(html).toContain('“Time zone of the file&#39;s time stamps”')
    expect(html).not.toContain('--utc-offset')
  })

  it('gives problem details with askFileQuestions for the script', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ product: 'shelled-corn', format: 'bundle' }, [{ name: 'quillow.csv', bytes: quillow }]),
    })
    expect(res.status).toBe(422)
    expect(res.headers.get('content-type')).toBe('application/problem+json')
    const p = (await res.json()) as { status: number; detail: string; askFileQuestions: boolean }
    expect(p.status).toBe(422)
    expect(p.askFileQuestions).toBe(true)
  })

  it('names the field of a bad value and echoes malicious input as text', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ ...BASE, deadlineDays: 'soon', siteName: '"><script>alert(1)</script>' }, [
        { name: 'x.csv', bytes: tamarel },
      ]),
    })
    expect(res.status).toBe(400)
    const html = await res.text()
    expect(html).toContain('deadlineDays: must be a number from 0.25 to 365 days, got &quot;soon&quot;')
    expect(html).not.toContain('<script>alert(1)')
    expect(html).toContain('value="&quot;&gt;&lt;script&gt;alert(1)&lt;/script&gt;"')
  })

  it('says what is missing when no file is sent, and rejects a non-form body with 415', async () => {
    const res = await app.request('/report', { method: 'POST', body: form({ product: 'wheat' }) })
    expect(res.status).toBe(400)
    expect(await res.text()).toContain('file: choose a weather file (CSV or EPW) to upload, or a demo site')
    const bad = await app.request('/report', {
      method: 'POST',
      body: '{}',
      headers: { 'content-type': 'application/json' },
    })
    expect(bad.status).toBe(415)
    expect(bad.headers.get('content-type')).toBe('application/problem+json')
  })

  it('rejects an unknown product and a bad season day by field name', async () => {
    for (const [fields, msg] of [
      [{ product: 'unobtainium' }, /product: unknown product &#39;unobtainium&#39;/],
      [{ product: 'wheat', seasonStart: '6/15' }, /seasonStart: must be a day as MM-DD/],
      [
        { product: 'wheat', method: 'microwave' },
        /method: must be one of open-air, shade, solar-cabinet, tunnel, heated/,
      ],
    ] as const) {
      const res = await app.request('/report', {
        method: 'POST',
        body: form(fields, [{ name: 'x.csv', bytes: new TextEncoder().encode('a,b\n1,2\n') }]),
      })
      expect(res.status).toBe(400)
      expect(await res.text()).toMatch(msg)
    }
  })
})

describe('demo sites supplied by the entry point', () => {
  // What src/node/server.ts would pass: the catalogue's files, read from climate-demo/ on demand.
  const files = demoFilesFromCatalogue(JSON.parse(readFileSync(join(DEMO, 'sites.json'), 'utf8')))
  const demo = {
    list: () => files,
    read: async (file: string) =>
      files.some((d) => d.file === file) ? new Uint8Array(readFileSync(join(DEMO, file))) : null,
  }
  const demoApp = createApp({ demo } as Parameters<typeof createApp>[0])

  it('offers them on the page and assesses one by name, with the options the catalogue gives', async () => {
    const page = await (await demoApp.request('/')).text()
    expect(page).toContain('<option value="quillow-valley-2021-2023-local-dst-imperial.csv">')
    const f = form({
      demo: 'quillow-valley-2021-2023-local-dst-imperial.csv',
      product: 'shelled-corn',
      method: 'heated',
      seasonStart: '10-01',
      seasonEnd: '10-31',
      format: 'bundle',
    })
    const res = await demoApp.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { json: string }
    const a = JSON.parse(b.json) as { site: { name: string; utcOffsetHours: number } }
    expect(a.site.name).toBe('Quillow Landing')
    expect(a.site.utcOffsetHours).toBe(-6)
  }, 30_000)

  it('refuses a demo name that is not in the list (no path tricks)', async () => {
    const res = await demoApp.request('/report', {
      method: 'POST',
      body: form({ demo: '../package.json', product: 'wheat' }),
    })
    expect(res.status).toBe(400)
    expect(await res.text()).toContain('demo: unknown demo file &quot;../package.json&quot;')
  })
})

describe('several files', () => {
  it('answer with the sites side by side and each site report', async () => {
    const f = form({ ...BASE, format: 'bundle' }, [
      { name: 'first site.csv', bytes: tamarel },
      { name: 'second site.csv', bytes: tamarel },
    ])
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string; csv: string; json: string }
    expect(b.article).toContain('data-report="comparison"')
    expect((b.article.match(/data-report="assessment"/g) ?? []).length).toBe(2)
    expect(b.article).toContain('first site')
    expect(b.article).toContain('second site')
    expect(b.csv.startsWith('Sites ranked\r\n')).toBe(true)
    expect((JSON.parse(b.json) as unknown[]).length).toBe(2)
  }, 60_000)
})
