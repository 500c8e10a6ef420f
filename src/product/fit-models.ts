/**
 * @module product/fit-models
 * Fit thin-layer models to moisture-vs-time points by Levenberg–Marquardt (`least-squares.ts`):
 * Lewis [k, Me, M0], Page [k, n, Me, M0], Fick diffusion (slab/cylinder/sphere, full series) [Deff/L², Me, M0].
 * M0 is fitted, not fixed at the first weighing, because that weighing carries the same scale error as the
 * others. Starting values come from a grid over the rate parameters with Me and M0 solved by linear least
 * squares at each grid point (the model is linear in Me and M0; cf. variable projection, Golub & Pereyra 1973). Models are ranked by the small-sample Akaike criterion
 * AICc = n·ln(SSE/n) + 2p + 2p(p+1)/(n − p − 1) (Akaike 1974; Hurvich & Tsai 1989; Burnham & Anderson 2002,
 * *Model Selection and Multimodel Inference*, eq 2.14).
 */
import { power } from '../physics/power.ts'
import { diffusionMoistureRatio } from './diffusion.ts'
import { levenbergMarquardt } from './least-squares.ts'
import type { Shape } from './profile.ts'
import type { MoisturePoint } from './weighings.ts'

export type FittedModelName = 'lewis' | 'page' | 'diffusion'

export interface FittedModel {
  model: FittedModelName
  /** Parameter values by name: kPerH (Lewis), kPerHn and n (Page), tauRatePerH = Deff/L² (diffusion), equilibriumMoistureDb, initialMoistureDb. */
  params: Record<string, number>
  standardErrors: Record<string, number>
  sse: number
  rmseDb: number
  r2: number
  aicc: number
  n: number
  converged: boolean
  /** Predicted moisture [kg/kg db] at tH hours. */
  predict: (tH: number) => number
}

interface ModelDef {
  model: FittedModelName
  /** Names of the rate parameters (Me and M0 follow). */
  names: string[]
  mr: (rate: number[], tH: number) => number
  /** Grid of rate-parameter vectors for the starting values. */
  grid: number[][]
}

const LOG_GRID = Array.from({ length: 61 }, (_, i) => power(10, -3 + (i * 5) / 60))

function defs(shape: Shape): ModelDef[] {
  return [
    {
      model: 'lewis',
      names: ['kPerH'],
      mr: (p, t) => {
        if (!(p[0] > 0)) throw new RangeError('rate must be positive')
        return Math.exp(-p[0] * t)
      },
      grid: LOG_GRID.map((k) => [k]),
    },
    {
      model: 'page',
      names: ['kPerHn', 'n'],
      mr: (p, t) => {
        if (!(p[0] > 0)) throw new RangeError('rate must be positive')
        if (!(p[1] > 0.1 && p[1] < 5)) throw new RangeError('n out of range')
        return Math.exp(-p[0] * power(t, p[1]))
      },
      grid: LOG_GRID.filter((_, i) => i % 2 === 0).flatMap((k) =>
        [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1, 1.1, 1.2, 1.35, 1.5, 1.75, 2, 2.5].map((n) => [k, n]),
      ),
    },
    {
      model: 'diffusion',
      names: ['tauRatePerH'],
      mr: (p, t) => {
        if (!(p[0] > 0)) throw new RangeError('rate must be positive')
        return diffusionMoistureRatio(shape, p[0] * t)
      },
      grid: LOG_GRID.map((k) => [k]),
    },
  ]
}

/** Me and M0 by linear least squares for a given MR curve f: M = Me·(1 − f) + M0·f. */
function linearMeM0(f: number[], pts: MoisturePoint[]): { me: number; m0: number; sse: number } | null {
  let saa = 0
  let sab = 0
  let sbb = 0
  let say = 0
  let sby = 0
  pts.forEach((p, i) => {
    const a = 1 - f[i]
    const b = f[i]
    saa += a * a
    sab += a * b
    sbb += b * b
    say += a * p.moistureDb
    sby += b * p.moistureDb
  })
  const det = saa * sbb - sab * sab
  if (!(Math.abs(det) > 1e-14)) return null
  const me = (say * sbb - sby * sab) / det
  const m0 = (saa * sby - sab * say) / det
  const sse = pts.reduce((s, p, i) => s + (me * (1 - f[i]) + m0 * f[i] - p.moistureDb) ** 2, 0)
  return { me, m0, sse }
}

function fitOne(def: ModelDef, pts: MoisturePoint[]): FittedModel {
  const nr = def.names.length
  let start: number[] | null = null
  let bestSse = Number.POSITIVE_INFINITY
  for (const g of def.grid) {
    const f = pts.map((p) => def.mr(g, p.timeH))
    const lin = linearMeM0(f, pts)
    if (lin && lin.me >= 0 && lin.m0 > lin.me && lin.sse < bestSse) {
      bestSse = lin.sse
      start = [...g, lin.me, lin.m0]
    }
  }
  if (!start) throw new RangeError(`${def.model}: no starting point with a positive equilibrium moisture`)
  const model = (p: number[], t: number): number => {
    const me = p[nr]
    const m0 = p[nr + 1]
    if (!(me >= 0 && m0 > me)) throw new RangeError('equilibrium moisture out of range')
    return me + (m0 - me) * def.mr(p.slice(0, nr), t)
  }
  const res = levenbergMarquardt((p) => pts.map((q) => model(p, q.timeH) - q.moistureDb), start, {
    maxIterations: 300,
  })
  const n = pts.length
  const names = [...def.names, 'equilibriumMoistureDb', 'initialMoistureDb']
  const k = names.length
  const mean = pts.reduce((s, q) => s + q.moistureDb, 0) / n
  const sst = pts.reduce((s, q) => s + (q.moistureDb - mean) ** 2, 0)
  const params: Record<string, number> = {}
  const standardErrors: Record<string, number> = {}
  names.forEach((name, i) => {
    params[name] = res.params[i]
    standardErrors[name] = res.standardErrors[i]
  })
  const sse = Math.max(res.sse, 1e-300)
  const p = [...res.params]
  return {
    model: def.model,
    params,
    standardErrors,
    sse: res.sse,
    rmseDb: Math.sqrt(res.sse / n),
    r2: sst > 0 ? 1 - res.sse / sst : 0,
    aicc: n * Math.log(sse / n) + 2 * k + (2 * k * (k + 1)) / (n - k - 1),
    n,
    converged: res.converged,
    predict: (t) => model(p, t),
  }
}

/** Minimum number of weighings for a fit: the 4-parameter Page model needs n − p − 1 > 0 and a spare. */
export const MIN_WEIGHINGS = 6

/** Fit every model; sorted best first by AICc. Models that fail to fit are left out. */
export function fitDryingModels(pts: MoisturePoint[], shape: Shape): FittedModel[] {
  if (pts.length < MIN_WEIGHINGS) {
    throw new RangeError(
      `need at least ${MIN_WEIGHINGS} weighings with a mass to fit a drying curve, got ${pts.length}`,
    )
  }
  // a loop, not Math.min(...array): spreading 130,000 points overflows the call stack
  let lowest = Number.POSITIVE_INFINITY
  for (const p of pts) if (p.moistureDb < lowest) lowest = p.moistureDb
  const drop = pts[0].moistureDb - lowest
  if (!(drop > 0.02 * pts[0].moistureDb)) {
    throw new RangeError(
      'the weighings show almost no drying (less than 2 % of the initial water lost): nothing to fit',
    )
  }
  const out: FittedModel[] = []
  for (const d of defs(shape)) {
    try {
      out.push(fitOne(d, pts))
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
    }
  }
  if (out.length === 0) throw new RangeError('no drying model could be fitted to these weighings')
  return out.sort((a, b) => a.aicc - b.aicc)
}
