/**
 * @module api/problem
 * RFC 9457 problem details (`application/problem+json`) for every 4xx/5xx answer. Every problem has a
 * stable `type` from {@link PROBLEM_TYPES} (clients branch on it, not on the wording of `detail`); messages
 * name the field (as a JSON-pointer-like path) or the file line; never a stack trace or engine text.
 */
import type { Context } from 'hono'
import type { ContentfulStatusCode } from 'hono/utils/http-status'

export interface ProblemField {
  /** Where the problem is: a query/body field path such as `rh` or `options.method.kind`, or `line 12`. */
  path: string
  message: string
}

export interface Problem {
  type: string
  title: string
  status: number
  detail: string
  /** Field paths or file lines at fault, when known. */
  errors?: ProblemField[]
}

/** Every kind of problem the API answers with: its status, title and what it means. */
export const PROBLEM_TYPES = {
  'invalid-parameters': {
    status: 400,
    title: 'Invalid parameters',
    description:
      'a query parameter, option or form field is missing, unknown or out of range; `errors` names each field path',
  },
  'unreadable-body': {
    status: 400,
    title: 'Unreadable request body',
    description:
      'the body could not be read: a broken multipart body, an options part that is not JSON, corrupt gzip or deflate data, or a connection closed early',
  },
  'not-found': { status: 404, title: 'Not found', description: 'no such path or product' },
  'method-not-allowed': {
    status: 405,
    title: 'Method not allowed',
    description: 'the path exists but not with this method; the `Allow` header lists the methods it takes',
  },
  'too-large': {
    status: 413,
    title: 'Request too large',
    description:
      'more bytes (also after gzip decoding), rows, columns or files than the limits in GET /openapi.json (`x-limits`)',
  },
  'unsupported-media-type': {
    status: 415,
    title: 'Unsupported media type',
    description:
      'a content type, content encoding (gzip and deflate are read) or charset that is not accepted',
  },
  'unusable-input': {
    status: 422,
    title: 'Input cannot be used',
    description:
      'a file that arrives whole but cannot be used (no time column, no usable row …), with the line where known',
  },
  'too-much-work': {
    status: 422,
    title: 'Too much work for one request',
    description:
      'the request would simulate more batch-hours than the limit; the detail says which option to change',
  },
  'time-budget': {
    status: 422,
    title: 'Time budget exceeded',
    description: 'reading and computing took longer than the time budget per request; use a coarser request',
  },
  'resource-limit': {
    status: 422,
    title: 'Input too large to process',
    description:
      'the input needed more memory or nesting than the engine can give; send a smaller file or fewer rows',
  },
  'client-closed': {
    status: 499,
    title: 'Client closed the request',
    description: 'the client went away before the answer; the work was stopped (seen only in server logs)',
  },
  internal: {
    status: 500,
    title: 'Internal error',
    description: 'a fault of dryhours itself; the request was not processed and the server logged it',
  },
  busy: {
    status: 503,
    title: 'Server busy',
    description: 'every worker is busy and the queue is full; try again after the seconds in `Retry-After`',
  },
} as const

export type ProblemType = keyof typeof PROBLEM_TYPES
export type ProblemStatus = (typeof PROBLEM_TYPES)[ProblemType]['status']

/** Base of the `type` URIs: a stable identifier (RFC 9457 §3.1.1), documented at GET /docs#problems. */
export const PROBLEM_TYPE_BASE = 'https://dryhours.invalid/problems/'

/** The type a status gets when the thrower names none. */
const DEFAULT_TYPE: Record<number, ProblemType> = {
  400: 'invalid-parameters',
  404: 'not-found',
  405: 'method-not-allowed',
  413: 'too-large',
  415: 'unsupported-media-type',
  422: 'unusable-input',
  499: 'client-closed',
  500: 'internal',
  503: 'busy',
}

/** An error that the API turns into a problem-details response with its status and type. */
export class ApiProblem extends Error {
  readonly type: ProblemType
  constructor(
    readonly status: 400 | 404 | 405 | 413 | 415 | 422 | 499 | 500 | 503,
    detail: string,
    readonly errors?: ProblemField[],
    type?: ProblemType,
    /** Extra response headers (`Allow`, `Retry-After`, `Accept-Encoding`). */
    readonly headers?: Record<string, string>,
  ) {
    super(detail)
    this.name = 'ApiProblem'
    this.type = type ?? DEFAULT_TYPE[status]
  }
}

export function problemBody(
  status: number,
  detail: string,
  errors?: ProblemField[],
  type?: ProblemType,
): Problem {
  const t: ProblemType = type ?? DEFAULT_TYPE[status] ?? 'internal'
  const body: Problem = {
    type: `${PROBLEM_TYPE_BASE}${t}`,
    title: PROBLEM_TYPES[t].title,
    status,
    detail,
  }
  if (errors && errors.length > 0) body.errors = errors
  return body
}

/** A problem-details `Response` without a Hono context (entry points: the Node pool, the server). */
export function problemAnswer(
  status: number,
  detail: string,
  options: { errors?: ProblemField[]; type?: ProblemType; headers?: Record<string, string> } = {},
): Response {
  return new Response(JSON.stringify(problemBody(status, detail, options.errors, options.type)), {
    status,
    headers: { 'content-type': 'application/problem+json', ...(options.headers ?? {}) },
  })
}

export function problemResponse(
  c: Context,
  status: number,
  detail: string,
  errors?: ProblemField[],
  type?: ProblemType,
  headers?: Record<string, string>,
): Response {
  return c.body(JSON.stringify(problemBody(status, detail, errors, type)), status as ContentfulStatusCode, {
    ...(headers ?? {}),
    'content-type': 'application/problem+json',
  })
}

/** zod issues → problem fields (paths joined with dots; an unknown key is named in its own path). */
export function zodIssuesToFields(
  issues: ReadonlyArray<{
    path: ReadonlyArray<PropertyKey>
    message: string
    code?: string
    keys?: string[]
  }>,
  prefix = '',
): ProblemField[] {
  const join = (parts: PropertyKey[]) =>
    [prefix, ...parts.map(String)].filter((s) => s !== '').join('.') || '(root)'
  return issues.flatMap((i) =>
    i.code === 'unrecognized_keys' && i.keys && i.keys.length > 0
      ? i.keys.map((k) => ({
          path: join([...i.path, k]),
          message: 'unknown key: not an option of this request',
        }))
      : [{ path: join([...i.path]), message: i.message }],
  )
}
