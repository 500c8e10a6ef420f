/**
 * @module api/routes/page
 * The web page: GET / (assess a site), /compare (sites side by side), /inspect (how a weather file is read),
 * /fit (drying speed from weighings) and /energy (energy charts), GET /app.js and GET /app.css (same-origin,
 * as the CSP requires), and POST /report (every form: multipart or urlencoded, its job in the `task`
 * field). POST /report answers, by the form's `format`: `page` – the page with the result above the form
 * (works without JavaScript); `handout`, `html`, `csv`, `json` – a download; `bundle` – JSON {article,
 * document, handout, csv, json, title} for the page script. Errors come back as the page with the message
 * (naming the field by its label) or as problem details (csv, json, bundle).
 */
import { type Context, Hono } from 'hono'
import { AssessOptionError, planAssessment } from '../../analysis/plan.ts'
import { APP_JS } from '../../web/app-js.ts'
import type { DemoProvider } from '../../web/demo-files.ts'
import { FormFieldError, type FormInput, parseForm } from '../../web/form-input.ts'
import { pageCss } from '../../web/page-css.ts'
import { fieldLabel, PAGE_TASKS, type PageTask, renderPage, TASK_IDS } from '../../web/page-html.ts'
import { FormQuestion, runForm } from '../../web/run-form.ts'
import { runEnergy, runFit, runInspect, type ToolResult } from '../../web/run-tools.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, problemFor } from '../errors.ts'
import { checkBatchHours } from '../limits.ts'
import { ApiProblem, type ProblemType, problemBody } from '../problem.ts'
import { checkedUploadText } from '../upload.ts'
import { workControl } from '../work.ts'

/** The page's configuration: the API config, plus demo files when the entry point can read them. */
export type PageConfig = ApiConfig & { demo?: DemoProvider }

const NO_STORE = { 'cache-control': 'no-store' }
const FORMATS = ['page', 'handout', 'html', 'csv', 'json']

function echoValues(form: FormData): { values: Record<string, string>; multi: Record<string, string[]> } {
  const values: Record<string, string> = {}
  const multi: Record<string, string[]> = {}
  for (const [k, v] of form.entries()) {
    if (typeof v !== 'string' || k === 'format' || k === 'task') continue
    values[k] = v
    multi[k] = [...(multi[k] ?? []), v]
  }
  const f = form.get('format')
  if (typeof f === 'string' && FORMATS.includes(f)) values.format = f
  return { values, multi }
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

/**
 * The form's field for an engine option that can lower the work (the batch-hour limit's message names it by its
 * label), or null: the form has no start-date step or maximum batch length.
 */
const LEVER_FIELDS: Record<string, string | null> = {
  seasonStart: 'seasonStart',
  startStepDays: null,
  maxDays: null,
  'method.airflowsM3PerMinPerTonne': 'binAirflows',
}
const leverWords = (option: string): string | null => {
  const field = option in LEVER_FIELDS ? LEVER_FIELDS[option] : option
  return field === null ? null : `“${fieldLabel(field)}”`
}

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

/** The job of a posted form: the last `task` value (a "check the file first" button overrides the form's own). */
function taskOf(form: FormData): PageTask {
  const values = form.getAll('task').filter((v): v is string => typeof v === 'string')
  const last = values[values.length - 1]
  return (TASK_IDS as string[]).includes(last ?? '') ? (last as PageTask) : 'assess'
}

type Answer = Pick<FormResult, 'title' | 'article' | 'json'> &
  Partial<Pick<FormResult, 'document' | 'handout' | 'csv'>>

/** The answer in the format asked for: a download, the bundle for the page script, or the page. */
function formAnswer(
  c: Context,
  format: string,
  out: Answer,
  pageWith: (article: string) => string,
): Response {
  const stem = downloadStem(out.title)
  const download = (body: string, type: string, ext: string, suffix = '') =>
    c.body(body, 200, {
      'content-type': `${type}; charset=utf-8`,
      'content-disposition': `attachment; filename="${stem}${suffix}.${ext}"`,
    })
  switch (format) {
    case 'bundle':
      return c.body(JSON.stringify({ stem, ...out }), 200, {
        'content-type': 'application/json; charset=utf-8',
        ...NO_STORE,
      })
    case 'handout':
      return out.handout
        ? download(out.handout, 'text/html', 'html', '-summary')
        : c.html(pageWith(out.article))
    case 'html':
      return out.document ? download(out.document, 'text/html', 'html') : c.html(pageWith(out.article))
    case 'csv':
      return out.csv ? download(out.csv, 'text/csv', 'csv') : download(out.json, 'application/json', 'json')
    case 'json':
      return download(out.json, 'application/json', 'json')
    default:
      return c.html(pageWith(out.article))
  }
}

/** The page a posted form came from (a "check the file first" answer shows above the assess form). */
function pageTaskOf(form: FormData): PageTask {
  const first = form.get('task')
  return typeof first === 'string' && (TASK_IDS as string[]).includes(first) ? (first as PageTask) : 'assess'
}

/** What answering one posted form needs: the request, the format asked for, and the page to show again. */
interface PostedForm {
  c: Context
  config: PageConfig
  form: FormData
  format: string
  work: ReturnType<typeof workControl>
  /** The page with these form values (and a message or a result). */
  page: (state: Parameters<typeof renderPage>[0]) => string
  pageTask: PageTask
  values: Record<string, string>
  multi: Record<string, string[]>
  demoIds: string[]
}

/** A problem as the form's answer: problem JSON for the page script and downloads, else the page with the message. */
function failAnswer(p: PostedForm, problem: ApiProblem, ask: boolean, field?: string): Response {
  const { status, message } = problem
  if (wantsJson(p.format)) {
    return p.c.body(
      JSON.stringify({
        ...problemBody(status, message, problem.errors, problem.type),
        askFileQuestions: ask,
        field: field ?? null,
      }),
      status as 400,
      { 'content-type': 'application/problem+json', ...NO_STORE },
    )
  }
  return p.c.html(
    p.page({
      task: p.pageTask,
      values: p.values,
      multi: p.multi,
      error: { message, askFileQuestions: ask, field },
    }),
    status as 400,
  )
}

/** An error thrown while answering a form, as its answer: the field named by its label where there is one. */
function errorAnswer(p: PostedForm, e: unknown, ask = false): Response {
  if (e instanceof FormFieldError) {
    const message = `${fieldLabel(e.field)}: ${e.detail}`
    return failAnswer(
      p,
      new ApiProblem(400, message, [{ path: e.field, message: e.detail }]),
      e.field === 'file',
      e.field,
    )
  }
  if (e instanceof FormQuestion) return failAnswer(p, new ApiProblem(422, e.message), true)
  if (e instanceof AssessOptionError) {
    const field = formField(e.option)
    const message = `${fieldLabel(field)}: ${e.message}`
    return failAnswer(p, new ApiProblem(400, message, [{ path: field, message: e.message }]), false, field)
  }
  const problem = problemFor(e, { optionPath: formField })
  if (problem === null) {
    console.error(`dryhours: internal error on POST /report: ${(e as Error).message}`)
    return failAnswer(
      p,
      new ApiProblem(503, 'internal error; nothing was assessed', undefined, 'internal'),
      false,
    )
  }
  return failAnswer(p, problem, ask)
}

/** The page with the result above the form (the answer without JavaScript). */
function resultPage(p: PostedForm): (article: string) => string {
  return (article) =>
    p.page({
      task: p.pageTask,
      values: p.values,
      multi: p.multi,
      result: `<p class="hint no-print">To download the result, choose a file under “Answer as” and send the form again.</p>${article}`,
    })
}

/** The same row and column limits as the API's files, before any reader runs. */
function uploadChecker(config: PageConfig) {
  return (file: { name: string; bytes: Uint8Array }, field: string, kind?: 'weighings' | 'log' | 'weather') =>
    checkedUploadText({ name: file.name, field, bytes: file.bytes }, config, kind)
}

/** Inspect, fit and energy charts: no engine planner, the tool's own reader. */
async function answerTool(p: PostedForm, task: 'inspect' | 'fit' | 'energy'): Promise<Response> {
  const run = task === 'inspect' ? runInspect : task === 'fit' ? runFit : runEnergy
  let out: ToolResult
  try {
    out = await run(p.form, {
      demo: p.config.demo,
      demoIds: p.demoIds,
      checkUpload: uploadChecker(p.config),
      onProgress: p.work.checkpoint,
    })
    p.work.checkpoint()
  } catch (e) {
    return errorAnswer(p, e)
  }
  return formAnswer(p.c, p.format === 'csv' ? 'json' : p.format, out, resultPage(p))
}

/** The form of an assess or compare job, read and planned before any file is read. */
async function readAssessForm(p: PostedForm): Promise<FormInput | Response> {
  const checkUpload = uploadChecker(p.config)
  try {
    const input = await parseForm(p.form, p.demoIds, p.config.maxSites)
    // The engine's planner checks the options before any file is read.
    planAssessment({ ...input.assess, product: input.product })
    for (const f of input.files) checkUpload(f, 'file')
    for (const s of input.sites) checkUpload(s.file, `site${s.row}.file`)
    return input
  } catch (e) {
    return formInputError(p, e)
  }
}

/** A bad value in the form: a plain RangeError names its field by the text before the colon. */
function formInputError(p: PostedForm, e: unknown): Response {
  if (
    e instanceof RangeError &&
    !isRuntimeFault(e) &&
    !(e instanceof AssessOptionError) &&
    !(e instanceof FormFieldError)
  ) {
    const field = /^([A-Za-z]+):/.exec(e.message)?.[1]
    return failAnswer(
      p,
      new ApiProblem(400, e.message, field ? [{ path: field, message: e.message }] : undefined),
      e.message.startsWith('file:'),
    )
  }
  return errorAnswer(p, e)
}

/** Assess a site or compare sites: the same work limit and time budget as the API. */
async function answerAssess(p: PostedForm): Promise<Response> {
  const input = await readAssessForm(p)
  if (input instanceof Response) return input
  let out: FormResult
  try {
    out = await runForm(input, p.config.demo, {
      beforeAssess: (optionSets, hours) => {
        p.work.checkpoint()
        checkBatchHours(optionSets, hours, p.config, formField, leverWords)
      },
      onProgress: p.work.checkpoint,
    })
    p.work.checkpoint()
  } catch (e) {
    return errorAnswer(p, e)
  }
  return formAnswer(p.c, input.format, out, resultPage(p))
}

export function pageRouter(config: PageConfig): Hono {
  const demo = config.demo
  const demoList = () => demo?.list() ?? []
  const page = (state: Parameters<typeof renderPage>[0] = {}) =>
    renderPage({ demo: demoList(), maxSites: config.maxSites, ...state })
  const router = new Hono()

  for (const task of TASK_IDS) router.get(PAGE_TASKS[task].path, (c) => c.html(page({ task })))
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
    const posted: PostedForm = {
      c,
      config,
      form,
      format: typeof formatRaw === 'string' ? formatRaw : 'page',
      work,
      page,
      pageTask: pageTaskOf(form),
      ...echoValues(form),
      demoIds: demoList().map((d) => d.file),
    }
    const task = taskOf(form)
    if (task === 'inspect' || task === 'fit' || task === 'energy') return answerTool(posted, task)
    return answerAssess(posted)
  })
  return router
}
