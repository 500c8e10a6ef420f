import { describe, expect, it } from 'vitest'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { productById } from '../../src/product/catalogue.ts'

describe('tabulated product response agrees with direct evaluation', () => {
  // Stated accuracy of the grid (0.5 °C × 0.5 % RH, bilinear; ln k for the rate constant): 0.5 % over
  // 0–60 °C and 10–95 % RH, the range weather and heated air cover.
  for (const id of ['grapes-to-raisins', 'apricot-halves', 'shelled-corn', 'wheat', 'chili-peppers']) {
    it(id, () => {
      const direct = productResponse(productById(id))
      const tab = tabulatedResponse(direct)
      const a = new Float64Array(2)
      const b = new Float64Array(2)
      let worstEmc = 0
      let worstK = 0
      for (let i = 0; i < 400; i++) {
        const t = (i * 7.31) % 60
        const rh = 10 + ((i * 13.7) % 85)
        worstEmc = Math.max(
          worstEmc,
          Math.abs(tab.emcDesorptionDb(t, rh) / direct.emcDesorptionDb(t, rh) - 1),
        )
        direct.stepParameters(t, rh, a)
        tab.stepParameters(t, rh, b)
        // Thompson (n = 0) passes its parameter (the temperature) through untabulated
        worstK =
          a[1] === 0 ? Math.max(worstK, Math.abs(b[0] - a[0])) : Math.max(worstK, Math.abs(b[0] / a[0] - 1))
        expect(b[1]).toBe(a[1])
      }
      expect(worstEmc).toBeLessThan(0.005)
      expect(worstK).toBeLessThan(0.005)
    })
  }
})
