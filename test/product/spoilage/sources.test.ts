import { describe, expect, it } from 'vitest'
import { CONFIDENCE_LEVELS } from '../../../src/product/profile.ts'
import { spoilageModels } from '../../../src/product/spoilage/index.ts'

// The spoilage models grade their sources with the catalogue's levels (src/product/profile.ts), by the same
// rules as test/product/sources.test.ts: a copied number names the text it was copied from, and a rule of thumb
// is `memory` and says "common practice, no source".

describe('spoilage model sources use the catalogue levels', () => {
  it('every model has a catalogue level (never `user`)', () => {
    for (const m of spoilageModels()) {
      expect(CONFIDENCE_LEVELS, m.id).toContain(m.source.confidence)
      expect(m.source.confidence, m.id).not.toBe('user')
    }
  })

  it('`transcribed`: the citation names the text it was copied from', () => {
    const bad = spoilageModels()
      .filter((m) => m.source.confidence === 'transcribed')
      .filter(
        (m) =>
          !/\bas (?:given|quoted|transcribed|tabulated|rendered) in\b|\bas quoted (?:by|from)\b/i.test(
            m.source.citation,
          ),
      )
      .map((m) => `${m.id}: ${m.source.citation}`)
    expect(bad).toEqual([])
  })

  it('a rule of thumb is `memory` and says "common practice, no source"', () => {
    // none is left: the fish rule of thumb gave way to the FDA seafood HACCP exposure limits
    const rules = spoilageModels().filter((m) => /common practice/i.test(m.source.citation))
    expect(rules.map((m) => m.id)).toEqual([])
    for (const m of rules) {
      expect(m.source.confidence, m.id).toBe('memory')
      expect(m.source.citation, m.id).toMatch(/common practice, no source/)
    }
  })

  it('`published`: none of the current models claims to have read its original', () => {
    // Grain DML constants were read in code that transcribes Steele 1967 and Thompson 1972; coffee's window in a
    // note that quotes FAO 2006; the mould-free-time lines in a textbook and a forum that quote Seiler and
    // Cauvain & Seiler. A model that becomes `published` must cite the original it was read in.
    expect(spoilageModels().filter((m) => m.source.confidence === 'published')).toEqual([])
  })
})
