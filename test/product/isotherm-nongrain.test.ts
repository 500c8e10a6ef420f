import { describe, expect, it } from 'vitest'
import { PRODUCT_CATALOGUE, productById } from '../../src/product/catalogue.ts'
import {
  equilibriumMoistureDb,
  equilibriumRelativeHumidityPct,
  safeMoistureWbPct,
} from '../../src/product/equilibrium.ts'
import { emcDb, erhPct, gabConstantsAt } from '../../src/product/isotherm-models.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../../src/product/moisture-basis.ts'

const wb = (id: string, tC: number, rh: number) =>
  moistureWbPctFromDb(equilibriumMoistureDb(productById(id), tC, rh))

describe('dried fruit: Beuchat 1981 (Cereal Foods World 26:345): dried fruit at 15–20 % MC has aw 0.60–0.65', () => {
  // the GAB C and K of these profiles are from memory: this checks them against a published band.
  // Tolerance: the band ±2 pt.
  for (const id of ['grapes-to-raisins', 'plums-to-prunes', 'apricot-halves', 'apple-slices']) {
    it(`${id}: EMC at 25 °C between 13 and 22 % wb over aw 0.60–0.65`, () => {
      for (const rh of [60, 62.5, 65]) {
        const m = wb(id, 25, rh)
        expect(m).toBeGreaterThan(13)
        expect(m).toBeLessThan(22)
      }
    })
  }
})

describe('cocoa beans, published GAB (Sandoval et al. 2020, peeled fermented bean, 25 °C)', () => {
  it('at the 7.5 % wb drying end point the water activity is below 0.70 (University of Guelph: moulds need about 0.70)', () => {
    const aw = equilibriumRelativeHumidityPct(productById('cocoa-beans'), 25, moistureDbFromWbPct(7.5)) / 100
    expect(aw).toBeLessThan(0.7)
    expect(aw).toBeGreaterThan(0.5)
  })
})

describe('figs: Oksar, Şen & Aksoy 2017 end point 22 % wb ↔ aw 0.65, and sun-dried figs aw 0.63–0.67 (Morocco study)', () => {
  it('ERH at 22 % wb, 25 °C, lies in the published sun-dried range 0.63–0.67', () => {
    const aw = equilibriumRelativeHumidityPct(productById('figs'), 25, moistureDbFromWbPct(22)) / 100
    expect(aw).toBeGreaterThanOrEqual(0.63)
    expect(aw).toBeLessThanOrEqual(0.67)
  })
})

describe('monolayer moistures read in abstracts (the GAB constant the abstract gives; C, K from memory)', () => {
  const xm0 = (id: string) => {
    const eq = productById(id).isotherm.desorption.equation
    if (eq.model !== 'gab') throw new Error(`${id} is not GAB`)
    return eq.xm0
  }
  it('apple (memory): the Xm0 in use lies inside 0.107–0.168 kg/kg db (Fuji apple at 50–70 °C, Moraes, Rosa & Pinto, FURG abstract); the middle of that range with the recalled C and K leaves the Beuchat band', () => {
    expect(xm0('apple-slices')).toBeGreaterThanOrEqual(0.107)
    expect(xm0('apple-slices')).toBeLessThanOrEqual(0.168)
    const mid = {
      model: 'gab' as const,
      xm0: 0.1375,
      c0: 3,
      k0: 0.97,
      hxJPerMol: 0,
      hcJPerMol: 0,
      hkJPerMol: 0,
    }
    // measured: 23.7 % wb at aw 0.65, 25 °C (the band allows 22 with its ±2 pt)
    expect(moistureWbPctFromDb(emcDb(mid, 25, 65))).toBeGreaterThan(22)
  })
  it('onion: Xm 11.0 g/100 g dry matter for air-dried untreated onion (GAB; BET 9.8), Alam & Islam 2015, Bangladesh J. Agril. Res. 40:35', () => {
    expect(xm0('onion-slices')).toBe(0.11)
  })
  it('fish: Xm 4.94 % db (freeze-dried sardines, 25–50 °C, Sablani et al. 2001, Drying Technol. 19:673)', () => {
    expect(xm0('fish-fillets')).toBe(0.0494)
  })
})

describe('water-activity limits used for targets (Beuchat 1981; ICO; Oksar et al. 2017)', () => {
  it('no profile targets an aw at which mycotoxigenic aspergilli grow (≥ 0.80, Beuchat 1981)', () => {
    for (const p of PRODUCT_CATALOGUE) expect(p.waterActivityTarget.value).toBeLessThan(0.8)
  })
  it('dried-fruit targets use 0.60 (no proliferation) or 0.65 (osmophilic yeasts only), as Beuchat lists', () => {
    for (const p of PRODUCT_CATALOGUE.filter((x) => x.category === 'fruit')) {
      expect([0.6, 0.65]).toContain(p.waterActivityTarget.value)
    }
  })
  it('coffee: ICO aw 0.68; figs: 0.65; salted fish: saturated brine 0.75', () => {
    expect(productById('coffee-parchment').waterActivityTarget.value).toBe(0.68)
    expect(productById('figs').waterActivityTarget.value).toBe(0.65)
    expect(productById('fish-fillets-salted').waterActivityTarget.value).toBe(0.75)
  })
  it('the stricter safe moisture never exceeds the target moisture and meets the aw target', () => {
    for (const p of PRODUCT_CATALOGUE) {
      const s = safeMoistureWbPct(p, 25)
      expect(s.stricterWbPct).toBeLessThanOrEqual(p.targetMoistureWbPct.value)
      const aw = equilibriumRelativeHumidityPct(p, 25, moistureDbFromWbPct(s.stricterWbPct)) / 100
      expect(aw).toBeLessThanOrEqual(p.waterActivityTarget.value + 1e-6)
    }
  })
  it('rough rice at the 14 % IRRI target sits above aw 0.65 at 25 °C: the aw target is the stricter one', () => {
    const s = safeMoistureWbPct(productById('rough-rice'), 25)
    expect(s.atWaterActivityTargetWbPct).toBeLessThan(14)
  })
})

describe('GAB free-water limit', () => {
  it('a GAB product wetter than its saturation moisture reports ERH 100 % (free water), not NaN', () => {
    expect(equilibriumRelativeHumidityPct(productById('hops'), 25, 4)).toBe(100)
  })
})

describe('GAB with temperature dependence (Kiranoudis et al. 1993 potato constants, as given via Singh 1996 in public code: mirrorscotty/material-data isotherms/gab-potato.c)', () => {
  // Xm0 0.056, Hx 1.39 kJ/mol; C0 0.017, Hc 20 kJ/mol; K0 0.94, Hk −0.92 kJ/mol
  const eq = {
    model: 'gab',
    xm0: 0.056,
    c0: 0.017,
    k0: 0.94,
    hxJPerMol: 1390,
    hcJPerMol: 20000,
    hkJPerMol: -920,
  } as const
  it('constants follow X = X0·exp(H/RT): C at 30 °C = 0.017·exp(20000/(8.314·303.15)) ≈ 47.5', () => {
    expect(gabConstantsAt(eq, 30).c).toBeCloseTo(0.017 * Math.exp(20000 / (8.314462618 * 303.15)), 9)
    expect(gabConstantsAt(eq, 30).c).toBeCloseTo(47.5, 0)
  })
  it('EMC falls with temperature at fixed RH over 30–60 °C and ERH inverts it', () => {
    for (const rh of [20, 50, 80]) {
      const m30 = emcDb(eq, 30, rh)
      const m60 = emcDb(eq, 60, rh)
      expect(m60).toBeLessThan(m30)
      expect(erhPct(eq, 60, m60)).toBeCloseTo(rh, 8)
    }
  })
})
