/**
 * @module report/sections/context
 * What every report section needs besides the assessment: the display units, input info and a figure
 * counter.
 */

import type { Spread } from '../../analysis/statistics.ts'
import { integerPower } from '../../physics/power.ts'
import type { ReportInputInfo } from '../assessment-view.ts'
import { formatNumber, type UnitFormatter } from '../display-units.ts'

export interface SectionContext {
  units: UnitFormatter
  info: ReportInputInfo
  /** Display name of the site (never empty). */
  siteName: string
  /** Prefix for element ids, so that several reports can share one page. */
  idPrefix: string
  nextFigure: () => number
  /** A message with its option names as the reader's interface names them (flags, API keys or form labels). */
  optionWords: (message: string) => string
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

/** The currency of the assessment's prices (`heat.currency`), or null when none was given. */
export function currencyOf(a: { heat: object }): string | null {
  const c = (a.heat as { currency?: unknown }).currency
  return typeof c === 'string' && c.trim() !== '' ? c.trim() : null
}

/**
 * An amount of money in words: "95.00 EUR" with a currency; without one, the number and what it is in:
 * "95.00 in example-price units (no currency)" when every price is an example, else "95.00 (your prices' currency)".
 */
export function moneyWords(
  value: number | null,
  a: { heat: object },
  allExample: boolean,
  digits = 2,
): string {
  const c = currencyOf(a)
  const n = formatNumber(value, digits)
  if (c) return `${n} ${c}`
  return allExample ? `${n} in example-price units (no currency)` : `${n} (in your prices' currency)`
}

/** "per tonne" or "per short ton" for the unit system. */
export function perMassWords(ctx: SectionContext): string {
  return ctx.units.system === 'us' ? 'per short ton' : 'per tonne'
}

/** Fresh-product mass factor from per tonne to the display mass unit (1, or 0.907 for short tons). */
export function perMassFactor(ctx: SectionContext): number {
  return ctx.units.system === 'us' ? 0.90718474 : 1
}
