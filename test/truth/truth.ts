/**
 * Truth fixtures (test/fixtures/truth/*.json): published reference values with where they come from and
 * a tolerance per field, in the style of a tolerance table. Each fixture is read by one test in this
 * folder, which computes the same quantities with dryhours and checks every case.
 *
 * A tolerance is `{ abs }` (|ours − expected| ≤ abs), `{ rel }` (|ours/expected − 1| ≤ rel) or
 * `{ relMin, relMax }` (relMin ≤ ours/expected − 1 ≤ relMax, for one-sided gaps such as perfect-gas
 * against real-gas tables). A case's own tolerance overrides the fixture's for that field.
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'

export type Tolerance = { abs: number } | { rel: number } | { relMin: number; relMax: number }

export interface TruthCase {
  name: string
  input: Record<string, number | string>
  expected: Record<string, number>
  tolerance?: Record<string, Tolerance>
  note?: string
}

export interface TruthFixture {
  title: string
  /** The original: authors, year, title or standard, table or equation. */
  source: string
  /** Where the values were actually read, when not in the original. */
  readIn: string
  units: Record<string, string>
  tolerance: Record<string, Tolerance>
  toleranceNote: string
  cases: TruthCase[]
}

export const TRUTH_DIR = 'test/fixtures/truth'

export function loadTruth(file: string): TruthFixture {
  return JSON.parse(readFileSync(join(TRUTH_DIR, file), 'utf8')) as TruthFixture
}

/** What is wrong with one case (empty when every expected field is within its tolerance). */
export function caseFailures(
  fixture: TruthFixture,
  c: TruthCase,
  actual: Record<string, number | undefined>,
): string[] {
  const out: string[] = []
  for (const [field, expected] of Object.entries(c.expected)) {
    const tol = c.tolerance?.[field] ?? fixture.tolerance[field]
    const ours = actual[field]
    if (tol === undefined) {
      out.push(`${field}: no tolerance stated`)
      continue
    }
    if (ours === undefined || !Number.isFinite(ours)) {
      out.push(`${field}: dryhours gave ${ours}, expected ${expected}`)
      continue
    }
    let ok: boolean
    let text: string
    if ('abs' in tol) {
      ok = Math.abs(ours - expected) <= tol.abs
      text = `±${tol.abs}`
    } else if ('rel' in tol) {
      ok = Math.abs(ours / expected - 1) <= tol.rel
      text = `±${tol.rel} relative`
    } else {
      const r = ours / expected - 1
      ok = r >= tol.relMin && r <= tol.relMax
      text = `${tol.relMin}…${tol.relMax} relative`
    }
    if (!ok) out.push(`${field}: dryhours ${ours}, expected ${expected} ${text}`)
  }
  return out
}
