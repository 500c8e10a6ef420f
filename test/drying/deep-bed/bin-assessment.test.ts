import { describe, expect, it } from 'vitest'
import {
  assessBinDrying,
  type BinAssessmentInput,
  deepBedGrainFromProfile,
} from '../../../src/drying/deep-bed/index.ts'
import { productById } from '../../../src/product/catalogue.ts'
import { multiYearWeather } from './bin-weather.ts'

const corn = deepBedGrainFromProfile(productById('shelled-corn'))

// Invented autumns (no place): a daily cycle around a mean per kind of year. A "good" year dries the grain at
// 1 m³/min per t; a "medium" one only at 2 (at 1 the top layer passes 0.5 % DML first); in a "bad" one the air is
// wetter than the grain and no airflow dries it.
const KINDS = { good: [12, 62], medium: [17, 74], bad: [22, 93] } as const
type Kind = keyof typeof KINDS

function tenYears(kindOf: (year: number) => Kind) {
  return multiYearWeather(2001, 10, (year, _month, hour) => {
    const [t, rh] = KINDS[kindOf(year)]
    const d = Math.cos((2 * Math.PI * (hour - 5)) / 24)
    return { tC: t - 5 * d, rhPct: Math.min(98, rh + 15 * d) }
  })
}

const BIN = {
  floorAreaM2: 20,
  depthM: 2.5,
  layers: 8,
  initialMoistureWbPct: 20,
  targetMoistureWbPct: 15.5,
}

function assess(weather: BinAssessmentInput['weather'], extra: Partial<BinAssessmentInput> = {}) {
  return assessBinDrying({
    weather,
    grain: corn,
    bin: BIN,
    startDates: [{ month: 9, day: 15 }],
    airflowsM3PerMinPerT: [1, 2, 4],
    seasonDays: 45,
    ...extra,
  })
}

describe('natural-air bin assessment over years', () => {
  const oneBadOneMedium = assess(tenYears((y) => (y === 2004 ? 'bad' : y === 2007 ? 'medium' : 'good')))

  it('runs every year × airflow and reports days, top-layer DML and fan energy per year', () => {
    const a = oneBadOneMedium
    expect(a.years).toEqual([2001, 2002, 2003, 2004, 2005, 2006, 2007, 2008, 2009, 2010])
    expect(a.runs).toBe(30)
    expect(a.runsLeftOut).toBe(0)
    expect(a.starts).toHaveLength(3)
    const at1 = a.starts.find((s) => s.airflowM3PerMinPerT === 1)!
    const bad = at1.runs.find((r) => r.year === 2004)!
    expect(bad.daysUntilTopDry).toBeNull()
    expect(bad.topLimitExceeded).toBe(true)
    expect(bad.safe).toBe(false)
    const good = at1.runs.find((r) => r.year === 2001)!
    expect(good.daysUntilTopDry).toBeGreaterThan(5)
    expect(good.safe).toBe(true)
    // fan energy per tonne = fan power per tonne × fan hours
    const facts = a.airflows.find((f) => f.airflowM3PerMinPerT === 1)!
    expect(good.fanEnergyKwhPerT).toBeCloseTo(facts.fanPowerKwPerT * good.fanHours, 9)
    expect(good.fanHours).toBe(Math.round(good.daysUntilTopDry! * 24))
    // the grain goes in at the mean outside temperature of its first day (12 °C in a good year)
    expect(good.initialGrainTempC).toBeCloseTo(12, 6)
  })

  it('more airflow: fewer days and lower top-layer DML in every year that dries, more static pressure and power', () => {
    const a = oneBadOneMedium
    const byQ = [1, 2, 4].map((q) => a.starts.find((s) => s.airflowM3PerMinPerT === q)!)
    for (let k = 1; k < byQ.length; k++) {
      for (const run of byQ[k].runs) {
        const lower = byQ[k - 1].runs.find((r) => r.year === run.year)!
        if (lower.daysUntilTopDry === null) continue
        expect(run.daysUntilTopDry!).toBeLessThan(lower.daysUntilTopDry)
        expect(run.topDryMatterLossPct).toBeLessThan(lower.topDryMatterLossPct)
      }
      expect(a.airflows[k].staticPressurePa).toBeGreaterThan(a.airflows[k - 1].staticPressurePa)
      expect(a.airflows[k].fanPowerKwPerT).toBeGreaterThan(a.airflows[k - 1].fanPowerKwPerT)
    }
    // in the year wetter than the grain, air only rewets it: more airflow does not save the top layer
    const bad = byQ.map((s) => s.runs.find((r) => r.year === 2004)!)
    expect(bad.every((r) => r.daysUntilTopDry === null && r.topLimitExceeded)).toBe(true)
  })

  it('picks the smallest airflow safe in 9 of 10 years: one bad year is allowed, a second is not', () => {
    // one bad and one medium year: at 1 m³/min per t 8 of 10 years are safe, at 2 nine
    const m = oneBadOneMedium.minimumAirflowByMonth
    expect(m).toHaveLength(1)
    expect(m[0].month).toBe(9)
    expect(m[0].minimumAirflowM3PerMinPerT).toBe(2)
    expect(m[0].shareOfYearsSafe).toBe(0.9)
    expect(oneBadOneMedium.starts.find((s) => s.airflowM3PerMinPerT === 1)!.yearsSafe).toBe(8)
    // only the medium year: 9 of 10 safe already at 1
    const oneMedium = assess(tenYears((y) => (y === 2007 ? 'medium' : 'good')))
    expect(oneMedium.minimumAirflowByMonth[0].minimumAirflowM3PerMinPerT).toBe(1)
    // two bad years: no airflow reaches 9 of 10; the share at the largest candidate is reported
    const twoBad = assess(tenYears((y) => (y === 2004 || y === 2009 ? 'bad' : 'good')))
    expect(twoBad.minimumAirflowByMonth[0].minimumAirflowM3PerMinPerT).toBeNull()
    expect(twoBad.minimumAirflowByMonth[0].shareOfYearsSafe).toBe(0.8)
    // the P90 of DML across 10 years (Hyndman–Fan type 7) is 0.9 × second-worst + 0.1 × worst year
    for (const s of oneBadOneMedium.starts) {
      const sorted = s.runs.map((r) => r.topDryMatterLossPct).sort((x, y) => x - y)
      expect(s.p90TopDryMatterLossPct).toBeCloseTo(0.9 * sorted[8] + 0.1 * sorted[9], 12)
    }
  })

  it('with every year required, asks for more airflow', () => {
    const a = assess(
      tenYears((y) => (y === 2007 ? 'medium' : 'good')),
      { requiredShareOfYears: 1 },
    )
    expect(a.minimumAirflowByMonth[0].minimumAirflowM3PerMinPerT).toBe(2)
    expect(a.rule).toMatch(/100 %/)
  })

  it('leaves out a season that runs past the end of the file, and says so', () => {
    const a = assess(
      tenYears(() => 'good'),
      { startDates: [{ month: 12, day: 1 }] },
    )
    expect(a.runs).toBe(27) // 2001–2009
    expect(a.runsLeftOut).toBe(3) // 2010 at three airflows
  })

  it('with a typical year: one run per start date and airflow, wrapping the year end, and a rule that says one year', () => {
    const typical = { ...tenYears(() => 'good'), typicalYear: true }
    // keep only the first year, as a typical-year file would hold
    const n = 8760
    const w = {
      startUtcMs: typical.startUtcMs.slice(0, n),
      dryBulbC: typical.dryBulbC.slice(0, n),
      relativeHumidityPct: typical.relativeHumidityPct.slice(0, n),
      pressureKpa: 101.325,
      typicalYear: true,
    }
    const a = assess(w, { startDates: [{ month: 12, day: 10 }] })
    expect(a.typicalYear).toBe(true)
    expect(a.years).toEqual([2001])
    expect(a.runs).toBe(3)
    expect(a.runsLeftOut).toBe(0)
    expect(a.rule).toMatch(/typical year/)
    expect(a.starts[0].runs[0].daysUntilTopDry).not.toBeNull() // ran on into January of the same file
  })

  it("starts on the site's clock when it is given: a summer clock an hour ahead starts as standard time + 1 h", () => {
    const w = tenYears((y) => (y % 3 === 0 ? 'medium' : 'good'))
    const pick = (a: ReturnType<typeof assess>) =>
      a.starts.map((s) => s.runs.map((r) => [r.year, r.daysUntilTopDry, r.initialGrainTempC]))
    // standard time UTC−6, daylight saving time UTC−5 in September (as America/Chicago)
    const summer = assess(w, {
      utcOffsetHours: -6,
      startHourLocal: 8,
      toUtcMs: (y, m, d, h) => Date.UTC(y, m - 1, d, h) + 5 * 3_600_000,
    })
    const standardPlusOne = assess(w, { utcOffsetHours: -5, startHourLocal: 8 })
    const standard = assess(w, { utcOffsetHours: -6, startHourLocal: 8 })
    expect(pick(summer)).toEqual(pick(standardPlusOne))
    // and the hour makes a difference here (the test could fail): grain goes in at another temperature
    expect(pick(summer)).not.toEqual(pick(standard))
  })

  it('rejects bad dates, airflows and seasons by name', () => {
    const w = tenYears(() => 'good')
    expect(() => assess(w, { startDates: [{ month: 2, day: 30 }] })).toThrow(/start date/)
    expect(() => assess(w, { airflowsM3PerMinPerT: [0] })).toThrow(/airflow/)
    expect(() => assess(w, { seasonDays: 0 })).toThrow(/seasonDays/)
    expect(() => assess(w, { requiredShareOfYears: 1.5 })).toThrow(/requiredShareOfYears/)
  })
})
