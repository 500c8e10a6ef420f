/**
 * @module api/schemas/air
 * Query of GET /v1/air. Same meaning and units as `dryhours air`.
 */
import { z } from 'zod'
import { numberParam } from './params.ts'

export const airQuerySchema = z
  .strictObject({
    tdb: numberParam('dry-bulb temperature [°C]'),
    rh: numberParam('relative humidity over liquid water [%], greater than 0 and at most 100').optional(),
    twb: numberParam('thermodynamic wet-bulb temperature [°C]').optional(),
    tdp: numberParam('dew point over liquid water [°C]').optional(),
    w: numberParam('humidity ratio [g water per kg dry air]').optional(),
    elevation: numberParam('site elevation [m]; standard atmosphere (ASHRAE HOF 2017 ch. 1 eq 3)').optional(),
    pressure: numberParam('station pressure [kPa], 30–110').optional(),
  })
  .superRefine((q, ctx) => {
    const given = (['rh', 'twb', 'tdp', 'w'] as const).filter((k) => q[k] !== undefined)
    if (given.length !== 1) {
      ctx.addIssue({ code: 'custom', path: ['rh'], message: 'give exactly one of rh, twb, tdp or w' })
    }
    if (q.elevation !== undefined && q.pressure !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['pressure'],
        message: 'give either elevation or pressure, not both',
      })
    }
  })

/** The response of GET /v1/air (and `dryhours air --json`). */
export const airStateResponseSchema = z.strictObject({
  dryBulbC: z.number().describe('dry bulb [°C]'),
  wetBulbC: z.number().describe('thermodynamic wet bulb [°C]'),
  dewPointC: z.number().describe('dew point over liquid water [°C]'),
  frostPointC: z
    .number()
    .nullable()
    .describe('frost point over ice [°C] when the dew point is below the triple point (0.01 °C), else null'),
  relativeHumidityPct: z.number().describe('relative humidity over liquid water [%]'),
  humidityRatioGPerKg: z.number().describe('humidity ratio [g/kg dry air]'),
  enthalpyKjPerKg: z.number().describe('enthalpy [kJ/kg dry air]'),
  specificVolumeM3PerKg: z.number().describe('specific volume [m³/kg dry air]'),
  densityKgPerM3: z.number().describe('density of the moist air [kg/m³]'),
  vaporPressureKpa: z.number().describe('vapour pressure [kPa]'),
  saturationVaporPressureKpa: z
    .number()
    .describe('saturation vapour pressure over liquid water at the dry bulb [kPa]'),
  pressureKpa: z.number().describe('total pressure [kPa]'),
})
