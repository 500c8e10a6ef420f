/**
 * @module product/profile-numbers
 * Every number of a product profile with its confidence level and citation, one entry per constant: the
 * moisture targets and limits, each constant of the isotherm and kinetics equations (with per-constant sources
 * where an equation mixes published and recalled constants), the reference thickness, the rewetting factor,
 * geometry and loading. Used by `dryhours products <id>`, `dryhours products --sources` and by answers that must
 * say which figures rest on memory (`memoryNumbers`).
 */
import { THOMPSON_CORN } from './kinetics-models.ts'
import {
  CONFIDENCE_LEVELS,
  CONFIDENCE_RANK,
  type Confidence,
  type IsothermSpec,
  type KineticsSpec,
  type ParameterSource,
  type ProductProfile,
  type Sourced,
} from './profile.ts'

export type NumberGroup = 'moisture-and-limits' | 'isotherm' | 'kinetics' | 'geometry-and-loading'

export const NUMBER_GROUPS: readonly NumberGroup[] = [
  'moisture-and-limits',
  'isotherm',
  'kinetics',
  'geometry-and-loading',
]

export interface ProfileNumber {
  group: NumberGroup
  /** Path in the profile, e.g. `isotherm.desorption.equation.xm0`. */
  path: string
  /** Plain-words name, e.g. `GAB monolayer moisture Xm0`. */
  label: string
  value: number
  unit: string
  confidence: Confidence
  source: string
}

const ISOTHERM_LABELS: Record<string, [string, string]> = {
  a: ['constant A', ''],
  b: ['constant B', ''],
  c: ['constant C', ''],
  xm0: ['GAB monolayer moisture Xm0', 'kg/kg db'],
  c0: ['GAB constant C0', ''],
  k0: ['GAB constant K0', ''],
  hxJPerMol: ['GAB temperature term ΔHx (0: none)', 'J/mol'],
  hcJPerMol: ['GAB temperature term ΔHc (0: none)', 'J/mol'],
  hkJPerMol: ['GAB temperature term ΔHk (0: none)', 'J/mol'],
}

const KINETICS_LABELS: Record<string, [string, string]> = {
  'k.kRefPerH': ['rate constant k at the reference temperature', 'h⁻¹ (h⁻ⁿ for Page)'],
  'k.tRefC': ['reference temperature of k', '°C'],
  'k.activationEnergyJPerMol': ['activation energy of k', 'J/mol'],
  'k.k0': ['rate constant k0 (k = k0 + kPerC·T + kPerRh·RH)', 'per time unitⁿ'],
  'k.kPerC': ['rate constant slope kPerC', 'per time unitⁿ per °C'],
  'k.kPerRh': ['rate constant slope kPerRh', 'per time unitⁿ'],
  n: ['Page exponent n', ''],
  'n.n0': ['Page exponent n0 (n = n0 + nPerC·T + nPerRh·RH)', ''],
  'n.nPerC': ['Page exponent slope nPerC', 'per °C'],
  'n.nPerRh': ['Page exponent slope nPerRh', ''],
  a: ['Henderson–Pabis coefficient a', ''],
  dRefM2PerS: ['effective diffusivity at the reference temperature', 'm²/s'],
  tRefC: ['reference temperature of the diffusivity', '°C'],
  activationEnergyJPerMol: ['activation energy of the diffusivity', 'J/mol'],
}

function numericLeaves(obj: unknown, prefix = ''): [string, number][] {
  if (typeof obj !== 'object' || obj === null) return []
  const out: [string, number][] = []
  for (const [k, v] of Object.entries(obj)) {
    const path = prefix ? `${prefix}.${k}` : k
    if (typeof v === 'number') out.push([path, v])
    else if (typeof v === 'object' && v !== null) out.push(...numericLeaves(v, path))
  }
  return out
}

function sourceOf(
  key: string,
  spec: { source: string; confidence: Confidence; parameters?: Record<string, ParameterSource> },
): ParameterSource {
  return spec.parameters?.[key] ?? { source: spec.source, confidence: spec.confidence }
}

function isothermNumbers(spec: IsothermSpec, direction: 'desorption' | 'adsorption'): ProfileNumber[] {
  const eq = spec.equation as unknown as Record<string, unknown>
  return Object.entries(eq)
    .filter((e): e is [string, number] => typeof e[1] === 'number')
    .map(([key, value]) => {
      const [label, unit] = ISOTHERM_LABELS[key] ?? [key, '']
      const s = sourceOf(key, spec)
      return {
        group: 'isotherm' as const,
        path: `isotherm.${direction}.equation.${key}`,
        label: `${direction} isotherm (${spec.equation.model}): ${label}`,
        value,
        unit,
        confidence: s.confidence,
        source: s.source,
      }
    })
}

function kineticsNumbers(k: KineticsSpec): ProfileNumber[] {
  const out: ProfileNumber[] = []
  const model = k.equation.model
  for (const [key, value] of numericLeaves(k.equation)) {
    const [label, unit] = KINETICS_LABELS[key] ?? [key, '']
    const s = sourceOf(key, k)
    out.push({
      group: 'kinetics',
      path: `kinetics.equation.${key}`,
      label: `kinetics (${model}): ${label}`,
      value,
      unit,
      confidence: s.confidence,
      source: s.source,
    })
  }
  if (model === 'thompson-corn') {
    const s = sourceOf('thompson', k)
    for (const [key, c] of Object.entries(THOMPSON_CORN)) {
      out.push({
        group: 'kinetics',
        path: `kinetics.thompson.${key}`,
        label: `kinetics (thompson-corn): ${c.label}`,
        value: c.value,
        unit: c.unit,
        confidence: s.confidence,
        source: s.source,
      })
    }
  }
  const t = sourceOf('referenceThicknessMm', k)
  out.push({
    group: 'kinetics',
    path: 'kinetics.referenceThicknessMm',
    label: `kinetics: thickness or diameter at which the constants hold (${k.shape})`,
    value: k.referenceThicknessMm,
    unit: 'mm',
    confidence: t.confidence,
    source: t.source,
  })
  out.push(
    sourced('kinetics', 'kinetics.rewettingRateFactor', 'rewetting rate factor', '', k.rewettingRateFactor),
  )
  if (k.biotNumber) {
    out.push(
      sourced(
        'kinetics',
        'kinetics.biotNumber',
        'mass-transfer Biot number at the reference size (skin against inside)',
        '',
        k.biotNumber,
      ),
    )
  }
  if (k.wallThicknessMm) {
    out.push(
      sourced(
        'kinetics',
        'kinetics.wallThicknessMm',
        'wall thickness of the hollow product (its drying length)',
        'mm',
        k.wallThicknessMm,
      ),
    )
  }
  if (k.airVelocity) {
    const a = k.airVelocity
    out.push(
      {
        group: 'kinetics',
        path: 'kinetics.airVelocity.referenceMs',
        label: 'air-velocity effect: reference velocity',
        value: a.referenceMs,
        unit: 'm/s',
        confidence: a.confidence,
        source: a.source,
      },
      {
        group: 'kinetics',
        path: 'kinetics.airVelocity.exponent',
        label: 'air-velocity effect: exponent',
        value: a.exponent,
        unit: '',
        confidence: a.confidence,
        source: a.source,
      },
    )
  }
  return out
}

function sourced(
  group: NumberGroup,
  path: string,
  label: string,
  unit: string,
  s: Sourced<number>,
): ProfileNumber {
  return { group, path, label, value: s.value, unit, confidence: s.confidence, source: s.source }
}

/** Every number of the profile with its level and citation, in a fixed order. */
export function profileNumbers(p: ProductProfile): ProfileNumber[] {
  const out: ProfileNumber[] = [
    sourced(
      'moisture-and-limits',
      'initialMoistureWbPct',
      'initial moisture',
      '% wb',
      p.initialMoistureWbPct,
    ),
    sourced('moisture-and-limits', 'targetMoistureWbPct', 'target moisture', '% wb', p.targetMoistureWbPct),
    sourced('moisture-and-limits', 'waterActivityTarget', 'water-activity target', '', p.waterActivityTarget),
  ]
  if (p.maxProductTempC) {
    out.push(
      sourced(
        'moisture-and-limits',
        'maxProductTempC',
        'maximum product temperature',
        '°C',
        p.maxProductTempC,
      ),
    )
  }
  out.push(...isothermNumbers(p.isotherm.desorption, 'desorption'))
  if (p.isotherm.adsorption) out.push(...isothermNumbers(p.isotherm.adsorption, 'adsorption'))
  out.push(...kineticsNumbers(p.kinetics))
  out.push(
    sourced(
      'geometry-and-loading',
      'defaultThicknessMm',
      'default thickness or diameter',
      'mm',
      p.defaultThicknessMm,
    ),
    sourced(
      'geometry-and-loading',
      'defaultLoadingKgPerM2',
      'default loading',
      'kg fresh/m²',
      p.defaultLoadingKgPerM2,
    ),
  )
  return out
}

/** The numbers of a profile that rest on memory (recalled or assumed, not verified in a document). */
export function memoryNumbers(p: ProductProfile): ProfileNumber[] {
  return profileNumbers(p).filter((n) => n.confidence === 'memory')
}

/** The weakest confidence among the given numbers (`published` for none). */
export function weakestConfidence(numbers: { confidence: Confidence }[]): Confidence {
  let worst: Confidence = 'published'
  for (const n of numbers) if (CONFIDENCE_RANK[n.confidence] < CONFIDENCE_RANK[worst]) worst = n.confidence
  return worst
}

export type LevelCounts = Record<Confidence, number> & { total: number }

function emptyCounts(): LevelCounts {
  const c = { total: 0 } as LevelCounts
  for (const l of CONFIDENCE_LEVELS) c[l] = 0
  return c
}

/** Counts of numbers per group and level over the given profiles, plus an `all` row. */
export function confidenceCounts(
  profiles: readonly ProductProfile[],
): Record<NumberGroup | 'all', LevelCounts> {
  const out = { all: emptyCounts() } as Record<NumberGroup | 'all', LevelCounts>
  for (const g of NUMBER_GROUPS) out[g] = emptyCounts()
  for (const p of profiles) {
    for (const n of profileNumbers(p)) {
      for (const row of [out[n.group], out.all]) {
        row[n.confidence]++
        row.total++
      }
    }
  }
  return out
}
