/**
 * @module report/product-json
 * JSON shape of the catalogue listing, shared by the CLI (`products --json`) and the API
 * (GET /v1/products). The equilibrium answers are computed in analysis/equilibrium-answers.ts.
 */
import type { ProductProfile } from '../product/profile.ts'

/** One line of the catalogue listing. */
export function productSummaryJson(p: ProductProfile) {
  return {
    id: p.id,
    name: p.name,
    category: p.category,
    variantOf: p.variantOf ?? null,
    initialMoistureWbPct: p.initialMoistureWbPct.value,
    targetMoistureWbPct: p.targetMoistureWbPct.value,
    waterActivityTarget: p.waterActivityTarget.value,
    maxProductTempC: p.maxProductTempC?.value ?? null,
    isothermModel: p.isotherm.desorption.equation.model,
    isothermConfidence: p.isotherm.desorption.confidence,
    kineticsModel: p.kinetics.equation.model,
    kineticsConfidence: p.kinetics.confidence,
  }
}
