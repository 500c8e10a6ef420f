/**
 * @module bench/section
 * The shape of one benchmark section. `bench/run.ts` imports every section listed there, runs them in
 * turn, prints their figures and writes them to `bench/latest.json`.
 */

/** One measured figure. `value` is what was measured in this run, never a constant. */
export interface BenchFigure {
  /** What was measured, e.g. 'column form throughput'. */
  name: string
  value: number
  /** Unit of `value`, e.g. 'states/s', '°C', 'x' (ratio), '' (count). */
  unit: string
  /** How it was obtained (median of n runs, best of n, over which hours …). */
  note?: string
}

export interface BenchSection {
  /** Short id, also the key in latest.json, e.g. 'moist-air'. */
  id: string
  /** One line: what the section measures and against what reference. */
  title: string
  /** Runs the measurements; may take a few seconds. */
  run: () => BenchFigure[] | Promise<BenchFigure[]>
}

/** Median of a list of numbers (the list is copied, not sorted in place). */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b)
  const mid = s.length >> 1
  return s.length % 2 === 1 ? s[mid] : 0.5 * (s[mid - 1] + s[mid])
}

/** Seeded pseudo-random numbers in [0, 1): mulberry32 (Tommy Ettinger, 2017, public domain; from memory). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
