/**
 * @module api/limits
 * The work limit of a request, asked of the engine's planner (analysis/plan.ts): the same estimate for
 * /v1/assess, /v1/compare and the page, before any hour is computed.
 */
import type { AssessOptions } from '../analysis/assess.ts'
import { estimateBatchHours, planAssessment } from '../analysis/plan.ts'
import type { ApiConfig } from './config.ts'
import { rethrowAsProblem } from './errors.ts'
import { ApiProblem } from './problem.ts'

/**
 * Refuse (422 `too-much-work`) a request whose simulated batch-hours, summed over its series of
 * `seriesHours` hours each, exceed `config.maxBatchHours`. `optionPath` names the options in the request.
 */
export function checkBatchHours(
  options: AssessOptions,
  seriesHours: readonly number[],
  config: ApiConfig,
  optionPath: (option: string) => string = (o) => o,
): void {
  let work: number
  try {
    work = estimateBatchHours(options, seriesHours)
  } catch (e) {
    rethrowAsProblem(e, { optionPath, rangeStatus: 400 })
  }
  if (work > config.maxBatchHours && planAssessment(options).bin) {
    const levers = ['seasonStart', 'startStepDays', 'method.airflowsM3PerMinPerTonne', 'maxDays'].map(
      optionPath,
    )
    throw new ApiProblem(
      422,
      `this request would simulate about ${(work / 1e6).toFixed(1)} million batch-hours of bin runs (start dates × airflows × years × season hours × layers, in batch-hour equivalents), more than the limit of ${(config.maxBatchHours / 1e6).toFixed(1)} million: give the harvest season only (${levers[0]}), a larger start-date step (${levers[1]}), fewer airflows to compare (${levers[2]}), a shorter season in the bin (${levers[3]}), or fewer years per file`,
      levers.map((path) => ({ path, message: 'too much work for one request' })),
      'too-much-work',
    )
  }
  if (work > config.maxBatchHours) {
    const levers = ['startStepDays', 'seasonStart', 'maxDays'].map(optionPath)
    throw new ApiProblem(
      422,
      `this request would simulate about ${(work / 1e6).toFixed(1)} million batch-hours (start dates × years × maximum batch length), more than the limit of ${(config.maxBatchHours / 1e6).toFixed(1)} million: use a larger start-date step (${levers[0]}), a shorter season (${levers[1]}) or a shorter maximum batch length (${levers[2]}), fewer years per file, or fewer sites per request`,
      levers.map((path) => ({ path, message: 'too much work for one request' })),
      'too-much-work',
    )
  }
}
