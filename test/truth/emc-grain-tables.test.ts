import { describe, expect, it } from 'vitest'
import { productById } from '../../src/product/catalogue.ts'
import { equilibriumMoistureDb } from '../../src/product/equilibrium.ts'
import { moistureWbPctFromDb } from '../../src/product/moisture-basis.ts'
import { caseFailures, loadTruth } from './truth.ts'

const fixture = loadTruth('emc-grain-tables.json')
describe(`${fixture.title} (grain EMC tables and charts)`, () => {
  for (const c of fixture.cases) {
    it(c.name, () => {
      const profile = productById(c.input.product as string)
      const db = equilibriumMoistureDb(profile, c.input.tC as number, c.input.rhPct as number)
      expect(caseFailures(fixture, c, { emcWbPct: moistureWbPctFromDb(db) })).toEqual([])
    })
  }
})
