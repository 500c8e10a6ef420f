import { describe, expect, it } from 'vitest'
import {
  BUSHEL_WEIGHT_KG,
  deepBedGrainFromProfile,
  m3PerMinPerTonneFromCfmPerBu,
  simulateDeepBed,
} from '../../src/drying/deep-bed/index.ts'
import { productById } from '../../src/product/catalogue.ts'
import { emcFitQuality, emcResidualsWbPct, fitIsotherm } from '../../src/product/fit-isotherm.ts'
import type { IsothermEquation } from '../../src/product/isotherm-models.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import { grainDryMatterLossModel } from '../../src/product/spoilage/index.ts'
import { steadyWeather } from '../drying/deep-bed/bin-weather.ts'
import { ISOTHERM_FITS, runFit, tablePoints } from './isotherm-tables.ts'

// The tables are in test/fixtures/isotherm-data/grain-emc-tables.json with the page each was read on.

describe('wheat: modified Oswin fitted to the durum wheat table (Wikipedia) and the 25 °C wheat row (Lotus Harvestec)', () => {
  const fit = runFit(ISOTHERM_FITS.find((c) => c.product === 'wheat')!)
  const eq = productById('wheat').isotherm.desorption.equation as Extract<
    IsothermEquation,
    { model: 'modified-oswin' }
  >

  it('the catalogue holds the fit (constants rounded to six figures)', () => {
    expect(fit.converged).toBe(true)
    expect(eq.model).toBe('modified-oswin')
    expect(eq.a / fit.equation.a - 1).toBeCloseTo(0, 5)
    expect(eq.b / fit.equation.b - 1).toBeCloseTo(0, 5)
    expect(eq.c / fit.equation.c - 1).toBeCloseTo(0, 5)
  })

  // measured: RMSE 0.077, largest 0.157 pt (durum); 0.202, 0.347 pt (25 °C row)
  it('meets every point of the Wikipedia durum wheat table (35–100 °F, RH 25–35 %) within 0.2 pt wb', () => {
    expect(emcFitQuality(eq, tablePoints('wikipedia-durum-wheat')).maxAbsWbPct).toBeLessThan(0.2)
  })
  it('meets the 25 °C wheat row (Lotus Harvestec, RH 30–90 %) within 0.35 pt wb', () => {
    expect(emcFitQuality(eq, tablePoints('lotus-25c/wheat')).maxAbsWbPct).toBeLessThan(0.35)
  })

  it('the two tables agree: the form fitted to the durum table alone (RH ≤ 35 %) predicts the 25 °C row up to 90 % RH within 0.45 pt', () => {
    // measured: largest 0.43 pt (at 30 % RH); the durum-only fit is not the adopted one (it misses the soft red
    // winter wheat extension value, test/fixtures/truth/emc-grain-tables.json, by 0.55 pt, beyond its 0.5 pt)
    const durumOnly = fitIsotherm(
      { model: 'modified-oswin', a: 15, b: -0.07, c: 2.5 },
      tablePoints('wikipedia-durum-wheat'),
    )
    expect(durumOnly.maxAbsWbPct).toBeLessThan(0.05)
    expect(emcFitQuality(durumOnly.equation, tablePoints('lotus-25c/wheat')).maxAbsWbPct).toBeLessThan(0.45)
  })

  it('the constants it replaced (Chung–Pfost 610.34, 0.15526, 93.213, recalled) lay up to 1.1 pt above the 25 °C row', () => {
    const old = { model: 'modified-chung-pfost' as const, a: 610.34, b: 0.15526, c: 93.213 }
    const r = emcResidualsWbPct(old, tablePoints('lotus-25c/wheat'))
    expect(Math.max(...r)).toBeGreaterThan(1.0)
    expect(Math.max(...r.map(Math.abs))).toBeLessThan(1.2)
  })
})

describe('shelled corn: the manual table (Henderson–Thompson values) and why its fit is not adopted', () => {
  const fToC = (f: number) => ((f - 32) * 5) / 9
  it('the table is the ASABE D245.6 modified Henderson corn isotherm (K 8.6541e-5, N 1.8634, C 49.81, as transcribed in public code) to its printed rounding (0.05 pt)', () => {
    const henderson = { model: 'modified-henderson' as const, a: 8.6541e-5, b: 1.8634, c: 49.81 }
    const q = emcFitQuality(henderson, tablePoints('manual-corn-henderson-thompson'))
    expect(tablePoints('manual-corn-henderson-thompson').length).toBe(126)
    expect(q.maxAbsWbPct).toBeLessThanOrEqual(0.0501)
  })

  it('Chung–Pfost fitted to the manual and Wikipedia corn tables: RMSE 0.46 pt; the natural-air bin then misses the UNL band (20–27 days + 15 %)', () => {
    const fit = runFit(ISOTHERM_FITS.find((c) => c.product === 'shelled-corn')!)
    expect(fit.rmseWbPct).toBeLessThan(0.46)
    const base = productById('shelled-corn')
    expect(base.isotherm.desorption.equation).not.toEqual(fit.equation)
    const withFit: ProductProfile = {
      ...base,
      isotherm: { desorption: { ...base.isotherm.desorption, equation: fit.equation } },
    }
    // the UNL case of test/drying/deep-bed/deep-bed.test.ts (Dorn, UNL CropWatch 2008): 20 → 15 % at 51 °F, 50 %
    const run = (p: ProductProfile) =>
      simulateDeepBed(
        deepBedGrainFromProfile(p),
        {
          floorAreaM2: 50,
          depthM: 5,
          initialMoistureWbPct: 20,
          initialGrainTempC: fToC(51),
          airflowM3PerMinPerT: m3PerMinPerTonneFromCfmPerBu(1, BUSHEL_WEIGHT_KG['shelled-corn']),
          targetMoistureWbPct: 15,
          fanHeatToAir: false,
        },
        steadyWeather(45, fToC(51), 50),
        grainDryMatterLossModel(),
      ).hoursUntilDry! / 24
    // measured: 32.1 days with the fit, 30.1 with the catalogue's recalled constants; the test allows 31.05
    expect(run(withFit)).toBeGreaterThan(27 * 1.15)
    expect(run(base)).toBeLessThan(27 * 1.15)
  })
})
