import { describe, expect, it } from 'vitest'
import { cosIncidenceAngle } from '../../src/physics/irradiance.ts'
import { sinGeometricSunAltitude, sunPosition } from '../../src/physics/sun.ts'
import { caseFailures, loadTruth, type TruthCase } from './truth.ts'

const DEG = 180 / Math.PI
const n = (c: TruthCase, k: string) => c.input[k] as number

const fixture = loadTruth('sun-positions.json')
describe(`${fixture.title} (NREL SPA, NOAA)`, () => {
  for (const c of fixture.cases) {
    it(c.name, () => {
      let actual: Record<string, number>
      if (typeof c.input.utc === 'string') {
        const t = Date.parse(c.input.utc)
        const lat = n(c, 'latitudeDeg')
        const lon = n(c, 'longitudeDeg')
        const p = sunPosition(t, lat, lon)
        actual = {
          zenithDeg: 90 - p.altitudeDeg,
          azimuthDeg: p.azimuthDeg,
          altitudeDeg: p.altitudeDeg,
          geometricElevationDeg: Math.asin(sinGeometricSunAltitude(t, lat, lon)) * DEG,
        }
        if (c.expected.altitudeDeg !== undefined)
          expect(Math.sign(p.altitudeDeg)).toBe(Math.sign(c.expected.altitudeDeg))
      } else {
        const cos = cosIncidenceAngle(
          n(c, 'zenithDeg'),
          n(c, 'sunAzimuthDeg'),
          n(c, 'slopeDeg'),
          n(c, 'surfaceAzimuthDeg'),
        )
        actual = { incidenceDeg: Math.acos(cos) * DEG }
      }
      expect(caseFailures(fixture, c, actual)).toEqual([])
    })
  }
})
