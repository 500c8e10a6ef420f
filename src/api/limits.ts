/**
 * @module api/limits
 * The work limit of a request, asked of the engine's planner (analysis/plan.ts): the same estimate for
 * /v1/assess, /v1/compare and the page, before any hour is computed.
 */
import type { AssessOptions } from '../analysis/assess.ts'
import { estimateWork, type WorkEstimate } from '../analysis/plan.ts'
import type { ApiConfig } from './config.ts'
import { rethrowAsProblem } from './errors.ts'
import { ApiProblem } from './problem.ts'

/**
 * Amounts of work in words: millions with one decimal, or whole batch-hours when the request and the limit would
 * read the same (just over the limit).
 */
function amounts(work: number, limit: number): [string, string] {
  const m = (x: number) => `${(x / 1e6).toFixed(1)} million`
  if (m(work) !== m(limit)) return [m(work), m(limit)]
  const whole = (x: number) => String(Math.ceil(x)).replace(/\B(?=(\d{3})+$)/g, ',')
  return [whole(work), whole(limit)]
}

/** A lever of the work: the option, what to do with it, and the name it has where the request came from. */
type Lever = [option: string, advice: string]

/**
 * Refuse (422 `too-much-work`) a request whose simulated batch-hours, summed over its series of
 * `seriesHours` hours each and over its option sets (one per method side by side, from analysis/compare-methods.ts
 * `methodOptionSets`), exceed `config.maxBatchHours`. The estimate is the planner's (plan.ts `estimateWork`), the
 * same for the API and the page. `optionPath` names an option's field in the request; `optionWords` names it in
 * the message (default: its path), or null when the request's form has no such field (the lever is then left out).
 */
export function checkBatchHours(
  optionSets: AssessOptions | readonly AssessOptions[],
  seriesHours: readonly number[],
  config: ApiConfig,
  optionPath: (option: string) => string = (o) => o,
  optionWords: (option: string) => string | null = optionPath,
): void {
  const sets: readonly AssessOptions[] = Array.isArray(optionSets)
    ? optionSets
    : [optionSets as AssessOptions]
  let estimate: WorkEstimate = { batchHours: 0, bin: false }
  try {
    estimate = estimateWork(sets, seriesHours)
  } catch (e) {
    rethrowAsProblem(e, { optionPath, rangeStatus: 400 })
  }
  const { batchHours: work, bin } = estimate
  if (!(work > config.maxBatchHours)) return
  const levers: Lever[] = bin
    ? [
        ['seasonStart', 'give the harvest season only'],
        ['startStepDays', 'a larger start-date step'],
        ['method.airflowsM3PerMinPerTonne', 'fewer airflows to compare'],
        ['maxDays', 'a shorter season in the bin'],
      ]
    : [
        ['startStepDays', 'use a larger start-date step'],
        ['seasonStart', 'a shorter season'],
        ['maxDays', 'a shorter maximum batch length'],
      ]
  const named = levers.flatMap(([option, advice]) => {
    const words = optionWords(option)
    return words === null ? [] : [{ path: optionPath(option), text: `${advice} (${words})` }]
  })
  const others = [
    'fewer years per file',
    ...(sets.length > 1 ? ['fewer methods side by side'] : []),
    ...(bin ? [] : ['fewer sites per request']),
  ]
  const [asked, limit] = amounts(work, config.maxBatchHours)
  const what = bin
    ? 'of bin runs (start dates × airflows × years × season hours × layers, in batch-hour equivalents)'
    : '(start dates × years × maximum batch length)'
  const methods = sets.length > 1 ? `, summed over ${sets.length} methods side by side` : ''
  const todo = [...named.map((l) => l.text), ...others]
  throw new ApiProblem(
    422,
    `this request would simulate about ${asked} batch-hours ${what}${methods}, more than this server's limit of ${limit} batch-hours per request: ${todo.slice(0, -1).join(', ')} or ${todo[todo.length - 1]}`,
    named.map((l) => ({ path: l.path, message: 'too much work for one request' })),
    'too-much-work',
  )
}
