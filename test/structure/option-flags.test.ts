/**
 * Every CLI flag a core message writes (`give --site-tz <zone>`, `set --baseline`) is in the one table of option
 * names (weather/option-spec.ts `WEATHER_OPTION_SPECS`, analysis/option-names.ts `OTHER_OPTION_NAMES` and
 * `ENERGY_OPTION_NAMES`), so that every answer can name it as its own user knows it (the API by its key, the page
 * by its label). A flag missing from the table would reach API users as a CLI word (`--drying-temp` did).
 * The string literals and template texts of the core are read with rolldown's parser, comments left aside.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { parseAst } from 'rolldown/parseAst'
import { describe, expect, it } from 'vitest'
import { ENERGY_OPTION_NAMES, OTHER_OPTION_NAMES } from '../../src/analysis/option-names.ts'
import { WEATHER_OPTION_SPECS } from '../../src/weather/option-spec.ts'

/** The core folders whose messages reach every interface. */
const CORE = ['src/analysis', 'src/drying', 'src/product', 'src/weather', 'src/physics', 'src/math']

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    return statSync(path).isDirectory() ? files(path) : path.endsWith('.ts') ? [path] : []
  })
}

/** The texts of every string literal and template part of a parsed file. */
function texts(node: unknown, out: string[] = []): string[] {
  if (Array.isArray(node)) {
    for (const n of node) texts(n, out)
    return out
  }
  if (node === null || typeof node !== 'object') return out
  const n = node as { type?: string; value?: unknown; cooked?: unknown }
  if (n.type === 'Literal' && typeof n.value === 'string') out.push(n.value)
  if (n.type === 'TemplateElement') {
    const v = (n.value as { cooked?: string; raw?: string } | undefined) ?? {}
    out.push(v.cooked ?? v.raw ?? '')
  }
  for (const [k, v] of Object.entries(node)) if (k !== 'parent') texts(v, out)
  return out
}

/** Flags written in a text: `--name` at the start of a word. */
function flagsIn(text: string): string[] {
  const out: string[] = []
  for (const m of text.matchAll(/(?:^|[\s('"“])--([a-z][a-z-]*)/g)) out.push(m[1])
  return out
}

describe('the flags core messages write', () => {
  const known = new Set([
    ...WEATHER_OPTION_SPECS.map((s) => s.flag),
    ...OTHER_OPTION_NAMES.map((o) => o.flag),
    ...ENERGY_OPTION_NAMES.map((o) => o.flag),
  ])
  const found: { file: string; flag: string }[] = []
  for (const dir of CORE) {
    for (const file of files(dir)) {
      const ast = parseAst(readFileSync(file, 'utf8'), { lang: 'ts' }, file)
      for (const t of texts(ast)) for (const flag of flagsIn(t)) found.push({ file, flag })
    }
  }

  it('finds the flags the messages write (the scan reads the texts)', () => {
    const flags = new Set(found.map((f) => f.flag))
    for (const f of ['site-tz', 'map', 'lat', 'baseline', 'drying-temp', 'initial-wb'])
      expect(flags).toContain(f)
  })

  it('every one is in the table of option names', () => {
    expect(found.filter((f) => !known.has(f.flag))).toEqual([])
  })
})
