/**
 * @module api/routes/products
 * GET /v1/products, GET /v1/products/{id}, GET /v1/equilibrium, POST /v1/fit: the product catalogue,
 * equilibrium moisture, and calibration from a grower's own weighings. Same shapes as the CLI.
 */
import { Hono } from 'hono'
import { z } from 'zod'
import { equilibriumHumidityAnswer, equilibriumMoistureAnswer } from '../../analysis/equilibrium-answers.ts'
import { optionWords, optionWordsAll } from '../../analysis/option-names.ts'
import { PRODUCT_CATALOGUE, productById, productIds } from '../../product/catalogue.ts'
import { fitWeighings, profileFromFit } from '../../product/fit-weighings.ts'
import type { ProductProfile } from '../../product/profile.ts'
import { type MoistureReference, parseWeighingsCsv } from '../../product/weighings.ts'
import { fitJson } from '../../report/fit-json.ts'
import { productSummaryJson } from '../../report/product-json.ts'
import type { ApiConfig } from '../config.ts'
import { isRuntimeFault, rethrowAsProblem } from '../errors.ts'
import { registerOperation } from '../operations.ts'
import { ApiProblem } from '../problem.ts'
import { numberParam } from '../schemas/params.ts'
import { productSchemas } from '../schemas/responses/products.ts'
import { checkedUploadText, readUpload } from '../upload.ts'
import { parseOrProblem, queryObject } from '../validate.ts'
import { workControl } from '../work.ts'

const productIdParam = z.string().describe('catalogue product id (kebab-case), see GET /v1/products')

export const equilibriumQuerySchema = z
  .strictObject({
    product: productIdParam,
    tdb: numberParam('air temperature [°C]'),
    rh: numberParam('relative humidity [%]: gives the equilibrium moisture').optional(),
    moistureWb: numberParam('product moisture, wet basis [%]: gives the equilibrium RH').optional(),
    direction: z
      .enum(['desorption', 'adsorption'])
      .optional()
      .describe('isotherm branch: desorption (drying, default) or adsorption (rewetting)'),
  })
  .superRefine((q, ctx) => {
    if ((q.rh === undefined) === (q.moistureWb === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['rh'], message: 'give exactly one of rh or moistureWb' })
    }
  })

export const fitQuerySchema = z
  .strictObject({
    dryMass: numberParam('dry mass of the tray contents [g]').optional(),
    initialWb: numberParam('initial moisture, wet basis [%]').optional(),
    finalWb: numberParam('moisture at the last weighing, wet basis [%]').optional(),
    thickness: numberParam('product thickness [mm] (enables the diffusion model)').optional(),
    shape: z
      .enum(['slab', 'cylinder', 'sphere'])
      .optional()
      .describe('product shape for the diffusion model'),
    targetWb: numberParam('target moisture, wet basis [%], for the predicted time to target').optional(),
    product: productIdParam.optional().describe('catalogue product whose isotherm a returned profile keeps'),
    id: z
      .string()
      .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'must be kebab-case')
      .optional()
      .describe('id of the returned profile'),
  })
  .superRefine((q, ctx) => {
    const n = [q.dryMass, q.initialWb, q.finalWb].filter((v) => v !== undefined).length
    if (n !== 1)
      ctx.addIssue({
        code: 'custom',
        path: ['dryMass'],
        message: 'give exactly one of dryMass, initialWb or finalWb',
      })
  })

function productOr404(id: string): ProductProfile {
  try {
    return productById(id)
  } catch {
    throw new ApiProblem(404, `no product '${id}'; known ids: ${productIds().join(', ')}`, [
      { path: 'product', message: 'unknown product id' },
    ])
  }
}

export const productsRouter = new Hono()
  .get('/', (c) => c.json(PRODUCT_CATALOGUE.map(productSummaryJson)))
  .get('/:id', (c) => c.json(productOr404(c.req.param('id'))))

export const equilibriumRouter = new Hono().get('/', (c) => {
  const q = parseOrProblem(equilibriumQuerySchema, queryObject(c.req.url))
  const profile = productOr404(q.product)
  const direction = q.direction ?? 'desorption'
  try {
    return c.json(
      q.rh !== undefined
        ? equilibriumMoistureAnswer(profile, q.tdb, q.rh, direction)
        : equilibriumHumidityAnswer(profile, q.tdb, q.moistureWb as number, direction),
    )
  } catch (e) {
    if (e instanceof RangeError) throw new ApiProblem(400, e.message, [{ path: 'query', message: e.message }])
    throw e
  }
})

export const fitRouter = (config: ApiConfig) =>
  new Hono().post('/', async (c) => {
    const work = workControl(c, config)
    const upload = await readUpload(c, { defaultName: 'weighings.csv' })
    const q = parseOrProblem(fitQuerySchema, upload.options ?? upload.query, upload.options ? 'options' : '')
    // with an options part, the query string must be empty: nothing given is silently ignored
    if (upload.options !== undefined) parseOrProblem(z.strictObject({}), upload.query)
    if (upload.files.length !== 1) {
      throw new ApiProblem(400, `send exactly one weighings file, got ${upload.files.length}`, [
        { path: 'file', message: 'one file part expected' },
      ])
    }
    const reference: MoistureReference =
      q.dryMass !== undefined
        ? { dryMassG: q.dryMass }
        : q.initialWb !== undefined
          ? { initialWbPct: q.initialWb }
          : { finalWbPct: q.finalWb as number }
    const base = q.product !== undefined ? productOr404(q.product) : undefined
    // Row and column limits before parsing (without them 130,000 weighings overflowed the stack).
    const text = checkedUploadText(upload.files[0], config, 'weighings')
    work.checkpoint()
    try {
      const weighings = parseWeighingsCsv(text)
      work.checkpoint()
      const fit = fitWeighings(weighings, {
        reference,
        thicknessMm: q.thickness,
        shape: q.shape ?? base?.kinetics.shape ?? 'slab',
        targetWbPct: q.targetWb,
      })
      const profile = base ? profileFromFit(fit, base, q.id ?? `${base.id}-calibrated`, q.targetWb) : null
      // the engine's messages name options as CLI flags: renamed as this request names them
      return c.json({ ...fitJson(fit), warnings: optionWordsAll(fit.warnings, 'query'), profile })
    } catch (e) {
      if (e instanceof RangeError && !isRuntimeFault(e)) e.message = optionWords(e.message, 'query')
      rethrowAsProblem(e)
    }
  })

registerOperation({
  method: 'get',
  path: '/v1/products',
  summary: 'Product catalogue',
  description:
    'Every built-in product profile with its initial and target moisture, water-activity target and models.',
  response: {
    contentType: 'application/json',
    description: 'list of product summaries',
    schema: () => productSchemas().productSummaryResponseSchema,
  },
  errors: [],
  examples: [{ name: 'all products', url: '/v1/products' }],
})
registerOperation({
  method: 'get',
  path: '/v1/products/:id',
  summary: 'One product profile',
  description:
    'The full profile with the source and a confidence flag (published, fitted, memory, user) for every number.',
  response: {
    contentType: 'application/json',
    description: 'the profile',
    schema: () => productSchemas().productProfileResponseSchema,
  },
  errors: [404],
  examples: [{ name: 'raisins', url: '/v1/products/grapes-to-raisins' }],
})
registerOperation({
  method: 'get',
  path: '/v1/equilibrium',
  summary: 'Equilibrium moisture or equilibrium RH',
  description:
    'With rh: the equilibrium moisture content of the product (wet and dry basis) in air at tdb and rh. With moistureWb: the equilibrium relative humidity (water activity × 100) of the product at that moisture.',
  query: equilibriumQuerySchema,
  response: {
    contentType: 'application/json',
    description: 'the equilibrium point, model and source',
    schema: () => productSchemas().equilibriumResponseSchema,
  },
  errors: [400, 404],
  examples: [
    { name: 'shelled corn, 15.6 °C, 80 %', url: '/v1/equilibrium?product=shelled-corn&tdb=15.6&rh=80' },
    { name: 'figs at 22 % wb', url: '/v1/equilibrium?product=figs&tdb=25&moistureWb=22' },
  ],
})
registerOperation({
  method: 'post',
  path: '/v1/fit',
  summary: 'Fit drying kinetics to weighings',
  description:
    'Body: a weighings CSV (header elapsed_h or time, mass_g, optional air_c, rh_pct) as text/csv with options in the query, or multipart with a file part and an options JSON part. Fits Lewis, Page and diffusion, picks by AICc.',
  query: fitQuerySchema,
  requestBody: [
    { contentType: 'text/csv', description: 'weighings CSV' },
    { contentType: 'multipart/form-data', description: 'file part + options JSON part' },
  ],
  response: {
    contentType: 'application/json',
    description: 'fitted models, the best by AICc, and a profile when product is given',
    schema: () => productSchemas().fitResponseSchema,
  },
  errors: [400, 404, 413, 415, 422],
  examples: [
    {
      name: 'six weighings of apple slices',
      url: '/v1/fit?dryMass=150&thickness=5&targetWb=20&product=apple-slices',
      contentType: 'text/csv',
      body: 'elapsed_h,mass_g\n0,1000\n1,780\n2,610\n3,490\n4,400\n6,290\n8,230\n10,200\n',
    },
  ],
})
