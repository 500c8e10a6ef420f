import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { planAssessment } from '../../src/analysis/plan.ts'
import { productById } from '../../src/product/catalogue.ts'
import { assessmentText } from '../../src/report/assessment-text.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { demoSeries, sliceSeries } from '../drying/demo-weather.ts'

const raisins = productById('grapes-to-raisins')
// six summer weeks of the dry upland demo site (invented, climate-demo/)
const series = sliceSeries(demoSeries('dryUpland'), 24 * 160, 24 * 42)
const base = {
  product: raisins,
  method: { kind: 'open-air' } as const,
  seasonStart: '06-10',
  seasonEnd: '06-20',
  deadlineDays: 21,
  maxDays: 30,
}

describe('what "dry" means, in every output', () => {
  it('default: the planner takes the moisture of the safe water activity at 25 °C', () => {
    const plan = planAssessment(base)
    expect(plan.dryTarget.basis).toBe('water-activity')
    expect(plan.targetWbPct).toBe(plan.dryTarget.targetWbPct)
    expect(plan.targetWbPct).toBeLessThan(raisins.targetMoistureWbPct.value)
  })
  it('a colder store is stated and changes nothing it should not: the storage temperature is carried', () => {
    expect(planAssessment({ ...base, storageTempC: 15 }).dryTarget.storageTempC).toBe(15)
    expect(() => planAssessment({ ...base, storageTempC: 90 })).toThrow(/storage temperature/)
  })
  it("the user's target above the safe water activity: used, warned in the JSON, the CLI text and the report", () => {
    const a = assess(series, { ...base, targetWbPct: 18 })
    expect(a.product.targetMoistureWbPct).toBe(18)
    expect(a.product.dryTarget.basis).toBe('user')
    expect(a.product.dryTarget.waterActivityAtTarget as number).toBeGreaterThan(0.6)
    const warning = a.warnings.find((w) => w.includes('above its safe 0.60'))
    expect(warning).toBeDefined()
    const text = assessmentText(a)
    expect(text).toContain(`dry means ${a.product.dryTarget.sentence}`)
    expect(text).toContain('above its safe 0.60')
    const html = renderReportHtml(a)
    expect(html).toContain('Dry means')
    expect(html).toContain('above its safe 0.60')
  })
})
