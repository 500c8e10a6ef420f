/**
 * @module api/validate
 * zod validation at the edge: a failed parse becomes a 400 problem naming each field.
 */
import type { z } from 'zod'
import { ApiProblem, zodIssuesToFields } from './problem.ts'

export function parseOrProblem<S extends z.ZodType>(schema: S, value: unknown, prefix = ''): z.output<S> {
  const result = schema.safeParse(value)
  if (!result.success) {
    const errors = zodIssuesToFields(result.error.issues, prefix)
    throw new ApiProblem(400, errors.map((e) => `${e.path}: ${e.message}`).join('; '), errors)
  }
  return result.data
}

/** Query parameters as a plain object of strings (the last value wins for repeated keys). */
export function queryObject(url: string): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [k, v] of new URL(url).searchParams) out[k] = v
  return out
}
