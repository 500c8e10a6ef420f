import { describe, expect, it } from 'vitest'
import { dayOfYearAt } from '../../src/physics/calendar.ts'
import { windSpeedAt2mMs } from '../../src/physics/evaporation.ts'
import {
  atmosphericPressureFao56Kpa,
  netLongwaveHourlyMjM2,
  psychrometricConstantFao56KpaPerC,
  referenceEtHourlyFao56,
  saturationSlopeFao56KpaPerC,
  saturationVaporPressureFao56Kpa,
} from '../../src/physics/fao56-reference-et.ts'
import {
  daylightHours,
  extraterrestrialRadiationDailyMjM2,
  extraterrestrialRadiationPeriodMjM2,
  fao56HourAngleRad,
  inverseRelativeDistanceEarthSun,
  seasonalCorrectionHours,
  solarDeclinationRad,
  sunsetHourAngleRad,
} from '../../src/physics/fao56-solar.ts'
import { clearSkyRadiationFao56 } from '../../src/physics/irradiance.ts'
import { caseFailures, loadTruth, type TruthCase } from './truth.ts'

const RAD = Math.PI / 180
const n = (c: TruthCase, k: string) => c.input[k] as number

const hourly = loadTruth('fao56-example-19-hourly-eto.json')
describe(`${hourly.title} (FAO-56 Example 19)`, () => {
  for (const c of hourly.cases) {
    it(c.name, () => {
      const r = referenceEtHourlyFao56({
        latitudeDeg: 16 + 13 / 60,
        longitudeWestDeg: 16.25,
        timeZoneCentreWestDeg: 15,
        elevationM: 8,
        year: 2001, // FAO-56 gives no year; any non-leap year puts 1 October on J = 274
        month: 10,
        day: 1,
        clockHourMid: n(c, 'clockHourMid'),
        airTempC: n(c, 'airTempC'),
        relativeHumidityPct: n(c, 'relativeHumidityPct'),
        windAt2mMs: n(c, 'windAt2mMs'),
        solarRadiationMjM2: n(c, 'solarRadiationMjM2'),
      })
      expect(
        caseFailures(hourly, c, {
          ...r,
          vaporPressureDeficitKpa: r.saturationVaporPressureKpa - r.vaporPressureKpa,
        } as unknown as Record<string, number>),
      ).toEqual([])
    })
  }
})

/** Each example's quantities, computed by dryhours from the example's inputs. */
const EXAMPLES: Record<string, (c: TruthCase) => Record<string, number>> = {
  '2': (c) => {
    const p = atmosphericPressureFao56Kpa(n(c, 'elevationM'))
    return { pressureKpa: p, psychrometricKpaPerC: psychrometricConstantFao56KpaPerC(p) }
  },
  '3': (c) => ({
    saturationVaporPressureKpa:
      (saturationVaporPressureFao56Kpa(n(c, 'tMaxC')) + saturationVaporPressureFao56Kpa(n(c, 'tMinC'))) / 2,
  }),
  '17': (c) => ({ slopeKpaPerC: saturationSlopeFao56KpaPerC(n(c, 'tC')) }),
  '20': (c) => ({ saturationVaporPressureKpa: saturationVaporPressureFao56Kpa(n(c, 'tC')) }),
  '14': (c) => ({ windAt2mMs: windSpeedAt2mMs(n(c, 'windMs'), n(c, 'heightM')) }),
  '18-wind': (c) => ({ windAt2mMs: windSpeedAt2mMs(n(c, 'windMs'), n(c, 'heightM')) }),
  '8-9': (c) => {
    const lat = n(c, 'latitudeDeg') * RAD
    const j = n(c, 'dayOfYear')
    const ws = sunsetHourAngleRad(lat, solarDeclinationRad(j))
    return {
      inverseRelativeDistance: inverseRelativeDistanceEarthSun(j),
      declinationRad: solarDeclinationRad(j),
      sunsetHourAngleRad: ws,
      extraterrestrialDailyMjM2: extraterrestrialRadiationDailyMjM2(lat, j),
      daylightHours: daylightHours(ws),
    }
  },
  '18-radiation': (c) => {
    const ra = extraterrestrialRadiationDailyMjM2(n(c, 'latitudeDeg') * RAD, n(c, 'dayOfYear'))
    return {
      extraterrestrialDailyMjM2: ra,
      clearSkyDailyMjM2: clearSkyRadiationFao56(ra, n(c, 'elevationM')),
    }
  },
  '19-sun': (c) => {
    const j = dayOfYearAt(Date.UTC(2001, 9, 1))
    const w = fao56HourAngleRad(n(c, 'clockHourMid'), n(c, 'lzWestDeg'), n(c, 'lmWestDeg'), j)
    const ra = extraterrestrialRadiationPeriodMjM2(n(c, 'latitudeDeg') * RAD, j, w, 1)
    return {
      dayOfYear: j,
      seasonalCorrectionH: seasonalCorrectionHours(j),
      hourAngleRad: w,
      hourAngleStartRad: w - Math.PI / 24,
      hourAngleEndRad: w + Math.PI / 24,
      extraterrestrialHourlyMjM2: ra,
      clearSkyHourlyMjM2: clearSkyRadiationFao56(ra, n(c, 'elevationM')),
    }
  },
  '11': (c) => {
    // The daily form averages T⁴ of Tmax and Tmin; σ_daily = 24 σ_hourly (4.903e-9 vs 24 × 2.043e-10 = 4.9032e-9).
    const tK4 = ((n(c, 'tMaxC') + 273.16) ** 4 + (n(c, 'tMinC') + 273.16) ** 4) / 2
    const tEffC = Math.sqrt(Math.sqrt(tK4)) - 273.16
    return {
      netLongwaveDailyMjM2:
        24 * netLongwaveHourlyMjM2(tEffC, n(c, 'vaporPressureKpa'), n(c, 'shortwaveRatio')),
    }
  },
}

const examples = loadTruth('fao56-examples.json')
describe(`${examples.title} (FAO-56)`, () => {
  for (const c of examples.cases) {
    it(c.name, () => {
      const compute = EXAMPLES[c.input.example as string]
      expect(compute, `no computation for example ${c.input.example}`).toBeDefined()
      expect(caseFailures(examples, c, compute(c))).toEqual([])
    })
  }
})
