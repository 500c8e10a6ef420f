/**
 * @module api/schemas/responses/spoilage
 * Spoilage along the batches (analysis/assessment.ts `SpoilageSummary`, `AssessmentSpoilage`): the product
 * family's model stepped hour by hour along each batch, with the unit of every field. Built on first use.
 */
import { z } from 'zod'
import type { AssessmentSpoilage, SpoilageSummary } from '../../../analysis/assessment.ts'
import { count, medianP90, num, numOrNull, once, text, texts } from './common.ts'

/** Spoilage along the batches of one start date, one month, or the whole season. */
export const spoilageSummarySchema = once(() =>
  z
    .strictObject({
      modelId: text('id of the spoilage model'),
      source: text('its source in short (authors and years)'),
      batches: count('batches summarised'),
      batchesSpoiledBeforeDry: count("batches whose measure reached the model's limit before the target"),
      probability: numOrNull('share of those batches: the probability of spoiling before dry [0–1]'),
      hoursAtRisk: medianP90('h', 'across batches').describe(
        'hours in conditions the model counts as at risk, until dry or the end of the batch [h]',
      ),
      shareOfLimitUsed: medianP90('share of the limit', 'across batches').describe(
        "the model's measure when dry (or at the end) as a share of its limit [0–1; 1 = spoiled]",
      ),
    })
    .nullable()
    .describe('spoilage along those batches; null when the assessment ran without spoilage'),
)

/** The spoilage model of an assessment and the season's figures. */
export const assessmentSpoilageSchema = once(() =>
  z
    .strictObject({
      model: z.strictObject({
        id: text('model id'),
        name: text('the model in words'),
        source: z.strictObject({
          citation: text('the citation'),
          equation: text('the equation or table used'),
          confidence: text('how the numbers are known'),
        }),
        measureName: text('what the measure is (e.g. dry-matter loss)'),
        measureUnit: text("the measure's unit ('' for a fraction)"),
        limit: num('the measure at which a batch counts as spoiled [the unit in measureUnit]'),
        limitSource: text('where the limit comes from'),
        atRiskWhen: text('when an hour counts as at risk'),
        validity: text('where the model holds'),
        waterActivity: z
          .strictObject({
            of: z
              .enum(['surface', 'piece'])
              .describe(
                "the water activity fed: at the product's surface, or of the piece (its mean moisture)",
              ),
            rule: text('the rule in words'),
            source: text('its sources'),
          })
          .describe('which water activity the model is fed along a batch'),
      }),
      rule: text('how the model is stepped along a batch'),
      season: spoilageSummarySchema().unwrap().describe("all the season's start-date batches together"),
      cautions: texts('what a reader must know with these figures'),
    })
    .nullable()
    .describe('the spoilage model and the season’s figures; null when the assessment ran without spoilage'),
)

/** Compile-time checks that the schemas describe the analysis types (see assessment.ts). */
type Describes<T, S extends T> = S
export type SpoilageSummaryDescribed = Describes<
  SpoilageSummary,
  NonNullable<z.output<ReturnType<typeof spoilageSummarySchema>>>
>
export type AssessmentSpoilageDescribed = Describes<
  AssessmentSpoilage,
  NonNullable<z.output<ReturnType<typeof assessmentSpoilageSchema>>>
>
