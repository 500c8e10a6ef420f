/**
 * @module report/sections/context
 * What every report section needs besides the assessment: the display units, input info and a figure
 * counter.
 */

import type { Spread } from '../../analysis/statistics.ts'
import { integerPower } from '../../physics/power.ts'
import type { ReportInputInfo } from '../assessment-view.ts'
import type { UnitFormatter } from '../display-units.ts'

export interface SectionContext {
  units: UnitFormatter
  info: ReportInputInfo
  /** Display name of the site (never empty). */
  siteName: string
  /** Prefix for element ids, so that several reports can share one page. */
  idPrefix: string
  nextFigure: () => number
}

export const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v)

/** Map a spread through a unit conversion, keeping nulls. */
export function convertSpread(s: Spread | null | undefined, f: (v: number) => number): Spread | null {
  if (!s) return null
  const c = (v: number | null) => (finite(v) ? f(v) : null)
  return { median: c(s.median), p10: c(s.p10), p90: c(s.p90) }
}

/** Round for display in data attributes and tables (kept as numbers). */
export function round(v: number | null | undefined, digits = 1): number | null {
  if (!finite(v)) return null
  const k = integerPower(10, digits)
  return Math.round(v * k) / k
}

/** "per tonne" or "per short ton" for the unit system. */
export function perMassWords(ctx: SectionContext): string {
  return ctx.units.system === 'us' ? 'per short ton' : 'per tonne'
}

/** Fresh-product mass factor from per tonne to the display mass unit (1, or 0.907 for short tons). */
export function perMassFactor(ctx: SectionContext): number {
  return ctx.units.system === 'us' ? 0.90718474 : 1
}
