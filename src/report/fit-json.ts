/**
 * @module report/fit-json
 * The JSON shape of a weighings fit (CLI `fit --json` and POST /v1/fit): the fit without its predictor function.
 */
import type { WeighingsFit } from '../product/fit-weighings.ts'

export function fitJson(fit: WeighingsFit): Omit<WeighingsFit, 'predictMoistureDb'> {
  const { predictMoistureDb: _predict, ...plain } = fit
  return plain
}
