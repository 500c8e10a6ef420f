/**
 * @module report/sections/context
 * What every report section needs: the display units, optional extras (the weather series for the
 * psychrometric chart, the product profile for its drying region), and a figure counter.
 */
import type { ProductProfile } from '../../product/profile.ts'
import type { HourlySeries } from '../../weather/series.ts'
import type { SpreadView } from '../assessment-view.ts'
import type { UnitFormatter } from '../display-units.ts'

export interface SectionContext {
  units: UnitFormatter
  series?: HourlySeries
  profile?: ProductProfile
  /** Prefix for element ids, so that several reports can share one page. */
  idPrefix: string
  nextFigure: () => number
}

export const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v)

/** A spread from either a spread object or a single number (typical year); null when absent. */
export function asSpread(v: SpreadView | number | null | undefined): SpreadView | null {
  if (v === null || v === undefined) return null
  if (typeof v === 'number') return Number.isFinite(v) ? { median: v, p10: v, p90: v } : null
  return v
}

/** Map a spread through a unit conversion, keeping nulls. */
export function convertSpread(s: SpreadView | null, f: (v: number) => number): SpreadView | null {
  if (!s) return null
  const c = (v: number | null) => (finite(v) ? f(v) : null)
  return { median: c(s.median), p10: c(s.p10), p90: c(s.p90) }
}

/** Round for display in data attributes and tables (kept as numbers). */
export function round(v: number | null | undefined, digits = 1): number | null {
  if (!finite(v)) return null
  const k = 10 ** digits
  return Math.round(v * k) / k
}
