/**
 * Calibration through the engine: for each kinetics constant that comes from a calibration experiment,
 * find the value with which the ENGINE (weather reconstruction → hourly conditions → batch, exactly as an
 * assessment runs) reproduces the published drying time, and write it into `src/product/calibration.ts`,
 * which the catalogue reads (level `fitted`, citing the experiment, the weather and this script).
 *
 *   npm run calibrate            (writes src/product/calibration.ts and prints the fits)
 *   npm run calibrate:check      (prints only; exits 1 when a written value is more than 0.5 % off the fit;
 *                                 `npm run calibrate -- --check` would hand the flag to the formatter instead)
 *
 * Only runs whose role is `calibration` are used (test/experiments/cases.ts); a validation run is never
 * fitted. The fit is a bisection on the logarithm of the constant (the predicted time falls as the rate
 * constant rises), to 0.01 % of the published time, or to the step nearest it where the engine's time jumps
 * (an end point that slips past a night). A time sampled every 24 h is met by a range of constants: the fit is
 * the geometric middle of that range.
 */
import { writeFileSync } from 'node:fs'
import { CALIBRATED_CONSTANTS } from '../../src/product/calibration.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { RECONSTRUCTIONS } from '../fixtures/experiments/weather/reconstructions.ts'
import { CALIBRATION_TARGETS, type CalibrationTarget, withParameter } from './calibration-targets.ts'
import { caseId, caseProfile, ENGINE_CASES, type EngineCase } from './cases.ts'
import { runCase } from './run-case.ts'
import { type Reconstruction, reconstructWeather } from './weather-reconstruction.ts'

export interface FitResult {
  target: CalibrationTarget
  engineCase: EngineCase
  value: number
  /** Predicted ÷ the fit's target time with the fitted value (rounded as written). */
  ratio: number
  iterations: number
  /** For a sampled end point: the range of values that meet it at the published sample. */
  sampledRange?: [number, number]
}

/** Significant digits written to the catalogue. */
const DIGITS = 4

function roundSignificant(x: number): number {
  return Number(x.toPrecision(DIGITS))
}

function predictedRatio(
  c: EngineCase,
  base: ProductProfile,
  t: CalibrationTarget,
  value: number,
  series?: HourlySeries,
): number {
  const r = runCase(c, withParameter(base, t.parameter, value), series)
  return r.reached ? r.continuousH / c.published.timeH : Number.POSITIVE_INFINITY
}

/**
 * Fit one target: bisection on ln(value) until the engine's time is within 0.01 % of the published one.
 * `series` replaces the committed weather (sensitivity runs).
 */
export function fitTarget(t: CalibrationTarget, series?: HourlySeries): FitResult {
  const c = ENGINE_CASES.find((x) => caseId(x) === t.caseId)
  if (!c) throw new RangeError(`calibration case '${t.caseId}' is not in test/experiments/cases.ts`)
  if (c.role !== 'calibration')
    throw new RangeError(`'${t.caseId}' is a ${c.role} run: it must never be fitted`)
  const base = caseProfile(c)
  if (c.published.sampledEveryH !== undefined) return fitSampled(t, c, base, series)
  let lo = Math.log(t.searchRange[0])
  let hi = Math.log(t.searchRange[1])
  if (
    !(
      predictedRatio(c, base, t, Math.exp(lo), series) > 1 &&
      predictedRatio(c, base, t, Math.exp(hi), series) < 1
    )
  ) {
    throw new RangeError(`${t.caseId}: the published time is not bracketed by ${t.searchRange.join('…')}`)
  }
  let iterations = 0
  for (; iterations < 60 && hi - lo > 1e-7; iterations++) {
    const mid = (lo + hi) / 2
    const ratio = predictedRatio(c, base, t, Math.exp(mid), series)
    if (Math.abs(ratio - 1) < 1e-4) {
      lo = mid
      hi = mid
      break
    }
    if (ratio > 1) lo = mid
    else hi = mid
  }
  // The engine's time can jump where the end point slips past a night (the last few hundredths of moisture
  // then wait for the next day): the fit is the rounded value on either side of the step nearest the
  // published time.
  const candidates = [roundSignificant(Math.exp(lo)), roundSignificant(Math.exp(hi))]
  let best = candidates[0]
  let bestRatio = predictedRatio(c, base, t, best, series)
  const other = predictedRatio(c, base, t, candidates[1], series)
  if (Math.abs(other - 1) < Math.abs(bestRatio - 1)) {
    best = candidates[1]
    bestRatio = other
  }
  return { target: t, engineCase: c, value: best, ratio: bestRatio, iterations }
}

/** The sampled time (the first sample at or after the end point) the engine gives with `value`. */
function sampledTimeH(
  c: EngineCase,
  base: ProductProfile,
  t: CalibrationTarget,
  value: number,
  series?: HourlySeries,
): number {
  const r = runCase(c, withParameter(base, t.parameter, value), series)
  return r.reached ? r.predictedH : Number.POSITIVE_INFINITY
}

/** Smallest value (on a log scale, to 1e-6) for which `ok` holds; `ok` must be monotone in the value. */
function lowestWhere(lo: number, hi: number, ok: (value: number) => boolean): number {
  let a = Math.log(lo)
  let b = Math.log(hi)
  for (let i = 0; i < 60 && b - a > 1e-6; i++) {
    const mid = (a + b) / 2
    if (ok(Math.exp(mid))) b = mid
    else a = mid
  }
  return Math.exp(b)
}

/**
 * A sampled end point (the paper weighed every 24 h): every constant whose engine run meets the end point
 * after the previous sample and by the published one reproduces the paper; the fit is the geometric middle of
 * that range of constants. (Aiming at a continuous time in the middle of the interval would often aim at a
 * night, when covered product does not dry.)
 */
function fitSampled(
  t: CalibrationTarget,
  c: EngineCase,
  base: ProductProfile,
  series?: HourlySeries,
): FitResult {
  const published = c.published.timeH
  const [lo, hi] = t.searchRange
  const time = (v: number) => sampledTimeH(c, base, t, v, series)
  if (!(time(lo) > published && time(hi) < published)) {
    throw new RangeError(`${t.caseId}: the published time is not bracketed by ${t.searchRange.join('…')}`)
  }
  const first = lowestWhere(lo, hi, (v) => time(v) <= published)
  const beyond = lowestWhere(lo, hi, (v) => time(v) < published)
  const value = roundSignificant(Math.sqrt(first * beyond))
  return {
    target: t,
    engineCase: c,
    value,
    ratio: time(value) / published,
    iterations: 120,
    sampledRange: [roundSignificant(first), roundSignificant(beyond)],
  }
}

function sourceText(f: FitResult): string {
  const c = f.engineCase
  return `${f.target.parameterLabel} fitted by dryhours through the engine (npm run calibrate, test/experiments/calibrate.ts) so that the engine reproduces ${f.target.citation}: run '${c.runId}', ${c.initialWbPct.value.toFixed(1)} → ${c.endWbPct.value.toFixed(1)} % wb in ${c.published.timeH} h (${c.published.kind} time${c.published.sampledEveryH ? `, sampled every ${c.published.sampledEveryH} h: the geometric middle of the constants ${f.sampledRange?.join('–')} that meet the end point at that sample` : ''}) with method ${c.method.kind} on the weather reconstruction '${c.weather}' (test/fixtures/experiments/weather/; ${f.target.weatherNote}); engine ÷ target ${f.ratio.toFixed(4)}`
}

function moduleText(fits: FitResult[]): string {
  const entries = fits
    .map(
      (f) => `  {
    productId: ${JSON.stringify(f.target.productId)},
    parameter: ${JSON.stringify(f.target.parameter)},
    value: ${f.value},
    caseId: ${JSON.stringify(f.target.caseId)},
    source: ${JSON.stringify(sourceText(f))},
  },`,
    )
    .join('\n')
  return `/**
 * @module product/calibration
 * Kinetics constants fitted THROUGH THE ENGINE to the calibration experiments: each value is the one with
 * which the hourly engine, run on the experiment's weather reconstruction with its method, night practice,
 * size and moistures, reproduces the published drying time. Generated by \`npm run calibrate\`
 * (test/experiments/calibrate.ts): do not edit by hand; re-run it after any change to the engine or the
 * weather reconstructions. The catalogue reads these values (level \`fitted\`).
 */

export interface CalibratedConstant {
  productId: string
  /** Path of the constant inside the profile's kinetics equation (e.g. \`k.kRefPerH\`). */
  parameter: string
  value: number
  /** The calibration run (test/experiments/cases.ts). */
  caseId: string
  source: string
}

export const CALIBRATED_CONSTANTS: readonly CalibratedConstant[] = [
${entries}
]

/** The fitted constant of \`productId\` at \`parameter\`; throws when \`npm run calibrate\` has not written it. */
export function calibratedConstant(productId: string, parameter: string): CalibratedConstant {
  const found = CALIBRATED_CONSTANTS.find((c) => c.productId === productId && c.parameter === parameter)
  if (!found) throw new RangeError(\`no calibrated constant \${parameter} for \${productId}: run npm run calibrate\`)
  return found
}
`
}

/** The weather variants of the sensitivity study: each changes one input of the reconstruction. */
export const WEATHER_VARIANTS: { label: string; change: (r: Reconstruction) => Reconstruction }[] = [
  { label: 'temperatures −2 K', change: (r) => shiftTemperatures(r, -2) },
  { label: 'temperatures +2 K', change: (r) => shiftTemperatures(r, 2) },
  { label: 'air 10 % RH drier (dew point −2 K)', change: (r) => shiftHumidity(r, -1) },
  { label: 'air 10 % RH moister (dew point +2 K)', change: (r) => shiftHumidity(r, 1) },
  { label: 'sunshine −1.5 h a day', change: (r) => shiftSunshine(r, -1.5) },
  { label: 'sunshine +1.5 h a day', change: (r) => shiftSunshine(r, 1.5) },
]

function shiftTemperatures(r: Reconstruction, dK: number): Reconstruction {
  const t = r.temperature
  return {
    ...r,
    temperature: {
      tMaxC: { ...t.tMaxC, value: t.tMaxC.value + dK },
      tMinC: { ...t.tMinC, value: t.tMinC.value + dK },
    },
  }
}

function shiftHumidity(r: Reconstruction, sign: number): Reconstruction {
  const h = r.humidity
  switch (h.kind) {
    case 'rh-range':
      return {
        ...r,
        humidity: {
          ...h,
          rhMaxPct: { ...h.rhMaxPct, value: Math.min(100, h.rhMaxPct.value + 10 * sign) },
          rhMinPct: { ...h.rhMinPct, value: h.rhMinPct.value + 10 * sign },
        },
      }
    case 'rh-mean':
      return { ...r, humidity: { ...h, rhMeanPct: { ...h.rhMeanPct, value: h.rhMeanPct.value + 10 * sign } } }
    case 'dew-point':
      return { ...r, humidity: { ...h, dewPointC: { ...h.dewPointC, value: h.dewPointC.value + 2 * sign } } }
  }
}

function shiftSunshine(r: Reconstruction, dH: number): Reconstruction {
  const s = r.sun
  return s.kind === 'sunshine-hours'
    ? { ...r, sun: { ...s, hours: { ...s.hours, value: Math.max(0, s.hours.value + dH) } } }
    : { ...r, sun: { ...s, mjPerM2: { ...s.mjPerM2, value: s.mjPerM2.value * (1 + dH / 10) } } }
}

export interface SensitivityRow {
  target: CalibrationTarget
  label: string
  /** The constant fitted on the changed weather ÷ the constant fitted on the committed one. */
  factor: number
}

/** Fit every target again on each weather variant (in memory; the committed CSVs are not touched). */
export function sensitivity(fits: FitResult[]): SensitivityRow[] {
  const rows: SensitivityRow[] = []
  for (const f of fits) {
    const spec = RECONSTRUCTIONS.find((r) => r.id === f.engineCase.weather)
    if (!spec) throw new RangeError(`no reconstruction ${f.engineCase.weather}`)
    for (const v of WEATHER_VARIANTS) {
      const refit = fitTarget(f.target, reconstructWeather(v.change(spec)))
      rows.push({ target: f.target, label: v.label, factor: refit.value / f.value })
    }
  }
  return rows
}

function calibrationDoc(fits: FitResult[], rows: SensitivityRow[]): string {
  const out = [
    '# Calibration through the engine',
    '',
    'Written by `npm run calibrate` (test/experiments/calibrate.ts) together with src/product/calibration.ts;',
    '`test/experiments/calibration.test.ts` checks that the values here are the ones the catalogue uses and that',
    'the engine reproduces each calibration run with them. The runs, their weather and their assumptions are in',
    '[validation.md](validation.md).',
    '',
    '## Fitted constants',
    '',
    '| product | constant | value | calibration run | engine ÷ target |',
    '|---|---|---:|---|---:|',
  ]
  for (const f of fits) {
    out.push(
      `| ${f.target.productId} | ${f.target.parameter} | ${f.value} | ${f.target.caseId} | ${f.ratio.toFixed(4)} |`,
    )
  }
  out.push(
    '',
    '## How much each constant rests on the weather reconstruction',
    '',
    'Each constant fitted again with one input of its weather reconstruction changed (in memory, same seed):',
    'the factor is the new constant ÷ the committed one. Most papers report no weather (only the mint run gives its air',
    'temperature and humidity, not its sun or wind), so these are the',
    'uncertainties a user inherits from the reconstructions, before any uncertainty of the papers themselves.',
    '',
    `| change | ${fits.map((f) => f.target.productId).join(' | ')} |`,
    `|---|${fits.map(() => '---:').join('|')}|`,
  )
  for (const v of WEATHER_VARIANTS) {
    const cells = fits.map((f) => {
      const row = rows.find((r) => r.target === f.target && r.label === v.label)
      return row ? `× ${row.factor.toFixed(2)}` : '—'
    })
    out.push(`| ${v.label} | ${cells.join(' | ')} |`)
  }
  out.push('')
  return out.join('\n')
}

function main(): void {
  const check = process.argv.includes('--check')
  const fits = CALIBRATION_TARGETS.map((t) => fitTarget(t))
  let stale = false
  for (const f of fits) {
    const written = CALIBRATED_CONSTANTS.find(
      (c) => c.productId === f.target.productId && c.parameter === f.target.parameter,
    )
    const off = written ? Math.abs(written.value / f.value - 1) : Number.POSITIVE_INFINITY
    if (off > 0.005) stale = true
    console.log(
      `${f.target.caseId}: ${f.target.productId} ${f.target.parameter} = ${f.value} (engine ÷ published ${f.ratio.toFixed(4)}, ${f.iterations} bisections; written ${written?.value ?? 'none'})`,
    )
  }
  if (check) {
    if (stale) {
      console.error('the written constants differ from the fit: run npm run calibrate')
      process.exitCode = 1
    }
    return
  }
  writeFileSync(new URL('../../src/product/calibration.ts', import.meta.url), moduleText(fits))
  console.log('wrote src/product/calibration.ts; fitting again on each weather variant …')
  writeFileSync(
    new URL('../../docs/calibration.md', import.meta.url),
    calibrationDoc(fits, sensitivity(fits)),
  )
  console.log('wrote docs/calibration.md')
}

if (import.meta.url === `file://${process.argv[1]}`) main()
