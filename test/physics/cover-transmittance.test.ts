import { describe, expect, it } from 'vitest'
import {
  coverTransmittance,
  diffuseEquivalentAnglesDeg,
  fresnelReflectance,
  GLASS_REFRACTIVE_INDEX,
  transmittedIrradianceWm2,
} from '../../src/physics/cover-transmittance.ts'

const GLASS = { refractiveIndex: GLASS_REFRACTIVE_INDEX, extinctionThickness: 0 }

describe('cover transmittance (Duffie & Beckman ch. 5 method)', () => {
  it('reflects 27.1 % of natural light at 75° on n = 1.61 (worked problem, PCSCC 1993 optics equation file)', () => {
    const { perpendicular, parallel } = fresnelReflectance(75, 1.61)
    expect(Math.round(1000 * 0.5 * (perpendicular + parallel)) / 10).toBe(27.1)
  })

  it('gives ((n − 1)/(n + 1))² at normal incidence and joins it smoothly', () => {
    const r0 = ((1.526 - 1) / (1.526 + 1)) ** 2
    expect(fresnelReflectance(0, 1.526).perpendicular).toBeCloseTo(r0, 12)
    const r = fresnelReflectance(0.5, 1.526)
    expect(r.perpendicular).toBeCloseTo(r0, 4)
    expect(r.parallel).toBeCloseTo(r0, 4)
  })

  it('matches Duffie & Beckman’s one- and two-cover glass example at 60° (0.84 and 0.76; from memory)', () => {
    expect(coverTransmittance(GLASS, 60)).toBeCloseTo(0.84, 2)
    expect(coverTransmittance({ ...GLASS, covers: 2 }, 60)).toBeCloseTo(0.76, 2)
  })

  it('falls with angle, with absorption and with more covers', () => {
    let prev = 1
    for (let a = 0; a < 90; a += 5) {
      const t = coverTransmittance({ ...GLASS, extinctionThickness: 0.037 }, a)
      expect(t).toBeLessThanOrEqual(prev)
      prev = t
    }
    expect(coverTransmittance({ ...GLASS, extinctionThickness: 0.037 }, 30)).toBeLessThan(
      coverTransmittance(GLASS, 30),
    )
    expect(coverTransmittance(GLASS, 90)).toBe(0)
  })

  it('uses the diffuse equivalent angles (horizontal cover: sky 59.7°, ground 90°)', () => {
    expect(diffuseEquivalentAnglesDeg(0)).toEqual({ skyDeg: 59.7, groundDeg: 90 })
    const tau = transmittedIrradianceWm2(GLASS, {
      beamWm2: 600,
      skyDiffuseWm2: 200,
      groundWm2: 0,
      incidenceDeg: 20,
      slopeDeg: 0,
    })
    expect(tau).toBeCloseTo(600 * coverTransmittance(GLASS, 20) + 200 * coverTransmittance(GLASS, 59.7), 9)
  })

  it('rejects impossible covers by name', () => {
    expect(() => coverTransmittance({ refractiveIndex: 0.9, extinctionThickness: 0 }, 10)).toThrow(
      /refractive/,
    )
    expect(() => coverTransmittance({ ...GLASS, covers: 0 }, 10)).toThrow(/covers/)
  })
})
