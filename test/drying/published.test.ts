import { describe, expect, it } from 'vitest'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { type DryingMethodInput, parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { humidityRatioFromVaporPressure } from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { wetSurfaceEvaporationPenman1948KgPerM2H as wetSurfaceEvaporation } from '../../src/physics/wet-surface.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../../src/product/moisture-basis.ts'
import { constantSeries, type DiurnalWeather, diurnalSeries } from './synthetic-weather.ts'

describe('Penman open-water check (evaporation-and-sun.md §3)', () => {
  // FAO-56 Example 18 weather (Brussels, 6 July): T 16.9 °C, es − ea 0.5889 kPa (FAO-56 eq 12 mean es),
  // u2 2.078 m/s, P 100.12 kPa, open water albedo 0.08 → Rn 16.594 MJ m⁻² d⁻¹, G 0.
  // Check value: Penman 1948 wind function, E = 5.525 mm/d (the reference's recomputation).
  it('gives 5.525 mm/d within 1 %', () => {
    const t = 16.9
    const p = 100.12
    const ea = saturationVaporPressureLiquidKpa(t) - 0.5889 // the FAO deficit, as an equivalent vapour pressure
    const w = humidityRatioFromVaporPressure(ea, p)
    const eMmPerDay = 24 * wetSurfaceEvaporation(16.594e6 / 86400, t, ea, p, w, 2.078)
    expect(Math.abs(eMmPerDay - 5.525) / 5.525).toBeLessThan(0.01)
  })
})

describe('equilibrium moisture of shelled corn in natural-air drying air', () => {
  // Natural-air grain drying guidance: air at about 8 °C and 70 % RH brings shelled corn to about
  // 15–16 % wb; the published isotherm models differ by about a point there (issue 5; extension
  // guidance as summarised in drying-science.md §1.2). Checked through the hourly engine (shade method).
  const corn = productById('shelled-corn')
  const r = productResponse(corn)
  const s = constantSeries({ dryBulbC: 8, relativeHumidityPct: 70, hours: 24 * 60 })
  const c = computeHourlyConditions(s, parseDryingMethod({ kind: 'shade' }), r, {
    targetDb: moistureDbFromWbPct(13),
    initialWbPct: 25,
    loadingKgPerM2: 30,
    thresholds: parseDryingThresholds({ minProductTempC: 0 }),
    maxProductTempC: null,
  })
  it('EMC at 8 °C / 70 % is 14.5–16.5 % wb', () => {
    const wb = moistureWbPctFromDb(c.emcDesorptionDb[0])
    expect(wb).toBeGreaterThan(14.5)
    expect(wb).toBeLessThan(16.5)
  })
  it('a thin layer left in that air for 60 days ends within 0.3 points of the EMC and never below it', () => {
    const b = simulateBatch(c, r, {
      startIndex: 0,
      maxHours: 24 * 60,
      initialDb: moistureDbFromWbPct(25),
      targetDb: 0.01,
    })
    const endWb = moistureWbPctFromDb(b.finalDb)
    const emcWb = moistureWbPctFromDb(c.emcDesorptionDb[0])
    expect(endWb).toBeGreaterThanOrEqual(emcWb - 1e-9)
    expect(endWb - emcWb).toBeLessThan(0.3)
  })
})

/**
 * Published sun- and solar-drying experiments, time to target. The papers report place, season and
 * product; the weather here is reconstructed from that as a clear-sky diurnal cycle with climatological
 * values for the place and month (from memory, stated per case). Tolerance ±35 % on the time to target:
 * the reconstructed weather is a typical day, not the days of the experiment.
 */
function timeToTarget(
  id: string,
  w: DiurnalWeather,
  method: DryingMethodInput,
  initialWbPct: number,
  targetWbPct: number,
): number {
  const profile = productById(id)
  const r = productResponse(profile)
  const c = computeHourlyConditions(diurnalSeries(w), parseDryingMethod(method), r, {
    targetDb: moistureDbFromWbPct(targetWbPct),
    initialWbPct,
    loadingKgPerM2: profile.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: null,
  })
  // batches start at 08:00 local
  const b = simulateBatch(c, r, {
    startIndex: 8,
    maxHours: 24 * 30,
    initialDb: moistureDbFromWbPct(initialWbPct),
    targetDb: moistureDbFromWbPct(targetWbPct),
  })
  return b.hoursToTarget
}

const TOLERANCE = 0.35

describe('published drying experiments reproduced (time to target within ±35 %)', () => {
  // it.fails: the grape rate constant was fitted outside the engine (a constant 35 °C/35 % at the fruit around
  // the clock, src/product/catalogue-fruit.ts); with the product energy balance (evaporative cooling of the
  // berries, issue 15 item 7) the engine gives 250 h (1.42×), outside ±35 %. Re-fitting k through the engine
  // (issue 15 item 1, calibration) fixes it: flip back to `it` then.
  it.fails('Doymaz 2012 (J. Food Sci. Technol. 49:214): seedless grapes 17.2 mm, open sun, 78.2 → 22 % wb in 176 h', () => {
    // Aegean grape region (Manisa, 38.6 °N, 27.4 °E), mid-August: Tmax 34 °C, Tmin 20 °C, dew point 14 °C,
    // wind 2.5 m/s, clear (climatology from memory). Note: the profile's k was fitted to this experiment
    // under an assumed 35 °C/35 % at the fruit, so this checks the sun/temperature chain more than k.
    const hours = timeToTarget(
      'grapes-to-raisins',
      {
        latitudeDeg: 38.6,
        longitudeDeg: 27.4,
        utcOffsetHours: 3,
        firstDayUtcMs: Date.UTC(2010, 7, 15),
        days: 31,
        tMinC: 20,
        tMaxC: 34,
        dewPointC: 14,
        windMs: 2.5,
      },
      { kind: 'open-air' },
      78.2,
      22,
    )
    expect(Math.abs(hours - 176) / 176).toBeLessThan(TOLERANCE)
  })
  const umerkot: DiurnalWeather = {
    // Umerkot, Sindh (25.4 °N, 69.7 °E), mid-November: Tmax 31 °C, Tmin 14 °C, dew point 8 °C, wind 2 m/s,
    // clear dry-season sky (climatology from memory).
    latitudeDeg: 25.4,
    longitudeDeg: 69.7,
    utcOffsetHours: 5,
    firstDayUtcMs: Date.UTC(2022, 10, 10),
    days: 31,
    tMinC: 14,
    tMaxC: 31,
    dewPointC: 8,
    windMs: 2,
  }
  // Meghwar et al., Pak. J. Agric. Res. 36(1):63: red chilli 'Longi', Umerkot, Nov 2022, 80 → 10–12 % wb:
  // 81 h open sun, 63 h solar tunnel. Independent of the profile's k (fitted to Hossain & Bala 2007).
  it('Meghwar et al.: red chilli, open sun, 80 → 11 % wb in 81 h', () => {
    const hours = timeToTarget('chili-peppers', umerkot, { kind: 'open-air' }, 80, 11)
    expect(Math.abs(hours - 81) / 81).toBeLessThan(TOLERANCE)
  })
  it('Meghwar et al.: red chilli, solar tunnel (modelled as a solar cabinet, fans in sun), 80 → 11 % wb in 63 h', () => {
    const hours = timeToTarget('chili-peppers', umerkot, { kind: 'solar-cabinet' }, 80, 11)
    expect(Math.abs(hours - 63) / 63).toBeLessThan(TOLERANCE)
  })
  it('and the solar tunnel is faster than open sun, as published (63 h vs 81 h)', () => {
    expect(timeToTarget('chili-peppers', umerkot, { kind: 'solar-cabinet' }, 80, 11)).toBeLessThan(
      timeToTarget('chili-peppers', umerkot, { kind: 'open-air' }, 80, 11),
    )
  })
})
