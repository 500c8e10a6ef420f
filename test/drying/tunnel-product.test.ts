/**
 * The solar tunnel's product on its surface balance (drying/methods/tunnel.ts through physics/wet-surface.ts):
 * one hour of the method with stated air, checked against a handbook state and against the balance itself.
 */
import { describe, expect, it } from 'vitest'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { MethodHour } from '../../src/drying/methods/method-model.ts'
import { PRODUCT_EMISSIVITY } from '../../src/drying/methods/open-air.ts'
import { tunnel } from '../../src/drying/methods/tunnel.ts'
import type { SolarColumns } from '../../src/drying/solar-columns.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { thinCoverTemperatureC } from '../../src/physics/cover-exchange.ts'
import {
  flatPlateHeatTransferCoefficientWm2K,
  radiativeHeatTransferCoefficientWm2K,
} from '../../src/physics/evaporation.ts'
import { vaporPressureFromHumidityRatio } from '../../src/physics/moist-air.ts'
import { saturationPressureLiquidPa } from '../../src/physics/saturation.ts'
import { productById } from '../../src/product/catalogue.ts'
import { demoSeries } from './demo-weather.ts'

const chilli = productById('chili-peppers')

/** One hour of the tunnel `input` in air at `dryBulbC` and humidity ratio `w` (sea level, no sun unless `ghiWm2`). */
function tunnelHour(
  input: Record<string, unknown>,
  dryBulbC: number,
  w: number,
  ghiWm2 = 0,
  altitudeDeg = 0,
): MethodHour {
  const m = parseDryingMethod({ kind: 'tunnel', ...input })
  if (m.kind !== 'tunnel') throw new Error('kind')
  const solar: SolarColumns = {
    altitudeDeg: Float64Array.of(altitudeDeg),
    azimuthDeg: new Float64Array(0),
    raWm2: Float64Array.of(1300),
    rsOverRso: Float64Array.of(0.8),
  }
  const hourFn = tunnel.prepare(m, {
    series: demoSeries('dryUpland'),
    profile: chilli,
    initialWbPct: 80,
    targetWbPct: 10,
    solar,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: null,
    product: { shape: 'cylinder', sizeMm: 10, loadingKgPerM2: 2 },
  })
  const h = new MethodHour()
  h.index = 0
  h.dryBulbC = dryBulbC
  h.pressureKpa = 101.325
  h.humidityRatio = w
  h.vaporPressureKpa = vaporPressureFromHumidityRatio(w, h.pressureKpa)
  h.saturationPa = saturationPressureLiquidPa(dryBulbC)
  h.windAt2mMs = 1
  h.ghiWm2 = ghiWm2
  h.night = ghiWm2 === 0
  hourFn(h)
  return h
}

describe('solar tunnel: the product on its surface balance', () => {
  it('with no sun and fast air, a wet product sits at the wet bulb (ASHRAE HOF 2017 ch. 1 Example 1: 40 °C dry bulb, 20 °C wet bulb, W 0.0065)', () => {
    // ASHRAE Handbook — Fundamentals 2017 (SI) ch. 1 Example 1 (as in test/fixtures/truth/ashrae-2017-example-1.json).
    // No collector and no sun: the air is the ambient; the fans blow 10 m/s over the product (hc 32.8 W m⁻² K⁻¹),
    // and the cover, at the air's temperature on both faces, warms the product a little by long-wave radiation.
    const fast = tunnelHour({ fans: 'constant', collectorLengthM: 0, airSpeedOverProductMs: 10 }, 40, 0.0065)
    expect(fast.productWetC).toBeGreaterThan(20)
    expect(fast.productWetC).toBeLessThan(21) // measured 20.75
    // slower air: the cover's radiation weighs more against convection, the wet product sits higher
    const slow = tunnelHour(
      { fans: 'constant', collectorLengthM: 0, airSpeedOverProductMs: 0.25 },
      40,
      0.0065,
    )
    expect(slow.productWetC).toBeGreaterThan(fast.productWetC + 1)
    expect(slow.productWetC).toBeLessThan(40)
    // a product that evaporates nothing takes the air's (and cover's) temperature
    expect(slow.productC).toBeCloseTo(40, 9)
  })

  it('in sun, a wet product is cooled by what it evaporates; one that evaporates nothing runs warmer than the air', () => {
    const h = tunnelHour({}, 30, 0.012, 900, 70)
    expect(h.airC).toBeGreaterThan(50) // the collector's air
    expect(h.productC).toBeGreaterThan(h.airC)
    expect(h.productWetC).toBeLessThan(h.airC)
    expect(h.evaporationKgPerM2H).toBeGreaterThan(0)
    expect(h.airFlowShare).toBe(1)
  })

  it('exchanges long-wave with the cover, whose temperature lies between the tunnel air and the ambient by the two convection coefficients', () => {
    // no sun and no collector: air and cover at the ambient, nothing to exchange; a warm surface (no
    // evaporation) then sits exactly at the air
    const h = tunnelHour({ fans: 'constant' }, 25, 0.01)
    expect(h.airC).toBe(25)
    expect(h.productC).toBeCloseTo(25, 9)
    // the cover between two airs: h_in·(T_in − T_c) = h_out·(T_c − T_out)
    const hIn = flatPlateHeatTransferCoefficientWm2K(0.25)
    const hOut = flatPlateHeatTransferCoefficientWm2K(2)
    const tc = thinCoverTemperatureC(hIn, 55, hOut, 30)
    expect(hIn * (55 - tc)).toBeCloseTo(hOut * (tc - 30), 9)
    // with a warm tunnel air the product loses long-wave to the cooler cover: in full sun the no-evaporation
    // temperature is below T_air + α·τG/(A·hc) by the cover's share
    const sun = tunnelHour({}, 30, 0.012, 900, 70)
    const r = radiativeHeatTransferCoefficientWm2K(PRODUCT_EMISSIVITY, 30)
    expect(r).toBeGreaterThan(5)
    expect(sun.productC - sun.airC).toBeLessThan((0.7 * 900) / (Math.PI * hIn))
  })
})
