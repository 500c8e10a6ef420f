/**
 * The heated-every-hour sample of the heat cross-check (analysis/heat-summary.ts) runs its own batches on the
 * backup heater's conditions: the record of the method's own batches already run (StartContext.ran, which lets a
 * start shared by the monthly-heat and start-date stages run once) must never answer for them (a sample start can
 * fall on a start-date row's hour, e.g. hour 0 when the file begins at the season's first start). Outcomes planted
 * at every sample start must not reach the cross-check. Consistency check of the code, no outside source.
 */
import { describe, expect, it } from 'vitest'
import { hourlyConditionsStage, resolveAssessOptions, startContext } from '../../src/analysis/assess.ts'
import { heatSummary } from '../../src/analysis/heat-summary.ts'
import { localTimeColumns } from '../../src/analysis/local-time.ts'
import { HEATED_SAMPLE_BATCHES } from '../../src/analysis/plan.ts'
import {
  runStart,
  type StartContext,
  type StartOutcome,
  startRecord,
} from '../../src/analysis/start-dates.ts'
import { productById } from '../../src/product/catalogue.ts'
import { demoSeries, sliceSeries } from '../drying/demo-weather.ts'

describe('heat cross-check sample', () => {
  it('runs its own heated batches, never the method’s recorded outcomes', () => {
    const series = sliceSeries(demoSeries('dryUpland'), 24 * 180, 24 * 90)
    const run = resolveAssessOptions({
      product: productById('grapes-to-raisins'),
      method: { kind: 'open-air' },
      seasonStart: '07-01',
      seasonEnd: '07-20',
      startStepDays: 5,
      maxDays: 20,
      deadlineDays: 10,
    })
    const { primary, backup } = hourlyConditionsStage(series, run)
    // the assessment's own context (analysis/assess.ts startContext), its record emptied below for `plain`
    const base = startContext(series, run, localTimeColumns(series), primary, backup)
    const planted: StartOutcome = {
      unknown: false,
      missingHours: 0,
      hoursToTarget: 1,
      withinDeadline: true,
      rewettingHours: 0,
      rainExposureHours: 0,
      heatKwhPerTonne: 1e9,
      solarKwhPerTonne: 0,
      strategy: 'none-needed',
      spoilage: undefined,
    }
    const plain: StartContext = { ...base, ran: undefined }
    // a recorded outcome at every start of the sample (batch k starts at ⌊k·last/count⌋, last = hours − maximum length)
    const last = series.hours - base.maxHours
    const ran = startRecord(base)
    for (let k = 0; k < HEATED_SAMPLE_BATCHES; k++)
      ran.outcomes.set(Math.floor((k * last) / HEATED_SAMPLE_BATCHES), planted)
    const recorded: StartContext = { ...base, ran }
    const a = heatSummary([], backup, run, plain)
    const b = heatSummary([], backup, run, recorded)
    expect(a.crossCheck.ratioHeatedEveryHour).not.toBeNull()
    expect(b.crossCheck.ratioHeatedEveryHour).toBe(a.crossCheck.ratioHeatedEveryHour)
    // while a context with the record's own conditions reads it (the start is run once)
    const start = Math.floor((1 * last) / HEATED_SAMPLE_BATCHES)
    expect(runStart(recorded, start)).toBe(planted)
  })
})
