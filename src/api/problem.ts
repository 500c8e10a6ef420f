/**
 * @module api/problem
 * RFC 9457 problem details (`application/problem+json`) for every 4xx/5xx answer.
 * Messages name the field (as a JSON-pointer-like path) or the file line; never a stack trace.
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

const TITLES: Record<number, string> = {
  400: 'Invalid parameters',
  404: 'Not found',
  405: 'Method not allowed',
  413: 'Request too large',
  415: 'Unsupported media type',
  422: 'Input cannot be used',
  500: 'Internal error',
}

/** An error that the API turns into a problem-details response with its status. */
export class ApiProblem extends Error {
  constructor(
    readonly status: 400 | 404 | 405 | 413 | 415 | 422,
    detail: string,
    readonly errors?: ProblemField[],
  ) {
    super(detail)
    this.name = 'ApiProblem'
  }
}

export function problemBody(status: number, detail: string, errors?: ProblemField[]): Problem {
  const body: Problem = {
    type: `https://dryhours.invalid/problems/${status}`,
    title: TITLES[status] ?? 'Error',
    status,
    detail,
  }
  if (errors && errors.length > 0) body.errors = errors
  return body
}

export function problemResponse(
  c: Context,
  status: number,
  detail: string,
  errors?: ProblemField[],
): Response {
  return c.body(JSON.stringify(problemBody(status, detail, errors)), status as ContentfulStatusCode, {
    'content-type': 'application/problem+json',
  })
}

/** zod issues → problem fields (paths joined with dots). */
export function zodIssuesToFields(
  issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>,
  prefix = '',
): ProblemField[] {
  return issues.map((i) => ({
    path: [prefix, ...i.path.map(String)].filter((s) => s !== '').join('.') || '(root)',
    message: i.message,
  }))
}
