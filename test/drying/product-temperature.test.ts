import { describe, expect, it } from 'vitest'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { type DiurnalWeather, diurnalSeries } from './synthetic-weather.ts'

// A clear mid-August week in the Aegean grape region (Manisa, 38.6 °N): Tmax 34 °C, Tmin 20 °C, dew point
// 14 °C, wind 2.5 m/s (climatology from memory, as in published.test.ts). Noon irradiance about 900 W/m².
const aegean: DiurnalWeather = {
  latitudeDeg: 38.6,
  longitudeDeg: 27.4,
  utcOffsetHours: 3,
  firstDayUtcMs: Date.UTC(2010, 7, 15),
  days: 7,
  tMinC: 20,
  tMaxC: 34,
  dewPointC: 14,
  windMs: 2.5,
}

function firstDays(id: string) {
  const profile = productById(id)
  const r = productResponse(profile)
  const s = diurnalSeries(aegean)
  const c = computeHourlyConditions(s, parseDryingMethod({ kind: 'open-air' }), r, {
    targetDb: moistureDbFromWbPct(profile.targetMoistureWbPct.value),
    initialWbPct: profile.initialMoistureWbPct.value,
    loadingKgPerM2: profile.defaultLoadingKgPerM2.value,
    thresholds: parseDryingThresholds({}),
    maxProductTempC: null,
  })
  const b = simulateBatch(c, r, {
    startIndex: 0,
    maxHours: 24 * 7,
    initialDb: moistureDbFromWbPct(profile.initialMoistureWbPct.value),
    targetDb: moistureDbFromWbPct(profile.targetMoistureWbPct.value),
    recordTrace: true,
  })
  return { s, c, b }
}

describe('product temperature in the sun follows its energy balance', () => {
  it('sunlit grapes on a rack run more than 8 K above the air at midday (measured: "frequently in excess of 8 °C")', () => {
    // The role of solar energy in the drying of vine fruit, Aust. J. Agric. Res. 13(4):662–673, 1962,
    // doi:10.1071/AR9620662 (abstract; authors not shown on the page read): on drying racks (sheltered by an
    // iron roof, so less sun than here), "temperatures within the grapes in excess of 8 °C above air
    // temperatures were frequently recorded". The skin limits their drying, so they evaporate little and stay
    // near the no-evaporation temperature.
    const { s, c, b } = firstDays('grapes-to-raisins')
    let checked = 0
    for (let h = 0; h < b.hoursSimulated; h++) {
      if (s.ghiWm2[h] < 800 || c.mode[h] !== 0) continue
      const rise = (b.productTrace as Float64Array)[h] - s.dryBulbC[h]
      expect(rise).toBeGreaterThan(8)
      // and below a surface that evaporates nothing
      expect((b.productTrace as Float64Array)[h]).toBeLessThan(c.productC[h])
      checked++
    }
    expect(checked).toBeGreaterThan(5)
  })
  it('a fresh, wet layer (apricot halves) is cooled by what it evaporates; drier, it runs warmer', () => {
    const { s, c, b } = firstDays('apricot-halves')
    // first sunny midday: the fresh halves evaporate a large share of the wet-surface rate
    let h = 0
    while (!(s.ghiWm2[h] > 800 && c.mode[h] === 0)) h++
    const t = (b.productTrace as Float64Array)[h]
    expect(t).toBeGreaterThan(c.productWetC[h])
    expect(c.productC[h] - t).toBeGreaterThan(8)
    // late in the batch, drier, it evaporates less and runs warmer at the same hour of day
    const later = h + 24 * 4
    expect((b.productTrace as Float64Array)[later]).toBeGreaterThan(t + 3)
  })
})
