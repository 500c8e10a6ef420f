/**
 * @module api/operations
 * The documented operations of the API: one entry per route, from which GET /openapi.json and GET /docs
 * are generated. Query parameters and bodies come from the same zod schemas that validate requests.
 */
import { z } from 'zod'
import { airQuerySchema, airStateResponseSchema } from './schemas/air.ts'

export interface OperationExample {
  /** Short name. */
  name: string
  /** Path with query string, e.g. `/v1/air?tdb=40&twb=20`. */
  url: string
  /** For POST examples: the content type and a body to send (text). */
  contentType?: string
  body?: string
}

export interface Operation {
  method: 'get' | 'post'
  path: string
  summary: string
  description: string
  /** zod object of the query string, each field described with its unit. */
  query?: z.ZodObject
  /** Request bodies by content type (schema for JSON bodies; a description for file bodies). */
  requestBody?: { contentType: string; description: string; schema?: z.ZodType }[]
  /**
   * Success response: content type and schema. A function builds the schema when the OpenAPI document is
   * made (large answer schemas are not built in every worker thread that never serves /openapi.json).
   */
  response: { contentType: string; description: string; schema?: z.ZodType | (() => z.ZodType) }
  /** Error statuses this operation can answer with (problem details). */
  errors: number[]
  examples: OperationExample[]
}

const operations: Operation[] = [
  {
    method: 'get',
    path: '/healthz',
    summary: 'Liveness check',
    description:
      'Answers 200 with {"ok":true} when the service is up. Does no work, and answers while the worker threads compute. On Node, `work` gives the state of the worker pool.',
    response: {
      contentType: 'application/json',
      description: 'service is up',
      schema: z.object({
        ok: z.boolean().describe('true: the service is up'),
        service: z.string().describe('the name of the service'),
        work: z
          .object({
            threads: z.number().describe('worker threads [count]'),
            starting: z.number().describe('worker threads still loading [count]'),
            running: z.number().describe('requests computing now [count]'),
            queued: z.number().describe('requests waiting for a thread [count]'),
            queueLimit: z.number().describe('waiting requests beyond which the answer is 503 [count]'),
            completed: z.number().describe('requests answered by the threads since start [count]'),
            cancelled: z.number().describe('requests stopped because the client went away [count]'),
            refused: z.number().describe('requests refused with 503 since start [count]'),
            restarted: z.number().describe('worker threads replaced since start [count]'),
          })
          .optional()
          .describe('Node only: the worker pool'),
      }),
    },
    errors: [],
    examples: [{ name: 'health', url: '/healthz' }],
  },
  {
    method: 'get',
    path: '/v1/air',
    summary: 'Moist-air state',
    description:
      'The full moist-air state from dry bulb and exactly one of rh, twb, tdp or w, at a pressure or an elevation (sea level by default). ' +
      'Relative humidity is over liquid water at all temperatures, as weather stations report it. Same keys as `dryhours air --json`.',
    query: airQuerySchema,
    response: {
      contentType: 'application/json',
      description: 'the air state',
      schema: airStateResponseSchema,
    },
    errors: [400],
    examples: [
      { name: 'ASHRAE HOF 2017 ch. 1 Example 1', url: '/v1/air?tdb=40&twb=20' },
      { name: 'with RH at 1200 m', url: '/v1/air?tdb=30&rh=40&elevation=1200' },
    ],
  },
]

/** Register further operations (each resource module calls this once, at import). */
export function registerOperation(op: Operation): void {
  if (!operations.some((o) => o.method === op.method && o.path === op.path)) operations.push(op)
}

export function listOperations(): readonly Operation[] {
  return operations
}
