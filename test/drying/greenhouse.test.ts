/**
 * The greenhouse dryer (drying/methods/greenhouse.ts): one hour of the method with stated sun and air, checked
 * against its own balances (heat and water of the enclosure) and its settings. The relations it is built from are
 * checked against their sources in test/physics/greenhouse-air.test.ts.
 */
import { describe, expect, it } from 'vitest'
import { parseDryingMethod } from '../../src/drying/method.ts'
import {
  type GreenhouseMethod,
  greenhouse,
  greenhouseGeometry,
  greenhouseTonnes,
  referenceVentilationKgPerS,
} from '../../src/drying/methods/greenhouse.ts'
import { HourMode, MethodHour } from '../../src/drying/methods/method-model.ts'
import type { SolarColumns } from '../../src/drying/solar-columns.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { latentHeatVaporizationMjPerKg } from '../../src/physics/evaporation.ts'
import { coverHeatLossCoefficientWm2K, MIHARA_HAYASHI_1979 } from '../../src/physics/greenhouse-air.ts'
import {
  moistAirHeatCapacityKjPerKgK,
  moistAirSpecificVolumeM3PerKg,
  vaporPressureFromHumidityRatio,
} from '../../src/physics/moist-air.ts'
import { saturationPressureLiquidPa } from '../../src/physics/saturation.ts'
import { productById } from '../../src/product/catalogue.ts'
import { demoSeries } from './demo-weather.ts'

const chilli = productById('chili-peppers')
const LOADING = 5

function method(input: Record<string, unknown>): GreenhouseMethod {
  const m = parseDryingMethod({ kind: 'greenhouse', ...input })
  if (m.kind !== 'greenhouse') throw new Error('kind')
  return m
}

/** One hour of the greenhouse `m` at 30 °C, W 0.012, 1 m/s, sea level, `ghiWm2` with the sun 70° high. */
function hourOf(m: GreenhouseMethod, ghiWm2: number, initialWbPct = 80): MethodHour {
  const solar: SolarColumns = {
    altitudeDeg: Float64Array.of(70),
    azimuthDeg: new Float64Array(0),
    raWm2: Float64Array.of(1300),
    rsOverRso: Float64Array.of(0.8),
  }
  const hourFn = greenhouse.prepare(m, {
    series: demoSeries('dryUpland'),
    profile: chilli,
    initialWbPct,
    targetWbPct: 10,
    solar,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: null,
    product: { shape: 'cylinder', sizeMm: 10, loadingKgPerM2: LOADING },
  })
  const h = new MethodHour()
  h.index = 0
  h.dryBulbC = 30
  h.pressureKpa = 101.325
  h.humidityRatio = 0.012
  h.vaporPressureKpa = vaporPressureFromHumidityRatio(0.012, h.pressureKpa)
  h.saturationPa = saturationPressureLiquidPa(30)
  h.windAt2mMs = 1
  h.ghiWm2 = ghiWm2
  h.night = ghiWm2 === 0
  h.airC = h.productC = 30
  hourFn(h)
  return h
}

/** The hour's dry-air flow [kg/s], water carried out [kg/s] and heat balance terms [W]. */
function balanceOf(m: GreenhouseMethod, h: MethodHour) {
  const geo = greenhouseGeometry(m)
  const flow = h.airFlowShare * referenceVentilationKgPerS(m)
  const water = flow * (h.humidityRatio - 0.012)
  const rise = h.airC - 30
  const sunW = h.solarKwhPerTonne * 1000 * greenhouseTonnes(m, LOADING)
  const coverW = coverHeatLossCoefficientWm2K(MIHARA_HAYASHI_1979.pvcFilm, 1) * geo.coverM2 * rise
  const ventilationW = flow * 1000 * moistAirHeatCapacityKjPerKgK(h.humidityRatio) * rise
  const latentW = latentHeatVaporizationMjPerKg(h.productWetC) * 1e6 * water
  return { flow, water, rise, sunW, coverW, ventilationW, latentW }
}

describe('greenhouse dryer: one hour in the sun', () => {
  it('the sun passed to the air leaves through the cover, with the ventilation air and as evaporation', () => {
    const m = method({})
    const h = hourOf(m, 800)
    const b = balanceOf(m, h)
    expect(b.rise).toBeGreaterThan(1)
    expect(b.water).toBeGreaterThan(0) // the fresh product wets the air
    // converged to 0.01 K and 1e-5 kg/kg: the balance closes to about 1 %
    expect((b.coverW + b.ventilationW + b.latentW) / b.sunW).toBeCloseTo(1, 1)
    // the product in the sun sits above the air when it evaporates nothing, below it when wet in still air
    expect(h.productC).toBeGreaterThan(h.airC)
    expect(h.productWetC).toBeLessThan(h.productC)
    expect(h.mode).toBe(HourMode.active)
  })

  it('a product that gives no more water leaves the air at the outside humidity and warms it more', () => {
    const m = method({})
    const wet = hourOf(m, 800)
    // initial moisture below the product's equilibrium in this air: no water from its kinetics
    const dry = hourOf(m, 800, 5)
    expect(dry.humidityRatio).toBeCloseTo(0.012, 9)
    expect(dry.airC).toBeGreaterThan(wet.airC)
    const b = balanceOf(m, dry)
    expect((b.coverW + b.ventilationW) / b.sunW).toBeCloseTo(1, 2)
  })

  it('larger openings keep the air cooler and drier; a stated air-change rate replaces the stack', () => {
    const small = hourOf(method({ ventShareOfFloor: 0.05 }), 800)
    const large = hourOf(method({ ventShareOfFloor: 0.6 }), 800)
    expect(small.airC).toBeGreaterThan(large.airC)
    expect(small.humidityRatio).toBeGreaterThan(large.humidityRatio)
    const m = method({ airChangesPerHour: 60 })
    const h = hourOf(m, 800)
    const geo = greenhouseGeometry(m)
    const v = moistAirSpecificVolumeM3PerKg(h.airC, h.humidityRatio, 101.325)
    // 60 volumes an hour: one a minute, of the half-cylinder's volume
    expect(balanceOf(m, h).flow).toBeCloseTo(geo.volumeM3 / 60 / v, 3)
  })

  it('without sun the greenhouse is open to still ambient air or closed', () => {
    const open = hourOf(method({ nightPractice: 'open' }), 0)
    expect(open.airC).toBe(30)
    expect(open.humidityRatio).toBe(0.012)
    expect(open.airFlowShare).toBe(0) // no draught: the product rewets, it does not dry
    expect(open.mode).toBe(HourMode.active)
    const closed = hourOf(method({}), 0) // the default
    expect(closed.mode).toBe(HourMode.paused)
    expect(closed.pausedByNight).toBe(true)
  })

  it('geometry: a half-cylinder over the floor, trays no larger than the floor', () => {
    const geo = greenhouseGeometry(method({ lengthM: 10, widthM: 4 }))
    expect(geo.floorM2).toBe(40)
    expect(geo.coverM2).toBeCloseTo(Math.PI * 2 * 10 + Math.PI * 4, 10)
    expect(geo.volumeM3).toBeCloseTo(Math.PI * 2 * 10, 10)
    expect(geo.ventHeightM).toBe(2)
    expect(geo.ventAreaM2).toBeCloseTo(12, 10)
    expect(() => greenhouseGeometry(method({ trayAreaM2: 17 }))).toThrow(/trayAreaM2/)
  })
})
