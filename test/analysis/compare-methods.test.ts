import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import {
  CALENDAR_RULES,
  CALENDAR_STATES,
  calendarState,
  compareMethods,
  driedKgPerTonne,
} from '../../src/analysis/compare-methods.ts'
import { binComparisonAirflow, binSeasonAirflow } from '../../src/analysis/compare-methods-bin.ts'
import { GOOD_START_PROBABILITY } from '../../src/analysis/start-dates.ts'
import { fuelForHeat } from '../../src/drying/fuels.ts'
import { productById } from '../../src/product/catalogue.ts'
import { demoSeries, sliceSeries } from '../drying/demo-weather.ts'

const options = {
  product: productById('grapes-to-raisins'),
  seasonStart: '08-01',
  seasonEnd: '09-30',
  startStepDays: 2,
  currency: 'EUR',
  fuelPrices: { propane: 0.8 },
}

describe('methods side by side (analysis/compare-methods.ts)', () => {
  const c = compareMethods(demoSeries('dryUpland'), options, [
    { kind: 'open-air' },
    { kind: 'solar-cabinet' },
    { kind: 'heated' },
  ])

  it('carries each method’s own assessment, equal to assessing it alone', () => {
    expect(c.methods.map((m) => m.kind)).toEqual(['open-air', 'solar-cabinet', 'heated'])
    const alone = assess(demoSeries('dryUpland'), { ...options, method: { kind: 'solar-cabinet' } })
    expect(c.assessments[1]).toEqual(alone)
  })

  it('figures per method come from its start-date table and heat summary', () => {
    c.methods.forEach((m, i) => {
      const a = c.assessments[i]
      const rows = a.startDates.filter((r) => r.years > 0)
      const mean = rows.reduce((s, r) => s + r.probabilityWithinDeadline, 0) / rows.length
      expect(m.probabilityWithinDeadline).toBeCloseTo(mean, 3)
      expect(m.heatToAirKwhPerTonne).toEqual(a.heat.heatToAirKwhPerTonne)
      const fuel = a.heat.fuels.find((f) => f.fuel === a.heat.selectedFuel)
      expect(m.fuel.pricePerUnit).toBe(0.8)
      expect(m.fuel.priceIsExample).toBe(false)
      expect(m.costPerTonneFresh).toBe(fuel?.costPerTonne)
      // cost per kg of DRIED product: per tonne fresh ÷ the dried mass of a tonne fresh
      if (m.costPerTonneFresh !== null)
        expect(m.costPerKgDried).toBeCloseTo(m.costPerTonneFresh / c.driedKgPerTonneFresh, 2)
    })
    expect(c.currency).toBe('EUR')
    expect(c.assessments.every((a) => a.heat.currency === 'EUR')).toBe(true)
  })

  it('dried mass per tonne: the dry matter kept, 1000 × (1 − 0.782) / (1 − 0.18) = 265.9 kg (mass balance)', () => {
    expect(driedKgPerTonne(78.2, 18)).toBeCloseTo(265.85, 2)
    const p = c.product
    expect(c.driedKgPerTonneFresh).toBeCloseTo(
      (1000 * (100 - p.initialMoistureWbPct)) / (100 - p.targetMoistureWbPct),
      1,
    )
  })

  it('the season calendar: one row per method, one cell per week, each cell by its stated rule', () => {
    expect(c.calendar.weekStarts[0]).toBe('08-01')
    expect(c.calendar.weekStarts).toHaveLength(9) // 08-01 … 09-26, 61 days
    expect(c.calendar.rules.map((r) => r.state)).toEqual([...CALENDAR_STATES])
    c.calendar.rows.forEach((row, i) => {
      const a = c.assessments[i]
      expect(row.cells).toHaveLength(9)
      // recompute each week's mean share from the start-date rows (every 2 days from 08-01)
      row.cells.forEach((cell, w) => {
        const rows = a.startDates.filter((r, k) => Math.floor((2 * k) / 7) === w && r.years > 0)
        const p = rows.reduce((s, r) => s + r.probabilityWithinDeadline, 0) / rows.length
        expect(Math.abs((row.probabilityWithinDeadline[w] ?? -1) - p)).toBeLessThanOrEqual(0.0005 + 1e-12)
        const spoil = rows
          .map((r) => r.spoilage?.probability)
          .filter((v): v is number => typeof v === 'number')
        const s = spoil.length > 0 ? spoil.reduce((x, y) => x + y, 0) / spoil.length : null
        if (s !== null)
          expect(Math.abs((row.spoilageProbability[w] ?? -1) - s)).toBeLessThanOrEqual(0.0005 + 1e-12)
        const expected =
          s !== null && s >= 0.5
            ? 'spoils-first'
            : p < 0.5
              ? 'needs-heat'
              : p < GOOD_START_PROBABILITY || (s !== null && s >= 0.2)
                ? 'marginal'
                : 'dries'
        expect(cell).toBe(expected)
      })
    })
  })

  it('calendar states follow their rules, spoilage first', () => {
    expect(calendarState(null, null)).toBe('no-data')
    expect(calendarState(1, 0.6)).toBe('spoils-first')
    expect(calendarState(1, 0.3)).toBe('marginal')
    expect(calendarState(0.79, null)).toBe('marginal')
    expect(calendarState(0.49, null)).toBe('needs-heat')
    expect(calendarState(0.8, 0.1)).toBe('dries')
    for (const s of CALENDAR_STATES) expect(CALENDAR_RULES[s].length).toBeGreaterThan(20)
  })

  it('recommends the cheapest method per kg dried among those that finish in 80 % of years without spoiling, and says so', () => {
    const ok = c.methods.filter(
      (m) =>
        (m.probabilityWithinDeadline ?? 0) >= GOOD_START_PROBABILITY && (m.spoilageProbability ?? 0) < 0.2,
    )
    expect(c.recommendation.criterion).toContain('lowest fuel cost per kg of dried product')
    expect(c.recommendation.criterion).toContain('80 %')
    if (ok.length === 0) {
      // none qualifies: the closest is named with both of its shares, never "the most reliable"
      expect(c.recommendation.kind).toBeNull()
      expect(c.recommendation.text).toMatch(
        /^No method meets the criterion: .*; the closest is .*: it finishes in time in .*, spoils first in /,
      )
      return
    }
    const cheapest = [...ok].sort((x, y) => (x.costPerKgDried ?? 1e9) - (y.costPerKgDried ?? 1e9))[0]
    expect(c.recommendation.kind).toBe(cheapest.kind)
    expect(c.recommendation.criterion).toContain('lowest fuel cost per kg of dried product')
    expect(c.recommendation.criterion).toContain('80 %')
    expect(c.recommendation.text.toLowerCase()).toContain(cheapest.label.toLowerCase())
    if ((cheapest.costPerKgDried ?? 0) > 0) expect(c.recommendation.text).toContain('EUR per kg dried')
    else expect(c.recommendation.text).toContain('no fuel at the median batch')
  })

  it('spoilage is reported as not assessed, never invented, while the assessments carry no model', () => {
    const carries = c.assessments.some((a) => a.startDates.some((r) => 'spoilage' in r))
    expect(c.spoilageAssessed).toBe(carries)
    if (!carries) expect(c.methods.every((m) => m.spoilageProbability === null)).toBe(true)
  })

  it('with all, a method the file cannot serve is listed with its reason; listed by name, it is an error', () => {
    const s = sliceSeries(demoSeries('dryUpland'), 24 * 200, 24 * 60)
    s.ghiWm2 = new Float64Array(s.hours).fill(Number.NaN)
    s.site = { ...s.site, latitudeDeg: null, longitudeDeg: null }
    const short = { ...options, seasonStart: '07-20', seasonEnd: '07-27', startStepDays: 7, maxDays: 20 }
    const all = compareMethods(s, short, 'all')
    expect(all.notAssessed.map((n) => n.kind).sort()).toEqual([
      'greenhouse',
      'natural-air-bin',
      'open-air',
      'solar-cabinet',
      'tunnel',
    ])
    // grapes are not grain: the bin is left out for the product, before any work, with its reason
    expect(all.notAssessed[0].kind).toBe('natural-air-bin')
    expect(all.notAssessed[0].reason).toMatch(/grain/)
    expect(all.notAssessed[1].reason).toMatch(/needs the sun/)
    expect(all.methods.map((m) => m.kind)).toEqual(['shade', 'heated'])
    expect(() => compareMethods(s, short, [{ kind: 'open-air' }, { kind: 'heated' }])).toThrow(
      /open-air method needs the sun/,
    )
    expect(() => compareMethods(s, short, [{ kind: 'heated' }, { kind: 'heated' }])).toThrow(/twice/)
  })

  it('with all on a file with sun but no position, the methods facing the sun are listed, not an error', () => {
    const s = sliceSeries(demoSeries('dryUpland'), 24 * 200, 24 * 60)
    s.site = { ...s.site, latitudeDeg: null, longitudeDeg: null }
    const short = { ...options, seasonStart: '07-20', seasonEnd: '07-27', startStepDays: 7, maxDays: 20 }
    const all = compareMethods(s, short, 'all')
    const needPosition = all.notAssessed.filter((n) => /latitude and longitude/.test(n.reason))
    expect(needPosition.map((n) => n.kind).sort()).toEqual(['greenhouse', 'solar-cabinet', 'tunnel'])
    expect(all.methods.map((m) => m.kind)).toEqual(expect.arrayContaining(['open-air', 'shade', 'heated']))
    // named alone it is still refused, with the same words
    expect(() => assess(s, { ...short, method: { kind: 'tunnel' } })).toThrow(
      /needs the site's latitude and longitude/,
    )
  })

  it('a currency that is not a short printable name is refused before any work', () => {
    expect(() =>
      compareMethods(demoSeries('dryUpland'), { ...options, currency: '<b>' }, [{ kind: 'heated' }]),
    ).toThrow(/currency/)
  })
})

/**
 * Grain in a bin among the methods (analysis/compare-methods-bin.ts): corn harvested into a bin in the humid
 * valley (invented weather), Sep 15 – Oct 15, as the bin golden case. Consistency checks of how the bin's
 * answer enters the comparison; the bin model itself is checked in test/drying/deep-bed/.
 */
describe('grain in a bin among the methods side by side', () => {
  const corn = {
    product: productById('shelled-corn'),
    initialWbPct: 20,
    targetWbPct: 15.5,
    seasonStart: '09-15',
    seasonEnd: '10-15',
    fuelPrices: { propane: 0.8, electricity: 0.2 },
    currency: 'EUR',
  }
  const bin = { kind: 'natural-air-bin' as const, airflowsM3PerMinPerTonne: [1, 2, 3] }
  const c = compareMethods(demoSeries('humidValley'), corn, [bin, { kind: 'heated' }])
  const a = c.assessments[0]
  const m = c.methods[0]

  it('the bin is assessed as by itself, and its row is at the airflow that serves every start month', () => {
    expect(a).toEqual(assess(demoSeries('humidValley'), { ...corn, method: bin }))
    expect(a.bin).toBeDefined()
    const months = a.bin!.minimumAirflowByMonth
    const serving = binSeasonAirflow(a.bin!)
    if (months.every((x) => x.minimumAirflowM3PerMinPerTonne !== null))
      expect(serving).toBe(Math.max(...months.map((x) => x.minimumAirflowM3PerMinPerTonne as number)))
    else expect(serving).toBeNull()
    expect(m.bin?.airflowM3PerMinPerTonne).toBe(binComparisonAirflow(a.bin!).airflow)
    expect(m.bin?.airflowRule).toMatch(serving === null ? /the largest/ : /smallest airflow compared/)
  })

  it('its shares, days and energy come from its start dates at that airflow', () => {
    const q = m.bin!.airflowM3PerMinPerTonne
    const rows = a.bin!.startDates.filter((s) => s.airflowM3PerMinPerTonne === q && s.years > 0)
    expect(rows.length).toBeGreaterThan(1)
    const safe = rows.reduce((s, r) => s + r.shareOfYearsSafe, 0) / rows.length
    expect(m.probabilityWithinDeadline).toBeCloseTo(safe, 3)
    const spoiled = rows.reduce((s, r) => s + r.yearsDryMatterLossLimitExceeded / r.years, 0) / rows.length
    expect(m.spoilageProbability).toBeCloseTo(spoiled, 3)
    const days = rows
      .map((r) => r.daysUntilTopLayerDry.median ?? Number.POSITIVE_INFINITY)
      .sort((x, y) => x - y)
    const mid = (days.length - 1) / 2
    const median = (days[Math.floor(mid)] + days[Math.ceil(mid)]) / 2
    expect(m.daysToTarget.median).toBeCloseTo(median, 1)
    // no heater: no heat, no fuel; the fan's electricity is priced at the given 0.2 per kWh
    expect(m.heatToAirKwhPerTonne.median).toBe(0)
    expect(m.bin!.electricityPricePerKwh).toBe(0.2)
    expect(m.bin!.electricityPriceIsExample).toBe(false)
    const fan = m.bin!.fanEnergyKwhPerTonne as number
    expect(fan).toBeGreaterThan(0)
    expect(m.bin!.fanCostPerTonne).toBeCloseTo(fuelForHeat(fan, 1, 'electricity', 0.2).cost, 2)
    expect(m.costPerTonneFresh).toBeCloseTo(m.bin!.fanCostPerTonne as number, 2)
    expect(m.costPerKgDried).toBeCloseTo((m.costPerTonneFresh as number) / c.driedKgPerTonneFresh, 3)
    expect(c.costNote).toMatch(/fan’s electricity/)
  })

  it('its calendar row comes from the same start dates, week by week', () => {
    const q = m.bin!.airflowM3PerMinPerTonne
    const row = c.calendar.rows[0]
    expect(row.kind).toBe('natural-air-bin')
    expect(row.cells).toHaveLength(c.calendar.weekStarts.length)
    const first = a.bin!.startDates.find((s) => s.airflowM3PerMinPerTonne === q && s.startDate === '09-15')
    expect(row.probabilityWithinDeadline[0]).toBeCloseTo(first!.shareOfYearsSafe, 3)
    row.cells.forEach((cell, w) => {
      expect(cell).toBe(calendarState(row.probabilityWithinDeadline[w], row.spoilageProbability[w]))
    })
  })

  it('the recommendation states what in time means for a bin, and its cost includes the fan', () => {
    expect(c.recommendation.criterion).toMatch(/grain in a bin: "finishes in time"/)
    expect(c.recommendation.criterion).toMatch(/fan's electricity/)
    if (c.recommendation.kind === 'natural-air-bin') {
      expect(c.recommendation.text).toMatch(/top layer dries safely in/)
      expect(c.recommendation.text).toMatch(/fuel and fan electricity .* EUR per kg dried/)
    }
  })

  it('with all, a grain takes the bin with the parameters given for it', () => {
    const short = { ...corn, seasonStart: '09-15', seasonEnd: '09-22', startStepDays: 7 }
    const all = compareMethods(demoSeries('humidValley'), short, {
      all: [{ ...bin, airflowsM3PerMinPerTonne: [2] }],
    })
    expect(all.methods.map((x) => x.kind)).toContain('natural-air-bin')
    const b = all.assessments.find((x) => x.method.kind === 'natural-air-bin')
    expect(b?.bin?.airflows.map((x) => x.airflowM3PerMinPerTonne)).toEqual([2])
  })
})
