/**
 * @module product/fit-models
 * Fit thin-layer models to moisture-vs-time points by Levenberg–Marquardt (`least-squares.ts`):
 * Lewis [k, Me], Page [k, n, Me], Fick diffusion (slab/cylinder/sphere, full series) [Deff/L², Me], with
 * M0 fixed at the first weighing. Models are ranked by the small-sample Akaike criterion
 * AICc = n·ln(SSE/n) + 2p + 2p(p+1)/(n − p − 1) (Akaike 1974; Hurvich & Tsai 1989; Burnham & Anderson 2002,
 * *Model Selection and Multimodel Inference*, eq 2.14).
 */
import { diffusionMoistureRatio } from './diffusion.ts'
import { levenbergMarquardt } from './least-squares.ts'
import type { Shape } from './profile.ts'
import type { MoisturePoint } from './weighings.ts'

export type FittedModelName = 'lewis' | 'page' | 'diffusion'

export interface FittedModel {
  model: FittedModelName
  /** Parameter values by name: kPerH (Lewis), kPerHn and n (Page), tauRatePerH = Deff/L² (diffusion), equilibriumMoistureDb. */
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
  names: string[]
  mr: (p: number[], tH: number) => number
  start: (k0: number, me0: number) => number[]
}

function defs(shape: Shape): ModelDef[] {
  const checkPositive = (p: number[]) => {
    if (!(p[0] > 0)) throw new RangeError('rate must be positive')
  }
  return [
    {
      model: 'lewis',
      names: ['kPerH', 'equilibriumMoistureDb'],
      mr: (p, t) => {
        checkPositive(p)
        return Math.exp(-p[0] * t)
      },
      start: (k0, me0) => [k0, me0],
    },
    {
      model: 'page',
      names: ['kPerHn', 'n', 'equilibriumMoistureDb'],
      mr: (p, t) => {
        checkPositive(p)
        if (!(p[1] > 0.1 && p[1] < 5)) throw new RangeError('n out of range')
        return Math.exp(-p[0] * t ** p[1])
      },
      start: (k0, me0) => [k0, 1, me0],
    },
    {
      model: 'diffusion',
      names: ['tauRatePerH', 'equilibriumMoistureDb'],
      mr: (p, t) => {
        checkPositive(p)
        return diffusionMoistureRatio(shape, p[0] * t)
      },
      // k ≈ λ1·(D/L²): slab λ1 = π²/4
      start: (k0, me0) => [k0 / (shape === 'slab' ? 2.4674 : shape === 'cylinder' ? 5.783 : 9.8696), me0],
    },
  ]
}

function fitOne(def: ModelDef, pts: MoisturePoint[]): FittedModel {
  const m0 = pts[0].moistureDb
  const mLast = pts[pts.length - 1].moistureDb
  const tLast = pts[pts.length - 1].timeH
  const me0 = Math.max(0, 0.8 * Math.min(...pts.map((p) => p.moistureDb)))
  const k0 = Math.max(1e-4, -Math.log(Math.max(1e-3, (mLast - me0) / (m0 - me0))) / tLast)
  const model = (p: number[], t: number): number => {
    const me = p[p.length - 1]
    if (!(me >= 0 && me < m0)) throw new RangeError('equilibrium moisture out of range')
    return me + (m0 - me) * def.mr(p, t)
  }
  const res = levenbergMarquardt(
    (p) => pts.map((q) => model(p, q.timeH) - q.moistureDb),
    def.start(k0, me0),
    {
      maxIterations: 300,
    },
  )
  const n = pts.length
  const k = def.names.length
  const mean = pts.reduce((s, q) => s + q.moistureDb, 0) / n
  const sst = pts.reduce((s, q) => s + (q.moistureDb - mean) ** 2, 0)
  const params: Record<string, number> = {}
  const standardErrors: Record<string, number> = {}
  def.names.forEach((name, i) => {
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

/** Minimum number of weighings for a fit: the 3-parameter Page model needs n − p − 1 > 0 and some spare. */
export const MIN_WEIGHINGS = 5

/** Fit every model; sorted best first by AICc. Models that fail to fit are left out. */
export function fitDryingModels(pts: MoisturePoint[], shape: Shape): FittedModel[] {
  if (pts.length < MIN_WEIGHINGS) {
    throw new RangeError(
      `need at least ${MIN_WEIGHINGS} weighings with a mass to fit a drying curve, got ${pts.length}`,
    )
  }
  const drop = pts[0].moistureDb - Math.min(...pts.map((p) => p.moistureDb))
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
