/**
 * @module api/validate
 * zod validation at the edge: a failed parse becomes a 400 problem naming each field.
 */
import type { z } from 'zod'
import { ApiProblem, zodIssuesToFields } from './problem.ts'
import { queryParams } from './upload.ts'

export function parseOrProblem<S extends z.ZodType>(schema: S, value: unknown, prefix = ''): z.output<S> {
  const result = schema.safeParse(value)
  if (!result.success) {
    const errors = zodIssuesToFields(result.error.issues, prefix)
    throw new ApiProblem(400, errors.map((e) => `${e.path}: ${e.message}`).join('; '), errors)
  }
  return result.data
}

/**
 * Query parameters as an object of strings without prototype, so that `__proto__` and `constructor` are
 * keys like any other and strict schemas refuse them (the last value wins for repeated keys).
 */
export function queryObject(url: string): Record<string, string> {
  return queryParams(url)
}
