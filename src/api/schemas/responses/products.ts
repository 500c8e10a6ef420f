/**
 * @module api/schemas/responses/products
 * The answers of GET /v1/products, GET /v1/products/{id}, GET /v1/equilibrium and POST /v1/fit, with the
 * unit of every field. The constants of an isotherm or kinetics equation carry the units of the equation
 * named by its `model` (product/isotherm-models.ts, product/kinetics-models.ts; docs/product-sources.md).
 */
import { z } from 'zod'
import type { WeighingsFit } from '../../../product/fit-weighings.ts'
import type { ProductProfile } from '../../../product/profile.ts'
import { count, num, numOrNull, once, text, texts } from './common.ts'

/** How a number is known. */
const confidenceSchema = once(() =>
  z
    .enum(['published', 'transcribed', 'fitted', 'memory', 'user'])
    .describe(
      'how the number is known: read in the source, transcribed, fitted, from memory, or given by the user',
    ),
)

/** A number with its source and how it is known. */
const sourced = (what: string, unit: string) =>
  z
    .strictObject({
      value: num(`${what} [${unit}]`),
      source: text('where the number comes from'),
      confidence: confidenceSchema(),
    })
    .describe(`${what} [${unit}], with its source`)

/** The source of each constant of an equation, where they differ. */
const parameterSourcesSchema = once(() =>
  z
    .record(
      z.string(),
      z.strictObject({ source: text('source of the constant'), confidence: confidenceSchema() }),
    )
    .optional()
    .describe('the source of each constant, where they differ'),
)

/** A sorption isotherm: its equation (ASABE D245 forms or GAB) and where it was fitted. */
const isothermSpecSchema = once(() => {
  const d245 = <M extends string>(model: M, a: string, b: string, c: string) =>
    z.strictObject({
      model: z.literal(model).describe('ASABE D245 equation, Me in % dry basis, T in °C, RH a fraction'),
      a: num(`constant A [${a}]`),
      b: num(`constant B [${b}]`),
      c: num(`constant C [${c}]`),
    })

  const isothermEquation = z.discriminatedUnion('model', [
    // RH = 1 − exp[−A(T + C)·Me^B]
    d245('modified-henderson', '1/(°C · (% db)^B)', 'dimensionless', '°C'),
    // RH = exp[−A/(T + C)·exp(−B·Me)]
    d245('modified-chung-pfost', '°C', '1/% db', '°C'),
    // RH = exp[−exp(A + B·T)/Me^C]
    d245('modified-halsey', 'dimensionless', '1/°C', 'dimensionless'),
    // Me = (A + B·T)·[RH/(1 − RH)]^(1/C)
    d245('modified-oswin', '% db', '% db per °C', 'dimensionless'),
    z.strictObject({
      model: z.literal('gab').describe('Guggenheim–Anderson–de Boer, X in kg/kg dry basis'),
      xm0: num('monolayer moisture at the reference [kg water per kg dry matter]'),
      c0: num('GAB constant C0 [dimensionless]'),
      k0: num('GAB constant K0 [dimensionless]'),
      hxJPerMol: num('temperature term of Xm [J/mol]'),
      hcJPerMol: num('temperature term of C [J/mol]'),
      hkJPerMol: num('temperature term of K [J/mol]'),
    }),
  ])

  return z.strictObject({
    equation: isothermEquation,
    source: text('source of the isotherm'),
    confidence: confidenceSchema(),
    parameters: parameterSourcesSchema(),
    validTempC: z
      .tuple([num('lowest [°C]'), num('highest [°C]')])
      .describe('temperatures it was fitted at [°C]'),
    validRhPct: z
      .tuple([num('lowest [%]'), num('highest [%]')])
      .describe('relative humidities it was fitted at [%]'),
  })
})

/** A thin-layer drying equation and the rate law of its constant. */
const kineticsEquationSchema = once(() => {
  const rateLaw = z.discriminatedUnion('form', [
    z.strictObject({
      form: z.literal('arrhenius'),
      kRefPerH: num('rate constant at the reference temperature [1/h, or h⁻ⁿ for Page]'),
      tRefC: num('reference temperature [°C]'),
      activationEnergyJPerMol: num('activation energy [J/mol]'),
    }),
    z.strictObject({
      form: z.literal('linear-t-rh'),
      k0: num('intercept [1/time unit]'),
      kPerC: num('change per °C [1/(time unit · °C)]'),
      kPerRh: num('change per % RH [1/(time unit · %)]'),
      timeUnit: z.enum(['min', 'h']).describe('the time unit of the constants'),
    }),
  ])

  return z.discriminatedUnion('model', [
    z.strictObject({ model: z.literal('lewis'), k: rateLaw }),
    z.strictObject({
      model: z.literal('page'),
      k: rateLaw,
      n: z.union([
        num('Page exponent [dimensionless]'),
        z.strictObject({
          n0: num('exponent intercept [dimensionless]'),
          nPerC: num('change per °C [1/°C]'),
          nPerRh: num('change per % RH [1/%]'),
        }),
      ]),
    }),
    z.strictObject({
      model: z.literal('henderson-pabis'),
      k: rateLaw,
      a: num('coefficient a [dimensionless]'),
    }),
    z.strictObject({
      model: z.literal('diffusion'),
      dRefM2PerS: num('effective diffusivity at the reference [m²/s]'),
      tRefC: num('reference temperature [°C]'),
      activationEnergyJPerMol: num('activation energy [J/mol]'),
    }),
    z.strictObject({ model: z.literal('thompson-corn') }),
  ])
})

/** A product profile: every number with its source and confidence. */
const productProfileResponseSchema = once(() => {
  const confidence = confidenceSchema()
  const parameterSources = parameterSourcesSchema()
  const isothermSpec = isothermSpecSchema()
  const kineticsEquation = kineticsEquationSchema()
  return z
    .strictObject({
      id: text('product id'),
      name: text('product name'),
      category: z
        .enum(['grain', 'oilseed', 'fruit', 'vegetable', 'herb', 'fish', 'beverage-crop'])
        .describe('product category'),
      variantOf: z.string().optional().describe('the catalogue profile this one varies'),
      initialMoistureWbPct: sourced('initial moisture, wet basis', '%'),
      targetMoistureWbPct: sourced('target moisture, wet basis', '%'),
      waterActivityTarget: sourced('water activity for safe storage', '0–1'),
      maxProductTempC: sourced('highest product temperature', '°C').nullable(),
      isotherm: z.strictObject({ desorption: isothermSpec, adsorption: isothermSpec.optional() }),
      kinetics: z.strictObject({
        equation: kineticsEquation,
        referenceThicknessMm: num('thickness the kinetics were measured at [mm]'),
        shape: z.enum(['slab', 'cylinder', 'sphere']).describe('product shape of the diffusion model'),
        source: text('source of the kinetics'),
        confidence,
        parameters: parameterSources,
        rewettingRateFactor: sourced('rewetting rate ÷ drying rate', 'ratio'),
        biotNumber: sourced('mass-transfer Biot number at the reference size, h·L/D', 'dimensionless')
          .optional()
          .describe('surface (skin) resistance against the inside; absent: none'),
        wallThicknessMm: sourced('wall thickness of a hollow product, its drying length', 'mm').optional(),
        referenceWallThicknessMm: num('wall at which the kinetics were measured [mm]').optional(),
        airVelocity: z
          .strictObject({
            referenceMs: num('air speed of the measurements [m/s]'),
            exponent: num('exponent of the air-speed correction [dimensionless]'),
            source: text('its source'),
            confidence,
          })
          .optional(),
      }),
      defaultThicknessMm: sourced('default thickness', 'mm'),
      defaultLoadingKgPerM2: sourced('default loading', 'kg fresh per m²'),
      cautions: texts('food-safety and handling cautions'),
      notes: z.string().optional().describe('notes'),
    })
    .describe('a product profile: every number with its source and confidence')
})

/** The catalogue list. */
const productSummaryResponseSchema = once(() => {
  const confidence = confidenceSchema()
  return z.array(
    z.strictObject({
      id: text('product id'),
      name: text('product name'),
      category: text('product category'),
      variantOf: z.string().nullable().describe('the profile it varies'),
      initialMoistureWbPct: num('initial moisture, wet basis [%]'),
      targetMoistureWbPct: num('target moisture, wet basis [%]'),
      waterActivityTarget: num('water activity for safe storage [0–1]'),
      maxProductTempC: numOrNull('highest product temperature [°C]; null: no limit'),
      isothermModel: text('isotherm equation'),
      isothermConfidence: confidence,
      kineticsModel: text('kinetics equation'),
      kineticsConfidence: confidence,
    }),
  )
})

/** The equilibrium moisture at an air state, or the equilibrium RH of a moisture. */
const equilibriumResponseSchema = once(() => {
  const confidence = confidenceSchema()
  const equilibriumBase = {
    productId: text('product id'),
    dryBulbC: num('air temperature [°C]'),
    direction: z.enum(['desorption', 'adsorption']).describe('isotherm branch'),
    model: text('isotherm equation'),
    source: text('its source'),
    confidence,
    calibratedTempC: z
      .tuple([num('lowest [°C]'), num('highest [°C]')])
      .describe('temperatures it was fitted at [°C]'),
    calibratedRhPct: z
      .tuple([num('lowest [%]'), num('highest [%]')])
      .describe('relative humidities it was fitted at [%]'),
    extrapolated: z.boolean().describe('outside the temperatures or humidities it was fitted at'),
  }

  return z.union([
    z
      .strictObject({
        ...equilibriumBase,
        relativeHumidityPct: num('air relative humidity [%]'),
        equilibriumMoistureWbPct: num('equilibrium moisture, wet basis [%]'),
        equilibriumMoistureDbPct: num('equilibrium moisture, dry basis [%]'),
        netIsostericHeatKjPerMol: num('net isosteric heat of sorption [kJ/mol]'),
        heatOfSorptionMethod: text('how the heat of sorption was obtained'),
      })
      .describe('with rh: the equilibrium moisture'),
    z
      .strictObject({
        ...equilibriumBase,
        moistureWbPct: num('product moisture, wet basis [%]'),
        moistureDbPct: num('product moisture, dry basis [%]'),
        equilibriumRelativeHumidityPct: num('equilibrium relative humidity [%]'),
        waterActivity: num('water activity [0–1]'),
      })
      .describe('with moistureWb: the equilibrium relative humidity (water activity)'),
  ])
})

/** One drying model fitted to the weighings. */
const fittedModelSchema = once(() =>
  z.strictObject({
    model: z.enum(['lewis', 'page', 'diffusion']).describe('drying model'),
    params: z
      .record(
        z.string(),
        num(
          'fitted value, its unit by its name [kPerH 1/h; kPerHn h⁻ⁿ; n dimensionless; tauRatePerH 1/h; …Db kg water per kg dry matter]',
        ),
      )
      .describe('fitted parameters by name'),
    standardErrors: z
      .record(z.string(), num('standard error [unit of the parameter]'))
      .describe('standard error of each parameter'),
    rmseDb: num('root mean square error [kg water per kg dry matter]'),
    r2: num('coefficient of determination [0–1]'),
    aicc: num('small-sample Akaike information criterion [dimensionless]'),
    converged: z.boolean().describe('the fit converged'),
  }),
)

/** The columns the weighings were read from. */
const weighingColumnsSchema = once(() => {
  const column = <U extends z.ZodType>(unit: U) =>
    z.strictObject({
      index: count('column, from 0'),
      header: text('the header as written'),
      unit,
      unitFrom: z.enum(['header', 'default']).describe('unit written in the header, or assumed'),
    })
  return z
    .strictObject({
      time: column(z.enum(['s', 'min', 'h', 'd']).describe('time unit')).extend({
        dateTime: z.boolean().describe('a date-time column'),
      }),
      mass: column(z.enum(['g', 'kg', 'lb', 'oz']).describe('mass unit')),
      airTemp: column(z.enum(['C', 'F']).describe('temperature unit')).nullable(),
      rh: column(z.literal('%').describe('relative humidity unit')).nullable(),
      alsoMatched: z.array(
        z.strictObject({
          role: z
            .enum(['time', 'mass', 'air temperature', 'relative humidity'])
            .describe('what it could have been'),
          header: text('the header'),
        }),
      ),
    })
    .nullable()
    .describe('the columns the weighings were read from')
})

/** Drying kinetics fitted to weighings. */
const fitResponseSchema = once(() => {
  const fittedModel = fittedModelSchema()
  return z
    .strictObject({
      criterion: z
        .literal('AICc (small-sample Akaike information criterion)')
        .describe('how the best model is chosen'),
      best: fittedModel,
      models: z.array(fittedModel),
      effectiveDiffusivityM2PerS: z
        .strictObject({
          value: num('effective diffusivity [m²/s]'),
          standardError: num('standard error [m²/s]'),
        })
        .nullable()
        .describe('from the diffusion fit when a thickness was given'),
      shape: z.enum(['slab', 'cylinder', 'sphere']).describe('product shape of the diffusion model'),
      thicknessMm: numOrNull('product thickness [mm]'),
      dryMassG: num('dry matter on the tray [g]'),
      initialMoistureWbPct: num('moisture at the first weighing, wet basis [%]'),
      lastMoistureWbPct: num('moisture at the last weighing, wet basis [%]'),
      equilibriumMoistureWbPct: num('fitted equilibrium moisture, wet basis [%]'),
      readingsUsed: count('weighings used'),
      missingMassLines: z.array(count('line with an empty mass')),
      outliers: z.array(
        z.strictObject({
          line: count('line'),
          timeH: num('time [h]'),
          massG: num('mass [g]'),
          residualDb: num('residual [kg water per kg dry matter]'),
        }),
      ),
      periods: z.strictObject({
        intervals: z.array(
          z.strictObject({
            startH: num('start [h]'),
            endH: num('end [h]'),
            meanMoistureDb: num('mean moisture [kg water per kg dry matter]'),
            rateDbPerH: num('drying rate [kg water per kg dry matter per h]'),
          }),
        ),
        constantRate: z
          .strictObject({
            startH: num('start [h]'),
            endH: num('end [h]'),
            rateDbPerH: num('rate [kg water per kg dry matter per h]'),
            criticalMoistureDb: num('critical moisture [kg water per kg dry matter]'),
          })
          .nullable()
          .describe('the constant-rate period, when one was seen'),
        fallingRateStartH: num('start of the falling-rate period [h]'),
      }),
      target: z
        .strictObject({
          moistureWbPct: num('target moisture, wet basis [%]'),
          timeH: numOrNull('predicted time to it [h]; null: not reached'),
          note: text('how it was predicted'),
        })
        .nullable(),
      meanAirTempC: numOrNull('mean air temperature of the weighings [°C]'),
      meanRhPct: numOrNull('mean relative humidity of the weighings [%]'),
      columns: weighingColumnsSchema(),
      columnsRead: z.string().nullable().describe('the same, in one sentence'),
      warnings: texts('what limits the fit'),
      profile: productProfileResponseSchema()
        .nullable()
        .describe('with product: a profile with the fitted kinetics'),
    })
    .describe('drying kinetics fitted to weighings')
})

/** The schemas, built on first use (GET /openapi.json, GET /docs, tests) and kept. */
export const productSchemas = once(() => ({
  productProfileResponseSchema: productProfileResponseSchema(),
  productSummaryResponseSchema: productSummaryResponseSchema(),
  equilibriumResponseSchema: equilibriumResponseSchema(),
  fitResponseSchema: fitResponseSchema(),
}))

/** Compile-time checks that the schemas describe the types (see assessment.ts). */
type Describes<T, S extends T> = S
export type ProfileDescribed = Describes<
  ProductProfile,
  z.output<ReturnType<typeof productSchemas>['productProfileResponseSchema']>
>
export type FitDescribed = Describes<
  Omit<WeighingsFit, 'predictMoistureDb'>,
  Omit<z.output<ReturnType<typeof productSchemas>['fitResponseSchema']>, 'profile'>
>
