/**
 * @module analysis/energy/run-rules
 * The four Western Electric run rules (Western Electric Co. 1956, *Statistical Quality Control Handbook*,
 * as listed in Montgomery, *Introduction to Statistical Quality Control*, section 5.3.6):
 * - WE1: one point beyond 3σ from the centre line;
 * - WE2: two of three consecutive points beyond 2σ, on the same side;
 * - WE3: four of five consecutive points beyond 1σ, on the same side;
 * - WE4: eight consecutive points on the same side of the centre line.
 * A signal is placed on the point that completes the pattern, and only when that point is itself part of
 * it (beyond the zone on the signalling side), so one excursion is not reported again by later points
 * that are back in control. Points exactly on a boundary do not count as beyond it.
 */

export type RunRuleId = 'WE1' | 'WE2' | 'WE3' | 'WE4'

export const RUN_RULE_TEXT: Record<RunRuleId, string> = {
  WE1: 'one point beyond 3σ',
  WE2: 'two of three consecutive points beyond 2σ on the same side',
  WE3: 'four of five consecutive points beyond 1σ on the same side',
  WE4: 'eight consecutive points on the same side of the centre line',
}

export interface RunRuleSignal {
  /** Index of the point that completes the pattern (0-based, in the charted sequence). */
  index: number
  rule: RunRuleId
  side: 'above' | 'below'
  /** The rule in words. */
  description: string
}

/** Count, among `z[from..to]`, the points beyond `k` on `side` (z in units of σ from the centre). */
function countBeyond(z: readonly number[], from: number, to: number, k: number, sign: 1 | -1): number {
  let n = 0
  for (let j = Math.max(0, from); j <= to; j++) if (sign * z[j] > k) n++
  return n
}

/**
 * Western Electric signals for `values` against `centerLine` and `sigma` (> 0). Example: with centre 0,
 * σ = 1, the sequence [0, 2.5, 2.5] fires WE2 at index 2 (two of three beyond 2σ above).
 */
export function westernElectricSignals(
  values: readonly number[],
  centerLine: number,
  sigma: number,
): RunRuleSignal[] {
  if (!(sigma > 0 && Number.isFinite(sigma))) {
    throw new RangeError(`run rules need a standard deviation > 0, got ${sigma}`)
  }
  const z = values.map((v) => (v - centerLine) / sigma)
  const signals: RunRuleSignal[] = []
  const push = (index: number, rule: RunRuleId, sign: 1 | -1) =>
    signals.push({ index, rule, side: sign > 0 ? 'above' : 'below', description: RUN_RULE_TEXT[rule] })
  for (let i = 0; i < z.length; i++) {
    for (const sign of [1, -1] as const) {
      const s = sign * z[i]
      if (s > 3) push(i, 'WE1', sign)
      if (s > 2 && i >= 1 && countBeyond(z, i - 2, i, 2, sign) >= 2) push(i, 'WE2', sign)
      if (s > 1 && i >= 3 && countBeyond(z, i - 4, i, 1, sign) >= 4) push(i, 'WE3', sign)
      if (s > 0 && i >= 7 && countBeyond(z, i - 7, i, 0, sign) === 8) push(i, 'WE4', sign)
    }
  }
  return signals
}
