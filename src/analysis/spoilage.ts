/**
 * @module analysis/spoilage
 * Spoilage before the product is dry: the product family's spoilage model (product/spoilage/, chosen by
 * `spoilageModelFor`) is stepped hour by hour along every batch of the method alone (drying/batch.ts), and
 * its outcomes are summarised per start date, per month and over the season: the share of batches whose
 * measure reached the model's limit before the batch reached its target, the hours at risk and the share
 * of the limit used.
 */
import type { BatchSpoilageResult, BatchSpoilageSetup } from '../drying/batch.ts'
import { WaterActivityTable } from '../drying/water-activity-table.ts'
import type { ProductProfile } from '../product/profile.ts'
import {
  type SpoilageModel,
  SURFACE_WATER_ACTIVITY_RULE,
  SURFACE_WATER_ACTIVITY_SOURCE,
  spoilageModelFor,
} from '../product/spoilage/index.ts'
import type { AssessmentSpoilage, SpoilageSummary } from './assessment.ts'
import { quantileSorted, roundOrNull } from './statistics.ts'

/** The spoilage setup of an assessment: the product's model and its water-activity table. */
export function spoilageSetup(profile: ProductProfile): BatchSpoilageSetup {
  return { model: spoilageModelFor(profile), waterActivity: new WaterActivityTable(profile) }
}

/** How the engine steps the model along a batch, in words (the assessment's `spoilage.rule`). */
export const SPOILAGE_RULE =
  'stepped every hour of each batch of the method alone, from its start until the product reaches its target moisture (or the batch ends), covered and paused hours included: product temperature of the hour, moisture at its start, water activity from the desorption isotherm at that temperature and moisture, or for a model of mould the water activity at the product surface (model.waterActivity); hours with missing weather keep the last product temperature. A batch spoils before it is dry when the measure reaches the limit by the hour the target is reached; batches that never reach the target count as spoiled when the limit is reached within the maximum duration.'

/** Which water activity the model is fed, and how it is worked out (the assessment's `spoilage.model.waterActivity`). */
function waterActivityFed(model: SpoilageModel): AssessmentSpoilage['model']['waterActivity'] {
  if (model.waterActivityOf === 'surface')
    return { of: 'surface', rule: SURFACE_WATER_ACTIVITY_RULE, source: SURFACE_WATER_ACTIVITY_SOURCE }
  return {
    of: 'piece',
    rule: 'the product’s water activity from its desorption isotherm at its temperature and mean moisture',
    source: 'the product profile’s isotherm (dryhours products <id>)',
  }
}

function medianP90(values: number[], digits: number): { median: number | null; p90: number | null } {
  const s = values.filter((v) => Number.isFinite(v)).sort((a, b) => a - b)
  return {
    median: roundOrNull(quantileSorted(s, 0.5), digits),
    p90: roundOrNull(quantileSorted(s, 0.9), digits),
  }
}

/** Summary of the batches' spoilage outcomes (undefined entries, batches run without spoilage, are skipped). */
export function summariseSpoilage(
  model: SpoilageModel,
  results: readonly (BatchSpoilageResult | undefined)[],
): SpoilageSummary {
  const list = results.filter((r): r is BatchSpoilageResult => r !== undefined)
  const spoiled = list.filter((r) => r.spoiledBeforeDry).length
  return {
    modelId: model.id,
    source: model.source.short ?? model.source.citation,
    batches: list.length,
    batchesSpoiledBeforeDry: spoiled,
    probability: list.length > 0 ? roundOrNull(spoiled / list.length, 3) : null,
    hoursAtRisk: medianP90(
      list.map((r) => r.hoursAtRisk),
      0,
    ),
    shareOfLimitUsed: medianP90(
      list.map((r) => r.limitUsedFraction),
      3,
    ),
  }
}

/** The assessment's spoilage block: the model, the rule, the season's figures and the cautions. */
export function assessmentSpoilage(
  model: SpoilageModel,
  seasonResults: readonly (BatchSpoilageResult | undefined)[],
): AssessmentSpoilage {
  return {
    model: {
      id: model.id,
      name: model.name,
      source: {
        citation: model.source.citation,
        equation: model.source.equation,
        confidence: model.source.confidence,
      },
      measureName: model.measureName,
      measureUnit: model.measureUnit,
      limit: model.spoiledAt,
      limitSource: model.spoiledAtSource,
      atRiskWhen: model.atRiskWhen,
      validity: model.validity,
      waterActivity: waterActivityFed(model),
    },
    rule: SPOILAGE_RULE,
    season: summariseSpoilage(model, seasonResults),
    cautions: [...model.cautions, ...SPOILAGE_CAUTIONS],
  }
}

/** Cautions shown with every spoilage result (besides the model's own). */
export const SPOILAGE_CAUTIONS: readonly string[] = [
  'The spoilage figures come from a published model (or a stated rule) driven by the modelled product temperature and water activity; they are an estimate of risk, not a food-safety test.',
  'Where batches came near or past the limit, sort out mouldy or discoloured product and have lots tested for mycotoxins (aflatoxins, ochratoxin A) by an accredited laboratory before food or feed use.',
  'Hygiene, insects, birds and dust are not in the models, and dew and rain only through the product’s moisture and, for mould, its wetted surface; keep them all away from the product.',
]
