/**
 * @module api/schemas/responses/energy
 * The answer of POST /v1/energy-chart (and `dryhours energy-chart --json`), with the unit of every field.
 * A chart's values are in its set's `unit`: MJ per kg of water (raw and regression views) or % of the
 * expected energy (physics view).
 */
import { z } from 'zod'
import type { EnergyChartAssessment } from '../../../analysis/energy/energy-chart.ts'
import type { RunRuleId } from '../../../analysis/energy/run-rules.ts'
import { count, num, numOrNull, once, text, texts } from './common.ts'

const RUN_RULES = ['WE1', 'WE2', 'WE3', 'WE4'] as const satisfies readonly RunRuleId[]

const inUnit = (what: string) => num(`${what} [the chart set's unit]`)
const sideSchema = once(() => z.enum(['above', 'below']).describe('side of the centre line'))

/** The three control charts of a chart set: individuals and moving range, EWMA, CUSUM. */
const controlChartSchemas = once(() => {
  const side = sideSchema()
  const individuals = z.strictObject({
    values: z.array(inUnit('charted value')),
    baselineCount: count('baseline batches'),
    centerLine: inUnit('centre line, mean of the baseline'),
    meanMovingRange: inUnit('mean moving range of the baseline'),
    sigma: inUnit('standard deviation estimated as mean moving range ÷ 1.128'),
    upperControlLimit: inUnit('upper control limit, centre + 3σ'),
    lowerControlLimit: inUnit('lower control limit, centre − 3σ'),
    movingRanges: z.array(numOrNull("moving range [the chart set's unit]; null for the first")),
    movingRangeUpperLimit: inUnit('upper limit of the moving ranges'),
    movingRangeLowerLimit: inUnit('lower limit of the moving ranges'),
    signals: z.array(
      z.strictObject({
        index: count('charted point completing the pattern, from 0'),
        rule: z.enum(RUN_RULES).describe('Western Electric run rule'),
        side,
        description: text('the rule in words'),
      }),
    ),
    movingRangeSignals: z.array(count('charted point whose moving range is beyond its limit')),
    firstMonitoringSignal: z
      .number()
      .int()
      .nullable()
      .describe('first signal after the baseline [index]; null: none'),
  })

  const pointSignals = z.array(z.strictObject({ index: count('charted point, from 0'), side }))

  const ewma = z.strictObject({
    lambda: num('smoothing weight λ [0–1]'),
    limitWidthL: num('limit width L [σ of the EWMA]'),
    centerLine: inUnit('centre line'),
    sigma: inUnit('standard deviation of the charted values'),
    ewma: z.array(inUnit('exponentially weighted moving average')),
    upperLimits: z.array(inUnit('upper limit')),
    lowerLimits: z.array(inUnit('lower limit')),
    signals: pointSignals,
    firstMonitoringSignal: z
      .number()
      .int()
      .nullable()
      .describe('first signal after the baseline [index]; null: none'),
  })

  const cusum = z.strictObject({
    k: num('reference value k [σ]'),
    h: num('decision interval h [σ]'),
    centerLine: inUnit('target (centre line)'),
    sigma: inUnit('standard deviation'),
    baselineCount: count('baseline batches'),
    upper: z.array(num('upper cumulative sum [σ]')),
    lower: z.array(num('lower cumulative sum [σ]')),
    signals: pointSignals,
    firstUpperSignal: z.number().int().nullable().describe('first rise signal [index]; null: none'),
    firstLowerSignal: z.number().int().nullable().describe('first fall signal [index]; null: none'),
  })
  return { individuals, ewma, cusum }
})

/** A chart set: its charts and what they found. */
const chartSetSchema = once(() => {
  const side = sideSchema()
  const { individuals, ewma, cusum } = controlChartSchemas()
  const batchRef = z.strictObject({
    batchIndex: count('index of the batch in the log, from 0'),
    batchId: text('batch id from the log'),
    startText: text('start time as written in the log'),
  })

  const chartSignal = batchRef.extend({
    rules: z
      .array(z.enum([...RUN_RULES, 'EWMA', 'CUSUM']))
      .describe('the rules that signalled (Western Electric run rules, EWMA, CUSUM)'),
    side,
    batchesAfterBaseline: count('batches after the baseline when it signalled'),
  })

  const finding = z.strictObject({
    firstSignal: chartSignal.nullable().describe('the first signal after the baseline'),
    firstRiseSignal: chartSignal.nullable().describe('the first signal of a rise'),
    cusumRise: chartSignal.nullable().describe('the CUSUM’s first rise signal'),
    cusumFall: chartSignal.nullable().describe('the CUSUM’s first fall signal'),
    changePoint: batchRef
      .extend({
        probability: num('probability that the step began at this batch [0–1]'),
        intervalFrom: batchRef,
        intervalTo: batchRef,
        intervalProbability: num('probability that the step began within the interval [0–1]'),
        searchedUpTo: batchRef,
      })
      .nullable()
      .describe('where the step most likely began'),
    estimatedChangeStart: batchRef.nullable().describe('the batch where the change most likely began'),
    shiftAfterChange: numOrNull("mean shift after the change [the chart set's unit]"),
    baselineSignals: count('signals among the baseline batches'),
  })

  return z.strictObject({
    batchIndices: z.array(count('batch index of each charted point')),
    unit: z.enum(['MJ/kg water', '% of expected']).describe('the unit of the charted values'),
    individuals,
    ewma,
    cusum,
    finding,
  })
})

/** The physics view (against the dryer's own fitted efficiency) and the regression view. */
const viewSchemas = once(() => {
  const chartSet = chartSetSchema()
  const physicsView = chartSet.extend({
    fit: z.strictObject({
      efficiency: num('overall efficiency fitted on the baseline [0–1]'),
      fixedLossMj: num('fixed loss per batch [MJ]'),
      fixedLossHeldAtZero: z.boolean().describe('the free fit gave a negative loss, held at 0'),
      efficiencyStandardError: num('standard error of the efficiency [0–1]'),
      fixedLossStandardError: numOrNull('standard error of the fixed loss [MJ]; null when held at 0'),
      residualStandardError: num('residual standard error [MJ per kg water]'),
      crossValidatedError: num('leave-one-out prediction error [MJ per kg water]'),
      observations: count('baseline batches fitted'),
      inverse: z
        .array(z.array(num('element of (XᵀX)⁻¹ [inverse of the product of the two regressors’ units]')))
        .describe('(XᵀX)⁻¹ of the fit’s regressors, rows and columns in the order ideal heat, 1/water'),
    }),
    idealHeatMjPerKg: z.array(num('heat an ideal dryer needs [MJ per kg water]')),
    heatedWetBulbC: z.array(num('wet bulb of the heated air [°C]')),
    expectedSpecificEnergyMjPerKg: z.array(num('expected energy [MJ per kg water]')),
    ratioPct: z.array(num('measured ÷ expected energy [%]')),
    leverages: z.array(num('leverage of each batch in the fit [0–1]')),
  })

  const regressionView = chartSet.extend({
    regression: z.strictObject({
      coefficients: z.array(
        z.strictObject({
          name: text('regressor (intercept first)'),
          estimate: num('coefficient [MJ per kg water per unit of the regressor]'),
          standardError: num('standard error [as the estimate]'),
          tStatistic: num('t statistic [ratio]'),
        }),
      ),
      rSquared: num('coefficient of determination [0–1]'),
      adjustedRSquared: num('adjusted coefficient of determination [0–1]'),
      residualStandardError: num('residual standard error [MJ per kg water]'),
      observations: count('baseline batches fitted'),
      degreesOfFreedom: count('residual degrees of freedom'),
    }),
    fitted: z.array(num('fitted specific energy [MJ per kg water]')),
    residuals: z.array(num('measured − fitted [MJ per kg water]')),
    leverages: z.array(num('leverage [0–1]')),
    standardizedResiduals: z.array(num('residual ÷ its standard error [ratio]')),
    crossValidatedError: num('leave-one-out prediction error [MJ per kg water]'),
  })
  return { physicsView, regressionView }
})

/** One batch of the log with the figures derived from it. */
const batchSchema = once(() =>
  z.strictObject({
    index: count('index in the log, from 0'),
    line: count('line of the log'),
    batchId: text('batch id'),
    startText: text('start as written'),
    startUtcMs: num('start [ms since 1970-01-01 UTC]'),
    durationH: num('duration [h]'),
    freshMassKg: num('fresh mass [kg]'),
    waterRemovedKg: num('water removed [kg]'),
    energyMj: num('energy used [MJ]'),
    specificEnergyMjPerKg: num('energy per kg of water removed [MJ/kg]'),
    dryingTempC: num('drying air temperature [°C]'),
    latentHeatMjPerKg: num('latent heat of the water [MJ/kg]'),
    sorptionHeatMj: numOrNull('heat of sorption of the batch [MJ]; null without a product'),
    idealHeatMj: num('heat an ideal dryer needs [MJ]'),
    thermalEfficiencyPct: num('ideal heat ÷ energy used [%]'),
    ambient: z
      .strictObject({
        dryBulbC: num('outside dry bulb [°C]'),
        relativeHumidityPct: num('outside relative humidity [%]'),
        humidityRatioGPerKg: num('outside humidity ratio [g/kg dry air]'),
        pressureKpa: num('pressure [kPa]'),
        source: z.enum(['log', 'weather']).describe('from the log, or from the weather file'),
      })
      .nullable(),
  }),
)

/** Control charts of a heated dryer's energy use. */
export const energyChartResponseSchema = once(() => {
  const chartSet = chartSetSchema()
  const { physicsView, regressionView } = viewSchemas()
  return z
    .strictObject({
      kind: z.literal('energy-chart').describe('the shape of this object'),
      accounting: z.strictObject({
        rowsRead: count('rows of the log'),
        rowsUsed: count('rows used'),
        rowsRejected: count('rows rejected'),
        linesSkipped: count('lines skipped (blank, comments)'),
        ignoredColumns: texts('columns not used'),
      }),
      rejections: z.array(
        z.strictObject({
          line: count('line of the log'),
          field: text('the column'),
          value: text('the value'),
          message: text('why it was rejected'),
        }),
      ),
      batches: z.array(batchSchema()),
      baselineCount: count('baseline batches'),
      raw: chartSet.describe('raw specific energy [MJ per kg water]'),
      physics: physicsView.nullable().describe("against the dryer's own physics [% of expected]"),
      physicsUnavailableReason: z.string().nullable().describe('why the physics view is absent'),
      adjusted: regressionView
        .nullable()
        .describe('after a regression on weather and load [MJ per kg water]'),
      adjustedUnavailableReason: z.string().nullable().describe('why the regression view is absent'),
      answer: z.strictObject({
        view: z.enum(['physics', 'regression', 'raw']).describe('the view the answer uses'),
        reason: text('why that view'),
        physicsCrossValidatedError: numOrNull('physics view prediction error [MJ per kg water]'),
        regressionCrossValidatedError: numOrNull('regression prediction error [MJ per kg water]'),
        robustness: z.strictObject({
          monitored: count('monitored batches'),
          outside: count("monitored batches outside the baseline's weather"),
          insideFromChange: count("batches from the change on inside the baseline's weather"),
          verdict: z
            .enum(['stands', 'does-not-stand', 'cannot-check', 'no-signal'])
            .describe('whether the signal stands without them'),
          firstSignalBatchId: z.string().nullable().describe('first rise signal without them'),
        }),
      }),
      baselineWeather: z
        .strictObject({
          tempC: z
            .tuple([num('lowest [°C]'), num('highest [°C]')])
            .describe('outside temperature range [°C]'),
          humidityRatioGPerKg: z
            .tuple([num('lowest [g/kg dry air]'), num('highest [g/kg dry air]')])
            .describe('outside humidity-ratio range [g/kg dry air]'),
        })
        .nullable()
        .describe("the baseline's weather range"),
      outsideBaselineWeather: z.array(z.boolean()).describe("per batch: outside the baseline's weather"),
      cusumDesign: z.strictObject({
        k: num('reference value [σ]'),
        h: num('decision interval [σ]'),
        inControlArl: num('average run length without a change [batches]'),
        arlAtShiftSigma: z.array(
          z.strictObject({ shiftSigma: num('step size [σ]'), arl: num('average run length [batches]') }),
        ),
      }),
      assumptions: texts('assumptions, with their sources'),
      warnings: texts('what limits the answer'),
      sources: texts('sources of the methods'),
      summary: texts('the answer in sentences; the first is the answer'),
    })
    .describe('control charts of a heated dryer’s energy use')
})

/** Compile-time check that the schema describes the analysis type (see assessment.ts). */
type Describes<T, S extends T> = S
export type EnergyChartDescribed = Describes<
  EnergyChartAssessment,
  z.output<ReturnType<typeof energyChartResponseSchema>>
>
