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
      '<form id="assess-form" class="card task-form" data-task="assess" method="post" action="/report" enctype="multipart/form-data"',
    )
    const scripts = [...html.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)]
    expect(scripts).toHaveLength(1)
    expect(scripts[0][1]).toContain('src="/app.js"')
    expect(scripts[0][2]).toBe('')
    expect(html).not.toMatch(/\son[a-z]+="/) // no inline event handlers
    expect(html).not.toMatch(/https?:\/\//) // no external assets
  })

  it('lists the chillies by what growers do (plain id unblanched, blanched its own entry); an older id selects the profile it now names', () => {
    const html = renderPage({})
    expect(html).toContain(
      '<option value="chili-peppers">Chili peppers (red, whole pods, unblanched)</option>',
    )
    expect(html).toContain(
      '<option value="chili-peppers-blanched">Chili peppers (red, whole pods, blanched)</option>',
    )
    expect(html).not.toContain('value="chili-peppers-unblanched"')
    expect(renderPage({ values: { product: 'chili-peppers-unblanched' } })).toContain(
      '<option value="chili-peppers" selected>',
    )
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
    expect(renderPage({ demo: list })).toContain(
      '<select id="f-demo" name="demo" aria-describedby="f-demo-hint">',
    )
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
      /role="alert" tabindex="-1"><strong>Please check:<\/strong> quillow\.csv: the timestamps carry no UTC offset/,
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
    // the field by its label, and marked for screen readers
    expect(html).toContain('Finish within: must be a number from 0.25 to 365 days, got &quot;soon&quot;')
    expect(html).toMatch(/id="f-deadlineDays" name="deadlineDays"[^>]*aria-invalid="true"/)
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
      [{ product: 'unobtainium' }, /Product: unknown product &#39;unobtainium&#39;/],
      [{ product: 'wheat', seasonStart: '6/15' }, /First start day: must be a day as MM-DD/],
      [
        { product: 'wheat', method: 'microwave' },
        /Drying method: must be one of open-air, shade, solar-cabinet, tunnel, heated/,
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

  it('assesses grain in a bin (natural-air-bin) from the page: its fields reach the method, its handout shows the airflow per start month', async () => {
    expect(await (await demoApp.request('/')).text()).toContain('data-methods="natural-air-bin"')
    const f = form({
      demo: 'quillow-valley-2021-2023-local-dst-imperial.csv',
      product: 'shelled-corn',
      method: 'natural-air-bin',
      binAirflows: '1 2',
      binDepthM: '3',
      initialWbPct: '20',
      targetWbPct: '15.5',
      seasonStart: '09-15',
      seasonEnd: '10-15',
      format: 'bundle',
    })
    const res = await demoApp.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { json: string; handout: string; document: string }
    const a = JSON.parse(b.json) as {
      method: { kind: string; airflowsM3PerMinPerTonne: number[]; depthM: number }
      bin: { airflows: { airflowM3PerMinPerTonne: number }[]; bin: { depthM: number } }
      seasonCalendar: { cells: unknown[] }
    }
    expect(a.method).toMatchObject({ kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1, 2], depthM: 3 })
    expect(a.bin.airflows.map((q) => q.airflowM3PerMinPerTonne)).toEqual([1, 2])
    expect(a.bin.bin.depthM).toBe(3)
    // no start weeks for a bin: the handout shows the airflow per start month instead of the calendar
    expect(a.seasonCalendar.cells).toEqual([])
    expect(b.handout).toContain('data-section="bin-airflow"')
    expect(b.handout).toContain('data-table="bin-minimum-airflow"')
    expect(b.handout).not.toContain('data-section="start-table"')
    expect(b.handout).not.toContain('data-section="calendar"')
    expect(b.handout).toMatch(/Never enter a bin/)
    expect(b.document).toContain('data-section="bin"')
    // a bad airflow names its field by the label
    f.set('binAirflows', '1 fast')
    f.set('format', 'page')
    const bad = await demoApp.request('/report', { method: 'POST', body: f })
    expect(bad.status).toBe(400)
    expect(await bad.text()).toMatch(/Airflows to compare: each value must be a number from 0.01 to 50/)
  }, 60_000)

  it('refuses a demo name that is not in the list (no path tricks)', async () => {
    const res = await demoApp.request('/report', {
      method: 'POST',
      body: form({ demo: '../package.json', product: 'wheat' }),
    })
    expect(res.status).toBe(400)
    expect(await res.text()).toContain('Demo site: unknown demo file &quot;../package.json&quot;')
  })
})

describe('the sites table (compare)', () => {
  function sitesForm(fields: Record<string, string>, sites: { name: string; bytes: Uint8Array }[]): FormData {
    const f = form({ task: 'compare', ...fields })
    sites.forEach((x, i) => {
      f.append(
        `site${i + 1}.file`,
        new File([x.bytes as Uint8Array<ArrayBuffer>], x.name, { type: 'text/csv' }),
      )
    })
    return f
  }

  it('compares the sites, each with its own name, position and clock, with a short summary of each', async () => {
    const f = sitesForm(
      {
        product: 'apricot-halves',
        method: 'open-air',
        seasonStart: '07-01',
        seasonEnd: '07-31',
        format: 'bundle',
        'site1.name': 'Tamarel <east>',
        'site1.lat': '11.9',
        'site1.lon': '104.6',
        'site1.siteTz': 'Asia/Bangkok',
        'site2.name': 'Tamarel west',
        'site2.lat': '11.9',
        'site2.lon': '104.5',
      },
      [
        { name: 'first site.csv', bytes: tamarel },
        { name: 'second site.csv', bytes: tamarel },
      ],
    )
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string; csv: string; json: string }
    expect(b.article).toContain('data-report="comparison"')
    expect((b.article.match(/data-section="site"/g) ?? []).length).toBe(2)
    expect(b.article).toContain('Tamarel &lt;east&gt;')
    expect(b.article).toContain('Tamarel west')
    expect(b.csv.startsWith('Sites ranked\r\n')).toBe(true)
    const sites = JSON.parse(b.json) as {
      site: { name: string; timeZone: string | null; longitudeDeg: number }
    }[]
    expect(sites.map((x) => x.site.name)).toEqual(['Tamarel <east>', 'Tamarel west'])
    expect(sites[0].site.timeZone).toBe('Asia/Bangkok')
    expect(sites[1].site.longitudeDeg).toBe(104.5)
  }, 60_000)

  it('names the site row of a missing file and of a file that needs a question answered', async () => {
    const noFile = await app.request('/report', {
      method: 'POST',
      body: sitesForm({ product: 'wheat', 'site2.name': 'B' }, [{ name: 'a.csv', bytes: tamarel }]),
    })
    expect(noFile.status).toBe(400)
    expect(await noFile.text()).toContain(
      'Site 2: Weather file (CSV or EPW): choose this site’s weather file',
    )
    const question = await app.request('/report', {
      method: 'POST',
      body: sitesForm({ product: 'shelled-corn', format: 'bundle' }, [
        { name: 'a.csv', bytes: tamarel },
        { name: 'q.csv', bytes: quillow },
      ]),
    })
    expect(question.status).toBe(422)
    const p = (await question.json()) as { detail: string }
    expect(p.detail).toMatch(/^Site 2 \(q\.csv\): the timestamps carry no UTC offset/)
    expect(p.detail).not.toContain('--')
  }, 60_000)

  it('serves the compare page with three site rows, each field labelled, and a searchable zone list', async () => {
    const html = await (await app.request('/compare')).text()
    expect(html).toContain('aria-current="page">Compare sites</a>')
    expect((html.match(/<fieldset class="site"/g) ?? []).length).toBe(3)
    expect(html).toContain('<label for="f-site2-siteTz">Site&#39;s time zone</label>')
    expect(html).toMatch(/id="f-site2-siteTz" name="site2.siteTz" type="text"[^>]* list="tz-names"/)
    expect(html).toContain('<option value="Europe/Madrid"></option>')
  })
})

describe('the other jobs: check a file, fit weighings, energy charts', () => {
  it('checks a weather file: how it was read, each variable, problems, warnings apart from notes', async () => {
    const res = await app.request('/report', {
      method: 'POST',
      body: form({ task: 'inspect', lat: '11.9', lon: '104.6', format: 'bundle' }, [
        { name: 'tamarel.csv', bytes: tamarel },
      ]),
    })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string; json: string }
    expect(b.article).toContain('data-report="inspect"')
    for (const section of ['columns', 'variables', 'coverage', 'problems', 'warnings', 'notes'])
      expect(b.article).toContain(`data-section="${section}"`)
    expect(b.article).toContain('air temperature (dry bulb)')
    const notes = b.article.slice(b.article.indexOf('data-section="notes"'))
    expect(notes).toMatch(/comma-separated, header on line 1/)
    const warnings = b.article.slice(
      b.article.indexOf('data-section="warnings"'),
      b.article.indexOf('data-section="notes"'),
    )
    expect(warnings).not.toMatch(/separated/)
    expect(JSON.parse(b.json).format).toBe('csv')
  }, 30_000)

  it('"check the file first" on the assess form answers with the inspection above the assess form', async () => {
    const f = form({ ...BASE })
    f.append('file', new File([tamarel as Uint8Array<ArrayBuffer>], 'tamarel.csv', { type: 'text/csv' }))
    f.set('task', 'assess')
    f.append('task', 'inspect')
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const html = await res.text()
    expect(html).toContain('data-report="inspect"')
    expect(html).toContain('<form id="assess-form"')
    expect(html.indexOf('data-report="inspect"')).toBeLessThan(html.indexOf('<form id="assess-form"'))
  }, 30_000)

  it('fits weighings and names the form field when the reference is missing', async () => {
    const weighings = readFileSync(join(import.meta.dirname, '../fixtures/product/demo-weighings.csv'))
    const f = form({
      task: 'fit',
      reference: 'dryMass',
      referenceValue: '150',
      thicknessMm: '5',
      targetWbPct: '20',
      format: 'bundle',
    })
    f.append('weighings', new File([weighings as Uint8Array<ArrayBuffer>], 'w.csv', { type: 'text/csv' }))
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string; json: string }
    expect(b.article).toContain('data-report="fit"')
    expect(b.article).toContain('data-table="fit-models"')
    expect(JSON.parse(b.json).best.model).toMatch(/^(lewis|page|diffusion)$/)
    const g = form({ task: 'fit', reference: 'dryMass' })
    g.append('weighings', new File([weighings as Uint8Array<ArrayBuffer>], 'w.csv', { type: 'text/csv' }))
    const bad = await app.request('/report', { method: 'POST', body: g })
    expect(bad.status).toBe(400)
    expect(await bad.text()).toContain('Its value: give the dry mass or one moisture')
  }, 30_000)

  it('draws the energy charts of the demo batch log', async () => {
    const log = readFileSync(join(DEMO, 'energy/quillow-dryer-batches-2026.csv'))
    const f = form({ task: 'energy', format: 'bundle' })
    f.append('log', new File([log as Uint8Array<ArrayBuffer>], 'batches.csv', { type: 'text/csv' }))
    const res = await app.request('/report', { method: 'POST', body: f })
    expect(res.status).toBe(200)
    const b = (await res.json()) as { article: string }
    expect(b.article).toMatch(/data-chart="control-chart"|<svg/)
  }, 30_000)

  it('serves each job on its own address with the navigation marking it', async () => {
    for (const [path, name] of [
      ['/', 'Assess a site'],
      ['/inspect', 'Check a weather file'],
      ['/fit', 'Fit from weighings'],
      ['/energy', 'Energy charts'],
    ]) {
      const html = await (await app.request(path)).text()
      expect(html, path).toContain(`aria-current="page">${name}</a>`)
      expect((html.match(/aria-current=/g) ?? []).length).toBe(1)
    }
  })
})
