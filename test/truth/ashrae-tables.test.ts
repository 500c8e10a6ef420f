import { describe, expect, it } from 'vitest'
import { airState } from '../../src/physics/air-state.ts'
import {
  moistAirEnthalpyKjPerKg,
  moistAirSpecificVolumeM3PerKg,
  saturationHumidityRatio,
  standardPressureKpaAtElevation,
} from '../../src/physics/moist-air.ts'
import { saturationVaporPressureKpa } from '../../src/physics/saturation.ts'
import { caseFailures, loadTruth, type TruthCase } from './truth.ts'

const num = (c: TruthCase, k: string) => c.input[k] as number

const table3 = loadTruth('ashrae-2017-table-3-saturation-pressure.json')
describe(`${table3.title} (ASHRAE HOF 2017 ch. 1 Table 3)`, () => {
  for (const c of table3.cases) {
    it(c.name, () =>
      expect(caseFailures(table3, c, { pwsPa: saturationVaporPressureKpa(num(c, 'tC')) * 1000 })).toEqual([]),
    )
  }
})

const table2 = loadTruth('ashrae-2017-table-2-saturated-air.json')
describe(`${table2.title} (ASHRAE HOF 2017 ch. 1 Table 2)`, () => {
  for (const c of table2.cases) {
    it(c.name, () => {
      const t = num(c, 'tC')
      const p = num(c, 'pressureKpa')
      const ws = saturationHumidityRatio(t, p)
      const actual = {
        saturationHumidityRatio: ws,
        saturatedEnthalpyKjPerKg: moistAirEnthalpyKjPerKg(t, ws),
        dryAirVolumeM3PerKg: moistAirSpecificVolumeM3PerKg(t, 0, p),
      }
      expect(caseFailures(table2, c, actual)).toEqual([])
    })
  }
})

const table1 = loadTruth('ashrae-2017-table-1-standard-atmosphere.json')
describe(`${table1.title} (ASHRAE HOF 2017 ch. 1 Table 1)`, () => {
  for (const c of table1.cases) {
    it(c.name, () =>
      expect(
        caseFailures(table1, c, { pressurePa: standardPressureKpaAtElevation(num(c, 'elevationM')) * 1000 }),
      ).toEqual([]),
    )
  }
})

const example1 = loadTruth('ashrae-2017-example-1.json')
describe(`${example1.title} (ASHRAE HOF 2017 ch. 1 Example 1)`, () => {
  for (const c of example1.cases) {
    it(c.name, () => {
      const s = airState({
        dryBulbC: num(c, 'dryBulbC'),
        wetBulbC: num(c, 'wetBulbC'),
        pressureKpa: num(c, 'pressureKpa'),
      })
      const actual = {
        humidityRatio: s.humidityRatioGPerKg / 1000,
        relativeHumidityPct: s.relativeHumidityPct,
        enthalpyKjPerKg: s.enthalpyKjPerKg,
        specificVolumeM3PerKg: s.specificVolumeM3PerKg,
        dewPointC: s.dewPointC,
      }
      expect(caseFailures(example1, c, actual)).toEqual([])
    })
  }
})
