import { describe, expect, it } from 'vitest'
import {
  BUSHEL_WEIGHT_KG,
  deepBedGrainFromProfile,
  m3PerMinPerTonneFromCfmPerBu,
  simulateDeepBed,
  simulateDeepBedReference,
} from '../../../src/drying/deep-bed/index.ts'
import { defaultSubsteps } from '../../../src/drying/deep-bed/layer-model.ts'
import { productById } from '../../../src/product/catalogue.ts'
import { equilibriumMoistureDb } from '../../../src/product/equilibrium.ts'
import { grainDryMatterLossModel } from '../../../src/product/spoilage/index.ts'
import { asRows, cyclingWeather } from './bin-weather.ts'

const cornProfile = productById('shelled-corn')
const corn = deepBedGrainFromProfile(cornProfile)
const cfm = (x: number) => m3PerMinPerTonneFromCfmPerBu(x, BUSHEL_WEIGHT_KG['shelled-corn'])
const dml = () => grainDryMatterLossModel()

describe('fast bin model against the reference implementation (exact isotherm, bisection)', () => {
  it('gives the same hours to dry, top-layer DML, final profile and water removed', () => {
    const weather = cyclingWeather(25, 14, 65)
    const setup = {
      floorAreaM2: 30,
      depthM: 3,
      layers: 10,
      initialMoistureWbPct: 21,
      initialGrainTempC: 14,
      airflowM3PerMinPerT: cfm(2),
      targetMoistureWbPct: 15.5,
      heatRiseK: 2,
      heaterOnAboveRhPct: 75,
    }
    const ref = simulateDeepBedReference(corn, setup, asRows(weather), dml())
    const fast = simulateDeepBed(corn, setup, weather, dml())
    expect(ref.hoursUntilTopDry).not.toBeNull()
    expect(Math.abs(fast.hoursUntilTopDry! - ref.hoursUntilTopDry!)).toBeLessThanOrEqual(1)
    expect(Math.abs(fast.topDryMatterLossPct - ref.topDryMatterLossPct)).toBeLessThan(
      0.005 * ref.topDryMatterLossPct,
    )
    for (let i = 0; i < 10; i++) {
      expect(Math.abs(fast.finalMoistureWbPct[i] - ref.finalMoistureWbPct[i])).toBeLessThan(0.01)
    }
    expect(fast.waterRemovedKgPerT).toBeCloseTo(ref.waterRemovedKgPerT, 1)
    expect(fast.heaterEnergyKwhPerT).toBeCloseTo(ref.heaterEnergyKwhPerT, 6)
    expect(fast.fanEnergyKwhPerT).toBeCloseTo(ref.fanEnergyKwhPerT, 9)
  })

  it('holds the default sub-step (one layer dry mass of air) within 0.5 % of days and 1 % of DML of half that', () => {
    const weather = cyclingWeather(60, 15, 70)
    for (const [depthM, cfmPerBu] of [
      [2, 0.75],
      [6, 3],
    ]) {
      const setup = {
        floorAreaM2: 40,
        depthM,
        initialMoistureWbPct: 21,
        initialGrainTempC: 15,
        airflowM3PerMinPerT: cfm(cfmPerBu),
        targetMoistureWbPct: 15.5,
      }
      const coarse = simulateDeepBed(corn, setup, weather, dml(), { stopWhen: 'top-dry' })
      const layerDryKg = (corn.bulkDensityKgPerM3 * 0.79 * depthM) / 20
      const airKgPerM2H = (coarse.airflowM3PerS * 3600 * 1.2) / 40
      const fine = simulateDeepBed(
        corn,
        { ...setup, substepsPerHour: 2 * defaultSubsteps(airKgPerM2H, layerDryKg) },
        weather,
        dml(),
        { stopWhen: 'top-dry' },
      )
      expect(fine.hoursUntilTopDry).not.toBeNull()
      expect(
        Math.abs(coarse.hoursUntilTopDry! - fine.hoursUntilTopDry!) / fine.hoursUntilTopDry!,
      ).toBeLessThan(0.005)
      expect(Math.abs(coarse.topDryMatterLossPct / fine.topDryMatterLossPct - 1)).toBeLessThan(0.01)
    }
  })
})

describe('fan control', () => {
  const setup = {
    floorAreaM2: 40,
    depthM: 3,
    initialMoistureWbPct: 20,
    initialGrainTempC: 14,
    airflowM3PerMinPerT: cfm(1.5),
    targetMoistureWbPct: 15.5,
  }
  // humid nights (about 85–95 %), dry afternoons (about 40–50 %)
  const weather = cyclingWeather(80, 14, 68, 6, 24)

  it('runs the fan only in the hours the rule allows', () => {
    const rh = simulateDeepBed(
      corn,
      { ...setup, fanControl: { mode: 'rh-below', maxRhPct: 70 } },
      weather,
      dml(),
      {
        recordHourly: true,
      },
    )
    let allowed = 0
    for (let h = 0; h < weather.dryBulbC.length; h++) {
      const on = weather.relativeHumidityPct[h] <= 70
      if (on) allowed++
      expect(rh.hourly!.fanOn[h]).toBe(on ? 1 : 0)
    }
    expect(rh.fanHours).toBe(allowed)
    // EMC controller: on where the outside air's EMC (exact isotherm) is below 15.5 % wb; the table reads the
    // isotherm within 1e-4 in aw, so hours within 0.05 points of the set value are not compared
    const emc = simulateDeepBed(
      corn,
      { ...setup, fanControl: { mode: 'air-emc-below', maxEmcWbPct: 15.5 } },
      weather,
      dml(),
      { recordHourly: true },
    )
    let compared = 0
    for (let h = 0; h < weather.dryBulbC.length; h++) {
      const m = equilibriumMoistureDb(cornProfile, weather.dryBulbC[h], weather.relativeHumidityPct[h])
      const wb = (100 * m) / (1 + m)
      if (Math.abs(wb - 15.5) < 0.05) continue
      compared++
      expect(emc.hourly!.fanOn[h]).toBe(wb <= 15.5 ? 1 : 0)
    }
    expect(compared).toBeGreaterThan(1500)
  })

  it('trades days for fan energy: controlled fans use less energy, take longer and leave the top wetter for longer', () => {
    const run = (fanControl: Parameters<typeof simulateDeepBed>[1]['fanControl']) =>
      simulateDeepBed(corn, { ...setup, fanControl }, weather, dml(), { stopWhen: 'top-dry' })
    const continuous = run({ mode: 'continuous' })
    const humidistat = run({ mode: 'rh-below', maxRhPct: 70 })
    const emc = run({ mode: 'air-emc-below', maxEmcWbPct: 15.5 })
    expect(continuous.hoursUntilTopDry).not.toBeNull()
    for (const controlled of [humidistat, emc]) {
      expect(controlled.fanHours).toBeLessThan(0.85 * continuous.fanHours)
      expect(controlled.fanEnergyKwhPerT).toBeLessThan(continuous.fanEnergyKwhPerT)
      // slower: more calendar time (or not dry at all within the 80 days)
      expect(controlled.hoursUntilTopDry ?? Number.POSITIVE_INFINITY).toBeGreaterThan(
        continuous.hoursUntilTopDry!,
      )
      // the top layer waits longer, so it loses more dry matter
      expect(controlled.topDryMatterLossPct).toBeGreaterThan(continuous.topDryMatterLossPct)
      // but each fan hour does more: more water per kWh
      const perKwh = (r: typeof continuous) => r.waterRemovedKgPerT / r.fanEnergyKwhPerT
      expect(perKwh(controlled)).toBeGreaterThan(perKwh(continuous))
    }
  })

  it('rejects a control it does not know, and a set value out of range, by name', () => {
    expect(() =>
      simulateDeepBed(corn, { ...setup, fanControl: { mode: 'rh-below', maxRhPct: 0 } }, weather, dml()),
    ).toThrow(/maxRhPct/)
    expect(() =>
      simulateDeepBed(
        corn,
        { ...setup, fanControl: { mode: 'air-emc-below', maxEmcWbPct: 60 } },
        weather,
        dml(),
      ),
    ).toThrow(/maxEmcWbPct/)
    expect(() =>
      simulateDeepBed(corn, { ...setup, fanControl: { mode: 'sometimes' } as never }, weather, dml()),
    ).toThrow(/fanControl.mode/)
  })
})

describe('run options', () => {
  const setup = {
    floorAreaM2: 20,
    depthM: 2,
    layers: 8,
    initialMoistureWbPct: 19,
    initialGrainTempC: 15,
    airflowM3PerMinPerT: cfm(2),
    targetMoistureWbPct: 15.5,
  }

  it('stops when the top layer is dry, and a wrapped run equals the same weather laid end to end', () => {
    const w = cyclingWeather(20, 16, 60)
    const full = simulateDeepBed(corn, setup, w, dml())
    const stopped = simulateDeepBed(corn, setup, w, dml(), { stopWhen: 'top-dry' })
    expect(stopped.hoursSimulated).toBe(full.hoursUntilTopDry)
    expect(stopped.topDryMatterLossPct).toBeLessThan(full.topDryMatterLossPct + 1e-12)
    // start 10 days from the end of a 20-day year and wrap, vs the same hours concatenated
    const start = 10 * 24
    const n = w.dryBulbC.length
    const cat = (c: Float64Array) => Float64Array.from({ length: n }, (_, i) => c[(start + i) % n])
    const wrapped = simulateDeepBed(corn, setup, w, dml(), { startIndex: start, hours: n, wrap: true })
    const laid = simulateDeepBed(
      corn,
      setup,
      { dryBulbC: cat(w.dryBulbC), relativeHumidityPct: cat(w.relativeHumidityPct), pressureKpa: 101.325 },
      dml(),
    )
    expect(wrapped.hoursUntilTopDry).toBe(laid.hoursUntilTopDry)
    expect(wrapped.topDryMatterLossPct).toBe(laid.topDryMatterLossPct)
  })

  it('counts missing hours, runs no fan in them and keeps the spoilage clock running', () => {
    const w = cyclingWeather(6, 16, 60)
    for (let h = 30; h < 42; h++) w.relativeHumidityPct[h] = Number.NaN
    const r = simulateDeepBed(corn, setup, w, dml(), { recordHourly: true })
    expect(r.missingWeatherHours).toBe(12)
    expect(r.fanHours).toBe(w.dryBulbC.length - 12)
    expect(r.topSpoilage.hours).toBe(w.dryBulbC.length)
    expect(r.hourly!.fanOn[35]).toBe(0)
    expect(r.hourly!.topMoistureWbPct[35]).toBe(r.hourly!.topMoistureWbPct[29])
  })

  it('rejects a start outside the weather by name', () => {
    const w = cyclingWeather(2, 16, 60)
    expect(() => simulateDeepBed(corn, setup, w, dml(), { startIndex: 48 })).toThrow(/startIndex/)
    expect(() => simulateDeepBed(corn, { ...setup, depthM: 0 }, w, dml())).toThrow(/depthM/)
  })
})
