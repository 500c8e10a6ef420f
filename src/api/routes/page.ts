/**
 * @module api/routes/page
 * The web page: GET / (the form), GET /app.js and GET /app.css (same-origin, as the CSP requires), and
 * POST /report (the form post: multipart or urlencoded). POST /report answers, by the form's `format`:
 * `page` – the page with the report below the form (works without JavaScript); `html`, `csv`, `json` –
 * a download; `bundle` – JSON {article, document, csv, json, title} for the page script. Errors come back
 * as the page with the message (page, html) or as problem details (csv, json, bundle).
 */
import { type Context, Hono } from 'hono'
import { APP_JS } from '../../web/app-js.ts'
import type { DemoProvider } from '../../web/demo-files.ts'
import { type FormInput, parseForm } from '../../web/form-input.ts'
import { pageCss } from '../../web/page-css.ts'
import { renderPage } from '../../web/page-html.ts'
import { FormQuestion, runForm } from '../../web/run-form.ts'
import type { ApiConfig } from '../config.ts'
import { ApiProblem, problemBody } from '../problem.ts'
import { checkedUploadText } from '../upload.ts'

/** The page's configuration: the API config, plus demo files when the entry point can read them. */
export type PageConfig = ApiConfig & { demo?: DemoProvider }

const NO_STORE = { 'cache-control': 'no-store' }

function echoValues(form: FormData): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [k, v] of form.entries()) if (typeof v === 'string' && k !== 'format') out[k] = v
  const f = form.get('format')
  if (typeof f === 'string' && ['page', 'html', 'csv', 'json'].includes(f)) out.format = f
  return out
}

/** ASCII file-name stem from a title: letters, digits and dashes only. */
export function downloadStem(title: string): string {
  const stem = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
  return `dryhours-${stem || 'report'}`
}

function wantsJson(format: string | null): boolean {
  return format === 'bundle' || format === 'csv' || format === 'json'
}

export function pageRouter(config: PageConfig): Hono {
  const demo = config.demo
  const demoList = () => demo?.list() ?? []
  const router = new Hono()

  router.get('/', (c) => c.html(renderPage({ demo: demoList() })))
  router.get('/app.js', (c) =>
    c.body(APP_JS, 200, { 'content-type': 'text/javascript; charset=utf-8', 'cache-control': 'no-cache' }),
  )
  router.get('/app.css', (c) =>
    c.body(pageCss(), 200, { 'content-type': 'text/css; charset=utf-8', 'cache-control': 'no-cache' }),
  )

  router.post('/report', async (c: Context) => {
    const type = (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase()
    if (type !== 'multipart/form-data' && type !== 'application/x-www-form-urlencoded') {
      return c.body(
        JSON.stringify(
          problemBody(
            415,
            `POST /report takes the page's form (multipart/form-data); got ${type || 'no content type'}. For the JSON API use POST /v1/assess.`,
          ),
        ),
        415,
        { 'content-type': 'application/problem+json' },
      )
    }
    let form: FormData
    try {
      form = await c.req.formData()
    } catch {
      return c.body(
        JSON.stringify(problemBody(400, 'the form body could not be read (check the multipart boundary)')),
        400,
        {
          'content-type': 'application/problem+json',
        },
      )
    }
    const formatRaw = form.get('format')
    const format = typeof formatRaw === 'string' ? formatRaw : 'page'
    const values = echoValues(form)
    const fail = (status: 400 | 413 | 422 | 500, message: string, ask: boolean) => {
      if (wantsJson(format)) {
        return c.body(JSON.stringify({ ...problemBody(status, message), askFileQuestions: ask }), status, {
          'content-type': 'application/problem+json',
          ...NO_STORE,
        })
      }
      return c.html(
        renderPage({ demo: demoList(), values, error: { message, askFileQuestions: ask } }),
        status,
      )
    }
    let input: FormInput
    try {
      input = await parseForm(
        form,
        demoList().map((d) => d.file),
      )
    } catch (e) {
      if (e instanceof RangeError) return fail(400, e.message, e.message.startsWith('file:'))
      throw e
    }
    // The same row and column limits as the API's weather files, before the reader runs.
    for (const f of input.files) {
      try {
        checkedUploadText({ name: f.name, field: 'file', bytes: f.bytes }, config)
      } catch (e) {
        if (e instanceof ApiProblem && e.status === 413) return fail(413, e.message, false)
        throw e
      }
    }
    let out: Awaited<ReturnType<typeof runForm>>
    try {
      out = await runForm(input, demo)
    } catch (e) {
      if (e instanceof FormQuestion) return fail(422, e.message, true)
      if (e instanceof RangeError) return fail(422, e.message, false)
      console.error(`dryhours: internal error on POST /report: ${(e as Error).message}`)
      return fail(500, 'internal error; the file was not assessed', false)
    }
    const stem = downloadStem(out.title)
    switch (input.format) {
      case 'bundle':
        return c.body(
          JSON.stringify({
            title: out.title,
            stem,
            article: out.article,
            document: out.document,
            csv: out.csv,
            json: out.json,
          }),
          200,
          { 'content-type': 'application/json; charset=utf-8', ...NO_STORE },
        )
      case 'html':
        return c.body(out.document, 200, {
          'content-type': 'text/html; charset=utf-8',
          'content-disposition': `attachment; filename="${stem}.html"`,
        })
      case 'csv':
        return c.body(out.csv, 200, {
          'content-type': 'text/csv; charset=utf-8',
          'content-disposition': `attachment; filename="${stem}.csv"`,
        })
      case 'json':
        return c.body(out.json, 200, {
          'content-type': 'application/json; charset=utf-8',
          'content-disposition': `attachment; filename="${stem}.json"`,
        })
      default:
        return c.html(
          renderPage({
            demo: demoList(),
            values,
            result: `<p class="hint no-print">To download this report, choose a file under “Answer as” and assess again.</p>${out.article}`,
          }),
        )
    }
  })
  return router
}
