import { describe, expect, it } from 'vitest'
import { productById } from '../../src/product/catalogue.ts'
import { diffusionMoistureRatio } from '../../src/product/diffusion.ts'
import { fitWeighings, profileFromFit } from '../../src/product/fit-weighings.ts'
import { levenbergMarquardt } from '../../src/product/least-squares.ts'
import { parseUserProfile } from '../../src/product/profile-schema.ts'
import { parseWeighingsCsv, type Weighing } from '../../src/product/weighings.ts'

/** Park–Miller minimal-standard generator (Park & Miller 1988) and Box–Muller normal deviates: reproducible noise. */
function normalNoise(seed: number): () => number {
  let s = (seed * 7919 + 12345) % 2147483647
  const u = () => {
    s = (s * 16807) % 2147483647
    return s / 2147483647
  }
  for (let i = 0; i < 20; i++) u() // small seeds give small first draws: discard a warm-up run
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u())
}

const DRY_G = 200
function synthetic(
  mr: (t: number) => number,
  m0: number,
  me: number,
  times: number[],
  noiseG: number,
  seed: number,
): Weighing[] {
  const z = normalNoise(seed)
  return times.map((t, i) => ({
    line: i + 2,
    timeH: t,
    massG: DRY_G * (1 + me + (m0 - me) * mr(t)) + noiseG * z(),
    airTempC: 40,
    rhPct: 30,
  }))
}

const TIMES = [0, 0.5, 1, 1.5, 2, 3, 4, 5, 6, 7.5, 9, 10.5, 12, 14, 16, 18, 20, 24]

describe('Levenberg–Marquardt', () => {
  it('fits the exponential y = 3·exp(−0.4·x) + 0.5 from a poor start', () => {
    const xs = [0, 1, 2, 3, 4, 5, 6, 8, 10]
    const r = levenbergMarquardt(
      (p) => xs.map((x) => p[0] * Math.exp(-p[1] * x) + p[2] - (3 * Math.exp(-0.4 * x) + 0.5)),
      [1, 1, 0],
    )
    expect(r.params[0]).toBeCloseTo(3, 6)
    expect(r.params[1]).toBeCloseTo(0.4, 6)
    expect(r.params[2]).toBeCloseTo(0.5, 6)
  })
})

describe('fit recovers known parameters from synthetic noisy weighings (1 g scale noise on ~1 kg)', () => {
  it('Page k = 0.3, n = 1.2, Me = 0.10: every parameter within 3 standard errors, for 20 noise seeds ≥ 80 % within 2 SE (nominal 95 %; measured 83 %)', () => {
    const truth = { kPerHn: 0.3, n: 1.2, equilibriumMoistureDb: 0.1 }
    let within2 = 0
    let total = 0
    for (let seed = 1; seed <= 20; seed++) {
      const w = synthetic((t) => Math.exp(-0.3 * t ** 1.2), 4, 0.1, TIMES, 1, seed)
      const f = fitWeighings(w, { reference: { dryMassG: DRY_G } })
      expect(f.best.model).toBe('page')
      for (const [k, v] of Object.entries(truth)) {
        const z = Math.abs(f.best.params[k] - v) / f.best.standardErrors[k]
        expect(z).toBeLessThan(3)
        total++
        if (z < 2) within2++
      }
    }
    expect(within2 / total).toBeGreaterThanOrEqual(0.8)
  })
  it('Lewis data (k = 0.25 h⁻¹): AICc prefers Lewis over Page, k within 3 SE', () => {
    const w = synthetic((t) => Math.exp(-0.25 * t), 3, 0.15, TIMES, 1, 42)
    const f = fitWeighings(w, { reference: { dryMassG: DRY_G } })
    expect(f.best.model).toBe('lewis')
    expect(Math.abs(f.best.params.kPerH - 0.25) / f.best.standardErrors.kPerH).toBeLessThan(3)
  })
  it('slab diffusion data (Deff 4e-10 m²/s, 6 mm): diffusion chosen and Deff recovered within 3 SE', () => {
    const tauRate = (4e-10 * 3600) / 0.003 ** 2
    const w = synthetic((t) => diffusionMoistureRatio('slab', tauRate * t), 5, 0.12, TIMES, 1, 7)
    const f = fitWeighings(w, { reference: { dryMassG: DRY_G }, thicknessMm: 6, shape: 'slab' })
    expect(f.best.model).toBe('diffusion')
    const d = f.effectiveDiffusivityM2PerS
    if (!d) throw new Error('Deff expected')
    expect(Math.abs(d.value - 4e-10) / d.standardError).toBeLessThan(3)
  })
})

describe('messy weighings', () => {
  const base = () => synthetic((t) => Math.exp(-0.3 * t ** 1.2), 4, 0.1, TIMES, 1, 3)
  it('a reading off the rack (+60 g) is removed and reported with its line; the fit is unharmed', () => {
    const w = base()
    w[8].massG = (w[8].massG as number) + 60
    const f = fitWeighings(w, { reference: { dryMassG: DRY_G } })
    expect(f.outliers.map((o) => o.line)).toEqual([w[8].line])
    expect(Math.abs(f.best.params.n - 1.2)).toBeLessThan(3 * f.best.standardErrors.n)
  })
  it('a missing final weighing is left out and listed; --final-wb then says why it cannot be used', () => {
    const w = base()
    w[w.length - 1].massG = null
    const f = fitWeighings(w, { reference: { initialWbPct: 80 } })
    expect(f.missingMassLines).toEqual([w[w.length - 1].line])
    expect(() => fitWeighings(w, { reference: { finalWbPct: 10 } })).toThrow(/final weighing.*line/)
  })
  it('time to a target: inside the weighed period, and "not reachable" below the fitted equilibrium', () => {
    const f = fitWeighings(base(), { reference: { dryMassG: DRY_G }, targetWbPct: 20 })
    // analytic: 0.25 = 0.1 + 3.9·exp(−0.3·t^1.2) → t = (ln(3.9/0.15)/0.3)^(1/1.2)
    const exact = (Math.log(3.9 / 0.15) / 0.3) ** (1 / 1.2)
    expect(Math.abs((f.target?.timeH as number) - exact)).toBeLessThan(0.3)
    const g = fitWeighings(base(), { reference: { dryMassG: DRY_G }, targetWbPct: 5 })
    expect(g.target?.timeH).toBeNull()
    expect(g.target?.note).toMatch(/not reachable/)
  })
  it('too few weighings, no drying, dry mass above a weighing: clear errors', () => {
    expect(() => fitWeighings(base().slice(0, 5), { reference: { dryMassG: DRY_G } })).toThrow(/at least 6/)
    const flat = base().map((w) => ({ ...w, massG: 1000 }))
    expect(() => fitWeighings(flat, { reference: { dryMassG: DRY_G } })).toThrow(/no drying/)
    expect(() => fitWeighings(base(), { reference: { dryMassG: 5000 } })).toThrow(/below every weighing/)
  })
  it('CSV: uneven ISO times, semicolons, comments; bad rows rejected with their line number', () => {
    const w = parseWeighingsCsv(
      '# tray 1\ntime;mass_g;air_c\n2026-07-01T08:00;1000;30\n2026-07-01T08:40;950;31\n2026-07-01T10:00;;32\n',
    ).rows
    expect(w).toHaveLength(3)
    ;[0, 40 / 60, 2].forEach((t, i) => {
      expect(w[i].timeH).toBeCloseTo(t, 9)
    })
    expect(w[2].massG).toBeNull()
    expect(() => parseWeighingsCsv('elapsed_h,mass_g\n0,100\n1,abc\n')).toThrow(/line 3: mass_g 'abc'/)
    expect(() => parseWeighingsCsv('elapsed_h,mass_g\n0,100\n0,90\n')).toThrow(/line 3: time must increase/)
    expect(() => parseWeighingsCsv('label,notes\n0,100\n')).toThrow(
      /line 1: no mass column found among 'label', 'notes'/,
    )
    expect(() => parseWeighingsCsv('elapsed_h,mass_g,rh_pct\n0,100,140\n')).toThrow(/line 2: rh_pct 140/)
  })
  it('the demo fixture fits (Page, the 6.5 h off-rack reading removed) and its profile validates', async () => {
    const { readFile } = await import('node:fs/promises')
    const text = await readFile(new URL('../fixtures/product/demo-weighings.csv', import.meta.url), 'utf8')
    const f = fitWeighings(parseWeighingsCsv(text), { reference: { dryMassG: 150 }, thicknessMm: 5 })
    expect(f.best.model).toBe('page')
    expect(f.outliers).toHaveLength(1)
    expect(f.outliers[0].timeH).toBe(6.5)
    const profile = profileFromFit(f, productById('apple-slices'), 'my-apples', 18)
    expect(parseUserProfile(JSON.parse(JSON.stringify(profile))).kinetics.confidence).toBe('user')
  })
})
