/**
 * The calibration experiments reproduce their published times THROUGH THE ENGINE with the catalogue's
 * fitted constants (src/product/calibration.ts, written by `npm run calibrate`): the weather reconstruction
 * read from its CSV, the experiment's method, size and moistures, one batch as an assessment runs it. A
 * change to the engine, a reconstruction or a profile that moves these times fails here until the fit is
 * re-run. Fits that cannot land on the published time (the engine's time jumps where the end point slips
 * past a night) carry the nearest step; the bound below is that step's distance.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { CALIBRATED_CONSTANTS } from '../../src/product/calibration.ts'
import { productById } from '../../src/product/catalogue.ts'
import { CALIBRATION_TARGETS, parameterValue } from './calibration-targets.ts'
import { caseId, ENGINE_CASES } from './cases.ts'
import { runCase } from './run-case.ts'

describe.each(CALIBRATION_TARGETS.map((t) => [t.caseId, t] as const))('calibration run %s', (id, t) => {
  const c = ENGINE_CASES.find((x) => caseId(x) === id)
  it('is a calibration run (validation runs are never fitted)', () => {
    expect(c?.role).toBe('calibration')
  })
  it('the catalogue uses the fitted constant', () => {
    const written = CALIBRATED_CONSTANTS.find(
      (x) => x.productId === t.productId && x.parameter === t.parameter,
    )
    expect(written).toBeDefined()
    expect(parameterValue(productById(t.productId), t.parameter)).toBe(written?.value)
  })
  it('the engine reproduces the published time (within 6 %, the largest step of a fit)', () => {
    if (!c) throw new Error(`no case ${id}`)
    const r = runCase(c)
    expect(r.reached).toBe(true)
    expect(Math.abs(r.ratio - 1)).toBeLessThan(0.06)
  })
})

describe('docs/calibration.md', () => {
  it('lists the constants the catalogue uses (npm run calibrate writes both)', () => {
    const doc = readFileSync(new URL('../../docs/calibration.md', import.meta.url), 'utf8')
    for (const c of CALIBRATED_CONSTANTS) {
      expect(doc).toContain(`| ${c.productId} | ${c.parameter} | ${c.value} | ${c.caseId} |`)
    }
  })
})
