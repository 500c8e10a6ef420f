import { Hono } from 'hono'
import { buildOpenApiDocument } from '../openapi.ts'

/** GET /openapi.json: the OpenAPI 3.1 description of every route. */
export const openApiRouter = new Hono().get('/', (c) => c.json(buildOpenApiDocument()))
