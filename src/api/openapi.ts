/**
 * @module api/openapi
 * Builds the OpenAPI 3.1 document from {@link listOperations}: query parameters, bodies and responses are
 * the JSON Schema (2020-12, which OpenAPI 3.1 uses) of the zod schemas that validate the requests.
 */
import { z } from 'zod'
import { type ApiConfig, DEFAULT_API_CONFIG, limitsTable } from './config.ts'
import { FILE_ROUTES } from './file-routes.ts'
import { listOperations } from './operations.ts'
import { PROBLEM_TYPE_BASE, PROBLEM_TYPES, problemBody } from './problem.ts'

type Json = Record<string, unknown>

function jsonSchema(schema: z.ZodType, io: 'input' | 'output'): Json {
  const s = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as Json
  delete s.$schema
  return s
}

const problemSchema: Json = {
  type: 'object',
  description: 'RFC 9457 problem details',
  properties: {
    type: {
      type: 'string',
      description: `stable identifier of the kind of problem: ${PROBLEM_TYPE_BASE}<kind>, kinds listed in x-problem-types`,
    },
    title: { type: 'string' },
    status: { type: 'integer' },
    detail: { type: 'string' },
    errors: {
      type: 'array',
      items: {
        type: 'object',
        properties: { path: { type: 'string' }, message: { type: 'string' } },
        required: ['path', 'message'],
      },
    },
  },
  required: ['type', 'title', 'status', 'detail'],
}

/**
 * The OpenAPI document, with the limits in force (`x-limits`, from `config`) and every problem type
 * (`x-problem-types`).
 */
export function buildOpenApiDocument(config: ApiConfig = DEFAULT_API_CONFIG): Json {
  const paths: Record<string, Json> = {}
  for (const op of listOperations()) {
    const parameters: Json[] = []
    if (op.query) {
      const qs = jsonSchema(op.query, 'input') as { properties?: Record<string, Json>; required?: string[] }
      for (const [name, schema] of Object.entries(qs.properties ?? {})) {
        const { description, ...rest } = schema
        parameters.push({
          name,
          in: 'query',
          required: (qs.required ?? []).includes(name),
          description: description ?? '',
          schema: rest,
        })
      }
    }
    const responses: Json = {
      '200': {
        description: op.response.description,
        content: {
          [op.response.contentType]: {
            schema: op.response.schema
              ? jsonSchema(
                  typeof op.response.schema === 'function' ? op.response.schema() : op.response.schema,
                  'output',
                )
              : {},
          },
        },
      },
    }
    // Every route that takes a file can be refused while the server is busy (Node's worker pool).
    const statuses = FILE_ROUTES.includes(op.path) ? [...new Set([...op.errors, 503])] : op.errors
    for (const status of statuses) {
      responses[String(status)] = {
        description: problemBody(status, '').title,
        content: { 'application/problem+json': { schema: problemSchema } },
      }
    }
    const operation: Json = {
      operationId: `${op.method}${op.path.replace(/[^a-zA-Z0-9]+(.)?/g, (_m, ch: string | undefined) => (ch ? ch.toUpperCase() : ''))}`,
      summary: op.summary,
      description: op.description,
      parameters,
      responses,
    }
    if (op.requestBody) {
      operation.requestBody = {
        required: true,
        content: Object.fromEntries(
          op.requestBody.map((b) => [
            b.contentType,
            {
              schema: b.schema
                ? jsonSchema(b.schema, 'input')
                : { type: 'string', description: b.description },
            },
          ]),
        ),
      }
    }
    const apiPath = op.path.replace(/:([a-zA-Z]+)/g, '{$1}')
    for (const m of op.path.matchAll(/:([a-zA-Z]+)/g)) {
      parameters.push({
        name: m[1],
        in: 'path',
        required: true,
        description: `path parameter: ${m[1]}`,
        schema: { type: 'string' },
      })
    }
    paths[apiPath] = { ...(paths[apiPath] ?? {}), [op.method]: operation }
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'dryhours API',
      version: '0.1.0',
      description:
        'Drying potential of a site from its hourly weather: moist-air states, weather-file inspection, product equilibrium, seasonal assessments and site comparisons. SI units; each field states its unit. The limits of this server are in `x-limits`; every error is a problem-details object whose `type` is one of `x-problem-types`.',
    },
    'x-limits': limitsTable(config),
    'x-problem-types': Object.entries(PROBLEM_TYPES).map(([kind, t]) => ({
      type: `${PROBLEM_TYPE_BASE}${kind}`,
      status: t.status,
      title: t.title,
      description: t.description,
    })),
    paths,
  }
}
