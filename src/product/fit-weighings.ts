/**
 * @module product/fit-weighings
 * Calibration from a grower's weighings: moisture from mass, a robust fit of Lewis, Page and diffusion
 * (best by AICc), the drying-rate periods, the predicted time to a target, and conversion to a user profile.
 *
 * Messy data: uneven intervals are used as they are (the models are fitted in time, not per step);
 * rows without a mass (a missed or final weighing) are left out and listed; a reading far off the curve
 * (a tray weighed off the rack, a hand on the scale) is removed when its residual from the best fit exceeds
 * `OUTLIER_ROBUST_SIGMAS` robust standard deviations (1.4826·MAD, Hampel 1974), at most one in ten readings,
 * refitting after each removal, and listed with its line.
 */
import { ASSUMED_EA_J_PER_MOL } from './catalogue-helpers.ts'
import { type FittedModel, type FittedModelName, fitDryingModels } from './fit-models.ts'
import { dryingRatePeriods, type RatePeriods } from './fit-rate-curve.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from './moisture-basis.ts'
import type { KineticsSpec, ProductProfile, Shape } from './profile.ts'
import { describeColumns, type WeighingColumns } from './weighing-columns.ts'
import {
  dryMassG,
  type MoisturePoint,
  type MoistureReference,
  moisturePoints,
  type Weighing,
  type WeighingsTable,
} from './weighings.ts'

export const OUTLIER_ROBUST_SIGMAS = 5

export interface FitOptions {
  reference: MoistureReference
  /** Thickness (slab) or diameter [mm]: needed to turn the diffusion fit into Deff. */
  thicknessMm?: number
  shape?: Shape
  targetWbPct?: number
}

export interface ModelSummary {
  model: FittedModelName
  params: Record<string, number>
  standardErrors: Record<string, number>
  rmseDb: number
  r2: number
  aicc: number
  converged: boolean
}

export interface WeighingsFit {
  criterion: 'AICc (small-sample Akaike information criterion)'
  best: ModelSummary
  models: ModelSummary[]
  /** Deff [m²/s] from the diffusion fit when a thickness was given. */
  effectiveDiffusivityM2PerS: { value: number; standardError: number } | null
  shape: Shape
  thicknessMm: number | null
  dryMassG: number
  initialMoistureWbPct: number
  lastMoistureWbPct: number
  equilibriumMoistureWbPct: number
  readingsUsed: number
  missingMassLines: number[]
  outliers: { line: number; timeH: number; massG: number; residualDb: number }[]
  periods: RatePeriods
  target: { moistureWbPct: number; timeH: number | null; note: string } | null
  meanAirTempC: number | null
  meanRhPct: number | null
  /** The columns the weighings were read from (null when the weighings were not read from a file). */
  columns: WeighingColumns | null
  /** The same, as one sentence for the user. */
  columnsRead: string | null
  warnings: string[]
  /** Best model's prediction [kg/kg db] at tH. */
  predictMoistureDb: (tH: number) => number
}

function summary(m: FittedModel): ModelSummary {
  const { model, params, standardErrors, rmseDb, r2, aicc, converged } = m
  return { model, params, standardErrors, rmseDb, r2, aicc, converged }
}

function mean(xs: number[]): number | null {
  return xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  const h = s.length >> 1
  return s.length % 2 ? s[h] : (s[h - 1] + s[h]) / 2
}

/** Time [h] at which `predict` reaches `targetDb`, by bisection; null when the curve levels off above it. */
function timeToMoistureH(
  predict: (t: number) => number,
  targetDb: number,
  equilibriumDb: number,
): number | null {
  if (!(targetDb > equilibriumDb)) return null
  if (predict(0) <= targetDb) return 0
  let hi = 1
  while (predict(hi) > targetDb) {
    hi *= 2
    if (hi > 1e6) return null
  }
  let lo = 0
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2
    if (predict(mid) > targetDb) lo = mid
    else hi = mid
  }
  return hi
}

/** Fit the weighings (as parsed from a file, with their columns, or as plain rows). */
export function fitWeighings(input: WeighingsTable | Weighing[], options: FitOptions): WeighingsFit {
  const weighings = Array.isArray(input) ? input : input.rows
  const columns = Array.isArray(input) ? null : input.columns
  const shape = options.shape ?? 'slab'
  const dry = dryMassG(weighings, options.reference)
  let pts: MoisturePoint[] = moisturePoints(weighings, dry)
  const warnings: string[] = []
  const missingMassLines = weighings.filter((w) => w.massG === null).map((w) => w.line)
  if (missingMassLines.length)
    warnings.push(`readings without a mass were left out (lines ${missingMassLines.join(', ')})`)
  const outliers: WeighingsFit['outliers'] = []
  const maxRemovals = Math.max(1, Math.floor(pts.length / 10))
  let fits = fitDryingModels(pts, shape)
  for (let r = 0; r < maxRemovals; r++) {
    const best = fits[0]
    // the first weighing fixes M0 and is never removed
    const res = pts.map((p, i) => (i === 0 ? 0 : p.moistureDb - best.predict(p.timeH)))
    const sigma = Math.max(1.4826 * median(res.slice(1).map(Math.abs)), 1e-4 * pts[0].moistureDb)
    let worst = 1
    for (let i = 2; i < res.length; i++) if (Math.abs(res[i]) > Math.abs(res[worst])) worst = i
    if (!(Math.abs(res[worst]) > OUTLIER_ROBUST_SIGMAS * sigma)) break
    const p = pts[worst]
    outliers.push({ line: p.line, timeH: p.timeH, massG: p.massG, residualDb: res[worst] })
    warnings.push(
      `line ${p.line}: the weighing at ${p.timeH.toFixed(2)} h (${p.massG} g) is far off the drying curve and was left out`,
    )
    pts = pts.filter((_, i) => i !== worst)
    fits = fitDryingModels(pts, shape)
  }
  const best = fits[0]
  const me = best.params.equilibriumMoistureDb
  const diff = fits.find((f) => f.model === 'diffusion')
  let deff: WeighingsFit['effectiveDiffusivityM2PerS'] = null
  if (diff && options.thicknessMm !== undefined) {
    const l = options.thicknessMm / 2000
    // tauRate = Deff/L² [1/h] → Deff = tauRate·L²/3600
    deff = {
      value: (diff.params.tauRatePerH * l * l) / 3600,
      standardError: (diff.standardErrors.tauRatePerH * l * l) / 3600,
    }
  }
  let target: WeighingsFit['target'] = null
  if (options.targetWbPct !== undefined) {
    const tDb = moistureDbFromWbPct(options.targetWbPct)
    const t = timeToMoistureH(best.predict, tDb, me)
    target = {
      moistureWbPct: options.targetWbPct,
      timeH: t,
      note:
        t === null
          ? `not reachable under the weighed conditions: the fitted equilibrium moisture is ${moistureWbPctFromDb(me).toFixed(1)} % wb`
          : t > pts[pts.length - 1].timeH
            ? 'extrapolated beyond the last weighing'
            : 'within the weighed period',
    }
  }
  const temps = weighings.map((w) => w.airTempC).filter((x): x is number => x !== null)
  const rhs = weighings.map((w) => w.rhPct).filter((x): x is number => x !== null)
  return {
    criterion: 'AICc (small-sample Akaike information criterion)',
    best: summary(best),
    models: fits.map(summary),
    effectiveDiffusivityM2PerS: deff,
    shape,
    thicknessMm: options.thicknessMm ?? null,
    dryMassG: dry,
    initialMoistureWbPct: moistureWbPctFromDb(pts[0].moistureDb),
    lastMoistureWbPct: moistureWbPctFromDb(Math.max(0, pts[pts.length - 1].moistureDb)),
    equilibriumMoistureWbPct: moistureWbPctFromDb(me),
    readingsUsed: pts.length,
    missingMassLines,
    outliers,
    periods: dryingRatePeriods(pts),
    target,
    meanAirTempC: mean(temps),
    meanRhPct: mean(rhs),
    columns,
    columnsRead: columns ? describeColumns(columns) : null,
    warnings,
    predictMoistureDb: best.predict,
  }
}

/** Kinetics spec from a fit: the best model at the weighings' mean air temperature (30 °C when none given). */
export function kineticsFromFit(fit: WeighingsFit, base: ProductProfile): KineticsSpec {
  const tRefC = fit.meanAirTempC ?? 30
  const thicknessMm = fit.thicknessMm ?? base.defaultThicknessMm.value
  const note = `fitted by dryhours to the user's weighings (${fit.readingsUsed} readings, ${fit.best.model}, RMSE ${fit.best.rmseDb.toFixed(4)} kg/kg db) at a mean ${tRefC.toFixed(1)} °C${fit.meanAirTempC === null ? ' (assumed: no air temperature in the file)' : ''}; Ea assumed ${ASSUMED_EA_J_PER_MOL / 1000} kJ/mol`
  const k = (value: number) => ({
    form: 'arrhenius' as const,
    kRefPerH: value,
    tRefC,
    activationEnergyJPerMol: ASSUMED_EA_J_PER_MOL,
  })
  const p = fit.best.params
  const equation =
    fit.best.model === 'lewis'
      ? { model: 'lewis' as const, k: k(p.kPerH) }
      : fit.best.model === 'page'
        ? { model: 'page' as const, k: k(p.kPerHn), n: p.n }
        : {
            model: 'diffusion' as const,
            dRefM2PerS: (p.tauRatePerH * (thicknessMm / 2000) ** 2) / 3600,
            tRefC,
            activationEnergyJPerMol: ASSUMED_EA_J_PER_MOL,
          }
  return {
    equation,
    referenceThicknessMm: thicknessMm,
    shape: fit.shape,
    source: note,
    confidence: 'user',
    rewettingRateFactor: base.kinetics.rewettingRateFactor,
  }
}

/** A complete user profile: `base` with the fitted kinetics, the weighed initial moisture and the thickness. */
export function profileFromFit(
  fit: WeighingsFit,
  base: ProductProfile,
  id: string,
  targetWbPct?: number,
): ProductProfile {
  const user = (value: number, source: string) => ({ value, source, confidence: 'user' as const })
  const p: ProductProfile = {
    ...base,
    id,
    name: `${base.name} (calibrated from weighings)`,
    variantOf: base.id,
    initialMoistureWbPct: user(Math.round(fit.initialMoistureWbPct * 10) / 10, 'first weighing of the user'),
    kinetics: kineticsFromFit(fit, base),
  }
  if (fit.thicknessMm !== null)
    p.defaultThicknessMm = user(fit.thicknessMm, 'given by the user with the weighings')
  if (targetWbPct !== undefined) p.targetMoistureWbPct = user(targetWbPct, 'given by the user')
  return p
}
