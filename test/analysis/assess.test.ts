import { describe, expect, it } from 'vitest'
import { assess } from '../../src/analysis/assess.ts'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { compare } from '../../src/analysis/compare.ts'
import { quantileSorted, spread } from '../../src/analysis/statistics.ts'
import { productById } from '../../src/product/catalogue.ts'
import { demoSeries } from '../drying/demo-weather.ts'

describe('percentiles (Hyndman & Fan 1996 definition 7, as R quantile(type = 7))', () => {
  it('R: quantile(c(1, 2, 3, 4), 0.1) = 1.3; quantile(1:5 * 10, c(.1, .5, .9)) = 14, 30, 46', () => {
    expect(quantileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12)
    expect(spread([50, 10, 40, 20, 30])).toEqual({ median: 30, p10: 14, p90: 46 })
  })
  it('not-reached (+Infinity) values make the upper percentiles null, never NaN', () => {
    const s = spread([1, 2, Number.POSITIVE_INFINITY, Number.POSITIVE_INFINITY])
    expect(s.median).toBeNull()
    expect(s.p10).not.toBeNull()
  })
})

const raisin = productById('grapes-to-raisins')
const summerFruit = {
  product: raisin,
  method: { kind: 'open-air' } as const,
  seasonStart: '07-01',
  seasonEnd: '08-31',
  startStepDays: 7,
  deadlineDays: 10,
  maxDays: 40,
}

let upland: Assessment
let valley: Assessment
function uplandRaisins(): Assessment {
  upland ??= assess(demoSeries('dryUpland'), summerFruit)
  return upland
}
function valleyRaisins(): Assessment {
  valley ??= assess(demoSeries('humidValley'), summerFruit)
  return valley
}

describe('the assessment', () => {
  it('is plain JSON-safe data with the documented keys', () => {
    const a = uplandRaisins()
    expect(JSON.parse(JSON.stringify(a))).toEqual(a)
    for (const k of [
      'site',
      'product',
      'method',
      'monthly',
      'hourOfDay',
      'startDates',
      'assumptions',
      'warnings',
      'coverage',
    ]) {
      expect(a).toHaveProperty(k)
    }
    expect(a.monthly.map((m) => m.month)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])
    expect(a.monthly[6].usableHours.byYear.map((y) => y.year)).toEqual([2021, 2022, 2023, 2024])
    expect(a.startDates[0]).toMatchObject({ start: '07-01', years: 4 })
    expect(a.hourOfDay.usableFraction).toHaveLength(12)
    expect(a.hourOfDay.usableFraction[6]).toHaveLength(24)
  })
  it('usable hours add up: byYear median equals the median, and no month exceeds its hours', () => {
    for (const m of uplandRaisins().monthly) {
      const sorted = m.usableHours.byYear.map((y) => y.hours).sort((x, y) => x - y)
      expect(m.usableHours.median).toBe(Math.round(quantileSorted(sorted, 0.5)))
      for (const y of m.usableHours.byYear) expect(y.hours).toBeLessThanOrEqual(31 * 24)
      if (m.usableHours.p10 !== null && m.usableHours.p90 !== null) {
        expect(m.usableHours.p10).toBeLessThanOrEqual(m.usableHours.p90)
      }
    }
  })
  it('with open air covered at night, no night hour (hour-of-day 0–3 local) is usable in July', () => {
    const july = uplandRaisins().hourOfDay.usableFraction[6]
    for (const h of [0, 1, 2, 3, 22, 23]) expect(july[h]).toBe(0)
    expect(Math.max(...(july as number[]))).toBeGreaterThan(0.5)
  })
  it('states every threshold with a source', () => {
    const names = uplandRaisins().assumptions.map((x) => x.name)
    for (const n of [
      'percentiles',
      'minimum product temperature',
      'rain threshold',
      'minimum deficit',
      'heater efficiency',
    ]) {
      expect(names).toContain(n)
    }
    for (const x of uplandRaisins().assumptions) expect(x.source.length).toBeGreaterThan(3)
  })
  it('cross-checks heat against water × (latent heat + sorption heat) ÷ efficiency', () => {
    const a = valleyRaisins()
    const h = a.heat
    // the default target is the moisture of raisins' safe water activity (0.60 at 25 °C), 14.3 % wb
    expect(a.product.targetMoistureWbPct).toBe(14.3)
    expect(a.product.dryTarget.basis).toBe('water-activity')
    // 1000 kg from 78.2 to 14.3 % wb: 1000 − 1000·0.218/0.857 = 745.6 kg water (mass balance on dry matter)
    expect(h.crossCheck.waterToRemoveKgPerTonne).toBeCloseTo(745.6, 1)
    // at least the latent heat of free water at the hottest heated air allowed (70 °C): 2501 − 2.361·70
    expect(h.crossCheck.heatOfEvaporationKjPerKg).toBeGreaterThan(2501 - 2.361 * 70)
    expect(h.crossCheck.evaporationHeatFuelKwhPerTonne).toBeCloseTo(
      (745.6 * h.crossCheck.heatOfEvaporationKjPerKg) / 3600 / h.heaterEfficiency,
      0,
    )
    // a dryer heated every hour exhausts warm, unsaturated air: it needs more than the evaporation heat
    expect(h.crossCheck.ratioHeatedEveryHour!).toBeGreaterThan(1)
    // fuel figures follow from the heat and the heating values
    const propane = h.fuels.find((f) => f.fuel === 'propane')!
    if (h.heatToAirKwhPerTonne.median !== null && h.heatToAirKwhPerTonne.median > 0) {
      expect(propane.quantityPerTonne!).toBeCloseTo(
        (h.heatToAirKwhPerTonne.median * 3.6) / h.heaterEfficiency / 25.46,
        0,
      )
    }
  })
  it('a typical-year file gives one year and says that spread cannot be computed', () => {
    const a = assess(demoSeries('typicalUpland'), { ...summerFruit, startStepDays: 14 })
    expect(a.site.typicalYear).toBe(true)
    expect(a.warnings.join(' ')).toMatch(/typical-year.*spread across years.*cannot be computed/)
    expect(a.monthly[6].usableHours.byYear).toHaveLength(1)
    expect(a.monthly[6].usableHours.p10).toBeNull()
  })
  it('rejects a target above the initial moisture with a message naming both', () => {
    expect(() => assess(demoSeries('typicalUpland'), { ...summerFruit, targetWbPct: 80 })).toThrow(
      /target moisture 80 % wb must be below the initial moisture 78.2 % wb/,
    )
  })
})

describe('every demo site gives a plausible, different answer', () => {
  it('the dry upland beats the humid valley for open-air raisins (usable July hours, finishing in 10 days)', () => {
    const u = uplandRaisins()
    const v = valleyRaisins()
    expect(u.monthly[6].usableHours.median!).toBeGreaterThan(v.monthly[6].usableHours.median! * 1.2)
    const meanP = (a: Assessment) =>
      a.startDates.reduce((s, r) => s + r.probabilityWithinDeadline, 0) / a.startDates.length
    expect(meanP(u)).toBeGreaterThan(meanP(v))
    expect(meanP(u)).toBeGreaterThan(0.5)
  })
  it('the humid valley needs more supplemental heat per tonne (season P90, and month by month)', () => {
    const u = uplandRaisins()
    const v = valleyRaisins()
    expect(v.heat.heatToAirKwhPerTonne.p90!).toBeGreaterThan(u.heat.heatToAirKwhPerTonne.p90!)
    let more = 0
    let total = [0, 0]
    for (let m = 0; m < 12; m++) {
      const hu = u.monthly[m].supplementalHeatKwhPerTonne.median ?? 0
      const hv = v.monthly[m].supplementalHeatKwhPerTonne.median ?? 0
      if (hv >= hu) more++
      total = [total[0] + hu, total[1] + hv]
    }
    expect(more).toBeGreaterThanOrEqual(10)
    expect(total[1]).toBeGreaterThan(total[0] * 1.2)
  })
  it('the four climates give four different July usable-hour medians, upland highest of the temperate sites', () => {
    const coast = assess(demoSeries('coolCoast'), { ...summerFruit, startStepDays: 31 })
    const tropical = assess(demoSeries('tropical'), { ...summerFruit, startStepDays: 31 })
    const july = [uplandRaisins(), valleyRaisins(), coast, tropical].map(
      (a) => a.monthly[6].usableHours.median,
    )
    expect(new Set(july).size).toBe(4)
    expect(july[0]!).toBeGreaterThan(july[2]!)
  })
  it('compare ranks the upland first by probability within the deadline and says the criterion', () => {
    const c = compare([demoSeries('humidValley'), demoSeries('dryUpland')], {
      ...summerFruit,
      startStepDays: 14,
      labels: ['valley', 'upland'],
    })
    expect(c.sites[0].site).toBe('upland')
    expect(c.criterionDescription).toMatch(/share of years/)
  })
})

describe('common practice, no source: sun drying of fruit wants roughly ≥ 30 °C and < 60 % RH for several days', () => {
  // The rule is checked against the engine on the demo climates: where July has several hours a day at
  // ≥ 30 °C and < 60 % RH, open-air raisins finish within the deadline in most years; where it has almost
  // none, they do not.
  function hotDryHoursPerDayInJuly(key: 'dryUpland' | 'humidValley'): number {
    const s = demoSeries(key)
    let n = 0
    let days = 0
    for (let i = 0; i < s.hours; i++) {
      const d = new Date(s.startUtcMs[i])
      if (d.getUTCMonth() !== 6) continue
      if (d.getUTCHours() === 0) days++
      if (s.dryBulbC[i] >= 30 && s.relativeHumidityPct[i] < 60) n++
    }
    return n / days
  }
  it('dry upland: several such hours a day, and batches finish within 21 days in most years', () => {
    expect(hotDryHoursPerDayInJuly('dryUpland')).toBeGreaterThan(3)
    const julyStarts = uplandRaisins().startDates.filter((r) => r.start.startsWith('07-'))
    expect(julyStarts.every((r) => r.probabilityWithinDeadline >= 0.5)).toBe(true)
  })
  it('humid valley: fewer such hours, and a lower share of batches finishing', () => {
    expect(hotDryHoursPerDayInJuly('humidValley')).toBeLessThan(hotDryHoursPerDayInJuly('dryUpland'))
  })
})

describe('hourly detail', () => {
  it('lists both deficits, evaporation, EMC and the verdict; deficit to target ≤ deficit to saturation', async () => {
    const { hourlyDetail } = await import('../../src/analysis/hourly-detail.ts')
    const s = demoSeries('dryUpland')
    const rows = hourlyDetail(s, summerFruit, 24 * 200, 48)
    expect(rows).toHaveLength(48)
    let usable = 0
    for (const r of rows) {
      expect(r.deficitToSaturationGPerKg!).toBeGreaterThanOrEqual(r.deficitToTargetGPerKg! - 1e-9)
      if (r.usable) {
        usable++
        expect(r.reason).toBe('usable')
        expect(r.deficitToTargetGPerKg!).toBeGreaterThanOrEqual(0.2)
      }
    }
    expect(usable).toBeGreaterThan(10)
    expect(rows.some((r) => r.reason === 'nightWithoutDrying')).toBe(true)
    expect(() => hourlyDetail(s, summerFruit, -1, 10)).toThrow(/first hour/)
  })
})
