/**
 * Every truth fixture states where its values come from and a tolerance for every field it checks, and is
 * read by exactly one test in this folder.
 */
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { loadTruth, TRUTH_DIR } from './truth.ts'

const files = readdirSync(TRUTH_DIR).filter((f) => f.endsWith('.json'))
const tests = readdirSync('test/truth').filter((f) => f.endsWith('.test.ts') && f !== 'fixtures.test.ts')

describe('truth fixtures', () => {
  it('there are fixtures for the ASHRAE tables, FAO-56 examples, sun positions and EMC tables', () => {
    for (const stem of ['ashrae-2017-table-3', 'fao56-example-19', 'sun-positions', 'emc-grain']) {
      expect(
        files.some((f) => f.startsWith(stem)),
        stem,
      ).toBe(true)
    }
  })
  for (const file of files) {
    it(`${file}: provenance, units and a tolerance for every expected field; read by one test`, () => {
      const f = loadTruth(file)
      expect(f.title.length).toBeGreaterThan(10)
      expect(f.source.length).toBeGreaterThan(40) // the original, named
      expect(f.readIn.length).toBeGreaterThan(10)
      expect(f.toleranceNote.length).toBeGreaterThan(10)
      expect(f.cases.length).toBeGreaterThan(0)
      for (const c of f.cases) {
        for (const field of Object.keys(c.expected)) {
          expect(c.tolerance?.[field] ?? f.tolerance[field], `${c.name}: ${field}`).toBeDefined()
          expect(f.units[field], `${file}: unit of ${field}`).toBeDefined()
        }
      }
      const readers = tests.filter((t) => readFileSync(join('test/truth', t), 'utf8').includes(`'${file}'`))
      expect(readers, file).toHaveLength(1)
    })
  }
})
