import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { assessmentText } from '../../src/report/assessment-text.ts'
import { reportTables } from '../../src/report/report-csv.ts'
import { renderReportHtml } from '../../src/report/report-html.ts'
import { demoSeries, sliceSeries } from '../drying/demo-weather.ts'
import { constantSeries, copySeries } from '../drying/synthetic-weather.ts'

const apricot = productById('apricot-halves')

describe('a batch that runs into missing weather has an unknown outcome, not a slow one', () => {
  const series = constantSeries({ dryBulbC: 40, relativeHumidityPct: 20, hours: 24 * 10 })
  const gap = copySeries(series)
  for (let i = 30; i < 40; i++) gap.dryBulbC[i] = Number.NaN // ten hours without weather
  const r = productResponse(apricot)
  const options = {
    targetDb: moistureDbFromWbPct(20),
    initialWbPct: apricot.initialMoistureWbPct.value,
    loadingKgPerM2: 10,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: 65,
  }
  const method = parseDryingMethod({ kind: 'heated', setPointC: 50 })
  const batch = (s: typeof series, start: number) =>
    simulateBatch(computeHourlyConditions(s, method, r, options), r, {
      startIndex: start,
      maxHours: 24 * 8,
      initialDb: moistureDbFromWbPct(apricot.initialMoistureWbPct.value),
      targetDb: moistureDbFromWbPct(20),
    })
  it('meets the gap: outcome unknown, with the hours missing counted', () => {
    const b = batch(gap, 0)
    expect(b.outcomeUnknown).toBe(true)
    expect(b.missingHours).toBe(10)
  })
  it('starts after the gap: known', () => {
    const b = batch(gap, 40)
    expect(b.outcomeUnknown).toBe(false)
    expect(b.missingHours).toBe(0)
    expect(b.reached).toBe(true)
  })
})

describe('assessments report unknown batches apart and warn about capped heated air', () => {
  // 40 summer days of the dry upland demo site (invented, climate-demo/) with a 3-day logger gap
  const base = sliceSeries(demoSeries('dryUpland'), 24 * 160, 24 * 40)
  const gap = copySeries(base)
  for (let i = 24 * 12; i < 24 * 15; i++) gap.relativeHumidityPct[i] = Number.NaN
  const options = {
    product: apricot,
    method: { kind: 'heated', setPointC: 80 } as const,
    seasonStart: '06-10',
    seasonEnd: '06-30',
    deadlineDays: 5,
    maxDays: 8,
  }
  const a = assess(gap, options)
  it('the batches that met the gap are counted as unknown, with their hours, and left out of the figures', () => {
    expect(a.coverage.batchesWithUnknownOutcome).toBeGreaterThan(0)
    expect(a.coverage.missingWeatherHoursInBatches).toBeGreaterThan(0)
    const rows = a.startDates.filter((r) => r.yearsUnknown > 0)
    expect(rows.length).toBeGreaterThan(0)
    for (const row of rows) {
      expect(row.years).toBe(0) // one year of data: that start's only batch is unknown
      expect(row.daysToTarget.median).toBeNull()
      expect(row.missingWeatherHours).toBeGreaterThan(0)
    }
    expect(a.warnings.some((w) => w.includes('ran into hours without weather'))).toBe(true)
    // the start-date table of the CSV and HTML says so per row, and the CLI text beside the row
    const table = reportTables(a).find((t) => t.id === 'start-dates')
    const col = table?.columns.indexOf('years unknown (ran into hours without weather)') ?? -1
    expect(col).toBeGreaterThan(0)
    expect(table?.rows.some((r) => (r[col] as number) > 0)).toBe(true)
    const shown = assessmentText(a)
    expect(shown).toMatch(/\+ 1 year unknown \(\d+ h without weather\)/)
  })
  it('the heated set point above the product limit (80 > 65 °C): capped, and said in the JSON, the CLI text and the report', () => {
    const w = a.warnings.find((x) => x.includes('set point 80 °C is above'))
    expect(w).toMatch(/limit of 65 °C/)
    expect(assessmentText(a)).toContain('set point 80 °C is above')
    expect(renderReportHtml(a)).toContain('set point 80 °C is above')
  })
})
