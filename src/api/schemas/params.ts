import { z } from 'zod'

/**
 * A query-string number: trimmed, finite, decimal (hex/binary/octal literals such as `0x10`, which
 * `Number()` would silently read as 16, are refused), with its unit in the description (for OpenAPI).
 */
export function numberParam(description: string) {
  return z
    .string()
    .trim()
    .min(1, 'must not be empty')
    .transform((s, ctx) => {
      const n = Number(s)
      if (!Number.isFinite(n) || /^[-+]?0[xob]/i.test(s)) {
        ctx.addIssue({ code: 'custom', message: `must be a number, got '${s}'` })
        return z.NEVER
      }
      return n
    })
    .describe(description)
}

/** A query-string list of numbers separated by commas (e.g. `0.5,1,2`), each checked as {@link numberParam}. */
export function numberListParam(description: string) {
  return z
    .string()
    .trim()
    .min(1, 'must not be empty')
    .transform((s, ctx) => {
      const parts = s.split(',').map((p) => p.trim())
      const values = parts.map(Number)
      const bad = parts.findIndex(
        (p, i) => p === '' || !Number.isFinite(values[i]) || /^[-+]?0[xob]/i.test(p),
      )
      if (bad >= 0) {
        ctx.addIssue({ code: 'custom', message: `must be numbers separated by commas, got '${parts[bad]}'` })
        return z.NEVER
      }
      return values
    })
    .describe(description)
}
