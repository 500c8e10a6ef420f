/**
 * @module api/routes/page
 * The web page: GET / (the form), GET /app.js and GET /app.css (same-origin, as the CSP requires), and
 * POST /report (the form post: multipart or urlencoded). POST /report answers, by the form's `format`:
 * `page` – the page with the report below the form (works without JavaScript); `html`, `csv`, `json` –
 * a download; `bundle` – JSON {article, document, csv, json, title} for the page script. Errors come back
 * as the page with the message (page, html) or as problem details (csv, json, bundle).
 */
import { type Context, Hono } from 'hono'
import { AssessOptionError, planAssessment } from '../../analysis/plan.ts'
import { APP_JS } from '../../web/app-js.ts'
import type { DemoProvider } from '../../web/demo-files.ts'
import { type FormInput, parseForm } from '../../web/form-input.ts'
import { pageCss } from '../../web/page-css.ts'
import { renderPage } from '../../web/page-html.ts'
import { FormQuestion, runForm } from '../../web/run-form.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, problemFor } from '../errors.ts'
import { checkBatchHours } from '../limits.ts'
import { ApiProblem, type ProblemType, problemBody } from '../problem.ts'
import { checkedUploadText } from '../upload.ts'
import { workControl } from '../work.ts'

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

/** Page form fields of the engine's options (the form uses the engine's names where it has the field). */
const formField = (option: string): string => option

type FormResult = Awaited<ReturnType<typeof runForm>>

function problemResponse(c: Context, status: 400 | 415, message: string, type?: ProblemType): Response {
  return c.body(JSON.stringify(problemBody(status, message, undefined, type)), status, {
    'content-type': 'application/problem+json',
  })
}

/** The posted form, or the problem when the body is not the page's form or cannot be read. */
async function readPageForm(c: Context): Promise<FormData | Response> {
  const type = (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase()
  if (type !== 'multipart/form-data' && type !== 'application/x-www-form-urlencoded') {
    return problemResponse(
      c,
      415,
      `POST /report takes the page's form (multipart/form-data); got ${type.slice(0, 60) || 'no content type'}. For the JSON API use POST /v1/assess.`,
    )
  }
  try {
    return await c.req.formData()
  } catch {
    return problemResponse(
      c,
      400,
      'the form body could not be read (check the multipart boundary)',
      'unreadable-body',
    )
  }
}

/** The assessed form in the format asked for: a download, the bundle for the page script, or the page. */
function formAnswer(
  c: Context,
  format: FormInput['format'],
  out: FormResult,
  pageWith: (article: string) => string,
): Response | Promise<Response> {
  const stem = downloadStem(out.title)
  const download = (body: string, type: string, ext: string) =>
    c.body(body, 200, {
      'content-type': `${type}; charset=utf-8`,
      'content-disposition': `attachment; filename="${stem}.${ext}"`,
    })
  switch (format) {
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
      return download(out.document, 'text/html', 'html')
    case 'csv':
      return download(out.csv, 'text/csv', 'csv')
    case 'json':
      return download(out.json, 'application/json', 'json')
    default:
      return c.html(pageWith(out.article))
  }
}

export function pageRouter(config: PageConfig): Hono {
  const demo = config.demo
  const demoList = () => demo?.list() ?? []
  const page = (state: Parameters<typeof renderPage>[0] = {}) =>
    renderPage({ demo: demoList(), maxSites: config.maxSites, ...state })
  const router = new Hono()

  router.get('/', (c) => c.html(page()))
  router.get('/app.js', (c) =>
    c.body(APP_JS, 200, { 'content-type': 'text/javascript; charset=utf-8', 'cache-control': 'no-cache' }),
  )
  router.get('/app.css', (c) =>
    c.body(pageCss(), 200, { 'content-type': 'text/css; charset=utf-8', 'cache-control': 'no-cache' }),
  )

  router.post('/report', async (c: Context) => {
    const work = workControl(c, config)
    const form = await readPageForm(c)
    if (!(form instanceof FormData)) return form
    const formatRaw = form.get('format')
    const format = typeof formatRaw === 'string' ? formatRaw : 'page'
    const values = echoValues(form)
    const fail = (problem: ApiProblem, ask: boolean) => {
      const { status, message } = problem
      if (wantsJson(format)) {
        return c.body(
          JSON.stringify({
            ...problemBody(status, message, problem.errors, problem.type),
            askFileQuestions: ask,
          }),
          status as 400,
          { 'content-type': 'application/problem+json', ...NO_STORE },
        )
      }
      return c.html(page({ values, error: { message, askFileQuestions: ask } }), status as 400)
    }
    const failWith = (e: unknown, ask = false) => {
      const problem = problemFor(e, { optionPath: formField })
      if (problem === null) {
        console.error(`dryhours: internal error on POST /report: ${(e as Error).message}`)
        return fail(
          new ApiProblem(503, 'internal error; the file was not assessed', undefined, 'internal'),
          false,
        )
      }
      return fail(problem, ask)
    }
    let input: FormInput
    try {
      input = await parseForm(
        form,
        demoList().map((d) => d.file),
        config.maxSites,
      )
      // The engine's planner checks the options before any file is read.
      planAssessment({ ...input.assess, product: input.product })
    } catch (e) {
      if (e instanceof RangeError && !isRuntimeFault(e) && !(e instanceof AssessOptionError)) {
        const field = /^([A-Za-z]+):/.exec(e.message)?.[1]
        return fail(
          new ApiProblem(400, e.message, field ? [{ path: field, message: e.message }] : undefined),
          e.message.startsWith('file:'),
        )
      }
      return failWith(e)
    }
    // The same row and column limits as the API's weather files, before the reader runs.
    for (const f of input.files) {
      try {
        checkedUploadText({ name: f.name, field: 'file', bytes: f.bytes }, config)
      } catch (e) {
        return failWith(e)
      }
    }
    let out: FormResult
    try {
      out = await runForm(input, demo, {
        // The same work limit and time budget as the API.
        beforeAssess: (hours) => {
          work.checkpoint()
          checkBatchHours({ ...input.assess, product: input.product }, hours, config, formField)
        },
        onProgress: work.checkpoint,
      })
      work.checkpoint()
    } catch (e) {
      if (e instanceof FormQuestion) return fail(new ApiProblem(422, e.message), true)
      return failWith(e)
    }
    return formAnswer(c, input.format, out, (article) =>
      page({
        values,
        result: `<p class="hint no-print">To download this report, choose a file under “Answer as” and assess again.</p>${article}`,
      }),
    )
  })
  return router
}
