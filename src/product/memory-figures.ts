/**
 * @module product/memory-figures
 * The figures of a product that an answer rests on and that were recalled rather than read in a publication
 * (level `memory`, product/profile-numbers.ts): the list an assessment carries (JSON `product.figuresFromMemory`),
 * its count per kind, and the one plain-words line the CLI, the report and the comparison print.
 */
import type { ProductProfile } from './profile.ts'
import { NUMBER_GROUPS, type NumberGroup, type ProfileNumber, profileNumbers } from './profile-numbers.ts'

export interface MemoryFigure {
  /** The figure in plain words, as `dryhours products <id>` lists it. */
  name: string
  /** A short name for a one-line summary, e.g. `C0` or `reference size`. */
  shortName: string
  value: number
  unit: string
  kind: NumberGroup
  /** Path in the profile, e.g. `isotherm.desorption.equation.c0`. */
  path: string
}

/** Figures of a kind the answer uses, and how many of them rest on memory. */
export type FigureCounts = Record<NumberGroup, { figures: number; fromMemory: number }>

/**
 * Which of the profile's own figures the answer uses: the user's value replaces the profile's initial moisture,
 * thickness or loading when given, and the profile's target moisture is used only when it decides "dry".
 */
export interface FiguresInUse {
  initialMoisture: boolean
  targetMoisture: boolean
  thickness: boolean
  loading: boolean
}

const ALL_IN_USE: FiguresInUse = {
  initialMoisture: true,
  targetMoisture: true,
  thickness: true,
  loading: true,
}

const OPTIONAL_FIGURES: Record<string, keyof FiguresInUse> = {
  initialMoistureWbPct: 'initialMoisture',
  targetMoistureWbPct: 'targetMoisture',
  defaultThicknessMm: 'thickness',
  defaultLoadingKgPerM2: 'loading',
}

const SHORT_NAMES: Record<string, string> = {
  initialMoistureWbPct: 'initial moisture',
  targetMoistureWbPct: 'target moisture',
  waterActivityTarget: 'safe water activity',
  maxProductTempC: 'maximum product temperature',
  xm0: 'Xm0',
  c0: 'C0',
  k0: 'K0',
  hxJPerMol: 'ΔHx',
  hcJPerMol: 'ΔHc',
  hkJPerMol: 'ΔHk',
  'k.kRefPerH': 'k',
  'k.tRefC': 'reference temperature of k',
  'k.activationEnergyJPerMol': 'activation energy',
  'k.k0': 'k0',
  'k.kPerC': 'k per °C',
  'k.kPerRh': 'k per RH',
  n: 'n',
  'n.n0': 'n0',
  'n.nPerC': 'n per °C',
  'n.nPerRh': 'n per RH',
  dRefM2PerS: 'diffusivity',
  tRefC: 'reference temperature of the diffusivity',
  activationEnergyJPerMol: 'activation energy',
  referenceThicknessMm: 'reference size',
  rewettingRateFactor: 'rewetting factor',
  biotNumber: 'Biot number',
  wallThicknessMm: 'wall thickness',
  referenceMs: 'air-velocity effect',
  exponent: 'air-velocity effect',
  defaultThicknessMm: 'thickness',
  defaultLoadingKgPerM2: 'loading',
}

/** Short name of a profile number from its path (see {@link MemoryFigure.shortName}). */
export function figureShortName(path: string): string {
  const parts = path.split('.')
  if (parts[0] === 'isotherm') {
    const key = parts.slice(3).join('.')
    const name = SHORT_NAMES[key] ?? key.toUpperCase()
    return parts[1] === 'adsorption' ? `adsorption ${name}` : name
  }
  if (parts[0] === 'kinetics' && parts[1] === 'thompson') return 'Thompson grain constants'
  if (parts[0] === 'kinetics' && parts[1] === 'equation') {
    const key = parts.slice(2).join('.')
    return SHORT_NAMES[key] ?? key
  }
  const last = parts[parts.length - 1]
  return SHORT_NAMES[parts.slice(1).join('.')] ?? SHORT_NAMES[last] ?? last
}

/** GAB temperature terms: a zero means the isotherm has no temperature dependence. */
const TEMPERATURE_TERMS = /\.h[xck]JPerMol$/

function usedNumbers(p: ProductProfile, inUse: FiguresInUse): ProfileNumber[] {
  return profileNumbers(p).filter((n) => {
    const flag = OPTIONAL_FIGURES[n.path]
    return flag === undefined || inUse[flag]
  })
}

/** The figures of the profile that the answer uses and that rest on memory, in the order of `profileNumbers`. */
export function figuresFromMemory(p: ProductProfile, inUse: FiguresInUse = ALL_IN_USE): MemoryFigure[] {
  return usedNumbers(p, inUse)
    .filter((n) => n.confidence === 'memory')
    .map((n) => ({
      name: n.label,
      shortName:
        TEMPERATURE_TERMS.test(n.path) && n.value === 0 ? 'no temperature term' : figureShortName(n.path),
      value: n.value,
      unit: n.unit,
      kind: n.group,
      path: n.path,
    }))
}

/** Per kind: the figures the answer uses and how many of them rest on memory. */
export function figureCounts(p: ProductProfile, inUse: FiguresInUse = ALL_IN_USE): FigureCounts {
  const out = Object.fromEntries(NUMBER_GROUPS.map((g) => [g, { figures: 0, fromMemory: 0 }])) as FigureCounts
  for (const n of usedNumbers(p, inUse)) {
    out[n.group].figures++
    if (n.confidence === 'memory') out[n.group].fromMemory++
  }
  return out
}

const KIND_WORDS: Record<NumberGroup, string> = {
  'moisture-and-limits': 'moisture and limits',
  isotherm: 'isotherm',
  kinetics: 'drying rate',
  'geometry-and-loading': 'thickness and loading',
}

/** What {@link memoryFiguresLine} says when no figure rests on memory. */
export const NO_MEMORY_FIGURES =
  'No product figure used here rests on memory: each was read in a publication (or in a secondary source that cites it), fitted to published data, or given by you.'

/**
 * One plain-words line naming the figures recalled, not read in a publication, by kind (or
 * {@link NO_MEMORY_FIGURES}). E.g. `Figures recalled, not read in a publication (9 of 17): isotherm: C0, K0;
 * drying rate: k, n, …`.
 */
export function memoryFiguresLine(
  figures: readonly Pick<MemoryFigure, 'kind' | 'shortName'>[],
  counts: FigureCounts,
  productId: string,
): string {
  if (figures.length === 0) return NO_MEMORY_FIGURES
  const total = NUMBER_GROUPS.reduce((s, g) => s + counts[g].figures, 0)
  const parts = NUMBER_GROUPS.map((g) => {
    const names = [...new Set(figures.filter((f) => f.kind === g).map((f) => f.shortName))]
    return names.length ? `${KIND_WORDS[g]}: ${names.join(', ')}` : ''
  }).filter((s) => s !== '')
  return `Figures recalled, not read in a publication (${figures.length} of ${total}): ${parts.join('; ')}. Each figure with its source: dryhours products ${productId} (API: GET /v1/products/${productId}).`
}
