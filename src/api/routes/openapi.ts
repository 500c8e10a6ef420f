import { Hono } from 'hono'
import type { ApiConfig } from '../config.ts'
import { buildOpenApiDocument } from '../openapi.ts'

/** GET /openapi.json: the OpenAPI 3.1 description of every route, with this server's limits. */
export const openApiRouter = (config: ApiConfig) =>
  new Hono().get('/', (c) => c.json(buildOpenApiDocument(config)))
