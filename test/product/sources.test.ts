import { describe, expect, it } from 'vitest'
import { PRODUCT_CATALOGUE, productById } from '../../src/product/catalogue.ts'
import { CONFIDENCE_LEVELS, type ProductProfile } from '../../src/product/profile.ts'
import {
  confidenceCounts,
  memoryNumbers,
  type ProfileNumber,
  profileNumbers,
  weakestConfidence,
} from '../../src/product/profile-numbers.ts'

// The rules of the confidence levels (src/product/profile.ts): a number is `published` only when it was read in
// the cited document, cited with authors (or issuing body) and a year (`n.d.` when the document shows none).

/** A capitalised name, then within the same citation a year or `n.d.`. */
const AUTHOR_AND_YEAR = /\p{Lu}[\p{L}'’-]+[^;]{0,240}?(?:\b(?:1[89]\d\d|20\d\d)\b|\bn\.d\.)/u
/** Words that say a number was not read: they never belong to a `published` or `transcribed` source's own claim. */
const NOT_READ =
  /\bfrom memory\b|\bassum(?:e|ed|ption)\b|\bcomputed\b|\bour (?:own )?(?:estimate|assumption|choice|guess)\b|\bnot verified\b/i
/** The project's gathering notes must never be cited. */
const NOTES_CITED = /drying-science|reference §|shared\/references|reference file/i

function allNumbers(): { id: string; n: ProfileNumber }[] {
  return PRODUCT_CATALOGUE.flatMap((p) => profileNumbers(p).map((n) => ({ id: p.id, n })))
}

describe('confidence levels are honest (each level checked by its rule)', () => {
  it('every catalogue number has a level and a source of at least a few words', () => {
    for (const { id, n } of allNumbers()) {
      expect(CONFIDENCE_LEVELS, `${id} ${n.path}`).toContain(n.confidence)
      expect(n.source.length, `${id} ${n.path}`).toBeGreaterThan(15)
      expect(n.confidence, `${id} ${n.path}: catalogue numbers are never the user's`).not.toBe('user')
    }
  })

  it('`published`: names authors and year (or n.d.) and never says memory, assumed or computed', () => {
    const bad = allNumbers()
      .filter(({ n }) => n.confidence === 'published')
      .filter(({ n }) => !AUTHOR_AND_YEAR.test(n.source) || NOT_READ.test(n.source))
      .map(({ id, n }) => `${id} ${n.path}: ${n.source}`)
    expect(bad).toEqual([])
  })

  it('`transcribed`: names the secondary source it was copied from ("as given in …")', () => {
    const bad = allNumbers()
      .filter(({ n }) => n.confidence === 'transcribed')
      .filter(
        ({ n }) =>
          !/\bas (?:given|quoted|tabulated) in\b/i.test(n.source) || /\bfrom memory\b/i.test(n.source),
      )
      .map(({ id, n }) => `${id} ${n.path}: ${n.source}`)
    expect(bad).toEqual([])
  })

  it('`fitted`: says how dryhours derived it and names the published data (a year, n.d. or "as given in")', () => {
    const bad = allNumbers()
      .filter(({ n }) => n.confidence === 'fitted')
      .filter(
        ({ n }) =>
          !/\bfitted by dryhours\b|\bset by dryhours\b|\bthe middle of\b/i.test(n.source) ||
          !(AUTHOR_AND_YEAR.test(n.source) || /\bas given in\b/i.test(n.source)),
      )
      .map(({ id, n }) => `${id} ${n.path}: ${n.source}`)
    expect(bad).toEqual([])
  })

  it('`memory`: says so in its own words ("from memory" or "assumed")', () => {
    const bad = allNumbers()
      .filter(({ n }) => n.confidence === 'memory')
      .filter(({ n }) => !/\bfrom memory\b|\bassumed\b/i.test(n.source))
      .map(({ id, n }) => `${id} ${n.path}: ${n.source}`)
    expect(bad).toEqual([])
  })

  it("no source cites the project's gathering notes (users cannot follow them)", () => {
    const bad = allNumbers().filter(({ n }) => NOTES_CITED.test(n.source))
    expect(bad.map(({ id, n }) => `${id} ${n.path}`)).toEqual([])
    for (const p of PRODUCT_CATALOGUE) {
      for (const text of [p.isotherm.desorption.source, p.kinetics.source, ...p.cautions]) {
        expect(NOTES_CITED.test(text), `${p.id}: ${text}`).toBe(false)
      }
    }
  })

  it('an equation says the level of its weakest constant (so summaries never overstate it)', () => {
    for (const p of PRODUCT_CATALOGUE) {
      const numbers = profileNumbers(p)
      const iso = numbers.filter((n) => n.path.startsWith('isotherm.desorption.'))
      expect(p.isotherm.desorption.confidence, `${p.id} isotherm`).toBe(weakestConfidence(iso))
      const kin = numbers.filter(
        (n) =>
          n.path.startsWith('kinetics.equation.') ||
          n.path.startsWith('kinetics.thompson.') ||
          n.path === 'kinetics.referenceThicknessMm',
      )
      expect(p.kinetics.confidence, `${p.id} kinetics`).toBe(weakestConfidence(kin))
    }
  })

  it('a per-constant source names a constant that exists in the equation', () => {
    for (const p of PRODUCT_CATALOGUE) {
      const paths = new Set(profileNumbers(p).map((n) => n.path))
      for (const key of Object.keys(p.isotherm.desorption.parameters ?? {})) {
        expect(paths.has(`isotherm.desorption.equation.${key}`), `${p.id} isotherm ${key}`).toBe(true)
      }
      for (const key of Object.keys(p.kinetics.parameters ?? {})) {
        // `thompson` covers the four constants of the Thompson corn equation (`kinetics.thompson.a0` …)
        expect(
          paths.has(`kinetics.equation.${key}`) ||
            paths.has(`kinetics.${key}`) ||
            [...paths].some((path) => path.startsWith(`kinetics.${key}.`)),
          `${p.id} kinetics ${key}`,
        ).toBe(true)
      }
    }
  })
})

describe('the rule checks themselves fail on the cases they are for', () => {
  const grapes = productById('grapes-to-raisins')
  const withTarget = (source: string, confidence: ProductProfile['targetMoistureWbPct']['confidence']) =>
    ({ ...grapes, targetMoistureWbPct: { value: 18, source, confidence } }) as ProductProfile
  const published = (p: ProductProfile) =>
    profileNumbers(p).filter((n) => n.confidence === 'published' && n.path === 'targetMoistureWbPct')
  it('a `published` source without a year, or one that says "computed by dryhours" or "from memory", is caught', () => {
    for (const source of [
      'US grades of processed raisins: at most 18 %',
      'Doymaz 2012: 18 % computed by dryhours from the curve',
      'Doymaz 2012: 18 % from memory',
      'raisins 18 %, our assumption (Doymaz 2012)',
    ]) {
      const [n] = published(withTarget(source, 'published'))
      expect(AUTHOR_AND_YEAR.test(n.source) && !NOT_READ.test(n.source), source).toBe(false)
    }
    const [ok] = published(withTarget('USDA 1976, 7 CFR §52.1858: not more than 18 %', 'published'))
    expect(AUTHOR_AND_YEAR.test(ok.source) && !NOT_READ.test(ok.source)).toBe(true)
  })
})

describe('which figures rest on memory', () => {
  it('memoryNumbers lists exactly the memory numbers, with their paths and sources', () => {
    const p = productById('tomato-halves')
    const m = memoryNumbers(p)
    expect(m.every((n) => n.confidence === 'memory')).toBe(true)
    expect(m.map((n) => n.path)).toContain('kinetics.referenceThicknessMm')
    expect(m.map((n) => n.path)).not.toContain('kinetics.equation.dRefM2PerS')
    expect(m.length).toBe(profileNumbers(p).filter((n) => n.confidence === 'memory').length)
  })
  it('counts per kind add up to the total per level', () => {
    const c = confidenceCounts(PRODUCT_CATALOGUE)
    for (const level of CONFIDENCE_LEVELS) {
      expect(
        c.isotherm[level] +
          c.kinetics[level] +
          c['moisture-and-limits'][level] +
          c['geometry-and-loading'][level],
      ).toBe(c.all[level])
    }
    expect(c.all.total).toBe(allNumbers().length)
  })
  it('the products whose isotherm and kinetics constants all rest on memory are exactly these (the list may shrink, never grow unnoticed)', () => {
    // The papers' tables could not be read (corn now has transcribed Thompson constants, wheat a published Ea).
    const none = PRODUCT_CATALOGUE.filter((p) =>
      profileNumbers(p)
        .filter((n) => n.group === 'isotherm' || n.group === 'kinetics')
        .every((n) => n.confidence === 'memory'),
    ).map((p) => p.id)
    expect(none).toEqual(['apple-slices', 'hops'])
  })
})
