import { z } from 'zod'

/** A query-string number: trimmed, finite, with its unit in the description (for OpenAPI). */
export function numberParam(description: string) {
  return z
    .string()
    .trim()
    .min(1, 'must not be empty')
    .transform((s, ctx) => {
      const n = Number(s)
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `must be a number, got '${s}'` })
        return z.NEVER
      }
      return n
    })
    .describe(description)
}
