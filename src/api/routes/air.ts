import { Hono } from 'hono'
import { airState } from '../../physics/air-state.ts'
import { airStateJson } from '../../report/air-json.ts'
import { ApiProblem } from '../problem.ts'
import { airQuerySchema } from '../schemas/air.ts'
import { parseOrProblem, queryObject } from '../validate.ts'

/** GET /v1/air: the full moist-air state (same keys as `dryhours air --json`). */
export const airRouter = new Hono().get('/', (c) => {
  const q = parseOrProblem(airQuerySchema, queryObject(c.req.url))
  try {
    const state = airState({
      dryBulbC: q.tdb,
      relativeHumidityPct: q.rh,
      wetBulbC: q.twb,
      dewPointC: q.tdp,
      humidityRatioGPerKg: q.w,
      elevationM: q.elevation,
      pressureKpa: q.pressure,
    })
    return c.json(airStateJson(state))
  } catch (e) {
    if (e instanceof RangeError) throw new ApiProblem(400, e.message, [{ path: 'query', message: e.message }])
    throw e
  }
})
