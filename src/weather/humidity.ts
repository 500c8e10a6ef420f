/**
 * @module weather/humidity
 * Relative humidity over liquid water for every hour, from the file's RH, dew point or wet bulb
 * (first available per hour, in that order). RH = 100·e/es(T) with es over liquid water
 * (Hyland–Wexler, ASHRAE HOF 2017 ch. 1 eq 6; WMO practice for station RH, also below 0 °C); from
 * the wet bulb, e from the psychrometer balance (ASHRAE HOF 2017 ch. 1 eqs 33/35) at the hour's pressure.
 */
import { humidityRatioFromWetBulb, vaporPressureFromHumidityRatio } from '../physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../physics/saturation.ts'

export interface HumiditySources {
  relativeHumidityPct?: Float64Array
  dewPointC?: Float64Array
  wetBulbC?: Float64Array
}

/** Fill `out` with RH [%]; returns the count of hours derived from dew point and from wet bulb. */
export function deriveRelativeHumidity(
  dryBulbC: Float64Array,
  pressureKpa: Float64Array,
  sources: HumiditySources,
  out: Float64Array,
): { fromDewPoint: number; fromWetBulb: number } {
  let fromDewPoint = 0
  let fromWetBulb = 0
  const { relativeHumidityPct: rh, dewPointC: dew, wetBulbC: wet } = sources
  for (let s = 0; s < out.length; s++) {
    const t = dryBulbC[s]
    if (rh !== undefined && !Number.isNaN(rh[s])) {
      out[s] = rh[s]
      continue
    }
    if (Number.isNaN(t)) {
      out[s] = Number.NaN
      continue
    }
    if (dew !== undefined && !Number.isNaN(dew[s])) {
      out[s] = Math.min(
        100,
        (100 * saturationVaporPressureLiquidKpa(dew[s])) / saturationVaporPressureLiquidKpa(t),
      )
      fromDewPoint++
      continue
    }
    if (wet !== undefined && !Number.isNaN(wet[s]) && !Number.isNaN(pressureKpa[s])) {
      const w = humidityRatioFromWetBulb(t, wet[s], pressureKpa[s])
      const e = vaporPressureFromHumidityRatio(Math.max(0, w), pressureKpa[s])
      out[s] = Math.min(100, Math.max(0, (100 * e) / saturationVaporPressureLiquidKpa(t)))
      fromWetBulb++
      continue
    }
    out[s] = Number.NaN
  }
  return { fromDewPoint, fromWetBulb }
}
