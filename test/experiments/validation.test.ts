/**
 * Validation: every published validation run against the engine (docs/validation.md is the table). Each run
 * goes through the engine on its weather reconstruction (test/experiments/run-case.ts) with the catalogue's
 * constants, none of which was fitted to it. The target band is 0.75–1.33× of the published time (0.8–1.25×
 * where the paper reports its weather); each case states whether it is expected inside, and a case expected
 * outside carries its reason. The test is two-sided: a run that leaves its band, or one reported as a miss
 * that comes inside, fails until cases.ts and the table are updated together.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { loadExperiments } from '../docs/product-docs.ts'
import { band, caseId, ENGINE_CASES, NOT_RUN } from './cases.ts'
import { caseRows, renderValidationDoc } from './validation-doc.ts'

const rows = caseRows()

describe('the engine runs of the published experiments', () => {
  const experiments = loadExperiments()
  const runs = experiments.flatMap((e) => e.runs.map((r) => ({ id: `${e.id}/${r.id}`, run: r })))

  it('each case has the role its experiment fixture gives it (calibration runs are fitted, validation runs never)', () => {
    for (const c of ENGINE_CASES) {
      const found = runs.find((r) => r.id === caseId(c))
      expect(found, caseId(c)).toBeDefined()
      expect(found?.run.role, caseId(c)).toBe(c.role)
      expect(found?.run.timeH, caseId(c)).toBe(c.published.timeH)
    }
  })

  it('every calibration and validation run is either run or listed with the reason it is not', () => {
    const covered = new Set([...ENGINE_CASES.map(caseId), ...NOT_RUN.map((n) => n.id)])
    const missing = runs.filter((r) => r.run.role !== 'context' && !covered.has(r.id)).map((r) => r.id)
    expect(missing).toEqual([])
  })

  it('a published time the fixture calls elapsed or active is compared as such', () => {
    for (const c of ENGINE_CASES) {
      const kind = runs.find((r) => r.id === caseId(c))?.run.timeKind
      if (kind !== 'unknown') expect(c.published.kind, caseId(c)).toBe(kind)
    }
  })
})

describe.each(rows.filter((x) => x.c.role === 'validation').map((x) => [caseId(x.c), x] as const))(
  'validation run %s',
  (id, { c, r, inside }) => {
    const [lo, hi] = band(c)
    it(`${c.expect === 'within' ? 'is within' : 'is reported outside'} ${lo}–${hi}× of the published ${c.published.timeH} h (engine ${r.predictedH.toFixed(1)} h, ratio ${r.ratio.toFixed(2)})`, () => {
      expect(r.reached, id).toBe(true)
      if (c.expect === 'within') expect(inside, `${id}: ratio ${r.ratio}`).toBe(true)
      else {
        expect(inside, `${id} now lies inside its band: update cases.ts and docs/validation.md`).toBe(false)
        expect(c.remark ?? '', id).not.toBe('')
      }
    })
  },
)

describe('docs/validation.md', () => {
  it('equals a fresh rendering (npm run docs:validation)', () => {
    const committed = readFileSync(new URL('../../docs/validation.md', import.meta.url), 'utf8')
    expect(committed).toBe(renderValidationDoc(rows))
  })
})
