import { describe, expect, it } from 'vitest'
import {
  fillNightShortwaveRatioColumn,
  NIGHT_RS_RSO_DEFAULT,
  netLongwaveHourlyMjM2,
  referenceEtHourlyFao56,
  shortwaveRatio,
  soilHeatFluxHourlyMjM2,
} from '../../src/physics/fao56-reference-et.ts'

// FAO-56 Example 19's published values (and Example 11) are checked in test/truth/fao56.test.ts against
// test/fixtures/truth/fao56-example-19-hourly-eto.json; this file checks the rest of the hourly chain.
const site = {
  latitudeDeg: 16 + 13 / 60,
  longitudeWestDeg: 16.25,
  timeZoneCentreWestDeg: 15,
  elevationM: 8,
  year: 2001, // FAO-56 gives no year; any non-leap year puts 1 October on J = 274
  month: 10,
  day: 1,
}

describe('eq 39 and the night Rs/Rso ratio', () => {
  it('ratio limited to 0.3…1 (FAO-56 eq 39 upper, ASCE-EWRI 2005 eq 45 lower), NaN at night', () => {
    expect(shortwaveRatio(3, 2)).toBe(1)
    expect(shortwaveRatio(0.1, 2)).toBe(0.3)
    expect(Number.isNaN(shortwaveRatio(0, 0))).toBe(true)
  })
  it('column: night hours carry the last ratio with the sun above 0.3 rad; start of series uses 0.8', () => {
    const rs = new Float64Array([0, 0.5, 1.8, 1.2, 0.1, 0, 0])
    const rso = new Float64Array([0, 1, 2, 2, 0.5, 0, 0])
    const alt = new Float64Array([-5, 10, 40, 30, 5, -3, -20])
    const out = new Float64Array(7)
    fillNightShortwaveRatioColumn(rs, rso, alt, out)
    expect(Array.from(out)).toEqual([NIGHT_RS_RSO_DEFAULT, 0.5, 0.9, 0.6, 0.3, 0.6, 0.6])
  })
  it('G = 0.1 Rn by day (eq 45), 0.5 Rn at night (eq 46)', () => {
    expect(soilHeatFluxHourlyMjM2(2, true)).toBeCloseTo(0.2, 12)
    expect(soilHeatFluxHourlyMjM2(-0.2, false)).toBeCloseTo(-0.1, 12)
  })
  it('RangeErrors name the input', () => {
    expect(() => netLongwaveHourlyMjM2(20, 1, 1.2)).toThrow(/Rs\/Rso/)
    expect(() =>
      referenceEtHourlyFao56({
        ...site,
        clockHourMid: 12,
        airTempC: 30,
        relativeHumidityPct: 120,
        windAt2mMs: 2,
        solarRadiationMjM2: 2,
      }),
    ).toThrow(/relative humidity.*120/)
    expect(() =>
      fillNightShortwaveRatioColumn(
        new Float64Array(3),
        new Float64Array(2),
        new Float64Array(3),
        new Float64Array(3),
      ),
    ).toThrow(/3 values/)
  })
})
