/**
 * Published (moisture, water activity) pairs for non-grain products, read in abstracts
 * (test/fixtures/isotherm-data/product-aw-points.json, each with its page and the sentences read), used as checks of the
 * catalogue's isotherms. With fewer than four pairs a product's isotherm is checked, not fitted.
 */
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { productById } from '../../src/product/catalogue.ts'
import { equilibriumMoistureDb, equilibriumRelativeHumidityPct } from '../../src/product/equilibrium.ts'
import { type EmcPoint, fitGabIsotherm, type GabEquation } from '../../src/product/fit-isotherm.ts'
import { emcDb } from '../../src/product/isotherm-models.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../../src/product/moisture-basis.ts'

interface PointSet {
  id: string
  product: string
  citation: string
  url: string
  points: { moistureWbPct: number; aw: number }[]
}

interface Band {
  id: string
  product: string
  citation: string
  url: string
  waterContentWbPct: [number, number]
  rhPct: [number, number]
}

const FIXTURE = fileURLToPath(new URL('../fixtures/isotherm-data/product-aw-points.json', import.meta.url))
const fixture = JSON.parse(readFileSync(FIXTURE, 'utf8')) as { sets: PointSet[]; bands: Band[] }
const sets = fixture.sets
const set = (id: string) => {
  const s = sets.find((x) => x.id === id)
  if (!s) throw new Error(`no point set '${id}' in ${FIXTURE}`)
  return s
}

describe('the point sets as read', () => {
  it('every set names its page and product, and its points increase together (an isotherm rises)', () => {
    for (const s of sets) {
      expect(s.url).toMatch(/^https?:\/\//)
      expect(() => productById(s.product)).not.toThrow()
      const sorted = [...s.points].sort((a, b) => a.moistureWbPct - b.moistureWbPct)
      for (let i = 1; i < sorted.length; i++) expect(sorted[i].aw).toBeGreaterThan(sorted[i - 1].aw)
    }
  })
})

describe('prunes: Zettler et al. 2001 (California prunes, abstract): 16–38 % m.c. ↔ aw 0.575–0.858, aw 0.70 at 24.6 %', () => {
  // The plums-to-prunes GAB (Xm0 0.10, C 3, K 1.0, no temperature term) is from memory; these pairs check it.
  // The abstract gives no temperature for the aw readings; the isotherm has no temperature term, so 25 and 35 °C
  // give the same answer (both run, so a temperature term added later is checked over the incubation range).
  const p = productById('plums-to-prunes')
  const s = set('zettler-2001-prunes')
  for (const tC of [25, 35]) {
    it(`at ${tC} °C the isotherm's aw at each published moisture is within 0.03 of the published aw`, () => {
      // measured: +0.003 (16 %), +0.028 (24.6 %), −0.012 (38 %)
      for (const pt of s.points) {
        const aw = equilibriumRelativeHumidityPct(p, tC, moistureDbFromWbPct(pt.moistureWbPct)) / 100
        expect(Math.abs(aw - pt.aw)).toBeLessThan(0.03)
      }
    })
    it(`at ${tC} °C the isotherm's moisture at each published aw is within 2.1 pt wb of the published moisture`, () => {
      // measured: −0.12 (aw 0.575), −2.02 (aw 0.70), +2.03 pt (aw 0.858): the curve is steep above aw 0.7, where a
      // small difference in aw is a large one in moisture
      for (const pt of s.points) {
        const m = moistureWbPctFromDb(equilibriumMoistureDb(p, tC, 100 * pt.aw))
        expect(Math.abs(m - pt.moistureWbPct)).toBeLessThan(2.1)
      }
    })
  }
  it('the profile target (18 % wb) lies below the published 24.6 % at which aw reaches 0.70, and the isotherm puts it under the aw target 0.65', () => {
    expect(p.targetMoistureWbPct.value).toBeLessThan(24.6)
    const aw = equilibriumRelativeHumidityPct(p, 25, moistureDbFromWbPct(p.targetMoistureWbPct.value)) / 100
    expect(aw).toBeLessThan(p.waterActivityTarget.value)
  })
})

describe('coffee: Fretheim 2019 (Cafe Imports, as quoted): 652 of 703 green-coffee lots at 11–11.1 % MC had aw ≤ 0.60', () => {
  // A bound, not a pair: most lots at 11 % lie at or below aw 0.60. The coffee-parchment GAB (Xm0 0.06, C 10, K 0.85,
  // from memory) is for coffee in parchment, not green coffee; this records how far it lies from the green-coffee lots.
  const p = productById('coffee-parchment')
  const b = (
    set('fretheim-2019-green-coffee') as PointSet & { bound: { aw: number; lots: number; lotsAbove: number } }
  ).bound
  it('the lots as read: more than nine in ten at or below aw 0.60', () => {
    expect(1 - b.lotsAbove / b.lots).toBeGreaterThan(0.9)
  })
  it('the recalled isotherm gives aw 0.65 at 11 % wb and 25 °C: 0.04–0.06 above what most green-coffee lots show (not adopted, not changed)', () => {
    // measured: 0.648. A change waits for a parchment-coffee table (Corrêa et al. 2010; Ordoñez-Silva et al. 2018).
    const aw = equilibriumRelativeHumidityPct(p, 25, moistureDbFromWbPct(11)) / 100
    expect(aw - b.aw).toBeGreaterThan(0.04)
    expect(aw - b.aw).toBeLessThan(0.06)
  })
})

/**
 * How far [% wb] the isotherm at tC misses the rectangle of a band: 0 when its equilibrium moisture over the RH
 * range overlaps the water-content range, else the distance between the two ranges.
 */
function bandGapWbPct(b: Band, tC: number): number {
  const p = productById(b.product)
  const [lo, hi] = b.rhPct.map((rh) => moistureWbPctFromDb(equilibriumMoistureDb(p, tC, rh)))
  const [m1, m2] = b.waterContentWbPct
  return Math.max(0, m1 - hi, lo - m2)
}

describe('storage bands: water content beside the relative humidity at which it keeps (Container Handbook Table 21; Cargo Handbook)', () => {
  // Measured misses [% wb] at 20 and 25 °C (no profile here has a temperature term, so both give the same):
  // apples 0.41 (the recalled apple GAB holds 24.4–28.1 % at RH 70–75 %, the band says 20–24 %), sultanas 2.64 (the
  // raisin GAB gives 14.4 % at RH 60 %; the same table's raisin row, 14–16 % at 55–65 %, is met: the two rows differ
  // by product; that sultanas are often dipped is from memory), cocoa 0.22 (the published Sandoval et al. 2020 GAB gives 8.2–9.2 % at
  // RH 70–75 % against 6–8 %). Every other band is met.
  const misses: Record<string, number> = {
    'container-handbook/apples': 0.41,
    'container-handbook/sultanas': 2.64,
    'cargo-handbook/cocoa': 0.22,
  }
  it('every band is checked, and each names its page', () => {
    expect(fixture.bands.length).toBe(10)
    for (const b of fixture.bands) expect(b.url).toMatch(/^https?:\/\//)
  })
  for (const b of fixture.bands) {
    const miss = misses[b.id]
    const what = `${b.product}: ${b.waterContentWbPct.join('–')} % wb at RH ${b.rhPct.join('–')} %`
    if (miss === undefined) {
      it(`${b.id} (${what}): the isotherm passes through the band at 20 and 25 °C`, () => {
        for (const tC of [20, 25]) expect(bandGapWbPct(b, tC)).toBe(0)
      })
    } else {
      it(`${b.id} (${what}): the isotherm misses the band by ${miss} pt wb, as recorded (not changed)`, () => {
        for (const tC of [20, 25]) expect(Math.abs(bandGapWbPct(b, tC) - miss)).toBeLessThan(0.01)
      })
    }
  }
})

describe('fitGabIsotherm: the GAB form fitted through the engine (for point sets of four or more)', () => {
  // Points computed by the engine from the published cocoa GAB (Sandoval et al. 2020, peeled fermented bean,
  // 25 °C: Xm 0.036, C 21.63, K 0.871): the fit must give those constants back from a start far from them.
  const cocoa = productById('cocoa-beans').isotherm.desorption.equation as GabEquation
  const points: EmcPoint[] = [11, 23, 33, 43, 53, 65, 75, 85].map((rhPct) => ({
    tC: 25,
    rhPct,
    emcWbPct: moistureWbPctFromDb(emcDb(cocoa, 25, rhPct)),
  }))
  it('recovers Xm0, C0 and K0 to 1e-4 (relative) with zero residual', () => {
    const start: GabEquation = { ...cocoa, xm0: 0.07, c0: 5, k0: 0.8 }
    const fit = fitGabIsotherm(start, points)
    expect(fit.converged).toBe(true)
    expect(Math.abs(fit.equation.xm0 / cocoa.xm0 - 1)).toBeLessThan(1e-4)
    expect(Math.abs(fit.equation.c0 / cocoa.c0 - 1)).toBeLessThan(1e-4)
    expect(Math.abs(fit.equation.k0 / cocoa.k0 - 1)).toBeLessThan(1e-4)
    expect(fit.maxAbsWbPct).toBeLessThan(1e-4)
  })
  it('refuses fewer than four points: the three prune pairs are checks, not a fit', () => {
    const prunes = set('zettler-2001-prunes').points.map((p) => ({
      tC: 25,
      rhPct: 100 * p.aw,
      emcWbPct: p.moistureWbPct,
    }))
    const start = productById('plums-to-prunes').isotherm.desorption.equation as GabEquation
    expect(() => fitGabIsotherm(start, prunes)).toThrow(RangeError)
  })
})
