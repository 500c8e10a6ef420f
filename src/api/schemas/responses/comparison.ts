/**
 * @module api/schemas/responses/comparison
 * The answers of POST /v1/assess with several methods (the methods side by side) and of POST /v1/compare,
 * with the unit of every field: the same objects as `dryhours assess --method a,b --json` and `dryhours
 * compare --json` (analysis/compare-methods.ts, analysis/compare.ts). Built on first use and kept.
 */
import { z } from 'zod'
import type { Comparison } from '../../../analysis/compare.ts'
import { COMPARE_CRITERIA } from '../../../analysis/compare.ts'
import { CALENDAR_STATES, type MethodComparison } from '../../../analysis/compare-methods.ts'
import { assessmentParts, assessmentResponseSchema } from './assessment.ts'
import { methodBinFiguresSchema } from './bin.ts'
import {
  count,
  medianP90,
  monthDay,
  num,
  numOrNull,
  once,
  share,
  spreadSchema,
  text,
  texts,
} from './common.ts'

/** One method's figures in the methods side by side. */
const methodFiguresSchema = once(() => {
  const { kindSchema } = assessmentParts()
  return z.strictObject({
    kind: kindSchema,
    label: text('the method in plain words'),
    daysToTarget: medianP90('days', "over the season's start dates").describe(
      "days to target by the method alone: median of the start dates' medians and of their P90s [days]",
    ),
    probabilityWithinDeadline: share(
      "share of years finishing within the deadline, mean over the season's start dates",
    ),
    spoilageProbability: share(
      'share of years spoiling before dry, mean over the start dates; null: not assessed',
    ),
    heatToAirKwhPerTonne: spreadSchema('kWh per tonne fresh', "across the season's batches"),
    fuelHeatKwhPerTonne: numOrNull('fuel heat at the median [kWh per tonne fresh]'),
    fuel: z.strictObject({
      id: text('fuel id'),
      name: text('the fuel in words'),
      unit: text('the unit the fuel is sold in'),
      quantityPerTonne: numOrNull('fuel at the median heat [fuel unit per tonne fresh]'),
      pricePerUnit: num('price [currency per fuel unit]'),
      priceIsExample: z.boolean().describe('the price is an example'),
    }),
    costPerTonneFresh: numOrNull('fuel cost at the median heat [currency per tonne fresh]'),
    costPerKgDried: numOrNull('fuel cost at the median heat [currency per kg of dried product]'),
    bin: methodBinFiguresSchema(),
  })
})

/** Several methods on one site side by side. */
export const methodComparisonResponseSchema = once(() => {
  const { kindSchema, siteSchema, productSchema, seasonSchema } = assessmentParts()
  return z
    .strictObject({
      schema: z.literal('dryhours.method-comparison/1').describe('the shape of this object'),
      site: siteSchema,
      product: productSchema,
      season: seasonSchema,
      deadlineDays: num('the window to reach the target [days]'),
      maxDays: num('a batch counts as failed after this long [days]'),
      driedKgPerTonneFresh: num('dried product from one tonne of fresh product [kg]'),
      currency: z
        .string()
        .nullable()
        .describe('the currency of the costs as named by the user; null: not named'),
      costNote: text('what the costs include'),
      spoilageAssessed: z.boolean().describe('whether any method carries a spoilage model'),
      methods: z.array(methodFiguresSchema()).describe('one entry per method, in the order asked'),
      notAssessed: z
        .array(z.strictObject({ kind: kindSchema, reason: text('why the file cannot serve it') }))
        .describe('methods of "all" this file cannot serve'),
      calendar: z.strictObject({
        weekStarts: z.array(monthDay('first start date of the week')),
        rows: z.array(
          z.strictObject({
            kind: kindSchema,
            label: text('the method in plain words'),
            cells: z.array(z.enum(CALENDAR_STATES)).describe('the state of each week'),
            probabilityWithinDeadline: z
              .array(numOrNull('share of years finishing within the deadline, mean over the week [0–1]'))
              .describe('per week [0–1]'),
            spoilageProbability: z
              .array(numOrNull('share of years spoiling first, mean over the week [0–1]'))
              .describe('per week [0–1]; null: not assessed or no data'),
          }),
        ),
        rules: z.array(
          z.strictObject({
            state: z.enum(CALENDAR_STATES).describe('calendar state'),
            rule: text('the rule of the state'),
          }),
        ),
      }),
      recommendation: z.strictObject({
        kind: kindSchema.nullable().describe('the recommended method; null when none meets the criterion'),
        text: text('the recommendation in one line'),
        criterion: text('the criterion, in words'),
      }),
      assessments: z
        .array(assessmentResponseSchema())
        .describe("every method's full assessment, in the order of methods"),
    })
    .describe('several methods on one site side by side')
})

/** Several sites ranked by a stated criterion. */
export const comparisonResponseSchema = once(() => {
  const { productSchema, methodResponseSchema, seasonSchema } = assessmentParts()
  return z
    .strictObject({
      schema: z.literal('dryhours.comparison/1').describe('the shape of this object'),
      criterion: z.enum(COMPARE_CRITERIA).describe('the ranking criterion'),
      criterionDescription: text('the criterion in words'),
      tieBreak: text('how ties are broken'),
      caveats: texts('cautions on the ranking (typical years against multi-year files)'),
      product: productSchema,
      method: methodResponseSchema,
      season: seasonSchema,
      deadlineDays: num('the window to reach the target [days]'),
      sites: z
        .array(
          z.strictObject({
            rank: count('rank, 1 = best'),
            site: text("the site's label (its name, or its file's name)"),
            file: z.string().nullable().describe('its weather file'),
            given: count('position in the order given, from 0'),
            typicalYear: z.boolean().describe('the file is a typical year'),
            years: count('years with data'),
            decidedBy: z
              .enum([...COMPARE_CRITERIA, 'order-given'])
              .nullable()
              .describe('the criterion that placed this site below the one above; null for the first'),
            usableHoursInSeasonP10: numOrNull('usable hours in the season, P10 across years [h]'),
            usableHoursInSeasonMedian: numOrNull('usable hours in the season, median across years [h]'),
            meanProbabilityWithinDeadline: share(
              'share of years finishing within the deadline, mean over start dates',
            ),
            medianHeatKwhPerTonne: numOrNull('median supplemental heat [kWh per tonne fresh]'),
            bestStartWindow: z.string().nullable().describe("the best start window, 'MM-DD to MM-DD'"),
            spoilageProbability: share("share of the season's batches that spoiled before they were dry"),
            binSeasonMinimumAirflowM3PerMinPerTonne: z
              .number()
              .nullable()
              .optional()
              .describe(
                'grain in a bin: the airflow that serves every start month, the largest monthly minimum [m³/min per t]; null: some month has none; absent for batch methods',
              ),
            warnings: texts("the site's warnings"),
          }),
        )
        .describe('the sites, best first'),
      assessments: z
        .array(assessmentResponseSchema())
        .describe("each site's assessment, in the order of sites"),
    })
    .describe('several sites ranked by a stated criterion')
})

/** Compile-time checks that the schemas describe the analysis types (see assessment.ts). */
type Describes<T, S extends T> = S
export type MethodComparisonDescribed = Describes<
  Omit<MethodComparison, 'assessments'>,
  z.output<ReturnType<typeof methodComparisonResponseSchema>>
>
export type ComparisonDescribed = Describes<
  Omit<Comparison, 'assessments' | 'method'>,
  z.output<ReturnType<typeof comparisonResponseSchema>>
>
