/**
 * The column form (fillAirStateColumns) against the single-state function (airState), hour by hour:
 * the same ASHRAE HOF 2017 ch. 1 equations, so the same numbers to solver accuracy and to the 1e-9
 * relative interpolation error of the saturation table the column form uses at the dry bulb.
 */
import { describe, expect, it } from 'vitest'
import { seededRandom } from '../../bench/section.ts'
import { type AirColumnsOutput, fillAirStateColumns } from '../../src/physics/air-columns.ts'
import { airState } from '../../src/physics/air-state.ts'

function outputs(n: number): Required<AirColumnsOutput> {
  return {
    humidityRatioKgPerKg: new Float64Array(n),
    vaporPressureKpa: new Float64Array(n),
    dewPointC: new Float64Array(n),
    wetBulbC: new Float64Array(n),
    enthalpyKjPerKg: new Float64Array(n),
    densityKgPerM3: new Float64Array(n),
  }
}

describe('fillAirStateColumns', () => {
  const n = 2000
  const rnd = seededRandom(42)
  const dryBulbC = new Float64Array(n)
  const relativeHumidityPct = new Float64Array(n)
  const pressureKpa = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    dryBulbC[i] = -30 + 100 * rnd()
    relativeHumidityPct[i] = 1 + 99 * rnd()
    pressureKpa[i] = 60 + 45 * rnd()
  }
  const out = outputs(n)
  const invalid = fillAirStateColumns({ dryBulbC, relativeHumidityPct, pressureKpa }, out)

  it('equals airState hour by hour (W, pw, h, density to 1e-8 relative; dew point, wet bulb to 1e-7 °C)', () => {
    expect(invalid).toBe(0)
    for (let i = 0; i < n; i++) {
      const s = airState({
        dryBulbC: dryBulbC[i],
        relativeHumidityPct: relativeHumidityPct[i],
        pressureKpa: pressureKpa[i],
      })
      expect(Math.abs(out.humidityRatioKgPerKg[i] / (s.humidityRatioGPerKg / 1000) - 1)).toBeLessThan(1e-8)
      expect(Math.abs(out.vaporPressureKpa[i] / s.vaporPressureKpa - 1)).toBeLessThan(1e-8)
      expect(Math.abs(out.enthalpyKjPerKg[i] - s.enthalpyKjPerKg)).toBeLessThan(
        1e-8 * Math.abs(s.enthalpyKjPerKg) + 1e-9,
      )
      expect(Math.abs(out.densityKgPerM3[i] / s.densityKgPerM3 - 1)).toBeLessThan(1e-8)
      expect(Math.abs(out.dewPointC[i] - s.dewPointC)).toBeLessThan(1e-7)
      expect(Math.abs(out.wetBulbC[i] - s.wetBulbC)).toBeLessThan(1e-7)
    }
  })

  it('gives NaN in every output for missing or invalid input and counts those hours', () => {
    const bad: [number, number, number][] = [
      [Number.NaN, 50, 101.325], // missing dry bulb
      [20, Number.NaN, 101.325], // missing RH
      [20, 50, Number.NaN], // missing pressure
      [20, 120, 101.325], // RH above 100 %
      [20, 0, 101.325], // RH 0
      [20, 50, 101325], // pressure in Pa
      [150, 50, 101.325], // dry bulb above 100 °C
      [95, 50, 70], // above the boiling point at 70 kPa
      [-55, 0.1, 101.325], // dew point below −100 °C
    ]
    const good: [number, number, number] = [25, 40, 95]
    const rows = [good, ...bad, good]
    const m = rows.length
    const o = outputs(m)
    const count = fillAirStateColumns(
      {
        dryBulbC: Float64Array.from(rows.map((r) => r[0])),
        relativeHumidityPct: Float64Array.from(rows.map((r) => r[1])),
        pressureKpa: Float64Array.from(rows.map((r) => r[2])),
      },
      o,
    )
    expect(count).toBe(bad.length)
    for (let i = 1; i <= bad.length; i++) {
      for (const [k, col] of Object.entries(o)) expect(Number.isNaN(col[i]), `${k}[${i}]`).toBe(true)
    }
    // The valid hours around them are computed, and equal to airState.
    const s = airState({ dryBulbC: 25, relativeHumidityPct: 40, pressureKpa: 95 })
    for (const i of [0, m - 1]) {
      expect(o.wetBulbC[i]).toBeCloseTo(s.wetBulbC, 7)
      expect(o.humidityRatioKgPerKg[i]).toBeCloseTo(s.humidityRatioGPerKg / 1000, 10)
    }
  })

  it('computes only the columns asked for', () => {
    const only = { humidityRatioKgPerKg: new Float64Array(3) }
    fillAirStateColumns(
      {
        dryBulbC: Float64Array.of(10, 20, 30),
        relativeHumidityPct: Float64Array.of(50, 50, 50),
        pressureKpa: Float64Array.of(101.325, 101.325, 101.325),
      },
      only,
    )
    const s = airState({ dryBulbC: 30, relativeHumidityPct: 50, pressureKpa: 101.325 })
    expect(only.humidityRatioKgPerKg[2]).toBeCloseTo(s.humidityRatioGPerKg / 1000, 10)
  })
})
